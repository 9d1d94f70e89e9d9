using Newtonsoft.Json.Linq;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>
/// Bad building input gives one message per problem with place (line, JSON path) and fix, all at once — the project's
/// error contract (DEVELOPERS.md), so common practice. Range limits for C_d and I_e: ASCE 7-16 Tables 12.2-1 and 1.5-2
/// (from memory).
/// </summary>
public class BuildingInputTests
{
    private static JObject Good()
    {
        var m = ToJObject(BuildingModels.ShearBuilding(3.6, [800, 800, 800], [10, 20, 30]));
        m["driftChecks"] = JArray.FromObject(new[] { new { id = "seismic", cases = new[] { "EQ" }, Cd = 5.0, Ie = 1.0, allowedRatio = 0.02 } });
        return m;
    }

    private static ModelInputException Fails(JObject m) => Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString(), "bad.json"));

    private static ModelDiagnostic Single(ModelInputException e, string fragment)
    {
        var hits = e.Diagnostics.Where(d => d.Problem.Contains(fragment)).ToList();
        Assert.True(hits.Count == 1, $"expected one diagnostic containing '{fragment}', got:\n{e.Message}");
        Assert.False(string.IsNullOrWhiteSpace(hits[0].Fix), "every problem carries a fix");
        Assert.True(hits[0].Line > 0, "every problem carries a line");
        Assert.StartsWith("$.", hits[0].JsonPath);
        return hits[0];
    }

    [Fact]
    public void GoodModelReads()
    {
        var m = ModelReader.Parse(Good().ToString());
        Assert.Equal(4, m.Building.Levels.Count);
        Assert.Equal([0, 1], m.Building.Levels[0].Nodes);                 // the base: both supports, no tie
        Assert.Empty(m.Building.Levels[0].TiedNodes);
        Assert.Equal(2, m.Building.Levels[3].TiedNodes.Count);
    }

    [Fact]
    public void LevelWithNoNodes()
    {
        var m = Good();
        ((JArray)m["levels"]!).Add(JObject.FromObject(new { id = "L9", elevation = 50.0 }));
        var d = Single(Fails(m), "has no nodes");
        Assert.Equal("$.levels[4].elevation", d.JsonPath);
    }

    [Fact]
    public void TieAcrossASupport()
    {
        var m = Good();
        m["levels"]![0]!["diaphragm"] = "rigid";   // the base nodes are fixed
        var e = Fails(m);
        Assert.Equal(2, e.Diagnostics.Count(d => d.Problem.Contains("which a support holds in x")));
        Assert.Contains("\"diaphragm\": \"none\"", e.Diagnostics[0].Fix);
    }

    [Fact]
    public void DuplicateLevelsAndElevations()
    {
        var m = Good();
        ((JArray)m["levels"]!).Add(JObject.FromObject(new { id = "L1", elevation = 7.2, diaphragm = "none" }));
        ((JArray)m["levels"]!).Add(JObject.FromObject(new { id = "roof again", elevation = 10.8, diaphragm = "none" }));
        var e = Fails(m);
        Single(e, "duplicate level id \"L1\"");
        Assert.Equal(2, e.Diagnostics.Count(d => d.Problem.Contains("have the same elevation") && d.Line > 0 && d.Fix.Length > 0));
        Single(e, "levels \"L3\" and \"roof again\" have the same elevation 10.8 m");
    }

    [Theory]
    [InlineData("Cd", 0.5, "C_d = 0.5 is out of range")]
    [InlineData("Cd", 8.0, "C_d = 8 is out of range")]
    [InlineData("Ie", 0.8, "I_e = 0.8 is out of range")]
    [InlineData("Ie", 2.0, "I_e = 2 is out of range")]
    [InlineData("allowedRatio", 2.0, "allowable drift ratio 2 is out of range")]
    public void DriftFactorsOutOfRange(string key, double value, string problem)
    {
        var m = Good();
        m["driftChecks"]![0]![key] = value;
        Assert.Equal($"$.driftChecks[0].{key}", Single(Fails(m), problem).JsonPath);
    }

    [Fact]
    public void UnknownNamesInPresetsAndChecks()
    {
        var m = Good();
        m["driftChecks"]![0]!["cases"] = new JArray("EQ", "EQX");
        var check = (JObject)m["driftChecks"]![0]!;
        check.Remove("allowedRatio");
        check["allowed"] = JObject.FromObject(new { structure = "steel frame", riskCategory = "V" });
        m["crackedSections"] = JObject.FromObject(new { preset = "aci318", walls = "half", lines = new[] { "frame", "core" }, roles = new { colum = new { I = 0.7 }, wall = new { I = 0.35 } } });
        var e = Fails(m);
        // Every problem at once.
        Single(e, "unknown load case or combination \"EQX\"");
        Single(e, "unknown structure type \"steel frame\"");
        Single(e, "unknown risk category \"V\"");
        Single(e, "unknown cracked-section preset \"aci318\"");
        Single(e, "unknown wall state \"half\"");
        Single(e, "unknown line \"core\"");
        Assert.Contains("\"column\"", Single(e, "unknown role \"colum\"").Fix);
        Single(e, "no member has the role \"wall\"");
        Assert.Equal(8, e.Diagnostics.Count);
    }

    [Fact]
    public void PresetForFourStoriesRefusesATallerModel()
    {
        var m = ToJObject(BuildingModels.ShearBuilding(3.6, [800, 800, 800, 800, 800], [10, 20, 30, 40, 50]));
        m["driftChecks"] = JArray.FromObject(new[] { new { id = "d", cases = new[] { "EQ" }, Cd = 5.0, allowed = new { structure = "four-stories-or-fewer", riskCategory = "II" } } });
        Single(Fails(m), "four stories or fewer; the model has 5 stories");   // ASCE 7-16 Table 12.12-1 row heading
    }

    [Fact]
    public void NodeInTwoDiaphragms()
    {
        var m = Good();
        m["levels"]![2]!["nodes"] = new JArray("A2", "B2", "A3");
        Single(Fails(m), "is tied by the diaphragms of both level");
    }

    [Fact]
    public void DriftCheckWithoutLevels()
    {
        var m = Good();
        m.Remove("levels");
        Single(Fails(m), "drift checks need stories");
    }

    [Fact]
    public void UnknownKeyInALevelIsCaught()
    {
        var m = Good();
        m["levels"]![1]!["diafragm"] = "rigid";
        Single(Fails(m), "unknown key 'diafragm'");
    }
}
