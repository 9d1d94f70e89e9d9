using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// End-to-end frame analysis: reading the JSON model, then assembly + factorisation + solve + recovery of a regular
/// moment frame of <see cref="Bays"/> bays and <see cref="Stories"/> stories (fixed bases, lateral and gravity load
/// cases, one stiffness point). Invented geometry, kip–inch.
/// </summary>
[MemoryDiagnoser]
public class FrameAnalysisBenchmarks
{
    [Params(5, 20)]
    public int Bays { get; set; }

    [Params(10, 60)]
    public int Stories { get; set; }

    private string _json = "";
    private StructureModel _model = null!;

    [GlobalSetup]
    public void Setup()
    {
        _json = FrameJson(Bays, Stories);
        _model = ModelReader.Parse(_json, "frame.json");
    }

    [Benchmark]
    public StructureModel Read() => ModelReader.Parse(_json, "frame.json");

    [Benchmark]
    public AnalysisResult AssembleAndSolve() => LinearStaticAnalysis.Run(_model);

    [Benchmark]
    public AnalysisResult AssembleAndSolveDense() => LinearStaticAnalysis.Run(_model, new AnalysisOptions { Solver = new DenseLdlSolver() });

    /// <summary>A regular frame model as JSON text.</summary>
    public static string FrameJson(int bays, int stories)
    {
        var inv = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        sb.Append("{\"formatVersion\":1,\"materials\":[{\"id\":\"s\",\"E\":29000,\"nu\":0.3}],");
        sb.Append("\"sections\":[{\"id\":\"c\",\"shape\":\"I\",\"d\":14,\"bf\":14.5,\"tf\":0.71,\"tw\":0.44},{\"id\":\"b\",\"shape\":\"I\",\"d\":20.7,\"bf\":6.5,\"tf\":0.45,\"tw\":0.35}],");
        sb.Append("\"nodes\":[");
        for (int l = 0; l <= stories; l++)
            for (int c = 0; c <= bays; c++)
                sb.Append(inv, $"{(l + c > 0 ? "," : "")}{{\"id\":\"N{c}-{l}\",\"x\":{300 * c},\"y\":{156 * l}}}");
        sb.Append("],\"members\":[");
        bool first = true;
        for (int l = 1; l <= stories; l++)
        {
            for (int c = 0; c <= bays; c++)
            {
                sb.Append($"{(first ? "" : ",")}{{\"id\":\"C{c}-{l}\",\"start\":\"N{c}-{l - 1}\",\"end\":\"N{c}-{l}\",\"section\":\"c\",\"material\":\"s\"}}");
                first = false;
            }
            for (int c = 0; c < bays; c++)
                sb.Append($",{{\"id\":\"B{c}-{l}\",\"start\":\"N{c}-{l}\",\"end\":\"N{c + 1}-{l}\",\"section\":\"b\",\"material\":\"s\"}}");
        }
        sb.Append("],\"supports\":[");
        for (int c = 0; c <= bays; c++) sb.Append($"{(c > 0 ? "," : "")}{{\"node\":\"N{c}-0\",\"type\":\"fixed\"}}");
        sb.Append("],\"loadCases\":[{\"id\":\"lateral\",\"nodalLoads\":[");
        for (int l = 1; l <= stories; l++) sb.Append(inv, $"{(l > 1 ? "," : "")}{{\"node\":\"N0-{l}\",\"fx\":{2.0 * l / stories}}}");
        sb.Append("]},{\"id\":\"gravity\",\"memberLoads\":[");
        for (int l = 1; l <= stories; l++)
            for (int c = 0; c < bays; c++)
                sb.Append($"{(l + c > 1 ? "," : "")}{{\"member\":\"B{c}-{l}\",\"direction\":\"y\",\"w\":-0.1}}");
        sb.Append($"]}}],\"stiffnessAt\":[{{\"node\":\"N0-{stories}\",\"direction\":\"x\"}}]}}");
        return sb.ToString();
    }
}
