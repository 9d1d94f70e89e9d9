using Newtonsoft.Json.Linq;
using NJsonSchema;
using NJsonSchema.Validation;
using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>Files of the repository the tests read (models, docs), found from the test binary's folder.</summary>
internal static class RepositoryFiles
{
    private static readonly Lazy<string> RootPath = new(() =>
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "PlaneLateral.sln"))) return dir.FullName;
        throw new InvalidOperationException($"no folder above {AppContext.BaseDirectory} holds PlaneLateral.sln");
    });

    /// <summary>The folder that holds PlaneLateral.sln.</summary>
    public static string Root => RootPath.Value;

    public static string SchemaPath => Path.Combine(Root, "docs", "model.schema.json");

    /// <summary>Every models/**/*.json, relative to models/, with '/' separators, sorted.</summary>
    public static IReadOnlyList<string> Models(string under = "") =>
        Directory.EnumerateFiles(Path.Combine(Root, "models", under), "*.json", SearchOption.AllDirectories)
            .Select(p => Path.GetRelativePath(Path.Combine(Root, "models"), p).Replace('\\', '/'))
            .Order(StringComparer.Ordinal)
            .ToList();

    public static string ModelPath(string relative) => Path.Combine(Root, "models", relative);
}

/// <summary>
/// docs/model.schema.json against the shipped models and against deliberately wrong snippets. Every wrong snippet
/// must be rejected by the schema and by the reader alike, and a model using every optional key must pass both, so the
/// schema and the reader cannot drift apart unnoticed.
/// </summary>
public class SchemaTests
{
    private static readonly Lazy<JsonSchema> Schema = new(() => JsonSchema.FromFileAsync(RepositoryFiles.SchemaPath).GetAwaiter().GetResult());

    private static ICollection<ValidationError> Validate(string json) => Schema.Value.Validate(json);

    private static string Describe(IEnumerable<ValidationError> errors) =>
        string.Join("\n", errors.Select(e => $"  {e.Path} (line {e.LineNumber}): {e.Kind}" +
            (e is ChildSchemaValidationError c ? " [" + string.Join("; ", c.Errors.SelectMany(kv => kv.Value).Select(x => $"{x.Path}: {x.Kind}")) + "]" : "")));

    public static TheoryData<string> ShippedModels() => new(RepositoryFiles.Models());

    [Fact]
    public void TheShippedModelsAreFound()
    {
        var all = RepositoryFiles.Models();
        Assert.Contains("demo-clinic.json", all);
        Assert.True(all.Count(m => m.StartsWith("verification/", StringComparison.Ordinal)) >= 5, "at least five verification models");
    }

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public void EveryShippedModelIsValidAgainstTheSchema(string model)
    {
        var errors = Validate(File.ReadAllText(RepositoryFiles.ModelPath(model)));
        Assert.True(errors.Count == 0, $"{model} breaks the schema:\n{Describe(errors)}");
    }

    [Fact]
    public void TheSchemaIsDraft07()
    {
        var schema = JObject.Parse(File.ReadAllText(RepositoryFiles.SchemaPath));
        Assert.Equal("http://json-schema.org/draft-07/schema#", (string?)schema["$schema"]);
        Assert.False((bool)schema["additionalProperties"]!);
    }

    /// <summary>The worked example of docs/model-format.md: a valid model both the schema and the reader accept.</summary>
    private const string Base = """
        {
          "formatVersion": 1,
          "title": "Cantilever wall",
          "units": { "force": "kip", "length": "in" },
          "materials": [ { "id": "C", "E": 3600, "nu": 0.2 } ],
          "sections": [ { "id": "WALL", "shape": "rectangle", "b": 10, "d": 120 } ],
          "nodes": [ { "id": "B", "x": 0, "y": 0 }, { "id": "T", "x": 0, "y": 144 } ],
          "members": [ { "id": "W", "start": "B", "end": "T", "section": "WALL", "material": "C", "role": "wall" } ],
          "supports": [ { "node": "B", "type": "fixed" } ],
          "loadCases": [ { "id": "P", "nodalLoads": [ { "node": "T", "fx": 50 } ],
                           "memberLoads": [ { "member": "W", "direction": "x", "w": 0.1 } ] } ],
          "stiffnessAt": [ { "node": "T", "direction": "x" } ]
        }
        """;

