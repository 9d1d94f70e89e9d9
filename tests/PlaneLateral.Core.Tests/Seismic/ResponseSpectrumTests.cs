using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>The design spectrum, the CQC correlation, and the planar modal response spectrum analysis.</summary>
public class ResponseSpectrumTests
{
    /// <summary>
    /// ASCE 7-16 §11.4.6 (from memory, corroborated in ../shared/REFERENCES.md): S_a = S_DS(0.4 + 0.6T/T₀) below
    /// T₀ = 0.2·S_D1/S_DS, S_DS to T_S = S_D1/S_DS, S_D1/T to T_L, S_D1·T_L/T² beyond. With S_DS = 1.0, S_D1 = 0.6,
    /// T_L = 8: T₀ = 0.12 s, T_S = 0.6 s, S_a(0) = 0.4, S_a(0.06) = 0.7, S_a(T_L) = 0.075, S_a(16) = 0.01875 (derived).
    /// </summary>
    [Fact]
    public void DesignSpectrumHasTheCodeShapeAtT0TsAndTl()
    {
        var s = new DesignSpectrum(1.0, 0.6, 8);
        Near(0.12, s.T0, 1e-12, "T0");
        Near(0.6, s.TS, 1e-12, "TS");
        Near(0.4, s.Sa(0), 1e-12, "S_a(0) = 0.4 S_DS");
        Near(0.7, s.Sa(0.06), 1e-12, "half way up the ramp");
        Near(1.0, s.Sa(0.12), 1e-12, "S_a(T0) = S_DS");
        Near(1.0, s.Sa(0.6), 1e-12, "S_a(TS) = S_DS");
        Near(0.5, s.Sa(1.2), 1e-12, "S_D1/T");
        Near(0.075, s.Sa(8), 1e-12, "S_a(TL) = S_D1/TL");
        Near(0.01875, s.Sa(16), 1e-12, "S_D1·TL/T² beyond TL");
        Near(s.Sa(8 - 1e-9), s.Sa(8 + 1e-9), 1e-8, "continuous at TL");
    }

    [Fact]
    public void TableSpectrumInterpolatesLinearlyAndHoldsBeyondItsEnds()
    {
        var s = new DesignSpectrum([(0.1, 0.5), (0.5, 1.0), (2.0, 0.25)]);
        Near(0.5, s.Sa(0.0), 1e-12, "held below the first point");
        Near(0.75, s.Sa(0.3), 1e-12, "linear between points (derived)");
        Near(0.625, s.Sa(1.25), 1e-12, "linear between points (derived)");
        Near(0.25, s.Sa(5.0), 1e-12, "held beyond the last point");
    }

    /// <summary>
    /// Der Kiureghian (1981) equal-damping ρ = 8ζ²(1+β)β^{3/2} / [(1−β²)² + 4ζ²β(1+β)²]: ρ = 1 at β = 1 for any ζ; with
    /// ζ = 0.05, ρ(0.9) = 0.4730, ρ(0.8) = 0.1656, ρ(0.5) = 0.0185 (values computed from the formula and listed in
    /// ../shared/REFERENCES.md); symmetric in the two modes.
    /// </summary>
    [Fact]
    public void CqcCorrelationHasTheDerKiureghianValues()
    {
        Near(1.0, ModalCombination.Rho(10, 10, 0.05), 1e-12, "equal frequencies");
        Near(1.0, ModalCombination.Rho(3, 3, 0.2), 1e-12, "equal frequencies, other damping");
        Assert.Equal(0.4730, ModalCombination.Rho(10, 9, 0.05), 4);
        Assert.Equal(0.1656, ModalCombination.Rho(10, 8, 0.05), 4);
        Assert.Equal(0.0185, ModalCombination.Rho(10, 5, 0.05), 4);
        Near(ModalCombination.Rho(10, 8, 0.05), ModalCombination.Rho(8, 10, 0.05), 1e-12, "ρ_in = ρ_ni");
    }

