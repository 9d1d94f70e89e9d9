using System.Diagnostics;
using System.Globalization;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using PlaneLateral.Hand;
using PlaneLateral.Reports;
using PlaneLateral.Units;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The sweep command's default run (`planelateral sweep` with no options): a solid concrete wall, l = 240 in, t = 8 in,
/// f = 1.2, 25 h/l values from 0.25 to 4 (geometric) × both end conditions, each point the converged plane-stress panel
/// (three nested 9-node meshes) beside the Timoshenko line members; then the CSV and the two PNG figures.
/// </summary>
public static class DefaultSweep
{
    /// <summary>The spec the command builds from its defaults (SweepCommand: kip,in; concrete; 20 ft × 8 in; tolerance 0.10).</summary>
    public static SweepSpec Spec()
    {
        var u = UnitSystem.KipInch;
        var m = SweepMaterials.Get("concrete", u)!;
        return new SweepSpec(0.25, 4.0, 25, SweepSpacing.Geometric, u, 240, 8, m.E, m.G, m.Name, ShearForm.RectangleDefault,
            [EndFixity.Cantilever, EndFixity.FixedFixed], 0.10);
    }

    public static SweepResult Points(int threads) => AspectSweep.Run(Spec(), AspectSweep.DefaultModels(true), null, threads);

    /// <summary>
    /// "sweep [RUNS]": the default sweep's phases in one process, 1 and 2 threads in turn (RUNS pairs after one warm-up
    /// pair): wall and process CPU time of the points, of the two figures drawn one after the other and at the same time,
    /// of the CSV; the median of each, the ratio 1 thread / 2 threads, the load average before and after, and whether
    /// every run's files were byte-identical.
    /// </summary>
    public static void Report(string[] args)
    {
        int runs = args.Length > 1 ? int.Parse(args[1], CultureInfo.InvariantCulture) : 5;
        string load0 = LoadAverage();
        var proc = Process.GetCurrentProcess();
        (double Wall, double Cpu) Time(Action a)
        {
            proc.Refresh();
            var cpu0 = proc.TotalProcessorTime;
            var sw = Stopwatch.StartNew();
            a();
            double wall = sw.Elapsed.TotalSeconds;
            proc.Refresh();
            return (wall, (proc.TotalProcessorTime - cpu0).TotalSeconds);
        }
        var rows = new Dictionary<string, List<(double Wall, double Cpu)>>();
        void Add(string key, (double, double) v) { if (!rows.TryGetValue(key, out var l)) rows[key] = l = []; l.Add(v); }
        byte[][]? reference = null;
        bool identical = true;
        for (int run = -1; run < runs; run++)
            foreach (int threads in new[] { 1, 2 })
            {
                SweepResult r = null!;
                long bytes0 = GC.GetTotalAllocatedBytes(precise: true);
                int gc0 = GC.CollectionCount(0), gc2 = GC.CollectionCount(2);
                var pause0 = GC.GetTotalPauseDuration();
                long faults0 = MinorFaults(), locks0 = Monitor.LockContentionCount;
                var points = Time(() => r = Points(threads));
                long faults = MinorFaults() - faults0, locks = Monitor.LockContentionCount - locks0;
                double mib = (GC.GetTotalAllocatedBytes(precise: true) - bytes0) / 1048576.0;
                int gen0 = GC.CollectionCount(0) - gc0, gen2 = GC.CollectionCount(2) - gc2;
                double pause = (GC.GetTotalPauseDuration() - pause0).TotalSeconds;
                (string, byte[])[] files = null!;
                var serial = Time(() => { SweepFiles.RatioFigure(r); SweepFiles.ShearShareFigure(r); });
                var render = Time(() => files = SweepFiles.Render(r, "benchmark").ToArray());
                var csv = Time(() => SweepFiles.Csv(r, "benchmark"));
                var bytes = files.Select(f => f.Item2).ToArray();
                reference ??= bytes;
                identical &= bytes.Length == reference.Length && bytes.Zip(reference).All(p => p.First.AsSpan().SequenceEqual(p.Second));
                if (run < 0) continue;   // the warm-up pair: JIT and first use of the drawing library
                Add($"points, {threads} thread(s)", points);
                Add($"figures one after the other, {threads} thread(s) for points", serial);
                Add($"CSV + figures at the same time (SweepFiles.Render), {threads} thread(s) for points", render);
                Add($"CSV text alone, {threads} thread(s) for points", csv);
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"run {run + 1} threads {threads}: points {points.Wall:F3} s (cpu {points.Cpu:F3}, {mib:F0} MiB allocated, {gen0} gen-0 / {gen2} gen-2 collections, paused {pause:F3} s, {faults} minor page faults, {locks} lock contentions), figures serial {serial.Wall:F3} s (cpu {serial.Cpu:F3}), render {render.Wall:F3} s (cpu {render.Cpu:F3})"));
            }
        Console.WriteLine($"\nmedians of {runs} runs (wall s, process cpu s); processors {Environment.ProcessorCount}; load average before {load0}, after {LoadAverage()}");
        foreach (var (key, list) in rows)
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  {key,-78} {Median(list.Select(v => v.Wall)),7:F3} {Median(list.Select(v => v.Cpu)),7:F3}"));
        double p1 = Median(rows["points, 1 thread(s)"].Select(v => v.Wall)), p2 = Median(rows["points, 2 thread(s)"].Select(v => v.Wall));
        var pairs = rows["points, 1 thread(s)"].Zip(rows["points, 2 thread(s)"], (a, b) => a.Wall / b.Wall).ToArray();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"points: 1 thread / 2 threads = {p1 / p2:F2} (medians); per pair {string.Join(", ", pairs.Select(x => x.ToString("F2", CultureInfo.InvariantCulture)))}"));
        Console.WriteLine($"files byte-identical in every run, 1 and 2 threads: {(identical ? "yes" : "NO")}");
    }

    private static double Median(IEnumerable<double> v)
    {
        var a = v.Order().ToArray();
        return a.Length % 2 == 1 ? a[a.Length / 2] : 0.5 * (a[a.Length / 2 - 1] + a[a.Length / 2]);
    }

    /// <summary>The process's minor page faults so far (first touches of fresh memory), from /proc/self/stat; 0 where there is none.</summary>
    private static long MinorFaults()
    {
        try
        {
            string stat = File.ReadAllText("/proc/self/stat");
            var fields = stat[(stat.LastIndexOf(')') + 2)..].Split(' ');
            return long.Parse(fields[7], CultureInfo.InvariantCulture);   // field 10 of proc(5): minflt
        }
        catch (IOException) { return 0; }
    }

    private static string LoadAverage()
    {
        try { return string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)); }
        catch (IOException) { return "unknown"; }
    }
}

