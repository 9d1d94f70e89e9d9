using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Elements;

/// <summary>Properties every correct beam-column element has (Przemieniecki, Theory of Matrix Structural Analysis, 1968, ch. 5).</summary>
public class TimoshenkoElementTests
{
    private static Member MemberWith(double shearArea, bool relStart = false, bool relEnd = false, double a = 0, double b = 0, MemberKind kind = MemberKind.BeamColumn) =>
        new(0, "m", 0, 1, kind, "s", "mat", 200e9, 80e9, 0.02, 4e-4, shearArea, relStart, relEnd, a, b, StiffnessModifiers.None, "");

    private static FrameElement Inclined(Member m) => new(m, new Node(0, "a", 1.0, 2.0), new Node(1, "b", 4.0, 6.0)); // L = 5 m, inclined

    private static Matrix<double> M(double[,] a) => Matrix<double>.Build.DenseOfArray(a);

    public static TheoryData<double, bool, bool, double, double> Variants => new()
    {
        { 0.01, false, false, 0, 0 },
        { double.PositiveInfinity, false, false, 0, 0 },
        { 0.002, true, false, 0, 0 },
        { 0.002, false, true, 0.3, 0.2 },
        { 0.01, true, true, 0, 0 },
        { 0.01, false, false, 0.5, 0.4 },
    };

    [Theory]
    [MemberData(nameof(Variants))]
    public void GlobalStiffnessIsSymmetric(double shearArea, bool rs, bool re, double a, double b)
    {
        var k = M(Inclined(MemberWith(shearArea, rs, re, a, b)).GlobalStiffness);
        Assert.True((k - k.Transpose()).FrobeniusNorm() <= 1e-14 * k.FrobeniusNorm());
    }

    [Theory]
    [InlineData(0.01, false, false, 0, 0, 3)]
    [InlineData(double.PositiveInfinity, false, false, 0, 0, 3)]
    [InlineData(0.01, false, false, 0.5, 0.4, 3)]
    [InlineData(0.002, true, false, 0, 0, 4)]  // one release: the released end's rotation is a further zero mode
    [InlineData(0.01, true, true, 0, 0, 5)]    // both released: a pin-ended bar, 3 rigid modes + 2 free rotations
    public void HasExactlyTheExpectedZeroEnergyModes(double shearArea, bool rs, bool re, double a, double b, int zeroModes)
    {
        // A free planar element has exactly three rigid-body modes (two translations, one rotation); more would be a
        // spurious mechanism, fewer would mean it resists rigid motion (Przemieniecki 1968, §5).
        var k = M(Inclined(MemberWith(shearArea, rs, re, a, b)).GlobalStiffness);
        var eig = k.Evd(Symmetricity.Symmetric).EigenValues.Select(e => e.Real).OrderBy(e => e).ToArray();
        double max = eig.Max();
        Assert.Equal(zeroModes, eig.Count(e => Math.Abs(e) < 1e-10 * max));
        Assert.All(eig, e => Assert.True(e > -1e-10 * max, $"negative eigenvalue {e}"));
    }

    [Fact]
    public void RigidBodyMotionsProduceNoForce()
    {
        // Rigid translation (1, 2) and rigid rotation θ about node a: u_b = u_a + θ × (b − a).
        var k = M(Inclined(MemberWith(0.01, false, false, 0.5, 0.4)).GlobalStiffness);
        double th = 1e-3;
        var translation = Vector<double>.Build.DenseOfArray([1, 2, 0, 1, 2, 0]);
        var rotation = Vector<double>.Build.DenseOfArray([0, 0, th, -th * 4.0, th * 3.0, th]);
        Assert.True((k * translation).L2Norm() < 1e-12 * k.L2Norm() * translation.L2Norm());
        Assert.True((k * rotation).L2Norm() < 1e-12 * k.L2Norm() * rotation.L2Norm());
    }

