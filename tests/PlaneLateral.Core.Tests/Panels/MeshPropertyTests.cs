using System.Globalization;
using CsCheck;
using Newtonsoft.Json.Linq;
using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Panels;

/// <summary>
/// Property-based test of the layout check and the mesher together (CsCheck): a random wall panel, written as model
/// text (openings in bays, floor levels, some snapped to a hair from an opening edge, element size or count, maxAspect,
/// element kind, refinements, a placement from the origin to 1e16 m), is either refused by the reader with diagnostics
/// at the panel's keys, each with a problem and a fix, or meshed on every mesh of its convergence study into elements
/// with a positive Jacobian and side ratios within max(maxAspect, 2), which the element itself accepts. Never an exception.
/// </summary>
public class MeshPropertyTests
{
    private static readonly double[] Hairs = [0, 1e-13, 1e-10, 1e-9, 1e-8, 1e-7, 1e-5, 1e-3];

    /// <summary>The model text of a random panel from 40 numbers in [0, 1) and 8 whole numbers.</summary>
    internal static string PanelModel(double[] u, int[] n)
    {
        int q = 0;
        double U() => 0.02 + 0.96 * u[q++ % u.Length];   // CsCheck favours 0 and 1; keep inside
        double L = 1 + 11 * U(), H = 1 + 11 * U();
        int bays = n[0] % 4;   // 0 to 3 openings, one per bay
        var openings = new JArray();
        var edges = new List<double>();
        for (int b = 0; b < bays; b++)
        {
            double bay = L / bays, left = b * bay + (0.05 + 0.45 * U()) * bay, width = (0.05 + 0.45 * U()) * bay;
            double bottom = U() < 0.3 ? 0 : 0.5 * H * U(), height = (0.05 + 0.4 * U()) * H;
            openings.Add(new JObject { ["id"] = $"o{b}", ["left"] = left, ["bottom"] = bottom, ["width"] = width, ["height"] = height });
            if (bottom > 0) edges.Add(bottom);
            edges.Add(bottom + height);
        }
        var levels = new List<double>();
        for (int k = 0; k < n[1] % 3; k++)
        {
            double l = (0.05 + 0.9 * U()) * H;
            // Now and then a level a hair from an opening's edge (the near-coincident lines that make slivers).
            if (edges.Count > 0 && U() < 0.5) l = edges[n[2 + k] % edges.Count] + Hairs[n[4 + k] % Hairs.Length] * H * (U() < 0.5 ? -1 : 1);
            levels.Add(l);
        }
        levels.Sort();
        double[] places = [0, -50 + 100 * U(), 0, Math.Pow(10, 2 + 14 * U()) * (U() < 0.5 ? -1 : 1)];
        var mesh = new JObject
        {
            ["element"] = n[6] % 2 == 0 ? "quad4" : "quad9",
            ["maxAspect"] = new[] { 1, 1.5, 4, 4, 10, 100, 150 }[n[3] % 7],
            ["refinements"] = 1 + n[6] / 2 % 3,
            ["maxNodes"] = 6000,
        };
        if (n[7] % 3 == 0) mesh["elementSize"] = 0.1 + 0.6 * U(); else mesh["elementsAcrossNarrowest"] = 1 + n[7] / 3 % 2;
        var panel = new JObject
        {
            ["id"] = "W", ["x"] = places[n[5] % 4], ["y"] = places[n[5] / 4 % 4], ["length"] = L, ["height"] = H, ["thickness"] = 0.2,
            ["material"] = "C", ["openings"] = openings, ["floorLevels"] = new JArray(levels), ["mesh"] = mesh,
            ["storyForces"] = new JArray(new JObject { ["case"] = "wind", ["level"] = "top", ["fx"] = 100 }),
        };
        var model = new JObject
        {
            ["formatVersion"] = 1, ["units"] = new JObject { ["force"] = "kN", ["length"] = "m" },
            ["materials"] = new JArray(new JObject { ["id"] = "C", ["E"] = 25e6, ["nu"] = 0.2 }), ["sections"] = new JArray(),
            ["loadCases"] = new JArray(new JObject { ["id"] = "wind" }), ["panels"] = new JArray(panel),
        };
        return model.ToString();
    }

    private static readonly Gen<(double[], int[])> Layouts = Gen.Select(Gen.Double[0, 1].Array[40], Gen.Int[0, 1 << 20].Array[8]);

