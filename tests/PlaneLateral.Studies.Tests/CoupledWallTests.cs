using PlaneLateral.Hand;
using PlaneLateral.Model;

namespace PlaneLateral.Studies.Tests;

/// <summary>
/// Coupled walls: the continuous-connection closed form (Stafford Smith &amp; Coull, Tall Building Structures, 1991,
/// ch. 7; closed forms derived in docs/coupled-walls.md) and the two hand bounds beside the wide-column frame.
/// </summary>
public class CoupledWallTests
{
    private static readonly object Concrete = new { id = "C", E = 30e6, nu = 0.2 };   // kN/m², invented

    /// <summary>A carrier model in kN and m with one coupled-wall check (invented two-pier wall).</summary>
    internal static object Carrier(object check) => new
    {
        formatVersion = 1,
        units = new { force = "kN", length = "m" },
        materials = new[] { Concrete },
        sections = new[] { new { id = "S", shape = "rectangle", b = 0.3, d = 1.0 } },
        nodes = new[] { new { id = "a", x = 0.0, y = 0.0 }, new { id = "b", x = 0.0, y = 3.0 } },
        members = new[] { new { id = "stub", start = "a", end = "b", section = "S", material = "C" } },
        supports = new[] { new { node = "a", type = "fixed" } },
        stiffnessAt = new[] { new { node = "b", direction = "x" } },
        comparisons = new[] { check },
    };

    internal static object Wall(int stories, double storyHeight, double beamDepth, double l1 = 4.0, double opening = 1.5, double l2 = 6.0,
        double? uniformLoad = 10.0, double? topLoad = 100.0) => new
    {
        id = "CW", kind = "coupled-wall", stories, storyHeight, thickness = 0.3, beamDepth, material = "C",
        piers = new[] { new { x = 0.0, length = l1 }, new { x = l1 + opening, length = l2 } },
        uniformLoad, topLoad,
    };

    private static CoupledWallCheck Check(object wall) => (CoupledWallCheck)Models.Parse(Carrier(wall)).Comparisons.Single();

    private static CoupledWallResponse Fe(CoupledWallCheck c, bool shear, CoupledWallLoad load, double mag) =>
        new WideColumnFrame(shear).Solve(c, load, mag, "test.json", PlaneLateral.Units.UnitSystem.KipInch);

    [Theory]
    [InlineData(CoupledWallLoad.Uniform)]
    [InlineData(CoupledWallLoad.TopPoint)]
    public void Continuous_medium_agrees_with_the_frame_without_shear_better_as_stories_are_added(CoupledWallLoad load)
    {
        // Derived (the continuous medium is the limit of finely spaced beams): the height is held at 36 m and the beams'
        // I_c/h at that of a 0.6 m beam every 3 m (depth ∝ h^(1/3)), so k, α and kαH stay the same while the story count
        // grows. The frame without shear deformation then tends to the closed form; the gap is the smearing of discrete
        // beams (each beam gathers a story of medium; the first floor's half story below it has none), which shrinks with
        // h/H. The stiffness gap can pass through zero on the way, so the larger of the stiffness and coupling gaps is
        // judged. Tolerances: 12 stories 5%, 48 stories 1.5% (margins on a smearing error that is a few h/H at most), and
        // every step closer than the last.
        double last = double.PositiveInfinity;
        foreach (int n in new[] { 6, 12, 24, 48 })
        {
            double h = 36.0 / n, d = 0.6 * Math.Cbrt(h / 3.0);
            var c = Check(Wall(n, h, d));
            var pair = CoupledWallStudy.Pair(c)!;
            var cm = CoupledWalls.ContinuousMedium(pair, load, 1e4);
            var fe = Fe(c, false, load, 1e4);
            double errDelta = Math.Abs(fe.TopDeflection / cm.TopDeflection - 1);
            double errDoc = Math.Abs(fe.DegreeOfCoupling / cm.DegreeOfCoupling - 1);
            double err = Math.Max(errDelta, errDoc);
            Assert.True(err < last, $"{n} stories: gap {err:E3} not below {last:E3}");
            if (n == 12) Assert.True(err < 0.05, $"12 stories: gap {err:E3}");
            if (n == 48) Assert.True(err < 0.015, $"48 stories: gap {err:E3}");
            last = err;
        }
    }

