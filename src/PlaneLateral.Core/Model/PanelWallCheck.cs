namespace PlaneLateral.Model;

/// <summary>
/// A wall panel declared under "panels", named by its id, checked as a cantilever (base fixed, top free, load through
/// the top floor tie): the hand perforated-wall method and the Timoshenko line model (equivalent frame) built from the
/// panel's geometry and material, beside the panel's own converged plane-stress stiffness (docs/comparisons.md,
/// "panel-wall"). The reader has made sure the panel exists, has no floor levels below its top, ties its top, and
/// asks for at least three nested meshes.
/// </summary>
/// <param name="PanelId">Id of the panel under "panels".</param>
/// <param name="FormFactor">Shear form factor f = A/A_s of the hand method and the line members (1.2 for a rectangle).</param>
public sealed record PanelWallCheck(string Id, string Description, double? Tolerance, CheckLocation At, string PanelId, double FormFactor)
    : ComparisonCheck(Id, Description, Tolerance, At);
