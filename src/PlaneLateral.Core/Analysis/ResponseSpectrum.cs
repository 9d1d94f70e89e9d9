using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// A design response spectrum S_a(T) in g: the ASCE 7-16 §11.4.6 shape from S_DS, S_D1 and T_L (from memory, corroborated
/// in ../shared/REFERENCES.md), or a user table of (T, S_a) with linear interpolation between its points, S_a held at
/// the first value below the first T and at the last value beyond the last T (our choice, stated in the reports).
/// </summary>
public sealed class DesignSpectrum
{
    private readonly double[] _t, _sa;

    public double Sds { get; }
    public double Sd1 { get; }
    public double TL { get; }
    /// <summary>True when the spectrum is the user's table.</summary>
    public bool FromTable => _t.Length > 0;

    /// <summary>T₀ = 0.2·S_D1/S_DS (s); NaN for a table.</summary>
    public double T0 => FromTable ? double.NaN : 0.2 * Sd1 / Sds;
    /// <summary>T_S = S_D1/S_DS (s); NaN for a table.</summary>
    public double TS => FromTable ? double.NaN : Sd1 / Sds;

    /// <summary>The §11.4.6 shape.</summary>
    public DesignSpectrum(double sds, double sd1, double tl)
    {
        Sds = sds; Sd1 = sd1; TL = tl; _t = []; _sa = [];
    }

    /// <summary>A table of periods (s, strictly increasing, ≥ 0) and accelerations (g, ≥ 0).</summary>
    public DesignSpectrum(IReadOnlyList<(double T, double Sa)> table)
    {
        _t = table.Select(p => p.T).ToArray();
        _sa = table.Select(p => p.Sa).ToArray();
        Sds = Sd1 = TL = double.NaN;
    }

    /// <summary>The table's points (empty for the §11.4.6 shape).</summary>
    public IReadOnlyList<(double T, double Sa)> Points => _t.Zip(_sa).ToList();

    /// <summary>S_a (g) at period <paramref name="t"/> (s).</summary>
    public double Sa(double t)
    {
        if (FromTable)
        {
            if (t <= _t[0]) return _sa[0];
            if (t >= _t[^1]) return _sa[^1];
            int i = Array.BinarySearch(_t, t);
            if (i >= 0) return _sa[i];
            i = ~i;   // _t[i − 1] < t < _t[i]
            return _sa[i - 1] + (_sa[i] - _sa[i - 1]) * (t - _t[i - 1]) / (_t[i] - _t[i - 1]);
        }
        // §11.4.6: S_DS(0.4 + 0.6 T/T₀) below T₀; S_DS to T_S; S_D1/T to T_L; S_D1·T_L/T² beyond.
        if (t < T0) return Sds * (0.4 + 0.6 * t / T0);
        if (t <= TS) return Sds;
        if (t <= TL) return Sd1 / t;
        return Sd1 * TL / (t * t);
    }

    public string Describe() => FromTable
        ? $"table of {_t.Length} points (T, S_a), linear between points, held flat beyond the ends"
        : $"ASCE 7-16 §11.4.6 from S_DS = {Sds:0.###} g, S_D1 = {Sd1:0.###} g, T_L = {TL:0.##} s (T0 = {T0:0.###} s, TS = {TS:0.###} s)";
}

/// <summary>
/// Modal combination. CQC: r = √(Σ_i Σ_n ρ_in·r_i·r_n) with, for equal damping ζ, ρ = 8ζ²(1+β)β^{3/2} /
/// [(1−β²)² + 4ζ²β(1+β)²], β = ω_n/ω_i (Der Kiureghian, Earthquake Eng. Struct. Dyn. 9:419–435, 1981; Wilson, Der
/// Kiureghian &amp; Bayo, EESD 9:187–194, 1981). SRSS: r = √(Σ r_n²).
/// </summary>
public static class ModalCombination
{
    /// <summary>ρ for two modes of circular frequencies ω_i, ω_n and equal damping ζ (1 when ω_i = ω_n).</summary>
    public static double Rho(double omegaI, double omegaN, double zeta)
    {
        double b = omegaN / omegaI;
        double num = 8 * zeta * zeta * (1 + b) * Math.Pow(b, 1.5);
        double den = (1 - b * b) * (1 - b * b) + 4 * zeta * zeta * b * (1 + b) * (1 + b);
        return num / den;
    }