    [Theory]
    [InlineData(CoupledWallLoad.Uniform)]
    [InlineData(CoupledWallLoad.TopPoint)]
    public void Very_shallow_beams_give_independent_cantilevers(CoupledWallLoad load)
    {
        // Derived: beams 2 cm deep over a 1.5 m span carry almost nothing; flexure only, the frame is the two piers as
        // cantilevers sharing one deflection (elementary beam theory). Held to 1%.
        var c = Check(Wall(12, 3.0, 0.02));
        var fe = Fe(c, false, load, 1e4);
        var (cant, _) = CoupledWallStudy.Bounds(c, load, 1e4);
        Models.Near(cant.Value, fe.TopDeflection, 0.01, "frame against independent cantilevers");
        Assert.True(fe.DegreeOfCoupling < 0.01, $"degree of coupling {fe.DegreeOfCoupling}");
    }

    [Theory]
    [InlineData(CoupledWallLoad.Uniform)]
    [InlineData(CoupledWallLoad.TopPoint)]
    public void Very_deep_beams_approach_the_solid_wall_with_the_k2_share(CoupledWallLoad load)
    {
        // Derived: beams 2.8 m deep in 3 m stories over a 1.5 m span are nearly rigid; the frame without shear approaches
        // the piers' combined section, and the axial couple approaches 1/k² of the overturning moment (not all of it:
        // the piers still bend about their own axes). The piers still bend locally between the floors, so 5% on the
        // deflection.
        var c = Check(Wall(12, 3.0, 2.8));
        var fe = Fe(c, false, load, 1e4);
        var (cant, solid) = CoupledWallStudy.Bounds(c, load, 1e4);
        double k2 = CoupledWallStudy.Pair(c)!.K2;
        Models.Near(solid.Value, fe.TopDeflection, 0.05, "frame against one solid wall");
        Assert.True(fe.TopDeflection >= solid.Value * (1 - 1e-9), "no frame of these piers is stiffer than their combined section");
        // With beams this stiff kαH ≈ 79, about 6.6 per story: the smeared solution changes within one story, so the
        // discrete frame lags behind its limit; held to 10% and from below, and closer than with 1.2 m beams.
        Models.Near(1 / k2, fe.DegreeOfCoupling, 0.10, "degree of coupling against 1/k²");
        Assert.True(fe.DegreeOfCoupling < 1 / k2);
        Assert.True(Fe(Check(Wall(12, 3.0, 1.2)), false, load, 1e4).DegreeOfCoupling < fe.DegreeOfCoupling);
        Assert.True(1 / k2 < 0.9, $"1/k² = {1 / k2}: the k² effect is visible");
        // Shallow to deep, the frame moves from one bound to the other.
        var shallow = Fe(Check(Wall(12, 3.0, 0.02)), false, load, 1e4);
        Assert.True(shallow.TopDeflection > fe.TopDeflection * 3 && shallow.TopDeflection <= cant.Value * (1 + 1e-9));
    }

    [Theory]
    [InlineData(CoupledWallLoad.Uniform, true)]
    [InlineData(CoupledWallLoad.TopPoint, true)]
    [InlineData(CoupledWallLoad.Uniform, false)]
    public void Beam_shears_sum_to_the_pier_axial_force_at_the_base(CoupledWallLoad load, bool shear)
    {
        // Statics (vertical equilibrium of a pier; common practice): the beams' shears are the only vertical forces on
        // pier 1, so their sum is its base axial force; and the base moments plus the axial couple make up the overturning
        // moment (global moment equilibrium). Held to 1e-9 (round-off of the solve).
        var c = Check(Wall(12, 3.0, 0.6));
        var fe = Fe(c, shear, load, 1e4);
        double sum = fe.BeamShears.Sum(row => row[0]);
        Models.Near(fe.PierBaseAxialForces[0], sum, 1e-9, "Σ beam shears against pier 1's base axial force");
        Models.Near(-fe.PierBaseAxialForces[0], fe.PierBaseAxialForces[1], 1e-9, "the two piers' axial forces balance");
        Models.Near(fe.BaseOverturningMoment, fe.PierBaseMoments.Sum() + fe.AxialCouple, 1e-9, "base moments + couple = overturning moment");
        Assert.True(fe.PierBaseAxialForces[0] > 0, "the windward pier is in tension");
    }

