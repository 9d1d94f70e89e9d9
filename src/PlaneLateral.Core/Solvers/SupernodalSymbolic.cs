using System.Runtime.CompilerServices;

namespace PlaneLateral.Solvers;

/// <summary>
/// Symbolic analysis for the supernodal Cholesky factor of P·K·Pᵀ: elimination tree, postorder, column counts,
/// fundamental supernodes with relaxed amalgamation, and the row pattern of every supernode.
/// </summary>
/// <remarks>
/// <list type="bullet">
/// <item>Elimination tree: Liu's algorithm with path compression (J. W. H. Liu, "The role of elimination trees in sparse
/// factorization", SIAM J. Matrix Anal. Appl. 11(1), 1990, §3; Davis 2006, §4.1).</item>
/// <item>Postorder: depth-first, children visited in increasing order (Liu 1990, §2); the ordering is composed with it, so the
/// factor's columns are postordered and every supernode is a contiguous range.</item>
/// <item>Column counts: the pattern of row k of L is the subtree of the elimination tree spanned by the entries of row k of
/// the matrix (Liu 1990, §3.2); each column's count is the number of such row subtrees it lies in, found from the leaves of
/// the row subtrees and least common ancestors (Gilbert, Ng and Peyton 1994; Davis 2006, §4.5): O(nnz(A)·α(n)) time, not
/// the O(nnz(L)) of walking every row subtree.</item>
/// <item>Fundamental supernodes: column j joins j−1 when j is j−1's parent, its only child, and count(j−1) = count(j)+1
/// (Liu, Ng and Peyton, "On finding supernodes for sparse matrix computations", SIAM J. Matrix Anal. Appl. 14(1), 1993).</item>
/// <item>Relaxed amalgamation: a supernode is merged with its parent when they are contiguous and the explicit zeros this adds
/// stay under a size-dependent share (Ashcraft and Grimes, "The influence of relaxed supernode partitions on the multifrontal
/// method", ACM TOMS 15(4), 1989); the thresholds are this project's own, chosen by measurement on plane-stress grids.</item>
/// <item>Row pattern of a supernode: the rows below it in its columns of the matrix, united with its children's patterns
/// (Liu 1990, Theorem 3.3 applied to column blocks).</item>
/// </list>
/// </remarks>
internal sealed class SupernodalSymbolic
{
    public int N;
    public int[] Perm = null!;          // perm[new] = old (postordered)
    public int[] Inv = null!;
    public int SupernodeCount;
    public int[] First = null!;         // supernode s covers columns First[s] .. First[s+1]-1
    public int[] PatternStart = null!;  // rows below the supernode: PatternRows[PatternStart[s] .. PatternStart[s+1])
    public int[] PatternRows = null!;   // ascending, in the new numbering
    public int[] Parent = null!;        // parent supernode (−1: root)
    public long[] FactorOffset = null!; // start of supernode s's dense block (column-major, m rows × k columns)
    public long StoredEntries;          // Σ m·k (the rectangles held, upper part of the diagonal blocks included)
    public long FactorNonZeros;         // lower-trapezoid entries of the supernodes (amalgamation zeros included)
    public long ExactNonZeros;          // nnz(L) of the exact (unamalgamated) pattern, diagonal included
    public int[] ColumnCount = null!;   // entries of each column of the exact L (new numbering), diagonal included
    public double Flops;                // floating-point operations of the numeric factorisation (exact pattern)
    public int MaxFront;                // largest m
    // P·K·Pᵀ's lower entries by column (LowerByColumn), built for the row patterns and handed to the numeric phase, which
    // clears them when done so that the factor does not keep them.
    public int[]? ColPtr, RowsByCol, SourceByCol;

    /// <summary>Entries of P·K·Pᵀ grouped by column (lower triangle: row ≥ column), with the source index of each.</summary>
    internal static void LowerByColumn(SymmetricSparseMatrix a, int[] inv, out int[] colPtr, out int[] rows, out int[] source)
    {
        var perm = new int[inv.Length];
        for (int i = 0; i < inv.Length; i++) perm[inv[i]] = i;
        LowerByColumn(a, StrictLowerRows.Of(a), perm, inv, out colPtr, out rows, out source);
    }

