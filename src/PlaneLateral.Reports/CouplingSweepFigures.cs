using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>
/// The coupling sweep's figure: top deflection against coupling-beam depth for every model (closed forms, the two bounds,
/// the wide-column frames, the plane-stress panel), one figure per load (docs/coupled-walls.md).
/// </summary>
public static class CouplingSweepFigures
{
    /// <summary>The panel's colour: the palette has six, the figure seven series.</summary>
    private static readonly ScottPlot.Color Teal = ScottPlot.Color.FromHex("#0F7B74");

    /// <summary>File name of the figure for a load: coupling-sweep-uniform.png or coupling-sweep-top.png.</summary>
    public static string FileName(CoupledWallLoad load) => load == CoupledWallLoad.Uniform ? "coupling-sweep-uniform.png" : "coupling-sweep-top.png";

    /// <summary>Top deflection (model units) against beam depth: hand methods as lines, FE models as lines with markers.</summary>
    public static Figure Deflection(CoupledWallCheck c, CoupledWallLoad load, IReadOnlyList<CoupledWallStudy.SweepPoint> points, UnitSystem u)
    {
        string lu = u.LengthSymbol;
        string lname = load == CoupledWallLoad.Uniform ? "uniform load" : "top load";
        var plot = PlotStyle.New($"Coupled wall {c.Id}, {lname}: top deflection against beam depth", $"coupling-beam depth [{lu}]", $"top deflection [{lu}]");
        double[] x = points.Select(p => u.FromSI(p.BeamDepth, Quantity.Length)).ToArray();
        var series = new (string Name, Func<CoupledWallStudy.SweepPoint, double> Value, bool Fe)[]
        {
            ("independent cantilevers (hand)", p => p.Cantilevers, false),
            ("one solid wall (hand)", p => p.Solid, false),
            ("continuous medium (hand)", p => p.ClosedForm, false),
            ("continuous medium with beam shear (hand)", p => p.ClosedFormBeamShear, false),
            ("wide-column frame", p => p.FeShear, true),
            ("wide-column frame, no shear deformation", p => p.FeNoShear, true),
            (PanelCoupledWall.ModelName, p => p.FePanel, true),
        };
        double hi = 0;
        int k = 0;
        foreach (var (name, value, fe) in series)
        {
            double[] y = points.Select(p => u.FromSI(value(p), Quantity.Length)).ToArray();
            if (y.All(double.IsNaN)) { k++; continue; }
            hi = Math.Max(hi, y.Where(double.IsFinite).DefaultIfEmpty(0).Max());
            var sc = plot.Add.Scatter(x, y);
            sc.Color = k == 6 ? Teal : PlotStyle.Series[k % PlotStyle.Series.Length];
            sc.LineWidth = 2;
            sc.LinePattern = fe ? ScottPlot.LinePattern.Solid : ScottPlot.LinePattern.Dashed;
            sc.MarkerSize = fe ? 7 : 0;
            sc.MarkerShape = k == 6 ? ScottPlot.MarkerShape.FilledSquare : ScottPlot.MarkerShape.OpenCircle;
            sc.LegendText = name;
            k++;
        }
        plot.Axes.SetLimitsY(0, hi * 1.05);
        plot.ShowLegend(ScottPlot.Alignment.MiddleRight);
        var png = PlotStyle.Png(plot);
        return new Figure(FileName(load), $"Top deflection against beam depth, {lname}",
            $"Top deflection of coupled wall {c.Id} under the {lname} as the coupling beams deepen (everything else as the check gives it): hand methods dashed, FE models solid with markers; the plane-stress panel takes the uniform load as story forces at the floors (docs/coupled-walls.md §7).",
            png, PlotStyle.Width, PlotStyle.Height);
    }
}
