using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>Geometric stiffness, buckling and second-order drift against closed forms.</summary>
public class SecondOrderTests
{
    private const double L = 4.0;          // m
    private const double I = 2.0e-5;       // m⁴
    private static double EI => Building.BuildingModels.E * I;

    /// <summary>Cantilever column: P_cr = π²EI/(4L²) (Timoshenko &amp; Gere, <i>Theory of Elastic Stability</i>).</summary>
    private static double Pcr => Math.PI * Math.PI * EI / (4 * L * L);

    /// <summary>
    /// det(K − λ·K_G) = 0 for a unit tip load gives λ = P_cr. The consistent geometric stiffness with cubic shapes is a
    /// Rayleigh–Ritz approximation, so every mesh gives an upper bound and the error falls as the column is subdivided
    /// (common practice); one element is known to be about 0.75 % high (2.486 vs 2.467 EI/L², from memory).
    /// </summary>
    [Fact]
    public void CantileverCriticalLoadConvergesFromAbove()
    {
        double previous = double.PositiveInfinity;
        foreach (int n in new[] { 1, 2, 4, 8 })
        {
            var model = Parse(SeismicModels.Column(L, I, n, 1.0, 1.0));
            double p = SecondOrderAnalysis.CriticalLoadFactor(model, "P");
            double err = (p - Pcr) / Pcr;
            Assert.True(err > 0, $"{n} elements: upper bound, got {p} vs {Pcr}");
            Assert.True(err < previous, $"{n} elements: error {err} must fall below {previous}");
            previous = err;
        }
        Assert.True(previous < 1e-5, $"8 elements within 1e-5 of π²EI/4L², got {previous:E2}");
        Near(Pcr, SecondOrderAnalysis.CriticalLoadFactor(Parse(SeismicModels.Column(L, I, 1, 1.0, 1.0)), "P"), 0.01, "one element within 1 % (≈0.75 %, from memory)");
    }

    /// <summary>
    /// Tip deflection of a cantilever under axial P and tip shear H. With k² = P/EI and u = kL, the beam-column
    /// equation EI·y'' = H(L − x) + P(δ − y), y(0) = y'(0) = 0, gives δ = H(tan u − u)/(P·k) (derived; Timoshenko &amp;
    /// Gere, ch. 1), so δ/δ₀ = 3(tan u − u)/u³ with δ₀ = HL³/(3EI). The FE second-order solve converges to it as the mesh
    /// is refined; the simple amplification 1/(1 − P/P_cr) is within about 1 % of it at P = P_cr/2 (1.9863 vs 2).
    /// </summary>
    [Fact]
    public void TipDeflectionAmplificationApproachesTheClosedForm()
    {
        double p = 0.5 * Pcr, h = 1000.0;
        double u = Math.Sqrt(p / EI) * L;
        double exact = 3 * (Math.Tan(u) - u) / (u * u * u);
        double d0 = h * L * L * L / (3 * EI);
        double previous = double.PositiveInfinity;
        foreach (int n in new[] { 1, 2, 4, 8, 16 })
        {
            var model = Parse(SeismicModels.Column(L, I, n, p, h));
            var u2 = SecondOrderAnalysis.Solve(model, "P", "H");
            double ratio = u2[3 * n] / d0;
            double err = Math.Abs(ratio - exact) / exact;
            Assert.True(err <= previous * (1 + 1e-9), $"{n} elements: error {err} grows from {previous}");
            previous = err;
        }
        Assert.True(previous < 1e-5, $"16 elements within 1e-5 of 3(tan u − u)/u³, got {previous:E2}");
        Near(1 / (1 - p / Pcr), exact, 0.01, "1/(1 − P/P_cr) approximates the exact amplification at P = P_cr/2");
        // Linear check of the same model: without the gravity case, δ = δ₀ (one element is exact for end loads).
        var r = Solve(SeismicModels.Column(L, I, 1, p, h));
        Near(d0, r.Case("H").Displacement(1, Dof.X), 1e-9, "first order δ₀ = HL³/3EI");
    }

