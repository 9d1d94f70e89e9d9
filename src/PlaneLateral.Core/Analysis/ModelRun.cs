using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>
/// Everything one run of a planar model produced, computed once: the static results (load cases, combinations,
/// stiffness points, panels, linked panels), the building results (stories, lines, drift checks, soft story), the
/// split of story shear by each line's stiffness alone, and the seismic results (periods, story forces, stability
/// coefficient, second-order drifts, buckling factor). Renderers (console, files, report) only read it; nothing in it
/// changes after <see cref="ModelRun.Run"/> returns. All SI (N, m, rad).
/// </summary>
public sealed class ModelResult
{
    public required AnalysisResult Analysis { get; init; }
    public required BuildingResult Building { get; init; }

    /// <summary>Each lateral case's split of story shear by the lines' stiffness alone (empty with fewer than two lines).</summary>
    public required IReadOnlyList<(string CaseId, IReadOnlyList<LineSplitRow> Rows)> LineSplit { get; init; }

    /// <summary>Lateral cases without a split because a line alone is a mechanism.</summary>
    public required IReadOnlyList<string> LineSplitSkipped { get; init; }

    /// <summary>Periods, story forces, stability and second-order results; null without a seismic block.</summary>
    public required SeismicResult? Seismic { get; init; }
    /// <summary>The modal response spectrum analysis (docs/seismic.md, "Response spectrum"), or null without a <c>responseSpectrum</c> block.</summary>
    public PlanarSpectrumResult? Spectrum { get; init; }

    /// <summary>What ran on the frame's stiffness, in one short line (the solver a size rule picked, not the rule).</summary>
    public required string Solver { get; init; }

    /// <summary>Sparse factorisations the run made (each distinct matrix once) and the ones it was asked for.</summary>
    public required int Factorizations { get; init; }
    public required int FactorizationRequests { get; init; }

    /// <summary>
    /// The run's options: the solver the user chose, wrapped once in the run's <see cref="FactorOnceSolver"/>. A study that
    /// solves sub-models of this model (the comparison checks) passes them on, so the user's solver runs them too and a
    /// matrix this run already factorised (the whole model's K) is not factorised again.
    /// </summary>
    public required AnalysisOptions Options { get; init; }

    /// <summary>The model as solved (generated cases filled in).</summary>
    public StructureModel Model => Analysis.Model;
}

/// <summary>
/// One analysis run of a planar model, in ordered stages, each distinct matrix assembled and factorised once with the
/// solver the user chose (<see cref="AnalysisOptions.Solver"/>; the default when none):
/// <list type="number">
/// <item>the frame system: members and linked wall panels condensed in, K assembled and factorised;</item>
/// <item>seismic: periods and story forces on that factor, the generated story-force case, K + K_G factorised;</item>
/// <item>static: every load case, stiffness point and combination on K's factor; wall panels; linked-panel recovery;</item>
/// <item>building: stories, lines, drift checks, soft story (statics on the static results, no solve);</item>
/// <item>line alone: each line's own model, factorised once for all lateral cases;</item>
/// <item>second order: drifts on the factor of K + K_G, stability coefficient, buckling factor;</item>
/// <item>response spectrum: on stage 2's modes and story forces.</item>
/// </list>
/// A matrix met twice in one run (a panel's interior in its condensation and its recovery, a panel's own model in the
/// whole and in its line alone) is factorised once (<see cref="FactorOnceSolver"/>).
/// </summary>
public static class ModelRun
{
    /// <exception cref="UnstableModelException">The model is a mechanism.</exception>
    /// <exception cref="ModelInputException">The model cannot be solved as given (see the message).</exception>
    public static ModelResult Run(StructureModel model, AnalysisOptions? options = null)
    {
        options = AnalysisOptions.ForRun(options);
        var solver = (FactorOnceSolver)options.Solver!;
        var system = LinearStaticAnalysis.Setup(model, options);                      // 1
        var seismicStage = SeismicAnalysis.Stage(model, system);                     // 2
        var analysis = LinearStaticAnalysis.Solve(seismicStage.Model, system, options);   // 3
        var stories = StoryAnalysis.All(analysis);                                    // 4
        var building = new BuildingResult
        {
            Cases = stories, DriftChecks = DriftCheck.Run(analysis, stories), Irregularity = StiffnessIrregularity.Run(stories),
        };
        var split = LineAlone.SplitAll(analysis, stories, out var skipped, options);   // 5
        var seismic = SecondOrderAnalysis.Seismic(analysis, seismicStage, system);     // 6
        var spectrum = PlanarSpectrum.Run(seismicStage.Model, seismicStage.Modal, seismicStage.Forces, system, seismic);   // 7 (on stage 2's modes and K's factor)
        return new ModelResult
        {
            Analysis = analysis, Building = building, LineSplit = split, LineSplitSkipped = skipped, Seismic = seismic, Spectrum = spectrum,
            Solver = analysis.Solve.Solver, Factorizations = solver.Factorizations, FactorizationRequests = solver.Requests,
            Options = options,
        };
    }
}
