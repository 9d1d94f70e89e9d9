using PlaneLateral.Assembly;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>Everything a linear static analysis produced. All values SI (N, m, rad).</summary>
public sealed class AnalysisResult
{
    public required StructureModel Model { get; init; }
    public required DofMap Dofs { get; init; }
    public required SolveSummary Solve { get; init; }

    /// <summary>Load cases in file order, then combinations in file order.</summary>
    public required IReadOnlyList<CaseResult> Cases { get; init; }

    public required IReadOnlyList<StiffnessResult> Stiffness { get; init; }

    /// <summary>Plain-sentence notes about the model (e.g. rotations held because nothing stiffens them).</summary>
    public required IReadOnlyList<string> Notes { get; init; }

    /// <summary>Wall panels solved as plane-stress continua, in model order (none for a frame-only model).</summary>
    public IReadOnlyList<PanelResult> Panels { get; init; } = [];
    /// <summary>Links between frame nodes and panel edges: link forces and the checks of the whole (null when the model has none).</summary>
    public PanelLinkResults? PanelLinks { get; init; }
    /// <summary>Condition estimates of the factorised stiffness (see <see cref="Analysis.Conditioning"/>); null when not estimated.</summary>
    public ConditionEstimate? Conditioning { get; init; }
    /// <summary>The assembled frame system (stiffness and the load cases' vectors), for export (docs/export.md).</summary>
    public LinearSystem? System { get; init; }

    public CaseResult Case(string id) => Cases.First(c => c.Id == id);
}

/// <summary>Facts about the assembled system and its solution (no timings: results files stay byte-identical run to run).</summary>
public sealed record SolveSummary(string Solver, int Unknowns, int MatrixNonZerosLower, long FactorNonZeros, int RightHandSides);

/// <summary>Results of one load case or combination.</summary>
public sealed class CaseResult
{
    public required string Id { get; init; }
    public required bool IsCombination { get; init; }
    public required string Description { get; init; }

    /// <summary>Nodal displacements: index 3·node + dof (ux, uy in m; rz in rad).</summary>
    public required double[] Displacements { get; init; }

    /// <summary>Support reactions (rigid restraint and springs together), one per support, in model support order.</summary>
    public required IReadOnlyList<Reaction> Reactions { get; init; }

    /// <summary>Member end forces, one per member, in model member order.</summary>
    public required IReadOnlyList<MemberEndForces> MemberForces { get; init; }

    public required EquilibriumCheck Equilibrium { get; init; }

    /// <summary>‖K·u − f‖₂ / ‖f‖₂ over the unknowns (absolute ‖K·u − f‖₂ when f = 0).</summary>
    public required double RelativeResidual { get; init; }

    /// <summary>
    /// Normwise backward error η = ‖K·u − f‖∞ / (‖K‖∞·‖u‖∞ + ‖f‖∞) (Rigal &amp; Gaches 1967; Higham, <i>Accuracy and
    /// Stability of Numerical Algorithms</i>, 2nd ed., 2002, Thm 7.1): the relative change of K and f for which u is
    /// exact. A stable solve gives a small multiple of 1e-16 whatever the conditioning; the relative residual grows with it.
    /// </summary>
    public required double BackwardError { get; init; }

    public double Displacement(int node, Dof dof) => Displacements[3 * node + (int)dof];
}

/// <summary>Force and moment the support puts on the structure at a node (N, N·m), global axes.</summary>
public sealed record Reaction(int Node, double Fx, double Fy, double Mz);

/// <summary>
/// Forces on a member's flexible segment at its two ends, local axes, matrix sign convention: N1, V1, M1 at the
/// start face and N2, V2, M2 at the end face, positive along local x, local y and counter-clockwise. The axial
/// force as tension-positive is N2 at the end (−N1 at the start).
/// </summary>
public sealed record MemberEndForces(int Member, double N1, double V1, double M1, double N2, double V2, double M2);

/// <summary>
/// Global equilibrium: the applied loads (nodal loads plus the resultants of member loads, integrated along
/// the members independently of the element load vectors) against the sum of reactions; moments about the origin.
/// </summary>
public sealed record EquilibriumCheck(
    double AppliedFx, double AppliedFy, double AppliedMz,
    double ReactionFx, double ReactionFy, double ReactionMz)
{
    /// <summary>
    /// What the body carries (N): Σ|F| over the individual forces acting on it (loads, link forces, reactions), the larger
    /// of the x and y sums. When given (&gt; 0) the force imbalance is relative to at least this, so a body whose forces
    /// cancel in sum (a panel carried only by its links) is not judged by a round-off ratio of nothing to nothing.
    /// </summary>
    public double ForceScale { get; init; }

    /// <summary>Σ|M| (N·m) of the individual forces about the origin, as <see cref="ForceScale"/> for the moment imbalance.</summary>
    public double MomentScale { get; init; }

    /// <summary>Largest out-of-balance force, relative to the largest applied or reacting force or <see cref="ForceScale"/> (0 when all vanish).</summary>
    public double RelativeForceError
    {
        get
        {
            double scale = Math.Max(ForceScale, new[] { AppliedFx, AppliedFy, ReactionFx, ReactionFy }.Max(Math.Abs));
            double err = Math.Max(Math.Abs(AppliedFx + ReactionFx), Math.Abs(AppliedFy + ReactionFy));
            return scale == 0 ? err : err / scale;
        }
    }

    /// <summary>Out-of-balance moment relative to the largest applied or reacting moment about the origin.</summary>
    public double RelativeMomentError
    {
        get
        {
            double scale = Math.Max(MomentScale, Math.Max(Math.Abs(AppliedMz), Math.Abs(ReactionMz)));
            double err = Math.Abs(AppliedMz + ReactionMz);
            return scale == 0 ? err : err / scale;
        }
    }
}

/// <summary>Lateral stiffness at a point: the force per unit displacement there when only that point is pushed.</summary>
/// <param name="Flexibility">Displacement under a unit force (m/N).</param>
/// <param name="Stiffness">1 / flexibility (N/m).</param>
public sealed record StiffnessResult(StiffnessPoint Point, double Flexibility, double Stiffness);
