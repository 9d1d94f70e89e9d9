namespace PlaneLateral.Solvers;

/// <summary>The solver used when none is asked for.</summary>
public static class DefaultSolver
{
    /// <summary>Envelope L·D·Lᵀ with reverse Cuthill–McKee ordering (managed; see docs/solver.md).</summary>
    public static ISparseSpdSolver Create() => new EnvelopeCholeskySolver();
}
