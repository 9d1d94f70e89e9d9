using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The ordering and the symbolic analysis as they were before the speed work of issue 19, item 3 (session 6; main at
/// 9f8f748), kept unchanged as the "before" of a before/after measured in one process (<see cref="PhaseReport"/>): on a
/// shared, loaded machine only runs interleaved in one process compare fairly. Not used by the solver.
/// </summary>
internal static class PreviousPhases
{
    private const byte Variable = 0, Element = 1, Dead = 2;

    public static int[] Order(SymmetricSparseMatrix a)
    {
        ArgumentNullException.ThrowIfNull(a);
        int n = a.Size;
        // Full adjacency (both triangles, no diagonal).
        var deg0 = new int[n];
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int i = ri[p];
                if (i != j) { deg0[i]++; deg0[j]++; }
            }
        long nnz = 0;
        for (int i = 0; i < n; i++) nnz += deg0[i];
        long cap = nnz + nnz / 5 + 2L * n + 16;
        if (cap > Array.MaxLength) cap = Array.MaxLength;
        var iw = new int[cap];
        var pe = new long[n];
        var len = new int[n];
        var elen = new int[n];
        long pos = 0;
        for (int i = 0; i < n; i++) { pe[i] = pos; pos += deg0[i]; }
        long pfree = pos;
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int i = ri[p];
                if (i == j) continue;
                iw[pe[i] + len[i]++] = j;
                iw[pe[j] + len[j]++] = i;
            }
        // Remove duplicate neighbours (a matrix may repeat an entry).
        var stamp = new int[n];
        Array.Fill(stamp, -1);
        for (int i = 0; i < n; i++)
        {
            long s = pe[i];
            int m = 0;
            for (int q = 0; q < len[i]; q++)
            {
                int j = iw[s + q];
                if (stamp[j] == i) continue;
                stamp[j] = i;
                iw[s + m++] = j;
            }
            len[i] = m;
        }

        var nv = new int[n];          // supervariable size (0: not principal / absorbed)
        var state = new byte[n];
        var degree = new int[n];      // variable: approximate external degree; element: |Le| (weighted)
        var w = new long[n];          // element marks for |Le \ Lp|
        long wflg = 1;
        var mark = new long[n];       // general marker for variables/elements
        long mflg = 1;
        var head = new int[n + 1];
        var next = new int[n];
        var prev = new int[n];
        Array.Fill(head, -1);
        // Supervariable member lists (for the final order).
        var groupNext = new int[n];
        var groupTail = new int[n];
        for (int i = 0; i < n; i++)
        {
            nv[i] = 1;
            degree[i] = len[i];
            groupNext[i] = -1;
            groupTail[i] = i;
        }
        for (int i = 0; i < n; i++) Insert(i, degree[i]);
        int mindeg = 0;
        var order = new int[n];
        int nel = 0, written = 0;
        var hashList = new List<(long Hash, int Var)>();

        void Insert(int i, int d)
        {
            next[i] = head[d];
            prev[i] = -1;
            if (head[d] >= 0) prev[head[d]] = i;
            head[d] = i;
        }
        void Remove(int i)
        {
            int d = degree[i];
            if (prev[i] >= 0) next[prev[i]] = next[i]; else head[d] = next[i];
            if (next[i] >= 0) prev[next[i]] = prev[i];
        }
        void Compact(long need)
        {
            // Copy every live list to a fresh array (grown if the live lists plus need do not fit).
            long live = 0;
            for (int i = 0; i < n; i++) if (state[i] != Dead) live += len[i];
            long size = Math.Max(iw.LongLength, live + need + n);
            if (size > Array.MaxLength) size = Array.MaxLength;
            var fresh = new int[size];
            long q = 0;
            for (int i = 0; i < n; i++)
            {
                if (state[i] == Dead) { len[i] = 0; continue; }
                Array.Copy(iw, pe[i], fresh, q, len[i]);
                pe[i] = q;
                q += len[i];
            }
            iw = fresh;
            pfree = q;
        }

        while (nel < n)
        {
            // 1. Pivot of least approximate degree.
            while (mindeg < n && head[mindeg] < 0) mindeg++;
            int piv = head[mindeg];
            Remove(piv);
            int nvpiv = nv[piv];
            nv[piv] = -nvpiv; // mark: in Lp (the pivot itself is excluded below)

            // 2. Form Lp = (A_p ∪ ⋃_{e∈E_p} L_e) \ p, absorbing the elements of E_p.
            long bound = len[piv] - elen[piv];
            for (int q = 0; q < elen[piv]; q++)
            {
                int e = iw[pe[piv] + q];
                if (state[e] == Element) bound += len[e];
            }
            if (pfree + bound > iw.LongLength) Compact(bound);
            long start = pfree;
            int lpLen = 0;
            int degme = 0;
            long pp = pe[piv];
            int ne = elen[piv], lenp = len[piv];
            for (int q = 0; q < lenp; q++)
            {
                int x = iw[pp + q];
                if (q < ne)
                {
                    int e = x;
                    if (state[e] != Element) continue;
                    long pe2 = pe[e];
                    for (int r = 0; r < len[e]; r++)
                    {
                        int i = iw[pe2 + r];
                        int nvi = nv[i];
                        if (nvi <= 0 || state[i] != Variable) continue;
                        degme += nvi;
                        nv[i] = -nvi;
                        iw[start + lpLen++] = i;
                        Remove(i);
                    }
                    state[e] = Dead; // absorbed into piv
                    len[e] = 0;
                }
                else
                {
                    int i = x;
                    int nvi = nv[i];
                    if (nvi <= 0 || state[i] != Variable) continue;
                    degme += nvi;
                    nv[i] = -nvi;
                    iw[start + lpLen++] = i;
                    Remove(i);
                }
            }
            pfree = start + lpLen;
            state[piv] = Element;
            pe[piv] = start;
            len[piv] = lpLen;
            elen[piv] = -1;

            // 3. |Le \ Lp| for every element adjacent to a variable of Lp: w[e] − wflg.
            for (int q = 0; q < lpLen; q++)
            {
                int i = iw[start + q];
                int nvi = -nv[i];
                long pi = pe[i];
                for (int r = 0; r < elen[i]; r++)
                {
                    int e = iw[pi + r];
                    if (state[e] != Element || e == piv) continue;
                    if (w[e] >= wflg) w[e] -= nvi;
                    else w[e] = degree[e] + wflg - nvi;
                }
            }

            // 4. Degree update, pruning, mass elimination, hashing.
            hashList.Clear();
            int nleft = n - nel - nvpiv;
            for (int q = 0; q < lpLen; q++)
            {
                int i = iw[start + q];
                long pi = pe[i];
                int ei = elen[i], li = len[i];
                int deg = 0;
                long hash = 0;
                int outp = 0;
                // Elements: keep those with |Le \ Lp| > 0; absorb those with Le ⊆ Lp (aggressive absorption).
                for (int r = 0; r < ei; r++)
                {
                    int e = iw[pi + r];
                    if (state[e] != Element || e == piv) continue;
                    long dext = w[e] - wflg;
                    if (dext > 0)
                    {
                        deg += (int)dext;
                        iw[pi + outp++] = e;
                        hash += e;
                    }
                    else
                    {
                        state[e] = Dead;
                        len[e] = 0;
                    }
                }
                // Variables: keep principal variables outside Lp.
                int outv = 0;
                for (int r = ei; r < li; r++)
                {
                    int j = iw[pi + r];
                    if (state[j] != Variable || nv[j] <= 0) continue; // element, absorbed, or in Lp
                    deg += nv[j];
                    iw[pi + outp + outv++] = j;
                    hash += j;
                }
                // Shift right by one and put piv first. The list never grows: i lost at least piv from A_i or one
                // absorbed element from E_i (AMD paper, §3), so outp + outv + 1 ≤ li.
                System.Diagnostics.Debug.Assert(outp + outv + 1 <= li);
                Array.Copy(iw, pi, iw, pi + 1, outp + outv);
                iw[pi] = piv;
                int newElen = outp + 1;
                elen[i] = newElen;
                len[i] = newElen + outv;
                if (newElen == 1 && outv == 0)
                {
                    // Mass elimination: i is adjacent only to piv, so it is indistinguishable from it.
                    int nvi = -nv[i];
                    degme -= nvi;
                    nvpiv += nvi;
                    nleft -= nvi;
                    nv[i] = 0;
                    state[i] = Dead;
                    len[i] = 0;
                    // append i's group to piv's
                    groupNext[groupTail[piv]] = i;
                    groupTail[piv] = groupTail[i];
                    iw[start + q] = -1;
                }
                else
                {
                    degree[i] = Math.Min(degree[i], deg);
                    hashList.Add((hash + piv, i));
                }
            }
            nel += nvpiv;

            // 5. Supervariable detection among the variables of Lp: equal hash, then exact comparison of the lists.
            hashList.Sort();
            for (int s = 0; s < hashList.Count;)
            {
                int t = s;
                while (t < hashList.Count && hashList[t].Hash == hashList[s].Hash) t++;
                for (int a1 = s; a1 < t; a1++)
                {
                    int i = hashList[a1].Var;
                    if (nv[i] == 0) continue;
                    mflg++;
                    long pi = pe[i];
                    for (int r = 0; r < len[i]; r++) mark[iw[pi + r]] = mflg;
                    for (int b1 = a1 + 1; b1 < t; b1++)
                    {
                        int j = hashList[b1].Var;
                        if (nv[j] == 0 || len[j] != len[i] || elen[j] != elen[i]) continue;
                        long pj = pe[j];
                        bool same = true;
                        for (int r = 0; r < len[j] && same; r++) same = mark[iw[pj + r]] == mflg;
                        if (!same) continue;
                        // j merges into i.
                        nv[i] += nv[j]; // both negative (in Lp)
                        nv[j] = 0;
                        state[j] = Dead;
                        len[j] = 0;
                        groupNext[groupTail[i]] = j;
                        groupTail[i] = groupTail[j];
                    }
                }
                s = t;
            }

            // 6. Finalise degrees, put the variables back in the degree lists, compact Lp.
            int lpOut = 0;
            for (int q = 0; q < lpLen; q++)
            {
                int i = iw[start + q];
                if (i < 0 || nv[i] == 0) continue;
                int nvi = -nv[i];
                nv[i] = nvi;
                int d = Math.Min(degree[i] + degme - nvi, nleft - nvi);
                if (d < 0) d = 0;
                degree[i] = d;
                Insert(i, d);
                if (d < mindeg) mindeg = d;
                iw[start + lpOut++] = i;
            }
            len[piv] = lpOut;
            degree[piv] = degme;
            nv[piv] = nvpiv;
            pfree = start + lpOut;
            wflg += n + 1;

            // The pivot's supervariable and everything mass-eliminated with it are numbered now.
            for (int g = piv; g >= 0; g = groupNext[g]) order[written++] = g;
        }
        return order;
    }

    internal static void LowerByColumn(SymmetricSparseMatrix a, int[] inv, out int[] colPtr, out int[] rows, out int[] source)
    {
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        colPtr = new int[n + 1];
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++) colPtr[Math.Min(inv[ri[p]], inv[j]) + 1]++;
        for (int j = 0; j < n; j++) colPtr[j + 1] += colPtr[j];
        var next = (int[])colPtr.Clone();
        int nz = colPtr[n];
        rows = new int[nz];
        source = new int[nz];
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int r = inv[ri[p]], c = inv[j];
                if (r < c) (r, c) = (c, r);
                int q = next[c]++;
                rows[q] = r;
                source[q] = p;
            }
    }

    /// <summary>Strictly lower entries of P·K·Pᵀ grouped by row: row r lists the columns c &lt; r.</summary>
    private static void LowerByRow(SymmetricSparseMatrix a, int[] inv, out int[] rowPtr, out int[] cols)
    {
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        rowPtr = new int[n + 1];
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int r = inv[ri[p]], c = inv[j];
                if (r != c) rowPtr[Math.Max(r, c) + 1]++;
            }
        for (int j = 0; j < n; j++) rowPtr[j + 1] += rowPtr[j];
        var next = (int[])rowPtr.Clone();
        cols = new int[rowPtr[n]];
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int r = inv[ri[p]], c = inv[j];
                if (r == c) continue;
                if (r < c) (r, c) = (c, r);
                cols[next[r]++] = c;
            }
    }

    private static int[] EliminationTree(int n, int[] rowPtr, int[] cols)
    {
        var parent = new int[n];
        var ancestor = new int[n];
        for (int k = 0; k < n; k++)
        {
            parent[k] = -1;
            ancestor[k] = -1;
            for (int p = rowPtr[k]; p < rowPtr[k + 1]; p++)
            {
                int r = cols[p];
                while (r != -1 && r != k)
                {
                    int t = ancestor[r];
                    ancestor[r] = k;
                    if (t == -1) { parent[r] = k; break; }
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
        var delta = new int[n];        // summed over each subtree at the end: the column counts
        var first = new int[n];        // first[j]: the smallest (first in postorder) descendant of j
        var maxFirst = new int[n];     // per row i: the largest first[] of a leaf of its subtree seen so far
        var prevLeaf = new int[n];     // per row i: the last leaf of its subtree found
        var ancestor = new int[n];     // disjoint sets of the processed part of the tree, with path compression
        Array.Fill(first, -1);
        Array.Fill(maxFirst, -1);
        Array.Fill(prevLeaf, -1);
        for (int k = 0; k < n; k++)
        {
            delta[k] = first[k] == -1 ? 1 : 0;   // 1 for a leaf of the tree
            for (int j = k; j != -1 && first[j] == -1; j = parent[j]) first[j] = k;
            ancestor[k] = k;
        }
        for (int j = 0; j < n; j++)
        {
            if (parent[j] != -1) delta[parent[j]]--;
            for (int p = colPtr[j]; p < colPtr[j + 1]; p++)
            {
                int i = rows[p];
                if (i <= j || first[j] <= maxFirst[i]) continue;   // j is not a leaf of row i's subtree
                maxFirst[i] = first[j];
                int jPrev = prevLeaf[i];
                prevLeaf[i] = j;
                delta[j]++;
                if (jPrev == -1) continue;                         // the first leaf: the subtree's root is i itself
                int q = jPrev;
                while (q != ancestor[q]) q = ancestor[q];          // the least common ancestor of jPrev and j
                for (int s = jPrev; s != q;) { int up = ancestor[s]; ancestor[s] = q; s = up; }
                delta[q]--;
            }
            if (parent[j] != -1) ancestor[j] = parent[j];
        }
        for (int j = 0; j < n; j++)
            if (parent[j] != -1) delta[parent[j]] += delta[j];
        return delta;
    }

    public static SupernodalSymbolic Analyse(SymmetricSparseMatrix a, int[] ordering)
    {
        int n = a.Size;
        var inv0 = Orderings.Inverse(ordering);
        LowerByRow(a, inv0, out var rowPtr, out var cols);
        var parent0 = EliminationTree(n, rowPtr, cols);
        var post = Postorder(n, parent0);
        var perm = new int[n];
        for (int k = 0; k < n; k++) perm[k] = ordering[post[k]];
        var inv = Orderings.Inverse(perm);
        // The elimination tree of the postordered matrix is the same tree relabelled: a postorder is a topological
        // ordering of the tree, an equivalent reordering (Liu 1990, §2), so neither the tree nor the rows are built again.
        var position = Orderings.Inverse(post);
        var parent = new int[n];
        for (int k = 0; k < n; k++) { int p0 = parent0[post[k]]; parent[k] = p0 < 0 ? -1 : position[p0]; }

        // P·K·Pᵀ's lower entries by column: for the column counts, the row patterns, and the numeric phase.
        LowerByColumn(a, inv, out var colPtr, out var rowsByCol, out var sourceByCol);
        var count = ColumnCounts(n, parent, colPtr, rowsByCol);
        var childCount = new int[n];
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
        var firsts = new List<int>();
        for (int j = 0; j < n; j++)
        {
            bool joins = j > 0 && parent[j - 1] == j && childCount[j] == 1 && count[j - 1] == count[j] + 1;
            if (!joins) firsts.Add(j);
        }
        int ns0 = firsts.Count;
        // Supernode data for amalgamation: columns, rows below (of the last column), true non-zeros, parent.
        var sFirst = firsts.ToArray();
        var sCols = new int[ns0];
        var sBelow = new int[ns0];
        var sTrue = new long[ns0];
        var colToSuper = new int[n];
        for (int s = 0; s < ns0; s++)
        {
            int f = sFirst[s], l = s + 1 < ns0 ? sFirst[s + 1] : n;
            sCols[s] = l - f;
            sBelow[s] = count[l - 1] - 1;
            for (int j = f; j < l; j++) { colToSuper[j] = s; sTrue[s] += count[j]; }
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
        var keep = new List<int>();
        for (int s = 0; s < ns0; s++) if (alive[s]) keep.Add(s);
        int ns = keep.Count;
        var first = new int[ns + 1];
        for (int t = 0; t < ns; t++) first[t] = sFirst[keep[t]];
        first[ns] = n;
        var superOf = new int[n];
        for (int t = 0; t < ns; t++)
            for (int j = first[t]; j < first[t + 1]; j++) superOf[j] = t;

        // Row patterns: A's rows below the supernode in its columns, united with the children's patterns.
        var childHead = new int[ns];
        var childNext = new int[ns];
        Array.Fill(childHead, -1);
        var sp = new int[ns];
        var patStart = new int[ns + 1];
        var patList = new List<int[]>(ns);
        var marker = new int[n];
        Array.Fill(marker, -1);
        var buf = new List<int>();
        long patTotal = 0;
        for (int t = 0; t < ns; t++)
        {
            int f = first[t], l = first[t + 1] - 1;
            buf.Clear();
            for (int j = f; j <= l; j++)
                for (int p = colPtr[j]; p < colPtr[j + 1]; p++)
                {
                    int r = rowsByCol[p];
                    if (r > l && marker[r] != t) { marker[r] = t; buf.Add(r); }
                }
            for (int c = childHead[t]; c != -1; c = childNext[c])
                foreach (int r in patList[c])
                    if (r > l && marker[r] != t) { marker[r] = t; buf.Add(r); }
            buf.Sort();
            var pat = buf.ToArray();
            patList.Add(pat);
            patTotal += pat.Length;
            int par = pat.Length > 0 ? superOf[pat[0]] : -1;
            sp[t] = par;
            if (par >= 0)
            {
                // children kept in increasing order: prepend, then the list is descending; order does not matter for the union
                childNext[t] = childHead[par];
                childHead[par] = t;
            }
        }
        // Drop children's pattern arrays only after all are built (they are small relative to L).
        var patRows = new int[patTotal];
        long q = 0;
        for (int t = 0; t < ns; t++)
        {
            patStart[t] = (int)q;
            patList[t].CopyTo(patRows, q);
            q += patList[t].Length;
        }
        if (patTotal > int.MaxValue) throw new InvalidOperationException("Supernode patterns exceed 2³¹ entries.");
        patStart[ns] = (int)q;

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
