using PlaneLateral.Analysis;
using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>Wall panels tied to frame nodes by rigid links (docs/panels.md, "Panels in a frame").</summary>
public class PanelLinkTests
{
    private const double E = 25e9, Nu = 0.2, T = 0.2;   // N/m², -, m (kN/m² in the files below: ×1000)

    /// <summary>A frame node at the middle of the top of an l × h wall (kN, m), the whole top edge linked to it, loads at nodes.</summary>
    internal static object SlenderWall(double l, double h, double pKn, object[]? extraNodes = null, object[]? members = null, string loaded = "T", int across = 4) => new
    {
        formatVersion = 1,
        title = "panel in a frame",
        units = new { force = "kN", length = "m" },
        materials = new object[] { new { id = "C", E = E / 1000, nu = Nu } },
        sections = new object[] { new { id = "COL", shape = "rectangle", b = 0.3, d = 0.4 } },
        nodes = new object[] { new { id = "T", x = l / 2, y = h } }.Concat(extraNodes ?? []).ToArray(),
        members = members ?? [],
        supports = Array.Empty<object>(),
        loadCases = new[] { new { id = "P", nodalLoads = new[] { new { node = loaded, fx = pKn } } } },
        panels = new[]
        {
            new
            {
                id = "W", length = l, height = h, thickness = T, material = "C", floorTies = false,
                mesh = new { element = "quad9", elementsAcrossNarrowest = across },
                links = new[] { new { node = "T", edge = "top" } },
            },
        },
    };

    [Fact]
    public void SlenderWallUnderAFrameNodeDeflectsAsTheTimoshenkoCantilever()
    {
        // Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, §21 (cantilever loaded at the end), with the
        // shear coefficient κ = 5/6 of the rectangle: δ = P h³/(3EI) + P h/(κ G A). The panel's base is held in x and
        // y and its top is rigid (the link), which restrains the warping of both end sections within about one wall
        // length of each end (Saint-Venant), so the panel is a little stiffer than the beam; the tied-top table in
        // docs/panels.md shows 0.3 % at h/l = 4. Tolerance 0.5 %: that end restraint plus the mesh error (measured:
        // 0.25 %, 0.18 %, 0.16 % stiffer with 2, 4, 8 elements across, converging to the end-restraint effect).
        double l = 1, h = 6, p = 100e3;
        var r = Solve(SlenderWall(l, h, p / 1000));
        double i = T * l * l * l / 12, a = T * l, g = E / (2 * (1 + Nu));
        double expected = p * h * h * h / (3 * E * i) + p * h / (5.0 / 6 * g * a);
        double tip = r.Cases[0].Displacement(0, Dof.X);
        Near(expected, tip, 0.005, "tip deflection against Timoshenko beam theory");
        Assert.True(tip < expected, "the end restraints (held base, rigid top) can only stiffen the wall (Rayleigh: more constraint, less energy; common practice)");
        AssertWhole(r);
        var link = Assert.Single(r.PanelLinks!.Cases[0].Forces);
        Near(p, link.Fx, 1e-9, "the link passes the whole load to the panel (equilibrium of the frame node, derived)");
        Assert.True(Math.Abs(link.Fy) < 1e-9 * p && Math.Abs(link.Mz) < 1e-9 * p * l, $"no vertical force or moment at a free node: {link.Fy}, {link.Mz}");
    }

