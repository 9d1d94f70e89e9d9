namespace PlaneLateral.Elements.Plane;

/// <summary>
/// Four-node plane-stress quadrilateral with incompatible (bubble) modes, free of shear locking in bending:
/// the bilinear field plus α₁(1−ξ²) and α₂(1−η²) in each displacement (Wilson, Taylor, Doherty &amp; Ghaboussi,
/// "Incompatible displacement models", in <i>Numerical and Computer Methods in Structural Mechanics</i>, 1973), with
/// Taylor's correction for distorted shapes (Taylor, Beresford &amp; Wilson, "A non-conforming element for stress
/// analysis", IJNME 10:1211–1219, 1976, "QM6"): the derivatives of the internal modes are taken with the Jacobian
/// at the element centre J₀ and scaled by det J₀/det J, so that ∫ B_α dA = 0 and the element passes the patch test on
/// any convex shape. The four internal parameters are condensed statically; 2×2 Gauss.
/// </summary>
public sealed class IncompatibleQuad4 : IPlaneElement
{
    public static IncompatibleQuad4 Instance { get; } = new(true);

    /// <summary>
    /// Wilson's element without Taylor's correction (Q6: internal-mode derivatives with the local Jacobian). It fails the
    /// patch test on non-parallelogram shapes; kept only so the tests can show that the patch test detects this.
    /// </summary>
    internal static IncompatibleQuad4 Uncorrected { get; } = new(false);

    private readonly bool _taylor;

    private IncompatibleQuad4(bool taylorCorrection) => _taylor = taylorCorrection;

    public string Name => _taylor ? "4-node incompatible-mode quadrilateral (QM6, Taylor et al. 1976), 2x2 Gauss" : "4-node incompatible-mode quadrilateral without Taylor's correction (Q6)";
    public int NodeCount => 4;
    public int EdgeNodeCount => 2;

    private static readonly double[] Xi = [-1, 1, 1, -1], Eta = [-1, -1, 1, 1];
    private static readonly int[][] Edges = [[0, 1], [1, 2], [2, 3], [3, 0]];

    public int[] EdgeNodes(int edge) => (int[])Edges[edge].Clone();

    /// <summary>The 3×8 compatible and 3×4 internal strain matrices at (ξ, η), and det J.</summary>
    private (double[,] B, double[,] Bi, double Det) Matrices(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double xi, double eta)
    {
        Span<double> dxi = stackalloc double[4], deta = stackalloc double[4];
        double j00 = 0, j01 = 0, j10 = 0, j11 = 0, c00 = 0, c01 = 0, c10 = 0, c11 = 0;
        for (int a = 0; a < 4; a++)
        {
            dxi[a] = 0.25 * Xi[a] * (1 + eta * Eta[a]);
            deta[a] = 0.25 * Eta[a] * (1 + xi * Xi[a]);
            j00 += dxi[a] * x[a]; j01 += dxi[a] * y[a]; j10 += deta[a] * x[a]; j11 += deta[a] * y[a];
            // Jacobian at the centre (ξ = η = 0).
            c00 += 0.25 * Xi[a] * x[a]; c01 += 0.25 * Xi[a] * y[a]; c10 += 0.25 * Eta[a] * x[a]; c11 += 0.25 * Eta[a] * y[a];
        }
        var (i00, i01, i10, i11, det) = PlaneMath.Invert2(j00, j01, j10, j11);
        if (!(det > 0)) throw new ArgumentException("element has a non-positive Jacobian: nodes must be counter-clockwise and the shape convex");
        var b = new double[3, 8];
        for (int a = 0; a < 4; a++)
        {
            double nx = i00 * dxi[a] + i01 * deta[a], ny = i10 * dxi[a] + i11 * deta[a];
            b[0, 2 * a] = nx; b[1, 2 * a + 1] = ny; b[2, 2 * a] = ny; b[2, 2 * a + 1] = nx;
        }
        var (k00, k01, k10, k11, det0) = PlaneMath.Invert2(c00, c01, c10, c11);
        double s = det0 / det;
        if (!_taylor) (k00, k01, k10, k11, s) = (i00, i01, i10, i11, 1.0);
        // P1 = 1 − ξ², P2 = 1 − η²: ∂P1/∂ξ = −2ξ, ∂P2/∂η = −2η, mapped with J₀⁻¹ and scaled by det J₀/det J (Taylor et al. 1976).
        double p1x = s * k00 * (-2 * xi), p1y = s * k10 * (-2 * xi);
        double p2x = s * k01 * (-2 * eta), p2y = s * k11 * (-2 * eta);
        var bi = new double[3, 4];   // internal DOFs: u·P1, v·P1, u·P2, v·P2
        bi[0, 0] = p1x; bi[1, 1] = p1y; bi[2, 0] = p1y; bi[2, 1] = p1x;
        bi[0, 2] = p2x; bi[1, 3] = p2y; bi[2, 2] = p2y; bi[2, 3] = p2x;
        return (b, bi, det);
    }