    [Fact]
    public void Shear_deformation_matters_most_for_deep_short_beams()
    {
        // Derived: a beam's shear adds Φ_b = f(E/G)(d/b)² to its flexibility: 1.84 for a 1.2 m beam over 1.5 m (its
        // stiffness falls to 1/(1 + Φ_b) = 35%), 0.12 for a 0.3 m beam. The closed form with the beams' shear
        // (I_c/(1 + Φ_b)) loses more coupling with the deep beams; the frame with shear deformation follows it within 5%,
        // the rest being the piers' own shear, which neither closed form holds (it costs the frame about 3% of its
        // coupling even with shallow beams, so the frame's own loss does not isolate the beams).
        (double Loss, double Fe, double Cm, double CmLoss) Run(double d)
        {
            var c = Check(Wall(12, 3.0, d));
            double withShear = Fe(c, true, CoupledWallLoad.Uniform, 1e4).DegreeOfCoupling;
            double loss = withShear / Fe(c, false, CoupledWallLoad.Uniform, 1e4).DegreeOfCoupling;
            double cm = CoupledWalls.ContinuousMedium(CoupledWallStudy.Pair(c, beamShear: true)!, CoupledWallLoad.Uniform, 1e4).DegreeOfCoupling;
            double kah = CoupledWallStudy.Pair(c, beamShear: true)!.KAlphaH / CoupledWallStudy.Pair(c)!.KAlphaH;
            return (loss, withShear, cm, kah);
        }
        var deep = Run(1.2);
        var shallow = Run(0.3);
        Assert.True(deep.Loss < 1 && shallow.Loss < 1, $"deep {deep.Loss}, shallow {shallow.Loss}");
        // The governing parameter kαH falls by the factor 1/√(1 + Φ_b): 0.59 for the deep beams, 0.94 for the shallow
        // ones. What that does to the coupling depends on the regime: deep beams here are near saturation (kαH ≈ 20).
        Models.Near(1 / Math.Sqrt(1 + 1.2 * 2.4 * Math.Pow(1.2 / 1.5, 2)), deep.CmLoss, 1e-9, "kαH with beam shear, deep beams");
        Models.Near(1 / Math.Sqrt(1 + 1.2 * 2.4 * Math.Pow(0.3 / 1.5, 2)), shallow.CmLoss, 1e-9, "kαH with beam shear, shallow beams");
        Models.Near(deep.Cm, deep.Fe, 0.05, "frame with shear against the closed form with beam shear, deep beams");
        Models.Near(shallow.Cm, shallow.Fe, 0.05, "frame with shear against the closed form with beam shear, shallow beams");
    }

    [Fact]
    public void Comparison_rows_show_every_model_side_by_side()
    {
        var report = Models.Compare(Carrier(Wall(12, 3.0, 0.6)));
        Assert.All(report.Rows, r => Assert.Equal("coupled-wall", r.Kind));
        // Per load: closed-form stiffness, degree of coupling, axial force; both bounds.
        Assert.Equal(10, report.Rows.Count);
        Assert.All(report.Rows, r => Assert.Equal(["wide-column frame", "wide-column frame, no shear deformation", "plane-stress panel"], r.Fe.Select(f => f.Model).ToArray()));
        var cant = report.Rows.Single(r => r.Subject == "uniform load: stiffness, independent cantilevers");
        Assert.Equal(Verdict.HandLower, cant.Verdict);   // the beams stiffen the wall beyond two free cantilevers
        Assert.StartsWith("the coupling beams tie the piers", cant.Cause);
        var solid = report.Rows.Single(r => r.Subject == "uniform load: stiffness, one solid wall");
        Assert.Equal(Verdict.HandHigher, solid.Verdict);
        Assert.StartsWith("the coupling beams are not rigid", solid.Cause);
        var doc = report.Rows.Single(r => r.Subject == "uniform load: degree of coupling, continuous medium");
        Assert.Equal(ComparedQuantity.Fraction, doc.Quantity);
        Assert.Contains("coupling-beam shear per floor", doc.Hand.Detail);
        Assert.Contains("Stafford Smith & Coull", doc.Hand.Method.Source);
        var files = ComparisonFiles.Render(report, "test");
        Assert.Contains("coupled-wall", files.Single(f => f.Name == "comparisons.csv").Text);
    }

