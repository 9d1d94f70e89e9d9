using PlaneLateral.Analysis;
using PlaneLateral.Cli;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies.Tests;

/// <summary>
/// The "panel-wall" check: a panel declared under "panels" beside the perforated-wall hand method and the Timoshenko
/// line model (equivalent frame), with the panel's own converged stiffness.
/// </summary>
public class PanelWallTests
{
    private static string SquatWallPath => Path.Combine(AppContext.BaseDirectory, "models", "panels", "squat-wall.json");

    /// <summary>A model (kN, m) with one panel and one panel-wall check naming it; the panel's keys are given by the caller.</summary>
    private static object WithPanel(object panel, string panelRef = "P", double? shearFactor = null) => new
    {
        formatVersion = 1,
        units = new { force = "kN", length = "m" },
        materials = new[] { new { id = "C", E = 25e6, nu = 0.2 } },
        sections = Array.Empty<object>(),
        panels = new[] { panel },
        comparisons = new object[] { shearFactor is null ? new { id = "K", kind = "panel-wall", panel = panelRef } : new { id = "K", kind = "panel-wall", panel = panelRef, shearFactor } },
    };

    private static object Solid(double length, double height, int refinements = 3, object? floorLevels = null, bool floorTies = true) => new
    {
        id = "P", length, height, thickness = 0.2, material = "C",
        floorLevels = floorLevels ?? Array.Empty<double>(), floorTies,
        mesh = new { element = "quad9", elementsAcrossNarrowest = 2, maxNodes = 40000, refinements },
    };

    private static IReadOnlyList<ModelDiagnostic> Problems(object model) =>
        Assert.Throws<ModelInputException>(() => Models.Parse(model)).Diagnostics;

    [Fact]
    public void Squat_wall_row_sets_the_hand_method_line_model_and_converged_panel_side_by_side()
    {
        var model = ModelReader.ReadFile(SquatWallPath);
        var panel = Assert.Single(model.Panels);
        Assert.Equal(0.5, panel.Height / panel.Length, 12);                           // the issue's h/l = 0.5
        Assert.Contains(panel.Openings, o => o.Bottom == 0);                          // a door
        Assert.Contains(panel.Openings, o => o.Bottom > 0);                           // a window
        var row = Assert.Single(ComparisonStudy.Run(model).Rows);
        Assert.Equal("panel-wall", row.Kind);
        // One reference per row: the converged panel (error well within a quarter of the tolerance) comes first, the
        // line model beside it (docs/comparisons.md, "The reference").
        Assert.Equal(PanelEstimate.ModelName, row.Reference.Model);
        Assert.Equal(PanelWallStudy.LineModelName, row.Fe[1].Model);
        Assert.StartsWith("converged plane-stress panel", row.ReferenceBasis);
        var fe = row.Fe.Single(f => f.Model == PanelEstimate.ModelName);
        Assert.Equal(fe.EstimatedError, own0().Convergence!.EstimatedError);
        Assert.Equal(ComparisonRow.Judge(fe.Value / row.Hand.Value, row.Tolerance), row.Verdict);
        PanelResult own0() => Assert.Single(LinearStaticAnalysis.Run(model).Panels);

        // The row's panel number is the panel analysed on its own: the same stiffness to round-off (common practice).
        var own = Assert.Single(LinearStaticAnalysis.Run(model).Panels);
        var cv = own.Convergence!;
        Assert.True(double.IsFinite(cv.Extrapolated), cv.Note);
        Models.Near(model.Units.FromSI(cv.Extrapolated, Quantity.TranslationalStiffness), fe.Value, 1e-12, "row against the panel's own analysis");

        // The issue's done-when: a converged stiffness with an error estimate below 1% (Richardson extrapolation;
        // Roache, Verification and Validation in Computational Science and Engineering, 1998, ch. 5).
        Assert.True(cv.EstimatedError < 0.01, $"estimated discretisation error {cv.EstimatedError:P3}");
        Assert.Contains("estimated discretisation error", fe.Description);
        // Removing material cannot stiffen an elastic body (common practice): the panel with its openings is softer
        // than the same solid wall by the cantilever formula (Timoshenko & Goodier, Theory of Elasticity, 1970).
        var m = model.Materials.Single();
        double solid = 1 / (Math.Pow(panel.Height, 3) / (3 * m.E * panel.Thickness * Math.Pow(panel.Length, 3) / 12) + 1.2 * panel.Height / (m.G * panel.Thickness * panel.Length));
        Assert.True(cv.Extrapolated < solid, $"panel {cv.Extrapolated} against the solid wall {solid}");
        Assert.Contains("converged plane-stress panel", row.Cause);
    }

