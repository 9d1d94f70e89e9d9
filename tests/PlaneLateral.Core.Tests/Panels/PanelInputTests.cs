using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>Wall panels in the model file: reading, units, diagnostics at the right key, results files.</summary>
public class PanelInputTests
{
    private static object Model(object panel, object[]? cases = null) => new
    {
        formatVersion = 1,
        title = "panel test",
        units = new { force = "kN", length = "m" },
        materials = new[] { new { id = "C", E = 25e6, nu = 0.2 } },
        sections = Array.Empty<object>(),
        loadCases = cases ?? [new { id = "wind" }],
        panels = new[] { panel },
    };

    private static object Wall(object? mesh = null, object[]? openings = null, double[]? levels = null, object[]? forces = null) => new
    {
        id = "W",
        length = 4.0, height = 3.0, thickness = 0.2, material = "C",
        openings = openings ?? [],
        floorLevels = levels ?? [],
        mesh = mesh ?? new { element = "quad9", elementsAcrossNarrowest = 2 },
        storyForces = forces ?? [new { @case = "wind", level = "top", fx = 100.0 }],
    };

    [Fact]
    public void APanelOnlyModelIsReadInSIAndSolved()
    {
        var r = Solve(Model(Wall(levels: [1.5], forces: [new { @case = "wind", level = "top", fx = 100.0 }, new { @case = "wind", level = 1.5, fx = 50.0 }])));
        var p = Assert.Single(r.Panels);
        Assert.Equal(4.0, p.Panel.Length);
        Assert.Equal(25e9, p.Panel.E);   // kN/m² → N/m²: ×1000 (units conversion, derived)
        PlaneTestSupport.AssertChecks(p.Analysis);
        Near(150e3, p.Analysis.Cases[0].Equilibrium.AppliedFx, 1e-12, "story forces in N");
        Assert.Equal([1.5, 3.0], p.Mesh.Levels);
        Assert.True(p.TopStiffness > 0 && p.TopDisplacement(0) > p.LevelDisplacements[0][0]);
    }

    [Fact]
    public void ResultsFilesCarryThePanelAndAreByteIdenticalRunToRun()
    {
        var json = Json(Model(Wall()));
        var a = ResultFiles.Render(ModelRun.Run(ModelReader.Parse(json, "m.json")));
        var b = ResultFiles.Render(ModelRun.Run(ModelReader.Parse(json, "m.json")));
        Assert.Equal(a, b);
        Assert.Contains(a, f => f.Name == "panels.json" && f.Text.Contains("\"topStiffness\""));
        var stresses = a.Single(f => f.Name == "panel-stresses.csv").Text.Split('\n');
        Assert.StartsWith("panel,case,node,x [m],y [m],ux [m],uy [m],sigma x [kN/m²]", stresses[0]);
        Assert.Contains(a, f => f.Name == "panel-checks.csv");
        // A frame-only model gets no panel files (its outputs are unchanged).
        Assert.DoesNotContain(ResultFiles.Render(ModelRun.Run(Solve(Cantilever(144, 100, new { id = "S", shape = "rectangle", b = 12, d = 120 }, new { id = "MAT", E = 3605, nu = 0.2 })).Model)), f => f.Name.StartsWith("panel"));
    }

