using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Tests.Building;
using PlaneLateral.Tests.Input;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>
/// models/panels/masonry-wall-and-frame.json: a two-story masonry wall with a door (a plane-stress panel) tied by drag
/// beams to a one-bay steel frame, rigid floors, kip-inch, 8 kip at the second floor and 12 kip at the roof, applied to
/// the frame. The wall is part of the structure in every story result.
/// </summary>
public class LinkedWallStoryTests
{
    private static readonly Lazy<AnalysisResult> Solved = new(() => LinearStaticAnalysis.Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("panels/masonry-wall-and-frame.json"))));

    private static double Kip(AnalysisResult r, double si) => r.Model.Units.FromSI(si, Quantity.Force);

    [Fact]
    public void StoryShearsEqualTheAppliedLoadAboveEachStory()
    {
        var r = Solved.Value;
        var e = StoryAnalysis.ForCase(r, r.Case("E"));
        // Derived (statics): the part above a cut in story 1 carries 8 + 12 = 20 kip, above a cut in story 2 12 kip.
        Near(20.0, Kip(r, e.Stories[0].Shear), 1e-9, "story 1 shear, kip");
        Near(12.0, Kip(r, e.Stories[1].Shear), 1e-9, "story 2 shear, kip");
        // Derived: the gravity case has no horizontal load, so no story shear beyond round-off.
        var d = StoryAnalysis.ForCase(r, r.Case("D"));
        Assert.False(d.Lateral);
        foreach (var s in d.Stories) Assert.True(Math.Abs(Kip(r, s.Shear)) < 1e-9 * 54.0, $"D, story {s.Index}: {Kip(r, s.Shear)} kip");
        // The combination 0.9D + 1.0E carries E's horizontal loads only (derived).
        var combo = StoryAnalysis.ForCase(r, r.Case("0.9D+1.0E"));
        Near(20.0, Kip(r, combo.Stories[0].Shear), 1e-9, "0.9D+1.0E, story 1 shear, kip");
    }

    [Fact]
    public void TheWallIsItsOwnLineAndTheLinesAddUp()
    {
        var r = Solved.Value;
        var s1 = StoryAnalysis.ForCase(r, r.Case("E")).Stories[0];
        Assert.Equal(["frame", "masonry wall"], s1.Lines.Select(l => l.Line).ToArray());   // the panel's own line, by its id (no "line" key)
        Near(s1.Shear, s1.Lines.Sum(l => l.Shear), 1e-12, "Σ line shears = story shear (derived)");
        Near(1.0, s1.Lines.Sum(l => l.Share), 1e-12, "Σ shares = 1 (derived)");
    }

    [Fact]
    public void APanelDeclaredOnTheFramesLineSharesIt()
    {
        // The panel's "line" puts it on the frame's line: one line carries the whole story shear (derived: Σ shares = 1).
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(StoryInvariantTests.LinkedWallWithOwnLoads().ToString(), "test.json"));
        var s1 = StoryAnalysis.ForCase(r, r.Case("E")).Stories[0];
        var line = Assert.Single(s1.Lines);
        Assert.Equal("frame", line.Line);
        // Derived (statics): 8 + 12 kip on the frame and 3 + 4.5 kip spread on the wall's floor and top, all above story 1's cut.
        Near(27.5, Kip(r, s1.Shear), 1e-9, "story 1 shear, kip");
        Near(1.0, line.Share, 1e-12, "share of the one line");
    }

    [Fact]
    public void ABlankPanelLineIsRefusedAtItsKey()
    {
        var m = StoryInvariantTests.LinkedWallWithOwnLoads();
        m["panels"]![0]!["line"] = "  ";
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(m.ToString(), "test.json"));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.panels[0].line" && d.Line > 0 && d.Fix.Length > 0);
    }

    [Fact]
    public void TheWallsBaseShearEqualsItsLinkForces()
    {
        var r = Solved.Value;
        int pi = 0;
        for (int ci = 0; ci < r.Cases.Count; ci++)
        {
            var (bx, by, _) = StoryPanels.BaseReaction(r, pi, ci);
            var links = r.PanelLinks!.Cases[ci].Forces.Where(f => f.Panel == "masonry wall").ToList();
            double scale = links.Sum(f => Math.Abs(f.Fx) + Math.Abs(f.Fy));
            // Derived (equilibrium of the wall): it carries no load of its own, so its base takes back what the links bring.
            Assert.True(Math.Abs(bx + links.Sum(f => f.Fx)) <= 1e-9 * scale, $"{r.Cases[ci].Id}: base Fx {bx}, Σ link Fx {links.Sum(f => f.Fx)}");
            Assert.True(Math.Abs(by + links.Sum(f => f.Fy)) <= 1e-9 * scale, $"{r.Cases[ci].Id}: base Fy {by}, Σ link Fy {links.Sum(f => f.Fy)}");
            // The wall's own check is relative to what it carries (link forces), never 0/0 (derived: the same balance).
            var check = r.Panels[pi].Analysis.Cases[ci].Equilibrium;
            Assert.True(check.RelativeForceError < 1e-9, $"{r.Cases[ci].Id}: panel force imbalance {check.RelativeForceError}");
            Assert.True(check.RelativeMomentError < 1e-9, $"{r.Cases[ci].Id}: panel moment imbalance {check.RelativeMomentError}");
        }
        // The wall's story-1 shear is its base shear (no link below the cut at mid-story 1; derived).
        var s1 = StoryAnalysis.ForCase(r, r.Case("E")).Stories[0];
        Near(-StoryPanels.BaseReaction(r, pi, 0).Fx, s1.Lines.Single(l => l.Line == "masonry wall").Shear, 1e-12, "wall line shear, story 1");
    }

    [Fact]
    public void ReactionsBalanceTheLoadsInTheFiles()
    {
        var r = Solved.Value;
        StoryInvariantTests.AssertInvariants(r, "masonry wall and frame");
        var csv = ResultFiles.Render(ModelRun.Run(r.Model)).Single(f => f.Name == "reactions.csv").Text;
        Assert.Contains("E,masonry wall (panel base),", csv);
        // Derived: the base shear of the whole is the 20 kip applied, frame columns and wall together.
        double sum = csv.Split('\n').Skip(1).Where(l => l.StartsWith("E,", StringComparison.Ordinal)).Sum(l => double.Parse(l.Split(',')[2], System.Globalization.CultureInfo.InvariantCulture));
        Near(-20.0, sum, 1e-9, "Σ reaction Fx in reactions.csv, case E, kip");
    }

    [Fact]
    public void NoSoftStoryIsFlagged()
    {
        var r = Solved.Value;
        var b = BuildingResult.Of(r);
        var rows = b.Irregularity.Where(x => x.CaseId == "E").ToList();
        Assert.NotEmpty(rows);
        // The wall is solid above its door and the same in both stories: neither story is soft against the one above
        // (common practice: Type 1a needs k below 70 % of the story above, ASCE 7-16 Table 12.3-2).
        Assert.All(rows, x => Assert.False(x.Soft || x.ExtremelySoft, $"story {x.Story.Index}: k/k above {x.RatioToAbove}"));
        Assert.All(b.Cases.Where(c => c.Lateral).SelectMany(c => c.Stories), s => Assert.True(s.Stiffness > 0, $"story {s.Index}: stiffness {s.Stiffness}"));
    }

    [Fact]
    public void TheLineAloneSplitIncludesTheWall()
    {
        var r = Solved.Value;
        var split = LineAlone.Split(r, "E");
        var wall = split.Where(x => x.Line == "masonry wall").ToList();
        Assert.Equal(2, wall.Count);
        Assert.All(wall, x => Assert.True(x.AloneStiffness > 0 && double.IsFinite(x.AloneStiffness)));
        // Derived: the shares by stiffness alone of the lines in a story add up to one.
        foreach (var story in split.GroupBy(x => x.Story)) Near(1.0, story.Sum(x => x.AloneShare), 1e-12, $"story {story.Key}: Σ shares alone");
        // Derived (statics of the line alone): the wall alone under the level forces carries them all, 8 + 12 kip below its floor.
        var alone = LineAlone.Stories(r, "E", "masonry wall");
        Near(20.0, Kip(r, alone.Stories[0].Shear), 1e-9, "wall alone, story 1 shear, kip");
    }
}
