using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Meshing;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>The force and moment a link passes from its frame node to the panel (N, N·m), global axes, moment about the frame node.</summary>
public sealed record PanelLinkForce(string Panel, int Node, double Fx, double Fy, double Mz);

/// <summary>One load case (or combination) of a model with linked panels: the link forces and the checks of the whole.</summary>
public sealed class PanelLinkCase
{
    public required string Id { get; init; }

    /// <summary>One per link, panels in model order, links in file order.</summary>
    public required IReadOnlyList<PanelLinkForce> Forces { get; init; }

    /// <summary>Frame support reactions and panel base reactions against every load applied to frame and panels.</summary>
    public required EquilibriumCheck Whole { get; init; }

    /// <summary>
    /// Normwise backward error of the whole (frame and panel unknowns, the links as exact constraints), from the whole
    /// system assembled independently of the condensation: η = ‖K·u − f‖∞ / (‖K‖∞·‖u‖∞ + ‖f‖∞) (Higham 2002, Thm 7.1).
    /// </summary>
    public required double WholeBackwardError { get; init; }

    /// <summary>Backward error of the frame solve on the condensed system.</summary>
    public required double CondensedBackwardError { get; init; }
}

/// <summary>The condensation of one linked panel.</summary>
/// <param name="SymmetryError">Largest |K_ij − K_ji| / max |K| of the condensed stiffness before symmetrising.</param>
/// <param name="WorstBackwardError">Worst backward error of the panel solves (condensation and recovery).</param>
public sealed record PanelCondensation(string Panel, int Links, int Unknowns, double SymmetryError, double WorstBackwardError);

/// <summary>Results of the links between frame nodes and wall-panel edges (docs/panels.md, "Panels in a frame").</summary>
public sealed class PanelLinkResults
{
    public required IReadOnlyList<PanelCondensation> Panels { get; init; }

    /// <summary>Load cases in model order, then combinations.</summary>
    public required IReadOnlyList<PanelLinkCase> Cases { get; init; }
}

// Wall panels tied to frame nodes: each linked panel is condensed on its frame nodes (PanelSuperelement), added to the
// frame's stiffness and load vectors, and recovered from the frame's displacements; the whole is checked as one.
public static partial class LinearStaticAnalysis
{
    /// <summary>
    /// The DOF map and stiffness of the frame with every linked wall panel condensed exactly onto its frame nodes (the
    /// frame's alone when no panel has links): the stiffness the static analysis factorises, for the period and
    /// story-force analyses (SeismicAnalysis), so that they see the walls too.
    /// </summary>
    /// <exception cref="ModelInputException">A panel cannot be tied to the frame.</exception>
    public static (DofMap Dofs, SymmetricSparseMatrix K) StiffnessWithLinkedPanels(StructureModel model, IReadOnlyList<FrameElement> elements, AnalysisOptions? options = null)
    {
        var dofs = DofMap.Build(model, elements);
        var links = LinkedPanels.Prepare(model, options ?? new AnalysisOptions());
        if (links is null) return (dofs, Assemble(model, elements, dofs));
        dofs = dofs.WithAttachedRotations(links.Masters);
        return (dofs, links.Assemble(model, elements, dofs));
    }

    private sealed class LinkedPanel
    {
        public required WallPanel Panel { get; init; }
        public required PanelMesh Mesh { get; init; }
        public required PlaneStressProblem Problem { get; init; }
        public required List<PlaneLoadCase> Cases { get; init; }
        public required RigidSegment[] Segments { get; init; }
        public required int[] Masters { get; init; }
        public required CondensedPanel Condensed { get; init; }
        public PanelResult? Result { get; set; }
    }

    internal sealed partial class LinkedPanels
    {
        private readonly List<LinkedPanel> _panels;
        private double[][]? _frameLoads;

        private LinkedPanels(List<LinkedPanel> panels) => _panels = panels;

        /// <summary>Frame nodes tied to a panel.</summary>
        public IEnumerable<int> Masters => _panels.SelectMany(p => p.Masters).Distinct();

