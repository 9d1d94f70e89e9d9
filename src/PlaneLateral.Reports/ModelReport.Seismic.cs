using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>
/// The seismic part of the report: base shear, periods, vertical distribution of the story forces, stability
/// coefficient and second-order drifts, the drift check on the story-force case. Every number comes from Core
/// (<see cref="SeismicResult"/>, <see cref="SeismicAnalysis"/>); nothing is worked out again here.
/// </summary>
public static partial class ModelReport
{
    private static string P3(double v) => double.IsFinite(v) ? v.ToString("0.000", CultureInfo.InvariantCulture) : "n/a";
    private static string P4(double v) => double.IsFinite(v) ? v.ToString("0.0000", CultureInfo.InvariantCulture) : "n/a";

    /// <summary>θ with at least four decimals and three significant figures for small values.</summary>
    private static string Theta(double v) => double.IsFinite(v) ? v.ToString("0.0000##", CultureInfo.InvariantCulture) : "n/a";

    /// <summary>Rows of the methods table for the seismic block (none without one).</summary>
    private static IEnumerable<IReadOnlyList<string>> SeismicMethods(StructureModel m)
    {
        if (m.Seismic is not { } s) yield break;
        yield return ["Periods (lumped level masses)", "K·φ = ω²·M·φ on the diaphragm DOFs, K condensed exactly (F = K⁻¹ on the mass DOFs); M^½·F·M^½·ψ = ψ/ω² by cyclic Jacobi; mass share = (Σm·φ)²/(Σm·φ²·Σm)", "Golub & Van Loan, Matrix Computations, §8.5 (Jacobi; common practice); docs/seismic.md"];
        yield return ["Rayleigh period", "ω² = Σ f·u / Σ m·u² for the static deflection u under the story forces f; T = 2π/ω", "Rayleigh's method (common practice)"];
        yield return ["Approximate period", "T_a = C_t·h_n^x, h_n in ft; upper limit C_u·T_a", "ASCE 7-16 §12.8.2.1, Table 12.8-2 (C_t, x), Table 12.8-1 (C_u), from memory"];
        yield return s.Spectrum is null
            ? ["Base shear", "V as given; W = Σ w_x", "user input"]
            : ["Seismic response coefficient", "C_s = S_DS/(R/I_e) ≤ S_D1/(T·R/I_e) (T ≤ T_L) or S_D1·T_L/(T²·R/I_e) (T > T_L); ≥ 0.044·S_DS·I_e ≥ 0.01; ≥ 0.5·S_1/(R/I_e) where S_1 ≥ 0.6 g; V = C_s·W", "ASCE 7-16 §12.8.1.1, from memory"];
        yield return ["Vertical distribution", "F_x = C_vx·V, C_vx = w_x·h_x^k / Σ w_i·h_i^k; k = 1 (T ≤ 0.5 s), 2 (T ≥ 2.5 s), linear between", "ASCE 7-16 §12.8.3, from memory"];
        if (s.SecondOrder is not null)
        {
            yield return ["Stability coefficient", "θ = P_x·Δ·I_e/(V_x·h_sx·C_d), Δ = C_d·δ_e/I_e; θ ≤ 0.10 P-delta may be neglected; θ_max = 0.5/(β·C_d) ≤ 0.25", "ASCE 7-16 §12.8.7, from memory"];
            yield return ["Second-order (P-delta) drift", "(K + K_G)·u = f, K_G the consistent geometric stiffness of the cubic shape under the gravity axial forces (chord term N/L for braces and released members); amplification ≈ 1/(1 − θ)", "McGuire, Gallagher & Ziemian, Matrix Structural Analysis, 2nd ed., 2000, ch. 9"];
        }
    }

