using System.Buffers;
using System.Runtime.CompilerServices;

namespace PlaneLateral.Solvers;

/// <summary>Which fill-reducing ordering <see cref="SupernodalCholeskySolver"/> applies.</summary>
public enum SupernodalOrdering
{
    /// <summary>Approximate minimum degree (<see cref="MinimumDegreeOrdering"/>), the default.</summary>
    ApproximateMinimumDegree = 0,

    /// <summary>The caller's own numbering (postordered, which changes no fill).</summary>
    Natural = 1,

    /// <summary>Reverse Cuthill–McKee (<see cref="Orderings.ReverseCuthillMcKee(SymmetricSparseMatrix)"/>), for comparison.</summary>
    ReverseCuthillMcKee = 2,
}

/// <summary>
/// Supernodal multifrontal sparse Cholesky solver, P·K·Pᵀ = L·Lᵀ, for large sparse SPD systems (2D meshes and beyond).
/// </summary>
/// <remarks>
/// <para>
/// Phases: a fill-reducing ordering (approximate minimum degree by default); symbolic analysis (elimination tree, postorder,
/// column counts, relaxed supernodes and their row patterns, see <see cref="SupernodalSymbolic"/>); numeric factorisation by
/// the multifrontal method (Duff and Reid, "The multifrontal solution of indefinite sparse symmetric linear equations",
/// ACM TOMS 9(3), 1983; Liu, "The multifrontal method for sparse matrix solution: theory and practice", SIAM Review 34(1),
/// 1992): each supernode assembles its frontal matrix from the matrix entries and its children's update matrices
/// (extend-add), factorises its columns with dense blocked kernels (<see cref="FrontKernels"/>) and passes the Schur
/// complement to its parent on a stack. Memory: the factor plus the largest front plus the update-matrix stack.
/// </para>
/// <para>
/// Pivot failure, the project's policy: with d the Schur-complement diagonal at column j, a pivot with K_jj ≤ 0,
/// d ≤ tol·K_jj, or either not finite is recorded (original DOF, d, K_jj); column j of L becomes the unit vector, which
/// eliminates the DOF with no coupling (held at zero), and the factorisation goes on. The entries of row j of L are kept:
/// they give <see cref="ISparseSpdFactor.MechanismShape"/> as z = L⁻ᵀ·e_j, scaled.
/// </para>
/// <para>Thread safety: the solver and its factors are immutable after construction; solves use per-call scratch.
/// Determinism: the ordering, the symbolic phase and the numeric kernels give bitwise-equal results for the same input on the
/// same machine, whatever the number of threads (threads split columns of an update, never a sum).</para>
/// </remarks>
public sealed class SupernodalCholeskySolver : ISparseSpdSolver
{
    /// <summary>Creates the solver with the given ordering (approximate minimum degree by default).</summary>
    /// <param name="kernels">Dense kernels asked for: the managed ones (default) or OpenBLAS when it loads (see
    /// <see cref="NativeBlas"/>); <see cref="Kernels"/> says which are used.</param>
    public SupernodalCholeskySolver(SupernodalOrdering ordering = SupernodalOrdering.ApproximateMinimumDegree, int maxThreads = 0,
        DenseKernelBackend kernels = DenseKernelBackend.Managed)
    {
        if (!Enum.IsDefined(ordering)) throw new ArgumentOutOfRangeException(nameof(ordering));
        if (!Enum.IsDefined(kernels)) throw new ArgumentOutOfRangeException(nameof(kernels));
        ArgumentOutOfRangeException.ThrowIfNegative(maxThreads);
        Ordering = ordering;
        MaxThreads = maxThreads == 0 ? Environment.ProcessorCount : maxThreads;
        RequestedKernels = kernels;
        Kernels = kernels == DenseKernelBackend.OpenBlas && NativeBlas.IsAvailable ? DenseKernelBackend.OpenBlas : DenseKernelBackend.Managed;
    }

    /// <summary>The dense kernels asked for.</summary>
    public DenseKernelBackend RequestedKernels { get; }

    /// <summary>The dense kernels used: OpenBLAS only when asked for and loadable, else the managed ones.</summary>
    public DenseKernelBackend Kernels { get; }

    /// <summary>The ordering applied before factorising.</summary>
    public SupernodalOrdering Ordering { get; }

    /// <summary>Threads the dense updates of large fronts may use.</summary>
    public int MaxThreads { get; }

    /// <summary>Where the factorisation's large arrays live (<see cref="FactorBuffer"/>): by size unless a test asks.</summary>
    internal FactorStorage Storage { get; init; }

    /// <inheritdoc />
    public string Description => "supernodal multifrontal Cholesky, " + Ordering switch
    {
        SupernodalOrdering.ApproximateMinimumDegree => "approximate minimum degree order",
        SupernodalOrdering.Natural => "natural order",
        _ => "reverse Cuthill–McKee order",
    } + KernelDescription;

