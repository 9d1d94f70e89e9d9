using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>
/// Vertical distribution, the exponent k, C_s and the approximate period (ASCE 7-16 §12.8, values from memory as in
/// ../shared/REFERENCES.md — confirm the edition), and the generated load case in the model.
/// </summary>
public class StoryForceTests
{
    /// <summary>k = 1 for T ≤ 0.5 s, 2 for T ≥ 2.5 s, linear between (§12.8.3, from memory).</summary>
    [Theory]
    [InlineData(0.2, 1.0)]
    [InlineData(0.5, 1.0)]
    [InlineData(1.0, 1.25)]    // 1 + (1.0 − 0.5)/2 (derived)
    [InlineData(1.5, 1.5)]
    [InlineData(2.5, 2.0)]
    [InlineData(4.0, 2.0)]
    public void ExponentK(double t, double k) => Near(k, SeismicAnalysis.Exponent(t), 1e-12, $"k at T = {t} s");

    /// <summary>
    /// Worked by hand (derived): weights 100, 200, 150 at heights 10, 20, 30; T = 1.5 s → k = 1 + (1.5 − 0.5)/2 = 1.5.
    /// w·h^k: 100·10^1.5 = 100·31.6228 = 3162.28; 200·20^1.5 = 200·89.4427 = 17888.5; 150·30^1.5 = 150·164.317 = 24647.5;
    /// Σ = 45698.3. C_vx = 0.069199, 0.391448, 0.539353 (sum 1).
    /// </summary>
    [Fact]
    public void VerticalDistributionWorkedExample()
    {
        var c = SeismicAnalysis.VerticalDistribution([100, 200, 150], [10, 20, 30], SeismicAnalysis.Exponent(1.5));
        Near(0.069199, c[0], 1e-5, "C_v1 by hand");
        Near(0.391448, c[1], 1e-5, "C_v2 by hand");
        Near(0.539353, c[2], 1e-5, "C_v3 by hand");
        // k = 1 (T ≤ 0.5 s): C_vx ∝ w·h = 1000, 4000, 4500 of 9500 (derived).
        var c1 = SeismicAnalysis.VerticalDistribution([100, 200, 150], [10, 20, 30], SeismicAnalysis.Exponent(0.4));
        Near(1000.0 / 9500, c1[0], 1e-12, "k = 1");
        Near(4500.0 / 9500, c1[2], 1e-12, "k = 1");
    }

    /// <summary>
    /// C_s = S_DS/(R/I_e), not above S_D1/(T·R/I_e) (T ≤ T_L) or S_D1·T_L/(T²·R/I_e), not below 0.044·S_DS·I_e ≥ 0.01,
    /// and where S_1 ≥ 0.6 g not below 0.5·S_1/(R/I_e) (§12.8.1.1, from memory). Values by hand with S_DS = 1.0,
    /// S_D1 = 0.6, R = 8, I_e = 1, T_L = 8 s (derived).
    /// </summary>
    [Theory]
    [InlineData(0.3, double.NaN, 0.125)]          // 1.0/8; upper 0.6/(0.3·8) = 0.25 does not govern
    [InlineData(1.0, double.NaN, 0.075)]          // 0.6/(1.0·8)
    [InlineData(10.0, double.NaN, 0.044)]         // 0.6·8/(100·8) = 0.006 < 0.044·1.0·1 = 0.044
    [InlineData(10.0, 0.75, 0.046875)]            // 0.5·0.75/8 = 0.046875 > 0.044
    [InlineData(1.0, 0.75, 0.075)]                // the S_1 floor 0.046875 does not govern
    public void ResponseCoefficient(double t, double s1, double cs)
    {
        var (value, _) = SeismicAnalysis.ResponseCoefficient(new SpectralValues(1.0, 0.6, 8, 1.0, 8, s1), t);
        Near(cs, value, 1e-12, $"C_s at T = {t} s");
    }

