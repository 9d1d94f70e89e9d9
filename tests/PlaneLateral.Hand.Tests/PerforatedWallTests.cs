using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

public class PerforatedWallTests
{
    // Hand-friendly material: t = 1, E = 1000, G = 400 (G = 0.4E), f = 1.2, P = 1. For a solid rectangle of height h
    // and length l (r = h/l) the general formula then reads (identity derived in PierTests):
    //   fixed-fixed  Δ = r³/1000 + 0.003·r,      cantilever  Δ = 4r³/1000 + 0.003·r.
    private const double T = 1, E = 1000, G = 400;

    private static double FixedFixed(double h, double l) => Math.Pow(h / l, 3) / 1000 + 0.003 * h / l;
    private static double Cantilever(double h, double l) => 4 * Math.Pow(h / l, 3) / 1000 + 0.003 * h / l;

    [Theory]
    [InlineData(EndFixity.Cantilever)]
    [InlineData(EndFixity.FixedFixed)]
    public void NoOpeningsEqualsSolidWall(EndFixity ends)
    {
        // Common practice: with nothing cut out, the method is the solid pier formula.
        var r = PerforatedWall.Analyze(20, 12, T, E, G, ends, []);
        var solid = Piers.Rectangular(ends, 1, 12, 20, T, E, G);
        Assert.Equal(solid.TotalDeflection, r.Deflection, 14);
        Assert.Single(r.Steps);
    }

    [Theory]
    [InlineData(EndFixity.Cantilever)]
    [InlineData(EndFixity.FixedFixed)]
    public void FullHeightOpeningGivesTwoPiersInParallel(EndFixity ends)
    {
        // A full-height opening (x 8..11) leaves piers 8 and 9 long, 10 high; rigidities add (common practice).
        // The solid wall and the removed strip are then the same rectangle and cancel.
        var r = PerforatedWall.Analyze(20, 10, T, E, G, ends, [new WallOpening(8, 0, 3, 10, "D")]);
        double k1 = Piers.Rectangular(ends, 1, 10, 8, T, E, G).Stiffness;
        double k2 = Piers.Rectangular(ends, 1, 10, 9, T, E, G).Stiffness;
        Assert.Equal(k1 + k2, r.Stiffness, 9);
    }

