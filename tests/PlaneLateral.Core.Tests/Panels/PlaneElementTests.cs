using PlaneLateral.Analysis;
using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using PlaneLateral.Model;
using Xunit.Abstractions;
using static PlaneLateral.Tests.Panels.PlaneTestSupport;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>Element properties and published membrane benchmarks for the 4-node QM6 and the 9-node quadrilateral.</summary>
public class PlaneElementTests(ITestOutputHelper output)
{
    // MacNeal & Harder, "A proposed standard set of problems to test finite element accuracy", Finite Elements in
    // Analysis and Design 1:3–20 (1985), patch test (Fig. 1): a 0.24 × 0.12 rectangle, t = 0.001, E = 1e6, ν = 0.25,
    // interior nodes (0.04, 0.02), (0.18, 0.03), (0.16, 0.08), (0.08, 0.08); boundary displacements
    // u = 1e-3(x + y/2), v = 1e-3(y + x/2). The exact solution is that field everywhere, εx = εy = γxy = 1e-3,
    // σx = σy = E/(1−ν)·1e-3 = 1333.33, τxy = G·1e-3 = 400 (derived: plane-stress Hooke's law).
    private static readonly double[] PatchX = [0, 0.24, 0.24, 0, 0.04, 0.18, 0.16, 0.08];
    private static readonly double[] PatchY = [0, 0, 0.12, 0.12, 0.02, 0.03, 0.08, 0.08];
    private static readonly int[][] PatchQuads = [[0, 1, 5, 4], [1, 2, 6, 5], [2, 3, 7, 6], [3, 0, 4, 7], [4, 5, 6, 7]];

    [Theory]
    [InlineData("QM6")]
    [InlineData("Q9")]
    public void DistortedPatchReproducesConstantStressExactly(string name)
    {
        var mesh = StructuredMesh.FromCorners(Element(name), PatchX, PatchY, PatchQuads);
        var material = new PlaneStressMaterial(1e6, 0.25, 0.001);
        static double U(double x, double y) => 1e-3 * (x + y / 2);
        static double V(double x, double y) => 1e-3 * (y + x / 2);
        var boundary = Enumerable.Range(0, mesh.NodeCount).Where(i => mesh.X[i] is 0 or 0.24 || mesh.Y[i] is 0 or 0.12).ToArray();
        Assert.Equal(name == "QM6" ? 4 : 8, boundary.Length);
        var problem = new PlaneStressProblem { Mesh = mesh, Material = material, Restraints = boundary.SelectMany(i => new[] { (i, Dof.X), (i, Dof.Y) }).ToList() };
        var load = new PlaneLoadCase { Id = "patch", Prescribed = boundary.SelectMany(i => new[] { (i, Dof.X, U(mesh.X[i], mesh.Y[i])), (i, Dof.Y, V(mesh.X[i], mesh.Y[i])) }).ToList() };
        var r = PlaneStressAnalysis.Run(problem, [load]);
        AssertChecks(r);
        var c = r.Cases[0];
        for (int i = 0; i < mesh.NodeCount; i++)
        {
            Assert.True(Math.Abs(c.Ux[i] - U(mesh.X[i], mesh.Y[i])) < 1e-15, $"ux at node {i}");
            Assert.True(Math.Abs(c.Uy[i] - V(mesh.X[i], mesh.Y[i])) < 1e-15, $"uy at node {i}");
            Near(1e6 / 0.75 * 1e-3, c.NodalStress[i, 0], 1e-9, "nodal σx");
            Near(1e6 / 0.75 * 1e-3, c.NodalStress[i, 1], 1e-9, "nodal σy");
            Near(400, c.NodalStress[i, 2], 1e-9, "nodal τxy");
        }
        foreach (var pt in c.GaussStress.SelectMany(g => g))
        {
            Near(1e6 / 0.75 * 1e-3, pt.Sx, 1e-9, "Gauss σx");
            Near(400, pt.Txy, 1e-9, "Gauss τxy");
        }
    }

