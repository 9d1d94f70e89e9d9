using System.Globalization;
using PlaneLateral.Elements;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>
/// Condition estimates of the factorised stiffness matrix K (SI units), and of its diagonally scaled form
/// H = D^(−1/2)·K·D^(−1/2) (D = diag K), which is free of the units' mix of translations and rotations.
/// </summary>
/// <param name="Kappa1">Estimate of κ₁(K) = ‖K‖₁·‖K⁻¹‖₁ (a lower bound, usually within a factor 3); depends on the units.</param>
/// <param name="ScaledKappa1">Estimate of κ₁(H), the figure the warning is judged on.</param>
/// <param name="Threshold">Warning threshold on <paramref name="ScaledKappa1"/>.</param>
/// <param name="LikelyCause">When above the threshold, the member or spring whose stiffness stands out, in words; else null.</param>
/// <param name="Solves">Solves with the factor the two estimates used.</param>
public sealed record ConditionEstimate(double Kappa1, double ScaledKappa1, double Threshold, string? LikelyCause, int Solves)
{
    /// <summary>The scaled estimate is above the threshold.</summary>
    public bool IllConditioned => ScaledKappa1 > Threshold;

    /// <summary>Decimal digits the a-priori bound κ·u leaves (u = 2⁻⁵³ ≈ 1.1e−16), at least 0.</summary>
    public double DigitsAssured => Math.Max(0, -Math.Log10(ScaledKappa1 * Math.Pow(2, -53)));
}

/// <summary>
/// Estimates the conditioning of the stiffness after a successful factorisation (<see cref="OneNormEstimator"/>, Higham 2002
/// Alg. 15.4) and, above the threshold, names the likely cause.
/// </summary>
/// <remarks>
/// Why the scaled matrix: for Cholesky-type factorisations of an SPD matrix the error of the solution is governed by
/// κ(D^(−1/2)·K·D^(−1/2)), not by κ(K) (van der Sluis's result on diagonal scaling; Higham 2002, ch. 7 and 10, from memory),
/// and κ(K) itself changes with the units chosen for rotations against translations.
/// Threshold 1e8: with u ≈ 1.1e−16 the first-order bound κ·u on the relative error of the displacements is then about 1e−8,
/// i.e. fewer than about eight significant digits are assured, and the global equilibrium check of the results (relative
/// imbalance, held to 1e−9 by the tests) starts to show the loss. It also warns two orders of magnitude before the pivot test
/// (a pivot below 1e−10 of its diagonal is a mechanism) would report a link some 1e10 times stiffer than its neighbours as one.
/// The cause: stiff links or huge areas make one member's stiffness far above that of the members it meets, which is what
/// pushes the largest eigenvalue of H away from the rest; the member with the largest ratio of its largest translational
/// stiffness (a diagonal entry of its global element matrix, EA/L or 12EI/L³(1+Φ) in effect) to the median of its
/// neighbours' is named, and likewise a support spring against the members at its node.
/// </remarks>
public static class Conditioning
{
    /// <summary>Warning threshold on the scaled 1-norm condition estimate.</summary>
    public const double WarningThreshold = 1e8;

    /// <summary>Ratio of stiffnesses at which a member or spring is said to stand out from its neighbours.</summary>
    public const double StandOutRatio = 1e4;

    /// <summary>Both estimates; <paramref name="factor"/> must be a factor of <paramref name="k"/> without pivot failures.</summary>
    public static ConditionEstimate Estimate(StructureModel model, IReadOnlyList<FrameElement> elements, SymmetricSparseMatrix k, ISparseSpdFactor factor)
    {
        int n = k.Size;
        if (n == 0) return new ConditionEstimate(0, 0, WarningThreshold, null, 0);
        var b = new double[n];
        void Inverse(double[] x, double[] y)
        {
            factor.Solve(x, y);
        }
        double inv = OneNormEstimator.InverseNorm(n, Inverse, Inverse, out int s1);
        double kappa = OneNorm(k, null) * inv;

        var root = new double[n];   // √K_ii
        for (int i = 0; i < n; i++) root[i] = Math.Sqrt(k.Diagonal(i));
        void ScaledInverse(double[] x, double[] y)   // H⁻¹x = D^(1/2)·K⁻¹·D^(1/2)·x
        {
            for (int i = 0; i < n; i++) b[i] = root[i] * x[i];
            factor.Solve(b, y);
            for (int i = 0; i < n; i++) y[i] *= root[i];
        }
        double scaledInv = OneNormEstimator.InverseNorm(n, ScaledInverse, ScaledInverse, out int s2);
        double scaled = OneNorm(k, root) * scaledInv;
        string? cause = scaled > WarningThreshold ? LikelyCause(model, elements) : null;
        return new ConditionEstimate(kappa, scaled, WarningThreshold, cause, s1 + s2);
    }

