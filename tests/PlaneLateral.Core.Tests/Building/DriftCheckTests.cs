using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>Drift amplification (ASCE 7-16 eq. 12.8-15) and allowable drift ratios (ASCE 7-16 Table 12.12-1).</summary>
public class DriftCheckTests
{
    [Fact]
    public void AmplifiedDriftIsCdTimesElasticOverIe() =>
        // δx = C_d·δxe / I_e, ASCE 7-16 eq. 12.8-15 (confirmed): 5.5 × 0.40 / 1.25 = 1.76.
        Near(1.76, DriftCheck.Amplified(0.40, 5.5, 1.25), 1e-15, "eq. 12.8-15");

    [Theory]
    // ASCE 7-16 Table 12.12-1, Δa/h_sx for risk category I–II / III / IV (secondary, as listed in REFERENCES).
    [InlineData("four-stories-or-fewer", "I", 0.025)]
    [InlineData("four-stories-or-fewer", "II", 0.025)]
    [InlineData("four-stories-or-fewer", "III", 0.020)]
    [InlineData("four-stories-or-fewer", "IV", 0.015)]
    [InlineData("masonry-cantilever-wall", "II", 0.010)]
    [InlineData("masonry-cantilever-wall", "III", 0.010)]
    [InlineData("masonry-cantilever-wall", "IV", 0.010)]
    [InlineData("masonry-wall-other", "I", 0.007)]
    [InlineData("masonry-wall-other", "IV", 0.007)]
    [InlineData("other", "I", 0.020)]
    [InlineData("other", "II", 0.020)]
    [InlineData("other", "III", 0.015)]
    [InlineData("other", "IV", 0.010)]
    public void PresetAllowableDriftMatchesTable12_12_1(string structure, string risk, double expected) =>
        Assert.Equal(expected, BuildingPresets.AllowedDrift(structure, risk));

    private const double H = 3.6;     // m
    private const double I = 600.0;   // 10⁻⁶ m⁴

    /// <summary>One-story shear building (two fixed-guided columns, k = 24EI/h³ derived), load V, with a drift check.</summary>
    private static object Model(object check)
    {
        var m = ToJObject(BuildingModels.ShearBuilding(H, [I], [40.0]));
        m["driftChecks"] = new Newtonsoft.Json.Linq.JArray(Newtonsoft.Json.Linq.JObject.FromObject(check));
        return m;
    }

    private static double ElasticDrift => 40.0e3 / (24 * BuildingModels.E * I * 1e-6 / (H * H * H));   // derived: V/k

    [Fact]
    public void CheckAmplifiesTheElasticDriftAndGivesTheMargin()
    {
        var m = (Newtonsoft.Json.Linq.JObject)Model(new { id = "seismic", cases = new[] { "EQ" }, Cd = 4.0, Ie = 1.5, allowed = new { structure = "other", riskCategory = "II" } });
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(m.ToString(), "t.json"));
        var row = Assert.Single(BuildingResult.Of(r).DriftChecks);
        double amplified = 4.0 * ElasticDrift / 1.5, ratio = amplified / H;   // eq. 12.8-15
        Near(ElasticDrift, row.ElasticDrift, 1e-9, "elastic drift V/k (derived)");
        Near(amplified, row.AmplifiedDrift, 1e-9, "amplified drift");
        Near(ratio, row.Ratio, 1e-9, "drift ratio");
        Assert.Equal(0.020, row.Allowed);                          // Table 12.12-1, all other structures, RC II
        Assert.Equal(ratio <= 0.020, row.Passes);
        Near(1 - ratio / 0.020, row.Margin, 1e-9, "margin = 1 − ratio/allowed");
        Assert.Contains("Table 12.12-1", row.Check.LimitSource);
        Assert.Contains("governing code decides", row.Check.LimitSource);
    }

    [Fact]
    public void DriftAboveTheAllowableFails()
    {
        // An allowable ratio set just below the computed one must fail, just above must pass (the check is ratio ≤ allowed).
        double ratio = 5.0 * ElasticDrift / 1.0 / H;
        foreach (var (allowed, passes) in new[] { (ratio * 0.99, false), (ratio * 1.01, true) })
        {
            var m = (Newtonsoft.Json.Linq.JObject)Model(new { id = "d", cases = new[] { "EQ" }, Cd = 5.0, Ie = 1.0, allowedRatio = allowed });
            var r = LinearStaticAnalysis.Run(ModelReader.Parse(m.ToString(), "t.json"));
            var row = Assert.Single(BuildingResult.Of(r).DriftChecks);
            Assert.Equal(passes, row.Passes);
            Assert.Equal(passes, row.Margin >= 0);
            Assert.Equal("user value", row.Check.LimitSource);
        }
    }
}
