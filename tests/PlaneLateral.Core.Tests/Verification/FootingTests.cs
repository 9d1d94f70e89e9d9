using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Verification;

/// <summary>
/// A concrete wall on a footing that rocks: the footing's springs against the published formulas, and the FE top
/// deflection against the cantilever closed form with the base terms (derived).
/// </summary>
public class FootingTests
{
    // Kip–ft: a 20 ft long, 40 ft tall, 1 ft thick wall, E = 518 400 ksf (3600 ksi), ν = 0.2, f = 1.2, P = 100 kip at the top;
    // on the 24 × 6 ft footing of the published check, G = 1000 ksf, ν = 0.35.
    private const double E = 518_400, Nu = 0.2, H = 40, Lw = 20, T = 1, P = 100;

    internal static JObject Wall(double soilG = 1000, string[]? springs = null, double embedment = 0, string formulas = "pais-kausel")
    {
        var footing = new JObject
        {
            ["id"] = "F1", ["node"] = "B", ["length"] = 24, ["width"] = 6, ["embedment"] = embedment, ["formulas"] = formulas,
            ["soil"] = new JObject { ["shearModulus"] = soilG, ["poissonRatio"] = 0.35 },
        };
        if (springs is not null) footing["springs"] = new JArray(springs);
        var model = JObject.FromObject(new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "ft" },
            materials = new[] { new { id = "C", E, nu = Nu } },
            sections = new[] { new { id = "W", shape = "rectangle", b = T, d = Lw, shearFactor = 1.2 } },
            nodes = new[] { new { id = "B", x = 0.0, y = 0.0 }, new { id = "T", x = 0.0, y = H } },
            members = new[] { new { id = "M", start = "B", end = "T", section = "W", material = "C", role = "wall" } },
            supports = new[] { new { node = "B", type = "fixed" } },
            loadCases = new[] { new { id = "P", nodalLoads = new[] { new { node = "T", fx = P } } } },
            stiffnessAt = new[] { new { node = "T", direction = "x" } },
        });
        model["footings"] = new JArray(footing);
        return model;
    }

    private static StructureModel Read(JObject m) => ModelReader.Parse(m.ToString(), "footing.json");

    /// <summary>Cantilever closed form, fixed base: P·h³/(3EI) + f·P·h/(G·A) (Gere &amp; Timoshenko).</summary>
    private static double FixedBaseDeflection()
    {
        double i = T * Lw * Lw * Lw / 12, a = T * Lw, g = E / (2 * (1 + Nu));
        return P * H * H * H / (3 * E * i) + 1.2 * P * H / (g * a);
    }

    [Fact]
    public void TheRockingSpringIsThePublishedStiffness()
    {
        // Pais & Kausel (1988), NIST GCR 12-917-21 Table 2-2a; B = 3, L = 12 ft: K_yy = 1000·27/0.65·[3.73·4^2.4 + 0.27]
        // = 41 538.46·104.1789 = 4.3274E6 kip·ft/rad (published check 4.33E6). The wall lies along the footing's long
        // side (length 24 ft in the model's plane), so it rocks about the short axis: K_yy.
        var m = Read(Wall(springs: ["rz"]));
        var s = Assert.Single(m.Supports);
        double kr = m.Units.FromSI(s.SpringRZ, Quantity.RotationalStiffness);
        Near(4.33e6, kr, 1.5e-3, "K_yy against the published check");
        Near(4.32743e6, kr, 1e-5, "K_yy against the hand arithmetic");
        Assert.True(s.RestrainX && s.RestrainY && !s.RestrainRZ, "only rz given to the footing");
        Assert.Equal("F1", Assert.Single(m.Footings).Id);
    }

    [Fact]
    public void GazetasRockingSpringIsThePublishedSecondOpinion()
    {
        // Gazetas (1991): 3G/(1−ν)·I_by^0.75·(L/B)^0.15 = 4615.38·758.059·1.23114 = 4.3074E6 kip·ft/rad (published 4.31E6).
        var m = Read(Wall(springs: ["rz"], formulas: "gazetas"));
        Near(4.31e6, m.Units.FromSI(m.Supports[0].SpringRZ, Quantity.RotationalStiffness), 1.5e-3, "Gazetas K_yy");
    }

    [Fact]
    public void CantileverOnARockingSpringMatchesTheClosedForm()
    {
        // Derived: the base turns by θ = P·h/K_θ; the wall above moves rigidly with it by θ·h and bends and shears as a
        // fixed-base cantilever on top of that (its moments and shears are statically determinate):
        // Δ = P·h³/(3EI) + f·P·h/(GA) + P·h²/K_θ, with K_θ the support's spring as read.
        var m = Read(Wall(springs: ["rz"]));
        var r = LinearStaticAnalysis.Run(m);
        AssertChecks(r);
        double kTheta = m.Units.FromSI(m.Supports[0].SpringRZ, Quantity.RotationalStiffness);
        double expected = FixedBaseDeflection() + P * H * H / kTheta;
        double fe = m.Units.FromSI(r.Cases[0].Displacement(m.NodeIndex("T"), Dof.X), Quantity.Length);
        Near(expected, fe, 1e-9, "top deflection on a rocking base");
    }

    [Fact]
    public void CantileverOnRockingAndSlidingSpringsMatchesTheClosedForm()
    {
        // Derived as above, plus the base sliding P/K_h: Δ = P·h³/(3EI) + f·P·h/(GA) + P·h²/K_θ + P/K_h. The vertical
        // spring takes no load (no axial force in the wall under a lateral top load).
        var m = Read(Wall());
        var r = LinearStaticAnalysis.Run(m);
        AssertChecks(r);
        var s = m.Supports[0];
        Assert.False(s.RestrainX || s.RestrainY || s.RestrainRZ);
        double kTheta = m.Units.FromSI(s.SpringRZ, Quantity.RotationalStiffness), kH = m.Units.FromSI(s.SpringX, Quantity.TranslationalStiffness);
        double expected = FixedBaseDeflection() + P * H * H / kTheta + P / kH;
        double fe = m.Units.FromSI(r.Cases[0].Displacement(m.NodeIndex("T"), Dof.X), Quantity.Length);
        Near(expected, fe, 1e-9, "top deflection on rocking and sliding springs");
        // Σ reactions = Σ loads with spring reactions: the sliding spring pushes back −P; the load's moment about the base is
        // −P·h (counter-clockwise positive), so the rocking spring's is +P·h.
        var reaction = Assert.Single(r.Cases[0].Reactions);
        Near(-P, m.Units.FromSI(reaction.Fx, Quantity.Force), 1e-9, "spring shear");
        Near(P * H, m.Units.FromSI(reaction.Mz, Quantity.Moment), 1e-9, "spring moment");
    }

    [Fact]
    public void AsTheSoilStiffensTheWallTendsToItsFixedBaseStiffness()
    {
        // Derived: the base terms fall as 1/G, so Δ − Δ_fixed shrinks tenfold for each tenfold G and vanishes in the limit.
        double fixedDelta = FixedBaseDeflection();
        double previous = double.PositiveInfinity;
        foreach (double g in new[] { 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9 })
        {
            var m = Read(Wall(soilG: g));
            var r = LinearStaticAnalysis.Run(m);
            double fe = m.Units.FromSI(r.Cases[0].Displacement(m.NodeIndex("T"), Dof.X), Quantity.Length);
            double excess = fe / fixedDelta - 1;
            Assert.True(excess > 0 && excess < previous / 9.99, $"G = {g}: excess {excess} after {previous}");
            previous = excess;
        }
        Assert.True(previous < 1e-5, $"at G = 1E9 ksf the wall is within {previous} of its fixed base");
    }
}
