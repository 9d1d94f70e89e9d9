using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// Wall panels linked to the frame (docs/panels.md, "Panels in a frame") in the story results: which line of
/// resistance each belongs to, the shear it carries across a horizontal cut, its base reactions and the loads on it.
/// <para>
/// Story shear of a linked panel, derived by statics. Take as one body the panel with its links (each link's rigid arm
/// reaching from its frame node to its edge segment). The forces on that body are: the reactions of its held base
/// (at the base, y = Y0), the forces the links pass from their frame nodes (acting at the frame nodes, y_n) and the
/// panel's own story forces (at their levels). Cut the body at y_c. The part below the cut is in equilibrium under the
/// forces applied below the cut and the force the part above puts on it across the cut; so the horizontal force the
/// body carries across the cut (the force the part above exerts on the part below, positive in +x, the sign of
/// <see cref="StoryResult.Shear"/>) is
/// </para>
/// <para>V_p(y_c) = −( Σ base Rx [if Y0 &lt; y_c] + Σ link Fx [y_n &lt; y_c] + Σ own fx [level &lt; y_c] ).</para>
/// <para>
/// When every link's segment lies on the same side of the cut as its frame node (the usual case: a drag beam framing
/// into the wall at its floor) this is exactly the resultant of the panel's internal forces across the cut; a link arm
/// that crosses the cut carries its force across with the panel. Summed with the members' forces across the cut
/// (<see cref="StoryAnalysis.ShearAcrossCut"/>), the total is the horizontal load above the cut: the frame nodes below
/// the cut take −(link force) from each link there, so the link forces cancel and what remains is −(all reactions and
/// loads below the cut) = the loads above (global equilibrium). A panel without links is a structure of its own
/// (solved on its own, beside the frame): it is not part of the stories.
/// </para>
/// </summary>
public static class StoryPanels
{
    /// <summary>The panel's line of resistance: its "line", or its own id.</summary>
    public static string LineOf(WallPanel p) => string.IsNullOrEmpty(p.Line) ? p.Id : p.Line;

    /// <summary>Every line of resistance: the members' lines in model order, then the linked panels' lines not among them.</summary>
    public static IReadOnlyList<string> Lines(StructureModel model) =>
        model.Building.Lines.Concat(model.Panels.Where(p => p.Links.Count > 0).Select(LineOf)).Distinct(StringComparer.Ordinal).ToList();

    /// <summary>
    /// The horizontal force (N) each horizontal action on a linked panel's body applies, with its elevation (m): the
    /// base reaction resultant at Y0, each link force at its frame node, each own story force at its level.
    /// </summary>
    /// <param name="r">The solved model.</param>
    /// <param name="panel">Index of the panel in <see cref="StructureModel.Panels"/> (must have links).</param>
    /// <param name="caseIndex">Index of the case or combination in <see cref="AnalysisResult.Cases"/>.</param>
    public static IReadOnlyList<(double Y, double Fx)> HorizontalActions(AnalysisResult r, int panel, int caseIndex)
    {
        var model = r.Model;
        var p = model.Panels[panel];
        var list = new List<(double, double)> { (p.Y0, BaseReaction(r, panel, caseIndex).Fx) };
        if (r.PanelLinks is not null)
            foreach (var f in r.PanelLinks.Cases[caseIndex].Forces.Where(f => f.Panel == p.Id))
                list.Add((model.Nodes[f.Node].Y, f.Fx));
        foreach (var (load, factor) in OwnLoads(model, p, r.Cases[caseIndex]))
            list.Add((p.Y0 + load.Level, factor * load.Fx));
        return list;
    }

    /// <summary>
    /// The horizontal force (N, +x) a linked panel with its links carries across a horizontal cut at
    /// <paramref name="yc"/> (see the class notes for the derivation).
    /// </summary>
    public static double ShearAcrossCut(IReadOnlyList<(double Y, double Fx)> actions, double yc) =>
        -actions.Where(a => a.Y < yc).Sum(a => a.Fx);

    /// <summary>
    /// Resultant of a panel's base reactions in a case (N, N, and N·m counter-clockwise about the middle of its base,
    /// (X0 + length/2, Y0)): the forces its held base nodes take from the foundation. The link forces of a linked
    /// panel are not reactions (they come from the frame) and are left out.
    /// </summary>
    public static (double Fx, double Fy, double Mz) BaseReaction(AnalysisResult r, int panel, int caseIndex)
    {
        var p = r.Model.Panels[panel];
        var pr = r.Panels[panel];
        var mesh = pr.Mesh.Mesh;
        var c = pr.Analysis.Cases[caseIndex];
        double tol = 1e-9 * Math.Max(p.Length, p.Height);
        double xm = p.X0 + 0.5 * p.Length;
        double fx = 0, fy = 0, mz = 0;
        foreach (var (node, dof, value) in c.Reactions)
        {
            if (Math.Abs(mesh.Y[node] - p.Y0) > tol) continue;   // a segment node of a link: a link force, not a reaction
            if (dof == Dof.X) { fx += value; mz -= (mesh.Y[node] - p.Y0) * value; }
            else if (dof == Dof.Y) { fy += value; mz += (mesh.X[node] - xm) * value; }
        }
        return (fx, fy, mz);
    }

    /// <summary>The panel's own story forces acting in a case (factor 1) or a combination (each case's forces with its factor).</summary>
    public static IEnumerable<(PanelLoad Load, double Factor)> OwnLoads(StructureModel model, WallPanel p, CaseResult c)
    {
        if (!c.IsCombination)
        {
            int ci = model.LoadCases.ToList().FindIndex(x => x.Id == c.Id);
            return p.Loads.Where(l => l.Case == ci).Select(l => (l, 1.0));
        }
        var combo = model.Combinations.First(x => x.Id == c.Id);
        return combo.Factors.SelectMany(f => p.Loads.Where(l => l.Case == f.Case).Select(l => (l, f.Factor)));
    }

    /// <summary>Index of a case or combination in <see cref="AnalysisResult.Cases"/>.</summary>
    internal static int IndexOf(AnalysisResult r, CaseResult c)
    {
        for (int i = 0; i < r.Cases.Count; i++) if (ReferenceEquals(r.Cases[i], c)) return i;
        for (int i = 0; i < r.Cases.Count; i++) if (r.Cases[i].Id == c.Id && r.Cases[i].IsCombination == c.IsCombination) return i;
        throw new ArgumentException($"case \"{c.Id}\" is not among the results", nameof(c));
    }
}
