using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Verification;

/// <summary>Portal frames, member loads, releases and rigid zones against closed forms.</summary>
public class FrameTests
{
    private const double E = 29000, H = 144, L = 240, Ic = 800, P = 10;

    /// <summary>
    /// A single-bay portal. The closed forms neglect axial deformation: the joints B and C are held vertically (which
    /// removes column shortening) and the sway load is split equally between them (so the beam carries no axial force).
    /// </summary>
    private static object Portal(double ib, string baseType, double? columnShearArea = null, bool rigidJoints = false) => new
    {
        formatVersion = 1,
        materials = new[] { new { id = "steel", E, nu = 0.3 } },
        sections = new object[]
        {
            columnShearArea is null
                ? new { id = "col", shape = "general", A = 20.0, I = Ic }
                : new { id = "col", shape = "general", A = 20.0, I = Ic, shearArea = columnShearArea.Value },
            new { id = "beam", shape = "general", A = 20.0, I = ib },
        },
        nodes = new[] { new { id = "A", x = 0.0, y = 0.0 }, new { id = "B", x = 0.0, y = H }, new { id = "C", x = L, y = H }, new { id = "D", x = L, y = 0.0 } },
        members = new[]
        {
            new { id = "C1", start = "A", end = "B", section = "col", material = "steel" },
            new { id = "B1", start = "B", end = "C", section = "beam", material = "steel" },
            new { id = "C2", start = "D", end = "C", section = "col", material = "steel" },
        },
        supports = new object[]
        {
            new { node = "A", type = baseType }, new { node = "D", type = baseType },
            new { node = "B", type = "custom", restrain = rigidJoints ? new[] { "y", "rz" } : new[] { "y" } },
            new { node = "C", type = "custom", restrain = rigidJoints ? new[] { "y", "rz" } : new[] { "y" } },
        },
        loadCases = new[] { new { id = "sway", nodalLoads = new[] { new { node = "B", fx = P / 2 }, new { node = "C", fx = P / 2 } } } },
    };

    private static double SwayStiffness(AnalysisResult r)
    {
        var c = r.Cases[0];
        Near(c.Displacement(1, Dof.X), c.Displacement(2, Dof.X), 1e-12, "joints sway together");
        return P / r.Model.Units.FromSI(c.Displacement(1, Dof.X), Quantity.Length);
    }

    [Theory]
    [InlineData(10.0)]
    [InlineData(800.0)]
    [InlineData(8000.0)]
    public void FixedBasePortalMatchesSlopeDeflection(double ib)
    {
        // Derived by slope-deflection (equal joint rotations, beam bent in double curvature; see shared REFERENCES,
        // "Portal frames"): k = (24EI_c/h³)·(1+6β)/(4+6β), β = (I_b/L)/(I_c/h).
        double beta = ib / L / (Ic / H);
        double expected = 24 * E * Ic / (H * H * H) * (1 + 6 * beta) / (4 + 6 * beta);
        Near(expected, SwayStiffness(Solve(Portal(ib, "fixed"))), 1e-9);
    }

    [Theory]
    [InlineData(10.0)]
    [InlineData(800.0)]
    public void PinnedBasePortalMatchesSlopeDeflection(double ib)
    {
        // Derived by slope-deflection with pinned bases: k = (12EI_c/h³)·β/(2β+1).
        double beta = ib / L / (Ic / H);
        Near(12 * E * Ic / (H * H * H) * beta / (2 * beta + 1), SwayStiffness(Solve(Portal(ib, "pinned"))), 1e-9);
    }

    [Fact]
    public void RigidBeamPortalWithColumnShearDeformation()
    {
        // A rigid beam holds the column tops against rotation: two fixed-guided columns, k = 2·12EI/(h³(1+Φ)),
        // Φ = 12EI/(G·A_s·h²) (Przemieniecki 1968, §5.6). The joints' rotations are restrained to make the beam rigid.
        const double asv = 20;
        double g = E / 2.6, phi = 12 * E * Ic / (g * asv * H * H);
        var r = Solve(Portal(Ic, "fixed", asv, rigidJoints: true));
        Near(24 * E * Ic / (H * H * H * (1 + phi)), SwayStiffness(r), 1e-9);
    }

