using PlaneLateral.Hand;

namespace PlaneLateral.Studies.Tests;

/// <summary>Frame stories: rigid-beam and D-value hand values beside the FE story stiffness.</summary>
public class FrameStoryTests
{
    private const double E = 29000, H = 156, Span = 300, Ic = 999;

    [Fact]
    public void Flexible_beams_flag_beam_flexibility()
    {
        // Beam I = Ic/10 over a longer span: the joints rotate, so the story is far softer than Σ12EI/h³
        // (elementary beam theory; docs/hand-methods.md §6).
        var rows = Models.Compare(Models.Portal(H, Span, Ic, Ic / 10)).Rows;
        var rigid = rows.Single(r => r.Hand.Method.Name.StartsWith("Rigid-beam"));
        Models.Near(2 * 12 * E * Ic / (H * H * H), rigid.Hand.Value, 1e-12, "Σ12EI/h³");
        Assert.Equal(Verdict.HandHigher, rigid.Verdict);
        Assert.True(rigid.Ratio < 0.5, $"FE/hand {rigid.Ratio}");
        Assert.StartsWith("beam flexibility: rigid-beam assumption is too stiff", rigid.Cause);
    }

    [Fact]
    public void Very_stiff_beams_reach_the_rigid_beam_value()
    {
        var rigid = Models.Compare(Models.Portal(H, Span, Ic, Ic * 1e5)).Rows.Single(r => r.Hand.Method.Name.StartsWith("Rigid-beam"));
        Models.Near(rigid.Hand.Value, rigid.Reference.Value, 1e-3, "FE with very stiff beams against Σ12EI/h³");
        Assert.Equal(Verdict.WithinTolerance, rigid.Verdict);
        Assert.Equal("beams stiff enough for the rigid-beam assumption", rigid.Cause);
    }

    [Fact]
    public void Column_shear_deformation_enters_both_sides()
    {
        // With a column shear area the hand value is Σ12EI/(h³(1+Φ)) (Timoshenko); stiff beams again reach it.
        double asv = 6.0;
        var rigid = Models.Compare(Models.Portal(H, Span, Ic, Ic * 1e5, columnShearArea: asv)).Rows.Single(r => r.Hand.Method.Name.StartsWith("Rigid-beam"));
        double g = E / 2.6, phi = 12 * E * Ic / (g * asv * H * H);
        Models.Near(2 * 12 * E * Ic / (H * H * H * (1 + phi)), rigid.Hand.Value, 1e-12, "hand with Φ");
        Models.Near(rigid.Hand.Value, rigid.Reference.Value, 1e-3, "FE");
    }

    [Theory]
    [InlineData(0.25)]
    [InlineData(1.0)]
    [InlineData(4.0)]
    public void FE_matches_the_portal_formula_by_slope_deflection(double beta)
    {
        // Slope-deflection portal (derived; FrameStory.PortalFixedBase) is exact for a flexure-only portal with
        // axially rigid members; the FE has A = 1e6 in² and no shear area, so it must match to about 1e-4.
        double ib = beta * Ic / H * Span;
        var row = Models.Compare(Models.Portal(H, Span, Ic, ib)).Rows[0];
        Models.Near(FrameStory.PortalFixedBase(E, Ic, H, ib, Span).Stiffness, row.Reference.Value, 1e-3, $"beta {beta}");
    }

    [Fact]
    public void Pinned_base_D_value_equals_the_FE_portal()
    {
        // For a pinned single-bay portal the D-value coefficient a = 0.5k̄/(1+2k̄) equals slope-deflection exactly
        // (docs/hand-methods.md §6c), so the FE and the D-value agree.
        double ib = Ic / H * Span;
        var dv = Models.Compare(Models.Portal(H, Span, Ic, ib, bases: "pinned")).Rows.Single(r => r.Hand.Method.Name.StartsWith("D-value"));
        Models.Near(dv.Hand.Value, dv.Reference.Value, 1e-3);
        Assert.Equal(Verdict.WithinTolerance, dv.Verdict);
    }

    [Fact]
    public void Fixed_base_one_story_portal_is_stiffer_than_its_D_value_for_the_right_reason()
    {
        // β = 1: portal k = 24EI/h³·7/10 = 16.8EI/h³; D-value a = (0.5+1)/(2+1) = 0.5 per column → 12EI/h³ (derived).
        // The D-value assumes a story above sharing the beams' restraint; a one-story frame has none.
        double ib = Ic / H * Span;
        var dv = Models.Compare(Models.Portal(H, Span, Ic, ib)).Rows.Single(r => r.Hand.Method.Name.StartsWith("D-value"));
        Models.Near(12 * E * Ic / (H * H * H), dv.Hand.Value, 1e-12, "ΣD");
        Models.Near(16.8 / 12, dv.Ratio, 2e-3, "FE/D");
        Assert.Equal(Verdict.HandLower, dv.Verdict);
        Assert.Contains("no story above", dv.Cause);
    }

    [Fact]
    public void Story_stiffness_is_story_shear_over_interstory_drift_in_a_two_story_frame()
    {
        // Derived: two identical stories with very stiff beams: every story is Σ12EI/h³ whatever the pattern.
        var model = new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "S", E, nu = 0.3 } },
            sections = new[] { new { id = "C", shape = "general", A = 1e6, I = Ic }, new { id = "B", shape = "general", A = 1e6, I = Ic * 1e5 } },
            nodes = new[]
            {
                new { id = "a0", x = 0.0, y = 0.0 }, new { id = "a1", x = 0.0, y = H }, new { id = "a2", x = 0.0, y = 2 * H },
                new { id = "b0", x = Span, y = 0.0 }, new { id = "b1", x = Span, y = H }, new { id = "b2", x = Span, y = 2 * H },
            },
            members = new[]
            {
                new { id = "ca1", start = "a0", end = "a1", section = "C", material = "S" }, new { id = "ca2", start = "a1", end = "a2", section = "C", material = "S" },
                new { id = "cb1", start = "b0", end = "b1", section = "C", material = "S" }, new { id = "cb2", start = "b1", end = "b2", section = "C", material = "S" },
                new { id = "b1m", start = "a1", end = "b1", section = "B", material = "S" }, new { id = "b2m", start = "a2", end = "b2", section = "B", material = "S" },
            },
            supports = new[] { new { node = "a0", type = "fixed" }, new { node = "b0", type = "fixed" } },
            stiffnessAt = new[] { new { node = "a2", direction = "x" } },
            comparisons = new[] { new { id = "F", kind = "frame-stories", members = new[] { "ca1", "ca2", "cb1", "cb2", "b1m", "b2m" }, pattern = new[] { 1.0, 3.0 } } },
        };
        var rows = Models.Compare(model).Rows.Where(r => r.Hand.Method.Name.StartsWith("Rigid-beam")).ToList();
        Assert.Equal(["story 1 (h = 156 in)", "story 2 (h = 156 in)"], rows.Select(r => r.Subject));
        foreach (var r in rows) Models.Near(r.Hand.Value, r.Reference.Value, 1e-3, r.Subject);
    }
}
