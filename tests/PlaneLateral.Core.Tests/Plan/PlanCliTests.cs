using PlaneLateral.Tests.Input;
using static PlaneLateral.Tests.CliRun;

namespace PlaneLateral.Tests.Plan;

/// <summary>A building file through the command line (common practice: tables fit 100 columns, files written, input untouched).</summary>
public sealed class PlanCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-plancli-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void TheDemoBuildingSolvesWithTablesOfAtMost100Columns()
    {
        string model = RepositoryFiles.ModelPath("demo-building.json");
        var (code, stdout, stderr) = Run("solve", model, "--out", _dir);
        Assert.True(code == 0, stderr);
        foreach (var line in stdout.Split('\n').Where(l => !l.StartsWith("File ") && !l.StartsWith("Results written")))
            Assert.True(line.Length <= 100, $"{line.Length} columns: {line}");
        Assert.Contains("Torsional irregularity", stdout);
        Assert.Contains("hand design", stdout);
        Assert.True(new FileInfo(Path.Combine(_dir, "plan-line-stories.csv")).Length > 0);
        Assert.True(File.Exists(Path.Combine(_dir, "line-F-east-member-forces.csv")));
    }

    [Fact]
    public void ValidateAcceptsABuildingFile()
    {
        var (code, stdout, _) = Run("validate", RepositoryFiles.ModelPath("plan/taly-example-7-12.json"));
        Assert.Equal(0, code);
        Assert.Contains("valid building in plan", stdout);
    }
}
