namespace PlaneLateral.Hand;

/// <summary>
/// Level-by-level result of a multi-story cantilever wall. Index 0 is the first floor above the base.
/// Units: any consistent set (force F, length L).
/// </summary>
/// <param name="LevelHeights">Height of each level above the base (L).</param>
/// <param name="FlexuralDisplacements">Bending part of each level's lateral displacement (L).</param>
/// <param name="ShearDisplacements">Shear part of each level's lateral displacement (L).</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record StoryWallResult(
    IReadOnlyList<double> LevelHeights,
    IReadOnlyList<double> FlexuralDisplacements,
    IReadOnlyList<double> ShearDisplacements,
    HandMethod Method)
{
    /// <summary>Total lateral displacement of each level (L).</summary>
    public IReadOnlyList<double> Displacements =>
        FlexuralDisplacements.Zip(ShearDisplacements, (f, s) => f + s).ToArray();

    /// <summary>Interstory drift of each story, Δ_i − Δ_(i−1), with Δ at the base zero (L).</summary>
    public IReadOnlyList<double> Drifts
    {
        get
        {
            var d = Displacements;
            return d.Select((v, i) => v - (i == 0 ? 0.0 : d[i - 1])).ToArray();
        }
    }

    /// <summary>Interstory drift ratio of each story, drift / story height (dimensionless).</summary>
    public IReadOnlyList<double> DriftRatios
    {
        get
        {
            var dr = Drifts;
            return dr.Select((v, i) => v / (LevelHeights[i] - (i == 0 ? 0.0 : LevelHeights[i - 1]))).ToArray();
        }
    }
}

/// <summary>
/// A cantilever wall under lateral forces at its floor levels, deflections found in closed form by superposition.
/// Units: any consistent set (force F, length L).
/// </summary>
public static class StoryWall
{
    /// <summary>
    /// Uniform section. For a force P at height a, the displacement at height z is, in bending,
    /// P·z²(3a − z)/(6EI) for z ≤ a and P·a²(3z − a)/(6EI) for z ≥ a, and in shear f·P·min(z, a)/(GA);
    /// the level forces are superposed.
    /// Source: elementary beam theory, cantilever with a point load (Gere &amp; Timoshenko, Mechanics of Materials,
    /// table of beam deflections); shear term after Timoshenko.
    /// </summary>
    /// <param name="storyHeights">Height of each story, bottom story first (L), each positive.</param>
    /// <param name="levelForces">Lateral force at the top of each story (F), same count; zero or negative allowed.</param>
    /// <param name="ei">Flexural rigidity E·I (F·L²), positive.</param>
    /// <param name="ga">Shear rigidity G·A (F), positive.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1 (1.2 for a rectangle).</param>
    public static StoryWallResult Uniform(IReadOnlyList<double> storyHeights, IReadOnlyList<double> levelForces,
        double ei, double ga, double formFactor = ShearForm.RectangleDefault)
    {
        var z = Levels(storyHeights, levelForces);
        Guard.Positive(ei, "The flexural rigidity EI");
        Guard.Positive(ga, "The shear rigidity GA");
        Guard.FormFactor(formFactor);
        int n = z.Length;
        var flex = new double[n];
        var shear = new double[n];
        for (int k = 0; k < n; k++)          // level where displacement is sought
            for (int j = 0; j < n; j++)      // level where force acts
            {
                double p = levelForces[j], a = z[j], x = z[k];
                flex[k] += x <= a ? p * x * x * (3 * a - x) / (6 * ei) : p * a * a * (3 * x - a) / (6 * ei);
                shear[k] += formFactor * p * Math.Min(x, a) / ga;
            }
        return new StoryWallResult(z, flex, shear, Describe("Multi-story cantilever wall, uniform section, superposition of level forces", formFactor)
            .With("the section is the same over the full height"));
    }