    [Fact]
    public void Three_piers_get_the_bounds_and_the_frame_but_no_two_pier_closed_form()
    {
        var wall = new
        {
            id = "CW3", kind = "coupled-wall", stories = 10, storyHeight = 3.0, thickness = 0.25, beamDepth = 0.5, material = "C",
            piers = new[] { new { x = 0.0, length = 3.0 }, new { x = 4.0, length = 3.0 }, new { x = 8.0, length = 3.0 } },
        };
        var report = Models.Compare(Carrier(wall));
        Assert.Equal(4, report.Rows.Count);
        Assert.DoesNotContain(report.Rows, r => r.Subject.Contains("continuous medium"));
        var c = Check(wall);
        var fe = Fe(c, true, CoupledWallLoad.TopPoint, 1.0);
        Assert.Equal(2, fe.BeamShears[0].Count);
        Models.Near(fe.BaseOverturningMoment, fe.PierBaseMoments.Sum() + fe.AxialCouple, 1e-9, "moment equilibrium, three piers");
    }

    [Fact]
    public void Sweep_over_beam_depth_runs_from_one_bound_to_the_other()
    {
        var c = Check(Wall(12, 3.0, 0.6));
        var pts = CoupledWallStudy.OverBeamDepth(c, CoupledWallStudy.DefaultDepths(c), CoupledWallLoad.Uniform, 1e4, "test.json", PlaneLateral.Units.UnitSystem.KipInch);
        Assert.Equal(12, pts.Count);
        for (int i = 1; i < pts.Count; i++)
        {
            Assert.True(pts[i].FeShear < pts[i - 1].FeShear && pts[i].ClosedForm < pts[i - 1].ClosedForm, $"deeper beams are stiffer (point {i})");
            Assert.True(pts[i].DocFeNoShear > pts[i - 1].DocFeNoShear);
        }
        Assert.All(pts, p => Assert.True(p.Solid <= p.FeNoShear * (1 + 1e-9) && p.FeNoShear <= p.Cantilevers * (1 + 1e-9)));
        var csv = CoupledWallStudy.SweepCsv(c, CoupledWallLoad.Uniform, pts, PlaneLateral.Units.UnitSystem.KipInch);
        Assert.Equal(14, csv.TrimEnd('\n').Split('\n').Length);   // caution comment, header, 12 depths
        Assert.Throws<ArgumentException>(() => CoupledWallStudy.OverBeamDepth(c, [3.0], CoupledWallLoad.Uniform, 1, "t", PlaneLateral.Units.UnitSystem.KipInch));
    }

