using PlaneLateral.Analysis;
using PlaneLateral.Studies;

namespace PlaneLateral.Reports;

public static partial class BuildingReport
{
    /// <summary>One story of one case: the story shears and torque about the origin, the same summed over the lines, and their relative residual.</summary>
    internal sealed record StoryBalanceRow(string Case, int Story, double Vx, double LinesVx, double Vy, double LinesVy, double Mz, double LinesMz, double Residual);

    /// <summary>
    /// Σ line story shears against the story shear, every story of every case: a line's shear V along its direction α at
    /// lever r gives V·cos α, V·sin α and V·r about the origin, so Σ over the lines must equal (Vx, Vy, Mz) of the floor
    /// loads above the cut (equilibrium of the part above the cut — derived). Residual: the largest difference of the three
    /// (torques over the plan size) over the largest of them.
    /// </summary>
    internal static IReadOnlyList<StoryBalanceRow> StoryBalance(PlanResult r)
    {
        var p = r.Plan;
        double size = p.Size;
        var lines = p.Lines.ToDictionary(l => l.Id);
        var list = new List<StoryBalanceRow>();
        foreach (var c in r.Cases)
            foreach (var st in c.Stories)
            {
                double fx = 0, fy = 0, mz = 0;
                foreach (var ls in c.LineStories.Where(x => x.Story == st.Story))
                {
                    var l = lines[ls.Line];
                    fx += ls.Shear * l.Cos; fy += ls.Shear * l.Sin; mz += ls.Shear * l.Lever;
                }
                double scale = Math.Max(Math.Max(Math.Abs(st.Vx), Math.Abs(st.Vy)), Math.Abs(st.Mz) / size);
                double diff = Math.Max(Math.Max(Math.Abs(fx - st.Vx), Math.Abs(fy - st.Vy)), Math.Abs(mz - st.Mz) / size);
                list.Add(new StoryBalanceRow(c.Case.Id, st.Story, st.Vx, fx, st.Vy, fy, st.Mz, mz, scale > 0 ? diff / scale : diff));
            }
        return list;
    }

    private static IReadOnlyList<StoryBalanceRow> StoryBalance(Doc d) => StoryBalance(d.R);

    /// <summary>The cases in groups: the case the file names with its twins (and, for the seismic block, one group per direction).</summary>
    private static IEnumerable<IGrouping<(string Family, string Direction), PlanCaseResult>> Groups(PlanResult r) =>
        r.Cases.GroupBy(c => (c.Case.Family, c.Case.Direction));

    private static string GroupName((string Family, string Direction) g) => g.Direction == "" ? $"case {g.Family}" : $"cases {g.Family} along {g.Direction}";

    /// <summary>Short cause of a gap between the hand split and the FE: which part (direct or torsional) makes most of it.</summary>
    internal static string Cause(PlanSplitRow x)
    {
        if (!double.IsFinite(x.Gap)) return "no hand share";
        if (Math.Abs(x.Gap) <= 1e-6) return "agree";
        return Math.Abs(x.FeDirect - x.HandDirect) >= Math.Abs(x.FeTorsional - x.HandTorsional) ? "direct part" : "torsional part";
    }