    private (double[,] Kcc, double[,] Kic, double[,] Kii) Blocks(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial m)
    {
        var d = m.D();
        var kcc = new double[8, 8];
        var kic = new double[4, 8];
        var kii = new double[4, 4];
        foreach (double xi in GaussLegendre.Points2)
            foreach (double eta in GaussLegendre.Points2)
            {
                var (b, bi, det) = Matrices(x, y, xi, eta);
                double w = det * m.Thickness;   // Gauss weights are 1 for the 2-point rule
                PlaneMath.AddAtDB(kcc, b, d, b, w);
                PlaneMath.AddAtDB(kic, bi, d, b, w);
                PlaneMath.AddAtDB(kii, bi, d, bi, w);
            }
        return (kcc, kic, kii);
    }

    public double[,] Stiffness(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material)
    {
        var (kcc, kic, kii) = Blocks(x, y, material);
        var x_ = PlaneMath.Solve(kii, kic);   // Kii⁻¹·Kic, 4×8
        var k = new double[8, 8];
        for (int i = 0; i < 8; i++)
            for (int j = 0; j < 8; j++)
            {
                double s = 0;
                for (int p = 0; p < 4; p++) s += kic[p, i] * x_[p, j];
                k[i, j] = kcc[i, j] - s;
            }
        // Symmetrise the round-off of the condensation.
        for (int i = 0; i < 8; i++)
            for (int j = 0; j < i; j++) { double v = 0.5 * (k[i, j] + k[j, i]); k[i, j] = v; k[j, i] = v; }
        return k;
    }

    /// <summary>The condensed internal parameters α = −Kii⁻¹·Kic·ue recovered for element displacements ue.</summary>
    private double[] Internal(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial m, ReadOnlySpan<double> ue)
    {
        var (_, kic, kii) = Blocks(x, y, m);
        var rhs = new double[4, 1];
        for (int p = 0; p < 4; p++)
        {
            double s = 0;
            for (int j = 0; j < 8; j++) s += kic[p, j] * ue[j];
            rhs[p, 0] = -s;
        }
        var a = PlaneMath.Solve(kii, rhs);
        return [a[0, 0], a[1, 0], a[2, 0], a[3, 0]];
    }

    private PlaneStressPoint StressAt(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double[,] d, ReadOnlySpan<double> ue, double[] alpha, double xi, double eta)
    {
        var (b, bi, _) = Matrices(x, y, xi, eta);
        double ex = 0, ey = 0, g = 0;
        for (int j = 0; j < 8; j++) { ex += b[0, j] * ue[j]; ey += b[1, j] * ue[j]; g += b[2, j] * ue[j]; }
        for (int j = 0; j < 4; j++) { ex += bi[0, j] * alpha[j]; ey += bi[1, j] * alpha[j]; g += bi[2, j] * alpha[j]; }
        var (sx, sy, txy) = PlaneMath.Stress(d, ex, ey, g);
        double px = 0, py = 0;
        for (int a = 0; a < 4; a++) { double n = 0.25 * (1 + xi * Xi[a]) * (1 + eta * Eta[a]); px += n * x[a]; py += n * y[a]; }
        return new PlaneStressPoint(px, py, sx, sy, txy);
    }

    /// <summary>Stresses at the 2×2 Gauss points, ordered η outer, ξ inner (both ascending).</summary>
    public PlaneStressPoint[] GaussStresses(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, ReadOnlySpan<double> ue)
    {
        var alpha = Internal(x, y, material, ue);
        var d = material.D();
        var list = new PlaneStressPoint[4];
        int k = 0;
        foreach (double eta in GaussLegendre.Points2)
            foreach (double xi in GaussLegendre.Points2)
                list[k++] = StressAt(x, y, d, ue, alpha, xi, eta);
        return list;
    }

    public double[,] NodalStresses(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, ReadOnlySpan<double> ue)
    {
        var gp = GaussStresses(x, y, material, ue);
        var g = GaussLegendre.Points2;
        var s = new double[4, 3];
        for (int a = 0; a < 4; a++)
            for (int q = 0; q < 2; q++)       // η index
                for (int p = 0; p < 2; p++)   // ξ index
                {
                    double w = GaussLegendre.Lagrange(g, p, Xi[a]) * GaussLegendre.Lagrange(g, q, Eta[a]);
                    var pt = gp[2 * q + p];
                    s[a, 0] += w * pt.Sx; s[a, 1] += w * pt.Sy; s[a, 2] += w * pt.Txy;
                }
        return s;
    }
}
