using System.Globalization;
using System.Text;

namespace PlaneLateral.Studies;

/// <summary>
/// Renders a <see cref="ComparisonReport"/> as comparisons.json (everything, each hand value with its method's name,
/// source and assumptions) and comparisons.csv (one line per row and FE estimate). The text depends only on the
/// report, so the same model gives byte-identical files.
/// </summary>
public static class ComparisonFiles
{
    public static IReadOnlyList<(string Name, string Text)> Render(ComparisonReport report, string producedBy) =>
    [
        ("comparisons.json", PlaneLateral.Output.TypedJson.Write(Document(report, producedBy))),
        ("comparisons.csv", Csv(report)),
    ];

    private static string F(double v) => v.ToString("G12", CultureInfo.InvariantCulture);

    private static string CsvCell(string s) => PlaneLateral.Output.CsvText.Cell(s);   // the one escaper (quoting, formula neutralising)

    private static string Csv(ComparisonReport r)
    {
        // The caution leads as a comment line; the hand and FE values are in the row's own unit, named in "unit".
        var sb = new StringBuilder(PlaneLateral.Output.CsvText.Comment(ComparisonReport.Caution));
        sb.Append("check,kind,subject,quantity,unit,hand method,hand value,FE rank,FE model,reference,FE value,FE estimated error,FE/hand,hand flexural share,hand shear share,FE flexural share,FE shear share,h/l,tolerance,verdict,cause,reference basis\n");
        foreach (var row in r.Rows)
            for (int k = 0; k < row.Fe.Count; k++)
            {
                var fe = row.Fe[k];
                string Opt(double? v) => v is double d ? F(d) : "";
                var verdict = k == 0 ? row.VerdictText : ComparisonRow.VerdictWords(ComparisonRow.Judge(fe.Value / row.Hand.Value, row.Tolerance), row.Quantity);
                sb.Append(string.Join(",", new[]
                {
                    CsvCell(row.CheckId), row.Kind, CsvCell(row.Subject), Quantity(row.Quantity), CsvCell(row.Unit), CsvCell(row.Hand.Method.Name), F(row.Hand.Value),
                    (k + 1).ToString(CultureInfo.InvariantCulture), CsvCell(fe.Model), k == 0 ? "yes" : "no", F(fe.Value), Opt(fe.EstimatedError), F(fe.Value / row.Hand.Value),
                    Opt(row.Hand.FlexuralShare), Opt(row.Hand.ShearShare), Opt(fe.FlexuralShare), Opt(fe.ShearShare), Opt(row.AspectRatio),
                    F(row.Tolerance), verdict, CsvCell(k == 0 ? row.Cause : "(see the reference estimate, rank 1)"), CsvCell(row.ReferenceBasis),
                })).Append('\n');
            }
        return sb.ToString();
    }

    private static string Quantity(ComparedQuantity q) => q switch
    {
        ComparedQuantity.Stiffness => "lateral stiffness", ComparedQuantity.Fraction => "fraction", ComparedQuantity.Force => "force", _ => "story shear",
    };

    /// <summary>comparisons.json as a typed document.</summary>
    public static ComparisonsDocument Document(ComparisonReport r, string producedBy) => new(
        producedBy,
        ComparisonReport.Caution,
        new ComparisonsModel(r.ModelTitle, r.ModelFile),
        new ComparisonsUnits(r.ForceUnit, r.LengthUnit),
        r.DefaultTolerance,
        "ratio = FE/hand for the row's reference FE estimate (named in \"reference\", the first in \"fe\", with the reason in \"referenceBasis\": a converged plane-stress panel where the row has one, else the first line model); within tolerance when |ratio − 1| ≤ tolerance; below: the hand value is higher (hand stiffer), above: lower (hand softer)",
        r.Rows.Select(row => new ComparisonsRow(
            row.CheckId, row.Kind, row.Subject, Quantity(row.Quantity), row.Unit,
            new ComparisonsHand(row.Hand.Value, row.Hand.Method.Name, row.Hand.Method.Source, row.Hand.Method.Assumptions,
                row.Hand.FlexuralShare, row.Hand.ShearShare, row.Hand.Detail.Length > 0 ? row.Hand.Detail.Split('\n') : null),
            row.Fe.Select(fe => new ComparisonsFe(fe.Model, fe.Value, ReferenceEquals(fe, row.Reference), fe.Value / row.Hand.Value,
                fe.EstimatedError, fe.Description, fe.FlexuralShare, fe.ShearShare)),
            row.Reference.Model, row.ReferenceBasis, row.Ratio, row.AspectRatio, row.Tolerance, row.VerdictText, row.Cause)));
}