    private string KernelDescription => Kernels == DenseKernelBackend.OpenBlas
        ? $" (native dense kernels: {NativeBlas.Status}; fronts below {SupernodalFactor.NativeMinFront} rows managed)"
        : $" (managed, {FrontKernelsInfo.Width}, {MaxThreads} thread{(MaxThreads == 1 ? "" : "s")}"
          + (RequestedKernels == DenseKernelBackend.OpenBlas ? $"; OpenBLAS asked for but not used: {NativeBlas.Status}" : "") + ")";

    /// <summary>The fill-reducing permutation this solver would use for <paramref name="matrix"/> (<c>perm[new] = old</c>).</summary>
    public int[] ComputeOrdering(SymmetricSparseMatrix matrix) => Ordering switch
    {
        SupernodalOrdering.Natural => Orderings.Natural(matrix.Size),
        SupernodalOrdering.ReverseCuthillMcKee => Orderings.ReverseCuthillMcKee(matrix),
        _ => MinimumDegreeOrdering.Compute(matrix),
    };

    /// <inheritdoc />
    /// <remarks>With two threads or more and a large matrix, the matrix's rows (<see cref="StrictLowerRows"/>), which the
    /// symbolic analysis reads, are built on a second thread while the ordering runs; nothing either computes depends on
    /// the other, so the result is the same.</remarks>
    public ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        bool parallel = MaxThreads > 1 && SupernodalSymbolic.WorthASecondThread(matrix);
        var rows = parallel ? Task.Run(() => StrictLowerRows.Of(matrix)) : null;
        var ordering = ComputeOrdering(matrix);
        var lower = rows is null ? StrictLowerRows.Of(matrix) : rows.GetAwaiter().GetResult();
        return SupernodalFactor.Create(matrix, ordering, relativePivotTolerance, MaxThreads, Kernels == DenseKernelBackend.OpenBlas, lower, Storage);
    }

    /// <summary>Factorises under a permutation supplied by the caller (<c>perm[new] = old</c>; it is postordered, which
    /// changes no fill).</summary>
    public SupernodalFactor Factorize(SymmetricSparseMatrix matrix, int[] permutation, double relativePivotTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(permutation);
        if (permutation.Length != matrix.Size || !Orderings.IsPermutation(permutation))
            throw new ArgumentException("Not a permutation of the matrix's DOFs.", nameof(permutation));
        return SupernodalFactor.Create(matrix, (int[])permutation.Clone(), relativePivotTolerance, MaxThreads, Kernels == DenseKernelBackend.OpenBlas,
            storage: Storage);
    }

    /// <summary>Symbolic analysis only: the factor's size for a matrix under a permutation (for measurements).</summary>
    public static SupernodalAnalysis Analyse(SymmetricSparseMatrix matrix, int[] permutation)
    {
        var s = SupernodalSymbolic.Analyse(matrix, permutation);
        return new SupernodalAnalysis(s.ExactNonZeros, s.FactorNonZeros, s.SupernodeCount, s.MaxFront, s.Flops);
    }
}

/// <summary>Sizes from the symbolic analysis.</summary>
/// <param name="ExactNonZeros">nnz(L) of the exact pattern, diagonal included.</param>
/// <param name="StoredNonZeros">Entries held by the relaxed supernodes (explicit zeros included), diagonal included.</param>
/// <param name="Supernodes">Number of (relaxed) supernodes.</param>
/// <param name="LargestFront">Order of the largest frontal matrix.</param>
/// <param name="Flops">Floating-point operations of the factorisation on the exact pattern.</param>
public readonly record struct SupernodalAnalysis(long ExactNonZeros, long StoredNonZeros, int Supernodes, int LargestFront, double Flops);

internal static class FrontKernelsInfo
{
    /// <summary>The kernels' vector width in words for the description ("256-bit vector kernels", "scalar kernels").</summary>
    public static string Width => DenseKernels.VectorBits == 0 ? "scalar kernels" : $"{DenseKernels.VectorBits}-bit vector kernels";
}

/// <summary>The supernodal factor P·K·Pᵀ = L·Lᵀ. Immutable; safe to use from several threads at once.</summary>
/// <remarks>A large factor (values of <see cref="FactorBuffer.NativeMinBytes"/> or more) holds its values in native
/// memory: <see cref="Dispose"/> gives it back at once, after which solves throw <see cref="ObjectDisposedException"/>;
/// a factor never disposed is freed by a finalizer once unreachable.</remarks>
public sealed class SupernodalFactor : ISparseSpdFactor
{
    private readonly SupernodalSymbolic _s;
    private readonly FactorBuffer _l;
    private readonly bool[] _failed;   // by new index
    private readonly PivotFailure[] _failures;
    private readonly int[] _failurePosition;

    private SupernodalFactor(SupernodalSymbolic s, FactorBuffer l, bool[] failed, PivotFailure[] failures, int[] positions)
    {
        _s = s;
        _l = l;
        _failed = failed;
        _failures = failures;
        _failurePosition = positions;
    }

    /// <inheritdoc />
    public int Size => _s.N;

