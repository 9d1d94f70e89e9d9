using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The seismic block's results files: modes and period estimates, story forces, the stability coefficient beside the
/// second-order drift, the drift check on the second-order drift, and one JSON file with all of them and the caution.
/// Nothing when the model has no seismic block. Model units; the text depends only on the input.
/// </summary>
public static class SeismicFiles
{
    public const string Source = "ASCE 7-16 §12.8 (numbering and values from memory: confirm the edition); the governing code decides";

    public static IReadOnlyList<(string Name, string Text)> Render(ModelResult run)
    {
        var r = run.Analysis;
        var sr = run.Seismic;
        if (sr is null) return [];
        // One table per file (docs/model-format.md, "CSV files"): the modes and the period estimates apart, the stability
        // coefficients and the drift check on the second-order drift apart.
        var files = new List<(string, string)> { ("periods.csv", Periods(r, sr)), ("period-estimates.csv", PeriodEstimates(sr)), ("story-forces.csv", StoryForcesCsv(r, sr)) };
        if (sr.Stability.Count > 0) files.Add(("second-order.csv", SecondOrder(r, sr)));
        if (sr.SecondOrderDriftChecks.Count > 0) files.Add(("second-order-drift-checks.csv", SecondOrderDriftChecks(r, sr)));
        files.Add(("seismic.json", TypedJson.Write(Document(r, sr))));
        if (run.Spectrum is { } rs) files.AddRange(SpectrumFiles.Render(r, rs));
        return files;
    }

    private static string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "n/a";

    private static string Csv(string s) => PlaneLateral.Output.CsvText.Cell(s);   // the one escaper (quoting, formula neutralising)

    private static string Periods(AnalysisResult r, SeismicResult sr)
    {
        var levels = r.Model.Building.Levels;
        var sb = new StringBuilder("mode,period [s],omega [rad/s],mass share," + string.Join(",", levels.Skip(1).Select(l => Csv("shape " + l.Id))) + "\n");
        foreach (var m in sr.Forces.Modes)
            sb.Append($"{m.Number},{F(m.Period)},{F(m.Omega)},{F(m.MassShare)},{string.Join(",", m.LevelShape.Skip(1).Select(F))}\n");
        return sb.ToString();
    }

    private static string PeriodEstimates(SeismicResult sr)
    {
        var f = sr.Forces;
        return $"estimate,period [s]\neigen mode 1,{F(f.Modes.Count > 0 ? f.Modes[0].Period : double.NaN)}\nRayleigh (story forces),{F(f.RayleighPeriod)}\nTa = Ct*hn^x,{F(f.Ta)}\nCu*Ta,{F(f.Cu * f.Ta)}\nused,{F(f.PeriodUsed)}\n";
    }

    private static string StoryForcesCsv(AnalysisResult r, SeismicResult sr)
    {
        var u = r.Model.Units;
        var levels = r.Model.Building.Levels;
        var s = r.Model.Seismic!;
        var sb = new StringBuilder($"case,level,height [{u.LengthSymbol}],weight [{u.ForceSymbol}],Cvx,Fx [{u.ForceSymbol}],story shear below [{u.ForceSymbol}]\n");
        for (int i = 1; i < levels.Count; i++)
        {
            double w = s.Weights.FirstOrDefault(x => x.Level == i)?.Weight ?? 0;
            sb.Append($"{Csv(s.CaseId)},{Csv(levels[i].Id)},{F(u.FromSI(levels[i].Elevation - levels[0].Elevation, Quantity.Length))},{F(u.FromSI(w, Quantity.Force))},{F(sr.Forces.Cvx[i])},{F(u.FromSI(sr.Forces.LevelForces[i], Quantity.Force))},{F(u.FromSI(sr.Stories.Stories[i - 1].Shear, Quantity.Force))}\n");
        }
        return sb.ToString();
    }

