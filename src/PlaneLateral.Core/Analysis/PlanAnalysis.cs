using PlaneLateral.Elements;
using MathNet.Numerics.LinearAlgebra.Double;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// Analysis of a building in plan with planar lines (docs/plan.md): each line is condensed exactly onto its level
/// lateral DOFs (one factorisation of the line, one unit load per level: the flexibility F on the levels, K̂ = F⁻¹ —
/// static condensation, Przemieniecki, <i>Theory of Matrix Structural Analysis</i>, 1968, ch. 9), mapped to the floors'
/// (Ux, Uy, Rz) by u_line = cos α·Ux + sin α·Uy + r·Rz with r = x₀ sin α − y₀ cos α, and assembled K = Σ Tᵀ K̂ T
/// (pseudo-three-dimensional analysis: Weaver &amp; Nelson, J. Struct. Div. ASCE 92(ST6), 1966). The floor system is
/// solved for every case, each line's planar model is recovered under the level forces the floors put on it, and the
/// whole is checked: ΣFx, ΣFy, ΣMz of the line forces against the floor loads and the backward error of every solve.
/// </summary>
public static class PlanAnalysis
{
    /// <summary>An eigenvalue of the scaled floor stiffness below this fraction of the largest marks a free floor motion.</summary>
    public const double MechanismTolerance = 1e-10;

    /// <exception cref="UnstableModelException">The lines cannot hold a floor in some direction or in rotation (names the floor DOF).</exception>
    /// <param name="condensed">The lines' condensations when already made (PlanSeismic makes them for the modes), else null.</param>
    public static PlanResult Run(BuildingPlan plan, AnalysisOptions? options = null, IReadOnlyList<Condensation>? condensed = null)
    {
        options = AnalysisOptions.ForRun(options);   // one solver for the run: each line's stiffness factorised once (condensation and recovery)
        int n = plan.FloorCount;
        condensed ??= plan.Lines.Select(l => Condense(l, n, options)).ToList();
        // Floors that bend (docs/plan.md): their own assembly; rigid floors keep the path below unchanged.
        if (plan.Floors.Any(f => f.Kind != FloorKind.Rigid)) return PlanDiaphragm.Result(plan, condensed, options);
        var k = Assemble(plan.Lines, condensed.Select(c => c.K).ToList(), n);
        double size = plan.Size;
        CheckStable(plan, k, size);

        var scaled = Scaled(k, n, size);
        var chol = Factor(plan, scaled);
        var locked = Translational(k, n);
        var lockedChol = DenseMatrix.OfArray(locked).Cholesky();

        var cases = new List<(PlanLoadCase Case, double[] U, double[] ULocked, double Eta)>();
        foreach (var c in plan.Cases)
        {
            var f = LoadVector(c, n);
            var fs = (double[])f.Clone();
            for (int l = 0; l < n; l++) fs[3 * l + 2] /= size;   // the torque over the plan size: a force, like the others
            var us = chol.Solve(DenseVector.OfArray(fs)).ToArray();
            double eta = BackwardError(scaled, us, fs);
            var u = (double[])us.Clone();
            for (int l = 0; l < n; l++) u[3 * l + 2] /= size;    // Rz = (Rz·size) / size
            var ft = new double[2 * n];
            for (int l = 0; l < n; l++) { ft[2 * l] = f[3 * l]; ft[2 * l + 1] = f[3 * l + 1]; }
            var ut = lockedChol.Solve(DenseVector.OfArray(ft)).ToArray();
            eta = Math.Max(eta, BackwardError(locked, ut, ft));
            var ul = new double[3 * n];
            for (int l = 0; l < n; l++) { ul[3 * l] = ut[2 * l]; ul[3 * l + 1] = ut[2 * l + 1]; }
            cases.Add((c, u, ul, eta));
        }

        // Level forces on each line, per case: p = K̂ (T u).
        var lineForces = plan.Lines.Select((line, i) => cases.Select(c => SmallMatrix.Times(condensed[i].K, Project(line, c.U, n))).ToArray()).ToArray();
        var lineForcesLocked = plan.Lines.Select((line, i) => cases.Select(c => SmallMatrix.Times(condensed[i].K, Project(line, c.ULocked, n))).ToArray()).ToArray();

        var lineResults = new List<PlanLineResult>();
        for (int i = 0; i < plan.Lines.Count; i++)
            lineResults.Add(Recover(plan.Lines[i], condensed[i], cases.Select(c => c.Case.Id).ToList(), lineForces[i], cases.Select(c => Project(plan.Lines[i], c.U, n)).ToList(), options));

        var caseResults = new List<PlanCaseResult>();
        for (int ci = 0; ci < cases.Count; ci++)
        {
            var (c, u, ul, eta) = cases[ci];
            var motion = Enumerable.Range(0, n).Select(l => new FloorMotion(l + 1, u[3 * l], u[3 * l + 1], u[3 * l + 2])).ToList();
            var lockedMotion = Enumerable.Range(0, n).Select(l => new FloorMotion(l + 1, ul[3 * l], ul[3 * l + 1], 0)).ToList();
            var stories = StoryLoads(c, n);
            var lineStories = LineStories(plan, ci, stories, lineResults, i => lineForces[i][ci], i => lineForcesLocked[i][ci], i => Project(plan.Lines[i], u, n));
            caseResults.Add(new PlanCaseResult(c, motion, lockedMotion, eta, Equilibrium(plan, c, lineForces.Select(lf => lf[ci]).ToList(), size),
                stories, lineStories, Vertices(plan, motion)) { Points = PointMotions(plan, (l, p) => motion[l].At(p)) });
        }

        return new PlanResult
        {
            Plan = plan,
            Lines = lineResults,
            FloorStiffness = new MatrixView(k),
            Cases = caseResults,
            Rigidity = Rigidity(plan, condensed.Select(c => c.K).ToList()),
            Irregularity = Irregularity(plan, caseResults),
            DriftChecks = plan.DriftLimit is { } lim ? DriftChecks(plan, caseResults, lim) : [],
            Diaphragms = PlanDiaphragm.Study(plan, condensed.Select(c => c.K).ToList()),
        };
    }

