using PlaneLateral.Assembly;
using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using PlaneLateral.Model;
using PlaneLateral.Solvers;
using PlaneLateral.Units;

namespace PlaneLateral.Analysis;

/// <summary>A plane-stress mesh with its material, restraints and floor ties: everything but the loads.</summary>
public sealed class PlaneStressProblem
{
    public required PlaneMesh Mesh { get; init; }
    public required PlaneStressMaterial Material { get; init; }

    /// <summary>Restrained nodal DOFs (Dof.X or Dof.Y); their values are 0 unless a load prescribes one.</summary>
    public IReadOnlyList<(int Node, Dof Dof)> Restraints { get; init; } = [];

    /// <summary>Floor ties: each is a set of nodes whose horizontal displacements are one unknown (exact constraint).</summary>
    public IReadOnlyList<int[]> HorizontalTies { get; init; } = [];

    /// <summary>
    /// Vertical ties: each is a set of nodes whose vertical displacements are one unknown (exact constraint). With a
    /// horizontal tie over the same nodes it makes a straight edge that translates without rotating (a guided top). The
    /// tie forces sum to zero but form a couple: the moment the guide applies (<see cref="PlaneCaseResult.GuideMoments"/>).
    /// </summary>
    public IReadOnlyList<int[]> VerticalTies { get; init; } = [];

    /// <summary>Label of node i in messages (default "n{i}").</summary>
    public Func<int, string> NodeLabel { get; init; } = i => $"n{i}";

    /// <summary>File named in error messages.</summary>
    public string SourcePath { get; init; } = "<panel>";
}

/// <summary>A distributed load on one element edge (N/m per unit edge length, linear from edge start to end).</summary>
public readonly record struct PlaneEdgeLoad(int Element, int Edge, double Qx1, double Qy1, double Qx2, double Qy2);

/// <summary>One load case on a plane-stress problem.</summary>
public sealed class PlaneLoadCase
{
    public required string Id { get; init; }
    public IReadOnlyList<(int Node, double Fx, double Fy)> NodalForces { get; init; } = [];
    public IReadOnlyList<PlaneEdgeLoad> EdgeLoads { get; init; } = [];

    /// <summary>Horizontal forces (N) on floor ties (index into <see cref="PlaneStressProblem.HorizontalTies"/>).</summary>
    public IReadOnlyList<(int Tie, double Fx)> TieForces { get; init; } = [];

    /// <summary>Non-zero values (m) of restrained DOFs (each must be in <see cref="PlaneStressProblem.Restraints"/>).</summary>
    public IReadOnlyList<(int Node, Dof Dof, double Value)> Prescribed { get; init; } = [];
}

/// <summary>Results of one plane-stress load case. SI units.</summary>
public sealed class PlaneCaseResult
{
    public required string Id { get; init; }
    public required double[] Ux { get; init; }
    public required double[] Uy { get; init; }

    /// <summary>Nodal stresses (N/m²) [node, (σx, σy, τxy)]: Gauss-point values extrapolated in each element and averaged over the elements meeting at the node.</summary>
    public required double[,] NodalStress { get; init; }

    /// <summary>Stresses at every element's Gauss points.</summary>
    public required PlaneStressPoint[][] GaussStress { get; init; }

    /// <summary>Reactions (N) at the restrained DOFs, in restraint order.</summary>
    public required IReadOnlyList<(int Node, Dof Dof, double Value)> Reactions { get; init; }

    /// <summary>
    /// Moment (N·m, counter-clockwise positive) that each vertical tie applies to the mesh: Σ xᵢ·rᵢ over its nodes, rᵢ
    /// the vertical force the tie supplies at node i (the forces sum to zero, so the couple does not depend on the
    /// origin). It is counted with the reactions in <see cref="Equilibrium"/>. Empty without vertical ties.
    /// </summary>
    public IReadOnlyList<double> GuideMoments { get; init; } = [];

    public required EquilibriumCheck Equilibrium { get; init; }
    public required double RelativeResidual { get; init; }

    /// <summary>Normwise backward error, as for frames (Higham 2002, Thm 7.1).</summary>
    public required double BackwardError { get; init; }
}

/// <summary>Everything a plane-stress analysis produced.</summary>
public sealed class PlaneAnalysisResult
{
    public required DofMap Dofs { get; init; }
    public required SolveSummary Solve { get; init; }
    public required IReadOnlyList<PlaneCaseResult> Cases { get; init; }

    /// <summary>Horizontal displacement (m/N) of each floor tie under a unit horizontal force on that tie alone.</summary>
    public required double[] TieFlexibility { get; init; }

