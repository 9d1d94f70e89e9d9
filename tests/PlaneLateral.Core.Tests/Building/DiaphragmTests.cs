using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>
/// The rigid-diaphragm tie (exact, by equation sharing) and the split of story shear among lines of resistance in
/// limit cases checkable by hand.
/// </summary>
public class DiaphragmTests
{
    private const double H = 3.6, P = 1.0e5;   // m, N
    private const double Iwall = 0.08, Icol = 3.0e-4;   // m⁴

    /// <summary>
    /// One story: a cantilever wall (line "wall") at x = 0 and two columns (line "frame") at x = 7.5 and 15 m whose tops
    /// have their rotation held (fixed-guided: a frame with a beam rigid in bending). No member joins the lines: only the
    /// level's diaphragm does. Load P at the wall's top.
    /// </summary>
    internal static object WallBesideFrame(bool withWall = true, bool diaphragm = true, string? wallSection = null)
    {
        var nodes = new List<object>
        {
            new { id = "C1-0", x = 7.5, y = 0.0 }, new { id = "C1-1", x = 7.5, y = H },
            new { id = "C2-0", x = 15.0, y = 0.0 }, new { id = "C2-1", x = 15.0, y = H },
        };
        var members = new List<object>
        {
            new { id = "C1", start = "C1-0", end = "C1-1", section = "COL", material = "MAT", role = "column", line = "frame" },
            new { id = "C2", start = "C2-0", end = "C2-1", section = "COL", material = "MAT", role = "column", line = "frame" },
        };
        var supports = new List<object>
        {
            new { node = "C1-0", type = "fixed" }, new { node = "C2-0", type = "fixed" },
            new { node = "C1-1", type = "custom", restrain = new[] { "rz" } }, new { node = "C2-1", type = "custom", restrain = new[] { "rz" } },
        };
        string loaded = "C1-1";
        if (withWall)
        {
            nodes.Add(new { id = "W-0", x = 0.0, y = 0.0 });
            nodes.Add(new { id = "W-1", x = 0.0, y = H });
            members.Add(new { id = "W", start = "W-0", end = "W-1", section = wallSection ?? "WALL", material = "MAT", role = "wall", line = "wall" });
            supports.Add(new { node = "W-0", type = "fixed" });
            loaded = "W-1";
        }
        return new
        {
            formatVersion = 1,
            units = new { force = "N", length = "m" },
            materials = new[] { BuildingModels.Material },
            sections = new[] { BuildingModels.Section("WALL", Iwall), BuildingModels.Section("COL", Icol) },
            nodes,
            members,
            supports,
            levels = new object[] { new { id = "base", elevation = 0.0, diaphragm = "none" }, new { id = "roof", elevation = H, diaphragm = diaphragm ? "rigid" : "none" } },
            loadCases = new[] { new { id = "L", nodalLoads = new[] { new { node = loaded, fx = P } } } },
        };
    }

    // Derived (Euler–Bernoulli, Φ = 0): cantilever k = 3EI/h³; fixed-guided column k = 12EI/h³ (REFERENCES, Timoshenko
    // element with Φ = 0). Under one rigid diaphragm the lines move together, so each takes P·k_i/Σk.
    private static double Kwall => 3 * BuildingModels.E * Iwall / (H * H * H);
    private static double Kframe => 2 * 12 * BuildingModels.E * Icol / (H * H * H);

    [Fact]
    public void TiedNodesMoveExactlyTogetherAndEquilibriumHolds()
    {
        var r = Solve(WallBesideFrame());   // Solve asserts backward error and equilibrium (TestModels.AssertChecks)
        var m = r.Model;
        var c = r.Cases[0];
        double w = c.Displacement(m.NodeIndex("W-1"), Dof.X);
        // One shared equation: the values are the same double, not merely close (exact constraint, no penalty).
        Assert.Equal(w, c.Displacement(m.NodeIndex("C1-1"), Dof.X));
        Assert.Equal(w, c.Displacement(m.NodeIndex("C2-1"), Dof.X));
        Assert.Equal(m.Nodes.Count * 3 - 3 * 3 - 2 - 2, r.Dofs.FreeCount); // 18 DOFs − 3 fixed bases × 3 − 2 held rz − 2 shared ux
    }