    /// <inheritdoc />
    /// <remarks>Entries of the relaxed supernodes' lower trapezoids, explicit zeros of the amalgamation included.</remarks>
    public long FactorNonZeros => _s.FactorNonZeros;

    /// <summary>nnz(L) of the exact (unamalgamated) pattern, diagonal included.</summary>
    public long ExactNonZeros => _s.ExactNonZeros;

    /// <summary>Number of supernodes.</summary>
    public int Supernodes => _s.SupernodeCount;

    /// <summary>Order of the largest frontal matrix.</summary>
    public int LargestFront => _s.MaxFront;

    /// <summary>The ordering used (postordered), <c>perm[new] = old</c> (a copy).</summary>
    public int[] Permutation => (int[])_s.Perm.Clone();

    /// <inheritdoc />
    public IReadOnlyList<PivotFailure> PivotFailures => _failures;

    /// <summary>Whether independent subtrees were factorised on several threads (for tests).</summary>
    internal bool SubtreesInParallel { get; private init; }

    /// <summary>Total front work (Σ k·m²) from which subtrees are factorised in parallel.</summary>
    internal const double ParallelWorkThreshold = 5e8;

    /// <summary>Smallest front (rows) handed to native BLAS; smaller ones stay managed, where a call costs more than it saves.</summary>
    internal const int NativeMinFront = 96;

    /// <summary>Whether some fronts were factorised by native BLAS (for tests).</summary>
    internal int NativeFronts { get; private init; }

    /// <summary>Bytes of the arrays the numeric factorisation allocated or reused: the factor, the workspaces (update block,
    /// packing buffer, update-matrix stack, index maps), the subtree roots' update matrices and the matrix entries regrouped by
    /// column. An upper bound of the phase's peak memory (the symbolic analysis and the matrix itself come on top).</summary>
    public long NumericBytes { get; private init; }

    /// <summary>The factor's stored values (supernode blocks, column-major), for the tests that compare kernels bit for bit.</summary>
    internal ReadOnlySpan<double> Values => _l.Span;

    /// <summary>Whether the factor's values are in native memory (for tests and measurements).</summary>
    internal bool ValuesNative => _l.IsNative;

    /// <summary>Bytes of the factor's values (<c>8 × Σ m·k</c>).</summary>
    public long FactorBytes => (long)_l.Length * sizeof(double);

    /// <summary>Releases the factor's values (native memory given back at once; a solve running on another thread
    /// finishes first). Later solves and mechanism shapes throw <see cref="ObjectDisposedException"/>; the sizes and
    /// <see cref="PivotFailures"/> stay readable. Calling it again does nothing.</summary>
    public void Dispose() => _l.Dispose();

    /// <summary>
    /// Per-worker scratch of the numeric factorisation: the update block of the current front, the packing buffer, the
    /// update-matrix stack (lower triangles, packed by column), index maps and failures. Sized once from the symbolic
    /// analysis before any front is factorised, so nothing grows during the factorisation; kept between factorisations
    /// (weakly, so the collector may take them back) so that a run that factorises several matrices maps its scratch once.
    /// </summary>
    private sealed class Workspace : IDisposable
    {
        public FactorBuffer Upd = FactorBuffer.Allocate(0, false);
        public double[] Pack = Array.Empty<double>();
        public int[] Map = Array.Empty<int>();
        public int[] Rel = Array.Empty<int>();
        public FactorBuffer Stack = FactorBuffer.Allocate(0, false);
        public long Top;
        public readonly List<int> StackSuper = new();
        public readonly List<long> StackOffset = new();
        public readonly List<(int Position, PivotFailure Failure)> Failures = new();
        public readonly List<(int Column, double Pivot)> FrontFailures = new();
        public double[] Save = Array.Empty<double>();
        public int NativeFronts;

        /// <param name="offHeap">Whether the update block and the stack go to native memory (<see cref="FactorBuffer"/>).</param>
        public void Reserve(in Needs need, int n, bool offHeap)
        {
            if (Map.Length < n) Map = new int[n];
            // Written before read (the update block's triangle is cleared per front): uninitialised, large ones on huge pages.
            long updLen = (long)need.MaxUpdate * need.MaxUpdate;
            if (Upd.Length < updLen || Upd.IsNative != offHeap)
            {
                Upd.Dispose();
                Upd = FactorBuffer.Allocate(updLen, offHeap);
            }
            int packLen = ((need.MaxFront + 7) / 8 + 1) * 8 * FrontKernels.PanelWidth;
            if (Pack.Length < packLen) Pack = new double[packLen];
            if (Rel.Length < need.MaxFront) Rel = new int[need.MaxFront];
            if (Stack.Length < need.Stack || Stack.IsNative != offHeap)
            {
                Stack.Dispose();
                Stack = FactorBuffer.Allocate(need.Stack, offHeap);
            }
            if (need.Native && Save.LongLength < (long)need.MaxPivots * need.MaxPivots) Save = new double[(long)need.MaxPivots * need.MaxPivots];
            Top = 0;
            StackSuper.Clear();
            StackOffset.Clear();
            Failures.Clear();
            NativeFronts = 0;
        }