    /// <summary>C_u of Table 12.8-1 (from memory) at its rows and between them (linear, our choice).</summary>
    [Theory]
    [InlineData(0.5, 1.4)]
    [InlineData(0.4, 1.4)]
    [InlineData(0.3, 1.4)]
    [InlineData(0.25, 1.45)]
    [InlineData(0.2, 1.5)]
    [InlineData(0.15, 1.6)]
    [InlineData(0.1, 1.7)]
    [InlineData(0.05, 1.7)]
    public void UpperLimitCoefficient(double sd1, double cu) => Near(cu, SeismicPresets.UpperLimitCoefficient(sd1), 1e-12, $"C_u at S_D1 = {sd1}");

    private static JObjectModel ThreeStory(object extra) => new(SeismicModels.ShearBuilding(4.0, [900, 700, 500], [600e3, 600e3, 400e3], extra));

    private sealed record JObjectModel(Newtonsoft.Json.Linq.JObject Json)
    {
        public StructureModel Model => ModelReader.Parse(Json.ToString(), "three.json");
    }

    /// <summary>
    /// Generated case with a given base shear and period: F_x = C_vx·V at each level's diaphragm; the story shears
    /// by statics are the sums above (derived). Heights 4, 8, 12 m, weights 600, 600, 400 kN, T = 1.5 s → k = 1.5:
    /// w·h^k = 600·8 = 4800, 600·22.6274 = 13576.5, 400·41.5692 = 16627.7; Σ = 35004.2 (by hand).
    /// </summary>
    [Fact]
    public void GeneratedCaseCarriesTheStoryForces()
    {
        var m = ThreeStory(new { baseShear = 300e3, period = 1.5 });
        var r = LinearStaticAnalysis.Run(m.Model);
        var s = SeismicResult.Of(r)!;
        Near(1.5, s.Forces.PeriodUsed, 1e-12, "given period");
        double[] expected = [300e3 * 4800 / 35004.2, 300e3 * 13576.5 / 35004.2, 300e3 * 16627.7 / 35004.2];
        for (int l = 1; l <= 3; l++) Near(expected[l - 1], s.Forces.LevelForces[l], 1e-5, $"F at L{l} by hand");
        var elf = r.Case("ELF");
        Near(300e3, elf.Equilibrium.AppliedFx, 1e-12, "the generated case applies V in all");
        Near(expected[2], s.Stories.Stories[2].Shear, 1e-5, "top story shear = F3");
        Near(expected[1] + expected[2], s.Stories.Stories[1].Shear, 1e-5, "story 2 shear = F2 + F3");
        Near(300e3, s.Stories.Stories[0].Shear, 1e-9, "base story shear = V");
    }

    [Fact]
    public void SpectralValuesGiveTheBaseShear()
    {
        // S_DS = 1.0, R = 8, I_e = 1.25 → S_DS/(R/I_e) = 0.15625; with T = 0.4 s (given) S_D1/(T·R/I_e) = 0.5/(0.4·6.4)
        // = 0.1953 does not govern; V = 0.15625 · 1600 kN = 250 kN; k = 1 (derived).
        var m = ThreeStory(new { spectrum = new { SDS = 1.0, SD1 = 0.5, R = 8.0, Ie = 1.25, TL = 8.0 }, period = 0.4 });
        var s = SeismicResult.Of(LinearStaticAnalysis.Run(m.Model))!;
        Near(0.15625, s.Forces.Cs, 1e-12, "C_s");
        Near(250e3, s.Forces.BaseShear, 1e-12, "V = C_s·W");
        Near(1.0, s.Forces.Exponent, 1e-12, "k");
        Near(1600e3, s.Forces.TotalWeight, 1e-12, "W");
    }

