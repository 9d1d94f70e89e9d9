namespace PlaneLateral.Elements.Plane;

/// <summary>
/// An isotropic linear elastic material in plane stress, and the panel thickness.
/// D = E/(1−ν²)·[1 ν 0; ν 1 0; 0 0 (1−ν)/2] (Timoshenko &amp; Goodier, <i>Theory of Elasticity</i>, 3rd ed., 1970, §1.8–§7;
/// any finite-element text, e.g. Cook et al., <i>Concepts and Applications of Finite Element Analysis</i>, 4th ed., 2002, eq. 3.1-5).
/// </summary>
/// <param name="E">Young's modulus (N/m²).</param>
/// <param name="Nu">Poisson's ratio, in (−1, 0.5).</param>
/// <param name="Thickness">Panel thickness t (m).</param>
public sealed record PlaneStressMaterial(double E, double Nu, double Thickness)
{
    /// <summary>The 3×3 constitutive matrix (N/m²) relating (σx, σy, τxy) to (εx, εy, γxy).</summary>
    public double[,] D()
    {
        double c = E / (1 - Nu * Nu);
        return new double[,] { { c, c * Nu, 0 }, { c * Nu, c, 0 }, { 0, 0, c * (1 - Nu) / 2 } };
    }

    /// <summary>Shear modulus G = E/(2(1+ν)) (N/m²).</summary>
    public double G => E / (2 * (1 + Nu));
}

/// <summary>Stress (N/m²) at a point (x, y) in metres: σx, σy, τxy in global axes.</summary>
public readonly record struct PlaneStressPoint(double X, double Y, double Sx, double Sy, double Txy);

/// <summary>A plane-stress element: nodes carry ux and uy only (element DOF order ux0, uy0, ux1, uy1, ...).</summary>
public interface IPlaneElement
{
    /// <summary>Short name for reports, e.g. "4-node incompatible-mode quadrilateral (QM6)".</summary>
    string Name { get; }

    /// <summary>Nodes per element.</summary>
    int NodeCount { get; }

    /// <summary>Nodes per edge (2 or 3), in the order start, (mid,) end.</summary>
    int EdgeNodeCount { get; }

    /// <summary>Element node indices (local) on edge e = 0..3 (bottom, right, top, left in the parent square), counter-clockwise.</summary>
    int[] EdgeNodes(int edge);

    /// <summary>Element stiffness (N/m), 2n×2n, for node coordinates x, y (m) counter-clockwise.</summary>
    double[,] Stiffness(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material);

    /// <summary>
    /// The element stiffness (N/m) written into <paramref name="k"/> (2n×2n, every entry overwritten): the same values as
    /// <see cref="Stiffness(ReadOnlySpan{double}, ReadOnlySpan{double}, PlaneStressMaterial)"/>, for a caller that
    /// assembles one element after another into the same buffer instead of a new array each.
    /// </summary>
    void Stiffness(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, double[,] k)
    {
        var s = Stiffness(x, y, material);
        Array.Copy(s, k, s.Length);
    }

    /// <summary>Stresses at the element's Gauss points, for element displacements ue (m).</summary>
    PlaneStressPoint[] GaussStresses(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, ReadOnlySpan<double> ue);

    /// <summary>
    /// Stresses at the element's nodes, extrapolated from the Gauss points with the Lagrange polynomial through them
    /// in each parent direction (the usual recovery, Cook et al. 2002, §6.11; Hinton &amp; Campbell, IJNME 8, 1974).
    /// Returns [node, (σx, σy, τxy)] in N/m².
    /// </summary>
    double[,] NodalStresses(ReadOnlySpan<double> x, ReadOnlySpan<double> y, PlaneStressMaterial material, ReadOnlySpan<double> ue);
}

/// <summary>Gauss–Legendre points and weights on [−1, 1] (Abramowitz &amp; Stegun, <i>Handbook</i>, 1964, Table 25.4).</summary>
public static class GaussLegendre
{
    public static readonly double[] Points2 = [-1 / Math.Sqrt(3), 1 / Math.Sqrt(3)];
    public static readonly double[] Weights2 = [1, 1];
    public static readonly double[] Points3 = [-Math.Sqrt(0.6), 0, Math.Sqrt(0.6)];
    public static readonly double[] Weights3 = [5.0 / 9, 8.0 / 9, 5.0 / 9];

