using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>
/// The wall-panel part of the report: geometry and mesh, the mesh-convergence study of the top stiffness, level
/// displacements, solution checks and the mesh figures (displacement and shear stress) for the first lateral load case.
/// Every number comes from <see cref="PanelResult"/>.
/// </summary>
public static partial class ModelReport
{
    /// <summary>Rows of the methods table for the panel elements (none without panels).</summary>
    private static IEnumerable<IReadOnlyList<string>> PanelMethods(AnalysisResult r)
    {
        if (r.Panels.Count == 0) yield break;
        var kinds = r.Panels.Select(p => p.Panel.Mesh.Element).Distinct().ToHashSet();
        yield return ["Plane stress", "σ = D·ε, D = E/(1−ν²)·[1, ν, 0; ν, 1, 0; 0, 0, (1−ν)/2]; K_e = ∫ Bᵀ·D·B·t dA by Gauss quadrature", "Zienkiewicz & Taylor, The Finite Element Method, vol. 1, 5th ed., 2000"];
        if (kinds.Contains(PanelElementKind.Quad4))
            yield return ["4-node incompatible-mode quadrilateral (QM6)", "u = Σ N_a·u_a + (1−ξ²)·α₁ + (1−η²)·α₂ per direction; internal-mode derivatives with the centre Jacobian J₀, scaled by det J₀/det J (passes the patch test); 2×2 Gauss; α condensed", "Wilson, Taylor, Doherty & Ghaboussi 1973; Taylor, Beresford & Wilson, IJNME 10:1211–1219, 1976"];
        if (kinds.Contains(PanelElementKind.Quad9))
            yield return ["9-node Lagrangian quadrilateral", "biquadratic Lagrange shape functions N_a = l_i(ξ)·l_j(η); 3×3 Gauss", "Zienkiewicz & Taylor, vol. 1, 2000, §8.5"];
        yield return ["Nodal stresses", "Gauss-point stresses extrapolated to the nodes with the Lagrange polynomial through the Gauss points, averaged over the elements at each node", "Hinton & Campbell, IJNME 8, 1974"];
        yield return ["Floor ties and top stiffness", "the nodes of a level share one horizontal equation (exact, no penalty); k = 1/Δ under a unit force through the top tie", "common practice; docs/panels.md"];
        if (r.Panels.Any(p => p.Convergence is not null))
            yield return ["Mesh convergence", "p = log₂((k₁−k₂)/(k₂−k₃)); k∞ = k₃ + (k₃−k₂)/(2ᵖ−1); estimated error |k∞−k₃|/k∞ on nested meshes h, h/2, h/4", "Richardson, Phil. Trans. R. Soc. A 210, 1911; Roache, Verification and Validation in Computational Science and Engineering, 1998, ch. 5"];
    }

    /// <summary>The first load case (model order) in which the panel carries a horizontal story force (its own, or through its links), or −1.</summary>
    private static int FirstLateralCase(AnalysisResult r, PanelResult pr)
    {
        var p = pr.Panel;
        if (p.Links.Count > 0)   // a linked panel: the first load case with a horizontal load on the structure
            for (int c = 0; c < r.Model.LoadCases.Count && c < r.Cases.Count; c++)
            {
                var e = r.Cases[c].Equilibrium;
                if (Math.Abs(e.AppliedFx) > 1e-9 * Math.Abs(e.AppliedFy)) return c;
            }
        var cases = p.Loads.Where(l => l.Fx != 0).Select(l => l.Case).ToList();
        return cases.Count == 0 ? -1 : cases.Min();
    }

