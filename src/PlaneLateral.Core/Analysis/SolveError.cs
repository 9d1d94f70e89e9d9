using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>How well a computed u satisfies K·u = f: the check every solve reports.</summary>
/// <param name="RelativeResidual">‖K·u − f‖₂ / ‖f‖₂ (‖K·u − f‖₂ when f = 0).</param>
/// <param name="BackwardError">Normwise backward error ‖K·u − f‖∞ / (‖K‖∞·‖u‖∞ + ‖f‖∞) (Higham, Accuracy and Stability of
/// Numerical Algorithms, 2nd ed., 2002, Thm 7.1); 0 when u and f are both zero.</param>
public readonly record struct SolveError(double RelativeResidual, double BackwardError)
{
    /// <param name="kNormInf">‖K‖∞ (<see cref="SymmetricSparseMatrix.InfinityNorm"/>), computed once per matrix by the caller.</param>
    public static SolveError Of(SymmetricSparseMatrix k, double kNormInf, double[] u, double[] f)
    {
        var ku = new double[u.Length];
        k.Multiply(u, ku);
        double rr = 0, ff = 0, rInf = 0, uInf = 0, fInf = 0;
        for (int i = 0; i < u.Length; i++)
        {
            double ri = ku[i] - f[i];
            rr += ri * ri; ff += f[i] * f[i];
            rInf = Math.Max(rInf, Math.Abs(ri)); uInf = Math.Max(uInf, Math.Abs(u[i])); fInf = Math.Max(fInf, Math.Abs(f[i]));
        }
        double denominator = kNormInf * uInf + fInf;
        return new SolveError(ff == 0 ? Math.Sqrt(rr) : Math.Sqrt(rr / ff), denominator == 0 ? 0 : rInf / denominator);
    }
}
