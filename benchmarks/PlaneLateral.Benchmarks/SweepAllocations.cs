using System.Diagnostics.Tracing;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// "sweep-alloc": what the default sweep's points allocate, by type, small-object heap and large-object heap apart, from
/// the runtime's own allocation sampling (its GC AllocationTick event, one sample per about 100 KB allocated), on one
/// thread after a warm-up run. A sample stands for the bytes since the last one, so small types are rough.
/// </summary>
public sealed class SweepAllocations : EventListener
{
    private readonly Dictionary<string, (long Small, long Large)> _byType = [];
    private readonly Lock _gate = new();

    protected override void OnEventSourceCreated(EventSource source)
    {
        if (source.Name == "Microsoft-Windows-DotNETRuntime") EnableEvents(source, EventLevel.Verbose, (EventKeywords)0x1);   // GC keyword
    }

    protected override void OnEventWritten(EventWrittenEventArgs e)
    {
        if (e.EventName is null || !e.EventName.StartsWith("GCAllocationTick", StringComparison.Ordinal) || e.Payload is null || e.PayloadNames is null) return;
        string type = e.Payload[e.PayloadNames.IndexOf("TypeName")]?.ToString() ?? "?";
        long bytes = Convert.ToInt64(e.Payload[e.PayloadNames.IndexOf("AllocationAmount64")]);
        bool large = Convert.ToUInt32(e.Payload[e.PayloadNames.IndexOf("AllocationKind")]) == 1;
        lock (_gate)
        {
            _byType.TryGetValue(type, out var v);
            _byType[type] = large ? (v.Small, v.Large + bytes) : (v.Small + bytes, v.Large);
        }
    }

    public static void Run()
    {
        DefaultSweep.Points(1);   // warm-up
        using var listener = new SweepAllocations();
        long before = GC.GetTotalAllocatedBytes(precise: true);
        DefaultSweep.Points(1);
        long total = GC.GetTotalAllocatedBytes(precise: true) - before;
        Thread.Sleep(500);        // the last events arrive
        Console.WriteLine($"default sweep, points on 1 thread: {total / 1048576.0:F1} MiB allocated in all\n   small MiB   large MiB  type");
        lock (listener._gate)
            foreach (var (type, v) in listener._byType.OrderByDescending(kv => kv.Value.Small + kv.Value.Large).Take(12))
                Console.WriteLine($"{v.Small / 1048576.0,12:F1}{v.Large / 1048576.0,12:F1}  {type}");
    }
}
