using MathNet.Numerics.LinearAlgebra.Double;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// The code's flexibility test of a floor span (ASCE 7-16 §12.3.1.3, eq. 12.3-1) from the semi-rigid floor under the
/// story forces of <see cref="Case"/>: <see cref="Mdd"/> the largest in-plane deflection of the floor in the span
/// relative to the straight line through the floor at its two supporting lines (for an overhang, the end span's line),
/// <see cref="Adve"/> the average story drift of those lines (m); the floor may be idealised as flexible where
/// MDD/ADVE &gt; 2. The governing code decides.
/// </summary>
/// <param name="From">The supporting line(s) at the span's start ("" for an overhang's free end).</param>
public sealed record FloorFlexibilityTest(int Level, string Direction, string Case, string From, string To, double SpanFrom, double SpanTo,
    double Mdd, double Adve, double Ratio, bool Flexible);

/// <summary>
/// A line's story shear (N, along the line) under the three idealisations of the floors and their envelope (the largest
/// magnitude, N); NaN where an idealisation was not made. <see cref="Governing"/> names the one that gives the envelope.
/// </summary>
public sealed record LineShearEnvelope(string Case, int Story, string Line, double Rigid, double SemiRigid, double Flexible, double Envelope, string Governing);

/// <summary>
/// A line's story shear (N, along the line) by the hand tributary split (PlaneLateral.Hand.TributarySplit, made by
/// PlaneLateral.Studies.PlanTributarySplit) beside the FE flexible floor's (<see cref="LineShearEnvelope.Flexible"/>):
/// <see cref="Gap"/> = FE / hand − 1 (NaN where the hand shear is nil), <see cref="Cause"/> the features of the floors
/// above the cut that the two treat differently and that touch this line ("" where they agree).
/// </summary>
public sealed record TributaryShear(string Case, int Story, string Line, double Hand, double Flexible, double Gap, string Cause);

/// <summary>A point of a floor in plan and the floor's in-plane displacement there (m).</summary>
public sealed record FloorPoint(PlanPoint At, double Ux, double Uy);

/// <summary>
/// The in-plane deflected shape of a floor that bends (as given: semi-rigid or flexible) under one direction's case at
/// the centres of mass: <see cref="Outline"/> the floor's outline sampled at the floor model's nodes (in order around it),
/// <see cref="Lines"/> the floor's displacement at each line's plan point (in the order of the plan's lines).
/// </summary>
public sealed record FloorDeflection(int Level, string Direction, string Case, IReadOnlyList<FloorPoint> Outline, IReadOnlyList<FloorPoint> Lines);

/// <summary>Floors that bend: the kinds as given, which idealisations were made (and why not), the flexibility tests and the envelope.</summary>
public sealed record DiaphragmStudy(IReadOnlyList<FloorKind> Kinds, IReadOnlyList<string> Variants, IReadOnlyList<string> Notes,
    IReadOnlyList<FloorFlexibilityTest> Flexibility, IReadOnlyList<LineShearEnvelope> Envelope)
{
    /// <summary>The deflected shape of every floor that bends (as given), per direction; empty when every floor is rigid.</summary>
    public IReadOnlyList<FloorDeflection> Shapes { get; init; } = [];

    public const string Caution = "MDD/ADVE > 2 allows the flexible idealisation by ASCE 7-16 §12.3.1.3 (eq. 12.3-1); §12.3.1.1 and §12.3.1.2 " +
        "classify some floors by condition. The governing code decides which idealisation applies; the envelope is a design aid for " +
        "verification by a licensed engineer.";
}