    /// <summary>
    /// Each line's story shear (the sum of its level forces above the cut), share of the story shear along its direction,
    /// direct and torsional parts, planar story shear by member statics and story drift, every story of case
    /// <paramref name="ci"/>, from its level forces, level forces with rotation held and level displacements (per line).
    /// </summary>
    internal static List<PlanLineStory> LineStories(BuildingPlan plan, int ci, IReadOnlyList<PlanStoryLoad> stories, IReadOnlyList<PlanLineResult> lineResults,
        Func<int, double[]> forces, Func<int, double[]> forcesLocked, Func<int, double[]> displacements)
    {
        int n = plan.FloorCount;
        var lineStories = new List<PlanLineStory>();
        // Each line's planar story shears once per case (every story at once), not once per story: asked per story they
        // cost 2.4 s of a 3.8 s run on a 40-story, 24-line building (docs/benchmarks.md).
        var planarStories = lineResults.Select(lr => PlanarStoryShears(lr, ci)).ToList();   // panel lines by statics too
        var p = Enumerable.Range(0, plan.Lines.Count).Select(forces).ToList();
        var pl = Enumerable.Range(0, plan.Lines.Count).Select(forcesLocked).ToList();
        var ul = Enumerable.Range(0, plan.Lines.Count).Select(displacements).ToList();
        for (int s = 1; s <= n; s++)
            for (int i = 0; i < plan.Lines.Count; i++)
            {
                var line = plan.Lines[i];
                double v = Above(p[i], s), vd = Above(pl[i], s);
                var st = stories[s - 1];
                double along = line.Cos * st.Vx + line.Sin * st.Vy;
                double scale = Math.Max(Math.Abs(st.Vx), Math.Abs(st.Vy));
                double share = Math.Abs(along) > 1e-9 * scale && scale > 0 ? v / along : double.NaN;
                var planar = planarStories[i];
                double planarShear = planar.Count >= s ? planar[s - 1] : double.NaN;
                double drift = ul[i][s - 1] - (s >= 2 ? ul[i][s - 2] : 0);
                lineStories.Add(new PlanLineStory(s, line.Id, v, share, vd, v - vd, planarShear, drift));
            }
        return lineStories;
    }

