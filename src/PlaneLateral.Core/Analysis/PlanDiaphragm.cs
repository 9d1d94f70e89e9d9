using PlaneLateral.Elements;
using MathNet.Numerics.LinearAlgebra.Double;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// Buildings in plan whose floors bend (docs/plan.md, "Floors that bend"). Each floor is rigid (three DOFs: Ux, Uy,
/// Rz), semi-rigid (those three plus the deformation of a deep beam per direction, <see cref="FloorBeam"/>) or flexible
/// (no floor DOFs: each line keeps its own lateral DOF at that level and takes its tributary share of the floor's load
/// by simple-span statics). A line's condensed stiffness K̂ is assembled onto the floor DOFs at its plan position:
/// u_line = cos α·ux(x₀, y₀) + sin α·uy(x₀, y₀), K += Tᵀ K̂ T, exactly as for rigid floors.
/// </summary>
public static partial class PlanDiaphragm
{
    /// <summary>The three idealisations of the envelope, in table order.</summary>
    public static readonly IReadOnlyList<string> VariantNames = ["rigid", "semi-rigid", "flexible"];

    /// <summary>The DOFs of a building whose floors may bend, and each line's row T per level.</summary>
    internal sealed class Layout
    {
        public required BuildingPlan Plan { get; init; }
        public required FloorKind[] Kinds { get; init; }
        public int N { get; set; }
        /// <summary>Per floor (0 = level 1): the equation of Ux (Uy, Rz follow), −1 for a flexible floor.</summary>
        public int[] Rigid { get; init; } = [];
        public FloorBeam?[] BeamX { get; init; } = [];   // spans along Y, carries X loads
        public FloorBeam?[] BeamY { get; init; } = [];   // spans along X, carries Y loads
        /// <summary>[line][floor]: the row of T as (equation, coefficient) pairs.</summary>
        public List<(int Dof, double C)>[][] Rows { get; init; } = [];
        public List<NamedDof> Names { get; } = [];
        public List<bool> Turns { get; } = [];   // rotations: scaled by the plan size in the solve
        public double Tol { get; init; }
    }

    internal static Layout Lay(BuildingPlan plan, FloorKind[] kinds)
    {
        int n = plan.FloorCount;
        var lines = plan.Lines;
        var lay = new Layout
        {
            Plan = plan, Kinds = kinds, Rigid = new int[n], BeamX = new FloorBeam?[n], BeamY = new FloorBeam?[n],
            Rows = lines.Select(_ => new List<(int, double)>[n]).ToArray(), Tol = 1e-9 * Math.Max(plan.Size, 1e-9),
        };
        int next = 0;
        int Add(string node, Dof d, bool turns) { lay.Names.Add(new NamedDof(node, d)); lay.Turns.Add(turns); return next++; }
        for (int l = 0; l < n; l++)
        {
            var level = plan.Levels[l + 1];
            string name = $"floor {level.Id}";
            var kind = kinds[l];
            if (kind != FloorKind.Flexible)
            {
                lay.Rigid[l] = Add(name, Dof.X, false); Add(name, Dof.Y, false); Add(name, Dof.RZ, true);
            }
            else lay.Rigid[l] = -1;
            if (kind != FloorKind.Rigid)
            {
                var floor = plan.FloorOf(l + 1);   // its openings shape the loads of a flexible floor too; its section is used only when semi-rigid
                var bx = FloorBeam.Build(level, floor, false, lines.Where(x => x.Cos != 0).Select(x => x.Y0));
                var by = FloorBeam.Build(level, floor, true, lines.Where(x => x.Sin != 0).Select(x => x.X0));
                foreach (var b in new[] { bx, by })
                {
                    b.VDof = Enumerable.Repeat(-1, b.Nodes).ToArray();
                    b.TDof = Enumerable.Repeat(-1, b.Nodes).ToArray();
                    if (kind != FloorKind.SemiRigid) continue;
                    string axis = b.AlongX ? "x" : "y";
                    for (int i = 0; i < b.Nodes; i++)
                    {
                        string at = $"{name} at {axis} = {plan.Units.FromSI(b.S[i], Units.Quantity.Length):0.###}";
                        if (i > 0 && i < b.Nodes - 1) b.VDof[i] = Add(at, b.AlongX ? Dof.Y : Dof.X, false);
                        b.TDof[i] = Add(at, Dof.RZ, true);
                    }
                }
                lay.BeamX[l] = bx; lay.BeamY[l] = by;
            }
        }
        for (int li = 0; li < lines.Count; li++)
        {
            var line = lines[li];
            for (int l = 0; l < n; l++)
            {
                var row = new List<(int, double)>();
                int r0 = lay.Rigid[l];
                if (kinds[l] == FloorKind.Flexible)
                {
                    row.Add((Add($"line {line.Id} at {plan.Levels[l + 1].Id}", Dof.X, false), 1.0));
                }
                else
                {
                    if (line.Cos != 0) row.Add((r0, line.Cos));
                    if (line.Sin != 0) row.Add((r0 + 1, line.Sin));
                    if (line.Lever != 0) row.Add((r0 + 2, line.Lever));
                    if (kinds[l] == FloorKind.SemiRigid)
                    {
                        if (line.Cos != 0 && lay.BeamX[l]!.VDof[lay.BeamX[l]!.NodeAt(line.Y0, lay.Tol)] is var dx and >= 0) row.Add((dx, line.Cos));
                        if (line.Sin != 0 && lay.BeamY[l]!.VDof[lay.BeamY[l]!.NodeAt(line.X0, lay.Tol)] is var dy and >= 0) row.Add((dy, line.Sin));
                    }
                }
                lay.Rows[li][l] = row;
            }
        }
        lay.N = next;
        return lay;
    }