public static partial class PlanDiaphragm
{
    /// <summary>
    /// The rigid, semi-rigid (floors that give a section) and flexible (every floor) idealisations side by side, the
    /// envelope of each line's story shear, and the flexibility test of every semi-rigid floor. Null when the building
    /// file gives no "floor" block.
    /// </summary>
    public static DiaphragmStudy? Study(BuildingPlan plan, IReadOnlyList<double[,]> condensed)
    {
        if (plan.Floors.Count == 0) return null;
        int n = plan.FloorCount;
        var notes = new List<string>();
        Solved? Try(string name, FloorKind[] kinds)
        {
            try { return Solve(plan, kinds, condensed); }
            catch (UnstableModelException e) { notes.Add($"{name}: not solved, {e.Mechanisms.Count} free motion(s) of the floors"); return null; }
        }
        var rigid = Try("rigid", Enumerable.Repeat(FloorKind.Rigid, n).ToArray());
        var semiKinds = Enumerable.Range(1, n).Select(l => plan.FloorOf(l)?.HasSection == true ? FloorKind.SemiRigid : FloorKind.Rigid).ToArray();
        Solved? semi = null;
        if (semiKinds.Contains(FloorKind.SemiRigid))
        {
            semi = Try("semi-rigid", semiKinds);
            if (semiKinds.Contains(FloorKind.Rigid)) notes.Add("semi-rigid: floors without a section stay rigid");
        }
        else notes.Add("semi-rigid: no floor gives its section (thickness and material, or E and G)");
        Solved? flex = null;
        if (plan.Lines.FirstOrDefault(l => l.Cos != 0 && l.Sin != 0) is { } slanted) notes.Add($"flexible: line {slanted.Id} stands at an angle (the tributary split needs lines along X or Y)");
        else if (Positions(plan, true) < 2 || Positions(plan, false) < 2) notes.Add("flexible: fewer than two line positions in a direction");
        else flex = Try("flexible", Enumerable.Repeat(FloorKind.Flexible, n).ToArray());

        var variants = new[] { rigid, semi, flex };
        var envelope = new List<LineShearEnvelope>();
        for (int ci = 0; ci < plan.Cases.Count; ci++)
            for (int s = 1; s <= n; s++)
                for (int li = 0; li < plan.Lines.Count; li++)
                {
                    var v = variants.Select(x => x is null ? double.NaN : PlanAnalysis.Above(x.LineForces[li][ci], s)).ToArray();
                    int g = -1;
                    for (int i = 0; i < 3; i++) if (double.IsFinite(v[i]) && (g < 0 || Math.Abs(v[i]) > Math.Abs(v[g]))) g = i;
                    envelope.Add(new LineShearEnvelope(plan.Cases[ci].Id, s, plan.Lines[li].Id, v[0], v[1], v[2], g < 0 ? double.NaN : Math.Abs(v[g]), g < 0 ? "" : VariantNames[g]));
                }
        var tests = semi is null ? [] : Flexibility(semi);
        return new DiaphragmStudy(KindsAsGiven(plan), VariantNames.Where((_, i) => variants[i] is not null).ToList(), notes, tests, envelope);
    }

    /// <summary>How many different positions along the span the lines that carry loads along Y (<paramref name="alongX"/>) or X stand at.</summary>
    public static int Positions(BuildingPlan plan, bool alongX) =>
        plan.Lines.Where(l => alongX ? l.Sin != 0 : l.Cos != 0).Select(l => Math.Round((alongX ? l.X0 : l.Y0) / Math.Max(plan.Size, 1e-9), 9)).Distinct().Count();

    /// <summary>MDD, ADVE and their ratio per semi-rigid floor, direction and span, under each direction's case at the centres of mass.</summary>
    internal static List<FloorFlexibilityTest> Flexibility(Solved s)
    {
        var lay = s.Layout;
        var plan = lay.Plan;
        var list = new List<FloorFlexibilityTest>();
        for (int l = 0; l < plan.FloorCount; l++)
        {
            if (lay.Kinds[l] != FloorKind.SemiRigid) continue;
            foreach (var dir in new[] { "x", "y" })
            {
                int ci = -1;
                for (int i = 0; i < s.Cases.Count; i++) if (s.Cases[i].Case.Direction == dir && s.Cases[i].Case.Eccentricity == 0) { ci = i; break; }
                if (ci < 0) continue;
                bool alongX = dir == "y";   // loads along Y are carried by the beam spanning along X
                var b = alongX ? lay.BeamY[l]! : lay.BeamX[l]!;
                var u = s.Cases[ci].U;
                int r0 = lay.Rigid[l];
                double W(int i) => alongX ? u[r0 + 1] + u[r0 + 2] * b.S[i] + (b.VDof[i] >= 0 ? u[b.VDof[i]] : 0)
                                          : u[r0] - u[r0 + 2] * b.S[i] + (b.VDof[i] >= 0 ? u[b.VDof[i]] : 0);
                var sup = Supports(lay, l, alongX);
                if (sup.Count < 2) continue;
                var at = sup.Select(p => b.NodeAt(p.At, lay.Tol)).ToArray();
                double Drift(int g) => sup[g].Lines.Average(li => Math.Abs(s.LineDisplacements[li][ci][l] - (l > 0 ? s.LineDisplacements[li][ci][l - 1] : 0)));
                string Ids(int g) => string.Join("+", sup[g].Lines.Select(li => plan.Lines[li].Id));
                void Span(int a, int c, int from, int to, string fromId, string toId, double adve)
                {
                    // chord through the floor at supports a and c; deflection of nodes from..to relative to it
                    double sa = b.S[at[a]], sc = b.S[at[c]], wa = W(at[a]), wc = W(at[c]);
                    double mdd = 0;
                    for (int i = from; i <= to; i++) mdd = Math.Max(mdd, Math.Abs(W(i) - (wa + (wc - wa) * (b.S[i] - sa) / (sc - sa))));
                    list.Add(new FloorFlexibilityTest(l + 1, dir, s.Cases[ci].Case.Id, fromId, toId, b.S[from], b.S[to], mdd, adve, adve > 0 ? mdd / adve : double.NaN, mdd > 2 * adve));
                }
                if (at[0] > 0) Span(0, 1, 0, at[0], "", Ids(0), Drift(0));
                for (int g = 0; g + 1 < sup.Count; g++) Span(g, g + 1, at[g], at[g + 1], Ids(g), Ids(g + 1), 0.5 * (Drift(g) + Drift(g + 1)));
                int last = sup.Count - 1;
                if (at[last] < b.Nodes - 1) Span(last - 1, last, at[last], b.Nodes - 1, Ids(last), "", Drift(last));
            }
        }
        return list;
    }