    [Fact]
    public void ReducesToEulerBernoulliAsShearAreaGrows()
    {
        // Φ = 12EI/(G·A_s·L²) → 0 as A_s → ∞: the Hermite (Euler–Bernoulli) element (Przemieniecki 1968, eq. 5.116 with Φ = 0).
        var eb = M(Inclined(MemberWith(double.PositiveInfinity)).GlobalStiffness);
        var almost = M(Inclined(MemberWith(1e12)).GlobalStiffness);
        Assert.True((eb - almost).FrobeniusNorm() < 1e-9 * eb.FrobeniusNorm());
        var soft = M(Inclined(MemberWith(1e-3)).GlobalStiffness);
        Assert.True((eb - soft).FrobeniusNorm() > 1e-3 * eb.FrobeniusNorm());
    }

    [Fact]
    public void LocalStiffnessMatchesTheClosedFormTerms()
    {
        // Terms EI/(L³(1+Φ))·[12, 6L, (4+Φ)L², (2−Φ)L²] and EA/L (Przemieniecki 1968, §5.6; shared REFERENCES).
        const double e = 200e9, a = 0.02, i = 4e-4, g = 80e9, asv = 0.01, l = 5;
        double phi = TimoshenkoBeam.ShearParameter(e, i, g, asv, l);
        Assert.Equal(12 * e * i / (g * asv * l * l), phi, 12);
        var k = TimoshenkoBeam.LocalStiffness(e, a, i, phi, l);
        double c = e * i / (l * l * l * (1 + phi));
        Assert.Equal(e * a / l, k[0, 0], 6);
        Assert.Equal(12 * c, k[1, 1], 6);
        Assert.Equal(6 * l * c, k[1, 2], 6);
        Assert.Equal((4 + phi) * l * l * c, k[2, 2], 6);
        Assert.Equal((2 - phi) * l * l * c, k[2, 5], 6);
        Assert.Equal(-12 * c, k[1, 4], 6);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.7)]
    public void ShapeFunctionsInterpolateNodalValuesAndRigidMotion(double phi)
    {
        // At ξ = 0 and 1 the transverse shape functions take the nodal values; v1 + v2 sum to 1 (rigid translation);
        // a rigid rotation θ (v1 = 0, θ1 = θ2 = θ, v2 = θL) gives v = θ·x (Friedman & Kosmatka 1993).
        const double l = 3.0;
        var s0 = TimoshenkoBeam.TransverseShape(0, phi, l);
        var s1 = TimoshenkoBeam.TransverseShape(1, phi, l);
        Assert.Equal((1.0, 0.0, 0.0, 0.0), (Math.Round(s0.V1, 14), Math.Round(s0.T1, 14), Math.Round(s0.V2, 14), Math.Round(s0.T2, 14)));
        Assert.Equal((0.0, 0.0, 1.0, 0.0), (Math.Round(s1.V1, 14), Math.Round(s1.T1, 14), Math.Round(s1.V2, 14), Math.Round(s1.T2, 14)));
        foreach (double xi in new[] { 0.1, 0.37, 0.8 })
        {
            var s = TimoshenkoBeam.TransverseShape(xi, phi, l);
            Assert.Equal(1.0, s.V1 + s.V2, 12);
            Assert.Equal(xi * l, s.T1 + s.V2 * l + s.T2, 12);
        }
    }

    [Fact]
    public void UniformLoadEquivalentsAreHalfAndTwelfth()
    {
        // Uniform q: end forces qL/2 and moments ±qL²/12 whatever Φ (symmetric load; e.g. Przemieniecki 1968, §5.6 table).
        foreach (double phi in new[] { 0.0, 0.4, 3.0 })
        {
            var f = TimoshenkoBeam.EquivalentLoads(6.0, phi, 0, 0, -2.0, -2.0);
            Assert.Equal(-6.0, f[1], 12);
            Assert.Equal(-6.0, f[4], 12);
            Assert.Equal(-2.0 * 36 / 12, f[2], 12);
            Assert.Equal(2.0 * 36 / 12, f[5], 12);
        }
    }
}
