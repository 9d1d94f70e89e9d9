using System.Text.RegularExpressions;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

[Collection("current directory")]
public class ReportTests
{
    private static ReportDocument DemoDocument()
    {
        var model = ModelReader.ReadFile(DemoPath);
        var run = ModelRun.Run(model);
        return ModelReport.Build(run, ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run), "demo-clinic.json", "test");
    }

    [Theory]
    [InlineData(0.01, 100, 500)]      // derived: 0.08·100/0.01 = 800 → rounded down to 5·10²
    [InlineData(0.5, 100, 10)]        // derived: 16 → 1·10¹
    [InlineData(0.001, 10, 500)]      // derived: 800 → 5·10²
    [InlineData(2.0, 100, 2)]         // derived: 4 → 2·10⁰
    public void The_deflected_shape_scale_factor_is_a_round_number_near_eight_percent_of_the_model(double largest, double size, double expected)
    {
        Assert.Equal(expected, ModelPlots.ScaleFactor(largest, size), 12);
    }

    [Fact]
    public void The_demo_report_holds_every_table_and_figure_in_both_files()
    {
        string dir = TempDir("report");
        var (code, output, err) = Run("report", DemoPath, "--out", dir);
        Assert.True(code == 0, err);
        var doc = DemoDocument();
        string html = File.ReadAllText(Path.Combine(dir, "report.html"));
        string md = File.ReadAllText(Path.Combine(dir, "report.md"));
        var figures = doc.Figures.ToArray();
        var tables = doc.Tables.ToArray();
        // What a reviewer asks for (common practice): inputs, units, assumptions, formulas with sources, results, drift
        // checks, hand beside FE, verdicts, cautions; the demo declares levels, two drift checks and four kinds of check.
        foreach (var heading in new[] { "Inputs and units", "Assumptions", "Methods and formulas", "Solution checks", "Deflected shapes", "Story displacements", "Drift checks", "Seismic story forces", "Hand methods beside the finite-element model", "Verdicts", "Cautions" })
        {
            Assert.Contains(heading, html);
            Assert.Contains(heading, md);
        }
        Assert.Equal(tables.Length, Regex.Matches(html, "<table>").Count);
        foreach (var t in tables)
        {
            Assert.Contains($"<caption>{System.Net.WebUtility.HtmlEncode(t.Caption)}</caption>", html);
            Assert.Contains($"*{t.Caption.Replace("|", "\\|")}*", md);
        }
        foreach (var caption in new[] { "Materials", "Drift check results", "Hand method beside FE", "Methods, formulas and their published sources" })
            Assert.Contains(tables, t => t.Caption == caption);
        // Figures: 3 lateral load cases (W, E and the generated equivalent-lateral-force case E-forces), the displacement
        // profile, one drift figure per drift check (3), the seismic story forces and first- vs second-order drift (2),
        // one bar chart per check kind (4).
        Assert.Equal(3 + 1 + 3 + 2 + 4, figures.Length);
        var embedded = Regex.Matches(html, "data:image/png;base64,([A-Za-z0-9+/=]+)").Select(m => Convert.FromBase64String(m.Groups[1].Value)).ToArray();
        Assert.Equal(figures.Length, embedded.Length);
        for (int i = 0; i < figures.Length; i++)
        {
            byte[] file = File.ReadAllBytes(Path.Combine(dir, figures[i].FileName));
            Assert.Equal(file, embedded[i]);
            ValidPng(file, figures[i].Width, figures[i].Height, figures[i].FileName);
            Assert.Contains($"]({figures[i].FileName})", md);
        }
        // Self-contained: nothing fetched from elsewhere.
        Assert.DoesNotMatch("(src|href)=\"(https?:|//|[^d#])", html);
        foreach (var text in new[] { html, md })
        {
            Assert.Contains("licensed engineer", text);
            Assert.Contains("governing local building code", text);
            Assert.Contains("ASCE 7-16 eq. 12.8-15", text);
            Assert.Contains("Przemieniecki", text);
        }
        Assert.Contains("licensed engineer", output);
        // Story 1 is the lowest, between the demo's first two levels L0 and L1 (the model file's levels; docs/building.md).
        Assert.Contains("| 1 | L0–L1 | 156 |", md);
        Assert.DoesNotContain("| 2 | L0–L1 |", md);
    }

    [Fact]
    public void The_report_is_byte_identical_between_two_runs()
    {
        string a = TempDir("report-a"), b = TempDir("report-b");
        Assert.Equal(0, Run("report", DemoPath, "--out", a).Code);
        Assert.Equal(0, Run("report", DemoPath, "--out", b).Code);
        var names = Directory.GetFiles(a).Select(Path.GetFileName).Order().ToArray();
        Assert.Equal(names, Directory.GetFiles(b).Select(Path.GetFileName).Order().ToArray());
        foreach (var n in names)
            Assert.True(File.ReadAllBytes(Path.Combine(a, n!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, n!))), $"{n} differs");
    }

    [Fact]
    public void A_model_without_levels_still_gets_a_shape_figure_and_no_story_sections()
    {
        string json = """
        {
          "formatVersion": 1,
          "units": { "force": "kN", "length": "m" },
          "materials": [ { "id": "C", "E": 30000000, "nu": 0.2 } ],
          "sections": [ { "id": "W", "shape": "rectangle", "b": 0.2, "d": 3.0 } ],
          "nodes": [ { "id": "A", "x": 0, "y": 0 }, { "id": "B", "x": 0, "y": 6 } ],
          "members": [ { "id": "W1", "start": "A", "end": "B", "section": "W", "material": "C" } ],
          "supports": [ { "node": "A", "type": "fixed" } ],
          "loadCases": [ { "id": "H", "nodalLoads": [ { "node": "B", "fx": 100 } ] } ]
        }
        """;
        var model = ModelReader.Parse(json, "pier.json");
        var doc = ModelReport.Build(ModelRun.Run(model), null, "pier.json", "test");
        var f = Assert.Single(doc.Figures);
        Assert.Equal("shape-H.png", f.FileName);
        ValidPng(f.Png, PlotStyle.Width, PlotStyle.Height, f.FileName);
        string md = doc.Markdown();
        Assert.DoesNotContain("Drift checks", md);
        Assert.DoesNotContain("Hand methods beside", md);
        Assert.Contains("Units: force kN, length m", md);
    }

    [Fact]
    public void A_bad_model_gives_exit_2_and_writes_nothing()
    {
        string dir = TempDir("report-bad");
        string model = Path.Combine(Path.GetTempPath(), $"pl-bad-{Guid.NewGuid():N}.json");
        File.WriteAllText(model, "{ \"formatVersion\": 1, \"nodes\": [ ");
        var (code, _, err) = Run("report", model, "--out", dir);
        Assert.Equal(2, code);
        Assert.Contains("Nothing was written", err);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void An_unwritable_report_folder_gives_exit_4_and_no_files()
    {
        // A folder below a regular file cannot be created (common practice).
        string parent = TempDir("report-file");
        Directory.CreateDirectory(parent);
        string blocker = Path.Combine(parent, "a-file");
        File.WriteAllText(blocker, "x");
        var (code, _, err) = Run("report", DemoPath, "--out", Path.Combine(blocker, "out"));
        Assert.Equal(4, code);
        Assert.Contains("Fix: choose a writable folder", err);
        Assert.Equal([blocker], Directory.GetFileSystemEntries(parent));
    }

    [Fact]
    public void A_bad_tolerance_gives_exit_1()
    {
        var (code, _, err) = Run("report", DemoPath, "--tolerance", "2", "--out", TempDir("report-tol"));
        Assert.Equal(1, code);
        Assert.Contains("outside (0, 1)", err);
    }
}