    /// <summary>The full result of a building with floors that bend: floor solve, each line recovered, checks, and the study.</summary>
    internal static PlanResult Result(BuildingPlan plan, IReadOnlyList<PlanAnalysis.Condensation> condensed, AnalysisOptions? options)
    {
        int n = plan.FloorCount;
        var kinds = KindsAsGiven(plan);
        var kk = condensed.Select(c => c.K).ToList();
        var s = Solve(plan, kinds, kk);
        var lay = s.Layout;
        var ids = s.Cases.Select(c => c.Case.Id).ToList();
        var lineResults = plan.Lines.Select((line, i) => PlanAnalysis.Recover(line, condensed[i], ids, s.LineForces[i], s.LineDisplacements[i], options)).ToList();
        double size = plan.Size;
        var caseResults = new List<PlanCaseResult>();
        for (int ci = 0; ci < s.Cases.Count; ci++)
        {
            var (c, u, ul, eta) = s.Cases[ci];
            var motion = Enumerable.Range(0, n).Select(l => Motion(s, ci, l, u)).ToList();
            var lockedMotion = Enumerable.Range(0, n).Select(l => Motion(s, ci, l, ul) with { Rz = 0 }).ToList();
            var stories = PlanAnalysis.StoryLoads(c, n);
            var lineStories = PlanAnalysis.LineStories(plan, ci, stories, lineResults, i => s.LineForces[i][ci], i => s.LineForcesLocked[i][ci], i => s.LineDisplacements[i][ci]);
            var vertices = new List<PlanVertexMotion>();
            for (int l = 1; l <= n; l++)
            {
                var outline = plan.Levels[l].Outline;
                for (int vi = 0; vi < outline.Count; vi++)
                {
                    var (ux, uy) = At(s, ci, l - 1, outline[vi]);
                    var (bx, by) = l >= 2 ? At(s, ci, l - 2, outline[vi]) : (0, 0);
                    vertices.Add(new PlanVertexMotion(l, vi, outline[vi], ux, uy, ux - bx, uy - by));
                }
            }
            caseResults.Add(new PlanCaseResult(c, motion, lockedMotion, eta,
                PlanAnalysis.Equilibrium(plan, c, s.LineForces.Select(lf => lf[ci]).ToList(), size), stories, lineStories, vertices)
            { Points = PlanAnalysis.PointMotions(plan, (l, p) => At(s, ci, l, p)) });   // named points as the corners: with the floor's deformation
        }
        return new PlanResult
        {
            Plan = plan,
            Lines = lineResults,
            FloorStiffness = new MatrixView(FloorStiffness(s)),
            Cases = caseResults,
            Rigidity = PlanAnalysis.Rigidity(plan, kk),
            // Torsional irregularity applies to rigid and semi-rigid floors only (ASCE 7-16 Table 12.3-1).
            Irregularity = PlanAnalysis.Irregularity(plan, caseResults).Where(t => kinds[t.Story - 1] != FloorKind.Flexible).ToList(),
            DriftChecks = plan.DriftLimit is { } lim ? PlanAnalysis.DriftChecks(plan, caseResults, lim) : [],
            Diaphragms = Study(plan, kk) is { } study ? study with { Shapes = Shapes(s) } : null,
        };
    }

