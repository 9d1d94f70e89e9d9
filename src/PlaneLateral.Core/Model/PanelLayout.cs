using System.Globalization;
using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>A problem with a wall panel found before meshing: what is wrong, how to fix it, and the JSON key it concerns.</summary>
/// <param name="Key">The panel key at fault ("openings[1]", "floorLevels", "mesh", ...), for locating it in the file.</param>
public sealed record PanelProblem(string Key, string Problem, string Fix);

/// <summary>
/// The layout of a wall panel's structured mesh, worked out from the panel alone (no elements): every problem that stops
/// it from being meshed, and the grid lines at the wall's ends, every opening edge and every floor level, each interval
/// divided evenly into the fewest parts no longer than the element size (reduced where grid lines are close, so that no
/// element side ratio exceeds maxAspect). Kept in Model so that the reader can report these problems before any work;
/// the mesher (Meshing/PanelMesher.cs) builds the elements on it.
/// </summary>
public static class PanelLayout
{
    /// <summary>Every problem that stops the panel from being meshed (empty when it can be).</summary>
    /// <param name="units">The model's units: every length in a message is given in them, with the unit named (metres when null).</param>
    public static List<PanelProblem> Check(WallPanel p, UnitSystem? units = null) => Plan(p, units).Problems;

    public sealed class GridPlan
    {
        /// <summary>Every problem found; when any, the rest is unset.</summary>
        public List<PanelProblem> Problems { get; } = [];
        /// <summary>Element boundary lines (m, panel-local, ascending) of the base mesh.</summary>
        public double[]? XLines, YLines;
        /// <summary>Element size (m) and narrowest solid strip (m).</summary>
        public double Size, Narrowest;
        /// <summary>Nodes of the finest mesh the settings ask for.</summary>
        public int Nodes;
    }

    /// <summary>Checks the panel and, when it can be meshed, lays out the grid lines of its base mesh.</summary>
    /// <param name="units">The model's units for the lengths in the problems' texts (metres when null); the plan itself is SI.</param>
    public static GridPlan Plan(WallPanel p, UnitSystem? units = null)
    {
        var plan = new GridPlan();
        var bad = plan.Problems;
        double L = p.Length, H = p.Height, tol = 1e-9 * Math.Max(L, H);
        var u = units ?? UnitSystem.KilonewtonMetre;
        string F(double v) => u.FromSI(v, Quantity.Length).ToString("0.###", CultureInfo.InvariantCulture) + " " + u.LengthSymbol;
        string G(double v) => u.FromSI(v, Quantity.Length).ToString("G9", CultureInfo.InvariantCulture) + " " + u.LengthSymbol;

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
        if (p.Top == PanelTop.Guided && !p.FloorTies)
            bad.Add(new("top", "a guided top is a rigid floor that translates without rotating, but the panel has \"floorTies\": false",
                "remove \"floorTies\": false, or write \"top\": \"free\""));
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
        else if (m.MaxAspect > MaxAspectLimit)
            bad.Add(new("mesh.maxAspect", $"the largest aspect ratio {m.MaxAspect} is above {MaxAspectLimit}: elements that long and thin lose their stiffness to round-off (a false mechanism)",
                $"give \"maxAspect\" from 1 to {MaxAspectLimit} (4 is usual)"));
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
        double shortest = Math.Min(Gaps(xs).Min(), Gaps(ys).Min()), sizeAsked = size;
        size = Math.Min(size, m.MaxAspect * shortest);
        if (m.Refinements is < 1 or > 6)
        {
            bad.Add(new("mesh", $"{m.Refinements} meshes asked for the convergence study", "give \"refinements\" from 1 (no study) to 6; 3 or more give an observed order"));
            return plan;
        }
        // The finest mesh of a convergence study decides the size limit, checked before any work — counted from the
        // intervals, before the lines are laid out (a hair-thin interval once asked for millions of them).
        int r = (m.Element == PanelElementKind.Quad9 ? 2 : 1) << (m.Refinements - 1);
        long Nodes(double h)
        {
            double about = (r * Parts(xs, h) + 1) * (r * Parts(ys, h) + 1);
            return about < long.MaxValue / 2 ? (long)about : long.MaxValue / 2;
        }
        long nodes = Nodes(size);
        if (nodes > m.MaxNodes && Nodes(sizeAsked) <= m.MaxNodes)
        {
            // Only the cut in size for two grid lines close together (e.g. a floor level a hair above a door head) makes
            // the mesh too large: name them.
            var (gap, axis, first, second) = ClosestLines(p, tol);
            bad.Add(new(second.Key != "" ? second.Key : first.Key,
                $"{second.What} ({axis} = {G(second.V)}) and {first.What} ({axis} = {G(first.V)}) are only {G(gap)} apart, so elements no longer than {G(size)} (maxAspect × {G(gap)}) are needed and the {(m.Refinements > 1 ? "finest mesh" : "mesh")} would have about {nodes} nodes, more than the limit of {m.MaxNodes}",
                $"give them the same value if they are meant to line up (values within {G(tol)} are one line), or move them further apart"));
            return plan;
        }
        if (nodes > m.MaxNodes)
        {
            string finest = m.Refinements > 1 ? $"the finest of the {m.Refinements} meshes" : "the mesh";
            bad.Add(new("mesh", $"{finest} would have about {nodes} nodes, more than the limit of {m.MaxNodes}",
                m.Refinements > 1 ? "ask for fewer \"refinements\", a coarser base mesh, or a higher \"maxNodes\""
                    : $"give a larger element size (at least {F(size * Math.Sqrt((double)nodes / m.MaxNodes))}), fewer elements across the narrowest strip, or a higher \"maxNodes\""));
            return plan;
        }
        var xl = Subdivide(xs, size);
        var yl = Subdivide(ys, size);
        // Nodes are placed at (x + local x, y + local y). Far from the origin the spacing of doubles (about 2.2e-16 of the
        // coordinate) eats into the finest element's sides, down to zero (a non-positive Jacobian): found by the fuzzer
        // with "x": 1e15. Keep every side at least 1/PlacementDigits of the farthest coordinate, so that each side keeps
        // its length to about 2e-9 relative after placing.
        double finestSide = Math.Min(Gaps(xl).Min(), Gaps(yl).Min()) / r;
        double reach = Math.Max(Math.Max(Math.Abs(p.X0), Math.Abs(p.X0 + L)), Math.Max(Math.Abs(p.Y0), Math.Abs(p.Y0 + H)));
        if (!(finestSide * PlacementDigits >= reach))
        {
            string key = Math.Abs(p.X0) >= Math.Abs(p.Y0) ? "x" : "y";
            double at = key == "x" ? p.X0 : p.Y0;
            bad.Add(new(key, $"the panel is placed at {key} = {G(at)}, so far from the origin that the sides of its finest elements ({G(finestSide)}) are lost to round-off in the node coordinates",
                $"place the panel nearer the origin (its position only places its nodes), within {G(finestSide * PlacementDigits)} of it, or use a coarser mesh"));
            return plan;
        }
        plan.XLines = xl; plan.YLines = yl; plan.Size = size; plan.Narrowest = narrowest; plan.Nodes = (int)nodes;
        return plan;
    }

