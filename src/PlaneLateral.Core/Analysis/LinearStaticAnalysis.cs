using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>Settings of a linear static analysis.</summary>
public sealed record AnalysisOptions
{
    /// <summary>The sparse SPD solver; null picks the default sparse solver.</summary>
    public ISparseSpdSolver? Solver { get; init; }

    /// <summary>A pivot below this fraction of its original diagonal marks a mechanism.</summary>
    public double PivotTolerance { get; init; } = 1e-10;

    /// <summary>
    /// The options of one analysis run: the solver the user chose (the default when none) wrapped once in a
    /// <see cref="FactorOnceSolver"/>, so that every stage of the run uses that solver and no matrix is factorised twice.
    /// This is the one place where the default solver stands in for a choice not made.
    /// </summary>
    public static AnalysisOptions ForRun(AnalysisOptions? options)
    {
        options ??= new AnalysisOptions();
        return options.Solver is FactorOnceSolver ? options : options with { Solver = new FactorOnceSolver(options.Solver ?? DefaultSolver.Create()) };
    }

    /// <summary>
    /// <see cref="ForRun(AnalysisOptions?)"/>, and the run it made (null when <paramref name="options"/> already carried
    /// one, whose maker owns it): a caller whose results keep no factor disposes it when done, so that a large factor's
    /// native memory goes back at once (<see cref="FactorOnceSolver.Dispose"/>).
    /// </summary>
    public static AnalysisOptions ForOwnRun(AnalysisOptions? options, out FactorOnceSolver? made)
    {
        var run = ForRun(options);
        made = ReferenceEquals(run.Solver, options?.Solver) ? null : (FactorOnceSolver)run.Solver!;
        return run;
    }
}

/// <summary>
/// Linear static analysis of a planar frame model: assemble K once, factorise once, solve every load case and
/// every stiffness point on that factor, superpose the combinations, and check each result (residual and global
/// equilibrium).
/// </summary>
public static partial class LinearStaticAnalysis
{
    /// <exception cref="UnstableModelException">The model is a mechanism.</exception>
    /// <exception cref="ModelInputException">A load acts on a DOF that nothing can resist (e.g. a moment at a pinned-only joint).</exception>
    public static AnalysisResult Run(StructureModel model, AnalysisOptions? options = null)
    {
        options = AnalysisOptions.ForRun(options);
        var system = Setup(model, options);
        var prepared = SeismicAnalysis.Stage(model, system).Model;   // the generated story-force case, if any (docs/seismic.md)
        return Solve(prepared, system, options);
    }

    /// <summary>
    /// The frame's assembled system of one run, wall panels linked to it condensed in, factorised once: the stiffness
    /// the static, period, story-force and second-order stages all work on.
    /// </summary>
    internal sealed class FrameSystem
    {
        public required FrameElement[] Elements { get; init; }
        public required DofMap Dofs { get; init; }
        internal LinkedPanels? Links { get; init; }
        public required SymmetricSparseMatrix K { get; init; }
        public required ISparseSpdFactor Factor { get; init; }
        public required ISparseSpdSolver Solver { get; init; }
        public required AnalysisOptions Options { get; init; }
        /// <summary>True when wall panels are linked to the frame (their condensed stiffness is part of <see cref="K"/>).</summary>
        public bool HasLinkedPanels => Links is not null;
        /// <summary>True when a pivot failed: the model is a mechanism (reported by <see cref="Solve"/>).</summary>
        public bool Singular => Factor.PivotFailures.Count > 0;
    }

    /// <summary>
    /// Stage 1 of a run: members, DOF map, linked panels condensed onto their frame nodes, the stiffness assembled and
    /// factorised once with the run's solver. A mechanism is not reported here but by <see cref="Solve"/>.
    /// </summary>
    internal static FrameSystem Setup(StructureModel model, AnalysisOptions options)
    {
        var solver = options.Solver ?? throw new ArgumentException("the run's options carry no solver (use AnalysisOptions.ForRun)", nameof(options));
        var elements = model.Members.Select(m => new FrameElement(m, model.Nodes[m.Start], model.Nodes[m.End])).ToArray();
        var dofs = DofMap.Build(model, elements);
        var links = LinkedPanels.Prepare(model, options);   // wall panels tied to frame nodes (LinearStaticAnalysis.PanelLinks.cs)
        if (links is not null) dofs = dofs.WithAttachedRotations(links.Masters);
        CheckLoadsOnHeldRotations(model, dofs);
        var k = links is null ? Assemble(model, elements, dofs) : links.Assemble(model, elements, dofs);
        var factor = solver.Factorize(k, options.PivotTolerance);
        return new FrameSystem { Elements = elements, Dofs = dofs, Links = links, K = k, Factor = factor, Solver = solver, Options = options };
    }

