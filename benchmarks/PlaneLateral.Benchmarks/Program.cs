using BenchmarkDotNet.Running;
using PlaneLateral.Benchmarks;
using PlaneLateral.Solvers;

// "fill" prints the size and fill of each benchmark case; anything else goes to BenchmarkDotNet,
// e.g. `dotnet run -c Release -- --filter '*EnvelopeSolver*' --job short`.
if (args.Length > 0 && args[0] == "fill")
{
    Console.WriteLine("case                 ordering   n       nnz(K lower)  env(L)       nnz(L)       bandwidth");
    foreach (string c in EnvelopeSolverBenchmarks.Cases)
    {
        var a = EnvelopeSolverBenchmarks.BuildCase(c);
        foreach (var (name, perm) in new[] { ("RCM", Orderings.ReverseCuthillMcKee(a)), ("natural", Orderings.Natural(a.Size)) })
        {
            var f = EnvelopeCholeskySolver.Factorize(a, perm);
            Console.WriteLine($"{c,-20} {name,-10} {a.Size,-7} {a.NonZerosLower,-13} {f.EnvelopeSize,-12} {f.FactorNonZeros,-12} {Orderings.Bandwidth(a, perm)}");
        }
    }
    return;
}
// "phases NX [NY] [REPS]": the ordering and the symbolic analysis alone, repeated, with checksums (PhaseReport).
if (args.Length > 1 && args[0] == "phases")
{
    PhaseReport.Run(args);
    return;
}
// "supernodal NX [NY] [DIR|-] [THREADS] [PASSES]": measured passes (2 by default) of the supernodal solver on a plane-stress grid (writes DIR/wallNXxNY.mtx
// and its right-hand side for the CHOLMOD harness when DIR is given).
if (args.Length > 1 && args[0] == "supernodal")
{
    SupernodalReport.Run(args);
    return;
}
// "memory NX [NY] [THREADS]" or "memory FILE.mtx [THREADS]": one pass (matrix, order, factorise, solve) with the memory at each
// phase boundary, for the peak-memory comparison with the CHOLMOD harness under /usr/bin/time -v (MemoryReport).
if (args.Length > 1 && args[0] == "memory")
{
    MemoryReport.Run(args);
    return;
}
// "result-edge DIR [CASES]": the count limits' edge (10 000 nodes, 20 000 members, 200 cases) analysed and its results
// files streamed to DIR/out, with wall times, peak working set and file sizes (docs/hardening.md, "Size limits").
if (args.Length > 1 && args[0] == "result-edge")
{
    ResultEdgeReport.Run(args);
    return;
}
if (args.Length > 3 && args[0] == "frame-json") { FrameJsonCommand.Run(args); return; }   // "frame-json BAYS STORIES FILE": the benchmark frame as a model file
// "sweep-alloc": what the default sweep's points allocate, by type.
if (args.Length > 0 && args[0] == "sweep-alloc")
{
    SweepAllocations.Run();
    return;
}
// "sweep [RUNS]": the default sweep's phases (points on 1 and 2 threads, figures serial and concurrent, CSV) in one process.
if (args.Length > 0 && args[0] == "sweep")
{
    DefaultSweep.Report(args);
    return;
}
BenchmarkSwitcher.FromAssembly(typeof(EnvelopeSolverBenchmarks).Assembly).Run(args);
