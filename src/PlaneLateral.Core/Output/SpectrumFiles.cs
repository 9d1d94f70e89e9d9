using System.Globalization;
using System.Text;
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
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        string mu = u.Label(Quantity.Moment);
        string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "n/a";
        var sb = new StringBuilder($"mode,period [s],omega [rad/s],Sa [g],gamma,mass share,cumulative,base shear [{fu}]\n");
        foreach (var m in s.Modes)
            sb.Append($"{m.Mode},{F(m.Period)},{F(m.Omega)},{F(m.Sa)},{F(m.Gamma)},{F(m.Share)},{F(m.Cumulative)},{F(Fo(m.BaseShear))}\n");
        var stories = new StringBuilder($"story,ELF shear [{fu}],modal shear [{fu}],scaled modal shear [{fu}],drift [{lu}],design drift Cd*drift/Ie [{lu}],height [{lu}],design drift ratio,difference of combined displacements (not the drift) [{lu}],displacement of the level above [{lu}],overturning moment (no sign) [{mu}],scaled overturning moment [{mu}],Px [{fu}],theta (modal),theta (ELF),theta max\n");
        foreach (var st in s.Stories)
            stories.Append($"{st.Story},{F(Fo(st.ElfShear))},{F(Fo(st.ModalShear))},{F(Fo(st.ScaledShear))},{F(L(st.Drift))},{F(L(st.DesignDrift))},{F(L(st.Height))},{F(st.Ratio)},{F(L(st.DriftFromCombinedDisplacements))},{F(L(st.Displacement))},{F(Mo(st.Overturning))},{F(Mo(s.Scaling.ForceFactor * st.Overturning))},{F(Fo(st.Px))},{F(st.Theta)},{F(st.ThetaElf)},{F(st.ThetaMax)}\n");
        var json = new SpectrumDocument(
            Program: $"PlaneLateral {ResultFiles.Version}",
            Caution: ResultFiles.Caution,
            Source: PlanSeismicFiles.Source,
            Spectrum: s.Spectrum.Describe(), Combination: s.Settings.Rule.ToString().ToUpperInvariant(), Damping: s.Settings.Damping,
            R: s.R, Ie: s.Ie, Cd: s.Settings.Cd, Modes: s.ModesUsed, MassShare: s.CumulativeShare,
            Vt: Fo(s.Scaling.BaseShearModal), V: Fo(s.Scaling.BaseShearElf), ForceFactor: s.Scaling.ForceFactor, DriftFactor: s.Scaling.DriftFactor,
            Scaling: s.Scaling.Why,
            Stories: s.Stories.Select(st => new SpectrumStory(st.Story, Fo(st.ElfShear), Fo(st.ModalShear), Fo(st.ScaledShear),
                L(st.Drift), L(st.DesignDrift), st.Ratio, Mo(st.Overturning), Fo(st.Px), Num(st.Theta), Num(st.ThetaElf), Num(st.ThetaMax))),
            PxFrom: s.PxSource,
            CombinedValues: CombinedNote);
        var files = new List<(string, string)> { ("response-spectrum-modes.csv", sb.ToString()), ("response-spectrum-stories.csv", stories.ToString()), ("response-spectrum.json", TypedJson.Write(json)) };
        if (s.MemberForces.Count > 0)
        {
            var mf = new StringBuilder($"member,N start [{fu}],V start [{fu}],M start [{mu}],N end [{fu}],V end [{fu}],M end [{mu}],scaled N start [{fu}],scaled V start [{fu}],scaled M start [{mu}],scaled N end [{fu}],scaled V end [{fu}],scaled M end [{mu}]\n");
            foreach (var e in s.MemberForces)
                mf.Append($"{CsvText.Cell(r.Model.Members[e.Member].Id)},{EndForces(e, 1, Fo, Mo, F)},{EndForces(e, s.Scaling.ForceFactor, Fo, Mo, F)}\n");
            files.Add(("response-spectrum-members.csv", mf.ToString()));
        }
        if (s.Reactions.Count > 0)
        {
            var rf = new StringBuilder($"node,Rx [{fu}],Ry [{fu}],Mz [{mu}],scaled Rx [{fu}],scaled Ry [{fu}],scaled Mz [{mu}]\n");
            foreach (var e in s.Reactions)
                rf.Append($"{CsvText.Cell(r.Model.Nodes[e.Node].Id)},{Reactions(e, 1, Fo, Mo, F)},{Reactions(e, s.Scaling.ForceFactor, Fo, Mo, F)}\n");
            files.Add(("response-spectrum-reactions.csv", rf.ToString()));
        }
        return files;
    }

    /// <summary>What every combined value is, for the files (a combined peak has no sign).</summary>
    public const string CombinedNote = "combined mode by mode (CQC or SRSS of each response's per-mode values): peak magnitudes without sign, not simultaneous with one another; member end forces in the member's local axes";

    private static double? Num(double v) => double.IsFinite(v) ? v : null;

    /// <summary>Six end forces in the model's units, times <paramref name="k"/>, as CSV cells.</summary>
    internal static string EndForces(MemberEndForces e, double k, Func<double, double> fo, Func<double, double> mo, Func<double, string> f) =>
        $"{f(fo(k * e.N1))},{f(fo(k * e.V1))},{f(mo(k * e.M1))},{f(fo(k * e.N2))},{f(fo(k * e.V2))},{f(mo(k * e.M2))}";

    /// <summary>A reaction's three components in the model's units, times <paramref name="k"/>, as CSV cells.</summary>
    internal static string Reactions(Reaction e, double k, Func<double, double> fo, Func<double, double> mo, Func<double, string> f) =>
        $"{f(fo(k * e.Fx))},{f(fo(k * e.Fy))},{f(mo(k * e.Mz))}";
}
