using Newtonsoft.Json.Linq;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// Each kind of bad input gives its own message with place (line, JSON path) and fix; all problems come at once.
/// The expectations are the project's own error contract (docs/model-format.md), so they are common practice, not a source.
/// </summary>
public class ModelErrorTests
{
    private static JObject Good() => ToJObject(Cantilever(144, 10, new { id = "S", shape = "rectangle", b = 12.0, d = 120.0 }, new { id = "MAT", E = 3605.0, nu = 0.2 }, 2));

    private static ModelInputException Fails(JObject model) => Fails(model.ToString());

    private static ModelInputException Fails(string json) => Assert.Throws<ModelInputException>(() => ModelReader.Parse(json, "bad.json"));

    private static ModelDiagnostic Single(ModelInputException e, string problemFragment)
    {
        var hits = e.Diagnostics.Where(d => d.Problem.Contains(problemFragment)).ToList();
        Assert.True(hits.Count == 1, $"expected one diagnostic containing '{problemFragment}', got:\n{e.Message}");
        Assert.False(string.IsNullOrWhiteSpace(hits[0].Fix), "every problem carries a fix");
        Assert.True(hits[0].Line > 0, "every problem carries a line");
        return hits[0];
    }

    [Fact]
    public void GoodModelReads() => Assert.Equal(3, ModelReader.Parse(Good().ToString()).Nodes.Count);

    [Fact]
    public void MalformedJsonGivesLineColumnAndPath()
    {
        string json = "{\n  \"formatVersion\": 1,\n  \"nodes\": [\n    {\"id\": \"A\", \"x\": 0 \"y\": 0}\n  ]\n}";
        var e = Fails(json);
        var d = Assert.Single(e.Diagnostics);
        Assert.Equal(4, d.Line);
        Assert.True(d.Column > 0);
        Assert.StartsWith("$.nodes[0]", d.JsonPath);
        Assert.Contains("not valid JSON", d.Problem);
        Assert.Contains("bad.json:4:", d.ToString());
    }

    [Fact]
    public void TrailingTextAfterTheModelIsAnError() => Assert.Contains("not valid JSON", Assert.Single(Fails(Good() + "\n}").Diagnostics).Problem);

    [Fact]
    public void DuplicateKeyIsAnError() => Assert.Contains("not valid JSON", Assert.Single(Fails("{\"formatVersion\": 1, \"formatVersion\": 1}").Diagnostics).Problem);

    [Fact]
    public void UnknownNodeReferenceSuggestsTheNearestId()
    {
        var m = Good();
        m["members"]![1]!["end"] = "n2";
        var d = Single(Fails(m), "unknown node \"n2\"");
        Assert.Equal("$.members[1].end", d.JsonPath);
        Assert.Contains("\"N2\"", d.Fix);
    }

    [Fact]
    public void UnknownSectionAndMaterial()
    {
        var m = Good();
        m["members"]![0]!["section"] = "S9";
        m["members"]![1]!["material"] = "concrete";
        var e = Fails(m);
        Assert.Equal("$.members[0].section", Single(e, "unknown section \"S9\"").JsonPath);
        Assert.Equal("$.members[1].material", Single(e, "unknown material \"concrete\"").JsonPath);
    }

    [Fact]
    public void DuplicateIds()
    {
        var m = Good();
        m["members"]![1]!["id"] = "M0";
        ((JArray)m["nodes"]!).Add(JObject.FromObject(new { id = "N1", x = 50.0, y = 0.0 }));
        var e = Fails(m);
        Single(e, "duplicate member id \"M0\"");
        Single(e, "duplicate node id \"N1\"");
    }

    [Fact]
    public void ZeroLengthMember()
    {
        var m = Good();
        m["members"]![1]!["end"] = "N1";
        Single(Fails(m), "zero length");
    }

    [Fact]
    public void AMemberThatFailsToReadIsNotReportedAgainWhereItIsLoaded()
    {
        var m = Good();
        m["members"]![1]!["end"] = "N1";
        m["loadCases"]![0]!["memberLoads"] = JArray.FromObject(new[] { new { member = "M1", direction = "x", w = 1.0 } });
        var e = Fails(m);
        Single(e, "zero length");
        Assert.DoesNotContain(e.Diagnostics, d => d.Problem.Contains("unknown member"));
    }

    [Fact]
    public void AnUnknownShapeIsOneMessage()
    {
        var m = Good();
        m["sections"]![0]!["shape"] = "rect";
        var d = Assert.Single(Fails(m).Diagnostics);
        Assert.Contains("unknown section shape \"rect\"", d.Problem);
    }

    [Fact]
    public void NullValuesAreReported()
    {
        var m = Good();
        m["title"] = JValue.CreateNull();
        Assert.Equal("$.title", Single(Fails(m), "'title' is null").JsonPath);
    }

    [Fact]
    public void CoincidentNodes()
    {
        var m = Good();
        m["nodes"]![2]!["y"] = 72.0;
        Single(Fails(m), "stands at the same point");
    }

    [Theory]
    [InlineData("materials", 0, "E", -3605.0, "must be greater than zero")]
    [InlineData("materials", 0, "E", 0.0, "must be greater than zero")]
    [InlineData("sections", 0, "b", 0.0, "must be greater than zero")]
    [InlineData("sections", 0, "d", -1.0, "must be greater than zero")]
    public void NonPositiveProperties(string array, int index, string key, double value, string fragment)
    {
        var m = Good();
        m[array]![index]![key] = value;
        Assert.Equal($"$.{array}[{index}].{key}", Single(Fails(m), fragment).JsonPath);
    }

