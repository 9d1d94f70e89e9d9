using PlaneLateral.Elements;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Factorization;

namespace PlaneLateral.Analysis;

/// <summary>
/// Eigenvalues and eigenvectors of a dense symmetric matrix. <see cref="Solve"/> gives all of them by MathNet.Numerics'
/// symmetric eigen decomposition (Householder reduction to tridiagonal form, then the implicit QL method: Golub &amp;
/// Van Loan, <i>Matrix Computations</i>, §8.3 — common practice); <see cref="Largest"/> gives the few largest of a
/// positive semi-definite matrix by subspace iteration (Bathe, <i>Finite Element Procedures</i>, 1996, §11.6), whose
/// cost grows as n² per step instead of n³, and falls back to <see cref="Solve"/> when the matrix is small or the
/// iteration does not settle. Both are deterministic: the managed provider (no native provider is loaded by this
/// project) and our own loops run the same operations in the same order on every machine, and the start vectors come
/// from a fixed sequence. Meant for the DOFs that carry mass (at most <see cref="Model.ModelLimits.MaxMassDofs"/>) or
/// small test models, not for the whole stiffness.
/// </summary>
public static class SymmetricEigen
{
    /// <summary>At or below this size <see cref="Largest"/> decomposes the whole matrix.</summary>
    internal const int DenseUpTo = 200;

    /// <summary>Eigenvalues in descending order (ties in the order the decomposition returns them) and the matching
    /// unit eigenvectors (column k of the array), each signed so that its entry of largest magnitude is positive.</summary>
    public static (double[] Values, double[,] Vectors) Solve(double[,] matrix)
    {
        int n = matrix.GetLength(0);
        if (n == 0) return ([], new double[0, 0]);
        var evd = Matrix<double>.Build.DenseOfArray(matrix).Evd(Symmetricity.Symmetric);
        var lambda = evd.EigenValues;
        var v = evd.EigenVectors;
        // MathNet returns them ascending; a stable sort keeps the order fixed even for equal values.
        var order = Enumerable.Range(0, n).OrderByDescending(i => lambda[i].Real).ThenBy(i => i).ToArray();
        var values = order.Select(i => lambda[i].Real).ToArray();
        var vectors = new double[n, n];
        for (int k = 0; k < n; k++)
        {
            var column = new double[n];
            for (int i = 0; i < n; i++) column[i] = v[i, order[k]];
            SignLargestPositive(column);
            for (int i = 0; i < n; i++) vectors[i, k] = column[i];
        }
        return (values, vectors);
    }

    /// <summary>
    /// The <paramref name="count"/> largest eigenvalues (descending) of a symmetric positive semi-definite matrix and
    /// their unit eigenvectors (column k), signed as in <see cref="Solve"/>. Subspace iteration on q = max(2p, p + 8)
    /// vectors with a Rayleigh–Ritz step each time (Bathe 1996, §11.6.3); converged when every wanted pair has
    /// ‖A·x − θ·x‖ ≤ 10⁻¹² · θ₁, which bounds the eigenvalue error by the residual squared over the gap and the vector
    /// error by the residual over the gap (Parlett, <i>The Symmetric Eigenvalue Problem</i>, 1998, §11-5). Repeated
    /// eigenvalues are found as often as they occur, up to q.
    /// </summary>
    public static (double[] Values, double[,] Vectors) Largest(double[,] matrix, int count)
    {
        int n = matrix.GetLength(0);
        count = Math.Clamp(count, 0, n);
        int q = Math.Min(n, Math.Max(2 * count, count + 8));
        if (n <= DenseUpTo || 2 * q >= n) return Take(Solve(matrix), count);
        var x = StartVectors(n, q);
        Orthonormalize(x);
        var y = new double[q][];
        for (int iteration = 0; iteration < 500; iteration++)
        {
            for (int j = 0; j < q; j++) y[j] = SmallMatrix.Times(matrix, x[j]);
            // Rayleigh–Ritz on span(x): H = Xᵀ·A·X, symmetrised against rounding.
            var h = new double[q, q];
            for (int i = 0; i < q; i++)
                for (int j = 0; j <= i; j++)
                    h[i, j] = h[j, i] = 0.5 * (SmallMatrix.Dot(x[i], y[j]) + SmallMatrix.Dot(x[j], y[i]));
            var (theta, s) = Solve(h);
            var ritz = Combine(x, s, q);
            var image = Combine(y, s, q);
            bool settled = theta[0] > 0;
            for (int k = 0; k < count && settled; k++)
            {
                double r = 0;
                for (int i = 0; i < n; i++) { double d = image[k][i] - theta[k] * ritz[k][i]; r += d * d; }
                settled = Math.Sqrt(r) <= 1e-12 * theta[0];
            }
            if (settled || theta[0] <= 0)
            {
                var vectors = new double[n, count];
                for (int k = 0; k < count; k++)
                {
                    SignLargestPositive(ritz[k]);
                    for (int i = 0; i < n; i++) vectors[i, k] = ritz[k][i];
                }
                return (theta.Take(count).ToArray(), vectors);
            }
            x = image;   // A·(Ritz vectors): the next subspace
            Orthonormalize(x);
        }
        return Take(Solve(matrix), count);   // did not settle (eigenvalues clustered at the edge of the subspace)
    }