    /// <summary>Largest "maxAspect" accepted. Common practice: beyond about 10 accuracy suffers; 100 still keeps the
    /// element stiffness well clear of round-off.</summary>
    public const double MaxAspectLimit = 100;

    /// <summary>The farthest node coordinate accepted, in finest element sides (1e7; see the check in <see cref="Plan"/>).</summary>
    public const double PlacementDigits = 1e7;

    /// <summary>
    /// The two neighbouring grid lines closest together, on either axis, each with what puts it there and its panel key:
    /// the pair behind the shortest gap of the lines <see cref="Distinct"/> keeps (same clustering within tol).
    /// </summary>
    private static (double Gap, string Axis, (double V, string What, string Key) First, (double V, string What, string Key) Second) ClosestLines(WallPanel p, double tol)
    {
        var xSources = new List<(double V, string What, string Key)> { (0, "the left end", ""), (p.Length, "the right end", "length") };
        var ySources = new List<(double V, string What, string Key)> { (0, "the base", ""), (p.Height, "the top", "height") };
        for (int k = 0; k < p.FloorLevels.Count; k++) ySources.Add((p.FloorLevels[k], $"floor level {k + 1}", $"floorLevels[{k}]"));
        for (int k = 0; k < p.Openings.Count; k++)
        {
            var o = p.Openings[k];
            xSources.Add((o.Left, $"the left edge of opening \"{o.Id}\"", $"openings[{k}]"));
            xSources.Add((o.Left + o.Width, $"the right edge of opening \"{o.Id}\"", $"openings[{k}]"));
            ySources.Add((o.Bottom, $"the bottom of opening \"{o.Id}\"", $"openings[{k}]"));
            ySources.Add((o.Bottom + o.Height, $"the top of opening \"{o.Id}\"", $"openings[{k}]"));
        }
        var best = (Gap: double.PositiveInfinity, Axis: "x", First: xSources[0], Second: xSources[1]);
        foreach (var (axis, sources) in new[] { ("x", xSources), ("y", ySources) })
        {
            var sorted = sources.OrderBy(q => q.V).ToList();
            var line = sorted[0];
            foreach (var q in sorted.Skip(1))
            {
                double gap = q.V - line.V;
                if (gap <= tol) continue;   // the same line
                if (gap < best.Gap) best = (gap, axis, line, q);
                line = q;
            }
        }
        return best;
    }

    private static double[] Distinct(IEnumerable<double> values, double tol)
    {
        var list = new List<double>();
        foreach (var v in values.OrderBy(v => v))
            if (list.Count == 0 || v - list[^1] > tol) list.Add(v);
        return list.ToArray();
    }

    private static IEnumerable<double> Gaps(double[] lines) => lines.Zip(lines.Skip(1), (a, b) => b - a);

    /// <summary>Intervals <see cref="Subdivide"/> would make (as a double: it may be astronomically many).</summary>
    private static double Parts(double[] lines, double size)
    {
        double n = 0;
        for (int i = 0; i + 1 < lines.Length; i++) n += Math.Max(1, Math.Ceiling((lines[i + 1] - lines[i]) / size - 1e-9));
        return n;
    }

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
