using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

public class FootingTests
{
    private static bool Near(double expected, double actual, double relTol) => Math.Abs(actual - expected) <= relTol * Math.Abs(expected);

    // The 24 × 6 ft footing on soil with G = 1000 ksf, ν = 0.35 (units kip, ft): L = 12, B = 3 (half-dimensions), L/B = 4.
    private static readonly SoilProperties MediumSoil = Soil.FromShearModulus(1000, 0.35);

    [Fact]
    public void PaisKauselRockingAboutTheShortAxisReproducesThePublishedCheck()
    {
        // Pais & Kausel (1988), NIST GCR 12-917-21 Table 2-2a: K_yy = G·B³/(1−ν)·[3.73(L/B)^2.4 + 0.27].
        // By hand: G·B³/(1−ν) = 1000·27/0.65 = 41 538.46; (L/B)^2.4 = 4^2.4 = 2^4.8 = 27.8576;
        // 3.73·27.8576 + 0.27 = 104.1789; K_yy = 41 538.46·104.1789 = 4.3274E6 kip·ft/rad.
        // Published check value (docs: project references, "Foundation flexibility"): 4.33E6, three figures.
        var k = RigidFooting.PaisKausel(24, 6, 0, MediumSoil);
        Assert.True(Near(4.33e6, k.RockingYY, 1.5e-3), $"K_yy = {k.RockingYY}");
        Assert.True(Near(4.32743e6, k.RockingYY, 1e-5), $"K_yy = {k.RockingYY} against the hand arithmetic 4.32743E6");
        Assert.Equal(12, k.HalfLength);
        Assert.Equal(3, k.HalfWidth);
    }

    [Fact]
    public void GazetasRockingGivesThePublishedSecondOpinion()
    {
        // Gazetas (1991): K_ry = 3G/(1−ν)·I_by^0.75·(L/B)^0.15, I_by = (2B)(2L)³/12 = 6·24³/12 = 6912 ft⁴.
        // By hand: 6912^0.75 = 758.059; 4^0.15 = 1.23114; 3·1000/0.65 = 4615.38; product 4.3074E6.
        // Published check value: 4.31E6 kip·ft/rad.
        var k = RigidFooting.Gazetas(6, 24, 0, MediumSoil);   // sides in either order
        Assert.True(Near(4.31e6, k.RockingYY, 1.5e-3), $"K_yy = {k.RockingYY}");
        Assert.True(Near(4.30744e6, k.RockingYY, 1e-5), $"K_yy = {k.RockingYY}");
    }

    [Fact]
    public void AWallAlongTheLongSideRocksAboutTheStrongAxis()
    {
        // A wall in the plane of the footing's long side (x) tilts that plane, i.e. rotates about y: K_yy, the strong
        // axis (it grows as L^2.4·B^0.6). A wall along the short side rotates about x: K_xx = G·B³/(1−ν)·[3.2(L/B) + 0.8]
        // = 41 538.46·13.6 = 5.649E5 kip·ft/rad by hand (Pais & Kausel 1988, NIST GCR 12-917-21 Table 2-2a).
        var k = RigidFooting.PaisKausel(24, 6, 0, MediumSoil);
        Assert.True(Near(564_923.08, k.RockingXX, 1e-6), $"K_xx = {k.RockingXX}");
        Assert.Equal(k.RockingYY, k.InPlane(wallAlongLongSide: true).Rocking);
        Assert.Equal(k.SlidingX, k.InPlane(wallAlongLongSide: true).Sliding);
        Assert.Equal(k.RockingXX, k.InPlane(wallAlongLongSide: false).Rocking);
        Assert.True(k.RockingYY > 7 * k.RockingXX);
    }