    /// <summary>K = Σ Tᵀ K̂ T over the lines plus the floors' deep-beam stiffness on their deformation DOFs.</summary>
    internal static double[,] Stiffness(Layout lay, IReadOnlyList<double[,]> condensed)
    {
        var k = new double[lay.N, lay.N];
        int n = lay.Plan.FloorCount;
        for (int li = 0; li < lay.Rows.Length; li++)
        {
            var kh = condensed[li];
            for (int i = 0; i < n; i++)
                for (int j = 0; j < n; j++)
                    foreach (var (a, ca) in lay.Rows[li][i])
                        foreach (var (b, cb) in lay.Rows[li][j]) k[a, b] += ca * kh[i, j] * cb;
        }
        for (int l = 0; l < n; l++)
        {
            if (lay.Kinds[l] != FloorKind.SemiRigid) continue;
            foreach (var beam in new[] { lay.BeamX[l]!, lay.BeamY[l]! })
                for (int e = 0; e + 1 < beam.Nodes; e++)
                {
                    var ke = beam.ElementStiffness(e, out _);
                    int[] dofs = [beam.VDof[e], beam.TDof[e], beam.VDof[e + 1], beam.TDof[e + 1]];
                    for (int a = 0; a < 4; a++)
                        for (int b = 0; b < 4; b++)
                            if (dofs[a] >= 0 && dofs[b] >= 0) k[dofs[a], dofs[b]] += ke[a, b];
                }
        }
        return k;
    }

