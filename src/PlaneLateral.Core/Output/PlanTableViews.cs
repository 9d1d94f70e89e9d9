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
}