    /// <summary>The assembled system (stiffness and one load vector per case given to the analysis), for export (docs/export.md).</summary>
    public LinearSystem? System { get; init; }
}

/// <summary>
/// Linear static analysis of a plane-stress mesh: element stiffnesses assembled once into the sparse system, one
/// factorisation (through <see cref="ISparseSpdSolver"/>), a solve per load case and per floor tie (its flexibility),
/// then reactions, global equilibrium and the backward error per case, and smoothed nodal stresses.
/// </summary>
public static class PlaneStressAnalysis
{
    /// <exception cref="UnstableModelException">The mesh is not held against rigid-body motion.</exception>
    /// <param name="combinations">Factored sums of the cases (index into <paramref name="cases"/>, factor), solved by superposition
    /// and checked like the cases; their results follow the cases'.</param>
    public static PlaneAnalysisResult Run(PlaneStressProblem p, IReadOnlyList<PlaneLoadCase> cases, AnalysisOptions? options = null,
        IReadOnlyList<(string Id, IReadOnlyList<(int Case, double Factor)> Factors)>? combinations = null)
    {
        options = AnalysisOptions.ForOwnRun(options, out var made);   // the run's solver (the user's choice, or the default when none)
        using var ownRun = made;   // a run made here is disposed on return (the result keeps no factor); a caller's run is the caller's
        var solver = options.Solver!;
        var mesh = p.Mesh;
        int n = mesh.NodeCount;

        // The DOF map of the frame engine, on a model holding only the mesh nodes and its restraints: ux, uy free
        // unless restrained, rz unattached (no plane element stiffens it), then the floor ties share equations.
        var restrained = new Dictionary<int, (bool X, bool Y)>();
        foreach (var (node, dof) in p.Restraints)
        {
            restrained.TryGetValue(node, out var s);
            restrained[node] = dof == Dof.X ? (true, s.Y) : (s.X, true);
        }
        var carrier = new StructureModel
        {
            Title = "panel", SourcePath = p.SourcePath, Units = UnitSystem.KilonewtonMetre,
            Materials = [], Sections = [], Members = [], LoadCases = [], Combinations = [], StiffnessPoints = [],
            Nodes = Enumerable.Range(0, n).Select(i => new Node(i, p.NodeLabel(i), mesh.X[i], mesh.Y[i])).ToArray(),
            Supports = restrained.OrderBy(kv => kv.Key).Select(kv => new Support(kv.Key, "panel", kv.Value.X, kv.Value.Y, false, 0, 0, 0)).ToArray(),
        };
        var dofs = DofMap.Build(carrier, []).WithPanelTies(
        [
            .. p.HorizontalTies.Select(t => (IReadOnlyList<(int, Dof)>)t.Select(i => (i, Dof.X)).ToArray()),
            .. p.VerticalTies.Select(t => (IReadOnlyList<(int, Dof)>)t.Select(i => (i, Dof.Y)).ToArray()),
        ]);

        // Element matrices, kept for recovery when there is a case or combination to recover; with none (a stiffness
        // alone, e.g. each sweep point's meshes) every element is computed into one buffer and assembled from it, so
        // the assembly allocates no matrix per element. The sums are the same either way.
        int ne = mesh.Elements.Length, nn = mesh.Element.NodeCount;
        bool recover = cases.Count > 0 || combinations is { Count: > 0 };
        var ke = new double[recover ? ne : 0][,];
        var eqs = new int[recover ? ne : 0][];
        var elementEqs = new int[2 * nn];
        var kElement = new double[2 * nn, 2 * nn];   // the one buffer every element is computed in, when none is kept
        var builder = new SymmetricMatrixBuilder(dofs.FreeCount, ne * nn * (2 * nn + 1));
        for (int e = 0; e < ne; e++)
        {
            var (x, y) = mesh.ElementCoordinates(e);
            if (recover) kElement = mesh.Element.Stiffness(x, y, p.Material);
            else mesh.Element.Stiffness(x, y, p.Material, kElement);
            if (recover) elementEqs = new int[2 * nn];
            for (int a = 0; a < nn; a++)
            {
                elementEqs[2 * a] = dofs.Equation(mesh.Elements[e][a], Dof.X);
                elementEqs[2 * a + 1] = dofs.Equation(mesh.Elements[e][a], Dof.Y);
            }
            if (recover) { ke[e] = kElement; eqs[e] = elementEqs; }
            builder.AddElement(elementEqs, kElement);
        }
        var k = builder.Build();
        var factor = solver.Factorize(k, options.PivotTolerance);
        if (factor.PivotFailures.Count > 0) throw Unstable(p, dofs, factor);
        double kNorm = k.InfinityNorm();

        var results = new List<PlaneCaseResult>();
        var loads = cases.Select(c => Loads(p, dofs, ke, eqs, c)).ToArray();
        var solutions = new double[cases.Count][];
        for (int i = 0; i < cases.Count; i++)
        {
            solutions[i] = new double[dofs.FreeCount];
            factor.Solve(loads[i].F, solutions[i]);
            results.Add(Recover(p, dofs, ke, k, kNorm, cases[i].Id, solutions[i], loads[i].F, loads[i].Fext, loads[i].Prescribed));
        }
        foreach (var (id, factors) in combinations ?? [])
        {
            var u = new double[dofs.FreeCount];
            var f = new double[dofs.FreeCount];
            var fext = new double[2 * n];
            var pre = new double[2 * n];
            foreach (var (ci, fac) in factors)
            {
                for (int j = 0; j < u.Length; j++) { u[j] += fac * solutions[ci][j]; f[j] += fac * loads[ci].F[j]; }
                for (int j = 0; j < 2 * n; j++) { fext[j] += fac * loads[ci].Fext[j]; pre[j] += fac * loads[ci].Prescribed[j]; }
            }
            results.Add(Recover(p, dofs, ke, k, kNorm, id, u, f, fext, pre));
        }

        var flex = new double[p.HorizontalTies.Count];
        for (int t = 0; t < flex.Length; t++)
        {
            int eq = dofs.Equation(p.HorizontalTies[t][0], Dof.X);
            var b = new double[dofs.FreeCount];
            var u = new double[dofs.FreeCount];
            b[eq] = 1;
            factor.Solve(b, u);
            flex[t] = u[eq];
        }
        return new PlaneAnalysisResult
        {
            Dofs = dofs,
            Solve = new SolveSummary(solver.DescriptionFor(dofs.FreeCount), dofs.FreeCount, k.NonZerosLower, factor.FactorNonZeros, cases.Count + flex.Length),
            Cases = results,
            TieFlexibility = flex,
            System = new LinearSystem { Stiffness = k, CaseIds = cases.Select(c => c.Id).ToArray(), LoadVectors = loads.Select(l => l.F).ToArray() },
        };
    }