    /// <summary>A line condensed on its levels: K̂ (N/m) and the checks of the condensation.</summary>
    public sealed record Condensation(double[,] K, double SymmetryError, double BackwardError);

    /// <summary>
    /// The line's stiffness on its level DOFs: its planar model is factorised once and solved for a unit force at each
    /// level (F_ij = ux at level i under the unit force at level j), and K̂ = F⁻¹ (exact static condensation onto the
    /// loaded DOFs, since F is the corresponding block of K⁻¹ — derived).
    /// </summary>
    public static Condensation Condense(PlanLine line, int floors, AnalysisOptions? options = null)
    {
        var units = Enumerable.Range(0, floors).Select(j => Enumerable.Range(0, floors).Select(i => i == j ? 1.0 : 0.0).ToArray()).ToList();
        var r = LinearStaticAnalysis.Run(Loaded(line, units.Select((_, j) => $"unit {j + 1}").ToList(), units, "unit force at a level"), options);
        var flex = new double[floors, floors];
        for (int j = 0; j < floors; j++)
            for (int i = 0; i < floors; i++) flex[i, j] = LevelDisplacement(line, r, j, i);
        double biggest = 0, asym = 0;
        for (int i = 0; i < floors; i++)
            for (int j = 0; j < floors; j++) { biggest = Math.Max(biggest, Math.Abs(flex[i, j])); asym = Math.Max(asym, Math.Abs(flex[i, j] - flex[j, i])); }
        for (int i = 0; i < floors; i++)
            for (int j = 0; j < i; j++) flex[i, j] = flex[j, i] = 0.5 * (flex[i, j] + flex[j, i]);
        var kk = DenseMatrix.OfArray(flex).Inverse().ToArray();
        for (int i = 0; i < floors; i++)
            for (int j = 0; j < i; j++) kk[i, j] = kk[j, i] = 0.5 * (kk[i, j] + kk[j, i]);
        return new Condensation(kk, biggest == 0 ? 0 : asym / biggest, WorstBackwardError(line, r));
    }

    /// <summary>
    /// The line's model loaded by level forces only, one case per entry of <paramref name="forces"/> (N, lowest level
    /// first): on its level nodes (a line of members), or on its panel's floor ties (a panel line). Its own cases,
    /// combinations, checks, seismic block and its panels' own story forces (which refer to its own cases) are set aside.
    /// </summary>
    private static StructureModel Loaded(PlanLine line, IReadOnlyList<string> ids, IReadOnlyList<double[]> forces, string description)
    {
        var m = line.Model;
        var b = m.Building;
        var cases = ids.Select((id, ci) => new LoadCase(id, description,
            line.Panel >= 0 ? [] : forces[ci].Select((p, l) => new NodalLoad(line.LevelNodes[l], p, 0, 0)).ToList(), [])).ToList();
        var panels = m.Panels.Select((p, i) => i != line.Panel ? (p.Loads.Count == 0 ? p : p with { Loads = [] }) : p with
        {
            Loads = Enumerable.Range(0, ids.Count).SelectMany(ci => forces[ci].Select((f, l) => (f, l)).Where(x => x.f != 0)
                .Select(x => new PanelLoad(ci, p.Levels[line.LevelNodes[x.l]], x.f, 0, PanelLoadPath.Tie))).ToList(),
        }).ToList();
        return m with
        {
            LoadCases = cases, Combinations = [], StiffnessPoints = [], Comparisons = [], Seismic = null, Panels = panels,
            Building = new BuildingData { Levels = b.Levels, MemberLines = b.MemberLines, Lines = b.Lines, Modifiers = b.Modifiers, CrackedSections = b.CrackedSections },
        };
    }