    /// <summary>The seismic section: base shear, periods, story forces, second-order drifts and θ, drift check.</summary>
    private static void AddSeismic(List<Block> blocks, Action<Figure> figure, AnalysisResult r, BuildingResult b, SeismicResult sr, string heading, PlanarSpectrumResult? spectrum = null)
    {
        var m = r.Model;
        var s = m.Seismic!;
        var u = m.Units;
        var f = sr.Forces;
        var levels = m.Building.Levels;
        string len = u.LengthSymbol, force = u.ForceSymbol;
        string L(double si) => F(u.FromSI(si, Quantity.Length));
        string Fo(double si) => F(u.FromSI(si, Quantity.Force));

        blocks.Add(new Heading(2, heading));
        blocks.Add(new Paragraph($"The seismic block of the model: story weights, {(s.Spectrum is null ? "a given base shear" : "spectral values")}, the equivalent lateral forces written to the generated load case \"{s.CaseId}\"{(s.SecondOrder is { } g ? $", and the stability coefficient and a second-order analysis under the gravity case \"{g.GravityCase}\"" : "")}. Clause numbers and table values: {SeismicPresets.Status}."));

        // Base shear.
        var bs = new List<IReadOnlyList<string>>();
        if (s.Spectrum is { } sp)
        {
            bs.Add(["S_DS", $"{F(sp.Sds)} g", "design spectral acceleration, short periods (input)"]);
            bs.Add(["S_D1", $"{F(sp.Sd1)} g", "design spectral acceleration at 1 s (input)"]);
            bs.Add(["R", F(sp.R), "response modification coefficient (input)"]);
            bs.Add(["I_e", F(sp.Ie), "importance factor (input)"]);
            bs.Add(["T_L", $"{F(sp.TL)} s", "long-period transition period (input)"]);
            if (double.IsFinite(sp.S1)) bs.Add(["S_1", $"{F(sp.S1)} g", "mapped spectral acceleration at 1 s (input)"]);
            bs.Add(["T", $"{P4(f.PeriodUsed)} s", $"period used: {f.PeriodNote}"]);
            var x = SeismicAnalysis.ResponseTerms(sp, f.PeriodUsed);
            bs.Add(["S_DS/(R/I_e)", P4(x.Basic), "§12.8.1.1, the basic value"]);
            bs.Add([x.UpperExpression, P4(x.Upper), "§12.8.1.1, upper limit at T"]);
            bs.Add(["0.044·S_DS·I_e ≥ 0.01", P4(x.Lower), "§12.8.1.1, lower limit"]);
            if (double.IsFinite(x.LowerNearFault)) bs.Add(["0.5·S_1/(R/I_e)", P4(x.LowerNearFault), "§12.8.1.1, lower limit where S_1 ≥ 0.6 g"]);
            bs.Add(["C_s", P4(f.Cs), $"governed by {f.CsNote}"]);
            bs.Add(["W", $"{Fo(f.TotalWeight)} {force}", "Σ of the story weights"]);
            bs.Add(["V = C_s·W", $"{Fo(f.BaseShear)} {force}", "base shear"]);
        }
        else
        {
            bs.Add(["W", $"{Fo(f.TotalWeight)} {force}", "Σ of the story weights"]);
            bs.Add(["V", $"{Fo(f.BaseShear)} {force}", "base shear as given (no spectral values, so no C_s)"]);
            bs.Add(["T", $"{P4(f.PeriodUsed)} s", $"period used for k: {f.PeriodNote}"]);
        }
        blocks.Add(new Table("Base shear", ["quantity", "value", "expression, source or note"], bs, [1]));

        // Periods.
        var upper = levels.Skip(1).ToList();
        blocks.Add(ReportTables.From(SeismicFiles.PeriodsTable(r, sr), "Vibration modes (level masses = story weights / g on the diaphragm equations; periods.csv)",
            ["mode", "period", "mass share", .. upper.Select(l => "shape " + l.Id)]));
        var est = new List<IReadOnlyList<string>>
        {
            new[] { "first eigen period", P4(f.Modes.Count > 0 ? f.Modes[0].Period : double.NaN), "K·φ = ω²·M·φ", "docs/seismic.md" },
            new[] { "Rayleigh", P4(f.RayleighPeriod), "static deflection under the story forces below (never longer than the first eigen period)", "Rayleigh's method (common practice)" },
            new[] { "T_a = C_t·h_n^x", P4(f.Ta), $"C_t = {F(f.Ct)}, x = {F(f.X)}, h_n = {f.HeightFeet.ToString("0.0", CultureInfo.InvariantCulture)} ft ({f.TypeRow})", "ASCE 7-16 §12.8.2.1, Table 12.8-2" },
        };
        if (double.IsFinite(f.Cu))
            est.Add(["C_u·T_a", P4(f.Cu * f.Ta), $"C_u = {f.Cu.ToString("0.00", CultureInfo.InvariantCulture)} for S_D1 = {F(s.Spectrum!.Sd1)} g (linear between rows, our choice)", "ASCE 7-16 Table 12.8-1"]);
        est.Add(["used", P4(f.PeriodUsed), f.PeriodNote, $"the model's \"period\" choice ({s.Period.ToString().ToLowerInvariant()})"]);
        blocks.Add(new Table("Period estimates side by side", ["estimate", "period [s]", "basis", "source"], est, [1]));

        // Vertical distribution (top level first, as a building is drawn).
        var weights = levels.Select(l => u.FromSI(s.Weights.FirstOrDefault(w => w.Level == l.Index)?.Weight ?? 0, Quantity.Force)).ToArray();
        var heights = levels.Select(l => u.FromSI(l.Elevation - levels[0].Elevation, Quantity.Length)).ToArray();
        var whk = SeismicAnalysis.WeightedHeights(weights, heights, f.Exponent);
        string k = f.Exponent.ToString("0.000", CultureInfo.InvariantCulture);
        var dist = new List<IReadOnlyList<string>>();
        for (int i = levels.Count - 1; i >= 1; i--)
            dist.Add([levels[i].Id, F(weights[i]), F(heights[i]), F(whk[i]), P4(f.Cvx[i]), Fo(f.LevelForces[i]), Fo(sr.Stories.Stories[i - 1].Shear)]);
        dist.Add(["Σ", F(weights.Sum()), "", F(whk.Sum()), P4(f.Cvx.Sum()), Fo(f.LevelForces.Sum()), ""]);
        blocks.Add(new Paragraph($"F_x = C_vx·V with C_vx = w_x·h_x^k / Σ w_i·h_i^k (ASCE 7-16 §12.8.3), h_x above the base, k = {k} for T = {P4(f.PeriodUsed)} s. The forces act in +x at each level's diaphragm in case \"{s.CaseId}\"; V_x is the story shear below the level, from the member forces by statics."));
        blocks.Add(new Table($"Vertical distribution of the base shear V = {Fo(f.BaseShear)} {force}, k = {k}",
            ["level", $"w_x [{force}]", $"h_x [{len}]", $"w_x·h_x^k [{force}·{len}^k]", "C_vx", $"F_x [{force}]", $"V_x [{force}]"], dist, [1, 2, 3, 4, 5, 6]));
        figure(SeismicPlots.StoryForces(r, sr));

        // Second-order effects.
        if (sr.Stability.Count > 0)
        {
            var so = s.SecondOrder!;
            double thetaMax = sr.Stability[0].ThetaMax;
            blocks.Add(new Paragraph($"Stability coefficient θ = P_x·Δ·I_e/(V_x·h_sx·C_d) per story (ASCE 7-16 §12.8.7) with C_d = {F(so.Cd)}, I_e = {F(so.Ie)}, β = {F(so.Beta)}: θ_max = min(0.5/(β·C_d), 0.25) = {P3(thetaMax)}. P_x is the vertical load of \"{so.GravityCase}\" above the story's cut, Δ = C_d·δ_e/I_e. Beside it the second-order analysis (K + K_G)·u = f of case \"{s.CaseId}\": its drift over the first-order drift, next to the estimate 1/(1 − θ). Status: θ ≤ {F(SecondOrderAnalysis.NeglectLimit)} P-delta may be neglected; above it P-delta to be included; above θ_max the limit is exceeded."));
            blocks.Add(new Table($"First- and second-order drift and θ per story, case {s.CaseId}, gravity {so.GravityCase}",
                ["story", $"P_x [{force}]", $"V_x [{force}]", $"δe, 1st order [{len}]", $"Δ [{len}]", "θ", $"δ, 2nd order [{len}]", "2nd / 1st", "1/(1−θ)", "status"],
                sr.Stability.Select(x => (IReadOnlyList<string>)[$"{x.Story.Index}", Fo(x.Px), Fo(x.Vx), L(x.ElasticDrift), L(x.DesignDrift), Theta(x.Theta), L(x.SecondOrderDrift), P4(x.Ratio), P4(x.Estimate), x.Status]).ToList(),
                [0, 1, 2, 3, 4, 5, 6, 7, 8]));
            if (double.IsFinite(sr.CriticalLoadFactor))
                blocks.Add(new Paragraph(double.IsPositiveInfinity(sr.CriticalLoadFactor)
                    ? $"The gravity case \"{so.GravityCase}\" does not soften the structure (no buckling load factor)."
                    : $"Gravity load factor to buckling, det(K + λ·K_G) = 0: λ = {sr.CriticalLoadFactor.ToString("0.0", CultureInfo.InvariantCulture)} (the gravity load of \"{so.GravityCase}\" would have to be that many times larger)."));
        }

        // Drift check on the story-force case, first and second order.
        var first = b.DriftChecks.Where(d => d.CaseId == s.CaseId).ToList();
        var rows = first.Concat(sr.SecondOrderDriftChecks).OrderBy(d => d.Check.Id, StringComparer.Ordinal).ThenBy(d => d.Story.Index).ThenBy(d => d.CaseId.Length).ToList();
        if (rows.Count > 0)
        {
            blocks.Add(new Table($"Drift check on the story forces, case {s.CaseId}: first and second order (δ = C_d·δe/I_e, ASCE 7-16 eq. 12.8-15)",
                ["check", "analysis", "story", $"δe [{len}]", $"δ [{len}]", "δ/h", "allowable", "margin", "result"],
                rows.Select(d => (IReadOnlyList<string>)[d.Check.Id, d.CaseId == s.CaseId ? "first order" : "second order", $"{d.Story.Index}", L(d.ElasticDrift), L(d.AmplifiedDrift), Pct(d.Ratio, "0.000"), Pct(d.Allowed, "0.##"), Pct(d.Margin, "0"), d.Passes ? "within" : "exceeds"]).ToList(),
                [2, 3, 4, 5, 6, 7]));
        }
        if (sr.Stability.Count > 0) figure(SeismicPlots.SecondOrderDrift(r, sr, b));
        if (spectrum is not null) AddSpectrum(blocks, figure, r, spectrum);
    }

