using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>
/// Story shear from member end forces equals the horizontal load above the cut (statics: equilibrium of the part of
/// the structure above a horizontal cut — derived). The model is built to exercise every branch of the derivation:
/// a wall drawn top-down, a column with a mid-story node, rigid end zones, a brace crossing a story on the slant,
/// horizontal distributed loads (uniform and linearly varying) on crossing members, and a combination.
/// </summary>
public class StoryShearStaticsTests
{
    private const double H = 3.0;   // m; forces in N

    internal static object Model() => new
    {
        formatVersion = 1,
        units = new { force = "N", length = "m" },
        materials = new[] { BuildingModels.Material },
        sections = new[] { BuildingModels.Section("WALL", 0.04, 1.3), BuildingModels.Section("COL", 3.7e-4, 0.026), new { id = "BM", shape = "general", A = 0.019, I = 6.2e-4, shearArea = 0.0077 } },
        nodes = new object[]
        {
            new { id = "W0", x = 0.0, y = 0.0 }, new { id = "W1", x = 0.0, y = H }, new { id = "W2", x = 0.0, y = 2 * H },
            new { id = "A0", x = 7.5, y = 0.0 }, new { id = "A1", x = 7.5, y = H }, new { id = "A1m", x = 7.5, y = 1.5 * H }, new { id = "A2", x = 7.5, y = 2 * H },
            new { id = "B0", x = 13.5, y = 0.0 }, new { id = "B1", x = 13.5, y = H }, new { id = "B2", x = 13.5, y = 2 * H },
        },
        members = new object[]
        {
            new { id = "W-1", start = "W1", end = "W0", section = "WALL", material = "MAT", line = "wall" },   // top-down
            new { id = "W-2", start = "W2", end = "W1", section = "WALL", material = "MAT", line = "wall" },
            new { id = "A-1", start = "A0", end = "A1", section = "COL", material = "MAT", line = "frame", rigidZones = new { start = 0.25, end = 0.2 } },
            new { id = "A-2a", start = "A1", end = "A1m", section = "COL", material = "MAT", line = "frame" },
            new { id = "A-2b", start = "A1m", end = "A2", section = "COL", material = "MAT", line = "frame", rigidZones = new { end = 1.25 } },   // the cut falls in this rigid zone
            new { id = "B-1", start = "B0", end = "B1", section = "COL", material = "MAT", line = "frame" },
            new { id = "B-2", start = "B2", end = "B1", section = "COL", material = "MAT", line = "frame" },
            new { id = "G-1", start = "A1", end = "B1", section = "BM", material = "MAT", line = "frame", rigidZones = new { start = 0.2, end = 0.2 } },
            new { id = "G-2", start = "A2", end = "B2", section = "BM", material = "MAT", line = "frame" },
            new { id = "X-1", start = "A0", end = "B1", section = "COL", material = "MAT", kind = "brace", line = "frame" },
        },
        supports = new object[] { new { node = "W0", type = "fixed" }, new { node = "A0", type = "fixed" }, new { node = "B0", type = "pinned" } },
        levels = new object[] { new { id = "L0", elevation = 0.0, diaphragm = "none" }, new { id = "L1", elevation = H }, new { id = "L2", elevation = 2 * H } },
        loadCases = new object[]
        {
            new
            {
                id = "WIND",
                nodalLoads = new object[] { new { node = "W1", fx = 12.0e3 }, new { node = "B2", fx = 7.0e3, fy = -3.0e3 }, new { node = "A1m", fx = 2.5e3 } },
                memberLoads = new object[]
                {
                    new { member = "A-1", direction = "x", w = 900.0 },
                    new { member = "B-2", direction = "x", wStart = 1600.0, wEnd = 350.0 },     // B-2 runs from B2 down to B1
                    new { member = "A-2b", direction = "x", w = 700.0 },
                    new { member = "G-2", direction = "y", w = -1800.0 },
                },
            },
            new { id = "GRAV", memberLoads = new object[] { new { member = "G-1", direction = "y", w = -3500.0 } } },
        },
        combinations = new object[] { new { id = "C", factors = new Dictionary<string, double> { ["WIND"] = 1.6, ["GRAV"] = 1.2 } } },
    };

