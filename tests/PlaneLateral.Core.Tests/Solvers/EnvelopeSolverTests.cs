using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// Accuracy of the envelope L·D·Lᵀ solver against an independent reference: MathNet.Numerics' dense Cholesky
/// (a general-purpose library, not our code). Tolerances: the test matrices have condition numbers below about 10⁴,
/// so a backward-stable Cholesky gives relative forward errors near 10⁴·ε ≈ 10⁻¹²; 1e-9 leaves room for the two
/// different summation orders while still catching any wrong entry of L (which gives errors of order 1).
/// Bounds from Higham, "Accuracy and Stability of Numerical Algorithms" (2nd ed., 2002), ch. 10.
/// </summary>
public class EnvelopeSolverTests
{
    public static TheoryData<int, int> Sizes() => new()
    {
        { 1, 11 }, { 2, 12 }, { 3, 13 }, { 7, 14 }, { 20, 15 }, { 64, 16 }, { 150, 17 }, { 333, 18 }, { 500, 19 },
    };

    private static void AssertMatchesDenseCholesky(SymmetricSparseMatrix a, ISparseSpdSolver solver, int seed, int rhsCount = 3)
    {
        var factor = solver.Factorize(a);
        Assert.Empty(factor.PivotFailures);
        Assert.Equal(a.Size, factor.Size);
        var reference = Dense(a).Cholesky(); // MathNet.Numerics dense Cholesky
        for (int r = 0; r < rhsCount; r++)
        {
            var b = RandomVector(a.Size, seed * 100 + r);
            var x = new double[a.Size];
            factor.Solve(b, x);
            var xRef = reference.Solve(Vector<double>.Build.DenseOfArray(b)).ToArray();
            Assert.True(RelativeDifference(x, xRef) < 1e-9, $"rhs {r}: relative difference {RelativeDifference(x, xRef):E2}");
            double rel = ResidualNorm(a, x, b) / Norm(b);
            Assert.True(rel < 1e-11, $"rhs {r}: relative residual {rel:E2}");
        }
    }

    [Theory]
    [MemberData(nameof(Sizes))]
    public void RandomLaplacianPlusDiagonal_MatchesDenseCholesky_Rcm(int n, int seed) =>
        AssertMatchesDenseCholesky(RandomLaplacianPlusDiagonal(n, seed), new EnvelopeCholeskySolver(), seed);

    [Theory]
    [MemberData(nameof(Sizes))]
    public void RandomLaplacianPlusDiagonal_MatchesDenseCholesky_Natural(int n, int seed) =>
        AssertMatchesDenseCholesky(RandomLaplacianPlusDiagonal(n, seed), new EnvelopeCholeskySolver(EnvelopeOrdering.Natural), seed);

    [Theory]
    [InlineData(1, 1, 1, 21)]
    [InlineData(5, 3, 1, 22)]
    [InlineData(20, 20, 1, 23)]
    [InlineData(7, 6, 5, 24)]
    [InlineData(8, 8, 7, 25)]
    public void ScrambledGridStencil_MatchesDenseCholesky(int nx, int ny, int nz, int seed)
    {
        var a = GridStencil(nx, ny, nz, scrambleSeed: seed, shift: 0.1, weightJitterSeed: seed);
        AssertMatchesDenseCholesky(a, new EnvelopeCholeskySolver(), seed);
        AssertMatchesDenseCholesky(a, new EnvelopeCholeskySolver(EnvelopeOrdering.Natural), seed);
    }

    [Fact]
    public void NaturalAndRcm_GiveTheSameSolution()
    {
        // Common practice: an ordering changes rounding, not the answer.
        var a = GridStencil(15, 12, 1, scrambleSeed: 5, shift: 0.05, weightJitterSeed: 6);
        var b = RandomVector(a.Size, 7);
        var x1 = new double[a.Size];
        var x2 = new double[a.Size];
        new EnvelopeCholeskySolver(EnvelopeOrdering.ReverseCuthillMcKee).Factorize(a).Solve(b, x1);
        new EnvelopeCholeskySolver(EnvelopeOrdering.Natural).Factorize(a).Solve(b, x2);
        Assert.True(RelativeDifference(x1, x2) < 1e-10, $"{RelativeDifference(x1, x2):E2}");
    }

