using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// A wall panel declared under "panels", checked as a cantilever (docs/comparisons.md, "panel-wall"): the hand
/// perforated-wall method and the Timoshenko line model (the equivalent frame generated from the panel's geometry)
/// beside the panel's own plane-stress stiffness, converged over its own nested meshes (Richardson extrapolation with
/// the observed order and the estimated discretisation error, <see cref="PanelConvergence"/>). The continuum shares no
/// assumption with the other two, so it is the reference the verdict uses.
/// </summary>
internal static class PanelWallStudy
{
    public const string Kind = "panel-wall";

    /// <param name="full">The model's own analysis when it has run: its result for the panel (the same stiffness matrices,
    /// loads aside) is read, not solved again.</param>
    /// <param name="options">The run's options (its solver factorises each distinct matrix once), or null.</param>
    public static IEnumerable<ComparisonRow> Rows(StructureModel model, PanelWallCheck c, double tol, AnalysisResult? full = null, AnalysisOptions? options = null)
    {
        var u = model.Units;
        var panel = model.Panels.First(p => p.Id == c.PanelId);
        var material = model.Materials.First(m => m.Id == panel.MaterialId);
        var openings = panel.Openings.Select(o => new OpeningSpec(o.Id, o.Left, o.Bottom, o.Width, o.Height)).ToArray();
        // The same wall as a perforated-wall check: the equivalent frame and the hand method read their geometry from it.
        var wall = new PerforatedWallCheck(c.Id, c.Description, c.Tolerance, c.At, panel.Length, panel.Height, panel.Thickness, material,
            c.FormFactor, CheckEnds.Cantilever, openings);

        double Len(double v) => u.FromSI(v, Quantity.Length);
        double Stress(double v) => u.FromSI(v, Quantity.Stress);
        var hand = PerforatedWall.Analyze(Len(panel.Length), Len(panel.Height), Len(panel.Thickness), Stress(material.E), Stress(material.G), EndFixity.Cantilever,
            openings.Select(o => new WallOpening(Len(o.X), Len(o.Y), Len(o.Width), Len(o.Height), o.Label)).ToArray(), 1.0, c.FormFactor);
        double handSI = u.ToSI(hand.Stiffness, Quantity.TranslationalStiffness);

        var frame = EquivalentFrame.Build(wall, u, model.SourcePath, rigidSpandrels: false);
        var rigid = EquivalentFrame.Build(wall, u, model.SourcePath, rigidSpandrels: true);
        double line = PerforatedWallStudy.Stiffness(frame), lineRigid = PerforatedWallStudy.Stiffness(rigid);
        // The same wall without openings bounds any wall with openings from above (removing material cannot stiffen an elastic body).
        double solid = Piers.Rectangular(EndFixity.Cantilever, 1.0, panel.Height, panel.Length, panel.Thickness, material.E, material.G, c.FormFactor).Stiffness;

        var fe = Solved(model, panel, full) ?? Converged(panel, model.SourcePath, options);
        var cv = fe.Convergence!;
        bool extrapolated = double.IsFinite(cv.Extrapolated) && cv.Extrapolated > 0;
        double k = extrapolated ? cv.Extrapolated : cv.Stiffness[^1];
        string element = panel.Mesh.Element == PanelElementKind.Quad9 ? "9-node quadrilaterals" : "4-node incompatible-mode quadrilaterals";
        string panelHow = extrapolated
            ? $"panel \"{panel.Id}\" as declared: plane-stress {element} on its {cv.Stiffness.Length} nested meshes (finest {cv.Unknowns[^1]} unknowns), base held, top tied, unit force through the tie; Richardson-extrapolated, observed order {F2(cv.ObservedOrder)}, estimated discretisation error {Pct3(cv.EstimatedError)}"
            : $"panel \"{panel.Id}\" as declared: plane-stress {element}, finest of {cv.Stiffness.Length} nested meshes ({cv.Unknowns[^1]} unknowns), not extrapolated: {cv.Note}";
        string lineHow = $"Timoshenko line members generated from the panel's geometry (equivalent frame: {frame.PierCount} pier member(s), {frame.SpandrelCount} spandrel(s) of their real depth, rigid zones where piers and spandrels overlap); base fixed, top free; unit force shared by the top joints, stiffness 1/(mean top deflection)";
        // Hand, line model and continuum side by side. The converged panel is the reference (ReferenceChoice); the
        // line models stand beside it with their own ratios.
        var lines = new List<FeEstimate> { new(LineModelName, ComparisonStudy.Stiffness(u, line), lineHow) };
        if (frame.SpandrelCount > 0)
            lines.Add(new FeEstimate("equivalent frame, spandrels made rigid", ComparisonStudy.Stiffness(u, lineRigid),
                $"the same frame with every spandrel's I and shear area multiplied by {EquivalentFrame.RigidFactor:G3}"));
        var panelEstimate = new FeEstimate(PanelEstimate.ModelName, ComparisonStudy.Stiffness(u, k), panelHow, EstimatedError: extrapolated ? cv.EstimatedError : null);
        var (ordered, basis, panelFirst) = ReferenceChoice.Order(lines, panelEstimate, tol, null);
        double aspect = panel.Height / panel.Length;
        bool none = panel.Openings.Count == 0;
        string lineCause = PerforatedWallStudy.Cause(line / handSI, lineRigid / handSI, tol, frame.SpandrelCount, none ? aspect : double.NaN, none ? 0 : line / solid);
        string cause = panelFirst
            ? ReferenceChoice.PanelFirstCause("reference, " + PanelCause(k / handSI, tol, cv.EstimatedError, none)[2..], lines[0], hand.Stiffness, lineCause)
            : lineCause + PanelCause(k / handSI, tol, extrapolated ? cv.EstimatedError : double.NaN, none);
        yield return new ComparisonRow(c.Id, Kind, $"panel \"{panel.Id}\", cantilever", ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
            new HandEstimate(hand.Stiffness, hand.Method.With($"lengths in {u.LengthSymbol}, forces in {u.ForceSymbol} (the breakdown's units)"), Detail: hand.Breakdown),
            ordered, aspect, tol, cause, basis);
    }

