namespace PlaneLateral.Tests.Analysis;

/// <summary>
/// The cyclic Jacobi method (Golub &amp; Van Loan, <i>Matrix Computations</i>, §8.5 — common practice), kept only as an
/// independent reference for <see cref="PlaneLateral.Analysis.SymmetricEigen"/>: slow (about ten sweeps of n³), but a
/// different algorithm, so the two cannot share a bug. Eigenvalues descending, vectors in the columns.
/// </summary>
internal static class JacobiReference
{
    public static (double[] Values, double[,] Vectors) Solve(double[,] matrix)
    {
        int n = matrix.GetLength(0);
        var a = (double[,])matrix.Clone();
        var v = new double[n, n];
        for (int i = 0; i < n; i++) v[i, i] = 1;
        for (int sweep = 0; sweep < 100; sweep++)
        {
            double off = 0, diag = 0;
            for (int i = 0; i < n; i++)
            {
                diag += a[i, i] * a[i, i];
                for (int j = i + 1; j < n; j++) off += a[i, j] * a[i, j];
            }
            if (off <= 1e-30 * diag || off == 0) break;
            for (int p = 0; p < n - 1; p++)
                for (int q = p + 1; q < n; q++)
                {
                    if (a[p, q] == 0) continue;
                    double theta = (a[q, q] - a[p, p]) / (2 * a[p, q]);
                    double t = Math.Sign(theta == 0 ? 1 : theta) / (Math.Abs(theta) + Math.Sqrt(theta * theta + 1));
                    double c = 1 / Math.Sqrt(t * t + 1), s = t * c;
                    for (int k = 0; k < n; k++)
                    {
                        double akp = a[k, p], akq = a[k, q];
                        a[k, p] = c * akp - s * akq;
                        a[k, q] = s * akp + c * akq;
                    }
                    for (int k = 0; k < n; k++)
                    {
                        double apk = a[p, k], aqk = a[q, k];
                        a[p, k] = c * apk - s * aqk;
                        a[q, k] = s * apk + c * aqk;
                    }
                    for (int k = 0; k < n; k++)
                    {
                        double vkp = v[k, p], vkq = v[k, q];
                        v[k, p] = c * vkp - s * vkq;
                        v[k, q] = s * vkp + c * vkq;
                    }
                }
        }
        var order = Enumerable.Range(0, n).OrderByDescending(i => a[i, i]).ThenBy(i => i).ToArray();
        var vectors = new double[n, n];
        for (int k = 0; k < n; k++) for (int i = 0; i < n; i++) vectors[i, k] = v[i, order[k]];
        return (order.Select(i => a[i, i]).ToArray(), vectors);
    }
}
