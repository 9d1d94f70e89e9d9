namespace PlaneLateral.Hand;

/// <summary>
/// A line of resistance for the torsion split: plan point (X, Y) it passes through, direction angle (rad, from plan X
/// towards plan Y) and story stiffness k (F/L).
/// </summary>
public sealed record TorsionLine(string Id, double X, double Y, double Angle, double Stiffness);

/// <summary>
/// A line's story shear by relative rigidity with torsion (F, along the line's direction).
/// <see cref="Distance"/> is its signed lever d about the centre of rigidity (L); <see cref="Direct"/> = its share of
/// the story shear with the floor held against twist; <see cref="Torsional"/> = k·d·T/J; <see cref="Total"/> the sum;
/// <see cref="Design"/> = the total where torsion adds to the direct shear, the direct shear where it would reduce it
/// (a torsional part that reduces a line's shear is not taken).
/// </summary>
public sealed record TorsionLineShear(string Id, double Distance, double Direct, double Torsional, double Total, double Design);

/// <summary>The split of one story: centre of rigidity (L), torsional stiffness J = Σk·d² (F·L), torque about the centre of rigidity (F·L).</summary>
public sealed record TorsionSplitResult(double XR, double YR, double J, double Torque, double Vx, double Vy, IReadOnlyList<TorsionLineShear> Lines, HandMethod Method);

/// <summary>
/// Story shear among lines of resistance in plan by relative rigidity with torsion (Taly, <i>Design of Reinforced Masonry
/// Structures</i>, 2nd ed., 2010, §7.9, eqs. 7.72–7.75): centre of rigidity x_R = Σk_y·x/Σk_y, y_R = Σk_x·y/Σk_x;
/// J = Σk_x(y − y_R)² + Σk_y(x − x_R)²; V_i = V·k_i/Σk_∥ + k_i·d_i·T/J, T the story torque about the centre of
/// rigidity. For lines at other angles the same split is made about the point where translation and twist uncouple:
/// the direct part from the 2×2 translational stiffness Σk(c, s)ᵀ(c, s), the torsional part k·d·T/J with
/// d = (x − x_R)·sin α − (y − y_R)·cos α (derived; for orthogonal lines it is the textbook split).
/// Units: any consistent set.
/// </summary>
public static class TorsionSplit
{
    /// <summary>
    /// Splits a story shear (V_x, V_y) whose resultant gives the torque <paramref name="mzAboutOrigin"/> about the plan
    /// origin (F·L, counter-clockwise positive) among the lines.
    /// </summary>
    /// <param name="lockRotation">True: the floor held against twist, the direct part only (what one planar direction gives).</param>
    public static TorsionSplitResult Split(IReadOnlyList<TorsionLine> lines, double vx, double vy, double mzAboutOrigin, bool lockRotation = false)
    {
        Guard.NotEmpty(lines, "The list of lines");
        Guard.Finite(vx, "The story shear V_x");
        Guard.Finite(vy, "The story shear V_y");
        Guard.Finite(mzAboutOrigin, "The story torque");
        foreach (var l in lines) Guard.Positive(l.Stiffness, $"The stiffness of line {l.Id}");
        double kxx = 0, kxy = 0, kyy = 0, kxt = 0, kyt = 0;
        foreach (var l in lines)
        {
            double c = Cos(l.Angle), s = Sin(l.Angle), r = l.X * s - l.Y * c;
            kxx += l.Stiffness * c * c; kxy += l.Stiffness * c * s; kyy += l.Stiffness * s * s;
            kxt += l.Stiffness * c * r; kyt += l.Stiffness * s * r;
        }
        double det = kxx * kyy - kxy * kxy;
        if (!(det > 1e-12 * kxx * kyy) || kxx <= 0 || kyy <= 0)
            throw new ArgumentException("The lines cannot resist both plan directions (all parallel): the centre of rigidity is undefined.");
        // The centre of rigidity: where Σk·c·d = Σk·s·d = 0 with d = r − (x_R s − y_R c).
        double xr = (-kxt * kxy + kxx * kyt) / det;
        double yr = (kxy * kyt - kyy * kxt) / det;
        double j = 0;
        var d = lines.Select(l => (l.X - xr) * Sin(l.Angle) - (l.Y - yr) * Cos(l.Angle)).ToArray();
        for (int i = 0; i < lines.Count; i++) j += lines[i].Stiffness * d[i] * d[i];
        double torque = mzAboutOrigin - (xr * vy - yr * vx);
        // Floor translation under (Vx, Vy) alone: [[kxx, kxy], [kxy, kyy]]·(Δx, Δy) = (Vx, Vy).
        double dx = (kyy * vx - kxy * vy) / det, dy = (kxx * vy - kxy * vx) / det;
        double theta = lockRotation || j == 0 ? 0 : torque / j;
        var shares = lines.Select((l, i) =>
        {
            double direct = l.Stiffness * (Cos(l.Angle) * dx + Sin(l.Angle) * dy);
            double tors = l.Stiffness * d[i] * theta;
            double total = direct + tors;
            double design = Math.Abs(total) > Math.Abs(direct) ? total : direct;
            return new TorsionLineShear(l.Id, d[i], direct, tors, total, design);
        }).ToList();
        return new TorsionSplitResult(xr, yr, j, torque, vx, vy, shares, new HandMethod(
            lockRotation ? "Story shear by relative rigidity, floor held against twist" : "Story shear by relative rigidity with torsion, V_i = V·k_i/Σk + k_i·d_i·T/J",
            "Taly, Design of Reinforced Masonry Structures, 2nd ed., 2010, §7.9, eqs. 7.72–7.75",
            ["the diaphragm is rigid in its plane", "each line has one story stiffness, found from the line alone",
             "the centre of rigidity is that of this story's stiffnesses (in a multi-story building it moves with the story and the load)",
             "a torsional part that reduces a line's shear is not taken in the design shear", "linear elastic"]));
    }

    private static double Cos(double a) => Math.Abs(Math.Cos(a)) < 1e-15 ? 0 : Math.Cos(a);
    private static double Sin(double a) => Math.Abs(Math.Sin(a)) < 1e-15 ? 0 : Math.Sin(a);
}
