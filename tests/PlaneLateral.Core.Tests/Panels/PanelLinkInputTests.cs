using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Tests.Input;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>Bad links between frame nodes and panel edges: each a diagnostic at its key, before any work (DEVELOPERS.md, common practice).</summary>
public class PanelLinkInputTests
{
    /// <summary>A 4 × 6 m wall (floor at 3 m, no ties unless asked) beside a one-storey column line: nodes A (x 6, y 3) and B (x 6, y 6), beams A–L3 and B–L6 ending at the wall's right edge.</summary>
    private static object Model(object[] links, bool ties = false, object[]? supports = null, object? mesh = null) => new
    {
        formatVersion = 1,
        title = "links",
        units = new { force = "kN", length = "m" },
        materials = new object[] { new { id = "C", E = 25e6, nu = 0.2 } },
        sections = new object[] { new { id = "B", shape = "rectangle", b = 0.3, d = 0.5 } },
        nodes = new object[]
        {
            new { id = "G", x = 8.0, y = 0.0 }, new { id = "A", x = 8.0, y = 3.0 }, new { id = "B", x = 8.0, y = 6.0 },
            new { id = "L3", x = 4.0, y = 3.0 }, new { id = "L6", x = 4.0, y = 6.0 },
        },
        members = new object[]
        {
            new { id = "c1", start = "G", end = "A", section = "B", material = "C" }, new { id = "c2", start = "A", end = "B", section = "B", material = "C" },
            new { id = "b3", start = "L3", end = "A", section = "B", material = "C" }, new { id = "b6", start = "L6", end = "B", section = "B", material = "C" },
        },
        supports = supports ?? [new { node = "G", type = "fixed" }],
        loadCases = new[] { new { id = "wind", nodalLoads = new[] { new { node = "B", fx = 100.0 } } } },
        panels = new[]
        {
            new
            {
                id = "W", length = 4.0, height = 6.0, thickness = 0.2, material = "C", floorLevels = new[] { 3.0 }, floorTies = ties,
                mesh = mesh ?? new { element = "quad9", elementSize = 0.5 },
                links,
            },
        },
    };

    private static object Link(string node, string edge, double from, double to) => new { node, edge, from, to };

    private static readonly object[] Good = [Link("L3", "right", 2.75, 3.25), Link("L6", "right", 5.75, 6.0)];

    [Fact]
    public void AWallBesideAFrameIsReadAndSolvedAsOne()
    {
        var r = Solve(Model(Good));
        PanelLinkTests.AssertWhole(r);
        var c = r.PanelLinks!.Cases[0];
        Assert.Equal(2, c.Forces.Count);
        // The wall is far stiffer than the column: it takes most of the storey shear through the links (common practice).
        Assert.True(-c.Forces.Sum(f => f.Fx) < 0 && c.Forces.Sum(f => f.Fx) > 0.5 * 100e3, $"link shears {string.Join(", ", c.Forces.Select(f => f.Fx))}");
        var files = ResultFiles.Render(ModelRun.Run(r.Model));
        var csv = files.Single(f => f.Name == "panel-links.csv").Text.Split('\n');
        Assert.StartsWith("panel,node,case,Fx [kN],Fy [kN],Mz [kN·m]", csv[0]);
        Assert.Equal(ResultFiles.Render(ModelRun.Run(Parse(Model(Good)))), files);   // byte-identical run to run
    }