    /// <summary>Value at ξ of the Lagrange polynomial through <paramref name="points"/> that is 1 at points[k].</summary>
    public static double Lagrange(double[] points, int k, double xi)
    {
        double v = 1;
        for (int j = 0; j < points.Length; j++)
            if (j != k) v *= (xi - points[j]) / (points[k] - points[j]);
        return v;
    }
}

/// <summary>Small dense helpers shared by the plane elements.</summary>
internal static class PlaneMath
{
    /// <summary>Inverse of a 2×2 Jacobian [[a, b], [c, d]] and its determinant.</summary>
    public static (double I00, double I01, double I10, double I11, double Det) Invert2(double a, double b, double c, double d)
    {
        double det = a * d - b * c;
        return (d / det, -b / det, -c / det, a / det, det);
    }

    /// <summary>Adds w·Aᵀ·D·B to k (A is 3×na, B is 3×nb).</summary>
    public static void AddAtDB(double[,] k, double[,] a, double[,] d, double[,] b, double w)
    {
        int na = a.GetLength(1), nb = b.GetLength(1);
        var db = new double[3, nb];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < nb; j++)
                db[i, j] = d[i, 0] * b[0, j] + d[i, 1] * b[1, j] + d[i, 2] * b[2, j];
        for (int i = 0; i < na; i++)
            for (int j = 0; j < nb; j++)
                k[i, j] += w * (a[0, i] * db[0, j] + a[1, i] * db[1, j] + a[2, i] * db[2, j]);
    }

    /// <summary>
    /// Adds w·Bᵀ·D·B to k, B given row by row (3 × n) in a span: the same arithmetic, in the same order, as
    /// <see cref="AddAtDB"/> with A = B, without a temporary on the heap.
    /// </summary>
    public static void AddBtDB(double[,] k, ReadOnlySpan<double> b, int n, double[,] d, double w)
    {
        Span<double> db = n <= 32 ? stackalloc double[3 * n] : new double[3 * n];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < n; j++)
                db[i * n + j] = d[i, 0] * b[j] + d[i, 1] * b[n + j] + d[i, 2] * b[2 * n + j];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                k[i, j] += w * (b[i] * db[j] + b[n + i] * db[n + j] + b[2 * n + i] * db[2 * n + j]);
    }

    /// <summary>Solves A·X = B for a small SPD A by Gaussian elimination with partial pivoting (A and B are copied).</summary>
    public static double[,] Solve(double[,] a, double[,] b)
    {
        int n = a.GetLength(0), m = b.GetLength(1);
        var A = (double[,])a.Clone();
        var X = (double[,])b.Clone();
        for (int c = 0; c < n; c++)
        {
            int p = c;
            for (int r = c + 1; r < n; r++) if (Math.Abs(A[r, c]) > Math.Abs(A[p, c])) p = r;
            if (p != c)
            {
                for (int j = 0; j < n; j++) (A[c, j], A[p, j]) = (A[p, j], A[c, j]);
                for (int j = 0; j < m; j++) (X[c, j], X[p, j]) = (X[p, j], X[c, j]);
            }
            for (int r = c + 1; r < n; r++)
            {
                double f = A[r, c] / A[c, c];
                if (f == 0) continue;
                for (int j = c; j < n; j++) A[r, j] -= f * A[c, j];
                for (int j = 0; j < m; j++) X[r, j] -= f * X[c, j];
            }
        }
        for (int c = n - 1; c >= 0; c--)
            for (int j = 0; j < m; j++)
            {
                double s = X[c, j];
                for (int k = c + 1; k < n; k++) s -= A[c, k] * X[k, j];
                X[c, j] = s / A[c, c];
            }
        return X;
    }

    /// <summary>σ = D·ε for ε = (εx, εy, γxy).</summary>
    public static (double Sx, double Sy, double Txy) Stress(double[,] d, double ex, double ey, double gxy) =>
        (d[0, 0] * ex + d[0, 1] * ey + d[0, 2] * gxy, d[1, 0] * ex + d[1, 1] * ey + d[1, 2] * gxy, d[2, 0] * ex + d[2, 1] * ey + d[2, 2] * gxy);
}