    /// <summary>Common practice: CQC equals SRSS for well-separated modes (within 1 %), exceeds it for close modes of the
    /// same sign, and SRSS is never below the largest single mode.</summary>
    [Fact]
    public void CqcAgainstSrss()
    {
        double[] separated = [10, 30, 60];
        double[] r = [1.0, 0.6, -0.3];
        double cqc = ModalCombination.Combine(r, ModalCombination.Correlation(separated, 0.05, ModalRule.Cqc));
        double srss = ModalCombination.Combine(r, ModalCombination.Correlation(separated, 0.05, ModalRule.Srss));
        Near(Math.Sqrt(1 + 0.36 + 0.09), srss, 1e-12, "SRSS by hand");
        Assert.True(Math.Abs(cqc / srss - 1) < 0.01, $"separated modes: CQC {cqc} vs SRSS {srss}");
        Assert.True(srss >= r.Max(Math.Abs), "SRSS ≥ largest single mode");
        double[] close = [10, 9.5];
        double[] same = [1.0, 0.8];
        Assert.True(ModalCombination.Combine(same, ModalCombination.Correlation(close, 0.05, ModalRule.Cqc))
            > ModalCombination.Combine(same, ModalCombination.Correlation(close, 0.05, ModalRule.Srss)) * 1.1, "close modes, same sign: CQC > SRSS");
    }

    [Fact]
    public void ScalingFollowsTheCodeRules()
    {
        // §12.9.1.4.1 (from memory): V_t < V → forces × V/V_t; V_t ≥ V → 1. §12.9.1.4.2: drifts only where C_s is set by eq. 12.8-6.
        var low = ModalScaling.Of(80, 100, 0.1, "S_DS/(R/Ie)", 1000);
        Near(1.25, low.ForceFactor, 1e-12, "100/80");
        Near(1.0, low.DriftFactor, 1e-12, "drifts not scaled");
        var high = ModalScaling.Of(120, 100, 0.1, "S_DS/(R/Ie)", 1000);
        Near(1.0, high.ForceFactor, 1e-12, "not scaled down");
        var nearFault = ModalScaling.Of(80, 100, 0.1, "0.5·S_1/(R/Ie), lower limit where S_1 ≥ 0.6 g", 1000);
        Near(1.25, nearFault.DriftFactor, 1e-12, "C_s·W/V_t = 100/80");
    }

    private const double H = 3.5, I = 400, W = 500e3;
    private static double StoryK => 2 * 12 * Building.BuildingModels.E * I * 1e-6 / (H * H * H);   // 24EI/h³ (derived)
    private static double Mass => W / SeismicPresets.Gravity;

    private static StructureModel TwoStory(string rule, double? s1 = null)
    {
        var spectrum = new Dictionary<string, object> { ["SDS"] = 1.0, ["SD1"] = 0.6, ["R"] = 5.0, ["Ie"] = 1.25, ["TL"] = 8.0 };
        if (s1 is { } v) spectrum["S1"] = v;
        var m = SeismicModels.ShearBuilding(H, [2 * I, I], [2 * W, W], new
        {
            spectrum,
            period = "computed",
            responseSpectrum = new { combination = rule, Cd = 4.0 },
        });
        return ModelReader.Parse(m.ToString(), "two-story.json");
    }

