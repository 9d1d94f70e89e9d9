namespace PlaneLateral.Solvers;

/// <summary>The solver used when none is asked for.</summary>
public static class DefaultSolver
{
    /// <summary>
    /// Order from which the supernodal solver is used. Below it the envelope solver is as fast or faster on the models
    /// measured (frames are banded; small walls have little fill either way), and results of existing small models stay
    /// bit for bit what they were; above it the supernodal solver's far smaller fill wins (docs/solver.md, "Default solver").
    /// </summary>
    public const int SupernodalThreshold = 5000;

    /// <summary>
    /// Envelope L·D·Lᵀ with reverse Cuthill–McKee ordering below <see cref="SupernodalThreshold"/> unknowns, supernodal
    /// multifrontal Cholesky with approximate minimum degree ordering from it on (see docs/solver.md). Its dense kernels are
    /// the managed ones unless the environment variable <see cref="NativeBlas.EnvironmentVariable"/> asks for OpenBLAS and
    /// the library loads; the solver's description says which ran.
    /// </summary>
    public static ISparseSpdSolver Create() =>
        new SizeRuleSolver(new EnvelopeCholeskySolver(), new SupernodalCholeskySolver(kernels: NativeBlas.Requested()), SupernodalThreshold);
}