    private static (double[] Values, double[,] Vectors) Take((double[] Values, double[,] Vectors) all, int count)
    {
        int n = all.Values.Length;
        var vectors = new double[n, count];
        for (int i = 0; i < n; i++) for (int k = 0; k < count; k++) vectors[i, k] = all.Vectors[i, k];
        return (all.Values.Take(count).ToArray(), vectors);
    }

    private static void SignLargestPositive(double[] v)
    {
        int big = 0;
        for (int i = 1; i < v.Length; i++) if (Math.Abs(v[i]) > Math.Abs(v[big]) + 1e-12) big = i;
        if (v[big] < 0) for (int i = 0; i < v.Length; i++) v[i] = -v[i];
    }

    /// <summary>Columns Σ_j v[j]·s[j, k] for k &lt; q.</summary>
    private static double[][] Combine(double[][] v, double[,] s, int q)
    {
        int n = v[0].Length;
        var r = new double[q][];
        for (int k = 0; k < q; k++)
        {
            var c = new double[n];
            for (int j = 0; j < q; j++)
            {
                double f = s[j, k];
                if (f == 0) continue;
                var vj = v[j];
                for (int i = 0; i < n; i++) c[i] += f * vj[i];
            }
            r[k] = c;
        }
        return r;
    }

    /// <summary>First all ones (the shape a uniform lateral load excites), then a fixed pseudo-random sequence (a
    /// 64-bit linear congruential generator, Knuth's MMIX constants — common practice), the same on every machine.</summary>
    private static double[][] StartVectors(int n, int q)
    {
        var x = new double[q][];
        ulong state = 0x9E3779B97F4A7C15UL;
        for (int j = 0; j < q; j++)
        {
            x[j] = new double[n];
            for (int i = 0; i < n; i++)
            {
                if (j == 0) { x[j][i] = 1; continue; }
                state = state * 6364136223846793005UL + 1442695040888963407UL;
                x[j][i] = (state >> 11) * (1.0 / (1UL << 53)) - 0.5;
            }
        }
        return x;
    }

    /// <summary>Modified Gram–Schmidt, twice (Giraud et al., "Rounding error analysis of the classical Gram-Schmidt
    /// orthogonalization process", 2005: twice is enough); a column that vanishes is replaced by a unit vector on the
    /// first coordinate direction not yet spanned, so the basis keeps its size.</summary>
    private static void Orthonormalize(double[][] x)
    {
        int n = x[0].Length;
        int next = 0;
        for (int k = 0; k < x.Length; k++)
        {
            double before = Math.Sqrt(SmallMatrix.Dot(x[k], x[k]));
            for (int pass = 0; pass < 2; pass++)
                for (int j = 0; j < k; j++)
                {
                    double d = SmallMatrix.Dot(x[j], x[k]);
                    for (int i = 0; i < n; i++) x[k][i] -= d * x[j][i];
                }
            double norm = Math.Sqrt(SmallMatrix.Dot(x[k], x[k]));
            if (!(norm > 1e-10 * before) || norm == 0)
            {
                if (next >= n) throw new InvalidOperationException("subspace larger than the matrix");
                Array.Clear(x[k]);
                x[k][next++] = 1;
                k--;   // orthogonalise the replacement
                continue;
            }
            for (int i = 0; i < n; i++) x[k][i] /= norm;
        }
    }
}
