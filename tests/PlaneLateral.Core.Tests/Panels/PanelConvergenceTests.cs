using PlaneLateral.Analysis;
using PlaneLateral.Model;
using Xunit.Abstractions;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>The convergence study: observed order and Richardson extrapolation of the top stiffness.</summary>
public class PanelConvergenceTests(ITestOutputHelper output)
{
    private static WallPanel Panel(PanelElementKind kind, int across, int meshes, IReadOnlyList<PanelOpening>? openings = null) => new()
    {
        Id = "W", X0 = 0, Y0 = 0, Length = 4, Height = 3, Thickness = 0.2, MaterialId = "C", E = 25e9, Nu = 0.2,
        Openings = openings ?? [], Mesh = new PanelMeshSettings(kind, 0, across, Refinements: meshes),
    };

    [Fact]
    public void RichardsonExtrapolationOfTheFourNodeMeshesLandsNearerTheConvergedStiffness()
    {
        // Richardson (1911): with an observed order p from three nested meshes, k∞ = k₃ + (k₃ − k₂)/(2ᵖ − 1) removes the
        // leading error term. The "converged" stiffness comes from the independent 9-node element on its finest mesh.
        // The displacement-based FE stiffness converges from above (common practice: compatible models are too stiff;
        // QM6 is not strictly compatible, but is in practice on rectangles).
        var study = PanelConvergence.Study(Panel(PanelElementKind.Quad4, 1, 3), 3);
        var q9 = PanelConvergence.Study(Panel(PanelElementKind.Quad9, 1, 3), 3);
        double best = q9.Stiffness[^1];
        output.WriteLine($"QM6 k: {string.Join(", ", study.Stiffness.Select(k => k.ToString("E6")))}; p = {study.ObservedOrder:0.00}; k∞ = {study.Extrapolated:E6}, est. error {study.EstimatedError:E2}");
        output.WriteLine($"Q9  k: {string.Join(", ", q9.Stiffness.Select(k => k.ToString("E6")))}; p = {q9.ObservedOrder:0.00}; k∞ = {q9.Extrapolated:E6}");
        Assert.True(study.Stiffness[0] > study.Stiffness[1] && study.Stiffness[1] > study.Stiffness[2], "converges from above");
        Assert.True(Math.Abs(study.Extrapolated - best) < Math.Abs(study.Stiffness[^1] - best), "extrapolation improves on the finest mesh");
        // The estimated error of the finest mesh is of the size of its actual error (within a factor 3, common practice
        // for Richardson estimates in the asymptotic range).
        double actual = Math.Abs(study.Stiffness[^1] - best) / best;
        Assert.InRange(study.EstimatedError / actual, 1.0 / 3, 3);
    }

    [Fact]
    public void ReentrantCornersOfAnOpeningLimitTheObservedOrder()
    {
        // The corners of an opening are re-entrant (270°): the elastic field there varies as r^λ with λ = 0.5445
        // (Williams, J. Appl. Mech. 19, 1952, first mode of a free-free 270° wedge), so on uniform meshes the energy —
        // and with it the stiffness — converges as h^(2λ) ≈ h^1.09 whatever the element order (Strang & Fix, An
        // Analysis of the Finite Element Method, 1973, §8.2). The observed order must come out near 1.1, well below the
        // element's smooth-problem 2: between 0.8 and 1.6 (four nested QM6 meshes, order from the three finest).
        var window = new PanelOpening("win", 1.5, 1, 1, 1);
        var study = PanelConvergence.Study(Panel(PanelElementKind.Quad4, 1, 4, [window]), 4);
        output.WriteLine($"QM6 with window k: {string.Join(", ", study.Stiffness.Select(k => k.ToString("E6")))}; p = {study.ObservedOrder:0.00}; k∞ = {study.Extrapolated:E6}, est. error {study.EstimatedError:E2}");
        Assert.InRange(study.ObservedOrder, 0.8, 1.6);
    }

    [Fact]
    public void ExtrapolationFormulaIsRichardsons()
    {
        // Derived: k(h) = k∞ + C·h² exactly → p = 2 and k∞ recovered to round-off.
        double[] h = [1, 0.5, 0.25];
        var k = h.Select(x => 10 + 3 * x * x).ToArray();
        var r = PanelConvergence.Extrapolate(h, k, [1, 2, 3]);
        Near(2, r.ObservedOrder, 1e-12, "order");
        Near(10, r.Extrapolated, 1e-12, "limit");
        Near(3 * 0.0625 / 10, r.EstimatedError, 1e-9, "estimated error of the finest");
        Assert.True(double.IsNaN(PanelConvergence.Extrapolate(h, [1, 2, 1.5], [1, 2, 3]).ObservedOrder), "oscillating results give no order");
    }

    [Fact]
    public void AStudyIsRunWhenTheMeshSettingsAskForIt()
    {
        var r = PanelAnalysis.Run(Panel(PanelElementKind.Quad4, 1, 3), []);
        Assert.NotNull(r.Convergence);
        Assert.Equal(3, r.Convergence!.Stiffness.Length);
        Assert.Equal(r.TopStiffness, r.Convergence.Stiffness[0]);
        Assert.Null(PanelAnalysis.Run(Panel(PanelElementKind.Quad4, 1, 1), []).Convergence);
    }
}
