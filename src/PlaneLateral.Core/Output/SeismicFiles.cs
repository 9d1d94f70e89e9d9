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
        if (run.Seismic is not { } sr) return [];
        var files = new List<(string, string)>(Tables(r, sr).Select(t => t.Text())) { ("seismic.json", TypedJson.Write(Document(r, sr))) };
        if (run.Spectrum is { } rs) files.AddRange(SpectrumFiles.Render(r, rs));
        return files;
    }

    /// <summary>The seismic block's CSV files, then the response spectrum's, each from its table (none without a seismic block).</summary>
    public static IReadOnlyList<CsvTableFile> Tables(ModelResult run) =>
        run.Seismic is not { } sr ? [] : [.. Tables(run.Analysis, sr), .. run.Spectrum is { } rs ? SpectrumFiles.Tables(run.Analysis, rs) : []];

    private static List<CsvTableFile> Tables(AnalysisResult r, SeismicResult sr)
    {
        // One table per file (docs/model-format.md, "CSV files"): the modes and the period estimates apart, the stability
        // coefficients and the drift check on the second-order drift apart.
        var files = new List<CsvTableFile> { new("periods.csv", PeriodsTable(r, sr)), new("period-estimates.csv", PeriodEstimatesTable(sr)), new("story-forces.csv", StoryForcesTable(r, sr)) };
        if (sr.Stability.Count > 0) files.Add(new("second-order.csv", SecondOrderTable(r, sr)));
        if (sr.SecondOrderDriftChecks.Count > 0) files.Add(new("second-order-drift-checks.csv", SecondOrderDriftChecksTable(r, sr)));
        return files;
    }

    /// <summary>The vibration modes: period, circular frequency, mass share and the shape at each level above the base.</summary>
    public static ResultTable PeriodsTable(AnalysisResult r, SeismicResult sr)
    {
        var levels = r.Model.Building.Levels;
        return new ResultTable
        {
            Title = "Periods (masses = story weights / g on the diaphragm equations; K condensed to them exactly)",
            Columns = [new("mode"), new("period", "s"), new("omega", "rad/s"), new("mass share", Kind: CellKind.Percent), .. levels.Skip(1).Select(l => new TableColumn("shape " + l.Id))],
            Rows = sr.Forces.Modes.Select(m => (IReadOnlyList<object>)[m.Number, m.Period, m.Omega, m.MassShare, .. m.LevelShape.Skip(1).Select(v => (object)v)]).ToList(),
        };
    }

    /// <summary>The period estimates side by side: first eigen period, Rayleigh, the approximate period, its upper limit, the one used.</summary>
    public static ResultTable PeriodEstimatesTable(SeismicResult sr)
    {
        var f = sr.Forces;
        return new ResultTable
        {
            Title = "Period estimates",
            Columns = [new("estimate", Kind: CellKind.Text), new("period", "s")],
            Rows =
            [
                ["eigen mode 1", f.Modes.Count > 0 ? f.Modes[0].Period : double.NaN], ["Rayleigh (story forces)", f.RayleighPeriod], ["Ta = Ct*hn^x", f.Ta],
                ["Cu*Ta", f.Cu * f.Ta], ["used", f.PeriodUsed],
            ],
        };
    }

    /// <summary>The equivalent lateral forces: each level's height, weight, Cvx, force and the story shear below it (bottom level first).</summary>
    public static ResultTable StoryForcesTable(AnalysisResult r, SeismicResult sr)
    {
        var u = r.Model.Units;
        var levels = r.Model.Building.Levels;
        var s = r.Model.Seismic!;
        var rows = new List<IReadOnlyList<object>>();
        for (int i = 1; i < levels.Count; i++)
            rows.Add([s.CaseId, levels[i].Id, u.FromSI(levels[i].Elevation - levels[0].Elevation, Quantity.Length), u.FromSI(s.Weights.FirstOrDefault(x => x.Level == i)?.Weight ?? 0, Quantity.Force),
                sr.Forces.Cvx[i], u.FromSI(sr.Forces.LevelForces[i], Quantity.Force), u.FromSI(sr.Stories.Stories[i - 1].Shear, Quantity.Force)]);
        return new ResultTable
        {
            Title = $"Story forces, case \"{s.CaseId}\": Fx = Cvx·V, Cvx = wx·hx^k / Σ wi·hi^k (ASCE 7-16 §12.8.3)",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("level", Kind: CellKind.Text), new("height", u.LengthSymbol), new("weight", u.ForceSymbol), new("Cvx"),
                new("Fx", u.ForceSymbol), new("story shear below", u.ForceSymbol),
            ],
            Rows = rows,
        };
    }

    /// <summary>The stability coefficient per story beside the second-order drift.</summary>
    public static ResultTable SecondOrderTable(AnalysisResult r, SeismicResult sr)
    {
        var u = r.Model.Units;
        string l = u.LengthSymbol, f = u.ForceSymbol;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        return new ResultTable
        {
            Title = "Second-order effects: θ = Px·Δ·Ie/(Vx·hsx·Cd) (ASCE 7-16 §12.8.7) beside the second-order drift",
            Columns =
            [
                new("story"), new("Px", f), new("Vx", f), new("height", l), new("first-order drift", l), new("design drift Cd*de/Ie", l), new("theta"), new("theta max"),
                new("status", Kind: CellKind.Text), new("second-order drift", l), new("second/first"), new("1/(1-theta)"),
            ],
            Rows = sr.Stability.Select(x => (IReadOnlyList<object>)
                [x.Story.Index, Fo(x.Px), Fo(x.Vx), L(x.Story.Height), L(x.ElasticDrift), L(x.DesignDrift), x.Theta, x.ThetaMax, x.Status, L(x.SecondOrderDrift), x.Ratio, x.Estimate]).ToList(),
        };
    }

    /// <summary>The drift check on the second-order drift, every check and story.</summary>
    public static ResultTable SecondOrderDriftChecksTable(AnalysisResult r, SeismicResult sr)
    {
        var u = r.Model.Units;
        string l = u.LengthSymbol;
        return new ResultTable
        {
            Title = "Drift check on the second-order drift (amplified = Cd·drift / Ie, ASCE 7-16 eq. 12.8-15)",
            Columns =
            [
                new("check", Kind: CellKind.Text), new("case", Kind: CellKind.Text), new("story"), new("drift", l), new("amplified", l), new("ratio"), new("allowed"),
                new("result", Kind: CellKind.Text), new("margin", Kind: CellKind.Percent),
            ],
            Rows = sr.SecondOrderDriftChecks.Select(d => (IReadOnlyList<object>)
                [d.Check.Id, d.CaseId, d.Story.Index, u.FromSI(d.ElasticDrift, Quantity.Length), u.FromSI(d.AmplifiedDrift, Quantity.Length), d.Ratio, d.Allowed,
                 d.Passes ? "within" : "exceeds", d.Margin]).ToList(),
        };
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