    /// <summary>External nodal forces (N) as applied, index 2·node + (0 for x, 1 for y); a tie force at the tie's first node.</summary>
    internal static double[] ExternalForces(PlaneStressProblem p, PlaneLoadCase c)
    {
        var mesh = p.Mesh;
        var fext = new double[2 * mesh.NodeCount];
        foreach (var (node, fx, fy) in c.NodalForces) { fext[2 * node] += fx; fext[2 * node + 1] += fy; }
        foreach (var el in c.EdgeLoads)
        {
            var local = mesh.Element.EdgeNodes(el.Edge);
            var nodes = local.Select(a => mesh.Elements[el.Element][a]).ToArray();
            var fe = EdgeLoad.Consistent(nodes.Select(i => mesh.X[i]).ToArray(), nodes.Select(i => mesh.Y[i]).ToArray(), el.Qx1, el.Qy1, el.Qx2, el.Qy2);
            for (int a = 0; a < nodes.Length; a++) { fext[2 * nodes[a]] += fe[2 * a]; fext[2 * nodes[a] + 1] += fe[2 * a + 1]; }
        }
        foreach (var (tie, fx) in c.TieForces) fext[2 * p.HorizontalTies[tie][0]] += fx;
        return fext;
    }

    /// <summary>External nodal forces as applied, prescribed values, and the right-hand side over the unknowns.</summary>
    private static (double[] Fext, double[] Prescribed, double[] F) Loads(PlaneStressProblem p, DofMap dofs, double[][,] ke, int[][] eqs, PlaneLoadCase c)
    {
        var mesh = p.Mesh;
        int n = mesh.NodeCount, nn = mesh.Element.NodeCount;
        var fext = ExternalForces(p, c);

        var prescribed = new double[2 * n];
        foreach (var (node, dof, value) in c.Prescribed)
        {
            if (dofs.State(node, dof) != DofState.Restrained) throw new ArgumentException($"a prescribed displacement at {p.NodeLabel(node)} {DofNames.Name(dof)} is not on a restrained DOF");
            prescribed[2 * node + (int)dof] = value;
        }

        var f = new double[dofs.FreeCount];
        for (int i = 0; i < n; i++)
            for (int d = 0; d < 2; d++)
            {
                int eq = dofs.Equation(i, (Dof)d);
                if (eq >= 0) f[eq] += fext[2 * i + d];
            }
        for (int e = 0; e < ke.Length; e++)
            for (int b = 0; b < 2 * nn; b++)
            {
                int node = mesh.Elements[e][b / 2];
                double v = prescribed[2 * node + b % 2];
                if (v == 0) continue;
                for (int a = 0; a < 2 * nn; a++) if (eqs[e][a] >= 0) f[eqs[e][a]] -= ke[e][a, b] * v;
            }

        return (fext, prescribed, f);
    }

