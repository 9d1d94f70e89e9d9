using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The converged plane-stress panel in the aspect-ratio sweep, and where each hand formula departs from it.</summary>
[Collection("current directory")]
public class SweepPanelTests
{
    // An invented concrete wall in kip and inch: l = 240 in, t = 8 in, E = 3600 ksi, ν = 0.2 (G = 1500 ksi, E/G = 2.4).
    private static SweepSpec Spec(double from, double to, int points, SweepSpacing spacing = SweepSpacing.Geometric,
        IReadOnlyList<EndFixity>? ends = null, double tol = 0.10, double g = 1500) =>
        new(from, to, points, spacing, UnitSystem.KipInch, 240, 8, 3600, g, "test concrete", 1.2,
            ends ?? [EndFixity.Cantilever, EndFixity.FixedFixed], tol);

    [Fact]
    public void A_sweep_point_equals_the_same_panel_solved_from_a_model_file()
    {
        // The wall at h/l = 1.5 (h = 360 in) as a "panels" entry with the sweep's mesh settings (9-node, 2 across the
        // shorter side, 3 nested meshes), read by ModelReader and solved by LinearStaticAnalysis: the same extrapolated
        // stiffness to round-off (derived: same panel, same meshes, same solver; the sweep forms h = (h/l)·l and
        // ν = E/(2G) − 1 in SI, the file gives h and ν directly, which may differ in the last bit: hence 1e-9).
        var sweep = AspectSweep.Run(Spec(1, 2.25, 3), [new PanelWallModel()]);
        foreach (var (ends, top) in new[] { (EndFixity.Cantilever, "free"), (EndFixity.FixedFixed, "guided") })
        {
            string json = $$"""
            {
              "formatVersion": 1,
              "units": { "force": "kip", "length": "in" },
              "materials": [ { "id": "C", "E": 3600.0, "nu": 0.2 } ],
              "sections": [],
              "loadCases": [ { "id": "unit" } ],
              "panels": [ { "id": "W", "length": 240, "height": 360, "thickness": 8, "material": "C", "top": "{{top}}",
                            "mesh": { "element": "quad9", "elementsAcrossNarrowest": 2, "maxNodes": 40000, "refinements": 3 } } ]
            }
            """;
            var single = LinearStaticAnalysis.Run(ModelReader.Parse(json, "panel.json")).Panels.Single();
            var point = sweep.Points.Single(p => p.Ends == ends && Math.Abs(p.AspectRatio - 1.5) < 1e-12);
            double kSingle = UnitSystem.KipInch.FromSI(single.Convergence!.Extrapolated, Quantity.TranslationalStiffness);
            Near(kSingle, point.Fe[0].Value, 1e-9, $"{ends} panel stiffness");
            Near(single.Convergence.EstimatedError, point.FeErrors[0]!.Value, 1e-6, $"{ends} estimated error");
        }
    }

    [Fact]
    public void The_panel_over_the_pier_formula_tends_to_one_as_the_wall_gets_slender()
    {
        // Plane-stress elasticity tends to beam theory with Timoshenko's shear term as the wall gets slender: the
        // continuum differs only in end zones about one depth long (Timoshenko & Goodier, Theory of Elasticity, 1970,
        // §21; Saint-Venant), whose share of the deflection falls with h/l. So |panel/hand − 1| must fall steadily from
        // h/l = 2 to 8 and be under 1% at h/l = 8 for both end conditions; each panel value carries an estimated mesh
        // error far below that (< 0.1%).
        var r = AspectSweep.Run(Spec(2, 8, 3), AspectSweep.DefaultModels());
        foreach (var ends in new[] { EndFixity.Cantilever, EndFixity.FixedFixed })
        {
            var pts = r.Points.Where(p => p.Ends == ends).OrderBy(p => p.AspectRatio).ToArray();
            var gap = pts.Select(p => Math.Abs(p.Ratio - 1)).ToArray();
            Assert.True(gap[0] > gap[1] && gap[1] > gap[2], $"{ends}: gaps {string.Join(", ", gap)}");
            Assert.True(gap[2] < 0.01, $"{ends}: panel/hand at h/l = 8 is {pts[2].Ratio}");
            Assert.All(pts, p => Assert.True(p.FeErrors[0] < 1e-3, $"{ends} h/l = {p.AspectRatio}: estimated error {p.FeErrors[0]}"));
            Assert.All(pts, p => Assert.Null(p.FeErrors[1]));   // the exact Timoshenko element reports none
        }
    }

