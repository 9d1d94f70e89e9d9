using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

/// <summary>Relative rigidity with torsion (Taly, Design of Reinforced Masonry Structures, 2nd ed., 2010, §7.9).</summary>
public class TorsionSplitTests
{
    private static void Near(double expected, double actual, double tol, string what) =>
        Assert.True(Math.Abs(actual - expected) <= tol * Math.Abs(expected), $"{what}: expected {expected}, got {actual}");

    [Fact]
    public void TalyExample7_12()
    {
        // Taly Ex. 7.12: A (x = 0, R = 4.5) and B (x = 90 ft, R = 5.5) along y; C (y = 0) and D (y = 60 ft), R = 4, along x.
        // V = 100 kip along y at x = 45 − 4.5 = 40.5 ft (centre of mass shifted by 5 % of 90 ft): x_R = 49.5 ft, J = 27,247.5,
        // T = 100·(40.5 − 49.5) = −900 kip·ft; V_A = 45 + 7.36 = 52.36, V_B = 55 − 7.36 = 47.64; design V_B = 55 kip.
        var lines = new[]
        {
            new TorsionLine("A", 0, 30, Math.PI / 2, 4.5), new TorsionLine("B", 90, 30, Math.PI / 2, 5.5),
            new TorsionLine("C", 45, 0, 0, 4), new TorsionLine("D", 45, 60, 0, 4),
        };
        var r = TorsionSplit.Split(lines, 0, 100, 40.5 * 100);
        Near(49.5, r.XR, 1e-12, "x_R");
        Near(30, r.YR, 1e-12, "y_R");
        Near(27247.5, r.J, 1e-12, "J");
        Near(-900, r.Torque, 1e-12, "T");
        Near(52.36, r.Lines[0].Total, 1e-4, "V_A");
        Near(47.64, r.Lines[1].Total, 1e-4, "V_B");
        Near(52.36, r.Lines[0].Design, 1e-4, "design V_A");
        Near(55, r.Lines[1].Design, 1e-12, "design V_B");
        var locked = TorsionSplit.Split(lines, 0, 100, 40.5 * 100, lockRotation: true);
        Near(45, locked.Lines[0].Total, 1e-12, "locked V_A");
        Assert.Equal(0, locked.Lines[2].Total);
    }

    [Fact]
    public void ParallelLinesAreRefused() =>
        Assert.Throws<ArgumentException>(() => TorsionSplit.Split([new TorsionLine("A", 0, 0, 0, 1), new TorsionLine("B", 0, 5, 0, 1)], 1, 0, 0));
}
