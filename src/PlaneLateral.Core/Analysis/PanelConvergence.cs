using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// A mesh-convergence study of a panel's top stiffness: nested meshes h, h/2, h/4, ... (each element split in four),
/// the observed order of convergence from the last three, p = log₂((k₁ − k₂)/(k₂ − k₃)), and Richardson's
/// extrapolation k∞ ≈ k₃ + (k₃ − k₂)/(2ᵖ − 1) with the estimated discretisation error of the finest mesh |k∞ − k₃|
/// (Richardson, Phil. Trans. R. Soc. A 210, 1911; Roache, <i>Verification and Validation in Computational Science and
/// Engineering</i>, 1998, ch. 5). Valid when the three results are in the asymptotic range: monotone, with p > 0.
/// </summary>
/// <param name="ElementSizes">Element size of each mesh (m), coarse to fine.</param>
/// <param name="Stiffness">Top stiffness on each mesh (N/m).</param>
/// <param name="Unknowns">Unknowns of each mesh.</param>
/// <param name="ObservedOrder">p, or NaN with fewer than three meshes or non-monotone results.</param>
/// <param name="Extrapolated">k∞ (N/m), or NaN when p is.</param>
/// <param name="EstimatedError">|k∞ − k_finest| / k∞, the estimated relative discretisation error of the finest mesh, or NaN.</param>
/// <param name="Note">Plain sentence on how to read the figures.</param>
public sealed record PanelConvergenceResult(double[] ElementSizes, double[] Stiffness, int[] Unknowns, double ObservedOrder, double Extrapolated, double EstimatedError, string Note)
{
    /// <summary>The horizontal displacement (m) of every level in every load case (then combination) on each mesh, coarse to fine: [mesh][case][level]. Empty when the study solved no load case.</summary>
    public double[][][] MeshLevelDisplacements { get; init; } = [];

    /// <summary>
    /// A result computed on every mesh (coarse to fine), Richardson-extrapolated with the stiffness's observed order p
    /// (the same extrapolation as the stiffness), with its own estimated relative error |v∞ − v_finest| / |v∞|. Where
    /// the stiffness is not extrapolated, the finest mesh's value and NaN (no estimate). A value that is zero on the
    /// finest mesh and on the extrapolation (a held level) has error 0.
    /// </summary>
    public (double Value, double EstimatedError) ExtrapolateValue(IReadOnlyList<double> perMesh)
    {
        double fine = perMesh[^1];
        if (perMesh.Count < 3 || !double.IsFinite(ObservedOrder) || !double.IsFinite(Extrapolated)) return (fine, double.NaN);
        double ext = double.IsPositiveInfinity(ObservedOrder) ? fine : fine + (fine - perMesh[^2]) / (Math.Pow(2, ObservedOrder) - 1);
        double err = ext == 0 ? (fine == 0 ? 0 : double.PositiveInfinity) : Math.Abs(ext - fine) / Math.Abs(ext);
        return (ext, err);
    }
}

public static class PanelConvergence
{
    /// <summary>Solves the panel on <paramref name="meshes"/> nested meshes (≥ 2) for its top stiffness and extrapolates.</summary>
    /// <param name="baseMesh">The panel already solved on the base mesh (its stiffness is reused), or null.</param>
    /// <param name="caseIds">The model's load case ids: the panel's load cases (and <paramref name="combinations"/>) are
    /// solved on every mesh too, on the same factorisation, so their level displacements can be extrapolated like the
    /// stiffness (<see cref="PanelConvergenceResult.MeshLevelDisplacements"/>). Null: the stiffness alone.</param>
    public static PanelConvergenceResult Study(WallPanel panel, int meshes, AnalysisOptions? options = null, PanelResult? baseMesh = null,
        IReadOnlyList<string>? caseIds = null, IReadOnlyList<Combination>? combinations = null)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(meshes, 2);
        var sizes = new double[meshes];
        var k = new double[meshes];
        var unknowns = new int[meshes];
        var levels = new double[meshes][][];
        for (int i = 0; i < meshes; i++)
        {
            if (i == 0 && baseMesh is not null)
            {
                (sizes[0], k[0], unknowns[0]) = (baseMesh.Mesh.ElementSize, baseMesh.TopStiffness, baseMesh.Analysis.Solve.Unknowns);
                levels[0] = baseMesh.LevelDisplacements;
                continue;
            }
            var pm = PanelMesher.Mesh(panel, i);
            var r = caseIds is null
                ? PanelAnalysis.Run(panel with { Loads = [] }, pm, [], options)
                : PanelAnalysis.Run(panel, pm, caseIds, options, combinations: combinations);
            sizes[i] = pm.ElementSize;
            k[i] = r.TopStiffness;
            unknowns[i] = r.Analysis.Solve.Unknowns;
            levels[i] = r.LevelDisplacements;
        }
        var result = Extrapolate(sizes, k, unknowns);
        return caseIds is null ? result : result with { MeshLevelDisplacements = levels };
    }

    /// <summary>Observed order and Richardson extrapolation from results on meshes halved each time.</summary>
    public static PanelConvergenceResult Extrapolate(double[] sizes, double[] k, int[] unknowns)
    {
        int n = k.Length;
        if (n < 3)
            return new(sizes, k, unknowns, double.NaN, double.NaN, double.NaN, "two meshes give no observed order; ask for three or more");
        double d1 = k[n - 2] - k[n - 3], d2 = k[n - 1] - k[n - 2];
        if (d2 == 0)
            return new(sizes, k, unknowns, double.PositiveInfinity, k[n - 1], 0, "the two finest meshes agree to the last digit");
        double ratio = d1 / d2;
        if (!(ratio > 1))
            return new(sizes, k, unknowns, double.NaN, double.NaN, double.NaN, "the stiffness does not converge monotonically on these meshes (not yet in the asymptotic range): refine further before trusting an extrapolation");
        double p = Math.Log(ratio) / Math.Log(2);
        double ext = k[n - 1] + d2 / (Math.Pow(2, p) - 1);
        return new(sizes, k, unknowns, p, ext, Math.Abs(ext - k[n - 1]) / Math.Abs(ext),
            "observed order from the three finest meshes; the extrapolated stiffness and the error estimate hold in the asymptotic range only");
    }
}
