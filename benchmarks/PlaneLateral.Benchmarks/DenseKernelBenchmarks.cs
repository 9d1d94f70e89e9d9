using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The supernodal factorisation (ordering given) with the managed dense kernels against OpenBLAS's dpotrf/dtrsm/dsyrk,
/// on the same square plane-stress walls in one run, so the ratio is what to read. Without an OpenBLAS library the
/// OpenBlas rows fall back to the managed kernels (the solver's description, printed in the global setup, says so).
/// </summary>
[MemoryDiagnoser]
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 1, iterationCount: 5)]
public class DenseKernelBenchmarks
{
    /// <summary>Nodes per side: 71 → 9,940 unknowns; 224 → 99,904; 708 → 1,001,112.</summary>
    [Params(71, 224, 708)]
    public int Side { get; set; }

    [Params(DenseKernelBackend.Managed, DenseKernelBackend.OpenBlas)]
    public DenseKernelBackend Kernels { get; set; }

    private SymmetricSparseMatrix _a = null!;
    private int[] _perm = null!;
    private SupernodalCholeskySolver _solver = null!;

    [GlobalSetup]
    public void Setup()
    {
        _a = PlaneStressGrid.Build(Side, Side);
        _solver = new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree, 0, Kernels);
        _perm = _solver.ComputeOrdering(_a);
        Console.WriteLine($"// {_a.Size} unknowns: {_solver.Description}");
    }

    [Benchmark]
    public long Factorize()
    {
        using var f = _solver.Factorize(_a, _perm); // a large factor's native memory goes back at once
        return f.FactorNonZeros;
    }
}
