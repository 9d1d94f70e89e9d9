using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>A read-only square matrix (a copy is taken on construction).</summary>
public sealed class MatrixView
{
    private readonly double[,] _a;

    public MatrixView(double[,] a) => _a = (double[,])a.Clone();

    public int Size => _a.GetLength(0);
    public double this[int i, int j] => _a[i, j];

    /// <summary>A copy of the entries.</summary>
    public double[,] ToArray() => (double[,])_a.Clone();
}

/// <summary>
/// Everything the analysis of a building in plan produced (docs/plan.md). All SI (N, m, rad). Renderers read it; nothing
/// in it changes after <see cref="PlanAnalysis.Run"/> returns.
/// </summary>
public sealed class PlanResult
{
    public required BuildingPlan Plan { get; init; }
    public required IReadOnlyList<PlanLineResult> Lines { get; init; }

    /// <summary>The floor stiffness K = Σ Tᵀ K̂ T on (Ux, Uy, Rz) of every floor, lowest first, about the plan origin (N/m, N, N·m/rad).</summary>
    public required MatrixView FloorStiffness { get; init; }

    /// <summary>Load cases in file order (each with its accidental-eccentricity twins after it).</summary>
    public required IReadOnlyList<PlanCaseResult> Cases { get; init; }

    /// <summary>Per direction of loading and story: each line's story stiffness alone and the centre of rigidity they give.</summary>
    public required IReadOnlyList<PlanStoryRigidity> Rigidity { get; init; }

    public required IReadOnlyList<TorsionalIrregularity> Irregularity { get; init; }

    /// <summary>Amplified drifts at the outline corners against the allowable ratio (empty without "driftCheck").</summary>
    public required IReadOnlyList<CornerDriftCheck> DriftChecks { get; init; }

    /// <summary>
    /// Floors that bend (docs/plan.md): the floor kinds, the code's flexibility test and the envelope of the line shears
    /// under rigid, semi-rigid and flexible floors; null when the building file gives no "floor" block. Where a floor
    /// is semi-rigid, <see cref="FloorStiffness"/> is condensed exactly onto the floors' (Ux, Uy, Rz); with a flexible floor
    /// it is the whole system's (floor, floor-beam and flexible-level line DOFs).
    /// </summary>
    public DiaphragmStudy? Diaphragms { get; init; }

    /// <summary>Worst backward error of the floor solves (scaled system, Rz times the plan size).</summary>
    public double WorstBackwardError => Cases.Count == 0 ? 0 : Cases.Max(c => c.BackwardError);

    /// <summary>Worst relative out-of-balance of ΣFx, ΣFy, ΣMz (line forces against floor loads).</summary>
    public double WorstEquilibriumError => Cases.Count == 0 ? 0 : Cases.Max(c => c.Equilibrium.RelativeError);

    public PlanCaseResult Case(string id) => Cases.First(c => c.Case.Id == id);
}

/// <summary>
/// One line: its condensed stiffness on its level DOFs (N/m) from one factorisation, the checks of that condensation,
/// and its planar model recovered under the level forces the floors put on it (every planar result per line).
/// </summary>
/// <param name="SymmetryError">Largest |F_ij − F_ji| of the line's flexibility on its levels, relative to its largest entry.</param>
/// <param name="CondensationBackwardError">Worst backward error of the unit-load solves of the condensation.</param>
/// <param name="Recovered">The line's planar analysis, one load case per building case (the level forces), same ids.</param>
/// <param name="RecoveryError">Largest |u_recovered − u_floor| of the line's level displacements over all cases, relative to the largest.</param>
public sealed record PlanLineResult(PlanLine Line, MatrixView Condensed, double SymmetryError, double CondensationBackwardError,
    AnalysisResult Recovered, double RecoveryError)
{
    /// <summary>Worst backward error of the recovery solves: the line's frame and, for a panel line, its panel.</summary>
    public double RecoveryBackwardError => PlanAnalysis.WorstBackwardError(Line, Recovered);
}

/// <summary>A floor's motion: Ux, Uy (m) of the plan origin and Rz (rad, counter-clockwise seen from above).</summary>
public sealed record FloorMotion(int Level, double Ux, double Uy, double Rz)
{
    /// <summary>Displacement of the floor at a plan point: ux = Ux − Rz·y, uy = Uy + Rz·x.</summary>
    public (double Ux, double Uy) At(PlanPoint p) => (Ux - Rz * p.Y, Uy + Rz * p.X);
}

/// <summary>ΣFx, ΣFy (N) and ΣMz about the origin (N·m) of the floor loads and of the forces the lines take.</summary>
/// <param name="RelativeError">Largest |applied − lines| over the three, relative to the largest force (moments divided by the plan size).</param>
public sealed record PlanEquilibrium(double AppliedFx, double AppliedFy, double AppliedMz, double LinesFx, double LinesFy, double LinesMz, double RelativeError);

