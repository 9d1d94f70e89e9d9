using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Units;
using ScottPlot;

namespace PlaneLateral.Reports;

/// <summary>The field a panel-mesh figure is coloured by.</summary>
public enum PanelField
{
    /// <summary>|u| = √(ux² + uy²) at the nodes, in the model's length unit.</summary>
    DisplacementMagnitude,
    /// <summary>The horizontal shear stress τxy at the nodes (Gauss-point values extrapolated and averaged, docs/panels.md), in the model's stress unit.</summary>
    ShearStress,
}

/// <summary>A panel-mesh figure and the colour range its colour bar spans (model units).</summary>
public sealed record PanelFigure(Figure Figure, double ColourMin, double ColourMax);

/// <summary>
/// Figures of a wall panel: the mesh drawn deformed (scale factor printed), every element outlined, openings left
/// blank with their undeformed outlines dashed, filled by a nodal field with a colour bar. Values in the model's units.
/// </summary>
public static class PanelPlots
{
    /// <summary>Most sub-cells drawn for the fill (each element is split into n × n cells coloured by the field interpolated at the cell's centre).</summary>
    public const int MaxCells = 24000;

    private static string F(double v, string fmt = "G4") => v.ToString(fmt, CultureInfo.InvariantCulture);

    /// <summary>The field at every mesh node, in the model's units.</summary>
    public static double[] FieldValues(PanelResult p, int caseIndex, PanelField field, UnitSystem u)
    {
        var c = p.Analysis.Cases[caseIndex];
        int n = p.Mesh.Mesh.NodeCount;
        return field switch
        {
            PanelField.DisplacementMagnitude => Enumerable.Range(0, n).Select(i => u.FromSI(Math.Sqrt(c.Ux[i] * c.Ux[i] + c.Uy[i] * c.Uy[i]), Quantity.Length)).ToArray(),
            _ => Enumerable.Range(0, n).Select(i => u.FromSI(c.NodalStress[i, 2], Quantity.Stress)).ToArray(),
        };
    }

    /// <summary>File name of a panel figure.</summary>
    public static string FileName(string panelId, string caseId, PanelField field) =>
        $"panel-{ModelPlots.Slug(panelId)}-{(field == PanelField.DisplacementMagnitude ? "displacement" : "shear-stress")}-{ModelPlots.Slug(caseId)}.png";

    // Parent coordinates of the element nodes: corners counter-clockwise from (−1, −1), then the mid-sides (between
    // corners 0–1, 1–2, 2–3, 3–0), then the centre, as the elements number them.
    private static readonly double[] Xi9 = [-1, 1, 1, -1, 0, 1, 0, -1, 0], Eta9 = [-1, -1, 1, 1, -1, 0, 1, 0, 0];

    /// <summary>Shape functions of the element at (ξ, η): bilinear for 4 nodes, biquadratic Lagrange for 9 (Zienkiewicz &amp; Taylor, vol. 1, §8.5).</summary>
    private static void Shape(int nodes, double xi, double eta, Span<double> n)
    {
        if (nodes == 4)
        {
            for (int a = 0; a < 4; a++) n[a] = 0.25 * (1 + Xi9[a] * xi) * (1 + Eta9[a] * eta);
            return;
        }
        static double Q(double p, double s) => p < 0 ? 0.5 * s * (s - 1) : p > 0 ? 0.5 * s * (s + 1) : 1 - s * s;
        for (int a = 0; a < 9; a++) n[a] = Q(Xi9[a], xi) * Q(Eta9[a], eta);
    }

