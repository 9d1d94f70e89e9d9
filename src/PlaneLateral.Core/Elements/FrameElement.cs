using PlaneLateral.Model;

namespace PlaneLateral.Elements;

/// <summary>
/// One line member in global axes: a Timoshenko beam-column (or axial-only brace) between the faces of optional
/// rigid end zones, with optional moment releases at the flexible ends. Global DOF order:
/// ux1, uy1, rz1, ux2, uy2, rz2 (start node, then end node). SI units.
/// <para>
/// Rigid end zones: the flexible segment runs from distance a (start) to L − b (end) along the axis; its end
/// motions follow the node's as a rigid body: v_f1 = v1 + a·θ1, v_f2 = v2 − b·θ2 (local axes), the standard rigid
/// end-offset transformation (e.g. McGuire, Gallagher &amp; Ziemian, <i>Matrix Structural Analysis</i>, 2nd ed., 2000, §13.3).
/// Releases are condensed out of the flexible segment's stiffness and loads (static condensation).
/// </para>
/// </summary>
public sealed class FrameElement
{
    private readonly double[,] _kFlexible;   // local, flexible length, before condensation
    private readonly double[,] _offset;      // node local → flexible-end local
    private readonly double[,] _rotation;    // global → local (both ends)
    private readonly int[] _released;        // indices (2 and/or 5) condensed out

    public FrameElement(Member member, Node start, Node end)
    {
        Member = member;
        double dx = end.X - start.X, dy = end.Y - start.Y;
        Length = Math.Sqrt(dx * dx + dy * dy);
        Cos = dx / Length;
        Sin = dy / Length;
        FlexibleLength = Length - member.RigidStart - member.RigidEnd;

        if (member.Kind == MemberKind.Brace)
        {
            Phi = 0;
            _kFlexible = TimoshenkoBeam.AxialStiffness(member.E, member.A, FlexibleLength);
            _released = [];
        }
        else
        {
            Phi = TimoshenkoBeam.ShearParameter(member.E, member.I, member.G, member.ShearArea, FlexibleLength);
            _kFlexible = TimoshenkoBeam.LocalStiffness(member.E, member.A, member.I, Phi, FlexibleLength);
            var rel = new List<int>(2);
            if (member.ReleaseStart) rel.Add(2);
            if (member.ReleaseEnd) rel.Add(5);
            _released = rel.ToArray();
        }

        _offset = Identity6();
        _offset[1, 2] = member.RigidStart;
        _offset[4, 5] = -member.RigidEnd;

        _rotation = new double[6, 6];
        for (int n = 0; n < 2; n++)
        {
            int o = 3 * n;
            _rotation[o, o] = Cos; _rotation[o, o + 1] = Sin;
            _rotation[o + 1, o] = -Sin; _rotation[o + 1, o + 1] = Cos;
            _rotation[o + 2, o + 2] = 1;
        }

        var (kc, _) = SmallMatrix.Condense(_kFlexible, new double[6], _released);
        GlobalStiffness = SmallMatrix.Congruent(SmallMatrix.Congruent(kc, _offset), _rotation);
    }

    public Member Member { get; }

    /// <summary>Node-to-node length (m).</summary>
    public double Length { get; }

    /// <summary>Length between the rigid zones (m).</summary>
    public double FlexibleLength { get; }

    public double Cos { get; }
    public double Sin { get; }

    /// <summary>Φ = 12EI/(G·A_s·L_f²) of the flexible segment (0 for a brace or with no shear deformation).</summary>
    public double Phi { get; }

    /// <summary>6×6 stiffness in global axes.</summary>
    public double[,] GlobalStiffness { get; }

    /// <summary>
    /// Which global element DOFs this member actually stiffens: translations always; a node's rotation only for a
    /// beam-column whose end there is not released, or is released behind a rigid zone.
    /// </summary>
    public bool Stiffens(int localDof) => localDof switch
    {
        2 => Member.Kind == MemberKind.BeamColumn && (!Member.ReleaseStart || Member.RigidStart > 0),
        5 => Member.Kind == MemberKind.BeamColumn && (!Member.ReleaseEnd || Member.RigidEnd > 0),
        _ => true,
    };

    /// <summary>
    /// Local components (axial q_x, transverse q_y; N/m) of a member load at the start and end nodes.
    /// </summary>
    public (double Qx1, double Qx2, double Qy1, double Qy2) LocalIntensity(MemberLoad load)
    {
        double w1 = load.WStart, w2 = load.WEnd;
        if (load.Axes == LoadAxes.Local)
            return load.Direction == 0 ? (w1, w2, 0, 0) : (0, 0, w1, w2);
        // Global X load (w, 0): axial w·c, transverse −w·s. Global Y load (0, w): axial w·s, transverse w·c.
        double ax = load.Direction == 0 ? Cos : Sin;
        double tr = load.Direction == 0 ? -Sin : Cos;
        return (w1 * ax, w2 * ax, w1 * tr, w2 * tr);
    }

    /// <summary>Equivalent nodal loads in local axes of the flexible segment (before condensation).</summary>
    private double[] FlexibleLoads(IEnumerable<MemberLoad> loads)
    {
        var f = new double[6];
        double a = Member.RigidStart, lf = FlexibleLength, l = Length;
        foreach (var ld in loads)
        {
            var (qx1, qx2, qy1, qy2) = LocalIntensity(ld);
            double At(double q1, double q2, double s) => q1 + (q2 - q1) * s / l;
            var fe = TimoshenkoBeam.EquivalentLoads(lf, Phi,
                At(qx1, qx2, a), At(qx1, qx2, a + lf), At(qy1, qy2, a), At(qy1, qy2, a + lf));
            for (int i = 0; i < 6; i++) f[i] += fe[i];
        }
        return f;
    }

