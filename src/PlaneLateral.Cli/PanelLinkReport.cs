using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The console table of links between frame nodes and panel edges (details in panel-links.csv, panel-link-checks.csv).</summary>
internal static class PanelLinkReport
{
    public static string Render(AnalysisResult r)
    {
        if (r.PanelLinks is not { } links) return "";
        var u = r.Model.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        var sb = new System.Text.StringBuilder("\nPanel links (frame node to panel edge, rigid and exact; force the link passes to the panel)\n");
        var t = new TextTable("case", "panel", "node", $"Fx [{fu}]", $"Fy [{fu}]", $"Mz [{mu}]").Numeric(3, 4, 5);
        foreach (var c in links.Cases)
            foreach (var f in c.Forces)
                t.Add(c.Id, f.Panel, r.Model.Nodes[f.Node].Id, TextTable.Num(u.FromSI(f.Fx, Quantity.Force)), TextTable.Num(u.FromSI(f.Fy, Quantity.Force)), TextTable.Num(u.FromSI(f.Mz, Quantity.Moment)));
        sb.Append(t.Render());
        double eta = links.Cases.Count == 0 ? 0 : links.Cases.Max(c => c.WholeBackwardError);
        double imbalance = links.Cases.Count == 0 ? 0 : links.Cases.Max(c => Math.Max(c.Whole.RelativeForceError, c.Whole.RelativeMomentError));
        double asym = links.Panels.Max(p => p.SymmetryError);
        sb.Append($"  whole (frame and panels): worst backward error {TextTable.Sci(eta)}, worst imbalance {TextTable.Sci(imbalance)}; condensed panel stiffness asymmetry {TextTable.Sci(asym)} before symmetrising.\n");
        return sb.ToString();
    }
}
