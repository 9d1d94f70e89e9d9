using System.Text.Json;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The plan figures of a building (PlanPlots) on the shipped demo building, and their writing by `solve`.</summary>
public class PlanPlotsTests
{
    private static string BuildingPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-building.json");

    private const double Foot = 0.3048;   // m per international foot (exact, by definition)

    private static readonly Lazy<PlanResult> Demo = new(() => PlanSeismic.Run(ModelReader.ReadPlanFile(BuildingPath)).Result);

    private static Task<T> Guarded<T>(Func<T> f) => Task.Run(f).WaitAsync(TimeSpan.FromSeconds(300));

    [Fact]
    public async Task DemoBuilding_OneValidFigurePerStory_UnderTheGoverningDriftCase()
    {
        var r = await Guarded(() => Demo.Value);
        var figures = PlanPlots.Governing(r);
        var g = PlanPlots.GoverningDriftCase(r)!.Value;
        Assert.Equal(r.Plan.FloorCount, figures.Count);
        for (int s = 1; s <= r.Plan.FloorCount; s++)
        {
            var f = figures[s - 1];
            Assert.StartsWith($"plan-story{s}-", f.FileName);
            Assert.EndsWith(".png", f.FileName);
            Assert.Contains(g.Case.Case.Id, f.Caption);
            ValidPng(f.Png, PlotStyle.Width, PlotStyle.Height, f.FileName);
        }
        // The governing case is the one the analysis' own corner drift check (docs/plan.md, driftCheck) finds worst:
        // its ratio C_d·δ/(I_e·h) is the same corner ratio times the constant C_d/I_e (derived), so the two orders agree.
        Assert.NotEmpty(r.DriftChecks);
        var worst = r.DriftChecks.MaxBy(d => d.Ratio)!;
        Assert.Equal(worst.Case, g.Case.Case.Id);
        Assert.Equal(worst.Story, g.Story);
        var lim = r.Plan.DriftLimit!;
        Near(worst.Ratio, g.Ratio * lim.Cd / lim.Ie, 1e-12, "governing corner drift ratio against the drift check's");
    }

    [Fact]
    public async Task DemoBuilding_SegmentsStandWhereTheFileSaysTheLinesStand()
    {
        var r = await Guarded(() => Demo.Value);
        using var doc = JsonDocument.Parse(File.ReadAllText(BuildingPath));
        var lines = doc.RootElement.GetProperty("plan").GetProperty("lines");
        for (int level = 1; level <= r.Plan.FloorCount; level++)
        {
            var segments = PlanPlots.Segments(r.Plan, level);
            Assert.Equal(lines.GetArrayLength(), segments.Count);
            foreach (var l in lines.EnumerateArray())
            {
                string id = l.GetProperty("id").GetString()!;
                var seg = segments.Single(s => s.Line == id);
                double x0 = l.GetProperty("at")[0].GetDouble() * Foot, y0 = l.GetProperty("at")[1].GetDouble() * Foot;
                string dir = l.GetProperty("direction").GetString()!;
                double c = dir == "x" ? 1 : 0, sn = dir == "y" ? 1 : 0;
                if (l.TryGetProperty("wall", out var wall))
                {
                    // A wall is centred on its point (docs/plan.md) and runs its plan length along its direction (derived).
                    double h = wall.GetProperty("length").GetDouble() * Foot / 2;
                    Assert.True(seg.LengthKnown, id);
                    Near(x0 - h * c, seg.Start.X, 1e-12, $"{id} start x");
                    Near(y0 - h * sn, seg.Start.Y, 1e-12, $"{id} start y");
                    Near(x0 + h * c, seg.End.X, 1e-12, $"{id} end x");
                    Near(y0 + h * sn, seg.End.Y, 1e-12, $"{id} end y");
                }
                else
                {
                    // A line with no plan length: a marker 0.12 × the plan size (120 ft) = 14.4 ft long, through its
                    // point along its direction, on the floor (the 120 × 60 ft outline): both demo frames stand on the
                    // outline's edge next to a corner, so their markers run from the point into the floor (derived).
                    Assert.False(seg.LengthKnown, id);
                    double dx = seg.End.X - seg.Start.X, dy = seg.End.Y - seg.Start.Y;
                    Near(14.4 * Foot, Math.Sqrt(dx * dx + dy * dy), 1e-12, $"{id} marker length");
                    Assert.True(Math.Abs(dx * sn - dy * c) < 1e-12, $"{id}: marker not along its direction");
                    Assert.True(Math.Abs((x0 - seg.Start.X) * sn - (y0 - seg.Start.Y) * c) < 1e-12, $"{id}: marker not through its point");
                    foreach (var p in new[] { seg.Start, seg.End })
                        Assert.True(p.X >= -1e-9 && p.X <= 120 * Foot + 1e-9 && p.Y >= -1e-9 && p.Y <= 60 * Foot + 1e-9, $"{id}: marker end ({p.X}, {p.Y}) off the floor");
                    Near(x0, seg.Start.X, 1e-12, $"{id} start x (from its point)");
                    Near(y0, seg.Start.Y, 1e-12, $"{id} start y (from its point)");
                }
            }
        }
    }

    [Fact]
    public void LineWidth_GrowsWithTheShare()
    {
        Assert.Equal(2f, PlanPlots.Width(0));
        Assert.Equal(2f, PlanPlots.Width(double.NaN));
        Assert.Equal(8f, PlanPlots.Width(0.5));
        Assert.Equal(8f, PlanPlots.Width(-0.5));
        Assert.Equal(14f, PlanPlots.Width(1.3));
    }

    [Fact]
    public async Task Solve_WritesThePlanFiguresBesideTheCsvFiles_ByteIdenticalOnTwoRuns()
    {
        string a = TempDir("planfig-a"), b = TempDir("planfig-b");
        try
        {
            var (codeA, outA, errA) = await Guarded(() => Run("solve", BuildingPath, "--out", a, "--detail", "summary"));
            Assert.True(codeA == 0, errA);
            var (codeB, _, errB) = await Guarded(() => Run("solve", BuildingPath, "--out", b, "--detail", "summary"));
            Assert.True(codeB == 0, errB);
            var pngs = Directory.GetFiles(a, "plan-story*.png").Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
            Assert.Equal(3, pngs.Count);   // the demo building has three stories
            Assert.NotEmpty(Directory.GetFiles(a, "plan-*.csv"));
            Assert.Contains("plan-story*.png", outA);
            foreach (var name in pngs)
            {
                var bytesA = File.ReadAllBytes(Path.Combine(a, name!));
                ValidPng(bytesA, PlotStyle.Width, PlotStyle.Height, name!);
                Assert.True(bytesA.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, name!))), $"{name} differs between two runs");
            }
        }
        finally
        {
            foreach (var d in new[] { a, b }) if (Directory.Exists(d)) Directory.Delete(d, true);
        }
    }
}
