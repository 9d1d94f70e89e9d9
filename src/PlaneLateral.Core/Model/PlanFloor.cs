namespace PlaneLateral.Model;

/// <summary>How a floor works in its own plane (docs/plan.md, "Floors that bend").</summary>
public enum FloorKind
{
    /// <summary>A rigid diaphragm: the floor translates and turns as a body (three DOFs per floor).</summary>
    Rigid,
    /// <summary>The floor as a deep beam in its plane, spanning each direction between the lines (Timoshenko members).</summary>
    SemiRigid,
    /// <summary>The floor as simple spans between the lines: each line takes its tributary load by statics.</summary>
    Flexible,
}

/// <summary>A rectangular hole in a floor, sides along plan X and Y (m).</summary>
public sealed record PlanOpening(PlanPoint Min, PlanPoint Max);

/// <summary>
/// A floor's in-plane model. <see cref="Thickness"/> (m), <see cref="E"/>, <see cref="G"/> (Pa) and
/// <see cref="ShearFactor"/> give its section as a deep beam (shear area = net area / factor); NaN when not given
/// (a rigid or flexible floor then has no semi-rigid alternative for the envelope).
/// </summary>
public sealed record PlanFloor(int Level, FloorKind Kind, double Thickness, double E, double G, double ShearFactor,
    IReadOnlyList<PlanOpening> Openings, CheckLocation At)
{
    /// <summary>True when the floor gives its section, so it can be modelled as a semi-rigid deep beam.</summary>
    public bool HasSection => Thickness > 0 && E > 0 && G > 0 && ShearFactor > 0;

    /// <summary>The word of the building file: "rigid", "semi-rigid", "flexible".</summary>
    public static string Word(FloorKind k) => k switch { FloorKind.SemiRigid => "semi-rigid", FloorKind.Flexible => "flexible", _ => "rigid" };
}

/// <summary>
/// Cuts through a floor outline with its openings: the pieces of floor a line x = const (or y = const) crosses, from
/// which the deep beam's net section is made (common practice: openings as reduced sections).
/// </summary>
public static class PlanFloorSection
{
    /// <summary>
    /// The intervals of floor on the cut at <paramref name="at"/> across the axis: <paramref name="acrossX"/> true cuts
    /// along x = at (intervals in y: the section of the beam spanning along X); false cuts along y = at (intervals in x).
    /// </summary>
    public static List<(double From, double To)> Cut(IReadOnlyList<PlanPoint> outline, IReadOnlyList<PlanOpening> openings, double at, bool acrossX)
    {
        var hits = new List<double>();
        for (int i = 0; i < outline.Count; i++)
        {
            var a = outline[i]; var b = outline[(i + 1) % outline.Count];
            double a1 = acrossX ? a.X : a.Y, b1 = acrossX ? b.X : b.Y, a2 = acrossX ? a.Y : a.X, b2 = acrossX ? b.Y : b.X;
            // Half-open rule on the edge so that a vertex is counted once.
            if ((a1 <= at && at < b1) || (b1 <= at && at < a1)) hits.Add(a2 + (at - a1) / (b1 - a1) * (b2 - a2));
        }
        hits.Sort();
        var pieces = new List<(double, double)>();
        for (int i = 0; i + 1 < hits.Count; i += 2) pieces.Add((hits[i], hits[i + 1]));
        foreach (var o in openings)
        {
            double lo1 = acrossX ? o.Min.X : o.Min.Y, hi1 = acrossX ? o.Max.X : o.Max.Y;
            if (!(at > lo1 && at < hi1)) continue;
            double lo = acrossX ? o.Min.Y : o.Min.X, hi = acrossX ? o.Max.Y : o.Max.X;
            var next = new List<(double, double)>();
            foreach (var (f, t) in pieces)
            {
                if (hi <= f || lo >= t) { next.Add((f, t)); continue; }
                if (lo > f) next.Add((f, lo));
                if (hi < t) next.Add((hi, t));
            }
            pieces = next;
        }
        return pieces;
    }

    /// <summary>Net depth (m), second moment of the net depth about its own centroid (m³, per unit thickness) of a cut.</summary>
    public static (double Depth, double Inertia) Section(List<(double From, double To)> pieces)
    {
        double d = pieces.Sum(p => p.To - p.From);
        if (d <= 0) return (0, 0);
        double c = pieces.Sum(p => (p.To - p.From) * 0.5 * (p.To + p.From)) / d;
        double i = pieces.Sum(p => { double l = p.To - p.From, m = 0.5 * (p.To + p.From) - c; return l * l * l / 12 + l * m * m; });
        return (d, i);
    }
}
