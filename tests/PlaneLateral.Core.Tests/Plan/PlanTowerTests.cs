using PlaneLateral.Analysis;
using PlaneLateral.Benchmarks;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Plan;

/// <summary>
/// The plan benchmark's building (benchmarks/PlaneLateral.Benchmarks/PlanTower.cs, 40 stories, 24 wall and frame lines,
/// invented) solves and balances, so that the model the benchmark times is a right one. Not timed.
/// </summary>
public class PlanTowerTests
{
    [Fact]
    public async Task TheBenchmarkTowerSolvesAndItsLineForcesBalanceTheFloorLoads()
    {
        var r = await Task.Run(() => PlanAnalysis.Run(ModelReader.ParsePlan(PlanTower.Json(), "plan-tower.json"))).WaitAsync(TimeSpan.FromSeconds(120));

        Assert.Equal(PlanTower.Stories, r.Plan.FloorCount);
        Assert.Equal(PlanTower.Lines, r.Lines.Count);
        Assert.Equal(6, r.Cases.Count);   // WX, WY, each at the centre of mass and ± the accidental eccentricity (docs/plan.md)
        // The applied total, in newtons: Σ 0.5·i kip for i = 1..40 = 410 kip (derived), 1 kip = 4448.2216152605 N (exact by definition).
        double total = 410 * PlanJson.KipN;
        foreach (var c in r.Cases)
        {
            var eq = c.Equilibrium;
            double applied = c.Case.Direction == "x" ? eq.AppliedFx : eq.AppliedFy;
            Assert.Equal(total, applied, total * 1e-12);
            // Σ line forces = applied, in ΣFx, ΣFy and ΣMz about the origin (the plan equilibrium check, common practice).
            Assert.True(eq.RelativeError < 1e-10, $"{c.Case.Id}: equilibrium {eq.RelativeError}");
            Assert.Equal(eq.AppliedFx, eq.LinesFx, total * 1e-10);
            Assert.Equal(eq.AppliedFy, eq.LinesFy, total * 1e-10);
            Assert.True(c.BackwardError < 1e-12, $"{c.Case.Id}: floor backward error {c.BackwardError}");
            // The base story shear of the lines along the loading sums to the applied total (Σ story shear = load above the cut).
            double along = c.LineStories.Where(s => s.Story == 1).Sum(s => { var l = r.Plan.Lines.First(x => x.Id == s.Line); return s.Shear * (c.Case.Direction == "x" ? l.Cos : l.Sin); });
            Assert.Equal(total, along, total * 1e-9);
        }
        foreach (var l in r.Lines)
        {
            Assert.True(l.CondensationBackwardError < 1e-12, $"{l.Line.Id}: condensation {l.CondensationBackwardError}");
            Assert.True(l.RecoveryError < 1e-8, $"{l.Line.Id}: recovery {l.RecoveryError}");
        }
        // The plan is unsymmetric: the ±eccentricity cases turn the floors (a non-zero roof rotation).
        Assert.True(r.Cases.All(c => Math.Abs(c.Motion[^1].Rz) > 0));
    }
}
