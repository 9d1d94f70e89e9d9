using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>Periods from the stiffness and the lumped story masses, and Rayleigh's estimate beside them.</summary>
public class PeriodTests
{
    private const double H = 3.5;       // m
    private const double I = 400;       // 10⁻⁶ m⁴ per column
    private const double W = 500e3;     // N per level

    private static double StoryK => 2 * 12 * Building.BuildingModels.E * I * 1e-6 / (H * H * H);   // 24EI/h³ (derived: fixed-guided columns)
    private static double Mass => W / SeismicPresets.Gravity;

    private static ModalModel Modal(int stories, double[]? weights = null, double[]? columnI = null)
    {
        var m = SeismicModels.ShearBuilding(H, columnI ?? Enumerable.Repeat(I, stories).ToArray(), weights ?? Enumerable.Repeat(W, stories).ToArray(), new { baseShear = 1000.0 });
        var model = ModelReader.Parse(m.ToString(), "shear.json");
        return SeismicAnalysis.Modal(model)!;
    }

    /// <summary>
    /// Uniform shear building of N stories, story stiffness k, floor mass m: ω_n = 2√(k/m)·sin[(2n−1)π/(2(2N+1))]
    /// (from memory; ../shared/REFERENCES.md). Checked by hand: N = 1 gives 2·sin(π/6) = 1, ω = √(k/m), the single
    /// oscillator. N = 2: K = k[[2, −1], [−1, 1]], M = m·I, det(K − λM) = 0 → λ² − 3(k/m)λ + (k/m)² = 0 →
    /// λ = (k/m)(3 ∓ √5)/2 = 0.381966 k/m and 2.618034 k/m; the formula gives (2 sin(π/10))² = 0.381966 and
    /// (2 sin(3π/10))² = 2.618034. Agreed. The condensation to the diaphragm DOFs is exact and the element exact for
    /// fixed-guided columns, so the FE frequencies must match to round-off.
    /// </summary>
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(6)]
    public void UniformShearBuildingHasTheClosedFormFrequencies(int n)
    {
        var modes = Modal(n).Modes(n);
        Assert.Equal(n, modes.Count);
        for (int j = 1; j <= n; j++)
        {
            double omega = 2 * Math.Sqrt(StoryK / Mass) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1)));
            Near(omega, modes[j - 1].Omega, 1e-9, $"N = {n}, mode {j}: closed form (from memory, checked by hand for N = 1, 2)");
            Near(2 * Math.PI / omega, modes[j - 1].Period, 1e-9, "T = 2π/ω");
        }
    }

    [Fact]
    public void TwoStoryHandValues()
    {
        // The N = 2 hand solution above: ω₁² = 0.381966·k/m, ω₂² = 2.618034·k/m (derived, to the six digits written).
        var modes = Modal(2).Modes(2);
        Near(0.381966 * StoryK / Mass, modes[0].Omega * modes[0].Omega, 1e-6, "ω₁² by hand");
        Near(2.618034 * StoryK / Mass, modes[1].Omega * modes[1].Omega, 1e-6, "ω₂² by hand");
        // Mode 1 shape by hand: (2k − λ₁m)φ₁ = kφ₂ → φ₁/φ₂ = 1/(2 − 0.381966) = 0.618034 (derived).
        Near(0.618034, modes[0].LevelShape[1], 1e-5, "mode 1 shape at L1 (L2 = 1)");
        // Effective masses add up to the total mass (common practice: Σ Γ²·M* = Σm).
        Near(1.0, modes.Sum(x => x.MassShare), 1e-9, "mass shares sum to 1 over all modes");
    }

    public static TheoryData<double[]> LoadShapes() => new()
    {
        new[] { 1.0, 1.0, 1.0, 1.0 },
        new[] { 1.0, 2.0, 3.0, 4.0 },
        new[] { 0.0, 0.0, 0.0, 1.0 },
        new[] { 1.0, -0.5, 0.25, 2.0 },
    };

    /// <summary>
    /// Rayleigh's quotient bounds ω₁² from above for any trial shape (Rayleigh's principle — common practice), so the
    /// Rayleigh period from a static deflection is never longer than the first eigen period.
    /// </summary>
    [Theory]
    [MemberData(nameof(LoadShapes))]
    public void RayleighPeriodIsNeverLongerThanTheFirstEigenPeriod(double[] shape)
    {
        var modal = Modal(4, [400e3, 520e3, 480e3, 300e3], [600, 450, 450, 300]);
        double t1 = modal.Modes(1)[0].Period;
        double tr = modal.RayleighPeriod([0.0, .. shape]);
        Assert.True(tr <= t1 * (1 + 1e-12), $"Rayleigh {tr} s must not exceed T1 = {t1} s");
    }

    /// <summary>
    /// When the static load is the inertia load of mode 1, f = ω₁²·M·φ₁, the deflection is φ₁ itself and Rayleigh's
    /// quotient is ω₁² exactly (derived: K⁻¹·ω₁²Mφ₁ = φ₁).
    /// </summary>
    [Fact]
    public void RayleighPeriodEqualsTheEigenPeriodForTheModeShapeLoad()
    {
        double[] w = [400e3, 520e3, 480e3, 300e3];
        var modal = Modal(4, w, [600, 450, 450, 300]);
        var mode = modal.Modes(1)[0];
        // Rigid diaphragms: each level is one mass DOF, so level force = m·φ (the scale does not matter).
        var f = new double[5];
        for (int l = 1; l <= 4; l++) f[l] = w[l - 1] / SeismicPresets.Gravity * mode.LevelShape[l];
        Near(mode.Period, modal.RayleighPeriod(f), 1e-9, "Rayleigh = eigen for the mode-shape load");
        Assert.True(modal.RayleighPeriod([0, 1, 1, 1, 1]) < mode.Period * (1 - 1e-6), "a uniform load is not the mode shape: strictly shorter");
    }

    /// <summary>
    /// Levels without a diaphragm share their mass equally among their nodes. The shear building has no beams, so its
    /// two column lines are then two independent chains, each of story stiffness 12EI/h³ and floor mass m/2: the same
    /// k/m as the tied building, so every frequency of the closed form appears twice (derived).
    /// </summary>
    [Fact]
    public void LevelsWithoutDiaphragmSplitTheirMass()
    {
        const int n = 3;
        var m = SeismicModels.ShearBuilding(H, Enumerable.Repeat(I, n).ToArray(), Enumerable.Repeat(W, n).ToArray(), new { baseShear = 1000.0 });
        foreach (var l in ((Newtonsoft.Json.Linq.JArray)m["levels"]!).Skip(1)) l["diaphragm"] = "none";
        var modal = SeismicAnalysis.Modal(ModelReader.Parse(m.ToString(), "loose.json"))!;
        Assert.Equal(2 * n, modal.Masses.Length);
        var modes = modal.Modes(2 * n);
        for (int j = 1; j <= n; j++)
        {
            double omega = 2 * Math.Sqrt(StoryK / Mass) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1)));
            Near(omega, modes[2 * j - 2].Omega, 1e-9, $"mode {j}, first chain");
            Near(omega, modes[2 * j - 1].Omega, 1e-9, $"mode {j}, second chain");
        }
    }
}