    /// <summary>The line's displacement (m) along it at its level <paramref name="level"/> (0 = the lowest floor) in case <paramref name="ci"/>: its level node's ux, or its panel's floor tie.</summary>
    internal static double LevelDisplacement(PlanLine line, AnalysisResult r, int ci, int level) =>
        line.Panel >= 0 ? r.Panels[line.Panel].LevelDisplacements[ci][line.LevelNodes[level]] : r.Cases[ci].Displacement(line.LevelNodes[level], Dof.X);

    /// <summary>Worst backward error of a line's solves: its frame's cases and, for a panel line, its panel's.</summary>
    internal static double WorstBackwardError(PlanLine line, AnalysisResult r) =>
        r.Cases.Select(c => c.BackwardError).Concat(line.Panel >= 0 ? r.Panels[line.Panel].Analysis.Cases.Select(c => c.BackwardError) : []).DefaultIfEmpty(0).Max();

    /// <summary>
    /// The recovered line's story shears (N, story 1 first) in case <paramref name="ci"/> by statics of its own model,
    /// beside the floors' numbers: a line of members by its members' forces across each story's cut
    /// (<see cref="StoryAnalysis"/>); a panel line by its base reactions and the tie forces below the cut
    /// (<see cref="StoryPanels"/>: V(y_c) = −(Σ base Rx + Σ tie forces below y_c)).
    /// </summary>
    internal static IReadOnlyList<double> PlanarStoryShears(PlanLineResult lr, int ci)
    {
        var r = lr.Recovered;
        if (lr.Line.Panel < 0) return StoryAnalysis.ForCase(r, r.Cases[ci]).Stories.Select(s => s.Shear).ToList();
        var p = r.Model.Panels[lr.Line.Panel];
        var actions = StoryPanels.HorizontalActions(r, lr.Line.Panel, ci);
        var lv = p.Levels.Prepend(0.0).ToList();
        return Enumerable.Range(1, lv.Count - 1).Select(s => StoryPanels.ShearAcrossCut(actions, p.Y0 + 0.5 * (lv[s - 1] + lv[s]))).ToList();
    }

    /// <summary>K = Σ Tᵀ K̂ T on (Ux, Uy, Rz) per floor, T's row i = (cos α, sin α, r) at floor i.</summary>
    public static double[,] Assemble(IReadOnlyList<PlanLine> lines, IReadOnlyList<double[,]> condensed, int floors)
    {
        var k = new double[3 * floors, 3 * floors];
        for (int li = 0; li < lines.Count; li++)
        {
            var t = new[] { lines[li].Cos, lines[li].Sin, lines[li].Lever };
            var kh = condensed[li];
            for (int i = 0; i < floors; i++)
                for (int j = 0; j < floors; j++)
                    for (int a = 0; a < 3; a++)
                        for (int b = 0; b < 3; b++) k[3 * i + a, 3 * j + b] += t[a] * kh[i, j] * t[b];
        }
        return k;
    }

    /// <summary>
    /// K on (Ux, Uy, Rz·size): with D = diag(1, 1, 1/size) per floor, D·K·D has every entry in N/m (a rotational
    /// stiffness N·m/rad over size²), so its eigenvalues compare translations and turns on one scale.
    /// </summary>
    internal static double[,] Scaled(double[,] k, int n, double size)
    {
        var s = (double[,])k.Clone();
        for (int i = 0; i < 3 * n; i++)
            for (int j = 0; j < 3 * n; j++) s[i, j] /= (i % 3 == 2 ? size : 1) * (j % 3 == 2 ? size : 1);
        return s;
    }

    internal static double[,] Translational(double[,] k, int n)
    {
        var t = new double[2 * n, 2 * n];
        for (int i = 0; i < 2 * n; i++)
            for (int j = 0; j < 2 * n; j++) t[i, j] = k[3 * (i / 2) + i % 2, 3 * (j / 2) + j % 2];
        return t;
    }

