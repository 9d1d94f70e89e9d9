using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>
/// A wall panel whose base stands on a rigid footing on soil: the base nodes follow the footing's rigid motion, the
/// springs act at the middle of the base (Analysis/PanelOnFooting.cs, docs/footings.md).
/// </summary>
public class PanelOnFootingTests
{
    // An invented squat concrete wall, 6 m long and 3 m tall (h/l = 0.5), 0.25 m thick, E = 25 GPa, ν = 0.2.
    private const double L = 6, H = 3, T = 0.25, E = 25e9, Nu = 0.2;

    private static WallPanel Panel(bool ties = true) => new()
    {
        Id = "W", X0 = 2, Y0 = 0, Length = L, Height = H, Thickness = T, MaterialId = "C", E = E, Nu = Nu,
        Mesh = new PanelMeshSettings(PanelElementKind.Quad9, 0, 4), Openings = [], FloorLevels = [], Loads = [], FloorTies = ties,
    };

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void OnARockingAndSlidingSpringTheTopMovesByTheFixedBaseValuePlusTheBaseTerms(bool ties)
    {
        // Derived: the panel's base resultants under a unit top force are set by statics (V = 1, M = 1·h about the middle
        // of the base, no vertical force), so its deformation relative to its rigid base is that of the fixed-base panel and
        // the footing adds a rigid-body motion: the base slides by 1/K_h and turns by h/K_θ, moving the top by h²/K_θ more.
        // Hence 1/k_footing = 1/k_fixed + h²/K_θ + 1/K_h on the same mesh, to round-off. Springs chosen so that rocking and
        // sliding each give about as much as the wall itself (invented soil).
        double kTheta = 2e10, kH = 4e9;   // N·m/rad, N/m
        var fixedBase = PanelAnalysis.Run(Panel(ties), []);
        var onFooting = PanelOnFooting.Run(Panel(ties), [], kH, double.PositiveInfinity, kTheta);
        Near(1 / fixedBase.TopStiffness + H * H / kTheta + 1 / kH, 1 / onFooting.TopStiffness, 1e-9, "top flexibility on the footing");
        // Rocking alone, and a vertical spring (no vertical force on the base: it does not move) change nothing else.
        var rockOnly = PanelOnFooting.Run(Panel(ties), [], double.PositiveInfinity, 1e9, kTheta);
        Near(1 / fixedBase.TopStiffness + H * H / kTheta, 1 / rockOnly.TopStiffness, 1e-9, "rocking spring only");
    }

    [Fact]
    public void AsTheSoilStiffensTheFixedBaseComesBack()
    {
        // Derived from the sum above: the base terms vanish as the springs grow.
        var fixedBase = PanelAnalysis.Run(Panel(), []);
        double previous = double.PositiveInfinity;
        foreach (double scale in new[] { 1.0, 1e2, 1e4, 1e6 })
        {
            var r = PanelOnFooting.Run(Panel(), [], 4e9 * scale, 1e10 * scale, 2e10 * scale);
            double gap = Math.Abs(r.TopStiffness / fixedBase.TopStiffness - 1);
            Assert.True(gap < previous, $"×{scale}: gap {gap} must fall below {previous}");
            previous = gap;
        }
        Assert.True(previous < 1e-5, $"nearly fixed: {previous}");
    }

    [Fact]
    public void AModelsFootingUnderAPanelSetsItsSpringsAndItsBaseReactionsBalanceTheLoads()
    {
        // The model key: a footing with "panel" instead of "node" (kN–m). The panel's springs are the footing's
        // (the engine's Pais & Kausel evaluation, checked against the hand library elsewhere); the top stiffness follows
        // the sum above with those springs, and the base reactions balance the story force (statics).
        var json = new
        {
            formatVersion = 1,
            units = new { force = "kN", length = "m" },
            materials = new[] { new { id = "C", E = E / 1000, nu = Nu } },
            sections = Array.Empty<object>(),
            loadCases = new[] { new { id = "W" } },
            panels = new[]
            {
                new
                {
                    id = "P", x = 0.0, y = 0.0, length = L, height = H, thickness = T, material = "C",
                    mesh = new { element = "quad9", elementsAcrossNarrowest = 4 },
                    storyForces = new[] { new { @case = "W", level = "top", fx = 100.0 } },
                },
            },
            footings = new[] { new { id = "F", panel = "P", length = 8.0, width = 2.5, soil = new { shearModulus = 60000.0, poissonRatio = 0.3 } } },
        };
        var model = Parse(json);
        var ft = Assert.Single(model.Footings);
        Assert.Equal("P", ft.Panel);
        var r = LinearStaticAnalysis.Run(model);
        var fixedModel = model with { Footings = [] };
        var rf = LinearStaticAnalysis.Run(fixedModel);
        Near(1 / rf.Panels[0].TopStiffness + H * H / ft.Springs.Rocking + 1 / ft.Springs.Sliding, 1 / r.Panels[0].TopStiffness, 1e-9, "top flexibility with the model's springs");
        var c = r.Panels[0].Analysis.Cases[0];
        Near(-100e3, c.Reactions.Where(x => x.Dof == Dof.X).Sum(x => x.Value), 1e-9, "base shear balances the story force");
        Near(100e3 / r.Panels[0].TopStiffness, r.Panels[0].LevelDisplacements[0][^1], 1e-9, "top displacement of the case = P/k on the footing");
    }

    [Fact]
    public void AFootingShorterThanItsPanelOrUnderALinkedPanelIsRefused()
    {
        var o = JObject.FromObject(new
        {
            formatVersion = 1,
            units = new { force = "kN", length = "m" },
            materials = new[] { new { id = "C", E = E / 1000, nu = Nu } },
            sections = Array.Empty<object>(),
            loadCases = new[] { new { id = "W" } },
            panels = new[] { new { id = "P", length = L, height = H, thickness = T, material = "C" } },
            footings = new[] { new { id = "F", panel = "P", length = 4.0, width = 2.5, soil = new { shearModulus = 60000.0, poissonRatio = 0.3 } } },
        });
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(o.ToString(), "short.json"));
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("shorter than the") && d.JsonPath == "$.footings[0].length" && d.Fix.Length > 0);
    }
}