    [Fact]
    public void AColumnOnTopOfTheWallAddsItsCantileverToThePanelPart()
    {
        // Superposition (Gere & Timoshenko, Mechanics of Materials, 4th ed., 1997, §9.5 and §9.11): the column of length c
        // above the wall adds its own cantilever deflection P c³/(3 E I_c) + P c/(G A_s) to the wall top's deflection and
        // rotation carried up the column, δ_T + θ_T·c. Checked two ways: exactly (round-off) with the wall top's δ_T and θ_T
        // as the model gives them, and against the beam formulas for the wall under the shear P and the moment P·c
        // (δ_T = P h³/3EI + P h/κGA + P c h²/2EI, θ_T = P h²/2EI + P c h/EI), within 1 % for the
        // same reasons as above (measured: 0.09 % stiffer).
        double l = 1, h = 6, c = 3, p = 50e3;
        var model = SlenderWall(l, h, p / 1000, extraNodes: [new { id = "C", x = l / 2, y = h + c }],
            members: [new { id = "COL", start = "T", end = "C", section = "COL", material = "C" }], loaded: "C");
        var r = Solve(model);
        var cs = r.Cases[0];
        double ic = 0.3 * Math.Pow(0.4, 3) / 12, ac = 0.3 * 0.4, g = E / (2 * (1 + Nu));
        double column = p * c * c * c / (3 * E * ic) + p * c / (g * ac / 1.2);   // shear area A/1.2, the rectangle's default (docs/engine.md)
        double dT = cs.Displacement(0, Dof.X), thT = cs.Displacement(0, Dof.RZ), dC = cs.Displacement(1, Dof.X);
        // θ > 0 counter-clockwise: a wall top swaying to +x turns clockwise, so the column top moves by −θ·c more.
        Near(dT - thT * c + column, dC, 1e-9, "superposition on the model's own wall top");
        double i = T * l * l * l / 12, a = T * l;
        double wallTop = p * h * h * h / (3 * E * i) + p * h / (5.0 / 6 * g * a) + p * c * h * h / (2 * E * i);
        double wallTurn = p * h * h / (2 * E * i) + p * c * h / (E * i);
        Near(wallTop + wallTurn * c + column, dC, 0.01, "column top against beam formulas");
        AssertWhole(r);
        var link = Assert.Single(r.PanelLinks!.Cases[0].Forces);
        Near(-p * c, link.Mz, 1e-9, "the link passes the column's base moment −P·c (statics, derived)");
    }

    [Fact]
    public void RigidMotionOfTheMastersGivesNoStressAndNoForce_AndTheCondensedStiffnessIsSymmetric()
    {
        // A free-floating panel tied at its top and its base to two masters: a rigid-body motion of the whole strains
        // nothing (Zienkiewicz & Taylor, The Finite Element Method, vol. 1, 2000, §2.2: rigid-body modes give zero
        // strain), so K_c·q_rigid = 0 and the recovered stresses vanish; K_c is symmetric by Betti's reciprocal theorem.
        var mesh = StructuredMesh.Grid(LagrangeQuad9.Instance, [0, 0.5, 1, 1.5, 2], [0, 1, 2, 3]);
        var p = new PlaneStressProblem { Mesh = mesh, Material = new PlaneStressMaterial(E, Nu, T) };
        var segs = new[]
        {
            new RigidSegment("top", 1.2, 3.5, mesh.NodesAtY(3)),
            new RigidSegment("base", 0.7, -0.4, mesh.NodesAtY(0)),
        };
        var cond = PanelSuperelement.Condense(p, segs, [new PlaneLoadCase { Id = "none" }]);
        Assert.True(cond.SymmetryError < 1e-11, $"symmetry error {cond.SymmetryError}");
        double u0 = 2e-3, v0 = -1e-3, th = 4e-4, x0 = 0.3, y0 = 0.9;
        double[] q = [.. Rigid(segs[0]), .. Rigid(segs[1])];
        double[] Rigid(RigidSegment s) => [u0 - th * (s.Y - y0), v0 + th * (s.X - x0), th];
        double kMax = 0;
        foreach (var v in cond.Stiffness) kMax = Math.Max(kMax, Math.Abs(v));
        for (int i = 0; i < 6; i++)
        {
            double f = 0;
            for (int j = 0; j < 6; j++) f += cond.Stiffness[i, j] * q[j];
            Assert.True(Math.Abs(f) < 1e-12 * kMax * q.Max(Math.Abs), $"condensed force {i} under a rigid motion: {f}");
        }
        var rec = PanelSuperelement.Recover(p, segs, [new PlaneLoadCase { Id = "rigid" }], [q]);
        double scale = E * u0 / 3;   // stress of a strain u0/h, for scale
        foreach (var s in rec.Cases[0].NodalStress) Assert.True(Math.Abs(s) < 1e-9 * scale, $"stress {s} under a rigid motion");
        Assert.True(Math.Abs(rec.Cases[0].Ux[5] - (u0 - th * (mesh.Y[5] - y0))) < 1e-15, "interior nodes follow the rigid motion too");
    }

