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
    public static IReadOnlyList<(string Name, string Text)> Render(AnalysisResult r) => [.. Tables(r).Select(t => t.Text())];

    /// <summary>The links' CSV files, each from its table (none without links).</summary>
    public static IReadOnlyList<CsvTableFile> Tables(AnalysisResult r) =>
        r.PanelLinks is not { } links ? [] : [new("panel-links.csv", ForcesTable(r, links)), new("panel-link-checks.csv", ChecksTable(r, links))];

    /// <summary>The force and moment each link passes from its frame node to the panel, every case.</summary>
    public static ResultTable ForcesTable(AnalysisResult r, PanelLinkResults links)
    {
        var u = r.Model.Units;
        return new ResultTable
        {
            Title = "Panel links (frame node to panel edge, rigid and exact; force the link passes to the panel)",
            Columns =
            [
                new("panel", Kind: CellKind.Text), new("node", Kind: CellKind.Text), new("case", Kind: CellKind.Text),
                new("Fx", u.ForceSymbol), new("Fy", u.ForceSymbol), new("Mz", u.Label(Quantity.Moment)),
            ],
            Rows = links.Cases.SelectMany(c => c.Forces.Select(f => (IReadOnlyList<object>)
                [f.Panel, r.Model.Nodes[f.Node].Id, c.Id, u.FromSI(f.Fx, Quantity.Force), u.FromSI(f.Fy, Quantity.Force), u.FromSI(f.Mz, Quantity.Moment)])).ToList(),
        };
    }

    /// <summary>The checks of the whole (frame and panels together), every case.</summary>
    public static ResultTable ChecksTable(AnalysisResult r, PanelLinkResults links)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol;
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        return new ResultTable
        {
            Title = "Checks of the whole, frame and panels together",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("whole backward error"), new("condensed backward error"), new("applied Fx", fu), new("applied Fy", fu),
                new("reaction Fx", fu), new("reaction Fy", fu), new("relative force imbalance"), new("relative moment imbalance"),
            ],
            Rows = links.Cases.Select(c => (IReadOnlyList<object>)
                [c.Id, c.WholeBackwardError, c.CondensedBackwardError, Fo(c.Whole.AppliedFx), Fo(c.Whole.AppliedFy), Fo(c.Whole.ReactionFx), Fo(c.Whole.ReactionFy),
                 c.Whole.RelativeForceError, c.Whole.RelativeMomentError]).ToList(),
        };
    }
}
