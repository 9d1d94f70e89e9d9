using System.Globalization;
using System.Text.RegularExpressions;
using PlaneLateral.Cli;
using PlaneLateral.Tests.Input;
using PlaneLateral.Tests.Seismic;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// The CSV conventions of docs/model-format.md ("CSV files"), proven on every CSV file every writing command produces:
/// <c>solve</c> of every shipped model and building under models/, <c>compare</c>, <c>report</c>, <c>sweep</c> (solid and
/// with a window), <c>coupling-sweep</c> and <c>export-matrices</c>. Each file is read by CsvHelper (a standard reader the
/// project does not write; RFC 4180, Shafranovich 2005, is the format) into one rectangular table with exactly one header
/// row: comments only as leading <c>#</c> lines, every row as wide as the header, numbers culture-invariant (the commands
/// run under a culture whose decimal separator is a comma), headers in the house style "name [unit]". Every *.csv found is
/// checked, so a table added later is covered without naming it here.
/// </summary>
public sealed class CsvConventionTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(120);   // hang guard per command (a solve of a panel model is the slowest)

    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-csvconv-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>A culture that writes 1234.5 as "1.234,5": any writer that formats with the current culture shows it.</summary>
    private static CultureInfo CommaCulture()
    {
        var c = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        c.NumberFormat.NumberDecimalSeparator = ",";
        c.NumberFormat.NumberGroupSeparator = ".";
        c.NumberFormat.PercentDecimalSeparator = ",";
        return c;
    }

    /// <summary>Runs the command line under <paramref name="culture"/> with a hang guard; returns the exit code and stderr.</summary>
    private static async Task<(int Code, string Err)> RunUnder(CultureInfo culture, params string[] args) =>
        await Task.Run(() =>
        {
            var before = CultureInfo.CurrentCulture;
            CultureInfo.CurrentCulture = culture;
            try
            {
                var err = new StringWriter();
                int code = CliApp.Run(args, new StringWriter(), err);
                return (code, err.ToString());
            }
            finally { CultureInfo.CurrentCulture = before; }
        }).WaitAsync(Guard);

    public static TheoryData<string> ShippedModels() => new(RepositoryFiles.Models());

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public async Task EverySolveWritesConventionalCsv(string model)
    {
        string outDir = Path.Combine(_dir, "out");
        var (code, err) = await RunUnder(CommaCulture(), "solve", RepositoryFiles.ModelPath(model), "--out", outDir, "--detail", "summary");
        Assert.True(code == 0, err);
        AssertConventional(outDir, minimum: 1);
    }

    public static TheoryData<string, string[]> OtherCommands() => new()
    {
        { "compare", ["compare", "demo-clinic.json"] },
        { "compare-coupled", ["compare", "demo-coupled-wall.json"] },
        { "report", ["report", "demo-clinic.json"] },
        { "sweep", ["sweep", "--points", "3"] },
        { "sweep-window", ["sweep", "--points", "3", "--ends", "both", "--opening-width", "0.3", "--opening-height", "0.4"] },
        { "coupling-sweep", ["coupling-sweep", "demo-coupled-wall.json", "--depths", "0.3,0.75"] },
        { "export", ["export-matrices", "demo-clinic.json"] },
        { "export-panels", ["export-matrices", "panels/two-story-wall.json"] },
    };

    [Theory]
    [MemberData(nameof(OtherCommands))]
    public async Task EveryOtherWritingCommandWritesConventionalCsv(string name, string[] args)
    {
        string outDir = Path.Combine(_dir, name);
        var full = args.Select(a => a.EndsWith(".json", StringComparison.Ordinal) ? RepositoryFiles.ModelPath(a) : a).Concat(["--out", outDir]).ToArray();
        var (code, err) = await RunUnder(CommaCulture(), full);
        Assert.True(code == 0, err);
        AssertConventional(outDir, minimum: name == "report" ? 0 : 1);   // the report writes figures and pages; any CSV it adds is checked
    }

    [Fact]
    public async Task APlanarResponseSpectrumWritesConventionalCsv()
    {
        // No shipped planar model has a response spectrum: the generated shear building of the spectrum tests does.
        var m = SeismicModels.ShearBuilding(3.5, [800, 400, 400], [600e3, 500e3, 400e3], new
        {
            spectrum = new { SDS = 1.0, SD1 = 0.6, R = 5.0, Ie = 1.0, TL = 8.0 },
            responseSpectrum = new { Cd = 4.0 },
        });
        string model = Path.Combine(_dir, "frame.json"), outDir = Path.Combine(_dir, "spectrum");
        await File.WriteAllTextAsync(model, m.ToString()).WaitAsync(Guard);
        var (code, err) = await RunUnder(CommaCulture(), "solve", model, "--out", outDir);
        Assert.True(code == 0, err);
        Assert.True(File.Exists(Path.Combine(outDir, "response-spectrum-modes.csv")));
        AssertConventional(outDir, minimum: 1);
    }

    [Theory]
    [InlineData("demo-clinic.json")]
    [InlineData("demo-building.json")]
    public async Task TheBytesDoNotDependOnTheCulture(string model)
    {
        string a = Path.Combine(_dir, "invariant"), b = Path.Combine(_dir, "comma");
        Assert.Equal(0, (await RunUnder(CultureInfo.InvariantCulture, "solve", RepositoryFiles.ModelPath(model), "--out", a, "--detail", "summary")).Code);
        Assert.Equal(0, (await RunUnder(CommaCulture(), "solve", RepositoryFiles.ModelPath(model), "--out", b, "--detail", "summary")).Code);
        var names = Directory.GetFiles(a).Where(f => f.EndsWith(".csv", StringComparison.Ordinal) || f.EndsWith(".json", StringComparison.Ordinal))
            .Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        Assert.NotEmpty(names);
        foreach (var n in names)
            Assert.True(File.ReadAllBytes(Path.Combine(a, n!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, n!))), $"{n} differs under a decimal-comma culture");
    }

    [Fact]
    public void TheCheckerRefusesWhatTheConventionForbids()
    {
        // The checks below must be able to fail: each broken file is one a writer of this tool once produced.
        Assert.NotNull(Problem("a,b\n1,2\n\nc,d\n3,4\n"));                        // two tables in one file
        Assert.NotNull(Problem("a,b\n1,2\n\"# caution, at the end\"\n"));        // a trailing caution row
        Assert.NotNull(Problem("a,b\n1,2\n# note at the end\n"));                 // a comment after the table
        Assert.NotNull(Problem("beam_depth_m,top_deflection\n1,2\n"));            // snake-case header with its unit in the name
        Assert.NotNull(Problem("a [m],b\n\"1,5\",2\n"));                         // a decimal comma
        Assert.NotNull(Problem("a,b\n1,2,3\n"));                                  // a row wider than its header
        Assert.NotNull(Problem("a,a\n1,2\n"));                                    // a repeated column name
        Assert.NotNull(Problem("a [m] b,c\n1,2\n"));                              // the unit not at the end
        Assert.Null(Problem("# caution: for verification\n# second note\nid,x [m],y [m],kind\n\"=A\",1.5,-2E-05,n/a\n"));
    }

    /// <summary>Every *.csv under <paramref name="dir"/> (at least <paramref name="minimum"/>) meets the conventions.</summary>
    private static void AssertConventional(string dir, int minimum)
    {
        var files = Directory.Exists(dir) ? Directory.GetFiles(dir, "*.csv", SearchOption.AllDirectories) : [];
        Assert.True(files.Length >= minimum, $"{files.Length} CSV files in {dir}");
        foreach (var f in files)
        {
            string? problem = Problem(File.ReadAllText(f));
            Assert.True(problem is null, $"{Path.GetFileName(f)}: {problem}");
        }
    }

    private static readonly Regex NumberLike = new(@"^[-+]?[0-9][0-9.,]*([eE][-+]?[0-9]+)?$", RegexOptions.CultureInvariant);
    private static readonly Regex HouseHeader = new(@"^[^\[\],]+( \[[^\[\]]+\])?$", RegexOptions.CultureInvariant);
    private static readonly Regex SnakeWords = new(@"[a-z]{2,}_[a-z]{2,}", RegexOptions.CultureInvariant);

    /// <summary>What breaks the conventions in <paramref name="text"/>, or null.</summary>
    internal static string? Problem(string text)
    {
        if (text.Length == 0 || text[^1] != '\n') return "does not end with a line feed";
        // Records as a standard reader sees them, comments not skipped: the '#' lines may only lead.
        var all = CsvTextTests.Read(text, comments: false);
        int leading = 0;
        while (leading < all.Count && all[leading].Length > 0 && all[leading][0].StartsWith('#')) leading++;
        for (int i = leading; i < all.Count; i++)
            if (all[i].Length > 0 && all[i][0].StartsWith('#')) return $"record {i + 1} starts with '#' after the header: comments may only lead";
        // The same text with the comments skipped: one header, then rows exactly as wide.
        var rows = CsvTextTests.Read(text, comments: true);
        if (rows.Count == 0) return "no header row";
        if (rows.Count != all.Count - leading) return "a comment line the reader did not skip";
        var header = rows[0];
        for (int i = 1; i < rows.Count; i++)
            if (rows[i].Length != header.Length)
                return $"row {i + 1} has {rows[i].Length} cells under a header of {header.Length} (a blank line or a second table?)";
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var h in header)
        {
            if (h.Length == 0 || h != h.Trim()) return $"header cell \"{h}\" is empty or padded";
            if (!seen.Add(h)) return $"header \"{h}\" repeated";
            if (!HouseHeader.IsMatch(h)) return $"header \"{h}\" is not \"name\" or \"name [unit]\" (one unit, in brackets, at the end)";
            if (SnakeWords.IsMatch(h)) return $"header \"{h}\" joins words with '_' (house style: plain words, units in brackets)";
        }
        foreach (var row in rows.Skip(1))
            foreach (var cell in row)
            {
                if (cell is "NaN" or "Infinity" or "-Infinity" or "∞" or "-∞") return $"cell \"{cell}\": a non-finite number is written n/a";
                if (!NumberLike.IsMatch(cell)) continue;
                if (cell.Contains(',')) return $"cell \"{cell}\" has a decimal or group comma";
                if (!double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out _)) return $"cell \"{cell}\" is not an invariant-culture number";
            }
        return null;
    }
}
