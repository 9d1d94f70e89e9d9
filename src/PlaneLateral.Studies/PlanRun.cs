using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Studies;

/// <summary>
/// Everything one run of a building in plan produces, computed once: the plan analysis with the seismic block's cases
/// (<see cref="PlanSeismic.Run"/>; floors that bend in <see cref="PlanResult.Diaphragms"/> when the file gives a floor
/// block), the modes, equivalent lateral forces and response spectrum (<see cref="Seismic"/>, null without a seismic
/// block), the hand split by relative rigidity with torsion beside the FE (<see cref="Hand"/>) and, for floors that bend,
/// the hand tributary split beside the FE flexible floor (<see cref="Tributary"/>, empty without a floor block). The solve
/// and report commands both call <see cref="Run"/>, so their numbers cannot differ; renderers only read it.
/// </summary>
public sealed record PlanRun(PlanResult Result, PlanSeismicResult? Seismic, IReadOnlyList<PlanSplitStory> Hand, IReadOnlyList<TributaryShear> Tributary)
{
    /// <exception cref="UnstableModelException">The lines cannot hold a floor.</exception>
    /// <exception cref="ModelInputException">The building cannot be solved as given (e.g. a floor without weight under a seismic block).</exception>
    public static PlanRun Run(BuildingPlan plan, AnalysisOptions? options = null)
    {
        var (result, seismic) = PlanSeismic.Run(plan, options);
        return new PlanRun(result, seismic, PlanHandSplit.Run(result), PlanTributarySplit.Run(result));
    }
}
