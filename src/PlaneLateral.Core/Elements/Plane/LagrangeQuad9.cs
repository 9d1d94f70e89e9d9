namespace PlaneLateral.Elements.Plane;

/// <summary>
/// Nine-node Lagrangian plane-stress quadrilateral (biquadratic, isoparametric), 3×3 Gauss (full integration).
/// Node order: corners counter-clockwise from parent (−1,−1), then mid-sides of the bottom, right, top and left edges,
/// then the centre (Zienkiewicz &amp; Taylor, <i>The Finite Element Method</i>, vol. 1, 5th ed., 2000, §8.5; Cook et al.,
/// <i>Concepts and Applications of Finite Element Analysis</i>, 4th ed., 2002, §6.5). Quadratic displacements represent
/// pure bending exactly on parallelogram shapes, and the element keeps good accuracy when distorted, unlike any
/// 4-node element (MacNeal, IJNME 24, 1987).
/// </summary>
public sealed class LagrangeQuad9 : IPlaneElement
{
    public static LagrangeQuad9 Instance { get; } = new();

    public string Name => "9-node Lagrangian quadrilateral, 3x3 Gauss";
    public int NodeCount => 9;
    public int EdgeNodeCount => 3;

    /// <summary>Parent coordinates of the nodes.</summary>
    public static readonly double[] Xi = [-1, 1, 1, -1, 0, 1, 0, -1, 0], Eta = [-1, -1, 1, 1, -1, 0, 1, 0, 0];
    private static readonly int[][] Edges = [[0, 4, 1], [1, 5, 2], [2, 6, 3], [3, 7, 0]];

    public int[] EdgeNodes(int edge) => (int[])Edges[edge].Clone();

    private static double L(double node, double s) => node < 0 ? 0.5 * s * (s - 1) : node > 0 ? 0.5 * s * (s + 1) : 1 - s * s;
    private static double dL(double node, double s) => node < 0 ? s - 0.5 : node > 0 ? s + 0.5 : -2 * s;

    /// <summary>Shape functions at (ξ, η).</summary>
    public static double[] Shape(double xi, double eta)
    {
        var n = new double[9];
        for (int a = 0; a < 9; a++) n[a] = L(Xi[a], xi) * L(Eta[a], eta);
        return n;
    }

    /// <summary>The strain-displacement matrix B at (ξ, η) into <paramref name="b"/> (3 × 18, row by row), and det J.
    /// On the caller's stack: the stiffness asks for it at 9 points of every element of every mesh.</summary>
    private static double Matrix(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double xi, double eta, Span<double> b)
    {
        Span<double> dxi = stackalloc double[9], deta = stackalloc double[9];
        double j00 = 0, j01 = 0, j10 = 0, j11 = 0;
        for (int a = 0; a < 9; a++)
        {
            dxi[a] = dL(Xi[a], xi) * L(Eta[a], eta);
            deta[a] = L(Xi[a], xi) * dL(Eta[a], eta);
            j00 += dxi[a] * x[a]; j01 += dxi[a] * y[a]; j10 += deta[a] * x[a]; j11 += deta[a] * y[a];
        }
        var (i00, i01, i10, i11, det) = PlaneMath.Invert2(j00, j01, j10, j11);
        if (!(det > 0)) throw new ArgumentException("element has a non-positive Jacobian: nodes must be counter-clockwise and the shape not folded");
        b.Clear();
        for (int a = 0; a < 9; a++)
        {
            double nx = i00 * dxi[a] + i01 * deta[a], ny = i10 * dxi[a] + i11 * deta[a];
            b[2 * a] = nx; b[18 + 2 * a + 1] = ny; b[36 + 2 * a] = ny; b[36 + 2 * a + 1] = nx;
        }
        return det;
    }

    public double[,] Stiffness(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material)
    {
        var k = new double[18, 18];
        Stiffness(x, y, material, k);
        return k;
    }

    public void Stiffness(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, double[,] k)
    {
        if (k.GetLength(0) != 18 || k.GetLength(1) != 18) throw new ArgumentException("the stiffness buffer must be 18 × 18", nameof(k));
        var d = material.D();
        Array.Clear(k);
        Span<double> b = stackalloc double[3 * 18];
        var g = GaussLegendre.Points3;
        var w = GaussLegendre.Weights3;
        for (int p = 0; p < 3; p++)
            for (int q = 0; q < 3; q++)
            {
                double det = Matrix(x, y, g[p], g[q], b);
                PlaneMath.AddBtDB(k, b, 18, d, w[p] * w[q] * det * material.Thickness);
            }
        for (int i = 0; i < 18; i++)
            for (int j = 0; j < i; j++) { double v = 0.5 * (k[i, j] + k[j, i]); k[i, j] = v; k[j, i] = v; }
    }

    /// <summary>Stresses at the 3×3 Gauss points, ordered η outer, ξ inner (both ascending).</summary>
    public PlaneStressPoint[] GaussStresses(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, ReadOnlySpan<double> ue)
    {
        var d = material.D();
        var g = GaussLegendre.Points3;
        var list = new PlaneStressPoint[9];
        Span<double> b = stackalloc double[3 * 18];
        int k = 0;
        foreach (double eta in g)
            foreach (double xi in g)
            {
                Matrix(x, y, xi, eta, b);
                double ex = 0, ey = 0, gxy = 0;
                for (int j = 0; j < 18; j++) { ex += b[j] * ue[j]; ey += b[18 + j] * ue[j]; gxy += b[36 + j] * ue[j]; }
                var (sx, sy, txy) = PlaneMath.Stress(d, ex, ey, gxy);
                var n = Shape(xi, eta);
                double px = 0, py = 0;
                for (int a = 0; a < 9; a++) { px += n[a] * x[a]; py += n[a] * y[a]; }
                list[k++] = new PlaneStressPoint(px, py, sx, sy, txy);
            }
        return list;
    }

    public double[,] NodalStresses(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, ReadOnlySpan<double> ue)
    {
        var gp = GaussStresses(x, y, material, ue);
        var g = GaussLegendre.Points3;
        var s = new double[9, 3];
        for (int a = 0; a < 9; a++)
            for (int q = 0; q < 3; q++)
                for (int p = 0; p < 3; p++)
                {
                    double w = GaussLegendre.Lagrange(g, p, Xi[a]) * GaussLegendre.Lagrange(g, q, Eta[a]);
                    var pt = gp[3 * q + p];
                    s[a, 0] += w * pt.Sx; s[a, 1] += w * pt.Sy; s[a, 2] += w * pt.Txy;
                }
        return s;
    }
}
