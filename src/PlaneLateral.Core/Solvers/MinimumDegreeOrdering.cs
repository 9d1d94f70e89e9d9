using System.Runtime.CompilerServices;

namespace PlaneLateral.Solvers;

/// <summary>
/// Approximate minimum degree (AMD) fill-reducing ordering, written from the description in Amestoy, Davis and Duff,
/// "An approximate minimum degree ordering algorithm", SIAM J. Matrix Anal. Appl. 17(4):886–905, 1996, and the
/// quotient-graph presentation in Davis, "Direct Methods for Sparse Linear Systems" (SIAM, 2006), §7.1.
/// </summary>
/// <remarks>
/// <para>
/// The elimination is simulated on the quotient graph: every eliminated pivot becomes an element whose variable list Lₑ
/// replaces the clique its elimination would create. Each step takes a supervariable of least approximate external degree,
/// forms its element Lₚ as the union of its variable adjacency and the lists of its adjacent elements (which are absorbed),
/// and then, for every i in Lₚ, computes the bound of the paper's eq. (4):
/// d̄ᵢ = min(n − k, d̄ᵢ(old) + |Lₚ \ i|, |Aᵢ \ i| + |Lₚ \ i| + Σ_{e∈Eᵢ\p} |Lₑ \ Lₚ|),
/// where |Lₑ \ Lₚ| comes from one scan of the elements adjacent to Lₚ. Also as in the paper: element absorption, aggressive
/// absorption (an element with Lₑ ⊆ Lₚ is absorbed into p), mass elimination (a variable of Lₚ adjacent to nothing but p is
/// eliminated with p), and supervariable detection by a hash of each list followed by exact comparison.
/// Dense-row handling is not implemented (finite-element stiffness matrices have none).
/// </para>
/// <para>Deterministic: the degree lists start filled in increasing index and each takes new entries at its head, so a tie in
/// degree goes to the variable most recently put in its list (at the start, the highest index); hash collisions are resolved
/// in a sorted order; no randomness, no parallelism.</para>
/// </remarks>
public static class MinimumDegreeOrdering
{
    private const byte Variable = 0, Element = 1, Dead = 2;