    /// <summary>
    /// T_a = C_t·h_n^x (Table 12.8-2, from memory): "other", h_n = 12 m = 39.3701 ft; ln 39.3701 = 3.67301, so
    /// 0.02·e^(0.75·3.67301) = 0.02·15.717 = 0.31434 s; steel moment frame 0.028·e^(0.8·3.67301) = 0.028·18.886 = 0.52880 s
    /// (by hand, with a calculator). With S_D1 = 0.5, C_u = 1.4; "capped" takes the eigen
    /// period when it is below C_u·T_a, else C_u·T_a.
    /// </summary>
    [Fact]
    public void ApproximatePeriodAndTheCap()
    {
        var spectrum = new { SDS = 1.0, SD1 = 0.5, R = 8.0, Ie = 1.0, TL = 8.0 };
        var other = SeismicAnalysis.Forces(ThreeStory(new { spectrum, structureType = "other" }).Model)!;
        Near(0.31434, other.Ta, 5e-5, "T_a, other");
        var smf = SeismicAnalysis.Forces(ThreeStory(new { spectrum, structureType = "steel-moment-frame", period = "approximate" }).Model)!;
        Near(0.52880, smf.Ta, 5e-5, "T_a, steel moment frame");
        Near(smf.Ta, smf.PeriodUsed, 1e-12, "approximate period used");
        double t1 = other.Modes[0].Period;
        Near(Math.Min(t1, 1.4 * other.Ta), other.PeriodUsed, 1e-12, "capped: min(T1, Cu·Ta)");
        var computed = SeismicAnalysis.Forces(ThreeStory(new { spectrum, period = "computed" }).Model)!;
        Near(t1, computed.PeriodUsed, 1e-12, "computed: T1");
    }

    [Fact]
    public void DriftChecksAndCombinationsCanNameTheGeneratedCase()
    {
        var json = SeismicModels.ShearBuilding(4.0, [900, 700, 500], [600e3, 600e3, 400e3], new { baseShear = 300e3 });
        json["combinations"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "0.5ELF", factors = new { ELF = 0.5 } } });
        json["driftChecks"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "d", cases = new[] { "ELF", "0.5ELF" }, Cd = 4.0, Ie = 1.0, allowedRatio = 0.02 } });
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(json.ToString(), "t.json"));
        var rows = DriftCheck.Run(r, StoryAnalysis.All(r));
        Assert.Equal(6, rows.Count);
        // Superposition: the half combination drifts half as much (common practice).
        for (int i = 0; i < 3; i++) Near(0.5 * rows[i].ElasticDrift, rows[i + 3].ElasticDrift, 1e-12, "0.5·ELF");
        Assert.True(rows[0].ElasticDrift > 0, "the generated case drifts");
    }
}

/// <summary>
/// SeismicAnalysis.Prepare copies the model with the generated case filled in; every public property must come across,
/// so a property added later (another branch) fails here until Prepare copies it too (common practice).
/// </summary>
public class PrepareCopiesTheModelTests
{
    [Fact]
    public void EveryPropertyIsCarriedOver()
    {
        var json = SeismicModels.ShearBuilding(4.0, [900, 700], [600e3, 400e3], new { baseShear = 300e3 });
        var model = ModelReader.Parse(json.ToString(), "p.json");
        var prepared = SeismicAnalysis.Prepare(model);
        Assert.NotSame(model, prepared);
        foreach (var p in typeof(StructureModel).GetProperties().Where(p => p.Name != nameof(StructureModel.LoadCases)))
            Assert.True(ReferenceEquals(p.GetValue(model), p.GetValue(prepared)) || Equals(p.GetValue(model), p.GetValue(prepared)), $"{p.Name} is not carried over by Prepare");
        Assert.Equal(model.LoadCases.Select(c => c.Id), prepared.LoadCases.Select(c => c.Id));
        Assert.Empty(model.LoadCases.First(c => c.Id == "ELF").NodalLoads);
        Assert.Equal(2, prepared.LoadCases.First(c => c.Id == "ELF").NodalLoads.Count);
    }
}
