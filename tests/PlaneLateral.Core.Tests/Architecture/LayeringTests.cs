using System.Reflection;

namespace PlaneLateral.Tests.Architecture;

/// <summary>
/// The dependency direction written as tests: model → elements → assembly/solvers → analysis → studies → CLI; the
/// hand methods reference no FE code (so the two cannot share a bug); the libraries do no console I/O.
/// </summary>
public class LayeringTests
{
    private static string RepoRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    private static string[] References(string assembly) =>
        System.Reflection.Assembly.Load(assembly).GetReferencedAssemblies().Select(a => a.Name!).Where(n => n.StartsWith("PlaneLateral")).ToArray();

    [Fact]
    public void HandMethodsReferenceNoOtherProjectOfOurs() => Assert.Empty(References("PlaneLateral.Hand"));

    [Fact]
    public void CoreReferencesNeitherHandMethodsNorTheCommandLine() => Assert.Empty(References("PlaneLateral.Core"));

    [Theory]
    [InlineData("src/PlaneLateral.Core")]
    [InlineData("src/PlaneLateral.Hand")]
    public void LibrariesDoNoConsoleIO(string folder)
    {
        var offenders = Directory.EnumerateFiles(Path.Combine(RepoRoot(), folder), "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}"))
            .Where(f => File.ReadAllText(f).Contains("Console."))
            .ToList();
        Assert.Empty(offenders);
    }

    [Fact]
    public void CoreFoldersDoNotReachBackUpTheChain()
    {
        // Lower layers never name the namespaces of the layers above them.
        string core = Path.Combine(RepoRoot(), "src/PlaneLateral.Core");
        var order = new[] { "Units", "Model", "Elements", "Assembly", "Solvers", "Analysis", "Output" };
        var forbidden = new Dictionary<string, string[]>
        {
            ["Units"] = ["PlaneLateral.Model", "PlaneLateral.Elements", "PlaneLateral.Assembly", "PlaneLateral.Analysis", "PlaneLateral.Output"],
            ["Model"] = ["PlaneLateral.Elements", "PlaneLateral.Assembly", "PlaneLateral.Analysis", "PlaneLateral.Output", "PlaneLateral.Solvers"],
            ["Elements"] = ["PlaneLateral.Assembly", "PlaneLateral.Analysis", "PlaneLateral.Output", "PlaneLateral.Solvers"],
            ["Solvers"] = ["PlaneLateral.Model", "PlaneLateral.Elements", "PlaneLateral.Assembly", "PlaneLateral.Analysis", "PlaneLateral.Output"],
            ["Assembly"] = ["PlaneLateral.Analysis", "PlaneLateral.Output"],
            ["Analysis"] = ["PlaneLateral.Output"],
        };
        var bad = new List<string>();
        foreach (var folder in order.Where(forbidden.ContainsKey))
            foreach (var f in Directory.EnumerateFiles(Path.Combine(core, folder), "*.cs", SearchOption.AllDirectories))
                foreach (var ns in forbidden[folder])
                    if (File.ReadAllLines(f).Any(l => l.TrimStart().StartsWith($"using {ns}") || l.Contains($" {ns}.")))
                        bad.Add($"{Path.GetFileName(f)} uses {ns}");
        Assert.Empty(bad);
    }
}
