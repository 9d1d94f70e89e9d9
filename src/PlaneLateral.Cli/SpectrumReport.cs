using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The planar response spectrum tables: modes with S_a, and the combined story results beside the ELF (≤ 100 columns).</summary>
internal static class SpectrumReport
{
    private static string P(double v, string f) => double.IsFinite(v) ? v.ToString(f, CultureInfo.InvariantCulture) : "-";

    public static string Render(AnalysisResult r, PlanarSpectrumResult? s)
    {
        if (s is null) return "";
        var u = r.Model.Units;
        string force = u.ForceSymbol, len = u.LengthSymbol;
        string Fo(double v) => TextTable.Num(u.FromSI(v, Quantity.Force));
        string L(double v) => TextTable.Num(u.FromSI(v, Quantity.Length));
        var sb = new StringBuilder();
        var rs = s.Settings;
        sb.Append($"\nModal response spectrum (ASCE 7-16 §12.9.1): {rs.Rule.ToString().ToUpperInvariant()}, ζ = {rs.Damping}, C_d = {rs.Cd}, R = {s.R}, I_e = {s.Ie}\n");
        sb.Append(PlanSeismicReport.Wrap($"Spectrum: {s.Spectrum.Describe()}", 100, "  "));
        sb.Append($"  {s.ModesUsed} modes, {P(100 * s.CumulativeShare, "0.0")} % of the mass (§12.9.1.1: at least 90 %)\n");
        var mt = new TextTable("mode", "period [s]", "S_a [g]", "Γ", "mass", "cumulative", $"base shear [{force}]").Numeric(0, 1, 2, 3, 4, 5, 6);
        foreach (var m in s.Modes)
            mt.Add(m.Mode.ToString(CultureInfo.InvariantCulture), P(m.Period, "0.0000"), P(m.Sa, "0.0000"), P(m.Gamma / Math.Sqrt(s.TotalMass), "0.000"),
                P(100 * m.Share, "0.0") + " %", P(100 * m.Cumulative, "0.0") + " %", Fo(Math.Abs(m.BaseShear)));
        sb.Append(mt.Render());
        sb.Append("  Γ for the shape scaled so that φᵀMφ = total mass; base shear reduced by R/I_e.\n");
        sb.Append($"  V_t = {Fo(s.Scaling.BaseShearModal)}, V = {Fo(s.Scaling.BaseShearElf)} {force} (ELF base shear)\n");
        sb.Append(PlanSeismicReport.Wrap($"Scaling: {s.Scaling.Why}.", 100, "  "));
        var t = new TextTable("story", $"ELF [{force}]", $"modal [{force}]", $"scaled [{force}]", $"drift [{len}]", $"δ [{len}]", "δ/h", $"Δ comb. [{len}]").Numeric(0, 1, 2, 3, 4, 5, 6, 7);
        foreach (var st in s.Stories.OrderByDescending(x => x.Story))
            t.Add(st.Story.ToString(CultureInfo.InvariantCulture), Fo(st.ElfShear), Fo(st.ModalShear), Fo(st.ScaledShear), L(st.Drift), L(st.DesignDrift), P(st.Ratio, "0.00000"),
                L(st.DriftFromCombinedDisplacements));
        sb.Append(t.Render());
        sb.Append("  drift: story drift per mode, combined, times the drift factor; δ = C_d·drift/I_e (§12.9.1.2);\n" +
                  "  Δ comb.: difference of the combined level displacements, shown only to compare (not the drift).\n");
        return sb.ToString();
    }
}
