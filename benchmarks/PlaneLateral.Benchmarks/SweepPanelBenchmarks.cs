using BenchmarkDotNet.Attributes;
using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// One point of the aspect-ratio sweep's plane-stress panel: the convergence study the sweep runs per wall and end
/// condition (9-node, 2 elements across the shorter side, three nested meshes; docs/reports.md). An invented concrete
/// wall, l = 20 ft = 6.096 m, t = 8 in, E = 24.9 GPa, ν = 0.2.
/// </summary>
[MemoryDiagnoser]
public class SweepPanelBenchmarks
{
    [Params(0.25, 1.0, 4.0)]
    public double AspectRatio { get; set; }

    [Params(PanelTop.Free, PanelTop.Guided)]
    public PanelTop Top { get; set; }

    private WallPanel _panel = null!;

    [GlobalSetup]
    public void Setup()
    {
        const double l = 6.096;
        _panel = new WallPanel
        {
            Id = "sweep", X0 = 0, Y0 = 0, Length = l, Height = AspectRatio * l, Thickness = 0.2032, MaterialId = "c",
            E = 24.9e9, Nu = 0.2, FloorTies = true, Top = Top,
            Mesh = new PanelMeshSettings(PanelElementKind.Quad9, 0, 2, MaxAspect: 4, MaxNodes: 40000, Refinements: 3),
        };
    }

    [Benchmark]
    public double ConvergedStiffness() => PanelAnalysis.Run(_panel, []).Convergence!.Extrapolated;
}
