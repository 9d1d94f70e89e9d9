using PlaneLateral.Analysis;
using PlaneLateral.Output;
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
        sb.Append(TableView.Render(PanelLinkFiles.ForcesTable(r, links), ["case", "panel", "node", "Fx", "Fy", "Mz"]));
        // Each linked panel's foundation: its base reaction beside the sum of the link forces it takes (with no load of
        // its own on the panel, the two balance: the wall's base shear is what its links bring).
        var bt = new TextTable("case", "panel", $"base Fx [{fu}]", $"base Fy [{fu}]", $"Σ link Fx [{fu}]", $"Σ link Fy [{fu}]").Numeric(2, 3, 4, 5);
        for (int ci = 0; ci < links.Cases.Count && ci < r.Cases.Count; ci++)
            for (int p = 0; p < r.Model.Panels.Count; p++)
            {
                var panel = r.Model.Panels[p];
                if (panel.Links.Count == 0) continue;
                var (bx, by, _) = StoryPanels.BaseReaction(r, p, ci);
                var mine = links.Cases[ci].Forces.Where(f => f.Panel == panel.Id).ToList();
                bt.Add(links.Cases[ci].Id, panel.Id, TextTable.Num(u.FromSI(bx, Quantity.Force)), TextTable.Num(u.FromSI(by, Quantity.Force)),
                    TextTable.Num(u.FromSI(mine.Sum(f => f.Fx), Quantity.Force)), TextTable.Num(u.FromSI(mine.Sum(f => f.Fy), Quantity.Force)));
            }
        sb.Append("Linked panels' bases (reactions of the held base, also in reactions.csv)\n").Append(bt.Render());
        double eta = links.Cases.Count == 0 ? 0 : links.Cases.Max(c => c.WholeBackwardError);
        double imbalance = links.Cases.Count == 0 ? 0 : links.Cases.Max(c => Math.Max(c.Whole.RelativeForceError, c.Whole.RelativeMomentError));
        double asym = links.Panels.Max(p => p.SymmetryError);
        sb.Append($"  whole (frame and panels): worst backward error {TextTable.Sci(eta)}, worst imbalance {TextTable.Sci(imbalance)}; condensed panel stiffness asymmetry {TextTable.Sci(asym)} before symmetrising.\n");
        return sb.ToString();
    }
}
