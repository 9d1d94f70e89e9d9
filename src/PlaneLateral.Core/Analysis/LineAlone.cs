using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>One line's story stiffness when it stands alone, and the split of story shear those stiffnesses imply.</summary>
/// <param name="AloneStiffness">Story stiffness of the line analysed alone (N/m; NaN when not defined).</param>
/// <param name="AloneShare">AloneStiffness / Σ AloneStiffness over the lines in that story: the split by relative rigidity.</param>
/// <param name="InStructureShare">The share the line takes in the whole structure (from <see cref="StoryAnalysis"/>).</param>
public sealed record LineSplitRow(int Story, string Line, double AloneStiffness, double AloneShare, double InStructureShare);

/// <summary>
/// Each line of resistance analysed by itself: its members and linked wall panels (with their links), the nodes they
/// use, the supports at those nodes and the levels restricted to those nodes, loaded with the case's level forces (the sum of the nodal fx applied at each
/// level's nodes, all lines together) at the line's first node on each level. Member loads and vertical loads are left
/// out: this is the lateral stiffness of the line under the story-force pattern, the quantity a relative-rigidity
/// distribution divides by. Set beside <see cref="LineStoryResult.Share"/> it shows how far interaction (a wall
/// pulling back a frame near the top) moves the split away from relative rigidity.
/// <para>The comparison layer (hand methods against FE) is the intended caller; Core itself does not compare.</para>
/// </summary>
public static class LineAlone
{
    /// <summary>Story results of <paramref name="line"/> standing alone under the level forces of case <paramref name="caseId"/>.</summary>
    /// <exception cref="ArgumentException">The model has no such line, or fewer than two levels.</exception>
    /// <exception cref="UnstableModelException">The line alone is a mechanism (e.g. it leans on another line).</exception>
    public static CaseStories Stories(AnalysisResult r, string caseId, string line, AnalysisOptions? options = null) =>
        Stories(r, [caseId], line, options)[0];

    /// <summary>
    /// Story results of <paramref name="line"/> standing alone under the level forces of each case in
    /// <paramref name="caseIds"/>, in that order: one model of the line with one load case per case, so its stiffness is
    /// factorised once whatever the number of cases.
    /// </summary>
    /// <exception cref="ArgumentException">The model has no such line, or fewer than two levels.</exception>
    /// <exception cref="UnstableModelException">The line alone is a mechanism (e.g. it leans on another line).</exception>
    public static IReadOnlyList<CaseStories> Stories(AnalysisResult r, IReadOnlyList<string> caseIds, string line, AnalysisOptions? options = null)
    {
        var model = r.Model;
        var b = model.Building;
        if (!StoryPanels.Lines(model).Contains(line)) throw new ArgumentException($"the model has no line \"{line}\"", nameof(line));
        if (b.Levels.Count < 2) throw new ArgumentException("the model has fewer than two levels, so no stories", nameof(r));

        var memberIdx = Enumerable.Range(0, model.Members.Count).Where(i => b.MemberLines[i] == line).ToList();
        var panelIdx = Enumerable.Range(0, model.Panels.Count).Where(i => model.Panels[i].Links.Count > 0 && StoryPanels.LineOf(model.Panels[i]) == line).ToList();
        var usedNodes = memberIdx.SelectMany(i => new[] { model.Members[i].Start, model.Members[i].End })
            .Concat(panelIdx.SelectMany(i => model.Panels[i].Links.Select(l => l.Node))).Distinct().Order().ToList();
        var newIndex = usedNodes.Select((n, k) => (n, k)).ToDictionary(p => p.n, p => p.k);
        var nodes = usedNodes.Select((n, k) => model.Nodes[n] with { Index = k }).ToList();
        var members = memberIdx.Select((i, k) => model.Members[i] with { Index = k, Start = newIndex[model.Members[i].Start], End = newIndex[model.Members[i].End] }).ToList();
        var supports = model.Supports.Where(s => newIndex.ContainsKey(s.Node)).Select(s => s with { Node = newIndex[s.Node] }).ToList();

        var levels = new List<Level>();
        foreach (var l in b.Levels)
        {
            var at = l.Nodes.Where(newIndex.ContainsKey).Select(n => newIndex[n]).ToList();
            levels.Add(l with { Nodes = at, TiedNodes = l.Rigid ? at : [] });
        }
        var loadCases = new List<LoadCase>();
        foreach (var caseId in caseIds)
        {
            var source = r.Case(caseId);
            var loads = new List<NodalLoad>();
            var applied = AppliedFx(model, source);
            var panelFx = LinkedPanelLevelFx(model, source);
            for (int li = 0; li < b.Levels.Count; li++)
            {
                var at = levels[li].Nodes;
                double fx = b.Levels[li].Nodes.Sum(n => applied[n]) + panelFx[li];
                if (fx != 0 && at.Count > 0) loads.Add(new NodalLoad(at[0], fx, 0, 0));
            }
            loadCases.Add(new LoadCase(caseId, $"level forces of {caseId}", loads, []));
        }
        var sub = new StructureModel
        {
            Title = $"{model.Title}, line {line} alone",
            SourcePath = model.SourcePath,
            Units = model.Units,
            Materials = model.Materials,
            Sections = model.Sections,
            Nodes = nodes,
            Members = members,
            Supports = supports,
            LoadCases = loadCases,
            Combinations = [],
            StiffnessPoints = [],
            // The line's linked wall panels with their links, without their own loads (the level forces carry them).
            Panels = panelIdx.Select(i => model.Panels[i] with { Loads = [], Links = model.Panels[i].Links.Select(k => k with { Node = newIndex[k.Node] }).ToList() }).ToList(),
            Building = new BuildingData
            {
                Levels = levels,
                MemberLines = members.Select(_ => line).ToList(),
                Lines = [line],
                Modifiers = memberIdx.Select((i, k) => b.Modifiers.Count > i ? b.Modifiers[i] with { Member = k } : new ModifierAssignment(k, members[k].Modifiers, "")).ToList(),
            },
        };
        var result = LinearStaticAnalysis.Run(sub, options);
        return result.Cases.Select(c => StoryAnalysis.ForCase(result, c)).ToList();
    }

