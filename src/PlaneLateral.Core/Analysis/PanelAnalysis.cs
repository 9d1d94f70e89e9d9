using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>Results of one wall panel. SI units.</summary>
public sealed class PanelResult
{
    public required WallPanel Panel { get; init; }
    public required PanelMesh Mesh { get; init; }
    public required PlaneAnalysisResult Analysis { get; init; }

    /// <summary>
    /// Lateral stiffness at the top (N/m): 1/Δ, Δ the top displacement under a unit horizontal force through the top
    /// floor tie (with a guided top: the top held against rotation, the fixed-guided stiffness) (or, without ties, under a unit force spread uniformly along the top edge, Δ the mean top displacement).
    /// On <see cref="Mesh"/> only (with a study: the base, coarsest mesh); the number to report is <see cref="ReportedStiffness"/>.
    /// </summary>
    public required double TopStiffness { get; init; }

    /// <summary>
    /// Horizontal displacement (m) of every level (top last) in every load case, then every combination, in model order:
    /// [case][level]. With a convergence study these are Richardson-extrapolated over the study's meshes like the
    /// stiffness, each with its estimated error in <see cref="LevelDisplacementErrors"/>; otherwise the mesh's own.
    /// </summary>
    public required double[][] LevelDisplacements { get; init; }

    /// <summary>Estimated relative discretisation error of each of <see cref="LevelDisplacements"/> ([case][level]; NaN where not extrapolated), or null without a convergence study.</summary>
    public double[][]? LevelDisplacementErrors { get; init; }

    /// <summary>
    /// The panel's stiffness as reported: the extrapolated stiffness where the study extrapolates, else the finest
    /// mesh's (N/m), with its estimated relative error (NaN: none); without a study, <see cref="TopStiffness"/> and NaN.
    /// </summary>
    public (double Value, double EstimatedError) ReportedStiffness => Convergence is { } c
        ? double.IsFinite(c.Extrapolated) && c.Extrapolated > 0 ? (c.Extrapolated, c.EstimatedError) : (c.Stiffness[^1], double.NaN)
        : (TopStiffness, double.NaN);

    /// <summary>The mesh-convergence study of the top stiffness, when the panel's mesh settings ask for more than one mesh.</summary>
    public PanelConvergenceResult? Convergence { get; init; }

    /// <summary>Top horizontal displacement (m) per load case (then combination), in model order.</summary>
    public double TopDisplacement(int caseIndex) => LevelDisplacements[caseIndex][^1];
}

/// <summary>
/// Analysis of a wall panel as a plane-stress continuum: mesh it (<see cref="PanelMesher"/>), hold the base, tie each
/// floor level (exact equation sharing of the horizontal displacements), guide the top when asked (its vertical
/// displacements shared too: the top edge translates without rotating), apply the story forces of every load case,
/// and solve on one factorisation (<see cref="PlaneStressAnalysis"/>).
/// </summary>
public static class PanelAnalysis
{
    /// <param name="caseIds">The model's load case ids, in order (panel loads refer to them by index).</param>
    /// <exception cref="ArgumentException">The panel cannot be meshed (see <see cref="PanelMesher.Check"/>).</exception>
    /// <param name="combinations">The model's combinations (factored sums of the cases), superposed; null for none.</param>
    public static PanelResult Run(WallPanel panel, IReadOnlyList<string> caseIds, AnalysisOptions? options = null, string sourcePath = "<panel>", IReadOnlyList<Combination>? combinations = null)
    {
        var mesh = PanelMesher.Mesh(panel);   // checks every problem, the finest study mesh's size included, before any work
        var result = Run(panel, mesh, caseIds, options, sourcePath, combinations);
        if (panel.Mesh.Refinements < 2) return result;
        // The load cases are solved on every mesh of the study too (one more right-hand side per factorisation) and
        // their level displacements extrapolated like the stiffness, so that each carries its own error estimate.
        var study = PanelConvergence.Study(panel, panel.Mesh.Refinements, options, result, caseIds, combinations);
        var meshes = study.MeshLevelDisplacements;
        int cases = result.LevelDisplacements.Length;
        var disp = new double[cases][];
        var errors = new double[cases][];
        for (int c = 0; c < cases; c++)
        {
            int levels = result.LevelDisplacements[c].Length;
            disp[c] = new double[levels];
            errors[c] = new double[levels];
            for (int l = 0; l < levels; l++)
                (disp[c][l], errors[c][l]) = study.ExtrapolateValue(meshes.Select(m => m[c][l]).ToArray());
        }
        return new PanelResult
        {
            Panel = result.Panel, Mesh = result.Mesh, Analysis = result.Analysis, TopStiffness = result.TopStiffness,
            LevelDisplacements = disp, LevelDisplacementErrors = errors, Convergence = study,
        };
    }