    /// <summary>
    /// The modal response spectrum part of the seismic section: the spectrum with the periods, the modes and their shapes,
    /// which scaling applied and why, the combined story results unscaled and scaled beside the ELF, the drift check on
    /// the modal drifts, θ from the modal results beside the ELF θ, and the combined reactions and member end forces.
    /// </summary>
    private static void AddSpectrum(List<Block> blocks, Action<Figure> figure, AnalysisResult r, PlanarSpectrumResult s)
    {
        var m = r.Model;
        var u = m.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol, mom = u.Label(Quantity.Moment);
        string L(double si) => F(u.FromSI(si, Quantity.Length));
        string Fo(double si) => F(u.FromSI(si, Quantity.Force));
        string Mo(double si) => F(u.FromSI(si, Quantity.Moment));
        var rs = s.Settings;
        double k = s.Scaling.ForceFactor;
        blocks.Add(new Paragraph($"Modal response spectrum analysis (§12.9.1; {SeismicPresets.Status}). Spectrum: {s.Spectrum.Describe()}; modes of the lumped level masses, the fewest reaching 90 % of the mass (§12.9.1.1){(rs.Modes > 0 ? $" and at least {rs.Modes}" : "")}: {s.ModesUsed} modes, {Pct(s.CumulativeShare, "0.0")}. Per mode the forces M·φ·Γ·S_a·g/(R/I_e) with R = {F(s.R)}, I_e = {F(s.Ie)}; every response (story shear, story drift, overturning moment, member end forces, reactions) is worked out per mode and then combined by {rs.Rule.ToString().ToUpperInvariant()}{(rs.Rule == ModalRule.Cqc ? $" (Der Kiureghian 1981, ζ = {F(rs.Damping)})" : "")}. Combined values are peak magnitudes without sign; they do not occur at one instant and do not balance one another."));
        figure(SpectrumPlots.Spectrum(s.Spectrum, s.Modes.Select(x => x.Period).ToList()));
        blocks.Add(new Table("Modal response spectrum: modes", ["mode", "period [s]", "S_a [g]", "Γ (φᵀMφ = M)", "mass share", "cumulative", $"base shear [{force}]"],
            s.Modes.Select(x => (IReadOnlyList<string>)[$"{x.Mode}", P4(x.Period), P4(x.Sa), P3(x.Gamma / Math.Sqrt(s.TotalMass)), Pct(x.Share, "0.0"), Pct(x.Cumulative, "0.0"), Fo(Math.Abs(x.BaseShear))]).ToList(),
            [0, 1, 2, 3, 4, 5, 6]));
        if (s.Shapes.Count > 0) figure(SpectrumPlots.ModeShapes(m, s));

        blocks.Add(new Paragraph($"Scaling (§12.9.1.4): the combined modal base shear V_t = {Fo(s.Scaling.BaseShearModal)} {force} against the ELF base shear V = {Fo(s.Scaling.BaseShearElf)} {force}: {s.Scaling.Why}. Forces are multiplied by {P4(k)}, drifts by {P4(s.Scaling.DriftFactor)}."));
        blocks.Add(new Table($"Modal response spectrum: story shear and overturning, combined (unscaled) and scaled × {P4(k)}, beside the ELF",
            ["story", $"ELF V_x [{force}]", $"modal V_x [{force}]", $"scaled V_x [{force}]", "scaled / ELF", $"modal overturning [{mom}]", $"scaled overturning [{mom}]"],
            s.Stories.OrderByDescending(x => x.Story).Select(x => (IReadOnlyList<string>)[$"{x.Story}", Fo(x.ElfShear), Fo(x.ModalShear), Fo(x.ScaledShear), P3(x.ScaledShear / x.ElfShear), Mo(x.Overturning), Mo(k * x.Overturning)]).ToList(),
            [0, 1, 2, 3, 4, 5, 6]));
        figure(SpectrumPlots.StoryShears(m, s));

        var check = m.Building.DriftChecks.FirstOrDefault(c => c.Cases.Contains(m.Seismic!.CaseId));
        blocks.Add(new Paragraph($"Drift from the modal results: the story drift of each mode (difference of the mode's level displacements), combined, times the drift factor {P4(s.Scaling.DriftFactor)}; δ = C_d·drift/I_e with C_d = {F(rs.Cd)} (§12.9.1.2). The difference of the combined level displacements is shown only to compare: it is not the drift. {(check is null ? "No drift check names the story-force case, so no allowable ratio is applied." : $"Allowable ratio from the drift check '{check.Id}' ({check.LimitSource}).")}"));
        blocks.Add(new Table("Modal response spectrum: drift check on the modal drifts",
            ["story", $"drift [{len}]", $"δ [{len}]", $"h [{len}]", "δ/h", "allowable", "result", $"Δ of combined displacements [{len}]"],
            s.Stories.OrderByDescending(x => x.Story).Select(x => (IReadOnlyList<string>)[$"{x.Story}", L(x.Drift), L(x.DesignDrift), L(x.Height), Pct(x.Ratio, "0.000"),
                check is null ? "-" : Pct(check.AllowedRatio, "0.##"), check is null ? "-" : x.Ratio <= check.AllowedRatio ? "within" : "exceeds", L(x.DriftFromCombinedDisplacements)]).ToList(),
            [0, 1, 2, 3, 4, 7]));
        blocks.Add(new Paragraph($"Stability coefficient from the modal results (ASCE 7-16 §12.8.7, eq. 12.8-16): θ = P_x·Δ·I_e/(V_x·h_sx·C_d) with Δ the combined design drift and V_x the scaled modal story shear; P_x is {s.PxSource}. Beside it the θ of the equivalent lateral forces (where the model has secondOrder)."));
        blocks.Add(new Table("Modal response spectrum: θ beside the ELF θ",
            ["story", $"P_x [{force}]", $"V_x scaled [{force}]", $"Δ [{len}]", "θ modal", "θ ELF", "θ_max", "status (modal)"],
            s.Stories.OrderByDescending(x => x.Story).Select(x => (IReadOnlyList<string>)[$"{x.Story}", Fo(x.Px), Fo(x.ScaledShear), L(x.DesignDrift), Theta(x.Theta), Theta(x.ThetaElf), P3(x.ThetaMax),
                x.Theta > x.ThetaMax ? "EXCEEDS theta max" : x.Theta > SecondOrderAnalysis.NeglectLimit ? "P-delta to be included" : "may be neglected"]).ToList(),
            [0, 1, 2, 3, 4, 5, 6]));
        if (s.Reactions.Count > 0)
            blocks.Add(ReportTables.From(SpectrumFiles.ReactionsTable(r, s), $"Modal response spectrum: support reactions combined mode by mode (no sign), scaled × {P4(k)} (response-spectrum-reactions.csv)",
                ["node", "scaled Rx", "scaled Ry", "scaled Mz"]));
        if (s.MemberForces.Count > 0)
        {
            blocks.Add(ReportTables.From(SpectrumFiles.MembersTable(r, s).WithRows(rows => rows.Take(MaxSpectrumMemberRows)),
                $"Modal response spectrum: member end forces combined mode by mode (no sign, local axes), scaled × {P4(k)} (response-spectrum-members.csv)",
                ["member", "scaled N start", "scaled V start", "scaled M start", "scaled N end", "scaled V end", "scaled M end"]));
            if (s.MemberForces.Count > MaxSpectrumMemberRows)
                blocks.Add(new Paragraph($"The first {MaxSpectrumMemberRows} of {s.MemberForces.Count} members are listed; all are in response-spectrum-members.csv."));
        }
    }

