using System.Runtime.InteropServices;

namespace PlaneLateral.Solvers;

/// <summary>Where the large arrays of a supernodal factorisation live.</summary>
internal enum FactorStorage
{
    /// <summary>Native memory when the factor's values take <see cref="FactorBuffer.NativeMinBytes"/> or more, else
    /// arrays of the collected heap (the default).</summary>
    BySize = 0,

    /// <summary>Always arrays of the collected heap.</summary>
    Managed = 1,

    /// <summary>Always native memory (for the tests that compare the two).</summary>
    Native = 2,
}

/// <summary>
/// A block of doubles of the numeric factorisation (the factor's values, an update block, the update-matrix stack, a
/// handed-over update matrix): an ordinary array (<see cref="FactorMemory.Allocate"/>), or native memory
/// (<see cref="NativeMemory.AlignedAlloc"/>) that is given back to the system the moment the block is disposed.
/// </summary>
/// <remarks>
/// <para>Why native memory for large factorisations (issue 19, docs/solver.md "Process peak memory"): memory the
/// collector frees stays mapped, so at 10⁶ unknowns the matrix assembly's and the ordering's freed temporaries and the
/// factor (972 MiB) added up in the process's peak. Out of the collected heap the factor and the workspaces are mapped
/// once, used and unmapped when done, and the collector's heap stays the size of what it still holds.</para>
/// <para>Why not below <see cref="NativeMinBytes"/>: small factorisations come many to a run (panels, sweep points);
/// there the collector's heap already has the memory mapped and the workspaces are reused from one factorisation to
/// the next, whereas fresh native memory costs a page fault per page touched every time.</para>
/// <para>The native block is a <see cref="SafeHandle"/>: disposing frees it at once (or, when a solve is running on
/// it, as soon as that solve ends), and a block never disposed is freed by its finalizer after the collector finds it
/// unreachable, so a forgotten <see cref="IDisposable.Dispose"/> costs memory for a while but never for ever.</para>
/// </remarks>
internal sealed class FactorBuffer : IDisposable
{
    /// <summary>Factor size (bytes of its values) from which a factorisation keeps its large arrays in native memory
    /// (64 MiB: about 10⁵ unknowns of a plane-stress wall, where the factorisation already begins with a full collection,
    /// <see cref="SupernodalFactor.CollectBeforeFactorBytes"/>).</summary>
    internal const long NativeMinBytes = 64L << 20;

    private double[]? _array;
    private readonly NativeBlock? _native;

    private FactorBuffer(double[]? array, NativeBlock? native, int length)
    {
        _array = array;
        _native = native;
        Length = length;
    }

    /// <summary>Entries held.</summary>
    public int Length { get; }

    /// <summary>Whether the block is native memory.</summary>
    public bool IsNative => _native is not null;

    /// <summary>Whether <see cref="Dispose"/> was called.</summary>
    public bool IsDisposed => _native is null ? _array is null : _native.IsClosed;

    /// <summary>An uninitialised block of <paramref name="count"/> doubles, native or an ordinary array.</summary>
    /// <param name="pressure">Whether the collector is told of the native bytes (<see cref="GC.AddMemoryPressure"/>), so
    /// that it runs the finalizer of a block nobody disposed soon enough: for blocks that outlive the factorisation (the
    /// factor); the workspaces are always disposed before the factorisation returns.</param>
    public static FactorBuffer Allocate(long count, bool native, bool pressure = false)
    {
        if (count > Array.MaxLength) throw new InvalidOperationException($"The factorisation needs an array of {count} entries, more than the largest array holds.");
        return native
            ? new FactorBuffer(null, new NativeBlock((int)count, pressure), (int)count)
            : new FactorBuffer(FactorMemory.Allocate(count), null, (int)count);
    }

    /// <summary>The entries. Throws <see cref="ObjectDisposedException"/> once disposed. Not for use while another thread
    /// may dispose the block: see <see cref="Enter"/>.</summary>
    public Span<double> Span
    {
        get
        {
            if (_native is null) return _array ?? throw Disposed();
            if (_native.IsClosed) throw Disposed();
            return _native.Span;
        }
    }

    /// <summary>The entries, held until <see cref="Exit"/>: a <see cref="Dispose"/> meanwhile (from another thread) frees
    /// the native memory only after <see cref="Exit"/>. Throws <see cref="ObjectDisposedException"/> once disposed.</summary>
    public Span<double> Enter()
    {
        if (_native is null) return _array ?? throw Disposed();
        bool added = false;
        try
        {
            _native.DangerousAddRef(ref added);
        }
        catch (ObjectDisposedException)
        {
            throw Disposed();
        }
        return _native.Span;
    }

    /// <summary>Ends an <see cref="Enter"/>.</summary>
    public void Exit() => _native?.DangerousRelease();

    /// <summary>Frees the block (native memory given back at once); later use throws <see cref="ObjectDisposedException"/>.</summary>
    public void Dispose()
    {
        _array = null;
        _native?.Dispose();
    }

    private static ObjectDisposedException Disposed() =>
        new(nameof(SupernodalFactor), "The factor was disposed and its memory released; factorise the matrix again to solve with it.");

    /// <summary>Native memory for <c>count</c> doubles: 64-byte aligned, and on Linux, when it spans at least one huge
    /// page (2 MiB), aligned to a huge page and advised for transparent huge pages (as the large managed arrays are,
    /// <see cref="FactorMemory"/>; no pinning to pay for here, so from one huge page on: the handed-over update matrices
    /// at 10⁶ unknowns, 86 MiB of fresh memory in blocks of a few MiB, cost 22,000 page faults more with 4 KiB pages).</summary>
    private sealed unsafe class NativeBlock : SafeHandle
    {
        private readonly int _count;
        private readonly long _pressure;

        public NativeBlock(int count, bool pressure) : base(IntPtr.Zero, ownsHandle: true)
        {
            _count = count;
            long bytes = Math.Max(1L, (long)count * sizeof(double));
            bool huge = bytes >= FactorMemory.HugePage && OperatingSystem.IsLinux();
            void* p = NativeMemory.AlignedAlloc((nuint)bytes, huge ? (nuint)FactorMemory.HugePage : 64);
            SetHandle((IntPtr)p);
            if (huge) FactorMemory.AdviseHugePages((nint)p, bytes);
            if (pressure)
            {
                _pressure = bytes;
                GC.AddMemoryPressure(bytes);
            }
        }

        public override bool IsInvalid => handle == IntPtr.Zero;

        public Span<double> Span => new((void*)handle, _count);

        protected override bool ReleaseHandle()
        {
            NativeMemory.AlignedFree((void*)handle);
            if (_pressure > 0) GC.RemoveMemoryPressure(_pressure);
            return true;
        }
    }
}
