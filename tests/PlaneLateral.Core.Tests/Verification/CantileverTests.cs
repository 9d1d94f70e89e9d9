using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Verification;

/// <summary>
/// Single piers and columns against Timoshenko beam theory. Closed forms: cantilever Δ = PL³/(3EI) + PL/(G·A_s),
/// fixed-guided Δ = PL³/(12EI) + PL/(G·A_s) (Timoshenko &amp; Gere, Mechanics of Materials, shear deflection of beams;
/// Przemieniecki, Theory of Matrix Structural Analysis, 1968, §5.6), G = E/(2(1+ν)).
/// </summary>
public class CantileverTests
{
    // A concrete wall pier 12 in thick, 120 in long, 144 in tall (invented demo geometry); E = 57000√4000 psi ≈ 3605 ksi
    // (ACI 318 E_c = 57,000√f′c), ν = 0.2.
    private const double E = 3605, Nu = 0.2, B = 12, D = 120, H = 144, P = 100;
    private static readonly object Material = new { id = "MAT", E, nu = Nu };
    private static readonly object Wall = new { id = "S", shape = "rectangle", b = B, d = D };

    private static double G => E / (2 * (1 + Nu));
    private static double I => B * D * D * D / 12;
    private static double As => B * D / 1.2;

    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    public void CantileverWallMatchesTimoshenkoClosedForm(int segments)
    {
        var r = Solve(Cantilever(H, P, Wall, Material, segments));
        double expected = P * H * H * H / (3 * E * I) + P * H / (G * As);
        double tip = r.Model.Units.FromSI(r.Cases[0].Displacement(segments, Dof.X), Units.Quantity.Length);
        Near(expected, tip, 1e-9, "cantilever tip");
        Near(P / expected, r.Model.Units.FromSI(r.Stiffness[0].Stiffness, Units.Quantity.TranslationalStiffness), 1e-9, "stiffness");
    }

    [Fact]
    public void CantileverWithoutShearAreaIsEulerBernoulli()
    {
        // General section with no shear area: Δ = PL³/(3EI) (any strength-of-materials text).
        var section = new { id = "S", shape = "general", A = B * D, I = I };
        var r = Solve(Cantilever(H, P, section, Material, 3));
        Near(P * H * H * H / (3 * E * I), r.Model.Units.FromSI(r.Cases[0].Displacement(3, Dof.X), Units.Quantity.Length), 1e-9);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(4)]
    public void FixedGuidedPierMatchesClosedForm(int segments)
    {
        var r = Solve(Cantilever(H, P, Wall, Material, segments, topSupport: "guided"));
        double expected = P * H * H * H / (12 * E * I) + P * H / (G * As);
        Near(expected, r.Model.Units.FromSI(r.Cases[0].Displacement(segments, Dof.X), Units.Quantity.Length), 1e-9, "fixed-guided top");
    }

    [Fact]
    public void CowperShearFactorChangesOnlyTheShearTerm()
    {
        // Cowper (J. Appl. Mech. 33:335–340, 1966): rectangle κ = 10(1+ν)/(12+11ν); ν = 0.2 → κ = 0.8451 (REFERENCES, secondary).
        var wall = new { id = "S", shape = "rectangle", b = B, d = D, shearFactor = "cowper" };
        var r = Solve(Cantilever(H, P, wall, Material));
        double kappa = 10 * (1 + Nu) / (12 + 11 * Nu);
        Assert.Equal(0.8451, kappa, 4);
        double expected = P * H * H * H / (3 * E * I) + P * H / (G * kappa * B * D);
        Near(expected, r.Model.Units.FromSI(r.Cases[0].Displacement(1, Dof.X), Units.Quantity.Length), 1e-9);
    }

    [Fact]
    public void SameStructureInKipInchAndKilonewtonMetreGivesSamePhysicalAnswer()
    {
        // Unit conversion: 1 in = 0.0254 m, 1 kip = 4.4482216152605 kN exactly (NIST SP 811, 2008).
        const double inch = 0.0254, kip = 4.4482216152605;
        var rKipIn = Solve(Cantilever(H, P, Wall, Material, 2));
        var materialSi = new { id = "MAT", E = E * kip / (inch * inch), nu = Nu };
        var wallSi = new { id = "S", shape = "rectangle", b = B * inch, d = D * inch };
        var rSi = Solve(Cantilever(H * inch, P * kip, wallSi, materialSi, 2, units: new { force = "kN", length = "m" }));
        Near(rKipIn.Cases[0].Displacement(2, Dof.X), rSi.Cases[0].Displacement(2, Dof.X), 1e-12, "SI displacement");
        double tipM = rSi.Model.Units.FromSI(rSi.Cases[0].Displacement(2, Dof.X), Units.Quantity.Length);
        double tipIn = rKipIn.Model.Units.FromSI(rKipIn.Cases[0].Displacement(2, Dof.X), Units.Quantity.Length);
        Near(tipIn * inch, tipM, 1e-12, "reported in model units");
        var nmm = Solve(Cantilever(H * 25.4, P * kip * 1000, new { id = "S", shape = "rectangle", b = B * 25.4, d = D * 25.4 },
            new { id = "MAT", E = E * kip * 1000 / (25.4 * 25.4), nu = Nu }, 2, units: new { force = "N", length = "mm" }));
        Near(rKipIn.Cases[0].Displacement(2, Dof.X), nmm.Cases[0].Displacement(2, Dof.X), 1e-12, "N–mm");
    }

    [Fact]
    public void RotationalSpringAtBaseAddsRigidBodyRotation()
    {
        // Derived by hand: a base spring k_r rotates the whole pier by P·H/k_r, adding P·H²/k_r at the top.
        const double kr = 5.0e7; // kip·in/rad
        var model = ToJObject(Cantilever(H, P, Wall, Material));
        model["supports"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { node = "N0", type = "custom", restrain = new[] { "x", "y" }, springs = new { rz = kr } } });
        var r = Solve(model);
        double expected = P * H * H * H / (3 * E * I) + P * H / (G * As) + P * H * H / kr;
        Near(expected, r.Model.Units.FromSI(r.Cases[0].Displacement(1, Dof.X), Units.Quantity.Length), 1e-9);
        // The load +P along x at height H turns the pier clockwise (moment −P·H about the base); the spring answers +P·H.
        Near(P * H, r.Model.Units.FromSI(r.Cases[0].Reactions[0].Mz, Units.Quantity.Moment), 1e-9, "spring moment reaction");
    }
}