    /// <summary>
    /// Loads on the rigid zones carried straight to the nodes, in local axes at the nodes
    /// (resultant force and its moment about the node).
    /// </summary>
    private double[] RigidZoneLoads(IEnumerable<MemberLoad> loads)
    {
        var f = new double[6];
        double a = Member.RigidStart, b = Member.RigidEnd, l = Length;
        if (a == 0 && b == 0) return f;
        foreach (var ld in loads)
        {
            var (qx1, qx2, qy1, qy2) = LocalIntensity(ld);
            // Linear load on [s0, s1]: resultant and first moment about s = pivot, exactly.
            (double R, double M) Zone(double q1, double q2, double s0, double s1, double pivot)
            {
                double qa = q1 + (q2 - q1) * s0 / l, qb = q1 + (q2 - q1) * s1 / l, len = s1 - s0;
                double r = 0.5 * (qa + qb) * len;
                // ∫ q(s)·(s − pivot) ds over the zone.
                double firstMoment = len * len * (qa + 2 * qb) / 6.0 + (s0 - pivot) * r;
                return (r, firstMoment);
            }
            if (a > 0)
            {
                var (rx, _) = Zone(qx1, qx2, 0, a, 0);
                var (ry, my) = Zone(qy1, qy2, 0, a, 0);
                f[0] += rx; f[1] += ry; f[2] += my;
            }
            if (b > 0)
            {
                var (rx, _) = Zone(qx1, qx2, l - b, l, l);
                var (ry, my) = Zone(qy1, qy2, l - b, l, l);
                f[3] += rx; f[4] += ry; f[5] += my;
            }
        }
        return f;
    }

    /// <summary>Equivalent nodal loads in global axes (what the member's loads put on the nodes).</summary>
    public double[] GlobalEquivalentLoads(IReadOnlyList<MemberLoad> loads)
    {
        if (loads.Count == 0) return new double[6];
        var flexible = FlexibleLoads(loads);
        // With no release the condensation leaves the loads as they are: skip it (and its copy of K) on the common path.
        var fc = _released.Length == 0 ? flexible : SmallMatrix.Condense(_kFlexible, flexible, _released).F;
        var fNode = SmallMatrix.TransposeTimes(_offset, fc);
        var fr = RigidZoneLoads(loads);
        for (int i = 0; i < 6; i++) fNode[i] += fr[i];
        return SmallMatrix.TransposeTimes(_rotation, fNode);
    }

    /// <summary>
    /// Forces acting on the flexible segment at its two ends (the faces of the rigid zones), local axes:
    /// N1, V1, M1, N2, V2, M2, matrix sign convention (positive along local x, y and counter-clockwise).
    /// </summary>
    /// <param name="uGlobal">Global element displacements ux1, uy1, rz1, ux2, uy2, rz2.</param>
    public double[] LocalEndForces(double[] uGlobal, IReadOnlyList<MemberLoad> loads)
    {
        var ff = FlexibleLoads(loads);
        var uf = FlexibleEnds(uGlobal, ff);
        var f = SmallMatrix.Times(_kFlexible, uf);
        for (int i = 0; i < 6; i++) f[i] -= ff[i];
        foreach (int r in _released) f[r] = 0; // exactly zero at a release
        return f;
    }

    /// <summary>
    /// Displacements of the flexible segment's two ends in local axes (u1, v1, θ1, u2, v2, θ2 at the faces of the rigid
    /// zones): the nodes' motion carried through the rigid zones, and at a released end the segment's own rotation
    /// recovered from the condensation (with the member's loads). With the element's shape functions these give the
    /// member's deflected shape between its nodes.
    /// </summary>
    /// <param name="uGlobal">Global element displacements ux1, uy1, rz1, ux2, uy2, rz2.</param>
    public double[] FlexibleEndDisplacements(double[] uGlobal, IReadOnlyList<MemberLoad> loads) => FlexibleEnds(uGlobal, FlexibleLoads(loads));

    private double[] FlexibleEnds(double[] uGlobal, double[] flexibleLoads)
    {
        var uf = SmallMatrix.Times(_offset, SmallMatrix.Times(_rotation, uGlobal));
        if (_released.Length > 0) SmallMatrix.RecoverCondensed(_kFlexible, flexibleLoads, _released, uf);
        return uf;
    }

    /// <summary>
    /// End forces acting on the member from its nodes, global axes: K·u − f_equivalent. At every free DOF these
    /// sum over the members meeting there to the applied nodal load; at a support the remainder is the reaction.
    /// </summary>
    public double[] GlobalNodeForces(double[] uGlobal, IReadOnlyList<MemberLoad> loads)
    {
        var f = SmallMatrix.Times(GlobalStiffness, uGlobal);
        var fe = GlobalEquivalentLoads(loads);
        for (int i = 0; i < 6; i++) f[i] -= fe[i];
        return f;
    }

    private static double[,] Identity6()
    {
        var t = new double[6, 6];
        for (int i = 0; i < 6; i++) t[i, i] = 1;
        return t;
    }
}
