using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// Ceilings on the work a model asks for, not only on its counts (docs/hardening.md, "Size limits"): result entries
/// (nodes + members) × (cases + combinations) within the measured edge, the requested panel mesh, the weighted levels of a seismic block. Each is
/// refused by `validate` (exit 2) with its own message at its key, before any heavy work. The limits themselves come
/// from measured cost (docs/hardening.md); these tests check that they are enforced where they are documented.
/// </summary>
public sealed class WorkLimitTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-limits-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private (int Code, string Err) Validate(JObject model)
    {
        string path = Path.Combine(_dir, "m.json");
        File.WriteAllText(path, model.ToString());
        var r = CliRun.Run("validate", path);
        return (r.Code, r.Err + r.Out);
    }

    private static JObject Chain(int nodes, int cases, int weightedLevels = 0)
    {
        var m = new JObject
        {
            ["formatVersion"] = 1,
            ["units"] = new JObject { ["force"] = "kN", ["length"] = "m" },
            ["materials"] = new JArray(new JObject { ["id"] = "C", ["E"] = 30e6, ["nu"] = 0.2 }),
            ["sections"] = new JArray(new JObject { ["id"] = "W", ["shape"] = "rectangle", ["b"] = 0.3, ["d"] = 6.0 }),
            ["nodes"] = new JArray(Enumerable.Range(0, nodes).Select(i => new JObject { ["id"] = $"N{i}", ["x"] = 0.0, ["y"] = 3.0 * i })),
            ["members"] = new JArray(Enumerable.Range(0, nodes - 1).Select(i => new JObject { ["id"] = $"M{i}", ["start"] = $"N{i}", ["end"] = $"N{i + 1}", ["section"] = "W", ["material"] = "C" })),
            ["supports"] = new JArray(new JObject { ["node"] = "N0", ["type"] = "fixed" }),
            ["loadCases"] = new JArray(Enumerable.Range(0, cases).Select(k => new JObject { ["id"] = $"C{k}", ["nodalLoads"] = new JArray(new JObject { ["node"] = $"N{nodes - 1}", ["fx"] = 1.0 }) })),
        };
        if (weightedLevels > 0)
        {
            m["levels"] = new JArray(Enumerable.Range(0, nodes).Select(i => new JObject { ["id"] = $"L{i}", ["elevation"] = 3.0 * i }));
            m["seismic"] = new JObject
            {
                ["loadCase"] = "EQ", ["baseShear"] = 100.0,
                ["weights"] = new JArray(Enumerable.Range(1, weightedLevels).Select(i => new JObject { ["level"] = $"L{i}", ["weight"] = 10.0 })),
            };
        }
        return m;
    }

    [Fact]
    public void TheCountLimitsKeepTheResultEntriesWithinTheMeasuredEdge()
    {
        // The results files stream, so no entry limit of its own is checked: the count limits bound the entries, and
        // their product is the edge measured in docs/hardening.md ("Size limits"). Raising a count limit fails here
        // until the new edge is measured and MeasuredResultEntries set from it.
        long edge = (long)(ModelLimits.MaxNodes + ModelLimits.MaxMembers) * ModelLimits.MaxCasesAndCombinations;
        Assert.True(edge <= ModelLimits.MeasuredResultEntries, $"the count limits allow {edge} result entries, more than the {ModelLimits.MeasuredResultEntries} measured");
    }

    [Fact]
    public void ResultEntriesAtTheCountLimitsAreAccepted()
    {
        // 10 000 nodes + 9 999 members under 200 cases: 3,999,800 entries, refused before the results were streamed
        // (the limit was 2,000,000); every count is within its own limit.
        var (code, text) = Validate(Chain(10_000, 200));
        Assert.DoesNotContain("result entries", text);
        Assert.Equal(0, code);
    }

    [Fact]
    public void APanelMeshAboveTheCeilingIsRefusedAtMaxNodes()
    {
        var m = JObject.Parse(File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "models", "panels", "squat-wall.json")));
        var panel = (JObject)((JArray)m["panels"]!)[0];
        var mesh = panel["mesh"] as JObject ?? new JObject();
        mesh["maxNodes"] = 100_000_000;
        panel["mesh"] = mesh;
        var (code, text) = Validate(m);
        Assert.Equal(2, code);
        Assert.Contains("$.panels[0].mesh.maxNodes", text);
        Assert.Contains("maxNodes", text);
    }

    [Fact]
    public void MoreWeightedLevelsThanTheEigenLimitAreRefusedAtTheWeights()
    {
        var (code, text) = Validate(Chain(ModelLimits.MaxMassDofs + 2, 1, weightedLevels: ModelLimits.MaxMassDofs + 1));
        Assert.Equal(2, code);
        Assert.Contains("$.seismic.weights", text);
        Assert.Contains("weighted levels", text);
    }
}
