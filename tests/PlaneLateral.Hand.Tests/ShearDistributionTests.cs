using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

public class ShearDistributionTests
{
    [Fact]
    public void SharesByRelativeRigidity()
    {
        // V_i = V·k_i/Σk (common practice; Taly ch. 7). Hand: k = 1, 2, 3, 4, Σk = 10, V = 100 → 10, 20, 30, 40;
        // drift 100/10 = 10.
        var r = ShearDistribution.ByRelativeRigidity(100, [1, 2, 3, 4]);
        Assert.Equal([0.1, 0.2, 0.3, 0.4], r.Shares.Select(s => Math.Round(s, 12)));
        Assert.Equal(30.0, r.Forces[2], 12);
        Assert.Equal(10.0, r.TotalStiffness, 12);
        Assert.Equal(10.0, r.Drift, 12);
    }

    [Fact]
    public void SharesSumToOne()
    {
        // Σ k_i/Σk = 1 by construction (derived by hand); forces sum to V (equilibrium).
        var r = ShearDistribution.ByRelativeRigidity(-37.5, [9418, 312.2, 45.01, 7777, 0.3]);
        Assert.Equal(1.0, r.Shares.Sum(), 12);
        Assert.Equal(-37.5, r.Forces.Sum(), 10);
    }

    [Fact]
    public void NonPositiveStiffnessIsRejected()
    {
        var ex = Assert.Throws<ArgumentException>(() => ShearDistribution.ByRelativeRigidity(10, [1, 0]));
        Assert.Contains("element 2", ex.Message);
        Assert.Throws<ArgumentException>(() => ShearDistribution.ByRelativeRigidity(10, []));
    }
}
