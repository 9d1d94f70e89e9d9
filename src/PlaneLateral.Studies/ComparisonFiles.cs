using System.Globalization;
using System.Text;
using Newtonsoft.Json;

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
        ("comparisons.json", Json(report, producedBy)),
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

    private static string Json(ComparisonReport r, string producedBy)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2, FloatFormatHandling = FloatFormatHandling.String })
        {
            w.WriteStartObject();
            w.WritePropertyName("producedBy"); w.WriteValue(producedBy);
            w.WritePropertyName("caution"); w.WriteValue(ComparisonReport.Caution);
            w.WritePropertyName("model");
            w.WriteStartObject();
            w.WritePropertyName("title"); w.WriteValue(r.ModelTitle);
            w.WritePropertyName("file"); w.WriteValue(r.ModelFile);
            w.WriteEndObject();
            w.WritePropertyName("units");
            w.WriteStartObject();
            w.WritePropertyName("force"); w.WriteValue(r.ForceUnit);
            w.WritePropertyName("length"); w.WriteValue(r.LengthUnit);
            w.WriteEndObject();
            w.WritePropertyName("defaultTolerance"); w.WriteValue(r.DefaultTolerance);
            w.WritePropertyName("verdicts"); w.WriteValue("ratio = FE/hand for the row's reference FE estimate (named in \"reference\", the first in \"fe\", with the reason in \"referenceBasis\": a converged plane-stress panel where the row has one, else the first line model); within tolerance when |ratio − 1| ≤ tolerance; below: the hand value is higher (hand stiffer), above: lower (hand softer)");
            w.WritePropertyName("rows");
            w.WriteStartArray();
            foreach (var row in r.Rows)
            {
                w.WriteStartObject();
                w.WritePropertyName("check"); w.WriteValue(row.CheckId);
                w.WritePropertyName("kind"); w.WriteValue(row.Kind);
                w.WritePropertyName("subject"); w.WriteValue(row.Subject);
                w.WritePropertyName("quantity"); w.WriteValue(Quantity(row.Quantity));
                w.WritePropertyName("unit"); w.WriteValue(row.Unit);
                w.WritePropertyName("hand");
                w.WriteStartObject();
                w.WritePropertyName("value"); w.WriteValue(row.Hand.Value);
                w.WritePropertyName("method"); w.WriteValue(row.Hand.Method.Name);
                w.WritePropertyName("source"); w.WriteValue(row.Hand.Method.Source);
                w.WritePropertyName("assumptions");
                w.WriteStartArray(); foreach (var a in row.Hand.Method.Assumptions) w.WriteValue(a); w.WriteEndArray();
                if (row.Hand.FlexuralShare is double hf) { w.WritePropertyName("flexuralShare"); w.WriteValue(hf); }
                if (row.Hand.ShearShare is double hs) { w.WritePropertyName("shearShare"); w.WriteValue(hs); }
                if (row.Hand.Detail.Length > 0)
                {
                    w.WritePropertyName("detail");
                    w.WriteStartArray(); foreach (var line in row.Hand.Detail.Split('\n')) w.WriteValue(line); w.WriteEndArray();
                }
                w.WriteEndObject();
                w.WritePropertyName("fe");
                w.WriteStartArray();
                foreach (var fe in row.Fe)
                {
                    w.WriteStartObject();
                    w.WritePropertyName("model"); w.WriteValue(fe.Model);
                    w.WritePropertyName("value"); w.WriteValue(fe.Value);
                    w.WritePropertyName("reference"); w.WriteValue(ReferenceEquals(fe, row.Reference));
                    w.WritePropertyName("ratioToHand"); w.WriteValue(fe.Value / row.Hand.Value);
                    if (fe.EstimatedError is double ee) { w.WritePropertyName("estimatedError"); w.WriteValue(ee); }
                    w.WritePropertyName("description"); w.WriteValue(fe.Description);
                    if (fe.FlexuralShare is double ff) { w.WritePropertyName("flexuralShare"); w.WriteValue(ff); }
                    if (fe.ShearShare is double fs) { w.WritePropertyName("shearShare"); w.WriteValue(fs); }
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WritePropertyName("reference"); w.WriteValue(row.Reference.Model);
                w.WritePropertyName("referenceBasis"); w.WriteValue(row.ReferenceBasis);
                w.WritePropertyName("ratio"); w.WriteValue(row.Ratio);
                if (row.AspectRatio is double ar) { w.WritePropertyName("aspectRatio"); w.WriteValue(ar); }
                w.WritePropertyName("tolerance"); w.WriteValue(row.Tolerance);
                w.WritePropertyName("verdict"); w.WriteValue(row.VerdictText);
                w.WritePropertyName("cause"); w.WriteValue(row.Cause);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }
}
