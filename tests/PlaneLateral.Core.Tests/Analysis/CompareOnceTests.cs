using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Solvers;
using PlaneLateral.Studies;
using PlaneLateral.Tests.Input;
using CountingSolver = PlaneLateral.Tests.Analysis.ComputeOnceTests.CountingSolver;

namespace PlaneLateral.Tests.Analysis;

/// <summary>
/// The comparison studies reuse their run: the whole model's static results come from the run (solve, report) or are
/// solved once (compare), every sub-model a check builds is solved with the solver the user chose, and no matrix is
/// factorised twice. The counting solver is the user's choice here: a study that fell back to the default solver would
/// make factorisations it never sees, so the count would drop below the one measured; a matrix factorised twice shows
/// as a fingerprint seen twice. Counts measured on the shipped models (docs/comparisons.md, "Work done once").
/// </summary>
public class CompareOnceTests
{
    /// <summary>Every shipped planar model that declares comparison checks.</summary>
    public static TheoryData<string> ShippedModelsWithChecks()
    {
        var data = new TheoryData<string>();
        string root = Path.GetDirectoryName(RepositoryFiles.ModelPath("demo-clinic.json"))!;
        foreach (var f in Directory.GetFiles(root, "*.json", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            if (ModelReader.IsPlanFile(f)) continue;
            string text = File.ReadAllText(f);
            if (text.Contains("\"comparisons\"", StringComparison.Ordinal)) data.Add(Path.GetRelativePath(root, f).Replace('\\', '/'));
        }
        return data;
    }

    private static StructureModel Read(string relative) => ModelReader.ReadFile(RepositoryFiles.ModelPath(relative));

    private static string Sizes(CountingSolver c) => string.Join(", ", c.Seen.Select(s => $"{s.Size}/{s.NonZeros}"));

    [Theory]
    [MemberData(nameof(ShippedModelsWithChecks))]
    public void CompareFactorisesEachMatrixOnceWithTheUsersSolver(string relative)
    {
        var model = Read(relative);
        Assert.NotEmpty(model.Comparisons);
        var counter = new CountingSolver(DefaultSolver.Create());
        var report = ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, new AnalysisOptions { Solver = counter });
        Assert.NotEmpty(report.Rows);
        Assert.True(counter.Count > 0, $"{relative}: no factorisation reached the user's solver");
        Assert.True(counter.Count == counter.Distinct, $"{relative}: {counter.Count} factorisations of {counter.Distinct} distinct matrices ({Sizes(counter)})");
    }

    [Theory]
    [MemberData(nameof(ShippedModelsWithChecks))]
    public void ComparisonsAfterARunReuseItsFactors(string relative)
    {
        // solve and report: the run first, then the checks on the run. The whole model's K is factorised once (by the
        // run), never again by a study, and nothing is factorised twice over the run and its checks together.
        var model = Read(relative);
        var counter = new CountingSolver(DefaultSolver.Create());
        var run = ModelRun.Run(model, new AnalysisOptions { Solver = counter });
        int byRun = counter.Count;
        var whole = counter.Seen[0].Fingerprint;   // stage 1 of the run: the whole model's K
        ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run);
        Assert.Equal(1, counter.Seen.Count(s => s.Fingerprint == whole));
        Assert.True(counter.Count == counter.Distinct, $"{relative}: {counter.Count} factorisations of {counter.Distinct} distinct matrices ({Sizes(counter)})");
        Assert.Equal(byRun, run.Factorizations);
    }

    /// <summary>
    /// Factorisations per shipped model, measured after this change (before it, with a counter on every factorisation:
    /// compare 22, 6, 34, 10, 5; report 24, 7, 36, 11, 9). Fewer here means a study bypassed the user's solver.
    /// </summary>
    [Theory]
    [InlineData("demo-clinic.json", 22, 23)]
    [InlineData("demo-coupled-wall.json", 3, 4)]
    [InlineData("footings/clinic-on-footing.json", 32, 33)]
    [InlineData("footings/wall-on-footing.json", 10, 10)]
    [InlineData("panels/squat-wall.json", 5, 6)]
    public void EveryFactorisationOfTheChecksReachesTheUsersSolver(string relative, int compare, int runAndChecks)
    {
        var model = Read(relative);
        var alone = new CountingSolver(DefaultSolver.Create());
        ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, new AnalysisOptions { Solver = alone });
        Assert.True(compare == alone.Count, $"{relative}: compare made {alone.Count} factorisations through the user's solver, expected {compare} ({Sizes(alone)})");

        var counter = new CountingSolver(DefaultSolver.Create());
        var run = ModelRun.Run(model, new AnalysisOptions { Solver = counter });
        ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run);
        Assert.True(runAndChecks == counter.Count, $"{relative}: the run and its checks made {counter.Count} factorisations through the user's solver, expected {runAndChecks} ({Sizes(counter)})");
    }

    [Fact]
    public void ADenseSolverChosenByTheUserRunsTheChecksToTheSameNumbers()
    {
        // The user's solver reaches every check: a dense solver in place of the default gives the same rows to round-off
        // (common practice: both are direct solvers of an SPD system) and sees every factorisation the default did.
        // The wall on its footing: line members only (small matrices, fit for a dense solver).
        var model = Read("footings/wall-on-footing.json");
        var dense = new CountingSolver(new DenseLdlSolver());
        var withDense = ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, new AnalysisOptions { Solver = dense });
        var reference = ComparisonStudy.Run(model);
        Assert.Equal(10, dense.Count);
        Assert.All(dense.Seen, s => Assert.True(s.Size < 100));
        Assert.Equal(reference.Rows.Count, withDense.Rows.Count);
        for (int i = 0; i < reference.Rows.Count; i++)
            for (int j = 0; j < reference.Rows[i].Fe.Count; j++)
                Assert.Equal(reference.Rows[i].Fe[j].Value, withDense.Rows[i].Fe[j].Value, Math.Abs(reference.Rows[i].Fe[j].Value) * 1e-8);
    }
}