        /// <summary>Meshes and condenses every panel that has links; null when none has.</summary>
        public static LinkedPanels? Prepare(StructureModel model, AnalysisOptions options)
        {
            var list = new List<LinkedPanel>();
            foreach (var panel in model.Panels.Where(p => p.Links.Count > 0))
            {
                try
                {
                    var pm = PanelMesher.Mesh(panel);
                    var (problem, cases) = PanelAnalysis.Setup(panel, pm, model.LoadCases.Select(c => c.Id).ToArray(), model.SourcePath);
                    var segments = panel.Links.Select(l => Segment(model, panel, pm, l)).ToArray();
                    list.Add(new LinkedPanel
                    {
                        Panel = panel, Mesh = pm, Problem = problem, Cases = cases, Segments = segments,
                        Masters = panel.Links.Select(l => l.Node).ToArray(),
                        Condensed = PanelSuperelement.Condense(problem, segments, cases, options),
                    });
                }
                catch (ArgumentException e)
                {
                    throw new ModelInputException([new ModelDiagnostic(model.SourcePath, 0, 0, $"panel \"{panel.Id}\"",
                        $"panel \"{panel.Id}\" cannot be tied to the frame: {e.Message}",
                        "check the panel's links: each segment on its own mesh nodes, off the base and the floor ties")]);
                }
            }
            return list.Count == 0 ? null : new LinkedPanels(list);
        }

        /// <summary>The mesh nodes of a link's segment, following its frame node.</summary>
        private static RigidSegment Segment(StructureModel model, WallPanel p, PanelMesh pm, PanelLink l)
        {
            var m = pm.Mesh;
            double tol = 1e-9 * Math.Max(p.Length, p.Height);
            bool On(int i) => l.Edge switch
            {
                PanelEdge.Left => Math.Abs(m.X[i] - p.X0) <= tol && m.Y[i] - p.Y0 >= l.From - tol && m.Y[i] - p.Y0 <= l.To + tol,
                PanelEdge.Right => Math.Abs(m.X[i] - p.X0 - p.Length) <= tol && m.Y[i] - p.Y0 >= l.From - tol && m.Y[i] - p.Y0 <= l.To + tol,
                _ => Math.Abs(m.Y[i] - p.Y0 - p.Height) <= tol && m.X[i] - p.X0 >= l.From - tol && m.X[i] - p.X0 <= l.To + tol,
            };
            var node = model.Nodes[l.Node];
            return new RigidSegment(node.Id, node.X, node.Y, Enumerable.Range(0, m.NodeCount).Where(On).ToArray());
        }

        /// <summary>The frame's stiffness with every panel's condensed stiffness added on its frame nodes.</summary>
        public SymmetricSparseMatrix Assemble(StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs)
        {
            var builder = new SymmetricMatrixBuilder(dofs.FreeCount, 21 * elements.Count + dofs.FreeCount + _panels.Sum(p => 9 * p.Masters.Length * p.Masters.Length));
            AddFrame(builder, model, elements, dofs);
            foreach (var p in _panels) builder.AddElement(MasterEquations(p, dofs), p.Condensed.Stiffness);
            return builder.Build();
        }

        private static int[] MasterEquations(LinkedPanel p, DofMap dofs) =>
            p.Masters.SelectMany(n => new[] { dofs.Equation(n, Dof.X), dofs.Equation(n, Dof.Y), dofs.Equation(n, Dof.RZ) }).ToArray();

        /// <summary>Moves each panel's own loads onto its frame nodes: f −= fixed-end forces. Keeps the frame's own load vectors for the check of the whole.</summary>
        public void AddFixedEndForces(double[][] loadVectors, DofMap dofs)
        {
            _frameLoads = loadVectors.Select(v => (double[])v.Clone()).ToArray();
            foreach (var p in _panels)
            {
                var eqs = MasterEquations(p, dofs);
                for (int c = 0; c < loadVectors.Length; c++)
                    for (int j = 0; j < eqs.Length; j++)
                        if (eqs[j] >= 0) loadVectors[c][eqs[j]] -= p.Condensed.FixedEndForces[c][j];
            }
        }

        /// <summary>The result of a linked panel (after <see cref="Finish"/>), or null for a panel solved on its own.</summary>
        public PanelResult? Result(WallPanel panel) => _panels.FirstOrDefault(p => ReferenceEquals(p.Panel, panel))?.Result;

