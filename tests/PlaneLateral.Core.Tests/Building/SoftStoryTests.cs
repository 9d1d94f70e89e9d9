using PlaneLateral.Analysis;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>
/// Stiffness–soft story irregularity, ASCE 7-16 Table 12.3-2 (confirmed via Taly, Table 7.7): Type 1a when a story's
/// stiffness is below 70 % of the story above or 80 % of the mean of the three above; Type 1b below 60 % or 70 %.
/// The models are shear buildings whose story stiffness is exactly 2·12EI/h³ (fixed-guided columns, derived), so the
/// ratios are known in advance from the chosen I values.
/// </summary>
public class SoftStoryTests
{
    private const double H = 3.6;   // m

    private static IReadOnlyList<StiffnessIrregularityRow> Rows(double[] columnI, out AnalysisResult r)
    {
        r = Solve(BuildingModels.ShearBuilding(H, columnI, new double[] { 10, 20, 30, 40, 50 }[..columnI.Length]));
        return StiffnessIrregularity.Run(StoryAnalysis.All(r));
    }

    [Fact]
    public void StoryStiffnessIsTheClosedForm()
    {
        double[] I = [500, 800, 800, 900];
        var rows = Rows(I, out _);
        for (int i = 0; i < I.Length; i++)
            Near(2 * 12 * BuildingModels.E * I[i] * 1e-6 / (H * H * H), rows[i].Stiffness, 1e-9, $"story {i + 1}: 24EI/h³ (derived)");
    }

    [Fact]
    public void RegularBuildingIsNotFlagged()
    {
        var rows = Rows([1000, 1000, 1000, 1000], out _);
        Assert.All(rows, x => { Assert.False(x.Soft); Assert.False(x.ExtremelySoft); });
        Near(1.0, rows[0].RatioToAbove, 1e-9, "equal stories");
        Near(1.0, rows[0].RatioToAverageAbove, 1e-9, "equal stories");
        Assert.True(double.IsNaN(rows[1].RatioToAverageAbove), "story 2 has only two stories above: no average test");
        Assert.True(double.IsNaN(rows[3].RatioToAbove), "top story: nothing above");
    }

    [Fact]
    public void ExtremelySoftFirstStoryIsFlagged()
    {
        var rows = Rows([500, 1000, 1000, 1000], out _);   // k1/k2 = 0.5 < 0.60
        Near(0.5, rows[0].RatioToAbove, 1e-9, "I ratio");
        Assert.True(rows[0].Soft);
        Assert.True(rows[0].ExtremelySoft);
        Assert.All(rows.Skip(1), x => Assert.False(x.Soft));
    }

    [Fact]
    public void SoftButNotExtremeBetweenTheLimits()
    {
        // k = 650, 1000, 800, 800: 0.65 of the story above (below 0.70, not below 0.60) and 650/866.7 = 0.75 of the mean
        // of the three above (below 0.80, not below 0.70): Type 1a by both tests, not 1b.
        var rows = Rows([650, 1000, 800, 800], out _);
        Near(0.65, rows[0].RatioToAbove, 1e-9, "ratio to above");
        Near(0.75, rows[0].RatioToAverageAbove, 1e-9, "ratio to mean of three above");
        Assert.True(rows[0].Soft);
        Assert.False(rows[0].ExtremelySoft);
    }

    [Fact]
    public void AverageOfThreeAboveCanFlagAlone()
    {
        // k = 780, 900, 1100, 1100: k1/k2 = 0.867 (no flag by the story above), k1/mean = 780/1033.3 = 0.755 < 0.80 (Type 1a), > 0.70 (not 1b).
        var rows = Rows([780, 900, 1100, 1100], out _);
        Near(780.0 / 900.0, rows[0].RatioToAbove, 1e-9, "ratio to above");
        Near(780.0 / ((900.0 + 1100 + 1100) / 3), rows[0].RatioToAverageAbove, 1e-9, "ratio to mean of three above");
        Assert.True(rows[0].Soft);
        Assert.False(rows[0].ExtremelySoft);
    }

    [Fact]
    public void NoMeanTestWithFewerThanThreeStoriesAbove()
    {
        // k = 750, 1000, 1000: 0.75 of the story above (not below 0.70); the mean of the two above would give 0.75 < 0.80,
        // but Table 12.3-2 speaks of the three stories above, so with two there is no mean test and no flag.
        var rows = Rows([750, 1000, 1000], out _);
        Near(0.75, rows[0].RatioToAbove, 1e-9, "ratio");
        Assert.True(double.IsNaN(rows[0].RatioToAverageAbove));
        Assert.False(rows[0].Soft);
    }

    [Fact]
    public void AWindCaseGetsTheRatiosButNotTheSeismicLabel()
    {
        // Table 12.3-2 (ASCE 7-16) is a seismic irregularity: on a wind case the ratios are worked out but no Type 1a/1b
        // flag is raised, and the row says why (issue: a soft-story check on a wind case must not carry the seismic label).
        var json = ToJObject(BuildingModels.ShearBuilding(H, [500, 1000, 1000, 1000], [10, 20, 30, 40]));
        json["loadCases"]![0]!["id"] = "W";
        json["loadCases"]![0]!["description"] = "wind from the west (invented)";
        var r = Solve(json);
        var br = BuildingResult.Of(r);
        Assert.All(br.Irregularity, x => Assert.True(x.WindCase, $"case {x.CaseId} is a wind case"));
        Near(0.5, br.Irregularity[0].RatioToAbove, 1e-9, "the ratio is still given (I ratio, derived)");
        Assert.False(br.Irregularity[0].Soft || br.Irregularity[0].ExtremelySoft, "no seismic flag on a wind case");
        Assert.DoesNotContain("soft story", br.Irregularity[0].Label);
        Assert.Contains("wind case", br.Irregularity[0].Label);
        // The same model under an earthquake case keeps the flag (control).
        var eq = BuildingResult.Of(Solve(BuildingModels.ShearBuilding(H, [500, 1000, 1000, 1000], [10, 20, 30, 40])));
        Assert.True(eq.Irregularity[0].ExtremelySoft && !eq.Irregularity[0].WindCase);
        Assert.Equal("extreme soft story (1b)", eq.Irregularity[0].Label);
    }
}
