using PlaneLateral.Analysis;
using PlaneLateral.Elements.Plane;
using PlaneLateral.Hand;
using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Studies;

/// <summary>
/// The plane-stress panel model of a coupled wall (docs/coupled-walls.md, section 7): one wall panel spanning the piers
/// and the openings, meshed with 9-node quadrilaterals on a structured grid. In every story the opening between two
/// piers runs from the floor below up to the underside of that floor's coupling beam (the beam at the top of the story,
/// its span the clear opening). The base is held; every floor and the roof is a floor tie (all nodes on the level share
/// one horizontal displacement: a rigid diaphragm, exact). A top load acts on the roof tie; a uniform load w is lumped
/// into story forces on the ties by tributary height (w·h at each floor, w·h/2 at the roof; the w·h/2 below the first
/// floor goes straight into the base), which keeps the overturning moment w·H²/2 exactly.
/// <para>Results: tie displacements (top deflection, drifts); each pier's base axial force and moment from its base
/// reactions (the moment about the pier centroid); the coupling-beam shear from the nodal forces of the beam elements on
/// the left of a vertical cut at mid-span of the opening (exact statics of the discrete model: the beam shears of every
/// floor add up to the pier's base axial force to round-off).</para>
/// It shares no assumption with the wide-column frame: no plane sections, no rigid arms, no shear form factor; the
/// beam-pier joints are as flexible as the continuum makes them.
/// </summary>
/// <param name="Refinement">k: every interval of the base grid split into 2ᵏ (nested meshes for a convergence study).</param>
/// <param name="ElementSize">Target element side of the base grid (m); 0: a quarter of the shorter of the story height
/// and the shortest pier.</param>
/// <param name="Element">The plane element (9-node by default).</param>
/// <param name="MaxNodes">Largest mesh built (nodes); a bigger wall gets no panel estimate (<see cref="Unsupported"/> says so).</param>
/// <param name="TieBeams">False (default): a floor tie holds the piers' nodes on the floor line and leaves the beams'
/// own nodes over the clear span free, as the frame and the closed form let a beam bend about its own axis. True: the tie
/// holds them too, which makes the beam's top edge inextensible (a slab rigid in its plane would do that) and stiffens it.</param>
public sealed class PanelCoupledWall(int Refinement = PanelCoupledWall.DefaultRefinement, double ElementSize = 0, PanelElementKind Element = PanelElementKind.Quad9,
    bool TieBeams = false, int MaxNodes = PanelCoupledWall.DefaultMaxNodes) : ICoupledWallModel
{
    public const string ModelName = "plane-stress panel";

    /// <summary>
    /// The default mesh: the base grid split once (a quarter of the shorter of story height and shortest pier, halved).
    /// Chosen from the refinement study in docs/coupled-walls.md (section 7): on the demo it solves in about a second per
    /// load and its top deflection is about 1% short of the Richardson-extrapolated value (the next mesh: 0.5%, at four
    /// times the nodes).
    /// </summary>
    public const int DefaultRefinement = 1;

    /// <summary>Default largest mesh (nodes), so that a very tall or finely meshed wall is left out rather than left to run for minutes.</summary>
    public const int DefaultMaxNodes = 120_000;

    public string Name => ModelName;

    /// <summary>The options the panel is solved with (the run's solver, which factorises each distinct matrix once), or null.</summary>
    public AnalysisOptions? Options { get; init; }

    /// <summary>The same model solved with <paramref name="options"/>.</summary>
    public PanelCoupledWall On(AnalysisOptions? options) => new(Refinement, ElementSize, Element, TieBeams, MaxNodes) { Options = options };

    public int MeshRefinement => Refinement;

    /// <summary>What the panel is: the coupled wall itself, its piers alone (beams left out), or the solid wall (openings filled).</summary>
    public enum Fill
    {
        /// <summary>The coupled wall: piers, coupling beams, openings.</summary>
        Openings,
        /// <summary>The piers alone, tied at the floors (no coupling beams): independent cantilevers deflecting alike.</summary>
        PiersOnly,
        /// <summary>The wall with no openings.</summary>
        Solid,
    }

    /// <summary>
    /// Why the panel cannot represent the check, or null when it can: the continuum has one thickness and no counterpart
    /// of a stiffness multiplier on the beams' I, and the mesh must stay within the record's MaxNodes.
    /// </summary>
    public string? Unsupported(CoupledWallCheck c)
    {
        long planned = PlannedNodes(c);
        if (planned > MaxNodes)
            return $"its mesh would have about {planned} nodes, more than the limit of {MaxNodes}";
        if (Math.Abs(c.BeamThickness - c.Thickness) > 1e-9 * c.Thickness)
            return "the beams' thickness differs from the piers' (the panel has one thickness)";
        if (c.BeamInertiaFactor != 1)
            return "a multiplier on the beams' I has no plane-stress counterpart";
        return null;
    }

    /// <summary>
    /// Story forces (N) on the floor ties, floor 1 first: the top load on the roof; a uniform load by tributary height.
    /// </summary>
    public static double[] StoryForces(CoupledWallCheck c, CoupledWallLoad load, double magnitude)
    {
        var f = new double[c.Stories];
        if (load == CoupledWallLoad.TopPoint) f[^1] = magnitude;
        else
        {
            for (int j = 0; j < c.Stories; j++) f[j] = magnitude * c.StoryHeight;
            f[^1] = magnitude * c.StoryHeight / 2;
        }
        return f;
    }

    /// <summary>The grid lines (m, the check's x from the wall's left end, y up from the base) of the mesh.</summary>
    public (double[] X, double[] Y) GridLines(CoupledWallCheck c)
    {
        double h = c.StoryHeight, d = c.BeamDepth;
        double s = ElementSize > 0 ? ElementSize : Math.Min(h, c.Piers.Min(p => p.Length)) / 4;
        int split = 1 << Refinement;
        var xs = new List<double> { c.Piers[0].X };
        void Divide(List<double> lines, double to, int parts)
        {
            double from = lines[^1];
            parts *= split;
            for (int k = 1; k < parts; k++) lines.Add(from + (to - from) * k / parts);
            lines.Add(to);
        }
        for (int i = 0; i < c.Piers.Count; i++)
        {
            var p = c.Piers[i];
            Divide(xs, p.X + p.Length, Math.Max(2, (int)Math.Ceiling(p.Length / s - 1e-9)));
            if (i + 1 < c.Piers.Count)
            {
                double b = c.Piers[i + 1].X - p.X - p.Length;
                // An even count puts a grid line at mid-span (the beam-shear cut); elements in the beam no longer than 4d.
                int n = 2 * Math.Max(1, (int)Math.Ceiling(b / (2 * Math.Min(s, 4 * d)) - 1e-9));
                Divide(xs, c.Piers[i + 1].X, n);
            }
        }
        var ys = new List<double> { 0 };
        for (int j = 1; j <= c.Stories; j++)
        {
            Divide(ys, j * h - d, Math.Max(1, (int)Math.Ceiling((h - d) / s - 1e-9)));
            Divide(ys, j * h, Math.Max(1, (int)Math.Ceiling(d / s - 1e-9)));
        }
        return (xs.ToArray(), ys.ToArray());
    }

    /// <summary>Nodes the mesh of the check would have (before meshing).</summary>
    public long PlannedNodes(CoupledWallCheck c)
    {
        var (xs, ys) = GridLines(c);
        int r = Element == PanelElementKind.Quad9 ? 2 : 1;
        return (long)(r * (xs.Length - 1) + 1) * (r * (ys.Length - 1) + 1);
    }

    /// <summary>The panel (with the load as story forces on the ties, case 0) and its mesh.</summary>
    /// <exception cref="ArgumentException">The mesh would exceed the record's MaxNodes.</exception>
    public (WallPanel Panel, PanelMesh Mesh) Build(CoupledWallCheck c, CoupledWallLoad load, double magnitude, Fill fill = Fill.Openings)
    {
        long planned = PlannedNodes(c);
        if (planned > MaxNodes)
            throw new ArgumentException($"coupled wall \"{c.Id}\": the panel mesh would have about {planned} nodes, more than {MaxNodes}");
        double h = c.StoryHeight, d = c.BeamDepth, x0 = c.Piers[0].X, x1 = c.Piers[^1].X + c.Piers[^1].Length;
        var (xs, ys) = GridLines(c);
        var openings = new List<(double Left, double Right)>();
        for (int i = 0; i + 1 < c.Piers.Count; i++) openings.Add((c.Piers[i].X + c.Piers[i].Length, c.Piers[i + 1].X));
        bool Solid(int i, int j)
        {
            double cx = 0.5 * (xs[i] + xs[i + 1]), cy = 0.5 * (ys[j] + ys[j + 1]);
            if (fill == Fill.Solid || !openings.Any(o => cx > o.Left && cx < o.Right)) return true;
            if (fill == Fill.PiersOnly) return false;
            double inStory = cy - Math.Floor(cy / h) * h;
            return inStory > h - d;
        }
        IPlaneElement element = Element == PanelElementKind.Quad4 ? IncompatibleQuad4.Instance : LagrangeQuad9.Instance;
        var mesh = StructuredMesh.Grid(element, xs, ys, Solid);
        double tol = 1e-9 * Math.Max(c.Height, x1 - x0);
        var levels = Enumerable.Range(1, c.Stories).Select(j => j * h).ToArray();
        bool OverOpening(int node) => openings.Any(o => mesh.X[node] > o.Left + tol && mesh.X[node] < o.Right - tol);
        var levelNodes = levels.Select(l => mesh.NodesAtY(l, tol).Where(n => TieBeams || fill == Fill.Solid || !OverOpening(n)).ToArray()).ToArray();
        var levelEdges = levels.Select(l => mesh.EdgesWhere((_, y) => Math.Abs(y - l) <= tol).Where(e => e.Edge == 2).ToList()).ToArray();
        double aspect = 1;
        foreach (var e in mesh.Elements)
        {
            double dx = mesh.X[e[1]] - mesh.X[e[0]], dy = mesh.Y[e[3]] - mesh.Y[e[0]];
            aspect = Math.Max(aspect, Math.Max(dx / dy, dy / dx));
        }
        var gaps = xs.Zip(xs.Skip(1), (a, b) => b - a).Concat(ys.Zip(ys.Skip(1), (a, b) => b - a));
        var pm = new PanelMesh
        {
            Mesh = mesh,
            BaseNodes = mesh.NodesAtY(0, tol),
            Levels = levels,
            LevelNodes = levelNodes,
            LevelEdges = levelEdges,
            ElementSize = gaps.Max(),
            NarrowestStrip = Math.Min(d, c.Piers.Min(p => p.Length)),
            LargestAspect = aspect,
        };
        var forces = StoryForces(c, load, magnitude);
        var panelOpenings = new List<PanelOpening>();
        if (fill == Fill.Openings)
            for (int i = 0; i < openings.Count; i++)
                for (int j = 0; j < c.Stories; j++)
                    panelOpenings.Add(new PanelOpening($"opening {i + 1} story {j + 1}", openings[i].Left - x0, j * h, openings[i].Right - openings[i].Left, h - d));
        var panel = new WallPanel
        {
            Id = $"{c.Id}: {ModelName}", X0 = x0, Y0 = 0, Length = x1 - x0, Height = c.Height, Thickness = c.Thickness,
            MaterialId = c.Material.Id, E = c.Material.E, Nu = c.Material.Nu,
            Openings = panelOpenings,
            FloorLevels = levels[..^1], FloorTies = true,
            Mesh = new PanelMeshSettings(Element, ElementSize, ElementSize > 0 ? 0 : 4, MaxAspect: aspect, MaxNodes: MaxNodes),
            Loads = forces.Select((f, j) => new PanelLoad(0, levels[j], f, 0, PanelLoadPath.Tie)).Where(l => l.Fx != 0).ToArray(),
        };
        return (panel, pm);
    }

    /// <summary>The panel solved: the mesh, the panel analysis and the response.</summary>
    public sealed record Solution(WallPanel Panel, PanelMesh Mesh, PanelResult Result, CoupledWallResponse Response, double[][] BeamShearsFromStress);

    /// <summary>Builds and solves the panel of the check (or its piers alone, or the solid wall) under the load.</summary>
    public Solution SolveFull(CoupledWallCheck c, CoupledWallLoad load, double magnitude, string source, Fill fill = Fill.Openings, AnalysisOptions? options = null)
    {
        var (panel, pm) = Build(c, load, magnitude, fill);
        var r = PanelAnalysis.Run(panel, pm, ["coupled"], options ?? Options, source);
        var cr = r.Analysis.Cases[0];
        var mesh = pm.Mesh;
        int np = c.Piers.Count, ns = c.Stories;
        double tol = 1e-9 * Math.Max(c.Height, panel.Length);

        // Pier base forces from the vertical base reactions (support on the wall): N tension positive, M about the
        // pier centroid, counter-clockwise positive (resisting a load to the right). Horizontal reactions act at y = 0,
        // on the moment's own axis.
        var axial = new double[np];
        var moments = new double[np];
        foreach (var (node, dof, value) in cr.Reactions)
        {
            if (dof != Dof.Y) continue;
            double x = mesh.X[node];
            int i = Enumerable.Range(0, np).First(k => x >= c.Piers[k].X - tol && x <= c.Piers[k].X + c.Piers[k].Length + tol
                || k == np - 1);
            axial[i] -= value;
            moments[i] += (x - c.Piers[i].Centroid) * value;
        }

        // Coupling-beam shear: at the vertical grid line at mid-span of each opening, the vertical nodal forces the
        // beam elements on its left take from the nodes on the line (K_e·u_e). That is the force the right part of the
        // wall exerts on the left part through the cut, exact for the discrete model (no load acts on the beam between
        // its ends, so any cut in the clear span gives the same value). Sign: positive when the beam lifts the left part,
        // which puts pier 1 in tension (the wide-column frame's convention: Σ shears = N₁ at the base).
        var material = new PlaneStressMaterial(panel.E, panel.Nu, panel.Thickness);
        var shears = new double[ns][];
        var fromStress = new double[ns][];
        for (int j = 0; j < ns; j++) { shears[j] = new double[np - 1]; fromStress[j] = new double[np - 1]; }
        var cuts = Enumerable.Range(0, np - 1).Select(i => 0.5 * (c.Piers[i].X + c.Piers[i].Length + c.Piers[i + 1].X)).ToArray();
        int nn = mesh.Element.NodeCount;
        double h = c.StoryHeight, d = c.BeamDepth;
        for (int e = 0; e < mesh.Elements.Length; e++)
        {
            var conn = mesh.Elements[e];
            double xmax = conn.Max(a => mesh.X[a]), cy = conn.Average(a => mesh.Y[a]);
            int cut = Array.FindIndex(cuts, x => Math.Abs(x - xmax) <= tol);
            if (cut < 0) continue;
            int floor = (int)Math.Ceiling(cy / h - 1e-12);          // the beam at the top of story `floor`
            if (floor < 1 || floor > ns || cy < floor * h - d) continue;
            var (x, y) = mesh.ElementCoordinates(e);
            var ke = mesh.Element.Stiffness(x, y, material);
            var ue = new double[2 * nn];
            for (int a = 0; a < nn; a++) { ue[2 * a] = cr.Ux[conn[a]]; ue[2 * a + 1] = cr.Uy[conn[a]]; }
            for (int a = 0; a < nn; a++)
            {
                if (Math.Abs(mesh.X[conn[a]] - xmax) > tol) continue;
                double fy = 0;
                for (int b = 0; b < 2 * nn; b++) fy += ke[2 * a + 1, b] * ue[b];
                shears[floor - 1][cut] += fy;
            }
        }

        // The same shear from the smoothed stresses: ∫ τxy·t dy over the beam depth on the mid-span line (Simpson on
        // each 9-node edge, trapezoid on 4-node edges). Not exact: it carries the stress-recovery error.
        var cutNodes = cuts.Select(x => mesh.NodesAtX(x, tol)).ToArray();
        for (int i = 0; i < np - 1; i++)
            for (int j = 1; j <= ns; j++)
            {
                var pts = cutNodes[i].Where(a => mesh.Y[a] >= j * h - d - tol && mesh.Y[a] <= j * h + tol).OrderBy(a => mesh.Y[a]).ToArray();
                double v = 0;
                int step = nn == 9 ? 2 : 1;
                for (int k = 0; k + step < pts.Length; k += step)
                {
                    double dy = mesh.Y[pts[k + step]] - mesh.Y[pts[k]];
                    v += nn == 9
                        ? dy / 6 * (cr.NodalStress[pts[k], 2] + 4 * cr.NodalStress[pts[k + 1], 2] + cr.NodalStress[pts[k + 2], 2])
                        : dy / 2 * (cr.NodalStress[pts[k], 2] + cr.NodalStress[pts[k + 1], 2]);
                }
                // τxy > 0 on the left part's right face (normal +x) is an upward traction on it: the beam lifts the left part.
                fromStress[j - 1][i] = v * panel.Thickness;
            }

        var heights = pm.Levels.ToArray();
        var disp = r.LevelDisplacements[0];
        var forces = StoryForces(c, load, magnitude);
        double m0 = forces.Select((f, j) => f * heights[j]).Sum();
        string how = $"one plane-stress panel of the wall ({(Element == PanelElementKind.Quad9 ? "9-node" : "4-node incompatible-mode")} quadrilaterals, {mesh.NodeCount} nodes, {r.Analysis.Solve.Unknowns} unknowns, largest element side {ComparisonStudy.G4(pm.ElementSize)} m)"
            + (fill switch
            {
                Fill.Openings => $": in each story the opening runs from the floor below to the underside of the beam (beam span the clear opening, beam-pier joints as flexible as the continuum)",
                Fill.PiersOnly => ": the piers alone, no coupling beams",
                _ => ": the wall with its openings filled",
            })
            + "; base held; a floor tie at every floor (rigid diaphragm, exact); "
            + (load == CoupledWallLoad.TopPoint ? "top load on the roof tie" : "uniform load lumped into story forces on the ties by tributary height (w·h per floor, w·h/2 at the roof; the overturning moment is kept)")
            + "; pier forces from the base reactions, beam shears from the nodal forces at a cut at mid-span";
        var response = new CoupledWallResponse(Name, how, heights, disp, moments, axial, shears, m0, c.Piers.Select(p => p.Centroid).ToArray());
        return new Solution(panel, pm, r, response, fromStress);
    }

    public CoupledWallResponse Solve(CoupledWallCheck c, CoupledWallLoad load, double magnitude, string source, PlaneLateral.Units.UnitSystem units, AnalysisOptions? options = null) =>
        SolveFull(c, load, magnitude, source, options: options).Response;
}
