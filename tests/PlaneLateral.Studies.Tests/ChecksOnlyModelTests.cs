using PlaneLateral.Model;

namespace PlaneLateral.Studies.Tests;

/// <summary>A model of self-contained checks only (built from their own dimensions) needs no frame (docs/comparisons.md).</summary>
public class ChecksOnlyModelTests
{
    private static readonly object Check = new
    {
        id = "PW", kind = "perforated-wall", length = 240.0, height = 120.0, thickness = 8.0, material = "CMU",
        openings = new[] { new { x = 90.0, y = 30.0, width = 60.0, height = 60.0 } },
    };

    [Fact]
    public void A_perforated_wall_check_reads_and_compares_without_a_dummy_frame()
    {
        // Derived: the check is built from its own dimensions, so the carrier frame plays no part in it; the rows with
        // and without the carrier are the same to the last bit.
        var bare = new { formatVersion = 1, units = new { force = "kip", length = "in" }, materials = new[] { Models.Masonry }, comparisons = new[] { Check } };
        var model = Models.Parse(bare);
        Assert.Empty(model.Nodes);
        Assert.Empty(model.Members);
        var row = Assert.Single(ComparisonStudy.Run(model).Rows);
        var carried = Assert.Single(Models.Compare(Models.Carrier([Check])).Rows);
        Assert.Equal(carried.Hand.Value, row.Hand.Value);
        Assert.Equal(carried.Fe.Select(f => (f.Model, f.Value)), row.Fe.Select(f => (f.Model, f.Value)));
    }

    [Fact]
    public void A_check_that_names_members_still_needs_the_frame()
    {
        // Common practice: a wall-line check reads the model's own members, so without them the reader lists what is missing.
        var bad = new
        {
            formatVersion = 1, units = new { force = "kip", length = "in" }, materials = new[] { Models.Masonry },
            comparisons = new object[] { Check, new { id = "W", kind = "wall-line", members = new[] { "M1" } } },
        };
        var e = Assert.Throws<ModelInputException>(() => Models.Parse(bad));
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("missing required key 'members'"));
    }
}