/// <summary>The floor loads above the cut of a story: shears Vx, Vy (N) and torque Mz about the origin (N·m).</summary>
public sealed record PlanStoryLoad(int Story, double Vx, double Vy, double Mz);

/// <summary>
/// A line's shear in a story (N, along the line, positive along its direction): the sum of the level forces on the line
/// above the cut. <see cref="Direct"/> is its shear with every floor held against rotation (the same loads, Rz = 0),
/// <see cref="Torsional"/> the rest (what the floors' rotation adds). <see cref="Share"/> is the shear over the story
/// shear along the line's direction (NaN when that is nil, e.g. a line across the loading).
/// <see cref="PlanarShear"/> is the story shear of the recovered planar line by statics of its members (the same
/// number by a different road).
/// </summary>
public sealed record PlanLineStory(int Story, string Line, double Shear, double Share, double Direct, double Torsional, double PlanarShear, double Drift);

/// <summary>A vertex of a floor outline: its displacement and its drift (this level minus the level below at the same plan point), m.</summary>
public sealed record PlanVertexMotion(int Level, int Vertex, PlanPoint At, double Ux, double Uy, double DriftX, double DriftY);

/// <summary>
/// A plan point the user named ("points"): its displacement at a level and its drift (this level minus the level below
/// at the same plan point; story 1: minus the base, which does not move), m. On a rigid floor from the floor's rigid
/// motion, ux = Ux − Rz·y, uy = Uy + Rz·x; on a floor that bends, as at the outline corners, with the floor's deformation.
/// </summary>
public sealed record PlanPointMotion(int Level, string Point, PlanPoint At, double Ux, double Uy, double DriftX, double DriftY);

/// <summary>Results of one load case.</summary>
/// <param name="BackwardError">‖K·u − f‖∞ / (‖K‖∞‖u‖∞ + ‖f‖∞) of the floor solve, on the system scaled so that Rz is multiplied by the plan size.</param>
public sealed record PlanCaseResult(PlanLoadCase Case, IReadOnlyList<FloorMotion> Motion, IReadOnlyList<FloorMotion> LockedMotion,
    double BackwardError, PlanEquilibrium Equilibrium, IReadOnlyList<PlanStoryLoad> Stories, IReadOnlyList<PlanLineStory> LineStories,
    IReadOnlyList<PlanVertexMotion> Vertices)
{
    /// <summary>Displacements and drifts at the user's named points (<see cref="BuildingPlan.Points"/>), per level; empty without points.</summary>
    public IReadOnlyList<PlanPointMotion> Points { get; init; } = [];
}

/// <summary>A line's story stiffness alone (N/m): story shear over story drift of the line by itself under the direction's floor-force pattern.</summary>
public sealed record PlanLineStiffness(string Line, double X0, double Y0, double Angle, double Stiffness);

/// <summary>
/// The centre of rigidity of a story by the hand definition (x_R = Σk_y·x / Σk_y, y_R = Σk_x·y / Σk_x for orthogonal lines;
/// in general the point about which Σk·(c, s, d) couples no rotation) from the lines' story stiffnesses alone under the
/// floor-force pattern of <see cref="Direction"/>.
/// </summary>
public sealed record PlanStoryRigidity(string Direction, int Story, IReadOnlyList<PlanLineStiffness> Lines, double XR, double YR);

/// <summary>
/// Torsional irregularity of a story for loading along <see cref="Direction"/> (ASCE 7-16 Table 12.3-1, Types 1a and 1b):
/// the largest story drift at the outline's corners along the loading over the average of the two extreme corners,
/// with accidental torsion (the worst of the cases). <see cref="Ax"/> = (δ_max / 1.2 δ_avg)², 1 ≤ A_x ≤ 3, on the
/// displacements of the story's top level (§12.8.4.3, eq. 12.8-14).
/// </summary>
/// <param name="WithAccidental">True when the ratio comes from the cases with the centre of mass shifted.</param>
/// <param name="Type">"1b" above 1.4, "1a" above 1.2, otherwise "none".</param>
public sealed record TorsionalIrregularity(string Direction, int Story, string Case, bool WithAccidental, double MaxDrift, double AverageDrift, double Ratio, string Type,
    double MaxDisplacement, double AverageDisplacement, double Ax);

/// <summary>Amplified drift δ = C_d·δ_e / I_e at an outline corner (vector drift in plan) against the allowable ratio.</summary>
/// <remarks>A row for a named point has <see cref="Point"/> set (its id) and <see cref="Vertex"/> −1.</remarks>
public sealed record CornerDriftCheck(string Case, int Story, int Vertex, PlanPoint At, double Drift, double Amplified, double Height, double Ratio, double Allowed, bool Within)
{
    /// <summary>The named point's id for a row of a user's point; null for an outline corner.</summary>
    public string? Point { get; init; }

    /// <summary>"corner 3" or "point \"stair core NE\"", for tables.</summary>
    public string Where => Point is null ? $"corner {Vertex + 1}" : $"point {Point}";
}
