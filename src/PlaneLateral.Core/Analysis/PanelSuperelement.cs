using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// Mesh nodes of a plane-stress problem that follow one master point rigidly: u_i = u − θ·(y_i − y_m),
/// v_i = v + θ·(x_i − x_m), with (u, v, θ) the master's motion (m, m, rad) and (x_m, y_m) its position (m).
/// </summary>
/// <param name="Master">Label of the master (the frame node's id), for messages and results.</param>
public sealed record RigidSegment(string Master, double X, double Y, int[] Nodes);

/// <summary>
/// A plane-stress problem condensed on the masters of its rigid segments: 3 DOFs (u, v, θ) per segment, in segment
/// order. SI units: N/m, N, N·m/rad and mixed.
/// </summary>
public sealed class CondensedPanel
{
    public required IReadOnlyList<RigidSegment> Segments { get; init; }

    /// <summary>
    /// Condensed stiffness [3m, 3m], symmetrised: column j is the force (and moment about each master) the panel takes
    /// from the masters when master DOF j moves by one unit and the others are held.
    /// </summary>
    public required double[,] Stiffness { get; init; }

    /// <summary>Largest |K_ij − K_ji| of the condensed stiffness as computed, relative to its largest entry (round-off: about 1e-12 or less).</summary>
    public required double SymmetryError { get; init; }

    /// <summary>Fixed-end forces [case][3m]: what the panel takes from the masters under its own loads with every master held.</summary>
    public required double[][] FixedEndForces { get; init; }

    /// <summary>Worst backward error of the condensation solves (unit master motions and held-master loads).</summary>
    public required double WorstBackwardError { get; init; }
}

/// <summary>
/// Exact rigid links between master points and segments of a plane-stress mesh by static condensation (a superelement
/// on the masters' DOFs; Przemieniecki, <i>Theory of Matrix Structural Analysis</i>, 1968, ch. 9 "substructure
/// displacement analysis"): the segment nodes are prescribed, the panel is solved on one factorisation for a unit
/// motion of every master DOF and for its own loads with the masters held, and the segment reactions, carried to the
/// masters through the rigid-body transformation, are the condensed stiffness columns and the fixed-end forces. No
/// penalty number: the constraint is exact. Recovery solves the panel with the masters' motions prescribed.
/// </summary>
public static class PanelSuperelement
{
    /// <summary>The problem with every segment node held in x and y (its values are then prescribed by the masters).</summary>
    /// <exception cref="ArgumentException">A segment node is already restrained, or in two segments, or a segment is empty.</exception>
    public static PlaneStressProblem Held(PlaneStressProblem p, IReadOnlyList<RigidSegment> segments)
    {
        var restrained = p.Restraints.Select(r => r.Node).ToHashSet();
        var seen = new HashSet<int>();
        foreach (var s in segments)
        {
            if (s.Nodes.Length == 0) throw new ArgumentException($"the segment of {s.Master} holds no mesh node");
            foreach (int i in s.Nodes)
            {
                if (restrained.Contains(i)) throw new ArgumentException($"mesh node {p.NodeLabel(i)} of the segment of {s.Master} is already restrained");
                if (!seen.Add(i)) throw new ArgumentException($"mesh node {p.NodeLabel(i)} is in two segments");
            }
        }
        return new PlaneStressProblem
        {
            Mesh = p.Mesh, Material = p.Material,
            Restraints = [.. p.Restraints, .. segments.SelectMany(s => s.Nodes.SelectMany(i => new[] { (i, Dof.X), (i, Dof.Y) }))],
            HorizontalTies = p.HorizontalTies, NodeLabel = p.NodeLabel, SourcePath = p.SourcePath,
        };
    }

    /// <summary>The segment nodes' displacements for the masters' motions q [3m] (u, v, θ per master).</summary>
    public static List<(int Node, Dof Dof, double Value)> Prescribe(PlaneMesh mesh, IReadOnlyList<RigidSegment> segments, ReadOnlySpan<double> q)
    {
        var list = new List<(int, Dof, double)>();
        for (int s = 0; s < segments.Count; s++)
        {
            var seg = segments[s];
            double u = q[3 * s], v = q[3 * s + 1], th = q[3 * s + 2];
            foreach (int i in seg.Nodes)
            {
                list.Add((i, Dof.X, u - th * (mesh.Y[i] - seg.Y)));
                list.Add((i, Dof.Y, v + th * (mesh.X[i] - seg.X)));
            }
        }
        return list;
    }

