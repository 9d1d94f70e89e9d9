using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Tests.Seismic;

namespace PlaneLateral.Tests.Analysis;

/// <summary>The dense symmetric eigen step (MathNet's decomposition, and subspace iteration for the few largest).</summary>
public class SymmetricEigenTests
{
    /// <summary>
    /// The second-difference matrix K = tridiag(−1, 2, −1) of order n has eigenvalues 2 − 2·cos(kπ/(n+1)), k = 1..n
    /// (Strang, <i>Computational Science and Engineering</i>, 2007, §1.5 — from memory), and its inverse has the entries
    /// (K⁻¹)ᵢⱼ = min(i, j)·(n + 1 − max(i, j))/(n + 1), 1-based (the discrete Green's function, same source; derived
    /// check for n = 2: K⁻¹ = [[2, 1], [1, 2]]/3 and the formula gives 1·2/3, 1·1/3, 2·1/3). So K⁻¹ has the eigenvalues
    /// 1/(2 − 2·cos(kπ/(n+1))), the largest for k = 1, a flexibility-like matrix like the one the periods come from.
    /// </summary>
    private static double[,] InverseSecondDifference(int n)
    {
        var a = new double[n, n];
        for (int i = 1; i <= n; i++)
            for (int j = 1; j <= n; j++)
                a[i - 1, j - 1] = (double)Math.Min(i, j) * (n + 1 - Math.Max(i, j)) / (n + 1);
        return a;
    }

    private static double ClosedForm(int n, int k) => 1 / (2 - 2 * Math.Cos(k * Math.PI / (n + 1)));

    private static void Near(double expected, double actual, double relTol, string what) =>
        Assert.True(Math.Abs(actual - expected) <= relTol * Math.Abs(expected), $"{what}: expected {expected:R}, got {actual:R}");

    private static double Residual(double[,] a, double[,] vectors, int k, double lambda)
    {
        int n = a.GetLength(0);
        double r = 0;
        for (int i = 0; i < n; i++)
        {
            double s = 0;
            for (int j = 0; j < n; j++) s += a[i, j] * vectors[j, k];
            r += (s - lambda * vectors[i, k]) * (s - lambda * vectors[i, k]);
        }
        return Math.Sqrt(r);
    }

    [Theory]
    [InlineData(5)]
    [InlineData(60)]
    public void FullDecompositionHasTheClosedFormEigenvaluesAndAgreesWithJacobi(int n)
    {
        var a = InverseSecondDifference(n);
        var (values, vectors) = SymmetricEigen.Solve(a);
        var (reference, _) = JacobiReference.Solve(a);
        for (int k = 0; k < n; k++)
        {
            Near(ClosedForm(n, k + 1), values[k], 1e-10, $"n = {n}, eigenvalue {k + 1}: closed form (Strang 2007)");
            Near(reference[k], values[k], 1e-10, $"n = {n}, eigenvalue {k + 1}: the Jacobi reference");
            Assert.True(Residual(a, vectors, k, values[k]) <= 1e-10 * values[0], $"‖A·x − λ·x‖ of pair {k + 1}");
        }
    }

    [Fact]
    public void SubspaceIterationFindsTheLargestOfALargeMatrix()
    {
        const int n = 600;   // above the size decomposed whole, so the subspace iteration runs
        Assert.True(n > SymmetricEigen.DenseUpTo);
        var a = InverseSecondDifference(n);
        var (values, vectors) = SymmetricEigen.Largest(a, 5);
        Assert.Equal(5, values.Length);
        for (int k = 0; k < 5; k++)
        {
            Near(ClosedForm(n, k + 1), values[k], 1e-10, $"eigenvalue {k + 1}: closed form (Strang 2007)");
            Assert.True(Residual(a, vectors, k, values[k]) <= 1e-9 * values[0], $"‖A·x − λ·x‖ of pair {k + 1}");
            // The eigenvector of K for k is sin(i·kπ/(n+1)) (same source); unit length, largest entry positive.
            double norm = Math.Sqrt(Enumerable.Range(1, n).Sum(i => Math.Pow(Math.Sin(i * (k + 1) * Math.PI / (n + 1)), 2)));
            int big = Enumerable.Range(0, n).MaxBy(i => Math.Abs(Math.Sin((i + 1) * (k + 1) * Math.PI / (n + 1))));
            double sign = Math.Sign(Math.Sin((big + 1) * (k + 1) * Math.PI / (n + 1)));
            for (int i = 0; i < n; i += 37)
                Assert.True(Math.Abs(vectors[i, k] - sign * Math.Sin((i + 1) * (k + 1) * Math.PI / (n + 1)) / norm) <= 1e-7,
                    $"vector {k + 1}, entry {i}");
        }
    }

    [Fact]
    public void SubspaceIterationFindsARepeatedEigenvalueTwice()
    {
        // Two identical uncoupled blocks: every eigenvalue of one block occurs twice (common practice: the spectrum of
        // a block-diagonal matrix is the union of the blocks' spectra). A single-vector method would find each once.
        const int m = 250;
        var block = InverseSecondDifference(m);
        var a = new double[2 * m, 2 * m];
        for (int i = 0; i < m; i++) for (int j = 0; j < m; j++) a[i, j] = a[m + i, m + j] = block[i, j];
        var (values, _) = SymmetricEigen.Largest(a, 4);
        double[] expected = [ClosedForm(m, 1), ClosedForm(m, 1), ClosedForm(m, 2), ClosedForm(m, 2)];
        for (int k = 0; k < 4; k++) Near(expected[k], values[k], 1e-10, $"eigenvalue {k + 1} of the doubled spectrum");
    }

    [Fact]
    public void LargestIsTheSameBitsRunToRun()
    {
        var a = InverseSecondDifference(400);
        var (v1, x1) = SymmetricEigen.Largest(a, 3);
        var (v2, x2) = SymmetricEigen.Largest(a, 3);
        Assert.Equal(v1, v2);
        Assert.Equal(x1.Cast<double>(), x2.Cast<double>());
    }

    /// <summary>
    /// A uniform shear building of 300 stories (mass DOFs above the size decomposed whole): the first three
    /// frequencies ω_j = 2√(k/m)·sin[(2j−1)π/(2(2N+1))] (the closed form of Seismic/PeriodTests, from memory, checked by
    /// hand there for N = 1, 2). The subspace iteration must give them as the dense decomposition does.
    /// </summary>
    [Fact]
    public void TallShearBuildingHasTheClosedFormFrequencies()
    {
        const int n = 300;
        const double h = 3.5, columnI = 400, weight = 500e3;
        var m = SeismicModels.ShearBuilding(h, Enumerable.Repeat(columnI, n).ToArray(), Enumerable.Repeat(weight, n).ToArray(), new { baseShear = 1000.0, modes = 3 });
        var model = ModelReader.Parse(m.ToString(), "tall-shear.json");
        var modal = SeismicAnalysis.Modal(model)!;
        Assert.True(modal.Masses.Length > SymmetricEigen.DenseUpTo);
        var modes = modal.Modes(3);
        double k = 2 * 12 * Building.BuildingModels.E * columnI * 1e-6 / (h * h * h), mass = weight / SeismicPresets.Gravity;   // 24EI/h³ (derived: fixed-guided columns)
        for (int j = 1; j <= 3; j++)
            Near(2 * Math.Sqrt(k / mass) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1))), modes[j - 1].Omega, 1e-8, $"mode {j}");
    }
}
