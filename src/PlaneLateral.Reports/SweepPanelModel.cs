using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Meshing;
using PlaneLateral.Studies;
using PlaneLateral.Units;
using PlaneLateral.Model;

namespace PlaneLateral.Reports;

/// <summary>A sweep FE result with its mesh-convergence facts (SI).</summary>
/// <param name="Stiffness">Lateral stiffness (N/m): the extrapolated value when there is one, else the finest mesh's.</param>
/// <param name="ShearShare">Shear share of the top deflection when the model can measure it, else null.</param>
/// <param name="EstimatedError">Estimated relative discretisation error of the finest mesh, |k∞ − k_finest| / k∞, or null when not extrapolated.</param>
/// <param name="ObservedOrder">Observed order of convergence, or null.</param>
/// <param name="FinestUnknowns">Unknowns of the finest mesh.</param>
public sealed record SweepFeSolution(double Stiffness, double? ShearShare, double? EstimatedError, double? ObservedOrder, int FinestUnknowns);

/// <summary>
/// A sweep FE model solved on a mesh sequence: it reports the estimated discretisation error beside the stiffness, and
/// may refuse specs it cannot model (the sweep lists those problems with its own, before any work).
/// </summary>
public interface IConvergedSweepFeModel : ISweepFeModel
{
    /// <summary>Stiffness with its convergence facts.</summary>
    SweepFeSolution SolveConverged(SweepWall wall);

    /// <summary>What in the spec this model cannot take, in plain words with a fix each; empty when it can run.</summary>
    IReadOnlyList<string> Problems(SweepSpec spec);
}

/// <summary>
/// The wall as a plane-stress continuum (<see cref="PanelAnalysis"/>): 9-node quadrilaterals, base held, top edge tied
/// (cantilever) or tied and guided, translating without rotating (fixed-fixed, <see cref="PanelTop.Guided"/>); unit
/// force through the top tie; ν = E/(2G) − 1. Solved on <c>meshes</c> nested meshes (h, h/2, h/4) from
/// <c>elementsAcross</c> elements across the wall's shorter side, and Richardson-extrapolated with its estimated error
/// (<see cref="PanelConvergence"/>). It shares no assumption with the hand formula (no plane sections, no shear
/// factor), so it is the sweep's reference.
/// </summary>
public sealed class PanelWallModel : IConvergedSweepFeModel
{
    /// <summary>The sweep's default: 2 elements across the shorter side on the coarsest of 3 meshes (8 across on the finest).</summary>
    public PanelWallModel(int elementsAcross = 2, int meshes = 3)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(elementsAcross, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(meshes, 2);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(meshes, 4);
        ElementsAcross = elementsAcross;
        Meshes = meshes;
    }

    public int ElementsAcross { get; }
    public int Meshes { get; }

    public string Name => "plane-stress panel";

    public string Description =>
        $"the wall as 9-node plane-stress quadrilaterals (nu = E/(2G) - 1), base held, top edge tied (cantilever) or tied and guided so it translates without rotating (fixed-fixed), unit force through the tie; {Meshes} nested meshes from {ElementsAcross} elements across the shorter side (finest {ElementsAcross << (Meshes - 1)} across), stiffness Richardson-extrapolated with its estimated discretisation error";

    /// <summary>The panel the sweep solves for <paramref name="w"/>: the same a model file would give with these mesh settings.</summary>
    public WallPanel Panel(SweepWall w) => new()
    {
        Id = $"sweep wall h/l = {w.AspectRatio.ToString("G6", CultureInfo.InvariantCulture)}",
        X0 = 0, Y0 = 0, Length = w.Length, Height = w.Height, Thickness = w.Thickness, MaterialId = "sweep",
        E = w.E, Nu = w.E / (2 * w.G) - 1,
        FloorTies = true,
        Top = w.Ends == EndFixity.FixedFixed ? PanelTop.Guided : PanelTop.Free,
        Openings = w.Openings.Select(o => new PanelOpening(o.Label, o.X, o.Y, o.Width, o.Height)).ToArray(),
        Mesh = new PanelMeshSettings(PanelElementKind.Quad9, 0, ElementsAcross, MaxAspect: 4, MaxNodes: MaxNodes, Refinements: Meshes),
    };

    /// <summary>Largest finest mesh a sweep point may have (nodes); a wall needing more is refused before any work.</summary>
    public const int MaxNodes = 40000;

