using Newtonsoft.Json.Linq;
using PlaneLateral.Tests.Building;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>Models for the seismic tests, in newtons and metres.</summary>
internal static class SeismicModels
{
    /// <summary>
    /// <see cref="BuildingModels.ShearBuilding"/> (story stiffness exactly 24EI/h³, derived) with a seismic block: the
    /// given weights (N) at L1…LN, the generated case "ELF", and <paramref name="extra"/> keys merged into the block.
    /// </summary>
    public static JObject ShearBuilding(double h, double[] columnI, double[] weights, object extra)
    {
        var m = ToJObject(BuildingModels.ShearBuilding(h, columnI, columnI.Select(_ => 1.0).ToArray()));
        var s = new JObject
        {
            ["loadCase"] = "ELF",
            ["weights"] = new JArray(weights.Select((w, i) => new JObject { ["level"] = $"L{i + 1}", ["weight"] = w })),
        };
        s.Merge(ToJObject(extra));
        m["seismic"] = s;
        return m;
    }

    /// <summary>
    /// A vertical cantilever column of height <paramref name="l"/> in <paramref name="segments"/> equal elements, fixed at
    /// the base, general section (I, large A, no shear deformation), cases "P" (tip load −<paramref name="p"/> in y) and
    /// "H" (tip load <paramref name="hx"/> in x).
    /// </summary>
    public static object Column(double l, double i, int segments, double p, double hx)
    {
        var nodes = Enumerable.Range(0, segments + 1).Select(k => new { id = $"N{k}", x = 0.0, y = l * k / segments }).ToArray();
        var members = Enumerable.Range(0, segments).Select(k => new { id = $"C{k}", start = $"N{k}", end = $"N{k + 1}", section = "S", material = "MAT" }).ToArray();
        return new
        {
            formatVersion = 1,
            units = new { force = "N", length = "m" },
            materials = new[] { BuildingModels.Material },
            sections = new[] { BuildingModels.Section("S", i, 1.0) },
            nodes,
            members,
            supports = new[] { new { node = "N0", type = "fixed" } },
            loadCases = new object[]
            {
                new { id = "P", nodalLoads = new[] { new { node = $"N{segments}", fy = -p } } },
                new { id = "H", nodalLoads = new[] { new { node = $"N{segments}", fx = hx } } },
            },
        };
    }
}