    /// <summary>
    /// Stepped section: each story has its own EI and GA. Displacements are found exactly, piecewise, by the
    /// unit-load (virtual work) integral δ(z) = Σ_segments ∫ M·m/EI dx + ∫ f·V·v/GA dx, with
    /// M = P(a − x), m = z − x over 0 ≤ x ≤ min(z, a), for each level force, superposed.
    /// Source: unit-load method / moment-area method, e.g. Gere &amp; Timoshenko, Mechanics of Materials (energy methods).
    /// </summary>
    /// <param name="storyHeights">Height of each story, bottom story first (L), each positive.</param>
    /// <param name="levelForces">Lateral force at the top of each story (F), same count.</param>
    /// <param name="ei">E·I of each story (F·L²), same count, each positive.</param>
    /// <param name="ga">G·A of each story (F), same count, each positive.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1 (1.2 for a rectangle).</param>
    public static StoryWallResult Stepped(IReadOnlyList<double> storyHeights, IReadOnlyList<double> levelForces,
        IReadOnlyList<double> ei, IReadOnlyList<double> ga, double formFactor = ShearForm.RectangleDefault)
    {
        var z = Levels(storyHeights, levelForces);
        int n = z.Length;
        if (ei is null || ei.Count != n) throw new ArgumentException($"Give one EI per story ({n}).");
        if (ga is null || ga.Count != n) throw new ArgumentException($"Give one GA per story ({n}).");
        for (int s = 0; s < n; s++)
        {
            Guard.Positive(ei[s], $"The flexural rigidity EI of story {s + 1}");
            Guard.Positive(ga[s], $"The shear rigidity GA of story {s + 1}");
        }
        Guard.FormFactor(formFactor);
        var flex = new double[n];
        var shear = new double[n];
        for (int k = 0; k < n; k++)
            for (int j = 0; j < n; j++)
            {
                double p = levelForces[j], a = z[j], x = z[k], top = Math.Min(a, x);
                for (int s = 0; s < n; s++)
                {
                    double x1 = s == 0 ? 0.0 : z[s - 1];
                    double x2 = Math.Min(z[s], top);
                    if (x2 <= x1) break;
                    // ∫ (a − ξ)(x − ξ) dξ = a·x·ξ − (a + x)ξ²/2 + ξ³/3
                    double F(double q) => a * x * q - (a + x) * q * q / 2 + q * q * q / 3;
                    flex[k] += p * (F(x2) - F(x1)) / ei[s];
                    shear[k] += formFactor * p * (x2 - x1) / ga[s];
                }
            }
        return new StoryWallResult(z, flex, shear, Describe("Multi-story cantilever wall, stepped section, unit-load integration per story", formFactor)
            .With("EI and GA are constant within each story and change only at floor levels"));
    }

    private static double[] Levels(IReadOnlyList<double> storyHeights, IReadOnlyList<double> levelForces)
    {
        Guard.NotEmpty(storyHeights, "The list of story heights");
        if (levelForces is null || levelForces.Count != storyHeights.Count)
            throw new ArgumentException($"Give one level force per story ({storyHeights.Count}).");
        var z = new double[storyHeights.Count];
        double sum = 0;
        for (int i = 0; i < z.Length; i++)
        {
            Guard.Positive(storyHeights[i], $"The height of story {i + 1}");
            Guard.Finite(levelForces[i], $"The force at level {i + 1}");
            sum += storyHeights[i];
            z[i] = sum;
        }
        return z;
    }

    private static HandMethod Describe(string name, double f) => new(name,
        "Elementary beam theory and superposition; unit-load method; Gere & Timoshenko, Mechanics of Materials",
        ["plane sections remain plane", "base fully fixed", "top free to rotate",
         $"shear deformation with form factor {f.ToString("0.####", System.Globalization.CultureInfo.InvariantCulture)}",
         "forces act at the floor levels", "linear elastic, uncracked, small displacements",
         "floor diaphragms and beams add no restraint to the wall"]);
}
