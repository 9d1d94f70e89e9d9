using System.Buffers;
using System.Runtime.CompilerServices;

namespace PlaneLateral.Solvers;

/// <summary>Which ordering <see cref="EnvelopeCholeskySolver"/> applies before factorising.</summary>
public enum EnvelopeOrdering
{
    /// <summary>Reverse Cuthill–McKee (<see cref="Orderings.ReverseCuthillMcKee(SymmetricSparseMatrix)"/>): small envelope, the default.</summary>
    ReverseCuthillMcKee = 0,

    /// <summary>The caller's own numbering (<see cref="Orderings.Natural"/>).</summary>
    Natural = 1,

    /// <summary>
    /// Whichever of reverse Cuthill–McKee and the caller's numbering has the smaller envelope (ties: RCM). Costs one extra
    /// envelope count, O(nnz); pays off when the input numbering is already good, e.g. a structured mesh numbered row by
    /// row along its shorter side, where RCM's level sets can be wider than the rows.
    /// </summary>
    SmallerEnvelope = 2,
}

/// <summary>
/// Envelope (variable-band, "skyline") direct solver: orders the matrix, stores the lower envelope row by row and
/// factorises it as P·K·Pᵀ = L·D·Lᵀ with unit lower-triangular L.
/// </summary>
/// <remarks>
/// <para>
/// The method is the row-oriented envelope factorisation of George and Liu, "Computer Solution of Large Sparse Positive
/// Definite Systems" (1981), ch. 4: the fill of L stays inside the envelope of P·K·Pᵀ, so storing row i from its first
/// non-zero column fᵢ up to the diagonal holds L exactly and needs no symbolic phase.
/// </para>
/// <para>
/// Why L·D·Lᵀ rather than L·Lᵀ: the pivot dₖ is then the Schur-complement diagonal itself, the very quantity the failure
/// test "dₖ ≤ tol·Kₖₖ" is stated on, with no square root in between; a negative or zero pivot is met as a number and
/// recorded instead of producing a NaN from √dₖ; and the row recurrence gₖ = aᵢₖ − Σ gₘ·Lₖₘ (g = row of L·D) is a plain dot
/// product of two contiguous spans, as fast as the L·Lᵀ form. See Golub and Van Loan, "Matrix Computations" (4th ed., 2013),
/// §4.1 for the L·D·Lᵀ recurrences.
/// </para>
/// <para>
/// Pivot failure: when dₖ ≤ tol·Kₖₖ, or Kₖₖ ≤ 0, or either is not finite, a <see cref="PivotFailure"/> is recorded; row k of L
/// (and, as later rows are computed, column k) is set to zero and dₖ = 1, which is the factor of K with that DOF held at zero.
/// Factorisation goes on, so every failure is found in one pass; the factor then solves the system with those DOFs restrained.
/// </para>
/// <para>Thread safety: the solver and its factors are immutable after construction; <see cref="ISparseSpdFactor.Solve"/> and
/// <see cref="ISparseSpdFactor.MechanismShape"/> use only per-call scratch and may be called from several threads at once.</para>
/// </remarks>
public sealed class EnvelopeCholeskySolver : ISparseSpdSolver
{
    /// <summary>Creates the solver with the given ordering (reverse Cuthill–McKee by default).</summary>
    public EnvelopeCholeskySolver(EnvelopeOrdering ordering = EnvelopeOrdering.ReverseCuthillMcKee)
    {
        if (!Enum.IsDefined(ordering)) throw new ArgumentOutOfRangeException(nameof(ordering));
        Ordering = ordering;
    }

    /// <summary>The ordering applied before factorising.</summary>
    public EnvelopeOrdering Ordering { get; }

    /// <inheritdoc />
    public string Description => Ordering switch
    {
        EnvelopeOrdering.ReverseCuthillMcKee => "envelope LDLᵀ (row-oriented skyline), reverse Cuthill–McKee order (managed)",
        EnvelopeOrdering.Natural => "envelope LDLᵀ (row-oriented skyline), natural order (managed)",
        _ => "envelope LDLᵀ (row-oriented skyline), smaller envelope of reverse Cuthill–McKee and natural order (managed)",
    };

