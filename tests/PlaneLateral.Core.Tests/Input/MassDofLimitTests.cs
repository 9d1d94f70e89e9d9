using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// The mass DOFs of a seismic block (docs/hardening.md, "Size limits"): a weighted level without a diaphragm carries
/// one mass DOF per node free in x, so few weighted levels can still ask for a dense eigenproblem above
/// <see cref="ModelLimits.MaxMassDofs"/>. They are counted when the periods are set up, before the flexibility is formed,
/// and refused at <c>$.seismic.weights</c> with a fix (exit 2, nothing written).
/// </summary>
public sealed class MassDofLimitTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-massdofs-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary><paramref name="columns"/> cantilever columns, fixed at the base (a level without a diaphragm: a rigid one
    /// across the supports is refused), their tops at one weighted level without a diaphragm.</summary>
    private static JObject Columns(int columns) => new()
    {
        ["formatVersion"] = 1,
        ["units"] = new JObject { ["force"] = "kN", ["length"] = "m" },
        ["materials"] = new JArray(new JObject { ["id"] = "S", ["E"] = 2e8, ["nu"] = 0.3 }),
        ["sections"] = new JArray(new JObject { ["id"] = "C", ["shape"] = "general", ["A"] = 0.01, ["I"] = 1e-4 }),
        ["nodes"] = new JArray(Enumerable.Range(0, columns).SelectMany(i => new[]
        {
            new JObject { ["id"] = $"B{i}", ["x"] = 1.0 * i, ["y"] = 0.0 },
            new JObject { ["id"] = $"T{i}", ["x"] = 1.0 * i, ["y"] = 3.0 },
        })),
        ["members"] = new JArray(Enumerable.Range(0, columns).Select(i => new JObject { ["id"] = $"M{i}", ["start"] = $"B{i}", ["end"] = $"T{i}", ["section"] = "C", ["material"] = "S" })),
        ["supports"] = new JArray(Enumerable.Range(0, columns).Select(i => new JObject { ["node"] = $"B{i}", ["type"] = "fixed" })),
        ["loadCases"] = new JArray(new JObject { ["id"] = "W", ["nodalLoads"] = new JArray(new JObject { ["node"] = "T0", ["fx"] = 1.0 }) }),
        ["levels"] = new JArray(new JObject { ["id"] = "L0", ["elevation"] = 0.0, ["diaphragm"] = "none" }, new JObject { ["id"] = "L1", ["elevation"] = 3.0, ["diaphragm"] = "none" }),
        ["seismic"] = new JObject
        {
            ["loadCase"] = "EQ", ["baseShear"] = 100.0,
            ["weights"] = new JArray(new JObject { ["level"] = "L1", ["weight"] = 1000.0 }),
        },
    };

    [Fact]
    public void OneLevelWithoutADiaphragmAboveTheMassDofLimitIsRefusedAtTheWeights()
    {
        // One weighted level, well within the level count, but MaxMassDofs + 1 free top nodes (derived: one mass DOF each).
        string path = Path.Combine(_dir, "m.json"), output = Path.Combine(_dir, "out");
        File.WriteAllText(path, Columns(ModelLimits.MaxMassDofs + 1).ToString());
        var (code, o, e) = CliRun.Run("solve", path, "--out", output);
        string text = o + e;
        Assert.Equal(2, code);
        Assert.Contains("$.seismic.weights", text);
        Assert.Contains($"carry {ModelLimits.MaxMassDofs + 1} DOFs with mass", text);
        Assert.Contains("Fix:", text);
        Assert.False(Directory.Exists(output) && Directory.EnumerateFiles(output).Any(), "nothing is written for a refused model");
    }
}