    /// <summary>Approximate minimum degree order of the symmetric pattern of <paramref name="a"/> (<c>perm[new] = old</c>).</summary>
    /// <remarks>
    /// Written for speed without changing a single choice: one method with the quotient graph in locals (no closures, so
    /// the arrays stay in registers), supervariable candidates grouped in hash buckets instead of sorted, and the quotient
    /// graph compacted in place. (Not marked for aggressive optimisation: that would keep it out of the ReadyToRun image
    /// and cost a JIT compilation at the start of every run that factorises a large system.) Every list, tie and merge comes out as before, so the permutation is the same
    /// to the index (<c>OrderingPinTests</c>).
    /// </remarks>
    public static int[] Compute(SymmetricSparseMatrix a)
    {
        ArgumentNullException.ThrowIfNull(a);
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        // Full adjacency (both triangles, no diagonal). List i: the columns j < i of its row in increasing order, then
        // the rows of its column in increasing order (the matrix holds no repeated entry: SymmetricMatrixBuilder sums them).
        var pe = new int[n];
        var len = new int[n];
        var elen = new int[n];
        for (int j = 0; j < n; j++)
        {
            int p0 = cp[j], p1 = cp[j + 1];
            if (p0 < p1 && ri[p0] == j) p0++; // the diagonal is first when stored
            len[j] += p1 - p0;
            for (int p = p0; p < p1; p++) len[ri[p]]++;
        }
        long nnz = 0;
        for (int i = 0; i < n; i++) nnz += len[i];
        long cap = nnz + nnz / 5 + 2L * n + 16;
        if (cap > Array.MaxLength) cap = Array.MaxLength;
        var iw = GC.AllocateUninitializedArray<int>((int)cap);
        int pfree = 0;
        for (int i = 0; i < n; i++) { pe[i] = pfree; pfree += len[i]; len[i] = 0; }
        for (int j = 0; j < n; j++)
        {
            int p0 = cp[j], p1 = cp[j + 1];
            if (p0 < p1 && ri[p0] == j) p0++;
            int pj = pe[j] + len[j];
            for (int p = p0; p < p1; p++)
            {
                int i = ri[p];
                iw[pe[i] + len[i]++] = j;
                iw[pj++] = i;
            }
            len[j] = pj - pe[j];
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
        for (int i = 0; i < n; i++)
        {
            // Insert i at the head of its degree list.
            int d = degree[i];
            next[i] = head[d];
            prev[i] = -1;
            if (head[d] >= 0) prev[head[d]] = i;
            head[d] = i;
        }
        int mindeg = 0;
        var order = new int[n];
        int nel = 0, written = 0;
        // Supervariable detection: candidates by hash bucket (hash mod n), each bucket taken in increasing index.
        var bucketHead = new int[n];
        var bucketNext = new int[n];
        Array.Fill(bucketHead, -1);
        var bucketsUsed = new int[n];
        var members = new int[n];

        while (nel < n)
        {
            // 1. Pivot of least approximate degree.
            while (mindeg < n && head[mindeg] < 0) mindeg++;
            int piv = head[mindeg];
            {
                int nx = next[piv];
                head[mindeg] = nx;
                if (nx >= 0) prev[nx] = -1;
            }
            int nvpiv = nv[piv];
            nv[piv] = -nvpiv; // mark: in Lp (the pivot itself is excluded below)

            // 2. Form Lp = (A_p ∪ ⋃_{e∈E_p} L_e) \ p, absorbing the elements of E_p.
            long bound = len[piv] - elen[piv];
            for (int q = 0; q < elen[piv]; q++)
            {
                int e = iw[pe[piv] + q];
                if (state[e] == Element) bound += len[e];
            }
            if (pfree + bound > iw.LongLength) iw = Compact(iw, bound, n, pe, len, state, ref pfree);
            int start = pfree;
            int lpLen = 0;
            int degme = 0;
            int pp = pe[piv];
            int ne = elen[piv], lenp = len[piv];
            for (int q = 0; q < lenp; q++)
            {
                int x = iw[pp + q];
                if (q < ne)
                {
                    int e = x;
                    if (state[e] != Element) continue;
                    int pe2 = pe[e], le = len[e];
                    for (int r = 0; r < le; r++)
                    {
                        int i = iw[pe2 + r];
                        int nvi = nv[i];
                        if (nvi <= 0 || state[i] != Variable) continue;
                        degme += nvi;
                        nv[i] = -nvi;
                        iw[start + lpLen++] = i;
                        RemoveFromDegreeList(i, degree, head, next, prev);
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
                    RemoveFromDegreeList(i, degree, head, next, prev);
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
                int pi = pe[i], ei = elen[i];
                for (int r = 0; r < ei; r++)
                {
                    int e = iw[pi + r];
                    if (state[e] != Element || e == piv) continue;
                    if (w[e] >= wflg) w[e] -= nvi;
                    else w[e] = degree[e] + wflg - nvi;
                }
            }

            // 4. Degree update, pruning, mass elimination, hashing.
            int nbuckets = 0;
            int nleft = n - nel - nvpiv;
            for (int q = 0; q < lpLen; q++)
            {
                int i = iw[start + q];
                int pi = pe[i];
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
                for (int r = pi + outp + outv; r > pi; r--) iw[r] = iw[r - 1];
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
                    int b = (int)((ulong)(hash + piv) % (ulong)n);
                    if (bucketHead[b] < 0) bucketsUsed[nbuckets++] = b;
                    bucketNext[i] = bucketHead[b];
                    bucketHead[b] = i;
                }
            }
            nel += nvpiv;

            // 5. Supervariable detection among the variables of Lp: same bucket, then exact comparison of the lists. Two
            // variables with the same list have the same hash, so they share a bucket; each class of equal lists is merged
            // into its lowest index, the others appended to its group in increasing index (as a sort by (hash, index)
            // followed by the same comparisons gives).
            for (int u = 0; u < nbuckets; u++)
            {
                int b = bucketsUsed[u];
                int t = 0;
                for (int i = bucketHead[b]; i >= 0; i = bucketNext[i]) members[t++] = i;
                bucketHead[b] = -1;
                if (t < 2) continue;
                if (t <= 16)
                {
                    for (int x = 1; x < t; x++)
                    {
                        int v = members[x], y = x - 1;
                        while (y >= 0 && members[y] > v) { members[y + 1] = members[y]; y--; }
                        members[y + 1] = v;
                    }
                }
                else Array.Sort(members, 0, t);
                for (int a1 = 0; a1 < t; a1++)
                {
                    int i = members[a1];
                    if (nv[i] == 0) continue;
                    mflg++;
                    int pi = pe[i], li = len[i], ei = elen[i];
                    for (int r = 0; r < li; r++) mark[iw[pi + r]] = mflg;
                    for (int b1 = a1 + 1; b1 < t; b1++)
                    {
                        int j = members[b1];
                        if (nv[j] == 0 || len[j] != li || elen[j] != ei) continue;
                        int pj = pe[j];
                        bool same = true;
                        for (int r = 0; r < li && same; r++) same = mark[iw[pj + r]] == mflg;
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
                next[i] = head[d];
                prev[i] = -1;
                if (head[d] >= 0) prev[head[d]] = i;
                head[d] = i;
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

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void RemoveFromDegreeList(int i, int[] degree, int[] head, int[] next, int[] prev)
    {
        int nx = next[i], pv = prev[i];
        if (pv >= 0) next[pv] = nx; else head[degree[i]] = nx;
        if (nx >= 0) prev[nx] = pv;
    }

    /// <summary>
    /// Moves every live list to the front of <paramref name="iw"/>, in place and in the order they lie in (each list's first
    /// entry is swapped for a flag naming its owner, as in the AMD paper's garbage collection), then grows the array only if
    /// the live lists and <paramref name="need"/> still do not fit. The lists' contents and order are unchanged; only where
    /// they lie moves. A fresh array every time would cost a page fault per 4 KiB of it.
    /// </summary>
    /// <remarks>Below <paramref name="pfree"/> every entry is a non-negative index (the −1 marks of mass elimination are
    /// compacted away, behind the free pointer, before the next pivot), so a negative entry there is a flag.</remarks>
    private static int[] Compact(int[] iw, long need, int n, int[] pe, int[] len, byte[] state, ref int pfree)
    {
        long live = 0;
        for (int i = 0; i < n; i++)
        {
            if (state[i] == Dead) { len[i] = 0; continue; }
            int l = len[i];
            if (l == 0) { pe[i] = 0; continue; }
            live += l;
            int p = pe[i];
            pe[i] = iw[p];      // the list's first entry, kept while its place holds the flag
            iw[p] = -(i + 1);
        }
        int dst = 0, end = pfree;
        for (int src = 0; src < end;)
        {
            int flag = iw[src];
            if (flag >= 0) { src++; continue; } // a stale entry
            int i = -flag - 1, l = len[i];
            iw[dst] = pe[i];
            pe[i] = dst;
            if (l > 1) Array.Copy(iw, src + 1, iw, dst + 1, l - 1);
            dst += l;
            src += l;
        }
        pfree = dst;
        if (dst + need <= iw.LongLength) return iw;
        long size = Math.Max(iw.LongLength, live + need + n);
        if (size > Array.MaxLength) size = Array.MaxLength;
        var grown = GC.AllocateUninitializedArray<int>((int)size);
        Array.Copy(iw, grown, dst);
        return grown;
    }
}
