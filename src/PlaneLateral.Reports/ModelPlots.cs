using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;
using ScottPlot;

namespace PlaneLateral.Reports;

/// <summary>Figures of a solved model: deflected shape, story displacement and drift-ratio profiles, hand-vs-FE bars. Values in the model's units.</summary>
public static class ModelPlots
{
    private static string F(double v, string fmt = "G4") => v.ToString(fmt, CultureInfo.InvariantCulture);

    /// <summary>A file-name-safe, short and distinct form of an id (<see cref="FigureNames.Slug"/>).</summary>
    public static string Slug(string id) => FigureNames.Slug(id);

    /// <summary>The factor that draws the largest nodal displacement at about 8% of the model's size, rounded down to 1, 2 or 5 × 10^k.</summary>
    public static double ScaleFactor(double largestDisplacement, double modelSize)
    {
        if (!(largestDisplacement > 0) || !(modelSize > 0)) return 1;
        double raw = 0.08 * modelSize / largestDisplacement;
        double p = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double m = raw / p;
        double nice = m >= 5 ? 5 : m >= 2 ? 2 : 1;
        return nice * p;
    }

    /// <summary>
    /// The element edges on a panel's outline and around its openings (edges that only one element has), each as its
    /// mesh nodes in order along it (corner, mid-side for the 9-node element, corner).
    /// </summary>
    private static IEnumerable<int[]> PanelOutline(PanelResult p)
    {
        var mesh = p.Mesh.Mesh;
        var count = new Dictionary<(int, int), int[]>();
        var seen = new Dictionary<(int, int), int>();
        for (int e = 0; e < mesh.Elements.Length; e++)
            for (int k = 0; k < 4; k++)
            {
                var nodes = mesh.Element.EdgeNodes(k).Select(a => mesh.Elements[e][a]).ToArray();
                var key = (Math.Min(nodes[0], nodes[^1]), Math.Max(nodes[0], nodes[^1]));
                seen[key] = seen.GetValueOrDefault(key) + 1;
                count[key] = nodes;
            }
        return seen.Where(x => x.Value == 1).OrderBy(x => x.Key).Select(x => count[x.Key]);
    }

