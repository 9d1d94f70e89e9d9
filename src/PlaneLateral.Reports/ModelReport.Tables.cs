using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>
/// The calculation-package tables of the planar report: every input a checker needs to rebuild the model by hand (nodes,
/// members, supports, loads, combinations, checks declared, panels) and the results to check it against (displacements,
/// reactions by line, member end forces), each in the model's units. Long result tables are cut at
/// <see cref="MaxResultRows"/> rows and <see cref="MaxResultCases"/> cases; the full tables are the CSV files of
/// <c>planelateral solve</c>.
/// </summary>
public static partial class ModelReport
{
    /// <summary>At most this many rows in one result table (nodes, reactions, members of one case).</summary>
    public const int MaxResultRows = 60;

    /// <summary>At most this many load cases and combinations get result tables (model order).</summary>
    public const int MaxResultCases = 12;

    private static IReadOnlyList<string> Row(params string[] cells) => cells;

    /// <summary>An input value to six significant figures (enough to rebuild the model; the file holds the exact value).</summary>
    private static string F6(double v)
    {
        if (!double.IsFinite(v)) return "n/a";
        double a = Math.Abs(v);
        if (a == 0) return "0";
        return a >= 1e-4 && a < 1e7 ? v.ToString("G6", CultureInfo.InvariantCulture) : v.ToString("0.00000E+0", CultureInfo.InvariantCulture);
    }

    /// <summary>A result to four significant figures, or 0 when it is round-off against the largest of its kind in the case
    /// (below 1E-10 of it: what the solver leaves of an exact zero).</summary>
    private static string R(double v, double scale) => Math.Abs(v) <= 1e-10 * scale ? "0" : F(v);

    /// <summary>The provenance: each input file (name only, no folder), its size and SHA-256, and the tool that read it.</summary>
    private static Table Provenance(StructureModel m, string modelFileName, string producedBy)
    {
        var rows = new List<IReadOnlyList<string>>();
        if (m.Inputs.Count == 0)
            rows.Add(Row(modelFileName, "-", "not read from a file: no hash"));
        foreach (var f in m.Inputs)
            rows.Add(Row(Path.GetFileName(f.Path), f.Bytes.ToString(CultureInfo.InvariantCulture), f.Sha256));
        rows.Add(Row("produced by", "", producedBy));
        return new Table("Provenance: the input read (sha256sum of the file prints the same hash) and the tool that read it", ["file", "bytes", "SHA-256"], rows, [1]);
    }

    /// <summary>What each declared comparison check is, in words: "WallLineCheck" → "wall line".</summary>
    private static string CheckKind(ComparisonCheck c)
    {
        string name = c.GetType().Name;
        if (name.EndsWith("Check", StringComparison.Ordinal)) name = name[..^5];
        var sb = new System.Text.StringBuilder();
        foreach (char ch in name)
        {
            if (char.IsUpper(ch) && sb.Length > 0) sb.Append(' ');
            sb.Append(char.ToLowerInvariant(ch));
        }
        return sb.ToString();
    }

    private static string Releases(Member x) => (x.ReleaseStart, x.ReleaseEnd) switch
    {
        (true, true) => "both ends",
        (true, false) => "start",
        (false, true) => "end",
        _ => "-",
    };

    private static string Held(Support s) =>
        string.Join(", ", new[] { (s.RestrainX, "ux"), (s.RestrainY, "uy"), (s.RestrainRZ, "rz") }.Where(x => x.Item1).Select(x => x.Item2)) is { Length: > 0 } h ? h : "none";