    private static object Beam(int segments, object load, string startSupport = "fixed", string endSupport = "fixed",
        double? shearArea = null, string[]? releases = null)
    {
        var nodes = Enumerable.Range(0, segments + 1).Select(i => new { id = $"N{i}", x = L * i / segments, y = 0.0 }).ToArray();
        var members = Enumerable.Range(0, segments).Select(i => new Dictionary<string, object>
        {
            ["id"] = $"M{i}", ["start"] = $"N{i}", ["end"] = $"N{i + 1}", ["section"] = "S", ["material"] = "steel",
        }).ToList();
        if (releases is not null) members[^1]["momentReleases"] = releases;
        object section = shearArea is null
            ? new { id = "S", shape = "general", A = 30.0, I = Ic }
            : new { id = "S", shape = "general", A = 30.0, I = Ic, shearArea = shearArea.Value };
        return new
        {
            formatVersion = 1,
            materials = new[] { new { id = "steel", E, nu = 0.3 } },
            sections = new[] { section },
            nodes,
            members,
            supports = new[] { new { node = "N0", type = startSupport }, new { node = $"N{segments}", type = endSupport } },
            loadCases = new[] { new { id = "w", memberLoads = Enumerable.Range(0, segments).Select(i => Load(load, i, segments)).ToArray() } },
        };
    }

    // A load over the whole beam, split over the elements: (wStart, wEnd) of the whole span, linear, global y.
    private static object Load(object spec, int i, int n)
    {
        var (w1, w2) = ((double, double))spec;
        double a = w1 + (w2 - w1) * i / n, b = w1 + (w2 - w1) * (i + 1) / n;
        return new { member = $"M{i}", direction = "y", wStart = a, wEnd = b };
    }

    [Theory]
    [InlineData(2, null)]
    [InlineData(2, 5.0)]
    [InlineData(6, 5.0)]
    public void FixedFixedBeamUnderUniformLoad(int segments, double? shearArea)
    {
        // Fixed-end moments wL²/12 and shears wL/2 (AISC Steel Construction Manual, Table 3-23, case 15; from memory);
        // midspan deflection wL⁴/(384EI) plus the shear part wL²/(8·G·A_s) (Timoshenko beam theory, derived:
        // by symmetry the moments do not change with shear deformation, and v_s′ = V/(G·A_s)).
        const double w = -0.05;
        var r = Solve(Beam(segments, (w, w), shearArea: shearArea));
        var u = r.Model.Units;
        var c = r.Cases[0];
        Near(-w * L / 2, u.FromSI(c.Reactions[0].Fy, Quantity.Force), 1e-9, "end shear");
        Near(-w * L * L / 12, u.FromSI(c.Reactions[0].Mz, Quantity.Moment), 1e-9, "fixed-end moment at start");
        Near(w * L * L / 12, u.FromSI(c.Reactions[1].Mz, Quantity.Moment), 1e-9, "fixed-end moment at end");
        double g = E / 2.6;
        double mid = w * L * L * L * L / (384 * E * Ic) + (shearArea is null ? 0 : w * L * L / (8 * g * shearArea.Value));
        Near(mid, u.FromSI(c.Displacement(segments / 2, Dof.Y), Quantity.Length), 1e-9, "midspan deflection");
    }

    [Fact]
    public void FixedFixedBeamUnderTriangularLoad()
    {
        // Load rising linearly from 0 to w: M = wL²/30 at the unloaded end, wL²/20 at the other; reactions 3wL/20 and
        // 7wL/20 (AISC Steel Construction Manual, Table 3-23, "load increasing uniformly to one end", fixed both ends;
        // from memory). One element, Euler–Bernoulli.
        const double w = -0.08;
        var r = Solve(Beam(1, (0.0, w)));
        var u = r.Model.Units;
        var c = r.Cases[0];
        Near(-3 * w * L / 20, u.FromSI(c.Reactions[0].Fy, Quantity.Force), 1e-9);
        Near(-7 * w * L / 20, u.FromSI(c.Reactions[1].Fy, Quantity.Force), 1e-9);
        Near(-w * L * L / 30, u.FromSI(c.Reactions[0].Mz, Quantity.Moment), 1e-9);
        Near(w * L * L / 20, u.FromSI(c.Reactions[1].Mz, Quantity.Moment), 1e-9);
    }

