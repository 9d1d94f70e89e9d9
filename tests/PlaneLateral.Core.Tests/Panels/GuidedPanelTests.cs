using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using Xunit.Abstractions;
using static PlaneLateral.Tests.Panels.PlaneTestSupport;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>Wall panels with a guided top: the continuum counterpart of the fixed-guided ("fixed-fixed") pier.</summary>
public class GuidedPanelTests(ITestOutputHelper output)
{
    // An invented concrete wall: t = 0.2 m, E = 25 GPa, ν = 0.2.
    private const double T = 0.2, E = 25e9, Nu = 0.2;

    private static WallPanel Panel(double length, double height, PanelTop top, int across = 2, int refinements = 1,
        IReadOnlyList<PanelLoad>? loads = null, IReadOnlyList<PanelOpening>? openings = null) => new()
    {
        Id = "W1", X0 = 3, Y0 = 0, Length = length, Height = height, Thickness = T, MaterialId = "C", E = E, Nu = Nu, Top = top,
        Mesh = new PanelMeshSettings(PanelElementKind.Quad9, 0, across, MaxNodes: 40000, Refinements: refinements),
        Loads = loads ?? [], Openings = openings ?? [],
    };

    /// <summary>
    /// Fixed-guided pier under a lateral force P at the guided end: Δ = P h³/(12EI) + f·P h/(GA), f = 6/5 (Gere &amp;
    /// Timoshenko, Mechanics of Materials, the fixed-guided beam with Timoshenko's shear term).
    /// </summary>
    private static double FixedGuidedStiffness(double l, double h)
    {
        double i = T * l * l * l / 12, a = T * l, g = E / (2 * (1 + Nu));
        return 1 / (h * h * h / (12 * E * i) + 1.2 * h / (g * a));
    }

    [Fact]
    public void SlenderGuidedPanelMatchesTheFixedGuidedTimoshenkoPier()
    {
        // h/l = 5, top guided. The shear term is 1.2·(E/G)·(l/h)² = 1.2·2.4/25 = 11.5% of the bending term (derived from
        // the pier formula above), so the comparison does test the shear term as well as bending. Plane-stress elasticity
        // tends to beam theory away from the ends (Timoshenko & Goodier, Theory of Elasticity, 1970, §21: the end-loaded
        // strip differs from beam theory in the shear coefficient and in zones about one depth long at each held end,
        // Saint-Venant). Both ends are held against warping here, so the continuum is a little stiffer; each end zone is
        // one depth of five, acting on the shear part: 2% is the allowance for that modelling difference. The
        // discretisation error is measured, not assumed: three nested meshes (2, 4, 8 elements across), Richardson's
        // extrapolation and its estimated error, which must itself be small (< 0.1%) and is added to the allowance.
        var r = PanelAnalysis.Run(Panel(1.2, 6, PanelTop.Guided, across: 2, refinements: 3), []);
        var c = r.Convergence!;
        output.WriteLine($"meshes k = {string.Join(", ", c.Stiffness.Select(k => k.ToString("E6")))}; order {c.ObservedOrder:0.00}; k∞ = {c.Extrapolated:E6}; error {c.EstimatedError:E2}");
        double closed = FixedGuidedStiffness(1.2, 6);
        double ratio = c.Extrapolated / closed;
        output.WriteLine($"closed form k = {closed:E6} N/m; panel/closed = {ratio:0.00000}");
        Assert.True(c.EstimatedError < 1e-3, $"estimated discretisation error {c.EstimatedError}");
        Assert.InRange(ratio, 1 - 0.02 - c.EstimatedError, 1 + 0.02 + c.EstimatedError);
        // The same wall with a free top against the cantilever formula P h³/(3EI) + f P h/(GA): the guide is what
        // changed, so the guided/free stiffness ratio must be the closed forms' ratio within the same allowances.
        var free = PanelAnalysis.Run(Panel(1.2, 6, PanelTop.Free, across: 2, refinements: 3), []).Convergence!;
        double i = T * 1.2 * 1.2 * 1.2 / 12, g = E / (2 * (1 + Nu));
        double cantilever = 1 / (216 / (3 * E * i) + 1.2 * 6 / (g * T * 1.2));
        output.WriteLine($"free top: panel/closed = {free.Extrapolated / cantilever:0.00000}");
        Assert.InRange(free.Extrapolated / cantilever, 0.98, 1.02);
    }