    /// <summary>
    /// Refuses floors that can move without resistance, naming the floor DOFs. Each line's K̂ is positive definite (the
    /// inverse of the flexibility of a planar model that factorised without a failed pivot), so uᵀKu = Σ (T u)ᵀ K̂ (T u)
    /// vanishes exactly when every line's row t = (cos α, sin α, r) is orthogonal to some floor's (Ux, Uy, Rz): the
    /// floors are held if and only if the lines' rows span all three directions (derived; the same rows act at every
    /// floor, since every line reaches every level). The test is on the 3 × 3 matrix Σ t·tᵀ with r over the plan size,
    /// so it does not depend on the lines' stiffnesses or on the number of floors. It replaced an eigenvalue test of K
    /// itself, whose spread grows with the floors (about n⁴ for a tall cantilever): it called a 400-story slender wall a
    /// mechanism, and cost a dense eigen decomposition of 3·floors rows on every run.
    /// </summary>
    internal static void CheckStable(BuildingPlan plan, double[,] k, double size)
    {
        var g = new double[3, 3];
        foreach (var line in plan.Lines)
        {
            var t = new[] { line.Cos, line.Sin, line.Lever / size };
            for (int a = 0; a < 3; a++)
                for (int b = 0; b < 3; b++) g[a, b] += t[a] * t[b];
        }
        var (values, vectors) = SymmetricEigen.Solve(g);
        double top = Math.Max(values[0], 0);
        var free = Enumerable.Range(0, 3).Where(m => !(top > 0 && values[m] > MechanismTolerance * top)).ToList();
        if (free.Count == 0) return;
        var mechanisms = new List<Mechanism>();
        for (int f = 1; f <= plan.FloorCount; f++)
            foreach (int m in free)
            {
                double big = Enumerable.Range(0, 3).Max(i => Math.Abs(vectors[i, m]));
                NamedDof Name(int i) => new($"floor {plan.Levels[f].Id}", (Dof)i);
                var moving = Enumerable.Range(0, 3).Where(i => Math.Abs(vectors[i, m]) > 1e-6 * big)   // the turn first when the floor turns
                    .OrderByDescending(i => i == 2 && Math.Abs(vectors[i, m]) > 0.1 * big ? 1 : 0).ThenByDescending(i => Math.Abs(vectors[i, m])).ThenBy(i => i).ToList();
                mechanisms.Add(new Mechanism(Name(moving[0]), moving.Select(Name).ToList()));
            }
        throw new UnstableModelException(plan.SourcePath, mechanisms);
    }

    /// <summary>
    /// The Cholesky factor of the floor stiffness <paramref name="a"/> (scaled, <see cref="Scaled"/>). The lines' rows
    /// span all three directions (<see cref="CheckStable"/>), so K is positive definite in exact arithmetic; should
    /// round-off still defeat the factorisation, the free motion is named by the eigenvectors of the smallest
    /// eigenvalues instead of a bare failure.
    /// </summary>
    internal static MathNet.Numerics.LinearAlgebra.Factorization.Cholesky<double> Factor(BuildingPlan plan, double[,] a)
    {
        try { return DenseMatrix.OfArray(a).Cholesky(); }
        catch (ArgumentException) { }
        int n = plan.FloorCount;
        var (values, vectors) = SymmetricEigen.Solve(a);
        double top = Math.Max(values[0], 0);
        var mechanisms = new List<Mechanism>();
        for (int m = values.Length - 1; m >= 0 && (mechanisms.Count == 0 || !(top > 0 && values[m] > MechanismTolerance * top)); m--)
        {
            double big = 0;
            for (int i = 0; i < 3 * n; i++) big = Math.Max(big, Math.Abs(vectors[i, m]));
            NamedDof Name(int i) => new($"floor {plan.Levels[i / 3 + 1].Id}", (Dof)(i % 3));
            var moving = Enumerable.Range(0, 3 * n).Where(i => Math.Abs(vectors[i, m]) > 1e-6 * big)
                .OrderByDescending(i => Math.Abs(vectors[i, m])).ThenBy(i => i).ToList();
            mechanisms.Add(new Mechanism(Name(moving[0]), moving.Select(Name).ToList()));
        }
        throw new UnstableModelException(plan.SourcePath, mechanisms);
    }

    internal static double[] LoadVector(PlanLoadCase c, int n)
    {
        var f = new double[3 * n];
        foreach (var l in c.Loads) { f[3 * (l.Level - 1)] += l.Fx; f[3 * (l.Level - 1) + 1] += l.Fy; f[3 * (l.Level - 1) + 2] += l.Mz; }
        return f;
    }

