using PlaneLateral.Solvers;
using Xunit;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// The supernodal factor in native memory (<see cref="FactorBuffer"/>, used for large factorisations) against the same
/// factor in ordinary arrays: the same bits, and a disposed factor refuses to solve with a clear exception. The storage
/// is forced per solver, so these run on small matrices.
/// </summary>
public class FactorStorageTests
{
    private static SupernodalCholeskySolver Solver(FactorStorage storage, int threads = 2,
        DenseKernelBackend kernels = DenseKernelBackend.Managed) =>
        new(SupernodalOrdering.ApproximateMinimumDegree, threads, kernels) { Storage = storage };

    /// <summary>
    /// The model Poisson problem −Δu = f on an nx×ny grid of interior nodes, spacing h = 1, with the 5-point stencil
    /// (4 on the diagonal, −1 to each interior neighbour) and Dirichlet values on the boundary moved to the right-hand
    /// side. With u(x, y) = x² + xy − 2y² + 3, f = −(2 − 4) = 2 and the stencil is exact on quadratics (its truncation error
    /// is (h²/12)(u_xxxx + u_yyyy) + O(h⁴): LeVeque, "Finite Difference Methods for Ordinary and Partial Differential
    /// Equations", SIAM 2007, ch. 3, the 5-point Laplacian; from memory), so the discrete solution is u at the nodes.
    /// </summary>
    private static (SymmetricSparseMatrix K, double[] B, double[] Exact) Poisson(int nx, int ny)
    {
        static double U(int x, int y) => (double)x * x + (double)x * y - 2.0 * y * y + 3.0;
        int Index(int x, int y) => (x - 1) + nx * (y - 1);
        var builder = new SymmetricMatrixBuilder(nx * ny);
        var b = new double[nx * ny];
        var exact = new double[nx * ny];
        for (int y = 1; y <= ny; y++)
            for (int x = 1; x <= nx; x++)
            {
                // The stencil as unit springs to the interior neighbours (1 on both diagonals, −1 between) plus 1 on the
                // diagonal per boundary neighbour, whose value goes to the right-hand side: 4 on every diagonal.
                int i = Index(x, y);
                b[i] = 2.0; // h²·f
                exact[i] = U(x, y);
                foreach (var (qx, qy) in new[] { (x - 1, y), (x + 1, y), (x, y - 1), (x, y + 1) })
                {
                    if (qx < 1 || qx > nx || qy < 1 || qy > ny)
                    {
                        builder.AddDiagonal(i, 1.0);
                        b[i] += U(qx, qy);
                    }
                    else if (Index(qx, qy) < i) AddSpring(builder, i, Index(qx, qy), 1.0);
                }
            }
        return (builder.Build(), b, exact);
    }

    [Fact]
    public void NativeAndManagedStorage_SameBits_OnThePoissonModelProblem()
    {
        var (k, b, exact) = Poisson(90, 70); // 6,300 unknowns: subtrees handed over, fronts of some hundred rows
        using var managed = (SupernodalFactor)Solver(FactorStorage.Managed).Factorize(k);
        using var native = (SupernodalFactor)Solver(FactorStorage.Native).Factorize(k);
        Assert.False(managed.ValuesNative);
        Assert.True(native.ValuesNative);
        Assert.True(managed.Values.SequenceEqual(native.Values), "the factors' values differ");
        var xm = new double[k.Size];
        var xn = new double[k.Size];
        managed.Solve(b, xm);
        native.Solve(b, xn);
        Assert.Equal(xm, xn); // bit for bit
        Assert.Empty(native.PivotFailures);
        // The discrete solution is the quadratic at the nodes (see Poisson): the solve's forward error, condition ≈ 10³.
        for (int i = 0; i < xn.Length; i++)
            Assert.True(Math.Abs(xn[i] - exact[i]) <= 1e-9 * Math.Max(1.0, Math.Abs(exact[i])), $"node {i}: {xn[i]} vs {exact[i]}");
    }