    [Theory]
    [InlineData("node", "$.panels[0].links[0].node", "unknown node \"Q\"")]
    [InlineData("edge", "$.panels[0].links[0].edge", "unknown edge \"middle\"")]
    [InlineData("bottom", "$.panels[0].links[0].edge", "cannot be on the bottom edge")]
    [InlineData("off", "$.panels[0].links[0].to", "off the panel's right edge")]
    [InlineData("reversed", "$.panels[0].links[0].to", "before it starts")]
    [InlineData("base", "$.panels[0].links[0].from", "reaches the panel's base")]
    [InlineData("nomesh", "$.panels[0].links[0]", "where the mesh has no node")]
    [InlineData("twice", "$.panels[0].links[1]", "is linked to this panel twice")]
    [InlineData("overlap", "$.panels[0].links[1]", "overlaps the link of node \"L3\"")]
    [InlineData("corner", "$.panels[0].links[1]", "overlaps the link of node \"L6\"")]
    [InlineData("tie", "$.panels[0].links[0]", "holds a node of a floor tie")]
    [InlineData("support", "$.panels[0].links[0]", "also held by a support")]
    public void EachBadLinkIsReportedAtItsKey(string what, string path, string problem)
    {
        var m = what switch
        {
            "node" => Model([Link("Q", "right", 2.75, 3.25)]),
            "edge" => Model([Link("L3", "middle", 2.75, 3.25)]),
            "bottom" => Model([new { node = "L3", edge = "bottom" }]),
            "off" => Model([Link("L3", "right", 2.75, 6.5)]),
            "reversed" => Model([Link("L3", "right", 3.25, 2.75)]),
            "base" => Model([Link("L3", "right", 0, 3.25)]),
            "nomesh" => Model([Link("L3", "right", 2.8, 2.9)]),
            "twice" => Model([Link("L3", "right", 2.75, 3.25), Link("L3", "right", 4.5, 5.0)]),
            "overlap" => Model([Link("L3", "right", 2.75, 3.25), Link("L6", "right", 3.0, 6.0)]),
            "corner" => Model([Link("L6", "right", 5.75, 6.0), new { node = "L3", edge = "top", from = 3.0, to = 4.0 }]),
            "tie" => Model([Link("L3", "right", 2.75, 3.25)], ties: true),
            _ => Model(Good, supports: [new { node = "G", type = "fixed" }, new { node = "L3", type = "pinned" }]),
        };
        var e = Assert.Throws<ModelInputException>(() => Parse(m));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == path && d.Problem.Contains(problem) && d.Line > 0 && d.Fix.Length > 0);
    }

    [Fact]
    public void ASecondOrderCheckBesideLinksIsNoLongerRefused()
    {
        // It was refused while its geometric stiffness and story vertical load saw the members only; both now include
        // the linked panels (LinkedPanelSecondOrderTests), so the model reads without error.
        var o = ToJObject(PanelLinkTests.SlenderWall(1, 6, 10));
        o["loadCases"] = Newtonsoft.Json.Linq.JArray.FromObject(new object[] { new { id = "G", nodalLoads = new[] { new { node = "T", fy = -10.0 } } } });
        ((Newtonsoft.Json.Linq.JArray)o["nodes"]!).Add(Newtonsoft.Json.Linq.JObject.FromObject(new { id = "B", x = 0.5, y = 0.0 }));
        o["members"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "strut", start = "B", end = "T", section = "COL", material = "C", kind = "brace" } });
        o["supports"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { node = "B", type = "fixed" } });
        o["levels"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "L0", elevation = 0.0, diaphragm = "none" }, new { id = "L1", elevation = 6.0, diaphragm = "rigid" } });
        o["seismic"] = Newtonsoft.Json.Linq.JObject.FromObject(new { loadCase = "ELF", weights = new[] { new { level = "L1", weight = 100.0 } }, baseShear = 10.0, secondOrder = new { gravity = "G", Cd = 4.0 } });
        var m = ModelReader.Parse(o.ToString(), "test.json");
        Assert.NotNull(m.Seismic!.SecondOrder);
    }

    [Fact]
    public void AOneNodeSegmentLeavesTheFrameNodeFreeToTurnAndTheMechanismIsNamed()
    {
        // One panel node on the segment restrains the frame node's u and v through the rigid arm but not its rotation
        // about that point; with no member there the node turns freely (a mechanism, common practice), named by node and DOF.
        var o = ToJObject(PanelLinkTests.SlenderWall(1, 6, 10));
        o["panels"]![0]!["links"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { node = "T", edge = "top", from = 0.5, to = 0.5 } });
        var e = Assert.Throws<UnstableModelException>(() => LinearStaticAnalysis.Run(ModelReader.Parse(o.ToString(), "test.json")));
        Assert.Contains("T rz", e.Message);
    }

    [Fact]
    public void TheShippedDemoSolvesFromTheCommandLineWithALinkTable()
    {
        string out1 = Path.Combine(Path.GetTempPath(), "planelateral-links-" + Environment.ProcessId);
        try
        {
            var (code, stdout, stderr) = CliRun.Run("solve", RepositoryFiles.ModelPath("panels/wall-in-frame.json"), "--out", out1);
            Assert.True(code == 0, stderr);
            Assert.Contains("Panel links (frame node to panel edge", stdout);
            Assert.True(File.Exists(Path.Combine(out1, "panel-links.csv")) && File.Exists(Path.Combine(out1, "panel-link-checks.csv")));
            var r = LinearStaticAnalysis.Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("panels/wall-in-frame.json")));
            AssertChecks(r);
            PanelLinkTests.AssertWhole(r);
            // A stiff wall beside a flexible frame takes most of the storey shear through the drag beams, and the frame
            // keeps a positive share of the 95 kN applied to it (common practice).
            double passed = r.PanelLinks!.Cases[0].Forces.Sum(f => f.Fx);
            Assert.InRange(passed, 0.5 * 95e3, 95e3);
        }
        finally { if (Directory.Exists(out1)) Directory.Delete(out1, true); }
    }

    [Fact]
    public void AFrameNodeLinkedToAPanelAndNothingElseCountsAsConnected()
    {
        // Without the link, node "T" would be refused as unconnected (ModelReader's connectivity check).
        var r = Solve(PanelLinkTests.SlenderWall(1, 6, 10));
        Assert.Single(r.PanelLinks!.Cases);
    }
}
