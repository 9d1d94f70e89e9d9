using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.Plan.PlanJson;

namespace PlaneLateral.Tests.Plan;

/// <summary>Bad buildings are refused with file, line, JSON path and a fix, or as unstable naming the free floor DOF (docs/plan.md; common practice).</summary>
public sealed class PlanInputTests : IDisposable
{
    private static readonly double[][] Box = [[0, 0], [60, 0], [60, 40], [0, 40]];
    private static readonly object[] LoadY = [new { id = "EY", direction = "y", forces = new[] { 100.0 } }];
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-plan-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static ModelDiagnostic Single(Action read, string problem)
    {
        var e = Assert.Throws<ModelInputException>(read);
        var d = e.Diagnostics.FirstOrDefault(x => x.Problem.Contains(problem, StringComparison.Ordinal));
        Assert.True(d is not null, $"no diagnostic with \"{problem}\" among:\n{e.Message}");
        Assert.False(string.IsNullOrWhiteSpace(d!.Fix));
        return d;
    }

    [Fact]
    public void AllLinesParallelIsUnstableNamingTheFreeTranslation()
    {
        // Two walls along y resist nothing along x: the floor's ux is free.
        var e = Assert.Throws<UnstableModelException>(() => Solve(PlanBuilding([Wall("A", 0, 20, "y", 16), Wall("B", 60, 20, "y", 16)], LoadY, [0, 12], Box)));
        Assert.Contains("floor L1 ux", e.Message);
    }

    [Fact]
    public void AllLinesThroughOnePointIsUnstableNamingTheFreeRotation()
    {
        // A wall along x and one along y, both through (30, 20): nothing resists a twist about that point.
        var e = Assert.Throws<UnstableModelException>(() => Solve(PlanBuilding([Wall("A", 30, 20, "x", 16), Wall("B", 30, 20, "y", 16)], LoadY, [0, 12], Box)));
        Assert.Contains("floor L1 rz", e.Message);
    }

