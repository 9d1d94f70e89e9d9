using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using static PlaneLateral.Tests.Plan.PlanJson;

namespace PlaneLateral.Tests.Plan;

/// <summary>Displacements and drifts at plan points the user names (docs/plan.md, "points").</summary>
public class PlanPointTests
{
    private static readonly double[][] Box60x40 = [[0, 0], [60, 0], [60, 40], [0, 40]];

    private static Dictionary<string, object> Building(object[] points, bool drift = false)
    {
        var b = (Dictionary<string, object>)PlanBuilding(
            [Wall("W", 0, 20, "y", 20), Wall("E", 60, 12, "y", 10), Wall("S", 20, 0, "x", 16), Wall("N", 40, 40, "x", 12)],
            [new { id = "EY", direction = "y", forces = new[] { 20.0, 30 } }, new { id = "EX", direction = "x", forces = new[] { 15.0, 25 } }], [0, 12, 24], Box60x40);
        var plan = JObject.FromObject(b["plan"]);
        plan["points"] = JArray.FromObject(points);
        if (drift) plan["driftCheck"] = JObject.FromObject(new { Cd = 5.0, Ie = 1.0, allowedRatio = 0.02 });
        b["plan"] = plan;
        return b;
    }

    [Fact]
    public void APointMovesWithTheRigidFloorAndACornerPointGivesTheCornersNumbers()
    {
        // Derived: a rigid floor turns by Rz about the plan origin while that origin moves by (Ux, Uy), so a point p
        // moves by u(p) = (Ux, Uy) + Rz ẑ × p: ux = Ux − Rz·y, uy = Uy + Rz·x; equivalently about any point p₀ of the
        // floor, ux = ux(p₀) − Rz·(y − y₀), uy = uy(p₀) + Rz·(x − x₀). The story drift is this floor's minus the floor
        // below's at the same plan point (the base does not move). A point at an outline corner is that corner.
        var r = Solve(Building([new { id = "stair core NE", at = new[] { 45.0, 30 } }, new { id = "corner", at = new[] { 60.0, 40 } }, new { id = "on W", at = new[] { 0.0, 20 } }]));
        foreach (var c in r.Cases)
        {
            Assert.Equal(2 * 3, c.Points.Count);
            foreach (var q in c.Points)
            {
                var m = c.Motion[q.Level - 1];
                var below = q.Level >= 2 ? c.Motion[q.Level - 2] : new FloorMotion(0, 0, 0, 0);
                // About the mass centre p₀ = (30, 20) ft: ux(p₀) = Ux − Rz·y₀, uy(p₀) = Uy + Rz·x₀, then moved to the point.
                double x0 = 30 * Ft, y0 = 20 * Ft, ux0 = m.Ux - m.Rz * y0, uy0 = m.Uy + m.Rz * x0;
                double scale = Math.Abs(m.Ux) + Math.Abs(m.Uy) + Math.Abs(m.Rz) * 60 * Ft;
                Assert.True(Math.Abs(ux0 - m.Rz * (q.At.Y - y0) - q.Ux) <= 1e-12 * scale, $"{c.Case.Id} {q.Point} ux about p0");
                Assert.True(Math.Abs(uy0 + m.Rz * (q.At.X - x0) - q.Uy) <= 1e-12 * scale, $"{c.Case.Id} {q.Point} uy about p0");
                Assert.True(Math.Abs(m.Ux - m.Rz * q.At.Y - q.Ux) <= 1e-12 * scale, $"{c.Case.Id} {q.Point} ux");
                Assert.True(Math.Abs(m.Uy + m.Rz * q.At.X - q.Uy) <= 1e-12 * scale, $"{c.Case.Id} {q.Point} uy");
                Assert.True(Math.Abs(q.DriftX - (q.Ux - (below.Ux - below.Rz * q.At.Y))) <= 1e-12 * scale, $"{c.Case.Id} {q.Point} drift x");
                Assert.True(Math.Abs(q.DriftY - (q.Uy - (below.Uy + below.Rz * q.At.X))) <= 1e-12 * scale, $"{c.Case.Id} {q.Point} drift y");
            }
            // The point at (60, 40) is outline corner 3: the same numbers, exactly (the same formula on the same numbers).
            foreach (var q in c.Points.Where(q => q.Point == "corner"))
            {
                var v = c.Vertices.Single(v => v.Level == q.Level && v.Vertex == 2);
                Assert.Equal(v.Ux, q.Ux); Assert.Equal(v.Uy, q.Uy); Assert.Equal(v.DriftX, q.DriftX); Assert.Equal(v.DriftY, q.DriftY);
            }
            // A point on wall W (its centre, along y): its uy is the wall line's own level displacement, recovered from the
            // line's planar model under the floors' level forces (an independent road: the line's member solve).
            var w = r.Lines.Single(l => l.Line.Id == "W");
            int ci = r.Cases.ToList().IndexOf(c);
            foreach (var q in c.Points.Where(q => q.Point == "on W"))
            {
                double line = w.Recovered.Cases[ci].Displacement(w.Line.LevelNodes[q.Level - 1], Dof.X);
                Assert.True(Math.Abs(line - q.Uy) <= 1e-9 * Math.Max(Math.Abs(q.Uy), 1e-12), $"{c.Case.Id} level {q.Level}: line {line}, point {q.Uy}");
            }
        }
    }

