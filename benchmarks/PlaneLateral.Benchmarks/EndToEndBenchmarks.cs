using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using PlaneLateral.Analysis;
using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Reports;
using PlaneLateral.Solvers;
using PlaneLateral.Units;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// End-to-end steps on the shipped demo model (models/demo-clinic.json): reading and validating it from text, assembly of
/// the global stiffness, the solve (factorisation and one solve per load case and stiffness point), and the whole
/// analysis as the command line runs it (assembly, solve, recovery, checks, condition estimate). ShortRun job in process (3
/// iterations, no separate build: the machine is shared). [MemoryDiagnoser]
/// gives the bytes allocated per operation, i.e. per solve for <see cref="Solve"/> and <see cref="FullAnalysis"/>.
/// </summary>
[MemoryDiagnoser]
[Config(typeof(EndToEndConfig))]
public class EndToEndBenchmarks
{
    private sealed class EndToEndConfig : ManualConfig
    {
        public EndToEndConfig() => AddJob(Job.ShortRun.WithToolchain(InProcessEmitToolchain.Instance).WithId("ShortRun-InProcess"));
    }

    private string _json = "";
    private StructureModel _model = null!;
    private FrameElement[] _elements = null!;
    private DofMap _dofs = null!;
    private SymmetricSparseMatrix _k = null!;
    private double[][] _rhs = null!;

    /// <summary>The repository's root, found upwards from the working directory (BenchmarkDotNet runs from bin/).</summary>
    internal static string RepositoryRoot()
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
            if (File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) return d.FullName;
        for (var d = new DirectoryInfo(Environment.CurrentDirectory); d is not null; d = d.Parent)
            if (File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) return d.FullName;
        throw new DirectoryNotFoundException("PlaneLateral.sln not found above " + AppContext.BaseDirectory);
    }

    [GlobalSetup]
    public void Setup()
    {
        _json = File.ReadAllText(Path.Combine(RepositoryRoot(), "models", "demo-clinic.json"));
        // The analysis fills in a generated seismic case first (docs/seismic.md); the split steps do the same.
        _model = SeismicAnalysis.Prepare(ModelReader.Parse(_json, "demo-clinic.json"));
        _elements = _model.Members.Select(m => new FrameElement(m, _model.Nodes[m.Start], _model.Nodes[m.End])).ToArray();
        _dofs = DofMap.Build(_model, _elements);
        _k = LinearStaticAnalysis.Assemble(_model, _elements, _dofs);
        // One right-hand side per load case and stiffness point, as the analysis solves; a triangular solve costs the
        // same whatever the values, so K·1 stands for the load vectors (which the analysis builds privately).
        int n = _k.Size, rhs = _model.LoadCases.Count + _model.StiffnessPoints.Count;
        var ones = Enumerable.Repeat(1.0, n).ToArray();
        _rhs = Enumerable.Range(0, rhs).Select(_ => { var b = new double[n]; _k.Multiply(ones, b); return b; }).ToArray();
    }

    /// <summary>Unknowns and right-hand sides, for the table.</summary>
    public (int Unknowns, int RightHandSides) Size => (_k.Size, _rhs.Length);

    [Benchmark(Description = "read + validate")]
    public StructureModel Read() => ModelReader.Parse(_json, "demo-clinic.json");

    [Benchmark(Description = "assembly")]
    public SymmetricSparseMatrix Assemble() => LinearStaticAnalysis.Assemble(_model, _elements, _dofs);

    [Benchmark(Description = "solve (factor + all cases)")]
    public double Solve()
    {
        using var factor = DefaultSolver.Create().Factorize(_k);
        var u = new double[_k.Size];
        double s = 0;
        foreach (var b in _rhs) { factor.Solve(b, u); s += u[0]; }
        return s;
    }

    [Benchmark(Description = "full analysis")]
    public AnalysisResult FullAnalysis() => LinearStaticAnalysis.Run(_model);
}

/// <summary>
/// A 1,000-point aspect-ratio sweep through the sweep's public API (<see cref="AspectSweep.Run(SweepSpec, IProgress{int}?)"/>:
/// the hand pier formula and the Timoshenko line-member model at every point, two solves each). The sweep accepts at
/// most <see cref="AspectSweep.MaxPoints"/> h/l values per end condition, so the 1,000 points are two sweeps of 250 h/l
/// values × both end conditions. The sweep runs on <see cref="Environment.ProcessorCount"/> threads, so the jobs set it
/// from outside, each in its own process: "1-core" pins the process to one core (affinity 1, so ProcessorCount = 1:
/// the serial run, the baseline); "1-thread-2-cores" sets DOTNET_PROCESSOR_COUNT=1 (one worker, while the runtime's own
/// threads, JIT and GC, may use the other core); "2-threads" is the default on the 2-core machine; "2-threads-serverGC"
/// repeats it with the server garbage collector, to show whether allocation and collection limit the speed-up. The
/// ratio of the means within one run is the parallel speed-up.
/// </summary>
[MemoryDiagnoser]
[Config(typeof(SweepConfig))]
public class SweepBenchmarks
{
    private sealed class SweepConfig : ManualConfig
    {
        public SweepConfig()
        {
            // Each job is its own process, built first; on the shared machine a build can take minutes.
            WithBuildTimeout(TimeSpan.FromMinutes(15));
            var run = Job.ShortRun.WithWarmupCount(10).WithIterationCount(7);
            AddJob(run.WithAffinity(1).WithId("1-core").AsBaseline());
            AddJob(run.WithEnvironmentVariable("DOTNET_PROCESSOR_COUNT", "1").WithId("1-thread-2-cores"));
            AddJob(run.WithId("2-threads"));
            AddJob(run.WithGcServer(true).WithId("2-threads-serverGC"));
        }
    }

    private static readonly SweepSpec Low = Spec(0.25, 2.0), High = Spec(2.0, 8.0);

    private static SweepSpec Spec(double from, double to) =>
        new(from, to, 250, SweepSpacing.Geometric, UnitSystem.KipInch, 240, 8, 1800, 720, "benchmark masonry", 1.2,
            [EndFixity.Cantilever, EndFixity.FixedFixed], 0.10);

    /// <summary>Points per operation: 2 sweeps × 250 h/l values × 2 end conditions.</summary>
    public const int Points = 1000;

    [Benchmark(Description = "sweep, 1,000 points (hand + Timoshenko)")]
    public int Sweep() => AspectSweep.Run(Low).Points.Count + AspectSweep.Run(High).Points.Count;

    /// <summary>The sweep command's default models: 12 h/l values × both end conditions, each point with the converged
    /// plane-stress panel (three nested 9-node meshes) beside the Timoshenko line members. Points cost milliseconds here,
    /// so this is where the parallel speed-up of the sweep shows, if the machine lets it.</summary>
    [Benchmark(Description = "sweep, 24 points with the converged panel")]
    public int SweepWithPanel() => AspectSweep.Run(PanelSpec, AspectSweep.DefaultModels(true)).Points.Count;

    private static readonly SweepSpec PanelSpec = Spec(0.25, 4.0) with { Points = 12 };
}
