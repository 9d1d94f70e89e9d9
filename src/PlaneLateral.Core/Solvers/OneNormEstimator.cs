namespace PlaneLateral.Solvers;

/// <summary>
/// Estimates ‖A⁻¹‖₁ from products with A⁻¹ and A⁻ᵀ only (solves with a factor), never forming A⁻¹.
/// </summary>
/// <remarks>
/// Hager's method (W. W. Hager, "Condition estimates", SIAM J. Sci. Stat. Comput. 5, 1984) as refined by Higham
/// (N. J. Higham, "FORTRAN codes for estimating the one-norm of a real or complex matrix, with applications to condition
/// estimation", ACM TOMS 14, 1988), stated as Algorithm 15.4 of Higham, <i>Accuracy and Stability of Numerical Algorithms</i>,
/// 2nd ed., SIAM, 2002 (the LAPACK estimator xLACON): a gradient ascent of ‖A⁻¹x‖₁ over the unit 1-norm ball from
/// x = e/n, at most five iterations, stopped when the sign vector repeats or the estimate stops growing, then the extra
/// test vector bᵢ = (−1)ⁱ⁺¹(1 + (i−1)/(n−1)) whose 2‖A⁻¹b‖₁/(3n) guards against the cases that fool the ascent.
/// Every value it returns is ‖A⁻¹x‖₁ for some ‖x‖₁ = 1 (or 2/(3n)·‖A⁻¹b‖₁ ≤ ‖A⁻¹‖₁), so it is a lower bound, in practice
/// within a factor of about 3 (Higham 2002, §15.3, from memory). Deterministic: no random start.
/// </remarks>
public static class OneNormEstimator
{
    /// <summary>Applies an operator: writes op(x) into y (both of length n).</summary>
    public delegate void Apply(double[] x, double[] y);

    /// <summary>Lower-bound estimate of ‖A⁻¹‖₁.</summary>
    /// <param name="n">Order of A.</param>
    /// <param name="inverse">y = A⁻¹x.</param>
    /// <param name="inverseTransposed">y = A⁻ᵀx (the same as <paramref name="inverse"/> for a symmetric A).</param>
    /// <param name="products">Number of products with A⁻¹ or A⁻ᵀ used (at most 11).</param>
    public static double InverseNorm(int n, Apply inverse, Apply inverseTransposed, out int products)
    {
        ArgumentNullException.ThrowIfNull(inverse);
        ArgumentNullException.ThrowIfNull(inverseTransposed);
        products = 0;
        if (n <= 0) return 0.0;
        var x = new double[n];
        var y = new double[n];
        var z = new double[n];
        Array.Fill(x, 1.0 / n);
        inverse(x, y); products++;
        if (n == 1) return Math.Abs(y[0]);

        double est = Norm1(y);
        var xi = Signs(y);
        inverseTransposed(xi, z); products++;
        int j = ArgMaxAbs(z);
        for (int iter = 2; iter <= 5; iter++)
        {
            Array.Clear(x);
            x[j] = 1.0;
            inverse(x, y); products++;
            double previous = est;
            double current = Norm1(y);
            est = Math.Max(est, current);
            var next = Signs(y);
            if (next.AsSpan().SequenceEqual(xi) || current <= previous) break;   // converged, or no longer growing
            xi = next;
            inverseTransposed(xi, z); products++;
            int last = j;
            j = ArgMaxAbs(z);
            if (Math.Abs(z[last]) == Math.Abs(z[j])) break;   // the gradient points back at the same vertex
        }

        // The alternative estimate.
        for (int i = 0; i < n; i++) x[i] = (i % 2 == 0 ? 1.0 : -1.0) * (1.0 + (double)i / (n - 1));
        inverse(x, y); products++;
        return Math.Max(est, 2.0 * Norm1(y) / (3.0 * n));
    }

    private static double Norm1(double[] v)
    {
        double s = 0;
        foreach (double a in v) s += Math.Abs(a);
        return s;
    }

    private static double[] Signs(double[] v)
    {
        var s = new double[v.Length];
        for (int i = 0; i < v.Length; i++) s[i] = v[i] >= 0 ? 1.0 : -1.0;
        return s;
    }

    private static int ArgMaxAbs(double[] v)
    {
        int best = 0;
        for (int i = 1; i < v.Length; i++) if (Math.Abs(v[i]) > Math.Abs(v[best])) best = i;
        return best;
    }
}
