using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// Every command prints its answers first: a summary of at most 15 lines, then the tables, every line within 100
/// columns; the summary's figures are the run's numbers. Each command runs under a hang guard.
/// </summary>
public class AnswersFirstTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "pl-answers-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
        GC.SuppressFinalize(this);
    }

    private async Task<(int Code, string Out, string Err)> Cli(params string[] args) =>
        await Task.Run(() => CliRun.Run(args)).WaitAsync(TimeSpan.FromSeconds(120));

    public static TheoryData<string> ShippedModels() => new(RepositoryFiles.Models());

    private static List<string> SummaryOf(string output)
    {
        var lines = output.Split('\n').ToList();
        int start = lines.IndexOf("Summary");
        Assert.True(start >= 0 && start <= 2, "the summary comes first:\n" + output);
        return lines.Skip(start).TakeWhile(l => l.Length > 0).ToList();
    }

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public async Task EveryShippedModelPrintsASummaryFirstAndEveryLineFitsOneHundredColumns(string model)
    {
        var (code, output, err) = await Cli("solve", RepositoryFiles.ModelPath(model), "-o", Path.Combine(_dir, model.Replace('/', '_')));
        Assert.True(code == 0, err);
        var summary = SummaryOf(output);
        Assert.InRange(summary.Count, 5, 15);
        Assert.Contains(summary, l => l.StartsWith("  Checks      passed", StringComparison.Ordinal));
        Assert.Contains(summary, l => l.StartsWith("  Drift ", StringComparison.Ordinal));
        Assert.Contains(summary, l => l.StartsWith("  Solver ", StringComparison.Ordinal));
        var wide = output.Split('\n').Where(l => l.Length > 100).ToList();
        Assert.True(wide.Count == 0, "lines over 100 columns:\n" + string.Join("\n", wide));
    }

    [Fact]
    public async Task TheSummaryOfTheDemoClinicCarriesTheRunsNumbers()
    {
        string path = RepositoryFiles.ModelPath("demo-clinic.json");
        var run = ModelRun.Run(ModelReader.ReadFile(path));
        var (code, output, err) = await Cli("solve", path, "-o", Path.Combine(_dir, "clinic"), "--detail", "summary");
        Assert.True(code == 0, err);
        var summary = string.Join("\n", SummaryOf(output));

        // The governing drift: the largest ratio over its allowable, first- and second-order checks together.
        var d = run.Building.DriftChecks.Concat(run.Seismic!.SecondOrderDriftChecks).MaxBy(x => x.Ratio / x.Allowed)!;
        string P(double v) => (100 * v).ToString("0.000", CultureInfo.InvariantCulture) + " %";
        Assert.Contains($"within: {P(d.Ratio)} of {P(d.Allowed)} allowed, story {d.Story.Index}, case {d.CaseId}", summary);
        Assert.Contains($"backward error {run.Analysis.Cases.Max(c => c.BackwardError).ToString("0.0E+0", CultureInfo.InvariantCulture)}", summary);
        var theta = run.Seismic.Stability.MaxBy(x => x.Theta)!;
        Assert.Contains($"θ max {theta.Theta.ToString("0.0000", CultureInfo.InvariantCulture)} (story {theta.Story.Index})", summary);
        Assert.Contains(run.Solver, summary);
        Assert.Contains($"{run.Factorizations} matrices factorised", summary);
        // Summary detail: no tables after it.
        Assert.DoesNotContain("Details", output);
        Assert.DoesNotContain("-----", output);
        Assert.Contains("Caution:", output);
    }

    [Fact]
    public async Task TheDemoBuildingInPlanIsSummarisedWithItsCornerDrift()
    {
        // The building the no-argument run solves, through the same command path.
        string path = RepositoryFiles.ModelPath("demo-building.json");
        var (plan, _) = PlanSeismic.Run(ModelReader.ReadPlanFile(path));   // as solve does: with the seismic block's cases
        var d = plan.DriftChecks.MaxBy(x => x.Ratio / x.Allowed)!;
        var (code, output, err) = await Cli("solve", path, "-o", Path.Combine(_dir, "building"), "--detail", "summary");
        Assert.True(code == 0, err);
        var summary = string.Join("\n", SummaryOf(output));
        string P(double v) => (100 * v).ToString("0.000", CultureInfo.InvariantCulture) + " %";
        Assert.Contains($"corner drift {P(d.Ratio)} of {P(d.Allowed)} allowed, story {d.Story}, case {d.Case}, corner {d.Vertex + 1}", summary);
        Assert.Contains($"worst backward error {plan.WorstBackwardError.ToString("0.0E+0", CultureInfo.InvariantCulture)}", summary);
        Assert.Contains("Hand vs FE", summary);
        Assert.All(output.Split('\n'), l => Assert.True(l.Length <= 100, l));
    }

    [Theory]
    [InlineData("solve")]
    [InlineData("compare")]
    [InlineData("report")]
    public async Task AnUnknownDetailLevelIsRefusedWithTheUsageExitCode(string command)
    {
        var (code, output, err) = await Cli(command, RepositoryFiles.ModelPath("demo-clinic.json"), "-o", Path.Combine(_dir, command), "--detail", "everything");
        Assert.Equal(1, code);
        Assert.Contains("--detail \"everything\" is not a detail level", err);
        Assert.Contains("summary", err);
        Assert.Equal("", output);
        Assert.False(Directory.Exists(Path.Combine(_dir, command)));
    }
}
