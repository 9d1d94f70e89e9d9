using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>
/// One story of the stability check (ASCE 7-16 §12.8.7, from memory — confirm the edition) beside the second-order
/// analysis. SI: N, m.
/// </summary>
/// <param name="Px">Vertical gravity load at and above the story (N), from the gravity case by statics across the story's cut: the members crossing it and the wall panels linked to the frame.</param>
/// <param name="Vx">Story shear of the story-force case (N).</param>
/// <param name="ElasticDrift">First-order elastic drift δ_e (m).</param>
/// <param name="DesignDrift">Δ = C_d·δ_e/I_e (m).</param>
/// <param name="Theta">θ = P_x·Δ·I_e/(V_x·h_sx·C_d).</param>
/// <param name="ThetaMax">θ_max = 0.5/(β·C_d), not above 0.25.</param>
/// <param name="Status">"may be neglected" (θ ≤ 0.10), "P-delta to be included" (0.10 &lt; θ ≤ θ_max), "EXCEEDS theta max".</param>
/// <param name="SecondOrderDrift">Elastic drift of the second-order analysis (m).</param>
/// <param name="Ratio">Second- over first-order drift.</param>
/// <param name="Estimate">1/(1 − θ).</param>
public sealed record StabilityRow(StoryResult Story, double Px, double Vx, double ElasticDrift, double DesignDrift, double Theta, double ThetaMax,
    string Status, double SecondOrderDrift, double Ratio, double Estimate);

/// <summary>Everything the seismic block adds: periods and story forces, the story results of the generated case, the
/// stability coefficient and second-order drifts per story, drift checks on the second-order drift and the gravity load
/// factor to buckling.</summary>
public sealed class SeismicResult
{
    public required StoryForces Forces { get; init; }
    public required CaseStories Stories { get; init; }
    public required IReadOnlyList<StabilityRow> Stability { get; init; }
    /// <summary>The drift checks that name the story-force case, on its second-order drift (case id "… (2nd order)").</summary>
    public required IReadOnlyList<DriftCheckRow> SecondOrderDriftChecks { get; init; }
    /// <summary>Factor on the gravity load at which the structure buckles (dense solve; NaN when not worked out, +∞ when the gravity load does not soften it).</summary>
    public required double CriticalLoadFactor { get; init; }

    /// <summary>
    /// The seismic results of a solved model, worked out again from its model (one more factorisation of K and of
    /// K + K_G); null when it has no seismic block. A run (<see cref="ModelRun"/>) holds them already: read
    /// <see cref="ModelResult.Seismic"/> there.
    /// </summary>
    public static SeismicResult? Of(AnalysisResult r, AnalysisOptions? options = null)
    {
        options = AnalysisOptions.ForRun(options);
        var system = LinearStaticAnalysis.Setup(r.Model, options);
        return SecondOrderAnalysis.Seismic(r, SeismicAnalysis.Stage(r.Model, system), system);
    }
}

/// <summary>
/// Second-order (P-Δ) analysis: the elastic stiffness plus the geometric stiffness of every member under its axial
/// force from a gravity case or combination, (K + K_G)·u = f, for a lateral case. The gravity case is taken as it
/// is (no iteration: its axial forces are those of the linear solve).
/// </summary>
public static class SecondOrderAnalysis
{
    public const double NeglectLimit = 0.10;

    /// <summary>θ_max = 0.5/(β·C_d) ≤ 0.25 (§12.8.7, from memory).</summary>
    public static double ThetaMax(double beta, double cd) => Math.Min(0.5 / (beta * cd), 0.25);

    /// <summary>θ = P_x·Δ·I_e/(V_x·h_sx·C_d) (§12.8.7, from memory).</summary>
    public static double Theta(double px, double designDrift, double ie, double vx, double h, double cd) => px * designDrift * ie / (vx * h * cd);

