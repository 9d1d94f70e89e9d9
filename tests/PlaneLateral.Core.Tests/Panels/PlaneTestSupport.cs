using PlaneLateral.Analysis;
using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Panels;

/// <summary>Shared set-ups for the plane-stress tests: the elements under test and clamped-edge helpers.</summary>
internal static class PlaneTestSupport
{
    public static IPlaneElement Element(string name) => name switch
    {
        "QM6" => IncompatibleQuad4.Instance,
        "Q9" => LagrangeQuad9.Instance,
        _ => throw new ArgumentException(name),
    };

    /// <summary>Both DOFs of every node with x = <paramref name="x"/> held.</summary>
    public static List<(int, Dof)> ClampAtX(PlaneMesh mesh, double x) =>
        mesh.NodesAtX(x, 1e-9).SelectMany(i => new[] { (i, Dof.X), (i, Dof.Y) }).ToList();

    /// <summary>Edges lying on the line x = <paramref name="x"/>.</summary>
    public static List<(int Element, int Edge)> EdgesAtX(PlaneMesh mesh, double x) => mesh.EdgesWhere((px, _) => Math.Abs(px - x) < 1e-9);

    /// <summary>
    /// Every solve is checked: backward error as for frames, and global equilibrium. The imbalance of a plane mesh is
    /// the sum of the solve's residuals over the free DOFs, so it is bounded by η·‖K‖·‖u‖ times the number of
    /// unknowns rather than by η alone: slender meshes of stiff material reach 1e-9 of the load, hence 1e-7 here
    /// (derived from the residual bound, Higham 2002, Thm 7.1). When the loads are self-equilibrated (no applied
    /// force) the scale is the largest single reaction.
    /// </summary>
    public static void AssertChecks(PlaneAnalysisResult r)
    {
        foreach (var c in r.Cases)
        {
            Assert.True(c.BackwardError < 1e-13, $"{c.Id}: backward error {c.BackwardError}");
            var q = c.Equilibrium;
            if (q.AppliedFx == 0 && q.AppliedFy == 0)
            {
                double biggest = c.Reactions.Max(x => Math.Abs(x.Value));
                Assert.True(Math.Abs(q.ReactionFx) <= 1e-9 * biggest && Math.Abs(q.ReactionFy) <= 1e-9 * biggest, $"{c.Id}: self-equilibrated reactions sum to ({q.ReactionFx}, {q.ReactionFy})");
                continue;
            }
            Assert.True(q.RelativeForceError < 1e-7, $"{c.Id}: force imbalance {q.RelativeForceError}");
            Assert.True(q.RelativeMomentError < 1e-7, $"{c.Id}: moment imbalance {q.RelativeMomentError}");
        }
    }

    /// <summary>Mean vertical displacement of the nodes on x = <paramref name="x"/>.</summary>
    public static double MeanUyAtX(PlaneMesh mesh, PlaneCaseResult c, double x) => mesh.NodesAtX(x).Average(i => c.Uy[i]);

    /// <summary>Observed order p = log₂((a − b)/(b − c)) from three results on meshes halved in size each time (Richardson; common practice).</summary>
    public static double ObservedOrder(double a, double b, double c) => Math.Log((a - b) / (b - c)) / Math.Log(2);
}
