using Newtonsoft.Json.Linq;
using PlaneLateral.Model;
using PlaneLateral.Tests.Verification;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// Bad footing input: each problem is reported with its place and a fix, all at once (the project's error contract,
/// docs/model-format.md and docs/footings.md; common practice, not a published source).
/// </summary>
public class FootingInputTests
{
    private static JObject Footing(JObject model) => (JObject)model["footings"]![0]!;

    private static ModelDiagnostic Single(JObject model, string fragment)
    {
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(model.ToString(), "bad.json"));
        var hits = e.Diagnostics.Where(d => d.Problem.Contains(fragment)).ToList();
        Assert.True(hits.Count == 1, $"expected one diagnostic containing '{fragment}', got:\n{e.Message}");
        Assert.False(string.IsNullOrWhiteSpace(hits[0].Fix));
        Assert.True(hits[0].Line > 0);
        Assert.StartsWith("$.footings[0]", hits[0].JsonPath);
        return hits[0];
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-500.0)]
    public void ANonPositiveSoilModulusIsAnError(double g)
    {
        var m = FootingTests.Wall(soilG: g);
        Assert.Contains("G₀ > 0", Single(m, "soil shear modulus").Fix);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.5)]
    [InlineData(0.62)]
    public void APoissonRatioOutsideZeroToHalfIsAnError(double nu)
    {
        var m = FootingTests.Wall();
        Footing(m)["soil"]!["poissonRatio"] = nu;
        Assert.Contains("strictly between 0 and 0.5", Single(m, "Poisson's ratio").Fix);
    }

    [Fact]
    public void AFootingShorterThanItsWallIsAnError()
    {
        var m = FootingTests.Wall();
        Footing(m)["length"] = 16;   // the wall is 20 ft long
        Assert.Contains("at least as long as the wall", Single(m, "shorter than member \"M\"").Fix);
    }

    [Fact]
    public void AFootingNarrowerThanItsWallIsAnError()
    {
        var m = FootingTests.Wall();
        Footing(m)["width"] = 0.75;  // the wall is 1 ft thick
        Single(m, "narrower than member \"M\"");
    }

    [Fact]
    public void AnImplausiblyDeepEmbedmentIsAnError()
    {
        var m = FootingTests.Wall(embedment: 13);   // more than twice the 6 ft width
        Assert.Contains("pier or caisson", Single(m, "more than 2 times").Problem);
    }

    [Fact]
    public void ADeepButPlausibleEmbedmentReadsWithACaution()
    {
        var model = ModelReader.Parse(FootingTests.Wall(embedment: 4).ToString(), "deep.json");
        Assert.Contains(model.Footings[0].Cautions, c => c.Contains("half the footing's smaller side"));
    }

    [Fact]
    public void AFootingUnderANodeWithoutASupportIsAnError()
    {
        var m = FootingTests.Wall();
        Footing(m)["node"] = "T";
        Assert.Contains("\"type\": \"fixed\"", Single(m, "has no support").Fix);
    }

    [Fact]
    public void AFootingNamingBothANodeAndAPanelIsRefused()
    {
        var m = FootingTests.Wall();
        Footing(m)["panel"] = "P1";
        Single(m, "names both a \"node\" and a \"panel\"");
    }

    [Fact]
    public void AFootingUnderAnUnknownPanelIsRefused()
    {
        var m = FootingTests.Wall();
        var f = Footing(m);
        f.Remove("node");
        f["panel"] = "P1";
        Single(m, "no wall panel \"P1\"");
    }

    [Fact]
    public void BothShearModulusAndWaveVelocityIsAnError()
    {
        var m = FootingTests.Wall();
        Footing(m)["soil"]!["shearWaveVelocity"] = 600;
        Footing(m)["soil"]!["unitWeight"] = 0.12;
        Single(m, "both 'shearModulus' and 'shearWaveVelocity'");
    }

    [Fact]
    public void AReductionFactorAboveOneIsAnError()
    {
        var m = FootingTests.Wall();
        Footing(m)["soil"]!["modulusReduction"] = 1.4;
        Single(m, "'modulusReduction' is 1.4");
    }

    [Fact]
    public void ASpringTheSupportAlreadyHasIsAnError()
    {
        var m = FootingTests.Wall();
        m["supports"] = JArray.FromObject(new[] { new { node = "B", type = "pinned", springs = new { rz = 1000.0 } } });
        Single(m, "already has a spring on 'rz'");
    }

    [Fact]
    public void ShearModulusFromTheWaveVelocity()
    {
        // G₀ = (γ/g)·Vs² (Kramer, Geotechnical Earthquake Engineering, 1996, ch. 5): γ = 0.12 kcf, Vs = 600 ft/s,
        // g = 9.80665 m/s² = 32.174 ft/s²: G₀ = 0.12/32.174·360 000 = 1342.70 ksf; with G/G₀ = 0.5 the footing uses 671.35 ksf.
        var m = FootingTests.Wall();
        Footing(m)["soil"] = new JObject { ["shearWaveVelocity"] = 600, ["unitWeight"] = 0.12, ["poissonRatio"] = 0.35, ["modulusReduction"] = 0.5 };
        var model = ModelReader.Parse(m.ToString(), "vs.json");
        var f = model.Footings[0];
        TestModels.Near(1342.70, model.Units.FromSI(f.SmallStrainModulus, PlaneLateral.Units.Quantity.Stress), 1e-5, "G₀");
        TestModels.Near(671.35, model.Units.FromSI(f.ShearModulus, PlaneLateral.Units.Quantity.Stress), 1e-5, "G");
        Assert.DoesNotContain(f.Cautions, c => c.Contains("no strain-compatible reduction"));
    }
}
