using Newtonsoft.Json;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Plan;

/// <summary>Building files for the tests, written in the format of docs/plan.md (kip and foot).</summary>
internal static class PlanJson
{
    public const double KipN = 4448.2216152605, Ft = 0.3048;

    public static object PlanBuilding(object[] lines, object[] loads, double[] elevations, double[][] outline, double ecc = 0.05, object[]? materials = null) => new Dictionary<string, object>
    {
        ["formatVersion"] = 1,
        ["title"] = "test building",
        ["units"] = new { force = "kip", length = "ft" },
        ["materials"] = materials ?? [new { id = "C", E = 580464.0, nu = 0.2 }],
        ["plan"] = new
        {
            outline,
            accidentalEccentricity = ecc,
            levels = elevations.Select((e, i) => (object)new { id = i == 0 ? "base" : $"L{i}", elevation = e }).ToArray(),
            lines,
            loads,
        },
    };

    public static object Wall(string id, double x, double y, string dir, double length, double thickness = 1) =>
        new { id, at = new[] { x, y }, direction = dir, wall = new { length, thickness, material = "C" } };

    public static object Springs(string id, double x, double y, object dir, params double[] k) =>
        new { id, at = new[] { x, y }, direction = dir, storyStiffness = k };

    public static string Text(object o) => JsonConvert.SerializeObject(o, Formatting.Indented);

    public static BuildingPlan Read(object o, string path = "building.json") => ModelReader.ParsePlan(Text(o), path);

    public static PlanResult Solve(object o) => PlanAnalysis.Run(Read(o));

    /// <summary>A planar wall model (kip, ft) as a JObject: one member per story, fixed base, rigid levels, offset x0 in its plane.</summary>
    public static JObject PlanarWall(string line, double x0, double length, double[] elevations, double thickness = 1) => JObject.FromObject(new
    {
        formatVersion = 1,
        units = new { force = "kip", length = "ft" },
        materials = new[] { new { id = "C", E = 580464.0, nu = 0.2 } },
        sections = new[] { new { id = "S", shape = "rectangle", b = thickness, d = length } },
        nodes = elevations.Select((e, i) => new { id = $"{line}{i}", x = x0, y = e }).ToArray(),
        members = elevations.Skip(1).Select((e, i) => new { id = $"{line}-S{i + 1}", start = $"{line}{i}", end = $"{line}{i + 1}", section = "S", material = "C", line }).ToArray(),
        supports = new[] { new { node = $"{line}0", type = "fixed" } },
        levels = elevations.Select((e, i) => new { id = $"L{i}", elevation = e, diaphragm = i == 0 ? "none" : "rigid" }).ToArray(),
    });

    /// <summary>A one-bay steel frame (kip, ft) as a JObject, columns at x0 and x0 + bay, rigid levels.</summary>
    public static JObject PlanarFrame(string line, double x0, double bay, double[] elevations) => JObject.FromObject(new
    {
        formatVersion = 1,
        units = new { force = "kip", length = "ft" },
        materials = new[] { new { id = "S", E = 4176000.0, nu = 0.3 } },
        sections = new[] { new { id = "COL", shape = "general", A = 0.184, I = 0.0482 }, new { id = "BM", shape = "general", A = 0.0903, I = 0.0407 } },
        nodes = elevations.SelectMany((e, i) => new[] { new { id = $"{line}a{i}", x = x0, y = e }, new { id = $"{line}b{i}", x = x0 + bay, y = e } }).ToArray(),
        members = elevations.Skip(1).SelectMany((e, i) => new[]
        {
            new { id = $"{line}-Ca{i + 1}", start = $"{line}a{i}", end = $"{line}a{i + 1}", section = "COL", material = "S", line },
            new { id = $"{line}-Cb{i + 1}", start = $"{line}b{i}", end = $"{line}b{i + 1}", section = "COL", material = "S", line },
            new { id = $"{line}-B{i + 1}", start = $"{line}a{i + 1}", end = $"{line}b{i + 1}", section = "BM", material = "S", line },
        }).ToArray(),
        supports = new[] { new { node = $"{line}a0", type = "fixed" }, new { node = $"{line}b0", type = "fixed" } },
        levels = elevations.Select((e, i) => new { id = $"L{i}", elevation = e, diaphragm = i == 0 ? "none" : "rigid" }).ToArray(),
    });

    /// <summary>Several planar lines side by side in one planar model, tied by one rigid diaphragm per level, with lateral forces at the levels.</summary>
    public static StructureModel SideBySide(JObject[] parts, double[] elevations, double[] forces)
    {
        var m = (JObject)parts[0].DeepClone();
        foreach (var key in new[] { "materials", "sections", "nodes", "members", "supports" })
        {
            var all = new JArray();
            var seen = new HashSet<string>();
            foreach (var p in parts)
                foreach (var item in (JArray)p[key]!)
                    if (key is not ("materials" or "sections") || seen.Add((string)item["id"]!)) all.Add(item.DeepClone());
            m[key] = all;
        }
        var firstNode = elevations.Select((e, i) => (string)((JArray)parts[0]["nodes"]!).First(n => (double)n["y"]! == e)["id"]!).ToArray();
        m["loadCases"] = new JArray(new JObject
        {
            ["id"] = "P",
            ["nodalLoads"] = new JArray(forces.Select((f, i) => new JObject { ["node"] = firstNode[i + 1], ["fx"] = f })),
        });
        return ModelReader.Parse(m.ToString(), "side-by-side.json");
    }
}
