using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Reports;

public static partial class BuildingReport
{
    /// <summary>Floors that bend: the kinds, the flexibility test per span (MDD/ADVE) and the envelope of rigid, semi-rigid and flexible floors.</summary>
    private static void Floors(Doc d)
    {
        var f = d.R.Diaphragms!;
        var p = d.P;
        d.Heading("Floors that bend");
        d.Table("Floors as given and the idealisations made", ["level", "kind as given"],
            f.Kinds.Select((k, i) => (IReadOnlyList<string>)[d.Level(i + 1), PlanFloor.Word(k)]));
        if (f.Kinds.Any(k => k != FloorKind.Rigid))
            d.Text("The sections above are of the floors as given; the hand split and the centre of rigidity assume rigid floors.");
        if (f.Variants.Count > 0) d.Text($"Idealisations solved for the envelope: {string.Join("; ", f.Variants)}.");
        if (f.Notes.Count > 0) d.Add(new BulletList(f.Notes.ToList()));

        if (f.Flexibility.Count > 0)
        {
            d.Text("Flexibility test of each floor span (ASCE 7-16 §12.3.1.3, eq. 12.3-1) on the semi-rigid floor under the story forces: MDD, the floor's largest in-plane " +
                "deflection in the span measured from the straight line through the floor at the span's supporting lines; ADVE, the average story drift of those lines. " +
                "MDD/ADVE > 2 permits the flexible idealisation; §12.3.1.1 and §12.3.1.2 classify some floors by condition. The governing code decides. " +
                "A line left empty: the span ends at the floor's free end.");
            d.Add(ReportTables.From(Output.PlanDiaphragmFiles.FlexibilityTable(d.R, f), "Floor flexibility test per span (plan-floor-flexibility.csv)",
                ["level", "case", "loading", "from line", "to line", "span from", "span to", "MDD", "ADVE", "MDD/ADVE", "flexible by eq. 12.3-1"]));
        }

        foreach (var family in p.Cases.Where(c => c.Direction is "x" or "y").GroupBy(c => (c.Family, c.Direction)))
        {
            var ids = family.Select(c => c.Id).ToHashSet();
            var rows = f.Envelope.Where(e => ids.Contains(e.Case)).ToList();
            if (rows.Count == 0) continue;
            d.Table($"Line shear envelope, {GroupName(family.Key)} ({string.Join(", ", ids)}): the largest |V| over the cases under each idealisation",
                ["story", "line", $"rigid [{d.Force}]", $"semi-rigid [{d.Force}]", $"flexible [{d.Force}]", $"envelope [{d.Force}]", "governs", "in case"],
                rows.GroupBy(e => (e.Story, e.Line)).Where(g => Along(d.Line(g.Key.Line), family.Key.Direction)).OrderByDescending(g => g.Key.Story).ThenBy(g => g.Key.Line, StringComparer.Ordinal).Select(g =>
                {
                    string Max(Func<LineShearEnvelope, double> sel) => g.Select(sel).Where(double.IsFinite).Select(Math.Abs).DefaultIfEmpty(double.NaN).Max() is var v && double.IsFinite(v) ? d.Fo(v) : "-";
                    var top = g.OrderByDescending(e => e.Envelope).First();
                    return (IReadOnlyList<string>)[I(g.Key.Story), g.Key.Line, Max(e => e.Rigid), Max(e => e.SemiRigid), Max(e => e.Flexible), d.Fo(top.Envelope), top.Governing, top.Case];
                }), 0, 2, 3, 4, 5);
        }
        d.Text("Rigid: every floor rigid; semi-rigid: the floors with a section as deep beams, the others rigid; flexible: every floor as simple spans between the lines " +
            "(tributary). Design for the envelope unless the governing code fixes the idealisation; the code decides, not this table. plan-shear-envelope.csv and " +
            "plan-floor-flexibility.csv, written by the solve command, hold every row, lines across the loading included.");
    }
}
