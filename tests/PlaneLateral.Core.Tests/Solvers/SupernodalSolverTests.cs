using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.MoreTestMatrices;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// The supernodal multifrontal Cholesky solver against independent references: MathNet.Numerics' dense Cholesky (a
/// general-purpose library, not our code) and the project's dense L·D·Lᵀ (<see cref="DenseLdlSolver"/>). Tolerances as in
/// <see cref="EnvelopeSolverTests"/>: condition numbers below about 10⁴, so relative forward errors near 10⁻¹² for a
/// backward-stable Cholesky (Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed., 2002, ch. 10); 1e-9 still
/// catches any wrong entry of L.
/// </summary>
public class SupernodalSolverTests
{
    public static TheoryData<int, int> Sizes() => new()
    {
        { 1, 11 }, { 2, 12 }, { 3, 13 }, { 7, 14 }, { 20, 15 }, { 64, 16 }, { 150, 17 }, { 333, 18 }, { 700, 19 },
    };

    public static TheoryData<SupernodalOrdering> AllOrderings() => new()
    {
        SupernodalOrdering.ApproximateMinimumDegree, SupernodalOrdering.Natural, SupernodalOrdering.ReverseCuthillMcKee,
    };

    private static void AssertMatchesDenseCholesky(SymmetricSparseMatrix a, ISparseSpdSolver solver, int seed, int rhsCount = 3)
    {
        var factor = solver.Factorize(a);
        Assert.Empty(factor.PivotFailures);
        Assert.Equal(a.Size, factor.Size);
        var reference = Dense(a).Cholesky(); // MathNet.Numerics dense Cholesky
        var bs = Enumerable.Range(0, rhsCount).Select(r => RandomVector(a.Size, seed * 100 + r)).ToArray();
        var xs = bs.Select(_ => new double[a.Size]).ToArray();
        ((SupernodalFactor)factor).Solve(bs, xs); // several right-hand sides
        for (int r = 0; r < rhsCount; r++)
        {
            var xRef = reference.Solve(Vector<double>.Build.DenseOfArray(bs[r])).ToArray();
            Assert.True(RelativeDifference(xs[r], xRef) < 1e-9, $"rhs {r}: relative difference {RelativeDifference(xs[r], xRef):E2}");
            double rel = ResidualNorm(a, xs[r], bs[r]) / Norm(bs[r]);
            Assert.True(rel < 1e-11, $"rhs {r}: relative residual {rel:E2}");
            var single = new double[a.Size];
            factor.Solve(bs[r], single);
            Assert.Equal(xs[r], single); // one vector at a time gives the same bits
        }
    }

    [Theory]
    [MemberData(nameof(Sizes))]
    public void RandomLaplacianPlusDiagonal_MatchesDenseCholesky(int n, int seed)
    {
        var a = RandomLaplacianPlusDiagonal(n, seed);
        foreach (var o in new[] { SupernodalOrdering.ApproximateMinimumDegree, SupernodalOrdering.Natural, SupernodalOrdering.ReverseCuthillMcKee })
            AssertMatchesDenseCholesky(a, new SupernodalCholeskySolver(o), seed);
    }

    [Theory]
    [InlineData(0.3, 41)]
    [InlineData(1.0, 42)]
    [InlineData(4.0, 43)]
    [InlineData(12.0, 44)]
    public void RandomLaplacian_SparseToNearlyDense_MatchesDenseCholesky(double edgesPerNode, int seed) =>
        AssertMatchesDenseCholesky(RandomLaplacianPlusDiagonal(240, seed, edgesPerNode), new SupernodalCholeskySolver(), seed);

    [Theory]
    [InlineData(1, 1, 1, 21)]
    [InlineData(5, 3, 1, 22)]
    [InlineData(20, 20, 1, 23)]
    [InlineData(7, 6, 5, 24)]
    [InlineData(8, 8, 7, 25)]
    public void ScrambledGridStencil_MatchesDenseCholesky(int nx, int ny, int nz, int seed)
    {
        var a = GridStencil(nx, ny, nz, scrambleSeed: seed, shift: 0.1, weightJitterSeed: seed);
        AssertMatchesDenseCholesky(a, new SupernodalCholeskySolver(), seed);
        AssertMatchesDenseCholesky(a, new SupernodalCholeskySolver(SupernodalOrdering.Natural), seed);
    }

    [Theory]
    [InlineData(6, 5, 31)]
    [InlineData(17, 13, 32)]
    [InlineData(25, 25, -1)]
    public void TwoDofQuadGrid_MatchesDenseCholesky(int nx, int ny, int seed) =>
        AssertMatchesDenseCholesky(TwoDofQuadGrid(nx, ny, seed), new SupernodalCholeskySolver(), 7);

