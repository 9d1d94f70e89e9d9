using System.Diagnostics;

namespace PlaneLateral.Cli;

/// <summary>
/// A phase timer for finding where a run's time goes (docs/benchmarks.md, "Where the frame's solve spends its time"):
/// off unless the environment variable PLANELATERAL_PHASES is set (to anything), then every <see cref="Mark"/> prints
/// one line to standard error: the phase's wall time, the process's CPU time in it, garbage collections, the time the
/// collector paused the program and bytes allocated. Nothing else changes, and no output file ever carries a time.
/// </summary>
internal static class PhaseTimes
{
    private static readonly bool On = Environment.GetEnvironmentVariable("PLANELATERAL_PHASES") is not null;
    private static long last;
    private static TimeSpan lastCpu;
    private static int lastGc0, lastGc1, lastGc2;
    private static long lastBytes;
    private static TimeSpan lastPause;

    /// <summary>Starts the clock (the first line then measures from the process's start to here).</summary>
    public static void Start()
    {
        if (!On) return;
        using var self = Process.GetCurrentProcess();
        double sinceStart = (DateTime.Now - self.StartTime).TotalMilliseconds;
        Console.Error.Write($"phase {"process start to Main",-28} {sinceStart,8:F1} ms wall (clock resolution of the start time: 10 ms)\n");
        Reset();
    }

    /// <summary>Prints the time since the previous mark under <paramref name="phase"/>.</summary>
    public static void Mark(string phase)
    {
        if (!On) return;
        long now = Stopwatch.GetTimestamp();
        var cpu = Environment.CpuUsage.TotalTime;
        int g0 = GC.CollectionCount(0), g1 = GC.CollectionCount(1), g2 = GC.CollectionCount(2);
        long bytes = GC.GetTotalAllocatedBytes();
        var pause = GC.GetTotalPauseDuration();
        Console.Error.Write($"phase {phase,-28} {Stopwatch.GetElapsedTime(last, now).TotalMilliseconds,8:F1} ms wall {(cpu - lastCpu).TotalMilliseconds,8:F1} ms CPU  " +
            $"GC {g0 - lastGc0}/{g1 - lastGc1}/{g2 - lastGc2} (gen 0/1/2) {(pause - lastPause).TotalMilliseconds,6:F1} ms paused  {(bytes - lastBytes) / 1048576.0,7:F1} MiB allocated\n");
        Reset();
    }

    private static void Reset()
    {
        last = Stopwatch.GetTimestamp();
        lastCpu = Environment.CpuUsage.TotalTime;
        lastGc0 = GC.CollectionCount(0); lastGc1 = GC.CollectionCount(1); lastGc2 = GC.CollectionCount(2);
        lastBytes = GC.GetTotalAllocatedBytes();
        lastPause = GC.GetTotalPauseDuration();
    }
}
