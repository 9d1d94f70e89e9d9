using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>A point in plan (m). Plan axes: X east, Y north, Rz counter-clockwise seen from above.</summary>
public readonly record struct PlanPoint(double X, double Y);

/// <summary>
/// A floor level of a building in plan. The base (index 0) carries no floor DOFs. SI: elevation in m, weight in N,
/// mass in kg, polar inertia in kg·m² about the centre of mass.
/// </summary>
/// <param name="Weight">Seismic weight (N); NaN when not given.</param>
/// <param name="CentreOfMass">Where floor forces of the "at the centre of mass" load cases act.</param>
/// <param name="Outline">The floor's plan outline (at least three vertices, counter-clockwise or clockwise).</param>
/// <param name="PolarInertia">Mass moment of inertia about the centre of mass (kg·m²): given, or the uniform floor's from the outline; NaN without a weight.</param>
public sealed record PlanLevel(int Index, string Id, string Name, double Elevation, double Weight, PlanPoint CentreOfMass,
    IReadOnlyList<PlanPoint> Outline, double PolarInertia);

/// <summary>How a line of resistance was given in the building file.</summary>
public enum PlanLineForm
{
    /// <summary>A planar model written inside the building file.</summary>
    Inline,
    /// <summary>A planar model in a file beside the building file.</summary>
    File,
    /// <summary>The compact wall form, turned into Timoshenko members per story or into a plane-stress panel (<see cref="PlanLine.Panel"/>).</summary>
    Wall,
    /// <summary>Story stiffnesses given directly (a shear-type line), turned into exact horizontal story springs.</summary>
    StoryStiffness,
}

/// <summary>
/// A line of resistance placed in plan: its planar model's X axis runs along the direction <see cref="Angle"/> (rad,
/// from plan X towards plan Y) through the point (<see cref="X0"/>, <see cref="Y0"/>) (m). The planar model's level
/// <c>l</c> is tied to the floor at building level <c>l</c>: its lateral DOF is the equation of node
/// <see cref="LevelNodes"/>[l − 1] in X (the master of the line's own rigid diaphragm at that level). A line whose
/// model is one plane-stress panel (<see cref="Panel"/> ≥ 0) is held by the panel's floor ties instead:
/// <see cref="LevelNodes"/>[l − 1] is then the index of the tie (the panel's level, its top last) at building level <c>l</c>.
/// </summary>
public sealed record PlanLine(string Id, PlanLineForm Form, string Source, double X0, double Y0, double Angle,
    StructureModel Model, IReadOnlyList<int> LevelNodes, CheckLocation At)
{
    /// <summary>
    /// Index in <see cref="StructureModel.Panels"/> of the panel that is the whole line (a compact wall given
    /// <c>"as": "panel"</c>, or a planar model of one panel and nothing else), whose floor ties the floors hold; −1 for
    /// a line of members (and panels linked to them).
    /// </summary>
    public int Panel { get; init; } = -1;

    /// <summary>The line's plan length when the tool knows it (a compact wall), m; NaN otherwise.</summary>
    public double PlanLength { get; init; } = double.NaN;

    public double Cos => Math.Abs(Math.Cos(Angle)) < 1e-15 ? 0 : Math.Cos(Angle);
    public double Sin => Math.Abs(Math.Sin(Angle)) < 1e-15 ? 0 : Math.Sin(Angle);

    /// <summary>Lever of the line about the plan origin, r = x₀·sin α − y₀·cos α (m): u_line = cos α·Ux + sin α·Uy + r·Rz.</summary>
    public double Lever => X0 * Sin - Y0 * Cos;

    /// <summary>"x", "y" or the angle in degrees, for tables.</summary>
    public string DirectionLabel => Sin == 0 ? "x" : Cos == 0 ? "y" : $"{Angle * 180 / Math.PI:0.##}°";
}

/// <summary>A force and torque applied to a floor, about the plan origin: Fx, Fy (N), Mz (N·m).</summary>
public sealed record PlanFloorLoad(int Level, double Fx, double Fy, double Mz);

/// <summary>
/// A lateral load case of the building: floor forces and torques (about the plan origin) per level.
/// <see cref="Direction"/> is "x" or "y" for forces at the centres of mass along one axis, "" otherwise;
/// <see cref="Eccentricity"/> is 0 at the centre of mass, +1 or −1 for the centre of mass shifted by the accidental
/// eccentricity; <see cref="Family"/> is the id of the case as the user named it.
/// </summary>
public sealed record PlanLoadCase(string Id, string Family, string Description, string Direction, int Eccentricity, IReadOnlyList<PlanFloorLoad> Loads);

/// <summary>A plan point the user names (docs/plan.md, "points"): its displacements and story drifts are reported at every floor (m).</summary>
public sealed record PlanNamedPoint(string Id, PlanPoint At);

/// <summary>Corner drift check: δ = C_d·δ_e / I_e (ASCE 7-16 eq. 12.8-15) at every outline vertex against an allowable ratio.</summary>
public sealed record PlanDriftLimit(double Cd, double Ie, double AllowedRatio);

/// <summary>
/// A building in plan (docs/plan.md): levels with their floors, lines of resistance each a planar model, lateral load
/// cases as floor forces. All SI.
/// </summary>
public sealed record BuildingPlan
{
    public required string Title { get; init; }
    public required string SourcePath { get; init; }
    public required UnitSystem Units { get; init; }

    /// <summary>Levels, base first, sorted by elevation.</summary>
    public required IReadOnlyList<PlanLevel> Levels { get; init; }
    public required IReadOnlyList<PlanLine> Lines { get; init; }
    public required IReadOnlyList<PlanLoadCase> Cases { get; init; }

