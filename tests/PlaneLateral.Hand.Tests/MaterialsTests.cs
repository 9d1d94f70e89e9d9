using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

public class MaterialsTests
{
    [Fact]
    public void ShearModulusFromEAndNu()
    {
        // G = E/(2(1+ν)), classical elasticity (Gere & Timoshenko, Mechanics of Materials).
        // Hand: E = 26000, ν = 0.3 → G = 26000/2.6 = 10000 exactly.
        Assert.Equal(10000.0, Elastic.ShearModulus(26000, 0.3).Value, 9);
        // Hand: E = 2400, ν = 0.2 → G = 2400/2.4 = 1000.
        double g = Elastic.ShearModulus(2400, 0.2);
        Assert.Equal(1000.0, g, 9);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(-1.0)]
    [InlineData(0.7)]
    [InlineData(double.NaN)]
    public void PoissonOutsideRangeIsRejected(double nu)
    {
        // ν must lie in (−1, 0.5) for a stable isotropic solid (classical elasticity).
        var ex = Assert.Throws<ArgumentException>(() => Elastic.ShearModulus(1000, nu));
        Assert.Contains("Poisson", ex.Message);
        Assert.Throws<ArgumentException>(() => ShearForm.CowperRectangleCoefficient(nu));
    }

    [Fact]
    public void NonPositiveModulusIsRejected()
    {
        Assert.Throws<ArgumentException>(() => Elastic.ShearModulus(0, 0.2));
        Assert.Throws<ArgumentException>(() => Elastic.ShearModulus(-5, 0.2));
    }

    [Theory]
    // Cowper, J. Appl. Mech. 33:335-340, 1966, rectangle κ = 10(1+ν)/(12+11ν):
    // ν = 0.2 → 12/14.2 = 0.8451; ν = 0.3 → 13/15.3 = 0.8497 (values as quoted for the paper's rectangle).
    [InlineData(0.2, 0.8451)]
    [InlineData(0.3, 0.8497)]
    // ν = 0 → 10/12 = 0.8333 (derived by hand from the same formula; equals 5/6).
    [InlineData(0.0, 0.8333)]
    public void CowperRectangleCoefficient(double nu, double kappa)
    {
        Assert.Equal(kappa, ShearForm.CowperRectangleCoefficient(nu).Value, 4);
        Assert.Equal(1.0 / kappa, ShearForm.CowperRectangle(nu).Value, 3);
    }

    [Fact]
    public void DefaultRectangleFormFactorIsOnePointTwo()
    {
        // Gere & Timoshenko, Mechanics of Materials: f = 1.2 for a rectangle (6/5).
        Assert.Equal(1.2, ShearForm.RectangleDefault);
        Assert.Throws<ArgumentException>(() => ShearForm.UserValue(0.9, "table"));
        Assert.Equal(2.0, ShearForm.UserValue(2.0, "section table").Value);
    }

    [Fact]
    public void MasonryModuliFromStrength()
    {
        // TMS 402 / MSJC via Taly, Design of Reinforced Masonry Structures, p.128: E_m = 900 f'm concrete masonry,
        // 700 f'm clay masonry; E_v = 0.4 E_m. Hand: f'm = 2 ksi → 1800 ksi (the modulus of Taly's example p.455),
        // 1400 ksi clay; E_v = 0.4·1800 = 720 ksi.
        Assert.Equal(1800.0, MasonryModuli.ConcreteMasonry(2.0).Value, 9);
        Assert.Equal(1400.0, MasonryModuli.ClayMasonry(2.0).Value, 9);
        Assert.Equal(720.0, MasonryModuli.ShearModulus(1800).Value, 9);
        Assert.Throws<ArgumentException>(() => MasonryModuli.ConcreteMasonry(0));
    }

    [Fact]
    public void ResultsCarryNameSourceAndAssumptions()
    {
        var v = ShearForm.CowperRectangleCoefficient(0.2);
        Assert.Contains("Cowper", v.Method.Source);
        Assert.Contains("1966", v.Method.Source);
        Assert.NotEmpty(v.Method.Assumptions);
    }
}