    /// <summary>
    /// A solid slender panel against the Timoshenko cantilever δ = P h³/(3EI) + P h/(κ G A), κ = 5/6 (Timoshenko &amp;
    /// Goodier, Theory of Elasticity, 3rd ed., 1970, §21, section number from memory). The same section of Timoshenko &amp; Goodier shows that beam
    /// theory cannot say how a clamped end holds the section: fixing the horizontal element of the axis at the base
    /// gives no shear term, fixing the vertical element gives P h/(κ G A) with κ = 2/3. A fully clamped continuum lies
    /// between the two (derived there); within that bracket it stays close to κ = 5/6, the gap being the base's end
    /// effect, which by Saint-Venant's principle is confined to about one wall length above the base, so its share falls
    /// as l/h.
    /// </summary>
    [Theory]
    [InlineData(4.0)]
    [InlineData(8.0)]
    public void Solid_slender_panel_agrees_with_the_Timoshenko_cantilever(double aspect)
    {
        var model = Models.Parse(WithPanel(Solid(1.0, aspect, refinements: 4)));
        var row = Assert.Single(ComparisonStudy.Run(model).Rows);
        var own = Assert.Single(LinearStaticAnalysis.Run(model).Panels).Convergence!;
        double k = own.Extrapolated, err = own.EstimatedError;
        Assert.True(err < 1e-3, $"estimated discretisation error {err:P3}");

        var mat = model.Materials.Single();
        double h = aspect, l = 1.0, t = 0.2, A = l * t, I = t * l * l * l / 12;
        double flex = h * h * h / (3 * mat.E * I), shear = h / (mat.G * A);
        double timoshenko = 1 / (flex + shear / (5.0 / 6));
        // Bracket of the two end fixings (no shear term; κ = 2/3), widened by the estimated discretisation error.
        Assert.InRange(k, 1 / (flex + 1.5 * shear) * (1 - err), 1 / flex * (1 + err));
        // Close to κ = 5/6: the end effect stays within 0.5% for h/l ≥ 4 (common practice for a clamped-base
        // cantilever of ν = 0.2) plus the estimated discretisation error.
        double gap = Math.Abs(k / timoshenko - 1);
        Assert.True(gap <= 0.005 + err, $"h/l = {aspect}: panel {k:G6} N/m against Timoshenko {timoshenko:G6} N/m, gap {gap:P3}, error estimate {err:P4}");
        // The hand cantilever formula (shear factor 1.2 = 1/κ) and the single Timoshenko line member are the same
        // closed form: their row numbers match it (derived).
        Models.Near(model.Units.FromSI(timoshenko, Quantity.TranslationalStiffness), row.Hand.Value, 1e-9, "hand");
        Models.Near(model.Units.FromSI(timoshenko, Quantity.TranslationalStiffness), row.Estimate(PanelWallStudy.LineModelName)!.Value, 1e-9, "line model");
        Assert.Equal(Verdict.WithinTolerance, ComparisonRow.Judge(row.Fe.Single(f => f.Model == PanelEstimate.ModelName).Value / row.Hand.Value, row.Tolerance));
    }

    [Fact]
    public void The_end_effect_shrinks_as_the_wall_gets_slender()
    {
        // Saint-Venant's principle (common practice): the base's end effect is local, so the gap to
        // the Timoshenko formula at h/l = 8 is smaller than at h/l = 4 (about half, as l/h; asserted: smaller by a quarter).
        double Gap(double aspect)
        {
            var model = Models.Parse(WithPanel(Solid(1.0, aspect, refinements: 4)));
            var mat = model.Materials.Single();
            double k = LinearStaticAnalysis.Run(model).Panels[0].Convergence!.Extrapolated;
            double I = 0.2 / 12, A = 0.2;
            return Math.Abs(k * (aspect * aspect * aspect / (3 * mat.E * I) + 1.2 * aspect / (mat.G * A)) - 1);
        }
        double g4 = Gap(4), g8 = Gap(8);
        Assert.True(g8 < 0.75 * g4, $"gap at h/l = 8: {g8:P3}; at h/l = 4: {g4:P3}");
    }

