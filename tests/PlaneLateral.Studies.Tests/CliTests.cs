using PlaneLateral.Cli;

namespace PlaneLateral.Studies.Tests;

/// <summary>The compare command end to end (common practice: exit codes, atomic files, byte-identical reruns).</summary>
[Collection("current directory")]
public class CliTests
{
    private static string DemoPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json");

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter(); var e = new StringWriter();
        int code = CliApp.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    private static string TempDir() => Path.Combine(Path.GetTempPath(), "pl-compare-" + Guid.NewGuid().ToString("N"));

    [Fact]
    public void Compare_on_the_demo_writes_both_files_and_prints_the_table()
    {
        string dir = TempDir();
        var (code, output, err) = Run("compare", DemoPath, "--out", dir);
        Assert.True(code == 0, err);
        Assert.True(File.Exists(Path.Combine(dir, "comparisons.json")));
        Assert.True(File.Exists(Path.Combine(dir, "comparisons.csv")));
        Assert.Contains("Hand methods beside the FE model", output);
        Assert.Contains("licensed engineer", output);
        var json = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(Path.Combine(dir, "comparisons.json")));
        var rows = (Newtonsoft.Json.Linq.JArray)json["rows"]!;
        Assert.True(rows.Count >= 10);
        foreach (var row in rows)
        {
            Assert.False(string.IsNullOrWhiteSpace((string?)row["hand"]!["method"]));
            Assert.False(string.IsNullOrWhiteSpace((string?)row["hand"]!["source"]));
            Assert.NotEmpty((Newtonsoft.Json.Linq.JArray)row["hand"]!["assumptions"]!);
            Assert.NotEmpty((Newtonsoft.Json.Linq.JArray)row["fe"]!);
        }
        // Every kind of check the demo declares shows up.
        foreach (var kind in new[] { "wall-line", "frame-stories", "shear-split", "perforated-wall" })
            Assert.Contains(rows, r => (string?)r["kind"] == kind);
        Directory.Delete(dir, true);
    }

    [Fact]
    public void Two_runs_give_byte_identical_files()
    {
        string a = TempDir(), b = TempDir();
        Assert.Equal(0, Run("compare", DemoPath, "--out", a).Code);
        Assert.Equal(0, Run("compare", DemoPath, "--out", b).Code);
        foreach (var f in new[] { "comparisons.json", "comparisons.csv" })
            Assert.Equal(File.ReadAllBytes(Path.Combine(a, f)), File.ReadAllBytes(Path.Combine(b, f)));
        Directory.Delete(a, true); Directory.Delete(b, true);
    }

    [Fact]
    public void Bad_check_gives_a_clear_error_and_writes_nothing()
    {
        string dir = TempDir();
        string model = Path.Combine(Path.GetTempPath(), $"bad-{Guid.NewGuid():N}.json");
        var demo = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(DemoPath));
        demo["comparisons"]![0]!["members"]![1] = "WALL1-S9";
        File.WriteAllText(model, demo.ToString());
        var (code, _, err) = Run("compare", model, "--out", dir);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("unknown member \"WALL1-S9\"", err);
        Assert.Contains("$.comparisons[0].members[1]", err);
        Assert.Contains("Fix:", err);
        Assert.Contains("Nothing was written", err);
        Assert.False(Directory.Exists(dir));
        File.Delete(model);
    }

    [Theory]
    [InlineData("abc")]
    [InlineData("1.5")]
    [InlineData("0")]
    public void Bad_tolerance_is_a_usage_error(string tol)
    {
        string dir = TempDir();
        var (code, _, err) = Run("compare", DemoPath, "--out", dir, "--tolerance", tol);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--tolerance", err);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void Tolerance_changes_the_verdicts()
    {
        // The frame's rigid-beam rows miss by far more than 10%; with a 99% band they fall within it.
        string dir = TempDir();
        var (code, output, _) = Run("compare", DemoPath, "--out", dir, "--tolerance", "99%");
        Assert.Equal(0, code);
        Assert.Contains("default tolerance ±99%", output);
        var json = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(Path.Combine(dir, "comparisons.json")));
        Assert.All((Newtonsoft.Json.Linq.JArray)json["rows"]!, r => Assert.Equal(0.99, (double)r["tolerance"]!));
        Directory.Delete(dir, true);
    }

    [Fact]
    public void Help_names_the_options()
    {
        var (code, output, _) = Run("compare", "--help");
        Assert.Equal(0, code);
        Assert.Contains("--tolerance", output);
        Assert.Contains("--out", output);
    }

    [Fact]
    public void No_argument_run_prints_the_comparison_table_after_the_solve_summary()
    {
        string old = Directory.GetCurrentDirectory(), dir = TempDir();
        Directory.CreateDirectory(dir);
        try
        {
            Directory.SetCurrentDirectory(dir);
            var (code, output, err) = Run();
            Assert.True(code == 0, err);
            // The no-argument run shows the demo building in plan (docs/plan.md): its hand-beside-FE split follows the solve checks.
            int summary = output.IndexOf("Checks of every floor solve", StringComparison.Ordinal);
            int table = output.IndexOf("Hand (relative rigidity with torsion) beside FE", StringComparison.Ordinal);
            Assert.True(summary >= 0 && table > summary, "comparison table after the solve summary");
            Assert.True(File.Exists(Path.Combine(dir, "planelateral-results", "demo-building", "plan.json")));
        }
        finally
        {
            Directory.SetCurrentDirectory(old);
            Directory.Delete(dir, true);
        }
    }
}

[Collection("current directory")]
public class CliMoreTests
{
    [Fact]
    public void Model_without_checks_is_refused_without_writing()
    {
        string model = Path.Combine(Path.GetTempPath(), $"nochecks-{Guid.NewGuid():N}.json");
        var demo = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json")));
        demo.Remove("comparisons");
        File.WriteAllText(model, demo.ToString());
        string dir = Path.Combine(Path.GetTempPath(), "pl-none-" + Guid.NewGuid().ToString("N"));
        var o = new StringWriter(); var e = new StringWriter();
        Assert.Equal(ExitCodes.BadModel, CliApp.Run(["compare", model, "--out", dir], o, e));
        Assert.Contains("declares no comparison checks", e.ToString());
        Assert.False(Directory.Exists(dir));
        File.Delete(model);
    }
}
