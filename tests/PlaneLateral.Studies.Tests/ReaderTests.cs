using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Studies.Tests;

/// <summary>Reader diagnostics for the "comparisons" key (common practice: every problem at once, with place and fix).</summary>
public class ReaderTests
{
    private static IReadOnlyList<ModelDiagnostic> Problems(object model)
    {
        var e = Assert.Throws<ModelInputException>(() => Models.Parse(model));
        Assert.All(e.Diagnostics, d =>
        {
            Assert.Equal("test.json", d.File);
            Assert.True(d.Line > 0, $"no line for {d}");
            Assert.StartsWith("$", d.JsonPath);
            Assert.False(string.IsNullOrWhiteSpace(d.Fix));
        });
        return e.Diagnostics;
    }

    private static object Wall(params object[] openings) => new
    {
        id = "PW", kind = "perforated-wall", length = 200.0, height = 120.0, thickness = 8.0, material = "CMU", openings,
    };

    [Fact]
    public void Missing_member_is_named_with_its_path()
    {
        var d = Assert.Single(Problems(Models.Carrier([new { id = "W", kind = "wall-line", members = new[] { "stub", "nope" } }])));
        Assert.Equal("$.comparisons[0].members[1]", d.JsonPath);
        Assert.Contains("unknown member \"nope\"", d.Problem);
    }

    [Fact]
    public void Opening_outside_the_wall_is_rejected()
    {
        var d = Assert.Single(Problems(Models.Carrier([Wall(new { label = "far window", x = 150.0, y = 40.0, width = 80.0, height = 40.0 })])));
        Assert.Equal("$.comparisons[0].openings[0]", d.JsonPath);
        Assert.Contains("'far window'", d.Problem);
        Assert.Contains("outside the wall", d.Problem);
    }

    [Fact]
    public void Overlapping_openings_are_rejected()
    {
        var d = Assert.Single(Problems(Models.Carrier([Wall(
            new { label = "a", x = 40.0, y = 40.0, width = 40.0, height = 40.0 },
            new { label = "b", x = 60.0, y = 60.0, width = 40.0, height = 40.0 })])));
        Assert.Contains("overlap", d.Problem);
        Assert.Equal("$.comparisons[0].openings[1]", d.JsonPath);
    }

    [Fact]
    public void Zero_width_piers_are_rejected()
    {
        // An opening reaching the wall's end, and two openings touching side by side.
        var ds = Problems(Models.Carrier([Wall(
            new { label = "end", x = 0.0, y = 40.0, width = 30.0, height = 40.0 },
            new { label = "left", x = 80.0, y = 40.0, width = 30.0, height = 40.0 },
            new { label = "right", x = 110.0, y = 30.0, width = 30.0, height = 40.0 })]));
        Assert.Equal(2, ds.Count);
        Assert.Contains(ds, d => d.Problem.Contains("'end' reaches the end of the wall") && d.Problem.Contains("zero width"));
        Assert.Contains(ds, d => d.Problem.Contains("'left' and 'right' touch side by side") && d.Problem.Contains("zero width"));
    }

