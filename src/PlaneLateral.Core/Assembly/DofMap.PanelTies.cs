using PlaneLateral.Model;

namespace PlaneLateral.Assembly;

// Floor ties of wall panels (plane-stress meshes): kept in this file so that other constraint work on the DOF map
// (e.g. building diaphragms) can live beside it without touching it.
public sealed partial class DofMap
{
    /// <summary>
    /// A copy of this map in which each group of DOFs shares one equation: an exact constraint u_a = u_b = ... by
    /// equation sharing (no penalty), as used for the floor tie of a wall panel (every node at a floor level moves with
    /// the same horizontal displacement). The shared equation is reported as the group's lowest (node, dof); a force
    /// on it is the resultant on the whole group. Equations are renumbered in (node, dof) order, so the map stays
    /// deterministic.
    /// </summary>
    /// <exception cref="ArgumentException">A group has a DOF that is not an unknown, or a DOF is in two groups.</exception>
    public DofMap WithPanelTies(IReadOnlyList<IReadOnlyList<(int Node, Dof Dof)>> groups)
    {
        int total = _equation.Length;
        var leader = new int[total];
        for (int k = 0; k < total; k++) leader[k] = k;
        var grouped = new bool[total];
        foreach (var g in groups)
        {
            if (g.Count == 0) continue;
            int lead = int.MaxValue;
            foreach (var (node, dof) in g)
            {
                int k = 3 * node + (int)dof;
                if (_state[k] != DofState.Free) throw new ArgumentException($"a tied DOF (node {node}, {DofNames.Name(dof)}) is not an unknown");
                if (grouped[k]) throw new ArgumentException($"DOF (node {node}, {DofNames.Name(dof)}) is in two ties");
                grouped[k] = true;
                lead = Math.Min(lead, k);
            }
            foreach (var (node, dof) in g) leader[3 * node + (int)dof] = lead;
        }

        var equation = new int[total];
        var dofOf = new List<int>(total);
        for (int k = 0; k < total; k++)
        {
            if (_state[k] != DofState.Free) { equation[k] = -1; continue; }
            if (leader[k] == k) { equation[k] = dofOf.Count; dofOf.Add(k); }
            else equation[k] = equation[leader[k]];   // the leader is the lowest k of its group, so already numbered
        }
        return new DofMap(equation, (DofState[])_state.Clone(), dofOf.ToArray());
    }
}
