namespace PlaneLateral.Elements;

/// <summary>
/// The exact two-node Timoshenko beam-column in its local axes. DOF order: u1, v1, θ1, u2, v2, θ2
/// (axial, transverse, rotation at each end; local x from node 1 to node 2, local y 90° counter-clockwise from it).
/// <para>
/// Stiffness: Przemieniecki, <i>Theory of Matrix Structural Analysis</i> (1968), §5.6 (beam with shear deformation):
/// bending terms EI/(L³(1+Φ))·[12, 6L, (4+Φ)L², (2−Φ)L²] with Φ = 12EI/(G·A_s·L²). It is exact for end loads, reduces
/// to the Euler–Bernoulli element as A_s → ∞ (Φ → 0), and has three rigid-body modes.
/// </para>
/// <para>
/// Loads: equivalent nodal loads from the element's exact (interdependent) transverse shape functions,
/// Friedman &amp; Kosmatka, "An improved two-node Timoshenko beam finite element", Computers &amp; Structures 47(3):473–481 (1993).
/// Because these shape functions solve the homogeneous Timoshenko equations, the equivalent loads are the exact
/// fixed-end forces of a shear-deformable member (by Betti's reciprocal theorem), not the Euler–Bernoulli ones.
/// </para>
/// Units: any consistent set.
/// </summary>
public static class TimoshenkoBeam
{
    /// <summary>Φ = 12EI/(G·A_s·L²); 0 when the shear area is infinite (no shear deformation).</summary>
    public static double ShearParameter(double e, double i, double g, double shearArea, double length) =>
        double.IsPositiveInfinity(shearArea) ? 0.0 : 12.0 * e * i / (g * shearArea * length * length);

    /// <summary>Local 6×6 stiffness of a beam-column of length L.</summary>
    public static double[,] LocalStiffness(double e, double a, double i, double phi, double length)
    {
        double l = length, l2 = l * l;
        double ea = e * a / l;
        double c = e * i / (l2 * l * (1.0 + phi));
        double k11 = 12 * c, k12 = 6 * l * c, k22 = (4 + phi) * l2 * c, k25 = (2 - phi) * l2 * c;
        return new double[6, 6]
        {
            {  ea,    0,    0, -ea,    0,    0 },
            {   0,  k11,  k12,   0, -k11,  k12 },
            {   0,  k12,  k22,   0, -k12,  k25 },
            { -ea,    0,    0,  ea,    0,    0 },
            {   0, -k11, -k12,   0,  k11, -k12 },
            {   0,  k12,  k25,   0, -k12,  k22 },
        };
    }

    /// <summary>Local 6×6 stiffness of an axial-only member (rotation rows and columns zero).</summary>
    public static double[,] AxialStiffness(double e, double a, double length)
    {
        double ea = e * a / length;
        var k = new double[6, 6];
        k[0, 0] = k[3, 3] = ea;
        k[0, 3] = k[3, 0] = -ea;
        return k;
    }

    /// <summary>
    /// Transverse displacement shape functions at ξ = x/L: values multiplying v1, θ1, v2, θ2
    /// (Friedman &amp; Kosmatka 1993, eq. 19). With Φ = 0 they are the Hermite cubics.
    /// </summary>
    public static (double V1, double T1, double V2, double T2) TransverseShape(double xi, double phi, double length)
    {
        double m = 1.0 / (1.0 + phi);
        double x2 = xi * xi, x3 = x2 * xi;
        return (
            m * (2 * x3 - 3 * x2 - phi * xi + 1 + phi),
            m * length * (x3 - (2 + phi / 2) * x2 + (1 + phi / 2) * xi),
            m * (-2 * x3 + 3 * x2 + phi * xi),
            m * length * (x3 - (1 - phi / 2) * x2 - (phi / 2) * xi));
    }

    /// <summary>
    /// Equivalent nodal loads (local axes, DOF order u1, v1, θ1, u2, v2, θ2) of distributed loads varying linearly
    /// along the element: axial q_x from <paramref name="qx1"/> to <paramref name="qx2"/>, transverse q_y from
    /// <paramref name="qy1"/> to <paramref name="qy2"/> (force per length). These equal minus the fixed-end reactions.
    /// </summary>
    public static double[] EquivalentLoads(double length, double phi, double qx1, double qx2, double qy1, double qy2)
    {
        var f = new double[6];
        for (int g = 0; g < 3; g++)
        {
            double xi = Gauss3.Points[g], w = Gauss3.Weights[g] * length; // cubic shape × linear load: exact
            double qx = qx1 + (qx2 - qx1) * xi, qy = qy1 + (qy2 - qy1) * xi;
            var (v1, t1, v2, t2) = TransverseShape(xi, phi, length);
            f[0] += w * qx * (1 - xi);
            f[3] += w * qx * xi;
            f[1] += w * qy * v1;
            f[2] += w * qy * t1;
            f[4] += w * qy * v2;
            f[5] += w * qy * t2;
        }
        return f;
    }
}
