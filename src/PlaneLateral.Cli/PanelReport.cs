using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The console table of wall panels solved as plane-stress continua (details in panels.json).</summary>
internal static class PanelReport
{
    public static string Render(AnalysisResult r)
    {
        if (r.Panels.Count == 0) return "";
        var u = r.Model.Units;
        string len = u.LengthSymbol, ku = u.Label(Quantity.TranslationalStiffness);
        var sb = new StringBuilder("\nWall panels (plane-stress continuum; base held, or on its footing where one is given; floors tied exactly)\n");
        var t = new TextTable("panel", "h/l", "openings", "element", "unknowns (finest)", $"top stiffness, finest mesh [{ku}]", "observed order", $"extrapolated [{ku}]", "est. error", "worst backward error")
            .Numeric(1, 2, 4, 5, 6, 7, 8, 9);
        foreach (var p in r.Panels)
        {
            var c = p.Convergence;
            double worst = p.Analysis.Cases.Count == 0 ? 0 : p.Analysis.Cases.Max(x => x.BackwardError);
            t.Add(p.Panel.Id, TextTable.Num(p.Panel.Height / p.Panel.Length), p.Panel.Openings.Count.ToString(CultureInfo.InvariantCulture),
                p.Panel.Mesh.Element.ToString(), (c?.Unknowns[^1] ?? p.Analysis.Dofs.FreeCount).ToString(CultureInfo.InvariantCulture),
                TextTable.Num(u.FromSI(c?.Stiffness[^1] ?? p.TopStiffness, Quantity.TranslationalStiffness)),
                c is null || !double.IsFinite(c.ObservedOrder) ? "-" : TextTable.Num(c.ObservedOrder),
                c is null || !double.IsFinite(c.Extrapolated) ? "-" : TextTable.Num(u.FromSI(c.Extrapolated, Quantity.TranslationalStiffness)),
                c is null || !double.IsFinite(c.EstimatedError) ? "-" : (100 * c.EstimatedError).ToString("0.00", CultureInfo.InvariantCulture) + " %",
                TextTable.Sci(worst));
        }
        sb.Append(t.Render());
        var caseIds = r.Model.LoadCases.Select(c => c.Id).Concat(r.Model.Combinations.Select(c => c.Id)).ToList();
        if (caseIds.Count > 0)
        {
            var d = new TextTable("panel", "case", $"top ux [{len}]").Numeric(2);
            foreach (var p in r.Panels)
                for (int i = 0; i < caseIds.Count && i < p.LevelDisplacements.Length; i++)
                    d.Add(p.Panel.Id, caseIds[i], TextTable.Num(u.FromSI(p.TopDisplacement(i), Quantity.Length)));
            sb.Append(d.Render());
        }
        sb.Append("  top stiffness: 1 / top displacement under a unit force through the top tie; with a mesh study the case displacements are extrapolated over the meshes like the stiffness, each with its estimated error in panels.json (nodal stresses stay on the first mesh).\n");
        return sb.ToString();
    }
}