    /// <summary>
    /// The static stage of a run: every load case and stiffness point solved on the system's one factor, the
    /// combinations superposed, each result checked. <paramref name="model"/> is the model with its generated cases filled in.
    /// </summary>
    /// <exception cref="UnstableModelException">The model is a mechanism.</exception>
    internal static AnalysisResult Solve(StructureModel model, FrameSystem system, AnalysisOptions options)
    {
        var (elements, dofs, links, k, factor, solver) = (system.Elements, system.Dofs, system.Links, system.K, system.Factor, system.Solver);
        if (factor.PivotFailures.Count > 0) throw Unstable(model, dofs, factor);
        double kNorm = k.InfinityNorm();
        var condition = Conditioning.Estimate(model, elements, k, factor);

        var memberLoads = model.LoadCases.Select(c => GroupByMember(c, model.Members.Count)).ToArray();
        var loadVectors = model.LoadCases.Select((c, i) => LoadVector(model, elements, dofs, c, memberLoads[i])).ToArray();
        links?.AddFixedEndForces(loadVectors, dofs);

        var cases = new List<CaseResult>();
        var solutions = new List<double[]>();
        for (int i = 0; i < model.LoadCases.Count; i++)
        {
            var u = new double[dofs.FreeCount];
            factor.Solve(loadVectors[i], u);
            solutions.Add(u);
            var lc = model.LoadCases[i];
            cases.Add(Recover(model, elements, dofs, k, kNorm, lc.Id, lc.Description, false, u, loadVectors[i], memberLoads[i], Applied(model, elements, lc)));
        }

        foreach (var combo in model.Combinations)
        {
            var u = new double[dofs.FreeCount];
            var f = new double[dofs.FreeCount];
            var loads = Enumerable.Range(0, model.Members.Count).Select(_ => new List<MemberLoad>()).ToArray();
            var applied = new double[3];
            foreach (var (ci, factorValue) in combo.Factors)
            {
                for (int j = 0; j < u.Length; j++) { u[j] += factorValue * solutions[ci][j]; f[j] += factorValue * loadVectors[ci][j]; }
                for (int m = 0; m < loads.Length; m++)
                    foreach (var ml in memberLoads[ci][m])
                        loads[m].Add(ml with { WStart = factorValue * ml.WStart, WEnd = factorValue * ml.WEnd });
                var a = Applied(model, elements, model.LoadCases[ci]);
                for (int d = 0; d < 3; d++) applied[d] += factorValue * a[d];
            }
            var grouped = loads.Select(l => (IReadOnlyList<MemberLoad>)l).ToArray();
            cases.Add(Recover(model, elements, dofs, k, kNorm, combo.Id, combo.Description, true, u, f, grouped, applied));
        }

        var stiffness = new List<StiffnessResult>();
        foreach (var p in model.StiffnessPoints)
        {
            int eq = dofs.Equation(p.Node, p.Direction);
            var b = new double[dofs.FreeCount];
            var u = new double[dofs.FreeCount];
            b[eq] = 1.0;
            factor.Solve(b, u);
            stiffness.Add(new StiffnessResult(p, u[eq], 1.0 / u[eq]));
        }

        CheckFinite(model, cases, stiffness);
        var linkResults = links?.Finish(model, elements, dofs, cases, options);
        return new AnalysisResult
        {
            Model = model,
            Dofs = dofs,
            Solve = new SolveSummary(solver.DescriptionFor(dofs.FreeCount), dofs.FreeCount, k.NonZerosLower, factor.FactorNonZeros, model.LoadCases.Count + model.StiffnessPoints.Count),
            Cases = cases,
            Stiffness = stiffness,
            Notes = Conditioning.WithNote(Notes(model, dofs), condition),
            Conditioning = condition,
            // With linked panels, K and the load vectors are the frame's with the panels condensed onto their frame nodes.
            System = new LinearSystem { Stiffness = k, CaseIds = model.LoadCases.Select(c => c.Id).ToArray(), LoadVectors = loadVectors },
            Panels = Panels(model, links, options),
            PanelLinks = linkResults,
        };
    }

