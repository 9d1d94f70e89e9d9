using System.Globalization;
using System.Text.RegularExpressions;
using PlaneLateral.Model;
using PlaneLateral.Tests.Input;
using PlaneLateral.Tests.Output;

namespace PlaneLateral.Tests.Architecture;

/// <summary>
/// The console's and the report's tables that repeat a building's results file show that file's rows (issue 20, "one
/// table model"): for every shipped building that has them, each row of the file the solve command wrote (read back by
/// CsvHelper, a reader the project does not write) appears as one row of the printed table (the solve command's console
/// at the default detail, and the report's Markdown), its chosen columns in order: each number the file's to four
/// significant figures (docs/reports.md, "Results print to four significant figures": half a unit in the fourth figure,
/// relative 5e-4 at most), each text as the file has it. A console or report table formatted by hand from other
/// numbers or to another rounding, or one that leaves out rows of its file, fails. (Common practice: architecture
/// rules written as tests.)
/// </summary>
public sealed partial class TablesShowTheFilesTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromMinutes(5);   // hang guard, not a timing
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-tableviews-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>A file's row: each column's cell by the column's name (the unit left out).</summary>
    private sealed class Row(Dictionary<string, string> cells)
    {
        public string this[string name] => cells[name];
        public double Number(string name) => double.TryParse(cells[name], NumberStyles.Float, CultureInfo.InvariantCulture, out double v) ? v : double.NaN;
    }

    /// <summary>A file's columns a table shows (by name, the unit left out) and which of its rows, given all of them (all when null).</summary>
    /// <remarks><paramref name="Optional"/>: a file that may lack the columns (a column written only when the input has such things); without them, no rows are checked.</remarks>
    private sealed record View(string File, string[] Columns, Func<Row, IReadOnlyList<Row>, bool>? Rows = null, bool Optional = false);

    /// <summary>
    /// A drift check row that governs its story (and named point): the largest ratio over allowed ratio of its group, the
    /// first of equals, over the outline corners only (a corner number given) or every row.
    /// </summary>
    private static bool Governs(Row row, IReadOnlyList<Row> all, bool cornersOnly, bool byPoint)
    {
        bool Point(Row x) => x["corner"] == "";
        if (cornersOnly && Point(row) || byPoint && !Point(row)) return false;
        var group = all.Where(x => x["story"] == row["story"] && (!cornersOnly || !Point(x)) && (!byPoint || Point(x) && x["point"] == row["point"])).ToList();
        double Use(Row x) => x.Number("ratio") / x.Number("allowed");
        return ReferenceEquals(group.MaxBy(Use), row);
    }

    /// <summary>The shipped planar models with a drift check or a response spectrum (the planar tables this test reads).</summary>
    public static TheoryData<string> PlanarModelsWithDriftChecksOrSpectrum() =>
        new(RepositoryFiles.Models().Where(m => !ModelReader.IsPlanFile(RepositoryFiles.ModelPath(m)) &&
            ModelReader.ReadFile(RepositoryFiles.ModelPath(m)) is var model && (model.Building.DriftChecks.Count > 0 || model.Seismic?.ResponseSpectrum is not null)));

    public static TheoryData<string> Buildings() => new(["demo-building.json", .. RepositoryFiles.Models("plan")]);

    [Theory]
    [MemberData(nameof(Buildings))]
    public async Task BuildingTablesShowTheirFilesRows(string building)
    {
        string path = RepositoryFiles.ModelPath(building);
        var plan = ModelReader.ReadPlanFile(path);
        bool Along(string line, string direction)
        {
            var l = plan.Lines.First(x => x.Id == line);
            return Math.Abs(direction == "x" ? l.Cos : l.Sin) > 1e-9;   // a component of the line along the loading
        }
        var atCentres = plan.Cases.Where(c => c.Direction is "x" or "y" && c.Eccentricity == 0).ToDictionary(c => c.Id, c => c.Direction);
        View flexibility = new("plan-floor-flexibility.csv", ["level", "case", "from line", "to line", "span from", "span to", "MDD", "ADVE", "MDD/ADVE", "flexible by eq. 12.3-1"]);
        View lines = new("plan-spectrum-lines.csv", ["story", "line", "ELF shear", "modal shear", "scaled modal shear", "accidental torsion", "design shear"], (r, _) => Along(r["line"], r["direction"]));
        View amplification = new("plan-amplification.csv", ["direction", "level", "max displacement", "average of the ends", "Ax", "applied"]);
        View[] console =
        [
            flexibility,
            new("plan-shear-envelope.csv", ["story", "line", "flexible", "hand tributary", "flexible/hand - 1", "gap cause"],
                (r, _) => r["hand tributary"] != "" && atCentres.TryGetValue(r["case"], out var dir) && Along(r["line"], dir)),
            new("plan-elf-forces.csv", ["direction", "level", "Fx"]),
            amplification,
            new("plan-spectrum-stories.csv", ["story", "Px", "theta (modal)", "theta (ELF)", "theta max"]),
            lines with { Columns = [.. lines.Columns, "design overturning"] },
            new("plan-spectrum-line-reactions.csv", ["line", "node", "Rx design", "Ry design", "Mz design"], (r, _) => Along(r["line"], r["direction"])),
            new("plan-drift-checks.csv", ["case", "story", "corner", "amplified drift", "ratio", "allowed", "result"], (r, all) => Governs(r, all, cornersOnly: true, byPoint: false)),
            new("plan-drift-checks.csv", ["point", "case", "story", "amplified drift", "ratio", "allowed", "result"], (r, all) => Governs(r, all, cornersOnly: false, byPoint: true), Optional: true),
        ];
        View[] report =
        [
            flexibility with { Columns = ["level", "case", "loading", .. flexibility.Columns[2..]] },
            amplification,
            new("plan-spectrum-modes.csv", ["mode", "period", "gamma", "base shear x", "base shear y", "base torque"]),
            lines,
            new("plan-drift-checks.csv", ["story", "case", "corner", "x", "y", "elastic drift", "amplified drift", "height", "ratio", "allowed", "result"],
                (r, all) => Governs(r, all, cornersOnly: false, byPoint: false)),
        ];
        var (files, stdout, markdown) = await Task.Run(() => Run(path)).WaitAsync(Guard);
        int shown = Check(files, console, ConsoleRows(stdout), "console") + Check(files, report, MarkdownRows(markdown), "report.md");
        // A building with any of these files has rows in them (seismic block, floors that bend, a drift limit).
        bool any = console.Concat(report).Any(v => File.Exists(Path.Combine(files, v.File)));
        Assert.True(any == (shown > 0), $"{building}: {shown} rows checked");
        Assert.Equal(plan.Seismic is not null || plan.Floors.Count > 0 || plan.DriftLimit is not null, any);
    }

    [Theory]
    [MemberData(nameof(PlanarModelsWithDriftChecksOrSpectrum))]
    public async Task PlanarTablesShowTheirFilesRows(string model)
    {
        var (files, stdout, markdown) = await Task.Run(() => Run(RepositoryFiles.ModelPath(model))).WaitAsync(Guard);
        View[] console =
        [
            new("response-spectrum-stories.csv", ["story", "ELF shear", "modal shear", "scaled modal shear", "drift", "design drift Cd*drift/Ie", "design drift ratio",
                "difference of combined displacements (not the drift)"]),
            new("response-spectrum-stories.csv", ["story", "overturning moment (no sign)", "scaled overturning moment", "Px", "theta (modal)", "theta (ELF)", "theta max"]),
        ];
        View[] report = [new("drift-checks.csv", ["check", "case", "story", "elastic drift", "amplified drift", "drift ratio", "allowed ratio", "margin", "result"])];
        int shown = Check(files, console, ConsoleRows(stdout), "console") + Check(files, report, MarkdownRows(markdown), "report.md");
        Assert.True(shown > 0, $"{model}: no rows checked");
    }

    /// <summary>The solve command's files and console (default detail) and the report command's Markdown.</summary>
    private (string Files, string Stdout, string Markdown) Run(string path)
    {
        string files = Path.Combine(_dir, "solve"), report = Path.Combine(_dir, "report");
        var (code, stdout, err) = CliRun.Run("solve", path, "--out", files);
        Assert.True(code == 0, err);
        var (rcode, _, rerr) = CliRun.Run("report", path, "--out", report);
        Assert.True(rcode == 0, rerr);
        return (files, stdout, File.ReadAllText(Path.Combine(report, "report.md")));
    }

    /// <summary>Each view's file rows against the printed rows; the number of rows checked (a missing file: none).</summary>
    private static int Check(string folder, IEnumerable<View> views, IReadOnlyList<string[]> printed, string where)
    {
        int n = 0;
        foreach (var view in views)
        {
            string file = Path.Combine(folder, view.File);
            if (!File.Exists(file)) continue;
            var records = CsvTextTests.Read(File.ReadAllText(file), comments: true).Where(r => r.Length > 1 || r[0] != "").ToList();
            var header = records[0];
            if (view.Optional && !view.Columns.All(c => header.Any(h => h == c || h.StartsWith(c + " [", StringComparison.Ordinal)))) continue;
            int Index(string name)
            {
                int i = Array.FindIndex(header, h => h == name || h.StartsWith(name + " [", StringComparison.Ordinal));
                Assert.True(i >= 0, $"{view.File} has no column \"{name}\"");
                return i;
            }
            var columns = view.Columns.Select(Index).ToArray();
            var rows = records.Skip(1).Select(record => new Row(header.Select((h, i) => (Name: Regex.Replace(h, @" \[[^\]]*\]$", ""), Value: record[i]))
                .ToDictionary(x => x.Name, x => x.Value))).ToList();
            foreach (var (record, row) in records.Skip(1).Zip(rows))
            {
                if (view.Rows is { } keep && !keep(row, rows)) continue;
                var expected = columns.Select(i => record[i]).Where(v => v != "").ToArray();
                Assert.True(printed.Any(row => Same(row, expected)),
                    $"{where}: no row shows {view.File}'s row [{string.Join(", ", record)}] as [{string.Join(" | ", expected)}]");
                n++;
            }
        }
        return n;
    }

    /// <summary>A printed row shows the file's cells: as many, each number to four significant figures (a fraction as a percentage to one decimal), each text equal.</summary>
    private static bool Same(string[] row, string[] file)
    {
        if (row.Length != file.Length) return false;
        for (int i = 0; i < row.Length; i++)
        {
            const NumberStyles style = NumberStyles.Float;
            var inv = CultureInfo.InvariantCulture;
            if (row[i].EndsWith(" %", StringComparison.Ordinal) && double.TryParse(file[i], style, inv, out double share) &&
                double.TryParse(row[i][..^2], style, inv, out double percent))
            {
                // A fraction shown as a percentage to one decimal: half a unit of it, 0.05 % (derived from the one-decimal display).
                if (Math.Abs(percent / 100 - share) > 5e-4 * (1 + 1e-9)) return false;
            }
            else if (double.TryParse(file[i], style, inv, out double v) && double.TryParse(row[i], style, inv, out double shown))
            {
                if (Math.Abs(shown - v) > 5e-4 * Math.Abs(v) * (1 + 1e-9)) return false;
            }
            else if (row[i] != file[i]) return false;
        }
        return true;
    }

    /// <summary>The console's table rows: each line's cells, split where two or more spaces part them, empty cells left out.</summary>
    private static List<string[]> ConsoleRows(string stdout) =>
        stdout.Split('\n').Select(l => Gap().Split(l.Trim()).Where(c => c != "").ToArray()).Where(c => c.Length > 1).ToList();

    /// <summary>The Markdown tables' rows: each "| a | b |" line's cells, empty cells left out.</summary>
    private static List<string[]> MarkdownRows(string markdown) =>
        markdown.Split('\n').Where(l => l.StartsWith('|')).Select(l => l.Trim().Trim('|').Split('|').Select(c => c.Trim()).Where(c => c != "").ToArray()).ToList();

    [GeneratedRegex(@"\s{2,}")]
    private static partial Regex Gap();
}