    [Fact]
    public void TheBaseSnippetIsValid()
    {
        Assert.Empty(Validate(Base));
        ModelReader.Parse(Base, "base.json");
    }

    [Fact]
    public void TheWorkedExampleInTheDocsIsValidAndGivesItsHandResult()
    {
        // The JSON block of "Worked example" in docs/model-format.md, checked as written there.
        string doc = File.ReadAllText(Path.Combine(RepositoryFiles.Root, "docs", "model-format.md"));
        int section = doc.IndexOf("## Worked example", StringComparison.Ordinal);
        Assert.True(section >= 0, "docs/model-format.md has no worked example");
        int start = doc.IndexOf("```json", section, StringComparison.Ordinal) + "```json".Length;
        string json = doc[start..doc.IndexOf("```", start, StringComparison.Ordinal)];
        var errors = Validate(json);
        Assert.True(errors.Count == 0, $"the worked example breaks the schema:\n{Describe(errors)}");
        var result = LinearStaticAnalysis.Run(ModelReader.Parse(json, "worked-example.json"));
        TestModels.AssertChecks(result);
        // By hand (docs/model-format.md): PL³/(3EI) + PL/(G·A_s) = 0.0096 + 0.0048 = 0.0144 in.
        var m = result.Model;
        TestModels.Near(0.0144, m.Units.FromSI(result.Cases[0].Displacement(m.NodeIndex("T"), Dof.X), PlaneLateral.Units.Quantity.Length), 1e-9, "worked example tip");
    }

    private static readonly Dictionary<string, Action<JObject>> Mistakes = new()
    {
        ["unknown top-level key"] = m => m["unitz"] = new JObject(),
        ["unknown key in a member"] = m => m["members"]![0]!["sectoin"] = "WALL",
        ["unknown key in units"] = m => m["units"]!["moment"] = "kip-in",
        ["wrong type: coordinate as a string"] = m => m["nodes"]![1]!["y"] = "144",
        ["wrong type: nodes as an object"] = m => m["nodes"] = new JObject(),
        ["wrong type: formatVersion 1.0"] = m => m["formatVersion"] = 1.0,
        ["missing formatVersion"] = m => m.Remove("formatVersion"),
        ["missing members"] = m => m.Remove("members"),
        ["missing node x"] = m => ((JObject)m["nodes"]![0]!).Remove("x"),
        ["formatVersion 2"] = m => m["formatVersion"] = 2,
        ["bad enum: support type"] = m => m["supports"]![0]!["type"] = "fix",
        ["bad enum: force unit"] = m => m["units"]!["force"] = "KN",
        ["bad enum: section shape"] = m => m["sections"]![0]!["shape"] = "rect",
        ["bad enum: member kind"] = m => m["members"]![0]!["kind"] = "truss",
        ["bad enum: moment release"] = m => m["members"]![0]!["momentReleases"] = new JArray("middle"),
        ["bad enum: stiffness direction"] = m => m["stiffnessAt"]![0]!["direction"] = "rz",
        ["material with both nu and G"] = m => m["materials"]![0]!["G"] = 1500,
        ["material with neither nu nor G"] = m => ((JObject)m["materials"]![0]!).Remove("nu"),
        ["negative E"] = m => m["materials"]![0]!["E"] = -3600,
        ["Poisson's ratio 0.5"] = m => m["materials"]![0]!["nu"] = 0.5,
        ["rectangle with an I-shape key"] = m => m["sections"]![0]!["tw"] = 0.5,
        ["shear factor below 1"] = m => m["sections"]![0]!["shearFactor"] = 0.9,
        ["empty id"] = m => m["nodes"]![1]!["id"] = "",
        ["local member load in direction y"] = m => { m["loadCases"]![0]!["memberLoads"]![0]!["axes"] = "local"; m["loadCases"]![0]!["memberLoads"]![0]!["direction"] = "y"; },
        ["member load with w and wStart"] = m => m["loadCases"]![0]!["memberLoads"]![0]!["wStart"] = 0.2,
        ["member load without intensity"] = m => ((JObject)m["loadCases"]![0]!["memberLoads"]![0]!).Remove("w"),
        ["restrain without custom"] = m => m["supports"]![0]!["restrain"] = new JArray("x"),
        ["custom support holding nothing"] = m => m["supports"]![0]!["type"] = "custom",
        ["negative spring"] = m => { m["supports"]![0]!["type"] = "pinned"; m["supports"]![0]!["springs"] = new JObject { ["rz"] = -1.0 }; },
        ["negative rigid zone"] = m => m["members"]![0]!["rigidZones"] = new JObject { ["start"] = -1.0 },
        ["zero stiffness modifier"] = m => m["members"]![0]!["modifiers"] = new JObject { ["I"] = 0 },
        ["empty supports"] = m => m["supports"] = new JArray(),
        ["nothing to solve"] = m => { m.Remove("loadCases"); m.Remove("stiffnessAt"); },
        ["combination without factors"] = m => m["combinations"] = new JArray(new JObject { ["id"] = "C", ["factors"] = new JObject() }),
        ["combination factor as a string"] = m => m["combinations"] = new JArray(new JObject { ["id"] = "C", ["factors"] = new JObject { ["P"] = "1.2" } }),
        ["panel-wall check without a panel"] = m => m["comparisons"] = new JArray(new JObject { ["id"] = "K", ["kind"] = "panel-wall" }),
        ["panel-wall check with a shear factor below 1"] = m => m["comparisons"] = new JArray(new JObject { ["id"] = "K", ["kind"] = "panel-wall", ["panel"] = "P", ["shearFactor"] = 0.8 }),
        ["panel-wall check with an unknown key"] = m => m["comparisons"] = new JArray(new JObject { ["id"] = "K", ["kind"] = "panel-wall", ["panel"] = "P", ["ends"] = "cantilever" }),
    };