    [Fact]
    public void CombinationsAreSuperposedAndChecked()
    {
        // Linearity (derived): the combination 1.2·A + 0.5·B moves every level by 1.2·u_A + 0.5·u_B, and its stresses
        // and equilibrium follow; the combination's residual is checked on its own like a case.
        var model = new
        {
            formatVersion = 1, title = "combo", units = new { force = "kN", length = "m" },
            materials = new[] { new { id = "C", E = 25e6, nu = 0.2 } }, sections = Array.Empty<object>(),
            loadCases = new[] { new { id = "A" }, new { id = "B" } },
            combinations = new[] { new { id = "U", factors = new Dictionary<string, double> { ["A"] = 1.2, ["B"] = 0.5 } } },
            panels = new[] { Wall(levels: [1.5], forces: [new { @case = "A", level = "top", fx = 100.0 }, new { @case = "B", level = 1.5, fx = -30.0 }]) },
        };
        var r = Solve(model);
        var p = r.Panels[0];
        Assert.Equal(["A", "B", "U"], p.Analysis.Cases.Select(c => c.Id));
        PlaneTestSupport.AssertChecks(p.Analysis);
        for (int l = 0; l < 2; l++)
            Near(1.2 * p.LevelDisplacements[0][l] + 0.5 * p.LevelDisplacements[1][l], p.LevelDisplacements[2][l], 1e-12, $"level {l}");
        Near(1.2 * 100e3 - 0.5 * 30e3, p.Analysis.Cases[2].Equilibrium.AppliedFx, 1e-12, "combined story force");
        int node = p.Mesh.BaseNodes[0];
        Near(1.2 * p.Analysis.Cases[0].NodalStress[node, 1] + 0.5 * p.Analysis.Cases[1].NodalStress[node, 1], p.Analysis.Cases[2].NodalStress[node, 1], 1e-10, "σy at a base corner");
    }

    [Theory]
    [InlineData("overlap", "$.panels[0].openings[1]", "overlap or touch")]
    [InlineData("outside", "$.panels[0].openings[0]", "reaches or passes the ends")]
    [InlineData("narrow", "$.panels[0].mesh", "narrower than one element")]
    [InlineData("toobig", "$.panels[0].mesh", "more than the limit")]
    [InlineData("level", "$.panels[0].storyForces[0].level", "no floor level at 2")]
    [InlineData("case", "$.panels[0].storyForces[0].case", "unknown load case")]
    [InlineData("element", "$.panels[0].mesh.element", "unknown element")]
    [InlineData("material", "$.panels[0].material", "unknown material")]
    public void BadPanelInputIsReportedAtItsKey(string what, string path, string problem)
    {
        object wall = what switch
        {
            "overlap" => Wall(openings: [new { id = "A", left = 1.0, bottom = 1.0, width = 1.0, height = 1.0 }, new { id = "B", left = 1.5, bottom = 0.5, width = 1.0, height = 1.0 }]),
            "outside" => Wall(openings: [new { id = "A", left = 3.5, bottom = 1.0, width = 1.0, height = 1.0 }]),
            "narrow" => Wall(mesh: new { element = "quad4", elementSize = 0.5 }, openings: [new { id = "A", left = 1.0, bottom = 1.0, width = 1.0, height = 1.0 }, new { id = "B", left = 2.2, bottom = 1.0, width = 1.0, height = 1.0 }]),
            "toobig" => Wall(mesh: new { element = "quad9", elementSize = 0.05 }),
            "level" => Wall(forces: [new { @case = "wind", level = 2.0, fx = 1.0 }]),
            "case" => Wall(forces: [new { @case = "quake", level = "top", fx = 1.0 }]),
            "element" => Wall(mesh: new { element = "triangle" }),
            _ => new { id = "W", length = 4.0, height = 3.0, thickness = 0.2, material = "steel" },
        };
        var e = Assert.Throws<ModelInputException>(() => Parse(Model(wall)));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == path && d.Problem.Contains(problem) && d.Line > 0 && d.Fix.Length > 0);
    }

    [Fact]
    public void EveryProblemOfAPanelIsReportedAtOnce()
    {
        // Diagnostics are collected, never thrown on the first one (DEVELOPERS.md).
        var wall = Wall(openings: [new { id = "A", left = -1.0, bottom = 1.0, width = 1.0, height = 1.0 }, new { id = "B", left = 1.0, bottom = 2.5, width = 1.0, height = 1.0 }],
            forces: [new { @case = "quake", level = "top", fx = 1.0 }]);
        var e = Assert.Throws<ModelInputException>(() => Parse(Model(wall)));
        Assert.True(e.Diagnostics.Count >= 3, string.Join("\n", e.Diagnostics));
    }
}
