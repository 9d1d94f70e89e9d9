using System.Globalization;
using PlaneLateral.Hand;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>The sweep's outputs: sweep.csv and two figures (FE/hand stiffness ratio and shear share against h/l).</summary>
public static class SweepFiles
{
    /// <summary>The caution carried by every sweep output.</summary>
    public const string Caution = ComparisonReport.Caution;

    /// <summary>Below this h/l a pier is squat and plane sections are doubtful (common practice; docs/hand-methods.md §2).</summary>
    public const double SquatAspectRatio = 0.5;

    /// <summary>The sweep's file names, in the order <see cref="Render"/> and <see cref="Start"/> give the files.</summary>
    public const string CsvFileName = "sweep.csv", RatioFigureFileName = "sweep-ratio.png", ShearShareFigureFileName = "sweep-shear-share.png";

    /// <summary>File name → bytes of every sweep output, in a fixed order (<see cref="Start"/>, waited for).</summary>
    public static IReadOnlyList<(string Name, byte[] Bytes)> Render(SweepResult r, string producedBy) =>
        Start(r, producedBy).Select(f => (f.Name, f.Bytes.GetAwaiter().GetResult())).ToArray();

    /// <summary>
    /// Starts every sweep output on its own task and returns at once: file name → its bytes when ready, in the order of
    /// <see cref="Render"/> (sweep.csv, then the two figures). The figures are independent drawings, each on its own
    /// plot and surface (nothing of the drawing library is shared between them but its loaded code and fonts), so on
    /// two processors they are drawn at the same time, and a caller can write the CSV, or set its console text, while
    /// they draw. No file's bytes depend on the processors or the order the tasks ran in.
    /// </summary>
    public static IReadOnlyList<(string Name, Task<byte[]> Bytes)> Start(SweepResult r, string producedBy)
    {
        // The dearest first: the ratio figure (more curves), the shear-share figure, then the CSV (under a millisecond).
        var ratio = Task.Run(() => RatioFigure(r).Png);
        var share = Task.Run(() => ShearShareFigure(r).Png);
        var csv = Task.Run(() => OutputSet.Text(CsvFileName, Csv(r, producedBy)).Bytes);
        return [(CsvFileName, csv), (RatioFigureFileName, ratio), (ShearShareFigureFileName, share)];
    }

    /// <summary>
    /// The drawing library's first use — loading it and its native part, the font, compiling the drawing code — on a
    /// throw-away 200 × 150 figure of the kinds the sweep draws (lines, markers, a shaded band, vertical lines, a legend,
    /// hand-placed ticks). Run beside the points (<see cref="AspectSweep.Run(SweepSpec, IReadOnlyList{ISweepFeModel}, IProgress{int}?, int)"/>)
    /// it takes that one-time cost off the end of the run. It writes nothing and changes no figure drawn after it.
    /// </summary>
    public static void WarmUp()
    {
        var plot = PlotStyle.New("warm-up", "x [-]", "y [-]");
        double[] x = [0, 1, 2], y = [1, 0.5, 1];
        var band = plot.Add.VerticalSpan(0.9, 1.1);
        band.LegendText = "band";
        var sc = plot.Add.Scatter(x, y);
        sc.LinePattern = ScottPlot.LinePattern.Dashed;
        sc.MarkerShape = ScottPlot.MarkerShape.OpenSquare;
        sc.LegendText = "line";
        plot.Add.ScatterPoints(x, y).LegendText = "points";
        plot.Add.VerticalLine(0.5).LinePattern = ScottPlot.LinePattern.Dotted;
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual([new ScottPlot.Tick(0, "0", true), new ScottPlot.Tick(1, "", false)]);
        plot.Axes.SetLimits(-0.1, 2.1, 0, 1.2);
        plot.ShowLegend(ScottPlot.Edge.Bottom);
        _ = PlotStyle.Png(plot, 200, 150);
    }

    public static string EndsName(EndFixity e) => e == EndFixity.Cantilever ? "cantilever" : "fixed-fixed";

    private static string F(double v) => v.ToString("G12", CultureInfo.InvariantCulture);