    [Fact]
    public void The_flexure_only_formula_departs_where_the_closed_form_shear_share_equals_the_tolerance()
    {
        // Derived (common algebra on the pier formula, Gere & Timoshenko): with Δf = P h³/(3EI) and Δs = f·P h/(AG),
        // I = t l³/12, A = t l, the shear share is s = Δs/(Δf + Δs). Where the panel equals the full formula, the panel
        // over the flexure-only formula is k_panel/k_f = Δf/(Δf + Δs) = 1 − s, so it leaves the band |ratio − 1| ≤ τ
        // where s = τ, i.e. Δs/Δf = τ/(1 − τ). Δs/Δf = f·3EI/(AG h²) = (f/4)(E/G)(l/h)², so
        // (h/l)* = √((f/4)(E/G)(1 − τ)/τ) = √(0.3 · 2.4 · 9) = 2.546 for f = 1.2, E/G = 2.4, τ = 0.1 (cantilever).
        // The panel is about 0.5% stiffer than the formula there (the test above), which moves the crossing by about
        // 0.005/(2τ) = 2.5% of (h/l)* (s ∝ (h/l)⁻² near it, derived); the h/l grid step is interpolated over. 4% covers both.
        double expected = Math.Sqrt(0.3 * 2.4 * 9);
        var r = AspectSweep.Run(Spec(1.5, 4, 13, ends: [EndFixity.Cantilever]), AspectSweep.DefaultModels());
        var d = SweepDepartures.Find(r).Single(x => x.Formula == SweepHandFormula.FlexureOnly);
        Assert.NotNull(d.Below);
        Near(expected, d.Below!.Value, 0.04, "flexure-only departure h/l");
        // The same crossing on the hand side alone: the hand shear share passes τ between the two bracketing points.
        var pts = r.Points.OrderBy(p => p.AspectRatio).ToArray();
        int i = Array.FindLastIndex(pts, p => p.AspectRatio < d.Below.Value);
        Assert.True(pts[i].Hand.ShearShare > 0.1 - 0.01 && pts[i + 1].Hand.ShearShare < 0.1 + 0.01);
        // Fixed-fixed: (h/l)* = √(f·(E/G)(1 − τ)/τ) = √(1.2 · 2.4 · 9) = 5.09 (Δs/Δf = f·12EI/(AG h²), derived): above a
        // range that ends at 4, so the flexure-only formula departs over the whole range; the full formula does not
        // depart at all for the slender end of the range.
        var ff = AspectSweep.Run(Spec(2, 4, 3, ends: [EndFixity.FixedFixed]), AspectSweep.DefaultModels());
        var all = SweepDepartures.Find(ff);
        Assert.True(all.Single(x => x.Formula == SweepHandFormula.FlexureOnly).WholeRange);
        var full = all.Single(x => x.Formula == SweepHandFormula.FlexureAndShear);
        Assert.False(full.WholeRange);
        Assert.Null(full.Below);
        Assert.Contains("within 10% of the plane-stress panel over the whole range", full.Words(2, 4));
    }

    [Fact]
    public void The_csv_carries_the_panel_with_its_error_and_the_departures()
    {
        var r = AspectSweep.Run(Spec(1, 4, 4), AspectSweep.DefaultModels());
        string csv = SweepFiles.Csv(r, "test");
        var lines = csv.Split('\n');
        string headerLine = lines.First(l => !l.StartsWith('#'));   // the notes lead as comment lines, then the one header
        Assert.Contains("fe1 stiffness [kip/in],fe1 FE/hand,fe1 shear share,fe1 FE/hand flexure only,fe1 estimated error", headerLine);
        Assert.Contains("# fe1: plane-stress panel", csv);
        Assert.Contains("# fe2: Timoshenko line members", csv);
        Assert.Equal(4, lines.Count(l => l.StartsWith("# departure:")));
        // Every data line: the panel's estimated error is a number, the line members' is blank (exact element).
        var header = headerLine.Split(',');
        int e1 = Array.IndexOf(header, "fe1 estimated error"), e2 = Array.IndexOf(header, "fe2 estimated error");
        foreach (var l in lines.Where(l => l.Length > 0 && !l.StartsWith('#')).Skip(1))
        {
            var f = l.Split(',');
            Assert.True(double.Parse(f[e1], CultureInfo.InvariantCulture) is > 0 and < 0.01, l);
            Assert.Equal("", f[e2]);
        }
    }

