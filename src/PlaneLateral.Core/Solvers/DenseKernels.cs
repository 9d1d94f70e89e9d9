using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace PlaneLateral.Solvers;

/// <summary>
/// The two inner loops of the envelope factorisation and solves: a dot product and an "y −= α·x" update.
/// </summary>
/// <remarks>
/// Reproducibility: <see cref="Dot"/> always sums in the same fixed order — eight interleaved partial sums
/// (element k goes to partial sum k mod 8), combined as ((s0+s4)+(s1+s5)) + ((s2+s6)+(s3+s7)), then the tail in order —
/// whether it runs on 256-bit vectors or on the scalar fallback, so a result does not depend on the CPU's vector width.
/// No fused multiply-add is used (the JIT does not contract a*b+c on its own). <see cref="SubtractScaled"/> is element-wise
/// and so is the same on every path.
/// </remarks>
internal static class DenseKernels
{
    private const int Block = 8; // two Vector256<double> accumulators

    /// <summary>Name of the AppContext switch that forces the scalar kernels (for measuring what the vector ones gain).</summary>
    public const string ScalarKernelsSwitch = "PlaneLateral.Solvers.ScalarKernels";

    /// <summary>Vector kernels are used when the CPU runs 256-bit vectors and the switch above is not set. Read once.</summary>
    internal static readonly bool UseVectors =
        Vector256.IsHardwareAccelerated && !(AppContext.TryGetSwitch(ScalarKernelsSwitch, out bool scalar) && scalar);

    /// <summary>Σ a[k]·b[k] over the common length (spans must have equal length).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        if (n < Block) return DotShort(a, b);
        return UseVectors ? DotVector(a, b) : DotScalar8(a, b);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double DotShort(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double s = 0.0;
        b = b[..a.Length];
        for (int k = 0; k < a.Length; k++) s += a[k] * b[k];
        return s;
    }

    private static double DotVector(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        if (b.Length < n) throw new ArgumentException("Spans differ in length.");
        ref double ra = ref MemoryMarshal.GetReference(a);
        ref double rb = ref MemoryMarshal.GetReference(b);
        var acc0 = Vector256<double>.Zero;
        var acc1 = Vector256<double>.Zero;
        int k = 0;
        int limit = n - Block;
        for (; k <= limit; k += Block)
        {
            acc0 += Vector256.LoadUnsafe(ref ra, (nuint)k) * Vector256.LoadUnsafe(ref rb, (nuint)k);
            acc1 += Vector256.LoadUnsafe(ref ra, (nuint)(k + 4)) * Vector256.LoadUnsafe(ref rb, (nuint)(k + 4));
        }
        double s = ((acc0.GetElement(0) + acc1.GetElement(0)) + (acc0.GetElement(1) + acc1.GetElement(1)))
                 + ((acc0.GetElement(2) + acc1.GetElement(2)) + (acc0.GetElement(3) + acc1.GetElement(3)));
        for (; k < n; k++) s += Unsafe.Add(ref ra, k) * Unsafe.Add(ref rb, k);
        return s;
    }

    /// <summary>Scalar path with exactly the summation order of <see cref="DotVector"/>.</summary>
    internal static double DotScalar8(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        b = b[..n];
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, s5 = 0, s6 = 0, s7 = 0;
        int k = 0;
        for (; k <= n - Block; k += Block)
        {
            s0 += a[k] * b[k];
            s1 += a[k + 1] * b[k + 1];
            s2 += a[k + 2] * b[k + 2];
            s3 += a[k + 3] * b[k + 3];
            s4 += a[k + 4] * b[k + 4];
            s5 += a[k + 5] * b[k + 5];
            s6 += a[k + 6] * b[k + 6];
            s7 += a[k + 7] * b[k + 7];
        }
        double s = ((s0 + s4) + (s1 + s5)) + ((s2 + s6) + (s3 + s7));
        for (; k < n; k++) s += a[k] * b[k];
        return s;
    }

    /// <summary>y[k] −= alpha·x[k] (spans must have equal length).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static void SubtractScaled(Span<double> y, double alpha, ReadOnlySpan<double> x)
    {
        int n = y.Length;
        if (x.Length < n) throw new ArgumentException("Spans differ in length.");
        int k = 0;
        if (UseVectors && n >= 4)
        {
            ref double ry = ref MemoryMarshal.GetReference(y);
            ref double rx = ref MemoryMarshal.GetReference(x);
            var va = Vector256.Create(alpha);
            for (; k <= n - 4; k += 4)
            {
                var v = Vector256.LoadUnsafe(ref ry, (nuint)k) - va * Vector256.LoadUnsafe(ref rx, (nuint)k);
                v.StoreUnsafe(ref ry, (nuint)k);
            }
        }
        for (; k < n; k++) y[k] -= alpha * x[k];
    }
}