    /// <inheritdoc />
    public ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int[] perm;
        switch (Ordering)
        {
            case EnvelopeOrdering.Natural:
                perm = Orderings.Natural(matrix.Size);
                break;
            case EnvelopeOrdering.SmallerEnvelope:
                var rcm = Orderings.ReverseCuthillMcKee(matrix);
                var natural = Orderings.Natural(matrix.Size);
                perm = Orderings.EnvelopeSize(matrix, natural) < Orderings.EnvelopeSize(matrix, rcm) ? natural : rcm;
                break;
            default:
                perm = Orderings.ReverseCuthillMcKee(matrix);
                break;
        }
        return EnvelopeFactor.Create(matrix, perm, relativePivotTolerance);
    }

    /// <summary>Factorises under a permutation supplied by the caller (<c>perm[new] = old</c>).</summary>
    public static EnvelopeFactor Factorize(SymmetricSparseMatrix matrix, int[] permutation, double relativePivotTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(permutation);
        if (permutation.Length != matrix.Size) throw new ArgumentException("Permutation length differs from the matrix size.", nameof(permutation));
        return EnvelopeFactor.Create(matrix, (int[])permutation.Clone(), relativePivotTolerance);
    }
}

/// <summary>
/// The factor P·K·Pᵀ = L·D·Lᵀ held in row-oriented envelope storage. Immutable; safe to use from several threads at once.
/// </summary>
/// <remarks>
/// L's entries, up to <see cref="SymmetricMatrixBuilder.PooledLength"/> of them, are held in an array rented from
/// <see cref="ArrayPool{T}.Shared"/> and given back on <see cref="Dispose"/>, so that a thread factorising one system after
/// another (the sweep's points, a convergence study's meshes, each disposed with its run) reuses the same memory instead
/// of a fresh large-object array each time; a larger L is an ordinary array left to the collector. After
/// <see cref="Dispose"/> the factor refuses to solve (<see cref="ObjectDisposedException"/>); it must not be disposed
/// while a solve on it is running.
/// </remarks>
public sealed class EnvelopeFactor : ISparseSpdFactor
{
    private readonly int _n;
    private readonly int[] _perm;       // perm[new] = old
    private readonly int[] _rowStart;   // row i of L (columns first[i] .. i-1) is _l[_rowStart[i] .. _rowStart[i+1])
    private double[]? _l;               // null once disposed
    private readonly bool _pooled;      // _l was rented from the shared pool
    private readonly double[] _d;
    private readonly bool[] _failed;    // by new index
    private readonly PivotFailure[] _failures;
    private readonly int[] _failurePosition;   // new index of each failure
    private readonly double[][] _failureRows;  // row of L at the failed pivot, before it was zeroed

    private EnvelopeFactor(int n, int[] perm, int[] rowStart, double[] l, bool pooled, double[] d, bool[] failed,
        PivotFailure[] failures, int[] failurePosition, double[][] failureRows)
    {
        _n = n;
        _perm = perm;
        _rowStart = rowStart;
        _l = l;
        _pooled = pooled;
        _d = d;
        _failed = failed;
        _failures = failures;
        _failurePosition = failurePosition;
        _failureRows = failureRows;
    }

    /// <inheritdoc />
    public int Size => _n;

    /// <inheritdoc />
    public long FactorNonZeros => (long)_rowStart[_n] + _n;

    /// <summary>Off-diagonal entries stored (the envelope size |Env| of P·K·Pᵀ).</summary>
    public long EnvelopeSize => _rowStart[_n];

    /// <summary>The ordering used, <c>perm[new] = old</c> (a copy).</summary>
    public int[] Permutation => (int[])_perm.Clone();

