using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Assembly;

/// <summary>State of one nodal DOF.</summary>
public enum DofState
{
    /// <summary>An unknown of the system.</summary>
    Free,
    /// <summary>Held at zero by a support.</summary>
    Restrained,
    /// <summary>
    /// A rotation that no member, support or spring stiffens (every member meeting there is a brace or released);
    /// held at zero, which changes nothing else, and reported.
    /// </summary>
    Unattached,
}

/// <summary>
/// Numbering of the model's nodal DOFs (3 per node: ux, uy, rz) into equations. Built once, then immutable.
/// Note: equation numbers are not node numbers; use <see cref="Equation"/> and <see cref="DofOf"/> to go between them.
/// </summary>
public sealed partial class DofMap
{
    private readonly int[] _equation;   // node*3+dof → equation or −1
    private readonly DofState[] _state;
    private readonly int[] _dofOfEquation;

    private DofMap(int[] equation, DofState[] state, int[] dofOfEquation)
    {
        _equation = equation;
        _state = state;
        _dofOfEquation = dofOfEquation;
    }

    /// <summary>Number of unknowns.</summary>
    public int FreeCount => _dofOfEquation.Length;

    public int NodeCount => _equation.Length / 3;

    /// <summary>Equation of (node, dof), or −1 when it is not an unknown.</summary>
    public int Equation(int node, Dof dof) => _equation[3 * node + (int)dof];

    public DofState State(int node, Dof dof) => _state[3 * node + (int)dof];

    /// <summary>(node, dof) of an equation; for an equation shared by a rigid diaphragm, the master node's ux.</summary>
    public (int Node, Dof Dof) DofOf(int equation)
    {
        int k = _dofOfEquation[equation];
        return (k / 3, (Dof)(k % 3));
    }

    /// <summary>Global equations of an element's six DOFs (−1 where not an unknown).</summary>
    public int[] ElementEquations(Member m) =>
    [
        Equation(m.Start, Dof.X), Equation(m.Start, Dof.Y), Equation(m.Start, Dof.RZ),
        Equation(m.End, Dof.X), Equation(m.End, Dof.Y), Equation(m.End, Dof.RZ),
    ];

    /// <summary>Numbers the DOFs: supports restrain, unattached rotations are held, the rest are unknowns in node order.</summary>
    public static DofMap Build(StructureModel model, IReadOnlyList<FrameElement> elements)
    {
        int n = model.Nodes.Count;
        var state = new DofState[3 * n];
        var stiffened = new bool[3 * n];
        foreach (var e in elements)
            for (int d = 0; d < 6; d++)
                if (e.Stiffens(d))
                    stiffened[3 * (d < 3 ? e.Member.Start : e.Member.End) + d % 3] = true;
        foreach (var s in model.Supports)
            for (int d = 0; d < 3; d++)
            {
                if (s.Restrains((Dof)d)) state[3 * s.Node + d] = DofState.Restrained;
                if (s.Spring((Dof)d) > 0) stiffened[3 * s.Node + d] = true;
            }
        for (int k = 0; k < 3 * n; k++)
            if (state[k] == DofState.Free && !stiffened[k] && k % 3 == (int)Dof.RZ)
                state[k] = DofState.Unattached;

        var equation = new int[3 * n];
        var dofOf = new List<int>(3 * n);
        // Rigid diaphragms: a tied node's ux shares the equation of its level's master (lowest-numbered, so numbered first).
        var master = model.Building.DiaphragmMasters(n);
        for (int k = 0; k < 3 * n; k++)
        {
            if (state[k] == DofState.Free && k % 3 == (int)Dof.X && master[k / 3] >= 0 && master[k / 3] != k / 3 && equation[3 * master[k / 3]] >= 0) equation[k] = equation[3 * master[k / 3]];
            else if (state[k] == DofState.Free) { equation[k] = dofOf.Count; dofOf.Add(k); }
            else equation[k] = -1;
        }
        if (model.Members.Any(m => m.AxiallyRigid)) return ShareAxiallyRigid(model, equation, state, dofOf);
        return new DofMap(equation, state, dofOf.ToArray());
    }

    /// <summary>
    /// Axially rigid members (<see cref="Member.AxiallyRigid"/>): the displacement along the member's axis (x for a
    /// horizontal member, y for a vertical one) of its two ends shares one equation, joined with any sharing already made
    /// (rigid diaphragms); equations renumbered in (node, dof) order, each reported as its group's lowest (node, dof).
    /// Exact (no penalty): the member's own axial terms cancel in the shared equation. The reader has made sure both
    /// ends are free along the axis.
    /// </summary>
    private static DofMap ShareAxiallyRigid(StructureModel model, int[] equation, DofState[] state, List<int> dofOf)
    {
        int n = dofOf.Count;
        var parent = Enumerable.Range(0, n).ToArray();
        int Find(int i) { while (parent[i] != i) { parent[i] = parent[parent[i]]; i = parent[i]; } return i; }
        foreach (var m in model.Members.Where(m => m.AxiallyRigid))
        {
            var a = model.Nodes[m.Start]; var b = model.Nodes[m.End];
            int d = Math.Abs(b.Y - a.Y) <= 1e-9 * Math.Abs(b.X - a.X) ? (int)Dof.X : (int)Dof.Y;
            int ea = equation[3 * m.Start + d], eb = equation[3 * m.End + d];
            if (ea < 0 || eb < 0) continue;
            int ra = Find(ea), rb = Find(eb);
            if (ra != rb) parent[Math.Max(ra, rb)] = Math.Min(ra, rb);
        }
        var renumber = new int[n];
        Array.Fill(renumber, -1);
        var newDofOf = new List<int>(n);
        var result = new int[equation.Length];
        for (int k = 0; k < equation.Length; k++)
        {
            if (equation[k] < 0) { result[k] = -1; continue; }
            int root = Find(equation[k]);
            if (renumber[root] < 0) { renumber[root] = newDofOf.Count; newDofOf.Add(k); }
            result[k] = renumber[root];
        }
        return new DofMap(result, state, newDofOf.ToArray());
    }
}
