using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

public class PierTests
{
    // A rectangular pier for hand arithmetic: t = 1, l = 10 → I = 1·10³/12 = 83.333…, A = 10;
    // E = 1000, G = 400, f = 1.2, h = 30, P = 10.
    private const double P = 10, H = 30, E = 1000, G = 400, Len = 10, T = 1;
    private static readonly double I = T * Len * Len * Len / 12.0;
    private const double A = T * Len;

    [Fact]
    public void CantileverTermsByHand()
    {
        // Derived by hand from Ph³/(3EI) (Gere & Timoshenko, cantilever tip load):
        // flexure = 10·27000/(3·1000·83.333) = 270000/250000 = 1.08.
        // Shear f·Ph/(AG) = 1.2·10·30/(10·400) = 360/4000 = 0.09. Total 1.17; k = 10/1.17 = 8.5470.
        var r = Piers.Cantilever(P, H, E, I, A, G);
        Assert.Equal(1.08, r.FlexuralDeflection, 10);
        Assert.Equal(0.09, r.ShearDeflection, 10);
        Assert.Equal(1.17, r.TotalDeflection, 10);
        Assert.Equal(8.5470, r.Stiffness, 4);
        Assert.Equal(1.08 / 1.17, r.FlexuralShare, 10);
        Assert.Equal(1.0, r.FlexuralShare + r.ShearShare, 12);
        Assert.Contains("top free to rotate", r.Method.Assumptions);
        Assert.Contains("plane sections remain plane", r.Method.Assumptions);
        Assert.Contains("shear deformation with form factor 1.2", r.Method.Assumptions);
    }

    [Fact]
    public void FixedFixedTermsByHand()
    {
        // Derived by hand from Ph³/(12EI): 270000/(12·1000·83.333) = 270000/1000000 = 0.27;
        // shear as above 0.09; total 0.36; shear share 0.09/0.36 = 0.25; k = 10/0.36 = 27.778.
        var r = Piers.FixedFixed(P, H, E, I, A, G);
        Assert.Equal(0.27, r.FlexuralDeflection, 10);
        Assert.Equal(0.09, r.ShearDeflection, 10);
        Assert.Equal(0.25, r.ShearShare, 10);
        Assert.Equal(27.778, r.Stiffness, 3);
        Assert.Contains("top held against rotation", r.Method.Assumptions);
    }

    [Fact]
    public void RectangularHelperMatchesSectionProperties()
    {
        // I = t·l³/12, A = t·l (common practice); same numbers as the fixed-fixed case above.
        var r = Piers.Rectangular(EndFixity.FixedFixed, P, H, Len, T, E, G);
        Assert.Equal(0.36, r.TotalDeflection, 10);
    }

    [Fact]
    public void TalyWorkedExampleFixedPierRigidity()
    {
        // Taly, Design of Reinforced Masonry Structures, p.455: fixed-fixed pier, h/l = 0.4545, E_m = 1800 ksi,
        // t = 7.625 in → R = 9418 kip/in. Hand: (0.4545)³ = 0.093886; 3·0.4545 = 1.3635; sum 1.457386;
        // E_m·t = 13725; R = 13725/1.457386 = 9417.5 → 9418 at the printed precision.
        var r = MasonryShortcut.Rigidity(EndFixity.FixedFixed, 0.4545, 7.625, 1800);
        Assert.Equal(9418.0, Math.Round(r.Value));
        Assert.Contains("7.12", r.Method.Source);
    }

