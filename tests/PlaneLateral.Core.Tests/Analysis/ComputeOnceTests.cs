using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Solvers;
using PlaneLateral.Studies;
using PlaneLateral.Tests.Input;
using PlaneLateral.Tests.Seismic;

namespace PlaneLateral.Tests.Analysis;

/// <summary>
/// One run factorises each distinct matrix once, with the solver the user chose, and the files read the run without
/// factorising anything. The counting solver belongs to each test (no shared state between tests run in parallel).
/// </summary>
public class ComputeOnceTests
{
    /// <summary>Counts the factorisations handed to it and remembers each matrix's fingerprint (order, pattern, values).</summary>
    internal sealed class CountingSolver(ISparseSpdSolver inner) : ISparseSpdSolver
    {
        private readonly Lock _gate = new();
        public List<(int Size, int NonZeros, string Fingerprint)> Seen { get; } = [];
        public string Description => inner.Description;
        public string DescriptionFor(int size) => inner.DescriptionFor(size);

        public ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10)
        {
            var hash = new HashCode();
            hash.Add(matrix.Size);
            foreach (int c in matrix.ColumnPointers) hash.Add(c);
            for (int k = 0; k < matrix.NonZerosLower; k++) { hash.Add(matrix.RowIndices[k]); hash.Add(BitConverter.DoubleToInt64Bits(matrix.Values[k])); }
            lock (_gate) Seen.Add((matrix.Size, matrix.NonZerosLower, $"{matrix.Size}/{matrix.NonZerosLower}/{hash.ToHashCode()}"));
            return inner.Factorize(matrix, relativePivotTolerance);
        }