    /// <summary>The input tables: nodes, members (geometry; stiffness used), supports, loads, combinations, panels, checks.</summary>
    private static void AddInputTables(List<Block> blocks, ModelResult run)
    {
        var r = run.Analysis;
        var m = r.Model;
        var u = m.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol, mom = u.Label(Quantity.Moment), stress = u.Label(Quantity.Stress), w = u.Label(Quantity.ForcePerLength);
        string L(double si) => F6(u.FromSI(si, Quantity.Length));
        string Fo(double si) => F6(u.FromSI(si, Quantity.Force));
        string Mo(double si) => F6(u.FromSI(si, Quantity.Moment));
        var lines = m.Building.MemberLines.Count == m.Members.Count ? m.Building.MemberLines : m.Members.Select(_ => "").ToList();
        bool anyLine = lines.Any(x => x != "");

        if (m.Nodes.Count > 0)
            blocks.Add(new Table($"Nodes (global x to the right, y up) [{len}]", ["node", "x", "y"],
                m.Nodes.Select(n => Row(n.Id, L(n.X), L(n.Y))).ToList(), [1, 2]));
        if (m.Members.Count > 0)
        {
            blocks.Add(new Table("Members: ends, kind and role (local x from start to end; rigid zones measured along the member from each end)",
                ["member", "start", "end", $"length [{len}]", "kind", "role", .. anyLine ? new[] { "line" } : [], "moment release", $"rigid zone at start [{len}]", $"rigid zone at end [{len}]"],
                m.Members.Select(x =>
                {
                    var a = m.Nodes[x.Start]; var b = m.Nodes[x.End];
                    double l = Math.Sqrt((b.X - a.X) * (b.X - a.X) + (b.Y - a.Y) * (b.Y - a.Y));
                    string kind = x.Kind == MemberKind.Brace ? "axial only" : x.AxiallyRigid ? "beam-column, inextensible" : "beam-column";
                    return (IReadOnlyList<string>)[x.Id, a.Id, b.Id, L(l), kind, x.Role == "" ? "-" : x.Role, .. anyLine ? new[] { lines[x.Index] == "" ? "-" : lines[x.Index] } : [],
                        Releases(x), x.RigidStart > 0 ? L(x.RigidStart) : "0", x.RigidEnd > 0 ? L(x.RigidEnd) : "0"];
                }).ToList(), anyLine ? [3, 8, 9] : [3, 7, 8]));
            var mods = m.Building.Modifiers.Count == m.Members.Count ? m.Building.Modifiers : null;
            blocks.Add(new Table("Members: stiffness used (effective values, the modifiers already applied; A_s the shear area, ∞ when shear deformation is left out)",
                ["member", "section", "material", $"E [{stress}]", $"G [{stress}]", $"A [{u.Label(Quantity.Area)}]", $"I [{u.Label(Quantity.SecondMomentOfArea)}]", $"A_s [{u.Label(Quantity.Area)}]", "modifiers I, A, A_s", "modifiers from"],
                m.Members.Select(x => Row(x.Id, x.SectionId, x.MaterialId, F6(u.FromSI(x.E, Quantity.Stress)), F6(u.FromSI(x.G, Quantity.Stress)),
                    F6(u.FromSI(x.A, Quantity.Area)), F6(u.FromSI(x.I, Quantity.SecondMomentOfArea)),
                    double.IsPositiveInfinity(x.ShearArea) ? "∞" : F6(u.FromSI(x.ShearArea, Quantity.Area)),
                    $"{F6(x.Modifiers.I)}, {F6(x.Modifiers.A)}, {F6(x.Modifiers.ShearArea)}", mods is null ? "the member" : mods[x.Index].Source)).ToList(), [3, 4, 5, 6, 7]));
        }
        if (m.Supports.Count > 0)
            blocks.Add(new Table("Supports (held: the displacement is zero; springs act on the displacements not held)",
                ["node", "kind", "held", $"spring x [{u.Label(Quantity.TranslationalStiffness)}]", $"spring y [{u.Label(Quantity.TranslationalStiffness)}]", $"spring rz [{u.Label(Quantity.RotationalStiffness)}]"],
                m.Supports.Select(s => Row(m.Nodes[s.Node].Id, s.Type, Held(s),
                    s.SpringX > 0 ? F6(u.FromSI(s.SpringX, Quantity.TranslationalStiffness)) : "-", s.SpringY > 0 ? F6(u.FromSI(s.SpringY, Quantity.TranslationalStiffness)) : "-",
                    s.SpringRZ > 0 ? F6(u.FromSI(s.SpringRZ, Quantity.RotationalStiffness)) : "-")).ToList(), [3, 4, 5]));
        if (m.Footings.Count > 0)
            blocks.Add(new Paragraph($"{m.Footings.Count} footing(s) on soil: their sliding and rocking springs are the springs of the supports above (Pais & Kausel 1988, as the methods table cites)."));
        if (m.StiffnessPoints.Count > 0)
            blocks.Add(new Table("Points where the lateral stiffness is reported (1 / displacement under a unit force there)", ["point", "node", "direction"],
                m.StiffnessPoints.Select(p => Row(p.Label, m.Nodes[p.Node].Id, DofNames.Name(p.Direction))).ToList(), []));

        // Loads: every load of every load case, as the file gives it (in model units), and the totals the solver balanced.
        var caseRows = new List<IReadOnlyList<string>>();
        for (int i = 0; i < m.LoadCases.Count; i++)
        {
            var lc = m.LoadCases[i];
            var res = r.Cases.FirstOrDefault(c => c.Id == lc.Id && !c.IsCombination);
            int panelLoads = m.Panels.Sum(p => p.Loads.Count(l => l.Case == i));
            caseRows.Add(Row(lc.Id, lc.Description == "" ? "-" : lc.Description, $"{lc.NodalLoads.Count}", $"{lc.MemberLoads.Count}", $"{panelLoads}",
                res is null ? "-" : Fo(res.Equilibrium.AppliedFx), res is null ? "-" : Fo(res.Equilibrium.AppliedFy)));
        }
        blocks.Add(new Table($"Load cases (ΣFx, ΣFy: the total applied load, member loads integrated) [{force}]", ["case", "description", "nodal loads", "member loads", "panel loads", "ΣFx", "ΣFy"], caseRows, [2, 3, 4, 5, 6]));
        var nodal = m.LoadCases.SelectMany(lc => lc.NodalLoads.Select(l => Row(lc.Id, m.Nodes[l.Node].Id, Fo(l.Fx), Fo(l.Fy), Mo(l.Mz)))).ToList();
        if (nodal.Count > 0)
            blocks.Add(new Table("Nodal loads (global axes; moments counter-clockwise positive)", ["case", "node", $"Fx [{force}]", $"Fy [{force}]", $"Mz [{mom}]"], nodal, [2, 3, 4]));
        var member = m.LoadCases.SelectMany(lc => lc.MemberLoads.Select(l => Row(lc.Id, m.Members[l.Member].Id, l.Axes == LoadAxes.Global ? "global" : "local",
            l.Axes == LoadAxes.Global ? (l.Direction == 0 ? "x" : "y") : (l.Direction == 0 ? "along the member (local x)" : "across the member (local y)"),
            F6(u.FromSI(l.WStart, Quantity.ForcePerLength)), F6(u.FromSI(l.WEnd, Quantity.ForcePerLength))))).ToList();
        if (member.Count > 0)
            blocks.Add(new Table($"Member loads (linear from the start node to the end node, per length of the member) [{w}]", ["case", "member", "axes", "direction", "w at start", "w at end"], member, [4, 5]));
        var panel = m.Panels.SelectMany(p => p.Loads.Select(l => Row(m.LoadCases[l.Case].Id, p.Id, L(l.Level), Fo(l.Fx), Fo(l.Fy), l.Path == PanelLoadPath.Tie ? "through the floor tie" : "spread along the level"))).ToList();
        if (panel.Count > 0)
            blocks.Add(new Table("Story forces on wall panels", ["case", "panel", $"level above the panel base [{len}]", $"Fx [{force}]", $"Fy [{force}]", "applied"], panel, [2, 3, 4]));
        if (m.Combinations.Count > 0)
            blocks.Add(new Table("Combinations (factored sums of load cases, by superposition)", ["combination", "description", "factors"],
                m.Combinations.Select(c => Row(c.Id, c.Description == "" ? "-" : c.Description, string.Join(" + ", c.Factors.Select(f => $"{F6(f.Factor)} × {m.LoadCases[f.Case].Id}")))).ToList(), []));
        if (m.Panels.Count > 0)
            blocks.Add(new Table($"Wall panels (bottom-left corner at x0, y0; openings as left, bottom, width × height from that corner) [{len}]",
                ["panel", "x0", "y0", "length", "height", "thickness", "material", "top", "openings"],
                m.Panels.Select(p => Row(p.Id, L(p.X0), L(p.Y0), L(p.Length), L(p.Height), L(p.Thickness), p.MaterialId, p.Top == PanelTop.Guided ? "guided" : "free",
                    p.Openings.Count == 0 ? "none" : string.Join("; ", p.Openings.Select(o => $"{o.Id}: {L(o.Left)}, {L(o.Bottom)}, {L(o.Width)} × {L(o.Height)}")))).ToList(), [1, 2, 3, 4, 5]));
        if (m.Comparisons.Count > 0)
            blocks.Add(new Table("Comparison checks declared (hand methods to set beside the FE model)", ["check", "kind", "description", "tolerance"],
                m.Comparisons.Select(c => Row(c.Id, CheckKind(c), c.Description == "" ? "-" : c.Description, c.Tolerance is double t ? Pct(t, "0.#") : "the run's default")).ToList(), []));
    }

