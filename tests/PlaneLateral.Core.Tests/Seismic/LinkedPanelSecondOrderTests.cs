using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Tests.Panels;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>
/// The second-order (P-delta) check beside a wall panel linked to the frame: the panel's condensed stiffness is in K,
/// the gravity the panel carries (loads through its links and its own story forces) is in the story's P_x and in the
/// story P-Δ term. On a one-story model whose only lateral unknown that K_G touches is the linked top node's x, the
/// second-order drift is exactly the first-order drift over 1 − θ (derived below).
/// </summary>
public class LinkedPanelSecondOrderTests
{
    private const double L = 1.0, H = 3.0;          // m: a one-story wall
    private const double P1 = 6000.0, P2 = 2000.0;  // kN: gravity through the link and on the wall's own level at 2 m
    private const double V = 500.0;                 // kN: the given base shear

    private static JObject Model()
    {
        var o = ToJObject(PanelLinkTests.SlenderWall(L, H, 1.0));
        o["loadCases"] = JArray.FromObject(new object[]
        {
            new { id = "G", nodalLoads = new[] { new { node = "T", fy = -P1 } } }
        });
        var panel = (JObject)((JArray)o["panels"]!)[0];
        panel["floorLevels"] = new JArray(2.0);
        panel["storyForces"] = JArray.FromObject(new[] { new { @case = "G", level = 2.0, fx = 0.0, fy = -P2, path = "spread" } });
        // A pin-ended strut from a held base node B up to T (a leaning column: axial force only, no lateral stiffness),
        // so that the base level has a node; it shares the gravity P1 with the wall.
        ((JArray)o["nodes"]!).Add(JObject.FromObject(new { id = "B", x = L / 2, y = 0.0 }));
        o["members"] = JArray.FromObject(new[] { new { id = "strut", start = "B", end = "T", section = "COL", material = "C", kind = "brace" } });
        o["supports"] = JArray.FromObject(new[] { new { node = "B", type = "fixed" } });
        o["levels"] = JArray.FromObject(new[] { new { id = "L0", elevation = 0.0, diaphragm = "none" }, new { id = "L1", elevation = H, diaphragm = "rigid" } });
        o["seismic"] = JObject.FromObject(new
        {
            loadCase = "ELF",
            weights = new[] { new { level = "L1", weight = 4000.0 } },
            baseShear = V,
            secondOrder = new { gravity = "G", Cd = 4.0, Ie = 1.25 },
        });
        return o;
    }

    [Fact]
    public void TheSecondOrderCheckBesideALinkedPanelIsAcceptedAndAmplifiesByOneOverOneMinusTheta()
    {
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(Model().ToString(), "linked-pdelta.json"));
        var s = SeismicResult.Of(r)!;
        var row = Assert.Single(s.Stability);
        var u = r.Model.Units;
        double kN = u.ToSI(1.0, Units.Quantity.Force);
        // Statics (derived): the strut and the wall together carry P1 and the wall's own P2 (at 2 m, above the story's cut
        // at 1.5 m) across the cut, however the strut and the wall share P1.
        Near((P1 + P2) * kN, row.Px, 1e-9, "P_x = P1 + P2");
        double strut = -r.Cases[0].MemberForces[0].N2;
        Assert.True(strut > 0.01 * P1 * kN && strut < 0.99 * P1 * kN, $"the strut and the wall share P1 (strut {strut / kN} kN)");
        Near(V * kN, row.Vx, 1e-9, "V_x = V");
        // θ = P_x·Δ·I_e/(V_x·h·C_d) with Δ = C_d·δ_e/I_e is P_x·δ_e/(V_x·h) (derived).
        Near(row.Px * row.ElasticDrift / (row.Vx * H), row.Theta, 1e-9, "θ = P·δ_e/(V·h)");
        // Derived (Sherman–Morrison): K_G = −(P/h)·e·eᵀ on the top node's x unknown e (the strut's string term N/h plus the
        // wall's story term P_p/h, N + P_p = P; the base node is held), so f₂ = eᵀ(K − (P/h)eeᵀ)⁻¹e = f/(1 − (P/h)·f) with f = eᵀK⁻¹e = δ_e/V; and (P/h)·f = θ. Hence the
        // second-order drift is δ_e/(1 − θ) exactly: the FE ratio equals the estimate 1/(1 − θ).
        Assert.True(row.Theta > 0.01, $"a θ large enough to see: {row.Theta}");
        Near(row.ElasticDrift / (1 - row.Theta), row.SecondOrderDrift, 1e-8, "δ₂ = δ_e/(1 − θ)");
        Near(row.Estimate, row.Ratio, 1e-8, "FE amplification = 1/(1 − θ)");
        // Derived: det(K − λ(P/h)eeᵀ) = 0 at λ·(P/h)·f = 1, so the gravity load factor to buckling is 1/θ.
        Near(1 / row.Theta, s.CriticalLoadFactor, 1e-6, "critical load factor = 1/θ");
    }

    [Fact]
    public void TheFrameAloneWouldMissTheWallsGravity()
    {
        // Without its own level load the wall carries P1 only: P_x follows the loads it is given (statics, derived).
        var o = Model();
        ((JObject)((JArray)o["panels"]!)[0])["storyForces"] = new JArray();
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(o.ToString(), "linked-pdelta.json"));
        var row = Assert.Single(SeismicResult.Of(r)!.Stability);
        Near(P1 * r.Model.Units.ToSI(1.0, Units.Quantity.Force), row.Px, 1e-9, "P_x = P1");
    }
}