/// <summary>
/// The default sweep's points on 1 and 2 threads, in one BenchmarkDotNet run (in process: no separate build), with the
/// figures drawn one after the other and at the same time. The ratio column is time over the 1-thread points.
/// </summary>
[MemoryDiagnoser]
[Config(typeof(InProcessShort))]
public class DefaultSweepBenchmarks
{
    private sealed class InProcessShort : ManualConfig
    {
        public InProcessShort() => AddJob(Job.ShortRun.WithToolchain(InProcessEmitToolchain.Instance).WithWarmupCount(2).WithIterationCount(5));
    }

    private SweepResult _result = null!;

    [GlobalSetup]
    public void Setup() => _result = DefaultSweep.Points(2);

    [Benchmark(Baseline = true, Description = "points, 1 thread")]
    public int Points1() => DefaultSweep.Points(1).Points.Count;

    [Benchmark(Description = "points, 2 threads")]
    public int Points2() => DefaultSweep.Points(2).Points.Count;

    [Benchmark(Description = "two figures one after the other")]
    public int FiguresSerial() => SweepFiles.RatioFigure(_result).Png.Length + SweepFiles.ShearShareFigure(_result).Png.Length;

    [Benchmark(Description = "CSV + two figures at the same time (SweepFiles.Render)")]
    public int Render() => SweepFiles.Render(_result, "benchmark").Count;
}
