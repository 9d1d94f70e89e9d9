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
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
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
        var tables = Tables(r, s).Select(t => t.Text()).ToList();
        return [.. tables.Take(2), ("response-spectrum.json", TypedJson.Write(json)), .. tables.Skip(2)];
    }

    /// <summary>The response spectrum's CSV files, each from its table: modes, stories, then member end forces and reactions where there are any.</summary>
    public static IReadOnlyList<CsvTableFile> Tables(AnalysisResult r, PlanarSpectrumResult s)
    {
        var files = new List<CsvTableFile> { new("response-spectrum-modes.csv", ModesTable(r, s)), new("response-spectrum-stories.csv", StoriesTable(r, s)) };
        if (s.MemberForces.Count > 0) files.Add(new("response-spectrum-members.csv", MembersTable(r, s)));
        if (s.Reactions.Count > 0) files.Add(new("response-spectrum-reactions.csv", ReactionsTable(r, s)));
        return files;
    }

    /// <summary>The modes: period, frequency, spectral acceleration, participation, mass share and base shear.</summary>
    public static ResultTable ModesTable(AnalysisResult r, PlanarSpectrumResult s)
    {
        var u = r.Model.Units;
        return new ResultTable
        {
            Title = "Modal response spectrum: modes",
            Columns =
            [
                new("mode"), new("period", "s"), new("omega", "rad/s"), new("Sa", "g"), new("gamma"), new("mass share", Kind: CellKind.Percent),
                new("cumulative", Kind: CellKind.Percent), new("base shear", u.ForceSymbol),
            ],
            Rows = s.Modes.Select(m => (IReadOnlyList<object>)[m.Mode, m.Period, m.Omega, m.Sa, m.Gamma, m.Share, m.Cumulative, u.FromSI(m.BaseShear, Quantity.Force)]).ToList(),
        };
    }

    /// <summary>The combined story results beside the ELF: shears, drifts, overturning and θ, story 1 first.</summary>
    public static ResultTable StoriesTable(AnalysisResult r, PlanarSpectrumResult s)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, lu = u.LengthSymbol, mu = u.Label(Quantity.Moment);
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        return new ResultTable
        {
            Title = "Modal response spectrum: stories, combined, beside the ELF",
            Columns =
            [
                new("story"), new("ELF shear", fu), new("modal shear", fu), new("scaled modal shear", fu), new("drift", lu), new("design drift Cd*drift/Ie", lu),
                new("height", lu), new("design drift ratio"), new("difference of combined displacements (not the drift)", lu), new("displacement of the level above", lu),
                new("overturning moment (no sign)", mu), new("scaled overturning moment", mu), new("Px", fu), new("theta (modal)"), new("theta (ELF)"), new("theta max"),
            ],
            Rows = s.Stories.Select(st => (IReadOnlyList<object>)
                [st.Story, Fo(st.ElfShear), Fo(st.ModalShear), Fo(st.ScaledShear), L(st.Drift), L(st.DesignDrift), L(st.Height), st.Ratio,
                 L(st.DriftFromCombinedDisplacements), L(st.Displacement), Mo(st.Overturning), Mo(s.Scaling.ForceFactor * st.Overturning), Fo(st.Px),
                 st.Theta, st.ThetaElf, st.ThetaMax]).ToList(),
        };
    }

    /// <summary>Member end forces combined mode by mode (local axes), unscaled then scaled.</summary>
    public static ResultTable MembersTable(AnalysisResult r, PlanarSpectrumResult s)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        double k = s.Scaling.ForceFactor;
        return new ResultTable
        {
            Title = "Member end forces, combined mode by mode (local axes)",
            Columns =
            [
                new("member", Kind: CellKind.Text), new("N start", fu), new("V start", fu), new("M start", mu), new("N end", fu), new("V end", fu), new("M end", mu),
                new("scaled N start", fu), new("scaled V start", fu), new("scaled M start", mu), new("scaled N end", fu), new("scaled V end", fu), new("scaled M end", mu),
            ],
            Rows = s.MemberForces.Select(e => (IReadOnlyList<object>)
                [r.Model.Members[e.Member].Id, Fo(e.N1), Fo(e.V1), Mo(e.M1), Fo(e.N2), Fo(e.V2), Mo(e.M2),
                 Fo(k * e.N1), Fo(k * e.V1), Mo(k * e.M1), Fo(k * e.N2), Fo(k * e.V2), Mo(k * e.M2)]).ToList(),
        };
    }

    /// <summary>Support reactions combined mode by mode, unscaled then scaled.</summary>
    public static ResultTable ReactionsTable(AnalysisResult r, PlanarSpectrumResult s)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        double k = s.Scaling.ForceFactor;
        return new ResultTable
        {
            Title = "Support reactions, combined mode by mode",
            Columns =
            [
                new("node", Kind: CellKind.Text), new("Rx", fu), new("Ry", fu), new("Mz", mu), new("scaled Rx", fu), new("scaled Ry", fu), new("scaled Mz", mu),
            ],
            Rows = s.Reactions.Select(e => (IReadOnlyList<object>)
                [r.Model.Nodes[e.Node].Id, Fo(e.Fx), Fo(e.Fy), Mo(e.Mz), Fo(k * e.Fx), Fo(k * e.Fy), Mo(k * e.Mz)]).ToList(),
        };
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