    [Fact]
    public void FactorNonZeros_IsEnvelopePlusDiagonal()
    {
        // George and Liu (1981), ch. 4: the envelope factor stores exactly Env(P·K·Pᵀ) plus the diagonal.
        var a = GridStencil(9, 11, 1, scrambleSeed: 3);
        foreach (var ordering in new[] { EnvelopeOrdering.ReverseCuthillMcKee, EnvelopeOrdering.Natural })
        {
            var f = (EnvelopeFactor)new EnvelopeCholeskySolver(ordering).Factorize(a);
            long env = Orderings.EnvelopeSize(a, f.Permutation);
            Assert.Equal(env + a.Size, f.FactorNonZeros);
            Assert.Equal(env, f.EnvelopeSize);
        }
    }

    [Fact]
    public void SmallerEnvelopeOption_PicksTheSmallerOfRcmAndNatural()
    {
        // Row-by-row numbering of an 8-neighbour grid along its shorter side is close to ideal (rows of width nx), while a
        // scrambled numbering is far worse than RCM; the option must pick natural for the first and RCM for the second.
        var solver = new EnvelopeCholeskySolver(EnvelopeOrdering.SmallerEnvelope);
        foreach (int seed in new[] { -1, 9 })
        {
            var a = QuadCellGrid(12, 40, scrambleSeed: seed);
            long envRcm = Orderings.EnvelopeSize(a, Orderings.ReverseCuthillMcKee(a));
            long envNat = Orderings.EnvelopeSize(a, Orderings.Natural(a.Size));
            var f = (EnvelopeFactor)solver.Factorize(a);
            Assert.Equal(Math.Min(envRcm, envNat), f.EnvelopeSize);
            if (seed < 0) Assert.True(envNat <= envRcm, $"row by row {envNat}, RCM {envRcm}");
            else Assert.True(envRcm < envNat);
            AssertMatchesDenseCholesky(a, solver, 3, rhsCount: 1);
        }
        Assert.Contains("smaller envelope", solver.Description);
    }

    [Fact]
    public void NaturalOrder_UsesTheIdentityPermutation()
    {
        var a = RandomLaplacianPlusDiagonal(40, 3);
        var f = (EnvelopeFactor)new EnvelopeCholeskySolver(EnvelopeOrdering.Natural).Factorize(a);
        Assert.Equal(Orderings.Natural(40), f.Permutation);
    }

    [Fact]
    public void CallerPermutation_GivesTheSameSolution()
    {
        var a = RandomLaplacianPlusDiagonal(120, 8);
        var perm = RandomPermutation(120, 9);
        var f = EnvelopeCholeskySolver.Factorize(a, perm);
        var b = RandomVector(120, 10);
        var x = new double[120];
        f.Solve(b, x);
        var xRef = Dense(a).Cholesky().Solve(Vector<double>.Build.DenseOfArray(b)).ToArray();
        Assert.True(RelativeDifference(x, xRef) < 1e-9);
    }

    [Fact]
    public void SeveralRightHandSides_OnOneFactor_AndTheArrayOverload()
    {
        var a = GridStencil(10, 10, 2, scrambleSeed: 31);
        var f = (EnvelopeFactor)new EnvelopeCholeskySolver().Factorize(a);
        var reference = Dense(a).Cholesky();
        var bs = Enumerable.Range(0, 6).Select(k => RandomVector(a.Size, 40 + k)).ToArray();
        var xs = bs.Select(_ => new double[a.Size]).ToArray();
        f.Solve(bs, xs);
        for (int k = 0; k < bs.Length; k++)
        {
            var xRef = reference.Solve(Vector<double>.Build.DenseOfArray(bs[k])).ToArray();
            Assert.True(RelativeDifference(xs[k], xRef) < 1e-9);
        }
    }

