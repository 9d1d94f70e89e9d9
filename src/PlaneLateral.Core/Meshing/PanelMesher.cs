using PlaneLateral.Elements.Plane;
using PlaneLateral.Model;

namespace PlaneLateral.Meshing;

/// <summary>A problem with a wall panel found before meshing: what is wrong, how to fix it, and the JSON key it concerns.</summary>
/// <param name="Key">The panel key at fault ("openings[1]", "floorLevels", "mesh", ...), for locating it in the file.</param>
public sealed record PanelProblem(string Key, string Problem, string Fix);

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
    public static List<PanelProblem> Check(WallPanel p) => Plan(p).Problems;

    /// <summary>
    /// Meshes the panel; <paramref name="refinement"/> k splits every element of the base mesh into 2ᵏ × 2ᵏ (the nested
    /// meshes h, h/2, h/4, ... of a convergence study).
    /// </summary>
    /// <exception cref="ArgumentException">The panel cannot be meshed; the message lists every problem of <see cref="Check"/>.</exception>
    public static PanelMesh Mesh(WallPanel p, int refinement = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(refinement);
        var plan = Plan(p);
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
    public static int PlannedNodes(WallPanel p) => Plan(p) is { Problems.Count: 0 } plan ? plan.Nodes : -1;

    private sealed class MeshPlan
    {
        public List<PanelProblem> Problems { get; } = [];
        public double[]? XLines, YLines;
        public double Size, Narrowest;
        public int Nodes;
    }

    private static MeshPlan Plan(WallPanel p)
    {
        var plan = new MeshPlan();
        var bad = plan.Problems;
        double L = p.Length, H = p.Height, tol = 1e-9 * Math.Max(L, H);
        string F(double v) => v.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture) + " m";

        for (int k = 0; k < p.Openings.Count; k++)
        {
            var o = p.Openings[k];
            string key = $"openings[{k}]";
            if (!(o.Width > 0 && o.Height > 0)) { bad.Add(new(key, $"opening \"{o.Id}\" has width {F(o.Width)} and height {F(o.Height)}", "give both greater than zero")); continue; }
            if (o.Left <= tol || o.Left + o.Width >= L - tol)
                bad.Add(new(key, $"opening \"{o.Id}\" spans x = {F(o.Left)} to {F(o.Left + o.Width)} and reaches or passes the ends of the {F(L)} long wall",
                    "keep a solid pier at each end (0 < left and left + width < length), or model the parts as separate panels"));
            if (o.Bottom < -tol || o.Bottom + o.Height >= H - tol)
                bad.Add(new(key, $"opening \"{o.Id}\" spans y = {F(o.Bottom)} to {F(o.Bottom + o.Height)}, outside the wall's height {F(H)} or up to its top",
                    "keep 0 ≤ bottom and bottom + height < height: a solid strip must remain above every opening"));
        }
        for (int a = 0; a < p.Openings.Count; a++)
            for (int b = a + 1; b < p.Openings.Count; b++)
            {
                var A = p.Openings[a]; var B = p.Openings[b];
                bool apart = A.Left + A.Width < B.Left - tol || B.Left + B.Width < A.Left - tol || A.Bottom + A.Height < B.Bottom - tol || B.Bottom + B.Height < A.Bottom - tol;
                if (!apart)
                    bad.Add(new($"openings[{b}]", $"openings \"{A.Id}\" and \"{B.Id}\" overlap or touch", "move them apart so solid wall remains between them, or give them as one opening"));
            }
        var levels = p.FloorLevels;
        for (int k = 0; k < levels.Count; k++)
        {
            double l = levels[k];
            if (!(l > tol && l < H - tol)) bad.Add(new($"floorLevels[{k}]", $"floor level {F(l)} is not between the base and the top ({F(H)})", "give floor levels above 0 and below the height (the top is always a level)"));
            else if (k > 0 && !(l > levels[k - 1] + tol)) bad.Add(new($"floorLevels[{k}]", $"floor level {F(l)} is not above the previous one ({F(levels[k - 1])})", "list floor levels once each, bottom to top"));
            foreach (var o in p.Openings)
                if (l > o.Bottom + tol && l < o.Bottom + o.Height - tol)
                    bad.Add(new($"floorLevels[{k}]", $"floor level {F(l)} passes through opening \"{o.Id}\" (y = {F(o.Bottom)} to {F(o.Bottom + o.Height)})", "a floor meets the wall in solid wall: move the level or the opening"));
        }
        var m = p.Mesh;
        if (!((m.ElementSize > 0) ^ (m.ElementsAcrossNarrowest > 0)))
            bad.Add(new("mesh", "give either an element size or a number of elements across the narrowest strip", "write \"elementSize\": <length> or \"elementsAcrossNarrowest\": <count>, not both"));
        if (!(m.MaxAspect >= 1)) bad.Add(new("mesh", $"the largest aspect ratio {m.MaxAspect} is below 1", "give \"maxAspect\" ≥ 1 (4 is usual)"));
        if (bad.Count > 0) return plan;

        var xs = Distinct([0, L, .. p.Openings.SelectMany(o => new[] { o.Left, o.Left + o.Width })], tol);
        var ys = Distinct([0, H, .. levels, .. p.Openings.SelectMany(o => new[] { o.Bottom, o.Bottom + o.Height })], tol);

        // Solid strips: along x in every horizontal band (piers), along y in every vertical band (wall above/below openings).
        double narrowest = double.PositiveInfinity;
        string narrowestWhat = "";
        for (int j = 0; j + 1 < ys.Length; j++)
        {
            double cy = 0.5 * (ys[j] + ys[j + 1]);
            var cuts = p.Openings.Where(o => cy > o.Bottom && cy < o.Bottom + o.Height).OrderBy(o => o.Left).ToList();
            double start = 0;
            foreach (var o in cuts.Append(new PanelOpening("", L, 0, 0, 0)))
            {
                double w = o.Left - start;
                if (w > tol && w < narrowest) { narrowest = w; narrowestWhat = $"the pier from x = {F(start)} to {F(o.Left)}"; }
                start = o.Left + o.Width;
            }
        }
        for (int i = 0; i + 1 < xs.Length; i++)
        {
            double cx = 0.5 * (xs[i] + xs[i + 1]);
            var cuts = p.Openings.Where(o => cx > o.Left && cx < o.Left + o.Width).OrderBy(o => o.Bottom).ToList();
            double start = 0;
            foreach (var o in cuts.Append(new PanelOpening("", 0, H, 0, 0)))
            {
                double w = o.Bottom - start;
                if (w > tol && w < narrowest) { narrowest = w; narrowestWhat = $"the wall from y = {F(start)} to {F(o.Bottom)} at x = {F(xs[i])} to {F(xs[i + 1])}"; }
                start = o.Bottom + o.Height;
            }
        }
        double size = m.ElementSize > 0 ? m.ElementSize : narrowest / m.ElementsAcrossNarrowest;
        if (narrowest < size * (1 - 1e-9))
        {
            bad.Add(new("mesh", $"{narrowestWhat} is {F(narrowest)} wide, narrower than one element ({F(size)})",
                $"give \"elementSize\" ≤ {F(narrowest)}, or \"elementsAcrossNarrowest\" instead"));
            return plan;
        }
        // Grid intervals shorter than the element size (e.g. two opening edges close together) would make slivers:
        // reduce the size so that no element side ratio exceeds maxAspect.
        double shortest = Math.Min(Gaps(xs).Min(), Gaps(ys).Min());
        size = Math.Min(size, m.MaxAspect * shortest);
        var xl = Subdivide(xs, size);
        var yl = Subdivide(ys, size);
        if (m.Refinements is < 1 or > 6)
        {
            bad.Add(new("mesh", $"{m.Refinements} meshes asked for the convergence study", "give \"refinements\" from 1 (no study) to 6; 3 or more give an observed order"));
            return plan;
        }
        // The finest mesh of a convergence study decides the size limit, checked before any work.
        int r = (m.Element == PanelElementKind.Quad9 ? 2 : 1) << (m.Refinements - 1);
        long nodes = (long)(r * (xl.Length - 1) + 1) * (r * (yl.Length - 1) + 1);
        if (nodes > m.MaxNodes)
        {
            string finest = m.Refinements > 1 ? $"the finest of the {m.Refinements} meshes" : "the mesh";
            bad.Add(new("mesh", $"{finest} would have about {nodes} nodes, more than the limit of {m.MaxNodes}",
                m.Refinements > 1 ? "ask for fewer \"refinements\", a coarser base mesh, or a higher \"maxNodes\""
                    : $"give a larger element size (at least {F(size * Math.Sqrt((double)nodes / m.MaxNodes))}), fewer elements across the narrowest strip, or a higher \"maxNodes\""));
            return plan;
        }
        plan.XLines = xl; plan.YLines = yl; plan.Size = size; plan.Narrowest = narrowest; plan.Nodes = (int)nodes;
        return plan;
    }

    private static double[] Distinct(IEnumerable<double> values, double tol)
    {
        var list = new List<double>();
        foreach (var v in values.OrderBy(v => v))
            if (list.Count == 0 || v - list[^1] > tol) list.Add(v);
        return list.ToArray();
    }

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

    private static IEnumerable<double> Gaps(double[] lines) => lines.Zip(lines.Skip(1), (a, b) => b - a);

    private static double[] Subdivide(double[] lines, double size)
    {
        var list = new List<double> { lines[0] };
        for (int i = 0; i + 1 < lines.Length; i++)
        {
            double a = lines[i], b = lines[i + 1];
            int n = Math.Max(1, (int)Math.Ceiling((b - a) / size - 1e-9));
            for (int k = 1; k < n; k++) list.Add(a + (b - a) * k / n);
            list.Add(b);
        }
        return list.ToArray();
    }
}
