using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>Displacement of a level in one case: the mean ux of the level's nodes (all equal under a rigid diaphragm), m.</summary>
/// <param name="Spread">Largest minus smallest ux of the level's nodes (m); zero to round-off under a rigid diaphragm.</param>
public sealed record LevelDisplacement(Level Level, double Ux, double Spread);

/// <summary>
/// One story's results in one case. Story <see cref="Index"/> runs from level <see cref="Bottom"/> to level <see cref="Top"/>.
/// SI: m, N, N/m.
/// </summary>
/// <param name="TopDisplacement">Displacement of the top level (m).</param>
/// <param name="Drift">Interstory drift: top level displacement minus bottom level displacement (m).</param>
/// <param name="DriftRatio">Drift / story height.</param>
/// <param name="CutElevation">Height of the horizontal cut where the story shear is taken (m).</param>
/// <param name="Shear">Story shear (N): the horizontal force the members crossing the cut carry, positive in +x; by statics the
/// sum of the horizontal loads above the cut.</param>
/// <param name="Stiffness">Shear / drift (N/m); NaN when the story carries no shear beyond round-off or does not drift.</param>
public sealed record StoryResult(int Index, Level Bottom, Level Top, double Height, double TopDisplacement, double Drift, double DriftRatio,
    double CutElevation, double Shear, double Stiffness, IReadOnlyList<LineStoryResult> Lines);

/// <summary>
/// The part of a story's shear one line of resistance carries: the sum, over its members crossing the cut, of the
/// horizontal force each carries across it.
/// </summary>
/// <param name="Line">Line name; "" for members without a line.</param>
/// <param name="Shear">Shear carried by the line (N).</param>
/// <param name="Share">Shear / story shear (NaN when the story shear is nil).</param>
/// <param name="Drift">Drift of the line's own nodes at the two levels (m; equal to the story drift under rigid diaphragms).</param>
/// <param name="Stiffness">The line's story stiffness in the whole structure: its shear / its drift (N/m; NaN when not defined).
/// Under interaction (a wall beside a frame) it can be small or negative in upper stories: it is not the stiffness of the line alone.</param>
public sealed record LineStoryResult(string Line, double Shear, double Share, double Drift, double Stiffness);

/// <summary>Story results of one load case or combination.</summary>
/// <param name="Lateral">The case carries story shear beyond round-off (gravity-only cases do not).</param>
public sealed record CaseStories(string CaseId, bool IsCombination, bool Lateral, IReadOnlyList<LevelDisplacement> Levels, IReadOnlyList<StoryResult> Stories);

/// <summary>
/// Story results from a solved model with levels: level displacements, interstory drifts, story shears from member end
/// forces, story stiffness and the share of each line of resistance.
/// <para>
/// Story shear, derived by statics: cut the structure horizontally at height y_c inside the story. For a member crossing
/// the cut, take the piece from the cut to its upper flexible face. The force on that face is the member end force
/// (local N, V at that end, acting on the flexible segment) turned into global x: F = N·cos α − V·sin α, α the member's
/// angle. The piece also carries its share of the member's distributed load, p_x(s) = q_x(s)·cos α − q_y(s)·sin α
/// (local components), integrated from the cut to that face along the axis (a signed integral when the cut lies in a
/// rigid zone). Their sum is the horizontal force the member carries across the cut; over all members crossing it, the
/// sum equals the horizontal load above the cut (equilibrium of the part above).
/// </para>
/// <para>
/// Wall panels linked to the frame are part of the structure: each adds the horizontal force it carries across the
/// cut, from its base reactions, link forces and own loads below the cut (<see cref="StoryPanels"/>), to the story shear
/// and to its line's shear; their loads count in the round-off scale.
/// </para>
/// </summary>
public static class StoryAnalysis
{
    /// <summary>A shear at or below this fraction of the case's total load magnitude is round-off.</summary>
    public const double RoundOff = 1e-9;

    /// <summary>Story results of every case and combination, in the order of <see cref="AnalysisResult.Cases"/>; empty when the model has fewer than two levels.</summary>
    public static IReadOnlyList<CaseStories> All(AnalysisResult r) => r.Cases.Select(c => ForCase(r, c)).ToList();