    [Fact]
    public void Solve_AllowsTheSameArrayForBAndX()
    {
        var a = RandomLaplacianPlusDiagonal(50, 4);
        var b = RandomVector(50, 5);
        var expected = new double[50];
        var f = new EnvelopeCholeskySolver().Factorize(a);
        f.Solve(b, expected);
        var inPlace = (double[])b.Clone();
        f.Solve(inPlace, inPlace);
        Assert.Equal(expected, inPlace);
    }

    [Fact]
    public void ConcurrentSolves_OnOneFactor_AgreeBitwiseWithSequentialOnes()
    {
        // The factor is documented as safe for concurrent Solve calls: no shared scratch.
        var a = GridStencil(30, 30, 1, scrambleSeed: 12);
        var f = new EnvelopeCholeskySolver().Factorize(a);
        const int count = 32;
        var bs = Enumerable.Range(0, count).Select(k => RandomVector(a.Size, 500 + k)).ToArray();
        var sequential = bs.Select(b => { var x = new double[a.Size]; f.Solve(b, x); return x; }).ToArray();
        var parallel = new double[count][];
        Parallel.For(0, count, new ParallelOptions { MaxDegreeOfParallelism = 4 }, k =>
        {
            var x = new double[a.Size];
            for (int rep = 0; rep < 5; rep++) f.Solve(bs[k], x);
            parallel[k] = x;
        });
        for (int k = 0; k < count; k++) Assert.Equal(sequential[k], parallel[k]);
    }

    [Fact]
    public void SameInput_SameOutput_Bitwise()
    {
        var a1 = GridStencil(12, 9, 3, scrambleSeed: 77, weightJitterSeed: 78);
        var a2 = GridStencil(12, 9, 3, scrambleSeed: 77, weightJitterSeed: 78);
        var b = RandomVector(a1.Size, 79);
        var x1 = new double[a1.Size];
        var x2 = new double[a1.Size];
        new EnvelopeCholeskySolver().Factorize(a1).Solve(b, x1);
        new EnvelopeCholeskySolver().Factorize(a2).Solve(b, x2);
        Assert.Equal(x1, x2);
    }

    [Fact]
    public void EmptyMatrix_FactorisesAndSolves()
    {
        var a = new SymmetricMatrixBuilder(0).Build();
        var f = new EnvelopeCholeskySolver().Factorize(a);
        Assert.Equal(0, f.Size);
        Assert.Equal(0, f.FactorNonZeros);
        f.Solve(ReadOnlySpan<double>.Empty, Span<double>.Empty);
    }

    [Fact]
    public void WrongVectorLength_Throws()
    {
        var f = new EnvelopeCholeskySolver().Factorize(RandomLaplacianPlusDiagonal(5, 1));
        Assert.Throws<ArgumentException>(() => f.Solve(new double[4], new double[5]));
        Assert.Throws<ArgumentException>(() => f.Solve(new double[5], new double[6]));
    }

    [Fact]
    public void Description_NamesTheOrdering()
    {
        Assert.Contains("reverse Cuthill–McKee", new EnvelopeCholeskySolver().Description);
        Assert.Contains("natural", new EnvelopeCholeskySolver(EnvelopeOrdering.Natural).Description);
        Assert.DoesNotContain('\n', new EnvelopeCholeskySolver().Description);
    }

    [Fact]
    public void VectorDot_AgreesBitwiseWithItsScalarTwin()
    {
        // Common practice: the vector and scalar kernels promise the same summation order, hence identical bits.
        var rng = new Random(2);
        for (int n = 0; n < 70; n++)
        {
            var x = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 2 - 1).ToArray();
            var y = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 2 - 1).ToArray();
            double naive = 0;
            for (int k = 0; k < n; k++) naive += x[k] * y[k];
            double dot = DenseKernels.Dot(x, y);
            if (n >= 8) Assert.Equal(DenseKernels.DotScalar8(x, y), dot);
            Assert.True(Math.Abs(dot - naive) <= 1e-14 * Math.Max(1, n));
        }
    }
}
