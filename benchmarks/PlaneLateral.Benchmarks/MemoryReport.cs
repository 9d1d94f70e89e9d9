using System.Diagnostics;
using System.Globalization;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The process the CHOLMOD harness is compared with for peak memory (issue 19): one process that gets the matrix (builds the
/// plane-stress grid, or reads the very Matrix Market file the harness reads), orders, analyses, factorises and solves once
/// through the public entry point (<see cref="SupernodalCholeskySolver.Factorize(SymmetricSparseMatrix, double)"/>), and
/// prints at each phase boundary the working set, the peak working set so far and the collector's committed bytes. The
/// process's own peak is read from outside with <c>/usr/bin/time -v</c> (maximum resident set size), as for the harness.
/// </summary>
public static class MemoryReport
{
    /// <summary>"memory NX [NY] [THREADS]" or "memory FILE.mtx [THREADS]".</summary>
    public static void Run(string[] args)
    {
        bool file = args[1].EndsWith(".mtx", StringComparison.OrdinalIgnoreCase);
        int next = 2;
        int nx = 0, ny = 0;
        if (!file)
        {
            nx = int.Parse(args[1], CultureInfo.InvariantCulture);
            ny = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : nx;
            next = 3;
        }
        int threads = args.Length > next ? int.Parse(args[next], CultureInfo.InvariantCulture) : Environment.ProcessorCount;
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        Snapshot("start");
        SymmetricSparseMatrix a;
        if (file)
            using (var r = new StreamReader(args[1])) a = MatrixMarket.ReadSymmetric(r);
        else a = PlaneStressGrid.Build(nx, ny);
        Snapshot(file ? "matrix read" : "grid built");
        var b = SupernodalSolverBenchmarks.RightHandSide(a.Size);
        var solver = new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree, threads);
        var c0 = Process.GetCurrentProcess().TotalProcessorTime;
        var sw = Stopwatch.StartNew();
        using var f = (SupernodalFactor)solver.Factorize(a);
        double tFac = sw.Elapsed.TotalSeconds;
        double cpuFac = (Process.GetCurrentProcess().TotalProcessorTime - c0).TotalSeconds;
        Snapshot("factorised");
        var x = new double[a.Size];
        f.Solve(b, x);
        Snapshot("solved");
        var y = new double[a.Size];
        a.Multiply(x, y);
        double r2 = 0, b2 = 0;
        for (int i = 0; i < y.Length; i++) { r2 += (y[i] - b[i]) * (y[i] - b[i]); b2 += b[i] * b[i]; }
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"MEMORY n={a.Size} nnz_lower={a.NonZerosLower} lstored={f.FactorNonZeros} factor_mib={f.FactorBytes / 1048576.0:F0} numeric_mib={f.NumericBytes / 1048576.0:F0} peak_ws_mib={Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0:F0} t_order_symbolic_factor={tFac:F3} cpu_order_symbolic_factor={cpuFac:F3} cpu_total={(Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds:F3} relres={Math.Sqrt(r2 / b2):E3} failures={f.PivotFailures.Count}"));
    }

    private static void Snapshot(string phase)
    {
        var p = Process.GetCurrentProcess();
        var gc = GC.GetGCMemoryInfo();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"  {phase,-12} working set {p.WorkingSet64 / 1048576.0,6:F0} MiB, peak {p.PeakWorkingSet64 / 1048576.0,6:F0} MiB, GC committed {gc.TotalCommittedBytes / 1048576.0,6:F0} MiB, GC heap {gc.HeapSizeBytes / 1048576.0,6:F0} MiB, allocated {GC.GetTotalAllocatedBytes() / 1048576.0,7:F0} MiB"));
    }
}