    /// <summary>Full nodal displacements (3 per node) of <paramref name="lateralCase"/> with the geometric stiffness of <paramref name="gravityCase"/>.</summary>
    /// <exception cref="ModelInputException">The gravity load buckles the structure.</exception>
    public static double[] Solve(StructureModel model, string gravityCase, string lateralCase, AnalysisOptions? options = null)
    {
        options = AnalysisOptions.ForRun(options);
        var system = LinearStaticAnalysis.Setup(model, options);
        if (system.Singular) throw new InvalidOperationException("the model is a mechanism; run the linear analysis for the details");
        var cf = new LinearStaticAnalysis.CondensedFrame(model, system);
        var f2 = CheckStable(cf, system.Factor, gravityCase, system.Solver);
        return Solve(cf, f2, lateralCase);
    }

    /// <summary>The second-order displacements of <paramref name="lateralCase"/> on the run's factor of K + K_G (linked panels condensed in).</summary>
    internal static double[] Solve(LinearStaticAnalysis.CondensedFrame cf, ISparseSpdFactor secondOrder, string lateralCase)
    {
        var (model, dofs) = (cf.Model, cf.Dofs);
        var f = cf.LoadVector(lateralCase);
        var u = new double[dofs.FreeCount];
        secondOrder.Solve(f, u);
        var full = new double[3 * model.Nodes.Count];
        for (int j = 0; j < full.Length; j++)
        {
            int eq = dofs.Equation(j / 3, (Dof)(j % 3));
            if (eq >= 0) full[j] = u[eq];
        }
        return full;
    }

    /// <summary>
    /// The geometric stiffness of a gravity case, scaled by λ, as element matrices on the unknowns: each member under
    /// its axial force (<see cref="GeometricStiffness.Global"/>), and for each wall panel linked to the frame, in each
    /// story, the story P-Δ term of the vertical load P_p the panel carries across the story's cut: the shear
    /// P_p·Δ/h that the load, displaced by the story drift Δ, adds (a leaning column of load P_p over the story height h;
    /// the same P-Δ the stability coefficient θ = P_x·Δ/(V_x·h) measures, common practice). Δ is the story drift as the
    /// story results take it, the mean x displacement of the top level's nodes less that of the bottom level's, so the
    /// term is −(λ·P_p/h)·a·aᵀ with a the coefficients of that difference on the x unknowns. A panel's own plane-stress
    /// geometric stiffness (the bowing of the wall between floors under its in-plane stresses) is left out.
    /// </summary>
    internal static List<(int[] Eqs, double[,] K)> GeometricTerms(LinearStaticAnalysis.CondensedFrame cf, double[] ug, string gravityCase, double lambda)
    {
        var model = cf.Model;
        var dofs = cf.Dofs;
        var axial = GeometricStiffness.AxialForces(model, cf.Elements, dofs, ug, gravityCase);
        var list = cf.Elements.Select(e => (dofs.ElementEquations(e.Member), GeometricStiffness.Global(e, lambda * axial[e.Member.Index]))).ToList();
        if (!cf.HasLinks) return list;
        var links = cf.LinkForces(ug, gravityCase);
        var lv = model.Building.Levels;
        for (int i = 1; i < lv.Count; i++)
        {
            double h = lv[i].Elevation - lv[i - 1].Elevation;
            double yc = StoryAnalysis.CutElevation(model, lv[i - 1].Elevation, lv[i].Elevation);
            double p = model.Panels.Where(x => x.Links.Count > 0).Sum(x => PanelVerticalLoad(model, x, links, gravityCase, yc));
            if (p == 0 || h <= 0 || lv[i].Nodes.Count == 0) continue;
            var a = new Dictionary<int, double>();
            void Add(Level l, double sign)
            {
                foreach (int n in l.Nodes)
                {
                    int eq = dofs.Equation(n, Dof.X);
                    if (eq >= 0) a[eq] = a.GetValueOrDefault(eq) + sign / l.Nodes.Count;
                }
            }
            Add(lv[i], 1);
            Add(lv[i - 1], -1);
            var eqs = a.Keys.Order().ToArray();
            var k = new double[eqs.Length, eqs.Length];
            for (int r = 0; r < eqs.Length; r++)
                for (int c = 0; c < eqs.Length; c++) k[r, c] = -lambda * p / h * a[eqs[r]] * a[eqs[c]];
            list.Add((eqs, k));
        }
        return list;
    }

