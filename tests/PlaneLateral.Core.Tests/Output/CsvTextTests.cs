using System.Globalization;
using CsvHelper;
using PlaneLateral.Cli;
using PlaneLateral.Output;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// The one CSV cell writer (<see cref="CsvText"/>): quoting by RFC 4180 (Shafranovich, 2005) including CR and the
/// other control characters, and text a spreadsheet would run (=, +, -, @, tab, CR first: the OWASP advice on CSV
/// injection — common practice) given a leading apostrophe. Checked by reading back with CsvHelper, a standard reader
/// the project does not write.
/// </summary>
public sealed class CsvTextTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-csv-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>The records CsvHelper reads from <paramref name="text"/> (comments skipped when asked; blank lines kept).</summary>
    internal static List<string[]> Read(string text, bool comments = false)
    {
        var options = new CsvReaderOptions
        {
            Separator = ',', HasHeader = false, CommentPrefix = comments ? '#' : null,
            MalformedData = CsvMalformedDataHandling.Throw, SkipEmptyLines = false,
        };
        using var reader = CsvReader.FromText(text, options);
        var rows = new List<string[]>();
        while (reader.Read()) rows.Add(reader.Current.ToArray());
        return rows;
    }

    public static TheoryData<string, string> Cells() => new()
    {
        // text, what a reader must get back
        { "plain", "plain" },
        { "wind A", "wind A" },
        { "a,b", "a,b" },
        { "say \"hi\"", "say \"hi\"" },
        { "line\nbreak", "line\nbreak" },
        { "carriage\rreturn", "carriage\rreturn" },
        { "crlf\r\nid", "crlf\r\nid" },
        { "bell\u0007and\u0001start", "bell\u0007and\u0001start" },
        { "del\u007f", "del\u007f" },
        { "=1+2", "'=1+2" },
        { "=HYPERLINK(\"http://x\",\"y\")", "'=HYPERLINK(\"http://x\",\"y\")" },
        { "+N2", "'+N2" },
        { "-N3", "'-N3" },
        { "@SUM(A1)", "'@SUM(A1)" },
        { "\tcell", "'\tcell" },
        { "\rcell", "'\rcell" },
        { "-1.5", "-1.5" },       // a number stays a number
        { "+2e3", "+2e3" },
        { "-", "'-" },
        { "#1", "#1" },           // quoted: no data line starts with the comment mark
        { "grid #3", "grid #3" },
    };

    [Theory]
    [MemberData(nameof(Cells))]
    public void ACellComesBackWholeAndNeutralised(string text, string expected)
    {
        if (text.Contains('#')) Assert.StartsWith("\"", CsvText.Cell(text));
        string csv = "id,value\n" + CsvText.Cell(text) + ",1\n" + CsvText.Cell("after") + ",2\n";
        var rows = Read(csv);
        Assert.Equal(3, rows.Count);                       // the row did not break
        Assert.All(rows, r => Assert.Equal(2, r.Length));
        Assert.Equal(expected, rows[1][0]);
        Assert.Equal("after", rows[2][0]);
        Assert.False(rows[1][0].Length > 0 && CsvText.IsFormulaStart(rows[1][0][0]) && !double.TryParse(rows[1][0], NumberStyles.Float, CultureInfo.InvariantCulture, out _),
            "no text cell may start a formula");
    }

    [Fact]
    public void EveryEscaperInTheToolIsTheOne()
    {
        // The hand-written copies are gone: no source file quotes by hand with the old one-liner.
        string src = Path.GetFullPath(Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "src"));
        if (!Directory.Exists(src)) return;   // run outside the repository: nothing to look at
        var copies = Directory.GetFiles(src, "*.cs", SearchOption.AllDirectories)
            .Where(f => File.ReadAllText(f).Contains("IndexOfAny([',', '\"', '\\n'])"))
            .Select(Path.GetFileName).ToList();
        Assert.Empty(copies);
    }

    /// <summary>
    /// The demo with formula-like ids, commas and quotes in them: every CSV file the solve writes reads back with a
    /// standard reader, every row as wide as its header (the caution row aside), and no text cell starts a formula.
    /// </summary>
    [Fact]
    public void HostileIdsReachNoSpreadsheetAsFormulasAndBreakNoRow()
    {
        string json = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json"))
            .Replace("\"W1-L1\"", "\"=W1,L1\"")
            .Replace("\"WALL1-S1\"", "\"+WALL \\\"one\\\"\"")
            .Replace("\"L2\"", "\"@L2\"")
            .Replace("\"F3A-L1\"", "\"-F3A-L1\"")
            .Replace("\"W\"", "\"=1+1\"");
        string model = Path.Combine(_dir, "hostile.json"), outDir = Path.Combine(_dir, "out");
        File.WriteAllText(model, json);
        var err = new StringWriter();
        int code = CliApp.Run(["solve", model, "--out", outDir], new StringWriter(), err);
        Assert.True(code == 0, err.ToString());
        var seen = new HashSet<string>();
        foreach (var file in Directory.GetFiles(outDir, "*.csv"))
        {
            var rows = Read(File.ReadAllText(file), comments: true);
            Assert.NotEmpty(rows);
            int width = -1;
            foreach (var r in rows)
            {
                if (r.Length == 1 && r[0].StartsWith("# ", StringComparison.Ordinal)) continue;   // the caution row
                if (r.Length == 1 && r[0] == "") { width = -1; continue; }                         // a blank line: a second table follows
                if (width < 0) width = r.Length;                                                     // its header
                Assert.True(r.Length == width, $"{Path.GetFileName(file)}: a row of {r.Length} cells under a header of {width}");
                foreach (var cell in r)
                {
                    seen.Add(cell);
                    Assert.False(cell.Length > 0 && CsvText.IsFormulaStart(cell[0]) && !double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out _),
                        $"{Path.GetFileName(file)}: the cell {cell} would run as a formula");
                }
            }
        }
        Assert.Contains("'=W1,L1", seen);
        Assert.Contains("'+WALL \"one\"", seen);
        Assert.Contains("'=1+1", seen);
    }
}
