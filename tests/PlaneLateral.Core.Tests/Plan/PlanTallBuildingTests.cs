using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.Plan.PlanJson;

namespace PlaneLateral.Tests.Plan;

/// <summary>
/// A building at the floor limit (<see cref="ModelLimits.MaxFloors"/>) with very slender walls: its floors are held (the
/// lines' rows span x, y and the turn), so it must solve, not be refused as a mechanism because the eigenvalues of its
/// floor stiffness spread over more than ten orders.
/// </summary>
public sealed class PlanTallBuildingTests
{
    private static readonly double[][] Box = [[0, 0], [60, 0], [60, 40], [0, 40]];

    [Fact]
    public void SlenderWallsAtTheFloorLimitSolveAndSplitBySymmetry()
    {
        int n = ModelLimits.MaxFloors;
        var elevations = Enumerable.Range(0, n + 1).Select(i => 12.0 * i).ToArray();
        object[] loads = [new { id = "EY", direction = "y", forces = Enumerable.Repeat(1.0, n).ToArray() }];
        // Walls 6 ft long, 3,600 ft tall; the y-walls symmetric about the centroid x = 30 ft.
        object[] lines = [Wall("A", 0, 20, "y", 6), Wall("B", 60, 20, "y", 6), Wall("C", 30, 0, "x", 6), Wall("D", 30, 40, "x", 6)];
        var plan = Read(PlanBuilding(lines, loads, elevations, Box));

        // What the eigenvalue test of K used to see: a spread wider than its tolerance, so it called this a mechanism.
        var condensed = plan.Lines.Select(l => PlanAnalysis.Condense(l, n)).ToList();
        var k = PlanAnalysis.Assemble(plan.Lines, condensed.Select(c => c.K).ToList(), n);
        var (values, _) = SymmetricEigen.Solve(PlanAnalysis.Scaled(k, n, plan.Size));
        Assert.True(values[^1] < PlanAnalysis.MechanismTolerance * values[0], $"spread {values[^1] / values[0]:E2} is no test of the old check");

        var r = PlanAnalysis.Run(plan, condensed: condensed);
        var ey = r.Case("EY");
        // By symmetry (derived) each y-wall carries half of every story shear in the case at the centroid. The floor
        // stiffness is conditioned near 10¹¹ here, so about five digits are assured (κ·u), not more: measured 0.5000005.
        foreach (int s in new[] { 1, n / 2, n })
        {
            double v = ey.Stories[s - 1].Vy;
            foreach (var line in new[] { "A", "B" })
                Assert.InRange(ey.LineStories.Single(x => x.Story == s && x.Line == line).Shear / v, 0.5 - 5e-6, 0.5 + 5e-6);
        }
        Assert.True(ey.Equilibrium.RelativeError < 1e-6, $"imbalance {ey.Equilibrium.RelativeError:E2}");
    }
}