    /// <summary>Story results of one case or combination.</summary>
    public static CaseStories ForCase(AnalysisResult r, CaseResult c)
    {
        var model = r.Model;
        var b = model.Building;
        var levels = b.Levels.Select(l => LevelUx(c, l)).ToList();
        var stories = new List<StoryResult>();
        if (b.Levels.Count < 2) return new CaseStories(c.Id, c.IsCombination, false, levels, stories);

        var elements = model.Members.Select(m => new FrameElement(m, model.Nodes[m.Start], model.Nodes[m.End])).ToArray();
        var loads = MemberLoadsOf(model, c);
        double scale = LoadMagnitude(model, elements, c, loads);
        var lineNames = b.MemberLines.Count == model.Members.Count ? b.MemberLines : model.Members.Select(_ => "").ToList();
        var order = StoryPanels.Lines(model).Concat([""]).ToList();
        // Wall panels linked to the frame are part of the structure (StoryPanels): their horizontal actions, per panel.
        int ci = StoryPanels.IndexOf(r, c);
        var panels = Enumerable.Range(0, model.Panels.Count).Where(p => model.Panels[p].Links.Count > 0 && p < r.Panels.Count)
            .Select(p => (Panel: model.Panels[p], Line: StoryPanels.LineOf(model.Panels[p]), Actions: StoryPanels.HorizontalActions(r, p, ci))).ToList();
        scale += panels.Sum(p => StoryPanels.OwnLoads(model, p.Panel, c).Sum(l => Math.Abs(l.Factor) * (Math.Abs(l.Load.Fx) + Math.Abs(l.Load.Fy))));

        for (int i = 0; i + 1 < b.Levels.Count; i++)
        {
            Level lo = b.Levels[i], hi = b.Levels[i + 1];
            double h = hi.Elevation - lo.Elevation;
            double yc = CutElevation(model, lo.Elevation, hi.Elevation);
            var byLine = new Dictionary<string, double>(StringComparer.Ordinal);
            var crossing = new Dictionary<string, HashSet<int>>(StringComparer.Ordinal);   // line → its member end nodes
            double v = 0;
            for (int m = 0; m < elements.Length; m++)
            {
                if (!Crosses(model, model.Members[m], yc)) continue;
                double f = ShearAcrossCut(model, elements[m], c.MemberForces[m], loads[m], yc);
                v += f;
                string line = lineNames[m];
                byLine[line] = byLine.GetValueOrDefault(line) + f;
                if (!crossing.TryGetValue(line, out var set)) crossing[line] = set = [];
                set.Add(model.Members[m].Start); set.Add(model.Members[m].End);
            }
            foreach (var (panel, line, actions) in panels)
            {
                if (!(panel.Y0 < yc && yc < panel.Y0 + panel.Height)) continue;   // the cut does not pass through the panel
                double f = StoryPanels.ShearAcrossCut(actions, yc);
                v += f;
                byLine[line] = byLine.GetValueOrDefault(line) + f;
                if (!crossing.TryGetValue(line, out var set)) crossing[line] = set = [];
                foreach (var link in panel.Links) set.Add(link.Node);   // the line's drift: from the frame nodes the panel is tied to
            }
            double drift = levels[i + 1].Ux - levels[i].Ux;
            bool carries = Math.Abs(v) > RoundOff * scale;
            double k = carries && drift != 0 ? v / drift : double.NaN;

            var lineResults = new List<LineStoryResult>();
            foreach (var line in order.Where(byLine.ContainsKey))
            {
                double vl = byLine[line];
                // The line's drift from its own nodes at each level; every line touches its levels in a planar model with
                // levels at its floors, else the level's mean is used.
                var nodes = crossing[line];
                double dl = LineUx(c, hi, nodes, levels[i + 1].Ux) - LineUx(c, lo, nodes, levels[i].Ux);
                bool lineCarries = Math.Abs(vl) > RoundOff * scale;
                lineResults.Add(new LineStoryResult(line, vl, carries ? vl / v : double.NaN, dl, lineCarries && dl != 0 ? vl / dl : double.NaN));
            }
            stories.Add(new StoryResult(i + 1, lo, hi, h, levels[i + 1].Ux, drift, drift / h, yc, v, k, lineResults));
        }
        bool lateral = stories.Any(s => Math.Abs(s.Shear) > RoundOff * scale);
        return new CaseStories(c.Id, c.IsCombination, lateral, levels, stories);
    }

    private static LevelDisplacement LevelUx(CaseResult c, Level l)
    {
        if (l.Nodes.Count == 0) return new LevelDisplacement(l, 0, 0);
        var ux = l.Nodes.Select(n => c.Displacement(n, Dof.X)).ToList();
        return new LevelDisplacement(l, ux.Average(), ux.Max() - ux.Min());
    }