    public const string LineModelName = "Timoshenko line model (equivalent frame)";

    /// <summary>The panel solved on its own mesh settings with its convergence study (as the panel's own analysis does), loads left out: they do not change the stiffness.</summary>
    internal static PanelResult Converged(WallPanel panel, string source, AnalysisOptions? options = null) => PanelAnalysis.Run(panel with { Loads = [] }, [], options, source);

    /// <summary>
    /// The panel as the model's own run solved it, when that is the panel on its own base: its convergence study is the
    /// one <see cref="Converged"/> would make (the loads add right-hand sides, not matrices, and each solve stands alone),
    /// so it is read instead of being assembled and factorised again. Null for a panel on a footing (its own run stands
    /// on the springs, the check's on a held base) or when the run has no convergence study of it.
    /// </summary>
    private static PanelResult? Solved(StructureModel model, WallPanel panel, AnalysisResult? full)
    {
        if (full is null || model.Footings.Any(f => f.Panel == panel.Id)) return null;
        var r = full.Panels.FirstOrDefault(p => p.Panel.Id == panel.Id);
        return r?.Convergence is null ? null : r;
    }

    /// <summary>What the converged panel says about the hand value, appended to the row's cause (docs/comparisons.md).</summary>
    /// <param name="panelOverHand">Converged panel stiffness over the hand value.</param>
    /// <param name="error">The panel's estimated relative discretisation error (NaN when not extrapolated).</param>
    internal static string PanelCause(double panelOverHand, double tol, double error, bool solid)
    {
        var v = ComparisonRow.Judge(panelOverHand, tol);
        string of = $"{panelOverHand.ToString("0.000", CultureInfo.InvariantCulture)} of the hand value";
        string words = v switch
        {
            Verdict.WithinTolerance => solid ? "within the tolerance: the continuum bears out the flexure-plus-shear cantilever formula" : "within the tolerance: the continuum bears out the perforated-wall method",
            Verdict.HandHigher => solid
                ? "softer: by the continuum's measure the cantilever formula is too stiff (plane sections and a uniform shear strain do not hold near the held base of a deep wall)"
                : "softer: by the continuum's measure the hand method is too stiff (it holds the wall around the openings rigid and the piers fixed-fixed, where the continuum lets spandrels and wall bend and shear)",
            _ => solid
                ? "stiffer: by the continuum's measure the cantilever formula is too soft (the tied top and held base restrain the warping the shear area lets happen)"
                : "stiffer: by the continuum's measure the hand method is too soft (subtracting a solid strip and adding back independent piers ignores the wall beside and between openings that works with them)",
        };
        string err = double.IsNaN(error)
            ? "; no error estimate (not extrapolated): refine the panel's mesh before trusting its number"
            : $" (estimated discretisation error {Pct3(error)}{(error > Math.Abs(panelOverHand - 1) ? ", larger than the gap: refine the panel's mesh before reading the gap" : "")})";
        return $"; converged plane-stress panel: {of}, {words}{err}";
    }

    private static string F2(double v) => v.ToString("0.00", CultureInfo.InvariantCulture);

    private static string Pct3(double fraction) => (100 * fraction).ToString("0.000", CultureInfo.InvariantCulture) + "%";
}
