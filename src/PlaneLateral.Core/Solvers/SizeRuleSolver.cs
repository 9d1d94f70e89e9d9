namespace PlaneLateral.Solvers;

/// <summary>
/// Picks a solver by the order of the matrix: below <see cref="Threshold"/> unknowns the small-system solver, from it on the
/// large-system one. <see cref="DefaultSolver"/> uses it with the envelope solver below and the supernodal one above.
/// </summary>
public sealed class SizeRuleSolver : ISparseSpdSolver
{
    public SizeRuleSolver(ISparseSpdSolver small, ISparseSpdSolver large, int threshold)
    {
        ArgumentNullException.ThrowIfNull(small);
        ArgumentNullException.ThrowIfNull(large);
        ArgumentOutOfRangeException.ThrowIfNegative(threshold);
        Small = small;
        Large = large;
        Threshold = threshold;
    }

    /// <summary>Solver for matrices of fewer than <see cref="Threshold"/> unknowns.</summary>
    public ISparseSpdSolver Small { get; }

    /// <summary>Solver for matrices of <see cref="Threshold"/> unknowns or more.</summary>
    public ISparseSpdSolver Large { get; }

    /// <summary>Order from which <see cref="Large"/> is used.</summary>
    public int Threshold { get; }

    /// <summary>The solver used for a matrix of order <paramref name="size"/>.</summary>
    public ISparseSpdSolver For(int size) => size < Threshold ? Small : Large;

    /// <inheritdoc />
    public string Description => $"below {Threshold} unknowns: {Small.Description}; from {Threshold}: {Large.Description}";

    /// <inheritdoc />
    public string DescriptionFor(int size) => For(size).DescriptionFor(size);

    /// <inheritdoc />
    public ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        return For(matrix.Size).Factorize(matrix, relativePivotTolerance);
    }
}
