using PlaneLateral.Cli;

namespace PlaneLateral.Studies.Tests;

/// <summary>The coupled-wall demo and the coupling-sweep command end to end (common practice: exit codes, byte-identical reruns).</summary>
[Collection("current directory")]
public class CouplingSweepCliTests
{
    private static string DemoPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-coupled-wall.json");

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter(); var e = new StringWriter();
        int code = CliApp.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    private static string TempDir() => Path.Combine(Path.GetTempPath(), "pl-sweep-" + Guid.NewGuid().ToString("N"));

    [Fact]
    public void Sweep_on_the_demo_writes_one_line_per_load_and_depth_and_reruns_identically()
    {
        string dir = TempDir();
        var (code, output, err) = Run("coupling-sweep", DemoPath, "--depths", "0.3,0.75,1.5", "--out", dir);
        Assert.True(code == 0, err);
        Assert.Contains("licensed engineer", output);
        string first = File.ReadAllText(Path.Combine(dir, "coupling-sweep.csv"));
        var lines = first.TrimEnd('\n').Split('\n');
        Assert.Equal(1 + 1 + 2 * 3, lines.Length);   // caution comment, header, two loads × three depths
        Assert.StartsWith("# ", lines[0]);
        Assert.Contains("licensed engineer", lines[0]);
        Assert.StartsWith("check,load,beam depth [m]", lines[1]);
        // The plane-stress panel's two columns come last and are filled for every depth (docs/coupled-walls.md §7).
        Assert.EndsWith("top deflection plane-stress panel [m],coupling plane-stress panel", lines[1]);
        Assert.All(lines[2..], l => Assert.False(l.EndsWith(',') || l.Split(',')[^2].Length == 0, l));
        var pngs = new[] { "coupling-sweep-uniform.png", "coupling-sweep-top.png" }.Select(n => File.ReadAllBytes(Path.Combine(dir, n))).ToArray();
        Assert.All(pngs, b => Assert.Equal(new byte[] { 0x89, (byte)'P', (byte)'N', (byte)'G' }, b[..4]));
        Assert.Equal(0, Run("coupling-sweep", DemoPath, "--depths", "0.3,0.75,1.5", "--out", dir).Code);
        Assert.Equal(first, File.ReadAllText(Path.Combine(dir, "coupling-sweep.csv")));
        Assert.Equal(pngs[0], File.ReadAllBytes(Path.Combine(dir, "coupling-sweep-uniform.png")));
        Directory.Delete(dir, true);
    }

    [Fact]
    public void Bad_depths_and_unknown_checks_write_nothing()
    {
        string dir = TempDir();
        var (code, _, err) = Run("coupling-sweep", DemoPath, "--depths", "0.3,3.5", "--out", dir);
        Assert.Equal(1, code);
        Assert.Contains("'3.5' is not a depth", err);
        (code, _, err) = Run("coupling-sweep", DemoPath, "--check", "NOPE", "--out", dir);
        Assert.Equal(2, code);
        Assert.Contains("CORE-B", err);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void The_demo_solves_and_compares()
    {
        string dir = TempDir();
        var (code, output, err) = Run("compare", DemoPath, "--out", dir);
        Assert.True(code == 0, err);
        Assert.Contains("stiffness, continuous medium", output);
        Assert.Contains("plane-stress panel", output);   // the panel's estimate in every row (docs/coupled-walls.md §7)
        Assert.Contains("\"plane-stress panel\"", File.ReadAllText(Path.Combine(dir, "comparisons.json")));
        Assert.Equal(0, Run("solve", DemoPath, "--out", dir).Code);
        Directory.Delete(dir, true);
    }
}