    /// <summary>
    /// For every story of case <paramref name="caseId"/>: each line's stiffness alone, the split those stiffnesses give, and
    /// the share the line takes in the whole structure.
    /// </summary>
    public static IReadOnlyList<LineSplitRow> Split(AnalysisResult r, string caseId, AnalysisOptions? options = null)
    {
        var lines = StoryPanels.Lines(r.Model);
        var alone = lines.ToDictionary(l => l, l => Stories(r, caseId, l, options));
        return Rows(StoryAnalysis.ForCase(r, r.Case(caseId)), lines, alone);
    }

    private static IReadOnlyList<LineSplitRow> Rows(CaseStories whole, IReadOnlyList<string> lines, Dictionary<string, CaseStories> alone)
    {
        var rows = new List<LineSplitRow>();
        foreach (var s in whole.Stories)
        {
            var k = alone.ToDictionary(p => p.Key, p => p.Value.Stories[s.Index - 1].Stiffness);
            double sum = k.Values.Where(double.IsFinite).Sum();
            foreach (var line in lines)
            {
                double share = s.Lines.FirstOrDefault(x => x.Line == line)?.Share ?? 0;
                rows.Add(new LineSplitRow(s.Index, line, k[line], double.IsFinite(k[line]) && sum != 0 ? k[line] / sum : double.NaN, share));
            }
        }
        return rows;
    }

    /// <summary>
    /// <see cref="Split"/> for every lateral case with two or more lines, each line analysed alone once for all those
    /// cases; when some line alone is a mechanism no split can be made, and every case is named in <paramref name="skipped"/>.
    /// </summary>
    public static IReadOnlyList<(string CaseId, IReadOnlyList<LineSplitRow> Rows)> SplitAll(AnalysisResult r, IReadOnlyList<CaseStories> stories, out IReadOnlyList<string> skipped,
        AnalysisOptions? options = null)
    {
        var list = new List<(string, IReadOnlyList<LineSplitRow>)>();
        skipped = [];
        var lines = StoryPanels.Lines(r.Model);
        var lateral = stories.Where(c => c.Lateral).ToList();
        if (lines.Count < 2 || r.Model.Building.Levels.Count < 2 || lateral.Count == 0) return list;
        var ids = lateral.Select(c => c.CaseId).ToList();
        var alone = new Dictionary<string, IReadOnlyList<CaseStories>>();
        try
        {
            foreach (var line in lines) alone[line] = Stories(r, ids, line, options);
        }
        catch (UnstableModelException)
        {
            skipped = ids;   // the line's stiffness does not depend on the case: a mechanism alone is one in every case
            return list;
        }
        for (int i = 0; i < lateral.Count; i++)
            list.Add((ids[i], Rows(lateral[i], lines, lines.ToDictionary(l => l, l => alone[l][i]))));
        return list;
    }

    /// <summary>
    /// The horizontal story forces on linked wall panels, summed per level (N): a force at a panel level goes to the
    /// model level at that elevation, or the nearest one (a panel level between floors is a modelling choice the line
    /// alone cannot reproduce; its force still counts).
    /// </summary>
    private static double[] LinkedPanelLevelFx(StructureModel model, CaseResult c)
    {
        var levels = model.Building.Levels;
        var fx = new double[levels.Count];
        foreach (var p in model.Panels.Where(p => p.Links.Count > 0))
            foreach (var (load, factor) in StoryPanels.OwnLoads(model, p, c))
            {
                if (load.Fx == 0) continue;
                double y = p.Y0 + load.Level;
                int at = Enumerable.Range(0, levels.Count).MinBy(i => Math.Abs(levels[i].Elevation - y));
                fx[at] += factor * load.Fx;
            }
        return fx;
    }

    /// <summary>Nodal fx applied at each node in a case or combination (N).</summary>
    private static double[] AppliedFx(StructureModel model, CaseResult c)
    {
        var fx = new double[model.Nodes.Count];
        IEnumerable<(LoadCase Case, double Factor)> parts = c.IsCombination
            ? model.Combinations.First(x => x.Id == c.Id).Factors.Select(p => (model.LoadCases[p.Case], p.Factor))
            : [(model.LoadCases.First(x => x.Id == c.Id), 1.0)];
        foreach (var (lc, factor) in parts)
            foreach (var nl in lc.NodalLoads) fx[nl.Node] += factor * nl.Fx;
        return fx;
    }
}
