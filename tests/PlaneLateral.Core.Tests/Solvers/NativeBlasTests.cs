using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Solvers;
using Xunit;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// The optional OpenBLAS dense kernels of the supernodal solver. The reference is MathNet.Numerics' dense Cholesky and the
/// project's managed kernels on the same matrices. Where no OpenBLAS library is installed, the tests check instead that
/// asking for it falls back to the managed kernels and says why (CI installs Debian's libopenblas0, so both paths are
/// exercised somewhere).
/// </summary>
public class NativeBlasTests
{
    private static SupernodalCholeskySolver Native(int threads = 0) => new(SupernodalOrdering.ApproximateMinimumDegree, threads, DenseKernelBackend.OpenBlas);

    [Fact]
    public void AskingForOpenBlas_UsesItWhenItLoads_ElseSaysWhyAndStaysManaged()
    {
        var s = Native();
        Assert.Equal(DenseKernelBackend.OpenBlas, s.RequestedKernels);
        if (NativeBlas.IsAvailable)
        {
            Assert.Equal(DenseKernelBackend.OpenBlas, s.Kernels);
            Assert.Contains("native dense kernels", s.Description);
            Assert.Contains("OpenBLAS", s.Description);
        }
        else
        {
            Assert.Equal(DenseKernelBackend.Managed, s.Kernels);
            Assert.Contains("OpenBLAS asked for but not used", s.Description);
            Assert.Contains("no OpenBLAS library found", NativeBlas.Status);
        }
        Assert.Equal(DenseKernelBackend.Managed, new SupernodalCholeskySolver().Kernels); // never by default
        Assert.DoesNotContain("OpenBLAS", new SupernodalCholeskySolver().Description);
    }

    [Theory]
    [InlineData(40, 40, 1)]  // 3,200 unknowns: largest fronts ≈ 160 rows, so both kernels are used
    [InlineData(70, 70, 2)]  // 9,800 unknowns
    public void TwoDofGrid_NativeEqualsManagedAndDenseCholesky(int nx, int ny, int seed)
    {
        var a = MoreTestMatrices.TwoDofQuadGrid(nx, ny, seed);
        var b = RandomVector(a.Size, seed);
        var managed = new SupernodalCholeskySolver().Factorize(a);
        var xm = new double[a.Size];
        managed.Solve(b, xm);
        var native = (SupernodalFactor)Native().Factorize(a);
        var xn = new double[a.Size];
        native.Solve(b, xn);
        Assert.Empty(native.PivotFailures);
        if (NativeBlas.IsAvailable) Assert.True(native.NativeFronts > 0, "no front went to OpenBLAS");
        Assert.True(RelativeDifference(xn, xm) < 1e-11, $"native vs managed: {RelativeDifference(xn, xm):E2}");
        Assert.True(ResidualNorm(a, xn, b) / Norm(b) < 1e-11);
        if (a.Size <= 3200)
        {
            var xRef = Dense(a).Cholesky().Solve(Vector<double>.Build.DenseOfArray(b)).ToArray(); // MathNet.Numerics
            Assert.True(RelativeDifference(xn, xRef) < 1e-9);
        }
    }

    [Fact]
    public void DenseFront_LargeEnoughForNative_MatchesDenseCholesky()
    {
        // One 400×400 dense SPD matrix is one front: the whole factorisation is dpotrf.
        var a = MoreTestMatrices.DenseSpd(400, 5);
        var b = RandomVector(a.Size, 6);
        var f = (SupernodalFactor)Native().Factorize(a);
        var x = new double[a.Size];
        f.Solve(b, x);
        if (NativeBlas.IsAvailable) Assert.Equal(1, f.NativeFronts);
        var xRef = Dense(a).Cholesky().Solve(Vector<double>.Build.DenseOfArray(b)).ToArray();
        Assert.True(RelativeDifference(x, xRef) < 1e-10);
    }

    [Fact]
    public void SingularGrid_SameFailuresAsManaged_NativeHandsTheFrontBack()
    {
        // A 2-DOF grid with every diagonal shift removed: a free body, singular with its two rigid translations. dpotrf cannot handle the failing pivots by the project's rule, so those fronts are redone by the
        // managed kernel; the failures (DOFs and count) must be exactly the managed ones.
        var a = MoreTestMatrices.TwoDofQuadGrid(30, 30, 7, shift: 0.0);
        var managed = new SupernodalCholeskySolver().Factorize(a);
        var native = Native().Factorize(a);
        Assert.NotEmpty(managed.PivotFailures);
        Assert.Equal(managed.PivotFailures.Select(p => p.Dof), native.PivotFailures.Select(p => p.Dof));
    }
}
