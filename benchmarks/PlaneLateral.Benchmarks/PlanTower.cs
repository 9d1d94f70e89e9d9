using Newtonsoft.Json;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// An invented 40-story building in plan for the plan benchmark (docs/plan.md format, kip and foot), written as the text
/// of a building file: a 150 × 100 ft floor, 12 ft stories, 24 lines of resistance — in each direction 6 compact
/// concrete walls (one Timoshenko member per story) and 6 inline three-bay concrete moment frames (4 columns and 3
/// beams per story, rigid levels) — placed unevenly so that the centre of rigidity is off the centre of mass and the
/// floors turn. Loads: a triangular pattern of floor forces along X and along Y, each with the default ±5 % accidental
/// eccentricity (6 cases). This file is compiled into the benchmark and, linked, into the core tests, which check that
/// the building solves and balances (PlanTowerTests).
/// </summary>
internal static class PlanTower
{
    public const int Stories = 40, Lines = 24, Bays = 3;
    public const double StoryHeight = 12, Width = 150, Depth = 100, Bay = 20;

    public static double[] Elevations => [.. Enumerable.Range(0, Stories + 1).Select(i => i * StoryHeight)];

    /// <summary>The floor force at floor i (1..40), kip: a triangular pattern, 0.5 kip per floor number.</summary>
    public static double Force(int floor) => 0.5 * floor;

    public static string Json()
    {
        var elev = Elevations;
        var lines = new List<object>();
        // Walls along X at y (lengths vary), walls along Y at x: bunched towards one side of the plan.
        double[] wxY = [0, 0, 30, 30, 100, 100], wxX = [20, 110, 40, 90, 30, 120], wxL = [30, 24, 20, 20, 16, 12];
        double[] wyX = [0, 0, 10, 10, 150, 75], wyY = [25, 75, 40, 60, 50, 50], wyL = [30, 30, 18, 18, 14, 16];
        for (int i = 0; i < 6; i++)
            lines.Add(new { id = $"WX{i + 1}", at = new[] { wxX[i], wxY[i] }, direction = "x", wall = new { length = wxL[i], thickness = 1.5, material = "C" } });
        for (int i = 0; i < 6; i++)
            lines.Add(new { id = $"WY{i + 1}", at = new[] { wyX[i], wyY[i] }, direction = "y", wall = new { length = wyL[i], thickness = 1.5, material = "C" } });
        // Frames along X at y (centred at x = 75), frames along Y at x (centred at y = 50).
        double[] fxY = [10, 20, 50, 60, 80, 90], fyX = [30, 45, 60, 90, 120, 140];
        for (int i = 0; i < 6; i++)
            lines.Add(new { id = $"FX{i + 1}", at = new[] { 75.0, fxY[i] }, direction = "x", model = Frame($"FX{i + 1}", elev) });
        for (int i = 0; i < 6; i++)
            lines.Add(new { id = $"FY{i + 1}", at = new[] { fyX[i], 50.0 }, direction = "y", model = Frame($"FY{i + 1}", elev) });

        var forces = Enumerable.Range(1, Stories).Select(Force).ToArray();
        var building = new Dictionary<string, object>
        {
            ["formatVersion"] = 1,
            ["title"] = "Benchmark tower, 40 stories, 24 lines (invented)",
            ["units"] = new { force = "kip", length = "ft" },
            ["materials"] = new[] { new { id = "C", E = 580464.0, nu = 0.2 } },
            ["plan"] = new
            {
                outline = new[] { new[] { 0.0, 0 }, new[] { Width, 0 }, new[] { Width, Depth }, new[] { 0.0, Depth } },
                accidentalEccentricity = 0.05,
                levels = elev.Select((e, i) => (object)new { id = i == 0 ? "base" : $"L{i}", elevation = e }).ToArray(),
                lines,
                loads = new object[]
                {
                    new { id = "WX", direction = "x", forces },
                    new { id = "WY", direction = "y", forces },
                },
            },
        };
        return JsonConvert.SerializeObject(building, Formatting.Indented);
    }

    /// <summary>A three-bay concrete moment frame as an inline planar model: columns 2.5 × 2.5 ft, beams 2 × 3 ft, fixed bases, centred on the line's point.</summary>
    private static object Frame(string line, double[] elev)
    {
        double x0 = -Bays * Bay / 2;
        var cols = Enumerable.Range(0, Bays + 1).ToArray();
        return new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "ft" },
            materials = new[] { new { id = "C", E = 580464.0, nu = 0.2 } },
            sections = new object[] { new { id = "COL", shape = "rectangle", b = 2.5, d = 2.5 }, new { id = "BM", shape = "rectangle", b = 2.0, d = 3.0 } },
            nodes = elev.SelectMany((e, i) => cols.Select(c => new { id = $"{line}n{c}-{i}", x = x0 + c * Bay, y = e })).ToArray(),
            members = elev.Skip(1).SelectMany((_, s) =>
                cols.Select(c => new { id = $"{line}-C{c}-{s + 1}", start = $"{line}n{c}-{s}", end = $"{line}n{c}-{s + 1}", section = "COL", material = "C", line })
                .Concat(cols.Skip(1).Select(c => new { id = $"{line}-B{c}-{s + 1}", start = $"{line}n{c - 1}-{s + 1}", end = $"{line}n{c}-{s + 1}", section = "BM", material = "C", line })))
                .ToArray(),
            supports = cols.Select(c => new { node = $"{line}n{c}-0", type = "fixed" }).ToArray(),
            levels = elev.Select((e, i) => new { id = $"L{i}", elevation = e, diaphragm = i == 0 ? "none" : "rigid" }).ToArray(),
        };
    }
}
