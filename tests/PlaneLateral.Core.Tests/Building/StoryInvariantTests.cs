using System.Globalization;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Tests.Input;
using PlaneLateral.Tests.Seismic;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Building;

/// <summary>
/// Invariants every solved model keeps, whatever it holds (members, braces, rigid zones, linked wall panels, panels
/// alone, generated seismic cases), checked over every shipped model (models/**.json) and every test model with levels:
/// <list type="bullet">
/// <item>Σ story shear at each story equals the horizontal load above the cut (derived: equilibrium of the part of the
/// structure above a horizontal cut), the load taken from the loads as written, not from the element vectors;</item>
/// <item>Σ reactions equals −Σ loads in every results file, read back from reactions.csv and results.json (derived:
/// global equilibrium of the whole).</item>
/// </list>
/// </summary>
public class StoryInvariantTests
{
    /// <summary>Every shipped model, by its path under models/.</summary>
    public static TheoryData<string> ShippedModels()
    {
        var data = new TheoryData<string>();
        // Buildings in plan have their own statics check in plan (ΣFx, ΣFy, ΣMz of line forces against floor loads,
        // Plan/PlanDerivedTests); their lines are planar models checked there.
        foreach (var m in RepositoryFiles.Models())
            if (!ModelReader.IsPlanFile(RepositoryFiles.ModelPath(m))) data.Add(m);
        return data;
    }

    /// <summary>The test models with levels (their JSON text, by a name).</summary>
    private static readonly Dictionary<string, Func<string>> TestModelsWithLevels = new()
    {
        ["shear building"] = () => Json(BuildingModels.ShearBuilding(3.0, [300, 250, 200], [30, 50, 70])),
        ["story shear statics (top-down wall, rigid zones, slanted brace, member loads)"] = () => Json(StoryShearStaticsTests.Model()),
        ["wall and frame, line alone"] = () => Json(LineAloneTests.Model()),
        ["wall beside a frame, diaphragm"] = () => Json(DiaphragmTests.WallBesideFrame()),
        ["wall beside a frame, no diaphragm"] = () => Json(DiaphragmTests.WallBesideFrame(diaphragm: false)),
        ["shear building, seismic block"] = () => SeismicModels.ShearBuilding(3.0, [300, 250, 200], [400e3, 400e3, 300e3], new { baseShear = 120e3, period = "computed" }).ToString(),
        ["linked masonry wall with its own story forces, on the frame's line"] = () => LinkedWallWithOwnLoads().ToString(),
    };

    public static TheoryData<string> TestModelNames()
    {
        var data = new TheoryData<string>();
        foreach (var k in TestModelsWithLevels.Keys) data.Add(k);
        return data;
    }

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public void ShippedModelKeepsStoryShearAndReactionInvariants(string relative)
    {
        var model = ModelReader.ReadFile(RepositoryFiles.ModelPath(relative));
        if (!HasSomethingToSolve(model)) return;   // a comparison-only model has no load case to check
        var r = LinearStaticAnalysis.Run(model);
        AssertInvariants(r, relative);
    }

