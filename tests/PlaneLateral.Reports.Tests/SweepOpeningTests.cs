using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The sweep with one centred window (--opening-width, --opening-height): perforated-wall method beside the panel and the equivalent frame.</summary>
[Collection("current directory")]
public class SweepOpeningTests
{
    // An invented concrete wall in kip and inch: l = 240 in, t = 8 in, E = 3600 ksi, ν = 0.2 (G = 1500 ksi).
    private static SweepSpec Spec(double from, double to, int points, SweepOpening? opening, IReadOnlyList<EndFixity>? ends = null) =>
        new SweepSpec(from, to, points, SweepSpacing.Geometric, UnitSystem.KipInch, 240, 8, 3600, 1500, "test concrete", 1.2,
            ends ?? [EndFixity.Cantilever, EndFixity.FixedFixed], 0.10) { Opening = opening };

    [Fact]
    public void A_sweep_point_equals_the_perforated_wall_comparison_of_the_same_wall()
    {
        // The wall at h/l = 1.5 (h = 360 in) with a window 0.3 l × 0.4 h centred (x = 84, y = 108, 72 × 144 in), declared
        // as a "perforated-wall" check and run through the comparison: the same hand value, the same equivalent frame and
        // the same converged panel (the comparison meshes 1 element across the narrowest strip, so the sweep's panel is
        // given the same) to round-off (common practice: same method, same geometry; the sweep forms the window from the
        // fractions in SI, the file gives it in inches, which may differ in the last bits: hence 1e-9).
        var opening = new SweepOpening(0.3, 0.4);
        var sweep = AspectSweep.Run(Spec(1, 1.5, 2, opening), [new PanelWallModel(elementsAcross: 1), new EquivalentFrameWallModel()]);
        foreach (var (ends, word) in new[] { (EndFixity.Cantilever, "cantilever"), (EndFixity.FixedFixed, "fixed-fixed") })
        {
            string json = $$"""
            {
              "formatVersion": 1,
              "units": { "force": "kip", "length": "in" },
              "materials": [ { "id": "C", "E": 3600.0, "nu": 0.2 } ],
              "sections": [ { "id": "S", "shape": "rectangle", "b": 8.0, "d": 48.0 } ],
              "nodes": [ { "id": "a", "x": 0.0, "y": 0.0 }, { "id": "b", "x": 0.0, "y": 100.0 } ],
              "members": [ { "id": "stub", "start": "a", "end": "b", "section": "S", "material": "C" } ],
              "supports": [ { "node": "a", "type": "fixed" } ],
              "stiffnessAt": [ { "node": "b", "direction": "x" } ],
              "comparisons": [ { "id": "W", "kind": "perforated-wall", "length": 240, "height": 360, "thickness": 8, "material": "C",
                                 "shearFactor": 1.2, "ends": "{{word}}",
                                 "openings": [ { "label": "window", "x": 84, "y": 108, "width": 72, "height": 144 } ] } ]
            }
            """;
            var row = ComparisonStudy.Run(ModelReader.Parse(json, "wall.json")).Rows.Single();
            var point = sweep.Points.Single(p => p.Ends == ends && Math.Abs(p.AspectRatio - 1.5) < 1e-12);
            Near(row.Hand.Value, point.Hand.Stiffness, 1e-9, $"{ends} hand stiffness");
            Near(row.Fe.Single(f => f.Model == "equivalent frame").Value, point.Fe[1].Value, 1e-9, $"{ends} equivalent frame");
            Near(row.Fe.Single(f => f.Model == "plane-stress panel").Value, point.Fe[0].Value, 1e-9, $"{ends} panel");
        }
    }