    [Fact]
    public void Unknown_panel_is_refused_with_a_suggestion()
    {
        var d = Assert.Single(Problems(WithPanel(Solid(4, 2), panelRef: "p")));
        Assert.Equal("$.comparisons[0].panel", d.JsonPath);
        Assert.Contains("unknown panel \"p\"", d.Problem);
        Assert.Contains("\"P\"", d.Fix);
    }

    [Fact]
    public void Panel_with_floor_levels_is_refused()
    {
        var d = Assert.Single(Problems(WithPanel(Solid(4, 6, floorLevels: new[] { 3.0 }))));
        Assert.Equal("$.comparisons[0].panel", d.JsonPath);
        Assert.Contains("floor levels", d.Problem);
        Assert.Contains("floorLevels", d.Fix);
    }

    [Fact]
    public void Panel_without_floor_ties_is_refused()
    {
        var d = Assert.Single(Problems(WithPanel(Solid(4, 2, floorTies: false))));
        Assert.Contains("\"floorTies\": false", d.Problem);
    }

    [Fact]
    public void Guided_panel_is_refused_because_the_check_is_a_cantilever()
    {
        var d = Assert.Single(Problems(WithPanel(new
        {
            id = "P", length = 4.0, height = 2.0, thickness = 0.2, material = "C", top = "guided",
            mesh = new { element = "quad9", elementsAcrossNarrowest = 2, maxNodes = 40000, refinements = 3 },
        })));
        Assert.Equal("$.comparisons[0].panel", d.JsonPath);
        Assert.Contains("\"top\": \"guided\"", d.Problem);
        Assert.Contains("fixed-fixed", d.Fix);
    }

    [Fact]
    public void Panel_with_fewer_than_three_meshes_is_refused()
    {
        var d = Assert.Single(Problems(WithPanel(Solid(4, 2, refinements: 2))));
        Assert.Contains("three or more nested meshes", d.Problem);
        Assert.Contains("\"refinements\": 3", d.Fix);
    }

    [Fact]
    public void Shear_factor_below_one_is_refused()
    {
        var d = Assert.Single(Problems(WithPanel(Solid(4, 2), shearFactor: 0.5)));
        Assert.Equal("$.comparisons[0].shearFactor", d.JsonPath);
        Assert.Contains("below 1", d.Problem);
    }

    [Fact]
    public void A_panel_that_failed_to_read_is_reported_once()
    {
        var panel = new { id = "P", length = 4.0, height = 2.0, thickness = 0.2, material = "nope" };
        var ds = Problems(WithPanel(panel));
        Assert.Contains(ds, d => d.Problem.Contains("unknown material"));
        Assert.DoesNotContain(ds, d => d.Problem.Contains("unknown panel"));
    }

    [Fact]
    public void Compare_command_prints_the_panel_beside_hand_and_line_model()
    {
        var o = new StringWriter();
        var e = new StringWriter();
        string dir = Directory.CreateTempSubdirectory("planelateral-panelwall-").FullName;
        try
        {
            int code = CliApp.Run(["compare", SquatWallPath, "--out", dir], o, e);
            Assert.True(code == 0, e.ToString());
            string text = o.ToString();
            Assert.Matches(@"reference\s+FE\s+model", text);   // the column and its title, wrapped to 100 columns
            Assert.Contains("reference: converged plane-stress panel", text);
            Assert.Contains("also: Timoshenko line model (equivalent frame)", text);
            Assert.Contains("panel-wall", File.ReadAllText(Path.Combine(dir, "comparisons.csv")));
            Assert.Contains("Timoshenko line model (equivalent frame)", File.ReadAllText(Path.Combine(dir, "comparisons.json")));
        }
        finally { Directory.Delete(dir, true); }
    }
}
