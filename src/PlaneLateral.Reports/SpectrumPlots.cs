using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;
using ScottPlot;

namespace PlaneLateral.Reports;

/// <summary>
/// Figures of the modal response spectrum analysis: the design spectrum with the modal periods marked (for a planar
/// model or a building: it takes the spectrum and a list of periods), the mode shapes over the height, and the story
/// shear of the equivalent lateral forces beside the modal one (combined, and scaled). Values from Core, model units.
/// </summary>
public static class SpectrumPlots
{
    private static string F(double v, string fmt = "G4") => v.ToString(fmt, CultureInfo.InvariantCulture);

    /// <summary>File names of the three figures.</summary>
    public const string SpectrumFile = "spectrum-periods.png", ShapesFile = "spectrum-mode-shapes.png", ShearFile = "spectrum-story-shear.png";

    /// <summary>Periods marked on the spectrum at most (longest first); the rest are named in the caption.</summary>
    public const int MaxMarkedPeriods = 12;

    /// <summary>
    /// S_a(T) of <paramref name="spectrum"/> from T = 0 to beyond the longest period, with each of
    /// <paramref name="periods"/> (s) marked by a dot on the curve and a dashed line down to the axis.
    /// </summary>
    /// <param name="labels">A label per period (e.g. "1", "2 (y)"); the mode numbers 1, 2, … when null.</param>
    public static Figure Spectrum(DesignSpectrum spectrum, IReadOnlyList<double> periods, IReadOnlyList<string>? labels = null, string fileName = SpectrumFile)
    {
        labels ??= periods.Select((_, i) => (i + 1).ToString(CultureInfo.InvariantCulture)).ToList();
        double longest = periods.Count > 0 ? periods.Max() : 1;
        double tEnd = Math.Max(1.25 * longest, spectrum.FromTable ? spectrum.Points[^1].T : Math.Max(2.5 * spectrum.TS, 3.0));
        var ts = new SortedSet<double>(Enumerable.Range(0, 401).Select(i => tEnd * i / 400.0));
        if (!spectrum.FromTable) { ts.Add(spectrum.T0); ts.Add(spectrum.TS); if (spectrum.TL < tEnd) ts.Add(spectrum.TL); }
        else foreach (var p in spectrum.Points.Where(p => p.T <= tEnd)) ts.Add(p.T);
        var xs = ts.ToArray();
        var ys = xs.Select(spectrum.Sa).ToArray();
        var plot = PlotStyle.New("Design spectrum and the modal periods", "period T [s]", "spectral acceleration S_a [g]");
        var curve = plot.Add.Scatter(xs, ys);
        curve.Color = PlotStyle.Ink;
        curve.LineWidth = 2.5f;
        curve.MarkerSize = 0;
        curve.LegendText = spectrum.FromTable ? "S_a(T), the given points, linear between" : "S_a(T), ASCE 7-16 §11.4.6";
        double top = ys.Max();
        var marked = periods.Select((t, i) => (t, i)).OrderByDescending(x => x.t).Take(MaxMarkedPeriods).ToList();
        var labelled = new List<double>();   // periods whose label is drawn: a label closer than 4 % of the axis to one would overprint it
        int unlabelled = 0;
        foreach (var (t, i) in marked)
        {
            double sa = spectrum.Sa(t);
            var line = plot.Add.Line(t, 0, t, sa);
            line.Color = PlotStyle.Brick;
            line.LineWidth = 1.2f;
            line.LinePattern = LinePattern.Dashed;
            var dot = plot.Add.ScatterPoints(new[] { t }, new[] { sa });
            dot.Color = PlotStyle.Brick;
            dot.MarkerShape = MarkerShape.FilledCircle;
            dot.MarkerSize = 9;
            if (labelled.Any(x => Math.Abs(x - t) < 0.04 * tEnd)) { unlabelled++; continue; }
            labelled.Add(t);
            var label = plot.Add.Text($"{labels[i]}: {F(t, "0.000")} s", t, sa);
            label.LabelFontSize = 12;
            label.LabelFontColor = PlotStyle.Brick;
            label.LabelAlignment = Alignment.LowerLeft;
            label.LabelRotation = -45;
            label.OffsetX = 4;
            label.OffsetY = -4;
        }
        var legendDot = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
        legendDot.Color = PlotStyle.Brick; legendDot.MarkerShape = MarkerShape.FilledCircle; legendDot.MarkerSize = 9; legendDot.LegendText = "modal periods";
        plot.Axes.SetLimits(0, tEnd, 0, 1.3 * top);
        plot.ShowLegend(Alignment.UpperRight);
        string rest = (periods.Count > marked.Count ? $" The {periods.Count - marked.Count} shortest of the {periods.Count} periods are not marked." : "") +
            (unlabelled > 0 ? $" {unlabelled} marked period(s) too close to a longer one to label legibly are dotted without a label (the modal table lists every period)." : "");
        return new Figure(fileName, "Design spectrum with the modal periods",
            $"{spectrum.Describe()}; S_a for 5 % damping as given. Each mode's period is marked on the curve (label: mode, period).{rest}",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>The mode shapes of a planar model over the height (level displacement of each mode, largest 1).</summary>
    public static Figure ModeShapes(StructureModel model, PlanarSpectrumResult s)
    {
        var u = model.Units;
        var levels = model.Building.Levels;
        double L(double si) => u.FromSI(si, Quantity.Length);
        var plot = PlotStyle.New("Mode shapes", "level displacement of the mode (largest 1)", $"elevation [{u.LengthSymbol}]");
        var zs = levels.Select(l => L(l.Elevation)).ToArray();
        for (int k = 0; k < s.Shapes.Count; k++)
        {
            var sc = plot.Add.Scatter(s.Shapes[k].ToArray(), zs);
            sc.Color = PlotStyle.Series[k % PlotStyle.Series.Length];
            sc.LineWidth = 2.2f;
            sc.MarkerSize = 7;
            sc.LinePattern = k < PlotStyle.Series.Length ? LinePattern.Solid : LinePattern.Dashed;
            sc.LegendText = $"mode {s.Modes[k].Mode}: T = {F(s.Modes[k].Period, "0.000")} s, {F(100 * s.Modes[k].Share, "0.0")} % of the mass";
        }
        var axis = plot.Add.VerticalLine(0);
        axis.Color = PlotStyle.Slate;
        axis.LineWidth = 1;
        double bottom = zs[0], topZ = zs[^1];
        plot.Axes.SetLimits(-1.15, 2.7, bottom - 0.04 * (topZ - bottom), topZ + 0.08 * (topZ - bottom));
        plot.ShowLegend(Alignment.UpperRight);
        return new Figure(ShapesFile, "Mode shapes",
            $"The {s.Shapes.Count} modes combined, each drawn as its level displacements scaled so that the largest is 1 (the sign of a mode is arbitrary); lumped level masses on the diaphragm DOFs, the stiffness condensed exactly onto them.",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>Story shear over the height: the equivalent lateral forces, the combined modal shear, and the modal shear scaled to the ELF base shear.</summary>
    public static Figure StoryShears(StructureModel model, PlanarSpectrumResult s)
    {
        var u = model.Units;
        var levels = model.Building.Levels;
        double L(double si) => u.FromSI(si, Quantity.Length);
        double Fo(double si) => u.FromSI(si, Quantity.Force);
        var plot = PlotStyle.New("Story shear: equivalent lateral forces and modal", $"story shear [{u.ForceSymbol}]", $"elevation [{u.LengthSymbol}]");
        var series = new (Func<SpectrumStoryRow, double> Value, string Text, Color Color, LinePattern Pattern)[]
        {
            (x => x.ElfShear, "equivalent lateral forces (§12.8)", PlotStyle.Ink, LinePattern.Solid),
            (x => x.ModalShear, "modal, combined per story (reduced by R/I_e)", PlotStyle.Moss, LinePattern.Dashed),
            (x => x.ScaledShear, $"modal, scaled × {F(s.Scaling.ForceFactor, "0.000")} (§12.9.1.4)", PlotStyle.Brick, LinePattern.DenselyDashed),
        };
        double max = 0;
        foreach (var (value, text, color, pattern) in series)
        {
            var xs = new List<double>(); var ys = new List<double>();
            foreach (var st in s.Stories)
            {
                double v = Fo(value(st));
                xs.Add(v); ys.Add(L(levels[st.Story - 1].Elevation));
                xs.Add(v); ys.Add(L(levels[st.Story].Elevation));
                max = Math.Max(max, v);
            }
            var sc = plot.Add.Scatter(xs.ToArray(), ys.ToArray());
            sc.Color = color;
            sc.LineWidth = 2.5f;
            sc.LinePattern = pattern;
            sc.MarkerSize = 0;
            sc.LegendText = text;
        }
        double bottom = L(levels[0].Elevation), top = L(levels[^1].Elevation);
        plot.Axes.SetLimits(0, 1.35 * Math.Max(max, 1e-300), bottom - 0.04 * (top - bottom), top + 0.2 * (top - bottom));
        plot.ShowLegend(Alignment.UpperRight);
        return new Figure(ShearFile, "Story shear, ELF beside the modal analysis",
            $"Story shear over each story's height in {u.ForceSymbol}: the equivalent lateral forces (V = {F(Fo(s.Scaling.BaseShearElf))}), the modal story shear combined mode by mode ({s.Settings.Rule.ToString().ToUpperInvariant()}, V_t = {F(Fo(s.Scaling.BaseShearModal))}), and the modal shear after the force scaling: {s.Scaling.Why}.",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }
}