    [Fact]
    public void WithoutTaylorsCorrectionTheDistortedPatchTestFails()
    {
        // Wilson's Q6 with the local Jacobian in the incompatible modes violates ∫ B_α dA = 0 on non-parallelogram
        // shapes, so it cannot reproduce constant stress there (Taylor, Beresford & Wilson 1976, §2): the patch test
        // above has teeth. Same patch, same boundary displacements.
        var mesh = StructuredMesh.FromCorners(IncompatibleQuad4.Uncorrected, PatchX, PatchY, PatchQuads);
        var boundary = new[] { 0, 1, 2, 3 };
        var problem = new PlaneStressProblem { Mesh = mesh, Material = new PlaneStressMaterial(1e6, 0.25, 0.001), Restraints = boundary.SelectMany(i => new[] { (i, Dof.X), (i, Dof.Y) }).ToList() };
        var load = new PlaneLoadCase { Id = "patch", Prescribed = boundary.SelectMany(i => new[] { (i, Dof.X, 1e-3 * (mesh.X[i] + mesh.Y[i] / 2)), (i, Dof.Y, 1e-3 * (mesh.Y[i] + mesh.X[i] / 2)) }).ToList() };
        var c = PlaneStressAnalysis.Run(problem, [load]).Cases[0];
        double worst = c.GaussStress.SelectMany(g => g).Max(pt => Math.Abs(pt.Sx - 1e6 / 0.75 * 1e-3) / (1e6 / 0.75 * 1e-3));
        output.WriteLine($"Q6 without correction: worst Gauss σx error {worst:E2}");
        Assert.True(worst > 1e-3, $"worst relative σx error {worst:E2}");
    }