    public static TheoryData<string> MistakeNames() => new(Mistakes.Keys);

    [Theory]
    [MemberData(nameof(MistakeNames))]
    public void AWrongSnippetIsRejectedByTheSchemaAndByTheReader(string mistake)
    {
        var model = JObject.Parse(Base);
        Mistakes[mistake](model);
        string json = model.ToString();
        Assert.True(Validate(json).Count > 0, $"the schema accepts: {mistake}");
        Assert.Throws<ModelInputException>(() => ModelReader.Parse(json, "wrong.json"));
    }

    /// <summary>Every optional key of the format in one model: the schema must not reject what the reader accepts.</summary>
    private const string EveryKey = """
        {
          "$schema": "../docs/model.schema.json",
          "formatVersion": 1,
          "title": "every key",
          "description": "a frame using every optional key of the format",
          "units": { "force": "kN", "length": "m" },
          "materials": [
            { "id": "CONC", "E": 30000000, "nu": 0.2, "description": "concrete" },
            { "id": "STEEL", "E": 200000000, "G": 77000000 }
          ],
          "sections": [
            { "id": "R-COWPER", "shape": "rectangle", "b": 0.3, "d": 0.6, "shearFactor": "cowper", "description": "column" },
            { "id": "R-1.5", "shape": "rectangle", "b": 0.3, "d": 0.5, "shearFactor": 1.5 },
            { "id": "W", "shape": "I", "d": 0.5, "bf": 0.2, "tf": 0.016, "tw": 0.01, "shearArea": 0.005, "description": "beam" },
            { "id": "G", "shape": "general", "A": 0.01, "I": 0.0002, "shearArea": 0.004, "depth": 0.3 },
            { "id": "LINK", "shape": "general", "A": 0.002, "I": 0.000001 }
          ],
          "nodes": [
            { "id": "A", "x": 0, "y": 0 }, { "id": "B", "x": 0, "y": 3 }, { "id": "C", "x": 4, "y": 3 },
            { "id": "D", "x": 4, "y": 0 }, { "id": "E", "x": 8, "y": 0 }, { "id": "F", "x": 8, "y": 3 }
          ],
          "members": [
            { "id": "C1", "start": "A", "end": "B", "section": "R-COWPER", "material": "CONC", "kind": "beam-column", "role": "column",
              "modifiers": { "I": 0.7, "A": 1.0, "shearArea": 0.8 } },
            { "id": "B1", "start": "B", "end": "C", "section": "W", "material": "STEEL", "role": "beam",
              "rigidZones": { "start": 0.15, "end": 0.2 }, "momentReleases": ["end"] },
            { "id": "C2", "start": "D", "end": "C", "section": "G", "material": "STEEL" },
            { "id": "BR", "start": "A", "end": "C", "section": "LINK", "material": "STEEL", "kind": "brace" },
            { "id": "C3", "start": "E", "end": "C", "section": "R-1.5", "material": "CONC", "rigidZones": { "end": 0.1 } },
            { "id": "B2", "start": "C", "end": "F", "section": "W", "material": "STEEL", "momentReleases": ["start", "end"], "rigidZones": { "start": 0.2 } }
          ],
          "supports": [
            { "node": "A", "type": "fixed" },
            { "node": "D", "type": "pinned", "springs": { "rz": 5000 } },
            { "node": "E", "type": "roller-y", "springs": { "y": 100000, "rz": 0 } },
            { "node": "F", "type": "roller-x" },
            { "node": "B", "type": "custom", "restrain": [], "springs": { "x": 2000 } }
          ],
          "loadCases": [
            { "id": "D", "description": "dead",
              "nodalLoads": [ { "node": "B", "fx": 1, "fy": -5, "mz": 2 } ],
              "memberLoads": [
                { "member": "B1", "direction": "y", "w": -10 },
                { "member": "B2", "axes": "local", "direction": "transverse", "wStart": -5, "wEnd": -2 },
                { "member": "C1", "axes": "global", "direction": "x", "wStart": 1 , "wEnd": 2 },
                { "member": "BR", "axes": "local", "direction": "axial", "w": 0.5 },
                { "member": "C3", "direction": "x", "wEnd": 1.5 }
              ] },
            { "id": "W", "nodalLoads": [ { "node": "C", "fx": 20 } ] },
            { "id": "EMPTY" }
          ],
          "combinations": [ { "id": "1.2D+W", "description": "factored", "factors": { "D": 1.2, "W": 1.0 } }, { "id": "-W", "factors": { "W": -1 } } ],
          "stiffnessAt": [ { "node": "C", "direction": "y", "label": "C vertical" }, { "node": "F" } ],
          "reference": { "anything": ["is", "accepted"] }
        }
        """;

