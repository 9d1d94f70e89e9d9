using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Reports;

public static partial class BuildingReport
{
    /// <summary>The seismic block: modes in plan, equivalent lateral forces, A_x, and the response spectrum beside the ELF.</summary>
    private static void Seismic(Doc d)
    {
        var s = d.Run.Seismic!;
        var p = d.P;
        var sd = p.Seismic!;
        d.Heading("Modes and seismic forces");
        d.Text($"Each floor's mass m = W/g at its centre of mass with its polar inertia J about it; modes of K·φ = ω²·M·φ on every floor's (Ux, Uy, Rz). " +
            $"Γ and the effective mass are for a unit motion along X, along Y and a unit turn about the building's centre of mass ({d.L(s.Modal.Pivot.X)}, {d.L(s.Modal.Pivot.Y)}) {d.Len}. " +
            "The mode shapes are in plan-modes.csv, written by the solve command.");
        d.Table("Modes in plan", ["mode", "period [s]", "dominant", "Γ x", "Γ y", "Γ torsion", "mass x", "mass y", "mass torsion", "cumulative x", "cumulative y", "cumulative torsion"],
            s.Modal.Modes.Select(m => (IReadOnlyList<string>)[I(m.Number), Ratio(m.Period, "0.0000"), m.Dominant, Num(m.Participation[0]), Num(m.Participation[1]), Num(m.Participation[2]),
                Pct(m.Share[0]), Pct(m.Share[1]), Pct(m.Share[2]), Pct(m.Cumulative[0]), Pct(m.Cumulative[1]), Pct(m.Cumulative[2])]),
            0, 1, 3, 4, 5, 6, 7, 8, 9, 10, 11);
        d.Text("Γ is in the units of the mass-normalised shapes (√kg for translation, kg·m/√kg for the turn, SI), shown to compare modes; the shares are dimensionless.");

        d.Sub("Equivalent lateral forces");
        d.Text($"S_DS = {Ratio(sd.Spectrum.Sds, "0.###")} g, S_D1 = {Ratio(sd.Spectrum.Sd1, "0.###")} g, R = {Ratio(sd.Spectrum.R, "0.###")}, I_e = {Ratio(sd.Spectrum.Ie, "0.###")}. " +
            "Per direction: the period of the mode with the largest effective mass along it, against T_a = C_t·h_n^x and C_u·T_a; C_s at the period used; V = C_s·W; " +
            "F_x = C_vx·V at the centres of mass, shifted ± the accidental eccentricity in the twin cases.");
        d.Table("Base shear per direction", ["along", "mode", "T mode [s]", "h_n [ft]", "T_a [s]", "C_u", "C_u·T_a [s]", "T used [s]", "why", "C_s", "C_s set by", $"W [{d.Force}]", $"V [{d.Force}]", "k", "cases"],
            s.Elf.Select(e => (IReadOnlyList<string>)[e.Direction, I(e.Mode), Ratio(e.ModalPeriod, "0.0000"), Ratio(e.HeightFeet, "0.##"), Ratio(e.Ta, "0.0000"), Ratio(e.Cu, "0.##"),
                Ratio(e.Cu * e.Ta, "0.0000"), Ratio(e.PeriodUsed, "0.0000"), e.PeriodNote, Ratio(e.Cs, "0.0000"), e.CsNote, d.Fo(e.Weight), d.Fo(e.BaseShear), Ratio(e.Exponent),
                string.Join(", ", e.Cases)]), 1, 2, 3, 4, 5, 6, 7, 9, 11, 12, 13);
        var heights = p.Levels.Select(l => l.Elevation - p.Levels[0].Elevation).ToList();
        d.Table("Story forces (F_x = C_vx·V) and story shears (V_x = Σ F above)", ["level", $"w_x [{d.Force}]", $"h_x [{d.Len}]", .. s.Elf.SelectMany(e => new[] { $"C_vx ({e.Direction})", $"F_x along {e.Direction} [{d.Force}]", $"V_x along {e.Direction} [{d.Force}]" })],
            Enumerable.Range(1, p.FloorCount).Reverse().Select(l => (IReadOnlyList<string>)[d.Level(l), d.Fo(p.Levels[l].Weight), d.L(heights[l]),
                .. s.Elf.SelectMany(e => new[] { Ratio(e.Cvx[l - 1], "0.0000"), d.Fo(e.LevelForces[l - 1]), d.Fo(e.LevelForces.Skip(l - 1).Sum()) })]),
            [.. Enumerable.Range(1, 2 + 3 * s.Elf.Count)]);
        d.Text("Their floor motions, line shears, corner drifts and torsional irregularity are in the sections above, as for any case.");

        if (s.Amplification.Count > 0)
        {
            d.Add(ReportTables.From(Output.PlanTableViews.Amplification(d.R, s),
                "Amplification of the accidental torsion, A_x = (δ_max/1.2·δ_avg)², 1 to 3 (ASCE 7-16 §12.8.4.3, eq. 12.8-14; plan-amplification.csv)"));
            d.Text("Applied (the cases named …+ecc·Ax and …-ecc·Ax) only in a direction with a Type 1a or 1b torsional irregularity; that A_x applies only in Seismic Design Categories C to F is for the engineer to confirm.");
        }

        if (s.Spectrum is { } sp) Spectrum(d, sp);
    }