    /// <inheritdoc />
    public IReadOnlyList<PivotFailure> PivotFailures => _failures;

    // AggressiveOptimization: these run a few times per model with long loops, so tiered compilation would leave them in
    // on-stack-replaced code; compiling them fully optimised up front gives steady timings from the first call.
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static EnvelopeFactor Create(SymmetricSparseMatrix a, int[] perm, double tol)
    {
        int n = a.Size;
        var inv = Orderings.Inverse(perm);
        var first = Orderings.FirstColumns(a, inv);

        var rowStart = new int[n + 1];
        long total = 0;
        for (int i = 0; i < n; i++)
        {
            total += i - first[i];
            if (total > Array.MaxLength)
                throw new InvalidOperationException($"Envelope of {total}+ entries exceeds the largest array; use a better ordering.");
            rowStart[i + 1] = (int)total;
        }
        bool pooled = total <= SymmetricMatrixBuilder.PooledLength;
        var l = pooled ? ArrayPool<double>.Shared.Rent((int)total) : new double[total];
        if (pooled) Array.Clear(l, 0, (int)total);   // a rented array holds what its last user left
        var d = new double[n];

        // Scatter the lower triangle of P·K·Pᵀ into the envelope (duplicates, if any, summed).
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        var va = a.Values;
        for (int j = 0; j < n; j++)
        {
            int nj = inv[j];
            for (int p = cp[j]; p < cp[j + 1]; p++)
            {
                int ni = inv[ri[p]];
                if (ni == nj) { d[ni] += va[p]; continue; }
                int r = Math.Max(ni, nj), c = Math.Min(ni, nj);
                l[rowStart[r] + (c - first[r])] += va[p];
            }
        }
        var original = (double[])d.Clone();

        var failed = new bool[n];
        var failures = new List<PivotFailure>();
        var positions = new List<int>();
        var rows = new List<double[]>();

        for (int i = 0; i < n; i++)
        {
            int fi = first[i];
            int len = i - fi;
            var row = l.AsSpan(rowStart[i], len);

            // Turn row i of K into g = row i of L·D:  g_j = a_ij − Σ_{m = max(fi, fj)}^{j−1} g_m · L_jm
            // (g at j = fi is a_ij itself). A column whose pivot failed is held at zero.
            if (len > 0 && failed[fi]) row[0] = 0.0;
            for (int j = fi + 1; j < i; j++)
            {
                int pj = j - fi;
                if (failed[j]) { row[pj] = 0.0; continue; }
                int fj = first[j];
                int lo = fi > fj ? fi : fj;
                int cnt = j - lo;
                if (cnt <= 0) continue;
                row[pj] -= DenseKernels.Dot(row.Slice(lo - fi, cnt), l.AsSpan(rowStart[j] + (lo - fj), cnt));
            }

            // L_ij = g_j / d_j and d_i = a_ii − Σ g_j · L_ij.
            double di = d[i];
            for (int k = 0; k < len; k++)
            {
                double g = row[k];
                if (g == 0.0) continue;
                double lij = g / d[fi + k];
                di -= lij * g;
                row[k] = lij;
            }

            double kii = original[i];
            // Written with negations so that a NaN pivot or diagonal counts as a failure.
            if (!(kii > 0.0) || !(di > tol * kii) || !double.IsFinite(di) || !double.IsFinite(kii))
            {
                failures.Add(new PivotFailure(perm[i], di, kii));
                positions.Add(i);
                rows.Add(row.ToArray());
                row.Clear();
                failed[i] = true;
                d[i] = 1.0;
            }
            else d[i] = di;
        }

        return new EnvelopeFactor(n, perm, rowStart, l, pooled, d, failed, failures.ToArray(), positions.ToArray(), rows.ToArray());
    }

