using PlaneLateral.Analysis;
using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Reports;

/// <summary>One point of a member's deflected shape: its distance along the undeformed axis from the start node (m),
/// its displacement along and across the axis (local u, v; m), its undeformed position (X0, Y0) and its displacement
/// (Dx, Dy) in global axes (m).</summary>
public readonly record struct CurvePoint(double S, double U, double V, double X0, double Y0, double Dx, double Dy);

/// <summary>
/// The deflected shape of a line member between its nodes, as the element itself describes it: the rigid zones move as
/// rigid bodies with their nodes; the flexible segment follows the exact Timoshenko shape functions of its end
/// displacements (Friedman &amp; Kosmatka 1993, eq. 19: the cubic Hermite functions with the shear correction Φ; axial
/// displacement linear), plus, when the member carries a distributed load, the deflection of the same segment held
/// fixed at both ends under that load (derived below). For a member without span loads this is the exact deflected
/// shape of the shear-deformable member; with span loads it is exact too, the particular part being the closed form.
/// Axial-only members are straight between their ends.
/// </summary>
public static class MemberCurves
{
    /// <summary>Points along member <paramref name="m"/> in case <paramref name="c"/>: both rigid zones' ends and
    /// <paramref name="segments"/> + 1 points over the flexible segment, start to end.</summary>
    public static IReadOnlyList<CurvePoint> Shape(StructureModel model, CaseResult c, Member m, int segments = 16)
    {
        var a = model.Nodes[m.Start];
        var b = model.Nodes[m.End];
        var e = new FrameElement(m, a, b);
        var uGlobal = new double[6];
        for (int k = 0; k < 3; k++)
        {
            uGlobal[k] = c.Displacement(a.Index, (Dof)k);
            uGlobal[3 + k] = c.Displacement(b.Index, (Dof)k);
        }
        var loads = StoryAnalysis.MemberLoadsOf(model, c)[m.Index]
            .Select(x => x.Load with { WStart = x.Factor * x.Load.WStart, WEnd = x.Factor * x.Load.WEnd }).ToList();
        var uf = e.FlexibleEndDisplacements(uGlobal, loads);
        double cos = e.Cos, sin = e.Sin, lf = e.FlexibleLength, ra = m.RigidStart;
        var points = new List<CurvePoint>();
        void Add(double s, double u, double v) => points.Add(new CurvePoint(s, u, v, a.X + s * cos, a.Y + s * sin, u * cos - v * sin, u * sin + v * cos));
        // Local displacement of a node (u along the axis, v across it).
        (double U, double V) Local(int o) => (cos * uGlobal[o] + sin * uGlobal[o + 1], -sin * uGlobal[o] + cos * uGlobal[o + 1]);
        if (m.Kind == MemberKind.Brace)
        {
            var (u1, v1) = Local(0);
            var (u2, v2) = Local(3);
            Add(0, u1, v1);
            Add(e.Length, u2, v2);
            return points;
        }
        if (ra > 0) { var (u1, v1) = Local(0); Add(0, u1, v1); }
        // The member's load intensities on the flexible segment (local axes), as the element's load vector takes them.
        double qx1 = 0, qx2 = 0, qy1 = 0, qy2 = 0, l = e.Length;
        foreach (var ld in loads)
        {
            var (px1, px2, py1, py2) = e.LocalIntensity(ld);
            qx1 += px1 + (px2 - px1) * ra / l; qx2 += px1 + (px2 - px1) * (ra + lf) / l;
            qy1 += py1 + (py2 - py1) * ra / l; qy2 += py1 + (py2 - py1) * (ra + lf) / l;
        }
        double ei = m.E * m.I, ks = double.IsPositiveInfinity(m.ShearArea) ? double.PositiveInfinity : m.G * m.ShearArea, ea = m.E * m.A;
        for (int i = 0; i <= segments; i++)
        {
            double xi = (double)i / segments, x = xi * lf;
            var (n1, n2, n3, n4) = TimoshenkoBeam.TransverseShape(xi, e.Phi, lf);
            double v = n1 * uf[1] + n2 * uf[2] + n3 * uf[4] + n4 * uf[5] + FixedEndDeflection(x, lf, ei, ks, qy1, qy2);
            double u = (1 - xi) * uf[0] + xi * uf[3] + FixedEndAxial(x, lf, ea, qx1, qx2);
            Add(ra + x, u, v);
        }
        if (m.RigidEnd > 0) { var (u2, v2) = Local(3); Add(l, u2, v2); }
        return points;
    }

    /// <summary>
    /// Transverse deflection at x of a shear-deformable segment of length L held fixed at both ends (v = ψ = 0) under a
    /// load varying linearly from q1 to q2 (force per length, + along local y). Derived: with the shear V(x) = V₀ − ∫q,
    /// the bending moment M = M₀ − ∫V (both as carried by the part beyond x), EI·ψ = ∫M and v = ∫ψ + (1/κGA)·∫V, the end
    /// conditions ψ(L) = v(L) = 0 give M₀ and V₀. Uniform q gives q·x²(L − x)²/(24EI) + q·x(L − x)/(2κGA), the
    /// fixed-fixed beam of the textbooks with its shear term.
    /// </summary>
    public static double FixedEndDeflection(double x, double length, double ei, double shearRigidity, double q1, double q2)
    {
        if (q1 == 0 && q2 == 0) return 0;
        double a = q1, bq = (q2 - q1) / length, l = length, f = double.IsPositiveInfinity(shearRigidity) ? 0 : 1 / shearRigidity;
        double Q2(double t) => a * t * t / 2 + bq * t * t * t / 6;
        double Q3(double t) => a * t * t * t / 6 + bq * t * t * t * t / 24;
        double Q4(double t) => a * t * t * t * t / 24 + bq * t * t * t * t * t / 120;
        // ψ(L) = 0: M₀·L − V₀·L²/2 + Q3(L) = 0;  v(L) = 0: (M₀·L²/2 − V₀·L³/6 + Q4(L))/EI + f·(V₀·L − Q2(L)) = 0.
        double a11 = l, a12 = -l * l / 2, r1 = -Q3(l);
        double a21 = l * l / (2 * ei), a22 = -l * l * l / (6 * ei) + f * l, r2 = -Q4(l) / ei + f * Q2(l);
        double det = a11 * a22 - a12 * a21;
        double m0 = (r1 * a22 - a12 * r2) / det, v0 = (a11 * r2 - a21 * r1) / det;
        return (m0 * x * x / 2 - v0 * x * x * x / 6 + Q4(x)) / ei + f * (v0 * x - Q2(x));
    }

    /// <summary>Axial displacement at x of a segment of axial rigidity EA held at both ends under an axial load varying
    /// linearly from p1 to p2 (derived: EA·u'' = −p, u(0) = u(L) = 0).</summary>
    public static double FixedEndAxial(double x, double length, double ea, double p1, double p2)
    {
        if (p1 == 0 && p2 == 0) return 0;
        double b = (p2 - p1) / length;
        double P(double t) => p1 * t * t / 2 + b * t * t * t / 6;   // ∫∫p
        return (x / length * P(length) - P(x)) / ea;
    }
}