    [Fact]
    public void Span_convention_and_cracked_beams_reach_the_closed_form_and_the_frame_alike()
    {
        // Derived: with "clear-plus-half-depth" both models bend the beam over b + d/2 (1.5 + 0.3 m), and a beam I factor
        // of 0.35 (ACI 318 Table 6.6.3.1.1(a), beams, as an example of a cracked value) scales I_c in both; the
        // flexure-only frame stays as close to the closed form as with the clear span (5%, the smearing gap of 12 stories).
        var plain = Check(Wall(12, 3.0, 0.6));
        var longer = plain with { BeamSpan = BeamSpanRule.ClearPlusHalfDepth };
        var cracked = plain with { BeamInertiaFactor = 0.35 };
        Models.Near(1.8, CoupledWallStudy.Pair(longer)!.BeamSpan, 1e-12, "b + d/2");
        Models.Near(0.35 * 0.3 * Math.Pow(0.6, 3) / 12, CoupledWallStudy.Pair(cracked)!.BeamInertia, 1e-12, "cracked I_c");
        foreach (var c in new[] { plain, longer, cracked })
        {
            var cm = CoupledWalls.ContinuousMedium(CoupledWallStudy.Pair(c)!, CoupledWallLoad.Uniform, 1e4);
            var fe = Fe(c, false, CoupledWallLoad.Uniform, 1e4);
            Models.Near(cm.TopDeflection, fe.TopDeflection, 0.05, $"{c.BeamSpan}, I factor {c.BeamInertiaFactor}: top deflection");
            Models.Near(cm.DegreeOfCoupling, fe.DegreeOfCoupling, 0.05, $"{c.BeamSpan}, I factor {c.BeamInertiaFactor}: coupling");
        }
        Assert.True(Fe(longer, false, CoupledWallLoad.Uniform, 1e4).TopDeflection > Fe(plain, false, CoupledWallLoad.Uniform, 1e4).TopDeflection);
        Assert.True(Fe(cracked, false, CoupledWallLoad.Uniform, 1e4).DegreeOfCoupling < Fe(plain, false, CoupledWallLoad.Uniform, 1e4).DegreeOfCoupling);
    }

    // ---- reader errors (common practice: every problem at once, with place and fix) ----

    private static IReadOnlyList<ModelDiagnostic> Problems(object wall)
    {
        var e = Assert.Throws<ModelInputException>(() => Models.Parse(Carrier(wall)));
        Assert.All(e.Diagnostics, d => { Assert.True(d.Line > 0); Assert.False(string.IsNullOrWhiteSpace(d.Fix)); });
        return e.Diagnostics;
    }

    [Fact]
    public void Beam_deeper_than_the_story_is_refused()
    {
        var d = Assert.Single(Problems(Wall(12, 3.0, 3.2)));
        Assert.Equal("$.comparisons[0].beamDepth", d.JsonPath);
        Assert.Contains("not shallower than the story", d.Problem);
    }

    [Fact]
    public void Overlapping_piers_are_refused()
    {
        var d = Assert.Single(Problems(Wall(12, 3.0, 0.6, l1: 4.0, opening: -0.5)));
        Assert.Equal("$.comparisons[0].piers[1]", d.JsonPath);
        Assert.Contains("overlap by 0.5 m", d.Problem);
        var touch = Assert.Single(Problems(Wall(12, 3.0, 0.6, l1: 4.0, opening: 0.0)));
        Assert.Contains("touch", touch.Problem);
    }

    [Fact]
    public void Fewer_than_two_piers_are_refused()
    {
        var wall = new { id = "CW", kind = "coupled-wall", stories = 3, storyHeight = 3.0, thickness = 0.3, beamDepth = 0.5, material = "C", piers = new[] { new { x = 0.0, length = 4.0 } } };
        var d = Assert.Single(Problems(wall));
        Assert.Equal("$.comparisons[0].piers", d.JsonPath);
        Assert.Contains("at least two piers; found 1", d.Problem);
    }

    [Fact]
    public void Several_problems_are_reported_together()
    {
        var wall = new { id = "CW", kind = "coupled-wall", stories = 2.5, storyHeight = -3.0, thickness = 0.3, beamDepth = 0.5, material = "X", beamSpan = "long", piers = new[] { new { x = 0.0, length = 4.0 } } };
        var ds = Problems(wall);
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[0].stories");
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[0].storyHeight");
        Assert.Contains(ds, d => d.Problem.Contains("unknown material \"X\""));
        Assert.Contains(ds, d => d.Problem.Contains("unknown beam span rule"));
        Assert.Contains(ds, d => d.Problem.Contains("at least two piers"));
    }
}