    /// <summary>The panels section.</summary>
    private static void AddPanels(List<Block> blocks, Action<Figure> figure, AnalysisResult r, string heading)
    {
        var m = r.Model;
        var u = m.Units;
        string len = u.LengthSymbol, stiff = u.Label(Quantity.TranslationalStiffness);
        string L(double si) => F(u.FromSI(si, Quantity.Length));
        string K(double si) => F(u.FromSI(si, Quantity.TranslationalStiffness));
        string S(double si) => F(u.FromSI(si, Quantity.Stress));
        var caseIds = m.LoadCases.Select(c => c.Id).Concat(m.Combinations.Select(c => c.Id)).ToList();

        blocks.Add(new Heading(2, heading));
        blocks.Add(new Paragraph("Each wall panel is meshed as a plane-stress continuum of its thickness (docs/panels.md): linear elastic, small displacements, base held in x and y at every node, the nodes of each floor level sharing one horizontal displacement when the panel has floor ties. The mesh conforms to every opening edge and floor level; cells inside openings are left out. "
            + (r.Panels.Any(p => p.Panel.Links.Count > 0)
                ? " A panel with links is part of the frame: every mesh node on a link's edge segment follows its frame node rigidly (exact constraint), the panel is condensed exactly onto those frame nodes (a superelement), solved with the frame as one structure and recovered from the frame's motion; it carries story shear with the members, and its base reactions are among the structure's reactions. The link forces are listed below."
                : "")
            + (r.Panels.Any(p => p.Panel.Links.Count == 0) && m.Members.Count > 0 ? " A panel without links is not connected to the members: it is solved on its own, under its own story forces." : "")));

        var ps = r.Panels;
        IReadOnlyList<string> Row(string what, Func<PanelResult, string> value) => [what, .. ps.Select(value)];
        blocks.Add(new Table("Panel geometry and mesh", ["quantity", .. ps.Select(p => $"panel {p.Panel.Id}")],
        [
            Row($"length × height [{len}]", p => $"{L(p.Panel.Length)} × {L(p.Panel.Height)}"),
            Row($"thickness [{len}]", p => L(p.Panel.Thickness)),
            Row($"bottom-left corner (x, y) [{len}]", p => $"({L(p.Panel.X0)}, {L(p.Panel.Y0)})"),
            Row($"material: E [{u.Label(Quantity.Stress)}], ν", p => $"{p.Panel.MaterialId}: {S(p.Panel.E)}, {F(p.Panel.Nu)}"),
            Row("openings", p => $"{p.Panel.Openings.Count}"),
            Row($"floor levels above the base [{len}]", p => string.Join(", ", p.Panel.Levels.Select(L)) + (p.Panel.FloorTies ? " (tied)" : " (no ties)")),
            Row("element", p => p.Mesh.Mesh.Element.Name),
            Row("nodes / elements", p => $"{p.Mesh.Mesh.NodeCount} / {p.Mesh.Mesh.Elements.Length}"),
            Row($"element size [{len}]", p => L(p.Mesh.ElementSize)),
            Row($"narrowest solid strip [{len}]", p => L(p.Mesh.NarrowestStrip)),
            Row("largest element side ratio", p => F(p.Mesh.LargestAspect)),
            Row("unknowns", p => $"{p.Analysis.Solve.Unknowns}"),
            Row($"top stiffness k, this mesh [{stiff}]", p => K(p.TopStiffness)),
        ], []));
        var openings = ps.SelectMany(p => p.Panel.Openings.Select(o => (IReadOnlyList<string>)[p.Panel.Id, o.Id, L(o.Left), L(o.Bottom), L(o.Width), L(o.Height)])).ToList();
        if (openings.Count > 0)
            blocks.Add(new Table("Panel openings (from the panel's bottom-left corner)", ["panel", "opening", $"left [{len}]", $"bottom [{len}]", $"width [{len}]", $"height [{len}]"], openings, [2, 3, 4, 5]));

        foreach (var p in ps.Where(p => p.Convergence is not null))
        {
            var c = p.Convergence!;
            var rows = new List<IReadOnlyList<string>>();
            for (int i = 0; i < c.Stiffness.Length; i++)
                rows.Add([i == 0 ? "h" : $"h/{1 << i}", L(c.ElementSizes[i]), $"{c.Unknowns[i]}", K(c.Stiffness[i]), i == 0 ? "" : Pct(c.Stiffness[i] / c.Stiffness[i - 1] - 1, "0.000")]);
            blocks.Add(new Table($"Mesh convergence of the top stiffness, panel {p.Panel.Id}", ["mesh", $"element size [{len}]", "unknowns", $"k [{stiff}]", "change from the mesh before"], rows, [1, 2, 3, 4]));
            blocks.Add(new Table($"Convergence estimate, panel {p.Panel.Id} (three finest meshes)", ["quantity", "value"],
            [
                ["observed order p", double.IsFinite(c.ObservedOrder) ? c.ObservedOrder.ToString("0.00", CultureInfo.InvariantCulture) : double.IsPositiveInfinity(c.ObservedOrder) ? "∞ (no change)" : "n/a"],
                [$"Richardson value k∞ [{stiff}]", K(c.Extrapolated)],
                ["estimated error of the finest mesh |k∞ − k|/k∞", Pct(c.EstimatedError, "0.000")],
            ], [1]));
            blocks.Add(new Paragraph($"Panel {p.Panel.Id}: {c.Note}. An opening's corners are re-entrant, which caps the order near 1 on uniform meshes (docs/panels.md)."));
        }

        var levelRows = new List<IReadOnlyList<string>>();
        foreach (var p in ps)
            for (int c = 0; c < p.LevelDisplacements.Length; c++)
                for (int l = 0; l < p.Panel.Levels.Count; l++)
                    levelRows.Add([p.Panel.Id, caseIds[c], L(p.Panel.Levels[l]), L(p.LevelDisplacements[c][l])]);
        blocks.Add(new Table("Panel level displacements", ["panel", "case", $"level above the base [{len}]", $"ux [{len}]"], levelRows, [2, 3]));
        blocks.Add(new Table("Panel solution checks", ["panel", "case", "backward error", "force imbalance", "moment imbalance", "verdict"],
            ps.SelectMany(p => p.Analysis.Cases.Select(c => (IReadOnlyList<string>)[p.Panel.Id, c.Id, c.BackwardError.ToString("0.0E+0", CultureInfo.InvariantCulture),
                c.Equilibrium.RelativeForceError.ToString("0.0E+0", CultureInfo.InvariantCulture), c.Equilibrium.RelativeMomentError.ToString("0.0E+0", CultureInfo.InvariantCulture),
                PanelCaseSolved(c) ? "solved" : "check the model"])).ToList(), [2, 3, 4]));

        if (r.PanelLinks is { } links)
        {
            string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
            string Fo(double si) => F(u.FromSI(si, Quantity.Force));
            var rows = new List<IReadOnlyList<string>>();
            foreach (var lc in links.Cases)
                foreach (var f in lc.Forces)
                    rows.Add([lc.Id, f.Panel, m.Nodes[f.Node].Id, Fo(f.Fx), Fo(f.Fy), F(u.FromSI(f.Mz, Quantity.Moment))]);
            blocks.Add(new Table("Link forces: what each link passes from its frame node to the panel (moment about the frame node)", ["case", "panel", "frame node", $"Fx [{fu}]", $"Fy [{fu}]", $"Mz [{mu}]"], rows, [3, 4, 5]));
            var bases = new List<IReadOnlyList<string>>();
            for (int ci = 0; ci < links.Cases.Count && ci < r.Cases.Count; ci++)
                for (int pi = 0; pi < m.Panels.Count; pi++)
                {
                    if (m.Panels[pi].Links.Count == 0) continue;
                    var (bx, by, bm) = StoryPanels.BaseReaction(r, pi, ci);
                    var mine = links.Cases[ci].Forces.Where(f => f.Panel == m.Panels[pi].Id).ToList();
                    bases.Add([links.Cases[ci].Id, m.Panels[pi].Id, Fo(bx), Fo(by), F(u.FromSI(bm, Quantity.Moment)), Fo(mine.Sum(f => f.Fx)), Fo(mine.Sum(f => f.Fy))]);
                }
            blocks.Add(new Table("Linked panels' base reactions (moment about the middle of the base) beside the sum of their link forces", ["case", "panel", $"base Fx [{fu}]", $"base Fy [{fu}]", $"base Mz [{mu}]", $"Σ link Fx [{fu}]", $"Σ link Fy [{fu}]"], bases, [2, 3, 4, 5, 6]));
        }

        foreach (var p in ps)
        {
            int c = FirstLateralCase(r, p);
            if (c < 0) continue;
            figure(PanelPlots.Mesh(p, c, caseIds[c], PanelField.DisplacementMagnitude, u).Figure);
            figure(PanelPlots.Mesh(p, c, caseIds[c], PanelField.ShearStress, u).Figure);
        }
    }

