namespace PlaneLateral.Solvers;

/// <summary>
/// A direct solver for sparse symmetric positive definite systems K·x = b.
/// Implementations order, factorise once, and solve for any number of right-hand sides.
/// </summary>
public interface ISparseSpdSolver
{
    /// <summary>One-line description, e.g. "envelope Cholesky, reverse Cuthill–McKee order (managed)".</summary>
    string Description { get; }

    /// <summary>What runs on a matrix of order <paramref name="size"/>, in one short line (a solver that picks by size names the one it picks).</summary>
    string DescriptionFor(int size) => Description;

    /// <summary>
    /// Orders and factorises <paramref name="matrix"/>. Never throws for a singular or indefinite matrix:
    /// a pivot that fails is recorded in <see cref="ISparseSpdFactor.PivotFailures"/>, its DOF is held at zero,
    /// and the factorisation goes on, so every failing DOF is found in one pass.
    /// </summary>
    /// <param name="matrix">Symmetric matrix (lower triangle stored).</param>
    /// <param name="relativePivotTolerance">A pivot d_k with d_k ≤ tol·K_kk is a failure (default 1e-10).</param>
    ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10);
}

/// <summary>A factorisation P·K·Pᵀ = L·D·Lᵀ (or L·Lᵀ) ready to solve.</summary>
/// <remarks>Disposable: a factor that holds native memory (a large <see cref="SupernodalFactor"/>) gives it back on
/// <see cref="IDisposable.Dispose"/>, after which it refuses to solve; factors held in ordinary arrays need nothing and
/// by default do nothing. Whoever factorises owns the factor (a <see cref="FactorOnceSolver"/> owns those it keeps).</remarks>
public interface ISparseSpdFactor : IDisposable
{
    /// <summary>Order of the matrix.</summary>
    int Size { get; }

    /// <summary>Number of stored entries of the factor L, diagonal included (its fill).</summary>
    long FactorNonZeros { get; }

    /// <summary>
    /// Pivots that were zero, negative or too small relative to the original diagonal, in elimination order,
    /// each with its DOF in the caller's (original) numbering. Empty for an SPD matrix.
    /// </summary>
    IReadOnlyList<PivotFailure> PivotFailures { get; }

    /// <summary>Solves K·x = b (original numbering); DOFs with a failed pivot come out as zero.</summary>
    void Solve(ReadOnlySpan<double> b, Span<double> x);

    /// <summary>
    /// For the failed pivot <paramref name="failureIndex"/>: the vector z (original numbering) with z at the failed DOF = 1
    /// and K·z ≈ 0 over the DOFs eliminated before it, i.e. the shape of the mechanism that pivot found,
    /// scaled so that its largest absolute entry is 1.
    /// </summary>
    double[] MechanismShape(int failureIndex);

    /// <summary>Nothing to release: the default for factors held in ordinary arrays.</summary>
    void IDisposable.Dispose() { }
}

/// <summary>A pivot that failed during factorisation.</summary>
/// <param name="Dof">DOF in the caller's numbering.</param>
/// <param name="Pivot">The pivot value met.</param>
/// <param name="Diagonal">The original diagonal entry K_dd.</param>
public readonly record struct PivotFailure(int Dof, double Pivot, double Diagonal);