        /// <summary>
        /// Recovers every linked panel from the frame's displacements, then checks the whole: its equilibrium (frame
        /// reactions and panel base reactions against all loads) and its backward error, which replace the frame-only
        /// ones in <paramref name="cases"/>.
        /// </summary>
        public PanelLinkResults Finish(StructureModel model, FrameElement[] elements, DofMap dofs, List<CaseResult> cases, AnalysisOptions options)
        {
            int nc = model.LoadCases.Count;
            var combos = model.Combinations.Select(c => (c.Id, (IReadOnlyList<(int, double)>)c.Factors)).ToArray();
            var recovered = new List<PlaneAnalysisResult>();
            foreach (var p in _panels)
            {
                var motions = cases.Take(nc).Select(c => p.Masters.SelectMany(n => new[] { c.Displacement(n, Dof.X), c.Displacement(n, Dof.Y), c.Displacement(n, Dof.RZ) }).ToArray()).ToArray();
                var rec = PanelSuperelement.Recover(p.Problem, p.Segments, p.Cases, motions, options, combos);
                recovered.Add(rec);
                var alone = RunPanel(model, p.Panel, options);   // the panel's own top stiffness and convergence study
                p.Result = new PanelResult
                {
                    Panel = p.Panel, Mesh = p.Mesh, Analysis = rec, TopStiffness = alone.TopStiffness, Convergence = alone.Convergence,
                    LevelDisplacements = rec.Cases.Select(c => PanelAnalysis.LevelDisplacements(p.Panel, p.Mesh, c)).ToArray(),
                };
            }

            var (kw, offsets) = WholeMatrix(model, elements, dofs, recovered);
            double kwNorm = kw.InfinityNorm();
            var panelLoads = _panels.Select(p => p.Cases.Select(c => PlaneStressAnalysis.ExternalForces(p.Problem, c)).ToArray()).ToArray();
            var linkCases = new List<PanelLinkCase>();
            var panelChecks = _panels.Select(_ => new List<PlaneCaseResult>()).ToArray();   // each panel's own check, links as loads
            for (int ci = 0; ci < cases.Count; ci++)
            {
                var c = cases[ci];
                var factors = ci < nc ? [(ci, 1.0)] : model.Combinations[ci - nc].Factors;
                var uw = new double[kw.Size];
                var fw = new double[kw.Size];
                for (int eq = 0; eq < dofs.FreeCount; eq++)
                {
                    var (node, dof) = dofs.DofOf(eq);
                    uw[eq] = c.Displacement(node, dof);
                    foreach (var (k, fac) in factors) fw[eq] += fac * _frameLoads![k][eq];
                }
                double ax = c.Equilibrium.AppliedFx, ay = c.Equilibrium.AppliedFy, am = c.Equilibrium.AppliedMz;
                double rx = c.Equilibrium.ReactionFx, ry = c.Equilibrium.ReactionFy, rm = c.Equilibrium.ReactionMz;
                var forces = new List<PanelLinkForce>();
                for (int pi = 0; pi < _panels.Count; pi++)
                {
                    var p = _panels[pi];
                    var pc = recovered[pi].Cases[ci];
                    var pd = recovered[pi].Dofs;
                    var mesh = p.Mesh.Mesh;
                    var fext = new double[2 * mesh.NodeCount];
                    foreach (var (k, fac) in factors) for (int j = 0; j < fext.Length; j++) fext[j] += fac * panelLoads[pi][k][j];
                    var owner = SegmentOwners(p);
                    for (int i = 0; i < mesh.NodeCount; i++)
                        for (int d = 0; d < 2; d++)
                        {
                            int eq = pd.Equation(i, (Dof)d);
                            if (eq >= 0) { uw[offsets[pi] + eq] = d == 0 ? pc.Ux[i] : pc.Uy[i]; fw[offsets[pi] + eq] += fext[2 * i + d]; }
                            else if (owner.TryGetValue(i, out int s))
                                foreach (var (weq, coef) in Follow(p, s, i, d, dofs)) fw[weq] += coef * fext[2 * i + d];
                        }
                    ax += pc.Equilibrium.AppliedFx; ay += pc.Equilibrium.AppliedFy; am += pc.Equilibrium.AppliedMz;
                    foreach (var (node, dof, r) in pc.Reactions)
                    {
                        if (owner.ContainsKey(node)) continue;   // a link force is internal to the whole
                        if (dof == Dof.X) { rx += r; rm -= mesh.Y[node] * r; } else { ry += r; rm += mesh.X[node] * r; }
                    }
                    var q = PanelSuperelement.LinkForces(mesh, p.Segments, pc);
                    for (int s = 0; s < p.Segments.Length; s++) forces.Add(new PanelLinkForce(p.Panel.Id, p.Masters[s], q[3 * s], q[3 * s + 1], q[3 * s + 2]));
                    panelChecks[pi].Add(WithLinksAsLoads(model, p, pc, q, fext));
                }
                double eta = SolveError.Of(kw, kwNorm, uw, fw).BackwardError;
                var whole = new EquilibriumCheck(ax, ay, am, rx, ry, rm);
                linkCases.Add(new PanelLinkCase { Id = c.Id, Forces = forces, Whole = whole, WholeBackwardError = eta, CondensedBackwardError = c.BackwardError });
                cases[ci] = new CaseResult
                {
                    Id = c.Id, IsCombination = c.IsCombination, Description = c.Description, Displacements = c.Displacements,
                    Reactions = c.Reactions, MemberForces = c.MemberForces, Equilibrium = whole, RelativeResidual = c.RelativeResidual,
                    BackwardError = Math.Max(eta, c.BackwardError),
                };
            }
            for (int pi = 0; pi < _panels.Count; pi++)
            {
                var p = _panels[pi];
                var a = p.Result!.Analysis;
                p.Result = new PanelResult
                {
                    Panel = p.Result.Panel, Mesh = p.Result.Mesh, TopStiffness = p.Result.TopStiffness, Convergence = p.Result.Convergence,
                    LevelDisplacements = p.Result.LevelDisplacements,
                    Analysis = new PlaneAnalysisResult { Dofs = a.Dofs, Solve = a.Solve, Cases = panelChecks[pi], TieFlexibility = a.TieFlexibility, System = a.System },
                };
            }
            return new PanelLinkResults
            {
                Panels = _panels.Select((p, i) => new PanelCondensation(p.Panel.Id, p.Segments.Length, recovered[i].Dofs.FreeCount, p.Condensed.SymmetryError,
                    Math.Max(p.Condensed.WorstBackwardError, recovered[i].Cases.Count == 0 ? 0 : recovered[i].Cases.Max(c => c.BackwardError)))).ToArray(),
                Cases = linkCases,
            };
        }