    [Fact]
    public void OneWindowWorkedByHand()
    {
        // Derived by hand (invented wall). Cantilever wall l = 20, h = 12; window 4 wide, 4 high, x 6..10, y 4..8.
        //   solid wall, cantilever, r = 0.6:     4·0.216/1000 + 0.0018       = 0.002664
        //   minus strip y 4..8, fixed-fixed, r = 0.2: 0.008/1000 + 0.0006    = 0.000608
        //   piers, fixed-fixed, h = 4:
        //     left  l = 6,  r = 0.6667: 0.296296/1000 + 0.002 = 0.0022963  → R = 435.48
        //     right l = 10, r = 0.4:    0.064/1000   + 0.0012 = 0.001264   → R = 791.14
        //     together ΣR = 1226.62 → Δ = 0.00081525
        //   wall: 0.002664 − 0.000608 + 0.00081525 = 0.00287125; rigidity 348.28.
        var r = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(6, 4, 4, 4, "W")]);
        Assert.Equal(0.00287125, r.Deflection, 8);
        Assert.Equal(348.28, r.Stiffness, 2);
        // The breakdown a reviewer follows: solid (+), strip (−), two piers, piers together (+).
        Assert.Equal([WallStepKind.SolidRegion, WallStepKind.StripRemoved, WallStepKind.Pier, WallStepKind.Pier, WallStepKind.BandAdded],
            r.Steps.Select(s => s.Kind));
        Assert.Equal(0.000608, r.Steps[1].Deflection, 9);
        Assert.Equal(-1, r.Steps[1].Sign);
        Assert.Equal(435.48, r.Steps[2].Rigidity, 2);
        Assert.Equal(6.0, r.Steps[2].Length, 12);
        Assert.Equal(4.0, r.Steps[2].Height, 12);
        Assert.Equal(EndFixity.FixedFixed, r.Steps[2].Ends);
        Assert.Contains("left of 'W'", r.Steps[2].Label);
        Assert.Contains("right of 'W'", r.Steps[3].Label);
        Assert.Contains("= wall deflection", r.Breakdown);
    }

    [Fact]
    public void OneWindowInFixedFixedWallByHand()
    {
        // Derived by hand: the wall of OneWindowWorkedByHand held against rotation at its top.
        //   solid wall, fixed-fixed, r = 0.6: 0.216/1000 + 0.0018 = 0.002016
        //   minus strip 0.000608, plus piers 0.00081525 (both as before, fixed-fixed)
        //   wall: 0.002016 − 0.000608 + 0.00081525 = 0.00222325.
        var r = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.FixedFixed, [new WallOpening(6, 4, 4, 4, "W")]);
        Assert.Equal(0.00222325, r.Deflection, 8);
    }

    [Fact]
    public void TopLevelLinesOfTheBreakdownAddUpToTheTotal()
    {
        // A reviewer adds the depth-0 lines with their signs and must land on the total (the procedure's definition).
        var r = PerforatedWall.Analyze(24, 14, T, E, G, EndFixity.Cantilever,
            [new WallOpening(2, 0, 3, 8, "D"), new WallOpening(12, 4, 4, 4, "W1"), new WallOpening(18, 10, 3, 2, "W2")]);
        double sum = r.Steps.Where(s => s.Depth == 0).Sum(s => s.Sign * s.Deflection);
        Assert.Equal(r.Deflection, sum, 14);
        Assert.Equal(r.Load / r.Deflection, r.Stiffness, 12);
    }

    [Fact]
    public void DoorAndWindowWithRecursionWorkedByHand()
    {
        // Derived by hand (invented wall). Cantilever wall l = 20, h = 12.
        // Door D x 2..5, y 0..8; window W x 12..16, y 4..8. One band y 0..8 (the openings overlap in height).
        // The door spans the band, so it cuts the strip into a left pier (x 0..2) and a right part (x 5..20)
        // that still holds the window: a sub-wall, worked the same way.
        //   solid wall, cantilever, r = 0.6:                 0.002664
        //   minus strip y 0..8, fixed-fixed, r = 0.4:         0.064/1000 + 0.0012      = 0.001264
        //   left pier l = 2, h = 8, fixed-fixed, r = 4:       64/1000 + 0.012          = 0.076      → R = 13.158
        //   sub-wall x 5..20 (l = 15), h = 8, fixed-fixed:
        //     solid, r = 0.5333:                              0.151704/1000 + 0.0016   = 0.0017517
        //     minus strip y 4..8, r = 0.2667:                 0.018963/1000 + 0.0008   = 0.00081896
        //     piers h = 4: l = 7 (x 5..12), r = 0.5714:       0.186589/1000 + 0.0017143 = 0.0019009 → R = 526.08
        //                  l = 4 (x 16..20), r = 1:           0.001 + 0.003            = 0.004     → R = 250
        //                  together Δ = 1/776.08             = 0.0012885
        //     sub-wall Δ = 0.0017517 − 0.00081896 + 0.0012885 = 0.0022213 → R = 450.19
        //   band: ΣR = 13.158 + 450.19 = 463.35 → Δ = 0.0021582
        //   wall: 0.002664 − 0.001264 + 0.0021582 = 0.0035582.
        // Note the pier between door and window (x 5..12) comes out 4 high, the shorter opening's height.
        var r = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever,
            [new WallOpening(2, 0, 3, 8, "D"), new WallOpening(12, 4, 4, 4, "W")]);
        Assert.Equal(0.0035582, r.Deflection, 7);
        var sub = r.Steps.Single(s => s.Kind == WallStepKind.SubWall);
        Assert.Equal(450.19, sub.Rigidity, 2);
        var between = r.Steps.Single(s => s.Kind == WallStepKind.Pier && s.Label.Contains("between 'D' and 'W'"));
        Assert.Equal(4.0, between.Height, 12);
        Assert.Equal(7.0, between.Length, 12);
        Assert.True(between.Depth > sub.Depth);
    }

    [Fact]
    public void StaggeredOpeningsAreSlicedInSeries()
    {
        // Derived by hand (invented wall), the slicing rule for a band no opening spans.
        // Cantilever wall l = 16, h = 10; A x 4..6, y 2..6; B x 10..12, y 4..8. Band y 2..8, fixed-fixed.
        //   solid, cantilever, r = 0.625:  4·0.244141/1000 + 0.001875 = 0.0028516
        //   minus strip y 2..8, r = 0.375: 0.052734/1000 + 0.001125   = 0.0011777
        //   slice y 2..4 (A only): piers l = 4 (Δ 0.000125 + 0.0015 = 0.001625) and l = 10 (0.000008 + 0.0006
        //     = 0.000608): Δ = 1/(615.38 + 1644.74) = 0.00044245
        //   slice y 4..6 (A and B): piers l = 4, 4, 4: Δ = 0.001625/3 = 0.00054167
        //   slice y 6..8 (B only): piers l = 10 and 4: Δ = 0.00044245
        //   wall: 0.0028516 − 0.0011777 + 0.00044245 + 0.00054167 + 0.00044245 = 0.0031004.
        var r = PerforatedWall.Analyze(16, 10, T, E, G, EndFixity.Cantilever,
            [new WallOpening(4, 2, 2, 4, "A"), new WallOpening(10, 4, 2, 4, "B")]);
        Assert.Equal(0.0031004, r.Deflection, 7);
        Assert.Equal(3, r.Steps.Count(s => s.Kind == WallStepKind.Slice));
    }

    [Fact]
    public void TopBandOfCantileverWallUsesCantileverPiers()
    {
        // Common practice: openings reaching a cantilever wall's free top leave piers free at the top.
        // Derived by hand: l = 20, h = 12, notch x 8..12, y 8..12.
        //   solid, cantilever, r = 0.6:    0.002664
        //   minus strip y 8..12, cantilever, r = 0.2: 4·0.008/1000 + 0.0006 = 0.000632
        //   piers, cantilever, h = 4, l = 8 each, r = 0.5: 4·0.125/1000 + 0.0015 = 0.002 → two: 0.001
        //   wall: 0.002664 − 0.000632 + 0.001 = 0.003032.
        var r = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(8, 8, 4, 4, "N")]);
        Assert.Equal(0.003032, r.Deflection, 9);
        Assert.All(r.Steps.Skip(1), s => Assert.Equal(EndFixity.Cantilever, s.Ends));
        // The same notch in a wall held against rotation at its top: strip and piers fixed-fixed.
        var f = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.FixedFixed, [new WallOpening(8, 8, 4, 4, "N")]);
        Assert.All(f.Steps, s => Assert.Equal(EndFixity.FixedFixed, s.Ends));
    }

    [Fact]
    public void TwoBandsAddIndependently()
    {
        // By the method's definition (Taly ch. 7), each band removes its own strip and adds its own piers, so
        // (two bands) − solid = (band 1 alone − solid) + (band 2 alone − solid). Derived by hand from the procedure.
        var w1 = new WallOpening(3, 1, 3, 3, "ground window");
        var w2 = new WallOpening(9, 6, 4, 3, "upper window");
        double solid = PerforatedWall.Analyze(18, 10, T, E, G, EndFixity.FixedFixed, []).Deflection;
        double a = PerforatedWall.Analyze(18, 10, T, E, G, EndFixity.FixedFixed, [w1]).Deflection;
        double b = PerforatedWall.Analyze(18, 10, T, E, G, EndFixity.FixedFixed, [w2]).Deflection;
        double both = PerforatedWall.Analyze(18, 10, T, E, G, EndFixity.FixedFixed, [w1, w2]).Deflection;
        Assert.Equal((a - solid) + (b - solid), both - solid, 12);
        Assert.True(both > a && both > b && a > solid);
    }

    [Fact]
    public void OpeningsMakeTheWallMoreFlexible()
    {
        // Common sense check: cutting material out cannot make the method's wall stiffer.
        double solid = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, []).Deflection;
        double one = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(6, 4, 4, 4)]).Deflection;
        double wider = PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(6, 4, 8, 4)]).Deflection;
        Assert.True(solid < one && one < wider);
    }

    [Fact]
    public void PoissonOverloadUsesIsotropicG()
    {
        // G = E/(2(1+ν)); ν = 0.25 → G = 1000/2.5 = 400, the G used above.
        var a = PerforatedWall.AnalyzeWithPoisson(20, 12, T, E, 0.25, EndFixity.Cantilever, [new WallOpening(6, 4, 4, 4)]);
        Assert.Equal(0.00287125, a.Deflection, 8);
    }

    [Fact]
    public void OpeningOutsideTheWallIsNamed()
    {
        var ex = Assert.Throws<ArgumentException>(() =>
            PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(18, 2, 4, 2, "W7")]));
        Assert.Contains("'W7'", ex.Message);
        Assert.Contains("outside", ex.Message);
        ex = Assert.Throws<ArgumentException>(() =>
            PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(5, 10, 2, 3)]));
        Assert.Contains("'opening 1'", ex.Message);
    }

    [Fact]
    public void OverlappingOpeningsAreNamed()
    {
        var ex = Assert.Throws<ArgumentException>(() =>
            PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever,
                [new WallOpening(2, 2, 4, 4, "A"), new WallOpening(5, 5, 4, 4, "B")]));
        Assert.Contains("'A'", ex.Message);
        Assert.Contains("'B'", ex.Message);
        Assert.Contains("overlap", ex.Message);
    }

    [Fact]
    public void ZeroWidthPiersAreRejected()
    {
        var ex = Assert.Throws<ArgumentException>(() =>
            PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever,
                [new WallOpening(2, 2, 4, 4, "A"), new WallOpening(6, 3, 2, 2, "B")]));
        Assert.Contains("'A' and 'B'", ex.Message);
        Assert.Contains("zero width", ex.Message);
        ex = Assert.Throws<ArgumentException>(() =>
            PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(0, 2, 4, 4, "edge")]));
        Assert.Contains("'edge'", ex.Message);
        Assert.Contains("zero width", ex.Message);
    }

    [Fact]
    public void BadSizesAreRejected()
    {
        Assert.Throws<ArgumentException>(() => PerforatedWall.Analyze(0, 12, T, E, G, EndFixity.Cantilever, []));
        Assert.Throws<ArgumentException>(() => PerforatedWall.Analyze(20, 12, -1, E, G, EndFixity.Cantilever, []));
        var ex = Assert.Throws<ArgumentException>(() =>
            PerforatedWall.Analyze(20, 12, T, E, G, EndFixity.Cantilever, [new WallOpening(2, 2, 0, 4, "slot")]));
        Assert.Contains("'slot'", ex.Message);
    }

    [Fact]
    public void HandFormulasUsedAboveMatchTheGeneralPier()
    {
        // Guards the test's own shorthand against the general formula (identity derived in PierTests).
        Assert.Equal(Piers.Rectangular(EndFixity.FixedFixed, 1, 4, 7, T, E, G).TotalDeflection, FixedFixed(4, 7), 14);
        Assert.Equal(Piers.Rectangular(EndFixity.Cantilever, 1, 12, 20, T, E, G).TotalDeflection, Cantilever(12, 20), 14);
    }
}