    [Fact]
    public void PaisKauselTranslationsByHand()
    {
        // NIST GCR 12-917-21 Table 2-2a, L/B = 4, G·B/(1−ν) = 3000/0.65 = 4615.38, G·B/(2−ν) = 3000/1.65 = 1818.18:
        // K_z = 4615.38·[3.1·4^0.75 + 1.6] = 4615.38·(3.1·2.82843 + 1.6) = 4615.38·10.36813 = 47 852.9 kip/ft;
        // K_y = 1818.18·[6.8·4^0.65 + 3.2 + 1.6] = 1818.18·(6.8·2.46229 + 4.8) = 1818.18·21.54357 = 39 170.1 kip/ft;
        // K_x = 1818.18·[6.8·2.46229 + 2.4] = 1818.18·19.14357 = 34 806.5 kip/ft.
        var k = RigidFooting.PaisKausel(24, 6, 0, MediumSoil);
        Assert.True(Near(47_852.9, k.Vertical, 1e-5), $"K_z = {k.Vertical}");
        Assert.True(Near(39_170.1, k.SlidingY, 1e-5), $"K_y = {k.SlidingY}");
        Assert.True(Near(34_806.5, k.SlidingX, 1e-5), $"K_x = {k.SlidingX}");
    }

    [Fact]
    public void EmbedmentRaisesTheRockingStiffnessByThePublishedFactor()
    {
        // η_yy = 1 + D/B + 1.6/(0.35 + (L/B)⁴)·(D/B)² (Pais & Kausel 1988 via NIST GCR 12-917-21): D = B = 3 ft, L/B = 4:
        // 1 + 1 + 1.6/256.35 = 2.0062415. η_xx = 1 + 1 + 1.6/4.35 = 2.3678161 (from memory).
        var surface = RigidFooting.PaisKausel(24, 6, 0, MediumSoil);
        var embedded = RigidFooting.PaisKausel(24, 6, 3, MediumSoil);
        Assert.True(Near(2.0062415, embedded.RockingYY / surface.RockingYY, 1e-7));
        Assert.True(Near(2.3678161, embedded.RockingXX / surface.RockingXX, 1e-7));
        Assert.Equal(surface.RockingYY, embedded.SurfaceRockingYY, 6);
        Assert.Contains(embedded.Method.Assumptions, a => a.Contains("sidewalls"));
    }

    [Fact]
    public void BothFormulaSetsAgreeOnASquareFooting()
    {
        // For a square (L = B) Pais & Kausel give K_xx = K_yy = 4.0·G·B³/(1−ν) (3.2 + 0.8 = 3.73 + 0.27 = 4.0) and
        // Gazetas 3G/(1−ν)·(4B⁴/3)^0.75 = 3·(4/3)^0.75·G·B³/(1−ν) = 3.7224·G·B³/(1−ν): within 7 % (derived from the
        // published forms); the classical disk value 8Ga³/(3(1−ν)) with the equal-area radius, 8/3·(4/π)^1.5 = 3.831,
        // lies between (Bycroft 1956, common practice).
        var soil = Soil.FromShearModulus(1, 0.3);
        var pk = RigidFooting.PaisKausel(2, 2, 0, soil);
        var gz = RigidFooting.Gazetas(2, 2, 0, soil);
        Assert.True(Near(4.0 / 0.7, pk.RockingYY, 1e-12));
        Assert.True(Near(4.0 / 0.7, pk.RockingXX, 1e-12));
        Assert.True(Near(3 * Math.Pow(4.0 / 3.0, 0.75) / 0.7, gz.RockingYY, 1e-12));
        Assert.True(Math.Abs(gz.RockingYY / pk.RockingYY - 1) < 0.07);
    }

