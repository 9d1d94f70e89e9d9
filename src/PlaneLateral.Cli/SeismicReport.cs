using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
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
        double L(double v) => u.FromSI(v, Quantity.Length);
        double F(double v) => u.FromSI(v, Quantity.Force);
        string P(double v) => v.ToString("0.000", CultureInfo.InvariantCulture);
        string T(double v) => v.ToString("0.0000", CultureInfo.InvariantCulture);
        var f = sr.Forces;
        var levels = m.Building.Levels;
        var sb = new StringBuilder();

        sb.Append($"\nPeriods (masses = story weights / g on the diaphragm equations; K condensed to them exactly)\n");
        var mt = new TextTable(["mode", "period [s]", "mass share", .. levels.Skip(1).Select(l => $"shape {l.Id}")]).Numeric([.. Enumerable.Range(0, levels.Count + 2)]);
        foreach (var md in f.Modes)
            mt.Add([md.Number.ToString(CultureInfo.InvariantCulture), T(md.Period), (100 * md.MassShare).ToString("0.0", CultureInfo.InvariantCulture) + " %", .. md.LevelShape.Skip(1).Select(P)]);
        sb.Append(mt.Render());
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
        var ft = new TextTable("level", $"height [{len}]", $"weight [{force}]", "Cvx", $"Fx [{force}]", $"story shear [{force}]").Numeric(1, 2, 3, 4, 5);
        for (int i = levels.Count - 1; i >= 1; i--)
        {
            double w = s.Weights.FirstOrDefault(x => x.Level == i)?.Weight ?? 0;
            var st = sr.Stories.Stories[i - 1];
            ft.Add(levels[i].Id, TextTable.Num(L(levels[i].Elevation - levels[0].Elevation)), TextTable.Num(F(w)), P(f.Cvx[i]), TextTable.Num(F(f.LevelForces[i])), TextTable.Num(F(st.Shear)));
        }
        sb.Append(ft.Render());

        if (sr.Stability.Count > 0)
        {
            var so = s.SecondOrder!;
            sb.Append($"\nSecond-order effects, gravity \"{so.GravityCase}\": θ = Px·Δ·Ie/(Vx·hsx·Cd) (ASCE 7-16 §12.8.7), Cd = {so.Cd}, Ie = {so.Ie}, β = {so.Beta}; θmax = {P(sr.Stability[0].ThetaMax)}\n");
            var t = new TextTable("story", $"Px [{force}]", $"Vx [{force}]", $"1st-order drift [{len}]", $"Δ = Cd·δe/Ie [{len}]", "θ", $"2nd-order drift [{len}]", "2nd/1st", "1/(1−θ)", "status")
                .Numeric(0, 1, 2, 3, 4, 5, 6, 7, 8);
            foreach (var x in sr.Stability)
                t.Add(x.Story.Index.ToString(CultureInfo.InvariantCulture), TextTable.Num(F(x.Px)), TextTable.Num(F(x.Vx)), TextTable.Num(L(x.ElasticDrift)), TextTable.Num(L(x.DesignDrift)),
                    TextTable.Num(x.Theta), TextTable.Num(L(x.SecondOrderDrift)), x.Ratio.ToString("0.0000", CultureInfo.InvariantCulture),
                    x.Estimate.ToString("0.0000", CultureInfo.InvariantCulture), x.Status);
            sb.Append(t.Render());
            sb.Append("  2nd-order drift: (K + K_G)·u = f with the geometric stiffness of the gravity axial forces; θ ≤ 0.10: P-delta may be neglected (§12.8.7).\n");
            if (double.IsFinite(sr.CriticalLoadFactor))
                sb.Append($"  The gravity load would have to be {sr.CriticalLoadFactor.ToString("0.0", CultureInfo.InvariantCulture)} times larger to buckle the structure (det(K + λ·K_G) = 0).\n");
        }

        if (sr.SecondOrderDriftChecks.Count > 0)
        {
            sb.Append("\nDrift check on the second-order drift (amplified = Cd·drift / Ie, ASCE 7-16 eq. 12.8-15)\n");
            var t = new TextTable("check", "case", "story", $"drift [{len}]", $"amplified [{len}]", "ratio", "allowed", "result", "margin").Numeric(2, 3, 4, 5, 6, 8);
            foreach (var d in sr.SecondOrderDriftChecks)
                t.Add(d.Check.Id, d.CaseId, d.Story.Index.ToString(CultureInfo.InvariantCulture), TextTable.Num(L(d.ElasticDrift)), TextTable.Num(L(d.AmplifiedDrift)),
                    TextTable.Num(d.Ratio), TextTable.Num(d.Allowed), d.Passes ? "within" : "EXCEEDS", (100 * d.Margin).ToString("0.0", CultureInfo.InvariantCulture) + " %");
            sb.Append(t.Render());
        }
        sb.Append(SpectrumReport.Render(r, run.Spectrum));
        sb.Append($"  Periods, Cs, k and θ: {SeismicPresets.Status}. A computed aid for a licensed engineer, not a code check.\n");
        return sb.ToString();
    }
}