    /// <summary>
    /// Horizontal load above height y, from the loads as written (derived): nodal fx at nodes above y, plus for each
    /// vertical member with a global-x load the integral of the (linear in y) intensity over its part above y.
    /// </summary>
    private static double LoadAbove(double y, double factor)
    {
        double sum = 0;
        if (H > y) sum += 12.0e3;            // W1
        if (2 * H > y) sum += 7.0e3;         // B2
        if (1.5 * H > y) sum += 2.5e3;       // A1m
        // y from 0 to H, w = 900.
        sum += 900.0 * Math.Max(0, H - Math.Max(y, 0));
        // A-2b: y from 1.5H to 2H, w = 700.
        sum += 700.0 * Math.Max(0, 2 * H - Math.Max(y, 1.5 * H));
        // B-2: from B2 (y = 2H, w = 1600) down to B1 (y = H, w = 350): w(y) = 350 + 1250·(y − H)/H; ∫ from max(y,H) to 2H.
        double lo = Math.Max(y, H);
        if (lo < 2 * H)
        {
            double w1 = 350.0 + 1250.0 * (lo - H) / H, w2 = 1600.0;
            sum += 0.5 * (w1 + w2) * (2 * H - lo);
        }
        return factor * sum;
    }

    [Fact]
    public void StoryShearEqualsTheLoadAboveInEveryStory()
    {
        var r = Solve(Model());
        var wind = StoryAnalysis.ForCase(r, r.Case("WIND"));
        Assert.Equal(2, wind.Stories.Count);
        foreach (var s in wind.Stories)
        {
            Near(LoadAbove(s.CutElevation, 1.0), s.Shear, 1e-9, $"story {s.Index} shear = load above the cut at y = {s.CutElevation}");
            Near(s.Shear, s.Lines.Sum(l => l.Shear), 1e-12, "line shears add up to the story shear");
        }
        // The cut of story 2 lies between the mid-story node and L2: y = 1.75 H, inside A-2b's 1.25 m rigid zone (its flexible part ends at 1.5H + 0.25).
        Near(1.75 * H, wind.Stories[1].CutElevation, 1e-12, "cut above the mid-story node");
        var combo = StoryAnalysis.ForCase(r, r.Case("C"));
        foreach (var s in combo.Stories) Near(LoadAbove(s.CutElevation, 1.6), s.Shear, 1e-9, $"combination, story {s.Index}");
    }

    [Fact]
    public void GravityOnlyCaseCarriesNoStoryShear()
    {
        var r = Solve(Model());
        var grav = StoryAnalysis.ForCase(r, r.Case("GRAV"));
        Assert.False(grav.Lateral);
        foreach (var s in grav.Stories)
        {
            Assert.True(Math.Abs(s.Shear) < 1e-9 * 3500.0 * 6.0, $"story {s.Index}: {s.Shear}");   // statics: no horizontal load
            Assert.True(double.IsNaN(s.Stiffness), "no stiffness from round-off shear");
        }
    }

    [Fact]
    public void StoryShearFollowsTheTopDownWallToo()
    {
        // The wall members are drawn top-down; reversing them must not change the wall's share (derived: same structure).
        var r1 = Solve(Model());
        var m = ToJObject(Model());
        foreach (var mem in m["members"]!)
            if (((string)mem["id"]!).StartsWith("W-")) (mem["start"], mem["end"]) = (mem["end"], mem["start"]);
        var r2 = LinearStaticAnalysis.Run(ModelReader.Parse(m.ToString(), "t.json"));
        var a = StoryAnalysis.ForCase(r1, r1.Case("WIND"));
        var b = StoryAnalysis.ForCase(r2, r2.Case("WIND"));
        for (int i = 0; i < 2; i++)
            Near(a.Stories[i].Lines.Single(l => l.Line == "wall").Shear, b.Stories[i].Lines.Single(l => l.Line == "wall").Shear, 1e-9, $"story {i + 1}");
    }
}
