using PlaneLateral.Cli;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Plan;

/// <summary>
/// Every plan-*.csv a building run writes is one <see cref="ResultTable"/> (docs/plan.md; one table model for the files,
/// the console and the report): the solve command's file is byte for byte the table's <see cref="ResultTable.ToCsv"/>,
/// no plan-*.csv is written without a table and no table without its file, and each table is rectangular (every row as
/// wide as its columns). Run on every shipped building.
/// </summary>
public sealed class PlanTableFilesTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(120);   // hang guard, not a timing
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-plantables-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    public static TheoryData<string> Buildings() => new(["demo-building.json", .. RepositoryFiles.Models("plan")]);

    [Theory]
    [MemberData(nameof(Buildings))]
    public async Task EveryPlanCsvIsItsTable(string building)
    {
        string path = RepositoryFiles.ModelPath(building), outDir = Path.Combine(_dir, "out");
        var (code, err, run) = await Task.Run(() =>
        {
            var e = new StringWriter();
            int c = CliApp.Run(["solve", path, "--out", outDir, "--detail", "summary"], new StringWriter(), e);
            return (c, e.ToString(), PlanRun.Run(ModelReader.ReadPlanFile(path)));
        }).WaitAsync(Guard);
        Assert.True(code == 0, err);

        var tables = PlanFiles.Tables(run.Result, run.Tributary)
            .Concat(run.Seismic is null ? [] : PlanSeismicFiles.Tables(run.Result, run.Seismic)).ToList();
        var csv = Directory.GetFiles(outDir, "*.csv").Select(Path.GetFileName).ToList();
        Assert.All(csv, n => Assert.True(n!.StartsWith("plan-", StringComparison.Ordinal) || n.StartsWith("line-", StringComparison.Ordinal), $"{n}: a CSV of no known table"));
        Assert.Equal(tables.Select(t => t.Name).Order(StringComparer.Ordinal), csv.Where(n => n!.StartsWith("plan-", StringComparison.Ordinal)).Order(StringComparer.Ordinal));
        foreach (var (name, table) in tables)
        {
            Assert.Equal(table.ToCsv(), File.ReadAllText(Path.Combine(outDir, name)));
            Assert.All(table.Rows, row => Assert.Equal(table.Columns.Count, row.Count));
        }
    }
}
