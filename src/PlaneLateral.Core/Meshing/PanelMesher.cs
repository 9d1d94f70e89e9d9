using PlaneLateral.Elements.Plane;
using PlaneLateral.Model;

namespace PlaneLateral.Meshing;

/// <summary>The meshed panel: the mesh, its base and level nodes, and the facts of how it was made.</summary>
public sealed class PanelMesh
{
    public required PlaneMesh Mesh { get; init; }

    /// <summary>Nodes on the base (held in x and y).</summary>
    public required int[] BaseNodes { get; init; }

    /// <summary>Levels (m above the base, ascending, the top last) and the nodes on each.</summary>
    public required double[] Levels { get; init; }
    public required int[][] LevelNodes { get; init; }

    /// <summary>Element edges along each level (element, edge), for spread loads.</summary>
    public required List<(int Element, int Edge)>[] LevelEdges { get; init; }

    /// <summary>Element size used (m): the target, or less to keep the aspect limit.</summary>
    public required double ElementSize { get; init; }

    /// <summary>Narrowest solid strip of the panel (m): pier, or wall beside, above or below an opening.</summary>
    public required double NarrowestStrip { get; init; }

    /// <summary>Largest element side ratio in the mesh.</summary>
    public required double LargestAspect { get; init; }
}

/// <summary>
/// Structured quadrilateral meshing of a rectangular wall panel with rectangular openings: grid lines at the wall's
/// ends, every opening edge and every floor level, each interval divided evenly into the fewest parts no longer than
/// the element size; cells inside an opening are left out. The mesh conforms to every opening edge and floor level, its
/// aspect ratio is bounded, and its numbering (row by row from the base, then left to right) depends only on the input.
/// Local coordinates: x from the panel's left end, y up from its base; nodes are placed at (X0 + x, Y0 + y).
/// </summary>
public static class PanelMesher
{
    /// <summary>Every problem that stops the panel from being meshed (empty when it can be).</summary>
    public static List<PanelProblem> Check(WallPanel p) => PanelLayout.Check(p);

    /// <summary>
    /// Meshes the panel; <paramref name="refinement"/> k splits every element of the base mesh into 2ᵏ × 2ᵏ (the nested
    /// meshes h, h/2, h/4, ... of a convergence study).
    /// </summary>
    /// <exception cref="ArgumentException">The panel cannot be meshed; the message lists every problem of <see cref="Check"/>.</exception>
    public static PanelMesh Mesh(WallPanel p, int refinement = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(refinement);
        var plan = PanelLayout.Plan(p);
        if (plan.Problems.Count > 0)
            throw new ArgumentException($"wall panel \"{p.Id}\" cannot be meshed: " + string.Join("; ", plan.Problems.Select(q => $"{q.Key}: {q.Problem} ({q.Fix})")));
        IPlaneElement element = p.Mesh.Element == PanelElementKind.Quad4 ? IncompatibleQuad4.Instance : LagrangeQuad9.Instance;
        var xs = Split(plan.XLines!, 1 << refinement);
        var ys = Split(plan.YLines!, 1 << refinement);
        bool Solid(int i, int j)
        {
            double cx = 0.5 * (xs[i] + xs[i + 1]), cy = 0.5 * (ys[j] + ys[j + 1]);
            return !p.Openings.Any(o => cx > o.Left && cx < o.Left + o.Width && cy > o.Bottom && cy < o.Bottom + o.Height);
        }
        var local = StructuredMesh.Grid(element, xs, ys, Solid);
        var mesh = new PlaneMesh { Element = element, X = local.X.Select(x => p.X0 + x).ToArray(), Y = local.Y.Select(y => p.Y0 + y).ToArray(), Elements = local.Elements };
        double tol = 1e-9 * Math.Max(p.Length, p.Height);
        var levels = p.Levels.ToArray();
        double aspect = 1;
        foreach (var c in local.Elements)
        {
            double dx = local.X[c[1]] - local.X[c[0]], dy = local.Y[c[3]] - local.Y[c[0]];
            aspect = Math.Max(aspect, Math.Max(dx / dy, dy / dx));
        }
        return new PanelMesh
        {
            Mesh = mesh,
            BaseNodes = Enumerable.Range(0, local.NodeCount).Where(i => Math.Abs(local.Y[i]) <= tol).ToArray(),
            Levels = levels,
            LevelNodes = levels.Select(l => Enumerable.Range(0, local.NodeCount).Where(i => Math.Abs(local.Y[i] - l) <= tol).ToArray()).ToArray(),
            LevelEdges = levels.Select(l => LevelEdgesAt(local, l, tol)).ToArray(),
            ElementSize = plan.Size / (1 << refinement),
            NarrowestStrip = plan.Narrowest,
            LargestAspect = aspect,
        };
    }

    /// <summary>
    /// Element edges along the line y = level, each once: the top edges of the elements below it, then the bottom edges
    /// of the elements above it where no element lies below (e.g. over a door).
    /// </summary>
    private static List<(int Element, int Edge)> LevelEdgesAt(PlaneMesh local, double level, double tol)
    {
        var list = new List<(int, int)>();
        var seen = new HashSet<(int, int)>();
        foreach (int edge in new[] { 2, 0 })
            for (int e = 0; e < local.Elements.Length; e++)
            {
                var c = local.Elements[e];
                var n = local.Element.EdgeNodes(edge);
                int a = c[n[0]], b = c[n[^1]];
                if (Math.Abs(local.Y[a] - level) > tol || Math.Abs(local.Y[b] - level) > tol) continue;
                if (seen.Add((Math.Min(a, b), Math.Max(a, b)))) list.Add((e, edge));
            }
        return list;
    }

    /// <summary>Number of nodes the panel's mesh will have (before meshing), or −1 when it cannot be meshed.</summary>
    public static int PlannedNodes(WallPanel p) => PanelLayout.Plan(p) is { Problems.Count: 0 } plan ? plan.Nodes : -1;

    private static double[] Split(double[] lines, int parts)
    {
        if (parts == 1) return lines;
        var list = new List<double> { lines[0] };
        for (int i = 0; i + 1 < lines.Length; i++)
        {
            for (int k = 1; k < parts; k++) list.Add(lines[i] + (lines[i + 1] - lines[i]) * k / parts);
            list.Add(lines[i + 1]);
        }
        return list.ToArray();
    }

}
