using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The building tables the solve command prints: stories, line shares, drift checks, soft story, modifiers.</summary>
internal static class BuildingReport
{
    public static string Render(ModelResult run, Detail detail = Detail.Normal)
    {
        var r = run.Analysis;
        var m = r.Model;
        var b = m.Building;
        if (ReferenceEquals(b, BuildingData.Empty)) return "";
        var u = m.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol, ku = u.Label(Quantity.TranslationalStiffness);
        double L(double v) => u.FromSI(v, Quantity.Length);
        var br = run.Building;
        var sb = new StringBuilder();

        if (b.Levels.Count > 0)
        {
            sb.Append("\nLevels (rigid: the level's nodes share one horizontal displacement, exactly)\n");
            var t = new TextTable("level", "name", $"elevation [{len}]", "diaphragm", "nodes").Numeric(2);
            foreach (var l in b.Levels)
                t.Add(l.Id, l.Name, TextTable.Num(L(l.Elevation)), l.Rigid ? "rigid" : "none", $"{l.Nodes.Count} ({l.Selection})");
            sb.Append(t.Render());
        }

        // The console shows lateral load cases (and at full detail the lateral combinations); gravity-only cases are in the files.
        var lateral = br.Cases.Where(c => c.Lateral && (detail == Detail.Full || !c.IsCombination)).ToList();
        var shown = lateral.Select(c => c.CaseId).ToHashSet();
        if (br.HasStories)
        {
            sb.Append(detail == Detail.Full ? "\nStories (lateral cases and combinations; gravity-only cases are in stories.csv)\n"
                : "\nStories (lateral load cases; combinations and gravity-only cases are in stories.csv)\n");
            sb.Append(TableView.Render(BuildingTables.Stories(run),
                ["case", "story", "bottom level", "top level", "height", "top displacement", "drift", "drift ratio", "story shear", "story stiffness"],
                row => shown.Contains((string)row[0])));

            if (StoryPanels.Lines(r.Model).Count > 0)
            {
                sb.Append("\nStory shear by line of resistance (from member end forces and, for linked wall panels, base reactions and link forces by statics; stiffness = line shear / line drift, within the whole structure)\n");
                sb.Append(TableView.Render(BuildingFiles.StoryLinesTable(r, br),
                    ["case", "story", "line", "shear", "share of story shear", "line story stiffness in the structure"], row => shown.Contains((string)row[0])));
            }

            var (split, skipped) = (run.LineSplit, run.LineSplitSkipped);
            var loadCaseSplit = split.Where(x => shown.Contains(x.CaseId)).ToList();
            if (loadCaseSplit.Count > 0)
            {
                sb.Append("\nStory shear split: each line's story stiffness alone (same level forces) and the split it implies, beside the split in the structure\n");
                sb.Append(TableView.Render(BuildingFiles.LineSplitTable(r, loadCaseSplit)));
                sb.Append("  the difference is the interaction the diaphragms force between lines that deform differently (combinations: line-split.csv).\n");
            }
            foreach (var id in skipped) sb.Append($"  {id}: a line alone is a mechanism, so no split by stiffness alone.\n");

            sb.Append("\nStiffness (soft story) irregularity, ASCE 7-16 Table 12.3-2 Types 1a/1b: k below 70 % (60 %) of the story above or 80 % (70 %) of the mean of the three above (load cases; all cases in soft-story.csv)\n");
            sb.Append(TableView.Render(BuildingFiles.SoftStoryTable(r, br), row => shown.Contains((string)row[0])));
        }

        if (br.DriftChecks.Count > 0)
        {
            var drift = BuildingTables.DriftChecks(run);
            sb.Append('\n').Append(drift.Title).Append('\n');
            sb.Append(TableView.Render(drift, ["check", "case", "story", "elastic drift", "Cd", "Ie", "amplified drift", "drift ratio", "allowed ratio", "result", "margin"]));
            foreach (var c in b.DriftChecks) sb.Append($"  {c.Id}: allowable ratio {TextTable.Num(c.AllowedRatio)}, {c.LimitSource}.\n");
            foreach (var note in drift.Notes) sb.Append($"  {note}\n");
        }

        if (b.Modifiers.Count > 0 && (b.CrackedSections is not null || b.Modifiers.Any(a => a.Modifiers != StiffnessModifiers.None)))
        {
            sb.Append("\nStiffness modifiers by member (I, A, shear area multipliers, and why)\n");
            var t = new TextTable("members", "role", "I", "A", "As", "source").Numeric(2, 3, 4);
            foreach (var g in b.Modifiers.GroupBy(a => (m.Members[a.Member].Role, a.Modifiers, a.Source)))
            {
                var ids = g.Select(a => m.Members[a.Member].Id).ToList();
                string who = ids.Count <= 3 ? string.Join(", ", ids) : $"{ids[0]} … {ids[^1]} ({ids.Count})";
                t.Add(who, g.Key.Role, TextTable.Num(g.Key.Modifiers.I), TextTable.Num(g.Key.Modifiers.A), TextTable.Num(g.Key.Modifiers.ShearArea), g.Key.Source);
            }
            sb.Append(t.Render());
        }
        return sb.ToString();
    }
}