    /// <summary>
    /// Every wall panel's result, in model order: a linked panel's from its recovery; the others solved, independent
    /// of one another, side by side on the processors when there are several (each stored at its own index, each solve
    /// the same arithmetic on any thread, so the results do not depend on the processors). A failure is reported for the
    /// first failing panel in model order, as a one-by-one run would.
    /// </summary>
    private static PanelResult[] Panels(StructureModel model, LinkedPanels? links, AnalysisOptions options)
    {
        int n = model.Panels.Count;
        var results = new PanelResult[n];
        for (int i = 0; i < n; i++) results[i] = links?.Result(model.Panels[i])!;
        var own = Enumerable.Range(0, n).Where(i => results[i] is null).ToArray();
        if (own.Length <= 1)
        {
            foreach (int i in own) results[i] = RunPanel(model, model.Panels[i], options);
            return results;
        }
        var errors = new Exception?[n];
        Parallel.ForEach(own, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i =>
        {
            try { results[i] = RunPanel(model, model.Panels[i], options); }
            catch (Exception e) { errors[i] = e; }
        });
        if (errors.FirstOrDefault(e => e is not null) is { } first) System.Runtime.ExceptionServices.ExceptionDispatchInfo.Throw(first);
        return results;
    }

    /// <summary>
    /// Solves one wall panel. The element once refused a collapsed element on a refined mesh (the fuzzer's "x": 1e15:
    /// nodes placed where doubles are 0.125 m apart); the layout check (PanelLayout.Plan) now refuses that input before
    /// any work, at its key, as it does grid lines a hair apart and a "maxAspect" above 100, and the property test
    /// (tests/.../Panels/MeshPropertyTests.cs) shows that every accepted layout meshes into elements the element accepts.
    /// The catch stays as a last guard only: should an element still refuse a mesh the check let through, the user gets
    /// an input error naming the panel (exit 2), not a crash. Reaching it is a bug of the layout check.
    /// </summary>
    private static PanelResult RunPanel(StructureModel model, WallPanel panel, AnalysisOptions options)
    {
        try
        {
            if (model.Footings.FirstOrDefault(f => f.Panel == panel.Id) is { } ft)   // a panel on a footing (Analysis/PanelOnFooting.cs)
                return PanelOnFooting.Run(panel, model.LoadCases.Select(c => c.Id).ToArray(),
                    ft.SpringDirections.Contains(Dof.X) ? ft.Springs.Sliding : double.PositiveInfinity,
                    ft.SpringDirections.Contains(Dof.Y) ? ft.Springs.Vertical : double.PositiveInfinity,
                    ft.SpringDirections.Contains(Dof.RZ) ? ft.Springs.Rocking : double.PositiveInfinity, options, model.SourcePath, model.Combinations);
            return PanelAnalysis.Run(panel, model.LoadCases.Select(c => c.Id).ToArray(), options, model.SourcePath, model.Combinations);
        }
        catch (ArgumentException e)
        {
            throw new ModelInputException([new ModelDiagnostic(model.SourcePath, 0, 0, $"panel \"{panel.Id}\"",
                $"panel \"{panel.Id}\" cannot be solved: {e.Message}",
                "check the panel's length, height, openings and floor levels, and its mesh settings (fewer refinements or a coarser element size)")]);
        }
    }

    /// <summary>Assembles the global stiffness of the unknowns (members and support springs).</summary>
    public static SymmetricSparseMatrix Assemble(StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs)
    {
        var builder = new SymmetricMatrixBuilder(dofs.FreeCount, 21 * elements.Count + dofs.FreeCount);
        AddFrame(builder, model, elements, dofs);
        return builder.Build();
    }

    /// <summary>Adds the members and support springs to a builder whose first equations are the frame's.</summary>
    private static void AddFrame(SymmetricMatrixBuilder builder, StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs)
    {
        foreach (var e in elements) builder.AddElement(dofs.ElementEquations(e.Member), e.GlobalStiffness);
        foreach (var s in model.Supports)
            for (int d = 0; d < 3; d++)
            {
                double ks = s.Spring((Dof)d);
                int eq = dofs.Equation(s.Node, (Dof)d);
                if (ks > 0 && eq >= 0) builder.AddDiagonal(eq, ks);
            }
    }

