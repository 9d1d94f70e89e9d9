using PlaneLateral.Analysis;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>
/// Each line analysed alone under the story-force pattern, against closed forms (derived, Euler–Bernoulli, Φ = 0):
/// a cantilever wall of uniform EI with forces F1 at h and F2 at 2h deflects (superposition of tip loads,
/// u(x) = P·x²(3a − x)/(6EI) for x ≤ a) u1 = (F1 + 2.5·F2)·h³/(3EI), u2 = (2.5·F1 + 8·F2)·h³/(3EI); a story of two
/// fixed-guided columns has k = 24EI/h³.
/// </summary>
public class LineAloneTests
{
    private const double H = 3.5, F1 = 40e3, F2 = 70e3, Iw = 0.05, Ic = 2.5e-4;

    internal static object Model() => new
    {
        formatVersion = 1,
        units = new { force = "N", length = "m" },
        materials = new[] { BuildingModels.Material },
        sections = new[] { BuildingModels.Section("W", Iw), BuildingModels.Section("C", Ic) },
        nodes = new object[]
        {
            new { id = "W0", x = 0.0, y = 0.0 }, new { id = "W1", x = 0.0, y = H }, new { id = "W2", x = 0.0, y = 2 * H },
            new { id = "A0", x = 8.0, y = 0.0 }, new { id = "A1", x = 8.0, y = H }, new { id = "A2", x = 8.0, y = 2 * H },
            new { id = "B0", x = 14.0, y = 0.0 }, new { id = "B1", x = 14.0, y = H }, new { id = "B2", x = 14.0, y = 2 * H },
        },
        members = new object[]
        {
            new { id = "W-1", start = "W0", end = "W1", section = "W", material = "MAT", line = "wall" },
            new { id = "W-2", start = "W1", end = "W2", section = "W", material = "MAT", line = "wall" },
            new { id = "A-1", start = "A0", end = "A1", section = "C", material = "MAT", line = "frame" },
            new { id = "A-2", start = "A1", end = "A2", section = "C", material = "MAT", line = "frame" },
            new { id = "B-1", start = "B0", end = "B1", section = "C", material = "MAT", line = "frame" },
            new { id = "B-2", start = "B1", end = "B2", section = "C", material = "MAT", line = "frame" },
        },
        supports = new object[]
        {
            new { node = "W0", type = "fixed" }, new { node = "A0", type = "fixed" }, new { node = "B0", type = "fixed" },
            new { node = "A1", type = "custom", restrain = new[] { "rz" } }, new { node = "A2", type = "custom", restrain = new[] { "rz" } },
            new { node = "B1", type = "custom", restrain = new[] { "rz" } }, new { node = "B2", type = "custom", restrain = new[] { "rz" } },
        },
        levels = new object[] { new { id = "L0", elevation = 0.0, diaphragm = "none" }, new { id = "L1", elevation = H }, new { id = "L2", elevation = 2 * H } },
        loadCases = new[] { new { id = "EQ", nodalLoads = new[] { new { node = "W1", fx = F1 }, new { node = "B2", fx = F2 } } } },
    };

    private static double EI(double i) => BuildingModels.E * i;

    [Fact]
    public void EachLineAloneHasItsClosedFormStoryStiffness()
    {
        var r = Solve(Model());
        var wall = LineAlone.Stories(r, "EQ", "wall");
        double u1 = (F1 + 2.5 * F2) * H * H * H / (3 * EI(Iw)), u2 = (2.5 * F1 + 8 * F2) * H * H * H / (3 * EI(Iw));
        Near((F1 + F2) / u1, wall.Stories[0].Stiffness, 1e-9, "wall story 1");
        Near(F2 / (u2 - u1), wall.Stories[1].Stiffness, 1e-9, "wall story 2");
        var frame = LineAlone.Stories(r, "EQ", "frame");
        foreach (var s in frame.Stories) Near(24 * EI(Ic) / (H * H * H), s.Stiffness, 1e-9, $"frame story {s.Index}: 24EI/h³");
    }

    [Fact]
    public void RelativeRigiditySplitAddsUpAndDiffersFromInteraction()
    {
        var r = Solve(Model());
        var rows = LineAlone.Split(r, "EQ");
        foreach (var story in rows.GroupBy(x => x.Story))
        {
            Near(1.0, story.Sum(x => x.AloneShare), 1e-12, $"story {story.Key}: alone shares add to 1");
            Near(1.0, story.Sum(x => x.InStructureShare), 1e-9, $"story {story.Key}: in-structure shares add to 1");
        }
        // A cantilever and a shear-type frame deform differently, so the diaphragm makes them interact and the split in the
        // structure is not the relative-rigidity split (derived: equal only if both lines had the same deflected shape).
        Assert.True(rows.Max(x => Math.Abs(x.AloneShare - x.InStructureShare)) > 1e-3);
    }
}