    /// <summary>
    /// The deflected shape of each floor that bends under each direction's case at the centres of mass (the first case
    /// along X, along Y without eccentricity): the outline sampled where it crosses the floor beams' nodes, and the
    /// floor's displacement at every line's point, from the same field as the corner drifts (<see cref="At"/>).
    /// </summary>
    internal static List<FloorDeflection> Shapes(Solved s)
    {
        var lay = s.Layout;
        var plan = lay.Plan;
        var list = new List<FloorDeflection>();
        for (int l = 0; l < plan.FloorCount; l++)
        {
            if (lay.Kinds[l] == FloorKind.Rigid) continue;
            var outline = plan.Levels[l + 1].Outline;
            var xs = lay.BeamY[l]!.S;   // the beam along X: its nodes' x
            var ys = lay.BeamX[l]!.S;   // the beam along Y: its nodes' y
            var ring = new List<PlanPoint>();
            for (int v = 0; v < outline.Count; v++)
            {
                var a = outline[v]; var b = outline[(v + 1) % outline.Count];
                var ts = new List<double> { 0 };
                foreach (var x in xs) if (b.X != a.X && (x - a.X) / (b.X - a.X) is var t and > 0 and < 1) ts.Add(t);
                foreach (var y in ys) if (b.Y != a.Y && (y - a.Y) / (b.Y - a.Y) is var t and > 0 and < 1) ts.Add(t);
                ts.Sort();
                foreach (var t in ts.Distinct()) ring.Add(new PlanPoint(a.X + t * (b.X - a.X), a.Y + t * (b.Y - a.Y)));
            }
            foreach (var dir in new[] { "x", "y" })
            {
                int ci = -1;
                for (int i = 0; i < s.Cases.Count; i++) if (s.Cases[i].Case.Direction == dir && s.Cases[i].Case.Eccentricity == 0) { ci = i; break; }
                if (ci < 0) continue;
                FloorPoint Point(PlanPoint p) { var (ux, uy) = At(s, ci, l, p); return new FloorPoint(p, ux, uy); }
                list.Add(new FloorDeflection(l + 1, dir, s.Cases[ci].Case.Id, ring.Select(Point).ToList(),
                    plan.Lines.Select(line => Point(new PlanPoint(line.X0, line.Y0))).ToList()));
            }
        }
        return list;
    }

    /// <summary>
    /// The stiffness on the floors' (Ux, Uy, Rz), the floors' beam DOFs condensed out exactly (K_rr − K_rd K_dd⁻¹ K_dr,
    /// static condensation), when every floor has those three DOFs; with a flexible floor (no floor DOFs) the whole
    /// system's K (floor, floor-beam and flexible-level line DOFs).
    /// </summary>
    private static double[,] FloorStiffness(Solved s)
    {
        var lay = s.Layout;
        if (lay.Rigid.Any(r => r < 0)) return s.K;
        var r = lay.Rigid.SelectMany(r0 => new[] { r0, r0 + 1, r0 + 2 }).ToArray();
        var d = Enumerable.Range(0, lay.N).Except(r).ToArray();
        var a = DenseMatrix.Create(r.Length, r.Length, (i, j) => s.K[r[i], r[j]]);
        if (d.Length == 0) return a.ToArray();
        var krd = DenseMatrix.Create(r.Length, d.Length, (i, j) => s.K[r[i], d[j]]);
        var kdd = DenseMatrix.Create(d.Length, d.Length, (i, j) => s.K[d[i], d[j]]);
        var c = a - krd * kdd.Cholesky().Solve(krd.Transpose());
        var res = c.ToArray();
        for (int i = 0; i < r.Length; i++)
            for (int j = 0; j < i; j++) res[i, j] = res[j, i] = 0.5 * (res[i, j] + res[j, i]);
        return res;
    }

    /// <summary>
    /// A floor's motion: the rigid part (Ux, Uy, Rz: the chords through the floor's ends) of a rigid or semi-rigid floor;
    /// for a flexible floor, the rigid motion that best fits its lines' displacements (least squares).
    /// </summary>
    private static FloorMotion Motion(Solved s, int ci, int l, double[] u)
    {
        var lay = s.Layout;
        int r0 = lay.Rigid[l];
        if (r0 >= 0) return new FloorMotion(l + 1, u[r0], u[r0 + 1], u[r0 + 2]);
        var a = new double[3, 3]; var b = new double[3];
        for (int li = 0; li < lay.Plan.Lines.Count; li++)
        {
            var line = lay.Plan.Lines[li];
            double[] t = [line.Cos, line.Sin, line.Lever];
            double v = lay.Rows[li][l].Sum(x => x.C * u[x.Dof]);
            for (int i = 0; i < 3; i++) { b[i] += t[i] * v; for (int j = 0; j < 3; j++) a[i, j] += t[i] * t[j]; }
        }
        var x = DenseMatrix.OfArray(a).Solve(DenseVector.OfArray(b));
        return new FloorMotion(l + 1, x[0], x[1], x[2]);
    }
}
