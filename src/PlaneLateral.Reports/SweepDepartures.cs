using System.Globalization;
using PlaneLateral.Hand;

namespace PlaneLateral.Reports;

/// <summary>A hand formula of the sweep, judged against the reference FE model.</summary>
public enum SweepHandFormula
{
    /// <summary>The flexural term alone: P h³/(3EI) cantilever, P h³/(12EI) fixed-fixed.</summary>
    FlexureOnly,
    /// <summary>Flexure plus Timoshenko's shear term f·P h/(AG): the pier formula.</summary>
    FlexureAndShear,
}

/// <summary>
/// Where a hand formula leaves the tolerance band of the reference FE model, for one end condition.
/// </summary>
/// <param name="Below">The h/l below which the formula departs by more than the tolerance (interpolated between the two
/// points that bracket the crossing), or null when it does not cross inside the range (see <see cref="WholeRange"/>).</param>
/// <param name="WholeRange">True: the formula departs already at the slenderest point (it departs over the whole range).
/// False with <see cref="Below"/> null: within the tolerance over the whole range.</param>
public sealed record SweepDeparture(EndFixity Ends, SweepHandFormula Formula, double? Below, bool WholeRange, string ReferenceModel, double Tolerance)
{
    /// <summary>True: the hand values are the perforated-wall method's (a wall with a window), not the pier formula's.</summary>
    public bool Perforated { get; init; }

    public string FormulaName => Perforated
        ? (Formula == SweepHandFormula.FlexureOnly ? "perforated-wall method without shear deformation" : "perforated-wall method, flexure + shear")
        : Formula == SweepHandFormula.FlexureOnly
        ? (Ends == EndFixity.Cantilever ? "flexure only, P h^3/(3EI)" : "flexure only, P h^3/(12EI)")
        : (Ends == EndFixity.Cantilever ? "flexure + shear, P h^3/(3EI) + f P h/(AG)" : "flexure + shear, P h^3/(12EI) + f P h/(AG)");

    /// <summary>One plain sentence, e.g. "cantilever, flexure only: departs from the plane-stress panel by more than 10% below h/l = 2.55".</summary>
    public string Words(double from, double to)
    {
        string head = $"{SweepFiles.EndsName(Ends)}, {FormulaName}: ";
        string pct = (100 * Tolerance).ToString("0.#", CultureInfo.InvariantCulture) + "%";
        if (Below is double b) return head + $"departs from the {ReferenceModel} by more than {pct} below h/l = {b.ToString("0.00", CultureInfo.InvariantCulture)}";
        if (WholeRange) return head + $"departs from the {ReferenceModel} by more than {pct} over the whole range (already at h/l = {to.ToString("G4", CultureInfo.InvariantCulture)})";
        return head + $"within {pct} of the {ReferenceModel} over the whole range (down to h/l = {from.ToString("G4", CultureInfo.InvariantCulture)})";
    }
}

/// <summary>
/// For each end condition and hand formula, the h/l below which the formula departs from the sweep's reference FE model
/// (the first) by more than the tolerance: scanning from the slenderest point down, the first point outside the band
/// and the one above it bracket the crossing of |FE/hand − 1| = tolerance, found by linear interpolation of
/// |FE/hand − 1| in the plotted axis (h/l, or log h/l for geometric spacing). A formula that comes back into the band
/// at lower h/l is still reported at its first departure from above.
/// </summary>
public static class SweepDepartures
{
    public static IReadOnlyList<SweepDeparture> Find(SweepResult r)
    {
        var s = r.Spec;
        bool log = s.Spacing == SweepSpacing.Geometric;
        var list = new List<SweepDeparture>();
        foreach (var ends in s.Ends)
        {
            var pts = r.Points.Where(p => p.Ends == ends).OrderBy(p => p.AspectRatio).ToArray();
            foreach (var formula in new[] { SweepHandFormula.FlexureOnly, SweepHandFormula.FlexureAndShear })
            {
                double Excess(SweepPoint p) => Math.Abs(Ratio(p, formula) - 1) - s.Tolerance;
                double? below = null;
                bool whole = Excess(pts[^1]) > 0;
                if (!whole)
                    for (int i = pts.Length - 2; i >= 0; i--)
                    {
                        double e0 = Excess(pts[i]);
                        if (!(e0 > 0)) continue;
                        double e1 = Excess(pts[i + 1]);   // ≤ 0: inside the band
                        double x0 = X(pts[i].AspectRatio, log), x1 = X(pts[i + 1].AspectRatio, log);
                        double x = x0 + (x1 - x0) * e0 / (e0 - e1);
                        below = log ? Math.Pow(10, x) : x;
                        break;
                    }
                list.Add(new SweepDeparture(ends, formula, below, whole, r.FeModels[0], s.Tolerance) { Perforated = s.Opening is not null });
            }
        }
        return list;
    }

    /// <summary>Reference FE stiffness over the hand formula's stiffness at a point.</summary>
    public static double Ratio(SweepPoint p, SweepHandFormula formula) =>
        p.Fe[0].Value / (formula == SweepHandFormula.FlexureOnly ? p.HandFlexuralStiffness : p.Hand.Stiffness);

    private static double X(double aspect, bool log) => log ? Math.Log10(aspect) : aspect;
}