    private static string SecondOrder(AnalysisResult r, SeismicResult sr)
    {
        var u = r.Model.Units;
        string l = u.LengthSymbol, f = u.ForceSymbol;
        var sb = new StringBuilder($"story,Px [{f}],Vx [{f}],height [{l}],first-order drift [{l}],design drift Cd*de/Ie [{l}],theta,theta max,status,second-order drift [{l}],second/first,1/(1-theta)\n");
        foreach (var x in sr.Stability)
            sb.Append($"{x.Story.Index},{F(u.FromSI(x.Px, Quantity.Force))},{F(u.FromSI(x.Vx, Quantity.Force))},{F(u.FromSI(x.Story.Height, Quantity.Length))},{F(u.FromSI(x.ElasticDrift, Quantity.Length))},{F(u.FromSI(x.DesignDrift, Quantity.Length))},{F(x.Theta)},{F(x.ThetaMax)},{Csv(x.Status)},{F(u.FromSI(x.SecondOrderDrift, Quantity.Length))},{F(x.Ratio)},{F(x.Estimate)}\n");
        return sb.ToString();
    }

    private static string SecondOrderDriftChecks(AnalysisResult r, SeismicResult sr)
    {
        var u = r.Model.Units;
        string l = u.LengthSymbol;
        var sb = new StringBuilder($"check,case,story,drift [{l}],amplified [{l}],ratio,allowed,result,margin\n");
        foreach (var d in sr.SecondOrderDriftChecks)
            sb.Append($"{Csv(d.Check.Id)},{Csv(d.CaseId)},{d.Story.Index},{F(u.FromSI(d.ElasticDrift, Quantity.Length))},{F(u.FromSI(d.AmplifiedDrift, Quantity.Length))},{F(d.Ratio)},{F(d.Allowed)},{(d.Passes ? "within" : "exceeds")},{F(d.Margin)}\n");
        return sb.ToString();
    }

    /// <summary>A finite number, or null (a number the seismic step cannot give).</summary>
    private static double? N(double v) => double.IsFinite(v) ? v : null;

    /// <summary>seismic.json as a typed document.</summary>
    public static SeismicDocument Document(AnalysisResult r, SeismicResult sr)
    {
        var m = r.Model;
        var s = m.Seismic!;
        var u = m.Units;
        var fo = sr.Forces;
        double? L(double v) => N(u.FromSI(v, Quantity.Length));
        double? Fc(double v) => N(u.FromSI(v, Quantity.Force));
        var so = s.SecondOrder;
        return new SeismicDocument(
            ProducedBy: $"PlaneLateral {ResultFiles.Version}",
            Caution: ResultFiles.Caution,
            Source: Source,
            Units: $"length {u.LengthSymbol}, force {u.ForceSymbol}, period s",
            LoadCase: s.CaseId,
            Modes: fo.Modes.Select(md => new SeismicMode(md.Number, N(md.Period), N(md.Omega), N(md.MassShare), md.LevelShape)),
            RayleighPeriod: N(fo.RayleighPeriod), ApproximatePeriod: N(fo.Ta), Ct: N(fo.Ct), X: N(fo.X), StructureRow: fo.TypeRow, HnFeet: N(fo.HeightFeet),
            Cu: N(fo.Cu), PeriodUsed: N(fo.PeriodUsed), PeriodNote: fo.PeriodNote,
            Cs: N(fo.Cs), CsGovernedBy: fo.CsNote, TotalWeight: Fc(fo.TotalWeight), BaseShear: Fc(fo.BaseShear), K: N(fo.Exponent),
            StoryForces: Enumerable.Range(1, Math.Max(0, m.Building.Levels.Count - 1)).Select(i => new SeismicStoryForce(
                m.Building.Levels[i].Id, N(fo.Cvx[i]), Fc(fo.LevelForces[i]), Fc(sr.Stories.Stories[i - 1].Shear))),
            Gravity: so?.GravityCase, Cd: so is null ? null : N(so.Cd), Ie: so is null ? null : N(so.Ie), Beta: so is null ? null : N(so.Beta),
            GravityFactorToBuckling: N(sr.CriticalLoadFactor),
            Stability: sr.Stability.Select(x => new SeismicStability(x.Story.Index, Fc(x.Px), Fc(x.Vx), L(x.ElasticDrift), L(x.DesignDrift),
                N(x.Theta), N(x.ThetaMax), x.Status, L(x.SecondOrderDrift), N(x.Ratio), N(x.Estimate))),
            SecondOrderDriftChecks: sr.SecondOrderDriftChecks.Select(d => new SeismicSecondOrderDriftCheck(d.Check.Id, d.Story.Index,
                L(d.ElasticDrift), L(d.AmplifiedDrift), N(d.Ratio), N(d.Allowed), d.Passes ? "within" : "exceeds", N(d.Margin))))
        { HasSecondOrder = so is not null };
    }
}
