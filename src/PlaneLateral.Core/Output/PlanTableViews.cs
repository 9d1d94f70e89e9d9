using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Output;

/// <summary>
/// The console's and the report's views of a building's results files: the file's own table (the one its CSV is
/// written from) over the rows a section shows, in the order it shows them (top story first, the lines along the
/// loading). One place for each view, so the console, the report and the file cannot disagree.
/// </summary>
public static class PlanTableViews
{
    /// <summary>Whether <paramref name="line"/> carries load along <paramref name="direction"/> ("x" or "y"): a component of its direction along it.</summary>
    public static bool Along(PlanLine line, string direction) => direction == "x" ? Math.Abs(line.Cos) > 1e-9 : Math.Abs(line.Sin) > 1e-9;

    private static bool Along(BuildingPlan p, object lineId, string direction) => Along(p.Lines.First(l => l.Id == (string)lineId), direction);

    /// <summary>The level's index from its id (a cell of a table).</summary>
    private static Func<object, int> LevelIndex(BuildingPlan p)
    {
        var index = p.Levels.Select((l, i) => (l.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        return id => index[(string)id];
    }

    /// <summary>plan-amplification.csv's table by direction, the top level first.</summary>
    public static ResultTable Amplification(PlanResult r, PlanSeismicResult s)
    {
        var level = LevelIndex(r.Plan);
        return PlanSeismicFiles.AmplificationTable(r, s).WithRows(rows => rows.OrderBy(x => (string)x[0], StringComparer.Ordinal).ThenByDescending(x => level(x[1])));
    }

    /// <summary>plan-elf-forces.csv's table by direction, the top level first.</summary>
    public static ResultTable ElfForces(PlanResult r, PlanSeismicResult s)
    {
        var level = LevelIndex(r.Plan);
        return PlanSeismicFiles.ElfForcesTable(r, s).WithRows(rows => rows.OrderBy(x => (string)x[0], StringComparer.Ordinal).ThenByDescending(x => level(x[1])));
    }

    /// <summary>plan-spectrum-stories.csv's table along <paramref name="direction"/>, the top story first.</summary>
    public static ResultTable SpectrumStories(PlanResult r, PlanSpectrumResult sp, string direction) =>
        PlanSeismicFiles.SpectrumStoriesTable(r, sp).WithRows(rows => rows.Where(x => (string)x[0] == direction).OrderByDescending(x => (int)x[1]));

    /// <summary>plan-spectrum-lines.csv's table along <paramref name="direction"/>, lines along it only, the top story first, then by line.</summary>
    public static ResultTable SpectrumLines(PlanResult r, PlanSpectrumResult sp, string direction) =>
        PlanSeismicFiles.SpectrumLinesTable(r, sp).WithRows(rows => rows.Where(x => (string)x[0] == direction && Along(r.Plan, x[2], direction))
            .OrderByDescending(x => (int)x[1]).ThenBy(x => (string)x[2], StringComparer.Ordinal));

    /// <summary>plan-spectrum-line-reactions.csv's table along <paramref name="direction"/>, lines along it only.</summary>
    public static ResultTable SpectrumLineReactions(PlanResult r, PlanSpectrumResult sp, string direction) =>
        PlanSeismicFiles.SpectrumLineReactionsTable(r, sp).WithRows(rows => rows.Where(x => (string)x[0] == direction && Along(r.Plan, x[1], direction)));

    /// <summary>plan-spectrum-modes.csv's table along <paramref name="direction"/>.</summary>
    public static ResultTable SpectrumModes(PlanResult r, PlanSpectrumResult sp, string direction) =>
        PlanSeismicFiles.SpectrumModesTable(r, sp).WithRows(rows => rows.Where(x => (string)x[0] == direction));

    /// <summary>plan-shear-envelope.csv's table for case <paramref name="caseId"/> loading along <paramref name="direction"/>: lines along it only, the top story first.</summary>
    public static ResultTable ShearEnvelope(PlanResult r, DiaphragmStudy d, IReadOnlyList<TributaryShear>? tributary, string caseId, string direction) =>
        PlanDiaphragmFiles.EnvelopeTable(r, d, tributary).WithRows(rows => rows.Where(x => (string)x[0] == caseId && Along(r.Plan, x[2], direction))
            .OrderByDescending(x => (int)x[1]));

    /// <summary>
    /// plan-drift-checks.csv's governing row of each story (the largest ratio over its allowed ratio, the first of equals),
    /// over the outline corners only or over every row (named points too), the top story first or the bottom one.
    /// </summary>
    public static ResultTable GoverningDriftChecks(PlanResult r, bool cornersOnly, bool topFirst)
    {
        var table = PlanFiles.DriftChecksTable(r);
        int corner = table.Column("corner");
        var use = Use(table);
        return table.WithRows(rows =>
        {
            var governing = rows.Where(x => !cornersOnly || x[corner] is int).GroupBy(x => (int)x[1]).Select(g => g.MaxBy(use)!);
            return topFirst ? governing.OrderByDescending(x => (int)x[1]) : governing.OrderBy(x => (int)x[1]);
        });
    }

    /// <summary>plan-drift-checks.csv's governing row of each story and named point, by story, then point.</summary>
    public static ResultTable GoverningPointDriftChecks(PlanResult r)
    {
        var table = PlanFiles.DriftChecksTable(r);
        if (r.Plan.Points.Count == 0) return table;   // no point rows, no "point" column
        int point = table.Column("point");
        var use = Use(table);
        return table.WithRows(rows => rows.Where(x => (string)x[point] != "").GroupBy(x => ((int)x[1], (string)x[point]))
            .OrderBy(g => g.Key.Item1).ThenBy(g => g.Key.Item2, StringComparer.Ordinal).Select(g => g.MaxBy(use)!));
    }

    /// <summary>A drift check row's ratio over its allowed ratio (NaN where either is not a number).</summary>
    private static Func<IReadOnlyList<object>, double> Use(ResultTable driftChecks)
    {
        int ratio = driftChecks.Column("ratio"), allowed = driftChecks.Column("allowed");
        return x => x[ratio] is double a && x[allowed] is double b ? a / b : double.NaN;
    }
}