    [Fact]
    public void A_vanishing_window_tends_to_the_solid_wall()
    {
        // As the window shrinks (0.1, 0.05, 0.02 of l and h) the perforated-wall method tends to the solid pier formula
        // (the strip removed and the piers added back both vanish with the strip's height; common practice, Taly ch. 7),
        // and the continuum tends to the solid panel (removing a hole of vanishing area changes the elastic stiffness
        // less and less; Timoshenko & Goodier, Theory of Elasticity, 1970, on local disturbances, Saint-Venant): both gaps
        // fall steadily and are small at 0.02. The fixed-fixed equivalent frame tends to the solid wall too (wall members
        // above and below the band); the cantilever frame does not: its spandrel level takes the strip above the window
        // rigid over half its depth (docs/comparisons.md §3), which is why the comparison's cause rule flags a frame
        // stiffer than the solid wall.
        var solid = AspectSweep.Run(Spec(1, 2, 2, null), AspectSweep.DefaultModels());
        var gaps = new List<(double Hand, double Panel)>[2] { [], [] };
        foreach (double eps in new[] { 0.1, 0.05, 0.02 })
        {
            var r = AspectSweep.Run(Spec(1, 2, 2, new SweepOpening(eps, eps)), AspectSweep.DefaultModels(new SweepOpening(eps, eps)));
            foreach (var p in r.Points.Where(p => p.AspectRatio == 1))
            {
                var s = solid.Points.Single(q => q.Ends == p.Ends && q.AspectRatio == 1);
                Assert.True(p.Hand.Stiffness < s.Hand.Stiffness, $"{p.Ends}, {eps}: the window must soften the hand value");
                gaps[p.Ends == EndFixity.Cantilever ? 0 : 1].Add((1 - p.Hand.Stiffness / s.Hand.Stiffness, 1 - p.Fe[0].Value / s.Fe[0].Value));
                if (eps == 0.02)
                {
                    Near(s.Hand.Stiffness, p.Hand.Stiffness, 1e-3, $"{p.Ends} hand at a 2% window");
                    Near(s.Fe[0].Value, p.Fe[0].Value, 5e-3, $"{p.Ends} panel at a 2% window");
                    if (p.Ends == EndFixity.FixedFixed) Near(s.Fe[1].Value, p.Fe[1].Value, 1e-3, "fixed-fixed equivalent frame at a 2% window");
                    else Assert.True(p.Fe[1].Value > 1.1 * s.Fe[1].Value, "the cantilever frame's rigid spandrel zone keeps it stiffer than the solid wall");
                }
            }
        }
        foreach (var g in gaps)
            for (int i = 1; i < g.Count; i++)
            {
                Assert.True(g[i].Hand < g[i - 1].Hand, "hand gap to the solid wall falls as the window shrinks");
                Assert.True(g[i].Panel < g[i - 1].Panel, "panel gap to the solid wall falls as the window shrinks");
            }
    }

    [Fact]
    public void Two_runs_with_a_window_give_byte_identical_files_and_the_csv_names_the_window()
    {
        string a = TempDir("sweep-open-a"), b = TempDir("sweep-open-b");
        string[] args = ["sweep", "--from", "0.5", "--to", "2", "--points", "4", "--opening-width", "0.3", "--opening-height", "0.4"];
        var first = Run([.. args, "--out", a]);
        Assert.True(first.Code == 0, first.Err);
        Assert.Contains("a centred window 0.3 l wide and 0.4 h high", first.Out);
        Assert.Equal(0, Run([.. args, "--out", b]).Code);
        foreach (var name in new[] { "sweep.csv", "sweep-ratio.png", "sweep-shear-share.png" })
            Assert.True(File.ReadAllBytes(Path.Combine(a, name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, name))), $"{name} differs");
        string csv = File.ReadAllText(Path.Combine(a, "sweep.csv"));
        Assert.Contains("# opening: a centred window 0.3 l wide and 0.4 h high", csv);
        Assert.Contains("# hand: PerforatedWall", csv);
        Assert.Contains("# fe2: equivalent frame", csv);
        ValidPng(File.ReadAllBytes(Path.Combine(a, "sweep-ratio.png")), PlotStyle.Width, PlotStyle.Height, "sweep-ratio.png");
    }

    [Theory]
    [InlineData("0", "0.4", "opening width fraction 0 is outside (0, 1)")]
    [InlineData("1", "0.4", "opening width fraction 1 is outside (0, 1)")]
    [InlineData("0.3", "1.2", "opening height fraction 1.2 is outside (0, 1)")]
    [InlineData("0.3", "-0.1", "opening height fraction -0.1 is outside (0, 1)")]
    [InlineData("0.999", "0.4", "cannot be meshed")]
    [InlineData("0.9999999", "0.4", "thinner than a millionth")]
    public void Bad_opening_fractions_are_refused_with_nothing_written(string width, string height, string message)
    {
        string dir = TempDir("sweep-open-bad");
        var (code, _, err) = Run("sweep", "--points", "3", "--opening-width", width, "--opening-height", height, "--out", dir);
        Assert.Equal(1, code);
        Assert.Contains(message, err);
        Assert.Contains("Fix:", err);
        Assert.Contains("Nothing was written", err);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void One_opening_fraction_without_the_other_is_refused()
    {
        string dir = TempDir("sweep-open-half");
        var (code, _, err) = Run("sweep", "--points", "3", "--opening-width", "0.3", "--out", dir);
        Assert.Equal(1, code);
        Assert.Contains("--opening-width is given without --opening-height", err);
        Assert.False(Directory.Exists(dir));
    }
}
