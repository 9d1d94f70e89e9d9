using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;

namespace PlaneLateral.Studies;

/// <summary>
/// Moment-frame stories: hand rigid-beam stiffness Σ12EI/(h³(1+Φ)) and D-values beside the FE story stiffness of the
/// frame's members on the model's supports, under the check's lateral pattern (story shear / interstory drift).
/// </summary>
internal static class FrameStoryStudy
{
    /// <summary>For the "beams made rigid" FE estimate: each beam's I/L is raised to this multiple of the stiffest column's I/h.</summary>
    public const double RigidFactor = 1e4;

    /// <summary>The frame's geometry, story by story.</summary>
    internal sealed record Story(int Number, double Bottom, double Top, IReadOnlyList<Member> Columns,
        IReadOnlyList<double> BeamIAbove, IReadOnlyList<double> BeamIBelow, IReadOnlyList<double> Spans);

    public static IEnumerable<ComparisonRow> Rows(StructureModel model, FrameStoriesCheck c, double tol)
    {
        var u = model.Units;
        var stories = Stories(model, c);
        var (fe, driftRatio) = StoryStiffness(model, c, rigidBeams: false);
        var (feRigid, _) = StoryStiffness(model, c, rigidBeams: true);
        string pattern = "lateral pattern " + string.Join(", ", c.Pattern.Select(p => ComparisonStudy.G4(u.FromSI(p, Units.Quantity.Force)))) + $" {u.ForceSymbol} at the levels, bottom first, shared equally by each level's column joints";
        foreach (int s in c.Stories)
        {
            var st = stories[s - 1];
            double h = st.Top - st.Bottom;
            var rigid = RigidBeams(st);
            var dv = DValue(model, c, st);
            var feAsBuilt = new FeEstimate("frame members on their supports", ComparisonStudy.Stiffness(u, fe[s - 1]),
                $"the check's {c.Members.Count} members with the model's supports, {pattern}; story stiffness = story shear / interstory drift (mean of the joints at each level)");
            var feStiffBeams = new FeEstimate("same frame, beams made rigid", ComparisonStudy.Stiffness(u, feRigid[s - 1]),
                $"as the first, with every beam's I/L raised to {RigidFactor:G3} times the stiffest column's I/h: what is left of the gap is column shear and axial shortening");
            string subject = $"story {s} (h = {ComparisonStudy.G4(u.FromSI(h, Units.Quantity.Length))} {u.LengthSymbol})";
            double r1 = fe[s - 1] / rigid.Stiffness;
            yield return new ComparisonRow(c.Id, "frame-stories", subject, ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
                new HandEstimate(ComparisonStudy.Stiffness(u, rigid.Stiffness), rigid.Method),
                [feAsBuilt, feStiffBeams], null, tol, RigidCause(r1, feRigid[s - 1] / rigid.Stiffness, tol));
            double r2 = fe[s - 1] / dv.Stiffness;
            yield return new ComparisonRow(c.Id, "frame-stories", subject, ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
                new HandEstimate(ComparisonStudy.Stiffness(u, dv.Stiffness), dv.Method,
                    Detail: string.Join("\n", dv.Columns.Select((col, j) => $"column {st.Columns[j].Id}: k̄ = {ComparisonStudy.G4(col.BeamToColumnRatio)}, a = {ComparisonStudy.G4(col.Coefficient)}"))),
                [feAsBuilt], null, tol, DValueCause(r2, tol, s, driftRatio));
        }
    }