    /// <summary>Members listed in the report's spectrum table at most (all are in the results file).</summary>
    private const int MaxSpectrumMemberRows = 60;

    /// <summary>Verdict lines of the seismic block.</summary>
    private static IEnumerable<string> SeismicVerdicts(AnalysisResult r, SeismicResult? sr)
    {
        if (sr is null) yield break;
        var u = r.Model.Units;
        var f = sr.Forces;
        yield return $"Seismic story forces: V = {F(u.FromSI(f.BaseShear, Quantity.Force))} {u.ForceSymbol} ({(double.IsFinite(f.Cs) ? $"C_s = {P4(f.Cs)}, governed by {f.CsNote}" : "given")}), period used {P4(f.PeriodUsed)} s: {f.PeriodNote}; k = {f.Exponent.ToString("0.000", CultureInfo.InvariantCulture)}.";
        if (sr.Stability.Count > 0)
        {
            var worst = sr.Stability.MaxBy(x => x.Theta)!;
            double tmax = worst.ThetaMax;
            int over = sr.Stability.Count(x => x.Theta > tmax), pd = sr.Stability.Count(x => x.Theta > SecondOrderAnalysis.NeglectLimit);
            yield return over > 0
                ? $"Stability coefficient: θ exceeds θ_max = {P3(tmax)} in {over} of {sr.Stability.Count} stories (largest θ = {Theta(worst.Theta)}, story {worst.Story.Index}); ASCE 7-16 §12.8.7 does not allow that: the structure is potentially unstable as modelled."
                : pd > 0
                    ? $"Stability coefficient: θ above 0.10 in {pd} of {sr.Stability.Count} stories (largest θ = {Theta(worst.Theta)}, story {worst.Story.Index}; θ_max = {P3(tmax)}): P-delta effects are to be included; the second-order drifts are in the seismic section."
                    : $"Stability coefficient: θ ≤ 0.10 in every story (largest θ = {Theta(worst.Theta)}, story {worst.Story.Index}; θ_max = {P3(tmax)}): by §12.8.7 P-delta effects may be neglected.";
            var gap = sr.Stability.MaxBy(x => Math.Abs(x.Ratio - x.Estimate))!;
            yield return $"Second-order analysis: drift amplification 2nd/1st from {P4(sr.Stability.Min(x => x.Ratio))} to {P4(sr.Stability.Max(x => x.Ratio))}; the largest difference from 1/(1 − θ) is {P4(gap.Ratio - gap.Estimate)} (story {gap.Story.Index}).";
        }
        foreach (var g in sr.SecondOrderDriftChecks.GroupBy(d => d.Check.Id))
        {
            var worst = g.MaxBy(d => d.Ratio)!;
            int over = g.Count(d => !d.Passes);
            yield return over == 0
                ? $"Drift check '{g.Key}' on the second-order drift: every story within the allowable {Pct(worst.Allowed, "0.##")}; the largest δ/h is {Pct(worst.Ratio, "0.000")} (story {worst.Story.Index})."
                : $"Drift check '{g.Key}' on the second-order drift: {over} of {g.Count()} stories exceed the allowable {Pct(worst.Allowed, "0.##")}; the largest δ/h is {Pct(worst.Ratio, "0.000")} (story {worst.Story.Index}).";
        }
    }

    /// <summary>Caution lines of the seismic block.</summary>
    private static IEnumerable<string> SeismicCautions(SeismicResult? sr)
    {
        if (sr is null) yield break;
        yield return $"Seismic: the equivalent lateral force procedure is applied as described in docs/seismic.md, with clause numbers and table values as quoted there ({SeismicPresets.Status}). The governing code decides whether the procedure is permitted and which values, exceptions and footnotes apply (none of the §12.8 exceptions is applied; a planar model has no accidental torsion; where the model asks for the modal response spectrum analysis, its rules and choices are stated in its part of the seismic section). Nothing here shows compliance.";
        if (sr.Stability.Count > 0)
            yield return "Second order: the axial forces of the gravity case are those of the linear solve (no iteration); K_G leaves out the shear flexibility; θ is worked out from the first-order drift and the gravity load above each story (§12.8.7, from memory); the second-order drift is shown beside it, not substituted for it.";
    }
}