    [Fact]
    public void ShearModulusFromTheShearWaveVelocity()
    {
        // G₀ = (γ/g)·Vs² (Kramer 1996, ch. 5): γ = 0.12 kcf, g = 32.174 ft/s², Vs = 600 ft/s → 0.12/32.174·360 000
        // = 1342.70 ksf; with G/G₀ = 0.5, G = 671.35 ksf.
        var s = Soil.FromShearWaveVelocity(600, 0.12, 32.174, 0.3, 0.5);
        Assert.True(Near(1342.70, s.SmallStrainModulus, 1e-5));
        Assert.True(Near(671.35, s.ShearModulus, 1e-5));
        Assert.Contains(s.Method.Assumptions, a => a.Contains("0.5"));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.5)]
    [InlineData(-0.1)]
    public void APoissonRatioOutsideZeroToHalfIsRefused(double nu)
    {
        var e = Assert.Throws<ArgumentException>(() => Soil.FromShearModulus(1000, nu));
        Assert.Contains("between 0 and 0.5", e.Message);
    }

    [Fact]
    public void ANonPositiveModulusOrReductionIsRefused()
    {
        Assert.Throws<ArgumentException>(() => Soil.FromShearModulus(0, 0.3));
        Assert.Throws<ArgumentException>(() => Soil.FromShearModulus(1000, 0.3, 1.5));
        Assert.Throws<ArgumentException>(() => RigidFooting.PaisKausel(24, 6, -1, MediumSoil));
    }

    [Fact]
    public void CantileverOnBaseSpringsAddsTheRockingAndSlidingTerms()
    {
        // Derived: P = 10, h = 30, E = 1000, I = 83.333, A = 10, G = 400, f = 1.2: flexure 1.08, shear 0.09
        // (Piers tests, Gere & Timoshenko). K_θ = 10 000: rocking P·h²/K_θ = 10·900/10 000 = 0.9; K_h = 100: sliding
        // 10/100 = 0.1. Total 2.17; k = 10/2.17 = 4.6083; fixed-base k = 10/1.17; rocking share 0.9/2.17.
        var fixedBase = Piers.Cantilever(10, 30, 1000, 1000.0 / 12, 10, 400);
        var r = FlexibleBase.Cantilever(fixedBase, 10_000, 100);
        Assert.Equal(0.9, r.RockingDeflection, 12);
        Assert.Equal(0.1, r.SlidingDeflection, 12);
        Assert.Equal(2.17, r.TotalDeflection, 12);
        Assert.Equal(10 / 2.17, r.Stiffness, 12);
        Assert.Equal(10 / 1.17, r.FixedBaseStiffness, 12);
        Assert.Equal(0.9 / 2.17, r.RockingShare, 12);
        Assert.Equal(1.0, r.FlexuralShare + r.ShearShare + r.RockingShare + r.SlidingShare, 12);
        Assert.DoesNotContain("base fully fixed", r.Method.Assumptions);
        // A fixed base in the limit: infinite springs give back the fixed-base stiffness.
        Assert.Equal(fixedBase.Stiffness, FlexibleBase.Cantilever(fixedBase, double.PositiveInfinity, double.PositiveInfinity).Stiffness, 12);
        Assert.Throws<ArgumentException>(() => FlexibleBase.Cantilever(Piers.FixedFixed(10, 30, 1000, 83.3, 10, 400), 1e4, 100));
    }

    [Fact]
    public void PeriodRatioOfTheSingleModeExpression()
    {
        // ASCE 7-16 eq. 19.2-3 (from memory): k = 100, K_y = 400, K_θ = 1E5, h̄ = 20:
        // 1 + 100/400·(1 + 400·400/1E5) = 1 + 0.25·2.6 = 1.65 → T̃/T = √1.65 = 1.284523.
        // Derived the same way from springs in series: 1/k̃ = 1/100 + 1/400 + 400/1E5 = 0.0165 → k/k̃ = 1.65.
        Assert.Equal(Math.Sqrt(1.65), FlexibleBase.PeriodRatio(100, 400, 1e5, 20).Value, 12);
        // A base held against sliding drops the 1/K_y term: 1 + 100·400/1E5 = 1.4 (derived).
        Assert.Equal(Math.Sqrt(1.4), FlexibleBase.PeriodRatio(100, double.PositiveInfinity, 1e5, 20).Value, 12);
        Assert.Throws<ArgumentException>(() => FlexibleBase.PeriodRatio(100, 0, 1e5, 20));
    }
}