        public long Bytes => 8 * ((long)Upd.Length + Pack.LongLength + Stack.Length + Save.LongLength) + 4L * (Map.Length + Rel.Length);

        /// <summary>Frees the update block and the stack (native ones given back at once).</summary>
        public void Dispose()
        {
            Upd.Dispose();
            Stack.Dispose();
        }
    }

    /// <summary>What a workspace must hold for a set of supernodes: largest front, largest update block, peak of the
    /// update-matrix stack (entries), largest pivot block.</summary>
    private record struct Needs(int MaxFront, int MaxUpdate, long Stack, int MaxPivots, bool Native)
    {
        public static Needs Max(Needs a, Needs b) => new(Math.Max(a.MaxFront, b.MaxFront), Math.Max(a.MaxUpdate, b.MaxUpdate),
            Math.Max(a.Stack, b.Stack), Math.Max(a.MaxPivots, b.MaxPivots), a.Native || b.Native);
    }

    private static readonly System.Collections.Concurrent.ConcurrentBag<WeakReference<Workspace>> Cache = new();

    private static Workspace TakeWorkspace()
    {
        while (Cache.TryTake(out var r))
            if (r.TryGetTarget(out var ws)) return ws;
        return new Workspace();
    }

    private static void ReturnWorkspace(Workspace ws) => Cache.Add(new WeakReference<Workspace>(ws));

    /// <summary>Packed lower triangle of an update block of order nb.</summary>
    private static long Packed(int nb) => (long)nb * (nb + 1) / 2;

    /// <summary>Replays the stack discipline of <see cref="FactorSupernode"/> over the supernodes <paramref name="nodes"/>
    /// (in factorisation order) to find the workspace they need.</summary>
    private static Needs Simulate(SupernodalSymbolic s, IEnumerable<int> nodes, bool[] subtreeRoot, bool native)
    {
        var stack = new List<(int Node, long Size)>();
        long top = 0, peak = 0;
        int maxFront = 1, maxUpdate = 0, maxPivots = 0;
        foreach (int t in nodes)
        {
            int k = s.First[t + 1] - s.First[t], nb = s.PatternStart[t + 1] - s.PatternStart[t];
            maxFront = Math.Max(maxFront, k + nb);
            maxUpdate = Math.Max(maxUpdate, nb);
            maxPivots = Math.Max(maxPivots, k);
            while (stack.Count > 0 && s.Parent[stack[^1].Node] == t)
            {
                top -= stack[^1].Size;
                stack.RemoveAt(stack.Count - 1);
            }
            if (nb == 0 || s.Parent[t] < 0 || subtreeRoot[t]) continue;
            stack.Add((t, Packed(nb)));
            top += Packed(nb);
            peak = Math.Max(peak, top);
        }
        return new Needs(maxFront, maxUpdate, peak, maxPivots, native);
    }

    /// <summary>Shared inputs of the numeric factorisation.</summary>
    private sealed class NumericJob
    {
        public SupernodalSymbolic S = null!;
        public int[] ColPtr = null!, Rows = null!, Source = null!;
        public double[] Values = null!, Diag = null!;
        public FactorBuffer L = null!;
        public bool OffHeap;
        public bool[] Failed = null!;
        public double Tol;
        public bool Native;
        public bool[] SubtreeRoot = null!;
        public FactorBuffer?[] Handover = null!;
        public int[] ChildHead = null!, ChildNext = null!;
    }

