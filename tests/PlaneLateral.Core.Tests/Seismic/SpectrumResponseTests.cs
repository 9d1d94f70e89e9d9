using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>
/// Every response of the modal response spectrum analysis combined mode by mode: member end forces, reactions,
/// overturning, and θ from the modal results (planar); the shipped uniform five-story shear frame.
/// </summary>
public class SpectrumResponseTests
{
    private const double H = 3.5, I = 400, W = 500e3, Rr = 5.0, Ie = 1.25, Cd = 4.0;
    private static double StoryK => 2 * 12 * Building.BuildingModels.E * I * 1e-6 / (H * H * H);   // 24EI/h³ (derived)
    private static readonly DesignSpectrum Spec = new(1.0, 0.6, 8);

    /// <summary>A one-story frame (one mass DOF: one mode) whose case "EQ" carries <paramref name="fx"/> (N) at the level.</summary>
    private static JObject OneStory(double fx, object? secondOrder = null)
    {
        var m = SeismicModels.ShearBuilding(H, [I], [W], new
        {
            spectrum = new { SDS = 1.0, SD1 = 0.6, R = Rr, Ie, TL = 8.0 },
            period = "computed",
            responseSpectrum = new { combination = "CQC", Cd },
        });
        ((JArray)m["loadCases"]![0]!["nodalLoads"]!)[0]!["fx"] = fx;
        if (secondOrder is not null)
        {
            ((JArray)m["loadCases"]!).Add(JObject.FromObject(new { id = "G", nodalLoads = new[] { new { node = "A1", fy = -0.5 * W }, new { node = "B1", fy = -0.5 * W } } }));
            m["seismic"]!["secondOrder"] = JObject.FromObject(secondOrder);
        }
        return m;
    }

    /// <summary>The one-story frame's spectral force: S_a(T)·M·g/(R/I_e), T = 2π√(m/k) (one DOF, M_eff = M: derived).</summary>
    private static (double T, double F) SpectralForce()
    {
        double t = 2 * Math.PI * Math.Sqrt(W / SeismicPresets.Gravity / StoryK);
        return (t, Spec.Sa(t) * W / (Rr / Ie));
    }

    /// <summary>
    /// Derived: with one mode the combination of any response is its magnitude in that mode, and the mode's forces are
    /// the spectral static force S_a·M_eff·g/(R/I_e) at the level (distributed by φ, here one DOF). So the combined member
    /// end forces and reactions equal the magnitudes of the static solve under that force, the combined reactions balance
    /// the modal base shear exactly, and the overturning moment at the base is F·h.
    /// </summary>
    [Fact]
    public void OneModeCombinedMemberForcesAndReactionsAreTheSpectralStaticForces()
    {
        var (_, f) = SpectralForce();
        var run = ModelRun.Run(ModelReader.Parse(OneStory(f).ToString(), "one-story.json"));
        var s = run.Spectrum!;
        Assert.Equal(1, s.ModesUsed);
        Near(f, s.Scaling.BaseShearModal, 1e-9, "V_t = S_a·W/(R/I_e)");
        var eq = run.Analysis.Case("EQ");
        Assert.Equal(eq.MemberForces.Count, s.MemberForces.Count);
        double scale = eq.MemberForces.Max(m => Math.Max(Math.Abs(m.V1), Math.Abs(m.M1) / H));
        foreach (var (c, st) in s.MemberForces.Zip(eq.MemberForces))
        {
            Assert.Equal(st.Member, c.Member);
            foreach (var (a, b) in new[] { (c.N1, st.N1), (c.V1, st.V1), (c.M1 / H, st.M1 / H), (c.N2, st.N2), (c.V2, st.V2), (c.M2 / H, st.M2 / H) })
                Assert.True(Math.Abs(a - Math.Abs(b)) <= 1e-9 * scale, $"member {c.Member}: combined {a} against |static| {Math.Abs(b)}");
        }
        foreach (var (c, st) in s.Reactions.Zip(eq.Reactions))
        {
            Assert.Equal(st.Node, c.Node);
            Near(Math.Abs(st.Fx), c.Fx, 1e-9, "Rx");
            Assert.True(Math.Abs(c.Mz - Math.Abs(st.Mz)) <= 1e-9 * f * H, "Mz");
        }
        Near(f, s.Reactions.Sum(x => x.Fx), 1e-9, "Σ combined Rx = combined base shear (one mode, reactions of one sign)");
        Near(f * H, s.Stories[0].Overturning, 1e-9, "overturning at the base = F·h");
    }

