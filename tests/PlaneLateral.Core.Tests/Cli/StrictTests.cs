using Newtonsoft.Json.Linq;
using PlaneLateral.Cli;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// --strict on solve, validate, compare and report: a model whose only fault is a warning (here no "units" key, so kip
/// and inch are assumed) is refused like a bad model (exit 2, README's list), each warning listed as a problem with its
/// place and fix, nothing written; without --strict the same model runs (exit 0). Other commands keep refusing the
/// option as unknown (exit 1). Every run is hang-guarded.
/// </summary>
public sealed class StrictTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-strict-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static async Task<(int Code, string Out, string Err)> Run(params string[] args) =>
        await Task.Run(() => CliRun.Run(args)).WaitAsync(TimeSpan.FromSeconds(120));

    /// <summary>A shipped model written without its "units" key (the demo clinic is in kip and inch, so its numbers read the same).</summary>
    private string WithoutUnits(string relative)
    {
        var o = JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath(relative)));
        o.Remove("units");
        string path = Path.Combine(_dir, Path.GetFileName(relative));
        File.WriteAllText(path, o.ToString());
        return path;
    }

    private static void AssertRefused((int Code, string Out, string Err) r, bool writes = true)
    {
        Assert.Equal(ExitCodes.BadModel, r.Code);
        Assert.Contains("refused under --strict", r.Err);
        // Listed as a bad model's problems are: file:line:column: at the path: the problem. Fix: ...
        Assert.Matches(@"\.json(:\d+:\d+)?: at \$[^\n]*: the (model|building file) has no ""units"" key[^\n]*\. Fix: ", r.Err);
        Assert.DoesNotContain("warning:", r.Err);
        if (writes) Assert.Contains("Nothing was written.", r.Err);
        Assert.DoesNotContain("valid", r.Out);
    }

    [Theory]
    [InlineData("solve")]
    [InlineData("compare")]
    [InlineData("report")]
    public async Task AWarningRefusesTheModelUnderStrict(string command)
    {
        string model = WithoutUnits("demo-clinic.json");
        string outDir = Path.Combine(_dir, "out-" + command);
        var r = await Run(command, model, "--strict", "--out", outDir);
        AssertRefused(r);
        Assert.False(Directory.Exists(outDir), "nothing may be written under a refusal");
    }

    [Fact]
    public async Task ValidateUnderStrictRefusesAWarning()
    {
        string model = WithoutUnits("demo-clinic.json");
        AssertRefused(await Run("validate", model, "--strict"), writes: false);
        // Without --strict the same file is valid, its warning printed.
        var plain = await Run("validate", model);
        Assert.Equal(ExitCodes.Success, plain.Code);
        Assert.Contains("valid", plain.Out);
        Assert.Contains("warning: the model has no \"units\" key", plain.Err);
    }

    [Fact]
    public async Task WithoutStrictTheWarningDoesNotStopASolve()
    {
        string model = WithoutUnits("demo-clinic.json");
        string outDir = Path.Combine(_dir, "plain");
        var r = await Run("solve", model, "--out", outDir);
        Assert.Equal(ExitCodes.Success, r.Code);
        Assert.Contains("no \"units\" key", r.Err);
        Assert.True(File.Exists(Path.Combine(outDir, "results.json")));
    }

    [Fact]
    public async Task AModelWithoutWarningsPassesUnderStrict()
    {
        var r = await Run("validate", RepositoryFiles.ModelPath("demo-clinic.json"), "--strict");
        Assert.Equal(ExitCodes.Success, r.Code);
        Assert.Contains("valid", r.Out);
        Assert.Equal("", r.Err);
    }

    [Theory]
    [InlineData("solve")]
    [InlineData("validate")]
    [InlineData("report")]
    public async Task ABuildingInPlanIsRefusedUnderStrictToo(string command)
    {
        string building = WithoutUnits("plan/taly-example-7-12.json");
        string outDir = Path.Combine(_dir, "plan-" + command);
        var r = command == "validate" ? await Run(command, building, "--strict") : await Run(command, building, "--strict", "--out", outDir);
        AssertRefused(r, writes: command != "validate");
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public async Task OtherCommandsStillRefuseTheOptionAsUnknown()
    {
        // Unknown-option handling unchanged: exit 1 (usage), as for any option a command does not take.
        var sweep = await Run("sweep", "--strict", "--out", Path.Combine(_dir, "sweep"));
        Assert.Equal(ExitCodes.Usage, sweep.Code);
        Assert.False(Directory.Exists(Path.Combine(_dir, "sweep")));
        var misspelt = await Run("solve", RepositoryFiles.ModelPath("demo-clinic.json"), "--stricter", "--out", Path.Combine(_dir, "misspelt"));
        Assert.Equal(ExitCodes.Usage, misspelt.Code);
    }
}