    /// <summary>
    /// The force and moment (about each master) that each link passes from its master to the panel [3m], from the
    /// reactions of a solve of the held problem: Σ Tᵢᵀ rᵢ over the segment's nodes.
    /// </summary>
    public static double[] LinkForces(PlaneMesh mesh, IReadOnlyList<RigidSegment> segments, PlaneCaseResult c)
    {
        var owner = new Dictionary<int, int>();
        for (int s = 0; s < segments.Count; s++) foreach (int i in segments[s].Nodes) owner[i] = s;
        var q = new double[3 * segments.Count];
        foreach (var (node, dof, r) in c.Reactions)
        {
            if (!owner.TryGetValue(node, out int s)) continue;
            var seg = segments[s];
            if (dof == Dof.X) { q[3 * s] += r; q[3 * s + 2] -= (mesh.Y[node] - seg.Y) * r; }
            else { q[3 * s + 1] += r; q[3 * s + 2] += (mesh.X[node] - seg.X) * r; }
        }
        return q;
    }

    /// <summary>
    /// Condenses the problem on its segments' masters. The <paramref name="cases"/> carry the panel's own loads (their
    /// prescribed values, if any, are ignored: the masters are held).
    /// </summary>
    /// <exception cref="UnstableModelException">The panel with its segments held is still a mechanism.</exception>
    public static CondensedPanel Condense(PlaneStressProblem p, IReadOnlyList<RigidSegment> segments, IReadOnlyList<PlaneLoadCase> cases, AnalysisOptions? options = null)
    {
        var held = Held(p, segments);
        int m = 3 * segments.Count;
        var solves = new List<PlaneLoadCase>();
        for (int j = 0; j < m; j++)
        {
            var e = new double[m];
            e[j] = 1;
            solves.Add(new PlaneLoadCase { Id = $"unit {segments[j / 3].Master} {"u v θ".Split(' ')[j % 3]}", Prescribed = Prescribe(p.Mesh, segments, e) });
        }
        solves.AddRange(cases.Select(c => new PlaneLoadCase { Id = c.Id, NodalForces = c.NodalForces, EdgeLoads = c.EdgeLoads, TieForces = c.TieForces }));
        var r = PlaneStressAnalysis.Run(held, solves, options);

        var k = new double[m, m];
        for (int j = 0; j < m; j++)
        {
            var col = LinkForces(p.Mesh, segments, r.Cases[j]);
            for (int i = 0; i < m; i++) k[i, j] = col[i];
        }
        double biggest = 0, asym = 0;
        for (int i = 0; i < m; i++)
            for (int j = 0; j < m; j++) biggest = Math.Max(biggest, Math.Abs(k[i, j]));
        for (int i = 0; i < m; i++)
            for (int j = 0; j < i; j++)
            {
                asym = Math.Max(asym, Math.Abs(k[i, j] - k[j, i]));
                k[i, j] = k[j, i] = 0.5 * (k[i, j] + k[j, i]);
            }
        return new CondensedPanel
        {
            Segments = segments,
            Stiffness = k,
            SymmetryError = biggest == 0 ? 0 : asym / biggest,
            FixedEndForces = Enumerable.Range(0, cases.Count).Select(c => LinkForces(p.Mesh, segments, r.Cases[m + c])).ToArray(),
            WorstBackwardError = r.Cases.Count == 0 ? 0 : r.Cases.Max(c => c.BackwardError),
        };
    }

    /// <summary>
    /// Recovers the panel: solved with its own loads and the segment nodes following the masters' motions
    /// <paramref name="motions"/>[case][3m]; the combinations are superposed as in <see cref="PlaneStressAnalysis.Run"/>.
    /// </summary>
    public static PlaneAnalysisResult Recover(PlaneStressProblem p, IReadOnlyList<RigidSegment> segments, IReadOnlyList<PlaneLoadCase> cases, IReadOnlyList<double[]> motions,
        AnalysisOptions? options = null, IReadOnlyList<(string Id, IReadOnlyList<(int Case, double Factor)> Factors)>? combinations = null)
    {
        var held = Held(p, segments);
        var solves = cases.Select((c, i) => new PlaneLoadCase
        {
            Id = c.Id, NodalForces = c.NodalForces, EdgeLoads = c.EdgeLoads, TieForces = c.TieForces,
            Prescribed = Prescribe(p.Mesh, segments, motions[i]),
        }).ToArray();
        return PlaneStressAnalysis.Run(held, solves, options, combinations);
    }
}