    /// <summary>
    /// Derived: a combined response is a seminorm of its per-mode values, ‖r‖ = √(rᵀρr) (ρ positive semidefinite for
    /// equal damping; the identity for SRSS). The base shear per mode is minus the sum of the horizontal reactions, so
    /// by the triangle inequality the combined base shear is at most the sum of the combined reactions, with equality
    /// only when every reaction keeps one share of the base shear in every mode. Here a continuous column beside
    /// fixed-guided story columns takes a different share in each mode, so the bound is strict.
    /// </summary>
    [Theory]
    [InlineData("CQC")]
    [InlineData("SRSS")]
    public void CombinedReactionsBoundTheCombinedBaseShearForSeveralModes(string rule)
    {
        var m = SeismicModels.ShearBuilding(H, [2 * I, I, I], [W, W, W], new
        {
            spectrum = new { SDS = 1.0, SD1 = 0.6, R = Rr, Ie, TL = 8.0 },
            responseSpectrum = new { combination = rule, Cd, modes = 3 },
        });
        var supports = (JArray)m["supports"]!;
        foreach (var sup in supports.Where(x => ((string)x["node"]!).StartsWith('B') && (string)x["node"]! != "B0").ToList()) sup.Remove();
        var s = ModelRun.Run(ModelReader.Parse(m.ToString(), "three-story.json")).Spectrum!;
        Assert.Equal(3, s.ModesUsed);
        double v = s.Stories[0].ModalShear, sum = s.Reactions.Sum(x => x.Fx);
        Assert.True(sum >= v * (1 - 1e-12), $"Σ combined reactions {sum} below the combined base shear {v}");
        Assert.True(sum > v * (1 + 1e-6), $"the shares differ by mode, so the bound is strict: Σ {sum}, V {v}");
        Assert.All(s.MemberForces, e => Assert.True(e.N1 >= 0 && e.V1 >= 0 && e.M1 >= 0 && e.N2 >= 0 && e.V2 >= 0 && e.M2 >= 0, "combined values have no sign"));
    }

    /// <summary>
    /// Derived (ASCE 7-16 eq. 12.8-16, from memory): θ = P_x·Δ·I_e/(V_x·h_sx·C_d) with Δ = C_d·δ/I_e the combined design
    /// drift and V_x the scaled story shear. One mode: δ = F/k with F the spectral force; V_x = max(F, V) with
    /// V = C_s·W the ELF base shear at the eigen period ("computed"); P_x the gravity case's load above the cut, or the
    /// story weight without <c>secondOrder</c>.
    /// </summary>
    [Fact]
    public void OneModeThetaFromTheModalResultsIsTheHandFormula()
    {
        var (t, f) = SpectralForce();
        double cs = Math.Max(Math.Min(1.0, 0.6 / t), 0.044 * 1.0 * Ie) / (Rr / Ie);
        double vx = Math.Max(f, cs * W);
        double delta = Cd * (f / StoryK) / Ie;
        foreach (var (so, p) in new (object? So, double P)[] { (null, W), (new { gravity = "G", Cd, beta = 1.0 }, W) })
        {
            var s = ModelRun.Run(ModelReader.Parse(OneStory(1.0, so).ToString(), "one-story.json")).Spectrum!;
            var row = s.Stories.Single();
            Near(p, row.Px, 1e-9, "P_x");
            Near(delta, row.DesignDrift, 1e-9, "Δ = C_d·(F/k)/I_e");
            Near(vx, row.ScaledShear, 1e-9, "V_x scaled to V where V_t < V");
            Near(p * delta * Ie / (vx * H * Cd), row.Theta, 1e-9, "θ by hand");
            Near(0.5 / Cd, row.ThetaMax, 1e-12, "θ_max = 0.5/(β·C_d)");
            if (so is null) Assert.True(double.IsNaN(row.ThetaElf));
            else Assert.True(row.ThetaElf > 0);
        }
    }

