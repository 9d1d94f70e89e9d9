using System.Globalization;
using System.Text;
using Newtonsoft.Json;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>The planar response spectrum files: response-spectrum-modes.csv, response-spectrum-stories.csv (one table per file) and response-spectrum.json. Model units.</summary>
public static class SpectrumFiles
{
    public static IReadOnlyList<(string Name, string Text)> Render(AnalysisResult r, PlanarSpectrumResult s)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, lu = u.LengthSymbol;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "n/a";
        var sb = new StringBuilder($"mode,period [s],omega [rad/s],Sa [g],gamma,mass share,cumulative,base shear [{fu}]\n");
        foreach (var m in s.Modes)
            sb.Append($"{m.Mode},{F(m.Period)},{F(m.Omega)},{F(m.Sa)},{F(m.Gamma)},{F(m.Share)},{F(m.Cumulative)},{F(Fo(m.BaseShear))}\n");
        var stories = new StringBuilder($"story,ELF shear [{fu}],modal shear [{fu}],scaled modal shear [{fu}],drift [{lu}],design drift Cd*drift/Ie [{lu}],height [{lu}],design drift ratio,difference of combined displacements (not the drift) [{lu}],displacement of the level above [{lu}]\n");
        foreach (var st in s.Stories)
            stories.Append($"{st.Story},{F(Fo(st.ElfShear))},{F(Fo(st.ModalShear))},{F(Fo(st.ScaledShear))},{F(L(st.Drift))},{F(L(st.DesignDrift))},{F(L(st.Height))},{F(st.Ratio)},{F(L(st.DriftFromCombinedDisplacements))},{F(L(st.Displacement))}\n");
        var json = new SpectrumJson($"PlaneLateral {ResultFiles.Version}", ResultFiles.Caution, PlanSeismicFiles.Source, s.Spectrum.Describe(),
            s.Settings.Rule.ToString().ToUpperInvariant(), s.Settings.Damping, s.R, s.Ie, s.Settings.Cd, s.ModesUsed, s.CumulativeShare,
            Fo(s.Scaling.BaseShearModal), Fo(s.Scaling.BaseShearElf), s.Scaling.ForceFactor, s.Scaling.DriftFactor, s.Scaling.Why,
            s.Stories.Select(st => new SpectrumStoryJson(st.Story, Fo(st.ElfShear), Fo(st.ModalShear), Fo(st.ScaledShear), L(st.Drift), L(st.DesignDrift), st.Ratio)).ToList());
        return [("response-spectrum-modes.csv", sb.ToString()), ("response-spectrum-stories.csv", stories.ToString()), ("response-spectrum.json", TypedJson.Write(json))];
    }

    /// <summary>response-spectrum.json: model units (force, length), periods in s.</summary>
    private sealed record SpectrumJson(
        [property: JsonProperty("program")] string Program, [property: JsonProperty("caution")] string Caution, [property: JsonProperty("source")] string Source,
        [property: JsonProperty("spectrum")] string Spectrum, [property: JsonProperty("combination")] string Combination, [property: JsonProperty("damping")] double Damping,
        [property: JsonProperty("R")] double R, [property: JsonProperty("Ie")] double Ie, [property: JsonProperty("Cd")] double Cd, [property: JsonProperty("modes")] int Modes,
        [property: JsonProperty("massShare")] double MassShare, [property: JsonProperty("Vt")] double Vt, [property: JsonProperty("V")] double V,
        [property: JsonProperty("forceFactor")] double ForceFactor, [property: JsonProperty("driftFactor")] double DriftFactor, [property: JsonProperty("scaling")] string Scaling,
        [property: JsonProperty("stories")] IReadOnlyList<SpectrumStoryJson> Stories);

    private sealed record SpectrumStoryJson(
        [property: JsonProperty("story")] int Story, [property: JsonProperty("elfShear")] double ElfShear, [property: JsonProperty("modalShear")] double ModalShear,
        [property: JsonProperty("scaledShear")] double ScaledShear, [property: JsonProperty("drift")] double Drift, [property: JsonProperty("designDrift")] double DesignDrift,
        [property: JsonProperty("ratio")] double Ratio);
}
