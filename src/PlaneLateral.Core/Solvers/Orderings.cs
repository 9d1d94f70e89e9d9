using System.Buffers;

namespace PlaneLateral.Solvers;

/// <summary>How <see cref="Orderings.ReverseCuthillMcKee(SymmetricSparseMatrix, RcmStart)"/> picks each component's starting node.</summary>
public enum RcmStart
{
    /// <summary>
    /// George and Liu's FNROOT as published: the pseudo-peripheral node it ends on. On meshes whose level sets from a
    /// corner are wider than from an edge (e.g. a square grid with 8-neighbour coupling) this can double the envelope.
    /// </summary>
    GeorgeLiu = 0,

    /// <summary>
    /// The default: FNROOT, then — after Gibbs, Poole and Stockmeyer, "An algorithm for reducing the bandwidth and
    /// profile of a sparse matrix" (SIAM J. Numer. Anal. 13, 1976) — up to 24 nodes of the last level (evenly spaced in
    /// breadth-first order) are tried as roots, and the one whose level structure has the fewest nodes in its widest
    /// level, among those at least as eccentric, is taken. It is still a pseudo-peripheral node.
    /// </summary>
    MinimumWidth = 1,
}

/// <summary>
/// Fill-reducing orderings for symmetric matrices, and the envelope (profile) measure they are judged by.
/// </summary>
/// <remarks>
/// <para>
/// Permutation convention, used everywhere in this namespace: a permutation is an <c>int[] perm</c> of length n with
/// <c>perm[newIndex] = oldIndex</c>, i.e. row/column <c>newIndex</c> of the reordered matrix P·K·Pᵀ is row/column
/// <c>perm[newIndex]</c> of K. Its inverse (<see cref="Inverse"/>) maps the other way: <c>inv[oldIndex] = newIndex</c>.
/// </para>
/// <para>
/// All functions are deterministic: ties are broken by the original index, never by hashing or timing.
/// </para>
/// </remarks>
public static class Orderings
{
    /// <summary>The identity permutation 0, 1, …, n−1.</summary>
    public static int[] Natural(int n)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(n);
        var p = new int[n];
        for (int i = 0; i < n; i++) p[i] = i;
        return p;
    }

    /// <summary>Inverse of a permutation: <c>inv[perm[k]] = k</c>. Throws if <paramref name="perm"/> is not a permutation.</summary>
    public static int[] Inverse(ReadOnlySpan<int> perm)
    {
        int n = perm.Length;
        var inv = new int[n];
        inv.AsSpan().Fill(-1);
        for (int k = 0; k < n; k++)
        {
            int old = perm[k];
            if ((uint)old >= (uint)n || inv[old] >= 0)
                throw new ArgumentException($"Not a permutation of 0..{n - 1}: entry {k} is {old}.", nameof(perm));
            inv[old] = k;
        }
        return inv;
    }

    /// <summary>True when <paramref name="perm"/> holds each of 0..n−1 exactly once.</summary>
    public static bool IsPermutation(ReadOnlySpan<int> perm)
    {
        int n = perm.Length;
        var seen = new bool[n];
        foreach (int v in perm)
        {
            if ((uint)v >= (uint)n || seen[v]) return false;
            seen[v] = true;
        }
        return true;
    }

    /// <summary>
    /// Size of the envelope (profile) of P·K·Pᵀ for <c>perm[new] = old</c>: Σᵢ (i − fᵢ), where fᵢ is the column of the
    /// first structural non-zero in row i of the reordered lower triangle (fᵢ = i for a row with nothing left of the
    /// diagonal). The diagonal is not counted. This is |Env(A)| of George and Liu, "Computer Solution of Large Sparse
    /// Positive Definite Systems" (1981), ch. 4; an envelope factor stores this many off-diagonal entries.
    /// </summary>
    public static long EnvelopeSize(SymmetricSparseMatrix a, ReadOnlySpan<int> perm)
    {
        ArgumentNullException.ThrowIfNull(a);
        if (perm.Length != a.Size) throw new ArgumentException("Permutation length differs from the matrix size.", nameof(perm));
        var inv = Inverse(perm);
        var first = FirstColumns(a, inv);
        long sum = 0;
        for (int i = 0; i < first.Length; i++) sum += i - first[i];
        return sum;
    }

    /// <summary>Half-bandwidth of P·K·Pᵀ: maxᵢ (i − fᵢ), with fᵢ as in <see cref="EnvelopeSize"/>.</summary>
    public static int Bandwidth(SymmetricSparseMatrix a, ReadOnlySpan<int> perm)
    {
        ArgumentNullException.ThrowIfNull(a);
        if (perm.Length != a.Size) throw new ArgumentException("Permutation length differs from the matrix size.", nameof(perm));
        var first = FirstColumns(a, Inverse(perm));
        int bw = 0;
        for (int i = 0; i < first.Length; i++) bw = Math.Max(bw, i - first[i]);
        return bw;
    }

    /// <summary>
    /// Reverse Cuthill–McKee ordering of the graph of <paramref name="a"/> (structural non-zeros off the diagonal),
    /// returned as <c>perm[new] = old</c>.
    /// </summary>
    /// <remarks>
    /// Follows George and Liu, "Computer Solution of Large Sparse Positive Definite Systems" (1981), §4.3–4.4
    /// (their GENRCM / FNROOT / RCM procedures): connected components are taken in order of their lowest-numbered node;
    /// in each, a pseudo-peripheral starting node is found from that node by repeated rooted level structures
    /// (the Gibbs–Poole–Stockmeyer idea as simplified by George and Liu); the component is then numbered breadth first,
    /// each node's unnumbered neighbours taken in increasing degree (ties: lower original index first), and that
    /// component's numbering is reversed. Isolated DOFs (no off-diagonal entries) are components of one node.
    /// </remarks>
    public static int[] ReverseCuthillMcKee(SymmetricSparseMatrix a) => ReverseCuthillMcKee(a, RcmStart.MinimumWidth);

    /// <summary>Reverse Cuthill–McKee with an explicit choice of starting node (see <see cref="RcmStart"/>).</summary>
    public static int[] ReverseCuthillMcKee(SymmetricSparseMatrix a, RcmStart startNode)
    {
        ArgumentNullException.ThrowIfNull(a);
        if (!Enum.IsDefined(startNode)) throw new ArgumentOutOfRangeException(nameof(startNode));
        int n = a.Size;
        // The adjacency and the scratch arrays are rented and given back at the end (a thread ordering one system after
        // another reuses them); each is cleared or fully written before it is read, so the ordering is the same.
        var ints = ArrayPool<int>.Shared;
        var (xadj, adj) = Adjacency(a);
        var degree = ints.Rent(n);
        var numbered = ArrayPool<bool>.Shared.Rent(n);
        // Scratch for level structures: a level-set list and its level pointers, plus a per-node stamp so that
        // "visited in this sweep" needs no clearing between sweeps.
        var levelNodes = ints.Rent(n);
        var levelPtr = ints.Rent(n + 1);
        var stamp = ints.Rent(n);
        try
        {
            return ReverseCuthillMcKee(n, startNode, xadj, adj, degree, numbered, levelNodes, levelPtr, stamp);
        }
        finally
        {
            ints.Return(xadj);
            ints.Return(adj);
            ints.Return(degree);
            ArrayPool<bool>.Shared.Return(numbered);
            ints.Return(levelNodes);
            ints.Return(levelPtr);
            ints.Return(stamp);
        }
    }

    private static int[] ReverseCuthillMcKee(int n, RcmStart startNode, int[] xadj, int[] adj, int[] degree, bool[] numbered,
        int[] levelNodes, int[] levelPtr, int[] stamp)
    {
        for (int v = 0; v < n; v++) degree[v] = xadj[v + 1] - xadj[v];
        Array.Clear(numbered, 0, n);
        Array.Clear(stamp, 0, n);
        var perm = new int[n];
        int stampValue = 0;
        var neighbourBuffer = new List<int>();
        var candidates = new List<int>();

        int next = 0;
        for (int seed = 0; seed < n; seed++)
        {
            if (numbered[seed]) continue;
            int root = PseudoPeripheralNode(seed, xadj, adj, degree, numbered, levelNodes, levelPtr, stamp, ref stampValue);
            if (startNode == RcmStart.MinimumWidth)
                root = NarrowestRoot(root, xadj, adj, numbered, levelNodes, levelPtr, stamp, ref stampValue, candidates);

            // Cuthill–McKee numbering of this component from root.
            int start = next;
            perm[next++] = root;
            numbered[root] = true;
            for (int head = start; head < next; head++)
            {
                int v = perm[head];
                neighbourBuffer.Clear();
                for (int p = xadj[v]; p < xadj[v + 1]; p++)
                {
                    int w = adj[p];
                    if (numbered[w]) continue;
                    numbered[w] = true;
                    neighbourBuffer.Add(w);
                }
                neighbourBuffer.Sort((x, y) => degree[x] != degree[y] ? degree[x].CompareTo(degree[y]) : x.CompareTo(y));
                foreach (int w in neighbourBuffer) perm[next++] = w;
            }
            Array.Reverse(perm, start, next - start);
        }
        return perm;
    }

    /// <summary>
    /// George–Liu FNROOT: from <paramref name="seed"/>, repeatedly root a level structure at a minimum-degree node of the
    /// last level while the number of levels (eccentricity + 1) grows. Only unnumbered nodes are visited.
    /// </summary>
    private static int PseudoPeripheralNode(int seed, int[] xadj, int[] adj, int[] degree, bool[] numbered,
        int[] levelNodes, int[] levelPtr, int[] stamp, ref int stampValue)
    {
        int root = seed;
        int levels = RootedLevelStructure(root, xadj, adj, numbered, levelNodes, levelPtr, stamp, ref stampValue, out int size);
        if (levels == 1 || levels == size) return root; // isolated node, or a path rooted at an end
        while (true)
        {
            // Minimum-degree node in the last level (ties: lower index).
            int best = -1;
            for (int p = levelPtr[levels - 1]; p < levelPtr[levels]; p++)
            {
                int v = levelNodes[p];
                if (best < 0 || degree[v] < degree[best] || (degree[v] == degree[best] && v < best)) best = v;
            }
            int newLevels = RootedLevelStructure(best, xadj, adj, numbered, levelNodes, levelPtr, stamp, ref stampValue, out _);
            root = best;
            if (newLevels <= levels) return root;
            levels = newLevels;
            if (levels >= size) return root;
        }
    }

    private const int MaxWidthCandidates = 24;

    /// <summary>
    /// GPS-style refinement of a pseudo-peripheral <paramref name="root"/>: among up to <see cref="MaxWidthCandidates"/>
    /// nodes of its last level, the root of the level structure with the smallest maximum level size (ties: the earlier
    /// candidate, the original root first), restricted to candidates at least as eccentric as the root.
    /// </summary>
    private static int NarrowestRoot(int root, int[] xadj, int[] adj, bool[] numbered,
        int[] levelNodes, int[] levelPtr, int[] stamp, ref int stampValue, List<int> candidates)
    {
        int levels = RootedLevelStructure(root, xadj, adj, numbered, levelNodes, levelPtr, stamp, ref stampValue, out int size);
        if (levels <= 2 || levels == size) return root;
        int bestWidth = MaxLevelWidth(levelPtr, levels);
        candidates.Clear();
        int lastBegin = levelPtr[levels - 1], lastCount = levelPtr[levels] - lastBegin;
        int take = Math.Min(lastCount, MaxWidthCandidates);
        for (int t = 0; t < take; t++) candidates.Add(levelNodes[lastBegin + (int)((long)t * lastCount / take)]);

        int best = root;
        foreach (int c in candidates)
        {
            int l = RootedLevelStructure(c, xadj, adj, numbered, levelNodes, levelPtr, stamp, ref stampValue, out _);
            if (l < levels) continue;
            int w = MaxLevelWidth(levelPtr, l);
            if (w < bestWidth) { bestWidth = w; best = c; }
        }
        return best;
    }

    private static int MaxLevelWidth(int[] levelPtr, int levels)
    {
        int w = 0;
        for (int k = 0; k < levels; k++) w = Math.Max(w, levelPtr[k + 1] - levelPtr[k]);
        return w;
    }

    /// <summary>Breadth-first level structure rooted at <paramref name="root"/> over unnumbered nodes. Returns the number of levels.</summary>
    private static int RootedLevelStructure(int root, int[] xadj, int[] adj, bool[] numbered,
        int[] levelNodes, int[] levelPtr, int[] stamp, ref int stampValue, out int size)
    {
        int mark = ++stampValue;
        int count = 0, levels = 0;
        levelNodes[count++] = root;
        stamp[root] = mark;
        int begin = 0;
        while (begin < count)
        {
            levelPtr[levels++] = begin;
            int end = count;
            for (int h = begin; h < end; h++)
            {
                int v = levelNodes[h];
                for (int p = xadj[v]; p < xadj[v + 1]; p++)
                {
                    int w = adj[p];
                    if (numbered[w] || stamp[w] == mark) continue;
                    stamp[w] = mark;
                    levelNodes[count++] = w;
                }
            }
            begin = end;
        }
        levelPtr[levels] = count;
        size = count;
        return levels;
    }

    /// <summary>
    /// Full (both triangles) adjacency of the structural off-diagonal non-zeros, neighbours in ascending order, in arrays
    /// rented from <see cref="ArrayPool{T}.Shared"/> (longer than needed: xadj[0..n], adj[0..xadj[n]) hold it) that the
    /// caller gives back.
    /// </summary>
    internal static (int[] Xadj, int[] Adj) Adjacency(SymmetricSparseMatrix a)
    {
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        var ints = ArrayPool<int>.Shared;
        var xadj = ints.Rent(n + 1);
        Array.Clear(xadj, 0, n + 1);
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int i = ri[p];
                if (i == j) continue;
                xadj[i + 1]++;
                xadj[j + 1]++;
            }
        for (int v = 0; v < n; v++) xadj[v + 1] += xadj[v];
        var adj = ints.Rent(xadj[n]);
        var fill = ints.Rent(n);
        Array.Copy(xadj, fill, n);
        // Column j ascending: node i > j receives j (ascending j); node j receives its rows i > j (ascending),
        // after all of its smaller neighbours were added from earlier columns — so each list comes out sorted.
        for (int j = 0; j < n; j++)
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int i = ri[p];
                if (i == j) continue;
                adj[fill[i]++] = j;
                adj[fill[j]++] = i;
            }
        ints.Return(fill);
        return (xadj, adj);
    }

    /// <summary>
    /// For the reordered matrix (inverse permutation <c>inv[old] = new</c>): first structural column fᵢ ≤ i of every row
    /// of the lower triangle.
    /// </summary>
    internal static int[] FirstColumns(SymmetricSparseMatrix a, ReadOnlySpan<int> inv)
    {
        int n = a.Size;
        var first = new int[n];
        for (int i = 0; i < n; i++) first[i] = i;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        for (int j = 0; j < n; j++)
        {
            int nj = inv[j];
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int ni = inv[ri[p]];
                int r = Math.Max(ni, nj), c = Math.Min(ni, nj);
                if (c < first[r]) first[r] = c;
            }
        }
        return first;
    }
}