    private static void Results(Doc d)
    {
        var r = d.R;
        var p = d.P;

        // Checks of every solve.
        d.Heading("Checks of the solution");
        d.Text("For each case: the floor loads summed (ΣFx, ΣFy, ΣMz about the origin) against the forces the lines take (imbalance: the largest difference " +
            "over the largest force, torques over the plan size), and the backward error ‖K·u − f‖/(‖K‖·‖u‖ + ‖f‖) of the floor solve. " +
            $"Limits called passed: imbalance ≤ {Sci(RunSummary.ImbalanceLimit)}, backward error ≤ {Sci(RunSummary.BackwardErrorLimit)} (common practice in double precision).");
        d.Table("Checks of every floor solve", ["case", $"ΣFx [{d.Force}]", $"ΣFy [{d.Force}]", $"ΣMz [{d.MomentUnit}]", "imbalance", "backward error", "verdict"],
            r.Cases.Select(c => (IReadOnlyList<string>)[c.Case.Id, d.Fo(c.Equilibrium.AppliedFx), d.Fo(c.Equilibrium.AppliedFy), d.M(c.Equilibrium.AppliedMz),
                Sci(c.Equilibrium.RelativeError), Sci(c.BackwardError),
                c.Equilibrium.RelativeError <= RunSummary.ImbalanceLimit && c.BackwardError <= RunSummary.BackwardErrorLimit ? "passed" : "look"]), 1, 2, 3, 4, 5);
        d.Table("Checks of each line's condensation and recovery", ["line", "flexibility symmetry", "condensation backward error", "level recovery error", "solver"],
            r.Lines.Select(l => (IReadOnlyList<string>)[l.Line.Id, Sci(l.SymmetryError), Sci(l.CondensationBackwardError), Sci(l.RecoveryError),
                Output.MachineFree.Solver(l.Recovered.Solve.Solver)]), 1, 2, 3);
        d.Text("Symmetry: the largest |F_ij − F_ji| of the line's flexibility on its levels over its largest entry; recovery: the largest difference between the line's " +
            "level displacements solved again in its own planar model and the floor's, over the largest.");
        var balance = StoryBalance(d);
        d.Table("Σ line story shears against the story shear, every story of every case", ["case", "story", $"Vx [{d.Force}]", $"Σ lines [{d.Force}]", $"Vy [{d.Force}]", $"Σ lines [{d.Force}]",
                $"Mz [{d.MomentUnit}]", $"Σ lines [{d.MomentUnit}]", "residual"],
            balance.Select(b => (IReadOnlyList<string>)[b.Case, I(b.Story), d.Fo(b.Vx), d.Fo(b.LinesVx), d.Fo(b.Vy), d.Fo(b.LinesVy), d.M(b.Mz), d.M(b.LinesMz), Sci(b.Residual)]),
            1, 2, 3, 4, 5, 6, 7, 8);
        d.Text("A line's story shear V along its direction α at lever r contributes V·cos α, V·sin α and V·r; summed over the lines they must give the shears and the torque " +
            "(about the origin) of the floor loads above the cut. Residual: the largest difference over the largest of the three (torques over the plan size).");

        // Floor motions.
        d.Heading("Floor motions");
        d.Text("Ux, Uy of the plan origin and the turn Rz of each floor (a point (x, y) of the floor moves ux = Ux − Rz·y, uy = Uy + Rz·x), and the motion of its centre of mass.");
        foreach (var g in Groups(r))
            d.Table($"Floor motions, {GroupName(g.Key)}", ["case", "level", $"Ux [{d.Len}]", $"Uy [{d.Len}]", "Rz [rad]", $"ux at centre of mass [{d.Len}]", $"uy at centre of mass [{d.Len}]"],
                g.SelectMany(c => c.Motion.OrderByDescending(m => m.Level).Select(m =>
                {
                    var (ux, uy) = m.At(p.Levels[m.Level].CentreOfMass);
                    return (IReadOnlyList<string>)[c.Case.Id, d.Level(m.Level), d.L(m.Ux), d.L(m.Uy), Sci(m.Rz), d.L(ux), d.L(uy)];
                })), 2, 3, 4, 5, 6);

        // Story shear per line.
        d.Heading("Story shear per line");
        d.Text("A line's story shear is the sum of the level forces on it above the cut, along its direction. Direct: the same loads with every floor held against " +
            "turning; torsional: what the turn adds (shear = direct + torsional). Share: the line's shear over the story shear along its direction. The columns " +
            "to the right give the line's shear in each twin of the case (accidental eccentricity); plan-line-stories.csv, written by the solve command, holds every " +
            "number of this section with the shear from the recovered planar model beside it.");
        foreach (var g in Groups(r))
        {
            var list = g.ToList();
            var first = list[0];
            var twins = list.Skip(1).ToList();
            d.Table($"Story shear per line, {GroupName(g.Key)}: {first.Case.Id} with its direct and torsional parts{(twins.Count > 0 ? ", then the twins" : "")}",
                ["story", "line", "along", $"{first.Case.Id} [{d.Force}]", "share", $"direct [{d.Force}]", $"torsional [{d.Force}]", .. twins.Select(t => $"{t.Case.Id} [{d.Force}]")],
                first.LineStories.OrderByDescending(s => s.Story).Select(s => (IReadOnlyList<string>)[I(s.Story), s.Line, d.Line(s.Line).DirectionLabel, d.Fo(s.Shear),
                    double.IsFinite(s.Share) ? Ratio(s.Share) : "-", d.Fo(s.Direct), d.Fo(s.Torsional),
                    .. twins.Select(t => d.Fo(t.LineStories.First(x => x.Story == s.Story && x.Line == s.Line).Shear))]),
                [0, .. Enumerable.Range(3, 4 + twins.Count)]);
        }

        // Centre of rigidity.
        if (r.Rigidity.Count > 0)
        {
            d.Heading("Centre of rigidity per story");
            d.Text("Hand definition: from each line's story stiffness alone (the line by itself under the direction's floor-force pattern, story shear over story drift), " +
                "x_R = Σk_y·x / Σk_y, y_R = Σk_x·y / Σk_x for orthogonal lines (in general the point about which the lines' stiffness couples no turn). " +
                "In a building of several stories it depends on the story and the load pattern; the FE solution does not use it.");
            d.Table("Centre of rigidity and centre of mass", ["loading along", "story", $"x_R [{d.Len}]", $"y_R [{d.Len}]", $"x_M [{d.Len}]", $"y_M [{d.Len}]", $"x_M − x_R [{d.Len}]", $"y_M − y_R [{d.Len}]"],
                r.Rigidity.Select(g =>
                {
                    var cm = p.Levels[g.Story].CentreOfMass;
                    return (IReadOnlyList<string>)[g.Direction, I(g.Story), d.L(g.XR), d.L(g.YR), d.L(cm.X), d.L(cm.Y), d.L(cm.X - g.XR), d.L(cm.Y - g.YR)];
                }), 1, 2, 3, 4, 5, 6, 7);
            d.Table("Each line's story stiffness alone", ["loading along", "story", .. p.Lines.Select(l => $"{l.Id} [{d.StiffUnit}]")],
                r.Rigidity.Select(g => (IReadOnlyList<string>)[g.Direction, I(g.Story), .. p.Lines.Select(l => g.Lines.FirstOrDefault(x => x.Line == l.Id) is { } k ? d.K(k.Stiffness) : "-")]),
                [1, .. Enumerable.Range(2, p.Lines.Count)]);
        }

        HandSplit(d);
        Drifts(d);
    }