    /// <summary>
    /// Two-story shear building with m₁ = 2m, m₂ = m, k₁ = 2k, k₂ = k (Chopra, <i>Dynamics of Structures</i>, the two-story
    /// shear frame of the MDOF chapter — derived here): det(K − λM) = 0 gives ω₁² = k/(2m), ω₂² = 2k/m, φ₁ = (½, 1),
    /// φ₂ = (−1, 1). L₁ = 2m, M₁ = 1.5m, Γ₁ = 4/3, M₁* = 8m/3 (8/9 of the mass); L₂ = −m, M₂ = 3m, Γ₂ = −1/3, M₂* = m/3.
    /// So one mode has 88.9 % of the mass and §12.9.1.1 needs both. Per mode u = Γφ·S_a·g/ω²/(R/I_e); story drifts per
    /// mode: mode 1 (½, ½)·Γ₁D₁, mode 2 (−1, 2)·Γ₂D₂; SRSS of those, not the difference of the SRSS displacements.
    /// </summary>
    [Fact]
    public void TwoStoryShearBuildingAgreesWithTheClosedFormModes()
    {
        var r = PlanarSpectrum.Run(TwoStory("SRSS"))!;
        Assert.Equal(2, r.ModesUsed);
        double w1 = Math.Sqrt(StoryK / (2 * Mass)), w2 = Math.Sqrt(2 * StoryK / Mass);
        Near(w1, r.Modes[0].Omega, 1e-9, "ω₁");
        Near(w2, r.Modes[1].Omega, 1e-9, "ω₂");
        Near(8.0 / 9, r.Modes[0].Share, 1e-9, "M₁*/M");
        Near(1.0, r.Modes[1].Cumulative, 1e-9, "all the mass");
        var spec = new DesignSpectrum(1.0, 0.6, 8);
        double rie = 5.0 / 1.25, g = SeismicPresets.Gravity;
        double sa1 = spec.Sa(2 * Math.PI / w1), sa2 = spec.Sa(2 * Math.PI / w2);
        double d1 = sa1 * g / (w1 * w1) / rie, d2 = sa2 * g / (w2 * w2) / rie;
        // Base shears per mode: M*·S_a·g/(R/I_e) (derived).
        Near(8 * Mass / 3 * sa1 * g / rie, Math.Abs(r.Modes[0].BaseShear), 1e-9, "V₁");
        Near(Mass / 3 * sa2 * g / rie, Math.Abs(r.Modes[1].BaseShear), 1e-9, "V₂");
        double f = r.Scaling.DriftFactor;
        Assert.Equal(1.0, f);   // C_s is not set by eq. 12.8-6 here
        double drift1 = Math.Sqrt(Math.Pow(4.0 / 3 * 0.5 * d1, 2) + Math.Pow(-1.0 / 3 * -1 * d2, 2));
        double drift2 = Math.Sqrt(Math.Pow(4.0 / 3 * 0.5 * d1, 2) + Math.Pow(-1.0 / 3 * 2 * d2, 2));
        Near(drift1, r.Stories[0].Drift, 1e-9, "story 1 drift, per mode then SRSS");
        Near(drift2, r.Stories[1].Drift, 1e-9, "story 2 drift, per mode then SRSS");
        double u2 = Math.Sqrt(Math.Pow(4.0 / 3 * d1, 2) + Math.Pow(1.0 / 3 * d2, 2)), u1 = Math.Sqrt(Math.Pow(4.0 / 3 * 0.5 * d1, 2) + Math.Pow(1.0 / 3 * d2, 2));
        Near(u2 - u1, r.Stories[1].DriftFromCombinedDisplacements, 1e-9, "difference of combined displacements");
        Assert.True(r.Stories[1].Drift > r.Stories[1].DriftFromCombinedDisplacements * 1.01, "the per-mode drift differs from the difference of combined displacements");
        Near(4.0 * drift2 / 1.25, r.Stories[1].DesignDrift, 1e-9, "δ = C_d·δ_e/I_e");
        // Statics per mode: Σ story shear = Σ of the mode's level forces above the cut; SRSS ≥ the largest mode.
        Assert.True(r.Stories[0].ModalShear >= r.Modes.Max(m => Math.Abs(m.BaseShear)) - 1e-9, "SRSS ≥ max single mode");
        Near(Math.Sqrt(r.Modes.Sum(m => m.BaseShear * m.BaseShear)), r.Stories[0].ModalShear, 1e-9, "SRSS of the modal base shears");
    }

    /// <summary>§12.9.1.4.1 (from memory): V_t below the ELF V scales forces by V/V_t, and the scaled base shear is V.</summary>
    [Fact]
    public void ModalBaseShearIsScaledToTheElfBaseShear()
    {
        var model = TwoStory("CQC");
        var r = PlanarSpectrum.Run(model)!;
        var elf = SeismicAnalysis.Forces(model)!;
        Near(elf.BaseShear, r.Scaling.BaseShearElf, 1e-12, "V from the ELF path");
        if (r.Scaling.BaseShearModal < elf.BaseShear)
            Near(elf.BaseShear, r.Stories[0].ScaledShear, 1e-9, "scaled to 100 % of V");
        else Near(r.Stories[0].ModalShear, r.Stories[0].ScaledShear, 1e-12, "not scaled");
        Near(elf.BaseShear, r.Stories[0].ElfShear, 1e-9, "ELF story shear at the base = V (statics)");
    }
}
