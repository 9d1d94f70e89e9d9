using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// "phases NX [NY] [REPS]": the ordering and the symbolic analysis alone on a plane-stress grid, before (the implementation
/// kept in <see cref="PreviousPhases"/>) and now, interleaved in one process REPS times (which goes first alternates; the
/// first pass includes JIT compilation). Prints the fastest and the median warm time of each, as wall clock and as the
/// measuring thread's CPU time (steadier than the wall clock on a loaded machine, where a thread waits for a core), and
/// checksums of the permutation and of the symbolic analysis of both, which must agree.
/// </summary>
public static class PhaseReport
{
    public static void Run(string[] args)
    {
        int nx = int.Parse(args[1], CultureInfo.InvariantCulture);
        int ny = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : nx;
        int reps = args.Length > 3 ? int.Parse(args[3], CultureInfo.InvariantCulture) : 5;
        var a = PlaneStressGrid.Build(nx, ny);
        string[] names = { "order before", "order now", "symbolic before", "symbolic now", "order + symbolic before", "order + symbolic now" };
        var wall = names.Select(_ => new List<double>()).ToArray();
        var cpu = names.Select(_ => new List<double>()).ToArray();
        var sums = new ulong[2, 2];
        var allocated = new long[6];
        long lnz = 0;
        for (int rep = 0; rep < reps; rep++)
        {
            for (int k = 0; k < 2; k++)
            {
                bool now = (rep + k) % 2 == 1;
                int v = now ? 1 : 0;
                long b0 = GC.GetAllocatedBytesForCurrentThread();
                var (w0, c0) = Clocks();
                var perm = now ? MinimumDegreeOrdering.Compute(a) : PreviousPhases.Order(a);
                var (w1, c1) = Clocks();
                long b1 = GC.GetAllocatedBytesForCurrentThread();
                var s = now ? SupernodalSymbolic.Analyse(a, perm) : PreviousPhases.Analyse(a, perm);
                var (w2, c2) = Clocks();
                long b2 = GC.GetAllocatedBytesForCurrentThread();
                (allocated[v], allocated[2 + v], allocated[4 + v]) = (b1 - b0, b2 - b1, b2 - b0);
                wall[v].Add(w1 - w0); cpu[v].Add(c1 - c0);
                wall[2 + v].Add(w2 - w1); cpu[2 + v].Add(c2 - c1);
                wall[4 + v].Add(w2 - w0); cpu[4 + v].Add(c2 - c0);
                if (rep == 0)
                {
                    sums[v, 0] = Hash(perm);
                    sums[v, 1] = Hash(s.Perm, s.First, s.PatternStart, s.PatternRows, s.Parent, s.ColumnCount, s.ColPtr!, s.RowsByCol!, s.SourceByCol!);
                    lnz = s.ExactNonZeros;
                }
            }
        }
        double load = File.Exists("/proc/loadavg") ? double.Parse(File.ReadAllText("/proc/loadavg").Split(' ')[0], CultureInfo.InvariantCulture) : double.NaN;
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"grid {nx}x{ny}: n = {a.Size}, nnz(L) exact {lnz}, {reps} interleaved passes, load average {load} at the end"));
        Console.WriteLine("  phase                       wall: first   warm min   median | thread CPU: first  warm min   median (s) | allocated (MB)");
        for (int i = 0; i < names.Length; i++)
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"  {names[i],-26} {wall[i][0],10:F4} {Min(wall[i]),10:F4} {Median(wall[i]),8:F4} | {cpu[i][0],10:F4} {Min(cpu[i]),10:F4} {Median(cpu[i]),8:F4} | {allocated[i] / 1e6,8:F1}"));
        Console.WriteLine($"  checksums before: permutation {sums[0, 0]:X16}, symbolic {sums[0, 1]:X16}");
        Console.WriteLine($"  checksums now:    permutation {sums[1, 0]:X16}, symbolic {sums[1, 1]:X16}" +
            (sums[0, 0] == sums[1, 0] && sums[0, 1] == sums[1, 1] ? " (equal)" : " (DIFFERENT)"));
    }

    private static double Min(List<double> t) => t.Count > 1 ? t.Skip(1).Min() : t[0];

    private static double Median(List<double> t)
    {
        var warm = t.Skip(1).OrderBy(x => x).ToList();
        return warm.Count == 0 ? t[0] : warm[warm.Count / 2];
    }

    private static readonly Stopwatch Clock = Stopwatch.StartNew();

    private static (double Wall, double Cpu) Clocks() => (Clock.Elapsed.TotalSeconds, ThreadCpuSeconds());

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec { public long Seconds, Nanoseconds; }

    [DllImport("libc", EntryPoint = "clock_gettime")]
    private static extern int ClockGetTime(int clock, out TimeSpec time);

    /// <summary>CPU time of the calling thread (Linux: CLOCK_THREAD_CPUTIME_ID); elsewhere the process's.</summary>
    private static double ThreadCpuSeconds()
    {
        if (OperatingSystem.IsLinux() && ClockGetTime(3, out var ts) == 0) return ts.Seconds + ts.Nanoseconds * 1e-9;
        return Environment.CpuUsage.TotalTime.TotalSeconds;
    }

    /// <summary>FNV-1a (64-bit) over the arrays' lengths and entries.</summary>
    private static ulong Hash(params int[][] arrays)
    {
        ulong h = 14695981039346656037UL;
        foreach (var arr in arrays)
        {
            h = (h ^ (uint)arr.Length) * 1099511628211UL;
            foreach (int v in arr) h = (h ^ (uint)v) * 1099511628211UL;
        }
        return h;
    }
}
