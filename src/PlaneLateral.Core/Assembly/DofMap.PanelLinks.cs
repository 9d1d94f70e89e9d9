using PlaneLateral.Model;

namespace PlaneLateral.Assembly;

// Frame nodes tied to wall panels (docs/panels.md, "Panels in a frame"): the panel stiffens their rotation.
public sealed partial class DofMap
{
    /// <summary>
    /// A copy of this map in which the rotation of each given node is an unknown even where no member stiffens it (it
    /// was held as unattached): a rigid link to a panel edge stiffens it. Equations shared before (diaphragms, ties)
    /// stay shared; all are renumbered in (node, dof) order, so the map stays deterministic.
    /// </summary>
    public DofMap WithAttachedRotations(IEnumerable<int> nodes)
    {
        var state = (DofState[])_state.Clone();
        bool changed = false;
        foreach (int n in nodes)
            if (state[3 * n + (int)Dof.RZ] == DofState.Unattached) { state[3 * n + (int)Dof.RZ] = DofState.Free; changed = true; }
        if (!changed) return this;
        var equation = new int[state.Length];
        var renumbered = new Dictionary<int, int>();
        var dofOf = new List<int>(state.Length);
        for (int k = 0; k < state.Length; k++)
        {
            if (state[k] != DofState.Free) { equation[k] = -1; continue; }
            int old = _equation[k];
            if (old >= 0 && renumbered.TryGetValue(old, out int shared)) { equation[k] = shared; continue; }
            equation[k] = dofOf.Count;
            if (old >= 0) renumbered[old] = dofOf.Count;
            dofOf.Add(k);
        }
        return new DofMap(equation, state, dofOf.ToArray());
    }
}
