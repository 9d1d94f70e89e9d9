using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;
using ScottPlot;

namespace PlaneLateral.Reports;

/// <summary>
/// Figures of floors that bend (docs/plan.md, "Floors that bend"): each bending floor's in-plane deflected shape in plan
/// with the lines where they stand, and a bar chart of each line's share of the story shear under the rigid, semi-rigid
/// and flexible idealisations beside the hand tributary split. They only read the results (<see cref="DiaphragmStudy"/>,
/// <see cref="TributaryShear"/>); no analysis is run to draw them. In the building file's units.
/// </summary>
public static class PlanFloorPlots
{
    private static string F(double v, string fmt = "G4") => v.ToString(fmt, CultureInfo.InvariantCulture);

    /// <summary>File name of the deflected shape of the floor of level <paramref name="levelId"/> under case <paramref name="caseId"/>.</summary>
    public static string ShapeFileName(string levelId, string caseId) => $"plan-floor-{FigureNames.Slug(levelId)}-{FigureNames.Slug(caseId)}.png";

    /// <summary>File name of the bar chart of the line shares of story <paramref name="story"/> under case <paramref name="caseId"/>.</summary>
    public static string SharesFileName(int story, string caseId) => $"plan-floor-shares-story{story}-{FigureNames.Slug(caseId)}.png";

    /// <summary>
    /// Every figure of the floors that bend: the deflected shape of each bending floor per direction (one displacement
    /// scale per figure), and the shares bar chart of every story under each direction's case at the centres of mass.
    /// None without a "floor" block.
    /// </summary>
    public static IReadOnlyList<Figure> All(PlanResult r, IReadOnlyList<TributaryShear>? hand = null)
    {
        if (r.Diaphragms is not { } d) return [];
        var used = new HashSet<string>();
        var list = new List<Figure>();
        foreach (var shape in d.Shapes) list.Add(FigureNames.Unique(Shape(r, shape), used));
        foreach (var c in r.Plan.Cases.Where(c => c.Direction is "x" or "y" && c.Eccentricity == 0))
            for (int s = 1; s <= r.Plan.FloorCount; s++) list.Add(FigureNames.Unique(Shares(r, c.Id, s, hand), used));
        return list;
    }

    /// <summary>The factor the displacements of a shape are drawn with: its largest displacement at about 8 % of the plan size (1, 2 or 5 × 10^k).</summary>
    public static double Scale(PlanResult r, FloorDeflection shape)
    {
        double largest = shape.Outline.Concat(shape.Lines).Select(p => Math.Sqrt(p.Ux * p.Ux + p.Uy * p.Uy)).DefaultIfEmpty(0).Max();
        return ModelPlots.ScaleFactor(largest, r.Plan.Size);
    }

    /// <summary>
    /// The displaced outline as drawn (building-file length units): each sampled point of the outline moved by
    /// <paramref name="scale"/> × its displacement, closed on its first point.
    /// </summary>
    public static (double[] X, double[] Y) DrawnOutline(PlanResult r, FloorDeflection shape, double scale)
    {
        var u = r.Plan.Units;
        var pts = shape.Outline.Append(shape.Outline[0]).ToList();
        return (pts.Select(p => u.FromSI(p.At.X + scale * p.Ux, Quantity.Length)).ToArray(), pts.Select(p => u.FromSI(p.At.Y + scale * p.Uy, Quantity.Length)).ToArray());
    }