        /// <summary>
        /// The panel's own equilibrium check with its links as what they are for the panel, loads from the frame: applied
        /// = its own loads + the link forces (each acting at its frame node: Fx, Fy and the moment Mz about the node, so
        /// about the origin Mz + x_n·Fy − y_n·Fx), reactions = its base alone. The segment nodes' reactions of the held
        /// solve sum to exactly those link forces (<see cref="PanelSuperelement.LinkForces"/>), so this moves them from one
        /// side to the other; the imbalance is relative to Σ|F| of every force on the panel (links, own loads, base
        /// reactions), never to a sum that cancels.
        /// </summary>
        private static PlaneCaseResult WithLinksAsLoads(StructureModel model, LinkedPanel p, PlaneCaseResult pc, double[] q, double[] fext)
        {
            var e = pc.Equilibrium;
            var mesh = p.Mesh.Mesh;
            double lx = 0, ly = 0, lm = 0, sx = 0, sy = 0, sm = 0;
            for (int s = 0; s < p.Segments.Length; s++)
            {
                var n = model.Nodes[p.Masters[s]];
                double fx = q[3 * s], fy = q[3 * s + 1], m = q[3 * s + 2] + n.X * fy - n.Y * fx;
                lx += fx; ly += fy; lm += m;
                sx += Math.Abs(fx); sy += Math.Abs(fy); sm += Math.Abs(m);
            }
            var owner = SegmentOwners(p);
            foreach (var (node, dof, r) in pc.Reactions)
            {
                if (owner.ContainsKey(node)) continue;
                if (dof == Dof.X) { sx += Math.Abs(r); sm += Math.Abs(mesh.Y[node] * r); } else { sy += Math.Abs(r); sm += Math.Abs(mesh.X[node] * r); }
            }
            for (int i = 0; i < mesh.NodeCount; i++)
            {
                sx += Math.Abs(fext[2 * i]); sy += Math.Abs(fext[2 * i + 1]);
                sm += Math.Abs(mesh.X[i] * fext[2 * i + 1] - mesh.Y[i] * fext[2 * i]);
            }
            return new PlaneCaseResult
            {
                Id = pc.Id, Ux = pc.Ux, Uy = pc.Uy, NodalStress = pc.NodalStress, GaussStress = pc.GaussStress, Reactions = pc.Reactions,
                GuideMoments = pc.GuideMoments, RelativeResidual = pc.RelativeResidual, BackwardError = pc.BackwardError,
                Equilibrium = new EquilibriumCheck(e.AppliedFx + lx, e.AppliedFy + ly, e.AppliedMz + lm, e.ReactionFx - lx, e.ReactionFy - ly, e.ReactionMz - lm)
                { ForceScale = Math.Max(sx, sy), MomentScale = sm },
            };
        }

