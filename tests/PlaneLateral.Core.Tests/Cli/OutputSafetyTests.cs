using PlaneLateral.Cli;
using PlaneLateral.Output;
using PlaneLateral.Reports;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// Outputs never touch inputs (docs/hardening.md): a set that would replace the model is refused with exit 4 and
/// nothing written; temporary files left by a stopped run are removed by the next write in that folder, and no other
/// file; figure names stay distinct and short whatever the ids (common practice: an output never clobbers an input).
/// </summary>
public sealed class OutputSafetyTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-outsafety-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string Shipped(string relative) => Path.Combine(AppContext.BaseDirectory, "models", relative);

    private static (int Code, string Err) Run(params string[] args)
    {
        var err = new StringWriter();
        int code = CliApp.Run(args, new StringWriter(), err);
        return (code, err.ToString());
    }

    [Theory]
    [InlineData("solve", "results.json")]
    [InlineData("solve", "displacements.csv")]
    [InlineData("report", "report.md")]
    [InlineData("compare", "comparisons.json")]
    public void AnOutputSetThatWouldReplaceTheModelIsRefused(string command, string modelName)
    {
        string model = Path.Combine(_dir, modelName);
        File.Copy(Shipped("demo-clinic.json"), model);
        byte[] before = File.ReadAllBytes(model);
        var (code, err) = Run(command, model, "--out", _dir);
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("which this run reads", err);
        Assert.Contains("Fix:", err);
        Assert.Equal(before, File.ReadAllBytes(model));
        Assert.Equal([modelName], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName));   // nothing else written
    }

    [Fact]
    public void TheModelReachedThroughALinkIsProtectedToo()
    {
        string real = Path.Combine(_dir, "results.json"), link = Path.Combine(_dir, "model-link.json");
        File.Copy(Shipped("demo-clinic.json"), real);
        File.CreateSymbolicLink(link, real);
        byte[] before = File.ReadAllBytes(real);
        var (code, _) = Run("solve", link, "--out", _dir);
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Equal(before, File.ReadAllBytes(real));
    }

    [Fact]
    public void TheModelsOwnFolderIsFineWhenNoNameCollides()
    {
        string model = Path.Combine(_dir, "clinic.json");
        File.Copy(Shipped("demo-clinic.json"), model);
        byte[] before = File.ReadAllBytes(model);
        Assert.Equal(0, Run("solve", model, "--out", _dir).Code);
        Assert.Equal(before, File.ReadAllBytes(model));
        Assert.True(File.Exists(Path.Combine(_dir, "results.json")));
    }

    [Fact]
    public void StalePartialsOfAnEndedRunAreRemovedAndNothingElse()
    {
        string outDir = Directory.CreateDirectory(Path.Combine(_dir, "out")).FullName;
        string hex = new('a', 32);
        // A process id that no process has: above the largest Linux allows (2^22 = 4194304, proc(5) — from memory).
        string ended = Path.Combine(outDir, $".results.json.99999999-{hex}.partial");
        string earlier = Path.Combine(outDir, $".results.csv.{hex}.partial");                        // an earlier version's name
        string running = Path.Combine(outDir, $".report.md.{Environment.ProcessId}-{hex}.partial");     // a run still going (this one)
        string foreign = Path.Combine(outDir, ".notes.partial"), user = Path.Combine(outDir, "my-notes.txt");
        foreach (var f in new[] { ended, earlier, running, foreign, user }) File.WriteAllText(f, "x");
        Assert.Equal(0, Run("solve", Shipped("demo-clinic.json"), "--out", outDir).Code);
        Assert.False(File.Exists(ended));
        Assert.False(File.Exists(earlier));
        Assert.True(File.Exists(running));
        Assert.True(File.Exists(foreign));
        Assert.True(File.Exists(user));
        // A day-old file of a running process is left over too (its id may have been reused).
        File.SetLastWriteTimeUtc(running, DateTime.UtcNow.AddDays(-2));
        Assert.Equal(1, AtomicFiles.RemoveStalePartials(outDir));
        Assert.False(File.Exists(running));
    }

    [Fact]
    public void FigureNamesDifferForIdsThatOnceCollidedAndStayShort()
    {
        string[] ids = ["wind A", "wind_A", "wind/A", "Wind_A", new string('x', 300), new string('x', 299) + "y"];
        var slugs = ids.Select(FigureNames.Slug).ToArray();
        Assert.Equal(ids.Length, slugs.Distinct(StringComparer.Ordinal).Count());
        Assert.All(slugs, s => Assert.True(s.Length <= FigureNames.MaxIdChars + 9, s));
        Assert.All(slugs, s => Assert.DoesNotContain('/', s));
        Assert.Equal("wind_A", FigureNames.Slug("wind_A"));   // a safe id keeps its name
        Assert.Equal(FigureNames.Slug("wind A"), FigureNames.Slug("wind A"));   // the same id, the same name every run
        // Names equal but for case are told apart within a report (case-insensitive file systems).
        var used = new HashSet<string>();
        var a = FigureNames.Unique(new Figure("shape-Wind_A.png", "", "", [], 1, 1), used);
        var b = FigureNames.Unique(new Figure("shape-wind_A.png", "", "", [], 1, 1), used);
        Assert.Equal("shape-Wind_A.png", a.FileName);
        Assert.Equal("shape-wind_A-2.png", b.FileName);
    }

    [Fact]
    public void AReportWithCollidingAndVeryLongCaseIdsWritesOneFigurePerCase()
    {
        string longId = "wind " + new string('w', 240);
        var root = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(Shipped("demo-clinic.json")));
        var cases = (Newtonsoft.Json.Linq.JArray)root["loadCases"]!;
        foreach (var id in new[] { "wind A", "wind_A", "wind/A", "Wind_A", longId })
            cases.Add(Newtonsoft.Json.Linq.JObject.FromObject(new { id, nodalLoads = new[] { new { node = "W1-L3", fx = 10.0 } } }));
        string json = root.ToString();
        string model = Path.Combine(_dir, "ids.json"), outDir = Path.Combine(_dir, "report");
        File.WriteAllText(model, json);
        var (code, err) = Run("report", model, "--out", outDir);
        Assert.True(code == 0, err);
        var shapes = Directory.GetFiles(outDir, "shape-*.png").Select(Path.GetFileName).ToList();
        Assert.Equal(shapes.Count, shapes.Distinct(StringComparer.OrdinalIgnoreCase).Count());
        Assert.All(Directory.GetFiles(outDir).Select(Path.GetFileName), n => Assert.True(n!.Length < 100, n));
        string md = File.ReadAllText(Path.Combine(outDir, "report.md"));
        foreach (var s in shapes) Assert.Contains($"]({s})", md);   // the report names each figure's file
    }
}
