namespace PlaneLateral.Hand;

/// <summary>
/// A line of resistance under a flexible floor: its position along the floor's span (L) and its story stiffness (F/L),
/// which only shares the load among lines standing at one position (0 or NaN: they share equally).
/// </summary>
public sealed record TributaryLine(string Id, double At, double Stiffness = double.NaN);

/// <summary>
/// A line's share of a flexible floor's load: the tributary strip it gathers (<see cref="From"/> to <see cref="To"/>, L),
/// its <see cref="Force"/> (F) and its <see cref="Share"/> of the floor's load (its share of the strip's load when it
/// stands at one position with other lines).
/// </summary>
public sealed record TributaryShare(string Id, double At, double From, double To, double Force, double Share);

/// <summary>The split of one floor's load; <see cref="Lines"/> in the order given.</summary>
public sealed record TributarySplitResult(IReadOnlyList<TributaryShare> Lines, double Load, HandMethod Method);

/// <summary>
/// The flexible-floor (tributary) split of a floor's lateral load among the lines that hold it: the floor is a chain of
/// simple spans between neighbouring line positions, so a uniform load on each span goes half to each end line (the lever
/// rule of a simple span); a line gathers the strip from the midpoint of the span on one side to the midpoint of the span
/// on the other, and an end line also the floor beyond it (the overhang, taken whole by the end line as its tributary
/// area: common practice; the overhang's moment is not sent to the next line). Lines at one position share their strip
/// by their story stiffnesses. Wight &amp; MacGregor, <i>Reinforced Concrete: Mechanics and Design</i>, the section on
/// diaphragm stiffness: three equal walls under a flexible diaphragm take 1/4, 1/2, 1/4.
/// Units: any consistent set. No finite-element code is used, so it cannot share a bug with the FE flexible floor.
/// </summary>
public static class TributarySplit
{
    private static readonly HandMethod Method = new("Tributary split of a flexible diaphragm (simple spans between lines)",
        "Wight & MacGregor, Reinforced Concrete: Mechanics and Design, the section on diaphragm stiffness; common practice",
        [
            "the floor is flexible in its plane: each span between neighbouring lines is a simple span (no continuity over the lines)",
            "the floor's load is uniform along the span over the floor's extent",
            "the floor's torque is not distributed (a flexible floor does not carry torsion between lines)",
            "an overhang beyond an end line is tributary to that line",
            "lines at one position share their strip by their story stiffnesses",
        ]);

    /// <summary>
    /// Splits the load <paramref name="force"/> spread uniformly over the floor from <paramref name="from"/> to
    /// <paramref name="to"/> along the span among <paramref name="lines"/> (at least two different positions, all within
    /// the floor's extent).
    /// </summary>
    public static TributarySplitResult Uniform(IReadOnlyList<TributaryLine> lines, double from, double to, double force)
    {
        ArgumentNullException.ThrowIfNull(lines);
        Guard.Finite(from, "The floor's start");
        Guard.Finite(to, "The floor's end");
        Guard.Finite(force, "The floor's load");
        if (!(to > from)) throw new ArgumentException($"The floor's extent must be positive; got {from} to {to}.");
        double tol = 1e-9 * (to - from);
        foreach (var l in lines)
        {
            Guard.Finite(l.At, $"The position of line {l.Id}");
            if (l.At < from - tol || l.At > to + tol) throw new ArgumentException($"Line {l.Id} at {l.At} stands outside the floor ({from} to {to}).");
        }
        // The distinct positions, ascending; lines closer than the tolerance stand at one position.
        var positions = new List<double>();
        foreach (double p in lines.Select(l => l.At).Order())
            if (positions.Count == 0 || p - positions[^1] > tol) positions.Add(p);
        if (positions.Count < 2) throw new ArgumentException("A flexible floor needs lines at two different positions at least.");
        double w = force / (to - from);
        var shares = new TributaryShare[lines.Count];
        for (int k = 0; k < positions.Count; k++)
        {
            double a = k == 0 ? from : 0.5 * (positions[k - 1] + positions[k]);
            double b = k == positions.Count - 1 ? to : 0.5 * (positions[k] + positions[k + 1]);
            double strip = w * (b - a);
            var here = Enumerable.Range(0, lines.Count).Where(i => Math.Abs(lines[i].At - positions[k]) <= tol).ToList();
            bool byStiffness = here.All(i => lines[i].Stiffness > 0 && double.IsFinite(lines[i].Stiffness));
            double sum = byStiffness ? here.Sum(i => lines[i].Stiffness) : here.Count;
            foreach (int i in here)
            {
                double part = (byStiffness ? lines[i].Stiffness : 1.0) / sum;
                shares[i] = new TributaryShare(lines[i].Id, lines[i].At, a, b, strip * part, (b - a) / (to - from) * part);
            }
        }
        return new TributarySplitResult(shares, force, Method);
    }
}