    /// <summary>Cause rules for the rigid-beam row (docs/comparisons.md).</summary>
    internal static string RigidCause(double ratio, double ratioRigidBeams, double tol)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        if (v == Verdict.WithinTolerance) return "beams stiff enough for the rigid-beam assumption";
        if (v == Verdict.HandLower) return "the frame is stiffer than rigid beams allow: something else in the listed members restrains the story; check the member list";
        double beamPart = ratioRigidBeams - ratio;   // share of the hand value lost to beam bending
        double otherPart = 1 - ratioRigidBeams;      // lost to column shear and axial shortening
        return beamPart >= otherPart
            ? $"beam flexibility: rigid-beam assumption is too stiff (with rigid beams the FE gives {ComparisonStudy.Pct(ratioRigidBeams)} of the hand value)"
            : $"column axial shortening and shear: with rigid beams the FE still gives only {ComparisonStudy.Pct(ratioRigidBeams)} of the hand value; overturning shortens and lengthens the columns";
    }

    /// <summary>
    /// Cause rules for the D-value row (docs/comparisons.md). The method assumes the stories next to this one drift at
    /// the same angle, so they share the beams' restraint equally; the FE drift angles of the neighbours say how far
    /// that holds. <paramref name="driftRatio"/> holds each story's FE drift angle (drift/h), story 1 first.
    /// </summary>
    internal static string DValueCause(double ratio, double tol, int story, IReadOnlyList<double> driftRatio)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        if (v == Verdict.WithinTolerance) return "flexible-beam estimate holds at this story";
        var neighbours = new List<(string Name, double Relative)>();
        if (story > 1) neighbours.Add(("the story below", driftRatio[story - 2] / driftRatio[story - 1]));
        if (story < driftRatio.Count) neighbours.Add(("the story above", driftRatio[story] / driftRatio[story - 1]));
        string G(double x) => x.ToString("0.00", System.Globalization.CultureInfo.InvariantCulture);
        if (v == Verdict.HandLower)
        {
            if (neighbours.Count == 0)
                return "frame stiffer than the D-value: a one-story frame has no story above to share its beams' restraint, which the method assumes";
            var n = neighbours.MinBy(x => x.Relative);
            return n.Relative < 1
                ? $"frame stiffer than the D-value: {n.Name} drifts only {G(n.Relative)} times this story's angle, so it holds the shared joints harder than the method's equal-drift assumption"
                : "frame stiffer than the D-value: the joints rotate less than the method assumes (the neighbouring stories drift more, so look to the beams' end restraint and the column bases)";
        }
        if (neighbours.Count > 0 && neighbours.MaxBy(x => x.Relative) is var m && m.Relative > 1)
            return $"frame softer than the D-value: {m.Name} drifts {G(m.Relative)} times this story's angle, so it restrains the shared joints less than the method's equal-drift assumption; the columns also shorten axially under overturning";
        return "frame softer than the D-value: the columns shorten axially under overturning, which the method leaves out";
    }

    internal static FrameStoryResult RigidBeams(Story st)
    {
        var cols = st.Columns.Select(m => double.IsFinite(m.ShearArea) ? new FrameColumn(m.E, m.I, m.G, m.ShearArea) : new FrameColumn(m.E, m.I)).ToArray();
        return FrameStory.RigidBeams(st.Top - st.Bottom, cols);
    }

    internal static DValueResult DValue(StructureModel model, FrameStoriesCheck c, Story st)
    {
        StoryPosition pos = StoryPosition.Upper;
        if (st.Number == 1)
        {
            var baseNode = LowerNode(model, st.Columns[0]);
            var sup = model.Supports.First(s => s.Node == baseNode);
            pos = sup.RestrainRZ ? StoryPosition.FixedBase : StoryPosition.PinnedBase;
        }
        return FrameStory.DValues(st.Columns[0].E, st.Top - st.Bottom, st.Columns.Select(m => m.I).ToArray(), st.Spans,
            st.BeamIAbove, pos == StoryPosition.Upper ? st.BeamIBelow : null, pos);
    }

    internal static int LowerNode(StructureModel model, Member m) => model.Nodes[m.Start].Y <= model.Nodes[m.End].Y ? m.Start : m.End;
    internal static int UpperNode(StructureModel model, Member m) => model.Nodes[m.Start].Y <= model.Nodes[m.End].Y ? m.End : m.Start;

    internal static List<Story> Stories(StructureModel model, FrameStoriesCheck c)
    {
        var members = c.Members.Select(i => model.Members[i]).ToList();
        bool Vertical(Member m) => model.Nodes[m.Start].X == model.Nodes[m.End].X || Math.Abs(model.Nodes[m.Start].X - model.Nodes[m.End].X) < 1e-9 * Math.Abs(model.Nodes[m.Start].Y - model.Nodes[m.End].Y);
        var columns = members.Where(Vertical).ToList();
        var beams = members.Where(m => !Vertical(m)).ToList();
        var list = new List<Story>();
        for (int s = 1; s < c.Levels.Count; s++)
        {
            double y0 = c.Levels[s - 1], y1 = c.Levels[s];
            var cols = columns.Where(m => Near(model.Nodes[LowerNode(model, m)].Y, y0)).OrderBy(m => model.Nodes[m.Start].X).ToList();
            var spans = new List<double>();
            var above = new List<double>();
            var below = new List<double>();
            for (int j = 0; j + 1 < cols.Count; j++)
            {
                spans.Add(model.Nodes[cols[j + 1].Start].X - model.Nodes[cols[j].Start].X);
                above.Add(BeamI(UpperNode(model, cols[j]), UpperNode(model, cols[j + 1])));
                below.Add(BeamI(LowerNode(model, cols[j]), LowerNode(model, cols[j + 1])));
            }
            list.Add(new Story(s, y0, y1, cols, above, below, spans));
        }
        return list;

        double BeamI(int a, int b) => beams.FirstOrDefault(m => (m.Start == a && m.End == b) || (m.Start == b && m.End == a))?.I ?? 0.0;
        static bool Near(double a, double b) => Math.Abs(a - b) <= 1e-9 * Math.Max(1.0, Math.Abs(a));
    }

    /// <summary>FE story stiffness of every story (story shear / interstory drift, SI) and each story's drift angle (drift / h).</summary>
    internal static (double[] Stiffness, double[] DriftAngle) StoryStiffness(StructureModel model, FrameStoriesCheck c, bool rigidBeams)
    {
        var sub = new SubModel($"{c.Id}: frame alone", model.SourcePath, model.Units);
        var map = new Dictionary<int, int>();
        int N(int n) => map.TryGetValue(n, out int k) ? k : map[n] = sub.NodeAt(model.Nodes[n].X, model.Nodes[n].Y, model.Nodes[n].Id);
        var stories = Stories(model, c);
        var columnMembers = stories.SelectMany(s => s.Columns).ToHashSet();
        // "Rigid" beams: I_b/L at least RigidFactor times the stiffest column's I_c/h (bending only, so the system stays well conditioned).
        double rigidI = RigidFactor * columnMembers.Max(m => m.I / Length(m));
        double Length(Member m) => Math.Sqrt(Math.Pow(model.Nodes[m.End].X - model.Nodes[m.Start].X, 2) + Math.Pow(model.Nodes[m.End].Y - model.Nodes[m.Start].Y, 2));
        foreach (int mi in c.Members)
        {
            var m = model.Members[mi];
            bool beam = !columnMembers.Contains(m);
            sub.Copy(beam && rigidBeams ? m with { I = Math.Max(m.I, rigidI * Length(m)) } : m, N(m.Start), N(m.End));
        }
        foreach (var s in model.Supports.Where(s => map.ContainsKey(s.Node)))
            sub.Support(map[s.Node], s.RestrainX, s.RestrainY, s.RestrainRZ);
        // Joints at each level: the column ends there.
        var joints = new List<int>[c.Levels.Count];
        for (int l = 0; l < c.Levels.Count; l++) joints[l] = [];
        foreach (var st in stories)
            foreach (var col in st.Columns)
            {
                int lo = map[LowerNode(model, col)], hi = map[UpperNode(model, col)];
                if (!joints[st.Number - 1].Contains(lo)) joints[st.Number - 1].Add(lo);
                if (!joints[st.Number].Contains(hi)) joints[st.Number].Add(hi);
            }
        for (int l = 1; l < c.Levels.Count; l++)
            foreach (int j in joints[l]) sub.Load(j, c.Pattern[l - 1] / joints[l].Count);
        var r = LinearStaticAnalysis.Run(sub.Build()).Cases[0];
        double Mean(int l) => joints[l].Average(j => r.Displacement(j, Dof.X));
        var k = new double[stories.Count];
        var angle = new double[stories.Count];
        for (int s = 1; s < c.Levels.Count; s++)
        {
            double shear = c.Pattern.Skip(s - 1).Sum();
            double drift = Mean(s) - Mean(s - 1);
            k[s - 1] = shear / drift;
            angle[s - 1] = drift / (c.Levels[s] - c.Levels[s - 1]);
        }
        return (k, angle);
    }
}
