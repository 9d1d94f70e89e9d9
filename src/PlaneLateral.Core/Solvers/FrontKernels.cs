using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace PlaneLateral.Solvers;

/// <summary>
/// Dense kernels of the supernodal factorisation, on column-major blocks: the partial Cholesky factorisation of a frontal
/// matrix (blocked, right-looking: panel factorisation, then a symmetric rank-w update of the trailing matrix).
/// </summary>
/// <remarks>
/// <para>The rank-w update is the hot spot. It packs the panel into 8-row strips and computes the trailing lower triangle in
/// 8×4 register blocks (eight 256-bit accumulators), the usual register-blocking scheme of high-performance matrix
/// multiplication (Goto and van de Geijn, "Anatomy of high-performance matrix multiplication", ACM TOMS 34(3), 2008);
/// the code is this project's own. Tiles on the diagonal and at the edges go through the same vector kernel into a
/// small buffer, of which only the entries in the lower part are subtracted.</para>
/// <para>Determinism: every entry of the result is computed by the same sequence of operations whatever the number of
/// threads (threads split the columns, never an inner sum) and whatever the vector width
/// (<see cref="DenseKernels.VectorBits"/>: 256-bit, 128-bit or scalar): an entry of a tile is a sum over the panel
/// from zero, one product and one addition per panel column in order, then subtracted; a panel column is updated by
/// subtracting one product per earlier panel column in order. No fused multiply-add is used anywhere (a fused
/// multiply-add rounds once where the other paths round twice), so the factor has the same bits on every x64 or Arm
/// CPU and with the vector instructions switched off.</para>
/// </remarks>
internal static class FrontKernels
{
    internal const int PanelWidth = 48;
    private const int MR = 8, NR = 4;

    /// <summary>Minimum trailing order for the rank-w update to be split between threads.</summary>
    internal static int ParallelThreshold = 384;

