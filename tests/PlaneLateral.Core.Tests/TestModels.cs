using Newtonsoft.Json;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Tests;

/// <summary>Builds model files in the published JSON format from C# objects, and solves them.</summary>
internal static class TestModels
{
    public static string Json(object model) => JsonConvert.SerializeObject(model, Formatting.Indented);

    public static StructureModel Parse(object model) => ModelReader.Parse(Json(model), "test.json");

    public static AnalysisResult Solve(object model, AnalysisOptions? options = null)
    {
        var result = LinearStaticAnalysis.Run(Parse(model), options);
        AssertChecks(result);
        return result;
    }

    /// <summary>Every solve is checked: residual and global equilibrium (common practice).</summary>
    public static void AssertChecks(AnalysisResult r)
    {
        foreach (var c in r.Cases)
        {
            Assert.True(c.BackwardError < 1e-13, $"{c.Id}: backward error {c.BackwardError}");
            Assert.True(c.Equilibrium.RelativeForceError < 1e-9, $"{c.Id}: force imbalance {c.Equilibrium.RelativeForceError}");
            Assert.True(c.Equilibrium.RelativeMomentError < 1e-9, $"{c.Id}: moment imbalance {c.Equilibrium.RelativeMomentError}");
        }
    }

    public static void Near(double expected, double actual, double relTol, string? what = null)
    {
        double err = Math.Abs(actual - expected) / Math.Max(Math.Abs(expected), 1e-300);
        Assert.True(err <= relTol, $"{what}: expected {expected:R}, got {actual:R}, relative error {err:E2} > {relTol:E1}");
    }

    /// <summary>A vertical cantilever of <paramref name="segments"/> elements, base fixed, with a lateral tip load.</summary>
    public static object Cantilever(double height, double p, object section, object material, int segments = 1,
        string topSupport = "none", object? units = null, object? extraMember = null)
    {
        var nodes = Enumerable.Range(0, segments + 1).Select(i => new { id = $"N{i}", x = 0.0, y = height * i / segments }).ToArray();
        var members = Enumerable.Range(0, segments).Select(i => (object)new { id = $"M{i}", start = $"N{i}", end = $"N{i + 1}", section = "S", material = "MAT" }).ToList();
        var supports = new List<object> { new { node = "N0", type = "fixed" } };
        if (topSupport == "guided") supports.Add(new { node = $"N{segments}", type = "custom", restrain = new[] { "rz" } });
        return new
        {
            formatVersion = 1,
            units = units ?? new { force = "kip", length = "in" },
            materials = new[] { material },
            sections = new[] { section },
            nodes,
            members,
            supports,
            loadCases = new[] { new { id = "P", nodalLoads = new[] { new { node = $"N{segments}", fx = p } } } },
            stiffnessAt = new[] { new { node = $"N{segments}", direction = "x" } },
        };
    }

    public static JObject ToJObject(object o) => JObject.Parse(Json(o));
}
