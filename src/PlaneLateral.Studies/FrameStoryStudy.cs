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

    /// <summary>Name of the reference FE estimate of a frame-stories row.</summary>
    public const string AsBuiltName = "frame members on their supports";

    public static IEnumerable<ComparisonRow> Rows(StructureModel model, FrameStoriesCheck c, double tol, AnalysisOptions options)
    {
        var u = model.Units;
        var stories = Stories(model, c);
        var bases = stories.Select(st => Bases(model, c, st)).ToList();   // refuses (throws) a story no formula here fits
        var (fe, driftRatio) = StoryStiffness(model, c, rigidBeams: false, options);
        var (feRigid, _) = StoryStiffness(model, c, rigidBeams: true, options);
        var members = c.Members.Select(i => model.Members[i]).ToList();
        var columns = stories.SelectMany(st => st.Columns).ToHashSet();
        var effects = Effects(columns, members.Where(m => !columns.Contains(m)).ToList());
        string basis = ReferenceChoice.LineModelsOnly(AsBuiltName, "no plane-stress panel applies to a frame story");
        string pattern = "lateral pattern " + string.Join(", ", c.Pattern.Select(p => ComparisonStudy.G4(u.FromSI(p, Units.Quantity.Force)))) + $" {u.ForceSymbol} at the levels, bottom first, shared equally by each level's column joints";
        foreach (int s in c.Stories)
        {
            var st = stories[s - 1];
            double h = st.Top - st.Bottom;
            var rigid = RigidBeams(st, bases[s - 1]);
            var feAsBuilt = new FeEstimate(AsBuiltName, ComparisonStudy.Stiffness(u, fe[s - 1]),
                $"the check's {c.Members.Count} members with the model's supports, {pattern}; story stiffness = story shear / interstory drift (mean of the joints at each level)");
            var feStiffBeams = new FeEstimate("same frame, beams made rigid", ComparisonStudy.Stiffness(u, feRigid[s - 1]),
                $"as the first, with every beam's I/L raised to {RigidFactor:G3} times the stiffest column's I/h and its shear deformation left out: what is left of the gap is {(effects.Rigid.Count > 0 ? string.Join(" and ", effects.Rigid) : "nothing the hand formula leaves out (these members have neither shear nor axial flexibility)")}");
            string subject = $"story {s} (h = {ComparisonStudy.G4(u.FromSI(h, Units.Quantity.Length))} {u.LengthSymbol})";
            double r1 = fe[s - 1] / rigid.Stiffness;
            yield return new ComparisonRow(c.Id, "frame-stories", subject, ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
                new HandEstimate(ComparisonStudy.Stiffness(u, rigid.Stiffness), rigid.Method),
                [feAsBuilt, feStiffBeams], null, tol, RigidCause(r1, feRigid[s - 1] / rigid.Stiffness, tol, effects.Rigid), basis);
            if (Portal(model, c, st, bases[s - 1], stories.Count) is FrameStoryResult portal)
            {
                double rp = fe[s - 1] / portal.Stiffness;
                yield return new ComparisonRow(c.Id, "frame-stories", subject, ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
                    new HandEstimate(ComparisonStudy.Stiffness(u, portal.Stiffness), portal.Method),
                    [feAsBuilt], null, tol, PortalCause(rp, tol, effects.Portal), basis);
            }
            if (bases[s - 1].Pinned.Distinct().Count() > 1)
                continue;   // no D-value row: the method takes one base condition for the whole ground story (Rows refuses nothing here: the rigid-beam row still holds)
            var dv = DValue(model, c, st, bases[s - 1]);
            double r2 = fe[s - 1] / dv.Stiffness;
            yield return new ComparisonRow(c.Id, "frame-stories", subject, ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
                new HandEstimate(ComparisonStudy.Stiffness(u, dv.Stiffness), dv.Method,
                    Detail: string.Join("\n", dv.Columns.Select((col, j) => $"column {st.Columns[j].Id}: k̄ = {ComparisonStudy.G4(col.BeamToColumnRatio)}, a = {ComparisonStudy.G4(col.Coefficient)}"))),
                [feAsBuilt], null, tol, DValueCause(r2, tol, s, driftRatio, effects.ColumnsAxial), basis);
        }
    }

    /// <summary>A story's column bases: which are free to rotate (pinned support or a moment release at the lower end).</summary>
    internal sealed record StoryBases(bool[] Pinned);

    /// <summary>
    /// The base condition of each column of a story as the model holds it, so the hand formulas follow the model's own
    /// boundary conditions. Above the ground story a column's base is held by the beams below (the rigid-beam row
    /// takes them rigid), unless the column is released there. In the ground story a column stands on a support that
    /// holds x and y: held against rotation (fixed) or free (pinned). Anything else (no support, a roller, a spring, a
    /// released column top) fits no formula here, so the check is refused with the reason.
    /// </summary>
    internal static StoryBases Bases(StructureModel model, FrameStoriesCheck c, Story st)
    {
        var pinned = new bool[st.Columns.Count];
        for (int j = 0; j < st.Columns.Count; j++)
        {
            var col = st.Columns[j];
            int lo = LowerNode(model, col);
            bool releasedLow = lo == col.Start ? col.ReleaseStart : col.ReleaseEnd;
            bool releasedTop = lo == col.Start ? col.ReleaseEnd : col.ReleaseStart;
            if (releasedTop)
                throw ComparisonStudy.Problem(c, $"column \"{col.Id}\" is released at its top in story {st.Number}: the rigid-beam, portal and D-value formulas all take the column held by the beams at its top",
                    "leave the column out of the check, or model the joint as it is and compare another way");
            if (st.Number > 1) { pinned[j] = releasedLow; continue; }
            var sup = model.Supports.FirstOrDefault(x => x.Node == lo);
            string where = $"column \"{col.Id}\" at node \"{model.Nodes[lo].Id}\"";
            if (sup is null)
                throw ComparisonStudy.Problem(c, $"{where} stands on no support: the story formulas need every ground-story column on a support",
                    "add a fixed or pinned support at the column base, or start the check's levels where the columns are supported");
            if (!sup.RestrainX || !sup.RestrainY)
                throw ComparisonStudy.Problem(c, $"{where} stands on a support that does not hold it in x and y (\"{sup.Type}\"): no story formula here takes a sliding or spring base",
                    "give the column a fixed or pinned support, or compare this frame another way");
            if (!sup.RestrainRZ && sup.SpringRZ > 0 && !releasedLow)
                throw ComparisonStudy.Problem(c, $"{where} stands on a rotational spring: the story formulas take a base either fixed or pinned",
                    "compare the frame with the base fixed or pinned, or leave the hand rows aside for this model");
            pinned[j] = releasedLow || !sup.RestrainRZ;
        }
        return new StoryBases(pinned);
    }

    /// <summary>
    /// The effects the FE members have that the hand formulas (flexure of prismatic members, axially rigid, zero-size
    /// joints) leave out, named only where the members actually have them.
    /// </summary>
    /// <param name="Rigid">Left in the FE model when the beams are made rigid (and shear-rigid).</param>
    /// <param name="Portal">Left out by slope-deflection (every member's shear and axial flexibility, rigid end zones).</param>
    /// <param name="ColumnsAxial">True when the columns shorten and lengthen axially.</param>
    internal sealed record FrameEffects(IReadOnlyList<string> Rigid, IReadOnlyList<string> Portal, bool ColumnsAxial, bool RigidZones);

    internal static FrameEffects Effects(IReadOnlyCollection<Member> columns, IReadOnlyCollection<Member> beams)
    {
        static bool Shear(Member m) => double.IsFinite(m.ShearArea) && m.ShearArea > 0;
        static bool Axial(Member m) => double.IsFinite(m.A);
        static bool Zones(Member m) => m.RigidStart > 0 || m.RigidEnd > 0;
        bool colShear = columns.Any(Shear), colAxial = columns.Any(Axial), beamShear = beams.Any(Shear), beamAxial = beams.Any(Axial);
        bool zones = columns.Concat(beams).Any(Zones);
        var rigid = new List<string>();
        if (colShear) rigid.Add("column shear deformation");
        if (colAxial) rigid.Add("column axial shortening under overturning");
        if (beamAxial) rigid.Add("beam axial stretching");
        var portal = new List<string>();
        if (colShear || beamShear) portal.Add(colShear && beamShear ? "shear deformation of columns and beam" : colShear ? "column shear deformation" : "beam shear deformation");
        if (colAxial || beamAxial) portal.Add(colAxial && beamAxial ? "axial deformation of columns and beam" : colAxial ? "column axial shortening under overturning" : "beam axial stretching");
        return new FrameEffects(rigid, portal, colAxial, zones);
    }

    /// <summary>
    /// The one-bay portal by slope-deflection (FrameStory.PortalFixedBase / PortalPinnedBase), where the check is one
    /// story of two columns of equal E·I on the same base condition (both fixed or both pinned) and one beam; null otherwise.
    /// β takes the beam's own modulus: (E_b·I_b/L)/(E_c·I_c/h).
    /// </summary>
    internal static FrameStoryResult? Portal(StructureModel model, FrameStoriesCheck c, Story st, StoryBases bases, int storyCount)
    {
        if (storyCount != 1 || st.Columns.Count != 2 || st.BeamIAbove.Count != 1 || st.BeamIAbove[0] <= 0) return null;
        var (a, b) = (st.Columns[0], st.Columns[1]);
        if (Math.Abs(a.E * a.I - b.E * b.I) > 1e-9 * a.E * a.I || bases.Pinned[0] != bases.Pinned[1]) return null;
        var beam = c.Members.Select(i => model.Members[i]).First(m => !st.Columns.Contains(m) && m.I == st.BeamIAbove[0]);
        double h = st.Top - st.Bottom, span = st.Spans[0];
        double beamI = st.BeamIAbove[0] * beam.E / a.E;   // the formula's one E: the beam's I scaled to the columns' modulus
        return bases.Pinned[0] ? FrameStory.PortalPinnedBase(a.E, a.I, h, beamI, span) : FrameStory.PortalFixedBase(a.E, a.I, h, beamI, span);
    }

    /// <summary>Cause rules for the portal row: the effects slope-deflection leaves out, named only where the members have them.</summary>
    internal static string PortalCause(double ratio, double tol, IReadOnlyList<string> effects)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        string present = effects.Count > 0 ? string.Join(" and ", effects) : "";
        if (v == Verdict.WithinTolerance)
            return effects.Count > 0
                ? $"slope-deflection holds: the FE members' {present}, which it leaves out, are small here"
                : "same beam theory on both sides (flexure, axially rigid members, rigid joints), so agreement checks the arithmetic, not the theory";
        if (v == Verdict.HandHigher)
            return effects.Count > 0
                ? $"frame softer than slope-deflection: the FE members have {present}, which the formula leaves out"
                : "frame softer than slope-deflection though its members have no shear or axial flexibility the formula leaves out: check the member list and supports";
        return "frame stiffer than slope-deflection: something in the listed members (rigid end zones, extra members) restrains the sway; check the member list";
    }

    /// <summary>Cause rules for the rigid-beam row (docs/comparisons.md).</summary>
    /// <param name="remaining">What the FE model with rigid beams still has that the formula leaves out (<see cref="FrameEffects.Rigid"/>).</param>
    internal static string RigidCause(double ratio, double ratioRigidBeams, double tol, IReadOnlyList<string> remaining)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        if (v == Verdict.WithinTolerance) return "beams stiff enough for the rigid-beam assumption";
        if (v == Verdict.HandLower) return "the frame is stiffer than rigid beams allow: something else in the listed members restrains the story; check the member list";
        double beamPart = ratioRigidBeams - ratio;   // share of the hand value lost to beam bending
        double otherPart = 1 - ratioRigidBeams;      // lost to what the members have beyond flexure
        if (beamPart >= otherPart)
            return $"beam flexibility: rigid-beam assumption is too stiff (with rigid beams the FE gives {ComparisonStudy.Pct(ratioRigidBeams)} of the hand value)";
        return remaining.Count > 0
            ? $"{string.Join(" and ", remaining)}: with rigid beams the FE still gives only {ComparisonStudy.Pct(ratioRigidBeams)} of the hand value"
            : $"with rigid beams the FE still gives only {ComparisonStudy.Pct(ratioRigidBeams)} of the hand value, though these members have neither shear nor axial flexibility: check the member list and supports";
    }

    /// <summary>
    /// Cause rules for the D-value row (docs/comparisons.md). The method assumes the stories next to this one drift at
    /// the same angle, so they share the beams' restraint equally; the FE drift angles of the neighbours say how far
    /// that holds. <paramref name="driftRatio"/> holds each story's FE drift angle (drift/h), story 1 first.
    /// </summary>
    internal static string DValueCause(double ratio, double tol, int story, IReadOnlyList<double> driftRatio, bool columnsAxial = true)
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
            return $"frame softer than the D-value: {m.Name} drifts {G(m.Relative)} times this story's angle, so it restrains the shared joints less than the method's equal-drift assumption{(columnsAxial ? "; the columns also shorten axially under overturning" : "")}";
        return columnsAxial
            ? "frame softer than the D-value: the columns shorten axially under overturning, which the method leaves out"
            : "frame softer than the D-value: its joints rotate more than the method's equal-rotation assumption allows (the columns are axially rigid, so not from their shortening)";
    }

    internal static FrameStoryResult RigidBeams(Story st, StoryBases bases)
    {
        var cols = st.Columns.Select((m, j) => double.IsFinite(m.ShearArea)
            ? new FrameColumn(m.E, m.I, m.G, m.ShearArea, bases.Pinned[j])
            : new FrameColumn(m.E, m.I, PinnedBase: bases.Pinned[j])).ToArray();
        return FrameStory.RigidBeams(st.Top - st.Bottom, cols);
    }

    internal static DValueResult DValue(StructureModel model, FrameStoriesCheck c, Story st, StoryBases bases)
    {
        StoryPosition pos = StoryPosition.Upper;
        if (st.Number == 1) pos = bases.Pinned[0] ? StoryPosition.PinnedBase : StoryPosition.FixedBase;
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
    internal static (double[] Stiffness, double[] DriftAngle) StoryStiffness(StructureModel model, FrameStoriesCheck c, bool rigidBeams, AnalysisOptions options)
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
            sub.Copy(beam && rigidBeams ? m with { I = Math.Max(m.I, rigidI * Length(m)), ShearArea = double.PositiveInfinity } : m, N(m.Start), N(m.End));
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
        var r = LinearStaticAnalysis.Run(sub.Build(), options).Cases[0];
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