    /// <summary>
    /// Factorises the pivot columns of a front held in two pieces: its first <paramref name="k"/> columns, all m rows, in
    /// <paramref name="l"/> from <paramref name="off"/> (column-major, leading dimension m: the supernode's block of the factor,
    /// factorised in place), and its trailing (m−k)×(m−k) lower block in <paramref name="upd"/> (leading dimension m−k, the
    /// update matrix): F₁₁ = L₁₁L₁₁ᵀ, L₂₁ = F₂₁L₁₁⁻ᵀ, F₂₂ −= L₂₁L₂₁ᵀ.
    /// A pivot d with !(diag &gt; 0) or !(d &gt; tol·diag) (diag = the original K_jj) is added to
    /// <paramref name="failures"/> (local column, pivot); its column is set to the unit vector and the elimination goes on.
    /// </summary>
    /// <remarks>Every entry receives the same operations in the same order as with the whole front in one m×m block (the
    /// update of an entry is one product summed over the panel from zero, then subtracted), so the split changes no bit.</remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void PartialCholesky(Span<double> l, int off, int m, int k, Span<double> upd, ReadOnlySpan<double> originalDiagonal,
        double tol, double[] packBuffer, int threads, List<(int Column, double Pivot)> failures)
    {
        for (int c0 = 0; c0 < k; c0 += PanelWidth)
        {
            int w = Math.Min(PanelWidth, k - c0);
            // Panel: left-looking inside the panel (columns c0..c0+w, already updated by all earlier panels).
            for (int c = c0; c < c0 + w; c++)
            {
                int colStart = off + c * m + c;
                if (c > c0) PanelColumn(l, off, m, c0, c);
                double d = l[colStart];
                double kjj = originalDiagonal[c];
                if (!(kjj > 0.0) || !(d > tol * kjj) || !double.IsFinite(d) || !double.IsFinite(kjj))
                {
                    failures.Add((c, d));
                    l.Slice(colStart, m - c).Clear();
                    l[colStart] = 1.0;
                    continue;
                }
                double sq = Math.Sqrt(d);
                l[colStart] = sq;
                Scale(l, colStart + 1, m - c - 1, 1.0 / sq);
            }
            int t0 = c0 + w;
            if (t0 >= m) continue;
            // Trailing pivot columns t0..k−1 (in the factor), then the update block (rows and columns k..m−1).
            if (t0 < k) RankUpdate(l, off, m, c0, w, t0, l, off + t0 * m + t0, m, k - t0, packBuffer, threads);
            if (k < m) RankUpdate(l, off, m, c0, w, k, upd, 0, m - k, m - k, packBuffer, threads);
        }
    }

    /// <summary>Column c of the panel, rows c..m−1: y −= x_p·l[c, p] for the panel columns p = c0..c−1 in order (one
    /// product, one subtraction each; the same order at every vector width).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void PanelColumn(Span<double> l, int off, int m, int c0, int c)
    {
        int len = m - c;
        ref double lr = ref MemoryMarshal.GetReference(l);
        nuint y = (nuint)(off + c * m + c);
        nuint first = (nuint)(off + c0 * m + c); // column c0, row c
        nuint step = (nuint)m;
        int count = c - c0;
        int i = 0;
        int bits = DenseKernels.VectorBits;
        if (bits == 256)
        {
            for (; i + 8 <= len; i += 8)
            {
                nuint yi = y + (nuint)i;
                var y0 = Vector256.LoadUnsafe(ref lr, yi);
                var y1 = Vector256.LoadUnsafe(ref lr, yi + 4);
                nuint x = first;
                for (int p = 0; p < count; p++, x += step)
                {
                    var a = Vector256.Create(Unsafe.Add(ref lr, x));
                    y0 -= Vector256.LoadUnsafe(ref lr, x + (nuint)i) * a;
                    y1 -= Vector256.LoadUnsafe(ref lr, x + (nuint)i + 4) * a;
                }
                y0.StoreUnsafe(ref lr, yi);
                y1.StoreUnsafe(ref lr, yi + 4);
            }
            for (; i + 4 <= len; i += 4)
            {
                nuint yi = y + (nuint)i;
                var y0 = Vector256.LoadUnsafe(ref lr, yi);
                nuint x = first;
                for (int p = 0; p < count; p++, x += step)
                    y0 -= Vector256.LoadUnsafe(ref lr, x + (nuint)i) * Vector256.Create(Unsafe.Add(ref lr, x));
                y0.StoreUnsafe(ref lr, yi);
            }
        }
        else if (bits == 128)
        {
            for (; i + 8 <= len; i += 8)
            {
                nuint yi = y + (nuint)i;
                var y0 = Vector128.LoadUnsafe(ref lr, yi);
                var y1 = Vector128.LoadUnsafe(ref lr, yi + 2);
                var y2 = Vector128.LoadUnsafe(ref lr, yi + 4);
                var y3 = Vector128.LoadUnsafe(ref lr, yi + 6);
                nuint x = first;
                for (int p = 0; p < count; p++, x += step)
                {
                    var a = Vector128.Create(Unsafe.Add(ref lr, x));
                    nuint xi = x + (nuint)i;
                    y0 -= Vector128.LoadUnsafe(ref lr, xi) * a;
                    y1 -= Vector128.LoadUnsafe(ref lr, xi + 2) * a;
                    y2 -= Vector128.LoadUnsafe(ref lr, xi + 4) * a;
                    y3 -= Vector128.LoadUnsafe(ref lr, xi + 6) * a;
                }
                y0.StoreUnsafe(ref lr, yi);
                y1.StoreUnsafe(ref lr, yi + 2);
                y2.StoreUnsafe(ref lr, yi + 4);
                y3.StoreUnsafe(ref lr, yi + 6);
            }
            for (; i + 2 <= len; i += 2)
            {
                nuint yi = y + (nuint)i;
                var y0 = Vector128.LoadUnsafe(ref lr, yi);
                nuint x = first;
                for (int p = 0; p < count; p++, x += step)
                    y0 -= Vector128.LoadUnsafe(ref lr, x + (nuint)i) * Vector128.Create(Unsafe.Add(ref lr, x));
                y0.StoreUnsafe(ref lr, yi);
            }
        }
        for (; i < len; i++)
        {
            nuint yi = y + (nuint)i;
            double v = Unsafe.Add(ref lr, yi);
            nuint x = first;
            for (int p = 0; p < count; p++, x += step)
                v -= Unsafe.Add(ref lr, x + (nuint)i) * Unsafe.Add(ref lr, x);
            Unsafe.Add(ref lr, yi) = v;
        }
    }

    /// <summary>x[from..from+n) *= s (element-wise: the same on every path).</summary>
    private static void Scale(Span<double> x, int from, int n, double s)
    {
        var span = x.Slice(from, n);
        for (int i = 0; i < span.Length; i++) span[i] *= s;
    }

    /// <summary>
    /// C (lower part) −= P·P₁ᵀ with P = rows t0..m−1 of the panel columns c0..c0+w of the block at <paramref name="off"/> in
    /// <paramref name="src"/> (leading dimension m) and P₁ its first <paramref name="cols"/> rows; C is (m−t0)×cols at
    /// <paramref name="cOff"/> in <paramref name="c"/> with leading dimension <paramref name="ldc"/>, its (0,0) entry the
    /// one of row t0, column t0.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static unsafe void RankUpdate(Span<double> src, int off, int m, int c0, int w, int t0, Span<double> c, int cOff, int ldc, int cols,
        double[] pack, int threads)
    {
        int r = m - t0;
        int strips = (r + MR - 1) / MR;
        // Pack: strip s, column p → pack[(s·w + p)·8 .. +8), rows past the end zero.
        ref double sr = ref MemoryMarshal.GetReference(src);
        ref double pr = ref MemoryMarshal.GetArrayDataReference(pack);
        if ((long)strips * w * MR > pack.Length) throw new ArgumentException("Packing buffer too small.", nameof(pack));
        for (int s = 0; s < strips; s++)
        {
            int i0 = t0 + s * MR;
            int rows = Math.Min(MR, m - i0);
            int baseS = s * w * MR;
            for (int p = 0; p < w; p++)
            {
                nuint from = (nuint)(off + (c0 + p) * m + i0);
                nuint dst = (nuint)(baseS + p * MR);
                if (rows == MR)
                    Unsafe.CopyBlockUnaligned(ref Unsafe.As<double, byte>(ref Unsafe.Add(ref pr, dst)),
                        ref Unsafe.As<double, byte>(ref Unsafe.Add(ref sr, from)), MR * sizeof(double));
                else
                {
                    int i = 0;
                    for (; i < rows; i++) Unsafe.Add(ref pr, dst + (nuint)i) = Unsafe.Add(ref sr, from + (nuint)i);
                    for (; i < MR; i++) Unsafe.Add(ref pr, dst + (nuint)i) = 0.0;
                }
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
            // The workers see the same block through its address (a span cannot be captured): fixed for the duration.
            fixed (double* cp = c)
            {
                nint at = (nint)cp;
                int length = c.Length;
                Parallel.For(0, chunks, new ParallelOptions { MaxDegreeOfParallelism = threads },
                    ch => UpdateColumns(new Span<double>((void*)at, length), cOff, ldc, w, r, cols, pack, bounds[ch], bounds[ch + 1]));
            }
        }
        else UpdateColumns(c, cOff, ldc, w, r, cols, pack, 0, colBlocks);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void UpdateColumns(Span<double> f, int cOff, int ldc, int w, int r, int cols, double[] pack, int cbFrom, int cbTo)
    {
        Span<double> tile = stackalloc double[MR * NR];
        ref double tr = ref MemoryMarshal.GetReference(tile);
        ref double pk = ref MemoryMarshal.GetArrayDataReference(pack);
        ref double fr = ref MemoryMarshal.GetReference(f);
        if ((long)cOff + (long)(cols - 1) * ldc + r > f.Length) throw new ArgumentException("Update block out of range.", nameof(f));
        int bits = DenseKernels.VectorBits;
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
                // A whole 8×4 tile strictly inside the lower part is subtracted in place; others go through the buffer.
                bool full = nrow == MR && ncol == NR && i >= j + NR - 1;
                ref double dst = ref full ? ref Unsafe.Add(ref fr, cOff + j * ldc + i) : ref tr;
                nuint ld = full ? (nuint)ldc : MR;
                if (bits == 256) Kernel8x4(ref pk, aBase, bBase, w, ref dst, ld, full);
                else if (bits == 128)
                {
                    Kernel8x2(ref pk, aBase, bBase, w, ref dst, ld, full);
                    Kernel8x2(ref pk, aBase, bBase + 2, w, ref Unsafe.Add(ref dst, 2 * ld), ld, full);
                }
                else TileScalar(ref pk, aBase, bBase, w, ref dst, ld, full);
                if (full) continue;
                for (int cc = 0; cc < ncol; cc++)
                {
                    int gcol = j + cc;
                    int colStart = cOff + gcol * ldc;
                    for (int rr = Math.Max(0, gcol - i); rr < nrow; rr++)
                        Unsafe.Add(ref fr, colStart + i + rr) -= Unsafe.Add(ref tr, cc * MR + rr);
                }
            }
        }
    }

    /// <summary>The 8×4 tile Σ_p a_p·b_pᵀ (from zero, one product and one addition per p in order) on 256-bit vectors:
    /// subtracted from <paramref name="c"/> (leading dimension <paramref name="ldc"/>) or stored there.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Kernel8x4(ref double pk, int aBase, int bBase, int w, ref double c, nuint ldc, bool subtract)
    {
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
            c00 += a0 * b; c10 += a1 * b;
            b = Vector256.Create(Unsafe.Add(ref pk, pb + 1));
            c01 += a0 * b; c11 += a1 * b;
            b = Vector256.Create(Unsafe.Add(ref pk, pb + 2));
            c02 += a0 * b; c12 += a1 * b;
            b = Vector256.Create(Unsafe.Add(ref pk, pb + 3));
            c03 += a0 * b; c13 += a1 * b;
            pa += MR;
            pb += MR;
        }
        if (subtract)
        {
            Sub(ref c, 0, c00); Sub(ref c, 4, c10);
            Sub(ref c, ldc, c01); Sub(ref c, ldc + 4, c11);
            Sub(ref c, 2 * ldc, c02); Sub(ref c, 2 * ldc + 4, c12);
            Sub(ref c, 3 * ldc, c03); Sub(ref c, 3 * ldc + 4, c13);
        }
        else
        {
            c00.StoreUnsafe(ref c, 0); c10.StoreUnsafe(ref c, 4);
            c01.StoreUnsafe(ref c, ldc); c11.StoreUnsafe(ref c, ldc + 4);
            c02.StoreUnsafe(ref c, 2 * ldc); c12.StoreUnsafe(ref c, 2 * ldc + 4);
            c03.StoreUnsafe(ref c, 3 * ldc); c13.StoreUnsafe(ref c, 3 * ldc + 4);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Sub(ref double c, nuint offset, Vector256<double> v) =>
        (Vector256.LoadUnsafe(ref c, offset) - v).StoreUnsafe(ref c, offset);

    /// <summary>Two columns of the 8×4 tile (lanes <paramref name="bBase"/>, +1) on 128-bit vectors, in the order of
    /// <see cref="Kernel8x4"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Kernel8x2(ref double pk, int aBase, int bBase, int w, ref double c, nuint ldc, bool subtract)
    {
        var c00 = Vector128<double>.Zero; var c10 = Vector128<double>.Zero; var c20 = Vector128<double>.Zero; var c30 = Vector128<double>.Zero;
        var c01 = Vector128<double>.Zero; var c11 = Vector128<double>.Zero; var c21 = Vector128<double>.Zero; var c31 = Vector128<double>.Zero;
        nuint pa = (nuint)aBase, pb = (nuint)bBase;
        for (int p = 0; p < w; p++)
        {
            var a0 = Vector128.LoadUnsafe(ref pk, pa);
            var a1 = Vector128.LoadUnsafe(ref pk, pa + 2);
            var a2 = Vector128.LoadUnsafe(ref pk, pa + 4);
            var a3 = Vector128.LoadUnsafe(ref pk, pa + 6);
            var b = Vector128.Create(Unsafe.Add(ref pk, pb));
            c00 += a0 * b; c10 += a1 * b; c20 += a2 * b; c30 += a3 * b;
            b = Vector128.Create(Unsafe.Add(ref pk, pb + 1));
            c01 += a0 * b; c11 += a1 * b; c21 += a2 * b; c31 += a3 * b;
            pa += MR;
            pb += MR;
        }
        if (subtract)
        {
            Sub(ref c, 0, c00); Sub(ref c, 2, c10); Sub(ref c, 4, c20); Sub(ref c, 6, c30);
            Sub(ref c, ldc, c01); Sub(ref c, ldc + 2, c11); Sub(ref c, ldc + 4, c21); Sub(ref c, ldc + 6, c31);
        }
        else
        {
            c00.StoreUnsafe(ref c, 0); c10.StoreUnsafe(ref c, 2); c20.StoreUnsafe(ref c, 4); c30.StoreUnsafe(ref c, 6);
            c01.StoreUnsafe(ref c, ldc); c11.StoreUnsafe(ref c, ldc + 2); c21.StoreUnsafe(ref c, ldc + 4); c31.StoreUnsafe(ref c, ldc + 6);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Sub(ref double c, nuint offset, Vector128<double> v) =>
        (Vector128.LoadUnsafe(ref c, offset) - v).StoreUnsafe(ref c, offset);

    /// <summary>The 8×4 tile without vectors, in the order of <see cref="Kernel8x4"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void TileScalar(ref double pk, int aBase, int bBase, int w, ref double c, nuint ldc, bool subtract)
    {
        Span<double> t = stackalloc double[MR * NR];
        t.Clear();
        for (int p = 0; p < w; p++)
        {
            nuint pa = (nuint)(aBase + p * MR), pb = (nuint)(bBase + p * MR);
            for (int cc = 0; cc < NR; cc++)
            {
                double b = Unsafe.Add(ref pk, pb + (nuint)cc);
                for (int rr = 0; rr < MR; rr++) t[cc * MR + rr] += Unsafe.Add(ref pk, pa + (nuint)rr) * b;
            }
        }
        for (int cc = 0; cc < NR; cc++)
            for (int rr = 0; rr < MR; rr++)
            {
                ref double e = ref Unsafe.Add(ref c, (nuint)cc * ldc + (nuint)rr);
                e = subtract ? e - t[cc * MR + rr] : t[cc * MR + rr];
            }
    }
}