        private static Dictionary<int, int> SegmentOwners(LinkedPanel p)
        {
            var owner = new Dictionary<int, int>();
            for (int s = 0; s < p.Segments.Length; s++) foreach (int i in p.Segments[s].Nodes) owner[i] = s;
            return owner;
        }

        /// <summary>Frame equations and coefficients of a segment node's DOF d (0 = x, 1 = y) in its master's motion (the rigid-body row Tᵢ).</summary>
        private static IEnumerable<(int Eq, double Coef)> Follow(LinkedPanel p, int s, int i, int d, DofMap dofs)
        {
            var seg = p.Segments[s];
            int n = p.Masters[s];
            var m = p.Mesh.Mesh;
            int eu = dofs.Equation(n, d == 0 ? Dof.X : Dof.Y), er = dofs.Equation(n, Dof.RZ);
            if (eu >= 0) yield return (eu, 1.0);
            if (er >= 0) yield return (er, d == 0 ? -(m.Y[i] - seg.Y) : m.X[i] - seg.X);
        }

        /// <summary>
        /// The whole system, assembled directly and independently of the condensation: the frame's equations first,
        /// then each panel's free equations; each panel element is transformed, Kᵍ = Tᵀ·K·T, so that its segment nodes'
        /// DOFs become their frame nodes' DOFs (the exact constraint of a rigid link by transformation; Cook, Malkus,
        /// Plesha &amp; Witt, <i>Concepts and Applications of Finite Element Analysis</i>, 4th ed., 2002, §9.2).
        /// </summary>
        private (SymmetricSparseMatrix K, int[] Offsets) WholeMatrix(StructureModel model, FrameElement[] elements, DofMap dofs, List<PlaneAnalysisResult> recovered)
        {
            var offsets = new int[_panels.Count];
            int size = dofs.FreeCount;
            for (int i = 0; i < _panels.Count; i++) { offsets[i] = size; size += recovered[i].Dofs.FreeCount; }
            var builder = new SymmetricMatrixBuilder(size);
            AddFrame(builder, model, elements, dofs);
            for (int pi = 0; pi < _panels.Count; pi++)
            {
                var p = _panels[pi];
                var mesh = p.Mesh.Mesh;
                var pd = recovered[pi].Dofs;
                var owner = SegmentOwners(p);
                int nn = mesh.Element.NodeCount;
                for (int e = 0; e < mesh.Elements.Length; e++)
                {
                    var (x, y) = mesh.ElementCoordinates(e);
                    var ke = mesh.Element.Stiffness(x, y, p.Problem.Material);
                    var columns = new List<int>();
                    var rows = new List<(int Col, double Coef)>[2 * nn];
                    for (int a = 0; a < 2 * nn; a++)
                    {
                        rows[a] = [];
                        int node = mesh.Elements[e][a / 2], d = a % 2;
                        int eq = pd.Equation(node, (Dof)d);
                        IEnumerable<(int, double)> terms = eq >= 0 ? [(offsets[pi] + eq, 1.0)] : owner.TryGetValue(node, out int s) ? Follow(p, s, node, d, dofs) : [];
                        foreach (var (geq, coef) in terms)
                        {
                            int col = columns.IndexOf(geq);
                            if (col < 0) { col = columns.Count; columns.Add(geq); }
                            rows[a].Add((col, coef));
                        }
                    }
                    int g = columns.Count;
                    if (g == 0) continue;
                    var kt = new double[2 * nn, g];   // K·T
                    for (int a = 0; a < 2 * nn; a++)
                        for (int b = 0; b < 2 * nn; b++)
                            foreach (var (col, coef) in rows[b]) kt[a, col] += ke[a, b] * coef;
                    var kg = new double[g, g];        // Tᵀ·K·T
                    for (int a = 0; a < 2 * nn; a++)
                        foreach (var (col, coef) in rows[a])
                            for (int j = 0; j < g; j++) kg[col, j] += coef * kt[a, j];
                    builder.AddElement(columns.ToArray(), kg);
                }
            }
            return (builder.Build(), offsets);
        }
    }
}
