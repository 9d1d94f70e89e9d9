using PlaneLateral.Cli;
using static PlaneLateral.Tests.CliRun;

namespace PlaneLateral.Tests.Cli;

[CollectionDefinition("current directory", DisableParallelization = true)]
public class CurrentDirectoryCollection;

/// <summary>End-to-end runs of the command line, as an engineer would type them (common practice).</summary>
[Collection("current directory")]
public sealed class CliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-cli-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string Write(string name, string text)
    {
        string p = Path.Combine(_dir, name);
        File.WriteAllText(p, text);
        return p;
    }

    [Fact]
    public void NoArgumentsSolvesTheShippedDemo()
    {
        string before = Directory.GetCurrentDirectory();
        Directory.SetCurrentDirectory(_dir);
        try
        {
            var (code, stdout, stderr) = Run();
            Assert.True(code == 0, stderr);
            Assert.Contains("shipped demo building in plan", stdout);
            Assert.Contains("Story shear per line", stdout);
            Assert.Contains("Torsional irregularity", stdout);
            Assert.Contains("Corner drifts", stdout);
            Assert.Contains("Caution", stdout);
            foreach (var f in new[] { "plan.json", "plan-floors.csv", "plan-corners.csv", "plan-line-stories.csv", "plan-torsional-irregularity.csv", "plan-checks.csv" })
                Assert.True(new FileInfo(Path.Combine(_dir, "planelateral-results", "demo-building", f)).Length > 0, f);
        }
        finally
        {
            Directory.SetCurrentDirectory(before);
        }
    }

    [Fact]
    public void SolveWritesByteIdenticalResultsTwiceAndLeavesTheInputAlone()
    {
        string model = Write("m.json", File.ReadAllText(CliApp.DemoModelPath));
        byte[] input = File.ReadAllBytes(model);
        string out1 = Path.Combine(_dir, "r1"), out2 = Path.Combine(_dir, "r2");
        Assert.Equal(0, Run("solve", model, "--out", out1).Code);
        Assert.Equal(0, Run("solve", model, "--out", out2).Code);
        foreach (var f in Directory.GetFiles(out1))
            Assert.Equal(File.ReadAllBytes(f), File.ReadAllBytes(Path.Combine(out2, Path.GetFileName(f))));
        Assert.Equal(input, File.ReadAllBytes(model));
        Assert.Empty(Directory.GetFiles(out1, ".*"));
    }

    [Fact]
    public void BadModelExitsNonZeroAndWritesNothing()
    {
        string model = Write("bad.json", "{ \"formatVersion\": 1, \"nodes\": [ ");
        string outDir = Path.Combine(_dir, "out");
        var (code, _, stderr) = Run("solve", model, "--out", outDir);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("bad.json:", stderr);
        Assert.Contains("Nothing was written", stderr);
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void UnstableModelExitsWithItsOwnCodeAndNamesTheNodes()
    {
        string model = Write("mech.json", """
        {
          "formatVersion": 1,
          "materials": [{"id": "s", "E": 29000, "nu": 0.3}],
          "sections": [{"id": "g", "shape": "general", "A": 10, "I": 100}],
          "nodes": [{"id": "A", "x": 0, "y": 0}, {"id": "TOP", "x": 0, "y": 120}],
          "members": [{"id": "C", "start": "A", "end": "TOP", "section": "g", "material": "s"}],
          "supports": [{"node": "A", "type": "pinned"}],
          "loadCases": [{"id": "L", "nodalLoads": [{"node": "TOP", "fx": 1}]}]
        }
        """);
        string outDir = Path.Combine(_dir, "out");
        var (code, _, stderr) = Run("solve", model, "--out", outDir);
        Assert.Equal(ExitCodes.Unstable, code);
        Assert.Contains("unstable", stderr);
        Assert.Contains("TOP ux", stderr);
        Assert.DoesNotContain("NaN", stderr);
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void UnwritableOutputFolderIsReported()
    {
        string blocker = Write("a-file", "x");
        var (code, _, stderr) = Run("solve", CliApp.DemoModelPath, "--out", Path.Combine(blocker, "sub"));
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("--out", stderr);
    }

    [Fact]
    public void ValidateReportsWithoutSolving()
    {
        var (code, stdout, _) = Run("validate", CliApp.DemoModelPath);
        Assert.Equal(0, code);
        Assert.Contains("valid", stdout);
    }

    [Fact]
    public void HelpListsTheCommands()
    {
        var (code, stdout, _) = Run("--help");
        Assert.Equal(0, code);
        Assert.Contains("solve", stdout);
        Assert.Contains("validate", stdout);
    }
}