    /// <summary>The line's level displacements u_i = cos α·Ux_i + sin α·Uy_i + r·Rz_i (m).</summary>
    public static double[] Project(PlanLine line, double[] u, int n)
    {
        var v = new double[n];
        for (int l = 0; l < n; l++) v[l] = line.Cos * u[3 * l] + line.Sin * u[3 * l + 1] + line.Lever * u[3 * l + 2];
        return v;
    }

    internal static double Above(double[] p, int story)
    {
        double v = 0;
        for (int l = story - 1; l < p.Length; l++) v += p[l];
        return v;
    }

    internal static double BackwardError(double[,] a, double[] x, double[] b)
    {
        int n = b.Length;
        double r = 0, an = 0, xn = 0, bn = 0;
        for (int i = 0; i < n; i++)
        {
            double s = -b[i], row = 0;
            for (int j = 0; j < n; j++) { s += a[i, j] * x[j]; row += Math.Abs(a[i, j]); }
            r = Math.Max(r, Math.Abs(s)); an = Math.Max(an, row); xn = Math.Max(xn, Math.Abs(x[i])); bn = Math.Max(bn, Math.Abs(b[i]));
        }
        double d = an * xn + bn;
        return d == 0 ? 0 : r / d;
    }

    internal static List<PlanStoryLoad> StoryLoads(PlanLoadCase c, int n)
    {
        var list = new List<PlanStoryLoad>();
        for (int s = 1; s <= n; s++)
        {
            var above = c.Loads.Where(l => l.Level >= s).ToList();
            list.Add(new PlanStoryLoad(s, above.Sum(l => l.Fx), above.Sum(l => l.Fy), above.Sum(l => l.Mz)));
        }
        return list;
    }

    internal static PlanEquilibrium Equilibrium(BuildingPlan plan, PlanLoadCase c, IReadOnlyList<double[]> forces, double size)
    {
        double ax = c.Loads.Sum(l => l.Fx), ay = c.Loads.Sum(l => l.Fy), am = c.Loads.Sum(l => l.Mz);
        double lx = 0, ly = 0, lm = 0;
        for (int i = 0; i < plan.Lines.Count; i++)
        {
            var line = plan.Lines[i];
            double p = forces[i].Sum();
            lx += line.Cos * p; ly += line.Sin * p; lm += line.Lever * p;
        }
        double scale = new[] { ax, ay, lx, ly, am / size, lm / size }.Max(Math.Abs);
        double err = new[] { ax - lx, ay - ly, (am - lm) / size }.Max(Math.Abs);
        return new PlanEquilibrium(ax, ay, am, lx, ly, lm, scale == 0 ? err : err / scale);
    }

    private static List<PlanVertexMotion> Vertices(BuildingPlan plan, IReadOnlyList<FloorMotion> motion)
    {
        var list = new List<PlanVertexMotion>();
        for (int l = 1; l < plan.Levels.Count; l++)
        {
            var outline = plan.Levels[l].Outline;
            for (int v = 0; v < outline.Count; v++)
            {
                var (ux, uy) = motion[l - 1].At(outline[v]);
                var (bx, by) = l >= 2 ? motion[l - 2].At(outline[v]) : (0, 0);
                list.Add(new PlanVertexMotion(l, v, outline[v], ux, uy, ux - bx, uy - by));
            }
        }
        return list;
    }

    /// <summary>
    /// The user's named points at every floor: displacement by <paramref name="at"/> (floor index from 0, point → ux, uy)
    /// and drift, this floor minus the one below at the same plan point (the base does not move).
    /// </summary>
    internal static List<PlanPointMotion> PointMotions(BuildingPlan plan, Func<int, PlanPoint, (double Ux, double Uy)> at)
    {
        var list = new List<PlanPointMotion>();
        for (int l = 1; l < plan.Levels.Count; l++)
            foreach (var q in plan.Points)
            {
                var (ux, uy) = at(l - 1, q.At);
                var (bx, by) = l >= 2 ? at(l - 2, q.At) : (0, 0);
                list.Add(new PlanPointMotion(l, q.Id, q.At, ux, uy, ux - bx, uy - by));
            }
        return list;
    }