    [Fact]
    public void Every_problem_is_listed_at_once()
    {
        var ds = Problems(Models.Carrier([
            new { id = "A", kind = "wall-line", members = new[] { "ghost" } },
            new { id = "A", kind = "perforated-wall", length = -5.0, height = 120.0, thickness = 8.0, material = "CMU" },
            new { id = "C", kind = "bridge" },
            new { id = "D", kind = "shear-split", loadCase = "none", lines = new[] { new { check = "A" } } },
            new { id = "E", kind = "wall-line", members = new[] { "stub" }, tolerance = 2.0, colour = "red" },
        ]));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[0].members[0]" && d.Problem.Contains("unknown member"));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[1].id" && d.Problem.Contains("duplicate"));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[1].length" && d.Problem.Contains("greater than zero"));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[2].kind" && d.Problem.Contains("unknown check kind \"bridge\""));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[3].loadCase" && d.Problem.Contains("unknown load case"));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[3].lines" && d.Problem.Contains("at least two lines"));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[4].tolerance" && d.Problem.Contains("outside (0, 1)"));
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[4].colour" && d.Problem.Contains("unknown key 'colour'"));
    }

    [Fact]
    public void Missing_kind_is_the_only_problem_reported()
    {
        var d = Assert.Single(Problems(Models.Carrier([new { id = "K", members = new[] { "stub" } }])));
        Assert.Equal("$.comparisons[0]", d.JsonPath);
        Assert.Contains("missing required key 'kind'", d.Problem);
    }

    [Fact]
    public void Wall_line_members_must_stand_base_first_in_one_chain()
    {
        var model = JObject.FromObject(Models.WallLine(300, 120, 10, 3));
        model["comparisons"]![0]!["members"] = new JArray("M0", "M2", "M1");
        var ds = Problems(model);
        Assert.Contains(ds, d => d.JsonPath == "$.comparisons[0].members[1]" && d.Problem.Contains("does not start where the previous member"));
    }

    [Fact]
    public void Split_line_must_name_a_wall_or_frame_check()
    {
        var model = JObject.FromObject(Models.WallLine(300, 120, 10, 1));
        model["loadCases"] = JArray.FromObject(new[] { new { id = "L", nodalLoads = new[] { new { node = "N1", fx = 1.0 } } } });
        ((JArray)model["comparisons"]!).Add(JObject.FromObject(new { id = "S", kind = "shear-split", loadCase = "L", lines = new[] { new { check = "WL" }, new { check = "WX" } } }));
        var d = Assert.Single(Problems(model));
        Assert.Equal("$.comparisons[1].lines[1].check", d.JsonPath);
        Assert.Contains("unknown check \"WX\"", d.Problem);
        Assert.Contains("did you mean \"WL\"", d.Fix);
    }

    [Fact]
    public void Frame_story_needs_two_columns_and_one_member_per_story()
    {
        var model = JObject.FromObject(Models.Portal(156, 300, 999, 999));
        model["comparisons"]![0]!["members"] = new JArray("CA", "BM");
        var ds = Problems(model);
        Assert.Contains(ds, d => d.Problem.Contains("story 1 of the frame has 1 column(s)"));
    }

    [Fact]
    public void A_good_model_reads_its_checks_in_SI()
    {
        var m = Models.Parse(Models.Carrier([Wall(new { label = "w", x = 50.0, y = 40.0, width = 60.0, height = 40.0 })]));
        var c = Assert.IsType<PerforatedWallCheck>(Assert.Single(m.Comparisons));
        Models.Near(200 * 0.0254, c.Length, 1e-12, "length in m");
        Assert.Equal(CheckEnds.Cantilever, c.Ends);
        Assert.Equal(1.2, c.FormFactor);
        Assert.Equal("w", Assert.Single(c.Openings).Label);
    }
}

/// <summary>More reader and work-out errors for comparison checks (common practice: place, problem and fix).</summary>
public class CheckErrorTests
{
    [Fact]
    public void Empty_lists_that_would_report_nothing_are_rejected()
    {
        var wall = JObject.FromObject(Models.WallLine(300, 120, 10, 1));
        wall["comparisons"]![0]!["ends"] = new JArray();
        var d = Assert.Single(Assert.Throws<ModelInputException>(() => ModelReader.Parse(wall.ToString(), "t.json")).Diagnostics);
        Assert.Equal("$.comparisons[0].ends", d.JsonPath);

        var frame = JObject.FromObject(Models.Portal(156, 300, 999, 999));
        frame["comparisons"]![0]!["stories"] = new JArray();
        d = Assert.Single(Assert.Throws<ModelInputException>(() => ModelReader.Parse(frame.ToString(), "t.json")).Diagnostics);
        Assert.Equal("$.comparisons[0].stories", d.JsonPath);
    }

