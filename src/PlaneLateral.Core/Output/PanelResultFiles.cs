using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The results files of wall panels (only when the model has panels): panels.json (mesh facts, top stiffness,
/// level displacements, checks, convergence study), panel-stresses.csv (smoothed nodal stresses and displacements per
/// case) and panel-checks.csv (equilibrium and backward error per panel and case). Model units; the text depends only
/// on the input.
/// </summary>
public static class PanelResultFiles
{
    public static IReadOnlyList<(string Name, string Text)> Render(AnalysisResult r) =>
        r.Panels.Count == 0 ? [] : [("panels.json", TypedJson.Write(Document(r))), ("panel-stresses.csv", Stresses(r)), ("panel-checks.csv", Checks(r))];

    private static string F(double v) => v.ToString("G12", CultureInfo.InvariantCulture);

    private static string Csv(string s) => PlaneLateral.Output.CsvText.Cell(s);   // the one escaper (quoting, formula neutralising)

    private static string Stresses(AnalysisResult r)
    {
        var u = r.Model.Units;
        string l = u.LengthSymbol, s = u.Label(Quantity.Stress);
        var sb = new StringBuilder($"panel,case,node,x [{l}],y [{l}],ux [{l}],uy [{l}],sigma x [{s}],sigma y [{s}],tau xy [{s}]\n");
        foreach (var p in r.Panels)
        {
            var m = p.Mesh.Mesh;
            foreach (var c in p.Analysis.Cases)
                for (int i = 0; i < m.NodeCount; i++)
                    sb.Append($"{Csv(p.Panel.Id)},{Csv(c.Id)},{i},{F(u.FromSI(m.X[i], Quantity.Length))},{F(u.FromSI(m.Y[i], Quantity.Length))},{F(u.FromSI(c.Ux[i], Quantity.Length))},{F(u.FromSI(c.Uy[i], Quantity.Length))},{F(u.FromSI(c.NodalStress[i, 0], Quantity.Stress))},{F(u.FromSI(c.NodalStress[i, 1], Quantity.Stress))},{F(u.FromSI(c.NodalStress[i, 2], Quantity.Stress))}\n");
        }
        return sb.ToString();
    }

    private static string Checks(AnalysisResult r)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol;
        var sb = new StringBuilder($"panel,case,relative residual,backward error,applied Fx [{fu}],applied Fy [{fu}],reaction Fx [{fu}],reaction Fy [{fu}],relative force imbalance,relative moment imbalance\n");
        foreach (var p in r.Panels)
            foreach (var c in p.Analysis.Cases)
            {
                var e = c.Equilibrium;
                sb.Append($"{Csv(p.Panel.Id)},{Csv(c.Id)},{F(c.RelativeResidual)},{F(c.BackwardError)},{F(u.FromSI(e.AppliedFx, Quantity.Force))},{F(u.FromSI(e.AppliedFy, Quantity.Force))},{F(u.FromSI(e.ReactionFx, Quantity.Force))},{F(u.FromSI(e.ReactionFy, Quantity.Force))},{F(e.RelativeForceError)},{F(e.RelativeMomentError)}\n");
            }
        return sb.ToString();
    }

    /// <summary>A finite number, or null (one that could not be determined; the note beside it says why).</summary>
    private static double? N(double v) => double.IsFinite(v) ? v : null;

    /// <summary>panels.json as a typed document.</summary>
    public static PanelsDocument Document(AnalysisResult r)
    {
        var u = r.Model.Units;
        double? Len(double v) => N(u.FromSI(v, Quantity.Length));
        double? Stiff(double v) => N(u.FromSI(v, Quantity.TranslationalStiffness));
        PanelsPanel Panel(PanelResult p)
        {
            var (kRep, kErr) = p.ReportedStiffness;
            var cv = p.Convergence;
            var errors = p.LevelDisplacementErrors;
            return new PanelsPanel(
                p.Panel.Id, p.Mesh.Mesh.Element.Name,
                new PanelsMesh(p.Mesh.Mesh.Elements.Length, p.Mesh.Mesh.NodeCount, p.Analysis.Solve.Unknowns, Len(p.Mesh.ElementSize), Len(p.Mesh.NarrowestStrip),
                    N(p.Mesh.LargestAspect), MachineFree.Solver(p.Analysis.Solve.Solver)),
                p.Panel.FloorTies,
                p.Panel.Top == Model.PanelTop.Guided ? "guided: the top edge translates without rotating (fixed-guided stiffness)" : null,
                Stiff(kRep), N(kErr),
                cv is null ? "the panel's one mesh (no error estimate)"
                    : double.IsFinite(kErr) ? "Richardson extrapolation over the convergence meshes (estimated relative error beside it)"
                    : "the finest convergence mesh, not extrapolated (no error estimate)",
                Stiff(p.TopStiffness),
                cv is null ? null : "the nodal displacements and stresses in panel-stresses.csv and the checks in panel-checks.csv are on the base (coarsest) mesh of the study and carry no error estimate; the level displacements here are extrapolated like the stiffness, each with its own estimated relative error",
                cv is null ? null : new PanelsConvergence(
                    Enumerable.Range(0, cv.Stiffness.Length).Select(i => new PanelsConvergenceMesh(Len(cv.ElementSizes[i]), cv.Unknowns[i], Stiff(cv.Stiffness[i]))),
                    N(cv.ObservedOrder), Stiff(cv.Extrapolated), N(cv.EstimatedError), cv.Note),
                Enumerable.Range(0, p.Analysis.Cases.Count).Select(c => new PanelsCase(
                    p.Analysis.Cases[c].Id, Len(p.TopDisplacement(c)), errors is null ? null : N(errors[c][^1]),
                    Enumerable.Range(0, p.Mesh.Levels.Length).Select(l => new PanelsLevel(Len(p.Mesh.Levels[l]), Len(p.LevelDisplacements[c][l]),
                        errors is null ? null : N(errors[c][l])) { HasError = errors is not null }),
                    N(p.Analysis.Cases[c].BackwardError), N(p.Analysis.Cases[c].Equilibrium.RelativeForceError), N(p.Analysis.Cases[c].Equilibrium.RelativeMomentError))
                    { HasErrors = errors is not null }));
        }
        return new PanelsDocument(
            $"PlaneLateral {ResultFiles.Version}",
            ResultFiles.Caution,
            "Plane-stress continuum (see docs/panels.md): base held in x and y (a panel on a footing: its base nodes follow the rigid footing on its springs, docs/footings.md); with floor ties every node of a level shares one horizontal displacement (exact constraint). Top stiffness = 1 / top displacement under a unit horizontal force through the top tie (without ties: spread along the top edge, mean top displacement).",
            new PanelsUnits(u.LengthSymbol, u.ForceSymbol, u.Label(Quantity.Stress), u.Label(Quantity.TranslationalStiffness)),
            r.Panels.Select(Panel));
    }
}
