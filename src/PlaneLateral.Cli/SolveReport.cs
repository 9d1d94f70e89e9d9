using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The compact summary the solve command prints.</summary>
internal static class SolveReport
{
    public static string Render(ModelResult run, string modelPath, Detail detail = Detail.Normal)
    {
        var r = run.Analysis;
        var m = r.Model;
        var u = m.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol;
        var sb = new StringBuilder();
        sb.Append("Details\n");
        sb.Append($"File      {modelPath}\n");
        sb.Append($"Size      {m.Nodes.Count} nodes, {m.Members.Count} members, {m.Supports.Count} supports, {m.LoadCases.Count} load cases, {m.Combinations.Count} combinations\n");
        if (m.Members.Count > 0)
        {
            sb.Append($"Solve     {r.Solve.Unknowns} unknowns, {r.Solve.FactorNonZeros} entries in the factor, {r.Solve.RightHandSides} right-hand sides on one factorisation; " +
                $"{run.Factorizations} distinct matrices factorised in the run, each once\n");
            if (r.Conditioning is { } cond) sb.Append($"Condition {TextTable.Sci(cond.ScaledKappa1)} (1-norm estimate of the diagonally scaled stiffness; warning above {TextTable.Sci(cond.Threshold)})\n");
        }
        foreach (var note in r.Notes) sb.Append($"Note      {note}\n");

        if (r.Stiffness.Count > 0)
        {
            sb.Append("\nLateral stiffness (force per unit displacement under a single force at the point)\n");
            sb.Append(TableView.Render(ResultFiles.StiffnessTable(r), ["label", "node", "direction", "stiffness"]));
        }

        if (r.Cases.Count > 0 && m.Members.Count > 0)
        {
            sb.Append("\nLoad cases and combinations\n");
            var t = new TextTable("case", "kind", $"max |ux| [{len}]", "at", $"max |uy| [{len}]", "at", $"ΣFx applied [{force}]", $"ΣFx reactions [{force}]", "imbalance", "backward error")
                .Numeric(2, 4, 6, 7, 8, 9);
            foreach (var c in r.Cases)
            {
                var (ux, nx) = Largest(c, m, Dof.X);
                var (uy, ny) = Largest(c, m, Dof.Y);
                double imbalance = Math.Max(c.Equilibrium.RelativeForceError, c.Equilibrium.RelativeMomentError);
                t.Add(c.Id, c.IsCombination ? "combination" : "load case",
                    TextTable.Num(u.FromSI(ux, Quantity.Length)), nx, TextTable.Num(u.FromSI(uy, Quantity.Length)), ny,
                    TextTable.Num(u.FromSI(c.Equilibrium.AppliedFx, Quantity.Force)), TextTable.Num(u.FromSI(c.Equilibrium.ReactionFx, Quantity.Force)),
                    TextTable.Sci(imbalance), TextTable.Sci(c.BackwardError));
            }
            sb.Append(t.Render());
            sb.Append("  imbalance: largest relative out-of-balance of ΣF and ΣM (reactions against applied loads); backward error: ‖K·u − f‖ / (‖K‖·‖u‖ + ‖f‖).\n");
        }
        sb.Append(BuildingReport.Render(run, detail));
        sb.Append(PanelReport.Render(r));
        sb.Append(PanelLinkReport.Render(r));
        sb.Append(SeismicReport.Render(run));
        sb.Append($"\nCaution: {ResultFiles.Caution}\n");
        return sb.ToString();
    }

    private static (double Value, string Node) Largest(CaseResult c, StructureModel m, Dof d)
    {
        double best = 0;
        string node = "-";
        foreach (var n in m.Nodes)
        {
            double v = Math.Abs(c.Displacement(n.Index, d));
            if (v > best) { best = v; node = n.Id; }
        }
        return (best, node);
    }
}