    /// <summary>The line of each supported node: the lines of the members framing into it ("" when none).</summary>
    private static string NodeLine(StructureModel m, IReadOnlyList<string> lines, int node)
    {
        var at = m.Members.Where(x => x.Start == node || x.End == node).Select(x => lines[x.Index]).Where(x => x != "").Distinct().ToList();
        return at.Count == 0 ? "" : string.Join(" + ", at);
    }

    /// <summary>Displacements, reactions (by line, with subtotals, where the model has lines) and member end forces per case.</summary>
    private static void AddResultTables(List<Block> blocks, AnalysisResult r)
    {
        var m = r.Model;
        var u = m.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol, mom = u.Label(Quantity.Moment);
        var lines = m.Building.MemberLines.Count == m.Members.Count ? m.Building.MemberLines : m.Members.Select(_ => "").ToList();
        bool anyLine = lines.Any(x => x != "");
        var shown = r.Cases.Take(MaxResultCases).ToList();
        string Cut(int count) => count > MaxResultRows ? $"; the first {MaxResultRows} of {count} rows, all of them in the CSV file named above" : "";
        blocks.Add(new Paragraph($"Results of {(shown.Count < r.Cases.Count ? $"the first {shown.Count} of {r.Cases.Count}" : $"all {r.Cases.Count}")} load cases and combinations, in model order. " +
            $"Tables longer than {MaxResultRows} rows are cut; `planelateral solve` writes every row of every case to displacements.csv, reactions.csv and member-forces.csv. " +
            "Displacements and reactions are in global axes (x to the right, y up, rotations and moments counter-clockwise positive). Member end forces act on the member's " +
            "flexible segment at the faces of its rigid zones, in its local axes (x from start to end, y 90° counter-clockwise from x): N1, V1, M1 at the start face and " +
            "N2, V2, M2 at the end face, each positive along local x, local y and counter-clockwise; the axial force as tension-positive is N2 (−N1). A released end carries M = 0."));
        for (int ci = 0; ci < shown.Count; ci++)
        {
            var c = shown[ci];
            string what = c.IsCombination ? "combination" : "load case";
            // The largest of each kind in the case, against which round-off is told from a value.
            double uMax = m.Nodes.Select(n => Math.Max(Math.Abs(c.Displacement(n.Index, Dof.X)), Math.Abs(c.Displacement(n.Index, Dof.Y)))).DefaultIfEmpty(0).Max();
            double rMax = m.Nodes.Select(n => Math.Abs(c.Displacement(n.Index, Dof.RZ))).DefaultIfEmpty(0).Max();
            double fMax = c.MemberForces.SelectMany(f => new[] { f.N1, f.V1, f.N2, f.V2 }).Concat(c.Reactions.SelectMany(x => new[] { x.Fx, x.Fy }))
                .Concat([c.Equilibrium.AppliedFx, c.Equilibrium.AppliedFy]).Select(Math.Abs).DefaultIfEmpty(0).Max();
            double mMax = c.MemberForces.SelectMany(f => new[] { f.M1, f.M2 }).Concat(c.Reactions.Select(x => x.Mz)).Concat([c.Equilibrium.AppliedMz, c.Equilibrium.ReactionMz])
                .Select(Math.Abs).DefaultIfEmpty(0).Max();
            string L(double si) => R(u.FromSI(si, Quantity.Length), u.FromSI(uMax, Quantity.Length));
            string Rot(double v) => R(v, rMax);
            string Fo(double si) => R(u.FromSI(si, Quantity.Force), u.FromSI(fMax, Quantity.Force));
            string Mo(double si) => R(u.FromSI(si, Quantity.Moment), u.FromSI(mMax, Quantity.Moment));
            blocks.Add(new Heading(3, $"Results, {what} {c.Id}"));
            blocks.Add(new Table($"Nodal displacements, {what} {c.Id} (displacements.csv{Cut(m.Nodes.Count)})", ["node", $"ux [{len}]", $"uy [{len}]", "rz [rad]"],
                m.Nodes.Take(MaxResultRows).Select(n => Row(n.Id, L(c.Displacement(n.Index, Dof.X)), L(c.Displacement(n.Index, Dof.Y)), Rot(c.Displacement(n.Index, Dof.RZ)))).ToList(), [1, 2, 3]));
            // Reactions, grouped by line with a subtotal per line when the model has lines, then the total against the load.
            // A wall panel linked to the frame takes its own base reactions: one row per panel, on the panel's line.
            var reactions = c.Reactions.Select(x => (Line: anyLine ? NodeLine(m, lines, x.Node) : "", Where: m.Nodes[x.Node].Id, Order: x.Node, x.Fx, x.Fy, x.Mz))
                .Concat(Enumerable.Range(0, m.Panels.Count).Where(pi => m.Panels[pi].Links.Count > 0 && pi < r.Panels.Count && ci < r.Panels[pi].Analysis.Cases.Count)
                    .Select(pi => (StoryPanels.BaseReaction(r, pi, ci), pi)).Select(x => (Line: anyLine ? StoryPanels.LineOf(m.Panels[x.pi]) : "", Where: $"panel {m.Panels[x.pi].Id} base (moment about its middle)",
                        Order: m.Nodes.Count + x.pi, x.Item1.Fx, x.Item1.Fy, x.Item1.Mz)))
                .OrderBy(x => x.Line, StringComparer.Ordinal).ThenBy(x => x.Order).ToList();
            var rows = new List<IReadOnlyList<string>>();
            foreach (var g in reactions.GroupBy(x => x.Line))
            {
                foreach (var x in g.Take(MaxResultRows))
                    rows.Add(anyLine ? Row(x.Line == "" ? "-" : x.Line, x.Where, Fo(x.Fx), Fo(x.Fy), Mo(x.Mz)) : Row(x.Where, Fo(x.Fx), Fo(x.Fy), Mo(x.Mz)));
                if (anyLine && reactions.Select(x => x.Line).Distinct().Count() > 1)
                    rows.Add(Row($"Σ line {(g.Key == "" ? "-" : g.Key)}", "", Fo(g.Sum(x => x.Fx)), Fo(g.Sum(x => x.Fy)), Mo(g.Sum(x => x.Mz))));
            }
            var eq = c.Equilibrium;
            rows.Add(anyLine ? Row("Σ all", "", Fo(eq.ReactionFx), Fo(eq.ReactionFy), Mo(eq.ReactionMz)) : Row("Σ all", Fo(eq.ReactionFx), Fo(eq.ReactionFy), Mo(eq.ReactionMz)));
            rows.Add(anyLine ? Row("applied load", "", Fo(eq.AppliedFx), Fo(eq.AppliedFy), Mo(eq.AppliedMz)) : Row("applied load", Fo(eq.AppliedFx), Fo(eq.AppliedFy), Mo(eq.AppliedMz)));
            if (reactions.Count > 0)
                blocks.Add(new Table($"Reactions{(anyLine ? " by line" : "")}, {what} {c.Id} (reactions.csv{Cut(c.Reactions.Count)}; moments about the node, the sums' moments about the origin)",
                    anyLine ? ["line", "node", $"Fx [{force}]", $"Fy [{force}]", $"Mz [{mom}]"] : ["node", $"Fx [{force}]", $"Fy [{force}]", $"Mz [{mom}]"], rows,
                    anyLine ? [2, 3, 4] : [1, 2, 3]));
            if (c.MemberForces.Count > 0)
                blocks.Add(new Table($"Member end forces, {what} {c.Id} (member-forces.csv{Cut(c.MemberForces.Count)})",
                    ["member", .. anyLine ? new[] { "line" } : [], $"N1 [{force}]", $"V1 [{force}]", $"M1 [{mom}]", $"N2 [{force}]", $"V2 [{force}]", $"M2 [{mom}]"],
                    c.MemberForces.Take(MaxResultRows).Select(f => (IReadOnlyList<string>)[m.Members[f.Member].Id, .. anyLine ? new[] { lines[f.Member] == "" ? "-" : lines[f.Member] } : [],
                        Fo(f.N1), Fo(f.V1), Mo(f.M1), Fo(f.N2), Fo(f.V2), Mo(f.M2)]).ToList(), anyLine ? [2, 3, 4, 5, 6, 7] : [1, 2, 3, 4, 5, 6]));
        }
        if (shown.Count < r.Cases.Count)
            blocks.Add(new Paragraph($"Cases not tabulated here ({r.Cases.Count - shown.Count}): {string.Join(", ", r.Cases.Skip(MaxResultCases).Select(c => c.Id))}; their results are in the CSV files of `planelateral solve`."));
    }