    [Fact]
    public void CondensationEqualsTheDirectSolveWithTheSameTopMotion()
    {
        // The condensed panel is linear in the masters' motions (superposition; Przemieniecki 1968, ch. 9): K_c·q + f_fe
        // must equal the link force of one direct solve with the top prescribed to follow q, to round-off, and the
        // recovered displacements must equal the direct ones.
        var mesh = StructuredMesh.Grid(IncompatibleQuad4.Instance, [0, 0.5, 1, 1.5, 2, 2.5, 3], [0, 0.6, 1.2, 1.8, 2.4]);
        var p = new PlaneStressProblem { Mesh = mesh, Material = new PlaneStressMaterial(E, Nu, T), Restraints = mesh.NodesAtY(0).SelectMany(i => new[] { (i, Dof.X), (i, Dof.Y) }).ToList() };
        var segs = new[] { new RigidSegment("top", 1.5, 2.4, mesh.NodesAtY(2.4)) };
        var load = new PlaneLoadCase { Id = "side", EdgeLoads = mesh.EdgesWhere((x, _) => Math.Abs(x) < 1e-12).Select(e => new PlaneEdgeLoad(e.Element, e.Edge, 30e3, 0, 30e3, 0)).ToList() };
        var cond = PanelSuperelement.Condense(p, segs, [load]);
        double[] q = [1.3e-3, -0.4e-3, 2.1e-4];
        var direct = PlaneStressAnalysis.Run(PanelSuperelement.Held(p, segs), [new PlaneLoadCase { Id = "d", EdgeLoads = load.EdgeLoads, Prescribed = PanelSuperelement.Prescribe(mesh, segs, q) }]);
        var f = PanelSuperelement.LinkForces(mesh, segs, direct.Cases[0]);
        for (int i = 0; i < 3; i++)
        {
            double kq = cond.FixedEndForces[0][i];
            for (int j = 0; j < 3; j++) kq += cond.Stiffness[i, j] * q[j];
            Assert.True(Math.Abs(kq - f[i]) <= 1e-9 * f.Max(Math.Abs), $"link force {i}: condensed {kq}, direct {f[i]}");
        }
        var rec = PanelSuperelement.Recover(p, segs, [load], [q]);
        for (int i = 0; i < mesh.NodeCount; i++) Assert.Equal(direct.Cases[0].Ux[i], rec.Cases[0].Ux[i], 15);
        PlaneTestSupport.AssertChecks(direct);
    }

    /// <summary>The whole (frame and panels) balances its loads and its backward error is at round-off (Higham 2002, Thm 7.1).</summary>
    internal static void AssertWhole(AnalysisResult r)
    {
        Assert.NotNull(r.PanelLinks);
        foreach (var c in r.PanelLinks!.Cases)
        {
            Assert.True(c.WholeBackwardError < 1e-12, $"{c.Id}: whole backward error {c.WholeBackwardError}");
            Assert.True(c.Whole.RelativeForceError < 1e-9 && c.Whole.RelativeMomentError < 1e-9, $"{c.Id}: whole imbalance {c.Whole.RelativeForceError}, {c.Whole.RelativeMomentError}");
        }
        foreach (var p in r.PanelLinks.Panels) Assert.True(p.SymmetryError < 1e-10, $"{p.Panel}: condensed stiffness asymmetry {p.SymmetryError}");
    }
}