    [Theory]
    [InlineData("QM6")]
    [InlineData("Q9")]
    public void DistortedElementHasExactlyThreeRigidBodyModesAndIsSymmetric(string name)
    {
        // A free element has three zero-energy modes (two translations, one rotation) and no others (common practice:
        // Cook et al. 2002, §6.12). Checked through K·r = 0 for the rigid modes and a positive energy for a straining mode.
        var mesh = StructuredMesh.FromCorners(Element(name), [0, 2, 2.5, 0.3], [0, 0.2, 1.7, 1.1], [[0, 1, 2, 3]]);
        var (x, y) = mesh.ElementCoordinates(0);
        var k = mesh.Element.Stiffness(x, y, new PlaneStressMaterial(200e9, 0.3, 0.01));
        int n = x.Length;
        double scale = Enumerable.Range(0, 2 * n).Max(i => k[i, i]);
        for (int i = 0; i < 2 * n; i++) for (int j = 0; j < 2 * n; j++) Assert.Equal(k[i, j], k[j, i]);
        var modes = new[]
        {
            Enumerable.Range(0, 2 * n).Select(d => d % 2 == 0 ? 1.0 : 0).ToArray(),
            Enumerable.Range(0, 2 * n).Select(d => d % 2 == 1 ? 1.0 : 0).ToArray(),
            Enumerable.Range(0, 2 * n).Select(d => d % 2 == 0 ? -y[d / 2] : x[d / 2]).ToArray(),
        };
        foreach (var m in modes)
            for (int i = 0; i < 2 * n; i++)
            {
                double s = 0;
                for (int j = 0; j < 2 * n; j++) s += k[i, j] * m[j];
                Assert.True(Math.Abs(s) < 1e-10 * scale, $"rigid mode force {s}");
            }
        // Exactly three: with the three rigid modes removed by holding node 0 (ux, uy) and node 1 (uy), the rest is
        // positive definite (every pivot of the reduced matrix positive).
        var keep = Enumerable.Range(0, 2 * n).Where(d => d is not (0 or 1 or 3)).ToArray();
        var a = new double[keep.Length, keep.Length];
        for (int i = 0; i < keep.Length; i++) for (int j = 0; j < keep.Length; j++) a[i, j] = k[keep[i], keep[j]];
        for (int c = 0; c < keep.Length; c++)
        {
            Assert.True(a[c, c] > 1e-8 * scale, $"pivot {c} = {a[c, c]}: a spurious zero-energy mode");
            for (int i = c + 1; i < keep.Length; i++)
            {
                double f = a[i, c] / a[c, c];
                for (int j = c; j < keep.Length; j++) a[i, j] -= f * a[c, j];
            }
        }
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    public void ConsistentEdgeLoadSumsToTheResultantAndItsMoment(int nodes)
    {
        // A linearly varying load q from 3 to 7 N/m along a straight edge of length 5 m: resultant (3 + 7)/2·5 = 25 N,
        // acting (3·5·2.5 + (7−3)·5/2·(2/3)·5)/25 = 70.833/25 m from the start (derived: a uniform part and a triangle);
        // the consistent forces reproduce both.
        double[] x = nodes == 2 ? [1, 4] : [1, 2.5, 4], y = nodes == 2 ? [2, 6] : [2, 4, 6];
        var f = EdgeLoad.Consistent(x, y, 0, 3, 0, 7);
        double fy = 0, m = 0;
        for (int a = 0; a < nodes; a++) { fy += f[2 * a + 1]; m += f[2 * a + 1] * (x[a] - 1); Assert.Equal(0, f[2 * a]); }
        Near(25, fy, 1e-12, "resultant");
        Near((37.5 + 100.0 / 3) * 0.6, m, 1e-12, "moment about the start (lever arm × cos θ, cos θ = 3/5)");
    }

    // ---- MacNeal & Harder (1985) straight cantilever ----

    /// <summary>
    /// The 6-element straight cantilever of MacNeal &amp; Harder (1985, Fig. 2): L = 6, depth 0.2, t = 0.1, E = 1e7,
    /// ν = 0.3. Rectangular: six 1 × 0.2 elements. Trapezoidal: the five inner element boundaries cross mid-depth at
    /// x = 1..5 and lean alternately ±45° (bottom x = i ∓ 0.1, top x = i ± 0.1). Parallelogram: all five lean +45°
    /// (bottom x = i − 0.1, top x = i + 0.1). The ends stay vertical (geometry from memory of MH's figure: interior
    /// boundaries at 45°).
    /// </summary>
    private static PlaneMesh MacNealHarder(IPlaneElement element, string shape)
    {
        var bottom = new double[7];
        var top = new double[7];
        for (int i = 0; i <= 6; i++)
        {
            double lean = i is 0 or 6 ? 0 : shape switch { "rectangle" => 0, "trapezoid" => i % 2 == 1 ? 0.1 : -0.1, _ => 0.1 };
            bottom[i] = i - lean;
            top[i] = i + lean;
        }
        var x = bottom.Concat(top).ToArray();
        var y = bottom.Select(_ => -0.1).Concat(top.Select(_ => 0.1)).ToArray();
        var quads = Enumerable.Range(0, 6).Select(i => new[] { i, i + 1, 8 + i, 7 + i }).ToArray();
        return StructuredMesh.FromCorners(element, x, y, quads);
    }

    private double MacNealHarderTip(string name, string shape)
    {
        var mesh = MacNealHarder(Element(name), shape);
        var problem = new PlaneStressProblem { Mesh = mesh, Material = new PlaneStressMaterial(1e7, 0.3, 0.1), Restraints = ClampAtX(mesh, 0) };
        // Unit in-plane shear at the tip, spread uniformly over the end (consistent edge forces): q = 1/0.2 per unit length.
        var edges = EdgesAtX(mesh, 6);
        var load = new PlaneLoadCase { Id = "tip shear", EdgeLoads = edges.Select(e => new PlaneEdgeLoad(e.Element, e.Edge, 0, 5, 0, 5)).ToList() };
        var r = PlaneStressAnalysis.Run(problem, [load]);
        AssertChecks(r);
        Near(1, r.Cases[0].Equilibrium.AppliedFy, 1e-12, "unit tip load");
        double tip = MeanUyAtX(mesh, r.Cases[0], 6);
        output.WriteLine($"MacNeal-Harder {name} {shape}: tip {tip:0.00000}, ratio to 0.1081 = {tip / 0.1081:0.0000}");
        return tip / 0.1081;
    }

    [Fact]
    public void MacNealHarderCantileverIncompatibleQuad()
    {
        // Reference tip deflection 0.1081 (MacNeal & Harder 1985, Table 2; confirmed, numbers secondary).
        // Rectangles: an incompatible-mode quad gives about 0.993 of it (REFERENCES, from the published tables):
        // within 1%. Trapezoids: by MacNeal's theorem (IJNME 24, 1987) a patch-test-passing 4-node element locks
        // under trapezoidal distortion, so it must be far below (we hold it under 0.5 so the test shows the locking).
        // Parallelograms: the QM6 correction keeps it usable; held to within 50% (MH's tables show incompatible-mode
        // quads between the two other shapes).
        double rect = MacNealHarderTip("QM6", "rectangle");
        Assert.InRange(rect, 0.983, 1.0);
        double trap = MacNealHarderTip("QM6", "trapezoid");
        Assert.InRange(trap, 0.0, 0.5);
        double para = MacNealHarderTip("QM6", "parallelogram");
        Assert.InRange(para, 0.5, 1.0);
        Assert.True(trap < para && para < rect, "the distortion sensitivity orders as MacNeal's theorem predicts");
    }

    [Theory]
    [InlineData("rectangle")]
    [InlineData("trapezoid")]
    [InlineData("parallelogram")]
    public void MacNealHarderCantileverNineNodeIsInsensitiveToDistortion(string shape)
    {
        // Quadratic elements are nearly insensitive to the MH distortions: MacNeal & Harder (1985, Table 2) report
        // 8- and 9-node quadrilaterals within a few percent of 0.1081 on all three shapes (from memory for the exact
        // entries). With one element through the depth and a fully clamped root (stiffer than the beam-theory root),
        // we hold ours within 2.5% on every shape — against 95% loss of the 4-node element on trapezoids.
        double ratio = MacNealHarderTip("Q9", shape);
        Assert.InRange(ratio, 0.975, 1.01);
    }
}
