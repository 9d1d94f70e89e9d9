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
        r.Panels.Count == 0 ? [] : [("panels.json", TypedJson.Write(Document(r))), .. Tables(r).Select(t => t.Text())];

    /// <summary>
    /// The panels' files as the command line writes them: panels.json and the CSV files streamed into their files, row
    /// by row (panel-stresses.csv grows with mesh nodes × cases: at the panel limit's edge it is about 0.9 GB of text,
    /// docs/hardening.md), never built as one string.
    /// </summary>
    public static IReadOnlyList<OutputFile> Files(AnalysisResult r) =>
        r.Panels.Count == 0 ? [] : [TypedJson.File("panels.json", Document(r)), .. Tables(r).Select(t => t.File())];

    /// <summary>The panels' CSV files, each from its table (none without panels).</summary>
    public static IReadOnlyList<CsvTableFile> Tables(AnalysisResult r) =>
        r.Panels.Count == 0 ? [] : [new("panel-stresses.csv", StressTable(r)), new("panel-checks.csv", ChecksTable(r))];

    /// <summary>Every panel mesh node's position, displacements and smoothed stresses, every case.</summary>
    public static ResultTable StressTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        string l = u.LengthSymbol, s = u.Label(Quantity.Stress);
        double L(double v) => u.FromSI(v, Quantity.Length);
        double S(double v) => u.FromSI(v, Quantity.Stress);
        return new ResultTable
        {
            Title = "Panel nodal displacements and smoothed stresses",
            Columns =
            [
                new("panel", Kind: CellKind.Text), new("case", Kind: CellKind.Text), new("node"), new("x", l), new("y", l), new("ux", l), new("uy", l),
                new("sigma x", s), new("sigma y", s), new("tau xy", s),
            ],
            Rows = r.Panels.SelectMany(p => p.Analysis.Cases.SelectMany(c => Enumerable.Range(0, p.Mesh.Mesh.NodeCount).Select(i => (IReadOnlyList<object>)
                [p.Panel.Id, c.Id, i, L(p.Mesh.Mesh.X[i]), L(p.Mesh.Mesh.Y[i]), L(c.Ux[i]), L(c.Uy[i]), S(c.NodalStress[i, 0]), S(c.NodalStress[i, 1]), S(c.NodalStress[i, 2])]))),
        };
    }

    /// <summary>Each panel's residual, backward error and equilibrium, every case.</summary>
    public static ResultTable ChecksTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol;
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        return new ResultTable
        {
            Title = "Panel solution checks",
            Columns =
            [
                new("panel", Kind: CellKind.Text), new("case", Kind: CellKind.Text), new("relative residual"), new("backward error"), new("applied Fx", fu),
                new("applied Fy", fu), new("reaction Fx", fu), new("reaction Fy", fu), new("relative force imbalance"), new("relative moment imbalance"),
            ],
            Rows = r.Panels.SelectMany(p => p.Analysis.Cases.Select(c => (IReadOnlyList<object>)
                [p.Panel.Id, c.Id, c.RelativeResidual, c.BackwardError, Fo(c.Equilibrium.AppliedFx), Fo(c.Equilibrium.AppliedFy), Fo(c.Equilibrium.ReactionFx),
                 Fo(c.Equilibrium.ReactionFy), c.Equilibrium.RelativeForceError, c.Equilibrium.RelativeMomentError])).ToList(),
        };
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
