using System.Diagnostics;
using System.Globalization;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// One measured pass of the supernodal solver on a plane-stress grid, phase by phase, for the comparison with the CHOLMOD
/// harness: writes the matrix and its right-hand side as Matrix Market files, then orders, analyses, factorises and solves
/// once each and prints the sizes, wall times, the process's peak working set and the residual.
/// (The repeated, statistically summarised timings are <see cref="SupernodalSolverBenchmarks"/>.)
/// </summary>
public static class SupernodalReport
{
    public static void Run(string[] args)
    {
        int nx = int.Parse(args[1], CultureInfo.InvariantCulture);
        int ny = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : nx;
        string? dir = args.Length > 3 && args[3] != "-" ? args[3] : null;
        int threads = args.Length > 4 ? int.Parse(args[4], CultureInfo.InvariantCulture) : Environment.ProcessorCount;
        int passes = args.Length > 5 ? int.Parse(args[5], CultureInfo.InvariantCulture) : 2;
        var sw = Stopwatch.StartNew();
        var a = PlaneStressGrid.Build(nx, ny);
        var b = SupernodalSolverBenchmarks.RightHandSide(a.Size);
        Console.WriteLine($"grid {nx}x{ny}: n = {a.Size}, nnz(K lower) = {a.NonZerosLower}, built in {sw.Elapsed.TotalSeconds:F2} s");
        if (dir is not null)
        {
            Directory.CreateDirectory(dir);
            string name = Path.Combine(dir, $"wall{nx}x{ny}");
            using (var w = new StreamWriter(name + ".mtx")) a.WriteMatrixMarket(w, $"plane-stress grid {nx}x{ny} (PlaneLateral.Benchmarks.PlaneStressGrid)");
            using (var w = new StreamWriter(name + "_b.mtx")) MatrixMarket.WriteArray(w, b, "b_i = sin(0.37 i)");
            Console.WriteLine($"wrote {name}.mtx and {name}_b.mtx");
        }
        for (int rep = 0; rep < passes; rep++)
        {
            var solver = new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree, threads);
            sw.Restart();
            var perm = solver.ComputeOrdering(a);
            double tOrder = sw.Elapsed.TotalSeconds;
            sw.Restart();
            var an = SupernodalCholeskySolver.Analyse(a, perm);
            double tSym = sw.Elapsed.TotalSeconds;
            var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
            var pause0 = GC.GetTotalPauseDuration();
            sw.Restart();
            using var f = solver.Factorize(a, perm); // disposed at the end of the pass: a large factor's native memory goes back
            double tFac = sw.Elapsed.TotalSeconds; // includes its own symbolic pass (tSym)
            double cpuFac = (Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds; // all threads, symbolic included
            double gcFac = (GC.GetTotalPauseDuration() - pause0).TotalSeconds; // the collector's pauses inside it
            var x = new double[a.Size];
            sw.Restart();
            f.Solve(b, x);
            double tSolve = sw.Elapsed.TotalSeconds;
            double res = ResidualRelative(a, x, b);
            Console.WriteLine($"  run {rep + 1}: order {tOrder:F3} s, symbolic {tSym:F3} s, factor (numeric) {tFac - tSym:F3} s (symbolic + numeric CPU {cpuFac:F3} s), solve {tSolve:F3} s");
            Console.WriteLine($"    nnz(L) exact {an.ExactNonZeros}, stored {an.StoredNonZeros}, supernodes {an.Supernodes}, largest front {an.LargestFront}, flops {an.Flops:E3}, {an.Flops / (tFac - tSym) * 1e-9:F2} GFlop/s");
            Console.WriteLine($"    residual {res:E2}, failures {f.PivotFailures.Count}, numeric phase {f.NumericBytes / 1048576.0:F0} MiB (factor {f.FactorBytes / 1048576.0:F0} MiB), peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0:F0} MiB");
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"RESULT n={a.Size} lnz={an.ExactNonZeros} lstored={an.StoredNonZeros} t_order={tOrder:F4} t_symbolic={tSym:F4} t_factor={tFac - tSym:F4} cpu_factor_with_symbolic={cpuFac:F4} t_solve={tSolve:F4} gc_pause_factor={gcFac:F4} peak_ws_mib={Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0:F0} numeric_mib={f.NumericBytes / 1048576.0:F0} relres={res:E3}"));
        }
    }

    private static double ResidualRelative(SymmetricSparseMatrix a, double[] x, double[] b)
    {
        var y = new double[a.Size];
        a.Multiply(x, y);
        double r = 0, nb = 0;
        for (int i = 0; i < y.Length; i++) { r += (y[i] - b[i]) * (y[i] - b[i]); nb += b[i] * b[i]; }
        return Math.Sqrt(r / nb);
    }
}
