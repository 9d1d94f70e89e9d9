namespace PlaneLateral.Elements;

/// <summary>Dense helpers for small matrices (element matrices, the floors' (Ux, Uy, Rz) systems, eigen projections).</summary>
internal static class SmallMatrix
{
    /// <summary>Tᵀ·K·T.</summary>
    public static double[,] Congruent(double[,] k, double[,] t)
    {
        int n = t.GetLength(0), m = t.GetLength(1);
        var kt = new double[n, m];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < m; j++)
            {
                double s = 0;
                for (int p = 0; p < n; p++) s += k[i, p] * t[p, j];
                kt[i, j] = s;
            }
        var r = new double[m, m];
        for (int i = 0; i < m; i++)
            for (int j = 0; j < m; j++)
            {
                double s = 0;
                for (int p = 0; p < n; p++) s += t[p, i] * kt[p, j];
                r[i, j] = s;
            }
        return r;
    }

    /// <summary>Tᵀ·f.</summary>
    public static double[] TransposeTimes(double[,] t, double[] f)
    {
        int n = t.GetLength(0), m = t.GetLength(1);
        var r = new double[m];
        for (int j = 0; j < m; j++)
        {
            double s = 0;
            for (int p = 0; p < n; p++) s += t[p, j] * f[p];
            r[j] = s;
        }
        return r;
    }

    /// <summary>T·u.</summary>
    public static double[] Times(double[,] t, double[] u)
    {
        int n = t.GetLength(0), m = t.GetLength(1);
        var r = new double[n];
        for (int i = 0; i < n; i++)
        {
            double s = 0;
            for (int j = 0; j < m; j++) s += t[i, j] * u[j];
            r[i] = s;
        }
        return r;
    }

    /// <summary>
    /// Static condensation of the DOFs in <paramref name="removed"/>: K* = K_cc − K_cr·K_rr⁻¹·K_rc and
    /// f* = f_c − K_cr·K_rr⁻¹·f_r, returned at full size with the removed rows and columns zero.
    /// </summary>
    public static (double[,] K, double[] F) Condense(double[,] k, double[] f, IReadOnlyList<int> removed)
    {
        var kc = (double[,])k.Clone();
        var fc = (double[])f.Clone();
        int n = k.GetLength(0);
        foreach (int r in removed)
        {
            double krr = kc[r, r];
            for (int i = 0; i < n; i++)
            {
                if (i == r) continue;
                double kir = kc[i, r] / krr;
                if (kir == 0) continue;
                for (int j = 0; j < n; j++)
                    if (j != r) kc[i, j] -= kir * kc[r, j];
                fc[i] -= kir * fc[r];
            }
            for (int i = 0; i < n; i++) { kc[i, r] = 0; kc[r, i] = 0; }
            fc[r] = 0;
        }
        return (kc, fc);
    }

    /// <summary>
    /// Given u on the kept DOFs, fills u on the <paramref name="removed"/> DOFs so that (K·u − f) vanishes there:
    /// solves K_rr·u_r = f_r − K_rc·u_c (at most a few unknowns; Gaussian elimination with partial pivoting).
    /// </summary>
    public static void RecoverCondensed(double[,] k, double[] f, IReadOnlyList<int> removed, double[] u)
    {
        int m = removed.Count, n = k.GetLength(0);
        if (m == 0) return;
        var a = new double[m, m + 1];
        for (int p = 0; p < m; p++)
        {
            int r = removed[p];
            double rhs = f[r];
            for (int j = 0; j < n; j++)
                if (!removed.Contains(j)) rhs -= k[r, j] * u[j];
            for (int q = 0; q < m; q++) a[p, q] = k[r, removed[q]];
            a[p, m] = rhs;
        }
        for (int c = 0; c < m; c++)
        {
            int piv = c;
            for (int r = c + 1; r < m; r++) if (Math.Abs(a[r, c]) > Math.Abs(a[piv, c])) piv = r;
            for (int q = 0; q <= m; q++) (a[c, q], a[piv, q]) = (a[piv, q], a[c, q]);
            for (int r = c + 1; r < m; r++)
            {
                double fct = a[r, c] / a[c, c];
                for (int q = c; q <= m; q++) a[r, q] -= fct * a[c, q];
            }
        }
        for (int c = m - 1; c >= 0; c--)
        {
            double s = a[c, m];
            for (int q = c + 1; q < m; q++) s -= a[c, q] * u[removed[q]];
            u[removed[c]] = s / a[c, c];
        }
    }

    /// <summary>aᵀ·b.</summary>
    public static double Dot(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }
}
