namespace PlaneLateral.Solvers;

/// <summary>
/// The solver of one analysis run: it passes every factorisation to the solver the user chose and keeps each factor, so
/// that a matrix met again in the same run (the same order, pattern, values and pivot tolerance, compared entry by entry)
/// is not factorised a second time. One instance belongs to one run (an analysis run); nothing is shared
/// between runs, so parallel runs never see each other's factors.
/// <para>
/// The factors a run keeps are those an analysis needs anyway (the frame, each panel, K + K_G); they are released with
/// the run. A factor is only ever solved on, never changed, so handing the same one out twice is safe.
/// </para>
/// <para>
/// The run owns the factors it keeps: <see cref="Dispose"/> disposes them (a large supernodal factor gives its native
/// memory back), so whoever made the run disposes it when no stage will solve again; a factor handed out must not be
/// disposed by the stage that asked for it. A run never disposed leaves its factors to their finalizers.
/// </para>
/// </summary>
public sealed class FactorOnceSolver : ISparseSpdSolver, IDisposable
{
    private readonly List<(SymmetricSparseMatrix Matrix, double Tolerance, ISparseSpdFactor Factor)> _kept = [];
    private readonly Lock _gate = new();
    private bool _disposed;

    public FactorOnceSolver(ISparseSpdSolver inner)
    {
        ArgumentNullException.ThrowIfNull(inner);
        Inner = inner is FactorOnceSolver f ? f.Inner : inner;
    }

    /// <summary>The solver the user chose (never another <see cref="FactorOnceSolver"/>).</summary>
    public ISparseSpdSolver Inner { get; }

    /// <summary>Factorisations actually made by <see cref="Inner"/> in this run.</summary>
    public int Factorizations { get { lock (_gate) return _kept.Count; } }

    /// <summary>Factorisations asked for, kept factors handed out again included.</summary>
    public int Requests { get; private set; }

    /// <inheritdoc />
    public string Description => Inner.Description;

    /// <inheritdoc />
    public string DescriptionFor(int size) => Inner.DescriptionFor(size);

    /// <inheritdoc />
    public ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_disposed, this);
            Requests++;
            foreach (var (m, tol, f) in _kept)
                if (tol.Equals(relativePivotTolerance) && Same(m, matrix)) return f;
        }
        var factor = Inner.Factorize(matrix, relativePivotTolerance);
        lock (_gate)
        {
            if (_disposed)
            {
                factor.Dispose();
                throw new ObjectDisposedException(nameof(FactorOnceSolver));
            }
            _kept.Add((matrix, relativePivotTolerance, factor));
        }
        return factor;
    }

    /// <summary>Disposes every factor the run kept; later factorisations throw <see cref="ObjectDisposedException"/>.</summary>
    public void Dispose()
    {
        lock (_gate)
        {
            if (_disposed) return;
            _disposed = true;
            foreach (var (_, _, f) in _kept) f.Dispose();
        }
    }

    private static bool Same(SymmetricSparseMatrix a, SymmetricSparseMatrix b) =>
        ReferenceEquals(a, b) ||
        (a.Size == b.Size && a.NonZerosLower == b.NonZerosLower &&
         a.ColumnPointers.AsSpan().SequenceEqual(b.ColumnPointers) &&
         a.RowIndices.AsSpan(0, a.NonZerosLower).SequenceEqual(b.RowIndices.AsSpan(0, b.NonZerosLower)) &&
         BitEqual(a.Values.AsSpan(0, a.NonZerosLower), b.Values.AsSpan(0, b.NonZerosLower)));

    private static bool BitEqual(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        for (int i = 0; i < a.Length; i++)
            if (BitConverter.DoubleToInt64Bits(a[i]) != BitConverter.DoubleToInt64Bits(b[i])) return false;
        return true;
    }
}