    /// <summary>
    /// The load vector of a case. A rigid floor takes its force and torque (Fx, Fy, Mz about the origin) on its three
    /// DOFs. A floor that bends carries them spread over its area: the force in proportion to the floor's net area
    /// along each span, the torque about the area's centroid as area × lever (the pattern of a rigid floor's turning
    /// inertia), so that the spread loads have exactly the case's Fx, Fy and Mz. A semi-rigid floor takes them as
    /// consistent nodal loads of its beams; a flexible floor hands them to its lines by simple-span statics (the lever
    /// rule between neighbouring lines, overhangs by the end span's statics; lines at one position share equally).
    /// </summary>
    internal static double[] Loads(Layout lay, PlanLoadCase c)
    {
        var f = new double[lay.N];
        int n = lay.Plan.FloorCount;
        foreach (var load in c.Loads)
        {
            int l = load.Level - 1;
            if (lay.Kinds[l] == FloorKind.Rigid)
            {
                f[lay.Rigid[l]] += load.Fx; f[lay.Rigid[l] + 1] += load.Fy; f[lay.Rigid[l] + 2] += load.Mz;
                continue;
            }
            var (bx, by) = (lay.BeamX[l]!, lay.BeamY[l]!);
            var (ax, yc, jx) = bx.Moments();
            var (ay, xc, jy) = by.Moments();
            double torque = load.Mz - (xc * load.Fy - yc * load.Fx);
            double alpha = torque / (jx + jy);
            // w_y(x) = m(x)·(Fy/A + α(x − xc)); w_x(y) = m(y)·(Fx/A − α(y − yc)).
            Spread(lay, l, by, load.Fy / ay - alpha * xc, alpha, f);
            Spread(lay, l, bx, load.Fx / ax + alpha * yc, -alpha, f);
        }
        return f;
    }

    private static void Spread(Layout lay, int l, FloorBeam b, double c0, double c1, double[] f)
    {
        if (c0 == 0 && c1 == 0) return;
        if (lay.Kinds[l] == FloorKind.SemiRigid)
        {
            int r0 = lay.Rigid[l];
            for (int e = 0; e + 1 < b.Nodes; e++)
            {
                var fe = b.ElementLoads(e, c0, c1);
                for (int end = 0; end < 2; end++)
                {
                    int node = e + end;
                    double fv = fe[2 * end], ft = fe[2 * end + 1];
                    if (b.AlongX) { f[r0 + 1] += fv; f[r0 + 2] += fv * b.S[node] + ft; }
                    else { f[r0] += fv; f[r0 + 2] += -fv * b.S[node] - ft; }
                    if (b.VDof[node] >= 0) f[b.VDof[node]] += fv;
                    if (b.TDof[node] >= 0) f[b.TDof[node]] += ft;
                }
            }
            return;
        }
        // Flexible: ∫ w(s)·φ_k(s) ds with φ_k the simple-span share of support k (the lever rule), exact by Gauss.
        var supports = Supports(lay, l, b.AlongX);
        for (int e = 0; e + 1 < b.Nodes; e++)
        {
            double len = b.S[e + 1] - b.S[e];
            for (int g = 0; g < 5; g++)
            {
                double xi = FloorBeam.GaussPoints[g], w = FloorBeam.GaussWeights[g] * len, s = b.S[e] + xi * len;
                double q = (b.M0[e] + (b.M1[e] - b.M0[e]) * xi) * (c0 + c1 * s) * w;
                foreach (var (k, share) in Shares(supports.Select(p => p.At).ToList(), s))
                    foreach (var dof in supports[k].Dofs) f[dof] += q * share / supports[k].Dofs.Count;
            }
        }
    }

    /// <summary>The lines that hold a flexible floor along a span direction, grouped by position (ascending), with their own DOFs.</summary>
    internal static List<(double At, List<int> Dofs, List<int> Lines)> Supports(Layout lay, int l, bool alongX)
    {
        var lines = lay.Plan.Lines;
        var list = new List<(double At, List<int> Dofs, List<int> Lines)>();
        for (int li = 0; li < lines.Count; li++)
        {
            var line = lines[li];
            if (alongX ? line.Sin == 0 : line.Cos == 0) continue;
            double at = alongX ? line.X0 : line.Y0;
            int dof = lay.Rows[li][l].Count == 1 && lay.Kinds[l] == FloorKind.Flexible ? lay.Rows[li][l][0].Dof : -1;
            int g = list.FindIndex(p => Math.Abs(p.At - at) <= lay.Tol);
            if (g < 0) list.Add((at, [dof], [li]));
            else { list[g].Dofs.Add(dof); list[g].Lines.Add(li); }
        }
        list.Sort((a, b) => a.At.CompareTo(b.At));
        return list;
    }