    /// <summary>Each wall panel's reactions in each case (their sums, beside the loads the panel carries), from its equilibrium check.</summary>
    private static void AddPanelReactions(List<Block> blocks, AnalysisResult r)
    {
        var u = r.Model.Units;
        string force = u.ForceSymbol, mom = u.Label(Quantity.Moment);
        var rows = new List<IReadOnlyList<string>>();
        foreach (var p in r.Panels)
            foreach (var c in p.Analysis.Cases)
            {
                var eq = c.Equilibrium;
                double fMax = new[] { eq.ReactionFx, eq.ReactionFy, eq.AppliedFx, eq.AppliedFy }.Max(Math.Abs), mMax = Math.Max(Math.Abs(eq.ReactionMz), Math.Abs(eq.AppliedMz));
                string Fo(double si) => R(u.FromSI(si, Quantity.Force), u.FromSI(fMax, Quantity.Force));
                string Mo(double si) => R(u.FromSI(si, Quantity.Moment), u.FromSI(mMax, Quantity.Moment));
                rows.Add(Row(c.Id, p.Panel.Id, Fo(eq.ReactionFx), Fo(eq.ReactionFy), Mo(eq.ReactionMz), Fo(eq.AppliedFx), Fo(eq.AppliedFy), Mo(eq.AppliedMz)));
            }
        blocks.Add(new Table("Wall panel reactions: the sums of the panel's reactions (held base nodes or footing springs) beside the loads on the panel (story forces, and link forces for a panel linked to a frame), moments about the origin",
            ["case", "panel", $"Σ Rx [{force}]", $"Σ Ry [{force}]", $"Σ RMz [{mom}]", $"load Fx [{force}]", $"load Fy [{force}]", $"load Mz [{mom}]"], rows, [2, 3, 4, 5, 6, 7]));
    }