    /// <summary>
    /// Numeric factorisation. The supernodal tree is cut into independent subtrees of bounded work (fixed by the tree alone,
    /// not by the thread count), which are factorised in parallel, each with its own update block and update stack; the
    /// remaining top of the tree is then factorised with the threads splitting the dense updates of its large fronts. The
    /// subtree roots hand their update matrices to the top part in separate arrays. Every sum is formed in the same order
    /// whatever the thread count, so the factor is bitwise the same with 1 or more threads.
    /// </summary>
    /// <remarks>
    /// <para>Memory: the factor is allocated once at its final size and each front's pivot columns are assembled and
    /// factorised in place in it; only the front's update block lives in the workspace, whose buffers and stack are sized
    /// from the symbolic analysis before the first front (the stack discipline is replayed on the tree), so nothing is
    /// copied into the factor and nothing grows. Update matrices are stored as packed lower triangles.</para>
    /// <para>With <paramref name="native"/> the fronts of at least <see cref="NativeMinFront"/> rows go to OpenBLAS, which
    /// threads each call itself; subtrees are then factorised one after the other, so that two threads of ours never
    /// call the library at once, and results are no longer bitwise independent of the library's thread count.</para>
    /// <para>Large factorisations (<paramref name="storage"/>, <see cref="FactorBuffer.NativeMinBytes"/>) keep the factor,
    /// the update blocks, the stacks and the handed-over update matrices in native memory: a handed-over matrix is freed as
    /// soon as its parent has added it, the subtrees' workspaces before the top part's is mapped, the top part's before
    /// returning. The arithmetic is the same on either storage, so are the bits.</para>
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static SupernodalFactor Create(SymmetricSparseMatrix a, int[] ordering, double tol, int threads, bool native = false,
        StrictLowerRows? lower = null, FactorStorage storage = FactorStorage.BySize)
    {
        var s = SupernodalSymbolic.Analyse(a, ordering, lower ?? StrictLowerRows.Of(a), threads > 1);
        int n = s.N, ns = s.SupernodeCount;
        if (s.StoredEntries > Array.MaxLength)
            throw new InvalidOperationException($"The factor needs {s.StoredEntries} entries, more than the largest array holds.");
        if (8 * s.StoredEntries >= CollectBeforeFactorBytes) CollectBeforeFactor();
        bool offHeap = storage == FactorStorage.Native || (storage == FactorStorage.BySize && 8 * s.StoredEntries >= FactorBuffer.NativeMinBytes);
        var job = new NumericJob
        {
            S = s, L = FactorBuffer.Allocate(s.StoredEntries, offHeap, pressure: true), OffHeap = offHeap, Failed = new bool[n], Tol = tol,
            Values = a.Values, Native = native,
        };
        // The matrix by column in the new numbering, as the symbolic phase grouped it (not kept by the factor).
        (job.ColPtr, job.Rows, job.Source) = (s.ColPtr!, s.RowsByCol!, s.SourceByCol!);
        (s.ColPtr, s.RowsByCol, s.SourceByCol) = (null, null, null);
        var diag = new double[n];
        for (int j = 0; j < n; j++)
            for (int p = job.ColPtr[j]; p < job.ColPtr[j + 1]; p++)
                if (job.Rows[p] == j) diag[j] += job.Values[job.Source[p]];
        job.Diag = diag;

        // Work of each front (≈ k·m²) and of each subtree; the first supernode of each subtree (postorder: contiguous).
        var work = new double[ns];
        var firstDesc = new int[ns];
        job.ChildHead = new int[ns];
        job.ChildNext = new int[ns];
        Array.Fill(job.ChildHead, -1);
        for (int t = 0; t < ns; t++) firstDesc[t] = t;
        for (int t = ns - 1; t >= 0; t--)
        {
            int par = s.Parent[t];
            if (par < 0) continue;
            job.ChildNext[t] = job.ChildHead[par];
            job.ChildHead[par] = t; // children in increasing order
        }
        double total = 0;
        for (int t = 0; t < ns; t++)
        {
            int k = s.First[t + 1] - s.First[t];
            int m = k + s.PatternStart[t + 1] - s.PatternStart[t];
            work[t] += (double)k * m * m + m;
            total += (double)k * m * m + m;
            int par = s.Parent[t];
            if (par >= 0)
            {
                work[par] += work[t];
                firstDesc[par] = Math.Min(firstDesc[par], firstDesc[t]);
            }
        }
        // Cut: split the heaviest subtree into its children while it holds more than 1/16 of the work.
        var isTop = new bool[ns];
        var roots = new SortedSet<(double Work, int Node)>(Comparer<(double, int)>.Create((x, y) =>
            x.Item1 != y.Item1 ? y.Item1.CompareTo(x.Item1) : x.Item2.CompareTo(y.Item2)));
        for (int t = 0; t < ns; t++) if (s.Parent[t] < 0) roots.Add((work[t], t));
        while (roots.Count > 0)
        {
            var heaviest = roots.Min;
            if (heaviest.Work <= total / 16 || job.ChildHead[heaviest.Node] < 0) break;
            roots.Remove(heaviest);
            isTop[heaviest.Node] = true;
            for (int c = job.ChildHead[heaviest.Node]; c >= 0; c = job.ChildNext[c]) roots.Add((work[c], c));
        }
        job.SubtreeRoot = new bool[ns];
        foreach (var (_, node) in roots) job.SubtreeRoot[node] = true;
        job.Handover = new FactorBuffer?[ns];
        var tasks = roots.Select(r => r.Node).ToArray(); // heaviest first

        // Workspace sizes: every subtree workspace can take any subtree; the top part has its own.
        var subtreeNeeds = new Needs(1, 0, 0, 0, native);
        foreach (int r in tasks)
            subtreeNeeds = Needs.Max(subtreeNeeds, Simulate(s, Enumerable.Range(firstDesc[r], r - firstDesc[r] + 1), job.SubtreeRoot, native));
        var topNeeds = Simulate(s, Enumerable.Range(0, ns).Where(t => isTop[t]), job.SubtreeRoot, native);
        long handoverBytes = 0;
        foreach (int r in tasks)
            if (s.Parent[r] >= 0) handoverBytes += 8 * Packed(s.PatternStart[r + 1] - s.PatternStart[r]);

        // Threads only pay off on large trees: on the 10k-unknown wall (work ≈ 10⁸) two threads were slower than one in
        // most paired runs on the (loaded) test machine. The cut above does not depend on this, so neither do the results.
        bool parallel = !native && threads > 1 && tasks.Length > 1 && total >= ParallelWorkThreshold;
        int workers = parallel ? Math.Min(threads, tasks.Length) : 1;
        var pool = new System.Collections.Concurrent.ConcurrentBag<Workspace>();
        var used = new List<Workspace>();
        for (int i = 0; i < workers && tasks.Length > 0; i++)
        {
            var ws = offHeap ? new Workspace() : TakeWorkspace();
            ws.Reserve(subtreeNeeds, n, offHeap);
            pool.Add(ws);
            used.Add(ws);
        }
        var failures = new List<(int Position, PivotFailure Failure)>();
        int nativeFronts = 0;
        long bytes = 8L * job.L.Length + 8L * n + n + 12L * job.Rows.Length + 4L * (n + 1) + handoverBytes
            + used.Sum(w => w.Bytes);
        void RunSubtree(int root)
        {
            pool.TryTake(out var ws);
            for (int t = firstDesc[root]; t <= root; t++) FactorSupernode(job, ws!, t, 1);
            pool.Add(ws!);
        }
        if (parallel)
            Parallel.ForEach(tasks, new ParallelOptions { MaxDegreeOfParallelism = workers }, RunSubtree);
        else
            foreach (int r in tasks) RunSubtree(r);
        foreach (var ws in used)
        {
            failures.AddRange(ws.Failures);
            nativeFronts += ws.NativeFronts;
        }
        // The top part: a subtree workspace when it is large enough (always so when one thread ran them), else its own.
        if (isTop.Any(x => x))
        {
            Workspace top;
            bool shared = used.Count > 0 && Needs.Max(subtreeNeeds, topNeeds) == subtreeNeeds;
            if (shared) top = used[0];
            else
            {
                if (offHeap)
                {
                    // The subtrees are done (their stacks empty): their native memory goes back before the top part's is mapped.
                    foreach (var ws in used) ws.Dispose();
                    used.Clear();
                }
                top = offHeap ? new Workspace() : TakeWorkspace();
                used.Add(top);
            }
            top.Reserve(topNeeds, n, offHeap);
            bytes += shared ? 0 : top.Bytes;
            for (int t = 0; t < ns; t++)
                if (isTop[t]) FactorSupernode(job, top, t, threads);
            failures.AddRange(top.Failures);
            nativeFronts += top.NativeFronts;
        }
        // Native workspaces are freed (managed ones kept, weakly, for the next factorisation). After an exception the
        // native blocks are left to their finalizers.
        foreach (var ws in used)
            if (offHeap) ws.Dispose();
            else ReturnWorkspace(ws);

        var all = failures.OrderBy(f => f.Position).ToArray();
        return new SupernodalFactor(s, job.L, job.Failed, all.Select(f => f.Failure).ToArray(), all.Select(f => f.Position).ToArray())
        {
            SubtreesInParallel = parallel,
            NativeFronts = nativeFronts,
            NumericBytes = bytes,
        };
    }

