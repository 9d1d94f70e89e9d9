using System.Globalization;
using System.Text;
using Newtonsoft.Json;
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
        files.Add(("seismic.json", Json(r, sr)));
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

    private static string Json(AnalysisResult r, SeismicResult sr)
    {
        var m = r.Model;
        var s = m.Seismic!;
        var u = m.Units;
        var fo = sr.Forces;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fc(double v) => u.FromSI(v, Quantity.Force);
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2 })
        {
            void P(string name, object? v) { w.WritePropertyName(name); if (v is double d && !double.IsFinite(d)) w.WriteNull(); else w.WriteValue(v); }
            w.WriteStartObject();
            P("producedBy", $"PlaneLateral {ResultFiles.Version}");
            P("caution", ResultFiles.Caution);
            P("source", Source);
            P("units", $"length {u.LengthSymbol}, force {u.ForceSymbol}, period s");
            P("loadCase", s.CaseId);
            w.WritePropertyName("modes");
            w.WriteStartArray();
            foreach (var md in fo.Modes)
            {
                w.WriteStartObject();
                P("mode", md.Number); P("period", md.Period); P("omega", md.Omega); P("massShare", md.MassShare);
                w.WritePropertyName("levelShape"); w.WriteStartArray(); foreach (var v in md.LevelShape) w.WriteValue(v); w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            P("rayleighPeriod", fo.RayleighPeriod);
            P("approximatePeriod", fo.Ta); P("Ct", fo.Ct); P("x", fo.X); P("structureRow", fo.TypeRow); P("hnFeet", fo.HeightFeet);
            P("Cu", fo.Cu); P("periodUsed", fo.PeriodUsed); P("periodNote", fo.PeriodNote);
            P("Cs", fo.Cs); P("CsGovernedBy", fo.CsNote); P("totalWeight", Fc(fo.TotalWeight)); P("baseShear", Fc(fo.BaseShear)); P("k", fo.Exponent);
            w.WritePropertyName("storyForces");
            w.WriteStartArray();
            for (int i = 1; i < m.Building.Levels.Count; i++)
            {
                w.WriteStartObject();
                P("level", m.Building.Levels[i].Id); P("Cvx", fo.Cvx[i]); P("Fx", Fc(fo.LevelForces[i])); P("storyShearBelow", Fc(sr.Stories.Stories[i - 1].Shear));
                w.WriteEndObject();
            }
            w.WriteEndArray();
            if (s.SecondOrder is { } so)
            {
                P("gravity", so.GravityCase); P("Cd", so.Cd); P("Ie", so.Ie); P("beta", so.Beta);
                P("gravityFactorToBuckling", sr.CriticalLoadFactor);
                w.WritePropertyName("stability");
                w.WriteStartArray();
                foreach (var x in sr.Stability)
                {
                    w.WriteStartObject();
                    P("story", x.Story.Index); P("Px", Fc(x.Px)); P("Vx", Fc(x.Vx)); P("firstOrderDrift", L(x.ElasticDrift)); P("designDrift", L(x.DesignDrift));
                    P("theta", x.Theta); P("thetaMax", x.ThetaMax); P("status", x.Status); P("secondOrderDrift", L(x.SecondOrderDrift));
                    P("secondOverFirst", x.Ratio); P("oneOverOneMinusTheta", x.Estimate);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WritePropertyName("secondOrderDriftChecks");
                w.WriteStartArray();
                foreach (var d in sr.SecondOrderDriftChecks)
                {
                    w.WriteStartObject();
                    P("check", d.Check.Id); P("story", d.Story.Index); P("drift", L(d.ElasticDrift)); P("amplifiedDrift", L(d.AmplifiedDrift));
                    P("ratio", d.Ratio); P("allowedRatio", d.Allowed); P("result", d.Passes ? "within" : "exceeds"); P("margin", d.Margin);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }
}
