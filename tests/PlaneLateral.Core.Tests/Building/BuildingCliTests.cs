using PlaneLateral.Analysis;
using PlaneLateral.Cli;
using static PlaneLateral.Tests.CliRun;
using PlaneLateral.Model;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>The shipped demo with levels: the building tables are printed and written (end to end, common practice).</summary>
public sealed class BuildingCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-building-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void DemoPrintsAndWritesTheBuildingTables()
    {
        string outDir = Path.Combine(_dir, "r");
        var (code, stdout, stderr) = Run("solve", CliApp.DemoModelPath, "--out", outDir);
        Assert.True(code == 0, stderr);
        foreach (var heading in new[] { "Levels", "Stories", "Story shear by line of resistance", "Stiffness (soft story) irregularity", "Drift check", "Stiffness modifiers by member", "governing code decides", "Caution" })
            Assert.Contains(heading, stdout);
        foreach (var f in new[] { "stories.csv", "story-lines.csv", "soft-story.csv", "drift-checks.csv", "member-stiffness.csv", "stories.json" })
            Assert.True(new FileInfo(Path.Combine(outDir, f)).Length > 0, f);
        Assert.Contains("caution", File.ReadAllText(Path.Combine(outDir, "stories.json")));
    }

    [Fact]
    public void DemoStoryShearsAreTheLoadsAbove()
    {
        // The demo's earthquake case puts 11, 22 and 31 kip at levels 1, 2, 3: story shears 64, 53, 31 kip (statics, derived).
        var r = LinearStaticAnalysis.Run(ModelReader.ReadFile(CliApp.DemoModelPath));
        AssertChecks(r);
        var e = StoryAnalysis.ForCase(r, r.Case("E"));
        double[] expected = [64, 53, 31];
        for (int i = 0; i < 3; i++)
        {
            var s = e.Stories[i];
            Near(expected[i], r.Model.Units.FromSI(s.Shear, Quantity.Force), 1e-9, $"story {i + 1}");
            Near(s.Shear, s.Lines.Sum(l => l.Shear), 1e-12, "lines add up");
            Assert.Equal(2, s.Lines.Count);   // grid 1 (wall) and grid 3 (frame); the links are horizontal and cross no story
        }
        // The diaphragm ties each floor: the wall and all three frame columns move together at every level.
        foreach (var l in r.Model.Building.Levels.Where(l => l.Rigid))
            Assert.All(l.Nodes, n => Assert.Equal(r.Case("E").Displacement(l.Nodes[0], Dof.X), r.Case("E").Displacement(n, Dof.X)));
    }

    [Fact]
    public void BadBuildingInputWritesNothing()
    {
        var json = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(CliApp.DemoModelPath));
        json["levels"]![0]!["diaphragm"] = "rigid";
        json["driftChecks"]![0]!["Cd"] = 12.0;
        string model = Path.Combine(_dir, "bad.json");
        File.WriteAllText(model, json.ToString());
        string outDir = Path.Combine(_dir, "out");
        var (code, _, stderr) = Run("solve", model, "--out", outDir);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("which a support holds in x", stderr);
        Assert.Contains("C_d = 12 is out of range", stderr);
        Assert.Contains("Nothing was written", stderr);
        Assert.False(Directory.Exists(outDir));
    }
}
