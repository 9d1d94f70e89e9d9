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
        if (ReferenceEquals(run.Model.Building, BuildingData.Empty)) return [];
        return [.. Tables(run).Select(t => t.Text()), ("stories.json", TypedJson.Write(Document(run.Analysis, run.Building)))];
    }

    /// <summary>The building layer's CSV files, each from its table (none without building keys).</summary>
    public static IReadOnlyList<CsvTableFile> Tables(ModelResult run)
    {
        var r = run.Analysis;
        var b = r.Model.Building;
        if (ReferenceEquals(b, BuildingData.Empty)) return [];
        var br = run.Building;
        var files = new List<CsvTableFile>();
        if (br.HasStories)
        {
            files.Add(new("stories.csv", BuildingTables.Stories(run)));
            files.Add(new("story-lines.csv", StoryLinesTable(r, br)));
            files.Add(new("soft-story.csv", SoftStoryTable(r, br)));
            var split = run.LineSplit;
            if (split.Count > 0) files.Add(new("line-split.csv", LineSplitTable(r, split)));
        }
        if (b.DriftChecks.Count > 0) files.Add(new("drift-checks.csv", BuildingTables.DriftChecks(run)));
        files.Add(new("member-stiffness.csv", MemberStiffnessTable(r)));
        return files;
    }

    private static string LineName(string l) => l.Length == 0 ? "(no line)" : l;

    /// <summary>Each line's share of each story's shear, its drift and its story stiffness within the structure, every case.</summary>
    public static ResultTable StoryLinesTable(AnalysisResult r, BuildingResult br)
    {
        var u = r.Model.Units;
        return new ResultTable
        {
            Title = "Story shear by line of resistance",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("story"), new("line", Kind: CellKind.Text), new("shear", u.ForceSymbol), new("share of story shear", Kind: CellKind.Percent),
                new("line drift", u.LengthSymbol), new("line story stiffness in the structure", u.Label(Quantity.TranslationalStiffness)),
            ],
            Rows = br.Cases.SelectMany(c => c.Stories.SelectMany(s => s.Lines.Select(l => (IReadOnlyList<object>)
                [c.CaseId, s.Index, LineName(l.Line), u.FromSI(l.Shear, Quantity.Force), l.Share, u.FromSI(l.Drift, Quantity.Length),
                 u.FromSI(l.Stiffness, Quantity.TranslationalStiffness)]))).ToList(),
        };
    }

    /// <summary>Each line's story stiffness alone and the split it implies, beside the split in the structure.</summary>
    public static ResultTable LineSplitTable(AnalysisResult r, IReadOnlyList<(string CaseId, IReadOnlyList<LineSplitRow> Rows)> split)
    {
        var u = r.Model.Units;
        return new ResultTable
        {
            Title = "Story shear split: each line's story stiffness alone (same level forces) and the split it implies, beside the split in the structure",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("story"), new("line", Kind: CellKind.Text), new("stiffness of the line alone", u.Label(Quantity.TranslationalStiffness)),
                new("share by stiffness alone", Kind: CellKind.Percent), new("share in the structure", Kind: CellKind.Percent),
            ],
            Rows = split.SelectMany(x => x.Rows.Select(row => (IReadOnlyList<object>)
                [x.CaseId, row.Story, row.Line, u.FromSI(row.AloneStiffness, Quantity.TranslationalStiffness), row.AloneShare, row.InStructureShare])).ToList(),
        };
    }

    /// <summary>The stiffness (soft story) irregularity check of every case and story.</summary>
    public static ResultTable SoftStoryTable(AnalysisResult r, BuildingResult br)
    {
        var u = r.Model.Units;
        static string Flag(bool wind, bool yes) => wind ? "not applied (wind case)" : yes ? "yes" : "no";
        return new ResultTable
        {
            Title = "Stiffness (soft story) irregularity, ASCE 7-16 Table 12.3-2 Types 1a/1b: k below 70 % (60 %) of the story above or 80 % (70 %) of the mean of the three above",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("story"), new("stiffness", u.Label(Quantity.TranslationalStiffness)), new("ratio to story above"),
                new("ratio to mean of three above"), new("type 1a soft (<0.70 or <0.80)", Kind: CellKind.Text), new("type 1b extreme (<0.60 or <0.70)", Kind: CellKind.Text),
            ],
            Rows = br.Irregularity.Select(i => (IReadOnlyList<object>)
                [i.CaseId, i.Story.Index, u.FromSI(i.Stiffness, Quantity.TranslationalStiffness), i.RatioToAbove, i.RatioToAverageAbove,
                 Flag(i.WindCase, i.Soft), Flag(i.WindCase, i.ExtremelySoft)]).ToList(),
        };
    }

    /// <summary>The stiffness modifiers (I, A, shear area) of every member and where they come from.</summary>
    public static ResultTable MemberStiffnessTable(AnalysisResult r)
    {
        var m = r.Model;
        var b = m.Building;
        var rows = new List<IReadOnlyList<object>>();
        for (int i = 0; i < m.Members.Count; i++)
        {
            var mem = m.Members[i];
            var a = i < b.Modifiers.Count ? b.Modifiers[i] : new ModifierAssignment(i, mem.Modifiers, "");
            rows.Add([mem.Id, mem.Role, i < b.MemberLines.Count ? b.MemberLines[i] : "", a.Modifiers.I, a.Modifiers.A, a.Modifiers.ShearArea, a.Source]);
        }
        return new ResultTable
        {
            Title = "Stiffness modifiers by member (I, A, shear area multipliers, and why)",
            Columns =
            [
                new("member", Kind: CellKind.Text), new("role", Kind: CellKind.Text), new("line", Kind: CellKind.Text), new("I modifier"), new("A modifier"),
                new("shear area modifier"), new("source", Kind: CellKind.Text),
            ],
            Rows = rows,
        };
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