    /// <summary>
    /// Simple-span shares of a load at s among supports at positions p (ascending, at least two): the two ends of the
    /// span that holds s get (p₂ − s)/(p₂ − p₁) and (s − p₁)/(p₂ − p₁); beyond the end supports the end span's statics
    /// (an overhang). One support takes everything.
    /// </summary>
    internal static IEnumerable<(int Index, double Share)> Shares(IReadOnlyList<double> p, double s)
    {
        if (p.Count == 1) { yield return (0, 1.0); yield break; }
        int j = 0;
        while (j < p.Count - 2 && s > p[j + 1]) j++;
        double t = (s - p[j]) / (p[j + 1] - p[j]);
        yield return (j, 1 - t);
        yield return (j + 1, t);
    }

    /// <summary>The solved system of one idealisation: per case the DOFs, with rotation held, and each line's level forces.</summary>
    internal sealed record Solved(Layout Layout, double[,] K, IReadOnlyList<(PlanLoadCase Case, double[] U, double[] ULocked, double Eta)> Cases,
        double[][][] LineForces, double[][][] LineForcesLocked, double[][][] LineDisplacements);

    internal static Solved Solve(BuildingPlan plan, FloorKind[] kinds, IReadOnlyList<double[,]> condensed)
    {
        var lay = Lay(plan, kinds);
        var k = Stiffness(lay, condensed);
        double size = plan.Size;
        var scale = lay.Turns.Select(t => t ? 1.0 / size : 1.0).ToArray();   // Rz·size: every entry of D·K·D in N/m (as PlanAnalysis.Scaled)
        var scaled = new double[lay.N, lay.N];
        for (int i = 0; i < lay.N; i++)
            for (int j = 0; j < lay.N; j++) scaled[i, j] = k[i, j] * scale[i] * scale[j];
        var chol = Factor(plan, lay, scaled);
        var held = lay.Rigid.Where(r => r >= 0).Select(r => r + 2).ToHashSet();
        var keep = Enumerable.Range(0, lay.N).Where(i => !held.Contains(i)).ToArray();
        var locked = new double[keep.Length, keep.Length];
        for (int i = 0; i < keep.Length; i++)
            for (int j = 0; j < keep.Length; j++) locked[i, j] = scaled[keep[i], keep[j]];
        var lockedChol = Factor(plan, lay, locked, keep);

        var cases = new List<(PlanLoadCase, double[], double[], double)>();
        foreach (var c in plan.Cases)
        {
            var f = Loads(lay, c);
            var fs = f.Select((v, i) => v * scale[i]).ToArray();
            var us = chol.Solve(DenseVector.OfArray(fs)).ToArray();
            double eta = PlanAnalysis.BackwardError(scaled, us, fs);
            var u = us.Select((v, i) => v * scale[i]).ToArray();
            var fl = keep.Select(i => fs[i]).ToArray();
            var ulr = lockedChol.Solve(DenseVector.OfArray(fl)).ToArray();
            eta = Math.Max(eta, PlanAnalysis.BackwardError(locked, ulr, fl));
            var ul = new double[lay.N];
            for (int i = 0; i < keep.Length; i++) ul[keep[i]] = ulr[i] * scale[keep[i]];
            cases.Add((c, u, ul, eta));
        }
        int n = plan.FloorCount;
        double[] Along(int li, double[] u) => Enumerable.Range(0, n).Select(l => lay.Rows[li][l].Sum(t => t.C * u[t.Dof])).ToArray();
        var disp = plan.Lines.Select((_, li) => cases.Select(c => Along(li, c.Item2)).ToArray()).ToArray();
        var forces = plan.Lines.Select((_, li) => disp[li].Select(u => SmallMatrix.Times(condensed[li], u)).ToArray()).ToArray();
        var forcesLocked = plan.Lines.Select((_, li) => cases.Select(c => SmallMatrix.Times(condensed[li], Along(li, c.Item3))).ToArray()).ToArray();
        return new Solved(lay, k, cases, forces, forcesLocked, disp);
    }

