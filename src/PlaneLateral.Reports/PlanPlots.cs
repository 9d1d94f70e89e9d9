using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;
using ScottPlot;

namespace PlaneLateral.Reports;

/// <summary>
/// Figures of a building in plan (docs/plan.md), one per story: the floor outline, each line of resistance where it
/// stands (width by its share of the story shear), the centre of mass, the centre of rigidity and the displaced outline
/// of one load case. Values read from a <see cref="PlanResult"/>, drawn in the building file's units.
/// </summary>
public static class PlanPlots
{
    private static string F(double v, string fmt = "G4") => v.ToString(fmt, CultureInfo.InvariantCulture);

    /// <summary>Length of the marker drawn for a line whose plan length is not known (a planar model, story stiffnesses), as a fraction of the plan size.</summary>
    public const double MarkerFraction = 0.12;

    /// <summary>A line of resistance as drawn in plan (SI, m): from <see cref="Start"/> to <see cref="End"/> along its direction, centred on its point.</summary>
    /// <param name="LengthKnown">True for a compact wall (its own plan length); false for a fixed-length marker.</param>
    public sealed record PlanSegment(string Line, PlanPoint Start, PlanPoint End, bool LengthKnown);

    /// <summary>
    /// The segment of every line on the floor of level <paramref name="level"/> (1 = lowest floor): a compact wall from
    /// its centre ± half its length along its direction (the wall's rectangular section depth is its plan length); any
    /// other line a marker of <see cref="MarkerFraction"/> × the plan size through its point along its direction, centred
    /// on the point when that stays on the floor, else running from the point forwards or backwards (a line standing on
    /// the outline's edge, e.g. at a corner), whichever stays on the floor.
    /// </summary>
    public static IReadOnlyList<PlanSegment> Segments(BuildingPlan plan, int level)
    {
        double marker = MarkerFraction * plan.Size;
        var outline = plan.Levels[level].Outline;
        double tol = 1e-6 * Math.Max(1, plan.Size);
        var list = new List<PlanSegment>();
        foreach (var l in plan.Lines)
        {
            double c = Math.Cos(l.Angle), s = Math.Sin(l.Angle);
            PlanPoint At(double t) => new(l.X0 + t * c, l.Y0 + t * s);
            if (l.Form == PlanLineForm.Wall && l.PlanLength > 0)   // a compact wall, as members or as a panel: its own plan length
            {
                double h = l.PlanLength / 2;
                list.Add(new PlanSegment(l.Id, At(-h), At(h), true));
                continue;
            }
            bool OnFloor(double a, double b) => Enumerable.Range(0, 21).All(k => PlanOutline.Contains(outline, At(a + (b - a) * k / 20.0), tol));
            var (lo, hi) = new[] { (-marker / 2, marker / 2), (0.0, marker), (-marker, 0.0) }.FirstOrDefault(x => OnFloor(x.Item1, x.Item2), (-marker / 2, marker / 2));
            list.Add(new PlanSegment(l.Id, At(lo), At(hi), false));
        }
        return list;
    }