    /// <summary>Recovers the line's planar model under the level forces p (one case per building case), and checks its level displacements.</summary>
    internal static PlanLineResult Recover(PlanLine line, Condensation c, IReadOnlyList<string> ids, double[][] forces, IReadOnlyList<double[]> expected, AnalysisOptions? options)
    {
        var r = LinearStaticAnalysis.Run(Loaded(line, ids, forces, "level forces from the floors"), options);
        double err = 0, scale = 0;
        for (int ci = 0; ci < ids.Count; ci++)
            for (int l = 0; l < line.LevelNodes.Count; l++)
            {
                err = Math.Max(err, Math.Abs(LevelDisplacement(line, r, ci, l) - expected[ci][l]));
                scale = Math.Max(scale, Math.Abs(expected[ci][l]));
            }
        return new PlanLineResult(line, new MatrixView(c.K), c.SymmetryError, c.BackwardError, r, scale == 0 ? err : err / scale);
    }

    /// <summary>
    /// Each line's story stiffness alone under the floor-force pattern of each loading direction (the line by itself,
    /// loaded at its levels by the pattern: story shear over story drift), and the centre of rigidity they give per story.
    /// </summary>
    internal static List<PlanStoryRigidity> Rigidity(BuildingPlan plan, IReadOnlyList<double[,]> condensed)
    {
        int n = plan.FloorCount;
        var list = new List<PlanStoryRigidity>();
        foreach (var dir in new[] { "x", "y" })
        {
            var c = plan.Cases.FirstOrDefault(x => x.Direction == dir && x.Eccentricity == 0);
            if (c is null) continue;
            var pattern = new double[n];
            foreach (var l in c.Loads) pattern[l.Level - 1] += Math.Abs(dir == "x" ? l.Fx : l.Fy);
            if (pattern.All(p => p == 0)) continue;
            var drifts = condensed.Select(k =>
            {
                var u = DenseMatrix.OfArray(k).Solve(DenseVector.OfArray(pattern)).ToArray();
                return Enumerable.Range(0, n).Select(s => u[s] - (s > 0 ? u[s - 1] : 0)).ToArray();
            }).ToList();
            for (int s = 1; s <= n; s++)
            {
                double v = Above(pattern, s);
                // A story the pattern leaves without shear has no stiffness under it (0 / drift is not the line's stiffness): NaN, written empty.
                var lines = plan.Lines.Select((line, i) => new PlanLineStiffness(line.Id, line.X0, line.Y0, line.Angle, v != 0 ? v / drifts[i][s - 1] : double.NaN)).ToList();
                var (xr, yr) = CentreOfRigidity(plan.Lines, lines.Select(l => l.Stiffness).ToList());
                list.Add(new PlanStoryRigidity(dir, s, lines, xr, yr));
            }
        }
        return list;
    }

    /// <summary>
    /// The point about which the story stiffnesses k_i of lines (c, s, r) couple no rotation with translation:
    /// [[−Kxy, Kxx], [−Kyy, Kxy]]·(x_R, y_R) = (−Kxθ, −Kyθ) with Kxx = Σk c², Kxy = Σk c s, Kyy = Σk s², Kxθ = Σk c r,
    /// Kyθ = Σk s r (derived from r' = r − (x_R s − y_R c)); for orthogonal lines x_R = Σk_y x / Σk_y, y_R = Σk_x y / Σk_x.
    /// NaN where lines of only one direction make it undefined.
    /// </summary>
    public static (double X, double Y) CentreOfRigidity(IReadOnlyList<PlanLine> lines, IReadOnlyList<double> k)
    {
        double kxx = 0, kxy = 0, kyy = 0, kxt = 0, kyt = 0;
        for (int i = 0; i < lines.Count; i++)
        {
            double c = lines[i].Cos, s = lines[i].Sin, r = lines[i].Lever;
            kxx += k[i] * c * c; kxy += k[i] * c * s; kyy += k[i] * s * s; kxt += k[i] * c * r; kyt += k[i] * s * r;
        }
        double det = -kxy * kxy + kxx * kyy;
        if (!(Math.Abs(det) > 1e-12 * Math.Max(kxx * kyy, 1e-300))) return (double.NaN, double.NaN);
        // Cramer on [[−kxy, kxx], [−kyy, kxy]]·(x, y) = (−kxt, −kyt).
        double x = (-kxt * kxy - kxx * -kyt) / det;
        double y = (-kxy * -kyt - -kyy * -kxt) / det;
        return (x, y);
    }

