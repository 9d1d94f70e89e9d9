using Newtonsoft.Json;
using PlaneLateral.Model;
using PlaneLateral.Studies;

namespace PlaneLateral.Studies.Tests;

/// <summary>Model files for the tests, written in the JSON format from C# objects.</summary>
internal static class Models
{
    public static string Json(object model) => JsonConvert.SerializeObject(model, Formatting.Indented);

    public static StructureModel Parse(object model) => ModelReader.Parse(Json(model), "test.json");

    public static ComparisonReport Compare(object model, double tol = ComparisonStudy.DefaultTolerance) => ComparisonStudy.Run(Parse(model), tol);

    public static void Near(double expected, double actual, double relTol, string? what = null)
    {
        double err = Math.Abs(actual - expected) / Math.Max(Math.Abs(expected), 1e-300);
        Assert.True(err <= relTol, $"{what}: expected {expected:R}, got {actual:R}, relative error {err:E2} > {relTol:E1}");
    }

    public static readonly object Masonry = new { id = "CMU", E = 1800.0, G = 720.0 };

    /// <summary>A model whose only purpose is to carry comparison checks: one stub member, supported, with a stiffness point.</summary>
    public static object Carrier(object[] comparisons, object? material = null) => new
    {
        formatVersion = 1,
        units = new { force = "kip", length = "in" },
        materials = new[] { material ?? Masonry },
        sections = new[] { new { id = "S", shape = "rectangle", b = 8.0, d = 48.0 } },
        nodes = new[] { new { id = "a", x = 0.0, y = 0.0 }, new { id = "b", x = 0.0, y = 100.0 } },
        members = new[] { new { id = "stub", start = "a", end = "b", section = "S", material = "CMU" } },
        supports = new[] { new { node = "a", type = "fixed" } },
        stiffnessAt = new[] { new { node = "b", direction = "x" } },
        comparisons,
    };

    /// <summary>A vertical wall of <paramref name="segments"/> members with a wall-line check over it.</summary>
    public static object WallLine(double height, double depth, double thickness, int segments, object? shearFactor = null, string[]? ends = null)
    {
        var section = shearFactor is null
            ? (object)new { id = "WALL", shape = "rectangle", b = thickness, d = depth }
            : new { id = "WALL", shape = "rectangle", b = thickness, d = depth, shearFactor };
        var nodes = Enumerable.Range(0, segments + 1).Select(i => new { id = $"N{i}", x = 0.0, y = height * i / segments }).ToArray();
        var members = Enumerable.Range(0, segments).Select(i => new { id = $"M{i}", start = $"N{i}", end = $"N{i + 1}", section = "WALL", material = "C" }).ToArray();
        return new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "C", E = 4031.0, nu = 0.2 } },
            sections = new[] { section },
            nodes,
            members,
            supports = new[] { new { node = "N0", type = "fixed" } },
            stiffnessAt = new[] { new { node = $"N{segments}", direction = "x" } },
            comparisons = new[] { new { id = "WL", kind = "wall-line", members = members.Select(m => m.id).ToArray(), ends = ends ?? ["cantilever", "fixed-fixed"] } },
        };
    }

    /// <summary>
    /// A one-story, one-bay portal: two columns (I-shapes given as general sections) and a beam, with a frame-stories check.
    /// </summary>
    public static object Portal(double h, double span, double columnI, double beamI, string bases = "fixed", double? columnShearArea = null, double area = 1e6)
    {
        object col = columnShearArea is double asv
            ? new { id = "COL", shape = "general", A = area, I = columnI, shearArea = asv }
            : new { id = "COL", shape = "general", A = area, I = columnI };
        return new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "in" },
            materials = new[] { new { id = "STEEL", E = 29000.0, nu = 0.3 } },
            sections = new[] { col, new { id = "BEAM", shape = "general", A = area, I = beamI } },
            nodes = new[]
            {
                new { id = "A0", x = 0.0, y = 0.0 }, new { id = "A1", x = 0.0, y = h },
                new { id = "B0", x = span, y = 0.0 }, new { id = "B1", x = span, y = h },
            },
            members = new[]
            {
                new { id = "CA", start = "A0", end = "A1", section = "COL", material = "STEEL" },
                new { id = "CB", start = "B0", end = "B1", section = "COL", material = "STEEL" },
                new { id = "BM", start = "A1", end = "B1", section = "BEAM", material = "STEEL" },
            },
            supports = new[] { new { node = "A0", type = bases }, new { node = "B0", type = bases } },
            stiffnessAt = new[] { new { node = "A1", direction = "x" } },
            comparisons = new[] { new { id = "P", kind = "frame-stories", members = new[] { "CA", "CB", "BM" } } },
        };
    }

    /// <summary>The row's first line-model estimate (its reference unless a converged plane-stress panel is).</summary>
    public static FeEstimate Line(ComparisonRow r) => r.Fe.First(f => f.Model != ComparisonRow.PanelModelName);

    /// <summary>FE/hand of the row's first line model.</summary>
    public static double LineRatio(ComparisonRow r) => Line(r).Value / r.Hand.Value;

    /// <summary>The verdict the row's first line model would give (the row's own verdict rests on its reference).</summary>
    public static Verdict LineVerdict(ComparisonRow r) => ComparisonRow.Judge(LineRatio(r), r.Tolerance);
}