    private static MathNet.Numerics.LinearAlgebra.Factorization.Cholesky<double> Factor(BuildingPlan plan, Layout lay, double[,] a, int[]? keep = null)
    {
        int m = a.GetLength(0);
        try
        {
            var chol = DenseMatrix.OfArray(a).Cholesky();
            // A pivot that keeps almost nothing of its own diagonal marks a free motion (the stiffnesses of a stiff floor
            // and of soft lines differ by many orders, so the pivots are compared with their own rows, not the largest).
            bool lost = false;
            for (int i = 0; i < m; i++) lost |= !(chol.Factor[i, i] * chol.Factor[i, i] > PlanAnalysis.MechanismTolerance * a[i, i]);
            if (!lost) return chol;
        }
        catch (ArgumentException) { }
        // A free motion: name it by the eigenvectors of the vanishing eigenvalues.
        var (values, vectors) = SymmetricEigen.Solve(a);
        double big0 = Math.Max(values.Max(), 0);
        var mechanisms = new List<Mechanism>();
        for (int v = 0; v < values.Length; v++)
        {
            if (big0 > 0 && values[v] > PlanAnalysis.MechanismTolerance * big0) continue;
            double big = 0;
            for (int i = 0; i < m; i++) big = Math.Max(big, Math.Abs(vectors[i, v]));
            NamedDof Name(int i) => lay.Names[keep is null ? i : keep[i]];
            var moving = Enumerable.Range(0, m).Where(i => Math.Abs(vectors[i, v]) > 1e-6 * big).OrderByDescending(i => Math.Abs(vectors[i, v])).ThenBy(i => i).ToList();
            mechanisms.Add(new Mechanism(Name(moving[0]), moving.Select(Name).ToList()));
        }
        if (mechanisms.Count == 0) mechanisms.Add(new Mechanism(lay.Names[0], [lay.Names[0]]));
        throw new UnstableModelException(plan.SourcePath, mechanisms);
    }

    /// <summary>The floor's displacement at a plan point (m): rigid part, plus its beams' deformation, or for a flexible floor the lines' displacements shared by the same simple-span rule.</summary>
    internal static (double Ux, double Uy) At(Solved s, int ci, int l, PlanPoint p)
    {
        var lay = s.Layout;
        var u = s.Cases[ci].U;
        if (lay.Kinds[l] == FloorKind.Flexible)
        {
            double Field(bool alongX)
            {
                var sup = Supports(lay, l, alongX);
                double v = 0;
                foreach (var (k, share) in Shares(sup.Select(q => q.At).ToList(), alongX ? p.X : p.Y))
                    v += share * sup[k].Lines.Average(li => s.LineDisplacements[li][ci][l] / (alongX ? lay.Plan.Lines[li].Sin : lay.Plan.Lines[li].Cos));
                return v;
            }
            return (Field(false), Field(true));
        }
        int r0 = lay.Rigid[l];
        double ux = u[r0] - u[r0 + 2] * p.Y, uy = u[r0 + 1] + u[r0 + 2] * p.X;
        if (lay.Kinds[l] == FloorKind.SemiRigid) { ux += Deformation(lay.BeamX[l]!, u, p.Y); uy += Deformation(lay.BeamY[l]!, u, p.X); }
        return (ux, uy);
    }

    /// <summary>The beam's deformation d at s, linear between nodes (nodes sit at the outline's corners and the lines).</summary>
    internal static double Deformation(FloorBeam b, double[] u, double s)
    {
        double V(int i) => b.VDof[i] >= 0 ? u[b.VDof[i]] : 0;
        if (s <= b.S[0]) return V(0);
        for (int i = 0; i + 1 < b.Nodes; i++)
            if (s <= b.S[i + 1]) { double t = (s - b.S[i]) / (b.S[i + 1] - b.S[i]); return (1 - t) * V(i) + t * V(i + 1); }
        return V(b.Nodes - 1);
    }

    /// <summary>The floor kinds as the building file gives them (rigid where it says nothing).</summary>
    public static FloorKind[] KindsAsGiven(BuildingPlan plan) => Enumerable.Range(1, plan.FloorCount).Select(plan.KindOf).ToArray();
}