    private static void HandSplit(Doc d)
    {
        var hand = d.Run.Hand;
        if (hand.Count == 0) return;
        d.Heading("Hand split beside the FE building");
        d.Text("Hand: relative rigidity with torsion (Taly 2010, §7.9, eqs. 7.72–7.75) from each line's story stiffness alone and the story's shears and torque: " +
            "direct part V·k/Σk along the loading, torsional part k·d·T/J about the story's centre of rigidity. Design: the total, except that a torsional part that " +
            "lowers the shear is not taken. FE: the building solved as a whole, the reference. gap = FE total / hand total − 1. Cause: the part (direct or torsional) " +
            "that makes most of the difference. A direct part that differs means the line's stiffness in the building is not its stiffness alone (lines of " +
            "different kinds share the floors differently from story to story; stories couple through each line); a torsional part that differs means the story's " +
            "centre of rigidity and torsional stiffness in the building are not the hand values (they depend on the story and the load, Goel & Chopra 1993). " +
            "For one story of lines with one stiffness each the two agree exactly.");
        var caseGroup = Groups(d.R).SelectMany(g => g.Select(c => (c.Case.Id, g.Key))).ToDictionary(x => x.Id, x => x.Key);
        foreach (var g in hand.GroupBy(s => caseGroup[s.Case]))
            d.Table($"Hand beside FE, {GroupName(g.Key)}", ["case", "story", "line", $"k alone [{d.StiffUnit}]", $"d [{d.Len}]", $"hand direct [{d.Force}]", $"hand torsional [{d.Force}]",
                    $"hand total [{d.Force}]", $"hand design [{d.Force}]", $"FE direct [{d.Force}]", $"FE torsional [{d.Force}]", $"FE total [{d.Force}]", "gap", "cause"],
                g.OrderBy(s => s.Case, StringComparer.Ordinal).ThenByDescending(s => s.Story).SelectMany(s => s.Rows.Select(x => (IReadOnlyList<string>)[x.Case, I(x.Story), x.Line,
                    d.K(x.LineStiffness), d.L(x.Distance), d.Fo(x.HandDirect), d.Fo(x.HandTorsional), d.Fo(x.HandTotal), d.Fo(x.HandDesign),
                    d.Fo(x.FeDirect), d.Fo(x.FeTorsional), d.Fo(x.FeTotal), double.IsFinite(x.Gap) ? Pct(x.Gap, "+0.0;-0.0;0.0") : "-", Cause(x)])),
                1, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12);
        d.Table("Centre of rigidity, torsional stiffness and torque of the hand split", ["case", "story", $"x_R [{d.Len}]", $"y_R [{d.Len}]", $"J = Σk·d² [{d.MomentUnit}/rad]", $"T about the centre of rigidity [{d.MomentUnit}]"],
            hand.Select(s => (IReadOnlyList<string>)[s.Case, I(s.Story), d.L(s.XR), d.L(s.YR), d.M(s.J),
                d.M(s.Torque)]), 1, 2, 3, 4, 5);

        // Floors held against turning: the twins differ from their case only by a torque, which a locked floor does not feel.
        var locked = hand.Where(s => d.R.Case(s.Case).Case.Eccentricity == 0).ToList();
        if (locked.Count > 0)
        {
            d.Sub("Floors held against turning");
            d.Text("The same split with every floor held against turning (Rz = 0), hand (V·k/Σk along the loading) beside the FE building with the turn locked. " +
                "The twins of a case differ from it only by a torque, which a locked floor does not feel, so the cases at the centres of mass are shown.");
            d.Table("Rotation-locked split beside FE", ["case", "story", "line", $"hand [{d.Force}]", $"FE, turn locked [{d.Force}]", "gap"],
                locked.OrderByDescending(s => s.Story).SelectMany(s => s.Rows.Select(x => (IReadOnlyList<string>)[x.Case, I(x.Story), x.Line, d.Fo(x.HandDirect), d.Fo(x.FeDirect),
                    x.HandDirect != 0 ? Pct(x.FeDirect / x.HandDirect - 1, "+0.0;-0.0;0.0") : "-"])), 1, 3, 4, 5);
        }
    }

