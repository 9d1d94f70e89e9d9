using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Studies;

namespace PlaneLateral.Reports;

/// <summary>One row of the answers-first summary: a short label ("Drift", "Checks"; empty for a continuation) and its text.</summary>
public sealed record SummaryRow(string Label, string Text);

/// <summary>
/// The answers first: the few rows every command prints before its tables and every report opens with: the model, the
/// solution checks, the governing drift and where, the worst hand-against-FE gap with its verdict and reference,
/// irregularities, warnings, and what solver ran. Reads results only; the console (PlaneLateral.Cli.Summary) and the
/// reports render the same rows.
/// </summary>
public static class RunSummary
{
    /// <summary>Largest equilibrium imbalance and backward error the summary calls a passed check (common practice for double precision).</summary>
    public const double ImbalanceLimit = 1e-8, BackwardErrorLimit = 1e-12;

    private static string Sci(double v) => v.ToString("0.0E+0", CultureInfo.InvariantCulture);

    private static string P(double ratio) => double.IsFinite(ratio) ? (100 * ratio).ToString("0.000", CultureInfo.InvariantCulture) + " %" : "n/a";

    private static SummaryRow Row(string label, string text) => new(label, text);

    /// <summary>The drift check row that governs: the largest drift ratio over its allowable (null without drift checks).</summary>
    public static DriftCheckRow? GoverningDrift(ModelResult run) =>
        run.Building.DriftChecks.Concat(run.Seismic?.SecondOrderDriftChecks ?? []).MaxBy(d => d.Ratio / d.Allowed);

    /// <summary>The line whose share in the structure departs most from its share by stiffness alone (the relative-rigidity hand split).</summary>
    public static (string CaseId, LineSplitRow Row, double Ratio)? WorstLineSplit(ModelResult run) =>
        run.LineSplit.SelectMany(s => s.Rows.Select(r => (s.CaseId, Row: r, Ratio: r.InStructureShare / r.AloneShare)))
            .Where(x => double.IsFinite(x.Ratio) && x.Row.AloneShare > 0)
            .Select(x => ((string, LineSplitRow, double)?)x)
            .MaxBy(x => Math.Abs(x!.Value.Item2.InStructureShare - x.Value.Item2.AloneShare));   // largest gap in share of the story shear:
                                                                                                  // a small share's ratio says little

