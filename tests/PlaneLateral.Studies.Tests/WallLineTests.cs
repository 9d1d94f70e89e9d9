using PlaneLateral.Hand;

namespace PlaneLateral.Studies.Tests;

/// <summary>
/// Wall lines: the hand pier formulas beside the Timoshenko members. Source: Timoshenko beam theory — the exact
/// two-node element (Przemieniecki 1968, §5.6) reproduces Δ = Ph³/(cEI) + Ph/(G·A_s) exactly for end loads, so hand and
/// FE must agree to rounding when they use the same E, G, I and shear area A_s = A/f.
/// </summary>
public class WallLineTests
{
    [Theory]
    [InlineData(468.0, 240.0, 12.0, 1)]    // slender, one member
    [InlineData(468.0, 240.0, 12.0, 3)]    // the same wall in three stories
    [InlineData(120.0, 300.0, 8.0, 1)]     // squat
    [InlineData(156.0, 96.0, 10.0, 4)]
    public void Hand_and_FE_agree_to_1e9_with_the_same_shear_area(double h, double l, double t, int segments)
    {
        var report = Models.Compare(Models.WallLine(h, l, t, segments));
        Assert.Equal(2, report.Rows.Count);
        foreach (var row in report.Rows)
        {
            Models.Near(row.Hand.Value, Models.Line(row).Value, 1e-9, $"{row.Subject} stiffness");
            Models.Near(row.Hand.FlexuralShare!.Value, Models.Line(row).FlexuralShare!.Value, 1e-9, $"{row.Subject} flexural share");
            Models.Near(row.Hand.ShearShare!.Value, Models.Line(row).ShearShare!.Value, 1e-9, $"{row.Subject} shear share");
            Assert.Equal(Verdict.WithinTolerance, Models.LineVerdict(row));
            Models.Near(h / l, row.AspectRatio!.Value, 1e-12, "h/l");
        }
    }

    [Fact]
    public void Agreement_holds_with_Cowper_shear_area()
    {
        // Cowper's κ gives a form factor other than 1.2; the check takes f = A/A_s from the member, so the two still agree.
        var report = Models.Compare(Models.WallLine(200, 160, 10, 2, shearFactor: "cowper"));
        foreach (var row in report.Rows) Models.Near(row.Hand.Value, Models.Line(row).Value, 1e-9, row.Subject);
    }

    [Fact]
    public void Hand_value_is_the_published_pier_formula_with_the_members_properties()
    {
        // Common practice: cantilever Δ = h³/(3EI) + f·h/(AG) for a unit force; E = 4031 ksi, ν = 0.2, G = E/2.4, f = 1.2.
        double h = 156, l = 240, t = 12, e = 4031, g = e / 2.4, a = l * t, i = t * l * l * l / 12;
        var row = Models.Compare(Models.WallLine(h, l, t, 1, ends: ["cantilever"])).Rows.Single();
        Models.Near(1 / (h * h * h / (3 * e * i) + 1.2 * h / (a * g)), row.Hand.Value, 1e-12, "cantilever stiffness");
        Assert.StartsWith("Cantilever pier", row.Hand.Method.Name);
        Assert.Contains("plane sections remain plane", row.Hand.Method.Assumptions);
    }

    [Fact]
    public void Squat_wall_is_flagged_even_when_the_numbers_agree()
    {
        // h/l = 0.4 < 0.5: both sides rest on plane sections, so agreement says nothing about a squat wall (common practice).
        var report = Models.Compare(Models.WallLine(96, 240, 12, 1));
        foreach (var row in report.Rows)
        {
            Assert.Equal(Verdict.WithinTolerance, Models.LineVerdict(row));
            Assert.Contains("squat", row.Cause);
            Assert.Contains("panel model", row.Cause);
        }
        var tall = Models.Compare(Models.WallLine(240, 240, 12, 1));
        Assert.All(tall.Rows, r => Assert.DoesNotContain("squat", r.Cause));
    }

    [Fact]
    public void Fixed_fixed_is_stiffer_than_cantilever_and_more_shear_dominated()
    {
        // Derived: the flexural term drops by 4 (h³/3EI → h³/12EI) and the shear term is unchanged.
        var rows = Models.Compare(Models.WallLine(300, 200, 10, 2)).Rows;
        var cant = rows.Single(r => r.Subject == "cantilever");
        var ff = rows.Single(r => r.Subject == "fixed-fixed");
        Assert.True(Models.Line(ff).Value > Models.Line(cant).Value);
        Assert.True(Models.Line(ff).ShearShare > Models.Line(cant).ShearShare);
        double flexC = Models.Line(cant).FlexuralShare!.Value / Models.Line(cant).Value, flexF = Models.Line(ff).FlexuralShare!.Value / Models.Line(ff).Value;
        Models.Near(4.0, flexC / flexF, 1e-9, "ratio of flexural deflections");
    }
}
