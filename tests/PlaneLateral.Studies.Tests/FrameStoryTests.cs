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

    [Fact]
    public void Pinned_base_rigid_beam_row_uses_the_cantilever_columns()
    {
        // Derived (slope-deflection; REFERENCES.md "Portal frames"): a pinned-base portal with a rigid beam has
        // k = 2 × 3EI/h³ = 6EI/h³, a quarter of the fixed-base 24EI/h³. The FE with very stiff beams must reach it.
        var rows = Models.Compare(Models.Portal(H, Span, Ic, Ic * 1e5, bases: "pinned")).Rows;
        var rigid = rows.Single(r => r.Hand.Method.Name.StartsWith("Rigid-beam"));
        Models.Near(6 * E * Ic / (H * H * H), rigid.Hand.Value, 1e-12, "6EI/h³");
        Assert.Contains("pinned-base", rigid.Hand.Method.Name);
        Models.Near(rigid.Hand.Value, rigid.Reference.Value, 1e-3, "FE with very stiff beams against 6EI/h³");
        Assert.Equal(Verdict.WithinTolerance, rigid.Verdict);
    }

    [Theory]
    [InlineData("pinned", 0.25)]
    [InlineData("pinned", 1.0)]
    [InlineData("pinned", 4.0)]
    [InlineData("fixed", 0.5)]
    [InlineData("fixed", 2.0)]
    public void Portal_row_is_the_slope_deflection_closed_form_and_matches_the_FE(string bases, double beta)
    {
        // Slope-deflection, derived (REFERENCES.md "Portal frames"; Hibbeler, Structural Analysis, slope-deflection
        // chapter): pinned k = (12EI_c/h³)·β/(2β+1); fixed k = (24EI_c/h³)(1+6β)/(4+6β); β = (I_b/L)/(I_c/h).
        // The FE has no shear area and A = 1e6 in² (axial deformation negligible), so it must agree to about 1e-4.
        double ib = beta * Ic / H * Span;
        var rows = Models.Compare(Models.Portal(H, Span, Ic, ib, bases: bases)).Rows;
        var portal = rows.Single(r => r.Hand.Method.Name.StartsWith("Single-bay portal"));
        double k0 = E * Ic / (H * H * H);
        double closed = bases == "pinned" ? 12 * k0 * beta / (2 * beta + 1) : 24 * k0 * (1 + 6 * beta) / (4 + 6 * beta);
        Models.Near(closed, portal.Hand.Value, 1e-12, "closed form");
        Models.Near(closed, portal.Reference.Value, 1e-3, "FE");
        Assert.Equal(Verdict.WithinTolerance, portal.Verdict);
        Assert.Contains(bases, portal.Hand.Method.Name);
    }

    [Fact]
    public void Causes_name_only_the_effects_the_members_have()
    {
        // Common practice: members with no shear area have no shear deformation, so no cause may blame it. With the
        // columns' area small (axially soft) a rigid-beam gap left after the beams are made rigid is axial shortening.
        var rows = Models.Compare(Models.Portal(H, Span, Ic, Ic / 10, bases: "pinned")).Rows;
        Assert.All(rows, r => Assert.DoesNotContain("shear deformation", r.Cause));
        Assert.All(rows, r => Assert.DoesNotContain("shear and", r.Cause));
        var soft = Models.Compare(Models.Portal(H, Span, Ic, Ic * 1e5, bases: "fixed", area: 0.05)).Rows
            .Single(r => r.Hand.Method.Name.StartsWith("Rigid-beam"));
        Assert.Equal(Verdict.HandHigher, soft.Verdict);
        Assert.StartsWith("column axial shortening under overturning", soft.Cause);
        Assert.DoesNotContain("shear", soft.Cause);
        var sheared = Models.Compare(Models.Portal(H, Span, Ic, Ic * 1e5, columnShearArea: 0.05)).Rows
            .Single(r => r.Hand.Method.Name.StartsWith("Single-bay portal"));
        Assert.Contains("column shear deformation", sheared.Cause);
    }

    [Fact]
    public void A_column_released_at_its_fixed_base_is_taken_as_pinned()
    {
        // Derived: a moment release at the column's lower end lets it rotate there whatever the support holds, so the
        // rigid-beam story is 2 × 3EI/h³ = 6EI/h³ (REFERENCES.md "Portal frames"), and the FE with very stiff beams reaches it.
        var model = new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "STEEL", E, nu = 0.3 } },
            sections = new[] { new { id = "COL", shape = "general", A = 1e6, I = Ic }, new { id = "BEAM", shape = "general", A = 1e6, I = Ic * 1e5 } },
            nodes = new[] { new { id = "A0", x = 0.0, y = 0.0 }, new { id = "A1", x = 0.0, y = H }, new { id = "B0", x = Span, y = 0.0 }, new { id = "B1", x = Span, y = H } },
            members = new object[]
            {
                new { id = "CA", start = "A0", end = "A1", section = "COL", material = "STEEL", momentReleases = new[] { "start" } },
                new { id = "CB", start = "B0", end = "B1", section = "COL", material = "STEEL", momentReleases = new[] { "start" } },
                new { id = "BM", start = "A1", end = "B1", section = "BEAM", material = "STEEL" },
            },
            supports = new[] { new { node = "A0", type = "fixed" }, new { node = "B0", type = "fixed" } },
            stiffnessAt = new[] { new { node = "A1", direction = "x" } },
            comparisons = new[] { new { id = "P", kind = "frame-stories", members = new[] { "CA", "CB", "BM" } } },
        };
        var rigid = Models.Compare(model).Rows.Single(r => r.Hand.Method.Name.StartsWith("Rigid-beam"));
        Models.Near(6 * E * Ic / (H * H * H), rigid.Hand.Value, 1e-12, "6EI/h³");
        Models.Near(rigid.Hand.Value, rigid.Reference.Value, 1e-3, "FE");
    }
}
