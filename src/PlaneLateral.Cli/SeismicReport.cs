using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The seismic tables the solve command prints: periods, story forces, stability coefficient and second-order drifts.</summary>
internal static class SeismicReport
{
    public static string Render(ModelResult run)
    {
        var r = run.Analysis;
        var sr = run.Seismic;
        if (sr is null) return "";
        var m = r.Model;
        var s = m.Seismic!;
        var u = m.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol;
        double F(double v) => u.FromSI(v, Quantity.Force);
        string P(double v) => v.ToString("0.000", CultureInfo.InvariantCulture);
        string T(double v) => v.ToString("0.0000", CultureInfo.InvariantCulture);
        var f = sr.Forces;
        var levels = m.Building.Levels;
        var sb = new StringBuilder();

        sb.Append($"\nPeriods (masses = story weights / g on the diaphragm equations; K condensed to them exactly)\n");
        sb.Append(TableView.Render(SeismicFiles.PeriodsTable(r, sr), ["mode", "period", "mass share", .. levels.Skip(1).Select(l => "shape " + l.Id)]));   // periods.csv's table
        var pt = new TextTable("estimate", "period [s]", "basis").Numeric(1);
        pt.Add("eigen, mode 1", T(f.Modes.Count > 0 ? f.Modes[0].Period : double.NaN), "K·φ = ω²·M·φ");
        pt.Add("Rayleigh", T(f.RayleighPeriod), "static deflection under the story forces below (never longer than mode 1)");
        pt.Add("Ta = Ct·hn^x", T(f.Ta), $"Ct = {f.Ct}, x = {f.X}, hn = {f.HeightFeet.ToString("0.0", CultureInfo.InvariantCulture)} ft ({f.TypeRow}); ASCE 7-16 §12.8.2.1, Table 12.8-2");
        if (double.IsFinite(f.Cu)) pt.Add("Cu·Ta", T(f.Cu * f.Ta), $"Cu = {f.Cu.ToString("0.00", CultureInfo.InvariantCulture)} for S_D1 = {s.Spectrum!.Sd1}; Table 12.8-1 (linear between rows)");
        pt.Add("used", T(f.PeriodUsed), f.PeriodNote);
        sb.Append(pt.Render());

        sb.Append($"\nStory forces, case \"{s.CaseId}\": Fx = Cvx·V, Cvx = wx·hx^k / Σ wi·hi^k (ASCE 7-16 §12.8.3), k = {f.Exponent.ToString("0.000", CultureInfo.InvariantCulture)}\n");
        sb.Append(double.IsFinite(f.Cs)
            ? $"  V = Cs·W = {f.Cs.ToString("0.0000", CultureInfo.InvariantCulture)} × {TextTable.Num(F(f.TotalWeight))} = {TextTable.Num(F(f.BaseShear))} {force}; Cs governed by {f.CsNote} (§12.8.1.1)\n"
            : $"  V = {TextTable.Num(F(f.BaseShear))} {force} (given); W = {TextTable.Num(F(f.TotalWeight))} {force}\n");
        // story-forces.csv's table, top level first.
        sb.Append(TableView.Render(SeismicFiles.StoryForcesTable(r, sr).WithRows(rows => rows.Reverse()), ["level", "height", "weight", "Cvx", "Fx", "story shear below"]));

        if (sr.Stability.Count > 0)
        {
            var so = s.SecondOrder!;
            sb.Append($"\nSecond-order effects, gravity \"{so.GravityCase}\": θ = Px·Δ·Ie/(Vx·hsx·Cd) (ASCE 7-16 §12.8.7), Cd = {so.Cd}, Ie = {so.Ie}, β = {so.Beta}; θmax = {P(sr.Stability[0].ThetaMax)}\n");
            sb.Append(TableView.Render(SeismicFiles.SecondOrderTable(r, sr),   // second-order.csv's table
                ["story", "Px", "Vx", "first-order drift", "theta", "second-order drift", "second/first", "status"]));
            sb.Append("  2nd-order drift: (K + K_G)·u = f with the geometric stiffness of the gravity axial forces; θ ≤ 0.10: P-delta may be neglected (§12.8.7); the design drift Cd·δe/Ie and 1/(1−θ) of each story are in second-order.csv.\n");
            if (double.IsFinite(sr.CriticalLoadFactor))
                sb.Append($"  The gravity load would have to be {sr.CriticalLoadFactor.ToString("0.0", CultureInfo.InvariantCulture)} times larger to buckle the structure (det(K + λ·K_G) = 0).\n");
        }

        if (sr.SecondOrderDriftChecks.Count > 0)
        {
            sb.Append("\nDrift check on the second-order drift (amplified = Cd·drift / Ie, ASCE 7-16 eq. 12.8-15)\n");
            sb.Append(TableView.Render(SeismicFiles.SecondOrderDriftChecksTable(r, sr)));   // second-order-drift-checks.csv's table
        }
        sb.Append(SpectrumReport.Render(r, run.Spectrum));
        sb.Append($"  Periods, Cs, k and θ: {SeismicPresets.Status}. A computed aid for a licensed engineer, not a code check.\n");
        return sb.ToString();
    }
}
