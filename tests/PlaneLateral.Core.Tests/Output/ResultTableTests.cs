using System.Globalization;
using CsvHelper;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// The story and drift tables are built once (<see cref="BuildingTables"/>) and written to CSV and the console from that
/// one model: each CSV reads back with a standard reader as one rectangular table with one header row, its numbers are
/// the run's, and the console shows the same rows.
/// </summary>
public class ResultTableTests
{
    private static List<string[]> Read(string text)
    {
        var options = new CsvReaderOptions { Separator = ',', HasHeader = false, MalformedData = CsvMalformedDataHandling.Throw };
        using var reader = CsvReader.FromText(text, options);
        var rows = new List<string[]>();
        while (reader.Read()) rows.Add(reader.Current.ToArray());
        return rows;
    }

    private static readonly Lazy<ModelResult> Clinic = new(() => ModelRun.Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("demo-clinic.json"))));

    [Fact]
    public void TheStoryTableIsOneRectangularCsvWithTheRunsNumbers()
    {
        var run = Clinic.Value;
        var table = BuildingTables.Stories(run);
        var rows = Read(table.ToCsv());
        Assert.Equal(table.Columns.Select(c => c.Header), rows[0]);
        Assert.All(rows, r => Assert.Equal(table.Columns.Count, r.Length));
        Assert.Equal(run.Building.Cases.Sum(c => c.Stories.Count), rows.Count - 1);
        // Story 2 of case E: its drift in the model's units (inches) as the run computed it.
        var e2 = run.Building.Cases.First(c => c.CaseId == "E").Stories[1];
        var row = rows.Single(r => r[0] == "E" && r[2] == "2");
        Assert.Equal(run.Model.Units.FromSI(e2.Drift, PlaneLateral.Units.Quantity.Length), double.Parse(row[table.Column("drift")], CultureInfo.InvariantCulture), 1e-11);
        Assert.Equal("drift [in]", table.Columns[table.Column("drift")].Header);
        // The same table is the one the files carry.
        Assert.Equal(table.ToCsv(), ResultFiles.Render(run).Single(f => f.Name == "stories.csv").Text);
    }

    [Fact]
    public void TheDriftTableIsOneRectangularCsvAndTheConsoleShowsItsRows()
    {
        var run = Clinic.Value;
        var table = BuildingTables.DriftChecks(run);
        var rows = Read(table.ToCsv());
        Assert.All(rows, r => Assert.Equal(table.Columns.Count, r.Length));
        Assert.Equal(run.Building.DriftChecks.Count, rows.Count - 1);
        Assert.Equal(table.ToCsv(), ResultFiles.Render(run).Single(f => f.Name == "drift-checks.csv").Text);
        var worst = run.Building.DriftChecks.MaxBy(d => d.Ratio)!;
        Assert.Contains(rows.Skip(1), r => r[1] == worst.CaseId && double.Parse(r[table.Column("drift ratio")], CultureInfo.InvariantCulture) == double.Parse(worst.Ratio.ToString("G12", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture));

        string console = PlaneLateral.Cli.TableView.Render(table, ["check", "case", "story", "drift ratio", "result", "margin"]);
        var lines = console.Split('\n').Where(l => l.Length > 0).ToList();
        Assert.All(lines, l => Assert.True(l.Length <= 100, l));
        int dash = lines.FindIndex(l => l.TrimStart().StartsWith("---", StringComparison.Ordinal));
        Assert.Equal(run.Building.DriftChecks.Count, lines.Count - dash - 1);   // these columns fit: one part, no notes
        Assert.Contains(lines, l => l.Contains("seismic, story forces", StringComparison.Ordinal));
    }
}