    [Fact]
    public void AGuidedTopTranslatesWithoutRotatingAndTakesHalfTheOverturningMoment()
    {
        // Exact constraints by equation sharing: every top node has bit-for-bit the same ux and the same uy. For a solid
        // (symmetric) wall the mesh and the boundary conditions are unchanged by a half turn about the wall's centre, and
        // the solution is unique, so the field is centro-symmetric: the base and the guide take equal moments, P·h/2
        // each (derived; as the fixed-guided beam, Gere & Timoshenko). Mirror symmetry about the centre line makes uy
        // antisymmetric, so the shared top uy is zero to round-off (derived).
        const double p = 100e3, l = 3, h = 4.5;
        var r = PanelAnalysis.Run(Panel(l, h, PanelTop.Guided, loads: [new PanelLoad(0, h, p, 0, PanelLoadPath.Tie)]), ["wind"]);
        AssertChecks(r.Analysis);   // global equilibrium counts the guide's moment with the reactions
        var c = r.Analysis.Cases[0];
        var top = r.Mesh.LevelNodes[^1];
        Assert.All(top, n => Assert.Equal(c.Ux[top[0]], c.Ux[n]));
        Assert.All(top, n => Assert.Equal(c.Uy[top[0]], c.Uy[n]));
        Assert.True(Math.Abs(c.Uy[top[0]]) < 1e-9 * c.Ux[top[0]], $"top uy {c.Uy[top[0]]} against ux {c.Ux[top[0]]}");
        double guide = Assert.Single(c.GuideMoments);
        // The force overturns clockwise (−P·h about the base); base and guide each resist with +P·h/2 (counter-clockwise).
        Near(p * h / 2, guide, 1e-9, "guide moment");
        double baseMoment = c.Reactions.Sum(x => x.Dof == Dof.Y ? r.Mesh.Mesh.X[x.Node] * x.Value : -r.Mesh.Mesh.Y[x.Node] * x.Value);
        Near(p * h / 2, baseMoment, 1e-9, "base moment");
    }

    [Fact]
    public void AGuidedTopStillLetsTheWallShortenUnderGravity()
    {
        // Sharing uy (rather than holding it) leaves the wall free to shorten: a vertical load W spread along a guided top
        // shortens a solid wall by about W·h/(E·A) (elementary axial member; the held base adds a little Poisson restraint,
        // so within 5%, common practice), and the guide takes no vertical force: the base carries all of W.
        const double w = -500e3, l = 2, h = 6;
        var r = PanelAnalysis.Run(Panel(l, h, PanelTop.Guided, loads: [new PanelLoad(0, h, 0, w, PanelLoadPath.Spread)]), ["gravity"]);
        AssertChecks(r.Analysis);
        var c = r.Analysis.Cases[0];
        double shortening = c.Uy[r.Mesh.LevelNodes[^1][0]];
        output.WriteLine($"top uy {shortening:E4} m against W h/(EA) = {w * h / (E * T * l):E4} m");
        Near(w * h / (E * T * l), shortening, 0.05, "axial shortening");
        Near(-w, c.Reactions.Where(x => x.Dof == Dof.Y).Sum(x => x.Value), 1e-9, "the base carries the gravity load");
    }

    private static object Model(object? top, bool ties = true) => new
    {
        formatVersion = 1,
        units = new { force = "kN", length = "m" },
        materials = new[] { new { id = "C", E = 25e6, nu = 0.2 } },
        sections = Array.Empty<object>(),
        loadCases = new[] { new { id = "wind" } },
        panels = new[] { top is null
            ? (object)new { id = "W", length = 2.0, height = 6.0, thickness = 0.2, material = "C", floorTies = ties }
            : new { id = "W", length = 2.0, height = 6.0, thickness = 0.2, material = "C", floorTies = ties, top } },
    };

    [Fact]
    public void TheTopKeyIsReadAndAFreeTopIsTheCantilever()
    {
        Assert.Equal(PanelTop.Free, Parse(Model(null)).Panels[0].Top);
        Assert.Equal(PanelTop.Free, Parse(Model("free")).Panels[0].Top);
        Assert.Equal(PanelTop.Guided, Parse(Model("guided")).Panels[0].Top);
        // The cantilever is unchanged: "top": "free" solves exactly as no key (same mesh, same equations).
        Assert.Equal(Solve(Model(null)).Panels[0].TopStiffness, Solve(Model("free")).Panels[0].TopStiffness);
        // Guided against free at h/l = 3, ν = 0.2 (E/G = 2.4): in units of P/(E t) the cantilever pier gives
        // 4(h/l)³ + 1.2·(E/G)(h/l) = 108 + 8.64 and the fixed-guided pier (h/l)³ + 1.2·(E/G)(h/l) = 27 + 8.64, a ratio of
        // 116.64/35.64 = 3.273 (derived from the pier formulas, Gere & Timoshenko). The continuum's end zones change each
        // by about 1% (tests above), so the ratio is held to 3%.
        double ratio = Solve(Model("guided")).Panels[0].TopStiffness / Solve(Model("free")).Panels[0].TopStiffness;
        output.WriteLine($"guided/free at h/l = 3: {ratio:0.0000}");
        Near(116.64 / 35.64, ratio, 0.03, "guided/free stiffness");
    }

    [Theory]
    [InlineData("sideways", true, "unknown top \"sideways\"")]
    [InlineData("guided", false, "a guided top is a rigid floor")]
    public void ABadTopIsRefusedAtItsKey(string top, bool ties, string problem)
    {
        var e = Assert.Throws<ModelInputException>(() => Parse(Model(top, ties)));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.panels[0].top" && d.Problem.Contains(problem) && d.Line > 0 && d.Fix.Length > 0);
    }
}
