using System.Globalization;

namespace PlaneLateral.Studies;

/// <summary>
/// One reference per comparison row, stated (docs/comparisons.md, "The reference"). Where the row has a converged
/// plane-stress panel, the panel is the reference: it shares no assumption with the hand methods or the line models (no
/// plane sections, no rigid spandrels or joints, no independent piers). "Converged" means Richardson-extrapolated over
/// nested meshes with an estimated discretisation error of at most a quarter of the row's tolerance, so that the
/// discretisation alone cannot move the ratio across more than a quarter of the band. Otherwise the first line model
/// is the reference and the row says why no panel is.
/// </summary>
public static class ReferenceChoice
{
    /// <summary>The largest estimated discretisation error, as a share of the row's tolerance, for a panel to be the reference.</summary>
    public const double MaxErrorShareOfTolerance = 0.25;

    /// <summary>True when <paramref name="e"/> is a plane-stress panel estimate converged well enough to be the reference.</summary>
    public static bool IsConvergedPanel(FeEstimate e, double tol) =>
        e.Model == PanelEstimate.ModelName && e.EstimatedError is double err && double.IsFinite(err) && err <= MaxErrorShareOfTolerance * tol;

    /// <summary>
    /// Orders the estimates so the reference comes first and states the basis. <paramref name="lineModels"/> are the
    /// line (Timoshenko member) models, reference first among them; <paramref name="panel"/> the plane-stress panel, if any;
    /// <paramref name="noPanel"/> why there is none (used when <paramref name="panel"/> is null).
    /// </summary>
    public static (List<FeEstimate> Fe, string Basis, bool PanelIsReference) Order(IReadOnlyList<FeEstimate> lineModels, FeEstimate? panel, double tol, string? noPanel)
    {
        if (panel is not null && IsConvergedPanel(panel, tol))
            return ([panel, .. lineModels],
                $"converged plane-stress panel (estimated discretisation error {Pct(panel.EstimatedError!.Value)}, within a quarter of the tolerance); the line models stand beside it with their own ratios",
                true);
        var list = new List<FeEstimate>(lineModels);
        if (panel is not null) list.Add(panel);
        string why = panel is null
            ? noPanel ?? "no plane-stress panel applies to this row"
            : panel.EstimatedError is double err && double.IsFinite(err)
                ? $"the plane-stress panel beside it is not converged to a quarter of the tolerance (estimated discretisation error {Pct(err)})"
                : "the plane-stress panel beside it has no error estimate (not extrapolated over nested meshes)";
        return (list, $"line models only: {lineModels[0].Model}; {why}", false);
    }

    /// <summary>The basis of a row whose FE models are all line models and no panel can represent it.</summary>
    public static string LineModelsOnly(string reference, string why) => $"line models only: {reference}; {why}";

    /// <summary>
    /// The cause of a row whose reference is the converged panel: the panel's judgement first, then what the reference
    /// line model says (its own cause text, with its own ratio).
    /// </summary>
    public static string PanelFirstCause(string panelJudgement, FeEstimate line, double handValue, string lineCause) =>
        $"{panelJudgement}; beside it, {line.Model} (FE/hand {(line.Value / handValue).ToString("0.000", CultureInfo.InvariantCulture)}): {lineCause}";

    private static string Pct(double f) => (100 * f).ToString("0.000", CultureInfo.InvariantCulture) + "%";
}