    private static void Spectrum(Doc d, PlanSpectrumResult sp)
    {
        var p = d.P;
        var rs = sp.Settings;
        d.Sub("Modal response spectrum");
        d.Text($"{rs.Rule.ToString().ToUpperInvariant()} combination, ζ = {Ratio(rs.Damping, "0.###")}, C_d = {Ratio(rs.Cd, "0.###")}, R = {Ratio(sp.R, "0.###")}, I_e = {Ratio(sp.Ie, "0.###")}. " +
            $"Spectrum: {sp.Spectrum.Describe()}. One excitation direction at a time; modes enough for {Pct(rs.MassShare, "0")} of the mass along it (ASCE 7-16 §12.9.1.1); " +
            "forces ÷ R/I_e; the story drift taken per mode at each outline corner, then combined, times the drift factor, plus the drift of the static accidental torsion " +
            "(§12.9.1.5); δ = C_d·drift/I_e. The combined displacements' difference is shown beside it only to make plain that it is not the drift.");
        var modes = sp.Directions[0].Modes;
        d.Figure(SpectrumPlots.Spectrum(sp.Spectrum, modes.Select(m => m.Period).ToList(), modes.Select(m => $"T{m.Mode}").ToList(), "plan-spectrum.png"));
        d.Add(ReportTables.From(Output.PlanTableViews.SpectrumModes(d.R, sp, sp.Directions[0].Direction), "Spectral accelerations at the modal periods (plan-spectrum-modes.csv)",
            ["mode", "period", "Sa"]));
        foreach (var dir in sp.Directions)
        {
            d.Add(ReportTables.From(Output.PlanTableViews.SpectrumModes(d.R, sp, dir.Direction),
                $"Modes along {dir.Direction}: base shears of each mode (reduced by R/I_e; plan-spectrum-modes.csv)",
                ["mode", "period", "gamma", "base shear x", "base shear y", "base torque"]));
            d.Text($"Along {dir.Direction}: {dir.ModesUsed} modes, {Pct(dir.CumulativeShare)} of the mass; combined modal base shear V_t = {d.Fo(dir.Scaling.BaseShearModal)} {d.Force}, " +
                $"ELF base shear V = {d.Fo(dir.Scaling.BaseShearElf)} {d.Force}; force factor {Ratio(dir.Scaling.ForceFactor, "0.0000")}, drift factor {Ratio(dir.Scaling.DriftFactor, "0.0000")}. " +
                $"Scaling rule applied: {dir.Scaling.Why}. Equilibrium of the combined story forces: {Sci(dir.EquilibriumError)}.");
            var lim = p.DriftLimit;
            d.Table($"Stories along {dir.Direction}: CQC/SRSS beside ELF, drift on the modal drifts", ["story", $"ELF shear [{d.Force}]", $"modal [{d.Force}]", $"scaled [{d.Force}]", "corner",
                    $"modal drift [{d.Len}]", $"torsion drift [{d.Len}]", $"drift [{d.Len}]", $"δ [{d.Len}]", "δ/h", "allowable", "result", $"Δ of combined displacements [{d.Len}]"],
                dir.Stories.OrderByDescending(x => x.Story).Select(x => (IReadOnlyList<string>)[I(x.Story), d.Fo(x.ElfShear), d.Fo(x.ModalShear), d.Fo(x.ScaledShear), I(x.Corner + 1),
                    d.L(x.ModalDrift), d.L(x.TorsionDrift), d.L(x.Drift), d.L(x.DesignDrift), Ratio(x.Ratio, "0.00000"), lim is null ? "-" : Ratio(lim.AllowedRatio, "0.####"),
                    lim is null ? "no check" : x.Ratio <= lim.AllowedRatio ? "within" : "exceeds", d.L(x.DriftFromCombinedDisplacements)]),
                0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 12);
            d.Add(ReportTables.From(Output.PlanTableViews.SpectrumLines(d.R, sp, dir.Direction),
                $"Line story shears along {dir.Direction}: ELF beside the modal (design = scaled + |accidental torsion|; plan-spectrum-lines.csv)",
                ["story", "line", "ELF shear", "modal shear", "scaled modal shear", "accidental torsion", "design shear"]));
        }
        d.Text("Lines across the excitation direction are in plan-spectrum-lines.csv, written by the solve command, with every story and mode of this section.");
    }

    private static bool Along(PlanLine line, string dir) => Output.PlanTableViews.Along(line, dir);
}