    /// <summary>Meshes every mesh of the study and checks each element; returns the number of elements checked.</summary>
    internal static int CheckMeshes(WallPanel panel)
    {
        int count = 0;
        var material = new PlaneStressMaterial(panel.E, panel.Nu, panel.Thickness);
        for (int k = 0; k < panel.Mesh.Refinements; k++)
        {
            var pm = PanelMesher.Mesh(panel, k);
            var m = pm.Mesh;
            // Derived bound: sides are at most the size s ≤ maxAspect × the shortest grid interval, and at least that
            // interval or, where an interval is split, more than s/2 — so no side ratio exceeds max(maxAspect, 2).
            double bound = Math.Max(panel.Mesh.MaxAspect, 2) * (1 + 1e-6);
            Assert.True(pm.LargestAspect <= bound, $"mesh {k}: reported aspect {pm.LargestAspect} above max(maxAspect, 2) = {bound}");
            for (int e = 0; e < m.Elements.Length; e++)
            {
                var (x, y) = m.ElementCoordinates(e);
                // Derived: the Jacobian determinant of the bilinear map of corners 0..3 is linear in ξ and in η (the ξη
                // terms cancel), so it is positive everywhere when positive at the four corners, where it is a quarter
                // of the cross product of the two edges leaving the corner. Each corner must also stay a right angle to
                // 1e-6 (the mesh is made of rectangles; round-off in the placed coordinates may not bend it).
                double shortest = double.PositiveInfinity, longest = 0;
                for (int c = 0; c < 4; c++)
                {
                    int a = (c + 1) % 4, b = (c + 3) % 4;
                    double ax = x[a] - x[c], ay = y[a] - y[c], bx = x[b] - x[c], by = y[b] - y[c];
                    double la = Math.Sqrt(ax * ax + ay * ay), lb = Math.Sqrt(bx * bx + by * by);
                    Assert.True(ax * by - ay * bx >= (1 - 1e-6) * la * lb, $"mesh {k}, element {e}, corner {c}: det J not positive or corner not square (cross {ax * by - ay * bx}, sides {la}, {lb})");
                    shortest = Math.Min(shortest, la); longest = Math.Max(longest, la);
                }
                Assert.True(longest <= bound * shortest, $"mesh {k}, element {e}: side ratio {longest / shortest} above max(maxAspect, 2) = {bound}");
                m.Element.Stiffness(x, y, material);   // the element's own check (throws on a non-positive Jacobian)
                count++;
            }
        }
        return count;
    }

    [Fact]
    public void RandomLayoutsMeshIntoSoundElementsOrAreRefusedWithADiagnostic()
    {
        int meshed = 0, refused = 0;
        var why = new System.Collections.Concurrent.ConcurrentBag<string>();
        Layouts.Sample(t =>
        {
            string text = PanelModel(t.Item1, t.Item2);
            StructureModel model;
            try { model = ModelReader.Parse(text, "panel.json"); }
            catch (ModelInputException e)
            {
                Assert.NotEmpty(e.Diagnostics);
                foreach (var d in e.Diagnostics)
                {
                    Assert.StartsWith("$.panels[0]", d.JsonPath);
                    Assert.False(string.IsNullOrWhiteSpace(d.Problem) || string.IsNullOrWhiteSpace(d.Fix), $"a diagnostic without a problem or fix: {d}");
                    Assert.True(d.Line > 0, $"no line: {d}");
                }
                Interlocked.Increment(ref refused);
                why.Add(e.Diagnostics[0].Problem[..Math.Min(60, e.Diagnostics[0].Problem.Length)]);
                return;
            }
            CheckMeshes(Assert.Single(model.Panels));
            Interlocked.Increment(ref meshed);
        }, iter: 300);
        // The generator must exercise both ways out, or the property says little (common practice).
        Assert.True(meshed >= 30 && refused >= 30, $"{meshed} meshed, {refused} refused; first problems:\n" + string.Join("\n", why.GroupBy(w => w[..30]).Select(g => g.Count() + " " + g.First())));
    }

    [Theory]
    [InlineData(1e15, 0.0)]   // the fuzzer's finding: nodes where doubles are 0.125 m apart
    [InlineData(0.0, -1e12)]
    public void APanelFarFromTheOriginIsRefusedAtItsPlacement(double x, double y)
    {
        // The shipped two-story wall (the fuzzer's seed): 6 m × 6.4 m, three nested quad4 meshes.
        string root = Path.GetFullPath(Path.Combine(Input.BadCorpusTests.CorpusFolder, "..", "..", ".."));
        var d = JObject.Parse(File.ReadAllText(Path.Combine(root, "models", "panels", "two-story-wall.json")));
        d["panels"]![0]!["x"] = x;
        d["panels"]![0]!["y"] = y;
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(d.ToString(), "panel.json"));
        var diag = Assert.Single(e.Diagnostics);
        Assert.Equal(x != 0 ? "$.panels[0].x" : "$.panels[0].y", diag.JsonPath);
        Assert.Contains("so far from the origin", diag.Problem);
        // The same panel at the origin meshes soundly (the refusal is about the placement alone).
        d["panels"]![0]!["x"] = 0;
        d["panels"]![0]!["y"] = 0;
        Assert.True(CheckMeshes(Assert.Single(ModelReader.Parse(d.ToString(), "panel.json").Panels)) > 0);
    }
}
