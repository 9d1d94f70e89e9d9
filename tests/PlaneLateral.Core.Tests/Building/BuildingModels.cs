namespace PlaneLateral.Tests.Building;

/// <summary>
/// Small building models for the story tests, in newtons and metres. Sections without a shear area have no shear
/// deformation (Φ = 0), so the closed forms below are the Euler–Bernoulli ones.
/// </summary>
internal static class BuildingModels
{
    public const double E = 2.0e11;   // Pa

    public static object Material => new { id = "MAT", E, nu = 0.3 };

    /// <summary>A general section with I (m⁴), large area (m²), no shear deformation.</summary>
    public static object Section(string id, double i, double a = 1.0) => new { id, shape = "general", A = a, I = i };

    /// <summary>
    /// A shear building: <paramref name="columnI"/>.Length stories of height h, two columns per story at x = 0 and
    /// x = 6 m, every level's rotations held by a support (custom, rz only), so each column is fixed-guided and a story's
    /// stiffness is exactly 2·12EI/h³ whatever the load pattern (derived). Rigid diaphragm at every level above the base.
    /// <paramref name="columnI"/> in units of 10⁻⁶ m⁴, <paramref name="levelFx"/> in kN (so the numbers read short). Loads at the left node of each level.
    /// </summary>
    public static object ShearBuilding(double h, double[] columnI, double[] levelFx)
    {
        int n = columnI.Length;
        var nodes = new List<object>();
        var members = new List<object>();
        var supports = new List<object> { new { node = "A0", type = "fixed" }, new { node = "B0", type = "fixed" } };
        var levels = new List<object> { new { id = "L0", elevation = 0.0, diaphragm = "none" } };
        for (int j = 0; j <= n; j++)
        {
            nodes.Add(new { id = $"A{j}", x = 0.0, y = h * j });
            nodes.Add(new { id = $"B{j}", x = 6.0, y = h * j });
            if (j > 0)
            {
                supports.Add(new { node = $"A{j}", type = "custom", restrain = new[] { "rz" } });
                supports.Add(new { node = $"B{j}", type = "custom", restrain = new[] { "rz" } });
                levels.Add(new { id = $"L{j}", elevation = h * j });
                members.Add(new { id = $"CA{j}", start = $"A{j - 1}", end = $"A{j}", section = $"S{j}", material = "MAT", role = "column", line = "frame" });
                members.Add(new { id = $"CB{j}", start = $"B{j - 1}", end = $"B{j}", section = $"S{j}", material = "MAT", role = "column", line = "frame" });
            }
        }
        return new
        {
            formatVersion = 1,
            units = new { force = "N", length = "m" },
            materials = new[] { Material },
            sections = columnI.Select((i, k) => Section($"S{k + 1}", i * 1e-6)).ToArray(),
            nodes,
            members,
            supports,
            levels,
            loadCases = new[] { new { id = "EQ", nodalLoads = levelFx.Select((f, k) => new { node = $"A{k + 1}", fx = 1e3 * f }).ToArray() } },
        };
    }
}