    public (double Stiffness, double? ShearShare) Solve(SweepWall wall)
    {
        var s = SolveConverged(wall);
        return (s.Stiffness, s.ShearShare);
    }

    /// <summary>The base mesh's planned nodes: the nested meshes and the banded factorisation grow with it alike.</summary>
    public double Cost(SweepWall wall) => Math.Max(1, PanelMesher.PlannedNodes(Panel(wall)));

    public SweepFeSolution SolveConverged(SweepWall wall)
    {
        var r = PanelAnalysis.Run(Panel(wall), []);
        var c = r.Convergence!;
        bool extrapolated = double.IsFinite(c.Extrapolated) && c.Extrapolated > 0;
        return new SweepFeSolution(extrapolated ? c.Extrapolated : c.Stiffness[^1], null,
            extrapolated ? c.EstimatedError : null, double.IsFinite(c.ObservedOrder) ? c.ObservedOrder : null, c.Unknowns[^1]);
    }

    public IReadOnlyList<string> Problems(SweepSpec spec)
    {
        double nu = spec.E / (2 * spec.G) - 1;
        if (double.IsFinite(nu) && !(nu > -1 && nu < 0.5))
            return [$"the plane-stress panel needs an isotropic material, but E and G give Poisson's ratio E/(2G) - 1 = {nu.ToString("G4", CultureInfo.InvariantCulture)}, not below 0.5 (G is not above E/3). Fix: give --nu (G = E/(2(1+nu))), or a --G above E/3, or --no-panel to leave the panel out."];
        if (spec.Opening is null) return [];
        // A window leaves piers (1 - wf)·l/2 wide and wall (1 - hf)·h/2 deep above and below it; the mesh puts
        // ElementsAcross elements across the narrowest of them. Every point's panel is planned (cheap) before any solve.
        var u = spec.Units;
        double l = u.ToSI(spec.Length, Quantity.Length), t = u.ToSI(spec.Thickness, Quantity.Length);
        double e = u.ToSI(spec.E, Quantity.Stress), g = u.ToSI(spec.G, Quantity.Stress);
        foreach (var ends in spec.Ends)
            foreach (double a in spec.AspectRatios())
            {
                var w = new SweepWall(a, a * l, l, t, e, g, spec.FormFactor, ends) { Opening = spec.Opening };
                var bad = PanelMesher.Check(Panel(w));
                if (bad.Count > 0)
                    return [$"at h/l = {a.ToString("G4", CultureInfo.InvariantCulture)} the plane-stress panel with {spec.Opening.Words} cannot be meshed: {string.Join("; ", bad.Select(q => q.Problem))}. Fix: give a smaller --opening-width or --opening-height (thicker piers and spandrels), a narrower h/l range, or --no-panel to leave the panel out."];
            }
        return [];
    }
}

/// <summary>
/// A wall with a window as the equivalent frame of Timoshenko line members (docs/comparisons.md §3), built exactly as
/// the perforated-wall comparison builds it (<see cref="EquivalentFrameWall"/>): piers beside the window, spandrels of
/// their real depth above it, solid wall below (and above, fixed-fixed) as full-length wall members, rigid zones and
/// links where pieces overlap; unit force shared by the top joints. It reports no shear share.
/// </summary>
public sealed class EquivalentFrameWallModel : ISweepFeModel
{
    public string Name => "equivalent frame";

    public string Description =>
        "the wall as the equivalent frame of exact Timoshenko line members the perforated-wall comparison generates (docs/comparisons.md section 3): piers beside the window, spandrels of their real depth, solid wall below (and above, fixed-fixed) as full-length wall members, rigid zones and links where pieces overlap; base fixed, top free or held against rotation; unit force shared by the top joints, stiffness 1/(mean top deflection)";

    public (double Stiffness, double? ShearShare) Solve(SweepWall w)
    {
        var mat = new Material("sweep", w.E, w.G, w.E / (2 * w.G) - 1);
        var (k, _, _) = EquivalentFrameWall.Stiffness($"sweep wall h/l = {w.AspectRatio.ToString("G6", CultureInfo.InvariantCulture)}",
            w.Length, w.Height, w.Thickness, mat, w.FormFactor, w.Ends == EndFixity.FixedFixed, w.Openings);
        return (k, null);
    }
}
