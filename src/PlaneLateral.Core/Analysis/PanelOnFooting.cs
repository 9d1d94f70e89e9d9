using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// A wall panel whose base stands on a rigid footing on soil (docs/footings.md, "A panel on a footing"): every base mesh
/// node follows the footing's rigid motion (u₀, v₀, θ) about the middle of the base, (X0 + length/2, Y0), so the base
/// stays plane and turns; the footing's sliding, vertical and rocking springs act there. The panel is condensed
/// exactly on that one master (<see cref="PanelSuperelement"/>: the base as one rigid segment), the 3×3 system
/// (K_c + K_s)·q = −q₀ gives the footing's motion in each case, and the panel is recovered with its base following it.
/// <para>
/// Derived: the panel's stresses relative to its base are those of the fixed-base panel (its base resultants are set by
/// statics), so the footing only adds a rigid-body motion: under a unit top force the top moves by the fixed-base value
/// plus h²/K_θ plus 1/K_h, exactly, on the same mesh.
/// </para>
/// </summary>
public static class PanelOnFooting
{
    /// <summary>Solves the panel on the footing's springs (SI: N/m, N/m, N·m/rad; +∞ for a direction held rigidly).</summary>
    /// <exception cref="ArgumentException">The panel cannot be meshed.</exception>
    public static PanelResult Run(WallPanel panel, IReadOnlyList<string> caseIds, double sliding, double vertical, double rocking,
        AnalysisOptions? options = null, string sourcePath = "<panel>", IReadOnlyList<Combination>? combinations = null)
    {
        var pm = PanelMesher.Mesh(panel);
        var (held, cases) = PanelAnalysis.Setup(panel, pm, caseIds, sourcePath);
        // The unit force at the top, for the top stiffness on the footing: through the top tie, or spread along the top.
        int top = pm.Levels.Length - 1;
        cases.Add(panel.FloorTies
            ? new PlaneLoadCase { Id = "unit top force", TieForces = [(top, 1.0)] }
            : new PlaneLoadCase { Id = "unit top force", EdgeLoads = PanelAnalysis.SpreadLoad(pm, top, 1, 0) });
        var free = new PlaneStressProblem
        {
            Mesh = held.Mesh, Material = held.Material, Restraints = [], HorizontalTies = held.HorizontalTies,
            NodeLabel = held.NodeLabel, SourcePath = held.SourcePath,
        };
        var segment = new RigidSegment($"footing under {panel.Id}", panel.X0 + 0.5 * panel.Length, panel.Y0, pm.BaseNodes.ToArray());
        var condensed = PanelSuperelement.Condense(free, [segment], cases, options);
        double[] k = [sliding, vertical, rocking];
        var motions = new List<double[]>();
        foreach (var q0 in condensed.FixedEndForces)
        {
            // (K_c + K_s)·q = −q₀, a rigid direction (k = ∞) held at zero.
            var free3 = Enumerable.Range(0, 3).Where(i => !double.IsPositiveInfinity(k[i])).ToArray();
            var q = new double[3];
            if (free3.Length > 0)
            {
                int n = free3.Length;
                var m = new double[n, n];
                var r = new double[n];
                for (int i = 0; i < n; i++)
                {
                    r[i] = -q0[free3[i]];
                    for (int j = 0; j < n; j++) m[i, j] = condensed.Stiffness[free3[i], free3[j]] + (i == j ? k[free3[i]] : 0);
                }
                var x = SolveSmall(m, r);
                for (int i = 0; i < n; i++) q[free3[i]] = x[i];
            }
            motions.Add(q);
        }
        var combos = (combinations ?? []).Select(c => (c.Id, (IReadOnlyList<(int, double)>)c.Factors)).ToArray();
        // Combinations superpose the model's cases only: recover the unit case apart.
        int nc = caseIds.Count;
        var rec = PanelSuperelement.Recover(free, [segment], cases.Take(nc).ToList(), motions.Take(nc).ToList(), options, combos);
        var unit = PanelSuperelement.Recover(free, [segment], [cases[nc]], [motions[nc]], options);
        double flex = PanelAnalysis.LevelDisplacement(panel, pm, unit.Cases[0], top);
        return new PanelResult
        {
            Panel = panel, Mesh = pm, Analysis = rec, TopStiffness = 1 / flex,
            LevelDisplacements = rec.Cases.Select(c => PanelAnalysis.LevelDisplacements(panel, pm, c)).ToArray(),
        };
    }

    /// <summary>Gaussian elimination with partial pivoting on a small dense system (at most 3×3 here).</summary>
    private static double[] SolveSmall(double[,] a, double[] b)
    {
        int n = b.Length;
        var m = (double[,])a.Clone();
        var x = (double[])b.Clone();
        for (int c = 0; c < n; c++)
        {
            int p = c;
            for (int r = c + 1; r < n; r++) if (Math.Abs(m[r, c]) > Math.Abs(m[p, c])) p = r;
            if (m[p, c] == 0) throw new InvalidOperationException("the panel on its footing is a mechanism");
            if (p != c)
            {
                for (int j = 0; j < n; j++) (m[c, j], m[p, j]) = (m[p, j], m[c, j]);
                (x[c], x[p]) = (x[p], x[c]);
            }
            for (int r = c + 1; r < n; r++)
            {
                double f = m[r, c] / m[c, c];
                for (int j = c; j < n; j++) m[r, j] -= f * m[c, j];
                x[r] -= f * x[c];
            }
        }
        for (int r = n - 1; r >= 0; r--)
        {
            double s = x[r];
            for (int j = r + 1; j < n; j++) s -= m[r, j] * x[j];
            x[r] = s / m[r, r];
        }
        return x;
    }
}
