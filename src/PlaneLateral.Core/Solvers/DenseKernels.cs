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
/// whether it runs on 256-bit vectors, on 128-bit vectors or on the scalar fallback, so a result does not depend on the
/// CPU's vector width. No fused multiply-add is used (the JIT does not contract a*b+c on its own). <see cref="SubtractScaled"/>
/// is element-wise and so is the same on every path. <see cref="VectorBits"/> says which path runs.
/// </remarks>
internal static class DenseKernels
{
    private const int Block = 8; // two Vector256<double> accumulators

    /// <summary>Name of the AppContext switch that forces the scalar kernels (for measuring what the vector ones gain).</summary>
    public const string ScalarKernelsSwitch = "PlaneLateral.Solvers.ScalarKernels";

    /// <summary>
    /// The vector width the dense kernels (these and <see cref="FrontKernels"/>) run at: 256 when the CPU runs 256-bit
    /// vectors, else 128 when it runs 128-bit ones, else 0 (scalar); 0 also when the switch above is set. Every width gives
    /// the same bits, so tests may change it in process to compare the paths (it is read once per kernel call).
    /// </summary>
    internal static int VectorBits = DetectVectorBits();

    internal static int DetectVectorBits()
    {
        if (AppContext.TryGetSwitch(ScalarKernelsSwitch, out bool scalar) && scalar) return 0;
        if (Vector256.IsHardwareAccelerated) return 256;
        return Vector128.IsHardwareAccelerated ? 128 : 0;
    }

    /// <summary>Σ a[k]·b[k] over the common length (spans must have equal length).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        if (n < Block) return DotShort(a, b);
        return VectorBits switch
        {
            256 => DotVector(a, b),
            128 => DotVector128(a, b),
            _ => DotScalar8(a, b),
        };
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double DotShort(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double s = 0.0;
        b = b[..a.Length];
        for (int k = 0; k < a.Length; k++) s += a[k] * b[k];
        return s;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
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

    /// <summary>128-bit path with the summation order of <see cref="DotVector"/> (partial sums k mod 8 in four vectors).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double DotVector128(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        if (b.Length < n) throw new ArgumentException("Spans differ in length.");
        ref double ra = ref MemoryMarshal.GetReference(a);
        ref double rb = ref MemoryMarshal.GetReference(b);
        var acc0 = Vector128<double>.Zero; // s0, s1
        var acc1 = Vector128<double>.Zero; // s2, s3
        var acc2 = Vector128<double>.Zero; // s4, s5
        var acc3 = Vector128<double>.Zero; // s6, s7
        int k = 0;
        int limit = n - Block;
        for (; k <= limit; k += Block)
        {
            nuint u = (nuint)k;
            acc0 += Vector128.LoadUnsafe(ref ra, u) * Vector128.LoadUnsafe(ref rb, u);
            acc1 += Vector128.LoadUnsafe(ref ra, u + 2) * Vector128.LoadUnsafe(ref rb, u + 2);
            acc2 += Vector128.LoadUnsafe(ref ra, u + 4) * Vector128.LoadUnsafe(ref rb, u + 4);
            acc3 += Vector128.LoadUnsafe(ref ra, u + 6) * Vector128.LoadUnsafe(ref rb, u + 6);
        }
        double s = ((acc0.GetElement(0) + acc2.GetElement(0)) + (acc0.GetElement(1) + acc2.GetElement(1)))
                 + ((acc1.GetElement(0) + acc3.GetElement(0)) + (acc1.GetElement(1) + acc3.GetElement(1)));
        for (; k < n; k++) s += Unsafe.Add(ref ra, k) * Unsafe.Add(ref rb, k);
        return s;
    }

    /// <summary>Scalar path with exactly the summation order of <see cref="DotVector"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
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
        int bits = VectorBits;
        if (bits != 0 && n >= 4)
        {
            ref double ry = ref MemoryMarshal.GetReference(y);
            ref double rx = ref MemoryMarshal.GetReference(x);
            if (bits == 256)
            {
                var va = Vector256.Create(alpha);
                for (; k <= n - 4; k += 4)
                {
                    var v = Vector256.LoadUnsafe(ref ry, (nuint)k) - va * Vector256.LoadUnsafe(ref rx, (nuint)k);
                    v.StoreUnsafe(ref ry, (nuint)k);
                }
            }
            else
            {
                var va = Vector128.Create(alpha);
                for (; k <= n - 2; k += 2)
                {
                    var v = Vector128.LoadUnsafe(ref ry, (nuint)k) - va * Vector128.LoadUnsafe(ref rx, (nuint)k);
                    v.StoreUnsafe(ref ry, (nuint)k);
                }
            }
        }
        for (; k < n; k++) y[k] -= alpha * x[k];
    }
}
