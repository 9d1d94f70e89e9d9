namespace PlaneLateral.Solvers;

/// <summary>
/// Dense L·D·Lᵀ in natural order, with the same pivot-failure policy as the sparse solvers. For small systems
/// and as a reference in tests: O(n³) time, O(n²) memory.
/// </summary>
public sealed class DenseLdlSolver : ISparseSpdSolver
{
    public string Description => "dense L·D·Lᵀ, natural order (managed)";

    public ISparseSpdFactor Factorize(SymmetricSparseMatrix matrix, double relativePivotTolerance = 1e-10)
    {
        int n = matrix.Size;
        var a = matrix.ToDense();
        var d = new double[n];
        var failures = new List<PivotFailure>();
        var failed = new bool[n];
        for (int k = 0; k < n; k++)
        {
            double diag = matrix.Diagonal(k);
            double piv = a[k, k];
            for (int p = 0; p < k; p++) piv -= a[k, p] * a[k, p] * d[p];
            if (!(piv > relativePivotTolerance * diag) || diag <= 0)
            {
                failures.Add(new PivotFailure(k, piv, diag));
                failed[k] = true;
                d[k] = 1;
                for (int p = 0; p < k; p++) a[k, p] = 0;
                for (int i = k + 1; i < n; i++) a[i, k] = 0;
                continue;
            }
            d[k] = piv;
            for (int i = k + 1; i < n; i++)
            {
                if (failed[i]) continue;
                double s = a[i, k];
                for (int p = 0; p < k; p++) s -= a[i, p] * a[k, p] * d[p];
                a[i, k] = s / piv;
            }
        }
        return new Factor(n, a, d, failures, failed, matrix);
    }

    private sealed class Factor(int n, double[,] l, double[] d, List<PivotFailure> failures, bool[] failed, SymmetricSparseMatrix k) : ISparseSpdFactor
    {
        public int Size => n;
        public long FactorNonZeros => (long)n * (n + 1) / 2;
        public IReadOnlyList<PivotFailure> PivotFailures => failures;

        public void Solve(ReadOnlySpan<double> b, Span<double> x)
        {
            b.CopyTo(x);
            Substitute(x, n);
        }

        /// <summary>Solves L·D·Lᵀ·x = x in place over the leading <paramref name="m"/> equations; failed DOFs give zero.</summary>
        private void Substitute(Span<double> x, int m)
        {
            for (int i = 0; i < m; i++)
            {
                if (failed[i]) { x[i] = 0; continue; }
                double s = x[i];
                for (int p = 0; p < i; p++) s -= l[i, p] * x[p];
                x[i] = s;
            }
            for (int i = 0; i < m; i++) x[i] /= d[i];
            for (int i = m - 1; i >= 0; i--)
            {
                if (failed[i]) { x[i] = 0; continue; }
                double s = x[i];
                for (int p = i + 1; p < m; p++) s -= l[p, i] * x[p];
                x[i] = s;
            }
        }

        public double[] MechanismShape(int failureIndex)
        {
            // z = [−K11⁻¹·K12·e; 1; 0], K11 the block eliminated before the failed DOF f.
            int f = failures[failureIndex].Dof;
            var dense = k.ToDense();
            var z = new double[n];
            for (int i = 0; i < f; i++) z[i] = -dense[i, f];
            Substitute(z, f);
            z[f] = 1;
            double max = z.Max(Math.Abs);
            for (int i = 0; i < n; i++) z[i] /= max;
            return z;
        }
    }
}