    /// <summary>The deflected shape of a bending floor in plan under one direction's case, with its lines where they stand.</summary>
    public static Figure Shape(PlanResult r, FloorDeflection shape)
    {
        var plan = r.Plan;
        var u = plan.Units;
        var level = plan.Levels[shape.Level];
        double L(double si) => u.FromSI(si, Quantity.Length);
        string kind = PlanFloor.Word(plan.KindOf(shape.Level));
        double k = Scale(r, shape);
        var plot = PlotStyle.New($"Floor {level.Id} ({kind}) in plan, case {shape.Case}", $"x [{u.LengthSymbol}]", $"y [{u.LengthSymbol}]");

        var ring = level.Outline.Append(level.Outline[0]).ToArray();
        var floor = plot.Add.ScatterLine(ring.Select(p => L(p.X)).ToArray(), ring.Select(p => L(p.Y)).ToArray());
        floor.Color = PlotStyle.Slate; floor.LineWidth = 1.5f; floor.MarkerSize = 0;
        floor.LegendText = $"floor outline, {level.Name}";
        foreach (var o in plan.FloorOf(shape.Level)?.Openings ?? [])
        {
            var hole = plot.Add.ScatterLine(new[] { L(o.Min.X), L(o.Max.X), L(o.Max.X), L(o.Min.X), L(o.Min.X) }, new[] { L(o.Min.Y), L(o.Min.Y), L(o.Max.Y), L(o.Max.Y), L(o.Min.Y) });
            hole.Color = PlotStyle.Slate; hole.LineWidth = 1f; hole.MarkerSize = 0; hole.LinePattern = LinePattern.Dotted;
        }

        var (dx, dy) = DrawnOutline(r, shape, k);
        var moved = plot.Add.ScatterLine(dx, dy);
        moved.Color = PlotStyle.Brick; moved.LineWidth = 2f; moved.LinePattern = LinePattern.Dashed; moved.MarkerSize = 0;
        moved.LegendText = $"deflected floor\n(displacements × {F(k, "G6")})";

        bool first = true;
        var centre = PlanOutline.Centroid(level.Outline);
        var segments = PlanPlots.Segments(plan, shape.Level);
        for (int i = 0; i < plan.Lines.Count; i++)
        {
            var line = plan.Lines[i];
            var seg = segments.First(s => s.Line == line.Id);
            var drawn = plot.Add.Line(L(seg.Start.X), L(seg.Start.Y), L(seg.End.X), L(seg.End.Y));
            drawn.Color = PlotStyle.Ink; drawn.LineWidth = 4; drawn.MarkerSize = 0;
            if (first) drawn.LegendText = "line of resistance, where it stands";
            var at = shape.Lines[i];
            var p = plot.Add.ScatterPoints(new[] { L(at.At.X + k * at.Ux) }, new[] { L(at.At.Y + k * at.Uy) });
            p.Color = PlotStyle.Moss; p.MarkerShape = MarkerShape.FilledCircle; p.MarkerSize = 9;
            if (first) p.LegendText = "the floor at the line, displaced";
            first = false;
            double along = shape.Direction == "x" ? at.Ux : at.Uy;
            var t = plot.Add.Text($"{line.Id}: {F(L(along), "G3")} {u.LengthSymbol}", L(line.X0), L(line.Y0));
            t.LabelFontSize = 12; t.LabelFontColor = PlotStyle.Ink; t.LabelBackgroundColor = Colors.White.WithAlpha(0.8);
            // Beside the line, on the side towards the floor's centre, so that the label stays over the floor.
            bool acrossX = Math.Abs(line.Sin) >= Math.Abs(line.Cos);   // a north-south line: label to its east or west
            if (acrossX) { bool east = line.X0 <= centre.X; t.LabelAlignment = east ? Alignment.MiddleLeft : Alignment.MiddleRight; t.OffsetX = east ? 8 : -8; }
            else { bool north = line.Y0 <= centre.Y; t.LabelAlignment = north ? Alignment.LowerCenter : Alignment.UpperCenter; t.OffsetY = north ? -8 : 8; }
        }

        double largest = shape.Outline.Select(q => Math.Sqrt(q.Ux * q.Ux + q.Uy * q.Uy)).DefaultIfEmpty(0).Max();
        var worst = r.Diaphragms?.Flexibility.Where(x => x.Level == shape.Level && x.Direction == shape.Direction && double.IsFinite(x.Ratio)).OrderByDescending(x => x.Ratio).FirstOrDefault();
        string note = $"displacements × {F(k, "G6")}; largest {F(L(largest), "G4")} {u.LengthSymbol}\nstory forces along {shape.Direction} at the centres of mass"
            + (worst is null ? "" : $"; largest MDD/ADVE {F(worst.Ratio, "0.00")}");
        var ann = plot.Add.Annotation(note, Alignment.LowerLeft);
        ann.LabelFontSize = 13; ann.LabelBackgroundColor = Colors.White.WithAlpha(0.9); ann.LabelBorderColor = PlotStyle.Slate;

        var outline = level.Outline;
        double xmin = outline.Min(q => q.X), xmax = outline.Max(q => q.X), ymin = outline.Min(q => q.Y), ymax = outline.Max(q => q.Y);
        double size = Math.Max(xmax - xmin, ymax - ymin);
        plot.Axes.SetLimits(L(xmin - 0.08 * size), L(xmax + 0.08 * size), L(ymin - 0.2 * size), L(ymax + 0.1 * size));
        plot.Axes.SquareUnits();
        plot.ShowLegend(Edge.Bottom);
        string caption = $"The {kind} floor of level {level.Id} ({level.Name}) seen from above under case {shape.Case} (the story forces along {shape.Direction} at the centres of mass): " +
            $"the outline (grey), the floor's in-plane displaced outline (dashed; the floor model's displacement at its nodes, drawn {F(k, "G6")} times their size), " +
            "each line of resistance where it stands (blue) and the floor's displaced point at each line (green), labelled with its displacement along the loading.";
        return new Figure(ShapeFileName(level.Id, shape.Case), $"Floor {level.Id} deflected, case {shape.Case}", caption, PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>The idealisations of the bar chart in order, with their colours.</summary>
    public static readonly IReadOnlyList<(string Name, Color Colour)> Series =
        [("rigid", PlotStyle.Ink), ("semi-rigid", PlotStyle.Moss), ("flexible (FE)", PlotStyle.Brick), ("flexible (hand tributary)", PlotStyle.Ochre)];

    /// <summary>
    /// Each line's share of the story shear along the case's direction (its story shear over the story shear), per
    /// idealisation in <see cref="Series"/> order (NaN where not made), for the lines along that direction.
    /// </summary>
    public static IReadOnlyList<(string Line, double[] Shares)> ShareValues(PlanResult r, string caseId, int story, IReadOnlyList<TributaryShear>? hand)
    {
        var c = r.Case(caseId);
        var st = c.Stories[story - 1];
        string dir = c.Case.Direction;
        double v = dir == "x" ? st.Vx : st.Vy;
        var list = new List<(string, double[])>();
        foreach (var line in r.Plan.Lines)
        {
            double along = dir == "x" ? line.Cos : line.Sin;
            if (along == 0) continue;
            var e = r.Diaphragms!.Envelope.First(x => x.Case == caseId && x.Story == story && x.Line == line.Id);
            var h = hand?.FirstOrDefault(x => x.Case == caseId && x.Story == story && x.Line == line.Id);
            double S(double shear) => v != 0 && double.IsFinite(shear) ? along * shear / v : double.NaN;
            list.Add((line.Id, [S(e.Rigid), S(e.SemiRigid), S(e.Flexible), S(h?.Hand ?? double.NaN)]));
        }
        return list;
    }

    /// <summary>The bar chart of each line's share of the story shear under the idealisations, one group of bars per line.</summary>
    public static Figure Shares(PlanResult r, string caseId, int story, IReadOnlyList<TributaryShear>? hand)
    {
        var values = ShareValues(r, caseId, story, hand);
        var c = r.Case(caseId);
        var st = c.Stories[story - 1];
        var u = r.Plan.Units;
        double v = c.Case.Direction == "x" ? st.Vx : st.Vy;
        var plot = PlotStyle.New($"Story {story}: line shares of the story shear, case {caseId}", "", "share of the story shear along " + c.Case.Direction + " [-]");
        var bars = new List<Bar>();
        var ticks = new List<Tick>();
        int m = Series.Count;
        double width = 0.8 / m;
        for (int i = 0; i < values.Count; i++)
        {
            for (int j = 0; j < m; j++)
            {
                double val = values[i].Shares[j];
                if (!double.IsFinite(val)) continue;
                double pos = i + (j - (m - 1) / 2.0) * width;
                bars.Add(new Bar { Position = pos, Value = val, Size = width * 0.92, FillColor = Series[j].Colour, LineWidth = 0 });
                var t = plot.Add.Text(F(val, "0.000"), pos, val);
                t.LabelFontSize = 10; t.LabelAlignment = val >= 0 ? Alignment.LowerCenter : Alignment.UpperCenter; t.LabelFontColor = Series[j].Colour;
            }
            ticks.Add(new Tick(i, values[i].Line, true));
        }
        plot.Add.Bars(bars);
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks.ToArray());
        plot.Axes.Bottom.MajorTickStyle.Length = 0;
        var all = values.SelectMany(x => x.Shares).Where(double.IsFinite).DefaultIfEmpty(0).ToList();
        double lo = Math.Min(0, all.Min()), hi = Math.Max(0, all.Max());
        plot.Axes.SetLimits(-0.6, values.Count - 0.4, lo - 0.08 * (hi - lo + 1e-9), hi + 0.18 * (hi - lo + 1e-9));
        plot.Grid.XAxisStyle.IsVisible = false;
        for (int j = 0; j < m; j++)
        {
            var key = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
            key.Color = Series[j].Colour; key.MarkerShape = MarkerShape.FilledSquare; key.MarkerSize = 12; key.LegendText = Series[j].Name;
        }
        plot.ShowLegend(Edge.Right);
        var ann = plot.Add.Annotation($"story shear V{c.Case.Direction} = {F(u.FromSI(v, Quantity.Force), "0.#")} {u.ForceSymbol}", Alignment.UpperLeft);
        ann.LabelFontSize = 13; ann.LabelBackgroundColor = Colors.White.WithAlpha(0.9); ann.LabelBorderColor = PlotStyle.Slate;
        string caption = $"Each line's story shear in story {story} over the story shear along {c.Case.Direction} (case {caseId}) under every floor rigid, the floors with a section semi-rigid " +
            "(deep beams in their plane), every floor flexible (FE, simple spans between the lines) and the hand tributary split (missing bars: the idealisation was not made; see the notes of the floor tables).";
        return new Figure(SharesFileName(story, caseId), $"Line shares, story {story}, case {caseId}", caption, PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }
}
