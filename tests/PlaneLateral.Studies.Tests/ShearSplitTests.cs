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
        var model = TwoWalls();
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
    /// <summary>Two equal cantilever walls tied by axial links at two floors (kip–inch), the split of case "L" between them.</summary>
    private static object TwoWalls() => new
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

    [Fact]
    public void On_a_footing_the_split_is_given_fixed_base_and_on_the_footing_side_by_side()
    {
        // Wall A stands on a 144 × 48 in surface footing on soil G = 10 ksi, ν = 0.35 (invented). The fixed-base rows are
        // the two equal walls' split (symmetry, derived: half each by hand; the FE of the same model with the footing's
        // springs replaced by restraints gives half within the links' stretch). The on-footing rows: wall A's hand
        // stiffness is the total force over its fixed-base top deflection plus the base rotation M_base/K_θ times the
        // height plus the slide V_base/K_h (derived; K_θ, K_h from Pais & Kausel 1988 by the hand library); wall B's is
        // its fixed-base value; each carries its share k_i/Σk of the story shear (relative rigidity, common practice).
        var m = Newtonsoft.Json.Linq.JObject.FromObject(TwoWalls());
        m["footings"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "FA", node = "a0", length = 144.0, width = 48.0, soil = new { shearModulus = 10.0, poissonRatio = 0.35 } } });
        var rows = Models.Compare(m).Rows.Where(r => r.Kind == "shear-split").ToList();
        Assert.Equal(8, rows.Count);

        double e = 4031.0, g = e / 2.4, i = 10.0 * 120 * 120 * 120 / 12, a = 10.0 * 120, h1 = 144, h2 = 288;
        // Top deflection of a cantilever under F at height y (to the top H = h2): F·y²(3H − y)/(6EI) + F·y/(G·A/1.2) (derived, Timoshenko beam).
        double Top(double f, double y) => f * y * y * (3 * h2 - y) / (6 * e * i) + f * y * 1.2 / (g * a);
        double dFixed = Top(10, h1) + Top(20, h2);
        var k = Hand.RigidFooting.By(Hand.FootingFormulas.PaisKausel, 144, 48, 0, Hand.Soil.FromShearModulus(10.0, 0.35)).InPlane(wallAlongLongSide: true);
        double moment = 10 * h1 + 20 * h2, total = 30;
        double dA = dFixed + moment / k.Rocking * h2 + total / k.Sliding;
        double kA = total / dA, kB = total / dFixed;
        foreach (int story in new[] { 1, 2 })
        {
            double v = story == 1 ? 30 : 20;
            var fixedA = rows.Single(r => r.Subject == $"story {story}: wall A, fixed base");
            var fixedB = rows.Single(r => r.Subject == $"story {story}: wall B, fixed base");
            Models.Near(v / 2, fixedA.Hand.Value, 1e-12, "fixed base: hand half");
            Models.Near(v / 2, fixedA.Reference.Value, 1e-3, "fixed base: FE half (the links stretch a little)");
            Models.Near(v / 2, fixedB.Reference.Value, 1e-3, "fixed base: FE half");
            var footA = rows.Single(r => r.Subject == $"story {story}: wall A, on footings");
            var footB = rows.Single(r => r.Subject == $"story {story}: wall B, on footings");
            Models.Near(v * kA / (kA + kB), footA.Hand.Value, 1e-9, "on the footing: hand share of wall A");
            Models.Near(v * kB / (kA + kB), footB.Hand.Value, 1e-9, "on the footing: hand share of wall B");
            Models.Near(v, footA.Reference.Value + footB.Reference.Value, 1e-9, "on the footing: FE shears add up to the story shear (statics)");
            Assert.True(footA.Reference.Value < 0.9 * v / 2, $"the rocking wall sheds shear to the other: {footA.Reference.Value} of {v}");
            Assert.Contains("fixed base: FE", footA.Reference.Description);
            Assert.Contains("on footings: FE", fixedA.Reference.Description);
        }
    }
}
