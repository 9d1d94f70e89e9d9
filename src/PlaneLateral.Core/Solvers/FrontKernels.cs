using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace PlaneLateral.Solvers;

/// <summary>
/// Dense kernels of the supernodal factorisation, on column-major blocks: the partial Cholesky factorisation of a frontal
/// matrix (blocked, right-looking: panel factorisation, then a symmetric rank-w update of the trailing matrix).
/// </summary>
/// <remarks>
/// <para>The rank-w update is the hot spot. It packs the panel into 8-row strips and computes the trailing lower triangle in
/// 8×4 register blocks (eight 256-bit accumulators), the usual register-blocking scheme of high-performance matrix
/// multiplication (Goto and van de Geijn, "Anatomy of high-performance matrix multiplication", ACM TOMS 34(3), 2008);
/// the code is this project's own.</para>
/// <para>Determinism: every entry of the result is computed by the same sequence of operations whatever the number of
/// threads (threads split the columns, never an inner sum), so results are bitwise reproducible on a given machine. Fused
/// multiply-add is used when the CPU has it, so results may differ in the last bits between CPUs with and without FMA.</para>
/// </remarks>
internal static class FrontKernels
{
    internal const int PanelWidth = 48;
    private const int MR = 8, NR = 4;

    /// <summary>Minimum trailing order for the rank-w update to be split between threads.</summary>
    internal static int ParallelThreshold = 384;

    private static readonly bool UseVectors =
        Vector256.IsHardwareAccelerated && !(AppContext.TryGetSwitch(DenseKernels.ScalarKernelsSwitch, out bool scalar) && scalar);

