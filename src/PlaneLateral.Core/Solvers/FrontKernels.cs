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
    /// Factorises the pivot columns of a front held in two pieces: its first <paramref name="k"/> columns, all m rows, in
    /// <paramref name="l"/> from <paramref name="off"/> (column-major, leading dimension m: the supernode's block of the factor,
    /// factorised in place), and its trailing (m−k)×(m−k) lower block in <paramref name="upd"/> (leading dimension m−k, the
    /// update matrix): F₁₁ = L₁₁L₁₁ᵀ, L₂₁ = F₂₁L₁₁⁻ᵀ, F₂₂ −= L₂₁L₂₁ᵀ.
    /// A pivot d with !(diag &gt; 0) or !(d &gt; tol·diag) (diag = the original K_jj) is reported through
    /// <paramref name="onFailure"/> (local column, pivot); its column is set to the unit vector and the elimination goes on.
    /// </summary>
    /// <remarks>Every entry receives the same operations in the same order as with the whole front in one m×m block (the
    /// update of an entry is one product summed over the panel from zero, then subtracted), so the split changes no bit.</remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void PartialCholesky(double[] l, int off, int m, int k, double[] upd, ReadOnlySpan<double> originalDiagonal,
        double tol, double[] packBuffer, int threads, Action<int, double> onFailure)
    {
        for (int c0 = 0; c0 < k; c0 += PanelWidth)
        {
            int w = Math.Min(PanelWidth, k - c0);
            // Panel: left-looking inside the panel (columns c0..c0+w, already updated by all earlier panels).
            for (int c = c0; c < c0 + w; c++)
            {
                var col = l.AsSpan(off + c * m + c, m - c);
                for (int p = c0; p < c; p++)
                {
                    double alpha = l[off + p * m + c];
                    if (alpha != 0.0) DenseKernels.SubtractScaled(col, alpha, l.AsSpan(off + p * m + c, m - c));
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
                double sq = Math.Sqrt(d);
                col[0] = sq;
                double rl = 1.0 / sq;
                var below = col[1..];
                for (int i = 0; i < below.Length; i++) below[i] *= rl;
            }
            int t0 = c0 + w;
            if (t0 >= m) continue;
            // Trailing pivot columns t0..k−1 (in the factor), then the update block (rows and columns k..m−1).
            if (t0 < k) RankUpdate(l, off, m, c0, w, t0, l, off + t0 * m + t0, m, k - t0, packBuffer, threads);
            if (k < m) RankUpdate(l, off, m, c0, w, k, upd, 0, m - k, m - k, packBuffer, threads);
        }
    }

    /// <summary>
    /// C (lower part) −= P·P₁ᵀ with P = rows t0..m−1 of the panel columns c0..c0+w of the block at <paramref name="off"/> in
    /// <paramref name="src"/> (leading dimension m) and P₁ its first <paramref name="cols"/> rows; C is (m−t0)×cols at
    /// <paramref name="cOff"/> in <paramref name="c"/> with leading dimension <paramref name="ldc"/>, its (0,0) entry the
    /// one of row t0, column t0.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void RankUpdate(double[] src, int off, int m, int c0, int w, int t0, double[] c, int cOff, int ldc, int cols,
        double[] pack, int threads)
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
                int from = off + (c0 + p) * m + i0;
                int dst = baseS + p * MR;
                int i = 0;
                for (; i < rows; i++) pack[dst + i] = src[from + i];
                for (; i < MR; i++) pack[dst + i] = 0.0;
            }
        }
        int colBlocks = (cols + NR - 1) / NR;
        if (r >= ParallelThreshold && threads > 1 && colBlocks > 1)
        {
            // Split the column blocks into chunks of about equal area (column block x spans rows x·NR .. r).
            int chunks = Math.Min(threads * 4, colBlocks);
            var bounds = new int[chunks + 1];
            double rb = (double)(r + NR - 1) / NR;
            double Area(double x) => x * rb - x * (x - 1) / 2;
            double total = Area(colBlocks);
            int cb = 0;
            for (int ch = 1; ch < chunks; ch++)
            {
                double target = total * ch / chunks;
                while (cb < colBlocks && Area(cb + 1) <= target) cb++;
                bounds[ch] = cb;
            }
            bounds[chunks] = colBlocks;
            Parallel.For(0, chunks, new ParallelOptions { MaxDegreeOfParallelism = threads },
                ch => UpdateColumns(c, cOff, ldc, w, r, cols, pack, bounds[ch], bounds[ch + 1]));
        }
        else UpdateColumns(c, cOff, ldc, w, r, cols, pack, 0, colBlocks);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void UpdateColumns(double[] f, int cOff, int ldc, int w, int r, int cols, double[] pack, int cbFrom, int cbTo)
    {
        Span<double> tile = stackalloc double[MR * NR];
        for (int cb = cbFrom; cb < cbTo; cb++)
        {
            int j = cb * NR;                // local column of C
            int ncol = Math.Min(NR, cols - j);
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
                    ref double cref = ref f[cOff + j * ldc + i];
                    Kernel8x4(pack, aBase, bBase, w, ref cref, ldc);
                }
                else
                {
                    TileScalarOrVector(pack, aBase, bBase, w, tile);
                    for (int cc = 0; cc < ncol; cc++)
                    {
                        int gcol = j + cc;
                        int colStart = cOff + gcol * ldc;
                        for (int rr = 0; rr < nrow; rr++)
                        {
                            int grow = i + rr;
                            if (grow >= gcol) f[colStart + grow] -= tile[cc * MR + rr];
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