    [Fact]
    public void Two_runs_with_the_panel_give_byte_identical_files()
    {
        // Output depends only on the input (DEVELOPERS.md): points in parallel, each stored at its index.
        string a = TempDir("sweep-panel-a"), b = TempDir("sweep-panel-b");
        string[] args = ["sweep", "--from", "0.25", "--to", "4", "--points", "25"];
        var first = Run([.. args, "--out", a]);
        Assert.True(first.Code == 0, first.Err);
        Assert.Contains("plane-stress panel (the reference)", first.Out);
        Assert.Equal(0, Run([.. args, "--out", b]).Code);
        foreach (var name in new[] { "sweep.csv", "sweep-ratio.png", "sweep-shear-share.png" })
            Assert.True(File.ReadAllBytes(Path.Combine(a, name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, name))), $"{name} differs");
    }

    [Fact]
    public void Moduli_the_panel_cannot_take_are_refused_unless_the_panel_is_left_out()
    {
        // G = E/4 gives ν = E/(2G) − 1 = 1: no isotropic material (ν < 0.5 needs G > E/3; common practice).
        string dir = TempDir("sweep-nu");
        var (code, _, err) = Run("sweep", "--E", "1000", "--G", "250", "--points", "3", "--out", dir);
        Assert.Equal(1, code);
        Assert.Contains("Poisson's ratio", err);
        Assert.Contains("Fix:", err);
        Assert.Contains("Nothing was written", err);
        Assert.False(Directory.Exists(dir));
        Assert.Equal(0, Run("sweep", "--E", "1000", "--G", "250", "--points", "3", "--no-panel", "--out", dir).Code);
        Assert.Throws<ArgumentException>(() => AspectSweep.Run(Spec(1, 2, 2, g: 900), AspectSweep.DefaultModels()));
    }

    [Fact]
    public void One_and_two_threads_and_any_order_give_the_same_points_and_files()
    {
        // Points run dearest first, handed out one at a time; each is stored at its index (common practice: the output
        // depends on the input only). 1 and 2 threads: every number bitwise equal and every file byte-identical.
        var spec = Spec(0.25, 4, 5);
        var one = AspectSweep.Run(spec, AspectSweep.DefaultModels(true), threads: 1);
        var two = AspectSweep.Run(spec, AspectSweep.DefaultModels(true), threads: 2);
        Assert.Equal(10, two.Points.Count);
        for (int k = 0; k < one.Points.Count; k++)
        {
            Assert.Equal(k, two.Points[k].Index);
            Assert.Equal(one.Points[k].AspectRatio, two.Points[k].AspectRatio);
            Assert.Equal(one.Points[k].Fe.Select(f => BitConverter.DoubleToInt64Bits(f.Value)), two.Points[k].Fe.Select(f => BitConverter.DoubleToInt64Bits(f.Value)));
        }
        var a = SweepFiles.Render(one, "test");
        var b = SweepFiles.Render(two, "test");
        Assert.Equal(a.Select(f => f.Name), b.Select(f => f.Name));
        for (int i = 0; i < a.Count; i++) Assert.True(a[i].Bytes.AsSpan().SequenceEqual(b[i].Bytes), $"{a[i].Name} differs between 1 and 2 threads");
        // The two figures drawn at the same time are the figures drawn one after the other.
        Assert.True(SweepFiles.RatioFigure(one).Png.AsSpan().SequenceEqual(a[1].Bytes));
        Assert.True(SweepFiles.ShearShareFigure(one).Png.AsSpan().SequenceEqual(a[2].Bytes));
        // The warm-up draws nothing that a later figure keeps.
        SweepFiles.WarmUp();
        Assert.True(SweepFiles.RatioFigure(one).Png.AsSpan().SequenceEqual(a[1].Bytes));
    }

    [Fact]
    public void The_panel_ranks_taller_walls_dearer_so_they_start_first()
    {
        // Cost = the base mesh's planned nodes (2 elements across the shorter side): a wall four times as tall as long has
        // more nodes than a square one; the line members cost the same at every wall.
        var model = new PanelWallModel();
        SweepWall W(double a) => new(a, a * 6.096, 6.096, 0.2032, 24.9e9, 10.4e9, 1.2, EndFixity.Cantilever);
        Assert.True(model.Cost(W(4)) > model.Cost(W(1)));
        Assert.Equal(((ISweepFeModel)new LineMemberWallModel()).Cost(W(4)), ((ISweepFeModel)new LineMemberWallModel()).Cost(W(1)));
    }
}
