using PlaneLateral.Cli;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// <c>--width N</c>: the console text and tables fitted to N columns (40 to 1000, default 100; README), bad values refused
/// with exit 1 and nothing written; <c>--detail full</c> for a building in plan adds tables; a path longer than the line
/// stays whole (common practice: a path cut mid-word cannot be copied back).
/// </summary>
public sealed class WidthTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(120);

    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-width-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static async Task<(int Code, string Out, string Err)> Run(params string[] args) =>
        await Task.Run(() => CliRun.Run(args)).WaitAsync(Guard);

    [Theory]
    [InlineData("0", "outside 40 to 1000")]
    [InlineData("-3", "outside 40 to 1000")]
    [InlineData("39", "too narrow")]
    [InlineData("1001", "wider than any console")]
    [InlineData("99999999999", "not a whole number")]
    [InlineData("abc", "not a whole number")]
    [InlineData("1.5e2", "not a whole number")]
    public async Task ABadWidthIsRefusedWithNothingWritten(string width, string words)
    {
        string outDir = Path.Combine(_dir, "out");
        var (code, stdout, stderr) = await Run("solve", RepositoryFiles.ModelPath("demo-clinic.json"), "--out", outDir, "--width", width);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--width", stderr);
        Assert.Contains(words, stderr);
        Assert.Contains("Fix:", stderr);
        Assert.Equal("", stdout);
        Assert.False(Directory.Exists(outDir));
    }

    [Theory]
    [InlineData("demo-clinic.json", 60)]
    [InlineData("demo-clinic.json", 140)]
    [InlineData("demo-building.json", 60)]
    [InlineData("demo-building.json", 140)]
    public async Task EveryLineFitsTheWidthAsked(string model, int width)
    {
        var (code, stdout, stderr) = await Run("solve", RepositoryFiles.ModelPath(model), "--out", Path.Combine(_dir, "o"), "--detail", "full", "--width", width.ToString());
        Assert.True(code == 0, stderr);
        var lines = stdout.Split('\n');
        foreach (var line in lines.Where(l => l.Contains(' ', StringComparison.Ordinal) || l.Length > 0))
            Assert.True(line.Length <= width || !line.Trim().Contains(' '), $"{line.Length} > {width} columns: {line}");
        if (width > 100) Assert.Contains(lines, l => l.Length > 100);   // the wider console is used, not only the default
    }

    [Fact]
    public async Task NoWidthIsTheDefaultHundred()
    {
        string model = RepositoryFiles.ModelPath("demo-clinic.json");
        var a = await Run("solve", model, "--out", Path.Combine(_dir, "a"), "--detail", "full");
        var b = await Run("solve", model, "--out", Path.Combine(_dir, "a"), "--detail", "full", "--width", "100");
        Assert.Equal(0, a.Code);
        Assert.Equal(a.Out, b.Out);
        Assert.All(a.Out.Split('\n'), l => Assert.True(l.Length <= 100, l));
    }

    [Fact]
    public async Task FullDetailAddsTablesForABuildingInPlan()
    {
        string model = RepositoryFiles.ModelPath("demo-building.json");
        var normal = await Run("solve", model, "--out", Path.Combine(_dir, "n"));
        var full = await Run("solve", model, "--out", Path.Combine(_dir, "f"), "--detail", "full");
        Assert.Equal(0, normal.Code);
        Assert.Equal(0, full.Code);
        Assert.DoesNotContain("Floor motion per case", normal.Out);
        Assert.Contains("Floor motion per case", full.Out);
        Assert.DoesNotContain("Story shear per line, case EX+ecc", normal.Out);   // the shifted cases' line shears: full only
        Assert.Contains("Story shear per line, case EX+ecc", full.Out);
        Assert.True(full.Out.Split('\n').Length > normal.Out.Split('\n').Length + 50);
    }

    [Fact]
    public async Task APathLongerThanTheLineStaysWhole()
    {
        // A results folder whose path alone is wider than the console: it must appear whole on one line.
        string deep = _dir;
        while (deep.Length < 150) deep = Path.Combine(deep, "a-rather-long-folder-name");
        var (code, stdout, stderr) = await Run("solve", RepositoryFiles.ModelPath("demo-clinic.json"), "--out", deep, "--detail", "summary");
        Assert.True(code == 0, stderr);
        Assert.Contains(stdout.Split('\n'), l => l.Contains(deep + ":", StringComparison.Ordinal));
        // And prose in general: a long word is never cut, lines with spaces still wrap.
        string text = ConsoleText.Fit("Results written to " + deep + ": results.json, displacements.csv", 60);
        Assert.Contains(text.Split('\n'), l => l.Trim() == deep + ":");
        Assert.All(text.Split('\n').Where(l => !l.Contains(deep, StringComparison.Ordinal)), l => Assert.True(l.Length <= 60, l));
    }
}