    [Fact]
    public void Wall_line_of_two_sections_is_rejected()
    {
        var m = JObject.FromObject(Models.WallLine(300, 120, 10, 2));
        ((JArray)m["sections"]!).Add(JObject.FromObject(new { id = "THIN", shape = "rectangle", b = 6.0, d = 120.0 }));
        m["members"]![1]!["section"] = "THIN";
        var d = Assert.Single(Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString(), "t.json")).Diagnostics);
        Assert.Contains("one section over the height", d.Problem);
        Assert.Equal("$.comparisons[0].members[1]", d.JsonPath);
    }

    [Fact]
    public void Frame_with_mixed_bases_is_rejected()
    {
        var m = JObject.FromObject(Models.Portal(156, 300, 999, 999));
        m["supports"]![1]!["type"] = "pinned";
        var ds = Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString(), "t.json")).Diagnostics;
        Assert.Contains(ds, x => x.Problem.Contains("mixes fixed and pinned column bases"));
    }

    [Fact]
    public void Frame_check_that_leaves_out_the_beams_is_unstable_and_says_where()
    {
        // Pinned columns without their beam are a mechanism: the error is placed at the check, not at the model.
        var m = JObject.FromObject(Models.Portal(156, 300, 999, 999, bases: "pinned"));
        m["comparisons"]![0]!["members"] = new JArray("CA", "CB");
        var model = ModelReader.Parse(m.ToString(), "t.json");
        var d = Assert.Single(Assert.Throws<ModelInputException>(() => ComparisonStudy.Run(model)).Diagnostics);
        Assert.Equal("$.comparisons[0]", d.JsonPath);
        Assert.Contains("comparison check \"P\"", d.Problem);
        Assert.Contains("unstable", d.Problem);
    }

    [Fact]
    public void Split_lines_on_different_floors_are_rejected_at_the_check()
    {
        // Two walls, one with floors at 144 and 288 in, the other at 100 and 288 in.
        var model = new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "C", E = 4031.0, nu = 0.2 } },
            sections = new object[] { new { id = "W", shape = "rectangle", b = 10.0, d = 120.0 }, new { id = "L", shape = "general", A = 1e5, I = 1.0 } },
            nodes = new[]
            {
                new { id = "a0", x = 0.0, y = 0.0 }, new { id = "a1", x = 0.0, y = 144.0 }, new { id = "a2", x = 0.0, y = 288.0 },
                new { id = "b0", x = 600.0, y = 0.0 }, new { id = "b1", x = 600.0, y = 100.0 }, new { id = "b2", x = 600.0, y = 288.0 },
            },
            members = new object[]
            {
                new { id = "wa1", start = "a0", end = "a1", section = "W", material = "C" }, new { id = "wa2", start = "a1", end = "a2", section = "W", material = "C" },
                new { id = "wb1", start = "b0", end = "b1", section = "W", material = "C" }, new { id = "wb2", start = "b1", end = "b2", section = "W", material = "C" },
                new { id = "l2", start = "a2", end = "b2", section = "L", material = "C", kind = "brace" },
            },
            supports = new[] { new { node = "a0", type = "fixed" }, new { node = "b0", type = "fixed" } },
            loadCases = new[] { new { id = "L", nodalLoads = new[] { new { node = "a2", fx = 20.0 } } } },
            comparisons = new object[]
            {
                new { id = "A", kind = "wall-line", members = new[] { "wa1", "wa2" } },
                new { id = "B", kind = "wall-line", members = new[] { "wb1", "wb2" } },
                new { id = "S", kind = "shear-split", loadCase = "L", lines = new[] { new { check = "A" }, new { check = "B" } } },
            },
        };
        var m = Models.Parse(model);
        var d = Assert.Single(Assert.Throws<ModelInputException>(() => ComparisonStudy.Run(m)).Diagnostics);
        Assert.Equal("$.comparisons[2]", d.JsonPath);
        Assert.Contains("different floor levels", d.Problem);
    }
}

public class FrameBeamReaderTests
{
    [Fact]
    public void Beam_spanning_past_a_column_is_rejected()
    {
        // Three columns and one beam member from the first to the third: the D-value needs a beam per bay.
        var model = new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "S", E = 29000.0, nu = 0.3 } },
            sections = new[] { new { id = "G", shape = "general", A = 30.0, I = 900.0 } },
            nodes = new[]
            {
                new { id = "a0", x = 0.0, y = 0.0 }, new { id = "a1", x = 0.0, y = 150.0 },
                new { id = "b0", x = 300.0, y = 0.0 }, new { id = "b1", x = 300.0, y = 150.0 },
                new { id = "c0", x = 600.0, y = 0.0 }, new { id = "c1", x = 600.0, y = 150.0 },
            },
            members = new[]
            {
                new { id = "ca", start = "a0", end = "a1", section = "G", material = "S" },
                new { id = "cb", start = "b0", end = "b1", section = "G", material = "S" },
                new { id = "cc", start = "c0", end = "c1", section = "G", material = "S" },
                new { id = "bm", start = "a1", end = "c1", section = "G", material = "S" },
            },
            supports = new[] { new { node = "a0", type = "fixed" }, new { node = "b0", type = "fixed" }, new { node = "c0", type = "fixed" } },
            stiffnessAt = new[] { new { node = "a1", direction = "x" } },
            comparisons = new[] { new { id = "F", kind = "frame-stories", members = new[] { "ca", "cb", "cc", "bm" } } },
        };
        var d = Assert.Single(Assert.Throws<ModelInputException>(() => Models.Parse(model)).Diagnostics);
        Assert.Equal("$.comparisons[0].members[3]", d.JsonPath);
        Assert.Contains("one beam member per bay", d.Problem);
    }
}