    public static IReadOnlyList<SummaryRow> Planar(ModelResult run, ComparisonReport? comparisons, string modelPath)
    {
        var r = run.Analysis;
        var m = r.Model;
        var u = m.Units;
        var lines = new List<SummaryRow>();
        lines.Add(Row("Model", $"{m.Title}; {Path.GetFileName(modelPath)}; units {u.ForceSymbol}, {u.LengthSymbol}"));
        lines.Add(Row("Size", $"{m.Nodes.Count} nodes, {m.Members.Count} members, {(m.Panels.Count > 0 ? $"{m.Panels.Count} panels, " : "")}{m.LoadCases.Count} load cases, " +
            $"{m.Combinations.Count} combinations; {r.Solve.Unknowns} unknowns"));
        if (r.Cases.Count > 0)
        {
            var worstEq = r.Cases.MaxBy(c => Math.Max(c.Equilibrium.RelativeForceError, c.Equilibrium.RelativeMomentError))!;
            double imb = Math.Max(worstEq.Equilibrium.RelativeForceError, worstEq.Equilibrium.RelativeMomentError);
            double eta = r.Cases.Max(c => c.BackwardError);
            bool ok = imb <= ImbalanceLimit && eta <= BackwardErrorLimit;
            lines.Add(Row("Checks", $"{(ok ? "passed" : "LOOK")}: imbalance {Sci(imb)} ({worstEq.Id}), backward error {Sci(eta)}; " +
                $"limits {Sci(ImbalanceLimit)}, {Sci(BackwardErrorLimit)}"));
        }
        if (GoverningDrift(run) is { } d)
            lines.Add(Row("Drift", $"{(d.Passes ? "within" : "EXCEEDS")}: {P(d.Ratio)} of {P(d.Allowed)} allowed, story {d.Story.Index}, case {d.CaseId}, check {d.Check.Id}"));
        else if (run.Building.Cases.SelectMany(c => c.Stories.Select(s => (c.CaseId, Story: s))).ToList() is { Count: > 0 } all)
        {
            var big = all.MaxBy(x => Math.Abs(x.Story.DriftRatio));
            lines.Add(Row("Drift", $"largest drift ratio {P(Math.Abs(big.Story.DriftRatio))}, story {big.Story.Index}, case {big.CaseId} (no drift check declared)"));
        }
        else
            lines.Add(Row("Drift", "no stories (the model declares fewer than two levels)"));
        if (run.Seismic is { } sr && sr.Stability.Count > 0)
        {
            var t = sr.Stability.MaxBy(x => x.Theta)!;
            lines.Add(Row("2nd order", $"θ max {t.Theta.ToString("0.0000", CultureInfo.InvariantCulture)} (story {t.Story.Index}): {t.Status}" +
                (double.IsFinite(sr.CriticalLoadFactor) ? $"; buckling at {sr.CriticalLoadFactor.ToString("0.0", CultureInfo.InvariantCulture)} × gravity" : "")));
        }
        if (comparisons is not null && comparisons.Rows.Count > 0)
        {
            var worst = comparisons.Rows.MaxBy(x => Math.Abs(x.Ratio - 1))!;
            int outside = comparisons.Rows.Count(x => x.Verdict != Verdict.WithinTolerance);
            lines.Add(Row("Hand vs FE", $"{outside} of {comparisons.Rows.Count} checks outside tolerance; worst FE/hand {worst.Ratio.ToString("0.000", CultureInfo.InvariantCulture)} ({worst.CheckId}): {worst.VerdictText}"));
            lines.Add(Row("", $"reference: {worst.Reference.Model}"));
        }
        else if (WorstLineSplit(run) is { } ls)
        {
            var v = ComparisonRow.Judge(ls.Ratio, ComparisonStudy.DefaultTolerance);
            lines.Add(Row("Hand vs FE", $"split by line stiffness alone, largest gap: line {ls.Row.Line}, story {ls.Row.Story}, case {ls.CaseId}: " +
                $"FE share {P(ls.Row.InStructureShare)}, hand {P(ls.Row.AloneShare)} (FE/hand {ls.Ratio.ToString("0.000", CultureInfo.InvariantCulture)})"));
            lines.Add(Row("", $"{ComparisonRow.VerdictWords(v, ComparedQuantity.Fraction)} (±{(100 * ComparisonStudy.DefaultTolerance).ToString("0", CultureInfo.InvariantCulture)} %); reference: the whole FE model"));
        }
        var soft = run.Building.Irregularity.Where(i => i.Soft).ToList();
        lines.Add(Row("Irregular", soft.Count == 0 ? (run.Building.HasStories ? "soft story (Table 12.3-2 1a/1b): none flagged" : "no stories to check")
            : $"soft story: {string.Join(", ", soft.Take(4).Select(i => $"story {i.Story.Index} in {i.CaseId} ({(i.ExtremelySoft ? "1b" : "1a")})"))}{(soft.Count > 4 ? $" and {soft.Count - 4} more" : "")}"));
        lines.Add(Row("Warnings", m.Warnings.Count == 0 ? "none" : WarningsRow(m.Warnings.Count)));
        lines.Add(Row("Solver", run.Solver));
        lines.Add(Row("", $"{run.Factorizations} matri{(run.Factorizations == 1 ? "x" : "ces")} factorised in the run, each once"));
        return lines;
    }

