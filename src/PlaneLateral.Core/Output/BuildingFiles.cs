using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The building layer's results files: story results, line shares, drift checks, the stiffness irregularity check,
/// the stiffness modifier of each member, and one JSON file with all of them. Nothing when the model has no building
/// keys. All in the model's units; the text depends only on the input.
/// </summary>
public static class BuildingFiles
{
    public static IReadOnlyList<(string Name, string Text)> Render(ModelResult run)
    {
        var r = run.Analysis;
        var b = r.Model.Building;
        if (ReferenceEquals(b, BuildingData.Empty)) return [];
        var br = run.Building;
        var files = new List<(string, string)>();
        if (br.HasStories)
        {
            files.Add(("stories.csv", BuildingTables.Stories(run).ToCsv()));
            files.Add(("story-lines.csv", StoryLines(r, br)));
            files.Add(("soft-story.csv", SoftStory(r, br)));
            var split = run.LineSplit;
            if (split.Count > 0) files.Add(("line-split.csv", Split(r, split)));
        }
        if (b.DriftChecks.Count > 0) files.Add(("drift-checks.csv", BuildingTables.DriftChecks(run).ToCsv()));
        files.Add(("member-stiffness.csv", MemberStiffness(r)));
        files.Add(("stories.json", TypedJson.Write(Document(r, br))));
        return files;
    }

    private static string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "n/a";

    private static string Csv(string s) => PlaneLateral.Output.CsvText.Cell(s);   // the one escaper (quoting, formula neutralising)

    private static string LineName(string l) => l.Length == 0 ? "(no line)" : l;

