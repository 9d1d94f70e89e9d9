using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// The envelope factor's L held in memory rented from the shared pool and given back on Dispose: a factor made in memory
/// another factor left behind is still exact, and a disposed factor refuses to solve instead of reading memory that may
/// belong to someone else by then. Reference: MathNet.Numerics' dense Cholesky (a general-purpose library, not our code);
/// tolerance as in <see cref="EnvelopeSolverTests"/> (condition numbers below about 10⁴, Higham 2002, ch. 10).
/// </summary>
public class EnvelopePoolTests
{
    [Fact]
    public void A_factor_made_in_memory_a_disposed_factor_gave_back_matches_dense_Cholesky()
    {
        var solver = new EnvelopeCholeskySolver();
        // The same pattern (same seed), other values: the same envelope, so the second factor rents the very array the
        // first gave back, full of the first factor's entries. A stale entry left in it would make an error of order 1.
        var first = RandomLaplacianPlusDiagonal(400, seed: 7, shiftMin: 0.05);
        var second = RandomLaplacianPlusDiagonal(400, seed: 7, shiftMin: 2.0);
        var f1 = solver.Factorize(first);
        f1.Dispose();
        using var f2 = solver.Factorize(second);
        var b = RandomVector(second.Size, 11);
        var x = new double[second.Size];
        f2.Solve(b, x);
        var xRef = Dense(second).Cholesky().Solve(Vector<double>.Build.DenseOfArray(b)).ToArray();
        Assert.True(RelativeDifference(x, xRef) < 1e-9, $"relative difference {RelativeDifference(x, xRef):E2}");
    }

    [Fact]
    public void A_disposed_factor_refuses_to_solve()
    {
        var a = RandomLaplacianPlusDiagonal(50, seed: 5);
        var f = new EnvelopeCholeskySolver().Factorize(a);
        f.Dispose();
        f.Dispose();   // a second Dispose does nothing
        Assert.Throws<ObjectDisposedException>(() => f.Solve(new double[a.Size], new double[a.Size]));
    }
}