    /// <summary>
    /// Published (Chopra, <i>Dynamics of Structures</i>, the uniform five-story shear frame of the MDOF chapter: floor
    /// weight 100 kip, k = 31.54 kip/in, h = 12 ft; T = 2.00, 0.6852, 0.4346, 0.3383, 0.2966 s — from memory of the book,
    /// ../shared/REFERENCES.md) and derived: ω_n = 2√(k/m)·sin[(2n−1)π/(2(2N+1))], shapes φ_j = sin(j·α_n) with
    /// α_n = (2n−1)π/(2N+1) (the uniform chain with a free top), so the effective mass share of mode n is
    /// (Σ_j sin jα_n)² / (N·Σ_j sin² jα_n), summing to 1. The shipped model models/verification/uniform-five-story-shear-frame.json.
    /// </summary>
    [Fact]
    public void ShippedFiveStoryShearFrameHasThePublishedPeriodsAndClosedFormEffectiveMasses()
    {
        var model = ModelReader.ReadFile(Input.RepositoryFiles.ModelPath("verification/uniform-five-story-shear-frame.json"));
        var run = ModelRun.Run(model);
        var s = run.Spectrum!;
        Assert.Equal(5, s.ModesUsed);
        double[] book = [2.00, 0.6852, 0.4346, 0.3383, 0.2966];
        double k = 31.54 * Plan.PlanJson.KipN / 0.0254, m = 100 * Plan.PlanJson.KipN / SeismicPresets.Gravity;
        for (int n = 0; n < 5; n++)
        {
            Near(book[n], s.Modes[n].Period, n == 0 ? 5e-3 : 5e-4, $"mode {n + 1}, book");
            Near(2 * Math.Sqrt(k / m) * Math.Sin((2 * n + 1) * Math.PI / 22), s.Modes[n].Omega, 1e-8, $"mode {n + 1}, closed form");
            double a = (2 * n + 1) * Math.PI / 11, l = 0, mm = 0;
            for (int j = 1; j <= 5; j++) { l += Math.Sin(j * a); mm += Math.Sin(j * a) * Math.Sin(j * a); }
            Near(l * l / (5 * mm), s.Modes[n].Share, 1e-8, $"mode {n + 1}, effective mass share");
        }
        Near(1.0, s.Modes[^1].Cumulative, 1e-9, "the modes carry all the mass");
        // Statics, mode by mode: the scaled base shear is V (V_t < V here) and the combined column shears of story 1 sum to it.
        Near(s.Scaling.BaseShearElf, s.Stories[0].ScaledShear, 1e-9, "scaled to V (§12.9.1.4.1)");
        Near(s.Stories[0].ModalShear, s.Reactions.Sum(x => x.Fx), 1e-9, "two equal columns: Σ combined Rx = V_t");
        Assert.All(s.Stories, st => Assert.True(st.Theta > 0 && st.ThetaElf > 0 && double.IsFinite(st.Overturning)));
    }

    [Fact]
    public void AccidentalTorsionKeyIsRefusedInAPlanarModel()
    {
        var m = OneStory(1.0);
        m["seismic"]!["responseSpectrum"]!["accidentalTorsion"] = "shifted-masses";
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString(), "one-story.json"));
        Assert.Contains(e.Diagnostics, x => x.JsonPath.EndsWith("accidentalTorsion", StringComparison.Ordinal) && x.Problem.Contains("planar model has no accidental torsion"));
    }
}