    [Fact]
    public void AModelUsingEveryOptionalKeyPassesTheSchemaAndTheReader()
    {
        var errors = Validate(EveryKey);
        Assert.True(errors.Count == 0, $"the schema rejects a model the reader accepts:\n{Describe(errors)}");
        var model = ModelReader.Parse(EveryKey, "every-key.json");
        Assert.Equal(6, model.Members.Count);
        TestModels.AssertChecks(LinearStaticAnalysis.Run(model));
    }

    [Fact]
    public void EveryReaderKeyIsInTheSchema()
    {
        // Keys the reader asks for, by object (from ModelReader.cs); the schema must list each, or it would reject valid models.
        var schema = JObject.Parse(File.ReadAllText(RepositoryFiles.SchemaPath));
        var defs = (JObject)schema["definitions"]!;
        string[] Keys(JToken o) => ((JObject)o["properties"]!).Properties().Select(p => p.Name).Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(new[] { "$schema", "combinations", "comparisons", "crackedSections", "description", "driftChecks", "formatVersion", "levels", "loadCases", "materials", "members", "nodes", "panels", "plan", "reference", "sections", "seismic", "stiffnessAt", "supports", "title", "units" }.Append("footings").Order(StringComparer.Ordinal), Keys(schema));
        Assert.Equal(new[] { "description", "E", "G", "id", "nu" }.Order(StringComparer.Ordinal), Keys(defs["material"]!));
        Assert.Equal(new[] { "axiallyRigid", "end", "id", "kind", "line", "material", "modifiers", "momentReleases", "rigidZones", "role", "section", "start" }, Keys(defs["member"]!));
        Assert.Equal(new[] { "node", "restrain", "springs", "type" }, Keys(defs["support"]!));
        Assert.Equal(new[] { "axes", "direction", "member", "w", "wEnd", "wStart" }, Keys(defs["memberLoad"]!));
    }
}
