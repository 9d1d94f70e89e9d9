namespace PlaneLateral.Solvers;

/// <summary>The solver used when none is asked for.</summary>
public static class DefaultSolver
{
    public static ISparseSpdSolver Create() => new DenseLdlSolver();
}
