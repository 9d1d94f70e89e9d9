using System.Text.RegularExpressions;
using Newtonsoft.Json.Linq;
using PlaneLateral.Model;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Plan;

/// <summary>
/// Messages about a compact wall made a panel (openings, mesh) give every length in the building file's own units with
/// the unit named, never in metres behind the engineer's back; one test per message kind. The building is the shipped
/// walls-with-openings office (kip, ft; the south wall 40 ft long, 26 ft high, stories of 13 ft; windows 3.5 ft above
/// each floor), with one key broken per case. The figures expected are the file's own numbers (derived).
/// </summary>
public partial class CompactWallUnitsTests
{
    private static JObject Office() => JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("plan/walls-with-openings.json")));

    private static JObject SouthWall(JObject o) => (JObject)o["plan"]!["lines"]![0]!["wall"]!;

    private static JObject Opening(JObject o, int k) => (JObject)SouthWall(o)["openings"]![k]!;

    /// <summary>The problems the reader finds in the building, each "problem. Fix: fix".</summary>
    private static async Task<List<string>> Problems(JObject building)
    {
        string text = building.ToString();
        var e = await Task.Run(() => Assert.Throws<ModelInputException>(() => ModelReader.ParsePlan(text, "walls.json"))).WaitAsync(TimeSpan.FromSeconds(60));
        return e.Diagnostics.Select(d => $"{d.Problem} Fix: {d.Fix}").ToList();
    }

    /// <summary>A length quoted in metres ("12 m", "0.5 m)"), which a file in feet must never see.</summary>
    [GeneratedRegex(@"\d m\b")]
    private static partial Regex Metres();

    private static string One(List<string> problems, string words)
    {
        var hit = Assert.Single(problems, p => p.Contains(words, StringComparison.Ordinal));
        Assert.DoesNotMatch(Metres(), hit);
        return hit;
    }

    [Fact]
    public async Task AStripNarrowerThanAnElementIsInFeet()
    {
        // The narrowest strip: the wall between the first floor (13 ft) and the window sill above it (16.5 ft), 3.5 ft.
        var o = Office();
        SouthWall(o)["mesh"] = new JObject { ["elementSize"] = 4 };
        var hit = One(await Problems(o), "narrower than one element");
        Assert.Contains("is 3.5 ft wide, narrower than one element (4 ft)", hit);
        Assert.Contains("give \"elementSize\" ≤ 3.5 ft", hit);
    }

    [Fact]
    public async Task TwoEdgesTooCloseAreInFeet()
    {
        // The entrance's head 0.001 ft below the windows' head (8.5 ft): elements no longer than 4 × 0.001 ft would be needed.
        var o = Office();
        Opening(o, 0)["height"] = 8.499;
        var hit = One(await Problems(o), "apart, so elements no longer than");
        Assert.Matches(@"\(y = 8\.5 ft\)", hit);
        Assert.Matches(@"\(y = 8\.499 ft\)", hit);
        Assert.Matches(@"are only 0\.00099999\d* ft apart|are only 0\.001000\d* ft apart|are only 0\.001 ft apart", hit);
        Assert.Contains(" ft are one line)", hit);
    }

    [Fact]
    public async Task AMeshTooLargeNamesItsElementSizeInFeet()
    {
        // One mesh of 0.1 ft elements over a 40 ft × 26 ft wall: about 800 × 520 nine-node elements' nodes, far over 3000.
        var o = Office();
        SouthWall(o)["mesh"] = new JObject { ["elementSize"] = 0.1 };
        var hit = One(await Problems(o), "more than the limit of 3000");
        Assert.Matches(@"give a larger element size \(at least [0-9.]+ ft\)", hit);
    }

    [Fact]
    public async Task AnOpeningPastAnEndIsInFeet()
    {
        var o = Office();
        Opening(o, 2)["left"] = 36;   // 36 + 6 = 42 ft on a 40 ft wall
        var hit = One(await Problems(o), "reaches or passes an end of the wall");
        Assert.Contains("runs from 36 ft to 42 ft along the 40 ft wall", hit);
    }

    [Theory]
    [InlineData(20, 7, "at or above the wall's top", "reaches 27 ft above the base, at or above the wall's top (26 ft)")]   // 20 + 7 = 27 ft > 26 ft
    [InlineData(10, 5, "crosses the floor level", "runs from 10 ft to 15 ft above the base and crosses the floor level at 13 ft")]
    public async Task AnOpeningUpToTheTopOrAcrossAFloorIsInFeet(double bottom, double height, string words, string expected)
    {
        // The west window taken from the base (no "stories"), raised or lowered.
        var o = Office();
        var w = Opening(o, 1);
        w.Remove("stories");
        w["bottom"] = bottom;
        w["height"] = height;
        Assert.Contains(expected, One(await Problems(o), words));
    }

    [Fact]
    public async Task AnOpeningBelowItsFloorIsInFeet()
    {
        var o = Office();
        Opening(o, 1)["bottom"] = -1.5;
        var hit = One(await Problems(o), "below the floor of its story");
        Assert.Contains("starts 1.5 ft below", hit);
    }

    [Fact]
    public async Task APanelOfAPlanarModelInInchesIsInInches()
    {
        // The same layout checks on a panel declared under "panels" of a kip-inch model: a 42 in door made 190 in wide
        // from 60 in runs to 250 in on the 240 in wall.
        var o = JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("panels/masonry-wall-and-frame.json")));
        o["panels"]![0]!["openings"]![0]!["width"] = 190;
        string text = o.ToString();
        var e = await Task.Run(() => Assert.Throws<ModelInputException>(() => ModelReader.Parse(text, "wall.json"))).WaitAsync(TimeSpan.FromSeconds(60));
        var hit = One(e.Diagnostics.Select(d => $"{d.Problem} Fix: {d.Fix}").ToList(), "reaches or passes the ends");
        Assert.Contains("spans x = 60 in to 250 in and reaches or passes the ends of the 240 in long wall", hit);
    }

    [Fact]
    public async Task APanelFarFromTheOriginIsInInches()
    {
        // The panel placed at x = 1e15 in: its finest elements' sides are lost to round-off in the node coordinates.
        var o = JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("panels/masonry-wall-and-frame.json")));
        o["panels"]![0]!["x"] = 1e15;
        string text = o.ToString();
        var e = await Task.Run(() => Assert.Throws<ModelInputException>(() => ModelReader.Parse(text, "wall.json"))).WaitAsync(TimeSpan.FromSeconds(60));
        var hit = One(e.Diagnostics.Select(d => $"{d.Problem} Fix: {d.Fix}").ToList(), "so far from the origin");
        Assert.Matches(@"placed at x = 1E\+15 in, .*finest elements \([0-9.]+ in\).*within [0-9.E+]+ in of it", hit);
    }
}
