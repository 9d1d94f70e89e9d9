using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

/// <summary>The tributary (flexible-floor) split of a floor's load among lines of resistance.</summary>
public class TributarySplitTests
{
    [Fact]
    public void ThreeEqualLinesOnTwoEqualSpansTakeAQuarterAHalfAQuarter()
    {
        // Wight & MacGregor, Reinforced Concrete: Mechanics and Design, the section on diaphragm stiffness: three equal walls
        // under a flexible diaphragm with a uniform load take 1/4, 1/2, 1/4 (1/3 each under a rigid one).
        var r = TributarySplit.Uniform([new TributaryLine("A", 0, 5), new TributaryLine("B", 60, 5), new TributaryLine("C", 120, 5)], 0, 120, 100);
        Assert.Equal([0.25, 0.5, 0.25], r.Lines.Select(l => l.Share).ToArray());
        Assert.Equal([25.0, 50.0, 25.0], r.Lines.Select(l => l.Force).ToArray());
        Assert.Equal((30.0, 90.0), (r.Lines[1].From, r.Lines[1].To));
    }

    [Fact]
    public void UnequalSpansFollowTheLeverRuleOfEachSimpleSpan()
    {
        // Derived: spans of 20 and 60 under w = 160/80 = 2 per unit length. Each simple span sends half its load wL to
        // each of its ends (lever rule, load centred): A = w·20/2 = 20, B = w·20/2 + w·60/2 = 80, C = w·60/2 = 60.
        // Given out of order, the results follow the order given.
        var r = TributarySplit.Uniform([new TributaryLine("C", 80), new TributaryLine("A", 0), new TributaryLine("B", 20)], 0, 80, 160);
        Assert.Equal(60, r.Lines[0].Force, 12);
        Assert.Equal(20, r.Lines[1].Force, 12);
        Assert.Equal(80, r.Lines[2].Force, 12);
        Assert.Equal(160, r.Lines.Sum(l => l.Force), 12);
    }

    [Fact]
    public void AnOverhangIsTributaryToItsEndLine()
    {
        // Common practice: the floor 0..100 on lines at 10, 50, 90; each end line takes its 10 of overhang with half the
        // 40 span: strips 30, 40, 30 of 100 (w = 1).
        var r = TributarySplit.Uniform([new TributaryLine("A", 10), new TributaryLine("B", 50), new TributaryLine("C", 90)], 0, 100, 100);
        Assert.Equal([30.0, 40.0, 30.0], r.Lines.Select(l => Math.Round(l.Force, 12)).ToArray());
    }

    [Fact]
    public void LinesAtOnePositionShareTheirStripByStiffness()
    {
        // Derived: two lines at x = 0 with stiffnesses 1 and 3 share the strip 0..30 (load 30 of w = 1) as 7.5 and 22.5.
        var r = TributarySplit.Uniform([new TributaryLine("A1", 0, 1), new TributaryLine("A2", 0, 3), new TributaryLine("B", 60, 2)], 0, 60, 60);
        Assert.Equal(7.5, r.Lines[0].Force, 12);
        Assert.Equal(22.5, r.Lines[1].Force, 12);
        Assert.Equal(30, r.Lines[2].Force, 12);
        // Without stiffnesses they share equally.
        var e = TributarySplit.Uniform([new TributaryLine("A1", 0), new TributaryLine("A2", 0), new TributaryLine("B", 60)], 0, 60, 60);
        Assert.Equal(15, e.Lines[0].Force, 12);
    }

    [Fact]
    public void OnePositionOrALineOffTheFloorIsRefused()
    {
        Assert.Throws<ArgumentException>(() => TributarySplit.Uniform([new TributaryLine("A", 0), new TributaryLine("B", 0)], 0, 10, 1));
        Assert.Throws<ArgumentException>(() => TributarySplit.Uniform([new TributaryLine("A", 0), new TributaryLine("B", 12)], 0, 10, 1));
        Assert.Throws<ArgumentException>(() => TributarySplit.Uniform([new TributaryLine("A", 0), new TributaryLine("B", 10)], 10, 10, 1));
    }
}
