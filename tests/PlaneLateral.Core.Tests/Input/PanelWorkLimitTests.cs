using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// The panel limits (docs/hardening.md, "Size limits"): the mesh ceiling <c>mesh.maxNodes</c> and the panel mesh
/// entries, Σ maxNodes × (load cases + combinations), each within the edge measured by benchmarks/edge/run.sh, and the
/// entry limit enforced by <c>validate</c> at <c>$.panels</c> before any mesh is built.
/// </summary>
public sealed class PanelWorkLimitTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-panel-limits-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private (int Code, string Text) Validate(JObject model)
    {
        string path = Path.Combine(_dir, "m.json");
        File.WriteAllText(path, model.ToString());
        var r = CliRun.Run("validate", path);
        return (r.Code, r.Err + r.Out);
    }

    /// <summary>The shipped squat wall (an 8 m × 4 m wall asking for the 40 000-node ceiling) <paramref name="panels"/>
    /// times side by side, under <paramref name="cases"/> load cases.</summary>
    private static JObject Walls(int panels, int cases, int maxNodes = ModelLimits.MaxPanelMeshNodes)
    {
        var m = JObject.Parse(File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "models", "panels", "squat-wall.json")));
        m.Remove("comparisons");
        var wall = (JObject)((JArray)m["panels"]!)[0];
        ((JObject)wall["mesh"]!)["maxNodes"] = maxNodes;
        m["panels"] = new JArray(Enumerable.Range(0, panels).Select(i =>
        {
            var p = (JObject)wall.DeepClone();
            p["id"] = $"wall {i}";
            p["x"] = 10.0 * i;
            return p;
        }));
        m["loadCases"] = new JArray(new JObject { ["id"] = "wind" }, Enumerable.Range(1, cases - 1).Select(k => new JObject { ["id"] = $"case {k}" }));
        return m;
    }

    [Fact]
    public void ThePanelLimitsStayWithinTheMeasuredEdge()
    {
        // Tripwire: the edge measured (docs/hardening.md) was one panel asking for 40 000 nodes (39 601 built) under
        // 200 cases, and two under 100. Raising the mesh ceiling or the entry limit fails here until the new edge is
        // measured (benchmarks/edge/run.sh) and the Measured… constants set from it.
        Assert.True(ModelLimits.MaxPanelMeshNodes <= ModelLimits.MeasuredPanelMeshNodes,
            $"the mesh ceiling {ModelLimits.MaxPanelMeshNodes} is above the {ModelLimits.MeasuredPanelMeshNodes} nodes measured");
        Assert.True(ModelLimits.MaxPanelMeshEntries <= ModelLimits.MeasuredPanelMeshEntries,
            $"the panel mesh entry limit {ModelLimits.MaxPanelMeshEntries} is above the {ModelLimits.MeasuredPanelMeshEntries} measured");
        // And the measured edge is reachable: one panel at the mesh ceiling under every case the count limit allows.
        Assert.True((long)ModelLimits.MaxPanelMeshNodes * ModelLimits.MaxCasesAndCombinations <= ModelLimits.MaxPanelMeshEntries);
    }

    [Fact]
    public void TwoWallsAtTheCeilingUnderOneCaseTooManyAreRefusedAtThePanels()
    {
        // 2 × 40 000 × 101 = 8 080 000 > 8 000 000 (derived); each count is within its own limit.
        var (code, text) = Validate(Walls(2, 101));
        Assert.Equal(2, code);
        Assert.Contains("$.panels", text);
        Assert.Contains("8080000 panel mesh entries", text);
        Assert.Contains("Fix:", text);
    }

    [Fact]
    public void TheMeasuredEdgeItselfIsAccepted()
    {
        // 2 × 40 000 × 100 = 8 000 000, the limit (derived), and one panel under 200 cases: both pass validate.
        var (code, text) = Validate(Walls(2, 100));
        Assert.DoesNotContain("panel mesh entries", text);
        Assert.Equal(0, code);
        (code, text) = Validate(Walls(1, 200));
        Assert.DoesNotContain("panel mesh entries", text);
        Assert.Equal(0, code);
    }

    [Fact]
    public void APanelWithoutMaxNodesCountsTheDefaultMesh()
    {
        // No maxNodes: the default 3 000 counts (PanelMeshSettings.Default). 14 × 3 000 × 200 = 8 400 000 > 8 000 000.
        var m = Walls(14, 200);
        foreach (var p in (JArray)m["panels"]!) ((JObject)p["mesh"]!).Remove("maxNodes");
        var (code, text) = Validate(m);
        Assert.Equal(2, code);
        Assert.Contains("8400000 panel mesh entries", text);
    }
}
