using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

public class StoryWallTests
{
    [Fact]
    public void TwoStoryUniformWallByHand()
    {
        // Two 3-unit stories (levels z = 3, 6), forces 10 at level 1 and 20 at the roof; EI = 1000, GA = 500, f = 1.2.
        // Cantilever point-load formulas (Gere & Timoshenko, table of cantilever deflections), superposed:
        //   z = 3: from 10 at a = 3: P a³/(3EI) = 10·27/3 = 90;  from 20 at a = 6 (z ≤ a): 20·3²(18 − 3)/6 = 450;
        //          flexure (90 + 450)/1000 = 0.540.
        //   z = 6: from 10 at a = 3 (z ≥ a): 10·3²(18 − 3)/6 = 225;  from 20 at a = 6: 20·216/3 = 1440;
        //          flexure (225 + 1440)/1000 = 1.665.
        //   shear f·Σ P·min(z, a)/GA: z = 3: 1.2·(30 + 60)/500 = 0.216;  z = 6: 1.2·(30 + 120)/500 = 0.360.
        //   totals 0.756 and 2.025; drifts 0.756 and 1.269; drift ratios 0.252 and 0.423.
        var r = StoryWall.Uniform([3, 3], [10, 20], 1000, 500);
        Assert.Equal([3.0, 6.0], r.LevelHeights);
        Assert.Equal(0.540, r.FlexuralDisplacements[0], 12);
        Assert.Equal(1.665, r.FlexuralDisplacements[1], 12);
        Assert.Equal(0.216, r.ShearDisplacements[0], 12);
        Assert.Equal(0.360, r.ShearDisplacements[1], 12);
        Assert.Equal(0.756, r.Displacements[0], 12);
        Assert.Equal(2.025, r.Displacements[1], 12);
        Assert.Equal(1.269, r.Drifts[1], 12);
        Assert.Equal(0.423, r.DriftRatios[1], 12);
    }

    [Fact]
    public void SingleRoofForceEqualsCantileverPier()
    {
        // One force at the top of a 3-story wall is one cantilever: Ph³/(3EI) + fPh/(GA) (elementary beam theory).
        // Checked against the independent pier formula, with E·I and G·A split as E = 2, I = 600, G = 5, A = 40.
        var r = StoryWall.Uniform([4, 3, 3], [0, 0, 12], 1200, 200, 1.2);
        var pier = Piers.Cantilever(12, 10, 2, 600, 40, 5, 1.2);
        Assert.Equal(pier.FlexuralDeflection, r.FlexuralDisplacements[2], 12);
        Assert.Equal(pier.ShearDeflection, r.ShearDisplacements[2], 12);
    }

    [Fact]
    public void SuperpositionOfSeparateForces()
    {
        // Linear elasticity (common practice): the response to forces together is the sum of the responses apart.
        var both = StoryWall.Uniform([3, 3, 3], [5, 7, 11], 900, 300);
        var a = StoryWall.Uniform([3, 3, 3], [5, 0, 0], 900, 300);
        var b = StoryWall.Uniform([3, 3, 3], [0, 7, 0], 900, 300);
        var c = StoryWall.Uniform([3, 3, 3], [0, 0, 11], 900, 300);
        for (int k = 0; k < 3; k++)
            Assert.Equal(a.Displacements[k] + b.Displacements[k] + c.Displacements[k], both.Displacements[k], 12);
    }

    [Fact]
    public void MaxwellReciprocity()
    {
        // Maxwell-Betti reciprocal theorem (common practice): displacement at level 1 from a unit force at level 3
        // equals displacement at level 3 from a unit force at level 1. Holds for the stepped wall too.
        var u13 = StoryWall.Stepped([3, 4, 3], [0, 0, 1], [3000, 2000, 1000], [900, 600, 300]);
        var u31 = StoryWall.Stepped([3, 4, 3], [1, 0, 0], [3000, 2000, 1000], [900, 600, 300]);
        Assert.Equal(u13.Displacements[0], u31.Displacements[2], 12);
    }

    [Fact]
    public void SteppedWithEqualStoriesEqualsUniform()
    {
        // The piecewise unit-load integral must reproduce the closed forms when all stories are alike
        // (two independent formulas for the same wall).
        var u = StoryWall.Uniform([3.5, 3, 3, 2.5], [4, 6, 8, 9], 5000, 800);
        var s = StoryWall.Stepped([3.5, 3, 3, 2.5], [4, 6, 8, 9], [5000, 5000, 5000, 5000], [800, 800, 800, 800]);
        for (int k = 0; k < 4; k++)
        {
            Assert.Equal(u.FlexuralDisplacements[k], s.FlexuralDisplacements[k], 10);
            Assert.Equal(u.ShearDisplacements[k], s.ShearDisplacements[k], 10);
        }
    }

    [Fact]
    public void SteppedTwoStoryWallByHand()
    {
        // Derived by hand. Stories 3 and 3; EI 2000 (lower), 1000 (upper); GA 1000, 500; f = 1.2; P = 10 at the roof.
        // Unit-load integral, M = 10(6 − x):
        //   roof: ∫0..3 (6−x)² dx = (216 − 27)/3 = 63 → 10·63/2000 = 0.315;  ∫3..6 (6−x)² dx = 9 → 10·9/1000 = 0.090;
        //         flexure 0.405.  Cross-check by moment-area: lower part under P and M = 30 at its top:
        //         δ = 10·27/6000 + 30·9/4000 = 0.1125, θ = 10·9/4000 + 30·3/2000 = 0.0675;
        //         roof = 0.1125 + 3·0.0675 + 10·27/3000 = 0.1125 + 0.2025 + 0.09 = 0.405.
        //   level 1: ∫0..3 (6−x)(3−x) dx = 54 − 40.5 + 9 = 22.5 → 10·22.5/2000 = 0.1125.
        //   shear: level 1: 1.2·10·3/1000 = 0.036;  roof: 1.2·10·(3/1000 + 3/500) = 0.108.
        var r = StoryWall.Stepped([3, 3], [0, 10], [2000, 1000], [1000, 500]);
        Assert.Equal(0.1125, r.FlexuralDisplacements[0], 12);
        Assert.Equal(0.405, r.FlexuralDisplacements[1], 12);
        Assert.Equal(0.036, r.ShearDisplacements[0], 12);
        Assert.Equal(0.108, r.ShearDisplacements[1], 12);
        Assert.Equal(0.513 - 0.1485, r.Drifts[1], 12);
    }

    [Fact]
    public void BadInputsAreRejected()
    {
        Assert.Throws<ArgumentException>(() => StoryWall.Uniform([3, 0], [1, 1], 1, 1));
        Assert.Throws<ArgumentException>(() => StoryWall.Uniform([3, 3], [1], 1, 1));
        Assert.Throws<ArgumentException>(() => StoryWall.Uniform([], [], 1, 1));
        Assert.Throws<ArgumentException>(() => StoryWall.Uniform([3], [1], 0, 1));
        Assert.Throws<ArgumentException>(() => StoryWall.Stepped([3, 3], [1, 1], [1], [1, 1]));
        Assert.Throws<ArgumentException>(() => StoryWall.Stepped([3, 3], [1, 1], [1, 1], [1, -1]));
    }
}