    /// <summary>
    /// Entries of P·K·Pᵀ grouped by column (lower triangle: row ≥ column), with the source index of each, gathered column by
    /// column from the matrix and its rows: new column c takes, from the old row perm[c], the entries whose column comes
    /// after c (in increasing old column), then, from the old column perm[c], those whose row does not come before it (in
    /// storage order) — the order a scatter of the matrix column by column gives, without a counting pass.
    /// </summary>
    internal static void LowerByColumn(SymmetricSparseMatrix a, StrictLowerRows lower, int[] perm, int[] inv,
        out int[] colPtr, out int[] rows, out int[] source)
    {
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        var rp = lower.RowPtr;
        var rc = lower.Cols;
        var rs = lower.Source;
        colPtr = new int[n + 1];
        int nz = cp[n];
        var rowsOut = GC.AllocateUninitializedArray<int>(nz);
        var sourceOut = GC.AllocateUninitializedArray<int>(nz);
        int q = 0;
        for (int c = 0; c < n; c++)
        {
            colPtr[c] = q;
            int o = perm[c];
            for (int t = rp[o], t1 = rp[o + 1]; t < t1; t++)
            {
                int r = inv[rc[t]];
                if (r > c) { rowsOut[q] = r; sourceOut[q] = rs[t]; q++; }
            }
            for (int p = cp[o], p1 = cp[o + 1]; p < p1; p++)
            {
                int r = inv[ri[p]];
                if (r >= c) { rowsOut[q] = r; sourceOut[q] = p; q++; }
            }
        }
        colPtr[n] = q;
        rows = rowsOut;
        source = sourceOut;
    }

    /// <summary>
    /// Elimination tree of P·K·Pᵀ (<paramref name="order"/>: <c>perm[new] = old</c>) by Liu's algorithm with path
    /// compression, each row's entries left of the diagonal gathered from the matrix and its rows (the tree does not depend
    /// on the order they are taken in).
    /// </summary>
    private static int[] EliminationTree(SymmetricSparseMatrix a, StrictLowerRows lower, int[] order, int[] inv)
    {
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        var rp = lower.RowPtr;
        var rc = lower.Cols;
        var parent = new int[n];
        var ancestor = new int[n];
        for (int k = 0; k < n; k++)
        {
            parent[k] = -1;
            ancestor[k] = -1;
            int o = order[k];
            int t0 = rp[o], t1 = rp[o + 1], p0 = cp[o], p1 = cp[o + 1];
            for (int q = t0, q1 = t1 + (p1 - p0); q < q1; q++)
            {
                // The row's entries, then the column's; those right of the diagonal (and the diagonal) are skipped.
                int r = q < t1 ? inv[rc[q]] : inv[ri[p0 + (q - t1)]];
                if (r >= k) continue;
                while (true)
                {
                    int t = ancestor[r];
                    ancestor[r] = k;
                    if (t == -1) { parent[r] = k; break; }
                    if (t == k) break;
                    r = t;
                }
            }
        }
        return parent;
    }

    private static int[] Postorder(int n, int[] parent)
    {
        var head = new int[n];
        var next = new int[n];
        Array.Fill(head, -1);
        for (int j = n - 1; j >= 0; j--)
        {
            int p = parent[j];
            if (p < 0) continue;
            next[j] = head[p];
            head[p] = j;
        }
        var post = new int[n];
        var stack = new int[n];
        int k = 0;
        for (int root = 0; root < n; root++)
        {
            if (parent[root] != -1) continue;
            int top = 0;
            stack[0] = root;
            while (top >= 0)
            {
                int v = stack[top];
                int c = head[v];
                if (c == -1) { top--; post[k++] = v; }
                else { head[v] = next[c]; stack[++top] = c; }
            }
        }
        return post;
    }

    /// <summary>
    /// Column counts of L (diagonal included) for a matrix whose elimination tree is postordered (parent[j] &gt; j, every
    /// subtree a contiguous range), from its lower entries by column, in O(nnz(A)·α(n)) time: Gilbert, Ng and Peyton,
    /// "An efficient algorithm to compute row and column counts for sparse Cholesky factorization", SIAM J. Matrix Anal.
    /// Appl. 15(4), 1994; written from the description in Davis 2006, §4.5. Column j's count is the number of row subtrees
    /// it lies in; each entry a_ij (i &gt; j) adds one at j when j is a leaf of row i's subtree, and one is taken off at the
    /// least common ancestor of j and the previous leaf of that row, so that summing over the subtree of j counts each row
    /// once.
    /// </summary>
    internal static int[] ColumnCounts(int n, int[] parent, int[] colPtr, int[] rows)
    {
        var w = new CountWork(n, parent);
        for (int j = 0; j < n; j++)
        {
            if (parent[j] != -1) w.Delta[parent[j]]--;
            for (int p = colPtr[j]; p < colPtr[j + 1]; p++) w.Entry(rows[p], j);
            if (parent[j] != -1) w.Ancestor[j] = parent[j];
        }
        return w.Finish(parent);
    }

