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
    public static int[] Compute(SymmetricSparseMatrix a)
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
}
