using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Verification;

/// <summary>
/// A rigid offset modelled the usual way, as a member far stiffer than the ones it joins (common practice for an arm
/// from a column's centre line to a load or a wall face): a cantilever column with a horizontal arm at its top whose
/// axial, bending and shear stiffnesses (EA/L, 12EI/L³, G·A_s/L) are r times the column's, a vertical load at the arm's
/// end, against the closed form (the arm's own tiny flexibility included). At r = 10³ nine digits and no warning; at
/// r = 10⁶ and 10⁷ the a-priori bound and the conditioning warning naming the arm. The exact alternative, with no
/// conditioning cost, is a member's "rigidZones" (Verification/FrameTests).
/// </summary>
public class RigidOffsetTests
{
    private const double E = 2.0e8, Nu = 0.3, A = 0.01, I = 1.0e-4, As = 0.005, H = 3.5, Arm = 0.6, P = 50.0;   // kN, m

    private static object Model(double r) => new
    {
        formatVersion = 1,
        units = new { force = "kN", length = "m" },
        materials = new[] { new { id = "steel", E, nu = Nu } },
        sections = new object[]
        {
            new { id = "col", shape = "general", A, I, shearArea = As },
            // r times the column's stiffnesses, member for member: EA/L, 12EI/L³ and G·A_s/L scaled by r (derived).
            new { id = "arm", shape = "general", A = r * A * Arm / H, I = r * I * Math.Pow(Arm / H, 3), shearArea = r * As * Arm / H },
        },
        nodes = new[] { new { id = "A", x = 0.0, y = 0.0 }, new { id = "B", x = 0.0, y = H }, new { id = "C", x = Arm, y = H } },
        members = new[]
        {
            new { id = "column", start = "A", end = "B", section = "col", material = "steel" },
            new { id = "arm", start = "B", end = "C", section = "arm", material = "steel" },
        },
        supports = new[] { new { node = "A", type = "fixed" } },
        loadCases = new[] { new { id = "P", nodalLoads = new[] { new { node = "C", fy = -P } } } },
    };

    private static (double UB, double ThetaB, double VC, double ThetaC) ClosedForm(double r)
    {
        // Derived from the cantilever formulas (Gere & Timoshenko, Mechanics of Materials, table of cantilever deflections,
        // from memory: tip moment M gives θ = ML/EI and δ = ML²/(2EI); tip force F gives δ = FL³/(3EI) + FL/(G·A_s) and
        // θ = FL²/(2EI); an axial force N shortens by NL/(EA)). The column carries N = P and the moment P·a at its top; the
        // arm is a cantilever from the column top. SI: kN → N.
        double e = E * 1e3, g = e / (2 * (1 + Nu)), p = P * 1e3;
        double m = p * Arm;                                  // clockwise moment at the column top
        double thetaB = -m * H / (e * I);                    // column top rotation (clockwise, negative)
        double uB = m * H * H / (2 * e * I);                 // the column top moves toward the arm (+x)
        double vB = -p * H / (e * A);                        // column shortening
        double eIa = r * e * I * Math.Pow(Arm / H, 3), gAa = r * g * As * Arm / H;
        double vC = vB + thetaB * Arm - (p * Arm * Arm * Arm / (3 * eIa) + p * Arm / gAa);
        return (uB, thetaB, vC, thetaB - p * Arm * Arm / (2 * eIa));
    }

    private static void AssertClosedForm(AnalysisResult result, double r, double tol)
    {
        var (uB, thetaB, vC, thetaC) = ClosedForm(r);
        var c = result.Case("P");
        Assert.True(c.BackwardError < 1e-13, $"backward error {c.BackwardError}");
        Near(uB, c.Displacement(1, Dof.X), tol, "u at the column top");
        Near(thetaB, c.Displacement(1, Dof.RZ), tol, "rotation at the column top");
        Near(vC, c.Displacement(2, Dof.Y), tol, "v at the arm's end");
        Near(uB, c.Displacement(2, Dof.X), tol, "u at the arm's end (the arm carries no axial force)");
        Near(thetaC, c.Displacement(2, Dof.RZ), tol, "rotation at the arm's end");
    }

    [Fact]
    public void AnArmAThousandTimesStifferGivesTheClosedFormToNineDigitsWithoutAWarning()
    {
        var result = LinearStaticAnalysis.Run(Parse(Model(1e3)));
        AssertChecks(result);   // backward error < 1e-13 and equilibrium to 1e-9
        AssertClosedForm(result, 1e3, 1e-9);
        Assert.False(result.Conditioning!.IllConditioned, $"scaled estimate {result.Conditioning.ScaledKappa1:E2}");
    }

    [Theory]
    [InlineData(1e6)]
    [InlineData(1e7)]
    public void AnArmAMillionTimesStifferStaysWithinTheBoundAndIsWarnedOfByName(double r)
    {
        // A bending offset conditions K far worse than an axial link of the same stiffness ratio (measured: scaled
        // estimate about 3e9 at r = 1e6, against 2e6 for the link of ConditionEstimateTests), so the displacements hold
        // to the a-priori bound κ·u (first order; Higham 2002, ch. 7 and 10, from memory; factor 10 of margin), some
        // seven to eight digits, not to the 1e-9 of an exact element; and the warning says so, naming the arm.
        var result = LinearStaticAnalysis.Run(Parse(Model(r)));
        var cond = result.Conditioning!;
        AssertClosedForm(result, r, Math.Max(1e-9, 10 * cond.ScaledKappa1 * Math.Pow(2, -53)));
        Assert.True(cond.IllConditioned, $"scaled estimate {cond.ScaledKappa1:E2}");
        Assert.Contains("member \"arm\"", cond.LikelyCause);
        Assert.Contains(result.Notes, n => n.Contains("ill-conditioned") && n.Contains("member \"arm\""));
    }
}
