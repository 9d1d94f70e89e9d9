using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The console summary of a building in plan (docs/plan.md): reads a <see cref="PlanResult"/>, prints tables of at most 100 columns.</summary>
internal static class PlanReport
{
    /// <param name="tributary">The run's hand tributary split beside the FE flexible floor (<see cref="PlanRun.Tributary"/>).</param>
    public static string Render(PlanResult r, IReadOnlyList<PlanSplitStory> hand, IReadOnlyList<TributaryShear> tributary, string path, Detail detail = Detail.Normal)
    {
        var p = r.Plan;
        var u = p.Units;
        string len = u.LengthSymbol, force = u.ForceSymbol;
        string L(double v) => TextTable.Num(u.FromSI(v, Quantity.Length));
        string Fo(double v) => TextTable.Num(u.FromSI(v, Quantity.Force));
        var sb = new StringBuilder();
        sb.Append($"Building  {p.Title}\n");
        sb.Append($"File      {path}\n");
        sb.Append($"Units     force {force}, length {len}\n");
        sb.Append($"Size      {p.FloorCount} floors, {p.Lines.Count} lines of resistance, {p.Cases.Count} load cases, accidental eccentricity {p.EccentricityRatio:0.###}\n");
        sb.Append($"Method    each line condensed exactly on its {p.FloorCount} level DOF{(p.FloorCount == 1 ? "" : "s")} (one factorisation per line),\n" +
                  "          floors solved on (Ux, Uy, Rz), each line's planar model recovered under the level forces\n");

        sb.Append("\nLines of resistance\n");
        var lt = new TextTable("line", "form", $"x [{len}]", $"y [{len}]", "direction", "members", $"level recovery error").Numeric(2, 3, 5, 6);
        foreach (var l in r.Lines)
            lt.Add(l.Line.Id, l.Line.Form switch { PlanLineForm.Wall => l.Line.Panel >= 0 ? "wall (panel)" : "wall", PlanLineForm.StoryStiffness => "story stiffness", PlanLineForm.File => "model file", _ => "model" },
                L(l.Line.X0), L(l.Line.Y0), l.Line.DirectionLabel,
                l.Line.Panel >= 0 ? $"panel, {l.Recovered.Panels[l.Line.Panel].Mesh.Mesh.Elements.Length} el." : l.Line.Model.Members.Count.ToString(), TextTable.Sci(l.RecoveryError));
        sb.Append(lt.Render());

        sb.Append("\nChecks of every floor solve (line forces against floor loads)\n");
        sb.Append(TableView.Render(PlanFiles.ChecksTable(r), ["what", "applied Fx", "applied Fy", "applied Mz about origin", "relative imbalance", "backward error"],
            row => ((string)row[0]).StartsWith("case ", StringComparison.Ordinal)));

        // Normal detail: the cases without accidental eccentricity; full: every case, the shifted ones too.
        var lineStories = PlanFiles.LineStoriesTable(r);
        foreach (var c in r.Cases.Where(c => c.Case.Eccentricity == 0 || detail == Detail.Full))
        {
            sb.Append($"\nStory shear per line, case {c.Case.Id}: {c.Case.Description}\n" +
                "  direct: floors held against twist; torsional: what the twist adds\n");
            string id = c.Case.Id;
            sb.Append(TableView.Render(lineStories.WithRows(rows => rows.Where(x => (string)x[0] == id).OrderByDescending(x => (int)x[1])),
                ["story", "line", "direction", "shear", "share", "direct", "torsional"]));
        }

        if (detail == Detail.Full) sb.Append(FloorMotion(r));

        var governing = r.Irregularity.Select(t => t.Case).Distinct().ToList();
        foreach (var id in governing)
        {
            var story = hand.Where(h => h.Case == id).OrderByDescending(h => h.Story).ToList();
            if (story.Count == 0) continue;
            sb.Append($"\nHand (relative rigidity with torsion) beside FE, case {id}\n");
            var t = new TextTable("story", "line", $"hand direct", "hand tors.", "hand total", "hand design", "FE direct", "FE total", "gap").Numeric(0, 2, 3, 4, 5, 6, 7, 8);
            foreach (var s in story)
                foreach (var row in s.Rows)
                    t.Add(s.Story.ToString(), row.Line, Fo(row.HandDirect), Fo(row.HandTorsional), Fo(row.HandTotal), Fo(row.HandDesign), Fo(row.FeDirect), Fo(row.FeTotal),
                        double.IsFinite(row.Gap) ? $"{100 * row.Gap:+0.0;-0.0;0.0}%" : "-");
            sb.Append(t.Render());
        }
        sb.Append($"  Shears in {force}. Hand: each line's story stiffness from the line alone; design = total,\n" +
                  "  except that a torsional part that reduces a line's shear is not taken. Direct columns: floors\n" +
                  "  held against twist (what one planar direction gives). gap = FE total / hand total - 1: the line\n" +
                  "  stiffness changes with the story (wall-frame interaction) and the centre of rigidity depends on\n" +
                  "  the story and the load; for one story of lines with one stiffness each the two agree.\n");

        if (r.Rigidity.Count > 0)
        {
            sb.Append("\nCentre of rigidity per story (hand definition, lines' story stiffness alone) and centre of mass\n");
            var t = new TextTable("loading", "story", $"x_R [{len}]", $"y_R [{len}]", $"x_M [{len}]", $"y_M [{len}]").Numeric(1, 2, 3, 4, 5);
            foreach (var g in r.Rigidity)
            {
                var cm = p.Levels[g.Story].CentreOfMass;
                t.Add(g.Direction, g.Story.ToString(), L(g.XR), L(g.YR), L(cm.X), L(cm.Y));
            }
            sb.Append(t.Render());
        }

        if (r.Irregularity.Count > 0)
        {
            sb.Append("\nTorsional irregularity (ASCE 7-16 Table 12.3-1: 1a above 1.2, 1b above 1.4; A_x eq. 12.8-14)\n");
            sb.Append(TableView.Render(PlanFiles.IrregularityTable(r), ["loading", "story", "governing case", "max corner drift", "average of the extreme corners", "ratio",
                "type (ASCE 7-16 Table 12.3-1)", "A_x (eq. 12.8-14)"]));
            sb.Append("  Drifts along the loading at the outline corners, with accidental torsion (worst shifted case).\n");
        }

        sb.Append("\nCorner drifts (largest drift in plan at an outline corner, per story)\n");
        var dt = new TextTable("case", "story", "corner", $"x [{len}]", $"y [{len}]", $"drift [{len}]", "drift / height").Numeric(1, 2, 3, 4, 5, 6);
        foreach (var c in r.Cases.Where(c => governing.Contains(c.Case.Id)))
            foreach (var g in c.Vertices.GroupBy(v => v.Level).OrderByDescending(g => g.Key))
            {
                var v = g.OrderByDescending(v => Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY)).ThenBy(v => v.Vertex).First();
                double d = Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY);
                double h = p.Levels[v.Level].Elevation - p.Levels[v.Level - 1].Elevation;
                dt.Add(c.Case.Id, v.Level.ToString(), (v.Vertex + 1).ToString(), L(v.At.X), L(v.At.Y), L(d), TextTable.Sci(d / h));
            }
        sb.Append(dt.Render());

        if (p.Points.Count > 0)
        {
            sb.Append("\nNamed points (\"points\"): displacement and story drift at each floor (all cases in plan-points.csv)\n");
            var qt = new TextTable("case", "level", "point", $"ux [{len}]", $"uy [{len}]", $"drift x [{len}]", $"drift y [{len}]", "drift / height").Numeric(3, 4, 5, 6, 7);
            foreach (var c in r.Cases.Where(c => governing.Contains(c.Case.Id)))
                foreach (var q in c.Points.OrderByDescending(q => q.Level))
                {
                    double h = p.Levels[q.Level].Elevation - p.Levels[q.Level - 1].Elevation;
                    qt.Add(c.Case.Id, p.Levels[q.Level].Id, q.Point, L(q.Ux), L(q.Uy), L(q.DriftX), L(q.DriftY), TextTable.Sci(Math.Sqrt(q.DriftX * q.DriftX + q.DriftY * q.DriftY) / h));
                }
            sb.Append(qt.Render());
        }

        if (r.DriftChecks.Count > 0)
        {
            var lim = p.DriftLimit!;
            sb.Append($"\nCorner drift check, the governing case of each story over every case solved (A_x cases included; all in\n" +
                      $"plan-drift-checks.csv): δ = C_d·δ_e/I_e (ASCE 7-16 eq. 12.8-15), C_d = {lim.Cd}, I_e = {lim.Ie}, allowed {lim.AllowedRatio}\n");
            sb.Append(TableView.Render(PlanTableViews.GoverningDriftChecks(r, cornersOnly: true, topFirst: false), ["case", "story", "corner", "amplified drift", "ratio", "allowed", "result"]));
            if (p.Points.Count > 0)
            {
                sb.Append("Named points, the governing case of each story and point:\n");
                sb.Append(TableView.Render(PlanTableViews.GoverningPointDriftChecks(r), ["point", "case", "story", "amplified drift", "ratio", "allowed", "result"]));
            }
        }
        sb.Append(PlanFloorReport.Render(r, tributary));   // floors that bend: with a "floor" block only
        sb.Append("\n" + Wrap($"Caution: {ResultFiles.Caution}", TextTable.Width));
        return sb.ToString();
    }

    /// <summary>Full detail: each floor's motion per case (plan-floors.csv), with the motion of the floors held against twist.</summary>
    private static string FloorMotion(PlanResult r) =>
        "\nFloor motion per case (Ux, Uy of the plan origin; \"locked\": the same loads with the floors held against twist)\n" + TableView.Render(PlanFiles.FloorsTable(r));

    private static string Wrap(string text, int width)
    {
        var sb = new StringBuilder();
        int col = 0;
        foreach (var word in text.Split(' '))
        {
            if (col > 0 && col + 1 + word.Length > width) { sb.Append('\n'); col = 0; }
            if (col > 0) { sb.Append(' '); col++; }
            sb.Append(word); col += word.Length;
        }
        return sb.Append('\n').ToString();
    }
}