    /// <summary>The same column counts, each column's entries gathered from the matrix and its rows (their order within a
    /// column does not change the counts), so that they need not wait for the columns of P·K·Pᵀ.</summary>
    private static int[] ColumnCounts(int[] parent, SymmetricSparseMatrix a, StrictLowerRows lower, int[] perm, int[] inv)
    {
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        var rp = lower.RowPtr;
        var rc = lower.Cols;
        var w = new CountWork(n, parent);
        for (int j = 0; j < n; j++)
        {
            if (parent[j] != -1) w.Delta[parent[j]]--;
            int o = perm[j];
            for (int t = rp[o], t1 = rp[o + 1]; t < t1; t++) w.Entry(inv[rc[t]], j);
            for (int p = cp[o], p1 = cp[o + 1]; p < p1; p++) w.Entry(inv[ri[p]], j);
            if (parent[j] != -1) w.Ancestor[j] = parent[j];
        }
        return w.Finish(parent);
    }

    /// <summary>State of the column count (see <see cref="ColumnCounts(int, int[], int[], int[])"/>).</summary>
    private readonly struct CountWork
    {
        public readonly int[] Delta;      // summed over each subtree at the end: the column counts
        private readonly int[] _first;    // first[j]: the smallest (first in postorder) descendant of j
        private readonly int[] _maxFirst; // per row i: the largest first[] of a leaf of its subtree seen so far
        private readonly int[] _prevLeaf; // per row i: the last leaf of its subtree found
        public readonly int[] Ancestor;   // disjoint sets of the processed part of the tree, with path compression

        public CountWork(int n, int[] parent)
        {
            Delta = new int[n];
            _first = new int[n];
            _maxFirst = new int[n];
            _prevLeaf = new int[n];
            Ancestor = new int[n];
            Array.Fill(_first, -1);
            Array.Fill(_maxFirst, -1);
            Array.Fill(_prevLeaf, -1);
            for (int k = 0; k < n; k++)
            {
                Delta[k] = _first[k] == -1 ? 1 : 0;   // 1 for a leaf of the tree
                for (int j = k; j != -1 && _first[j] == -1; j = parent[j]) _first[j] = k;
                Ancestor[k] = k;
            }
        }

        /// <summary>Entry a_ij of column j (entries with i ≤ j are ignored).</summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Entry(int i, int j)
        {
            if (i <= j || _first[j] <= _maxFirst[i]) return;   // j is not a leaf of row i's subtree
            _maxFirst[i] = _first[j];
            int jPrev = _prevLeaf[i];
            _prevLeaf[i] = j;
            Delta[j]++;
            if (jPrev == -1) return;                             // the first leaf: the subtree's root is i itself
            int q = jPrev;
            while (q != Ancestor[q]) q = Ancestor[q];            // the least common ancestor of jPrev and j
            for (int s = jPrev; s != q;) { int up = Ancestor[s]; Ancestor[s] = q; s = up; }
            Delta[q]--;
        }

        public int[] Finish(int[] parent)
        {
            for (int j = 0; j < parent.Length; j++)
                if (parent[j] != -1) Delta[parent[j]] += Delta[j];
            return Delta;
        }
    }

    /// <summary>Whether the analysis of <paramref name="a"/> is large enough to pay for a second thread.</summary>
    internal static bool WorthASecondThread(SymmetricSparseMatrix a) => a.NonZerosLower >= 200_000;

    private static Task<(int[] ColPtr, int[] Rows, int[] Source)> StartLowerByColumn(SymmetricSparseMatrix a, StrictLowerRows lower,
        int[] perm, int[] inv) => Task.Run(() =>
        {
            LowerByColumn(a, lower, perm, inv, out var colPtr, out var rows, out var source);
            return (colPtr, rows, source);
        });

    public static SupernodalSymbolic Analyse(SymmetricSparseMatrix a, int[] ordering) =>
        Analyse(a, ordering, StrictLowerRows.Of(a), Environment.ProcessorCount > 1);

