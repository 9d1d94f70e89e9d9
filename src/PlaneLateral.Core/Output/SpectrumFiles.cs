using System.Globalization;
using System.Text;
using Newtonsoft.Json;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>The planar response spectrum files: response-spectrum.csv (modes, then stories) and response-spectrum.json. Model units.</summary>
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
        sb.Append($"\nstory,ELF shear [{fu}],modal shear [{fu}],scaled modal shear [{fu}],drift [{lu}],design drift Cd*drift/Ie [{lu}],height [{lu}],design drift ratio,difference of combined displacements (not the drift) [{lu}],displacement of the level above [{lu}]\n");
        foreach (var st in s.Stories)
            sb.Append($"{st.Story},{F(Fo(st.ElfShear))},{F(Fo(st.ModalShear))},{F(Fo(st.ScaledShear))},{F(L(st.Drift))},{F(L(st.DesignDrift))},{F(L(st.Height))},{F(st.Ratio)},{F(L(st.DriftFromCombinedDisplacements))},{F(L(st.Displacement))}\n");
        var json = new JObject
        {
            ["program"] = $"PlaneLateral {ResultFiles.Version}",
            ["caution"] = ResultFiles.Caution,
            ["source"] = PlanSeismicFiles.Source,
            ["spectrum"] = s.Spectrum.Describe(), ["combination"] = s.Settings.Rule.ToString().ToUpperInvariant(), ["damping"] = s.Settings.Damping,
            ["R"] = s.R, ["Ie"] = s.Ie, ["Cd"] = s.Settings.Cd, ["modes"] = s.ModesUsed, ["massShare"] = s.CumulativeShare,
            ["Vt"] = Fo(s.Scaling.BaseShearModal), ["V"] = Fo(s.Scaling.BaseShearElf), ["forceFactor"] = s.Scaling.ForceFactor, ["driftFactor"] = s.Scaling.DriftFactor,
            ["scaling"] = s.Scaling.Why,
            ["stories"] = new JArray(s.Stories.Select(st => new JObject
            {
                ["story"] = st.Story, ["elfShear"] = Fo(st.ElfShear), ["modalShear"] = Fo(st.ModalShear), ["scaledShear"] = Fo(st.ScaledShear),
                ["drift"] = L(st.Drift), ["designDrift"] = L(st.DesignDrift), ["ratio"] = st.Ratio,
            })),
        };
        return [("response-spectrum.csv", sb.ToString()), ("response-spectrum.json", json.ToString(Formatting.Indented) + "\n")];
    }
}