    [Fact]
    public void NonPositiveAreaAndInertiaOfGeneralSection()
    {
        var m = Good();
        m["sections"]![0] = JObject.FromObject(new { id = "S", shape = "general", A = 0.0, I = -5.0 });
        var e = Fails(m);
        Single(e, "area 'A'");
        Single(e, "second moment of area 'I'");
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(-1.0)]
    [InlineData(0.7)]
    public void PoissonRatioOutsideRange(double nu)
    {
        var m = Good();
        m["materials"]![0]!["nu"] = nu;
        Assert.Equal("$.materials[0].nu", Single(Fails(m), "Poisson's ratio").JsonPath);
    }

    [Fact]
    public void UnknownUnits()
    {
        var m = Good();
        m["units"] = JObject.FromObject(new { force = "tonne", length = "yard" });
        var e = Fails(m);
        Assert.Contains("kip", Single(e, "unknown force unit \"tonne\"").Fix);
        Assert.Contains("mm", Single(e, "unknown length unit \"yard\"").Fix);
    }

    [Fact]
    public void NoSupports()
    {
        var m = Good();
        m["supports"] = new JArray();
        Single(Fails(m), "no supports");
    }

    [Fact]
    public void UnknownKeyIsNamedWithTheKnownOnes()
    {
        var m = Good();
        m["members"]![0]!["sectoin"] = "S";
        var d = Single(Fails(m), "unknown key 'sectoin'");
        Assert.Contains("section", d.Fix);
        // A typo of a known key is named as such (common practice: suggestions by edit distance, as for unknown ids).
        Assert.Contains("(did you mean \"section\"?)", d.Problem);
        var far = Good();
        far["members"]![0]!["colour"] = "red";
        Assert.DoesNotContain("did you mean", Single(Fails(far), "unknown key 'colour'").Problem);
    }

    [Fact]
    public void WrongTypesAndMissingKeys()
    {
        var m = Good();
        m["nodes"]![1]!["x"] = "zero";
        ((JObject)m["nodes"]![2]!).Remove("y");
        var e = Fails(m);
        Single(e, "'x' must be a number, found the string \"zero\"");
        Single(e, "missing required key 'y'");
    }

    [Fact]
    public void MissingOrWrongFormatVersion()
    {
        var m = Good();
        m.Remove("formatVersion");
        Single(Fails(m), "'formatVersion'");
        m["formatVersion"] = 7;
        Single(Fails(m), "reads format version 1");
    }

    [Fact]
    public void DisconnectedNode()
    {
        var m = Good();
        ((JArray)m["nodes"]!).Add(JObject.FromObject(new { id = "LOOSE", x = 500.0, y = 0.0 }));
        Single(Fails(m), "not connected to any member");
    }

    [Fact]
    public void TransverseLoadOnBraceIsRefused()
    {
        var m = Good();
        m["members"]![0]!["kind"] = "brace";
        m["loadCases"]![0]!["memberLoads"] = JArray.FromObject(new[] { new { member = "M0", direction = "x", w = 1.0 } });
        Single(Fails(m), "carries axial force only");
    }

    [Fact]
    public void EveryProblemIsListedAtOnce()
    {
        var m = Good();
        m["materials"]![0]!["E"] = -1.0;
        m["members"]![0]!["start"] = "NOPE";
        m["units"] = JObject.FromObject(new { force = "kip", length = "furlong" });
        m["supports"]![0]!["type"] = "clamped";
        var e = Fails(m);
        Assert.True(e.Diagnostics.Count >= 4, e.Message);
        Assert.Equal(e.Diagnostics.Count, e.Message.Split('\n').Length - 1);
    }

    [Fact]
    public void NonFiniteNumbersAreRefused()
    {
        // JSON has no NaN or Infinity; a reader that allowed them must still refuse them as values.
        string json = Good().ToString().Replace("\"E\": 3605.0", "\"E\": NaN");
        var e = Fails(json);
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("not a finite number") || d.Problem.Contains("not valid JSON"));
    }

    [Fact]
    public void AbsurdMagnitudesAreRefused()
    {
        // Found by the property-based fuzzer (Fuzz/ReaderPropertyTests): a load of 1e308 overflowed to NaN displacements.
        var m = Good();
        m["loadCases"]![0]!["nodalLoads"]![0]!["fx"] = 1e308;
        Assert.Equal("$.loadCases[0].nodalLoads[0].fx", Single(Fails(m), "beyond the range accepted").JsonPath);
    }

    [Fact]
    public void SpringOnRestrainedDirection()
    {
        var m = Good();
        m["supports"]![0] = JObject.FromObject(new { node = "N0", type = "fixed", springs = new { x = 100.0 } });
        Single(Fails(m), "already holds rigidly");
    }

    [Fact]
    public void RigidZonesLongerThanTheMember()
    {
        var m = Good();
        m["members"]![0]!["rigidZones"] = JObject.FromObject(new { start = 40.0, end = 40.0 });
        Single(Fails(m), "leave no flexible length");
    }

    [Fact]
    public void StiffnessPointAtRestrainedDirection()
    {
        var m = Good();
        m["stiffnessAt"] = JArray.FromObject(new[] { new { node = "N0", direction = "x" } });
        Single(Fails(m), "infinite");
    }

    [Fact]
    public void CombinationOfUnknownCase()
    {
        var m = Good();
        m["combinations"] = JArray.FromObject(new[] { new { id = "C1", factors = new Dictionary<string, double> { ["Q"] = 1.5 } } });
        Assert.Equal("$.combinations[0].factors.Q", Single(Fails(m), "unknown load case \"Q\"").JsonPath);
    }

    [Fact]
    public void MissingFileIsReported()
    {
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ReadFile("/nonexistent/folder/model.json"));
        Assert.Contains("cannot read the file", Assert.Single(e.Diagnostics).Problem);
    }
}