    [Fact]
    public void DenseMatrix_OneLargeFront_VectorAndParallelKernels_MatchDenseCholesky()
    {
        // n = 600 is one supernode whose trailing updates exceed the parallel threshold (384): this exercises the packed
        // 8×4 vector kernel, the diagonal tiles and the threaded split.
        var a = DenseSpd(600, 5);
        AssertMatchesDenseCholesky(a, new SupernodalCholeskySolver(SupernodalOrdering.Natural, maxThreads: 2), 5);
        AssertMatchesDenseCholesky(a, new SupernodalCholeskySolver(SupernodalOrdering.Natural, maxThreads: 1), 5);
    }

    [Theory]
    [InlineData("dense")]
    [InlineData("grid")]
    public void OneAndTwoThreads_GiveBitwiseEqualSolutions(string kind)
    {
        // "dense": one front, threaded rank updates; "grid": a 51,200-unknown 2-DOF grid, whose tree is large enough
        // (work above the parallel threshold) for the subtrees to be factorised in parallel as well.
        var a = kind == "dense" ? DenseSpd(520, 8) : TwoDofQuadGrid(160, 160, -1);
        var b = RandomVector(a.Size, 9);
        var x1 = new double[a.Size];
        var x2 = new double[a.Size];
        new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree, 1).Factorize(a).Solve(b, x1);
        var f2 = (SupernodalFactor)new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree, 2).Factorize(a);
        Assert.Equal(kind == "grid", f2.SubtreesInParallel);
        f2.Solve(b, x2);
        Assert.Equal(x1, x2);
    }

    [Theory]
    [InlineData(30, 51)]
    [InlineData(90, 52)]
    public void MatchesDenseLdlSolver(int n, int seed)
    {
        var a = RandomLaplacianPlusDiagonal(n, seed, edgesPerNode: 3.0);
        var b = RandomVector(n, seed);
        var x1 = new double[n];
        var x2 = new double[n];
        new SupernodalCholeskySolver().Factorize(a).Solve(b, x1);
        new DenseLdlSolver().Factorize(a).Solve(b, x2);
        Assert.True(RelativeDifference(x1, x2) < 1e-10, $"{RelativeDifference(x1, x2):E2}");
    }

    [Fact]
    public void NaturalAndMinimumDegree_SameSolution_FarLessFillOnA2DGrid()
    {
        // A 60×60-node, 2-DOF grid numbered node by node, row by row (half-bandwidth ≈ 2·61): the natural order's factor
        // fills its band; minimum degree's is much smaller. The ratio grows with the grid (n^1.5 against n log n).
        // Measured: natural 874,560, AMD 356,804 (ratio 2.45); the assertion asks for 2.0.
        var a = TwoDofQuadGrid(60, 60, -1);
        var b = RandomVector(a.Size, 3);
        var fn = (SupernodalFactor)new SupernodalCholeskySolver(SupernodalOrdering.Natural).Factorize(a);
        var fa = (SupernodalFactor)new SupernodalCholeskySolver().Factorize(a);
        var xn = new double[a.Size];
        var xa = new double[a.Size];
        fn.Solve(b, xn);
        fa.Solve(b, xa);
        Assert.True(RelativeDifference(xa, xn) < 1e-10, $"{RelativeDifference(xa, xn):E2}");
        double ratio = (double)fn.ExactNonZeros / fa.ExactNonZeros;
        Assert.True(ratio > 2.0, $"natural {fn.ExactNonZeros}, AMD {fa.ExactNonZeros}, ratio {ratio:F2}");
    }

    [Theory]
    [MemberData(nameof(AllOrderings))]
    public void ExactNonZeros_EqualsFillOfABooleanElimination(SupernodalOrdering ordering)
    {
        // Independent count: eliminate on a dense boolean matrix under the factor's own permutation.
        foreach (var a in new[] { RandomLaplacianPlusDiagonal(90, 61, 1.5), GridStencil(9, 8, 1, scrambleSeed: 62), TwoDofQuadGrid(6, 7, 63) })
        {
            var f = (SupernodalFactor)new SupernodalCholeskySolver(ordering).Factorize(a);
            Assert.Equal(SymbolicFillByElimination(a, f.Permutation), f.ExactNonZeros);
            Assert.True(f.FactorNonZeros >= f.ExactNonZeros);
            // Amalgamation adds explicit zeros but only a bounded share of them on these matrices.
            Assert.True(f.FactorNonZeros <= 2 * f.ExactNonZeros, $"{f.FactorNonZeros} vs {f.ExactNonZeros}");
        }
    }

    [Theory]
    [MemberData(nameof(AllOrderings))]
    public void ColumnCounts_EqualThoseOfABooleanElimination(SupernodalOrdering ordering)
    {
        // Each column's count from the row-subtree leaves and least common ancestors (Gilbert, Ng and Peyton 1994)
        // against elimination on a dense boolean matrix in the same (postordered) numbering (derived). The matrices
        // include a forest (a block-diagonal Laplacian with several components) and a path, whose trees are chains.
        var forest = RandomLaplacianPlusDiagonal(70, 64, 0.6);
        foreach (var a in new[] { RandomLaplacianPlusDiagonal(90, 61, 1.5), GridStencil(9, 8, 1, scrambleSeed: 62), TwoDofQuadGrid(6, 7, 63), forest, GridStencil(40, 1, 1, scrambleSeed: 65) })
        {
            var solver = new SupernodalCholeskySolver(ordering);
            var s = SupernodalSymbolic.Analyse(a, solver.ComputeOrdering(a));
            Assert.Equal(ColumnCountsByElimination(a, s.Perm), s.ColumnCount);
        }
    }

    [Fact]
    public void SeveralRightHandSides_WithFailedPivots_BitwiseTheSingleSolves()
    {
        // 11 right-hand sides on a singular matrix (ungrounded Laplacian: failures held at zero).
        var a = RandomLaplacianPlusDiagonal(300, 81, edgesPerNode: 0.9, shift: false);
        var f = (SupernodalFactor)new SupernodalCholeskySolver().Factorize(a);
        Assert.NotEmpty(f.PivotFailures);
        var bs = Enumerable.Range(0, 11).Select(i => RandomVector(a.Size, 200 + i)).ToArray();
        var xs = bs.Select(_ => new double[a.Size]).ToArray();
        f.Solve(bs, xs);
        for (int i = 0; i < bs.Length; i++)
        {
            var x = new double[a.Size];
            f.Solve(bs[i], x);
            Assert.Equal(x, xs[i]);
            foreach (var p in f.PivotFailures) Assert.Equal(0.0, xs[i][p.Dof]);
        }
    }

    [Fact]
    public void EmptyMatrix_Works()
    {
        var f = new SupernodalCholeskySolver().Factorize(new SymmetricMatrixBuilder(0).Build());
        Assert.Equal(0, f.Size);
        Assert.Empty(f.PivotFailures);
        f.Solve(Array.Empty<double>(), Array.Empty<double>());
    }

    [Fact]
    public void Solve_IsThreadSafe()
    {
        var a = TwoDofQuadGrid(20, 15, 71);
        var f = new SupernodalCholeskySolver().Factorize(a);
        var bs = Enumerable.Range(0, 16).Select(i => RandomVector(a.Size, 100 + i)).ToArray();
        var serial = bs.Select(b => { var x = new double[a.Size]; f.Solve(b, x); return x; }).ToArray();
        var parallel = new double[16][];
        Parallel.For(0, 16, i => { var x = new double[a.Size]; f.Solve(bs[i], x); parallel[i] = x; });
        for (int i = 0; i < 16; i++) Assert.Equal(serial[i], parallel[i]);
    }
}

/// <summary>The default solver's size rule.</summary>
public class DefaultSolverRuleTests
{
    [Fact]
    public void SmallSystems_Envelope_LargeSystems_Supernodal()
    {
        var rule = Assert.IsType<SizeRuleSolver>(DefaultSolver.Create());
        Assert.IsType<EnvelopeCholeskySolver>(rule.For(DefaultSolver.SupernodalThreshold - 1));
        Assert.IsType<SupernodalCholeskySolver>(rule.For(DefaultSolver.SupernodalThreshold));
        Assert.IsType<EnvelopeFactor>(rule.Factorize(TestMatrices.GridStencil(10, 10, 1, scrambleSeed: 1)));
        var big = MoreTestMatrices.TwoDofQuadGrid(51, 50, 2); // 5,100 unknowns
        var f = Assert.IsType<SupernodalFactor>(rule.Factorize(big));
        var b = TestMatrices.RandomVector(big.Size, 3);
        var x = new double[big.Size];
        f.Solve(b, x);
        Assert.True(TestMatrices.ResidualNorm(big, x, b) < 1e-10 * TestMatrices.Norm(b));
        Assert.Contains("supernodal", rule.Description);
        Assert.Contains("envelope", rule.Description);
    }
}