    internal static List<TorsionalIrregularity> Irregularity(BuildingPlan plan, IReadOnlyList<PlanCaseResult> cases)
    {
        int n = plan.FloorCount;
        var list = new List<TorsionalIrregularity>();
        foreach (var dir in new[] { "x", "y" })
        {
            var withAcc = cases.Where(c => c.Case.Direction == dir && c.Case.Eccentricity != 0).ToList();
            bool accidental = withAcc.Count > 0;
            var use = accidental ? withAcc : cases.Where(c => c.Case.Direction == dir).ToList();
            for (int s = 1; s <= n; s++)
            {
                TorsionalIrregularity? worst = null;
                foreach (var c in use)
                {
                    var st = c.Stories[s - 1];
                    double sign = Math.Sign(dir == "x" ? st.Vx : st.Vy);
                    if (sign == 0) continue;
                    var verts = c.Vertices.Where(v => v.Level == s).ToList();
                    var drift = verts.Select(v => sign * (dir == "x" ? v.DriftX : v.DriftY)).ToList();
                    var disp = verts.Select(v => sign * (dir == "x" ? v.Ux : v.Uy)).ToList();
                    double dmax = drift.Max(), davg = 0.5 * (drift.Max() + drift.Min());
                    double umax = disp.Max(), uavg = 0.5 * (disp.Max() + disp.Min());
                    double ratio = davg > 0 ? dmax / davg : double.NaN;
                    double ax = uavg > 0 ? Math.Clamp(Math.Pow(umax / (1.2 * uavg), 2), 1, 3) : double.NaN;
                    string type = ratio > 1.4 ? "1b" : ratio > 1.2 ? "1a" : "none";
                    var row = new TorsionalIrregularity(dir, s, c.Case.Id, accidental, dmax, davg, ratio, type, umax, uavg, ax);
                    if (worst is null || !(worst.Ratio >= row.Ratio)) worst = row;
                }
                if (worst is not null) list.Add(worst);
            }
        }
        return list;
    }

    internal static List<CornerDriftCheck> DriftChecks(BuildingPlan plan, IReadOnlyList<PlanCaseResult> cases, PlanDriftLimit lim)
    {
        var list = new List<CornerDriftCheck>();
        foreach (var c in cases)
            for (int s = 1; s <= plan.FloorCount; s++)
            {
                double h = plan.Levels[s].Elevation - plan.Levels[s - 1].Elevation;
                var worst = c.Vertices.Where(v => v.Level == s).OrderByDescending(v => Math.Sqrt(v.DriftX * v.DriftX + v.DriftY * v.DriftY)).ThenBy(v => v.Vertex).First();
                double d = Math.Sqrt(worst.DriftX * worst.DriftX + worst.DriftY * worst.DriftY);
                double amp = lim.Cd * d / lim.Ie;
                list.Add(new CornerDriftCheck(c.Case.Id, s, worst.Vertex, worst.At, d, amp, h, amp / h, lim.AllowedRatio, amp / h <= lim.AllowedRatio));
                // Every named point too, one row each, labelled by its id.
                foreach (var q in c.Points.Where(q => q.Level == s))
                {
                    double dq = Math.Sqrt(q.DriftX * q.DriftX + q.DriftY * q.DriftY), aq = lim.Cd * dq / lim.Ie;
                    list.Add(new CornerDriftCheck(c.Case.Id, s, -1, q.At, dq, aq, h, aq / h, lim.AllowedRatio, aq / h <= lim.AllowedRatio) { Point = q.Point });
                }
            }
        return list;
    }
}