    private static PlaneCaseResult Recover(PlaneStressProblem p, DofMap dofs, double[][,] ke, SymmetricSparseMatrix k, double kNorm,
        string id, double[] u, double[] f, double[] fext, double[] prescribed)
    {
        var mesh = p.Mesh;
        int n = mesh.NodeCount, nn = mesh.Element.NodeCount;
        var error = SolveError.Of(k, kNorm, u, f);

        var ux = new double[n];
        var uy = new double[n];
        for (int i = 0; i < n; i++)
        {
            int ex = dofs.Equation(i, Dof.X), ey = dofs.Equation(i, Dof.Y);
            ux[i] = ex >= 0 ? u[ex] : prescribed[2 * i];
            uy[i] = ey >= 0 ? u[ey] : prescribed[2 * i + 1];
        }

        // Forces the elements take from the nodes; at a restrained DOF the reaction is that less the load applied there.
        var fint = new double[2 * n];
        var gauss = new PlaneStressPoint[ke.Length][];
        var stress = new double[n, 3];
        var count = new int[n];
        for (int e = 0; e < ke.Length; e++)
        {
            var conn = mesh.Elements[e];
            var ue = new double[2 * nn];
            for (int a = 0; a < nn; a++) { ue[2 * a] = ux[conn[a]]; ue[2 * a + 1] = uy[conn[a]]; }
            for (int a = 0; a < 2 * nn; a++)
            {
                double s = 0;
                for (int b = 0; b < 2 * nn; b++) s += ke[e][a, b] * ue[b];
                fint[2 * conn[a / 2] + a % 2] += s;
            }
            var (x, y) = mesh.ElementCoordinates(e);
            gauss[e] = mesh.Element.GaussStresses(x, y, p.Material, ue);
            var ns = mesh.Element.NodalStresses(x, y, p.Material, ue);
            for (int a = 0; a < nn; a++)
            {
                for (int j = 0; j < 3; j++) stress[conn[a], j] += ns[a, j];
                count[conn[a]]++;
            }
        }
        for (int i = 0; i < n; i++)
            if (count[i] > 0) for (int j = 0; j < 3; j++) stress[i, j] /= count[i];

        var reactions = new List<(int, Dof, double)>();
        double rx = 0, ry = 0, rm = 0;
        foreach (var (node, dof) in p.Restraints)
        {
            double r = fint[2 * node + (int)dof] - fext[2 * node + (int)dof];
            reactions.Add((node, dof, r));
            if (dof == Dof.X) { rx += r; rm -= mesh.Y[node] * r; } else { ry += r; rm += mesh.X[node] * r; }
        }
        // A vertical tie's forces (what the elements take less the load, as for a reaction) sum to zero: their couple
        // is the guide's moment, a reaction of the panel as a whole.
        var guide = new double[p.VerticalTies.Count];
        for (int t = 0; t < guide.Length; t++)
        {
            foreach (int node in p.VerticalTies[t]) guide[t] += mesh.X[node] * (fint[2 * node + 1] - fext[2 * node + 1]);
            rm += guide[t];
        }
        double ax = 0, ay = 0, am = 0;
        for (int i = 0; i < n; i++) { ax += fext[2 * i]; ay += fext[2 * i + 1]; am += mesh.X[i] * fext[2 * i + 1] - mesh.Y[i] * fext[2 * i]; }

        return new PlaneCaseResult
        {
            Id = id,
            Ux = ux,
            Uy = uy,
            NodalStress = stress,
            GaussStress = gauss,
            Reactions = reactions,
            GuideMoments = guide,
            Equilibrium = new EquilibriumCheck(ax, ay, am, rx, ry, rm),
            RelativeResidual = error.RelativeResidual,
            BackwardError = error.BackwardError,
        };
    }

    private static UnstableModelException Unstable(PlaneStressProblem p, DofMap dofs, ISparseSpdFactor factor) =>
        UnstableModelException.FromFactor(p.SourcePath, dofs, p.NodeLabel, factor);
}