    /// <summary>The mesh of panel <paramref name="p"/> under case <paramref name="caseIndex"/>, deformed and coloured by <paramref name="field"/>.</summary>
    public static PanelFigure Mesh(PanelResult p, int caseIndex, string caseId, PanelField field, UnitSystem u)
    {
        var mesh = p.Mesh.Mesh;
        var c = p.Analysis.Cases[caseIndex];
        var panel = p.Panel;
        double L(double si) => u.FromSI(si, Quantity.Length);
        var values = FieldValues(p, caseIndex, field, u);
        double min = values.Min(), max = values.Max();
        bool signed = field == PanelField.ShearStress;
        string unit = field == PanelField.DisplacementMagnitude ? u.LengthSymbol : u.Label(Quantity.Stress);
        string what = field == PanelField.DisplacementMagnitude ? "displacement magnitude |u|" : "shear stress τxy";

        double largest = 0;
        int worst = 0;
        for (int i = 0; i < mesh.NodeCount; i++)
        {
            double d = Math.Sqrt(c.Ux[i] * c.Ux[i] + c.Uy[i] * c.Uy[i]);
            if (d > largest) { largest = d; worst = i; }
        }
        double scale = ModelPlots.ScaleFactor(largest, Math.Max(panel.Length, panel.Height));
        double X(int i) => L(mesh.X[i] + scale * c.Ux[i]);
        double Y(int i) => L(mesh.Y[i] + scale * c.Uy[i]);

        var plot = PlotStyle.New($"Panel {panel.Id}, case {caseId}: {what}", $"x [{u.LengthSymbol}]", $"y [{u.LengthSymbol}]");
        IColormap map = signed ? new DivergingMap(min, max) : new SequentialMap();
        // Very small or large values get a power of ten in the colour bar's label, so its ticks stay short.
        double big = Math.Max(Math.Abs(min), Math.Abs(max));
        int power = big > 0 && (big < 1e-2 || big >= 1e4) ? (int)Math.Floor(Math.Log10(big)) : 0;
        var scaleAxis = new ColourAxis(map, min, max, Math.Pow(10, -power));

        // Fill: each element split into n × n cells, each coloured by the field at its centre.
        int nodes = mesh.Element.NodeCount;
        int sub = Math.Clamp((int)Math.Floor(Math.Sqrt(MaxCells / (double)Math.Max(1, mesh.Elements.Length))), 1, nodes == 9 ? 8 : 6);
        Span<double> nf = stackalloc double[9];
        foreach (var el in mesh.Elements)
        {
            (double X, double Y) At(double xi, double eta, Span<double> n)
            {
                Shape(nodes, xi, eta, n);
                double x = 0, y = 0;
                for (int a = 0; a < nodes; a++) { x += n[a] * X(el[a]); y += n[a] * Y(el[a]); }
                return (x, y);
            }
            for (int j = 0; j < sub; j++)
                for (int i = 0; i < sub; i++)
                {
                    double x0 = -1 + 2.0 * i / sub, x1 = -1 + 2.0 * (i + 1) / sub, y0 = -1 + 2.0 * j / sub, y1 = -1 + 2.0 * (j + 1) / sub;
                    Shape(nodes, 0.5 * (x0 + x1), 0.5 * (y0 + y1), nf);
                    double v = 0;
                    for (int a = 0; a < nodes; a++) v += nf[a] * values[el[a]];
                    var colour = scaleAxis.ColourOf(v);
                    var corners = new[] { At(x0, y0, nf), At(x1, y0, nf), At(x1, y1, nf), At(x0, y1, nf) };
                    var poly = plot.Add.Polygon(corners.Select(q => new Coordinates(q.X, q.Y)).ToArray());
                    poly.FillColor = colour;
                    poly.LineColor = colour;
                    poly.LineWidth = 0.6f;
                }
        }
        // Element outlines (through the mid-side nodes of a 9-node element).
        int[] ring = nodes == 9 ? [0, 4, 1, 5, 2, 6, 3, 7] : [0, 1, 2, 3];
        var edgeColour = Color.FromHex("#2B2B2B").WithAlpha(0.55);
        foreach (var el in mesh.Elements)
        {
            var poly = plot.Add.Polygon(ring.Select(a => new Coordinates(X(el[a]), Y(el[a]))).ToArray());
            poly.FillColor = Colors.Transparent;
            poly.LineColor = edgeColour;
            poly.LineWidth = 0.8f;
        }
        // Undeformed outline and openings, dashed.
        void Rect(double x, double y, double w, double h, string? legend)
        {
            var r = plot.Add.Scatter(new[] { L(x), L(x + w), L(x + w), L(x), L(x) }, new[] { L(y), L(y), L(y + h), L(y + h), L(y) });
            r.Color = PlotStyle.Slate;
            r.LineWidth = 1.2f;
            r.LinePattern = LinePattern.Dashed;
            r.MarkerSize = 0;
            if (legend is not null) r.LegendText = legend;
        }
        Rect(panel.X0, panel.Y0, panel.Length, panel.Height, "undeformed outline and openings");
        foreach (var o in panel.Openings) Rect(panel.X0 + o.Left, panel.Y0 + o.Bottom, o.Width, o.Height, null);
        var bar = plot.Add.ColorBar(scaleAxis);
        bar.Label = power == 0 ? $"{what} [{unit}]" : $"{what} [10{Superscript(power)} {unit}]";
        bar.LabelStyle.FontSize = 14;
        string note = $"displacements × {F(scale, "G6")}; largest |u| = {F(L(largest))} {u.LengthSymbol} at ({F(L(mesh.X[worst]))}, {F(L(mesh.Y[worst]))}) {u.LengthSymbol}";
        var ann = plot.Add.Annotation(note, Alignment.UpperLeft);
        ann.LabelFontSize = 13;
        ann.LabelBackgroundColor = Colors.White.WithAlpha(0.9);
        ann.LabelBorderColor = PlotStyle.Slate;
        double size = L(Math.Max(panel.Length, panel.Height));
        plot.Axes.SetLimits(L(panel.X0) - 0.08 * size, L(panel.X0 + panel.Length) + 0.25 * size, L(panel.Y0) - 0.06 * size, L(panel.Y0 + panel.Height) + 0.2 * size);
        plot.Axes.SquareUnits();
        plot.ShowLegend(Alignment.UpperRight);
        string element = mesh.Element.Name;
        string caption = field == PanelField.DisplacementMagnitude
            ? $"Panel {panel.Id} under case {caseId}: the mesh ({mesh.Elements.Length} elements, {element}) drawn with its displacements × {F(scale, "G6")}, filled by the displacement magnitude |u| = √(ux² + uy²) in {u.LengthSymbol} (colour range {F(min)} to {F(max)}); undeformed outline and openings dashed. {note}."
            : $"Panel {panel.Id} under case {caseId}: the deformed mesh (displacements × {F(scale, "G6")}) filled by the horizontal shear stress τxy in {unit} (colour range {F(min)} to {F(max)}, white at zero): nodal values extrapolated from the Gauss points and averaged over the elements at each node. At re-entrant opening corners and at the ends of the held base the values stand for singular stresses: read them as \"high here\", not as a value.";
        var fig = new Figure(FileName(panel.Id, caseId, field), $"Panel {panel.Id}, {what}, case {caseId}", caption, PlotStyle.Png(plot), PlotStyle.Width, PlotStyle.Height);
        return new PanelFigure(fig, min, max);
    }