    [Fact]
    public void WithoutTheDiaphragmTheLinesAreApart()
    {
        var r = Solve(WallBesideFrame(diaphragm: false));
        var c = r.Cases[0];
        Assert.Equal(0.0, c.Displacement(r.Model.NodeIndex("C1-1"), Dof.X));   // nothing joins the frame to the loaded wall
        Near(P / Kwall, c.Displacement(r.Model.NodeIndex("W-1"), Dof.X), 1e-9, "wall alone, derived P·h³/3EI");
    }

    [Fact]
    public void WallBesideRigidBeamFrameSharesByStiffnessRatio()
    {
        var r = Solve(WallBesideFrame());
        var s = Assert.Single(StoryAnalysis.ForCase(r, r.Cases[0]).Stories);
        double total = Kwall + Kframe;
        Near(P, s.Shear, 1e-9, "story shear = load above (statics)");
        Near(total, s.Stiffness, 1e-9, "story stiffness = k_wall + k_frame (derived)");
        Near(P / total, s.Drift, 1e-9, "drift = P / Σk (derived)");
        var wall = s.Lines.Single(l => l.Line == "wall");
        var frame = s.Lines.Single(l => l.Line == "frame");
        Near(Kwall / total, wall.Share, 1e-9, "wall share = k_wall/Σk (derived)");
        Near(Kframe / total, frame.Share, 1e-9, "frame share = k_frame/Σk (derived)");
        Near(Kwall, wall.Stiffness, 1e-9, "line stiffness of the wall");
        Near(Kframe, frame.Stiffness, 1e-9, "line stiffness of the frame");
    }

    [Fact]
    public void FrameWithNoWallTakesAllTheShear()
    {
        var r = Solve(WallBesideFrame(withWall: false));
        var s = Assert.Single(StoryAnalysis.ForCase(r, r.Cases[0]).Stories);
        var frame = Assert.Single(s.Lines);
        Near(1.0, frame.Share, 1e-12, "one line carries everything");
        Near(Kframe, s.Stiffness, 1e-9, "two fixed-guided columns, 24EI/h³ (REFERENCES, portal with rigid beam)");
    }

    [Fact]
    public void IdenticalLinesShareEqually()
    {
        // Two identical cantilevers 10 m apart, tied at the top by the diaphragm; the load on one of them.
        var model = new
        {
            formatVersion = 1,
            units = new { force = "N", length = "m" },
            materials = new[] { BuildingModels.Material },
            sections = new[] { BuildingModels.Section("WALL", Iwall) },
            nodes = new object[] { new { id = "A0", x = 0.0, y = 0.0 }, new { id = "A1", x = 0.0, y = H }, new { id = "B0", x = 10.0, y = 0.0 }, new { id = "B1", x = 10.0, y = H } },
            members = new object[]
            {
                new { id = "A", start = "A0", end = "A1", section = "WALL", material = "MAT", line = "east" },
                new { id = "B", start = "B1", end = "B0", section = "WALL", material = "MAT", line = "west" },   // drawn top-down on purpose
            },
            supports = new object[] { new { node = "A0", type = "fixed" }, new { node = "B0", type = "fixed" } },
            levels = new object[] { new { id = "base", elevation = 0.0, diaphragm = "none" }, new { id = "top", elevation = H } },
            loadCases = new[] { new { id = "L", nodalLoads = new[] { new { node = "A1", fx = P } } } },
        };
        var r = Solve(model);
        var s = Assert.Single(StoryAnalysis.ForCase(r, r.Cases[0]).Stories);
        foreach (var l in s.Lines) Near(0.5, l.Share, 1e-9, $"line {l.Line}: identical lines share equally (derived)");
        Near(P / (2 * Kwall), s.Drift, 1e-9, "drift = P/(2k) (derived)");
    }

    [Fact]
    public void ListedNodesFormTheDiaphragmAndOthersStayFree()
    {
        var m = ToJObject(WallBesideFrame());
        m["levels"]![1]!["nodes"] = new Newtonsoft.Json.Linq.JArray("W-1", "C1-1");
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(m.ToString(), "t.json"));
        AssertChecks(r);
        var c = r.Cases[0];
        var model = r.Model;
        Assert.Equal(c.Displacement(model.NodeIndex("W-1"), Dof.X), c.Displacement(model.NodeIndex("C1-1"), Dof.X));
        Assert.Equal(0.0, c.Displacement(model.NodeIndex("C2-1"), Dof.X));   // C2 is not tied and unloaded
        Near(P / (Kwall + Kframe / 2), c.Displacement(model.NodeIndex("W-1"), Dof.X), 1e-9, "wall + one column (derived)");
    }
}
