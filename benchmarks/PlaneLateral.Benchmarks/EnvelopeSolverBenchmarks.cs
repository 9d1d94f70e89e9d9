using BenchmarkDotNet.Attributes;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// Factorise and solve a plane-stress-like grid (2 DOFs per node, 8-neighbour coupling) with the envelope solver,
/// reverse Cuthill–McKee against the natural (as-numbered) order.
/// </summary>
[MemoryDiagnoser]
public class EnvelopeSolverBenchmarks
{
    /// <summary>Grid and numbering, e.g. "50x50" (row by row) or "50x50-scrambled".</summary>
    [ParamsSource(nameof(Cases))]
    public string Case { get; set; } = "50x50";

    [Params(EnvelopeOrdering.ReverseCuthillMcKee, EnvelopeOrdering.Natural)]
    public EnvelopeOrdering Ordering { get; set; }

    public static IEnumerable<string> Cases => new[] { "50x50", "100x100", "30x30-scrambled" };

    private SymmetricSparseMatrix _matrix = null!;
    private EnvelopeCholeskySolver _solver = null!;
    private ISparseSpdFactor _factor = null!;
    private double[] _b = null!;
    private double[] _x = null!;

    [GlobalSetup]
    public void Setup()
    {
        _matrix = BuildCase(Case);
        _solver = new EnvelopeCholeskySolver(Ordering);
        _factor = _solver.Factorize(_matrix);
        if (_factor.PivotFailures.Count != 0) throw new InvalidOperationException("benchmark matrix is not SPD");
        _b = new double[_matrix.Size];
        for (int i = 0; i < _b.Length; i++) _b[i] = Math.Sin(0.37 * i);
        _x = new double[_matrix.Size];
    }

    public static SymmetricSparseMatrix BuildCase(string name)
    {
        bool scrambled = name.EndsWith("-scrambled", StringComparison.Ordinal);
        var dims = name.Split('-')[0].Split('x').Select(int.Parse).ToArray();
        return PlaneStressGrid.Build(dims[0], dims[1], scrambled ? PlaneStressGrid.Numbering.Scrambled : PlaneStressGrid.Numbering.RowByRow);
    }

    [Benchmark]
    public long Factorize() => _solver.Factorize(_matrix).FactorNonZeros;

    [Benchmark]
    public void Solve() => _factor.Solve(_b, _x);
}

/// <summary>The same factorisation with the vector kernels on and off (AppContext switch, read once per process).</summary>
[MemoryDiagnoser]
public class KernelBenchmarks
{
    [Params(false, true)]
    public bool ScalarKernels { get; set; }

    private SymmetricSparseMatrix _matrix = null!;
    private EnvelopeCholeskySolver _solver = null!;

    [GlobalSetup]
    public void Setup()
    {
        // Must run before the solver is first used in this process (BenchmarkDotNet runs each case in its own process).
        AppContext.SetSwitch("PlaneLateral.Solvers.ScalarKernels", ScalarKernels);
        _matrix = PlaneStressGrid.Build(100, 100);
        _solver = new EnvelopeCholeskySolver();
    }

    [Benchmark]
    public long FactorizeRcm100x100() => _solver.Factorize(_matrix).FactorNonZeros;
}
