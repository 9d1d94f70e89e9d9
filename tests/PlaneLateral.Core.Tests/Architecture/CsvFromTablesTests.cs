using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Architecture;

/// <summary>
/// Every CSV file the planar results, the comparisons and the matrix export write is a <see cref="ResultTable"/>
/// (issue 20, "one table model"): for every shipped planar model, the *.csv files of each writer, in order, are exactly
/// the files its <c>Tables</c> list names, byte for byte each table's <see cref="ResultTable.ToCsv"/>. A CSV added to a
/// writer by hand (a StringBuilder header and rows) is not in the list, and this fails. (Common practice: architecture
/// rules written as tests.)
/// </summary>
public sealed class CsvFromTablesTests
{
    public static TheoryData<string> PlanarModels() =>
        new(RepositoryFiles.Models().Where(m => !ModelReader.IsPlanFile(RepositoryFiles.ModelPath(m))));

    private static void AssertSame(IEnumerable<(string Name, string Text)> files, IReadOnlyList<CsvTableFile> tables, string what)
    {
        var csv = files.Where(f => f.Name.EndsWith(".csv", StringComparison.Ordinal)).ToList();
        Assert.True(csv.Select(f => f.Name).SequenceEqual(tables.Select(t => t.Name)),
            $"{what}: CSV files [{string.Join(", ", csv.Select(f => f.Name))}] but tables [{string.Join(", ", tables.Select(t => t.Name))}]");
        for (int i = 0; i < csv.Count; i++) Assert.True(csv[i].Text == tables[i].Table.ToCsv(), $"{what}: {csv[i].Name} is not its table's CSV");
    }

    [Theory]
    [MemberData(nameof(PlanarModels))]
    public async Task EveryCsvOfAShippedModelIsWrittenFromATable(string relative) => await Task.Run(() =>
    {
        var model = ModelReader.ReadFile(RepositoryFiles.ModelPath(relative));
        var run = ModelRun.Run(model);
        AssertSame(ResultFiles.Render(run), ResultFiles.CsvTables(run), $"{relative}, results");
        if (model.Comparisons.Count > 0)
        {
            var report = ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run);
            AssertSame(ComparisonFiles.Render(report, "test"), ComparisonFiles.Tables(report), $"{relative}, comparisons");
        }
        var exported = LinearStaticAnalysis.Run(model);
        AssertSame(MatrixExportFiles.Render(exported), MatrixExportFiles.Tables(exported), $"{relative}, matrix export");
    }).WaitAsync(TimeSpan.FromMinutes(5));   // a generous hang guard, not a timing
}