    /// <summary>The correlation matrix of the modes (identity for SRSS).</summary>
    public static double[,] Correlation(IReadOnlyList<double> omegas, double zeta, ModalRule rule)
    {
        int n = omegas.Count;
        var rho = new double[n, n];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                rho[i, j] = i == j ? 1 : rule == ModalRule.Srss ? 0 : Rho(omegas[i], omegas[j], zeta);
        return rho;
    }

    /// <summary>Each component of a vector response combined mode by mode (one array per mode, all of one length; ≥ 0).</summary>
    public static double[] CombineEach(IReadOnlyList<double[]> perMode, double[,] rho)
    {
        if (perMode.Count == 0) return [];
        var v = new double[perMode[0].Length];
        for (int c = 0; c < v.Length; c++) v[c] = Combine(perMode.Select(p => p[c]).ToList(), rho);
        return v;
    }

    /// <summary>The combined peak of one response given its value in each mode (≥ 0).</summary>
    public static double Combine(IReadOnlyList<double> perMode, double[,] rho)
    {
        double s = 0;
        for (int i = 0; i < perMode.Count; i++)
            for (int j = 0; j < perMode.Count; j++) s += rho[i, j] * perMode[i] * perMode[j];
        return Math.Sqrt(Math.Max(s, 0));
    }
}

/// <summary>
/// Scaling of the combined modal results (ASCE 7-16 §12.9.1.4, from memory; ../shared/REFERENCES.md): where the modal
/// base shear V_t is below the equivalent-lateral-force base shear V, forces are multiplied by V/V_t (§12.9.1.4.1, 100 %
/// in ASCE 7-16); drifts are multiplied by C_s·W/V_t only where C_s is set by the lower limit 0.5·S_1/(R/I_e)
/// (eq. 12.8-6) and V_t is below C_s·W (§12.9.1.4.2); otherwise drifts are not scaled.
/// </summary>
/// <param name="ForceFactor">Factor on every force result (≥ 1).</param>
/// <param name="DriftFactor">Factor on displacements and drifts (≥ 1).</param>
/// <param name="Why">Which rule applied and why, in words.</param>
public sealed record ModalScaling(double BaseShearModal, double BaseShearElf, double ForceFactor, double DriftFactor, string Why)
{
    public static ModalScaling Of(double vt, double v, double cs, string csNote, double weight)
    {
        double force = vt < v && vt > 0 ? v / vt : 1;
        string why = vt < v
            ? $"V_t below V: forces multiplied by V/V_t = {force:0.0000} (§12.9.1.4.1)"
            : $"V_t not below V (V_t/V = {vt / v:0.0000}): forces not scaled (§12.9.1.4.1)";
        double drift = 1;
        bool nearFault = csNote.StartsWith("0.5·S_1", StringComparison.Ordinal);
        if (nearFault && vt < cs * weight && vt > 0)
        {
            drift = cs * weight / vt;
            why += $"; C_s is set by 0.5·S_1/(R/Ie) (eq. 12.8-6) and V_t < C_s·W: drifts multiplied by C_s·W/V_t = {drift:0.0000} (§12.9.1.4.2)";
        }
        else why += nearFault ? "; drifts not scaled (V_t not below C_s·W)" : "; drifts not scaled (C_s is not set by 0.5·S_1/(R/Ie), §12.9.1.4.2)";
        return new ModalScaling(vt, v, force, drift, why);
    }
}