    [Theory]
    [MemberData(nameof(TestModelNames))]
    public void TestModelKeepsStoryShearAndReactionInvariants(string name)
    {
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(TestModelsWithLevels[name](), "test.json"));
        Assert.True(r.Model.Building.Levels.Count >= 2, $"{name}: a test model with levels");
        AssertInvariants(r, name);
    }

    private static bool HasSomethingToSolve(StructureModel m) => m.LoadCases.Count > 0 && (m.Nodes.Count > 0 || m.Panels.Count > 0);

    /// <summary>Both invariants on one solved model.</summary>
    internal static void AssertInvariants(AnalysisResult r, string name)
    {
        var model = r.Model;   // with a generated seismic case filled in
        var stories = StoryAnalysis.All(r);
        for (int ci = 0; ci < r.Cases.Count; ci++)
        {
            var c = r.Cases[ci];
            var (ax, ay, scale) = AppliedTotal(model, c);
            foreach (var s in stories[ci].Stories)
            {
                double expected = LoadAbove(model, c, s.CutElevation);
                double tol = 1e-9 * Math.Max(scale, 1e-300);
                Assert.True(Math.Abs(s.Shear - expected) <= tol,
                    $"{name}, case {c.Id}, story {s.Index}: story shear {s.Shear:R} N, load above the cut at y = {s.CutElevation} m {expected:R} N (statics)");
                Assert.True(Math.Abs(s.Lines.Sum(l => l.Shear) - s.Shear) <= tol, $"{name}, case {c.Id}, story {s.Index}: the lines' shears add up to the story shear");
            }
        }
        AssertFilesBalance(r, name);
    }

    /// <summary>
    /// Σ reactions read back from reactions.csv and from results.json (frame supports and panel bases) against the
    /// loads as written: Σ Rx = −Σ fx and Σ Ry = −Σ fy per case, to 1e-9 of Σ|load| (derived: global equilibrium).
    /// </summary>
    private static void AssertFilesBalance(AnalysisResult r, string name)
    {
        var u = r.Model.Units;
        var files = ResultFiles.Render(ModelRun.Run(r.Model)).ToDictionary(f => f.Name, f => f.Text);
        var csv = new Dictionary<string, (double Fx, double Fy)>();
        foreach (var line in files["reactions.csv"].Split('\n').Skip(1).Where(l => l.Length > 0))
        {
            var cells = SplitCsv(line);
            var (fx, fy) = csv.GetValueOrDefault(cells[0]);
            csv[cells[0]] = (fx + double.Parse(cells[2], CultureInfo.InvariantCulture), fy + double.Parse(cells[3], CultureInfo.InvariantCulture));
        }
        var json = JObject.Parse(files["results.json"]);
        var jcases = (JArray)json["cases"]!;
        for (int ci = 0; ci < r.Cases.Count; ci++)
        {
            var c = r.Cases[ci];
            var (ax, ay, scale) = AppliedTotal(r.Model, c);
            double Ax = u.FromSI(ax, Quantity.Force), Ay = u.FromSI(ay, Quantity.Force), tol = 1e-9 * Math.Max(u.FromSI(scale, Quantity.Force), 1e-300);
            var (cx, cy) = csv.GetValueOrDefault(c.Id);
            Assert.True(Math.Abs(cx + Ax) <= tol && Math.Abs(cy + Ay) <= tol,
                $"{name}, case {c.Id}: reactions.csv sums to ({cx:R}, {cy:R}), applied loads ({Ax:R}, {Ay:R}) {u.ForceSymbol}");
            var jc = (JObject)jcases[ci];
            Assert.Equal(c.Id, (string)jc["id"]!);
            var all = ((JArray)jc["reactions"]!).Concat((JArray?)jc["panelBaseReactions"] ?? []).ToList();
            double jx = all.Sum(x => (double)x["Fx"]!), jy = all.Sum(x => (double)x["Fy"]!);
            Assert.True(Math.Abs(jx + Ax) <= tol && Math.Abs(jy + Ay) <= tol,
                $"{name}, case {c.Id}: results.json reactions sum to ({jx:R}, {jy:R}), applied loads ({Ax:R}, {Ay:R}) {u.ForceSymbol}");
        }
    }

    /// <summary>One CSV record split into fields (RFC 4180 quoting).</summary>
    private static List<string> SplitCsv(string line)
    {
        var cells = new List<string>();
        var sb = new System.Text.StringBuilder();
        bool quoted = false;
        for (int i = 0; i < line.Length; i++)
        {
            char ch = line[i];
            if (quoted)
            {
                if (ch == '"' && i + 1 < line.Length && line[i + 1] == '"') { sb.Append('"'); i++; }
                else if (ch == '"') quoted = false;
                else sb.Append(ch);
            }
            else if (ch == '"') quoted = true;
            else if (ch == ',') { cells.Add(sb.ToString()); sb.Clear(); }
            else sb.Append(ch);
        }
        cells.Add(sb.ToString());
        return cells;
    }

    /// <summary>The load cases that make up a case (factor 1) or a combination (with their factors).</summary>
    private static IEnumerable<(int Case, double Factor)> Parts(StructureModel m, CaseResult c) => c.IsCombination
        ? m.Combinations.First(x => x.Id == c.Id).Factors
        : [(m.LoadCases.ToList().FindIndex(x => x.Id == c.Id), 1.0)];

    /// <summary>
    /// Global x and y components (N/m) of a member load of intensity w at the start and end (derived from the load's
    /// axes: a global load acts in its own direction; a local axial load along (cos α, sin α), a local transverse load
    /// along (−sin α, cos α)).
    /// </summary>
    private static (double X, double Y) Direction(StructureModel m, MemberLoad ml)
    {
        var mem = m.Members[ml.Member];
        var a = m.Nodes[mem.Start];
        var b = m.Nodes[mem.End];
        double len = Math.Sqrt((b.X - a.X) * (b.X - a.X) + (b.Y - a.Y) * (b.Y - a.Y)), cos = (b.X - a.X) / len, sin = (b.Y - a.Y) / len;
        if (ml.Axes == LoadAxes.Global) return ml.Direction == 0 ? (1, 0) : (0, 1);
        return ml.Direction == 0 ? (cos, sin) : (-sin, cos);
    }

    /// <summary>
    /// Resultant of a member load over the part of the member above height y (N, x and y): the intensity is linear
    /// along the axis, so its integral over [s0, s1] is (s1 − s0)·(w(s0) + w(s1))/2 (derived).
    /// </summary>
    private static (double X, double Y) MemberLoadAbove(StructureModel m, MemberLoad ml, double y)
    {
        var mem = m.Members[ml.Member];
        var a = m.Nodes[mem.Start];
        var b = m.Nodes[mem.End];
        double len = Math.Sqrt((b.X - a.X) * (b.X - a.X) + (b.Y - a.Y) * (b.Y - a.Y));
        double W(double s) => ml.WStart + (ml.WEnd - ml.WStart) * s / len;
        double s0, s1;
        if (a.Y == b.Y) { if (a.Y <= y) return (0, 0); s0 = 0; s1 = len; }
        else
        {
            double sc = Math.Clamp((y - a.Y) / (b.Y - a.Y), 0, 1) * len;
            (s0, s1) = b.Y > a.Y ? (sc, len) : (0, sc);
        }
        double total = (s1 - s0) * 0.5 * (W(s0) + W(s1));
        var (dx, dy) = Direction(m, ml);
        return (total * dx, total * dy);
    }

    /// <summary>
    /// The horizontal load above height y on the structure (N): nodal fx at nodes above y, member loads over the parts
    /// of members above y, story forces of linked wall panels at levels above y, and the x reactions of supports above
    /// y (a support above the cut loads the part above it like any other force).
    /// </summary>
    private static double LoadAbove(StructureModel m, CaseResult c, double y)
    {
        double sum = 0;
        foreach (var (ci, f) in Parts(m, c))
        {
            var lc = m.LoadCases[ci];
            foreach (var nl in lc.NodalLoads) if (m.Nodes[nl.Node].Y > y) sum += f * nl.Fx;
            foreach (var ml in lc.MemberLoads) sum += f * MemberLoadAbove(m, ml, y).X;
            foreach (var p in m.Panels.Where(p => p.Links.Count > 0))
                foreach (var pl in p.Loads.Where(l => l.Case == ci)) if (p.Y0 + pl.Level > y) sum += f * pl.Fx;
        }
        foreach (var re in c.Reactions) if (m.Nodes[re.Node].Y > y) sum += re.Fx;
        return sum;
    }

    /// <summary>Σ fx, Σ fy of every load of a case (frame and all panels) and Σ|f|, its scale (N).</summary>
    private static (double Fx, double Fy, double Scale) AppliedTotal(StructureModel m, CaseResult c)
    {
        double fx = 0, fy = 0, scale = 0;
        foreach (var (ci, f) in Parts(m, c))
        {
            var lc = m.LoadCases[ci];
            foreach (var nl in lc.NodalLoads) { fx += f * nl.Fx; fy += f * nl.Fy; scale += Math.Abs(f) * (Math.Abs(nl.Fx) + Math.Abs(nl.Fy)); }
            foreach (var ml in lc.MemberLoads)
            {
                var (x, y) = MemberLoadAbove(m, ml, double.NegativeInfinity);
                fx += f * x; fy += f * y; scale += Math.Abs(f) * (Math.Abs(x) + Math.Abs(y));
            }
            foreach (var p in m.Panels)
                foreach (var pl in p.Loads.Where(l => l.Case == ci)) { fx += f * pl.Fx; fy += f * pl.Fy; scale += Math.Abs(f) * (Math.Abs(pl.Fx) + Math.Abs(pl.Fy)); }
        }
        return (fx, fy, scale);
    }

    /// <summary>
    /// The shipped masonry wall tied to the frame, with story forces of its own on the wall (spread along its floor and
    /// its top) and declared on the frame's line, so one line holds members and a panel.
    /// </summary>
    internal static JObject LinkedWallWithOwnLoads()
    {
        var m = JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("panels/masonry-wall-and-frame.json")));
        var panel = (JObject)m["panels"]![0]!;
        panel["line"] = "frame";
        panel["storyForces"] = JArray.FromObject(new object[]
        {
            new { @case = "E", level = 144.0, fx = 3.0, path = "spread" },
            new { @case = "E", level = "top", fx = 4.5, fy = -2.0, path = "spread" },
            new { @case = "D", level = "top", fy = -30.0, path = "spread" },
        });
        return m;
    }
}