    [Fact]
    public void ALineWhoseLevelsDoNotMatchIsRefused()
    {
        var lines = new object[] { new { id = "A", at = new[] { 0.0, 20 }, direction = "y", model = PlanarWall("A", 0, 16, [0, 10]) }, Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16) };
        var d = Single(() => Read(PlanBuilding(lines, LoadY, [0, 12], Box)), "do not match the building's levels");
        Assert.Equal("$.plan.lines[0]", d.JsonPath);
        Assert.True(d.Line > 0);
    }

    [Fact]
    public void ALineOutsideTheOutlineIsRefused()
    {
        var d = Single(() => Read(PlanBuilding([Wall("A", 0, 20, "y", 16), Springs("B", 80, 20, "y", 5.0), Wall("C", 30, 0, "x", 16)], LoadY, [0, 12], Box)), "outside the plan outline");
        Assert.Equal("$.plan.lines[1].at", d.JsonPath);
        // A wall centred inside whose end pokes out is refused too.
        Single(() => Read(PlanBuilding([Wall("A", 0, 35, "y", 16), Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16)], LoadY, [0, 12], Box)), "stands outside the plan outline");
    }

    [Fact]
    public void ALineFileOutsideTheBuildingFolderIsRefused()
    {
        string sub = Directory.CreateDirectory(Path.Combine(_dir, "b")).FullName;
        File.WriteAllText(Path.Combine(_dir, "line.json"), PlanarWall("A", 0, 16, [0, 12]).ToString());
        foreach (var path in new[] { "../line.json", Path.Combine(_dir, "line.json") })
        {
            var lines = new object[] { new { id = "A", at = new[] { 0.0, 20 }, direction = "y", model = path }, Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16) };
            string file = Path.Combine(sub, "building.json");
            File.WriteAllText(file, Text(PlanBuilding(lines, LoadY, [0, 12], Box)));
            var d = Single(() => ModelReader.ReadPlanFile(file), "outside the building file's folder");
            Assert.Equal("$.plan.lines[0].model", d.JsonPath);
        }
    }

    [Fact]
    public void ALineFileBesideTheBuildingGivesTheInlineResult()
    {
        var wall = PlanarWall("A", 0, 16, [0, 12, 24]);
        File.WriteAllText(Path.Combine(_dir, "wall-a.json"), wall.ToString());
        object[] Lines(object model) => [new { id = "A", at = new[] { 0.0, 20 }, direction = "y", model }, Wall("B", 60, 20, "y", 10), Wall("C", 30, 0, "x", 16), Wall("D", 30, 40, "x", 16)];
        object[] loads = [new { id = "EY", direction = "y", forces = new[] { 40.0, 60 } }];
        string file = Path.Combine(_dir, "building.json");
        File.WriteAllText(file, Text(PlanBuilding(Lines("wall-a.json"), loads, [0, 12, 24], Box)));
        var fromFile = PlanAnalysis.Run(ModelReader.ReadPlanFile(file));
        var inline = Solve(PlanBuilding(Lines(wall), loads, [0, 12, 24], Box));
        Assert.Equal(PlanLineForm.File, fromFile.Plan.Lines[0].Form);
        // The same planar model read two ways gives bit-identical numbers (common practice: input form does not change the result).
        Assert.Equal(inline.Cases.SelectMany(c => c.LineStories.Select(s => s.Shear)), fromFile.Cases.SelectMany(c => c.LineStories.Select(s => s.Shear)));
    }

    [Fact]
    public void AProblemInsideALineFileNamesThatFile()
    {
        var wall = PlanarWall("A", 0, 16, [0, 12]);
        wall["members"]![0]!["section"] = "NOPE";
        File.WriteAllText(Path.Combine(_dir, "wall-a.json"), wall.ToString());
        string file = Path.Combine(_dir, "building.json");
        File.WriteAllText(file, Text(PlanBuilding([new { id = "A", at = new[] { 0.0, 20 }, direction = "y", model = "wall-a.json" }, Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16)], LoadY, [0, 12], Box)));
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ReadPlanFile(file));
        Assert.Contains(e.Diagnostics, d => d.File.EndsWith("wall-a.json", StringComparison.Ordinal) && d.JsonPath == "$.members[0].section");
    }

    [Fact]
    public void ALoadWithTheWrongNumberOfForcesAndAnUnknownMaterialAreRefusedTogether()
    {
        var lines = new object[] { new { id = "A", at = new[] { 0.0, 20 }, direction = "y", wall = new { length = 16, thickness = 1, material = "STEEL" } }, Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16) };
        var e = Assert.Throws<ModelInputException>(() => Read(PlanBuilding(lines, [new { id = "EY", direction = "y", forces = new[] { 1.0, 2 } }], [0, 12], Box)));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.plan.lines[0].wall.material");
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.plan.loads[0].forces");
    }

    [Fact]
    public void ABuildingFileIsReadAsStrictlyAsAPlanarModel()
    {
        // A zero-padded number is octal to a lenient reader (0144 = 100): refused in a building file as in a planar model
        // (RFC 8259 §6 allows no leading zeros; docs/hardening.md "Strict JSON").
        string text = Text(PlanBuilding([Wall("A", 0, 20, "y", 16), Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16)], LoadY, [0, 12], Box));
        string padded = text.Replace("\"length\": 16.0", "\"length\": 016", StringComparison.Ordinal).Replace("\"length\": 16", "\"length\": 016", StringComparison.Ordinal);
        Assert.NotEqual(text, padded);
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ParsePlan(padded, "building.json"));
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("not valid JSON") && d.Line > 0);
        // A trailing comma in a line file is refused there, under the line file's own name.
        File.WriteAllText(Path.Combine(_dir, "wall-a.json"), PlanarWall("A", 0, 16, [0, 12]).ToString().TrimEnd().TrimEnd('}') + ",}");
        string file = Path.Combine(_dir, "building.json");
        File.WriteAllText(file, Text(PlanBuilding([new { id = "A", at = new[] { 0.0, 20 }, direction = "y", model = "wall-a.json" }, Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16)], LoadY, [0, 12], Box)));
        var e2 = Assert.Throws<ModelInputException>(() => ModelReader.ReadPlanFile(file));
        Assert.Contains(e2.Diagnostics, d => d.File.EndsWith("wall-a.json", StringComparison.Ordinal) && d.Problem.Contains("not valid JSON"));
        Assert.Contains(e2.Diagnostics, d => d.JsonPath == "$.plan.lines[0].model");
    }

    [Fact]
    public async Task ALineFileThatIsANamedPipeIsRefusedWithoutBlocking()
    {
        if (OperatingSystem.IsWindows()) return;
        string fifo = Path.Combine(_dir, "wall-a.json");
        try
        {
            using var p = System.Diagnostics.Process.Start(new System.Diagnostics.ProcessStartInfo("mkfifo", [fifo]) { UseShellExecute = false });
            p!.WaitForExit();
            if (p.ExitCode != 0) return;
        }
        catch (System.ComponentModel.Win32Exception) { return; }   // no mkfifo on this machine
        string file = Path.Combine(_dir, "building.json");
        File.WriteAllText(file, Text(PlanBuilding([new { id = "A", at = new[] { 0.0, 20 }, direction = "y", model = "wall-a.json" }, Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16)], LoadY, [0, 12], Box)));
        // A hang guard, not a timing: opened for reading, a named pipe waits for a writer for ever.
        var e = await Task.Run(() => Assert.Throws<ModelInputException>(() => ModelReader.ReadPlanFile(file))).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("named pipe (FIFO)"));
    }

    [Fact]
    public void AStoryWithNoShearWritesAnEmptyShareNotNaN()
    {
        // Found by fuzzing: a load with nothing at the top level leaves the top story without shear, so each line's share
        // (its shear over the story shear) is undefined; the CSV wrote "NaN". Derived: story shear = load above the cut = 0.
        var r = Solve(PlanBuilding([Wall("A", 0, 20, "y", 16), Wall("B", 60, 20, "y", 16), Wall("C", 30, 0, "x", 16)],
            [new { id = "EY", direction = "y", forces = new[] { 50.0, 0 } }], [0, 12, 24], Box));
        Assert.Contains(r.Cases[0].LineStories, s => s.Story == 2 && double.IsNaN(s.Share));
        var files = PlaneLateral.Output.PlanFiles.Render(r);
        Assert.All(files, f => Assert.DoesNotContain("NaN", f.Text));
        string csv = files.Single(f => f.Name == "plan-line-stories.csv").Text;
        Assert.Contains(csv.Split('\n'), row => row.StartsWith("EY,2,A,", StringComparison.Ordinal) && row.Split(',')[5] == "");
    }

    [Fact]
    public void OnlyBuildingFilesAreTakenForBuildings()
    {
        Assert.True(ModelReader.IsPlanFile(Input.RepositoryFiles.ModelPath("demo-building.json")));
        Assert.False(ModelReader.IsPlanFile(Input.RepositoryFiles.ModelPath("demo-clinic.json")));
        Assert.False(ModelReader.IsPlanFile(Path.Combine(_dir, "missing.json")));
    }
}
