using PlaneLateral.Assembly;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>A nodal DOF named for people: node id and "ux", "uy" or "rz".</summary>
public readonly record struct NamedDof(string Node, Dof Dof)
{
    public override string ToString() => $"{Node} {DofNames.Name(Dof)}";
}

/// <summary>One way the structure can move without resistance.</summary>
/// <param name="FoundAt">The DOF whose pivot vanished when the factorisation reached it.</param>
/// <param name="Moving">The DOFs that move in that mechanism (largest first), FoundAt among them.</param>
public sealed record Mechanism(NamedDof FoundAt, IReadOnlyList<NamedDof> Moving);

/// <summary>The stiffness matrix is singular: the model is a mechanism. Names the free nodes and DOFs.</summary>
public sealed class UnstableModelException(string file, IReadOnlyList<Mechanism> mechanisms)
    : Exception(Describe(file, mechanisms))
{
    public string File { get; } = file;

    /// <summary>
    /// The mechanisms a factorisation found: for each failed pivot, the DOF where it was met and every DOF that moves in
    /// its shape (|z| above 1e-6 of the largest), largest first; <paramref name="nodeName"/> names a node index.
    /// </summary>
    public static UnstableModelException FromFactor(string file, DofMap dofs, Func<int, string> nodeName, ISparseSpdFactor factor)
    {
        NamedDof Name(int eq) { var (node, dof) = dofs.DofOf(eq); return new NamedDof(nodeName(node), dof); }
        var list = new List<Mechanism>();
        for (int i = 0; i < factor.PivotFailures.Count; i++)
        {
            var z = factor.MechanismShape(i);
            var moving = Enumerable.Range(0, z.Length).Where(j => Math.Abs(z[j]) > 1e-6)
                .OrderByDescending(j => Math.Abs(z[j])).ThenBy(j => j).Select(Name).ToList();
            list.Add(new Mechanism(Name(factor.PivotFailures[i].Dof), moving));
        }
        return new UnstableModelException(file, list);
    }
    public IReadOnlyList<Mechanism> Mechanisms { get; } = mechanisms;

    private static string Describe(string file, IReadOnlyList<Mechanism> ms)
    {
        var lines = new List<string>
        {
            $"{file}: the model is unstable: it can move without resistance ({ms.Count} independent mechanism{(ms.Count == 1 ? "" : "s")}).",
        };
        for (int i = 0; i < ms.Count && i < 10; i++)
        {
            var m = ms[i];
            var moving = string.Join(", ", m.Moving.Take(12).Select(d => d.ToString()));
            if (m.Moving.Count > 12) moving += $", and {m.Moving.Count - 12} more";
            lines.Add($"  mechanism {i + 1}: free at {m.FoundAt}; moving with it: {moving}");
        }
        if (ms.Count > 10) lines.Add($"  ... and {ms.Count - 10} more mechanisms");
        lines.Add("  Fix: add a support or a member that resists this motion, or remove a moment release or brace-only connection that leaves a joint free to turn or slide.");
        return string.Join(Environment.NewLine, lines);
    }
}