    /// <summary>
    /// The case of the largest corner drift ratio: vector drift of an outline corner in plan over the story height, over
    /// every story and corner (read from <see cref="PlanCaseResult.Vertices"/>); null when there is no case.
    /// </summary>
    public static (PlanCaseResult Case, int Story, double Ratio)? GoverningDriftCase(PlanResult r)
    {
        var levels = r.Plan.Levels;
        (PlanCaseResult, int, double)? best = null;
        foreach (var c in r.Cases)
            foreach (var v in c.Vertices)
            {
                if (v.Level < 1 || v.Level >= levels.Count) continue;
                double h = levels[v.Level].Elevation - levels[v.Level - 1].Elevation;
                if (!(h > 0)) continue;
                double ratio = Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY) / h;
                if (best is null || ratio > best.Value.Item3) best = (c, v.Level, ratio);
            }
        return best;
    }

    /// <summary>File name of the plan figure of story <paramref name="story"/> under case <paramref name="caseId"/>.</summary>
    public static string FileName(int story, string caseId) => $"plan-story{story}-{FigureNames.Slug(caseId)}.png";

    /// <summary>
    /// At most this many story figures per run: every story of a building of up to this many stories, otherwise the
    /// stories of the largest corner drift ratio in the governing case. A figure per story of a 200-story building
    /// took most of its run (about 40 ms each) and 200 files that nobody reads one by one.
    /// </summary>
    public const int MaxStoryFigures = 12;

    /// <summary>
    /// The stories drawn (1 = lowest, in story order): every story when there are at most <see cref="MaxStoryFigures"/>,
    /// else the <see cref="MaxStoryFigures"/> with the largest corner drift ratio under the governing drift case (ties:
    /// the lower story).
    /// </summary>
    public static IReadOnlyList<int> StoriesDrawn(PlanResult r)
    {
        int n = r.Plan.FloorCount;
        if (n <= MaxStoryFigures) return Enumerable.Range(1, n).ToList();
        if (GoverningDriftCase(r) is not { } g) return [];
        var levels = r.Plan.Levels;
        var worst = new double[n + 1];
        foreach (var v in g.Case.Vertices)
        {
            if (v.Level < 1 || v.Level > n) continue;
            double h = levels[v.Level].Elevation - levels[v.Level - 1].Elevation;
            if (h > 0) worst[v.Level] = Math.Max(worst[v.Level], Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY) / h);
        }
        return Enumerable.Range(1, n).OrderByDescending(s => worst[s]).ThenBy(s => s).Take(MaxStoryFigures).Order().ToList();
    }

    /// <summary>
    /// The plan figures of the stories <see cref="StoriesDrawn"/> picks, under the governing drift case
    /// (<see cref="GoverningDriftCase"/>); none without cases.
    /// </summary>
    public static IReadOnlyList<Figure> Governing(PlanResult r)
    {
        if (GoverningDriftCase(r) is not { } g) return [];
        var used = new HashSet<string>();
        // One displacement scale for every story, so that the figures compare.
        double largest = g.Case.Vertices.Select(v => Math.Sqrt(v.Ux * v.Ux + v.Uy * v.Uy)).DefaultIfEmpty(0).Max();
        double scale = ModelPlots.ScaleFactor(largest, r.Plan.Size);
        return StoriesDrawn(r)
            .Select(s => FigureNames.Unique(Story(r, s, g.Case.Case.Id, "the case of the largest corner drift ratio", scale), used)).ToList();
    }

    /// <summary>The line width (pixels) for a share of the story shear: 2 px at nil, 14 px at the whole shear.</summary>
    public static float Width(double share) => (float)(2 + 12 * Math.Clamp(double.IsFinite(share) ? Math.Abs(share) : 0, 0, 1));

    /// <summary>
    /// Story <paramref name="story"/> (1 = lowest) in plan under case <paramref name="caseId"/>: outline of the floor
    /// above it, its lines (width by share of the story shear), centre of mass and of rigidity, displaced outline.
    /// </summary>
    /// <param name="scale">Displacement scale; by default the one that draws this floor's largest corner displacement at about 8% of the plan size.</param>
    public static Figure Story(PlanResult r, int story, string caseId, string? why = null, double? scale = null)
    {
        var plan = r.Plan;
        var u = plan.Units;
        var c = r.Case(caseId);
        var level = plan.Levels[story];
        double L(double si) => u.FromSI(si, Quantity.Length);
        double Fo(double si) => u.FromSI(si, Quantity.Force);
        var outline = level.Outline;
        var load = c.Stories.FirstOrDefault(s => s.Story == story);
        double vTotal = load is null ? 0 : Math.Sqrt(load.Vx * load.Vx + load.Vy * load.Vy);

        var plot = PlotStyle.New($"Story {story} ({level.Name}) in plan, case {caseId}", $"x [{u.LengthSymbol}]", $"y [{u.LengthSymbol}]");

        // Floor outline.
        var ring = outline.Append(outline[0]).ToArray();
        var floor = plot.Add.ScatterLine(ring.Select(p => L(p.X)).ToArray(), ring.Select(p => L(p.Y)).ToArray());
        floor.Color = PlotStyle.Slate;
        floor.LineWidth = 1.5f;
        floor.MarkerSize = 0;
        floor.LegendText = $"floor outline, {level.Name}";

        // Displaced outline of the floor (the outline corners' displacements of this level).
        var verts = c.Vertices.Where(v => v.Level == story).OrderBy(v => v.Vertex).ToList();
        double largest = verts.Count == 0 ? 0 : verts.Max(v => Math.Sqrt(v.Ux * v.Ux + v.Uy * v.Uy));
        double k = scale ?? ModelPlots.ScaleFactor(largest, plan.Size);
        if (verts.Count == outline.Count)
        {
            var moved = verts.Select(v => new PlanPoint(v.At.X + k * v.Ux, v.At.Y + k * v.Uy)).Append(new PlanPoint(verts[0].At.X + k * verts[0].Ux, verts[0].At.Y + k * verts[0].Uy)).ToArray();
            var disp = plot.Add.ScatterLine(moved.Select(p => L(p.X)).ToArray(), moved.Select(p => L(p.Y)).ToArray());
            disp.Color = PlotStyle.Brick;
            disp.LineWidth = 2f;
            disp.LinePattern = LinePattern.Dashed;
            disp.MarkerSize = 0;
            disp.LegendText = $"displaced outline\n(displacements × {F(k, "G6")})";
        }

        // Lines of resistance, width by share of the story shear.
        var centre = PlanOutline.Centroid(outline);
        bool firstLine = true;
        var segments = Segments(plan, story);
        foreach (var seg in segments)
        {
            var ls = c.LineStories.FirstOrDefault(x => x.Story == story && x.Line == seg.Line);
            double share = ls is null ? double.NaN : double.IsFinite(ls.Share) ? ls.Share : (vTotal > 0 ? ls.Shear / vTotal : double.NaN);
            var line = plot.Add.Line(L(seg.Start.X), L(seg.Start.Y), L(seg.End.X), L(seg.End.Y));
            line.Color = seg.LengthKnown ? PlotStyle.Ink : PlotStyle.Moss;
            line.LineWidth = Width(share);
            line.MarkerSize = 0;
            if (firstLine) line.LegendText = "line of resistance\n(width ∝ share of story shear)";
            firstLine = false;
            // Label on the side of the line towards the floor's centre, so that it stays inside the outline.
            double mx = (seg.Start.X + seg.End.X) / 2, my = (seg.Start.Y + seg.End.Y) / 2;
            var pl = plan.Lines.First(x => x.Id == seg.Line);
            double nx = -pl.Sin, ny = pl.Cos;                      // normal to the line
            if ((centre.X - mx) * nx + (centre.Y - my) * ny < 0) { nx = -nx; ny = -ny; }
            string text = ls is null ? seg.Line
                : $"{seg.Line}: {F(Fo(ls.Shear), "0.#")} {u.ForceSymbol}" + (double.IsFinite(ls.Share) ? $", {F(100 * ls.Share, "0")}%" : " (across)");
            bool vertical = Math.Abs(ny) < Math.Abs(nx);           // the normal is mostly along x: a north-south line
            // A north-south line is labelled beside its middle; any other from its western end, so that the label runs
            // over the floor rather than out of the plot.
            var anchor = vertical ? new PlanPoint(mx, my) : seg.Start.X <= seg.End.X ? seg.Start : seg.End;
            var t = plot.Add.Text(text, L(anchor.X), L(anchor.Y));
            t.LabelFontSize = 13;
            t.LabelFontColor = line.Color;
            t.LabelBackgroundColor = Colors.White.WithAlpha(0.8);
            t.LabelAlignment = vertical ? (nx > 0 ? Alignment.MiddleLeft : Alignment.MiddleRight) : (ny > 0 ? Alignment.LowerLeft : Alignment.UpperLeft);
            t.OffsetX = vertical ? (nx > 0 ? 10 : -10) : 0;
            t.OffsetY = vertical ? 0 : (ny > 0 ? -10 : 10);        // pixel offsets: y grows downwards
        }
        if (segments.Any(s => !s.LengthKnown))
        {
            var key = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
            key.Color = PlotStyle.Moss; key.MarkerShape = MarkerShape.FilledSquare; key.MarkerSize = 10;
            key.LegendText = $"line without a plan length\n(marker {F(L(MarkerFraction * plan.Size), "0.#")} {u.LengthSymbol} long)";
        }

        // Centre of mass and centre of rigidity.
        var cm = plot.Add.ScatterPoints(new[] { L(level.CentreOfMass.X) }, new[] { L(level.CentreOfMass.Y) });
        cm.Color = PlotStyle.Ochre; cm.MarkerShape = MarkerShape.FilledCircle; cm.MarkerSize = 13;
        cm.LegendText = $"centre of mass\n({F(L(level.CentreOfMass.X), "0.##")}, {F(L(level.CentreOfMass.Y), "0.##")})";
        // The centre of rigidity for the case's direction of loading (by its story shear where the case names none).
        string dir = c.Case.Direction is "x" or "y" ? c.Case.Direction : load is not null && Math.Abs(load.Vy) > Math.Abs(load.Vx) ? "y" : "x";
        var cr = r.Rigidity.FirstOrDefault(x => x.Story == story && x.Direction == dir) ?? r.Rigidity.FirstOrDefault(x => x.Story == story);
        if (cr is not null && double.IsFinite(cr.XR) && double.IsFinite(cr.YR))
        {
            var p = plot.Add.ScatterPoints(new[] { L(cr.XR) }, new[] { L(cr.YR) });
            p.Color = PlotStyle.Plum; p.MarkerShape = MarkerShape.OpenDiamond; p.MarkerSize = 16; p.MarkerLineWidth = 2.5f;
            p.LegendText = $"centre of rigidity, loading along {cr.Direction}\n({F(L(cr.XR), "0.##")}, {F(L(cr.YR), "0.##")})";
        }

        string note = $"displacements × {F(k, "G6")}; largest corner displacement {F(L(largest), "G4")} {u.LengthSymbol}"
            + (load is null ? "" : $"; story shear Vx = {F(Fo(load.Vx), "0.#")}, Vy = {F(Fo(load.Vy), "0.#")} {u.ForceSymbol}");
        var ann = plot.Add.Annotation(note, Alignment.LowerLeft);
        ann.LabelFontSize = 13;
        ann.LabelBackgroundColor = Colors.White.WithAlpha(0.9);
        ann.LabelBorderColor = PlotStyle.Slate;

        double xmin = outline.Min(p => p.X), xmax = outline.Max(p => p.X), ymin = outline.Min(p => p.Y), ymax = outline.Max(p => p.Y);
        double size = Math.Max(xmax - xmin, ymax - ymin);
        plot.Axes.SetLimits(L(xmin - 0.08 * size), L(xmax + 0.08 * size), L(ymin - 0.22 * size), L(ymax + 0.1 * size));
        plot.Axes.SquareUnits();
        plot.ShowLegend(Edge.Right);
        string caption = $"Story {story} ({level.Name}) seen from above under case {caseId}{(why is null ? "" : $" ({why})")}: the floor outline (grey), " +
            "each line of resistance at its plan position along its direction — a compact wall over its own length, any other line as a marker of fixed length centred on its point — " +
            "drawn wider the larger its share of the story shear along its direction (a line across the loading by its shear over the story's resultant shear) and labelled with its story shear, " +
            $"the centre of mass, the centre of rigidity of the story (hand definition from the lines' story stiffnesses alone) and the displaced outline of the floor with displacements drawn {F(k, "G6")} times their size.";
        return new Figure(FileName(story, caseId), $"Story {story} in plan, case {caseId}", caption, PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }
}