    /// <summary>Accidental eccentricity as a fraction of the plan dimension perpendicular to the forces (0.05 by default).</summary>
    public double EccentricityRatio { get; init; } = 0.05;

    public PlanDriftLimit? DriftLimit { get; init; }

    /// <summary>Plan points named by the user ("points"), reported at every floor beside the outline corners; none by default.</summary>
    public IReadOnlyList<PlanNamedPoint> Points { get; init; } = [];

    /// <summary>The floors' in-plane models that the file gives (docs/plan.md, "Floors that bend"); a floor not listed is rigid.</summary>
    public IReadOnlyList<PlanFloor> Floors { get; init; } = [];

    /// <summary>How the floor of a level (1 = lowest floor) works in its plane: rigid unless the file says otherwise.</summary>
    public FloorKind KindOf(int level) => Floors.FirstOrDefault(f => f.Level == level)?.Kind ?? FloorKind.Rigid;

    /// <summary>The floor block of a level, or null when the file gives none.</summary>
    public PlanFloor? FloorOf(int level) => Floors.FirstOrDefault(f => f.Level == level);

    /// <summary>The seismic block: equivalent lateral forces from the plan modes, and the response spectrum analysis (null when not given).</summary>
    public PlanSeismicData? Seismic { get; init; }

    /// <summary>Plausibility warnings on the building file and its lines' models (Model/Plausibility.Plan.cs); none changes a number.</summary>
    public IReadOnlyList<ModelWarning> Warnings { get; init; } = [];

    /// <summary>The files this building was read from, with their SHA-256: the building file first, then each line file once, in the order first read (empty when parsed from text).</summary>
    public IReadOnlyList<InputFile> Inputs { get; init; } = [];

    /// <summary>Floors (levels above the base).</summary>
    public int FloorCount => Levels.Count - 1;

    /// <summary>Plan size: the largest extent of any outline (m), the length that makes Rz comparable with Ux, Uy.</summary>
    public double Size
    {
        get
        {
            var pts = Levels.Skip(1).SelectMany(l => l.Outline).ToList();
            if (pts.Count == 0) return 1;
            return Math.Max(pts.Max(p => p.X) - pts.Min(p => p.X), pts.Max(p => p.Y) - pts.Min(p => p.Y));
        }
    }
}

/// <summary>Plan geometry of a floor outline (a simple polygon): area, centroid, polar moment (standard polygon formulas).</summary>
public static class PlanOutline
{
    /// <summary>Signed area (m², positive when counter-clockwise), by the shoelace formula.</summary>
    public static double SignedArea(IReadOnlyList<PlanPoint> p)
    {
        double a = 0;
        for (int i = 0; i < p.Count; i++) { var q = p[i]; var r = p[(i + 1) % p.Count]; a += q.X * r.Y - r.X * q.Y; }
        return a / 2;
    }

    public static PlanPoint Centroid(IReadOnlyList<PlanPoint> p)
    {
        double a = 0, cx = 0, cy = 0;
        for (int i = 0; i < p.Count; i++)
        {
            var q = p[i]; var r = p[(i + 1) % p.Count];
            double c = q.X * r.Y - r.X * q.Y;
            a += c; cx += (q.X + r.X) * c; cy += (q.Y + r.Y) * c;
        }
        return new PlanPoint(cx / (3 * a), cy / (3 * a));
    }

    /// <summary>
    /// Polar second moment of the outline's area about its centroid per unit area (m²): I_p / A. For a b × d rectangle
    /// (b² + d²)/12. Polygon formulas: I_x = (1/12) Σ (x_i y_{i+1} − x_{i+1} y_i)(y_i² + y_i y_{i+1} + y_{i+1}²), same for
    /// I_y, then moved to the centroid (common practice).
    /// </summary>
    public static double PolarRadiusSquared(IReadOnlyList<PlanPoint> p)
    {
        double a = SignedArea(p), ix = 0, iy = 0;
        for (int i = 0; i < p.Count; i++)
        {
            var q = p[i]; var r = p[(i + 1) % p.Count];
            double c = q.X * r.Y - r.X * q.Y;
            ix += c * (q.Y * q.Y + q.Y * r.Y + r.Y * r.Y);
            iy += c * (q.X * q.X + q.X * r.X + r.X * r.X);
        }
        ix /= 12; iy /= 12;
        var g = Centroid(p);
        return (ix + iy) / a - (g.X * g.X + g.Y * g.Y);
    }

    /// <summary>True when the point lies inside the polygon or on its boundary (within <paramref name="tol"/> m).</summary>
    public static bool Contains(IReadOnlyList<PlanPoint> p, PlanPoint x, double tol)
    {
        for (int i = 0; i < p.Count; i++)
            if (DistanceToSegment(p[i], p[(i + 1) % p.Count], x) <= tol) return true;
        bool inside = false;
        for (int i = 0, j = p.Count - 1; i < p.Count; j = i++)
            if ((p[i].Y > x.Y) != (p[j].Y > x.Y) && x.X < (p[j].X - p[i].X) * (x.Y - p[i].Y) / (p[j].Y - p[i].Y) + p[i].X)
                inside = !inside;
        return inside;
    }

    private static double DistanceToSegment(PlanPoint a, PlanPoint b, PlanPoint x)
    {
        double dx = b.X - a.X, dy = b.Y - a.Y, l2 = dx * dx + dy * dy;
        double t = l2 == 0 ? 0 : Math.Clamp(((x.X - a.X) * dx + (x.Y - a.Y) * dy) / l2, 0, 1);
        double ex = a.X + t * dx - x.X, ey = a.Y + t * dy - x.Y;
        return Math.Sqrt(ex * ex + ey * ey);
    }
}