    /// <summary>Factor size (bytes) from which a full collection precedes its allocation (64 MiB: about 10⁵ unknowns).</summary>
    internal const long CollectBeforeFactorBytes = 64L << 20;

    /// <summary>
    /// A full blocking collection just before the factor is allocated: the matrix's assembly, the ordering and the symbolic
    /// analysis leave their temporaries (several times the matrix) as garbage, and whether the collector has swept them
    /// before the numeric phase maps its arrays otherwise depends on the timing of its background thread (on a loaded
    /// machine it often had not). Issue 19: at 10⁶ unknowns the process's peak resident memory went from 2,071 to 1,768 MiB
    /// with it (docs/solver.md, "Process peak memory"). One collection of a heap of a few large arrays; changes no value.
    /// <para>Aggressive mode (<see cref="GCCollectionMode.Aggressive"/>): a forced collection keeps the freed regions
    /// mapped (committed) for later allocations, and the native factor (<see cref="FactorBuffer"/>) cannot reuse them, so
    /// the collector is asked to give them back to the system; at 10⁶ unknowns this is what lets the native factor lower
    /// the peak (native factor with a forced collection: 2,082 MiB peak working set; with an aggressive one: 1,369–1,434
    /// MiB).</para>
    /// </summary>
    private static void CollectBeforeFactor() => GC.Collect(2, GCCollectionMode.Aggressive, blocking: true, compacting: true);