    [Theory]
    [InlineData(EndFixity.Cantilever, 12.0, 20.0)]
    [InlineData(EndFixity.FixedFixed, 12.0, 20.0)]
    [InlineData(EndFixity.Cantilever, 30.0, 7.5)]
    [InlineData(EndFixity.FixedFixed, 4.0, 17.0)]
    public void MasonryShortcutIsGeneralFormulaWithGPointFourEAndFPointTwo(EndFixity ends, double h, double l)
    {
        // Identity derived by hand. With I = t·l³/12, A = t·l, G = 0.4E, f = 1.2:
        //   cantilever flexure P h³/(3E·t l³/12) = 4P h³/(E t l³) = (P/(E t))·4(h/l)³,
        //   fixed-fixed flexure P h³/(12E·t l³/12) = (P/(E t))·(h/l)³,
        //   shear 1.2·P h/(t l·0.4E) = 3P h/(E t l) = (P/(E t))·3(h/l),
        // which are Taly's eqs. 7.1 and 7.12 term by term.
        double p = 7, t = 0.625, em = 1500;
        var shortcut = MasonryShortcut.Deflection(ends, p, h, l, t, em);
        var general = Piers.Rectangular(ends, p, h, l, t, em, 0.4 * em, 1.2);
        Assert.Equal(general.FlexuralDeflection, shortcut.FlexuralDeflection, 12);
        Assert.Equal(general.ShearDeflection, shortcut.ShearDeflection, 12);
        Assert.Equal(general.Stiffness, shortcut.Stiffness, 6);
        // And the rigidity form is the stiffness for any P.
        Assert.Equal(shortcut.Stiffness, MasonryShortcut.Rigidity(ends, h / l, t, em).Value, 6);
    }

    [Fact]
    public void TallPierIsFlexureDominatedSquatPierShearDominated()
    {
        // Common practice: shear share falls as h/l grows. Hand, cantilever masonry shortcut:
        // h/l = 0.25: flexure 4·0.015625 = 0.0625, shear 0.75 → shear share 0.75/0.8125 = 0.923.
        // h/l = 4:    flexure 4·64 = 256, shear 12 → shear share 12/268 = 0.0448.
        var squat = MasonryShortcut.Deflection(EndFixity.Cantilever, 1, 5, 20, 1, 1000);
        var tall = MasonryShortcut.Deflection(EndFixity.Cantilever, 1, 20, 5, 1, 1000);
        Assert.Equal(0.923, squat.ShearShare, 3);
        Assert.Equal(0.0448, tall.ShearShare, 4);
    }

    [Theory]
    [InlineData(0, 30, 1000, 83.3, 10, 400, 1.2, "force")]
    [InlineData(10, 0, 1000, 83.3, 10, 400, 1.2, "height")]
    [InlineData(10, 30, -1, 83.3, 10, 400, 1.2, "Young")]
    [InlineData(10, 30, 1000, 0, 10, 400, 1.2, "second moment")]
    [InlineData(10, 30, 1000, 83.3, 0, 400, 1.2, "area")]
    [InlineData(10, 30, 1000, 83.3, 10, 0, 1.2, "shear modulus")]
    [InlineData(10, 30, 1000, 83.3, 10, 400, 0.5, "form factor")]
    public void InvalidInputsAreRejectedWithPlainMessages(double p, double h, double e, double i, double a, double g, double f, string word)
    {
        var ex = Assert.Throws<ArgumentException>(() => Piers.Cantilever(p, h, e, i, a, g, f));
        Assert.Contains(word, ex.Message);
    }

    [Fact]
    public void ColumnIsFlexureOnlyByDefaultAndSaysSo()
    {
        // Elementary beam theory: fixed-fixed column k = 12EI/h³. Hand: E = 200, I = 50, h = 10 →
        // 12·200·50/1000 = 120; cantilever 3·200·50/1000 = 30.
        var ff = Columns.Deflection(EndFixity.FixedFixed, 1, 10, 200, 50);
        Assert.False(ff.IncludesShear);
        Assert.Equal(0.0, ff.ShearDeflection);
        Assert.Equal(120.0, ff.Stiffness, 9);
        Assert.Contains("shear deformation neglected (flexure only)", ff.Method.Assumptions);
        Assert.Equal(30.0, Columns.Deflection(EndFixity.Cantilever, 1, 10, 200, 50).Stiffness, 9);
    }

    [Fact]
    public void ColumnWithShear()
    {
        // Hand: shear term P h/(G A_s) = 1·10/(80·1.25) = 0.1; flexure 1/120 = 0.008333; total 0.108333.
        var r = Columns.Deflection(EndFixity.FixedFixed, 1, 10, 200, 50, new ColumnShear(80, 1.25));
        Assert.True(r.IncludesShear);
        Assert.Equal(0.1, r.ShearDeflection, 12);
        Assert.Equal(1.0 / 120 + 0.1, r.TotalDeflection, 12);
        Assert.DoesNotContain("shear deformation neglected (flexure only)", r.Method.Assumptions);
    }
}
