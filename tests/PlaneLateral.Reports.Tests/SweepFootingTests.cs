using PlaneLateral.Hand;
using PlaneLateral.Units;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>
/// The aspect-ratio sweep with a footing under the wall: the FE wall on the footing's springs beside the fixed-base pier
/// formula, so FE/hand shows where ignoring the footing stops being acceptable.
/// </summary>
public class SweepFootingTests
{
    private static SweepSpec Spec(SweepFooting? footing, double from = 0.25, double to = 4.0, int points = 5) =>
        new(from, to, points, SweepSpacing.Geometric, UnitSystem.KipInch, 240, 8, 3605, 1502, "concrete", 1.2, [EndFixity.Cantilever], 0.10)
        { Footing = footing };

    // 288 × 72 in surface footing on G = 4.86 ksi (about 700 ksf), ν = 0.35 (invented).
    private static readonly SweepFooting Footing = new(288, 72, 0, 4.86, 0.35);

    [Fact]
    public void The_FE_wall_on_the_footing_adds_the_base_terms_to_the_fixed_base_formula()
    {
        // Derived: a cantilever on a rocking spring K_θ and a sliding spring K_h under a top force P deflects by the
        // fixed-base P·h³/(3EI) + f·P·h/(GA) plus P·h²/K_θ (the base turns by P·h/K_θ) plus P/K_h; the exact Timoshenko
        // element reproduces the first two, so FE = 1/(1/k_hand + h²/K_θ + 1/K_h) to round-off. The springs are the
        // hand library's own evaluation of Pais & Kausel (1988) (NIST GCR 12-917-21 Table 2-2a), computed apart from the engine's.
        var r = AspectSweep.Run(Spec(Footing), AspectSweep.DefaultModels(Spec(Footing)));
        var k = RigidFooting.By(FootingFormulas.PaisKausel, 288, 72, 0, Soil.FromShearModulus(4.86, 0.35)).InPlane(wallAlongLongSide: true);
        foreach (var p in r.Points)
        {
            double h = p.Height;
            double expected = 1 / (1 / p.Hand.Stiffness + h * h / k.Rocking + 1 / k.Sliding);
            Near(expected, p.Fe[0].Value, 1e-9, $"h/l = {p.AspectRatio}: FE on the springs");
        }
        // The footing's share of the deflection falls as the wall gets slender (its h² term against the wall's h³):
        // FE/hand rises with h/l (derived from the same sum).
        for (int i = 1; i < r.Points.Count; i++) Assert.True(r.Points[i].Ratio > r.Points[i - 1].Ratio, $"FE/hand rises with h/l at point {i}");
        Assert.Single(r.FeModels);
    }

    [Fact]
    public void A_very_stiff_soil_gives_back_the_fixed_base_wall()
    {
        // Derived: as G grows the springs grow with it and both base terms vanish, so FE/hand tends to 1.
        var r = AspectSweep.Run(Spec(Footing with { ShearModulus = 4.86e7 }), AspectSweep.DefaultModels(Spec(Footing)));
        Assert.All(r.Points, p => Near(1.0, p.Ratio, 1e-5, $"h/l = {p.AspectRatio}"));
    }

    [Theory]
    [InlineData(200.0, 72.0, 0.0, 4.86, 0.35, "shorter than the wall length")]
    [InlineData(288.0, 72.0, 0.0, 0.0, 0.35, "soil shear modulus")]
    [InlineData(288.0, 72.0, 0.0, 4.86, 0.5, "Poisson's ratio")]
    [InlineData(288.0, 72.0, 0.0, 4.86, 0.0, "Poisson's ratio")]
    [InlineData(288.0, 72.0, 200.0, 4.86, 0.35, "embedment")]
    [InlineData(288.0, -1.0, 0.0, 4.86, 0.35, "not positive")]
    public void Bad_footing_inputs_are_refused_with_a_fix(double length, double width, double embedment, double g, double nu, string words)
    {
        var problems = AspectSweep.Problems(Spec(new SweepFooting(length, width, embedment, g, nu)));
        Assert.Contains(problems, p => p.Contains(words) && p.Contains("Fix:"));
    }

    [Fact]
    public void A_footing_with_a_window_is_refused()
    {
        var s = Spec(Footing) with { Opening = new SweepOpening(0.3, 0.4) };
        Assert.Contains(AspectSweep.Problems(s), p => p.Contains("footing with a window"));
    }
}