    /// <summary>
    /// The vertical load (N, compression positive) a linked panel carries across a horizontal cut at <paramref name="yc"/>
    /// in a case, by statics of the panel with its links (derived, as <see cref="StoryPanels"/> does for the shear):
    /// when its base is below the cut, P = −(Σ Fy of the links whose frame node is at or above the cut + Σ Fy of its own
    /// loads at or above the cut); zero when its base is at or above the cut.
    /// </summary>
    internal static double PanelVerticalLoad(StructureModel model, WallPanel panel, IReadOnlyList<(WallPanel Panel, int Node, double Fx, double Fy, double Mz)> links,
        string caseId, double yc)
    {
        if (panel.Y0 >= yc) return 0;
        double above = links.Where(l => ReferenceEquals(l.Panel, panel) && model.Nodes[l.Node].Y >= yc).Sum(l => l.Fy);
        foreach (var (c, fac) in Parts(model, caseId))
            above += panel.Loads.Where(l => l.Case == c && panel.Y0 + l.Level >= yc).Sum(l => fac * l.Fy);
        return -above;
    }

    private static IReadOnlyList<(int Case, double Factor)> Parts(StructureModel model, string id)
    {
        int i = model.LoadCases.ToList().FindIndex(c => c.Id == id);
        return i >= 0 ? [(i, 1.0)] : model.Combinations.First(c => c.Id == id).Factors;
    }

    /// <summary>
    /// Factorises K + K_G with <paramref name="solver"/> (the run's); a failed pivot means the gravity load buckles the
    /// structure, reported naming the story.
    /// </summary>
    internal static ISparseSpdFactor CheckStable(LinearStaticAnalysis.CondensedFrame cf, ISparseSpdFactor elastic, string gravityCase, ISparseSpdSolver solver)
    {
        var model = cf.Model;
        var dofs = cf.Dofs;
        var ug = new double[dofs.FreeCount];
        elastic.Solve(cf.LoadVector(gravityCase), ug);
        var f2 = solver.Factorize(cf.Stiffness(GeometricTerms(cf, ug, gravityCase, 1.0)));
        if (f2.PivotFailures.Count == 0) return f2;
        var problems = new List<ModelDiagnostic>();
        // One message per story where pivots failed, naming the DOFs found there (in elimination order).
        foreach (var g in f2.PivotFailures.Select(p => dofs.DofOf(p.Dof)).GroupBy(d => StoryOf(model, model.Nodes[d.Node].Y)).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var at = g.Select(d => $"\"{model.Nodes[d.Node].Id}\" {DofNames.Name(d.Dof)}").ToList();
            problems.Add(new ModelDiagnostic(model.SourcePath, 0, 0, "$.seismic.secondOrder.gravity",
                $"the gravity load \"{gravityCase}\" buckles the structure {g.Key}: with the geometric stiffness of the members' axial forces{(cf.HasLinks ? " and the linked panels' vertical loads" : "")} the stiffness loses positive definiteness at {string.Join(", ", at.Take(6))}{(at.Count > 6 ? ", ..." : "")}",
                "check the gravity loads and their units, the column and wall sections and the bracing of that story; a second-order analysis needs a gravity load below the buckling load"));
        }
        throw new ModelInputException(problems);
    }

    private static string StoryOf(StructureModel model, double y)
    {
        var lv = model.Building.Levels;
        if (lv.Count < 2) return "(the model has no levels to name a story)";
        for (int i = 1; i < lv.Count; i++)
            if (y <= lv[i].Elevation + 1e-9) return $"in story {i} ({lv[i - 1].Id}–{lv[i].Id})";
        return $"above the top level {lv[^1].Id}";
    }

    /// <summary>
    /// The factor λ on the gravity load at which det(K + λ·K_G) = 0, the smallest positive one: from the dense
    /// eigenproblem L⁻¹(−K_G)L⁻ᵀ·y = (1/λ)·y with K = L·Lᵀ. For models of up to <paramref name="maxUnknowns"/> unknowns; NaN beyond.
    /// </summary>
    public static double CriticalLoadFactor(StructureModel model, string gravityCase, int maxUnknowns = 400, AnalysisOptions? options = null)
    {
        options = AnalysisOptions.ForRun(options);
        var system = LinearStaticAnalysis.Setup(model, options);
        return CriticalLoadFactor(new LinearStaticAnalysis.CondensedFrame(model, system), system, gravityCase, maxUnknowns);
    }

