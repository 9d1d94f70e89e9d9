using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The supernodal solver's phases on square plane-stress walls (<see cref="PlaneStressGrid"/>, 2 DOFs per node, the
/// edge x = 0 fixed) of about 10k, 100k and 1M unknowns: ordering (AMD), symbolic analysis, numeric factorisation
/// (ordering given), solve. Few iterations: the 1M case takes seconds per operation.
/// </summary>
[MemoryDiagnoser]
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 1, iterationCount: 5)]
public class SupernodalSolverBenchmarks
{
    /// <summary>Nodes per side: 71 → 9,940 unknowns; 224 → 99,904; 708 → 1,001,112.</summary>
    [Params(71, 224, 708)]
    public int Side { get; set; }

    private SymmetricSparseMatrix _a = null!;
    private int[] _perm = null!;
    private SupernodalCholeskySolver _solver = null!;
    private ISparseSpdFactor _factor = null!;
    private double[] _b = null!, _x = null!;
    private double[][] _b8 = null!, _x8 = null!;

    public static double[] RightHandSide(int n)
    {
        var b = new double[n];
        for (int i = 0; i < n; i++) b[i] = Math.Sin(0.37 * i);
        return b;
    }

    [GlobalSetup]
    public void Setup()
    {
        _a = PlaneStressGrid.Build(Side, Side);
        _solver = new SupernodalCholeskySolver();
        _perm = _solver.ComputeOrdering(_a);
        _factor = _solver.Factorize(_a, _perm);
        _b = RightHandSide(_a.Size);
        _x = new double[_a.Size];
        _b8 = Enumerable.Range(0, 8).Select(c => _b.Select((v, i) => v * (1 + c) + Math.Cos(0.1 * c * i)).ToArray()).ToArray();
        _x8 = Enumerable.Range(0, 8).Select(_ => new double[_a.Size]).ToArray();
    }

    [Benchmark]
    public int[] Order() => MinimumDegreeOrdering.Compute(_a);

    [Benchmark]
    public long Symbolic() => SupernodalCholeskySolver.Analyse(_a, _perm).StoredNonZeros;

    [Benchmark]
    public long Factorize()
    {
        using var f = _solver.Factorize(_a, _perm); // a large factor's native memory goes back at once
        return f.FactorNonZeros;
    }

    [GlobalCleanup]
    public void Cleanup() => _factor.Dispose();

    [Benchmark]
    public void Solve() => _factor.Solve(_b, _x);

    /// <summary>Eight load cases one at a time (eight passes over L).</summary>
    [Benchmark]
    public void SolveEightOneByOne()
    {
        for (int c = 0; c < 8; c++) _factor.Solve(_b8[c], _x8[c]);
    }
}
