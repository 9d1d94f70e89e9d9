namespace PlaneLateral.Tests.Panels;

/// <summary>
/// The panel code keeps the engine's one-way data path (docs/engine.md, DEVELOPERS.md): Model → Elements → Meshing →
/// Assembly/Solvers → Analysis → Output. Meshing is new, so it is checked here.
/// </summary>
public class PanelLayeringTests
{
    private static string Core()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) d = d.Parent;
        return Path.Combine(d?.FullName ?? throw new InvalidOperationException("repository root not found"), "src/PlaneLateral.Core");
    }

    [Theory]
    [InlineData("Model", "PlaneLateral.Meshing")]
    [InlineData("Elements", "PlaneLateral.Meshing")]
    [InlineData("Meshing", "PlaneLateral.Assembly")]
    [InlineData("Meshing", "PlaneLateral.Solvers")]
    [InlineData("Meshing", "PlaneLateral.Analysis")]
    [InlineData("Meshing", "PlaneLateral.Output")]
    [InlineData("Assembly", "PlaneLateral.Meshing")]
    public void LowerLayersDoNotNameHigherOnes(string folder, string ns)
    {
        var bad = Directory.EnumerateFiles(Path.Combine(Core(), folder), "*.cs", SearchOption.AllDirectories)
            .Where(f => File.ReadAllLines(f).Any(l => l.TrimStart().StartsWith($"using {ns}") || l.Contains($" {ns}.")))
            .Select(Path.GetFileName).ToList();
        Assert.Empty(bad);
    }
}