    /// <summary>sweep.csv: the sweep's table written as CSV, its notes leading as comments.</summary>
    public static string Csv(SweepResult r, string producedBy) => Table(r, producedBy).ToCsv();

    /// <summary>
    /// One row per point (hand deflections for a unit force at the top, length per unit force), then for each FE model
    /// its stiffness, FE/hand, shear share, FE/hand against the flexure-only formula and estimated error; the notes
    /// (<see cref="Notes"/>) are the CSV's leading comments. A value a model does not give is an empty cell.
    /// </summary>
    public static ResultTable Table(SweepResult r, string producedBy)
    {
        var s = r.Spec;
        var u = s.Units;
        string len = u.LengthSymbol, k = u.Label(Quantity.TranslationalStiffness), flex = $"{len}/{u.ForceSymbol}";
        var columns = new List<TableColumn>
        {
            new("point"), new("ends", Kind: CellKind.Text), new("h/l"), new("height", len), new("hand flexural deflection", flex), new("hand shear deflection", flex),
            new("hand total deflection", flex), new("hand stiffness", k), new("hand flexural share"), new("hand shear share"),
        };
        for (int m = 0; m < r.FeModels.Count; m++)
            columns.AddRange([new($"fe{m + 1} stiffness", k), new($"fe{m + 1} FE/hand"), new($"fe{m + 1} shear share"), new($"fe{m + 1} FE/hand flexure only"), new($"fe{m + 1} estimated error")]);
        columns.Add(new("verdict", Kind: CellKind.Text));
        var rows = new List<IReadOnlyList<object>>();
        foreach (var p in r.Points)
        {
            var h = p.Hand;
            var row = new List<object> { p.Index + 1, EndsName(p.Ends), p.AspectRatio, p.Height, h.FlexuralDeflection, h.ShearDeflection, h.TotalDeflection, h.Stiffness, h.FlexuralShare, h.ShearShare };
            for (int m = 0; m < p.Fe.Count; m++)
            {
                var fe = p.Fe[m];
                double? err = m < p.FeErrors.Count ? p.FeErrors[m] : null;
                row.AddRange([fe.Value, fe.Value / h.Stiffness, fe.ShearShare is double sh ? sh : null!, fe.Value * h.FlexuralDeflection, err is double er ? er : null!]);
            }
            row.Add(ComparisonRow.VerdictWords(p.Verdict, ComparedQuantity.Stiffness));
            rows.Add(row);
        }
        return new ResultTable { Title = "Aspect-ratio sweep", Columns = columns, Rows = rows, Comments = Notes(r, producedBy) };
    }

    /// <summary>The sweep's notes (the caution first, then FE models, wall, hand method, tolerance, departures): the CSV's leading comment lines.</summary>
    public static IReadOnlyList<string> Notes(SweepResult r, string producedBy)
    {
        var s = r.Spec;
        var u = s.Units;
        string len = u.LengthSymbol;
        var notes = new List<string> { $"caution: {Caution}" };
        for (int m = 0; m < r.FeModels.Count; m++)
            notes.Add($"fe{m + 1}: {r.FeModels[m]}: {r.FeDescriptions[m]}");
        notes.Add($"wall: length {F(s.Length)} {len}, thickness {F(s.Thickness)} {len}; material {s.MaterialName}: E = {F(s.E)} {u.Label(Quantity.Stress)}, G = {F(s.G)} {u.Label(Quantity.Stress)}; shear form factor f = {F(s.FormFactor)}");
        if (s.Footing is { } ft)
            notes.Add($"footing: {ft.Words(u)}; the FE wall stands on its sliding and rocking springs, the hand pier formula keeps its fixed base, so FE/hand shows what ignoring the footing costs");
        if (s.Opening is { } o)
        {
            notes.Add($"opening: {o.Words} at every point (width {F(o.WidthFraction)} l, height {F(o.HeightFraction)} h, sill at {F((1 - o.HeightFraction) / 2)} h, left edge at {F((1 - o.WidthFraction) / 2)} l)");
            notes.Add($"hand: PerforatedWall, solid wall minus the strip holding the window plus its two piers in parallel, each piece P h^3/(3EI) or P h^3/(12EI) plus f P h/(AG) (Taly, Design of Reinforced Masonry Structures, ch. 7); hand flexural deflection = the same method without shear deformation (G = 1e12 E), hand shear deflection = total minus that");
        }
        else
            notes.Add($"hand: Piers.Rectangular, cantilever P h^3/(3EI) or fixed-fixed P h^3/(12EI) plus f P h/(AG), I = t l^3/12, A = t l (elementary beam theory with Timoshenko's shear term; Gere & Timoshenko, Mechanics of Materials)");
        notes.Add($"tolerance: |FE/hand - 1| <= {F(s.Tolerance)}; {producedBy}");
        foreach (var d in SweepDepartures.Find(r))
            notes.Add($"departure: {d.Words(s.From, s.To)}");
        return notes;
    }

