using PlaneLateral.Studies;

namespace PlaneLateral.Studies.Tests;

/// <summary>The plane-stress panel estimate beside the hand methods and the line models.</summary>
public class PanelColumnTests
{
    private static FeEstimate Panel(ComparisonRow row) => row.Fe.Single(f => f.Model == PanelEstimate.ModelName);

    [Fact]
    public void SlenderPierPanelApproachesTheTimoshenkoCantilever()
    {
        // h/l = 4: flexure governs (shear share about 5 %), and plane-stress elasticity tends to beam theory as the wall
        // gets slender (Timoshenko & Goodier, Theory of Elasticity, §21: the end-loaded cantilever differs from
        // PL³/3EI + f·PL/(GA) only in the shear term's coefficient and a root zone about one depth long). 3 % covers that.
        var row = Models.Compare(Models.WallLine(480, 120, 12, 4, ends: ["cantilever"])).Rows.Single();
        double ratio = Panel(row).Value / row.Hand.Value;
        Assert.InRange(ratio, 0.97, 1.03);
        Assert.Contains("plane-stress panel:", row.Cause);
    }

    [Fact]
    public void ShallowSpandrelsAreSoftInThePanelToo()
    {
        // The perforated-wall method takes the piers fixed-fixed under rigid spandrels (Taly, Design of Reinforced
        // Masonry Structures, ch. 7). With an 8 in band over 48 in windows (depth/span 0.17) the continuum, which shares none of the line
        // models' assumptions, must find the wall much softer too (common practice: shallow spandrels cannot fix piers).
        var model = Models.Carrier([new
        {
            id = "PW", kind = "perforated-wall", length = 240.0, height = 104.0, thickness = 8.0, material = "CMU", ends = "cantilever",
            openings = new[]
            {
                new { label = "window 1", x = 48.0, y = 48.0, width = 48.0, height = 48.0 },
                new { label = "window 2", x = 144.0, y = 48.0, width = 48.0, height = 48.0 },
            },
        }]);
        var row = Models.Compare(model).Rows.Single();
        Assert.True(row.Fe.Any(f => f.Model == PanelEstimate.ModelName), row.Cause);
        double panel = Panel(row).Value / row.Hand.Value;
        Assert.True(panel < 0.8, $"panel/hand {panel}");
        Assert.Contains("by the continuum's measure the hand method is too stiff", row.Cause);
    }

    [Fact]
    public void WallLinesWithStiffnessModifiersSayWhyThereIsNoPanel()
    {
        var model = Newtonsoft.Json.Linq.JObject.FromObject(Models.WallLine(144, 120, 12, 2, ends: ["cantilever"]));
        foreach (var m in model["members"]!) m["modifiers"] = Newtonsoft.Json.Linq.JObject.FromObject(new { I = 0.35 });
        var row = Models.Compare(model).Rows.Single();
        Assert.DoesNotContain(row.Fe, f => f.Model == PanelEstimate.ModelName);
        Assert.Contains("stiffness modifiers", row.Cause);
    }
}