    /// <summary>The analysis from the matrix and its rows. With <paramref name="twoThreads"/> (and a large matrix) the
    /// columns of P·K·Pᵀ, which only the numeric phase needs, are gathered on a second thread while this one counts the
    /// columns of L (from the same entries, gathered again) and finds the supernodes and their patterns: the two write
    /// separate arrays, so the result does not depend on it.</summary>
    internal static SupernodalSymbolic Analyse(SymmetricSparseMatrix a, int[] ordering, StrictLowerRows lower, bool twoThreads)
    {
        int n = a.Size;
        var inv0 = Orderings.Inverse(ordering);
        var parent0 = EliminationTree(a, lower, ordering, inv0);
        var post = Postorder(n, parent0);
        var perm = new int[n];
        for (int k = 0; k < n; k++) perm[k] = ordering[post[k]];
        var inv = Orderings.Inverse(perm);
        // The elimination tree of the postordered matrix is the same tree relabelled: a postorder is a topological
        // ordering of the tree, an equivalent reordering (Liu 1990, §2), so neither the tree nor the rows are built again.
        var position = inv0; // reused: position[k] = where column k of the first order went in the postorder
        for (int k = 0; k < n; k++) position[post[k]] = k;
        var parent = new int[n];
        for (int k = 0; k < n; k++) { int p0 = parent0[post[k]]; parent[k] = p0 < 0 ? -1 : position[p0]; }

        // P·K·Pᵀ's lower entries by column: for the column counts and the numeric phase.
        int[]? colPtr = null, rowsByCol = null, sourceByCol = null;
        int[] count;
        var columns = twoThreads && WorthASecondThread(a) ? StartLowerByColumn(a, lower, perm, inv) : null;
        if (columns is null)
        {
            LowerByColumn(a, lower, perm, inv, out colPtr, out rowsByCol, out sourceByCol);
            count = ColumnCounts(n, parent, colPtr, rowsByCol);
        }
        else count = ColumnCounts(parent, a, lower, perm, inv);
        var childCount = parent0; // reused: the first tree is no longer needed
        Array.Clear(childCount);
        for (int j = 0; j < n; j++) if (parent[j] >= 0) childCount[parent[j]]++;
        long exact = 0;
        double flops = 0;
        for (int j = 0; j < n; j++)
        {
            exact += count[j];
            double c = count[j] - 1;
            flops += 1 + c + c * (c + 1); // sqrt, scaling, and the symmetric update of the column
        }

        // Fundamental supernodes.
        var sFirst = new int[n];
        int ns0 = 0;
        for (int j = 0; j < n; j++)
        {
            bool joins = j > 0 && parent[j - 1] == j && childCount[j] == 1 && count[j - 1] == count[j] + 1;
            if (!joins) sFirst[ns0++] = j;
        }
        // Supernode data for amalgamation: columns, rows below (of the last column), true non-zeros, parent.
        var sCols = new int[ns0];
        var sBelow = new int[ns0];
        var sTrue = new long[ns0];
        var colToSuper = post; // reused: the postorder is no longer needed
        for (int s = 0; s < ns0; s++)
        {
            int f = sFirst[s], l = s + 1 < ns0 ? sFirst[s + 1] : n;
            sCols[s] = l - f;
            sBelow[s] = count[l - 1] - 1;
            long t = 0;
            for (int j = f; j < l; j++) { colToSuper[j] = s; t += count[j]; }
            sTrue[s] = t;
        }
        var sParent = new int[ns0];
        for (int s = 0; s < ns0; s++)
        {
            int l = (s + 1 < ns0 ? sFirst[s + 1] : n) - 1;
            sParent[s] = parent[l] < 0 ? -1 : colToSuper[parent[l]];
        }

        // Relaxed amalgamation, left to right: merge s into its parent when the parent starts right after s.
        var alive = new bool[ns0];
        Array.Fill(alive, true);
        for (int s = 0; s < ns0; s++)
        {
            int p = sParent[s];
            if (p != s + 1) continue; // in the postorder the parent is contiguous only when it is the next supernode
            int nc = sCols[s] + sCols[p];
            int below = sBelow[p];
            long stored = (long)nc * (nc + 1) / 2 + (long)nc * below;
            long zeros = stored - sTrue[s] - sTrue[p];
            double share = (double)zeros / stored;
            bool merge = nc <= 4 || (nc <= 16 && share <= 0.5) || (nc <= 48 && share <= 0.1) || share <= 0.03;
            if (!merge) continue;
            alive[s] = false;
            sFirst[p] = sFirst[s];
            sCols[p] = nc;
            sTrue[p] += sTrue[s]; // true non-zeros of the union; zeros are recomputed from it at the next merge
        }
        int ns = 0;
        for (int s = 0; s < ns0; s++) if (alive[s]) ns++;
        var first = new int[ns + 1];
        for (int s = 0, t = 0; s < ns0; s++) if (alive[s]) first[t++] = sFirst[s];
        first[ns] = n;
        var superOf = colToSuper; // reused: supernode of every column, now of the relaxed supernodes
        for (int t = 0; t < ns; t++)
            for (int j = first[t]; j < first[t + 1]; j++) superOf[j] = t;

        // Row patterns. A supernode's columns form a chain of the elimination tree (each column's parent is the next one:
        // fundamental supernodes by construction, and a merge joins a supernode's last column to its parent's first), so the
        // rows below it are those of its last column l, count(l) − 1 of them, and its parent is the supernode holding
        // parent(l). Row i of L lies in the columns of the row subtree of i (Liu 1990, §3.2): walking up the supernodal tree
        // from each entry a_ij (j < i) to the supernode of i, marking, reaches every supernode whose pattern holds i, so
        // taking the rows in increasing order fills each pattern already sorted, at its final size, in O(nnz(A) + Σ
        // pattern) — no merging of the children's patterns and no sort (the supernodal form of the row-subtree traversal).
        var sp = new int[ns];
        var patStart = new int[ns + 1];
        long patTotal = 0;
        for (int t = 0; t < ns; t++)
        {
            int l = first[t + 1] - 1;
            sp[t] = parent[l] < 0 ? -1 : superOf[parent[l]];
            patStart[t] = (int)patTotal;
            patTotal += count[l] - 1;
            if (patTotal > int.MaxValue) throw new InvalidOperationException("Supernode patterns exceed 2³¹ entries.");
        }
        patStart[ns] = (int)patTotal;
        var patRows = GC.AllocateUninitializedArray<int>((int)patTotal);
        var fill = new int[ns];
        Array.Copy(patStart, fill, ns);
        var marker = sParent.Length >= ns ? sParent : new int[ns]; // reused: ns ≤ ns0
        Array.Fill(marker, -1, 0, ns);
        {
            var cp = a.ColumnPointers;
            var ri = a.RowIndices;
            var rp = lower.RowPtr;
            var rc = lower.Cols;
            for (int i = 0; i < n; i++)
            {
                int top = superOf[i], o = perm[i];
                for (int t = rp[o], t1 = rp[o + 1]; t < t1; t++)
                {
                    int j = inv[rc[t]];
                    if (j >= i) continue;
                    for (int s = superOf[j]; s != top && marker[s] != i; s = sp[s]) { marker[s] = i; patRows[fill[s]++] = i; }
                }
                for (int p = cp[o], p1 = cp[o + 1]; p < p1; p++)
                {
                    int j = inv[ri[p]];
                    if (j >= i) continue;
                    for (int s = superOf[j]; s != top && marker[s] != i; s = sp[s]) { marker[s] = i; patRows[fill[s]++] = i; }
                }
            }
        }
        for (int t = 0; t < ns; t++)
            if (fill[t] != patStart[t + 1])
                throw new InvalidOperationException($"Symbolic analysis: supernode {t} has {fill[t] - patStart[t]} rows below it, its last column {patStart[t + 1] - patStart[t]}.");

        if (columns is not null) (colPtr, rowsByCol, sourceByCol) = columns.GetAwaiter().GetResult();

        var offset = new long[ns + 1];
        long stored2 = 0, lnz = 0;
        int maxFront = 0;
        for (int t = 0; t < ns; t++)
        {
            int k = first[t + 1] - first[t];
            int m = k + (patStart[t + 1] - patStart[t]);
            offset[t] = stored2;
            stored2 += (long)m * k;
            lnz += (long)k * (k + 1) / 2 + (long)k * (m - k);
            maxFront = Math.Max(maxFront, m);
        }
        offset[ns] = stored2;

        return new SupernodalSymbolic
        {
            N = n,
            Perm = perm,
            Inv = inv,
            SupernodeCount = ns,
            First = first,
            PatternStart = patStart,
            PatternRows = patRows,
            Parent = sp,
            FactorOffset = offset,
            StoredEntries = stored2,
            FactorNonZeros = lnz,
            ExactNonZeros = exact,
            ColumnCount = count,
            Flops = flops,
            MaxFront = maxFront,
            ColPtr = colPtr,
            RowsByCol = rowsByCol,
            SourceByCol = sourceByCol,
        };
    }
}
