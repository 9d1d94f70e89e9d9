using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The console tables of a building's seismic block: modes, equivalent lateral forces, A_x, and the response
/// spectrum analysis beside the ELF (tables of at most 100 columns).</summary>
internal static class PlanSeismicReport
{
    private static string P(double v, string f = "0.000") => double.IsFinite(v) ? v.ToString(f, CultureInfo.InvariantCulture) : "-";

    public static string Render(PlanResult r, PlanSeismicResult s)
    {
        var p = r.Plan;
        var u = p.Units;
        string force = u.ForceSymbol, len = u.LengthSymbol;
        string Fo(double v) => TextTable.Num(u.FromSI(v, Quantity.Force));
        string L(double v) => TextTable.Num(u.FromSI(v, Quantity.Length));
        var sb = new StringBuilder();

        sb.Append("\nModes in plan (floor mass W/g at the centre of mass, J about it; K on Ux, Uy, Rz of every floor)\n");
        sb.Append(TableView.Render(PlanSeismicFiles.ModesTable(r, s), ["mode", "period", "dominant", "share x", "share y", "share torsion", "cumulative x", "cumulative y", "cumulative torsion"]));
        sb.Append($"  Effective mass shares; torsion about the building's centre of mass ({L(s.Modal.Pivot.X)}, {L(s.Modal.Pivot.Y)}) {len}.\n");

        var sd = p.Seismic!;
        sb.Append($"\nEquivalent lateral forces (ASCE 7-16 §12.8), S_DS = {sd.Spectrum.Sds}, S_D1 = {sd.Spectrum.Sd1}, R = {sd.Spectrum.R}, I_e = {sd.Spectrum.Ie}\n");
        sb.Append(TableView.Render(PlanSeismicFiles.ElfTable(r, s), ["direction", "mode", "modal period", "Ta", "Cu*Ta", "period used", "Cs", "k", "V"]));
        foreach (var e in s.Elf)
            sb.Append($"  {e.Direction}: T = {e.PeriodNote}; Cs by {e.CsNote}; cases {string.Join(", ", e.Cases)}\n");
        sb.Append(TableView.Render(PlanTableViews.ElfForces(r, s), ["direction", "level", "Fx"]));
        sb.Append("  Applied at the centres of mass and shifted ± the accidental eccentricity; their story and line\n" +
                  "  shears, corner drifts and torsional irregularity are in the tables above.\n");

        if (s.Amplification.Count > 0)
        {
            sb.Append("\nAmplification of the accidental torsion A_x = (δmax / 1.2 δavg)², 1 to 3 (ASCE 7-16 §12.8.4.3)\n");
            sb.Append(TableView.Render(PlanTableViews.Amplification(r, s)));
            sb.Append("  Applied (cases <id>-x+ecc·Ax, <id>-x-ecc·Ax) only in a direction with a Type 1a or 1b torsional\n" +
                      "  irregularity (SDC C to F assumed: the governing code decides).\n");
        }

        if (s.Spectrum is { } sp)
        {
            var rs = sp.Settings;
            sb.Append($"\nModal response spectrum (ASCE 7-16 §12.9.1): {rs.Rule.ToString().ToUpperInvariant()}, ζ = {rs.Damping}, C_d = {rs.Cd}, R = {sp.R}, I_e = {sp.Ie}\n");
            sb.Append(Wrap($"Spectrum: {sp.Spectrum.Describe()}", 100, "  "));
            sb.Append(Wrap($"Accidental torsion: {sp.TorsionMethod}.", 100, "  "));
            var pts = new TextTable("mode", "analysis", "period [s]", "S_a [g]").Numeric(0, 2, 3);
            foreach (var m in sp.Directions[0].Modes) pts.Add(m.Mode.ToString(CultureInfo.InvariantCulture), m.Variant == "" ? "-" : "masses " + m.Variant, P(m.Period, "0.0000"), P(m.Sa, "0.0000"));
            sb.Append(pts.Render());
            foreach (var d in sp.Directions)
            {
                sb.Append($"\n  Along {d.Direction}: {d.ModesUsed} modes, {Pct(d.CumulativeShare)} of the mass (§12.9.1.1: at least 90 %); " +
                          $"V_t = {Fo(d.Scaling.BaseShearModal)}, V = {Fo(d.Scaling.BaseShearElf)} {force}\n");
                sb.Append(Wrap("Scaling: " + d.Scaling.Why + ".", 100, "  "));
                string dir = d.Direction;
                var stories = PlanTableViews.SpectrumStories(r, sp, dir);
                sb.Append(TableView.Render(stories,
                    ["story", "ELF shear", "modal shear", "scaled modal shear", "corner", "drift", "design drift Cd*drift/Ie", "design drift ratio",
                     "difference of combined displacements (not the drift)"]));
                if (p.DriftLimit is { } lim)
                {
                    var worst = d.Stories.OrderByDescending(x => x.Ratio).First();
                    var over = d.Stories.Where(x => x.Ratio > lim.AllowedRatio).Select(x => x.Story.ToString(CultureInfo.InvariantCulture)).ToList();
                    sb.Append($"  Modal drift check, allowed δ/h {lim.AllowedRatio}: worst {P(worst.Ratio, "0.00000")} (story {worst.Story}); " +
                              $"{(over.Count == 0 ? "all within" : "EXCEEDS in stories " + string.Join(", ", over))}\n");
                }
                sb.Append(TableView.Render(stories, ["story", "Px", "theta (modal)", "theta (ELF)", "theta max"]));
                sb.Append(TableView.Render(PlanTableViews.SpectrumLines(r, sp, dir),
                    ["story", "line", "ELF shear", "modal shear", "scaled modal shear", "accidental torsion", "design shear", "design overturning"]));
                sb.Append($"  Design reactions of the lines along {d.Direction} (scaled + accidental torsion; member end\n  forces in plan-spectrum-line-members.csv)\n")
                    .Append(TableView.Render(PlanTableViews.SpectrumLineReactions(r, sp, dir), ["line", "node", "Rx design", "Ry design", "Mz design"]));
            }
            sb.Append("  drift: at the worst outline corner, story drift per mode, combined, times the drift factor,\n" +
                      "  plus the static accidental torsion's (§12.9.1.5); δ = C_d·drift/I_e; Δ comb.: difference of\n" +
                      "  the combined displacements, shown only to compare (it is not the drift).\n" +
                      "  design = scaled + |accidental torsion| per line (torques from the ELF forces; 0 with shifted\n" +
                      "  masses, whose two analyses are enveloped). θ = P_x·Δ·I_e/(V_x·h·C_d) (eq. 12.8-16), P_x the floor\n" +
                      "  weights above the cut, Δ the design drift at the worst corner, V_x the scaled story shear; θ ELF\n" +
                      "  from the ELF cases' worst corner drift; θ max with β = 1. Combined values are peaks without sign,\n" +
                      "  each combined from its per-mode values (every line's planar model solved under each mode).\n");
        }
        sb.Append($"  {SeismicPresets.Status}.\n  A computed aid for a licensed engineer, not a code check.\n");
        return sb.ToString();
    }

    private static string Pct(double v) => (100 * v).ToString("0.0", CultureInfo.InvariantCulture) + " %";

    /// <summary>Words of <paramref name="text"/> in lines of at most <paramref name="width"/> columns, each starting with <paramref name="indent"/>.</summary>
    internal static string Wrap(string text, int width, string indent)
    {
        var sb = new StringBuilder(indent);
        int col = indent.Length;
        foreach (var word in text.Split(' '))
        {
            if (col > indent.Length && col + 1 + word.Length > width) { sb.Append('\n').Append(indent); col = indent.Length; }
            else if (col > indent.Length) { sb.Append(' '); col++; }
            sb.Append(word); col += word.Length;
        }
        return sb.Append('\n').ToString();
    }
}
