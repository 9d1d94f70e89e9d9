namespace PlaneLateral.Model;

/// <summary>The seismic weight of one level: the level's index in <see cref="BuildingData.Levels"/> and its weight (N).</summary>
public sealed record LevelWeight(int Level, double Weight);

/// <summary>Which period sets the story-force exponent k and the response coefficient C_s.</summary>
public enum PeriodUse
{
    /// <summary>The first eigen period, not above the upper limit C_u·T_a (needs S_D1 for C_u; without it, the eigen period).</summary>
    Capped,
    /// <summary>The first eigen period as computed.</summary>
    Computed,
    /// <summary>The approximate period T_a = C_t·h_n^x.</summary>
    Approximate,
    /// <summary>A period the user gives.</summary>
    Given,
}

/// <summary>Spectral values for C_s (ASCE 7-16 §12.8.1.1, from memory). Accelerations in g, periods in s.</summary>
/// <param name="S1">Mapped S_1 (g) for the lower limit where S_1 ≥ 0.6 g; NaN when not given.</param>
public sealed record SpectralValues(double Sds, double Sd1, double R, double Ie, double TL, double S1);

/// <summary>
/// The second-order settings: the gravity case or combination whose member axial forces give the geometric stiffness,
/// and the factors of the stability coefficient θ = P_x·Δ·I_e/(V_x·h_sx·C_d) (ASCE 7-16 §12.8.7, from memory).
/// </summary>
/// <param name="Beta">β, ratio of shear demand to shear capacity (1 unless given).</param>
public sealed record SecondOrderSettings(string GravityCase, double Cd, double Ie, double Beta);

/// <summary>
/// The "seismic" block (docs/seismic.md): story weights, the period estimate, the base shear or the spectral values
/// it comes from, the load case the story forces are written to, and the second-order settings. SI inside.
/// </summary>
public sealed class SeismicData
{
    /// <summary>Id of the generated load case (it is listed among the model's load cases, its loads filled in by the analysis).</summary>
    public required string CaseId { get; init; }

    /// <summary>Weights of the levels above the base, lowest first (N).</summary>
    public required IReadOnlyList<LevelWeight> Weights { get; init; }

    /// <summary>Structure type for the approximate period ("steel-moment-frame", ...; see <see cref="SeismicPresets"/>).</summary>
    public required string StructureType { get; init; }

    /// <summary>Base shear given by the user (N), or NaN when it comes from <see cref="Spectrum"/>.</summary>
    public double BaseShear { get; init; } = double.NaN;

    public SpectralValues? Spectrum { get; init; }

    public PeriodUse Period { get; init; } = PeriodUse.Capped;

    /// <summary>The period given (s) for <see cref="PeriodUse.Given"/>, else NaN.</summary>
    public double GivenPeriod { get; init; } = double.NaN;

    /// <summary>How many modes to report.</summary>
    public int Modes { get; init; } = 3;

    public SecondOrderSettings? SecondOrder { get; init; }

    /// <summary>Modal response spectrum analysis beside the story forces (null when not asked).</summary>
    public ResponseSpectrumSettings? ResponseSpectrum { get; init; }
}

/// <summary>
/// Table values for the period estimate, quoted in ../shared/REFERENCES.md from memory (ASCE 7-16 numbering; confirm the
/// edition). The governing code decides.
/// </summary>
public static class SeismicPresets
{
    /// <summary>Standard gravity (m/s²), to turn weights into masses (common practice).</summary>
    public const double Gravity = 9.80665;

    public const string Status = "ASCE 7-16 numbering, values from memory: confirm the edition; the governing code decides";

    /// <summary>C_t and x of ASCE 7-16 Table 12.8-2 with h_n in feet (from memory).</summary>
    public static IReadOnlyDictionary<string, (double Ct, double X, string Row)> PeriodCoefficients { get; } =
        new Dictionary<string, (double, double, string)>(StringComparer.Ordinal)
        {
            ["steel-moment-frame"] = (0.028, 0.8, "steel moment-resisting frames"),
            ["concrete-moment-frame"] = (0.016, 0.9, "concrete moment-resisting frames"),
            ["steel-eccentrically-braced-frame"] = (0.03, 0.75, "steel eccentrically braced frames"),
            ["other"] = (0.02, 0.75, "all other structural systems"),
        };

    /// <summary>
    /// Coefficient for the upper limit on the period, C_u (ASCE 7-16 Table 12.8-1, from memory): S_D1 ≥ 0.4 → 1.4,
    /// 0.3 → 1.4, 0.2 → 1.5, 0.15 → 1.6, ≤ 0.1 → 1.7; linear between the rows (our choice).
    /// </summary>
    public static double UpperLimitCoefficient(double sd1)
    {
        double[] s = [0.1, 0.15, 0.2, 0.3, 0.4];
        double[] c = [1.7, 1.6, 1.5, 1.4, 1.4];
        if (sd1 <= s[0]) return c[0];
        if (sd1 >= s[^1]) return c[^1];
        int i = 0;
        while (sd1 > s[i + 1]) i++;
        return c[i] + (c[i + 1] - c[i]) * (sd1 - s[i]) / (s[i + 1] - s[i]);
    }
}
