namespace PlaneLateral.Elements.Plane;

/// <summary>
/// Consistent nodal forces of a distributed load on one element edge: f_a = ∫ N_a·q ds, with the edge's own shape
/// functions (linear for 2 nodes, quadratic for 3) and 3-point Gauss along the edge, which is exact for a straight
/// edge and a load linear along it (Cook et al., <i>Concepts and Applications of Finite Element Analysis</i>, 4th ed.,
/// 2002, §6.10; Zienkiewicz &amp; Taylor, vol. 1, 2000, §9.5).
/// </summary>
public static class EdgeLoad
{
    /// <summary>
    /// Consistent forces (N), order fx0, fy0, fx1, fy1, ..., for edge nodes in order start, (mid,) end at
    /// coordinates x, y (m), under a load per unit edge length (N/m, i.e. traction × thickness) varying linearly in the
    /// edge parameter from (qx1, qy1) at the start to (qx2, qy2) at the end.
    /// </summary>
    public static double[] Consistent(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double qx1, double qy1, double qx2, double qy2)
    {
        int n = x.Length;
        if (n is not (2 or 3) || y.Length != n) throw new ArgumentException("an edge has 2 or 3 nodes");
        var f = new double[2 * n];
        var g = GaussLegendre.Points3;
        var w = GaussLegendre.Weights3;
        Span<double> N = stackalloc double[3], dN = stackalloc double[3];
        for (int k = 0; k < 3; k++)
        {
            double s = g[k];
            if (n == 2) { N[0] = 0.5 * (1 - s); N[1] = 0.5 * (1 + s); dN[0] = -0.5; dN[1] = 0.5; }
            else { N[0] = 0.5 * s * (s - 1); N[1] = 1 - s * s; N[2] = 0.5 * s * (s + 1); dN[0] = s - 0.5; dN[1] = -2 * s; dN[2] = s + 0.5; }
            double dx = 0, dy = 0;
            for (int a = 0; a < n; a++) { dx += dN[a] * x[a]; dy += dN[a] * y[a]; }
            double ds = Math.Sqrt(dx * dx + dy * dy);
            double t = 0.5 * (1 + s);
            double qx = qx1 + (qx2 - qx1) * t, qy = qy1 + (qy2 - qy1) * t;
            for (int a = 0; a < n; a++) { f[2 * a] += w[k] * ds * N[a] * qx; f[2 * a + 1] += w[k] * ds * N[a] * qy; }
        }
        return f;
    }
}