    public static IReadOnlyList<SummaryRow> Plan(PlanResult r, IReadOnlyList<PlanSplitStory> hand, string path)
    {
        var p = r.Plan;
        var u = p.Units;
        var lines = new List<SummaryRow>();
        lines.Add(Row("Building", $"{p.Title}; {Path.GetFileName(path)}; units {u.ForceSymbol}, {u.LengthSymbol}"));
        lines.Add(Row("Size", $"{p.FloorCount} floors, {p.Lines.Count} lines of resistance, {r.Cases.Count} cases solved (accidental eccentricity included)"));
        double recovery = r.Lines.Count == 0 ? 0 : r.Lines.Max(l => l.RecoveryError);
        bool ok = r.WorstEquilibriumError <= ImbalanceLimit && r.WorstBackwardError <= BackwardErrorLimit;
        lines.Add(Row("Checks", $"{(ok ? "passed" : "LOOK")}: worst imbalance {Sci(r.WorstEquilibriumError)}, worst backward error {Sci(r.WorstBackwardError)}, " +
            $"line recovery {Sci(recovery)}"));
        if (r.DriftChecks.MaxBy(d => d.Ratio / d.Allowed) is { } d)
            lines.Add(Row("Drift", $"{(d.Within ? "within" : "EXCEEDS")}: {(d.Point is null ? "corner" : "point")} drift {P(d.Ratio)} of {P(d.Allowed)} allowed, story {d.Story}, case {d.Case}, " +
                d.Where));
        else lines.Add(Row("Drift", "no drift check declared (\"driftCheck\" in the building file)"));
        // Lines along the loading (those with a direct share): a line across it carries only a small torsional shear, whose
        // relative gap says little about the split (the detail table lists every line).
        var rows = hand.SelectMany(s => s.Rows).Where(x => double.IsFinite(x.Gap) && x.HandDirect != 0).ToList();
        if (rows.MaxBy(x => Math.Abs(x.Gap)) is { } g)
        {
            var v = ComparisonRow.Judge(1 + g.Gap, ComparisonStudy.DefaultTolerance);
            lines.Add(Row("Hand vs FE", $"relative rigidity with torsion, lines along the loading: worst gap {(100 * g.Gap).ToString("+0.0;-0.0;0.0", CultureInfo.InvariantCulture)} %, story {g.Story}, " +
                $"line {g.Line}, case {g.Case}"));
            lines.Add(Row("", $"{ComparisonRow.VerdictWords(v, ComparedQuantity.StoryShear)} (±{(100 * ComparisonStudy.DefaultTolerance).ToString("0", CultureInfo.InvariantCulture)} %); reference: the FE building in plan"));
        }
        var flagged = r.Irregularity.Where(i => i.Type != "none").ToList();
        lines.Add(Row("Irregular", flagged.Count == 0 ? "torsional (Table 12.3-1 1a/1b): none flagged"
            : $"torsional: {flagged.Count} story-case(s), worst {Worst(flagged)}"));
        lines.Add(Row("Warnings", p.Warnings.Count == 0 ? "none" : WarningsRow(p.Warnings.Count)));
        var solver = r.Lines.Select(l => l.Recovered.Solve.Solver).Distinct().ToList();
        lines.Add(Row("Solver", $"lines: {string.Join("; ", solver)}"));
        lines.Add(Row("", "floors: dense Cholesky of the (Ux, Uy, Rz) stiffness of all floors"));
        return lines;
    }

    /// <summary>The warnings row: a verdict above rests on the input as read, so a warning (units, a slip) is named as a reason to check it.</summary>
    private static string WarningsRow(int count) =>
        $"{count} about the input, listed above: check them before trusting the verdicts";

    public static IReadOnlyList<SummaryRow> Compare(ComparisonReport r, string path)
    {
        var lines = new List<SummaryRow>();
        lines.Add(Row("Model", $"{r.ModelTitle} ({Path.GetFileName(path)})"));
        int outside = r.Rows.Count(x => x.Verdict != Verdict.WithinTolerance);
        lines.Add(Row("Checks", $"{r.Rows.Count} hand checks beside FE, {outside} outside tolerance (default ±{(100 * r.DefaultTolerance).ToString("0.#", CultureInfo.InvariantCulture)} %)"));
        if (r.Rows.MaxBy(x => Math.Abs(x.Ratio - 1)) is { } w)
        {
            lines.Add(Row("Worst", $"FE/hand {w.Ratio.ToString("0.000", CultureInfo.InvariantCulture)} ({w.CheckId}, {w.Subject}): {w.VerdictText}"));
            lines.Add(Row("", $"reference: {w.Reference.Model}"));
            lines.Add(Row("", $"cause: {w.Cause}"));
        }
        return lines;
    }

    private static string Worst(List<TorsionalIrregularity> flagged)
    {
        var w = flagged.MaxBy(i => i.Ratio)!;
        return $"story {w.Story} {w.Direction} in {w.Case} ({w.Type}, ratio {w.Ratio.ToString("0.00", CultureInfo.InvariantCulture)})";
    }
}