    /// <summary>Solves the panel on a given mesh (from <see cref="PanelMesher.Mesh"/>).</summary>
    public static PanelResult Run(WallPanel panel, PanelMesh pm, IReadOnlyList<string> caseIds, AnalysisOptions? options = null, string sourcePath = "<panel>", IReadOnlyList<Combination>? combinations = null)
    {
        var (problem, cases) = Setup(panel, pm, caseIds, sourcePath);
        if (!panel.FloorTies)
            cases.Add(new PlaneLoadCase { Id = "unit top force", EdgeLoads = Spread(pm, pm.Levels.Length - 1, 1, 0) });

        var combos = (combinations ?? []).Select(c => (c.Id, (IReadOnlyList<(int, double)>)c.Factors)).ToArray();
        var r = PlaneStressAnalysis.Run(problem, cases, options, combos);
        // Results in model order: the cases, then the combinations; without ties the unit-force case (solved after the
        // model's cases) is taken out.
        int nc = caseIds.Count;
        var kept = panel.FloorTies ? r.Cases : [.. r.Cases.Take(nc), .. r.Cases.Skip(nc + 1)];
        var levelDisp = kept.Select(c => LevelDisplacements(panel, pm, c)).ToArray();
        double flex = panel.FloorTies ? r.TieFlexibility[^1] : LevelDisplacement(panel, pm, r.Cases[nc], pm.Levels.Length - 1);
        var analysis = panel.FloorTies ? r : new PlaneAnalysisResult { Dofs = r.Dofs, Solve = r.Solve, Cases = kept, TieFlexibility = r.TieFlexibility, System = r.System };
        return new PanelResult { Panel = panel, Mesh = pm, Analysis = analysis, TopStiffness = 1 / flex, LevelDisplacements = levelDisp };
    }

    /// <summary>Horizontal displacement (m) of a level: with a tie every node of it has the same ux (shared equation); without, the level's mean.</summary>
    internal static double LevelDisplacement(WallPanel panel, PanelMesh pm, PlaneCaseResult c, int level) =>
        panel.FloorTies ? c.Ux[pm.LevelNodes[level][0]] : pm.LevelNodes[level].Average(i => c.Ux[i]);

    /// <summary>Horizontal displacement (m) of every level, the top last.</summary>
    internal static double[] LevelDisplacements(WallPanel panel, PanelMesh pm, PlaneCaseResult c) =>
        Enumerable.Range(0, pm.Levels.Length).Select(l => LevelDisplacement(panel, pm, c, l)).ToArray();

    /// <summary>The panel's plane-stress problem (base held, floors tied) and its story forces per model load case.</summary>
    internal static (PlaneStressProblem Problem, List<PlaneLoadCase> Cases) Setup(WallPanel panel, PanelMesh pm, IReadOnlyList<string> caseIds, string sourcePath)
    {
        var mesh = pm.Mesh;
        var problem = new PlaneStressProblem
        {
            Mesh = mesh,
            Material = new PlaneStressMaterial(panel.E, panel.Nu, panel.Thickness),
            Restraints = pm.BaseNodes.SelectMany(i => new[] { (i, Dof.X), (i, Dof.Y) }).ToList(),
            HorizontalTies = panel.FloorTies ? pm.LevelNodes : [],
            // A guided top: its nodes share one vertical displacement too, so the top edge translates without rotating.
            VerticalTies = panel.Top == PanelTop.Guided && panel.FloorTies ? [pm.LevelNodes[^1]] : [],
            NodeLabel = i => $"{panel.Id}:{i}",
            SourcePath = sourcePath,
        };
        var cases = new List<PlaneLoadCase>();
        for (int c = 0; c < caseIds.Count; c++)
        {
            var ties = new List<(int, double)>();
            var edges = new List<PlaneEdgeLoad>();
            foreach (var l in panel.Loads.Where(l => l.Case == c))
            {
                int level = LevelIndex(pm, l.Level);
                bool tie = l.Path == PanelLoadPath.Tie && panel.FloorTies;
                if (tie && l.Fx != 0) ties.Add((level, l.Fx));
                edges.AddRange(Spread(pm, level, tie ? 0 : l.Fx, l.Fy));
            }
            cases.Add(new PlaneLoadCase { Id = caseIds[c], TieForces = ties, EdgeLoads = edges });
        }
        return (problem, cases);
    }

    private static int LevelIndex(PanelMesh pm, double level)
    {
        for (int i = 0; i < pm.Levels.Length; i++)
            if (Math.Abs(pm.Levels[i] - level) <= 1e-9 * Math.Max(1, Math.Abs(level))) return i;
        throw new ArgumentException($"no floor level at {level} m");
    }

    /// <summary>Uniform line load of total (fx, fy) along the solid length of a level (for <see cref="PanelOnFooting"/>).</summary>
    internal static List<PlaneEdgeLoad> SpreadLoad(PanelMesh pm, int level, double fx, double fy) => Spread(pm, level, fx, fy);

    /// <summary>Uniform line load of total (fx, fy) along the solid length of a level.</summary>
    private static List<PlaneEdgeLoad> Spread(PanelMesh pm, int level, double fx, double fy)
    {
        if (fx == 0 && fy == 0) return [];
        var edges = pm.LevelEdges[level];
        var m = pm.Mesh;
        double length = edges.Sum(e =>
        {
            var c = m.Elements[e.Element];
            var n = m.Element.EdgeNodes(e.Edge);
            return Math.Abs(m.X[c[n[^1]]] - m.X[c[n[0]]]);
        });
        double qx = fx / length, qy = fy / length;
        return edges.Select(e => new PlaneEdgeLoad(e.Element, e.Edge, qx, qy, qx, qy)).ToList();
    }
}
