using System.Globalization;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// "frame-json BAYS STORIES FILE": writes <see cref="FrameAnalysisBenchmarks.FrameJson"/> to FILE, so that the whole
/// `solve` process can be timed on the benchmark's frame (benchmarks/ratios/run.sh: 20 bays × 60 stories).
/// </summary>
public static class FrameJsonCommand
{
    public static void Run(string[] args)
    {
        int bays = int.Parse(args[1], CultureInfo.InvariantCulture);
        int stories = int.Parse(args[2], CultureInfo.InvariantCulture);
        File.WriteAllText(args[3], FrameAnalysisBenchmarks.FrameJson(bays, stories));
        Console.WriteLine($"wrote {args[3]}: a frame of {bays} bays and {stories} stories");
    }
}