    /// <summary>
    /// Refuses results that overflowed: numbers in the model so far apart in magnitude that double precision cannot
    /// hold the answer. The message says where to look instead of returning NaN.
    /// </summary>
    private static void CheckFinite(StructureModel model, List<CaseResult> cases, List<StiffnessResult> stiffness)
    {
        var bad = cases.Where(c => c.Displacements.Any(v => !double.IsFinite(v)) || c.MemberForces.Any(f => !double.IsFinite(f.M1 + f.M2 + f.V1 + f.N1))).Select(c => c.Id)
            .Concat(stiffness.Where(s => !double.IsFinite(s.Stiffness) || s.Stiffness <= 0).Select(s => s.Point.Label)).ToList();
        if (bad.Count == 0) return;
        throw new ModelInputException([new ModelDiagnostic(model.SourcePath, 0, 0, "",
            $"the results of {string.Join(", ", bad.Select(b => $"\"{b}\""))} overflow double precision: loads, stiffnesses or sizes in the model differ by too many orders of magnitude",
            "check the units and exponents of loads, E, A, I and springs")]);
    }

    private static IReadOnlyList<MemberLoad>[] GroupByMember(LoadCase c, int memberCount)
    {
        var lists = Enumerable.Range(0, memberCount).Select(_ => new List<MemberLoad>()).ToArray();
        foreach (var ml in c.MemberLoads) lists[ml.Member].Add(ml);
        return lists.Select(l => (IReadOnlyList<MemberLoad>)l).ToArray();
    }

    private static double[] LoadVector(StructureModel model, FrameElement[] elements, DofMap dofs, LoadCase c, IReadOnlyList<MemberLoad>[] memberLoads)
    {
        var f = new double[dofs.FreeCount];
        foreach (var nl in c.NodalLoads)
        {
            AddAt(f, dofs.Equation(nl.Node, Dof.X), nl.Fx);
            AddAt(f, dofs.Equation(nl.Node, Dof.Y), nl.Fy);
            AddAt(f, dofs.Equation(nl.Node, Dof.RZ), nl.Mz);
        }
        for (int m = 0; m < elements.Length; m++)
        {
            if (memberLoads[m].Count == 0) continue;
            var fe = elements[m].GlobalEquivalentLoads(memberLoads[m]);
            var eqs = dofs.ElementEquations(elements[m].Member);
            for (int d = 0; d < 6; d++) AddAt(f, eqs[d], fe[d]);
        }
        return f;

        static void AddAt(double[] v, int eq, double value) { if (eq >= 0) v[eq] += value; }
    }

    /// <summary>Total applied Fx, Fy and moment about the origin, from the loads as written (not from element vectors).</summary>
    private static double[] Applied(StructureModel model, FrameElement[] elements, LoadCase c)
    {
        double fx = 0, fy = 0, mz = 0;
        foreach (var nl in c.NodalLoads)
        {
            var n = model.Nodes[nl.Node];
            fx += nl.Fx; fy += nl.Fy; mz += nl.Mz + n.X * nl.Fy - n.Y * nl.Fx;
        }
        foreach (var ml in c.MemberLoads)
        {
            // Integrate the load as written along the member's geometry: the integrand is at most quadratic in s,
            // so the three-point Gauss rule is exact.
            var e = elements[ml.Member];
            var start = model.Nodes[e.Member.Start];
            var (qx1, qx2, qy1, qy2) = e.LocalIntensity(ml);
            for (int g = 0; g < 3; g++)
            {
                double xi = Gauss3.Points[g], w = Gauss3.Weights[g] * e.Length;
                double qx = qx1 + (qx2 - qx1) * xi, qy = qy1 + (qy2 - qy1) * xi;
                double px = qx * e.Cos - qy * e.Sin, py = qx * e.Sin + qy * e.Cos;   // local x = (c, s), local y = (−s, c)
                double x = start.X + xi * e.Length * e.Cos, y = start.Y + xi * e.Length * e.Sin;
                fx += w * px; fy += w * py; mz += w * (x * py - y * px);
            }
        }
        return [fx, fy, mz];
    }

    private static CaseResult Recover(StructureModel model, FrameElement[] elements, DofMap dofs, SymmetricSparseMatrix k, double kNormInf,
        string id, string description, bool isCombination, double[] u, double[] f, IReadOnlyList<MemberLoad>[] memberLoads, double[] applied)
    {
        int n = model.Nodes.Count;
        var full = new double[3 * n];
        for (int j = 0; j < full.Length; j++)   // through each DOF's equation: nodes tied by a diaphragm read the shared one
        {
            int eq = dofs.Equation(j / 3, (Dof)(j % 3));
            if (eq >= 0) full[j] = u[eq];
        }

        var error = SolveError.Of(k, kNormInf, u, f);   // residual and backward error of the solve

        // Member end forces and the forces members take from each node.
        var nodeForce = new double[3 * n];
        var memberForces = new MemberEndForces[elements.Length];
        for (int m = 0; m < elements.Length; m++)
        {
            var e = elements[m];
            var ue = new double[6];
            for (int d = 0; d < 3; d++) { ue[d] = full[3 * e.Member.Start + d]; ue[d + 3] = full[3 * e.Member.End + d]; }
            var fl = e.LocalEndForces(ue, memberLoads[m]);
            memberForces[m] = new MemberEndForces(m, fl[0], fl[1], fl[2], fl[3], fl[4], fl[5]);
            var fg = e.GlobalNodeForces(ue, memberLoads[m]);
            for (int d = 0; d < 3; d++) { nodeForce[3 * e.Member.Start + d] += fg[d]; nodeForce[3 * e.Member.End + d] += fg[d + 3]; }
        }

        // Reactions: what the members take from a supported node, less the load applied straight to it; springs push back with −k·u.
        var reactions = new List<Reaction>();
        double rxSum = 0, rySum = 0, rmSum = 0;
        foreach (var s in model.Supports)
        {
            var r = new double[3];
            for (int d = 0; d < 3; d++)
            {
                double spring = s.Spring((Dof)d);
                if (s.Restrains((Dof)d)) r[d] = nodeForce[3 * s.Node + d] - DirectNodalLoad(model, id, isCombination, s.Node, d);
                else if (spring > 0) r[d] = -spring * full[3 * s.Node + d];
            }
            reactions.Add(new Reaction(s.Node, r[0], r[1], r[2]));
            var node = model.Nodes[s.Node];
            rxSum += r[0]; rySum += r[1]; rmSum += r[2] + node.X * r[1] - node.Y * r[0];
        }

        return new CaseResult
        {
            Id = id,
            IsCombination = isCombination,
            Description = description,
            Displacements = full,
            Reactions = reactions,
            MemberForces = memberForces,
            Equilibrium = new EquilibriumCheck(applied[0], applied[1], applied[2], rxSum, rySum, rmSum),
            RelativeResidual = error.RelativeResidual,
            BackwardError = error.BackwardError,
        };
    }

    /// <summary>The nodal load applied directly at (node, dof) in a case or, for a combination, the factored sum.</summary>
    private static double DirectNodalLoad(StructureModel model, string id, bool isCombination, int node, int dof)
    {
        double Of(LoadCase c) => c.NodalLoads.Where(l => l.Node == node).Sum(l => dof == 0 ? l.Fx : dof == 1 ? l.Fy : l.Mz);
        if (!isCombination) return Of(model.LoadCases.First(c => c.Id == id));
        var combo = model.Combinations.First(c => c.Id == id);
        return combo.Factors.Sum(f => f.Factor * Of(model.LoadCases[f.Case]));
    }

    private static void CheckLoadsOnHeldRotations(StructureModel model, DofMap dofs)
    {
        var problems = new List<ModelDiagnostic>();
        foreach (var c in model.LoadCases)
            foreach (var nl in c.NodalLoads)
                if (nl.Mz != 0 && dofs.State(nl.Node, Dof.RZ) == DofState.Unattached)
                    problems.Add(new ModelDiagnostic(model.SourcePath, 0, 0, $"load case \"{c.Id}\"",
                        $"a moment is applied at node \"{model.Nodes[nl.Node].Id}\", where no member, support or spring resists rotation (every member there is a brace or released)",
                        "apply the moment where a member without a release meets the node, or remove a moment release there"));
        if (problems.Count > 0) throw new ModelInputException(problems);
    }

    private static IReadOnlyList<string> Notes(StructureModel model, DofMap dofs)
    {
        var held = Enumerable.Range(0, model.Nodes.Count).Where(i => dofs.State(i, Dof.RZ) == DofState.Unattached).Select(i => model.Nodes[i].Id).ToList();
        if (held.Count == 0) return [];
        return [$"Rotation held at {held.Count} node(s) where only braces or released members meet ({string.Join(", ", held.Take(10))}{(held.Count > 10 ? ", ..." : "")}); nothing there resists rotation, so holding it changes no result."];
    }

    private static UnstableModelException Unstable(StructureModel model, DofMap dofs, ISparseSpdFactor factor) =>
        UnstableModelException.FromFactor(model.SourcePath, dofs, n => model.Nodes[n].Id, factor);
}