    /// <inheritdoc />
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        var l = _l ?? throw Disposed();
        if (b.Length != _n || x.Length != _n) throw new ArgumentException("Vector length differs from the factor size.");
        if (_n == 0) return;
        double[] rented = ArrayPool<double>.Shared.Rent(_n);
        try
        {
            var w = rented.AsSpan(0, _n);
            for (int i = 0; i < _n; i++) w[i] = _failed[i] ? 0.0 : b[_perm[i]];

            // L·y = P·b (row-oriented: one dot product per row).
            var rs = _rowStart;
            for (int i = 0; i < _n; i++)
            {
                int len = rs[i + 1] - rs[i];
                if (len > 0) w[i] -= DenseKernels.Dot(l.AsSpan(rs[i], len), w.Slice(i - len, len));
            }
            // D·z = y.
            for (int i = 0; i < _n; i++) w[i] /= _d[i];
            // Lᵀ·u = z (row-oriented: one update per row, from the last).
            for (int i = _n - 1; i > 0; i--)
            {
                int len = rs[i + 1] - rs[i];
                double wi = w[i];
                if (len > 0 && wi != 0.0) DenseKernels.SubtractScaled(w.Slice(i - len, len), wi, l.AsSpan(rs[i], len));
            }
            for (int i = 0; i < _n; i++) x[_perm[i]] = _failed[i] ? 0.0 : w[i];
        }
        finally
        {
            ArrayPool<double>.Shared.Return(rented);
        }
    }

    /// <summary>Solves K·X = B for several right-hand sides, one after another (each column a span of length Size).</summary>
    public void Solve(double[][] b, double[][] x)
    {
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(x);
        if (b.Length != x.Length) throw new ArgumentException("Different numbers of right-hand sides and solutions.");
        for (int c = 0; c < b.Length; c++) Solve(b[c], x[c]);
    }

    /// <inheritdoc />
    /// <remarks>
    /// With k the elimination position of the failed pivot and K₁₁ the leading block of P·K·Pᵀ eliminated before it
    /// (earlier failed DOFs held at zero), z₁ solves K₁₁·z₁ = −K₁ₖ, which with K₁₁ = L₁₁D₁₁L₁₁ᵀ and the unzeroed row lₖ of L
    /// is L₁₁ᵀ·z₁ = −lₖ: a single back substitution on the leading block. zₖ = 1, all later DOFs 0; then z is divided by
    /// max |zᵢ| so its largest entry is 1 in magnitude (the failed DOF's entry stays positive).
    /// </remarks>
    public double[] MechanismShape(int failureIndex)
    {
        var l = _l ?? throw Disposed();
        if ((uint)failureIndex >= (uint)_failures.Length) throw new ArgumentOutOfRangeException(nameof(failureIndex));
        int k = _failurePosition[failureIndex];
        double[] lk = _failureRows[failureIndex];
        var w = new double[k + 1];
        int fk = k - lk.Length;
        for (int m = 0; m < lk.Length; m++) w[fk + m] = -lk[m];
        w[k] = 1.0;
        for (int i = k - 1; i > 0; i--)
        {
            int len = _rowStart[i + 1] - _rowStart[i];
            double wi = w[i];
            if (len > 0 && wi != 0.0) DenseKernels.SubtractScaled(w.AsSpan(i - len, len), wi, l.AsSpan(_rowStart[i], len));
        }
        double max = 0.0;
        for (int i = 0; i <= k; i++) max = Math.Max(max, Math.Abs(w[i]));
        var z = new double[_n];
        for (int i = 0; i <= k; i++) z[_perm[i]] = _failed[i] && i != k ? 0.0 : w[i] / max;
        return z;
    }

    /// <summary>Gives L's array back to the shared pool when it came from there; later solves throw <see cref="ObjectDisposedException"/>.</summary>
    public void Dispose()
    {
        var l = Interlocked.Exchange(ref _l, null);
        if (l is not null && _pooled) ArrayPool<double>.Shared.Return(l);
    }

    private static ObjectDisposedException Disposed() => new(nameof(EnvelopeFactor), "the factor was disposed (its run ended); factorise again.");
}
