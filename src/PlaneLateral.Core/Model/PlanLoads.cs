namespace PlaneLateral.Model;

/// <summary>Floor-force load cases of a building in plan.</summary>
public static class PlanLoads
{
    /// <summary>
    /// Floor forces along X or Y at each floor's centre of mass, shifted perpendicular to the forces by
    /// <paramref name="sign"/>·<paramref name="ratio"/>·<paramref name="amplification"/>[floor] of the floor's plan
    /// dimension perpendicular to them (ASCE 7-16 §12.8.4.2: 5 % of the dimension, each way; the amplification is A_x of
    /// §12.8.4.3, 1 when not given). <paramref name="direction"/> is written to the case ("x", "y", or "" to keep the
    /// case out of the per-direction tables).
    /// </summary>
    public static PlanLoadCase AtCentreOfMass(string id, string family, string desc, string dir, int sign, IReadOnlyList<PlanLevel> levels,
        IReadOnlyList<double> forces, double ratio, IReadOnlyList<double>? amplification = null, string? direction = null)
    {
        var loads = new List<PlanFloorLoad>();
        for (int i = 1; i < levels.Count; i++)
        {
            var l = levels[i];
            double f = forces[i - 1];
            double ax = amplification?[i - 1] ?? 1;
            var c = l.CentreOfMass;
            if (dir == "x")
            {
                double e = sign * ratio * ax * (l.Outline.Max(q => q.Y) - l.Outline.Min(q => q.Y));
                loads.Add(new PlanFloorLoad(i, f, 0, -(c.Y + e) * f));
            }
            else
            {
                double e = sign * ratio * ax * (l.Outline.Max(q => q.X) - l.Outline.Min(q => q.X));
                loads.Add(new PlanFloorLoad(i, 0, f, (c.X + e) * f));
            }
        }
        string what = sign == 0 ? "at the centres of mass"
            : $"centres of mass shifted {(sign > 0 ? "+" : "−")}{ratio:0.###} of the plan dimension{(amplification is null ? "" : " × A_x")}";
        return new PlanLoadCase(id, family, string.IsNullOrEmpty(desc) ? what : $"{desc} ({what})", direction ?? dir, sign, loads);
    }
}
