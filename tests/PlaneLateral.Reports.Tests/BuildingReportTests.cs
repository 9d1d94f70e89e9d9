using System.Globalization;
using System.Security.Cryptography;
using System.Text.RegularExpressions;
using PlaneLateral.Cli;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The report of a building in plan through the command line (docs/reports.md), every test with a hang guard.</summary>
[Collection("current directory")]
public class BuildingReportTests
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(120);

    private static string Model(string name) => Path.Combine(AppContext.BaseDirectory, "models", name);

    private static async Task<(int Code, string Out, string Err)> Cli(params string[] args) =>
        await Task.Run(() => Run(args)).WaitAsync(Guard);

    /// <summary>The rows of the Markdown table whose caption starts with <paramref name="caption"/>: header, then rows of cells.</summary>
    private static (string[] Header, List<string[]> Rows) MdTable(string md, string caption)
    {
        var lines = md.Split('\n');
        int i = Array.FindIndex(lines, l => l.StartsWith("*" + caption, StringComparison.Ordinal));
        Assert.True(i >= 0, $"no table \"{caption}\" in the report");
        static string[] Cells(string l) => l.Trim().Trim('|').Split(" | ").Select(c => c.Trim()).ToArray();
        var header = Cells(lines[i + 2]);
        var rows = new List<string[]>();
        for (int k = i + 4; k < lines.Length && lines[k].StartsWith('|'); k++) rows.Add(Cells(lines[k]));
        return (header, rows);
    }

    public static TheoryData<string> Buildings => ["demo-building.json", "plan/long-warehouse.json", "plan/taly-example-7-12.json"];

    [Theory]
    [MemberData(nameof(Buildings))]
    public async Task Every_shipped_building_gets_its_report_with_inputs_provenance_figures_and_balanced_story_shears(string name)
    {
        string model = Model(name), dir = TempDir("building-report");
        try
        {
            var (code, stdout, stderr) = await Cli("report", model, "--out", dir);
            Assert.True(code == 0, stderr);
            Assert.Contains("Summary", stdout);
            Assert.Contains("Report written to", stdout);
            string md = await File.ReadAllTextAsync(Path.Combine(dir, "report.md")).WaitAsync(Guard);
            string html = await File.ReadAllTextAsync(Path.Combine(dir, "report.html")).WaitAsync(Guard);

            // Input tables (what a checker reads first), in both twins.
            foreach (var caption in new[] { "Summary: the answers first", "Input files", "Building size", "Levels (base first)", "Lines of resistance", "Load cases",
                         "Floor loads", "Methods, formulas and their published sources", "Checks of every floor solve", "Story shear per line", "Largest corner drift" })
            {
                Assert.Contains("*" + caption, md);
                Assert.Contains("<caption>" + System.Net.WebUtility.HtmlEncode(caption), html);
            }

            // Provenance: each input's SHA-256, computed here from the file's bytes (FIPS 180-4 via .NET), by name without folder.
            byte[] bytes = await File.ReadAllBytesAsync(model).WaitAsync(Guard);
            string sha = Convert.ToHexStringLower(SHA256.HashData(bytes));
            var inputs = MdTable(md, "Input files");
            var row = Assert.Single(inputs.Rows, r => r[0] == Path.GetFileName(model));
            Assert.Equal(sha, row[3]);
            Assert.Equal(bytes.Length.ToString(CultureInfo.InvariantCulture), row[2]);
            Assert.DoesNotContain(Path.GetDirectoryName(model)!, md);
            Assert.DoesNotContain(Path.GetDirectoryName(model)!, html);

            // The plan figures, one per story, beside the report and embedded in the HTML.
            var run = PlanRun.Run(ModelReader.ReadPlanFile(model));
            var figures = PlanPlots.Governing(run.Result);
            Assert.Equal(run.Result.Plan.FloorCount, figures.Count);
            foreach (var f in figures)
            {
                ValidPng(await File.ReadAllBytesAsync(Path.Combine(dir, f.FileName)).WaitAsync(Guard), f.Width, f.Height, f.FileName);
                Assert.Contains($"]({f.FileName})", md);
            }
            // Every figure embedded: the plan figures, the floors that bend (with a floor block) and the spectrum (with a response spectrum).
            int floorFigures = PlanFloorPlots.All(run.Result, PlanTributarySplit.Run(run.Result)).Count;
            int spectrumFigures = run.Seismic?.Spectrum is null ? 0 : 1;
            Assert.Equal(figures.Count + floorFigures + spectrumFigures, Regex.Matches(html, "data:image/png;base64,").Count);

            // Σ line story shears = story shear (and torque) in every story of every case: read back from the report's own table,
            // and recomputed here from the result it renders (equilibrium of the part above the cut — derived).
            var balance = MdTable(md, "Σ line story shears against the story shear");
            Assert.Equal(run.Result.Cases.Sum(c => c.Stories.Count), balance.Rows.Count);
            foreach (var b in balance.Rows)
                Assert.True(double.Parse(b[^1], CultureInfo.InvariantCulture) <= 1e-9, $"case {b[0]} story {b[1]}: residual {b[^1]}");
            var lines = run.Result.Plan.Lines.ToDictionary(l => l.Id);
            foreach (var c in run.Result.Cases)
                foreach (var st in c.Stories)
                {
                    var ls = c.LineStories.Where(x => x.Story == st.Story).ToList();
                    double scale = Math.Max(Math.Abs(st.Vx), Math.Abs(st.Vy));
                    Assert.True(Math.Abs(ls.Sum(x => x.Shear * Math.Cos(lines[x.Line].Angle)) - st.Vx) <= 1e-9 * scale, $"{c.Case.Id} story {st.Story}: ΣVx");
                    Assert.True(Math.Abs(ls.Sum(x => x.Shear * Math.Sin(lines[x.Line].Angle)) - st.Vy) <= 1e-9 * scale, $"{c.Case.Id} story {st.Story}: ΣVy");
                }

            // Verdicts and cautions close it; no compliance claim.
            Assert.Contains("Verdicts", md);
            Assert.Contains("verification by a licensed engineer", md);
            Assert.DoesNotContain("complies", md, StringComparison.OrdinalIgnoreCase);
        }
        finally { if (Directory.Exists(dir)) Directory.Delete(dir, true); }
    }

    [Fact]
    public async Task A_building_with_a_floor_block_reports_the_flexibility_test_and_the_envelope_and_one_with_a_seismic_block_its_modes_and_spectrum()
    {
        string a = TempDir("building-floor"), b = TempDir("building-seismic");
        try
        {
            Assert.Equal(0, (await Cli("report", Model("plan/long-warehouse.json"), "--out", a)).Code);
            string md = await File.ReadAllTextAsync(Path.Combine(a, "report.md")).WaitAsync(Guard);
            foreach (var caption in new[] { "Floor blocks", "Floor flexibility test per span", "Line shear envelope" }) Assert.Contains("*" + caption, md);
            Assert.Contains("the governing code decides", md, StringComparison.OrdinalIgnoreCase);

            Assert.Equal(0, (await Cli("report", Model("demo-building.json"), "--out", b)).Code);
            md = await File.ReadAllTextAsync(Path.Combine(b, "report.md")).WaitAsync(Guard);
            foreach (var caption in new[] { "Seismic block", "Modes in plan", "Base shear per direction", "Stories along x", "Stories along y", "Corner drift check, governing result per story", "Torsional irregularity", "Hand beside FE", "Rotation-locked split beside FE" })
                Assert.Contains("*" + caption, md);
            Assert.Contains("Scaling rule applied:", md);
        }
        finally
        {
            foreach (var d in new[] { a, b }) if (Directory.Exists(d)) Directory.Delete(d, true);
        }
    }

    [Fact]
    public async Task Two_runs_give_byte_identical_files()
    {
        string a = TempDir("building-twice-a"), b = TempDir("building-twice-b");
        try
        {
            Assert.Equal(0, (await Cli("report", Model("demo-building.json"), "--out", a)).Code);
            Assert.Equal(0, (await Cli("report", Model("demo-building.json"), "--out", b)).Code);
            var names = Directory.GetFiles(a).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
            Assert.Equal(names, Directory.GetFiles(b).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList());
            Assert.Contains("report.html", names);
            foreach (var n in names)
                Assert.True(File.ReadAllBytes(Path.Combine(a, n!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, n!))), $"{n} differs between runs");
        }
        finally
        {
            foreach (var d in new[] { a, b }) if (Directory.Exists(d)) Directory.Delete(d, true);
        }
    }

    [Fact]
    public async Task The_Taly_example_report_shows_the_published_numbers()
    {
        // Taly, Design of Reinforced Masonry Structures, 2nd ed., 2010, Example 7.12 (REFERENCES.md, confirmed):
        // x_R = 49.5 ft, y_R = 30 ft; with the centre of mass shifted 4.5 ft (case NS-ecc here) V_A = 52.36 kip, V_B = 47.64 kip;
        // the direct parts 45 and 55 kip (eq. 7.72); design V_B = 55 kip.
        string dir = TempDir("building-taly");
        try
        {
            Assert.Equal(0, (await Cli("report", Model("plan/taly-example-7-12.json"), "--out", dir)).Code);
            string md = await File.ReadAllTextAsync(Path.Combine(dir, "report.md")).WaitAsync(Guard);
            var cr = MdTable(md, "Centre of rigidity and centre of mass");
            var y = Assert.Single(cr.Rows, r => r[0] == "y");
            Assert.Equal(["49.5", "30"], y[2..4]);

            var shears = MdTable(md, "Story shear per line, cases NS along y");
            int ecc = Array.IndexOf(shears.Header, "NS-ecc [kip]");
            Assert.True(ecc > 0, string.Join(" | ", shears.Header));
            Assert.Equal("52.36", shears.Rows.Single(r => r[1] == "A")[ecc]);
            Assert.Equal("47.64", shears.Rows.Single(r => r[1] == "B")[ecc]);

            var hand = MdTable(md, "Hand beside FE, cases NS along y");
            int design = Array.IndexOf(hand.Header, "hand design [kip]"), direct = Array.IndexOf(hand.Header, "hand direct [kip]"), total = Array.IndexOf(hand.Header, "hand total [kip]");
            var b = hand.Rows.Single(r => r[0] == "NS-ecc" && r[2] == "B");
            Assert.Equal(("55", "55", "47.64"), (b[design], b[direct], b[total]));
            Assert.Equal("52.36", hand.Rows.Single(r => r[0] == "NS-ecc" && r[2] == "A")[total]);
            // One story, one stiffness per line: the hand split is exact (derived); a line across the loading with no torque
            // (NS+ecc puts the forces through the centre of rigidity) has no hand share to compare, and no FE shear either.
            Assert.All(hand.Rows, r => Assert.Equal(r[^2] == "-" ? "no hand share" : "agree", r[^1]));
            Assert.All(hand.Rows.Where(r => r[^2] == "-"), r => Assert.True(Math.Abs(double.Parse(r[^3], CultureInfo.InvariantCulture)) < 1e-9, r[^3]));
            Assert.Contains("Taly, Design of Reinforced Masonry Structures, 2nd ed., 2010, §7.9", md);
        }
        finally { if (Directory.Exists(dir)) Directory.Delete(dir, true); }
    }

    [Theory]
    [InlineData("\"storyStiffness\": [4.5, 3.0]", ExitCodes.BadModel)]     // two stiffnesses for one story: a bad building file
    [InlineData("\"storyStiffness\": [4.5]", ExitCodes.Unstable)]          // only north-south lines: the floor slides east-west
    public async Task A_bad_building_is_refused_with_the_exit_code_README_lists_and_nothing_is_written(string lineA, int expected)
    {
        string dir = TempDir("building-bad"), src = TempDir("building-bad-src");
        Directory.CreateDirectory(src);
        string file = Path.Combine(src, "bad-building.json");
        string text = """
            { "formatVersion": 1, "title": "bad", "units": { "force": "kip", "length": "ft" }, "materials": [],
              "plan": { "outline": [[0, 0], [90, 0], [90, 60], [0, 60]],
                "levels": [ { "id": "base", "elevation": 0 }, { "id": "roof", "elevation": 12 } ],
                "lines": [ { "id": "A", "at": [0, 30], "direction": "y", LINE_A },
                           { "id": "B", "at": [90, 30], "direction": "y", "storyStiffness": [5.5] } ],
                "loads": [ { "id": "NS", "direction": "y", "forces": [100] } ] } }
            """.Replace("LINE_A", lineA);
        await File.WriteAllTextAsync(file, text).WaitAsync(Guard);
        try
        {
            var (code, stdout, stderr) = await Cli("report", file, "--out", dir);
            Assert.True(code == expected, $"exit {code}: {stderr}");
            Assert.False(Directory.Exists(dir) && Directory.EnumerateFileSystemEntries(dir).Any(), "something was written");
            Assert.Contains("Nothing", stderr + stdout, StringComparison.OrdinalIgnoreCase);
            Assert.Equal(text, await File.ReadAllTextAsync(file).WaitAsync(Guard));   // the input is never modified
        }
        finally
        {
            foreach (var d in new[] { dir, src }) if (Directory.Exists(d)) Directory.Delete(d, true);
        }
    }
}