    [Fact]
    public void ShearDeformableFixedEndForcesAreExactForLinearLoads()
    {
        // The Timoshenko element is exact (its shape functions solve the homogeneous equations; Friedman & Kosmatka,
        // Computers & Structures 47(3), 1993), so with exact fixed-end forces one element and eight elements must give
        // the same reactions to round-off. Fixed-end forces of Euler–Bernoulli type would differ by O(Φ).
        const double w = -0.08, asv = 2.0; // a deep, shear-flexible member: Φ ≈ 0.5
        var one = Solve(Beam(1, (0.0, w), shearArea: asv));
        var eight = Solve(Beam(8, (0.0, w), shearArea: asv));
        for (int s = 0; s < 2; s++)
        {
            Near(one.Cases[0].Reactions[s].Fy, eight.Cases[0].Reactions[s].Fy, 1e-9, $"shear {s}");
            Near(one.Cases[0].Reactions[s].Mz, eight.Cases[0].Reactions[s].Mz, 1e-9, $"moment {s}");
        }
        // And they differ from the Euler–Bernoulli values by more than round-off.
        Assert.True(Math.Abs(one.Model.Units.FromSI(one.Cases[0].Reactions[0].Mz, Quantity.Moment) - (-w * L * L / 30)) > 1e-3 * Math.Abs(w * L * L / 30));
    }

    [Theory]
    [InlineData(null)]
    [InlineData(5.0)]
    public void ProppedCantileverUnderUniformLoad(double? shearArea)
    {
        // Prop reaction by compatibility (derived by hand): R = (wL⁴/8EI + wL²/(2GA_s)) / (L³/3EI + L/(GA_s)),
        // which is 3wL/8 without shear deformation (AISC Steel Construction Manual, Table 3-23, case 12; from memory).
        const double w = -0.05;
        var r = Solve(Beam(3, (w, w), endSupport: "roller-x", shearArea: shearArea));
        double g = E / 2.6, fs = shearArea is null ? 0 : 1 / (g * shearArea.Value);
        double expected = -w * (L * L * L * L / (8 * E * Ic) + L * L * fs / 2) / (L * L * L / (3 * E * Ic) + L * fs);
        Near(expected, r.Model.Units.FromSI(r.Cases[0].Reactions[1].Fy, Quantity.Force), 1e-9);
        if (shearArea is null) Near(-3 * w * L / 8, r.Model.Units.FromSI(r.Cases[0].Reactions[1].Fy, Quantity.Force), 1e-9);
    }

    [Fact]
    public void EndReleaseOnFixedSupportGivesProppedCantilever()
    {
        // Releasing the last member's end moment at a fixed support leaves a pin there: same prop reaction 3wL/8, and the
        // released end carries no moment (AISC Table 3-23, case 12; from memory). Node N3's rotation is then held: nothing stiffens it.
        const double w = -0.05;
        var r = Solve(Beam(3, (w, w), releases: ["end"]));
        Near(-3 * w * L / 8, r.Model.Units.FromSI(r.Cases[0].Reactions[1].Fy, Quantity.Force), 1e-9);
        Assert.Equal(0.0, r.Cases[0].MemberForces[2].M2);
        Assert.Equal(0.0, r.Cases[0].Reactions[1].Mz, 9);
    }

    [Fact]
    public void BothEndsReleasedGivesSimpleSpan()
    {
        // One member, both ends released, on pinned supports: a simple span with reactions wL/2 (Gere & Timoshenko,
        // Mechanics of Materials, simple beam under uniform load). Nothing resists the end nodes' rotations: they are held and noted.
        const double w = -0.05;
        var r = Solve(Beam(1, (w, w), startSupport: "pinned", endSupport: "pinned", releases: ["start", "end"]));
        Near(-w * L / 2, r.Model.Units.FromSI(r.Cases[0].Reactions[0].Fy, Quantity.Force), 1e-9);
        Assert.Equal(0.0, r.Cases[0].Reactions[0].Mz, 9);
        Assert.Contains(r.Notes, n => n.Contains("Rotation held"));
    }

