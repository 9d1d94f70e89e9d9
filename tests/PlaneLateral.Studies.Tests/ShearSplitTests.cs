using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Studies.Tests;

/// <summary>Story shear shared among parallel lines: relative rigidity beside the full FE model.</summary>
public class ShearSplitTests
{
    private static string DemoPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json");

    [Fact]
    public void FE_line_shears_add_up_to_the_story_shear_in_the_demo()
    {
        // Equilibrium (derived): the wall and the frame are the only vertical members, so in every story their
        // shears sum to the forces above; the hand shares sum to the same.
        var model = ModelReader.ReadFile(DemoPath);
        var rows = ComparisonStudy.Run(model).Rows.Where(r => r.Kind == "shear-split").ToList();
        var e = model.LoadCases.Single(c => c.Id == "E");
        double[] levelForces = [11, 22, 31];
        for (int s = 1; s <= 3; s++)
        {
            var story = rows.Where(r => r.Subject.StartsWith($"story {s}:")).ToList();
            Assert.Equal(2, story.Count);
            double v = levelForces.Skip(s - 1).Sum();
            Models.Near(v, story.Sum(r => r.Reference.Value), 1e-9, $"FE story {s}");
            Models.Near(v, story.Sum(r => r.Hand.Value), 1e-12, $"hand story {s}");
            Assert.All(story, r => Assert.Equal(ComparedQuantity.StoryShear, r.Quantity));
        }
    }

    [Fact]
    public void Wall_frame_interaction_is_named_where_the_split_fails()
    {
        // Common practice: a cantilever wall tied to a shear-type frame sheds shear to the frame near the top,
        // so relative rigidity gives the frame too little in the top story.
        var rows = ComparisonStudy.Run(ModelReader.ReadFile(DemoPath)).Rows.Where(r => r.Kind == "shear-split").ToList();
        var topFrame = rows.Single(r => r.Subject == "story 3: frame grid 3");
        Assert.Equal(Verdict.HandLower, topFrame.Verdict);
        Assert.Equal("hand gives less", topFrame.VerdictText);
        Assert.StartsWith("wall-frame interaction", topFrame.Cause);
        Assert.Contains("Story shear by relative rigidity", topFrame.Hand.Method.Name);
    }

    [Fact]
    public void Two_equal_walls_share_equally_and_the_split_holds()
    {
        // Symmetry (derived): two identical cantilever walls tied at each floor carry half each, by hand and by FE.
        var model = new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "C", E = 4031.0, nu = 0.2 } },
            sections = new object[] { new { id = "W", shape = "rectangle", b = 10.0, d = 120.0 }, new { id = "L", shape = "general", A = 1e5, I = 1.0 } },
            nodes = new[]
            {
                new { id = "a0", x = 0.0, y = 0.0 }, new { id = "a1", x = 0.0, y = 144.0 }, new { id = "a2", x = 0.0, y = 288.0 },
                new { id = "b0", x = 600.0, y = 0.0 }, new { id = "b1", x = 600.0, y = 144.0 }, new { id = "b2", x = 600.0, y = 288.0 },
            },
            members = new object[]
            {
                new { id = "wa1", start = "a0", end = "a1", section = "W", material = "C" }, new { id = "wa2", start = "a1", end = "a2", section = "W", material = "C" },
                new { id = "wb1", start = "b0", end = "b1", section = "W", material = "C" }, new { id = "wb2", start = "b1", end = "b2", section = "W", material = "C" },
                new { id = "l1", start = "a1", end = "b1", section = "L", material = "C", kind = "brace" },
                new { id = "l2", start = "a2", end = "b2", section = "L", material = "C", kind = "brace" },
            },
            supports = new[] { new { node = "a0", type = "fixed" }, new { node = "b0", type = "fixed" } },
            loadCases = new[] { new { id = "L", nodalLoads = new[] { new { node = "a1", fx = 10.0 }, new { node = "a2", fx = 20.0 } } } },
            comparisons = new object[]
            {
                new { id = "A", kind = "wall-line", members = new[] { "wa1", "wa2" }, ends = new[] { "cantilever" } },
                new { id = "B", kind = "wall-line", members = new[] { "wb1", "wb2" }, ends = new[] { "cantilever" } },
                new { id = "S", kind = "shear-split", loadCase = "L", lines = new[] { new { label = "wall A", check = "A" }, new { label = "wall B", check = "B" } } },
            },
        };
        var rows = Models.Compare(model).Rows.Where(r => r.Kind == "shear-split").ToList();
        Assert.Equal(4, rows.Count);
        foreach (var r in rows)
        {
            double v = r.Subject.StartsWith("story 1") ? 30 : 20;
            Models.Near(v / 2, r.Hand.Value, 1e-12, "hand half");
            // The links stretch a little, so wall A (loaded) carries a hair more than half.
            Models.Near(v / 2, r.Reference.Value, 1e-3, "FE half");
            Assert.Equal(Verdict.WithinTolerance, r.Verdict);
            Assert.Equal("relative rigidity holds at this story", r.Cause);
        }
    }
}