    /// <summary>Assembles, factorises and passes on the front of supernode t: its pivot columns in place in the factor,
    /// its update block in the workspace, from where it goes onto the stack (or to the top part for a subtree root).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void FactorSupernode(NumericJob job, Workspace ws, int t, int threads)
    {
        var s = job.S;
        var l = job.L.Span;
        var upd = ws.Upd.Span;
        var map = ws.Map;
        var rel = ws.Rel;
        var colPtr = job.ColPtr;
        var rows = job.Rows;
        var source = job.Source;
        var vals = job.Values;
        int f0 = s.First[t], k = s.First[t + 1] - f0;
        int ps = s.PatternStart[t], nb = s.PatternStart[t + 1] - ps;
        int m = k + nb;
        int off = (int)s.FactorOffset[t];
        for (int c = 0; c < k; c++) map[f0 + c] = c;
        for (int q = 0; q < nb; q++) map[s.PatternRows[ps + q]] = k + q;
        // The factor's block (allocated uninitialised: cleared here, just before use, while it goes into the cache) and the
        // update block's lower triangle are cleared.
        l.Slice(off, k * m).Clear();
        for (int c = 0; c < nb; c++) upd.Slice(c * nb + c, nb - c).Clear();

        // The matrix columns of the supernode.
        for (int c = 0; c < k; c++)
        {
            int j = f0 + c;
            int colBase = off + c * m;
            for (int p = colPtr[j]; p < colPtr[j + 1]; p++) l[colBase + map[rows[p]]] += vals[source[p]];
        }
        // Extend-add: children on this workspace's stack (on top, popped last-first), then children handed over by other
        // workspaces (increasing order).
        int depth = ws.StackSuper.Count;
        while (depth > 0 && s.Parent[ws.StackSuper[depth - 1]] == t)
        {
            int c = ws.StackSuper[--depth];
            long from = ws.StackOffset[depth];
            ws.StackSuper.RemoveAt(depth);
            ws.StackOffset.RemoveAt(depth);
            ExtendAdd(s, c, ws.Stack.Span, (int)from, l, off, m, k, upd, map, rel);
            ws.Top = from;
        }
        for (int c = job.ChildHead[t]; c >= 0; c = job.ChildNext[c])
        {
            var h = job.Handover[c];
            if (h is null) continue;
            ExtendAdd(s, c, h.Span, 0, l, off, m, k, upd, map, rel);
            job.Handover[c] = null;
            h.Dispose(); // native: given back now
        }

        bool done = false;
        if (job.Native && m >= NativeMinFront)
        {
            done = NativeBlas.TryPartialCholesky(l, off, m, k, upd, job.Diag.AsSpan(f0, k), job.Tol, ws.Save);
            if (done) ws.NativeFronts++;
        }
        if (!done)
        {
            var local = ws.FrontFailures;
            local.Clear();
            FrontKernels.PartialCholesky(l, off, m, k, upd, job.Diag.AsSpan(f0, k), job.Tol, ws.Pack, threads, local);
            foreach (var (c, piv) in local)
            {
                int j = f0 + c;
                ws.Failures.Add((j, new PivotFailure(s.Perm[j], piv, job.Diag[j])));
                job.Failed[j] = true;
            }
        }

        if (nb == 0 || s.Parent[t] < 0) return;
        Span<double> dst;
        long at;
        if (job.SubtreeRoot[t])
        {
            var h = FactorBuffer.Allocate(Packed(nb), job.OffHeap);
            dst = h.Span;
            at = 0;
            job.Handover[t] = h;
        }
        else
        {
            dst = ws.Stack.Span;
            at = ws.Top;
            ws.StackSuper.Add(t);
            ws.StackOffset.Add(at);
            ws.Top = at + Packed(nb);
        }
        for (int c = 0; c < nb; c++)
        {
            upd.Slice(c * nb + c, nb - c).CopyTo(dst.Slice((int)at, nb - c));
            at += nb - c;
        }
    }

