using PlaneLateral.Output;

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
        Tables(report)[0].Text(),
    ];

    /// <summary>The CSV file of <see cref="Render"/> as the table it is written from.</summary>
    public static IReadOnlyList<CsvTableFile> Tables(ComparisonReport report) => [new("comparisons.csv", Table(report))];

    /// <summary>
    /// One row per comparison row and FE estimate (rank 1 the reference), the caution as the CSV's leading comment; the
    /// hand and FE values are in the row's own unit, named in "unit". Empty cells where a value does not apply.
    /// </summary>
    public static ResultTable Table(ComparisonReport r)
    {
        var rows = new List<IReadOnlyList<object>>();
        foreach (var row in r.Rows)
            for (int k = 0; k < row.Fe.Count; k++)
            {
                var fe = row.Fe[k];
                var verdict = k == 0 ? row.VerdictText : ComparisonRow.VerdictWords(ComparisonRow.Judge(fe.Value / row.Hand.Value, row.Tolerance), row.Quantity);
                rows.Add([row.CheckId, row.Kind, row.Subject, Quantity(row.Quantity), row.Unit, row.Hand.Method.Name, row.Hand.Value, k + 1, fe.Model, k == 0 ? "yes" : "no",
                    fe.Value, Opt(fe.EstimatedError), fe.Value / row.Hand.Value, Opt(row.Hand.FlexuralShare), Opt(row.Hand.ShearShare), Opt(fe.FlexuralShare),
                    Opt(fe.ShearShare), Opt(row.AspectRatio), row.Tolerance, verdict, k == 0 ? row.Cause : "(see the reference estimate, rank 1)", row.ReferenceBasis]);
            }
        return new ResultTable
        {
            Title = "Hand methods beside the FE model",
            Columns =
            [
                new("check", Kind: CellKind.Text), new("kind", Kind: CellKind.Text), new("subject", Kind: CellKind.Text), new("quantity", Kind: CellKind.Text),
                new("unit", Kind: CellKind.Text), new("hand method", Kind: CellKind.Text), new("hand value"), new("FE rank"), new("FE model", Kind: CellKind.Text),
                new("reference", Kind: CellKind.Text), new("FE value"), new("FE estimated error"), new("FE/hand"), new("hand flexural share"), new("hand shear share"),
                new("FE flexural share"), new("FE shear share"), new("h/l"), new("tolerance"), new("verdict", Kind: CellKind.Text), new("cause", Kind: CellKind.Text),
                new("reference basis", Kind: CellKind.Text),
            ],
            Rows = rows,
            Comments = [ComparisonReport.Caution],
        };
    }

    /// <summary>An optional number as a cell: the value, or null (an empty cell).</summary>
    private static object Opt(double? v) => v is double d ? d : null!;

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
