using System.Globalization;
using System.Text;
using Newtonsoft.Json;
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
        r.Panels.Count == 0 ? [] : [("panels.json", Json(r)), ("panel-stresses.csv", Stresses(r)), ("panel-checks.csv", Checks(r))];

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

    private static string Json(AnalysisResult r)
    {
        var u = r.Model.Units;
        double Len(double v) => u.FromSI(v, Quantity.Length);
        double Stiff(double v) => u.FromSI(v, Quantity.TranslationalStiffness);
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2, FloatFormatHandling = FloatFormatHandling.String })
        {
            // A number that could not be determined (e.g. no observed order from a non-monotone mesh sequence) is written
            // as null, never as "NaN"; the note beside it says why.
            void P(string name, object? v) { w.WritePropertyName(name); w.WriteValue(v is double d && !double.IsFinite(d) ? null : v); }
            w.WriteStartObject();
            P("producedBy", $"PlaneLateral {ResultFiles.Version}");
            P("caution", ResultFiles.Caution);
            P("method", "Plane-stress continuum (see docs/panels.md): base held in x and y (a panel on a footing: its base nodes follow the rigid footing on its springs, docs/footings.md); with floor ties every node of a level shares one horizontal displacement (exact constraint). Top stiffness = 1 / top displacement under a unit horizontal force through the top tie (without ties: spread along the top edge, mean top displacement).");
            w.WritePropertyName("units");
            w.WriteStartObject();
            P("length", u.LengthSymbol); P("force", u.ForceSymbol); P("stress", u.Label(Quantity.Stress)); P("stiffness", u.Label(Quantity.TranslationalStiffness));
            w.WriteEndObject();
            w.WritePropertyName("panels");
            w.WriteStartArray();
            foreach (var p in r.Panels)
            {
                w.WriteStartObject();
                P("id", p.Panel.Id);
                P("element", p.Mesh.Mesh.Element.Name);
                w.WritePropertyName("mesh");
                w.WriteStartObject();
                P("elements", p.Mesh.Mesh.Elements.Length); P("nodes", p.Mesh.Mesh.NodeCount); P("unknowns", p.Analysis.Solve.Unknowns);
                P("elementSize", Len(p.Mesh.ElementSize)); P("narrowestStrip", Len(p.Mesh.NarrowestStrip)); P("largestAspect", p.Mesh.LargestAspect);
                P("solver", MachineFree.Solver(p.Analysis.Solve.Solver));
                w.WriteEndObject();
                P("floorTies", p.Panel.FloorTies);
                if (p.Panel.Top == Model.PanelTop.Guided) P("top", "guided: the top edge translates without rotating (fixed-guided stiffness)");
                var (kRep, kErr) = p.ReportedStiffness;
                P("topStiffness", Stiff(kRep));
                P("topStiffnessEstimatedError", kErr);
                P("topStiffnessOn", p.Convergence is null ? "the panel's one mesh (no error estimate)"
                    : double.IsFinite(kErr) ? "Richardson extrapolation over the convergence meshes (estimated relative error beside it)"
                    : "the finest convergence mesh, not extrapolated (no error estimate)");
                P("topStiffnessBaseMesh", Stiff(p.TopStiffness));
                if (p.Convergence is not null)
                    P("nodalResults", "the nodal displacements and stresses in panel-stresses.csv and the checks in panel-checks.csv are on the base (coarsest) mesh of the study and carry no error estimate; the level displacements here are extrapolated like the stiffness, each with its own estimated relative error");
                if (p.Convergence is { } cv)
                {
                    w.WritePropertyName("convergence");
                    w.WriteStartObject();
                    w.WritePropertyName("meshes");
                    w.WriteStartArray();
                    for (int i = 0; i < cv.Stiffness.Length; i++)
                    {
                        w.WriteStartObject();
                        P("elementSize", Len(cv.ElementSizes[i])); P("unknowns", cv.Unknowns[i]); P("topStiffness", Stiff(cv.Stiffness[i]));
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    P("observedOrder", cv.ObservedOrder);
                    P("extrapolatedStiffness", Stiff(cv.Extrapolated));
                    P("estimatedRelativeError", cv.EstimatedError);
                    P("note", cv.Note);
                    w.WriteEndObject();
                }
                w.WritePropertyName("cases");
                w.WriteStartArray();
                for (int c = 0; c < p.Analysis.Cases.Count; c++)
                {
                    var cr = p.Analysis.Cases[c];
                    w.WriteStartObject();
                    P("id", cr.Id);
                    P("topDisplacement", Len(p.TopDisplacement(c)));
                    if (p.LevelDisplacementErrors is { } te) P("topDisplacementEstimatedError", te[c][^1]);
                    w.WritePropertyName("levels");
                    w.WriteStartArray();
                    for (int l = 0; l < p.Mesh.Levels.Length; l++)
                    {
                        w.WriteStartObject();
                        P("height", Len(p.Mesh.Levels[l])); P("ux", Len(p.LevelDisplacements[c][l]));
                        if (p.LevelDisplacementErrors is { } le) P("uxEstimatedError", le[c][l]);
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    P("backwardError", cr.BackwardError);
                    P("relativeForceImbalance", cr.Equilibrium.RelativeForceError);
                    P("relativeMomentImbalance", cr.Equilibrium.RelativeMomentError);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }
}