    /// <summary>
    /// One story, two fixed-guided columns (one element each, rotations held at the level), gravity P on each column
    /// top. With θ₁ = θ₂ = 0 the consistent geometric stiffness leaves −36P/(30h) = −1.2P/h per column on the sway, so the
    /// second-order story stiffness is 2(12EI/h³ − 1.2P/h) exactly (derived). θ = P_x·Δ·I_e/(V_x·h·C_d) with
    /// Δ = C_d·δ_e/I_e reduces to 2P·δ_e/(V·h) (derived), and P_x = 2P by statics.
    /// </summary>
    [Fact]
    public void OneStoryStabilityCoefficientAndSecondOrderDrift()
    {
        const double h = 3.5, colI = 400, v = 200e3, p = 1.5e6;
        var json = SeismicModels.ShearBuilding(h, [colI], [1000e3], new { baseShear = v, secondOrder = new { gravity = "G", Cd = 4.0, Ie = 1.25 } });
        json["loadCases"] = Newtonsoft.Json.Linq.JArray.FromObject(new[]
        {
            new { id = "G", nodalLoads = new[] { new { node = "A1", fy = -p }, new { node = "B1", fy = -p } } },
        });
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(json.ToString(), "one.json"));
        var s = SeismicResult.Of(r)!;
        var row = Assert.Single(s.Stability);
        double k = 24 * Building.BuildingModels.E * colI * 1e-6 / (h * h * h);
        double de = v / k;
        Near(2 * p, row.Px, 1e-9, "P_x = 2P by statics");
        Near(v, row.Vx, 1e-9, "V_x = V");
        Near(de, row.ElasticDrift, 1e-9, "δ_e = V/k");
        Near(4.0 * de / 1.25, row.DesignDrift, 1e-9, "Δ = C_d·δ_e/I_e");
        Near(2 * p * de / (v * h), row.Theta, 1e-9, "θ = 2P·δ_e/(V·h)");
        Near(v / (k - 2 * 1.2 * p / h), row.SecondOrderDrift, 1e-9, "second-order drift with the consistent K_G (derived)");
        Near(Math.Min(0.5 / 4.0, 0.25), row.ThetaMax, 1e-12, "θ_max = 0.5/(β·C_d) ≤ 0.25");
        Assert.True(row.Ratio > row.Estimate, "P-δ inside the columns adds to P-Δ: FE ratio above 1/(1 − θ)");
    }

    [Fact]
    public void StabilityStatusFollowsTheLimits()
    {
        // θ grows with P; 0.10 and θ_max = 0.5/(1·4) = 0.125 split the statuses (§12.8.7, from memory).
        const double h = 3.5, colI = 400, v = 200e3;
        double k = 24 * Building.BuildingModels.E * colI * 1e-6 / (h * h * h);
        string StatusAt(double theta)
        {
            double p = theta * k * h / 2;   // θ = 2P/(k·h) (derived above)
            var json = SeismicModels.ShearBuilding(h, [colI], [1000e3], new { baseShear = v, secondOrder = new { gravity = "G", Cd = 4.0 } });
            json["loadCases"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "G", nodalLoads = new[] { new { node = "A1", fy = -p }, new { node = "B1", fy = -p } } } });
            return SeismicResult.Of(LinearStaticAnalysis.Run(ModelReader.Parse(json.ToString(), "s.json")))!.Stability[0].Status;
        }
        Assert.Equal("may be neglected", StatusAt(0.05));
        Assert.Equal("P-delta to be included", StatusAt(0.11));
        Assert.Equal("EXCEEDS theta max", StatusAt(0.2));
    }

    [Fact]
    public void AGravityLoadThatBucklesIsAnErrorNamingTheStory()
    {
        // Story 2 of a two-story shear building: columns of story 2 much weaker; gravity on the roof at twice the
        // story-2 sway buckling load 2·(12EI/h³)·h/1.2 (derived from the one-element K_G above) buckles that story only.
        const double h = 3.5;
        double k2 = 12 * Building.BuildingModels.E * 50e-6 / (h * h * h);
        double p = 2 * k2 * h / 1.2;
        var json = SeismicModels.ShearBuilding(h, [4000, 50], [500e3, 500e3], new { baseShear = 100e3, secondOrder = new { gravity = "G", Cd = 4.0 } });
        json["loadCases"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { id = "G", nodalLoads = new[] { new { node = "A2", fy = -p }, new { node = "B2", fy = -p } } } });
        var e = Assert.Throws<ModelInputException>(() => LinearStaticAnalysis.Run(ModelReader.Parse(json.ToString(), "b.json")));
        Assert.Contains("buckles", e.Message);
        Assert.Contains("story 2 (L1–L2)", e.Message);
        Assert.DoesNotContain("story 1", e.Message);
    }
}