    private static double LineUx(CaseResult c, Level l, HashSet<int> lineNodes, double fallback)
    {
        var at = l.Nodes.Where(lineNodes.Contains).ToList();
        return at.Count == 0 ? fallback : at.Average(n => c.Displacement(n, Dof.X));
    }

    /// <summary>
    /// The cut is taken at mid-height between the story's top level and the highest node below it in the story (the
    /// story's mid-height when no node stands between its levels), so no member ends at the cut.
    /// </summary>
    public static double CutElevation(StructureModel model, double bottom, double top)
    {
        double tol = 1e-9 * Math.Max(1.0, top - bottom);
        double below = bottom;
        foreach (var n in model.Nodes)
            if (n.Y > below && n.Y < top - tol) below = n.Y;
        return 0.5 * (below + top);
    }

    private static bool Crosses(StructureModel model, Member m, double y)
    {
        double y1 = model.Nodes[m.Start].Y, y2 = model.Nodes[m.End].Y;
        return Math.Min(y1, y2) < y && y < Math.Max(y1, y2);
    }

    /// <summary>
    /// Horizontal force (N, +x) member <paramref name="e"/> carries across a horizontal cut at <paramref name="yc"/>, from its
    /// end forces and loads (see the class notes for the derivation).
    /// </summary>
    public static double ShearAcrossCut(StructureModel model, FrameElement e, MemberEndForces f, IReadOnlyList<(MemberLoad Load, double Factor)> loads, double yc)
    {
        var m = e.Member;
        double y1 = model.Nodes[m.Start].Y, y2 = model.Nodes[m.End].Y;
        double sCut = (yc - y1) / (y2 - y1) * e.Length;
        bool endIsUpper = y2 > y1;
        double faceForce, sFace, from, to;
        if (endIsUpper)
        {
            faceForce = f.N2 * e.Cos - f.V2 * e.Sin;
            sFace = e.Length - m.RigidEnd;
            (from, to) = (sCut, sFace);
        }
        else
        {
            faceForce = f.N1 * e.Cos - f.V1 * e.Sin;
            sFace = m.RigidStart;
            (from, to) = (sFace, sCut);
        }
        double load = 0;
        foreach (var (ml, factor) in loads)
        {
            var (qx1, qx2, qy1, qy2) = e.LocalIntensity(ml);
            double Px(double s) => (qx1 + (qx2 - qx1) * s / e.Length) * e.Cos - (qy1 + (qy2 - qy1) * s / e.Length) * e.Sin;
            load += factor * (to - from) * 0.5 * (Px(from) + Px(to));   // exact for a linear intensity
        }
        return faceForce + load;
    }

    /// <summary>Member loads acting in a case (factor 1) or a combination (each case's loads with its factor), by member.</summary>
    public static IReadOnlyList<(MemberLoad Load, double Factor)>[] MemberLoadsOf(StructureModel model, CaseResult c)
    {
        var lists = model.Members.Select(_ => new List<(MemberLoad, double)>()).ToArray();
        IEnumerable<(LoadCase Case, double Factor)> parts = c.IsCombination
            ? model.Combinations.First(x => x.Id == c.Id).Factors.Select(p => (model.LoadCases[p.Case], p.Factor))
            : [(model.LoadCases.First(x => x.Id == c.Id), 1.0)];
        foreach (var (lc, factor) in parts)
            foreach (var ml in lc.MemberLoads) lists[ml.Member].Add((ml, factor));
        return lists.Select(l => (IReadOnlyList<(MemberLoad, double)>)l).ToArray();
    }

    /// <summary>Σ|F| of the case's nodal loads and member-load resultants (N): the scale that tells round-off from load.</summary>
    private static double LoadMagnitude(StructureModel model, FrameElement[] elements, CaseResult c, IReadOnlyList<(MemberLoad Load, double Factor)>[] loads)
    {
        IEnumerable<(LoadCase Case, double Factor)> parts = c.IsCombination
            ? model.Combinations.First(x => x.Id == c.Id).Factors.Select(p => (model.LoadCases[p.Case], p.Factor))
            : [(model.LoadCases.First(x => x.Id == c.Id), 1.0)];
        double sum = 0;
        foreach (var (lc, factor) in parts)
            foreach (var nl in lc.NodalLoads) sum += Math.Abs(factor) * (Math.Abs(nl.Fx) + Math.Abs(nl.Fy));
        for (int m = 0; m < elements.Length; m++)
            foreach (var (ml, factor) in loads[m])
                sum += Math.Abs(factor) * 0.5 * (Math.Abs(ml.WStart) + Math.Abs(ml.WEnd)) * elements[m].Length;
        return sum;
    }
}
