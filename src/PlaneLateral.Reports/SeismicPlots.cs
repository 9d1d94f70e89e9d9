using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Units;
using ScottPlot;

namespace PlaneLateral.Reports;

/// <summary>Figures of the seismic block: story forces and story shear over the height; first- against second-order drift. Values from <see cref="SeismicResult"/>, in the model's units.</summary>
public static class SeismicPlots
{
    private static string F(double v, string fmt = "G4") => v.ToString(fmt, CultureInfo.InvariantCulture);

    /// <summary>File name of the story-force figure.</summary>
    public const string StoryForcesFile = "seismic-story-forces.png";

    /// <summary>File name of the first- against second-order drift figure.</summary>
    public const string DriftFile = "seismic-drift-orders.png";

    /// <summary>F_x at each level as a horizontal bar, the story shear V_x as a step over each story's height.</summary>
    public static Figure StoryForces(AnalysisResult r, SeismicResult sr)
    {
        var m = r.Model;
        var u = m.Units;
        var levels = m.Building.Levels;
        double L(double si) => u.FromSI(si, Quantity.Length);
        double Fo(double si) => u.FromSI(si, Quantity.Force);
        string caseId = m.Seismic!.CaseId;
        var plot = PlotStyle.New($"Story forces and story shear, case {caseId}", $"force [{u.ForceSymbol}]", $"elevation [{u.LengthSymbol}]");
        double top = L(levels[^1].Elevation), bottom = L(levels[0].Elevation);
        double barHeight = 0.18 * (top - bottom) / Math.Max(1, levels.Count - 1);
        var bars = new List<Bar>();
        for (int i = 1; i < levels.Count; i++)
        {
            double fx = Fo(sr.Forces.LevelForces[i]);
            bars.Add(new Bar { Position = L(levels[i].Elevation), Value = fx, Size = barHeight, FillColor = PlotStyle.Ochre, LineWidth = 0, Orientation = Orientation.Horizontal });
            var t = plot.Add.Text($"F_x = {F(fx)} {u.ForceSymbol}", 0, L(levels[i].Elevation) + 0.5 * barHeight);
            t.LabelFontSize = 13;
            t.LabelFontColor = Colors.Black;
            t.LabelAlignment = Alignment.LowerLeft;
            t.OffsetX = 2;
            t.OffsetY = -2;
        }
        var bp = plot.Add.Bars(bars);
        bp.Horizontal = true;
        var xs = new List<double>(); var ys = new List<double>();
        foreach (var s in sr.Stories.Stories)
        {
            xs.Add(Fo(s.Shear)); ys.Add(L(s.Bottom.Elevation));
            xs.Add(Fo(s.Shear)); ys.Add(L(s.Top.Elevation));
        }
        var shear = plot.Add.Scatter(xs.ToArray(), ys.ToArray());
        shear.Color = PlotStyle.Ink;
        shear.LineWidth = 2.5f;
        shear.MarkerSize = 0;
        shear.LegendText = "story shear V_x (by statics)";
        foreach (var s in sr.Stories.Stories)
        {
            var t = plot.Add.Text($"V_x = {F(Fo(s.Shear))} {u.ForceSymbol}", Fo(s.Shear), 0.5 * (L(s.Bottom.Elevation) + L(s.Top.Elevation)));
            t.LabelFontSize = 13;
            t.LabelFontColor = PlotStyle.Ink;
            t.LabelAlignment = Alignment.MiddleLeft;
            t.OffsetX = 6;
        }
        var legendBar = plot.Add.ScatterPoints(new double[] { double.NaN }, new double[] { double.NaN });
        legendBar.Color = PlotStyle.Ochre; legendBar.MarkerShape = MarkerShape.FilledSquare; legendBar.MarkerSize = 12; legendBar.LegendText = "level force F_x";
        double max = Math.Max(sr.Stories.Stories.Max(s => Math.Abs(Fo(s.Shear))), 1e-300);
        plot.Axes.SetLimits(0, 1.35 * max, bottom - 0.05 * (top - bottom), top + 0.12 * (top - bottom));
        plot.ShowLegend(Alignment.UpperRight);
        return new Figure(StoryForcesFile, $"Story forces, case {caseId}",
            $"Equivalent lateral force F_x at each level (bars; ASCE 7-16 §12.8.3, k = {F(sr.Forces.Exponent, "0.000")}) and the story shear V_x below each level over the story's height (line), in {u.ForceSymbol}; base shear V = {F(Fo(sr.Forces.BaseShear))} {u.ForceSymbol}.",
            PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }

    /// <summary>
    /// First- and second-order drift ratio over each story's height, with θ printed per story: the amplified ratio
    /// C_d·δ/(I_e·h) of the drift check that names the story-force case (and its allowable line) when there is one,
    /// else the elastic ratio δ/h.
    /// </summary>
    public static Figure SecondOrderDrift(AnalysisResult r, SeismicResult sr, BuildingResult b)
    {
        var m = r.Model;
        var u = m.Units;
        double L(double si) => u.FromSI(si, Quantity.Length);
        string caseId = m.Seismic!.CaseId;
        var check = m.Building.DriftChecks.FirstOrDefault(c => c.Cases.Contains(caseId));
        var firstRows = check is null ? null : b.DriftChecks.Where(d => d.Check == check && d.CaseId == caseId).ToList();
        var secondRows = check is null ? null : sr.SecondOrderDriftChecks.Where(d => d.Check == check).ToList();
        string title = check is null ? $"First- and second-order drift, case {caseId}" : $"First- and second-order drift, check '{check.Id}'";
        var plot = PlotStyle.New(title, check is null ? "elastic drift ratio δ/h [%]" : "amplified drift ratio Cd·δ/(Ie·h) [%]", $"elevation [{u.LengthSymbol}]");
        double[] Ratio(bool second) => sr.Stability.Select(x => check is null
            ? 100 * Math.Abs(second ? x.SecondOrderDrift : x.ElasticDrift) / x.Story.Height
            : 100 * (second ? secondRows! : firstRows!).First(d => d.Story.Index == x.Story.Index).Ratio).ToArray();
        double worst = 0;
        foreach (bool second in new[] { false, true })
        {
            var ratio = Ratio(second);
            var xs = new List<double>(); var ys = new List<double>();
            for (int i = 0; i < sr.Stability.Count; i++)
            {
                var s = sr.Stability[i].Story;
                xs.Add(ratio[i]); ys.Add(L(s.Bottom.Elevation));
                xs.Add(ratio[i]); ys.Add(L(s.Top.Elevation));
                worst = Math.Max(worst, ratio[i]);
            }
            var sc = plot.Add.Scatter(xs.ToArray(), ys.ToArray());
            sc.Color = second ? PlotStyle.Brick : PlotStyle.Ink;
            sc.LineWidth = 2.5f;
            sc.LinePattern = second ? LinePattern.Dashed : LinePattern.Solid;
            sc.MarkerSize = 0;
            sc.LegendText = second ? "second order, (K + K_G)·u = f" : "first order, K·u = f";
        }
        double limit = check?.AllowedRatio * 100 ?? 0;
        // The drift is drawn to its own scale: an allowable line far to the right would squeeze the two curves,
        // whose difference is the point of the figure, into a sliver. It is then named in the legend only.
        bool limitOnScale = check is not null && limit <= 3 * worst;
        double xmax = 1.3 * (limitOnScale ? Math.Max(worst, limit) : worst);
        if (check is not null)
        {
            var line = plot.Add.VerticalLine(limit);
            line.Color = PlotStyle.Limit;
            line.LineWidth = 2;
            line.LinePattern = LinePattern.DenselyDashed;
            line.LegendText = limitOnScale ? $"allowable Δa/h = {F(limit)}%" : $"allowable Δa/h = {F(limit)}% (beyond this scale)";
        }
        var second2 = Ratio(true);
        for (int i = 0; i < sr.Stability.Count; i++)
        {
            var x = sr.Stability[i];
            var t = plot.Add.Text($"story {x.Story.Index}: θ = {F(x.Theta, "0.0000##")}, 2nd/1st = {F(x.Ratio, "0.000")}", second2[i], 0.5 * (L(x.Story.Bottom.Elevation) + L(x.Story.Top.Elevation)));
            t.LabelFontSize = 13;
            t.LabelFontColor = PlotStyle.Brick;
            t.LabelAlignment = Alignment.MiddleLeft;
            t.OffsetX = 8;
        }
        var levels = m.Building.Levels;
        double top = L(levels[^1].Elevation), bottom = L(levels[0].Elevation);
        plot.Axes.SetLimits(0, xmax * 1.35, bottom - 0.04 * (top - bottom), top + 0.16 * (top - bottom));
        plot.ShowLegend(Alignment.UpperRight);
        string caption = check is null
            ? $"Elastic drift ratio δ/h of case {caseId} from the first-order and the second-order analysis, over each story's height, with θ (ASCE 7-16 §12.8.7) and the ratio of second- to first-order drift per story."
            : $"Amplified drift ratio δ/h, δ = C_d·δe/I_e (C_d = {F(check.Cd)}, I_e = {F(check.Ie)}; ASCE 7-16 eq. 12.8-15), of case {caseId} from the first-order and the second-order analysis, beside the allowable Δa/h = {F(limit)}% ({check.LimitSource}); θ (§12.8.7) and the ratio of second- to first-order drift printed per story.";
        return new Figure(DriftFile, title, caption, PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
    }
}