    private static string StoryLines(AnalysisResult r, BuildingResult br)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,story,line,shear [{u.ForceSymbol}],share of story shear,line drift [{u.LengthSymbol}],line story stiffness in the structure [{u.Label(Quantity.TranslationalStiffness)}]\n");
        foreach (var c in br.Cases)
            foreach (var s in c.Stories)
                foreach (var l in s.Lines)
                    sb.Append($"{Csv(c.CaseId)},{s.Index},{Csv(LineName(l.Line))},{F(u.FromSI(l.Shear, Quantity.Force))},{F(l.Share)},{F(u.FromSI(l.Drift, Quantity.Length))},{F(u.FromSI(l.Stiffness, Quantity.TranslationalStiffness))}\n");
        return sb.ToString();
    }

    private static string Split(AnalysisResult r, IReadOnlyList<(string CaseId, IReadOnlyList<LineSplitRow> Rows)> split)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,story,line,stiffness of the line alone [{u.Label(Quantity.TranslationalStiffness)}],share by stiffness alone,share in the structure\n");
        foreach (var (id, rows) in split)
            foreach (var x in rows)
                sb.Append($"{Csv(id)},{x.Story},{Csv(x.Line)},{F(u.FromSI(x.AloneStiffness, Quantity.TranslationalStiffness))},{F(x.AloneShare)},{F(x.InStructureShare)}\n");
        return sb.ToString();
    }

    private static string SoftStory(AnalysisResult r, BuildingResult br)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,story,stiffness [{u.Label(Quantity.TranslationalStiffness)}],ratio to story above,ratio to mean of three above,type 1a soft (<0.70 or <0.80),type 1b extreme (<0.60 or <0.70)\n");
        foreach (var i in br.Irregularity)
            sb.Append($"{Csv(i.CaseId)},{i.Story.Index},{F(u.FromSI(i.Stiffness, Quantity.TranslationalStiffness))},{F(i.RatioToAbove)},{F(i.RatioToAverageAbove)},{(i.WindCase ? "not applied (wind case)" : i.Soft ? "yes" : "no")},{(i.WindCase ? "not applied (wind case)" : i.ExtremelySoft ? "yes" : "no")}\n");
        return sb.ToString();
    }

    private static string MemberStiffness(AnalysisResult r)
    {
        var m = r.Model;
        var b = m.Building;
        var sb = new StringBuilder("member,role,line,I modifier,A modifier,shear area modifier,source\n");
        for (int i = 0; i < m.Members.Count; i++)
        {
            var mem = m.Members[i];
            var a = i < b.Modifiers.Count ? b.Modifiers[i] : new ModifierAssignment(i, mem.Modifiers, "");
            string line = i < b.MemberLines.Count ? b.MemberLines[i] : "";
            sb.Append($"{Csv(mem.Id)},{Csv(mem.Role)},{Csv(line)},{F(a.Modifiers.I)},{F(a.Modifiers.A)},{F(a.Modifiers.ShearArea)},{Csv(a.Source)}\n");
        }
        return sb.ToString();
    }

    /// <summary>A finite number, or null (the building layer's "cannot be given": a story without shear has no stiffness).</summary>
    private static double? N(double v) => double.IsFinite(v) ? v : null;

    /// <summary>stories.json as a typed document.</summary>
    public static StoriesDocument Document(AnalysisResult r, BuildingResult br)
    {
        var m = r.Model;
        var u = m.Units;
        double? L(double v) => N(u.FromSI(v, Quantity.Length));
        double? Force(double v) => N(u.FromSI(v, Quantity.Force));
        double? K(double v) => N(u.FromSI(v, Quantity.TranslationalStiffness));
        return new StoriesDocument(
            ProducedBy: $"PlaneLateral {ResultFiles.Version}",
            Caution: ResultFiles.Caution,
            Units: $"length {u.LengthSymbol}, force {u.ForceSymbol}, stiffness {u.Label(Quantity.TranslationalStiffness)}",
            Definitions: "Story i runs from its bottom level to its top level. Level displacement: mean ux of the level's nodes. Drift: top minus bottom. Story shear: horizontal force carried across a horizontal cut in the story by the members crossing it (from their end forces and loads), positive in +x. Story stiffness: shear / drift, null where the story carries no shear or does not drift.",
            Levels: m.Building.Levels.Select(l => new StoriesLevel(l.Id, l.Name, L(l.Elevation), l.Rigid ? "rigid" : "none", l.Selection, l.Nodes.Select(n => m.Nodes[n].Id))),
            Cases: br.Cases.Select(c => new StoriesCase(c.CaseId, c.IsCombination ? "combination" : "load case", c.Lateral,
                c.Levels.Select(ld => new StoriesLevelDisplacement(ld.Level.Id, L(ld.Ux), L(ld.Spread))),
                c.Stories.Select(s => new StoriesStory(s.Index, s.Bottom.Id, s.Top.Id, L(s.Height), L(s.TopDisplacement), L(s.Drift), N(s.DriftRatio),
                    L(s.CutElevation), Force(s.Shear), K(s.Stiffness),
                    s.Lines.Select(l => new StoriesLine(LineName(l.Line), Force(l.Shear), N(l.Share), L(l.Drift), K(l.Stiffness))))))),
            DriftChecks: br.DriftChecks.Select(d => new StoriesDriftCheck(d.Check.Id, d.CaseId, d.Story.Index, N(d.Check.Cd), N(d.Check.Ie),
                L(d.ElasticDrift), L(d.AmplifiedDrift), N(d.Ratio), N(d.Allowed), d.Passes ? "within" : "exceeds", N(d.Margin), d.Check.LimitSource,
                "amplified drift = Cd·elastic drift / Ie (ASCE 7-16 eq. 12.8-15)")),
            StiffnessIrregularity: br.Irregularity.Select(i => new StoriesIrregularity(i.CaseId, i.Story.Index, K(i.Stiffness), N(i.RatioToAbove),
                N(i.RatioToAverageAbove), i.Soft, i.ExtremelySoft, i.WindCase)),
            IrregularitySource: "ASCE 7-16 Table 12.3-2, Types 1a (below 70 % of the story above or 80 % of the mean of the three above) and 1b (60 % and 70 %); the governing code decides",
            MemberStiffness: Enumerable.Range(0, Math.Min(m.Members.Count, m.Building.Modifiers.Count)).Select(i => new StoriesMemberStiffness(
                m.Members[i].Id, N(m.Building.Modifiers[i].Modifiers.I), N(m.Building.Modifiers[i].Modifiers.A), N(m.Building.Modifiers[i].Modifiers.ShearArea),
                m.Building.Modifiers[i].Source)));
    }
}
