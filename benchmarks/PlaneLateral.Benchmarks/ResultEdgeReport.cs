using System.Diagnostics;
using System.Globalization;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The result-size edge (docs/hardening.md, "Size limits"): a model at the count limits' edge — a plane frame of 100
/// column lines and 100 levels (10 000 nodes; 9 900 columns, 9 900 beams and 200 braces: 20 000 members, the member
/// limit), fixed at its base, under 200 load cases (the case limit), each a lateral force at one roof node: 6 000 000
/// result entries. Writes the model to DIR/result-edge.json (invented data), then reads, analyses and writes every
/// results file into DIR/out as the solve command does (streamed, through AtomicFiles), and prints each phase's wall
/// time, the process's peak working set and the size of each file. Run it alone, in Release, e.g.
/// <c>nice dotnet run -c Release --project benchmarks/PlaneLateral.Benchmarks -- result-edge /tmp/edge</c>; the CLI
/// on the same model (<c>/usr/bin/time -f "%e s %M KiB" planelateral solve DIR/result-edge.json --out DIR/cli</c>)
/// gives the figures the docs quote. A fewer-cases argument (<c>result-edge DIR 67</c>) runs a smaller model.
/// </summary>
public static class ResultEdgeReport
{
    public const int Columns = 100, Levels = 100, Members = 20_000, Cases = 200;

    /// <summary>The edge model as JSON text: <paramref name="cases"/> load cases on the 100 × 100 frame.</summary>
    public static string Model(int cases)
    {
        var nodes = new JArray();
        for (int j = 0; j < Levels; j++)
            for (int i = 0; i < Columns; i++)
                nodes.Add(new JObject { ["id"] = $"N{j}_{i}", ["x"] = 6.0 * i, ["y"] = 3.0 * j });
        var members = new JArray();
        JObject Member(string id, string a, string b, string section) =>
            new() { ["id"] = id, ["start"] = a, ["end"] = b, ["section"] = section, ["material"] = "S" };
        for (int j = 0; j < Levels; j++)
        {
            if (j > 0)
                for (int i = 0; i < Columns; i++) members.Add(Member($"C{j}_{i}", $"N{j - 1}_{i}", $"N{j}_{i}", "COL"));
            for (int i = 0; i < Columns - 1; i++) members.Add(Member($"B{j}_{i}", $"N{j}_{i}", $"N{j}_{i + 1}", "BM"));
        }
        for (int k = 0; members.Count < Members; k++)
        {
            int j = 1 + k % (Levels - 1), i = k / (Levels - 1);
            members.Add(Member($"X{j}_{i}", $"N{j - 1}_{i}", $"N{j}_{i + 1}", "COL"));
        }
        var model = new JObject
        {
            ["formatVersion"] = 1,
            ["title"] = $"result-size edge: {Columns} x {Levels} frame, {cases} cases",
            ["units"] = new JObject { ["force"] = "kN", ["length"] = "m" },
            ["materials"] = new JArray(new JObject { ["id"] = "S", ["E"] = 200e6, ["nu"] = 0.3 }),
            ["sections"] = new JArray(
                new JObject { ["id"] = "COL", ["shape"] = "rectangle", ["b"] = 0.5, ["d"] = 0.5 },
                new JObject { ["id"] = "BM", ["shape"] = "rectangle", ["b"] = 0.3, ["d"] = 0.6 }),
            ["nodes"] = nodes,
            ["members"] = members,
            ["supports"] = new JArray(Enumerable.Range(0, Columns).Select(i => new JObject { ["node"] = $"N0_{i}", ["type"] = "fixed" })),
            ["loadCases"] = new JArray(Enumerable.Range(0, cases).Select(k => new JObject
            {
                ["id"] = $"W{k}",
                ["nodalLoads"] = new JArray(new JObject { ["node"] = $"N{Levels - 1}_{k % Columns}", ["fx"] = 10.0 + k }),
            })),
        };
        return model.ToString(Newtonsoft.Json.Formatting.None);
    }

    public static void Run(string[] args)
    {
        string dir = args[1];
        int cases = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : Cases;
        Directory.CreateDirectory(dir);
        string path = Path.Combine(dir, "result-edge.json");
        File.WriteAllText(path, Model(cases));
        Console.WriteLine($"model {path}: {new FileInfo(path).Length} bytes, {Columns * Levels} nodes, {Members} members, {cases} cases: {(long)(Columns * Levels + Members) * cases} result entries");

        var sw = Stopwatch.StartNew();
        var model = ModelReader.ReadFile(path);
        Console.WriteLine($"read      {sw.Elapsed.TotalSeconds,8:F1} s");
        sw.Restart();
        var run = ModelRun.Run(model);
        Console.WriteLine($"analysis  {sw.Elapsed.TotalSeconds,8:F1} s  (peak working set so far {Peak()})");
        sw.Restart();
        var written = AtomicFiles.WriteAll(Path.Combine(dir, "out"), ResultFiles.Files(run));
        Console.WriteLine($"write     {sw.Elapsed.TotalSeconds,8:F1} s  (peak working set {Peak()})");
        foreach (var f in written) Console.WriteLine($"  {Path.GetFileName(f),-22} {new FileInfo(f).Length,14:N0} bytes");
    }

    private static string Peak()
    {
        using var p = Process.GetCurrentProcess();
        return $"{p.PeakWorkingSet64 / (1024.0 * 1024 * 1024):F2} GiB";
    }
}
