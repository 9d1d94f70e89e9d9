using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The planar response spectrum tables: modes with S_a, and the combined story results beside the ELF (≤ 100 columns).</summary>
internal static class SpectrumReport
{
    /// <summary>Members listed on the console at most (all are in the results file).</summary>
    private const int MaxMemberRows = 40;

    private static string P(double v, string f) => double.IsFinite(v) ? v.ToString(f, CultureInfo.InvariantCulture) : "-";

    public static string Render(AnalysisResult r, PlanarSpectrumResult? s)
    {
        if (s is null) return "";
        var u = r.Model.Units;
        string force = u.ForceSymbol;
        string Fo(double v) => TextTable.Num(u.FromSI(v, Quantity.Force));
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
        var stories = SpectrumFiles.StoriesTable(r, s).WithRows(rows => rows.OrderByDescending(x => (int)x[0]));   // the file's table, the top story first
        sb.Append(TableView.Render(stories, ["story", "ELF shear", "modal shear", "scaled modal shear", "drift", "design drift Cd*drift/Ie", "design drift ratio",
            "difference of combined displacements (not the drift)"]));
        sb.Append("  drift: story drift per mode, combined, times the drift factor; δ = C_d·drift/I_e (§12.9.1.2);\n" +
                  "  Δ comb.: difference of the combined level displacements, shown only to compare (not the drift).\n");

        sb.Append(TableView.Render(stories, ["story", "overturning moment (no sign)", "scaled overturning moment", "Px", "theta (modal)", "theta (ELF)", "theta max"]));
        sb.Append(PlanSeismicReport.Wrap($"Overturning: at each story's base, per mode, combined. θ = P_x·Δ·I_e/(V_x·h_sx·C_d) (ASCE 7-16 eq. 12.8-16) with Δ the design drift above and V_x the scaled story shear; P_x is {s.PxSource}.", 100, "  "));
        if (s.Reactions.Count > 0)
        {
            sb.Append("\n  Support reactions, combined mode by mode\n").Append(TableView.Render(SpectrumFiles.ReactionsTable(r, s)));   // the file's table
        }
        if (s.MemberForces.Count > 0)
        {
            // The file's table, its scaled columns, the first rows.
            var et = SpectrumFiles.MembersTable(r, s).WithRows(rows => rows.Take(MaxMemberRows));
            string[] scaled = ["member", "scaled N start", "scaled V start", "scaled M start", "scaled N end", "scaled V end", "scaled M end"];
            sb.Append("\n  Member end forces, combined mode by mode and scaled (local axes)\n").Append(TableView.Render(et, scaled));
            if (s.MemberForces.Count > MaxMemberRows)
                sb.Append($"  The first {MaxMemberRows} of {s.MemberForces.Count} members; all of them in response-spectrum-members.csv.\n");
        }
        sb.Append("  Combined values are peaks without sign, each combined from its own per-mode values (never\n" +
                  "  the combination of a sum); they do not occur at one instant and do not balance one another.\n");
        return sb.ToString();
    }
}
