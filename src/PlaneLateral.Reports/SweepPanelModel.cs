using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
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
        Mesh = new PanelMeshSettings(PanelElementKind.Quad9, 0, ElementsAcross, MaxAspect: 4, MaxNodes: 40000, Refinements: Meshes),
    };

    public (double Stiffness, double? ShearShare) Solve(SweepWall wall)
    {
        var s = SolveConverged(wall);
        return (s.Stiffness, s.ShearShare);
    }

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
        return [];
    }
}