    private static void Drifts(Doc d)
    {
        var r = d.R;
        var p = d.P;
        d.Heading("Corner drifts and the drift check");
        d.Text("Story drift at each outline corner: the displacement of the floor above minus that of the floor below at the same plan point, as a vector in plan. " +
            "Per case and story the corner with the largest drift; plan-corners.csv, written by the solve command, holds every corner.");
        d.Table("Largest corner drift per case and story", ["case", "story", "corner", $"x [{d.Len}]", $"y [{d.Len}]", $"drift x [{d.Len}]", $"drift y [{d.Len}]", $"drift [{d.Len}]", "drift / height"],
            r.Cases.SelectMany(c => c.Vertices.GroupBy(v => v.Level).OrderByDescending(g => g.Key).Select(g =>
            {
                var v = g.OrderByDescending(v => Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY)).ThenBy(v => v.Vertex).First();
                double dr = Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY);
                double h = p.Levels[v.Level].Elevation - p.Levels[v.Level - 1].Elevation;
                return (IReadOnlyList<string>)[c.Case.Id, I(v.Level), I(v.Vertex + 1), d.L(v.At.X), d.L(v.At.Y), d.L(v.DriftX), d.L(v.DriftY), d.L(dr), Sci(dr / h)];
            })), 1, 2, 3, 4, 5, 6, 7, 8);
        if (r.DriftChecks.Count > 0 && p.DriftLimit is { } lim)
        {
            int over = r.DriftChecks.Count(x => !x.Within);
            d.Text($"δ = C_d·δ_e/I_e (ASCE 7-16 eq. 12.8-15) with C_d = {Ratio(lim.Cd, "0.###")}, I_e = {Ratio(lim.Ie, "0.###")}, at every corner of every story in every case " +
                $"({r.DriftChecks.Count} results, {over} exceeding the allowable {Ratio(lim.AllowedRatio, "0.####")}); below, the governing result of each story. " +
                "plan-drift-checks.csv holds them all.");
            d.Add(ReportTables.From(Output.PlanTableViews.GoverningDriftChecks(r, cornersOnly: false, topFirst: true), "Corner drift check, governing result per story (plan-drift-checks.csv)",
                ["story", "case", "corner", "x", "y", "elastic drift", "amplified drift", "height", "ratio", "allowed", "result"]));
        }
        if (r.Irregularity.Count > 0)
        {
            d.Sub("Torsional irregularity");
            d.Text("Per story and direction of loading, the largest story drift along the loading at the outline's corners over the average of the two extreme corners, with " +
                "accidental torsion (the worst of the shifted cases), ASCE 7-16 Table 12.3-1: Type 1a above 1.2, Type 1b above 1.4 (rigid and semi-rigid floors). " +
                "A_x = (δ_max/1.2·δ_avg)², 1 ≤ A_x ≤ 3, on the displacements of the story's top level (§12.8.4.3, eq. 12.8-14).");
            d.Add(ReportTables.From(Output.PlanFiles.IrregularityTable(r), "Torsional irregularity", ["loading", "story", "governing case", "max corner drift",
                "average of the extreme corners", "ratio", "type (ASCE 7-16 Table 12.3-1)", "max corner displacement", "average displacement", "A_x (eq. 12.8-14)"]));
        }
    }
}