    /// <summary>The colour axis a colour bar reads: a colour map over [min, max].</summary>
    /// <param name="barFactor">The colour bar shows the values times this factor (a power of ten named in its label).</param>
    private sealed class ColourAxis(IColormap map, double min, double max, double barFactor) : IHasColorAxis
    {
        public IColormap Colormap => map;
        public ScottPlot.Range GetRange() => new(min * barFactor, max * barFactor);
        public Color ColourOf(double v) => map.GetColor(max > min ? Math.Clamp((v - min) / (max - min), 0, 1) : 0.5);
    }

    private static string Superscript(int n) =>
        new(n.ToString(CultureInfo.InvariantCulture).Select(c => c == '-' ? '⁻' : "⁰¹²³⁴⁵⁶⁷⁸⁹"[c - '0']).ToArray());

    private static Color Mix(Color a, Color b, double t) => new(
        (byte)Math.Round(a.R + (b.R - a.R) * t), (byte)Math.Round(a.G + (b.G - a.G) * t), (byte)Math.Round(a.B + (b.B - a.B) * t));

    private static Color Ramp(Color[] stops, double t)
    {
        t = Math.Clamp(t, 0, 1) * (stops.Length - 1);
        int i = Math.Min((int)Math.Floor(t), stops.Length - 2);
        return Mix(stops[i], stops[i + 1], t - i);
    }

    /// <summary>Our sequential map for magnitudes: pale sand through ochre and brick to a dark plum.</summary>
    private sealed class SequentialMap : IColormap
    {
        private static readonly Color[] Stops = [Color.FromHex("#F4F0E2"), Color.FromHex("#E4C57A"), Color.FromHex("#C98434"), Color.FromHex("#A4452C"), Color.FromHex("#55223F")];
        public string Name => "PlaneLateral sand-brick";
        public Color GetColor(double position) => Ramp(Stops, position);
    }

    /// <summary>Our diverging map for signed values: ink blue for negative, near-white at zero, brick for positive; zero sits where it falls in [min, max].</summary>
    private sealed class DivergingMap(double min, double max) : IColormap
    {
        private static readonly Color[] Negative = [Color.FromHex("#F5F4F0"), Color.FromHex("#8FA8C4"), Color.FromHex("#1F3A5F")];
        private static readonly Color[] Positive = [Color.FromHex("#F5F4F0"), Color.FromHex("#DDA184"), Color.FromHex("#8E3220")];
        private readonly double _span = Math.Max(Math.Abs(min), Math.Abs(max));
        public string Name => "PlaneLateral ink-brick";
        public Color GetColor(double position)
        {
            double v = min + position * (max - min);
            double t = _span > 0 ? Math.Abs(v) / _span : 0;   // the same shade for the same |value| on both sides
            return Ramp(v < 0 ? Negative : Positive, t);
        }
    }
}