    /// <summary>The note the results carry when the estimate is above the threshold; null otherwise.</summary>
    public static string? Note(ConditionEstimate c)
    {
        if (!c.IllConditioned) return null;
        string k = c.ScaledKappa1.ToString("0.0e0", CultureInfo.InvariantCulture);
        string digits = c.DigitsAssured.ToString("0", CultureInfo.InvariantCulture);
        return $"The stiffness matrix is ill-conditioned: estimated condition number {k} (1-norm, diagonally scaled; warning above " +
               $"{WarningThreshold.ToString("0e0", CultureInfo.InvariantCulture)}), so only about {digits} significant digits of the displacements are assured by the a-priori bound; " +
               $"the backward errors below say whether the solve itself was stable. Likely cause: {c.LikelyCause} " +
               "Fix: give such a member a stiffness of the order of its neighbours' (a link some 100 to 1000 times stiffer is rigid for practical purposes), or tie the nodes by a level's rigid diaphragm (docs/building.md).";
    }

    /// <summary><paramref name="notes"/> with the conditioning note after them when there is one.</summary>
    public static IReadOnlyList<string> WithNote(IReadOnlyList<string> notes, ConditionEstimate c) =>
        Note(c) is { } note ? [.. notes, note] : notes;

    /// <summary>‖S·K·S‖₁ of the full symmetric matrix (S = diag(1/√K_ii) when <paramref name="root"/> is given, else I).</summary>
    private static double OneNorm(SymmetricSparseMatrix k, double[]? root)
    {
        var col = new double[k.Size];
        for (int j = 0; j < k.Size; j++)
            for (int p = k.ColumnPointers[j]; p < k.ColumnPointers[j + 1]; p++)
            {
                int i = k.RowIndices[p];
                double a = Math.Abs(k.Values[p]);
                if (root is not null) a /= root[i] * root[j];
                col[j] += a;
                if (i != j) col[i] += a;
            }
        return col.Length == 0 ? 0 : col.Max();
    }

    private static string LikelyCause(StructureModel model, IReadOnlyList<FrameElement> elements)
    {
        // Largest translational stiffness of each member (N/m): the largest of its global translational diagonal entries.
        var s = elements.Select(e => new[] { 0, 1, 3, 4 }.Max(d => e.GlobalStiffness[d, d])).ToArray();
        var atNode = new List<int>[model.Nodes.Count];
        for (int i = 0; i < atNode.Length; i++) atNode[i] = [];
        foreach (var e in elements) { atNode[e.Member.Start].Add(e.Member.Index); atNode[e.Member.End].Add(e.Member.Index); }

        string best = "";
        double bestRatio = 0;
        foreach (var e in elements)
        {
            var others = atNode[e.Member.Start].Concat(atNode[e.Member.End]).Where(o => o != e.Member.Index).Distinct().Select(o => s[o]).ToList();
            if (others.Count == 0) continue;
            double ratio = s[e.Member.Index] / Median(others);
            if (ratio > bestRatio)
            {
                bestRatio = ratio;
                best = $"member \"{e.Member.Id}\" is about {Sci(ratio)} times as stiff (its largest translational stiffness, EA/L or 12EI/L³ in effect) as the median of the members it meets.";
            }
        }
        foreach (var sup in model.Supports)
        {
            var members = atNode[sup.Node];
            if (members.Count == 0) continue;
            double spring = Math.Max(sup.SpringX, sup.SpringY);
            double ratio = spring / members.Max(m => s[m]);
            if (ratio > bestRatio)
            {
                bestRatio = ratio;
                best = $"the support spring at node \"{model.Nodes[sup.Node].Id}\" is about {Sci(ratio)} times as stiff as the stiffest member there.";
            }
        }
        if (bestRatio >= StandOutRatio) return best;
        return "no single member or spring stands out from its neighbours (none is 1e4 times as stiff as those it meets); look for members of very different length, very short members between long ones, or units that differ between inputs.";
    }

    private static double Median(List<double> v)
    {
        v.Sort();
        int m = v.Count / 2;
        return v.Count % 2 == 1 ? v[m] : 0.5 * (v[m - 1] + v[m]);
    }

    private static string Sci(double v) => v.ToString("0.0e0", CultureInfo.InvariantCulture);
}
