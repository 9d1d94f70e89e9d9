using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.Plan.PlanJson;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Plan;

/// <summary>The modal response spectrum analysis in plan: each line's planar model under every mode, θ, and accidental
/// torsion by shifted floor masses.</summary>
public class PlanSpectrumResponseTests
{
    private static readonly double[][] Box = [[0, 0], [60, 0], [60, 40], [0, 40]];

    /// <summary>A symmetric building (kip, ft): y-lines at x = 0 and 60, x-lines at y = 0 and 40, floor weights at the centroid.</summary>
    private static BuildingPlan Symmetric(double[] elevations, double[] weights, object responseSpectrum)
    {
        var lines = new object[] { Springs("A", 0, 20, "y", weights.Select(_ => 30.0).ToArray()), Springs("B", 60, 20, "y", weights.Select(_ => 30.0).ToArray()),
            Springs("C", 30, 0, "x", weights.Select(_ => 45.0).ToArray()), Springs("D", 30, 40, "x", weights.Select(_ => 45.0).ToArray()) };
        var levels = elevations.Select((e, i) => i == 0 ? (object)new { id = "base", elevation = e } : new { id = $"L{i}", elevation = e, weight = weights[i - 1] }).ToArray();
        return Read(new Dictionary<string, object>
        {
            ["formatVersion"] = 1, ["title"] = "symmetric", ["units"] = new { force = "kip", length = "ft" },
            ["materials"] = new object[] { new { id = "C", E = 580464.0, nu = 0.2 } },
            ["plan"] = new Dictionary<string, object>
            {
                ["outline"] = Box, ["accidentalEccentricity"] = 0.05, ["levels"] = levels, ["lines"] = lines,
                ["seismic"] = new { loadCase = "E", structureType = "other", spectrum = new { SDS = 1.0, SD1 = 0.6, R = 5.0, Ie = 1.0, TL = 8.0 }, responseSpectrum },
            },
        });
    }

    /// <summary>
    /// Derived: on a symmetric plan, shifting every floor's mass by +e and by −e across the motion gives mirror images:
    /// the combined floor rotations are equal, and the rotation of the mode with most of the mass along the motion is
    /// equal and opposite (its Γ·φ does not depend on the sign chosen for φ). Without a shift the x modes do not turn.
    /// </summary>
    [Fact]
    public void ShiftedMassesOnASymmetricPlanGiveEqualAndOppositeRotations()
    {
        var plan = Symmetric([0, 12, 24], [300, 200], new { Cd = 4.0, accidentalTorsion = "shifted-masses" });
        var (_, s) = PlanSeismic.Run(plan);
        var sp = s!.Spectrum!;
        Assert.Contains("shifting every floor's centre of mass", sp.TorsionMethod);
        foreach (var d in sp.Directions)
        {
            Assert.Equal(2, d.Variants.Count);
            var (plus, minus) = (d.Variants.Single(v => v.Label == "+e"), d.Variants.Single(v => v.Label == "-e"));
            Near(-plus.Shift, minus.Shift, 1e-12, "±e");
            Near(0.05 * (d.Direction == "x" ? 40 : 60) * Ft, plus.Shift, 1e-12, "e = 5 % of the dimension across the motion");
            for (int l = 0; l < plan.FloorCount; l++)
            {
                Assert.True(Math.Abs(plus.DominantModeRotation[l]) > 0, "the shifted mass couples the motion with a turn");
                Near(-plus.DominantModeRotation[l], minus.DominantModeRotation[l], 1e-7, $"{d.Direction} floor {l + 1}: opposite rotations");
                Near(plus.FloorRotation[l], minus.FloorRotation[l], 1e-7, $"{d.Direction} floor {l + 1}: equal combined rotations");
            }
            Near(plus.Scaling.BaseShearModal, minus.Scaling.BaseShearModal, 1e-9, "mirror images have one base shear");
            Assert.All(d.Lines, x => Assert.Equal(0, x.Torsion));
            Assert.All(d.Stories, x => Assert.Equal(0, x.TorsionDrift));
            Assert.True(d.EquilibriumError < 1e-9);
        }
        var plain = PlanSeismic.Run(Symmetric([0, 12, 24], [300, 200], new { Cd = 4.0 })).Seismic!.Spectrum!;
        Assert.Contains("static accidental torsion", plain.TorsionMethod);
        Assert.All(plain.Directions.SelectMany(d => d.Variants).SelectMany(v => v.DominantModeRotation), r => Assert.True(Math.Abs(r) < 1e-12));
    }

    /// <summary>
    /// Derived: one story, symmetric plan: along x only the x mode takes part (the others have Γ_x = 0), so each x-line's
    /// planar model, recovered under that mode's level force, has base reactions whose combined sum is the line's modal
    /// story shear (one mode, one sign), half the modal base shear; the overturning moment of a line is its shear times
    /// the story height. θ is P_x·Δ·I_e/(V_x·h·C_d) with P_x the floor weight.
    /// </summary>
    [Fact]
    public void EachLinesPlanarModelUnderEachModeBalancesItsShare()
    {
        var plan = Symmetric([0, 12], [400], new { Cd = 4.0 });
        var (_, s) = PlanSeismic.Run(plan);
        var x = s!.Spectrum!.Directions.Single(d => d.Direction == "x");
        foreach (var id in new[] { "C", "D" })
        {
            var line = x.Lines.Single(l => l.Line == id && l.Story == 1);
            Near(0.5 * x.Stories[0].ModalShear, line.Modal, 1e-9, "half the base shear");
            var lf = x.LineForces.Single(l => l.Line == id);
            Near(line.Modal, lf.ModalReactions.Sum(r => r.Fx), 1e-9, $"line {id}: Σ combined reactions = its modal shear");
            Near(line.Modal * 12 * Ft, line.Overturning, 1e-9, "overturning = shear × h");
            Near(x.Scaling.ForceFactor * line.Modal + line.Torsion, line.Design, 1e-12, "design = scaled + torsion");
        }
        var st = x.Stories[0];
        Near(400 * KipN, st.Px, 1e-12, "P_x");
        Near(st.Px * st.DesignDrift * 1.0 / (st.ScaledShear * st.Height * 4.0), st.Theta, 1e-12, "θ, eq. 12.8-16");
    }

    [Fact]
    public void AnUnknownAccidentalTorsionMethodIsRefusedNamingTheKey()
    {
        var e = Assert.Throws<ModelInputException>(() => Symmetric([0, 12], [400], new { Cd = 4.0, accidentalTorsion = "rotate" }));
        Assert.Contains(e.Diagnostics, x => x.JsonPath.EndsWith("accidentalTorsion", StringComparison.Ordinal) && x.Problem.Contains("\"rotate\""));
    }
}