        public int Count { get { lock (_gate) return Seen.Count; } }
        public int Distinct { get { lock (_gate) return Seen.Select(s => s.Fingerprint).Distinct().Count(); } }
    }

    private static (ModelResult Run, CountingSolver Counter) Run(StructureModel model, ISparseSpdSolver? inner = null)
    {
        var counter = new CountingSolver(inner ?? DefaultSolver.Create());
        return (ModelRun.Run(model, new AnalysisOptions { Solver = counter }), counter);
    }

    [Fact]
    public void TheDemoClinicFactorisesEachOfItsFourMatricesOnce()
    {
        // Before the run object one solve of this model factorised 31 times (measured with a counter in the solvers).
        // Its distinct matrices (derived from the model): K of the frame (27 unknowns), K + K_G of the gravity case for
        // the second-order drift, and the two lines each standing alone (the wall 9, the frame 21 unknowns).
        var (run, counter) = Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("demo-clinic.json")));
        Assert.NotNull(run.Seismic);
        Assert.NotEmpty(run.Seismic!.Stability);
        Assert.Equal(4, counter.Count);
        Assert.Equal(4, counter.Distinct);
        Assert.Equal([9, 21, 27, 27], counter.Seen.Select(s => s.Size).Order().ToArray());
        Assert.Equal(4, run.Factorizations);
        Assert.True(run.FactorizationRequests >= run.Factorizations);

        // Writing every results file reads the run: not one more factorisation.
        var files = ResultFiles.Render(run);
        Assert.Contains(files, f => f.Name == "second-order.csv");
        Assert.Contains(files, f => f.Name == "line-split.csv");
        Assert.Equal(4, counter.Count);
    }

    [Fact]
    public void AWallLinkedToAFrameFactorisesEachMatrixOnce()
    {
        // Before: 24 factorisations in one solve. Distinct matrices (derived): the frame with the panel condensed in
        // (14 unknowns), the panel's interior with its link segments held (condensation and recovery share it), the panel
        // on its own base for its top stiffness (in the whole and in its line alone alike), and the two lines alone.
        var (run, counter) = Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("panels/masonry-wall-and-frame.json")));
        Assert.NotNull(run.Analysis.PanelLinks);
        Assert.Equal(counter.Distinct, counter.Count);
        Assert.Equal(5, counter.Count);
    }

    /// <summary>
    /// What `report` (and the no-argument demo's `solve`) runs: the model's run, then its comparison checks, on one set of
    /// options, so that one solver sees every factorisation of the run.
    /// </summary>
    private static (ModelResult Run, ComparisonReport? Checks, CountingSolver Counter, int ChecksRequests) Report(StructureModel model)
    {
        var counter = new CountingSolver(DefaultSolver.Create());
        var options = AnalysisOptions.ForRun(new AnalysisOptions { Solver = counter });
        var run = ModelRun.Run(model, options);
        var checks = model.Comparisons.Count > 0 ? ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run) : null;
        return (run, checks, counter, ((FactorOnceSolver)options.Solver!).Requests - run.FactorizationRequests);
    }

    [Theory]
    [InlineData("panels/masonry-wall-and-frame.json")]
    [InlineData("panels/squat-wall.json")]
    [InlineData("panels/two-story-wall.json")]
    [InlineData("panels/wall-in-frame.json")]
    [InlineData("footings/panel-on-footing.json")]
    public void EveryShippedPanelModelFactorisesEachDistinctMatrixOnceInSolveAndReport(string relative)
    {
        // `solve`: the run alone. Every panel's meshes are among the matrices the counter saw, each once.
        var model = ModelReader.ReadFile(RepositoryFiles.ModelPath(relative));
        var (run, counter) = Run(model);
        Assert.NotEmpty(run.Analysis.Panels);
        Assert.Equal(counter.Distinct, counter.Count);
        foreach (var p in run.Analysis.Panels)   // a standalone panel's meshes (a linked panel's are its interior, not checked here)
            foreach (int size in p.Convergence?.Unknowns ?? (run.Analysis.PanelLinks is null ? [p.Analysis.Solve.Unknowns] : []))
                Assert.Contains(counter.Seen, s => s.Size == size);
        Assert.Equal(run.Factorizations, counter.Count);
        // `report`: the checks on the run's solver add no factorisation of a matrix the run made.
        var (run2, _, counter2, _) = Report(model);
        Assert.Equal(counter2.Distinct, counter2.Count);
        Assert.True(counter2.Count >= run2.Factorizations);
    }

    [Fact]
    public void TheCoupledWallDemoFactorisesItsPanelOnceForBothLoads()
    {
        // demo-coupled-wall.json: a coupled-wall check with a uniform and a top load. The plane-stress panel of the wall
        // (about 21,000 unknowns) is one matrix under both loads; it was assembled and factorised once per load.
        var model = ModelReader.ReadFile(RepositoryFiles.ModelPath("demo-coupled-wall.json"));
        var (_, checks, counter, _) = Report(model);
        Assert.Contains(checks!.Rows, r => r.Fe.Any(f => f.Model == "plane-stress panel"));
        Assert.Equal(2, CoupledWallStudy.Loads((CoupledWallCheck)model.Comparisons[0]).Count());
        var big = counter.Seen.Where(s => s.Size > 10_000).ToArray();
        Assert.Single(big);
        Assert.Equal(counter.Distinct, counter.Count);
    }

    [Fact]
    public void IndependentPanelsOfOneModelSolvedSideBySideEqualEachSolvedAlone()
    {
        // Two standalone panels (the two-story wall and a copy with other openings, 10 m along): the run solves them in
        // parallel; each result is bitwise the panel's own analysis (common practice: the output depends on the input only).
        var json = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("panels/two-story-wall.json")));
        var panels = (Newtonsoft.Json.Linq.JArray)json["panels"]!;
        var second = (Newtonsoft.Json.Linq.JObject)panels[0].DeepClone();
        second["id"] = "south wall";
        second["x"] = 10;
        ((Newtonsoft.Json.Linq.JArray)second["openings"]!).RemoveAt(2);
        panels.Add(second);
        var model = ModelReader.Parse(json.ToString(), "two-panels.json");
        var (run, counter) = Run(model);
        Assert.Equal(2, run.Analysis.Panels.Count);
        Assert.Equal(counter.Distinct, counter.Count);
        string[] cases = model.LoadCases.Select(c => c.Id).ToArray();
        for (int i = 0; i < 2; i++)
        {
            var got = run.Analysis.Panels[i];
            var alone = PanelAnalysis.Run(model.Panels[i], cases, null, model.SourcePath, model.Combinations);
            Assert.Equal(model.Panels[i].Id, got.Panel.Id);
            Assert.Equal(BitConverter.DoubleToInt64Bits(alone.TopStiffness), BitConverter.DoubleToInt64Bits(got.TopStiffness));
            Assert.Equal(alone.Convergence!.Stiffness, got.Convergence!.Stiffness);
            Assert.Equal(alone.LevelDisplacements, got.LevelDisplacements);
        }
        Assert.NotEqual(run.Analysis.Panels[0].TopStiffness, run.Analysis.Panels[1].TopStiffness);
    }

    [Fact]
    public void ASeismicModelWithSecondOrderFactorisesKAndKPlusKgOnceEach()
    {
        // Two-story shear building, one line (no line-alone split): K for the statics, the periods and the story forces;
        // K + K_G of gravity "G" for the buckling check and the second-order drift.
        var json = SeismicModels.ShearBuilding(3.0, [4000, 400], [500e3, 500e3], new { baseShear = 100e3, secondOrder = new { gravity = "G", Cd = 4.0 } });
        json["loadCases"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "G", nodalLoads = new[] { new { node = "A2", fy = -100e3 }, new { node = "B2", fy = -100e3 } } } });
        var (run, counter) = Run(ModelReader.Parse(json.ToString(), "two-story.json"));
        Assert.NotEmpty(run.Seismic!.Stability);
        Assert.Empty(run.LineSplit);
        Assert.Equal(2, counter.Count);
        Assert.Equal(2, counter.Distinct);
        Assert.Equal(counter.Seen[0].Size, counter.Seen[1].Size);
    }

    [Fact]
    public void TheSolverTheUserChoseRunsEveryStage()
    {
        // A dense solver in place of the default: every one of the demo's four factorisations reaches it (had a stage
        // fallen back to the default solver, the counter would see fewer), and the run names it as what ran.
        var dense = new DenseLdlSolver();
        var (run, counter) = Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("demo-clinic.json")), dense);
        Assert.Equal(4, counter.Count);
        Assert.Equal(dense.Description, run.Solver);
        Assert.Equal(dense.Description, run.Analysis.Solve.Solver);
        // Same answers as the default solver, to round-off (common practice: both are direct solvers of an SPD system).
        var (reference, _) = Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("demo-clinic.json")));
        for (int c = 0; c < run.Analysis.Cases.Count; c++)
            for (int j = 0; j < run.Analysis.Cases[c].Displacements.Length; j++)
                Assert.Equal(reference.Analysis.Cases[c].Displacements[j], run.Analysis.Cases[c].Displacements[j], 1e-12);
        Assert.Equal(reference.Seismic!.Stability[0].SecondOrderDrift, run.Seismic!.Stability[0].SecondOrderDrift, 1e-12);
    }

    [Fact]
    public void TheRunsResultsEqualTheStandAloneAnalyses()
    {
        // The staged run gives the numbers the separate entry points give (these factorise again on their own).
        var model = ModelReader.ReadFile(RepositoryFiles.ModelPath("demo-clinic.json"));
        var (run, _) = Run(model);
        var alone = LinearStaticAnalysis.Run(model);
        Assert.Equal(alone.Cases.Select(c => c.Displacements).ToArray(), run.Analysis.Cases.Select(c => c.Displacements).ToArray());
        var seismic = SeismicResult.Of(alone)!;
        Assert.Equal(seismic.Forces.BaseShear, run.Seismic!.Forces.BaseShear);
        Assert.Equal(seismic.Stability.Select(s => s.SecondOrderDrift), run.Seismic.Stability.Select(s => s.SecondOrderDrift));
        Assert.Equal(seismic.CriticalLoadFactor, run.Seismic.CriticalLoadFactor);
        var split = LineAlone.SplitAll(alone, BuildingResult.Of(alone).Cases, out _);
        Assert.Equal(split.SelectMany(s => s.Rows), run.LineSplit.SelectMany(s => s.Rows));
    }
}