    /// <summary>FE/hand stiffness against h/l, one curve per end condition and FE model, the tolerance band shaded.</summary>
    public static Figure RatioFigure(SweepResult r)
    {
        var s = r.Spec;
        bool log = s.Spacing == SweepSpacing.Geometric;
        var plot = PlotStyle.New(s.Opening is null ? "Wall stiffness: FE / hand against aspect ratio" : "Wall with a window: FE / perforated-wall method against aspect ratio", XLabel(s, log), "FE stiffness / hand stiffness [-]");
        var band = plot.Add.VerticalSpan(1 - s.Tolerance, 1 + s.Tolerance);
        band.FillStyle.Color = PlotStyle.Band.WithAlpha(0.8);
        band.LineStyle.Width = 0;
        band.LegendText = $"tolerance band ±{Pct(s.Tolerance)}";
        double lo = 1 - 2 * s.Tolerance, hi = 1 + 2 * s.Tolerance;
        int c = 0;
        var referenceColor = new Dictionary<EndFixity, ScottPlot.Color>();
        foreach (var ends in s.Ends)
        {
            var pts = r.Points.Where(p => p.Ends == ends).ToArray();
            double[] x = pts.Select(p => X(p.AspectRatio, log)).ToArray();
            for (int m = 0; m < r.FeModels.Count; m++)
            {
                double[] y = pts.Select(p => p.Fe[m].Value / p.Hand.Stiffness).ToArray();
                lo = Math.Min(lo, y.Min()); hi = Math.Max(hi, y.Max());
                var sc = plot.Add.Scatter(x, y);
                sc.Color = PlotStyle.Series[c % PlotStyle.Series.Length];
                sc.LineWidth = 2;
                sc.LinePattern = ends == EndFixity.Cantilever ? ScottPlot.LinePattern.Solid : ScottPlot.LinePattern.Dashed;
                sc.MarkerSize = 6;
                sc.MarkerShape = ends == EndFixity.Cantilever ? ScottPlot.MarkerShape.FilledCircle : ScottPlot.MarkerShape.OpenSquare;
                sc.LegendText = $"{EndsName(ends)}, {r.FeModels[m]}";
                if (m == 0) referenceColor[ends] = sc.Color;
                c++;
            }
        }
        // The reference against the flexure-only formula, and where each hand formula leaves the band.
        var departures = SweepDepartures.Find(r);
        foreach (var ends in s.Ends)
        {
            var pts = r.Points.Where(p => p.Ends == ends).ToArray();
            double[] x = pts.Select(p => X(p.AspectRatio, log)).ToArray();
            double[] y = pts.Select(p => SweepDepartures.Ratio(p, SweepHandFormula.FlexureOnly)).ToArray();
            lo = Math.Min(lo, y.Min()); hi = Math.Max(hi, y.Max());
            var sc = plot.Add.Scatter(x, y);
            sc.Color = PlotStyle.Series[c % PlotStyle.Series.Length];
            sc.LineWidth = 2;
            sc.LinePattern = ends == EndFixity.Cantilever ? ScottPlot.LinePattern.Solid : ScottPlot.LinePattern.Dashed;
            sc.MarkerSize = 6;
            sc.MarkerShape = ScottPlot.MarkerShape.FilledTriangleDown;
            sc.LegendText = $"{EndsName(ends)}, {r.FeModels[0]} / {(s.Opening is null ? "flexure-only formula" : "hand method without shear")}";
            foreach (var d in departures.Where(d => d.Ends == ends && d.Below is not null))
            {
                var v = plot.Add.VerticalLine(X(d.Below!.Value, log));
                v.Color = d.Formula == SweepHandFormula.FlexureOnly ? sc.Color : referenceColor[ends];
                v.LineWidth = 2;
                v.LinePattern = ScottPlot.LinePattern.DenselyDashed;
                v.LegendText = $"{EndsName(ends)}, {(d.Formula == SweepHandFormula.FlexureOnly ? "flexure only" : "flexure + shear")} departs below h/l = {d.Below.Value.ToString("0.00", CultureInfo.InvariantCulture)}";
            }
            c++;
        }
        SquatLine(plot, log);
        LogTicks(plot, s, log);
        plot.Axes.SetLimitsY(lo - 0.02, hi + 0.02);
        plot.ShowLegend(ScottPlot.Edge.Bottom);   // below the axes: the curves fill the whole plot area
        var png = PlotStyle.Png(plot);
        string departureWords = string.Join("; ", departures.Select(d => d.Words(s.From, s.To)));
        return new Figure(RatioFigureFileName, "FE/hand stiffness against h/l",
            s.Opening is null
            ? $"Ratio of each FE model's lateral stiffness to the hand pier formula (flexure + shear), and of the reference ({r.FeModels[0]}) to the flexure-only formula (triangles), {Describe(s)}. Shaded: the tolerance band 1 ± {Pct(s.Tolerance)}. Dotted line: h/l = {SquatAspectRatio}, below which plane sections are doubtful (common practice). Densely dashed lines: where a hand formula leaves the band. {departureWords}. Timoshenko line members follow the same beam theory as the hand formula, so their ratio is 1 to rounding: that checks the arithmetic, not the theory; the plane-stress panel shares none of its assumptions."
            : $"Ratio of each FE model's lateral stiffness to the perforated-wall method (flexure + shear), and of the reference ({r.FeModels[0]}) to the same method without shear deformation (triangles), {Describe(s)}. Shaded: the tolerance band 1 ± {Pct(s.Tolerance)}. Dotted line: h/l = {SquatAspectRatio} of the whole wall (common practice). Densely dashed lines: where a hand value leaves the band. {departureWords}. The equivalent frame lets the spandrels bend, where the hand method holds them rigid; the plane-stress panel shares neither model's assumptions.",
            png, PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>Shear share of the top deflection against h/l: hand formula as lines, FE models as markers.</summary>
    public static Figure ShearShareFigure(SweepResult r)
    {
        var s = r.Spec;
        bool log = s.Spacing == SweepSpacing.Geometric;
        var plot = PlotStyle.New("Shear share of the top deflection against aspect ratio", XLabel(s, log), "shear deflection / total deflection [%]");
        int c = 0;
        foreach (var ends in s.Ends)
        {
            var pts = r.Points.Where(p => p.Ends == ends).ToArray();
            double[] x = pts.Select(p => X(p.AspectRatio, log)).ToArray();
            var color = PlotStyle.Series[c % PlotStyle.Series.Length];
            var hand = plot.Add.Scatter(x, pts.Select(p => 100 * p.Hand.ShearShare).ToArray());
            hand.Color = color;
            hand.LineWidth = 2;
            hand.MarkerSize = 0;
            hand.LinePattern = ends == EndFixity.Cantilever ? ScottPlot.LinePattern.Solid : ScottPlot.LinePattern.Dashed;
            hand.LegendText = $"{EndsName(ends)}, hand formula";
            for (int m = 0; m < r.FeModels.Count; m++)
            {
                if (pts.Any(p => p.Fe[m].ShearShare is null)) continue;
                var fe = plot.Add.ScatterPoints(x, pts.Select(p => 100 * p.Fe[m].ShearShare!.Value).ToArray());
                fe.Color = color;
                fe.MarkerSize = 8;
                fe.MarkerShape = m == 0 ? ScottPlot.MarkerShape.OpenCircle : ScottPlot.MarkerShape.OpenTriangleUp;
                fe.LegendText = $"{EndsName(ends)}, {r.FeModels[m]}";
            }
            c++;
        }
        SquatLine(plot, log);
        LogTicks(plot, s, log);
        plot.Axes.SetLimitsY(0, 100);
        plot.ShowLegend(ScottPlot.Alignment.UpperRight);
        var png = PlotStyle.Png(plot);
        return new Figure(ShearShareFigureFileName, "Shear share against h/l",
            $"Share of the top deflection that comes from shear deformation, {Describe(s)}. Lines: the hand formula's f·Ph/(AG) term over the total; markers: the FE models (from a second solve without shear deformation).",
            png, PlotStyle.Width, PlotStyle.Height);
    }

    private static string XLabel(SweepSpec s, bool log)
    {
        string label = log ? "aspect ratio h/l [-], logarithmic scale" : "aspect ratio h/l [-]";
        return s.Opening is { } o
            ? $"{label}; centred window {o.WidthFraction.ToString("G4", CultureInfo.InvariantCulture)} l wide, {o.HeightFraction.ToString("G4", CultureInfo.InvariantCulture)} h high"
            : label;
    }

    private static double X(double aspect, bool log) => log ? Math.Log10(aspect) : aspect;

    /// <summary>On a logarithmic axis (geometric spacing): ticks at 1–9 × 10^k, labelled at 1, 2, 3, 5 × 10^k and at the range ends.</summary>
    private static void LogTicks(ScottPlot.Plot plot, SweepSpec s, bool log)
    {
        if (!log) return;
        var ticks = new List<ScottPlot.Tick>();
        for (int k = (int)Math.Floor(Math.Log10(s.From)); k <= (int)Math.Ceiling(Math.Log10(s.To)); k++)
            for (int m = 1; m <= 9; m++)
            {
                double v = m * Math.Pow(10, k);
                if (v < s.From * 0.999 || v > s.To * 1.001) continue;
                bool major = m is 1 or 2 or 3 or 5;
                ticks.Add(new ScottPlot.Tick(Math.Log10(v), major ? v.ToString("G4", CultureInfo.InvariantCulture) : "", major));
            }
        foreach (double end in new[] { s.From, s.To })
        {
            ticks.RemoveAll(t => Math.Abs(t.Position - Math.Log10(end)) < 1e-9);
            ticks.Add(new ScottPlot.Tick(Math.Log10(end), end.ToString("G4", CultureInfo.InvariantCulture), true));
        }
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks.OrderBy(t => t.Position).ToArray());
        double pad = 0.03 * (Math.Log10(s.To) - Math.Log10(s.From));
        plot.Axes.SetLimitsX(Math.Log10(s.From) - pad, Math.Log10(s.To) + pad);
    }

    private static void SquatLine(ScottPlot.Plot plot, bool log)
    {
        var v = plot.Add.VerticalLine(X(SquatAspectRatio, log));
        v.Color = PlotStyle.Slate;
        v.LineWidth = 1.5f;
        v.LinePattern = ScottPlot.LinePattern.Dotted;
        v.LegendText = $"h/l = {SquatAspectRatio} (squat below, common practice)";
    }

    private static string Describe(SweepSpec s)
    {
        var u = s.Units;
        return $"{(s.Opening is { } o ? $"wall with {o.Words}," : "solid wall")} l = {F(s.Length)} {u.LengthSymbol}, t = {F(s.Thickness)} {u.LengthSymbol}, {s.MaterialName} (E = {F(s.E)}, G = {F(s.G)} {u.Label(Quantity.Stress)}), f = {F(s.FormFactor)}{(s.Footing is { } ft ? $"; FE on {ft.Words(u)}" : "")}";
    }

    private static string Pct(double f) => (100 * f).ToString("0.#", CultureInfo.InvariantCulture) + "%";
}
