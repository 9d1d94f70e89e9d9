using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Seismic;

/// <summary>
/// Bad seismic input: one message per problem with place and fix, all at once (the project's error contract,
/// DEVELOPERS.md — common practice). Ranges: S_DS, S_D1, R, I_e, T_L as in docs/seismic.md (R up to 8 and C_d up to 6.5
/// from ASCE 7-16 Table 12.2-1, from memory).
/// </summary>
public class SeismicInputTests
{
    private static JObject Good(object? extra = null) =>
        SeismicModels.ShearBuilding(3.5, [800, 800, 800], [500e3, 500e3, 400e3], extra ?? new { baseShear = 200e3 });

    private static ModelInputException Fails(JObject m) => Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString(), "bad.json"));

    private static void Has(ModelInputException e, string fragment)
    {
        var hits = e.Diagnostics.Where(d => d.Problem.Contains(fragment)).ToList();
        Assert.True(hits.Count == 1, $"expected one diagnostic containing '{fragment}', got:\n{e.Message}");
        Assert.False(string.IsNullOrWhiteSpace(hits[0].Fix), "every problem carries a fix");
        Assert.True(hits[0].Line > 0, "every problem carries a line");
        Assert.StartsWith("$.seismic", hits[0].JsonPath);
    }

    [Fact]
    public void GoodBlockReads()
    {
        var m = ModelReader.Parse(Good().ToString());
        Assert.NotNull(m.Seismic);
        Assert.Equal("ELF", m.Seismic!.CaseId);
        Assert.Equal(3, m.Seismic.Weights.Count);
        Assert.Contains(m.LoadCases, c => c.Id == "ELF");   // listed, loads filled in by the analysis
        Assert.Equal(PeriodUse.Capped, m.Seismic.Period);
    }

    [Fact]
    public void NegativeAndMissingWeightsNameTheirLevels()
    {
        var m = Good();
        var w = (JArray)m["seismic"]!["weights"]!;
        w[1]!["weight"] = -5.0;
        w.RemoveAt(2);
        var e = Fails(m);
        Has(e, "the weight of level \"L2\" is negative");
        Has(e, "level \"L3\" (story 3) has no weight");
    }

    [Fact]
    public void AllProblemsAtOnce()
    {
        var m = Good(new { spectrum = new { SDS = 4.0, SD1 = 0.0, R = 12.0, Ie = 2.0, TL = 8.0 }, period = "longest", structureType = "timber", secondOrder = new { gravity = "GRAV", Cd = 9.0, beta = 1.5 } });
        ((JObject)m["seismic"]!).Remove("baseShear");
        ((JArray)m["seismic"]!["weights"]!).Add(new JObject { ["level"] = "L9", ["weight"] = 1.0 });
        var e = Fails(m);
        Has(e, "'SDS' = 4 is out of range");
        Has(e, "'SD1' = 0 is out of range");
        Has(e, "'R' = 12 is out of range");
        Has(e, "'Ie' = 2 is out of range");
        Has(e, "unknown period choice \"longest\"");
        Has(e, "unknown structure type \"timber\"");
        Has(e, "unknown load case or combination \"GRAV\"");
        Has(e, "'Cd' = 9 is out of range");
        Has(e, "'beta' = 1.5 is out of range");
        Has(e, "unknown level \"L9\"");
        Assert.True(e.Diagnostics.Count >= 10);
    }

    [Fact]
    public void BaseShearAndSpectrumAreExclusiveAndOneIsNeeded()
    {
        var both = Good(new { baseShear = 1.0, spectrum = new { SDS = 1.0, SD1 = 0.5, R = 5.0, TL = 8.0 } });
        Assert.Contains(Fails(both).Diagnostics, d => d.Problem.Contains("both 'baseShear' and 'spectrum'"));
        var none = Good(new { });
        ((JObject)none["seismic"]!).Remove("baseShear");
        Assert.Contains(Fails(none).Diagnostics, d => d.Problem.Contains("neither 'baseShear' nor 'spectrum'"));
        var zero = Good(new { baseShear = 0.0 });
        Assert.Contains(Fails(zero).Diagnostics, d => d.Problem.Contains("base shear must be greater than zero"));
    }

    [Fact]
    public void TheBaseAndDuplicatesAreRefused()
    {
        var m = Good();
        var w = (JArray)m["seismic"]!["weights"]!;
        w.Add(new JObject { ["level"] = "L0", ["weight"] = 10.0 });
        w.Add(new JObject { ["level"] = "L1", ["weight"] = 10.0 });
        var e = Fails(m);
        Has(e, "level \"L0\" is the base");
        Has(e, "level \"L1\" has two weights");
    }

    [Fact]
    public void TheGeneratedCaseMayNotReuseAnId()
    {
        var m = Good();
        m["seismic"]!["loadCase"] = "EQ";   // the shear building's own case
        Assert.Contains(Fails(m).Diagnostics, d => d.Problem.Contains("has the id of a load case listed under \"loadCases\""));
    }

    [Fact]
    public void UnknownKeysInTheBlockAreReported()
    {
        var m = Good();
        m["seismic"]!["baseshear"] = 5.0;
        Assert.Contains(Fails(m).Diagnostics, d => d.Problem.Contains("unknown key 'baseshear'"));
    }
}