    /// <summary>Adds a child's update matrix (packed lower triangle at <paramref name="from"/> in <paramref name="src"/>) to
    /// the front: its columns among the pivot columns go to the factor's block, the others to the update block.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void ExtendAdd(SupernodalSymbolic s, int c, ReadOnlySpan<double> src, int from, Span<double> l, int off, int m, int k,
        Span<double> upd, int[] map, int[] rel)
    {
        int cps = s.PatternStart[c], cn = s.PatternStart[c + 1] - cps;
        int nb = m - k;
        for (int q = 0; q < cn; q++) rel[q] = map[s.PatternRows[cps + q]];
        int pos = from;
        for (int ca = 0; ca < cn; ca++)
        {
            int dc = rel[ca];
            if (dc < k)
            {
                int dstCol = off + dc * m;
                for (int rb = ca; rb < cn; rb++) l[dstCol + rel[rb]] += src[pos + rb - ca];
            }
            else
            {
                int dstCol = (dc - k) * nb - k;
                for (int rb = ca; rb < cn; rb++) upd[dstCol + rel[rb]] += src[pos + rb - ca];
            }
            pos += cn - ca;
        }
    }

    /// <inheritdoc />
    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        int n = _s.N;
        if (b.Length != n || x.Length != n) throw new ArgumentException("Vector length differs from the factor size.");
        if (n == 0) return;
        var l = _l.Enter(); // throws once disposed; a Dispose meanwhile waits for Exit
        double[] w = ArrayPool<double>.Shared.Rent(n);
        double[] buf = ArrayPool<double>.Shared.Rent(Math.Max(1, _s.MaxFront));
        try
        {
            var perm = _s.Perm;
            for (int i = 0; i < n; i++) w[i] = _failed[i] ? 0.0 : b[perm[i]];
            Forward(l, w, buf);
            for (int i = 0; i < _failurePosition.Length; i++) w[_failurePosition[i]] = 0.0;
            Backward(l, w, buf);
            for (int i = 0; i < n; i++) x[perm[i]] = _failed[i] ? 0.0 : w[i];
        }
        finally
        {
            ArrayPool<double>.Shared.Return(buf);
            ArrayPool<double>.Shared.Return(w);
            _l.Exit();
        }
    }

    /// <summary>Solves K·X = B for several right-hand sides (each an array of length Size), one after another.</summary>
    /// <remarks>A blocked variant (8 vectors per pass over L, scalar inner loops) was measured 1.1–1.4× slower than eight
    /// vectorised single solves (docs/solver.md), so the vectors are solved one at a time.</remarks>
    public void Solve(double[][] b, double[][] x)
    {
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(x);
        if (b.Length != x.Length) throw new ArgumentException("Different numbers of right-hand sides and solutions.");
        for (int c = 0; c < b.Length; c++) Solve(b[c], x[c]);
    }

    /// <summary>L·y = w in place (new numbering).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Forward(ReadOnlySpan<double> l, double[] w, double[] buf)
    {
        var s = _s;
        for (int t = 0; t < s.SupernodeCount; t++)
        {
            int f0 = s.First[t], k = s.First[t + 1] - f0;
            int ps = s.PatternStart[t], nb = s.PatternStart[t + 1] - ps;
            int m = k + nb;
            long off = s.FactorOffset[t];
            Array.Copy(w, f0, buf, 0, k);
            Array.Clear(buf, k, nb);
            for (int c = 0; c < k; c++)
            {
                long colBase = off + (long)c * m;
                double y = buf[c] / l[(int)colBase + c];
                buf[c] = y;
                if (y != 0.0 && c + 1 < m)
                    DenseKernels.SubtractScaled(buf.AsSpan(c + 1, m - c - 1), y, l.Slice((int)(colBase + c + 1), m - c - 1));
            }
            Array.Copy(buf, 0, w, f0, k);
            for (int q = 0; q < nb; q++) w[s.PatternRows[ps + q]] += buf[k + q];
        }
    }

    /// <summary>Lᵀ·z = w in place (new numbering).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Backward(ReadOnlySpan<double> l, double[] w, double[] buf)
    {
        var s = _s;
        for (int t = s.SupernodeCount - 1; t >= 0; t--)
        {
            int f0 = s.First[t], k = s.First[t + 1] - f0;
            int ps = s.PatternStart[t], nb = s.PatternStart[t + 1] - ps;
            int m = k + nb;
            long off = s.FactorOffset[t];
            Array.Copy(w, f0, buf, 0, k);
            for (int q = 0; q < nb; q++) buf[k + q] = w[s.PatternRows[ps + q]];
            for (int c = k - 1; c >= 0; c--)
            {
                long colBase = off + (long)c * m;
                double v = buf[c];
                if (c + 1 < m) v -= DenseKernels.Dot(l.Slice((int)(colBase + c + 1), m - c - 1), buf.AsSpan(c + 1, m - c - 1));
                buf[c] = v / l[(int)colBase + c];
            }
            Array.Copy(buf, 0, w, f0, k);
        }
    }

    /// <inheritdoc />
    /// <remarks>
    /// With j the elimination position of the failed pivot, z = L⁻ᵀ·e_j in the new numbering: zero past j, 1 at j, and over
    /// the DOFs eliminated before j the solution of L₁₁ᵀz₁ = −(row j of L)/L_jj (L_jj = 1 for a failed pivot), which is
    /// K₁₁z₁ = −K₁ⱼ with earlier failed DOFs held at zero (their columns of L are unit vectors, so their entries come out 0).
    /// Then z is divided by max |zᵢ| (the failed DOF's entry stays positive).
    /// </remarks>
    public double[] MechanismShape(int failureIndex)
    {
        if ((uint)failureIndex >= (uint)_failures.Length) throw new ArgumentOutOfRangeException(nameof(failureIndex));
        int n = _s.N;
        int k = _failurePosition[failureIndex];
        var w = new double[n];
        w[k] = 1.0;
        var buf = new double[Math.Max(1, _s.MaxFront)];
        var l = _l.Enter();
        try
        {
            Backward(l, w, buf);
        }
        finally
        {
            _l.Exit();
        }
        double max = 0.0;
        for (int i = 0; i < n; i++) max = Math.Max(max, Math.Abs(w[i]));
        var z = new double[n];
        var perm = _s.Perm;
        for (int i = 0; i < n; i++) z[perm[i]] = (_failed[i] && i != k) || i > k ? 0.0 : w[i] / max;
        return z;
    }
}
