using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using MathNet.Numerics.LinearAlgebra.Double;
using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The steps of <see cref="PlanAnalysis.Run"/> on the invented 40-story, 24-line building of <see cref="PlanTower"/>
/// (12 walls, 12 three-bay frames, 6 load cases): the condensation of one wall line, of one frame line and of all 24
/// (each line factorised once and solved for a unit force at each of its 40 levels); the floor solve (assembly of
/// K = Σ Tᵀ K̂ T on 120 floor DOFs, the stability check's eigenvalues, the Cholesky factors with and without floor
/// rotation, the 6 cases); the recovery of all 24 lines under the level forces the floors put on them (on the factors
/// the condensation made, kept by the run's solver, as in Run); and the whole Run. ShortRun job in process (3
/// iterations, no separate build: the machine is shared). [MemoryDiagnoser] gives the bytes allocated per operation.
/// </summary>
[MemoryDiagnoser]
[Config(typeof(PlanConfig))]
public class PlanBenchmarks
{
    private sealed class PlanConfig : ManualConfig
    {
        public PlanConfig() => AddJob(Job.ShortRun.WithToolchain(InProcessEmitToolchain.Instance).WithId("ShortRun-InProcess"));
    }

    private BuildingPlan _plan = null!;
    private int _n;
    private PlanLine _wall = null!, _frame = null!;
    private List<PlanAnalysis.Condensation> _condensed = null!;
    private AnalysisOptions _run = null!;
    private double[][][] _forces = null!;
    private List<double[]>[] _expected = null!;
    private List<string> _ids = null!;
    private List<PlanLineResult> _recovered = null!;

    [GlobalSetup]
    public void Setup()
    {
        _plan = ModelReader.ParsePlan(PlanTower.Json(), "plan-tower.json");
        _n = _plan.FloorCount;
        _wall = _plan.Lines.First(l => l.Id == "WX1");
        _frame = _plan.Lines.First(l => l.Id == "FX1");
        // The run's solver keeps each line's factor from the condensation: the recovery below solves on them, as Run does.
        _run = AnalysisOptions.ForRun(null);
        _condensed = _plan.Lines.Select(l => PlanAnalysis.Condense(l, _n, _run)).ToList();
        var u = FloorSolve();
        _ids = _plan.Cases.Select(c => c.Id).ToList();
        _forces = _plan.Lines.Select((line, i) => u.Select(ui => PlaneLateral.Elements.SmallMatrix.Times(_condensed[i].K, PlanAnalysis.Project(line, ui, _n))).ToArray()).ToArray();
        _expected = _plan.Lines.Select(line => u.Select(ui => PlanAnalysis.Project(line, ui, _n)).ToList()).ToArray();
        _recovered = _plan.Lines.Select((l, i) => PlanAnalysis.Recover(l, _condensed[i], _ids, _forces[i], _expected[i], _run)).ToList();
    }

    [Benchmark(Description = "condense one wall line (40 members)")]
    public PlanAnalysis.Condensation CondenseWall() => PlanAnalysis.Condense(_wall, _n, AnalysisOptions.ForRun(null));

    [Benchmark(Description = "condense one frame line (280 members)")]
    public PlanAnalysis.Condensation CondenseFrame() => PlanAnalysis.Condense(_frame, _n, AnalysisOptions.ForRun(null));

    [Benchmark(Description = "condense all 24 lines")]
    public int CondenseAll()
    {
        var options = AnalysisOptions.ForRun(null);
        return _plan.Lines.Select(l => PlanAnalysis.Condense(l, _n, options)).Count();
    }

    /// <summary>The floor stage of <see cref="PlanAnalysis.Run"/>: the same calls, in the same order, on the kept condensations.</summary>
    [Benchmark(Description = "floor solve (assemble + check + 2 Cholesky + 6 cases)")]
    public double[][] FloorSolve()
    {
        var k = PlanAnalysis.Assemble(_plan.Lines, _condensed.Select(c => c.K).ToList(), _n);
        double size = _plan.Size;
        PlanAnalysis.CheckStable(_plan, k, size);
        var scaled = PlanAnalysis.Scaled(k, _n, size);
        var chol = DenseMatrix.OfArray(scaled).Cholesky();
        var locked = PlanAnalysis.Translational(k, _n);
        var lockedChol = DenseMatrix.OfArray(locked).Cholesky();
        var result = new double[_plan.Cases.Count][];
        for (int ci = 0; ci < _plan.Cases.Count; ci++)
        {
            var f = PlanAnalysis.LoadVector(_plan.Cases[ci], _n);
            var fs = (double[])f.Clone();
            for (int l = 0; l < _n; l++) fs[3 * l + 2] /= size;
            var u = chol.Solve(DenseVector.OfArray(fs)).ToArray();
            PlanAnalysis.BackwardError(scaled, u, fs);
            for (int l = 0; l < _n; l++) u[3 * l + 2] /= size;
            var ft = new double[2 * _n];
            for (int l = 0; l < _n; l++) { ft[2 * l] = f[3 * l]; ft[2 * l + 1] = f[3 * l + 1]; }
            var ut = lockedChol.Solve(DenseVector.OfArray(ft)).ToArray();
            PlanAnalysis.BackwardError(locked, ut, ft);
            result[ci] = u;
        }
        return result;
    }

    [Benchmark(Description = "recover all 24 lines (6 cases each)")]
    public int RecoverAll()
    {
        int s = 0;
        for (int i = 0; i < _plan.Lines.Count; i++)
            s += PlanAnalysis.Recover(_plan.Lines[i], _condensed[i], _ids, _forces[i], _expected[i], _run).Recovered.Cases.Count;
        return s;
    }

    /// <summary>
    /// The planar story shears Run's result loop asks for: StoryAnalysis.ForCase of the recovered line model, called once
    /// per story × line × case (40 × 24 × 6 = 5,760 calls), each computing every story of the line.
    /// </summary>
    [Benchmark(Description = "story shears per line, as Run's loop calls them")]
    public double StoryShearsAsRunCalls()
    {
        double s = 0;
        for (int ci = 0; ci < _ids.Count; ci++)
            for (int st = 1; st <= _n; st++)
                foreach (var r in _recovered)
                {
                    var planar = StoryAnalysis.ForCase(r.Recovered, r.Recovered.Cases[ci]);
                    s += planar.Stories.Count >= st ? planar.Stories[st - 1].Shear : 0;
                }
        return s;
    }

    [Benchmark(Description = "PlanAnalysis.Run (whole)")]
    public PlanResult Run() => PlanAnalysis.Run(_plan);
}
