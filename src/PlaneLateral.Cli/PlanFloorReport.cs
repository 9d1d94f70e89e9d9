using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The console part on floors that bend (docs/plan.md): flexibility test and line shear envelope, within 100 columns.</summary>
internal static class PlanFloorReport
{
    /// <param name="tributary">The run's hand tributary split beside the FE flexible floor (<see cref="PlanRun.Tributary"/>), read, not computed.</param>
    public static string Render(PlanResult r, IReadOnlyList<TributaryShear> tributary)
    {
        if (r.Diaphragms is not { } d) return "";
        var p = r.Plan;
        var u = p.Units;
        string force = u.ForceSymbol;
        string Fo(double v) => double.IsFinite(v) ? TextTable.Num(u.FromSI(v, Quantity.Force)) : "-";
        var sb = new StringBuilder();
        sb.Append($"\nFloors in plan: {string.Join(", ", d.Kinds.Select((k, i) => $"{p.Levels[i + 1].Id} {PlanFloor.Word(k)}"))}\n");
        if (d.Kinds.Any(k => k != FloorKind.Rigid))
            sb.Append("  The tables above are of the floors as given; the hand split beside them assumes rigid floors.\n");
        foreach (var note in d.Notes) sb.Append($"  {note}\n");

        if (d.Flexibility.Count > 0)
        {
            sb.Append("\nFloor flexibility test (ASCE 7-16 §12.3.1.3, eq. 12.3-1), semi-rigid floor under the story forces\n");
            sb.Append(TableView.Render(PlanDiaphragmFiles.FlexibilityTable(r, d),
                ["level", "case", "from line", "to line", "span from", "span to", "MDD", "ADVE", "MDD/ADVE", "flexible by eq. 12.3-1"]));
            foreach (var g in d.Flexibility.GroupBy(x => (x.Level, x.Direction)))
            {
                var w = g.Where(x => double.IsFinite(x.Ratio)).OrderByDescending(x => x.Ratio).FirstOrDefault();
                if (w is null) continue;
                sb.Append($"  {p.Levels[w.Level].Id}, loads along {w.Direction}: largest MDD/ADVE {w.Ratio:0.000} " +
                    $"({(w.From == "" ? "end" : w.From)}-{(w.To == "" ? "end" : w.To)}): {(w.Flexible ? "flexible by eq. 12.3-1" : "not flexible by eq. 12.3-1")}\n");
            }
            sb.Append("  A line left empty: the span ends at the floor's free end.\n");
            sb.Append("  MDD: the floor's largest in-plane deflection in the span from the line through it at the span's\n" +
                      "  lines; ADVE: their average story drift. Eq. 12.3-1 permits the flexible idealisation where\n" +
                      "  MDD/ADVE > 2; the governing code decides.\n");
        }

        foreach (var family in p.Cases.Where(c => c.Direction is "x" or "y").GroupBy(c => c.Family))
        {
            string dir = family.First().Direction;
            var ids = family.Select(c => c.Id).ToHashSet();
            sb.Append($"\nLine shear envelope, loads {family.Key} ({string.Join(", ", ids)}): largest |V| over the cases\n");
            var t = new TextTable("story", "line", $"rigid [{force}]", $"semi-rigid [{force}]", $"flexible [{force}]", $"envelope [{force}]", "governs").Numeric(0, 2, 3, 4, 5);
            var rows = d.Envelope.Where(e => ids.Contains(e.Case)).ToList();
            foreach (var g in rows.GroupBy(e => (e.Story, e.Line)).OrderByDescending(g => g.Key.Story))
            {
                var line = p.Lines.First(l => l.Id == g.Key.Line);
                if ((dir == "x" ? line.Cos : line.Sin) == 0) continue;
                double Max(Func<LineShearEnvelope, double> f) => g.Select(f).Where(double.IsFinite).Select(Math.Abs).DefaultIfEmpty(double.NaN).Max();
                var top = g.OrderByDescending(e => e.Envelope).First();
                t.Add(g.Key.Story.ToString(), g.Key.Line, Fo(Max(e => e.Rigid)), Fo(Max(e => e.SemiRigid)), Fo(Max(e => e.Flexible)), Fo(top.Envelope), top.Governing);
            }
            sb.Append(t.Render());
        }
        sb.Append("  Rigid: every floor rigid; semi-rigid: floors with a section as deep beams, the others rigid;\n" +
                  "  flexible: every floor as simple spans between the lines (tributary). Design for the envelope\n" +
                  "  unless the governing code fixes the idealisation; it decides, not this table.\n");
        sb.Append(Tributary(r, tributary));
        return sb.ToString();
    }

    /// <summary>The hand tributary split beside the FE flexible floor, per load at the centres of mass, with the gap and its cause.</summary>
    private static string Tributary(PlanResult r, IReadOnlyList<TributaryShear> hand)
    {
        if (hand.Count == 0 || r.Diaphragms is not { } d || !d.Variants.Contains("flexible")) return "";
        var p = r.Plan;
        var sb = new StringBuilder();
        foreach (var c in p.Cases.Where(c => c.Direction is "x" or "y" && c.Eccentricity == 0))
        {
            sb.Append($"\nHand tributary split beside the FE flexible floor, case {c.Id}\n");
            sb.Append(TableView.Render(PlanTableViews.ShearEnvelope(r, d, hand, c.Id, c.Direction),
                ["story", "line", "flexible", "hand tributary", "flexible/hand - 1", "gap cause"]));
        }
        if (sb.Length == 0) return "";
        sb.Append("  Hand: each floor as simple spans between its lines under a uniform load over its extent, an\n" +
                  "  overhang to its end line, no torque, lines at one position by stiffness (Wight & MacGregor).\n" +
                  "  Gap from: torque (the FE spreads the floor's torque over it), overhang (the FE takes it by the\n" +
                  "  end span's statics), one position (the FE shares equally), net area (openings or an outline\n" +
                  "  that is not a rectangle: the FE load follows the net area).\n");
        return sb.ToString();
    }
}
