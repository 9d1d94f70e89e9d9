using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// The plane-stress continuum estimate of a wall's cantilever or fixed-fixed stiffness, for the comparison rows: the wall meshed with
/// 9-node quadrilaterals on three meshes (h, h/2, h/4; one 9-node element across the narrowest strip on the first), base held, top edge tied (a rigid floor: every top node shares
/// one horizontal displacement; for fixed-fixed also one vertical displacement, so the top translates without rotating),
/// unit force through the tie; the stiffness is Richardson-extrapolated from the mesh
/// sequence with its estimated discretisation error (docs/panels.md). It shares no assumption with the hand methods
/// or the line models: no plane sections, no rigid spandrels, no independent piers.
/// </summary>
internal static class PanelEstimate
{
    public const string ModelName = "plane-stress panel";

    /// <summary>
    /// The cantilever panel estimate (top free but for its floor tie), or null with the reason when it does not apply.
    /// Stiffness modifiers on the wall's members (cracked-section I) have no continuum counterpart: callers skip those.
    /// </summary>
    public static (FeEstimate? Estimate, string? Skipped) Cantilever(UnitSystem u, string id, double length, double height, double thickness,
        double e, double nu, IReadOnlyList<OpeningSpec> openings) =>
        ForEnds(EndFixity.Cantilever, u, id, length, height, thickness, e, nu, openings);

    /// <summary>
    /// The fixed-fixed (fixed-guided) panel estimate: the top edge guided, translating without rotating
    /// (<see cref="PanelTop.Guided"/>), the continuum counterpart of the hand method's fixed-fixed pier.
    /// </summary>
    public static (FeEstimate? Estimate, string? Skipped) FixedFixed(UnitSystem u, string id, double length, double height, double thickness,
        double e, double nu, IReadOnlyList<OpeningSpec> openings) =>
        ForEnds(EndFixity.FixedFixed, u, id, length, height, thickness, e, nu, openings);

    /// <summary>The panel estimate for either end condition (SI inputs: m, N/m²); the value is in <paramref name="u"/>.</summary>
    /// <param name="options">The run's options (its solver factorises each distinct matrix once), or null.</param>
    public static (FeEstimate? Estimate, string? Skipped) ForEnds(EndFixity ends, UnitSystem u, string id, double length, double height, double thickness,
        double e, double nu, IReadOnlyList<OpeningSpec> openings, AnalysisOptions? options = null)
    {
        PanelResult? r = null;
        string? problem = null;
        // Three meshes where the size limit allows, else two, else one (the estimate then says it is not extrapolated).
        for (int meshes = 3; meshes >= 1 && r is null; meshes--)
        {
            var panel = new WallPanel
            {
                Id = id, X0 = 0, Y0 = 0, Length = length, Height = height, Thickness = thickness, MaterialId = "",
                E = e, Nu = nu,
                Openings = openings.Select(o => new PanelOpening(o.Label, o.X, o.Y, o.Width, o.Height)).ToArray(),
                FloorTies = true,
                Top = ends == EndFixity.FixedFixed ? PanelTop.Guided : PanelTop.Free,
                Mesh = new PanelMeshSettings(PanelElementKind.Quad9, 0, 1, MaxAspect: 4, MaxNodes: 40000, Refinements: meshes),
            };
            try
            {
                r = PanelAnalysis.Run(panel, [], options);
            }
            catch (ArgumentException ex)
            {
                problem = ex.Message;
            }
        }
        if (r is null) return (null, $"no panel estimate: {problem}");
        var c = r.Convergence;
        bool extrapolated = c is not null && double.IsFinite(c.Extrapolated) && c.Extrapolated > 0;
        double k = extrapolated ? c!.Extrapolated : c?.Stiffness[^1] ?? r.TopStiffness;
        string top = ends == EndFixity.FixedFixed ? "top edge tied and guided (translates without rotating)" : "top edge tied";
        string how = extrapolated
            ? $"9-node plane-stress quadrilaterals on {c!.Stiffness.Length} meshes (finest {c.Unknowns[^1]} unknowns), base held, {top}, unit force through the tie; Richardson-extrapolated (observed order {c.ObservedOrder:0.00}), estimated discretisation error {100 * c.EstimatedError:0.00}%"
            : $"9-node plane-stress quadrilaterals, finest mesh ({c?.Unknowns[^1] ?? r.Analysis.Solve.Unknowns} unknowns), base held, {top}, unit force through the tie; no extrapolation ({c?.Note ?? "single mesh"})";
        return (new FeEstimate(ModelName, ComparisonStudy.Stiffness(u, k), how, EstimatedError: extrapolated ? c!.EstimatedError : null), null);
    }

    /// <summary>
    /// What the converged panel, as the row's reference, says about the hand value (the head of the row's cause),
    /// with the estimated discretisation error of the panel's number.
    /// </summary>
    public static string Judgement(double panelOverHand, double tol, double error)
    {
        var v = ComparisonRow.Judge(panelOverHand, tol);
        string words = v switch
        {
            Studies.Verdict.WithinTolerance => "within the tolerance of the hand value",
            Studies.Verdict.HandHigher => "softer than the hand value: by the continuum's measure the hand method is too stiff",
            _ => "stiffer than the hand value: by the continuum's measure the hand method is too soft",
        };
        string err = (100 * error).ToString("0.000", System.Globalization.CultureInfo.InvariantCulture) + "%";
        return $"reference, converged plane-stress panel: {panelOverHand.ToString("0.000", System.Globalization.CultureInfo.InvariantCulture)} of the hand value (estimated discretisation error {err}), {words}";
    }

    /// <summary>
    /// What the panel says about the hand value, for the row's cause: the continuum is the reference that shares no
    /// assumption with the hand method, so its verdict is stated even when the line or frame model agrees.
    /// </summary>
    public static string Verdict(double panelOverHand, double tol, string? skipped)
    {
        if (skipped is not null) return $"; plane-stress panel: {skipped}";
        var v = ComparisonRow.Judge(panelOverHand, tol);
        string words = v switch
        {
            Studies.Verdict.WithinTolerance => "within the tolerance of the hand value",
            Studies.Verdict.HandHigher => "softer than the hand value: by the continuum's measure the hand method is too stiff",
            _ => "stiffer than the hand value: by the continuum's measure the hand method is too soft",
        };
        return $"; plane-stress panel: {panelOverHand:0.000} of the hand value, {words}";
    }
}
