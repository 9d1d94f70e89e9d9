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
        // Each member's deflected shape between its nodes (MemberCurves: the element's shape functions); a span load can
        // move a point between the nodes more than any node, so the scale is set by the curves too.
        var curves = model.Members.Select(m => MemberCurves.Shape(model, c, m)).ToList();
        string where = model.Nodes.Count > 0 ? $"at node {model.Nodes[worst].Id}" : "";
        for (int k = 0; k < curves.Count; k++)
            foreach (var p in curves[k])
            {
                double d = Math.Sqrt(p.Dx * p.Dx + p.Dy * p.Dy);
                if (d > largest * (1 + 1e-9)) { largest = d; where = $"between the nodes of member {model.Members[k].Id}"; }
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
            var pts = curves[m.Index];
            var line = plot.Add.ScatterLine(pts.Select(p => L(p.X0 + scale * p.Dx)).ToArray(), pts.Select(p => L(p.Y0 + scale * p.Dy)).ToArray());
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
        DrawSupports(plot, model, 0.035 * L(size));
        string worstText = $"scale factor {F(scale, "G6")}; largest displacement {F(L(largest), "G4")} {u.LengthSymbol} {where}";
        var note = plot.Add.Annotation(worstText, Alignment.UpperLeft);
        note.LabelFontSize = 14;
        note.LabelBackgroundColor = Colors.White.WithAlpha(0.9);
        note.LabelBorderColor = PlotStyle.Slate;
        double pad = 0.12 * L(size);
        plot.Axes.SetLimits(L(xmin) - pad, L(xmax) + pad, L(ymin) - 0.8 * pad, L(ymax) + 1.5 * pad);
        plot.Axes.SquareUnits();
        plot.ShowLegend(Alignment.UpperRight);
        return new Figure($"shape-{Slug(caseId)}.png", $"Deflected shape, case {caseId}",
            $"Undeformed (dashed) and deflected (solid) shape under case {caseId}, displacements drawn {F(scale, "G6")} times their size; {worstText}. Each member is drawn as its own deflected shape between its nodes: the exact Timoshenko shape functions of its end displacements (cubic Hermite with the shear correction; Friedman & Kosmatka 1993, eq. 19), rigid zones moving rigidly, plus the fixed-end deflection under its span loads; axial-only members (braces, links) straight, in green. Supports in red by kind: fixed (ground line, hatched), pinned (triangle), roller (triangle on rollers), spring (zigzag; a circle for a rotational spring), other held sets (square).{(linked.Count > 0 ? " Wall panels linked to the frame are drawn by their edges and opening edges through the mesh nodes on them, displaced with the same scale (their bases are held)." : "")}",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>What a support is, for its symbol: the held set and the springs decide, not the file's type word.</summary>
    public static string SupportKind(Support s) => (s.RestrainX, s.RestrainY, s.RestrainRZ) switch
    {
        (true, true, true) => "fixed",
        (true, true, false) => "pinned",
        (false, true, false) => "roller-x",
        (true, false, false) => "roller-y",
        (false, false, false) => "spring",
        _ => "other",
    };

    /// <summary>Each support drawn by its kind at its node, symbols <paramref name="h"/> high (plot units); springs added to any kind.</summary>
    private static void DrawSupports(Plot plot, StructureModel model, double h)
    {
        var u = model.Units;
        double L(double si) => u.FromSI(si, Quantity.Length);
        var legend = new HashSet<string>(StringComparer.Ordinal);
        void Poly(double[] xs, double[] ys, string? label, float width = 2f)
        {
            var sl = plot.Add.ScatterLine(xs, ys);
            sl.Color = PlotStyle.Brick;
            sl.LineWidth = width;
            sl.MarkerSize = 0;
            if (label is not null && legend.Add(label)) sl.LegendText = label;
        }
        void Ground(double x, double y, string? label)   // a ground line at y with short hatching below it
        {
            Poly([x - 0.8 * h, x + 0.8 * h], [y, y], label, 2.5f);
            for (int k = 0; k < 5; k++)
            {
                double x0 = x - 0.8 * h + k * 0.4 * h;
                Poly([x0, x0 - 0.3 * h], [y, y - 0.3 * h], null, 1f);
            }
        }
        foreach (var s in model.Supports)
        {
            double x = L(model.Nodes[s.Node].X), y = L(model.Nodes[s.Node].Y);
            switch (SupportKind(s))
            {
                case "fixed":
                    Ground(x, y, "support, fixed");
                    break;
                case "pinned":
                    Poly([x, x - 0.5 * h, x + 0.5 * h, x], [y, y - h, y - h, y], "support, pinned");
                    Ground(x, y - h, null);
                    break;
                case "roller-x":
                    Poly([x, x - 0.5 * h, x + 0.5 * h, x], [y, y - 0.8 * h, y - 0.8 * h, y], "support, roller");
                    var rx = plot.Add.ScatterPoints(new[] { x - 0.25 * h, x + 0.25 * h }, new[] { y - 0.9 * h, y - 0.9 * h });
                    rx.Color = PlotStyle.Brick; rx.MarkerShape = MarkerShape.OpenCircle; rx.MarkerSize = 6;
                    Ground(x, y - h, null);
                    break;
                case "roller-y":
                    Poly([x, x - 0.8 * h, x - 0.8 * h, x], [y, y - 0.5 * h, y + 0.5 * h, y], "support, roller");
                    var ry = plot.Add.ScatterPoints(new[] { x - 0.9 * h, x - 0.9 * h }, new[] { y - 0.25 * h, y + 0.25 * h });
                    ry.Color = PlotStyle.Brick; ry.MarkerShape = MarkerShape.OpenCircle; ry.MarkerSize = 6;
                    Poly([x - h, x - h], [y - 0.8 * h, y + 0.8 * h], null, 2.5f);
                    break;
                case "other":
                    var sq = plot.Add.ScatterPoints(new[] { x }, new[] { y });
                    sq.Color = PlotStyle.Brick; sq.MarkerShape = MarkerShape.OpenSquare; sq.MarkerSize = 14;
                    if (legend.Add("support, other held set")) sq.LegendText = "support, other held set";
                    break;
            }
            // Springs: a zigzag along the spring's direction ending on a ground line; a circle for a rotational spring.
            if (s.SpringY > 0 && !s.RestrainY)
            {
                var xs = new List<double> { x }; var ys = new List<double> { y };
                for (int k = 1; k <= 6; k++) { xs.Add(x + (k % 2 == 0 ? -0.25 : 0.25) * h); ys.Add(y - k * 0.2 * h); }
                xs.Add(x); ys.Add(y - 1.4 * h);
                Poly(xs.ToArray(), ys.ToArray(), "support, spring", 1.5f);
                Ground(x, y - 1.4 * h, null);
            }
            if (s.SpringX > 0 && !s.RestrainX)
            {
                var xs = new List<double> { x }; var ys = new List<double> { y };
                for (int k = 1; k <= 6; k++) { xs.Add(x - k * 0.2 * h); ys.Add(y + (k % 2 == 0 ? -0.25 : 0.25) * h); }
                xs.Add(x - 1.4 * h); ys.Add(y);
                Poly(xs.ToArray(), ys.ToArray(), "support, spring", 1.5f);
                Poly([x - 1.4 * h, x - 1.4 * h], [y - 0.6 * h, y + 0.6 * h], null, 2.5f);
            }
            if (s.SpringRZ > 0 && !s.RestrainRZ)
            {
                var ci = plot.Add.ScatterPoints(new[] { x }, new[] { y });
                ci.Color = PlotStyle.Brick; ci.MarkerShape = MarkerShape.OpenCircle; ci.MarkerSize = 18;
                if (legend.Add("support, rotational spring")) ci.LegendText = "support, rotational spring";
            }
        }
    }

    /// <summary>An allowable drift more than this many times the largest drift is named, not drawn, so the drifts stay readable.</summary>
    public const double OffScale = 4;

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
            var used = rows.Where(x => x.Check == check).ToArray();
            double worst = used.Length == 0 ? 0 : used.Max(x => x.Ratio);
            bool drawn = !(worst > 0) || check.AllowedRatio <= OffScale * worst;
            if (drawn)
            {
                var limit = plot.Add.VerticalLine(100 * check.AllowedRatio);
                limit.Color = PlotStyle.Limit;
                limit.LineWidth = 2;
                limit.LinePattern = LinePattern.DenselyDashed;
                limit.LegendText = $"allowable Δa/h = {F(100 * check.AllowedRatio)}%";
                plot.Axes.SetLimitsX(0, 100 * Math.Max(check.AllowedRatio, worst) * 1.15);
            }
            else
            {
                plot.Axes.SetLimitsX(0, 100 * worst * 1.15);
                var note = plot.Add.Annotation($"allowable Δa/h = {F(100 * check.AllowedRatio)}% is off the scale: {F(check.AllowedRatio / worst, "0.0")} × the largest drift ratio ({F(100 * worst, "0.000")}%)", Alignment.LowerRight);
                note.LabelFontSize = 14;
                note.LabelBackgroundColor = Colors.White.WithAlpha(0.9);
                note.LabelBorderColor = PlotStyle.Limit;
            }
            caption = $"Amplified story drift ratio δ/h with δ = C_d·δe/I_e (C_d = {F(check.Cd)}, I_e = {F(check.Ie)}; ASCE 7-16 eq. 12.8-15), drawn over each story's height, " +
                (drawn ? $"beside the allowable Δa/h = {F(100 * check.AllowedRatio)}% ({check.LimitSource})."
                       : $"scaled to the drifts; the allowable Δa/h = {F(100 * check.AllowedRatio)}% ({check.LimitSource}) is {F(check.AllowedRatio / worst, "0.0")} times the largest ratio and off the scale, named on the plot.");
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