    /// <summary>Each lateral case's story shear split among the lines of resistance (models with named lines).</summary>
    private static void AddStoryLines(List<Block> blocks, IReadOnlyList<CaseStories> lateral, UnitSystem u)
    {
        string Fo(double si) => F(u.FromSI(si, Quantity.Force));
        string L(double si) => F(u.FromSI(si, Quantity.Length));
        string K(double si) => F(u.FromSI(si, Quantity.TranslationalStiffness));
        foreach (var cs in lateral)
        {
            if (!cs.Stories.Any(s => s.Lines.Count > 1 || s.Lines.Any(l => l.Line != ""))) continue;
            blocks.Add(new Table($"Story shear by line, {(cs.IsCombination ? "combination" : "load case")} {cs.CaseId} (story-lines.csv; a line's stiffness is its shear over its drift in the whole structure, not the line alone)",
                ["story", "line", $"shear [{u.ForceSymbol}]", "share", $"drift [{u.LengthSymbol}]", $"stiffness [{u.Label(Quantity.TranslationalStiffness)}]"],
                cs.Stories.SelectMany(s => s.Lines.Select(l => Row($"{s.Index}", l.Line == "" ? "(no line)" : l.Line, Fo(l.Shear), Pct(l.Share, "0.0"), L(l.Drift), K(l.Stiffness)))).ToList(),
                [0, 2, 3, 4, 5]));
        }
    }
}