    [Fact]
    public void RigidZonesShortenTheFlexibleLength()
    {
        // Derived by hand. Cantilever of length H, tip load P; rigid zone a at the base, b at the tip; flexible L_f = H − a − b.
        // Flexible tip under P and moment P·b: Δ_f = P·L_f³/3EI + P·b·L_f²/2EI + P·L_f/(G·A_s); θ_f = P·L_f²/2EI + P·b·L_f/EI;
        // node tip Δ = Δ_f + b·θ_f.
        const double e = 3605, nu = 0.2, bw = 12, d = 96, a = 20, b = 16, p = 50;
        var model = ToJObject(Cantilever(H, p, new { id = "S", shape = "rectangle", b = bw, d }, new { id = "MAT", E = e, nu }));
        model["members"]![0]!["rigidZones"] = Newtonsoft.Json.Linq.JObject.FromObject(new { start = a, end = b });
        var r = Solve(model);
        double i = bw * d * d * d / 12, g = e / (2 * (1 + nu)), asv = bw * d / 1.2, lf = H - a - b;
        double df = p * lf * lf * lf / (3 * e * i) + p * b * lf * lf / (2 * e * i) + p * lf / (g * asv);
        double tf = p * lf * lf / (2 * e * i) + p * b * lf / (e * i);
        Near(df + b * tf, r.Model.Units.FromSI(r.Cases[0].Displacement(1, Dof.X), Quantity.Length), 1e-9);
        // Moment at the base face of the flexible part: P·(H − a).
        // Moment on the flexible part at its base face: P·(H − a), counter-clockwise (it resists the load's overturning).
        Near(p * (H - a), r.Model.Units.FromSI(r.Cases[0].MemberForces[0].M1, Quantity.Moment), 1e-9, "face moment");
    }

    [Fact]
    public void InclinedMemberUnderGlobalAndLocalLoadsStaysInEquilibrium()
    {
        // Equilibrium (common practice): loads in global and local axes on an inclined, partly rigid, released member.
        var model = new
        {
            formatVersion = 1,
            materials = new[] { new { id = "m", E = 29000.0, G = 11200.0 } },
            sections = new[] { new { id = "I", shape = "I", d = 14.0, bf = 14.5, tf = 0.71, tw = 0.44 } },
            nodes = new[] { new { id = "A", x = 0.0, y = 0.0 }, new { id = "B", x = 120.0, y = 90.0 }, new { id = "C", x = 300.0, y = 90.0 } },
            members = new object[]
            {
                new { id = "AB", start = "A", end = "B", section = "I", material = "m", rigidZones = new { start = 10.0, end = 6.0 } },
                new { id = "BC", start = "B", end = "C", section = "I", material = "m", momentReleases = new[] { "end" } },
            },
            supports = new[] { new { node = "A", type = "fixed" }, new { node = "C", type = "pinned" } },
            loadCases = new object[]
            {
                new { id = "g", memberLoads = new object[] {
                    new { member = "AB", direction = "x", wStart = 0.2, wEnd = -0.1 },
                    new { member = "AB", axes = "local", direction = "transverse", w = 0.3 },
                    new { member = "AB", axes = "local", direction = "axial", wStart = 0.1, wEnd = 0.4 },
                    new { member = "BC", direction = "y", wStart = -0.5, wEnd = -0.2 } },
                    nodalLoads = new[] { new { node = "B", fx = 3.0, fy = -2.0, mz = 40.0 } } },
            },
            combinations = new[] { new { id = "1.2g", factors = new Dictionary<string, double> { ["g"] = 1.2 } } },
        };
        var r = Solve(model);
        Near(1.2 * r.Cases[0].Displacement(1, Dof.X), r.Cases[1].Displacement(1, Dof.X), 1e-12, "combination scales");
    }
}
