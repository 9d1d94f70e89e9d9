using PlaneLateral.Analysis;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Panels;

/// <summary>The shipped panel model files read and solve, and their key figures behave as the mechanics says.</summary>
public class PanelModelFileTests
{
    private static string RepoRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    [Fact]
    public void TwoStoryWallModelSolvesWithExactTiesAndEquilibrium()
    {
        var model = ModelReader.ReadFile(Path.Combine(RepoRoot(), "models/panels/two-story-wall.json"));
        var panel = Assert.Single(model.Panels);
        Assert.Equal(3, panel.Openings.Count);
        Assert.Equal(3, panel.Mesh.Refinements);
        // The base mesh only (the study's finer meshes are exercised in PanelConvergenceTests).
        var r = PanelAnalysis.Run(panel with { Mesh = panel.Mesh with { Refinements = 1 } }, model.LoadCases.Select(c => c.Id).ToArray());
        PlaneTestSupport.AssertChecks(r.Analysis);
        Assert.Equal(100e3, r.Analysis.Cases[0].Equilibrium.AppliedFx, 6);   // 40 + 60 kN as written in the file
        Assert.True(r.LevelDisplacements[0][1] > r.LevelDisplacements[0][0] && r.LevelDisplacements[0][0] > 0, "both floors drift with the wind");
        // Openings take material out: the wall is softer than the same wall solid (energy argument, common practice).
        var solid = PanelAnalysis.Run(panel with { Openings = [], Mesh = panel.Mesh with { Refinements = 1 } }, []);
        Assert.True(r.TopStiffness < solid.TopStiffness);
    }
}