    /// <summary>
    /// Factorises the first <paramref name="k"/> columns of the m×m column-major lower matrix <paramref name="f"/>
    /// (leading dimension m): F₁₁ = L₁₁L₁₁ᵀ, L₂₁ = F₂₁L₁₁⁻ᵀ, F₂₂ −= L₂₁L₂₁ᵀ.
    /// A pivot d with !(diag &gt; 0) or !(d &gt; tol·diag) (diag = the original K_jj) is reported through
    /// <paramref name="onFailure"/> (local column, pivot); its column is set to the unit vector and the elimination goes on.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void PartialCholesky(double[] f, int m, int k, ReadOnlySpan<double> originalDiagonal, double tol,
        double[] packBuffer, int threads, Action<int, double> onFailure)
    {
        for (int c0 = 0; c0 < k; c0 += PanelWidth)
        {
            int w = Math.Min(PanelWidth, k - c0);
            // Panel: left-looking inside the panel (columns c0..c0+w, already updated by all earlier panels).
            for (int c = c0; c < c0 + w; c++)
            {
                var col = f.AsSpan(c * m + c, m - c);
                for (int p = c0; p < c; p++)
                {
                    double alpha = f[p * m + c];
                    if (alpha != 0.0) DenseKernels.SubtractScaled(col, alpha, f.AsSpan(p * m + c, m - c));
                }
                double d = col[0];
                double kjj = originalDiagonal[c];
                if (!(kjj > 0.0) || !(d > tol * kjj) || !double.IsFinite(d) || !double.IsFinite(kjj))
                {
                    onFailure(c, d);
                    col.Clear();
                    col[0] = 1.0;
                    continue;
                }
                double l = Math.Sqrt(d);
                col[0] = l;
                double rl = 1.0 / l;
                var below = col[1..];
                for (int i = 0; i < below.Length; i++) below[i] *= rl;
            }
            int t0 = c0 + w;
            if (t0 < m) RankUpdate(f, m, c0, w, t0, packBuffer, threads);
        }
    }

    /// <summary>F[t0.., t0..] (lower) −= P·Pᵀ with P = F[t0.., c0..c0+w).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void RankUpdate(double[] f, int m, int c0, int w, int t0, double[] pack, int threads)
    {
        int r = m - t0;
        int strips = (r + MR - 1) / MR;
        // Pack: strip s, column p → pack[(s·w + p)·8 .. +8).
        for (int s = 0; s < strips; s++)
        {
            int i0 = t0 + s * MR;
            int rows = Math.Min(MR, m - i0);
            int baseS = s * w * MR;
            for (int p = 0; p < w; p++)
            {
                int src = (c0 + p) * m + i0;
                int dst = baseS + p * MR;
                int i = 0;
                for (; i < rows; i++) pack[dst + i] = f[src + i];
                for (; i < MR; i++) pack[dst + i] = 0.0;
            }
        }
        int colBlocks = (r + NR - 1) / NR;
        if (r >= ParallelThreshold && threads > 1)
        {
            // Split the column blocks into chunks of about equal triangular area.
            int chunks = threads * 4;
            var bounds = new int[chunks + 1];
            double total = (double)colBlocks * (colBlocks + 1) / 2;
            int cb = 0;
            for (int c = 1; c < chunks; c++)
            {
                double target = total * c / chunks;
                // area of columns [0, x) = x·colBlocks − x(x−1)/2
                while (cb < colBlocks && (double)(cb + 1) * colBlocks - (double)(cb + 1) * cb / 2 <= target) cb++;
                bounds[c] = cb;
            }
            bounds[chunks] = colBlocks;
            Parallel.For(0, chunks, new ParallelOptions { MaxDegreeOfParallelism = threads },
                c => UpdateColumns(f, m, t0, w, r, pack, bounds[c], bounds[c + 1]));
        }
        else UpdateColumns(f, m, t0, w, r, pack, 0, colBlocks);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void UpdateColumns(double[] f, int m, int t0, int w, int r, double[] pack, int cbFrom, int cbTo)
    {
        Span<double> tile = stackalloc double[MR * NR];
        for (int cb = cbFrom; cb < cbTo; cb++)
        {
            int j = cb * NR;                // local column in the trailing block
            int ncol = Math.Min(NR, r - j);
            int bStrip = j / MR, bLane = j % MR;
            int bBase = bStrip * w * MR + bLane;
            for (int s = j / MR; s * MR < r; s++)
            {
                int i = s * MR;             // local row of the strip
                int nrow = Math.Min(MR, r - i);
                int aBase = s * w * MR;
                bool full = nrow == MR && ncol == NR && i >= j + NR - 1 && UseVectors;
                if (full)
                {
                    // Whole 8×4 tile strictly inside the lower part: subtract in place.
                    ref double cref = ref f[(t0 + j) * m + t0 + i];
                    Kernel8x4(pack, aBase, bBase, w, ref cref, m);
                }
                else
                {
                    TileScalarOrVector(pack, aBase, bBase, w, tile);
                    for (int c = 0; c < ncol; c++)
                    {
                        int gcol = j + c;
                        int colStart = (t0 + gcol) * m + t0;
                        for (int rr = 0; rr < nrow; rr++)
                        {
                            int grow = i + rr;
                            if (grow >= gcol) f[colStart + grow] -= tile[c * MR + rr];
                        }
                    }
                }
            }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> Fmadd(Vector256<double> a, Vector256<double> b, Vector256<double> c) =>
        Fma.IsSupported ? Fma.MultiplyAdd(a, b, c) : a * b + c;

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Kernel8x4(double[] pack, int aBase, int bBase, int w, ref double c, int ldc)
    {
        ref double pk = ref MemoryMarshal.GetArrayDataReference(pack);
        var c00 = Vector256<double>.Zero; var c10 = Vector256<double>.Zero;
        var c01 = Vector256<double>.Zero; var c11 = Vector256<double>.Zero;
        var c02 = Vector256<double>.Zero; var c12 = Vector256<double>.Zero;
        var c03 = Vector256<double>.Zero; var c13 = Vector256<double>.Zero;
        nuint pa = (nuint)aBase, pb = (nuint)bBase;
        for (int p = 0; p < w; p++)
        {
            var a0 = Vector256.LoadUnsafe(ref pk, pa);
            var a1 = Vector256.LoadUnsafe(ref pk, pa + 4);
            var b = Vector256.Create(Unsafe.Add(ref pk, pb));
            c00 = Fmadd(a0, b, c00); c10 = Fmadd(a1, b, c10);
            b = Vector256.Create(Unsafe.Add(ref pk, pb + 1));
            c01 = Fmadd(a0, b, c01); c11 = Fmadd(a1, b, c11);
            b = Vector256.Create(Unsafe.Add(ref pk, pb + 2));
            c02 = Fmadd(a0, b, c02); c12 = Fmadd(a1, b, c12);
            b = Vector256.Create(Unsafe.Add(ref pk, pb + 3));
            c03 = Fmadd(a0, b, c03); c13 = Fmadd(a1, b, c13);
            pa += MR;
            pb += MR;
        }
        nuint ld = (nuint)ldc;
        Sub(ref c, 0, c00); Sub(ref c, 4, c10);
        Sub(ref c, ld, c01); Sub(ref c, ld + 4, c11);
        Sub(ref c, 2 * ld, c02); Sub(ref c, 2 * ld + 4, c12);
        Sub(ref c, 3 * ld, c03); Sub(ref c, 3 * ld + 4, c13);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Sub(ref double c, nuint offset, Vector256<double> v) =>
        (Vector256.LoadUnsafe(ref c, offset) - v).StoreUnsafe(ref c, offset);

    /// <summary>The 8×4 tile product (same operation order as the vector kernel: one multiply-add per p, in order).</summary>
    private static void TileScalarOrVector(double[] pack, int aBase, int bBase, int w, Span<double> tile)
    {
        tile.Clear();
        for (int p = 0; p < w; p++)
        {
            int pa = aBase + p * MR, pb = bBase + p * MR;
            for (int c = 0; c < NR; c++)
            {
                double b = pack[pb + c];
                for (int rr = 0; rr < MR; rr++)
                    tile[c * MR + rr] = Fma.IsSupported && UseVectors
                        ? Math.FusedMultiplyAdd(pack[pa + rr], b, tile[c * MR + rr])
                        : pack[pa + rr] * b + tile[c * MR + rr];
            }
        }
    }
}
