using Newtonsoft.Json.Linq;
using NJsonSchema;
using PlaneLateral.Model;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Seismic;

/// <summary>docs/model.schema.json and the reader agree on the seismic block (common practice: SchemaTests' rule).</summary>
public class SeismicSchemaTests
{
    private static readonly Lazy<JsonSchema> Schema = new(() => JsonSchema.FromFileAsync(RepositoryFiles.SchemaPath).GetAwaiter().GetResult());

    private static JObject EveryKey() => SeismicModels.ShearBuilding(3.5, [800, 800], [500e3, 400e3], new
    {
        structureType = "concrete-moment-frame",
        spectrum = new { SDS = 1.0, SD1 = 0.6, R = 8.0, Ie = 1.25, TL = 8.0, S1 = 0.7 },
        period = 0.8,
        modes = 2,
        secondOrder = new { gravity = "EQ", Cd = 5.5, Ie = 1.0, beta = 0.9 },
        responseSpectrum = new { combination = "SRSS", damping = 0.03, Cd = 5.5, modes = 2, points = new[] { new[] { 0.0, 0.4 }, new[] { 0.2, 1.0 }, new[] { 2.0, 0.1 } } },
    });

    [Fact]
    public void EveryKeyPassesBoth()
    {
        var m = EveryKey();
        Assert.Empty(Schema.Value.Validate(m.ToString()));
        Assert.NotNull(ModelReader.Parse(m.ToString()).Seismic);
    }

    [Fact]
    public void EverySeismicKeyIsInTheSchema()
    {
        var defs = (JObject)JObject.Parse(File.ReadAllText(RepositoryFiles.SchemaPath))["definitions"]!;
        var keys = ((JObject)defs["seismic"]!["properties"]!).Properties().Select(p => p.Name).Order(StringComparer.Ordinal);
        Assert.Equal(new[] { "baseShear", "loadCase", "modes", "period", "responseSpectrum", "secondOrder", "spectrum", "structureType", "weights" }, keys);
    }

    public static TheoryData<string, object> Wrong() => new()
    {
        { "negative weight", new JObject { ["weights"] = new JArray(new JObject { ["level"] = "L1", ["weight"] = -1.0 }, new JObject { ["level"] = "L2", ["weight"] = 1.0 }) } },
        { "R out of range", new JObject { ["spectrum"] = new JObject { ["SDS"] = 1.0, ["SD1"] = 0.6, ["R"] = 9.0, ["TL"] = 8.0 } } },
        { "unknown period choice", new JObject { ["period"] = "longest" } },
        { "beta above 1", new JObject { ["secondOrder"] = new JObject { ["gravity"] = "EQ", ["Cd"] = 4.0, ["beta"] = 1.2 } } },
        { "unknown key", new JObject { ["shear"] = 1.0 } },
        { "damping out of range", new JObject { ["responseSpectrum"] = new JObject { ["Cd"] = 4.0, ["damping"] = 0.6 } } },
        { "unknown combination", new JObject { ["responseSpectrum"] = new JObject { ["Cd"] = 4.0, ["combination"] = "ABS" } } },
        { "negative spectrum value", new JObject { ["responseSpectrum"] = new JObject { ["Cd"] = 4.0, ["points"] = new JArray(new JArray(0.0, 0.4), new JArray(1.0, -0.1)) } } },
    };

    [Theory]
    [MemberData(nameof(Wrong))]
    public void WrongSnippetsFailBoth(string what, object change)
    {
        var m = EveryKey();
        ((JObject)m["seismic"]!).Merge((JObject)change, new JsonMergeSettings { MergeArrayHandling = MergeArrayHandling.Replace });
        Assert.True(Schema.Value.Validate(m.ToString()).Count > 0, $"schema accepts: {what}");
        Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString()));
    }
}
