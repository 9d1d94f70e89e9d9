namespace PlaneLateral.Reports.Tests;

/// <summary>The Reports library's place in the layering (DEVELOPERS.md: libraries do no console I/O; the CLI sits on top).</summary>
public class LayeringTests
{
    private static string RepoRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    [Fact]
    public void Reports_does_no_console_IO()
    {
        var offenders = Directory.EnumerateFiles(Path.Combine(RepoRoot(), "src", "PlaneLateral.Reports"), "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}"))
            .Where(f => File.ReadAllText(f).Contains("Console."))
            .ToList();
        Assert.Empty(offenders);
    }

    [Fact]
    public void Reports_references_the_libraries_but_not_the_command_line()
    {
        var refs = typeof(AspectSweep).Assembly.GetReferencedAssemblies().Select(a => a.Name!).Where(n => n.StartsWith("PlaneLateral")).Order().ToArray();
        Assert.DoesNotContain("planelateral", refs);
        Assert.Contains("PlaneLateral.Core", refs);
        Assert.Contains("PlaneLateral.Hand", refs);
        Assert.Contains("PlaneLateral.Studies", refs);
    }
}