    [Fact]
    public void NamedPointsJoinTheDriftCheckAndTheFiles()
    {
        // Derived: δ = C_d·|drift|/I_e at each named point, its ratio δ/h (ASCE 7-16 eq. 12.8-15 as for the corners), one
        // row per case, story and point, labelled by the point's id.
        var r = Solve(Building([new { id = "stair core NE", at = new[] { 45.0, 30 } }], drift: true));
        foreach (var c in r.Cases)
            foreach (var q in c.Points)
            {
                var row = r.DriftChecks.Single(d => d.Case == c.Case.Id && d.Story == q.Level && d.Point == q.Point);
                Assert.Equal(-1, row.Vertex);
                Assert.Equal("point stair core NE", row.Where);
                double d = Math.Sqrt(q.DriftX * q.DriftX + q.DriftY * q.DriftY);
                TestModels.Near(5 * d, row.Amplified, 1e-14, "δ");
                TestModels.Near(5 * d / (12 * Ft), row.Ratio, 1e-12, "δ/h");
                // An interior point of a rigid floor never drifts more than the worst corner (|drift| is convex in the point).
                var corner = r.DriftChecks.Single(x => x.Case == c.Case.Id && x.Story == q.Level && x.Point is null);
                Assert.True(row.Drift <= corner.Drift * (1 + 1e-12));
            }
        var files = PlanFiles.Render(r).ToDictionary(f => f.Name, f => f.Text);
        var csv = files["plan-points.csv"].Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("case,level,point,", csv[0]);
        Assert.Equal(1 + r.Cases.Count * 2, csv.Length);
        Assert.Contains(files["plan-drift-checks.csv"].Split('\n'), l => l.EndsWith(",stair core NE", StringComparison.Ordinal));
        var json = JObject.Parse(files["plan.json"]);
        Assert.Equal("stair core NE", (string?)json["points"]![0]!["id"]);
        Assert.Equal(2, ((JArray)json["points"]![0]!["cases"]![0]!["levels"]!).Count);
    }

    [Fact]
    public void APointOffTheFloorIsRefusedAtItsKey()
    {
        var e = Assert.Throws<ModelInputException>(() => Read(Building([new { id = "outside", at = new[] { 70.0, 30 } }])));
        var d = e.Diagnostics.Single(x => x.Problem.Contains("lies outside the outline", StringComparison.Ordinal));
        Assert.Equal("$.plan.points[0].at", d.JsonPath);
        Assert.False(string.IsNullOrWhiteSpace(d.Fix));
        e = Assert.Throws<ModelInputException>(() => Read(Building([new { id = "a", at = new[] { 10.0, 10 } }, new { id = "a", at = new[] { 20.0, 10 } }])));
        Assert.Contains(e.Diagnostics, x => x.Problem.Contains("duplicate point id", StringComparison.Ordinal) && x.JsonPath == "$.plan.points[1].id");
    }
}