    /// <summary>
    /// <see cref="CriticalLoadFactor(StructureModel, string, int, AnalysisOptions)"/> on a run's system: the gravity axial
    /// forces are solved on its factor of K (linked panels condensed in). The eigenproblem needs K's Cholesky factor as a
    /// dense matrix, so for the (small) models it is made for, K is also factorised densely here (MathNet.Numerics).
    /// </summary>
    internal static double CriticalLoadFactor(LinearStaticAnalysis.CondensedFrame cf, LinearStaticAnalysis.FrameSystem system, string gravityCase, int maxUnknowns = 400)
    {
        var (dofs, factor, ks) = (cf.Dofs, system.Factor, system.K);
        if (dofs.FreeCount > maxUnknowns) return double.NaN;
        if (factor.PivotFailures.Count > 0) return double.NaN;
        var ug = new double[dofs.FreeCount];
        factor.Solve(cf.LoadVector(gravityCase), ug);
        var k = ks.ToDense();
        int n = k.GetLength(0);
        var kg = cf.Stiffness(GeometricTerms(cf, ug, gravityCase, 1.0)).ToDense();
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) kg[i, j] -= k[i, j];   // K_G alone
        // C = L⁻¹ (−K_G) L⁻ᵀ with K = L·Lᵀ by MathNet.Numerics' dense Cholesky (which refuses a K that is not positive
        // definite instead of taking the root of a negative pivot); the two triangular solves through one LU of L (MathNet
        // has no public triangular solve; partial pivoting on a triangular matrix keeps the solve backward stable).
        Matrix<double> kd;
        try { kd = Matrix<double>.Build.DenseOfArray(k).Cholesky().Factor; }
        catch (ArgumentException) { return double.NaN; }   // K not positive definite: no critical factor to report
        var lu = kd.LU();
        var y = lu.Solve(-Matrix<double>.Build.DenseOfArray(kg));   // L⁻¹ (−K_G)
        var c = lu.Solve(y.Transpose()).ToArray();                   // L⁻¹ (L⁻¹ (−K_G))ᵀ = L⁻¹ (−K_G) L⁻ᵀ, K_G symmetric
        for (int i = 0; i < n; i++) for (int j = 0; j < i; j++) c[i, j] = c[j, i] = 0.5 * (c[i, j] + c[j, i]);
        var (mu, _) = SymmetricEigen.Solve(c);
        return mu.Length == 0 || mu[0] <= 0 ? double.PositiveInfinity : 1 / mu[0];
    }

    /// <summary>
    /// Vertical force (N, +y) member <paramref name="e"/> carries across a horizontal cut at <paramref name="yc"/>: the
    /// y-components of its end forces at the upper flexible face, F = N·sin α + V·cos α, plus its distributed load
    /// between the cut and that face, p_y = q_x·sin α + q_y·cos α (the companion of <see cref="StoryAnalysis.ShearAcrossCut"/>).
    /// Summed over the members crossing the cut it is the vertical load above the cut.
    /// </summary>
    public static double VerticalAcrossCut(StructureModel model, FrameElement e, MemberEndForces f, IReadOnlyList<(MemberLoad Load, double Factor)> loads, double yc)
    {
        var m = e.Member;
        double y1 = model.Nodes[m.Start].Y, y2 = model.Nodes[m.End].Y;
        double sCut = (yc - y1) / (y2 - y1) * e.Length;
        double face, from, to;
        if (y2 > y1) { face = f.N2 * e.Sin + f.V2 * e.Cos; (from, to) = (sCut, e.Length - m.RigidEnd); }
        else { face = f.N1 * e.Sin + f.V1 * e.Cos; (from, to) = (m.RigidStart, sCut); }
        double load = 0;
        foreach (var (ml, factor) in loads)
        {
            var (qx1, qx2, qy1, qy2) = e.LocalIntensity(ml);
            double Py(double s) => (qx1 + (qx2 - qx1) * s / e.Length) * e.Sin + (qy1 + (qy2 - qy1) * s / e.Length) * e.Cos;
            load += factor * (to - from) * 0.5 * (Py(from) + Py(to));
        }
        return face + load;
    }

    /// <summary>
    /// The seismic stage's results of a solved model: story results of the generated case, the stability coefficient,
    /// the second-order drifts on the stage's factor of K + K_G, and the buckling load factor.
    /// </summary>
    internal static SeismicResult? Seismic(AnalysisResult r, SeismicAnalysis.SeismicStage stage, LinearStaticAnalysis.FrameSystem system)
    {
        var model = r.Model;
        if (model.Seismic is not { } s) return null;
        if (stage.Forces is not { } forces) return null;
        var lateral = r.Case(s.CaseId);
        var stories = StoryAnalysis.ForCase(r, lateral);
        var rows = new List<StabilityRow>();
        var drift2 = new List<DriftCheckRow>();
        double critical = double.NaN;
        if (s.SecondOrder is { } so)
        {
            var cf = new LinearStaticAnalysis.CondensedFrame(model, system);
            var u2 = Solve(cf, stage.SecondOrder ?? throw new InvalidOperationException("the seismic stage made no factor of K + K_G"), s.CaseId);
            var levels = model.Building.Levels;
            var ux2 = levels.Select(l => l.Nodes.Count == 0 ? 0 : l.Nodes.Average(n => u2[3 * n])).ToArray();
            var gravity = r.Case(so.GravityCase);
            var loads = StoryAnalysis.MemberLoadsOf(model, gravity);
            var elements = system.Elements;
            double thetaMax = ThetaMax(so.Beta, so.Cd);
            // The link forces of the gravity case, for the vertical load the linked panels carry across each cut.
            int gi = StoryPanels.IndexOf(r, gravity);
            var linkForces = r.PanelLinks is null ? [] : r.PanelLinks.Cases[gi].Forces
                .Select(f => (model.Panels.First(p => p.Id == f.Panel), f.Node, f.Fx, f.Fy, f.Mz)).ToList();
            foreach (var st in stories.Stories)
            {
                double px = 0;
                for (int m = 0; m < elements.Length; m++)
                {
                    double ya = model.Nodes[model.Members[m].Start].Y, yb = model.Nodes[model.Members[m].End].Y;
                    if (Math.Min(ya, yb) < st.CutElevation && st.CutElevation < Math.Max(ya, yb))
                        px -= VerticalAcrossCut(model, elements[m], gravity.MemberForces[m], loads[m], st.CutElevation);
                }
                foreach (var p in model.Panels.Where(p => p.Links.Count > 0)) px += PanelVerticalLoad(model, p, linkForces, so.GravityCase, st.CutElevation);
                double de = st.Drift, design = DriftCheck.Amplified(de, so.Cd, so.Ie);
                double theta = Theta(px, Math.Abs(design), so.Ie, Math.Abs(st.Shear), st.Height, so.Cd);
                string status = theta > thetaMax ? "EXCEEDS theta max" : theta > NeglectLimit ? "P-delta to be included" : "may be neglected";
                double d2 = ux2[st.Top.Index] - ux2[st.Bottom.Index];
                rows.Add(new StabilityRow(st, px, st.Shear, de, design, theta, thetaMax, status, d2, d2 / de, 1 / (1 - theta)));
            }
            foreach (var check in model.Building.DriftChecks.Where(c => c.Cases.Contains(s.CaseId)))
                foreach (var row in rows)
                {
                    double a = DriftCheck.Amplified(row.SecondOrderDrift, check.Cd, check.Ie);
                    double ratio = Math.Abs(a) / row.Story.Height;
                    drift2.Add(new DriftCheckRow(check, s.CaseId + " (2nd order)", row.Story, row.SecondOrderDrift, a, ratio, check.AllowedRatio, ratio <= check.AllowedRatio, 1 - ratio / check.AllowedRatio));
                }
            critical = CriticalLoadFactor(cf, system, so.GravityCase);
        }
        return new SeismicResult { Forces = forces, Stories = stories, Stability = rows, SecondOrderDriftChecks = drift2, CriticalLoadFactor = critical };
    }
}