    /// <summary>Undeformed and deflected shape of one case, the scale factor printed on the plot.</summary>
    public static Figure DeflectedShape(AnalysisResult r, string caseId)
    {
        var model = r.Model;
        var u = model.Units;
        var c = r.Case(caseId);
        double L(double si) => u.FromSI(si, Quantity.Length);
        double xmin = model.Nodes.Min(n => n.X), xmax = model.Nodes.Max(n => n.X), ymin = model.Nodes.Min(n => n.Y), ymax = model.Nodes.Max(n => n.Y);
        var linked = r.Panels.Where(p => p.Panel.Links.Count > 0).ToList();   // wall panels that are part of the frame
        foreach (var p in linked)
        {
            xmin = Math.Min(xmin, p.Panel.X0); xmax = Math.Max(xmax, p.Panel.X0 + p.Panel.Length);
            ymin = Math.Min(ymin, p.Panel.Y0); ymax = Math.Max(ymax, p.Panel.Y0 + p.Panel.Height);
        }
        double size = Math.Max(xmax - xmin, ymax - ymin);
        int worst = 0;
        double largest = 0;
        foreach (var n in model.Nodes)
        {
            double d = Math.Sqrt(Math.Pow(c.Displacement(n.Index, Dof.X), 2) + Math.Pow(c.Displacement(n.Index, Dof.Y), 2));
            if (d > largest) { largest = d; worst = n.Index; }
        }
        double scale = ScaleFactor(largest, size);

        var plot = PlotStyle.New($"Deflected shape, case {caseId}", $"x [{u.LengthSymbol}]", $"y [{u.LengthSymbol}]");
        bool first = true;
        foreach (var m in model.Members)
        {
            var a = model.Nodes[m.Start]; var b = model.Nodes[m.End];
            var line = plot.Add.Line(L(a.X), L(a.Y), L(b.X), L(b.Y));
            line.Color = PlotStyle.Slate.WithAlpha(0.7);
            line.LineWidth = 1.5f;
            line.LinePattern = LinePattern.Dashed;
            line.MarkerSize = 0;
            if (first) line.LegendText = "undeformed";
            first = false;
        }
        first = true;
        foreach (var m in model.Members)
        {
            var a = model.Nodes[m.Start]; var b = model.Nodes[m.End];
            var line = plot.Add.Line(
                L(a.X + scale * c.Displacement(a.Index, Dof.X)), L(a.Y + scale * c.Displacement(a.Index, Dof.Y)),
                L(b.X + scale * c.Displacement(b.Index, Dof.X)), L(b.Y + scale * c.Displacement(b.Index, Dof.Y)));
            line.Color = m.Kind == MemberKind.Brace ? PlotStyle.Moss : PlotStyle.Ink;
            line.LineWidth = 2.5f;
            line.MarkerSize = 0;
            if (first) line.LegendText = $"deflected, displacements × {F(scale, "G6")}";
            first = false;
        }
        int ci = r.Cases.ToList().FindIndex(x => ReferenceEquals(x, c));
        bool firstPanel = true;
        foreach (var p in linked)
        {
            if (ci < 0 || ci >= p.Analysis.Cases.Count) continue;
            var pc = p.Analysis.Cases[ci];
            foreach (var edge in PanelOutline(p))
            {
                var xs0 = edge.Select(i => L(p.Mesh.Mesh.X[i])).ToArray();
                var ys0 = edge.Select(i => L(p.Mesh.Mesh.Y[i])).ToArray();
                var before = plot.Add.ScatterLine(xs0, ys0);
                before.Color = PlotStyle.Slate.WithAlpha(0.5);
                before.LineWidth = 1f;
                before.LinePattern = LinePattern.Dashed;
                before.MarkerSize = 0;
                var xs = edge.Select(i => L(p.Mesh.Mesh.X[i] + scale * pc.Ux[i])).ToArray();
                var ys = edge.Select(i => L(p.Mesh.Mesh.Y[i] + scale * pc.Uy[i])).ToArray();
                var after = plot.Add.ScatterLine(xs, ys);
                after.Color = PlotStyle.Brick;
                after.LineWidth = 2f;
                after.MarkerSize = 0;
                if (firstPanel) after.LegendText = "linked wall panel: edges and openings, deflected";
                firstPanel = false;
            }
        }
        var sx = model.Supports.Select(s => L(model.Nodes[s.Node].X)).ToArray();
        var sy = model.Supports.Select(s => L(model.Nodes[s.Node].Y)).ToArray();
        if (sx.Length > 0)
        {
            var sup = plot.Add.ScatterPoints(sx, sy);
            sup.Color = PlotStyle.Brick;
            sup.MarkerShape = MarkerShape.FilledTriangleUp;
            sup.MarkerSize = 12;
            sup.LegendText = "supports";
        }
        string worstText = $"scale factor {F(scale, "G6")}; largest displacement {F(L(largest), "G4")} {u.LengthSymbol} at node {model.Nodes[worst].Id}";
        var note = plot.Add.Annotation(worstText, Alignment.UpperLeft);
        note.LabelFontSize = 14;
        note.LabelBackgroundColor = Colors.White.WithAlpha(0.9);
        note.LabelBorderColor = PlotStyle.Slate;
        double pad = 0.12 * L(size);
        plot.Axes.SetLimits(L(xmin) - pad, L(xmax) + pad, L(ymin) - 0.5 * pad, L(ymax) + 1.5 * pad);
        plot.Axes.SquareUnits();
        plot.ShowLegend(Alignment.UpperRight);
        return new Figure($"shape-{Slug(caseId)}.png", $"Deflected shape, case {caseId}",
            $"Undeformed (dashed) and deflected (solid) shape under case {caseId}, displacements drawn {F(scale, "G6")} times their size; {worstText}. Members are drawn straight between their displaced end nodes; axial-only members (braces, links) in green; supports as red triangles.{(linked.Count > 0 ? " Wall panels linked to the frame are drawn by their edges and opening edges through the mesh nodes on them, displaced with the same scale (their bases are held)." : "")}",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>Level displacement against elevation for every lateral case.</summary>
    public static Figure DisplacementProfile(AnalysisResult r, IReadOnlyList<CaseStories> cases)
    {
        var u = r.Model.Units;
        double L(double si) => u.FromSI(si, Quantity.Length);
        var plot = PlotStyle.New("Story displacement profile", $"level displacement ux [{u.LengthSymbol}]", $"elevation [{u.LengthSymbol}]");
        int k = 0;
        foreach (var cs in cases)
        {
            var sc = plot.Add.Scatter(cs.Levels.Select(l => L(l.Ux)).ToArray(), cs.Levels.Select(l => L(l.Level.Elevation)).ToArray());
            sc.Color = PlotStyle.Series[k % PlotStyle.Series.Length];
            sc.LineWidth = 2;
            sc.LinePattern = cs.IsCombination ? LinePattern.Dashed : LinePattern.Solid;
            sc.MarkerShape = cs.IsCombination ? MarkerShape.OpenSquare : MarkerShape.FilledCircle;
            sc.MarkerSize = 7;
            sc.LegendText = cs.IsCombination ? $"{cs.CaseId} (combination)" : cs.CaseId;
            k++;
        }
        var zero = plot.Add.VerticalLine(0);
        zero.Color = PlotStyle.Slate;
        zero.LineWidth = 1;
        plot.ShowLegend(Alignment.LowerRight);
        return new Figure("story-displacements.png", "Story displacement profile",
            "Displacement of each level (mean ux of its nodes) against its elevation, for every case that carries story shear; combinations dashed.",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>
    /// Drift ratio against elevation, drawn as steps over each story's height: the elastic ratio δe/h and, for a drift
    /// check, the amplified ratio C_d·δe/(I_e·h) beside its allowable line.
    /// </summary>
    public static Figure DriftProfile(IReadOnlyList<CaseStories> cases, IReadOnlyList<DriftCheckRow> rows, DriftCheckSpec? check, UnitSystem u)
    {
        double L(double si) => u.FromSI(si, Quantity.Length);
        string title = check is null ? "Story drift ratio profile (elastic)" : $"Story drift ratio profile, drift check '{check.Id}'";
        var plot = PlotStyle.New(title, check is null ? "elastic drift ratio δe/h [%]" : "amplified drift ratio Cd·δe/(Ie·h) [%]", $"elevation [{u.LengthSymbol}]");
        int k = 0;
        foreach (var cs in cases)
        {
            var xs = new List<double>(); var ys = new List<double>();
            foreach (var s in cs.Stories)
            {
                double ratio = check is null ? Math.Abs(s.DriftRatio) : rows.First(x => x.Check == check && x.CaseId == cs.CaseId && x.Story.Index == s.Index).Ratio;
                xs.Add(100 * ratio); ys.Add(L(s.Bottom.Elevation));
                xs.Add(100 * ratio); ys.Add(L(s.Top.Elevation));
            }
            var sc = plot.Add.Scatter(xs.ToArray(), ys.ToArray());
            sc.Color = PlotStyle.Series[k % PlotStyle.Series.Length];
            sc.LineWidth = 2.5f;
            sc.LinePattern = cs.IsCombination ? LinePattern.Dashed : LinePattern.Solid;
            sc.MarkerSize = 0;
            sc.LegendText = cs.IsCombination ? $"{cs.CaseId} (combination)" : cs.CaseId;
            k++;
        }
        string caption;
        if (check is not null)
        {
            var limit = plot.Add.VerticalLine(100 * check.AllowedRatio);
            limit.Color = PlotStyle.Limit;
            limit.LineWidth = 2;
            limit.LinePattern = LinePattern.DenselyDashed;
            limit.LegendText = $"allowable Δa/h = {F(100 * check.AllowedRatio)}%";
            plot.Axes.SetLimitsX(0, 100 * check.AllowedRatio * 1.15 + 1e-12);
            var used = rows.Where(x => x.Check == check).ToArray();
            double worst = used.Length == 0 ? 0 : used.Max(x => x.Ratio);
            plot.Axes.SetLimitsX(0, 100 * Math.Max(check.AllowedRatio, worst) * 1.15);
            caption = $"Amplified story drift ratio δ/h with δ = C_d·δe/I_e (C_d = {F(check.Cd)}, I_e = {F(check.Ie)}; ASCE 7-16 eq. 12.8-15), drawn over each story's height, beside the allowable Δa/h = {F(100 * check.AllowedRatio)}% ({check.LimitSource}).";
        }
        else
        {
            plot.Axes.SetLimitsX(0, cases.SelectMany(c => c.Stories).Select(s => 100 * Math.Abs(s.DriftRatio)).DefaultIfEmpty(1).Max() * 1.15);
            caption = "Elastic story drift ratio δe/h (interstory drift over story height), drawn over each story's height; no drift check is declared for these cases.";
        }
        plot.ShowLegend(Alignment.UpperRight);
        return new Figure(check is null ? "story-drift.png" : $"story-drift-{Slug(check.Id)}.png", title, caption, PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>Hand and FE values side by side, one pair of bars per comparison row of one kind.</summary>
    public static Figure HandVsFe(ComparisonReport rep, string kind)
    {
        var rows = rep.Rows.Where(x => x.Kind == kind).ToArray();
        string unit = rows[0].Unit;
        string quantity = rows[0].Quantity == ComparedQuantity.Stiffness ? "lateral stiffness" : "story shear";
        var plot = PlotStyle.New($"Hand method beside FE: {kind} checks", $"{quantity} [{unit}]", "");
        var bars = new List<Bar>();
        var ticks = new List<Tick>();
        int n = rows.Length;
        for (int i = 0; i < n; i++)
        {
            var row = rows[i];
            double pos = 3.0 * (n - 1 - i);   // first row on top
            var beside = row.Beside;   // the next FE model, with its own ratio
            double step = beside is null ? 1.0 : 0.8, size = beside is null ? 0.8 : 0.7;
            bars.Add(new Bar { Position = pos + step / 2 * (beside is null ? 1 : 2), Value = row.Hand.Value, FillColor = PlotStyle.Ochre, LineWidth = 0, Orientation = Orientation.Horizontal, Size = size });
            bars.Add(new Bar { Position = beside is null ? pos - step / 2 : pos, Value = row.Reference.Value, FillColor = PlotStyle.Ink, LineWidth = 0, Orientation = Orientation.Horizontal, Size = size });
            if (beside is not null)
                bars.Add(new Bar { Position = pos - step, Value = beside.Value, FillColor = PlotStyle.Plum, LineWidth = 0, Orientation = Orientation.Horizontal, Size = size });
            ticks.Add(new Tick(pos, $"{row.CheckId} {Shorten(row.Subject)}\n{MethodShort(row.Hand.Method.Name)}\nreference: {MethodShort(row.Reference.Model)}", true));
            var label = plot.Add.Text($"reference FE/hand {F(row.Ratio, "0.00")}" + (beside is null ? "" : $"\nbeside: {F(beside.Value / row.Hand.Value, "0.00")}"), Math.Max(row.Hand.Value, Math.Max(row.Reference.Value, beside?.Value ?? 0)), pos);
            label.LabelFontSize = 12;
            label.LabelFontColor = row.Verdict == Verdict.WithinTolerance ? PlotStyle.Moss : PlotStyle.Brick;
            label.LabelAlignment = Alignment.MiddleLeft;
            label.OffsetX = 6;
        }
        var bp = plot.Add.Bars(bars);
        bp.Horizontal = true;
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks.ToArray());
        plot.Axes.Left.MajorTickStyle.Length = 0;
        plot.Axes.Left.TickLabelStyle.FontSize = 12;
        double max = rows.Max(x => Math.Max(Math.Max(x.Hand.Value, x.Reference.Value), x.Beside?.Value ?? 0));
        plot.Axes.SetLimits(0, max * 1.3, -1.6, 3.0 * (n - 1) + 1.6);
        plot.Grid.YAxisStyle.IsVisible = false;
        var hand = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
        hand.Color = PlotStyle.Ochre; hand.MarkerShape = MarkerShape.FilledSquare; hand.MarkerSize = 12; hand.LegendText = "hand method";
        var fe = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
        fe.Color = PlotStyle.Ink; fe.MarkerShape = MarkerShape.FilledSquare; fe.MarkerSize = 12; fe.LegendText = "reference FE model (named under each row)";
        if (rows.Any(x => x.Beside is not null))
        {
            var pn = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
            pn.Color = PlotStyle.Plum; pn.MarkerShape = MarkerShape.FilledSquare; pn.MarkerSize = 12; pn.LegendText = "next FE model beside it";
        }
        plot.ShowLegend(Edge.Bottom);   // below the axes, so it never covers a bar
        int height = Math.Max(PlotStyle.Height, 120 + 90 * n);
        return new Figure($"hand-vs-fe-{Slug(kind)}.png", $"Hand method beside FE: {kind}",
            $"For each {kind} row, the hand-method value (ochre), the reference FE value (blue; the model is named under the row: a converged plane-stress panel where the row has one, else the first line model) and, where the row has one, the next FE model beside it (plum) in {unit}, with the reference FE/hand (green within tolerance, red outside) and the other model's own ratio.",
            PlotStyle.Png(plot, PlotStyle.Width, height), PlotStyle.Width, height);
    }

    /// <summary>The hand method's name up to its first comma (the full name is in the report's tables).</summary>
    private static string MethodShort(string name)
    {
        int i = name.IndexOf(", ", StringComparison.Ordinal);
        string s = i > 0 ? name[..i] : name;
        return s.Length <= 56 ? s : s[..53] + "...";
    }

    private static string Shorten(string s) => s.Length <= 34 ? s : s[..31] + "...";
}
