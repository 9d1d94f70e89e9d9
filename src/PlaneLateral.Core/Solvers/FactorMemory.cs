using System.Runtime.InteropServices;

namespace PlaneLateral.Solvers;

/// <summary>
/// Large arrays of the numeric factorisation — the factor's values, the update block, the update-matrix stack:
/// allocated uninitialised (each front clears its own block just before use; the others are written before read) and,
/// on Linux when it spans at least a few huge pages, pinned and advised for transparent huge pages (madvise
/// MADV_HUGEPAGE, Linux man-pages madvise(2)), so that the first touch of fresh memory costs one page fault per 2 MiB
/// instead of one per 4 KiB — first-touch page faults were the largest single cost of the numeric factorisation on
/// large systems (docs/solver.md). The advice changes no value; where it is refused or unavailable the array is simply
/// an ordinary one.
/// </summary>
internal static class FactorMemory
{
    internal const long HugePage = 2L << 20;
    private const int MadviseHugePage = 14; // MADV_HUGEPAGE in <asm-generic/mman-common.h>

    /// <summary>Smallest array advised (8 MiB: below it the saving is small against the pinning).</summary>
    internal const long AdviseMinBytes = 8L << 20;

    [DllImport("libc", EntryPoint = "madvise")]
    private static extern int Madvise(nint address, nuint length, int advice);

    internal static double[] Allocate(long count)
    {
        if (count > Array.MaxLength) throw new InvalidOperationException($"The factorisation needs an array of {count} entries, more than the largest array holds.");
        long bytes = count * sizeof(double);
        if (bytes < AdviseMinBytes || !OperatingSystem.IsLinux()) return GC.AllocateUninitializedArray<double>((int)count);
        var a = GC.AllocateUninitializedArray<double>((int)count, pinned: true);
        var handle = GCHandle.Alloc(a, GCHandleType.Pinned); // on the pinned-object heap already: the address stays
        try
        {
            AdviseHugePages(handle.AddrOfPinnedObject(), bytes);
        }
        finally
        {
            handle.Free();
        }
        return a;
    }

    /// <summary>Advises the whole huge pages inside [start, start + bytes) for transparent huge pages (Linux only; a
    /// refusal, or no libc madvise, changes nothing).</summary>
    internal static void AdviseHugePages(nint start, long bytes)
    {
        if (!OperatingSystem.IsLinux()) return;
        long from = (start + HugePage - 1) & ~(HugePage - 1), to = (start + bytes) & ~(HugePage - 1);
        if (to <= from) return;
        try
        {
            _ = Madvise((nint)from, (nuint)(to - from), MadviseHugePage); // advice: a refusal changes nothing
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            // No libc madvise: ordinary pages.
        }
    }
}
