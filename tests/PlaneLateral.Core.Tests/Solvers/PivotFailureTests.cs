using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// Singular and indefinite matrices: failed pivots, mechanism shapes, and the restrained solve.
/// Facts used (from memory, standard linear algebra): the Laplacian of a graph with c connected components has a null space
/// of dimension c spanned by the components' indicator vectors; in an L·D·Lᵀ elimination of a positive semidefinite matrix
/// a zero pivot appears exactly when the leading block gains a null vector, so such a Laplacian gives exactly c zero pivots,
/// one at the last-eliminated DOF of each component (Golub and Van Loan, "Matrix Computations", 2013, §4.2).
/// </summary>
public class PivotFailureTests
{
    /// <summary>Every sparse solver and ordering goes through the same contract.</summary>
    public static TheoryData<string> BothOrderings() => new() { "envelope-rcm", "envelope-natural", "supernodal-amd", "supernodal-natural", "supernodal-rcm" };

    private static ISparseSpdSolver Solver(string name) => name switch
    {
        "envelope-rcm" => new EnvelopeCholeskySolver(EnvelopeOrdering.ReverseCuthillMcKee),
        "envelope-natural" => new EnvelopeCholeskySolver(EnvelopeOrdering.Natural),
        "supernodal-amd" => new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree),
        "supernodal-natural" => new SupernodalCholeskySolver(SupernodalOrdering.Natural),
        "supernodal-rcm" => new SupernodalCholeskySolver(SupernodalOrdering.ReverseCuthillMcKee),
        _ => throw new ArgumentException(name),
    };

    private static int[] PermutationOf(ISparseSpdFactor f) => f switch
    {
        EnvelopeFactor e => e.Permutation,
        SupernodalFactor s => s.Permutation,
        _ => throw new ArgumentException("unknown factor"),
    };

    private static double KzRelative(SymmetricSparseMatrix a, double[] z)
    {
        var kz = new double[a.Size];
        a.Multiply(z, kz);
        return Norm(kz) / (FrobeniusNorm(a) * Norm(z));
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void FreeFloatingSpringChain_OneFailure_RigidTranslationMechanism(string ordering)
    {
        int n = 12;
        var label = RandomPermutation(n, 3);
        var b = new SymmetricMatrixBuilder(n);
        for (int k = 1; k < n; k++) AddSpring(b, label[k - 1], label[k], 1.0 + k);
        var a = b.Build();

        var f = Solver(ordering).Factorize(a);
        var failure = Assert.Single(f.PivotFailures);
        Assert.True(Math.Abs(failure.Pivot) < 1e-10 * failure.Diagonal);
        Assert.Equal(a.Diagonal(failure.Dof), failure.Diagonal);

        var z = f.MechanismShape(0);
        Assert.True(KzRelative(a, z) < 1e-12);
        Assert.Equal(1.0, z.Max(Math.Abs), 12);
        foreach (double v in z) Assert.Equal(1.0, v, 10); // a rigid translation: every DOF moves the same

        // The nonsingular part: the failed DOF held at zero acts as a support; the rest of the equations are met.
        var load = RandomVector(n, 4);
        var x = new double[n];
        f.Solve(load, x);
        Assert.Equal(0.0, x[failure.Dof]);
        var kx = new double[n];
        a.Multiply(x, kx);
        for (int i = 0; i < n; i++)
            if (i != failure.Dof) Assert.True(Math.Abs(kx[i] - load[i]) < 1e-11, $"row {i}");
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void LaplacianWithThreeFloatingComponentsAndOneGroundedOne_ThreeFailures(string ordering)
    {
        // Four random connected graphs (a spanning path plus random chords) on disjoint DOF sets, numbers interleaved.
        // Only the fourth is grounded (a spring to ground at one node). Expect exactly three failures, one per floating
        // component, with each mechanism the indicator of its component.
        int[] sizes = { 30, 45, 8, 60 };
        int n = sizes.Sum();
        var label = RandomPermutation(n, 17);
        var comp = new int[n];
        var rng = new Random(18);
        var b = new SymmetricMatrixBuilder(n);
        int offset = 0;
        for (int c = 0; c < sizes.Length; c++)
        {
            int m = sizes[c];
            int G(int k) => label[offset + k];
            for (int k = 0; k < m; k++) comp[G(k)] = c;
            for (int k = 1; k < m; k++) AddSpring(b, G(k - 1), G(k), 0.5 + rng.NextDouble());
            for (int e = 0; e < m; e++)
            {
                int i = rng.Next(m), j = rng.Next(m);
                if (i != j) AddSpring(b, G(i), G(j), 0.5 + rng.NextDouble());
            }
            if (c == 3) b.AddDiagonal(G(m / 2), 2.0);
            offset += m;
        }
        var a = b.Build();

        var f = Solver(ordering).Factorize(a);
        Assert.Equal(3, f.PivotFailures.Count);
        var failedComponents = f.PivotFailures.Select(p => comp[p.Dof]).OrderBy(c => c).ToArray();
        Assert.Equal(new[] { 0, 1, 2 }, failedComponents);

        for (int q = 0; q < 3; q++)
        {
            var z = f.MechanismShape(q);
            int c = comp[f.PivotFailures[q].Dof];
            Assert.True(KzRelative(a, z) < 1e-11, $"failure {q}: {KzRelative(a, z):E2}");
            for (int i = 0; i < n; i++) Assert.Equal(comp[i] == c ? 1.0 : 0.0, z[i], 9);
        }

        // Solve with the failed DOFs held at zero: compare with MathNet on the matrix with those rows/columns removed.
        var keep = Enumerable.Range(0, n).Where(i => !f.PivotFailures.Any(p => p.Dof == i)).ToArray();
        var dense = Dense(a);
        var reduced = Matrix<double>.Build.Dense(keep.Length, keep.Length, (i, j) => dense[keep[i], keep[j]]);
        var load = RandomVector(n, 19);
        var x = new double[n];
        f.Solve(load, x);
        var xr = reduced.Cholesky().Solve(Vector<double>.Build.Dense(keep.Length, i => load[keep[i]]));
        foreach (var p in f.PivotFailures) Assert.Equal(0.0, x[p.Dof]);
        var xk = keep.Select(i => x[i]).ToArray();
        Assert.True(RelativeDifference(xk, xr.ToArray()) < 1e-9);
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void RandomUngroundedLaplacian_FailuresEqualComponentCount(string ordering)
    {
        for (int seed = 0; seed < 8; seed++)
        {
            int n = 60 + 40 * seed;
            // Sparse enough (≈0.7 edges per node) to leave several components and isolated nodes.
            var a = RandomLaplacianPlusDiagonal(n, 1000 + seed, edgesPerNode: 0.7, shift: false);
            int components = CountComponents(a);
            var f = Solver(ordering).Factorize(a);
            Assert.Equal(components, f.PivotFailures.Count);
            for (int q = 0; q < f.PivotFailures.Count; q++)
            {
                var z = f.MechanismShape(q);
                Assert.True(KzRelative(a, z) < 1e-11);
                Assert.Equal(1.0, z.Max(Math.Abs), 12);
            }
        }
    }

    private static int CountComponents(SymmetricSparseMatrix a)
    {
        // Union–find over the stored off-diagonal entries (independent of the ordering code).
        var parent = Enumerable.Range(0, a.Size).ToArray();
        int Find(int v) { while (parent[v] != v) v = parent[v] = parent[parent[v]]; return v; }
        for (int j = 0; j < a.Size; j++)
            for (int p = a.ColumnPointers[j]; p < a.ColumnPointers[j + 1]; p++)
                if (a.RowIndices[p] != j && a.Values[p] != 0) parent[Find(a.RowIndices[p])] = Find(j);
        return Enumerable.Range(0, a.Size).Count(v => Find(v) == v);
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void DofWithNoStiffness_FailsAtThatDof(string ordering)
    {
        // DOF 3 of 8 gets no entry at all (e.g. a node no element reaches); the rest is SPD.
        int n = 8, dead = 3;
        var b = new SymmetricMatrixBuilder(n);
        var live = Enumerable.Range(0, n).Where(i => i != dead).ToArray();
        for (int k = 1; k < live.Length; k++) AddSpring(b, live[k - 1], live[k], 2.0);
        foreach (int i in live) b.AddDiagonal(i, 0.5);
        var a = b.Build();
        Assert.Equal(0.0, a.Diagonal(dead));

        var f = Solver(ordering).Factorize(a);
        var failure = Assert.Single(f.PivotFailures);
        Assert.Equal(dead, failure.Dof);
        Assert.Equal(0.0, failure.Pivot);
        Assert.Equal(0.0, failure.Diagonal);
        var z = f.MechanismShape(0);
        for (int i = 0; i < n; i++) Assert.Equal(i == dead ? 1.0 : 0.0, z[i]);

        var load = RandomVector(n, 2);
        var x = new double[n];
        f.Solve(load, x);
        Assert.Equal(0.0, x[dead]);
        var dense = Dense(a);
        var reduced = Matrix<double>.Build.Dense(live.Length, live.Length, (i, j) => dense[live[i], live[j]]);
        var xr = reduced.Cholesky().Solve(Vector<double>.Build.Dense(live.Length, i => load[live[i]])).ToArray();
        Assert.True(RelativeDifference(live.Select(i => x[i]).ToArray(), xr) < 1e-12);
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void Indefinite2x2_RecordsAFailure_NoNaN(string ordering)
    {
        // [1 2; 2 1] has eigenvalues 3 and −1: the second pivot is 1 − 4 = −3 in either order.
        var b = new SymmetricMatrixBuilder(2);
        b.AddElement(new[] { 0, 1 }, new[,] { { 1.0, 2.0 }, { 2.0, 1.0 } });
        var f = Solver(ordering).Factorize(b.Build());
        var failure = Assert.Single(f.PivotFailures);
        Assert.Equal(-3.0, failure.Pivot, 12);
        Assert.Equal(1.0, failure.Diagonal);
        var x = new double[2];
        f.Solve(new[] { 1.0, 1.0 }, x);
        Assert.Equal(0.0, x[failure.Dof]);
        Assert.Equal(1.0, x[1 - failure.Dof], 14); // the other equation alone: 1·x = 1
        var z = f.MechanismShape(0);
        Assert.All(z, v => Assert.True(double.IsFinite(v)));
        // z = (−2, 1) scaled, with the failed DOF's entry positive: the eliminated row (1·z₀ + 2·z₁ = 0) holds.
        Assert.Equal(1.0, Math.Abs(z[1 - failure.Dof]), 14);
        Assert.Equal(0.5, z[failure.Dof], 14);
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void IndefiniteLargerMatrix_FailuresRecorded_FiniteEverywhere_AndMechanismMeetsItsDefinition(string ordering)
    {
        // A scrambled grid Laplacian with a negative shift: eigenvalues of the 2D 5-point Laplacian lie in (0, 8),
        // so a shift of −1.5 leaves several negative ones (from memory of the stencil's spectrum).
        var a = GridStencil(12, 10, 1, scrambleSeed: 8, shift: -1.5);
        var f = Solver(ordering).Factorize(a);
        Assert.NotEmpty(f.PivotFailures);
        // The diagonal (degree − 1.5 ≥ 0.5) is positive everywhere, so each failure is a small or negative pivot.
        Assert.All(f.PivotFailures, p => Assert.True(p.Diagonal > 0 && p.Pivot <= 1e-10 * p.Diagonal));

        var x = new double[a.Size];
        f.Solve(RandomVector(a.Size, 1), x);
        Assert.All(x, v => Assert.True(double.IsFinite(v)));

        var inv = Orderings.Inverse(PermutationOf(f));
        var failedDofs = f.PivotFailures.Select(p => p.Dof).ToHashSet();
        for (int q = 0; q < f.PivotFailures.Count; q++)
        {
            var z = f.MechanismShape(q);
            Assert.All(z, v => Assert.True(double.IsFinite(v)));
            Assert.Equal(1.0, z.Max(Math.Abs), 12);
            int k = inv[f.PivotFailures[q].Dof];
            Assert.True(z[f.PivotFailures[q].Dof] > 0);
            var kz = new double[a.Size];
            a.Multiply(z, kz);
            double scale = FrobeniusNorm(a);
            for (int i = 0; i < a.Size; i++)
            {
                int pos = inv[i];
                if (pos > k) Assert.Equal(0.0, z[i]);                        // zero past the failed DOF
                if (pos < k && !failedDofs.Contains(i)) Assert.True(Math.Abs(kz[i]) < 1e-10 * scale, $"row {i}: {kz[i]:E2}");
                if (pos < k && failedDofs.Contains(i)) Assert.Equal(0.0, z[i]); // earlier failures stay held
            }
        }
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void NegativeDiagonal_FailsAtThatDof(string ordering)
    {
        var b = new SymmetricMatrixBuilder(4);
        b.AddDiagonal(0, 4.0);
        b.AddDiagonal(1, -2.0);
        b.AddDiagonal(2, 4.0);
        b.AddDiagonal(3, 4.0);
        AddSpring(b, 0, 2, 1.0);
        var f = Solver(ordering).Factorize(b.Build());
        var failure = Assert.Single(f.PivotFailures);
        Assert.Equal(1, failure.Dof);
        Assert.Equal(-2.0, failure.Diagonal);
        Assert.Equal(-2.0, failure.Pivot);
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void NaNEntry_IsAFailureNotAnException(string ordering)
    {
        var b = new SymmetricMatrixBuilder(3);
        b.AddDiagonal(0, 1.0);
        b.AddDiagonal(1, double.NaN);
        b.AddDiagonal(2, 1.0);
        var f = Solver(ordering).Factorize(b.Build());
        Assert.Equal(1, Assert.Single(f.PivotFailures).Dof);
        var x = new double[3];
        f.Solve(new[] { 1.0, 1.0, 1.0 }, x);
        Assert.Equal(new[] { 1.0, 0.0, 1.0 }, x);
    }

    [Theory]
    [InlineData("envelope-natural")]
    [InlineData("supernodal-natural")]
    public void RelativeTolerance_IsHonoured(string ordering)
    {
        // [1 1; 1 1+δ]: second pivot δ, diagonal 1+δ. With δ = 1e-6 it passes at tol 1e-10 and fails at tol 1e-4.
        var b = new SymmetricMatrixBuilder(2);
        b.AddElement(new[] { 0, 1 }, new[,] { { 1.0, 1.0 }, { 1.0, 1.0 + 1e-6 } });
        var a = b.Build();
        var solver = Solver(ordering);
        Assert.Empty(solver.Factorize(a, 1e-10).PivotFailures);
        var failure = Assert.Single(solver.Factorize(a, 1e-4).PivotFailures);
        Assert.Equal(1, failure.Dof);
        Assert.Equal(1e-6, failure.Pivot, 1e-15);
    }

    [Theory]
    [MemberData(nameof(BothOrderings))]
    public void MechanismShape_RejectsABadIndex(string ordering)
    {
        var f = Solver(ordering).Factorize(RandomLaplacianPlusDiagonal(5, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => f.MechanismShape(0));
    }
}
