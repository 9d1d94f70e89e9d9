using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The results files of links between frame nodes and panel edges (only when the model has links):
/// panel-links.csv (the force and moment each link passes from its frame node to the panel, per case) and
/// panel-link-checks.csv (the checks of the whole, frame and panels together, per case). Model units; the text
/// depends only on the input.
/// </summary>
public static class PanelLinkFiles
{
    public static IReadOnlyList<(string Name, string Text)> Render(AnalysisResult r) =>
        r.PanelLinks is null ? [] : [("panel-links.csv", Forces(r, r.PanelLinks)), ("panel-link-checks.csv", Checks(r, r.PanelLinks))];

    private static string F(double v) => v.ToString("G12", CultureInfo.InvariantCulture);

    private static string Csv(string s) => PlaneLateral.Output.CsvText.Cell(s);   // the one escaper (quoting, formula neutralising)

    private static string Forces(AnalysisResult r, PanelLinkResults links)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"panel,node,case,Fx [{u.ForceSymbol}],Fy [{u.ForceSymbol}],Mz [{u.Label(Quantity.Moment)}]\n");
        foreach (var c in links.Cases)
            foreach (var f in c.Forces)
                sb.Append($"{Csv(f.Panel)},{Csv(r.Model.Nodes[f.Node].Id)},{Csv(c.Id)},{F(u.FromSI(f.Fx, Quantity.Force))},{F(u.FromSI(f.Fy, Quantity.Force))},{F(u.FromSI(f.Mz, Quantity.Moment))}\n");
        return sb.ToString();
    }

    private static string Checks(AnalysisResult r, PanelLinkResults links)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol;
        var sb = new StringBuilder($"case,whole backward error,condensed backward error,applied Fx [{fu}],applied Fy [{fu}],reaction Fx [{fu}],reaction Fy [{fu}],relative force imbalance,relative moment imbalance\n");
        foreach (var c in links.Cases)
        {
            var e = c.Whole;
            sb.Append($"{Csv(c.Id)},{F(c.WholeBackwardError)},{F(c.CondensedBackwardError)},{F(u.FromSI(e.AppliedFx, Quantity.Force))},{F(u.FromSI(e.AppliedFy, Quantity.Force))},{F(u.FromSI(e.ReactionFx, Quantity.Force))},{F(u.FromSI(e.ReactionFy, Quantity.Force))},{F(e.RelativeForceError)},{F(e.RelativeMomentError)}\n");
        }
        return sb.ToString();
    }
}
