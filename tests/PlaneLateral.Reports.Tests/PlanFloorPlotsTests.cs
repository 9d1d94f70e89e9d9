using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The figures of floors that bend (PlanFloorPlots) on the shipped warehouse with a semi-rigid roof.</summary>
public class PlanFloorPlotsTests
{
    private static string WarehousePath => Path.Combine(AppContext.BaseDirectory, "models", "plan", "long-warehouse.json");

    private static readonly Lazy<PlanResult> Warehouse = new(() => PlanAnalysis.Run(ModelReader.ReadPlanFile(WarehousePath)));

    private static Task<T> Guarded<T>(Func<T> f) => Task.Run(f).WaitAsync(TimeSpan.FromSeconds(300));

    [Fact]
    public async Task TheDrawnDeflectionIsTheAnalysisDisplacementAndTheFloorMovesWithItsLines()
    {
        var r = await Guarded(() => Warehouse.Value);
        var shapes = r.Diaphragms!.Shapes;
        Assert.Equal(["x", "y"], shapes.Select(s => s.Direction).ToArray());   // the roof bends under each direction's case
        foreach (var shape in shapes)
        {
            double k = PlanFloorPlots.Scale(r, shape);
            var (x, y) = PlanFloorPlots.DrawnOutline(r, shape, k);
            Assert.Equal(shape.Outline.Count + 1, x.Length);
            const double ft = 0.3048;   // m per foot (exact, by definition); the warehouse is in kip and ft
            for (int i = 0; i < shape.Outline.Count; i++)
            {
                var p = shape.Outline[i];
                Assert.Equal((p.At.X + k * p.Ux) / ft, x[i], 9);
                Assert.Equal((p.At.Y + k * p.Uy) / ft, y[i], 9);
            }
            // Derived (attachment at plan position): the floor at a line's point moves along the line as the line's top
            // does; for one story that is the line's story drift from the analysis (a different road: K̂·T·u).
            var c = r.Case(shape.Case);
            for (int i = 0; i < r.Plan.Lines.Count; i++)
            {
                var line = r.Plan.Lines[i];
                var at = shape.Lines[i];
                double along = line.Cos * at.Ux + line.Sin * at.Uy;
                double drift = c.LineStories.First(s => s.Story == 1 && s.Line == line.Id).Drift;
                Assert.True(Math.Abs(along - drift) <= 1e-9 * Math.Abs(shape.Outline.Max(p => Math.Max(Math.Abs(p.Ux), Math.Abs(p.Uy)))), $"{shape.Case} {line.Id}: {along} vs {drift}");
            }
            // Derived: the roof spans between walls, so under NS loads its middle between W1 and W2 moves more than
            // the walls along Y that hold it (the floor bends, MDD > 0) — the drawn shape is not a rigid motion.
            if (shape.Direction == "y")
                Assert.True(shape.Outline.Max(p => p.Uy) > shape.Lines.Where((_, i) => r.Plan.Lines[i].Sin != 0).Max(p => p.Uy));
        }
    }

    [Fact]
    public async Task TheFiguresAreValidPngsAndByteIdenticalTwice()
    {
        var r = await Guarded(() => Warehouse.Value);
        var hand = PlanTributarySplit.Run(r);
        var a = await Guarded(() => PlanFloorPlots.All(r, hand));
        var b = await Guarded(() => PlanFloorPlots.All(r, hand));
        Assert.Equal(["plan-floor-roof-EW.png", "plan-floor-roof-NS.png", "plan-floor-shares-story1-NS.png", "plan-floor-shares-story1-EW.png"], a.Select(f => f.FileName).ToArray());
        for (int i = 0; i < a.Count; i++)
        {
            ValidPng(a[i].Png, PlotStyle.Width, PlotStyle.Height, a[i].FileName);
            Assert.Equal(a[i].Png, b[i].Png);
        }
        // The bars are the envelope's shears over the story shear (derived: the shares of each idealisation add up to 1).
        var shares = PlanFloorPlots.ShareValues(r, "NS", 1, hand);
        for (int j = 0; j < PlanFloorPlots.Series.Count; j++)
            Assert.Equal(1.0, shares.Sum(s => s.Shares[j]), 9);
    }
}
