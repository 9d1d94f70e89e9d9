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
/// </summary>
public sealed class FactorOnceSolver : ISparseSpdSolver
{
    private readonly List<(SymmetricSparseMatrix Matrix, double Tolerance, ISparseSpdFactor Factor)> _kept = [];
    private readonly Lock _gate = new();

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
            Requests++;
            foreach (var (m, tol, f) in _kept)
                if (tol.Equals(relativePivotTolerance) && Same(m, matrix)) return f;
        }
        var factor = Inner.Factorize(matrix, relativePivotTolerance);
        lock (_gate) _kept.Add((matrix, relativePivotTolerance, factor));
        return factor;
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