    [Fact]
    public void NativeAndManagedStorage_SameBits_WithOpenBlasKernels()
    {
        // The optional OpenBLAS path (managed kernels when it does not load: then the storages are compared on those).
        var (k, b, _) = Poisson(120, 100);
        using var managed = (SupernodalFactor)Solver(FactorStorage.Managed, kernels: DenseKernelBackend.OpenBlas).Factorize(k);
        using var native = (SupernodalFactor)Solver(FactorStorage.Native, kernels: DenseKernelBackend.OpenBlas).Factorize(k);
        if (NativeBlas.IsAvailable) Assert.True(native.NativeFronts > 0, "no front went to OpenBLAS");
        Assert.Equal(managed.NativeFronts, native.NativeFronts);
        Assert.True(managed.Values.SequenceEqual(native.Values), "the factors' values differ");
        var xm = new double[k.Size];
        var xn = new double[k.Size];
        managed.Solve(b, xm);
        native.Solve(b, xn);
        Assert.Equal(xm, xn);
    }

    [Fact]
    public void NativeStorage_FailedPivot_SameFailureAndMechanismShape()
    {
        // The Poisson matrix without its boundary (Neumann): a connected graph Laplacian, singular with the constants as
        // its null space (derived: each row sums to zero), so exactly one pivot fails and its mechanism is a rigid shift.
        int nx = 40, ny = 30;
        var builder = new SymmetricMatrixBuilder(nx * ny);
        for (int y = 0; y < ny; y++)
            for (int x = 0; x < nx; x++)
            {
                int i = x + nx * y;
                if (x + 1 < nx) AddSpring(builder, i, i + 1, 1.0);
                if (y + 1 < ny) AddSpring(builder, i, i + nx, 1.0);
            }
        var k = builder.Build();
        using var managed = (SupernodalFactor)Solver(FactorStorage.Managed).Factorize(k);
        using var native = (SupernodalFactor)Solver(FactorStorage.Native).Factorize(k);
        Assert.Single(native.PivotFailures);
        Assert.Equal(managed.PivotFailures, native.PivotFailures);
        var shape = native.MechanismShape(0);
        Assert.Equal(managed.MechanismShape(0), shape);
        Assert.All(shape, z => Assert.True(Math.Abs(z - 1.0) < 1e-9, $"not a rigid shift: {z}"));
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void DisposedFactor_RefusesToSolve_WithObjectDisposedException(bool native)
    {
        var (k, b, exact) = Poisson(30, 20);
        var f = (SupernodalFactor)Solver(native ? FactorStorage.Native : FactorStorage.Managed).Factorize(k);
        Assert.Equal(native, f.ValuesNative);
        var x = new double[k.Size];
        f.Solve(b, x);
        Assert.True(Math.Abs(x[0] - exact[0]) < 1e-9 * Math.Abs(exact[0])); // it solved before (see Poisson)
        f.Dispose();
        var e = Assert.Throws<ObjectDisposedException>(() => f.Solve(b, x));
        Assert.Contains("disposed", e.Message);
        Assert.Contains("factorise the matrix again", e.Message);
        Assert.Throws<ObjectDisposedException>(() => f.Solve(new[] { b }, new[] { x }));
        f.Dispose(); // a second time does nothing
        Assert.Equal(k.Size, f.Size); // sizes and failures stay readable
        Assert.Empty(f.PivotFailures);
    }

    [Fact]
    public void DisposedFactor_RefusesMechanismShape()
    {
        var builder = new SymmetricMatrixBuilder(3);
        AddSpring(builder, 0, 1, 1.0);
        AddSpring(builder, 1, 2, 1.0); // a free chain of springs: one rigid shift (derived)
        var f = Solver(FactorStorage.Native).Factorize(builder.Build());
        Assert.Single(f.PivotFailures);
        f.Dispose();
        Assert.Throws<ObjectDisposedException>(() => f.MechanismShape(0));
    }

    [Fact]
    public void DisposedRun_DisposesItsFactors_AndRefusesNewOnes()
    {
        var (k, b, _) = Poisson(20, 20);
        var run = new FactorOnceSolver(Solver(FactorStorage.Native));
        var f = run.Factorize(k);
        Assert.Same(f, run.Factorize(k)); // kept: the same factor handed out again
        run.Dispose();
        Assert.Throws<ObjectDisposedException>(() => f.Solve(b, new double[k.Size]));
        Assert.Throws<ObjectDisposedException>(() => run.Factorize(k));
        run.Dispose();
    }

    [Fact]
    public void BySize_SmallFactorStaysInOrdinaryArrays()
    {
        var (k, _, _) = Poisson(30, 30); // a factor of well under FactorBuffer.NativeMinBytes (64 MiB)
        using var f = (SupernodalFactor)new SupernodalCholeskySolver().Factorize(k);
        Assert.True(f.FactorBytes < FactorBuffer.NativeMinBytes);
        Assert.False(f.ValuesNative);
    }
}
