using BenchmarkDotNet.Attributes;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// Envelope against supernodal where the default solver's size rule is drawn: end-to-end frame analyses
/// (<see cref="FrameAnalysisBenchmarks.FrameJson"/>, assembly + factorisation + solves) and the factorisation of small
/// plane-stress walls (<see cref="PlaneStressGrid"/>, ordering included).
/// </summary>
[MemoryDiagnoser]
public class SolverChoiceBenchmarks
{
    /// <summary>"frame BAYSxSTORIES" (3 DOFs per node) or "wall SIDE" (square plane-stress grid).</summary>
    [Params("frame 5x10", "frame 20x60", "frame 40x100", "wall 30", "wall 50", "wall 71")]
    public string Case { get; set; } = "wall 30";

    [Params("envelope", "supernodal")]
    public string Solver { get; set; } = "envelope";

    private StructureModel? _model;
    private SymmetricSparseMatrix? _matrix;
    private ISparseSpdSolver _solver = null!;

    [GlobalSetup]
    public void Setup()
    {
        _solver = Solver == "envelope" ? new EnvelopeCholeskySolver() : new SupernodalCholeskySolver();
        var parts = Case.Split(' ');
        if (parts[0] == "frame")
        {
            var d = parts[1].Split('x').Select(int.Parse).ToArray();
            _model = ModelReader.Parse(FrameAnalysisBenchmarks.FrameJson(d[0], d[1]), "frame.json");
        }
        else
        {
            int side = int.Parse(parts[1]);
            _matrix = PlaneStressGrid.Build(side, side);
        }
    }

    [Benchmark]
    public object Run()
    {
        if (_model is not null) return LinearStaticAnalysis.Run(_model, new AnalysisOptions { Solver = _solver });
        using var f = _solver.Factorize(_matrix!); // a large factor's native memory goes back at once
        return f.FactorNonZeros;
    }
}
