using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// The 1-norm estimator (Higham 2002, Alg. 15.4) against exact inverse norms, and the analysis of a model with a link
/// far stiffer than its members: accurate against the closed form, backward error small, and the warning naming the link.
/// </summary>
public class ConditionEstimateTests
{
    private static double Estimate(SymmetricSparseMatrix k)
    {
        var f = new EnvelopeCholeskySolver().Factorize(k);
        void Inv(double[] x, double[] y) => f.Solve(x, y);
        return OneNormEstimator.InverseNorm(k.Size, Inv, Inv, out _);
    }

    [Fact]
    public void DiagonalMatrixGivesTheExactInverseNorm()
    {
        // Derived: diag(1, 1e-3, 5)⁻¹ has 1-norm 1000. From x = e/3 the sign vector is all +1, z = A⁻¹·e = (1, 1000, 0.2),
        // so the next vertex is e₂ and ‖A⁻¹e₂‖₁ = 1000 exactly.
        var b = new SymmetricMatrixBuilder(3);
        b.AddDiagonal(0, 1); b.AddDiagonal(1, 1e-3); b.AddDiagonal(2, 5);
        Near(1000, Estimate(b.Build()), 1e-12);
    }

    [Theory]
    [InlineData(9)]
    [InlineData(51)]
    public void SecondDifferenceMatrixAgainstItsClosedFormInverse(int n)
    {
        // Derived: T = tridiag(−1, 2, −1) of order n has (T⁻¹)ᵢⱼ = i(n+1−j)/(n+1) for i ≤ j (1-based; common practice), so
        // column j sums to j(n+1−j)/2 and ‖T⁻¹‖₁ = max_j j(n+1−j)/2, at j = (n+1)/2 for odd n: (n+1)²/8.
        var b = new SymmetricMatrixBuilder(n);
        for (int i = 0; i < n; i++) b.AddDiagonal(i, 2);
        for (int i = 0; i + 1 < n; i++) b.AddElement(new[] { i, i + 1 }, new[,] { { 0.0, -1.0 }, { -1.0, 0.0 } });
        double exact = (n + 1) * (n + 1) / 8.0;
        double est = Estimate(b.Build());
        Assert.True(est <= exact * (1 + 1e-12), $"an estimate is a lower bound: {est} > {exact}");
        Assert.True(est >= exact / 3, $"estimate {est} more than a factor 3 below {exact}");
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    public void RandomSpdMatricesAgainstTheDenseInverse(int seed)
    {
        // Lower bound always (every estimate is ‖A⁻¹x‖₁ with ‖x‖₁ = 1, or 2/(3n)·‖A⁻¹b‖₁ with ‖b‖₁ ≤ 3n/2: derived);
        // within a factor 3 on such matrices (Higham 2002, §15.3, from memory: "rarely more than 3 below").
        var k = TestMatrices.RandomLaplacianPlusDiagonal(40, seed, shiftMin: 1e-3);
        var inv = Matrix<double>.Build.DenseOfArray(k.ToDense()).Inverse();
        double exact = inv.L1Norm();
        double est = Estimate(k);
        Assert.True(est <= exact * (1 + 1e-9), $"{est} > {exact}");
        Assert.True(est >= exact / 3, $"{est} < {exact}/3");
    }

    /// <summary>
    /// Two equal steel cantilevers 3.5 m tall, 6 m apart, their tops joined by an axial link (a brace) whose EA/L is
    /// <paramref name="ratio"/> times the lateral stiffness k of one cantilever; P = 10 kN at the top of the first.
    /// </summary>
    private static object LinkedCantilevers(double ratio)
    {
        var (e, a, i, As, h, span) = (2.0e8, 0.01, 1.0e-4, 0.005, 3.5, 6.0);
        double k = CantileverStiffness(e, e / 2.6, i, As, h);
        double linkArea = ratio * k * span / e;
        return new
        {
            formatVersion = 1,
            units = new { force = "kN", length = "m" },
            materials = new[] { new { id = "steel", E = e, nu = 0.3 } },
            sections = new object[] { new { id = "col", shape = "general", A = a, I = i, shearArea = As }, new { id = "link", shape = "general", A = linkArea, I = 1.0 } },
            nodes = new[] { new { id = "A", x = 0.0, y = 0.0 }, new { id = "B", x = 0.0, y = h }, new { id = "C", x = span, y = h }, new { id = "D", x = span, y = 0.0 } },
            members = new object[]
            {
                new { id = "c1", start = "A", end = "B", section = "col", material = "steel" },
                new { id = "c2", start = "D", end = "C", section = "col", material = "steel" },
                new { id = "link", start = "B", end = "C", section = "link", material = "steel", kind = "brace" },
            },
            supports = new[] { new { node = "A", type = "fixed" }, new { node = "D", type = "fixed" } },
            loadCases = new[] { new { id = "P", nodalLoads = new[] { new { node = "B", fx = 10.0 } } } },
        };
    }

    /// <summary>
    /// Tip stiffness (kN/m) of a Timoshenko cantilever: 1/(h³/(3EI) + h/(G·A_s)) (Timoshenko and Gere, Mechanics of Materials;
    /// common practice). G = E/(2(1+ν)) = E/2.6 for ν = 0.3.
    /// </summary>
    private static double CantileverStiffness(double e, double g, double i, double As, double h) => 1.0 / (h * h * h / (3 * e * i) + h / (g * As));

    private static (double U1, double U2, double N) ClosedForm(double ratio)
    {
        // Derived: with k each cantilever's stiffness and k_l the link's, k·u1 + k_l(u1 − u2) = P and k·u2 + k_l(u2 − u1) = 0 give
        // u1 = P(k + k_l)/(k(k + 2k_l)), u2 = P·k_l/(k(k + 2k_l)), and the link force N = k_l(u2 − u1) = −P·k_l/(k + 2k_l) (compression).
        double k = CantileverStiffness(2.0e8, 2.0e8 / 2.6, 1.0e-4, 0.005, 3.5) * 1e3;   // N/m
        double kl = ratio * k, p = 10e3;
        return (p * (k + kl) / (k * (k + 2 * kl)), p * kl / (k * (k + 2 * kl)), -p * kl / (k + 2 * kl));
    }

    [Theory]
    [InlineData(1e3)]
    [InlineData(1e6)]
    public void ALinkAMillionTimesStifferStaysAccurate(double ratio)
    {
        var r = LinearStaticAnalysis.Run(Parse(LinkedCantilevers(ratio)));
        AssertChecks(r);   // backward error < 1e-13 and equilibrium to 1e-9
        var (u1, u2, n) = ClosedForm(ratio);
        var c = r.Case("P");
        Near(u1, c.Displacement(1, Dof.X), 1e-9, "u at B");
        Near(u2, c.Displacement(2, Dof.X), 1e-9, "u at C");
        // The link force comes from u1 − u2 = P/(k + 2k_l), a fraction 1/(1 + 2·ratio) of u1, so its rounding grows with the
        // ratio (about ratio·u relative; derived): tolerance 1e-14·ratio, at least 1e-9.
        Near(n, c.MemberForces[2].N2, Math.Max(1e-9, 1e-14 * ratio), "link force");
        Assert.False(r.Conditioning!.IllConditioned);
        Assert.DoesNotContain(r.Notes, note => note.Contains("ill-conditioned"));
    }

    [Theory]
    [InlineData(1e3)]
    [InlineData(1e6)]
    [InlineData(1e9)]
    public void TheEstimateBoundsTheExactScaledConditionNumberAndWarnsNamingTheLink(double ratio)
    {
        var model = Parse(LinkedCantilevers(ratio));
        var r = LinearStaticAnalysis.Run(model);
        Assert.True(r.Cases[0].BackwardError < 1e-13, $"backward error {r.Cases[0].BackwardError}");

        // The exact κ₁(H), H = D^(−1/2)·K·D^(−1/2), from the dense matrix and its inverse (common practice).
        var elements = model.Members.Select(m => new PlaneLateral.Elements.FrameElement(m, model.Nodes[m.Start], model.Nodes[m.End])).ToArray();
        var k = LinearStaticAnalysis.Assemble(model, elements, PlaneLateral.Assembly.DofMap.Build(model, elements));
        var h = Matrix<double>.Build.DenseOfArray(k.ToDense());
        var s = Matrix<double>.Build.DenseOfDiagonalArray(Enumerable.Range(0, k.Size).Select(i => 1 / Math.Sqrt(k.Diagonal(i))).ToArray());
        h = s * h * s;
        double exact = h.L1Norm() * h.Inverse().L1Norm();
        // The displacements within the a-priori bound κ·u (first order; Higham 2002, ch. 7 and 10, from memory), with a factor 10
        // of margin, and never looser than the 1e-9 of an exact element.
        var (u1, u2, _) = ClosedForm(ratio);
        double tol = Math.Max(1e-9, 10 * exact * Math.Pow(2, -53));
        Near(u1, r.Case("P").Displacement(1, Dof.X), tol, "u at B");
        Near(u2, r.Case("P").Displacement(2, Dof.X), tol, "u at C");

        var cond = r.Conditioning!;
        Assert.True(cond.ScaledKappa1 <= exact * (1 + 1e-6), $"estimate {cond.ScaledKappa1:E3} above the exact {exact:E3}");
        Assert.True(cond.ScaledKappa1 >= exact / 3, $"estimate {cond.ScaledKappa1:E3} more than 3 below the exact {exact:E3}");

        if (exact > 3 * Conditioning.WarningThreshold)   // then the estimate is above the threshold, by the line before
        {
            Assert.True(cond.IllConditioned);
            Assert.Contains("member \"link\"", cond.LikelyCause);
            Assert.Contains(r.Notes, note => note.Contains("ill-conditioned") && note.Contains("member \"link\""));
        }
        if (ratio == 1e9) Assert.True(exact > 3 * Conditioning.WarningThreshold, $"exact κ₁(H) {exact:E3} at ratio 1e9");
    }

    [Fact]
    public void TheShippedDemoIsWellConditioned()
    {
        // Common practice: a frame of ordinary members with exact diaphragm ties has nothing to make it ill-conditioned.
        var r = LinearStaticAnalysis.Run(ModelReader.ReadFile(PlaneLateral.Cli.CliApp.DemoModelPath));
        Assert.False(r.Conditioning!.IllConditioned);
        Assert.Null(r.Conditioning.LikelyCause);
    }
}