    private static bool PanelCaseSolved(PlaneCaseResult c) => c.BackwardError < 1e-10 && c.Equilibrium.RelativeForceError < 1e-8;

    /// <summary>Verdict lines of the panels.</summary>
    private static IEnumerable<string> PanelVerdicts(AnalysisResult r)
    {
        var u = r.Model.Units;
        foreach (var p in r.Panels)
        {
            int bad = p.Analysis.Cases.Count(c => !PanelCaseSolved(c));
            string conv = p.Convergence is { } c && double.IsFinite(c.EstimatedError)
                ? $"; mesh study: finest mesh {F(u.FromSI(c.Stiffness[^1], Quantity.TranslationalStiffness))}, Richardson value {F(u.FromSI(c.Extrapolated, Quantity.TranslationalStiffness))} {u.Label(Quantity.TranslationalStiffness)}, observed order {c.ObservedOrder.ToString("0.00", CultureInfo.InvariantCulture)}, estimated error of the finest mesh {Pct(c.EstimatedError, "0.00")}; the tables and figures of the cases are on the base mesh"
                : p.Convergence is { } c2 ? $"; mesh study: {c2.Note}" : "; no mesh study asked for";
            yield return bad == 0
                ? $"Panel {p.Panel.Id}: {p.Analysis.Cases.Count} case(s) solved and in equilibrium; top stiffness on the base mesh {F(u.FromSI(p.TopStiffness, Quantity.TranslationalStiffness))} {u.Label(Quantity.TranslationalStiffness)}{conv}."
                : $"Panel {p.Panel.Id}: the solution check is not met in {bad} case(s); check the model before using its numbers{conv}.";
        }
    }

    /// <summary>Caution lines of the panels.</summary>
    private static IEnumerable<string> PanelCautions(AnalysisResult r)
    {
        if (r.Panels.Count == 0) yield break;
        yield return "Panels: linear elastic plane stress, uncracked unless the material says otherwise. Averaged nodal stresses at re-entrant opening corners and at the ends of the held base stand for singular stresses: read them as \"high here\", not as design values. The base is held rigidly; foundation flexibility is not modelled.";
    }
}
