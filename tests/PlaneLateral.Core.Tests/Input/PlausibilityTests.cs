using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Cli;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// Plausibility warnings (Model/Plausibility.cs): a value outside the range of building materials and buildings in the
/// units in force, and the slips an engineer makes, each by its own test; none on a shipped model that is right; none
/// changes the answer. The ranges are common practice (E of steel 29,000 ksi, concrete 3,000-6,000 ksi, masonry
/// 1,000-3,000 ksi, timber about 1,500 ksi; story heights 8-30 ft), stated in docs/model-format.md.
/// </summary>
public sealed class PlausibilityTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-plausible-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string Repo => StrictInputTests.Repo();

    private static JObject Load(string relative) => JObject.Parse(File.ReadAllText(Path.Combine(Repo, relative)));

    private static StructureModel Read(JObject o) => ModelReader.Parse(o.ToString(), "plausible.json");

    private static ModelWarning One(StructureModel m, string fragment)
    {
        var hits = m.Warnings.Where(w => w.Problem.Contains(fragment, StringComparison.Ordinal)).ToList();
        Assert.True(hits.Count == 1, $"expected one warning with \"{fragment}\", got:\n{string.Join("\n", m.Warnings)}");
        Assert.True(hits[0].Line > 0 && hits[0].Column > 0, "a warning names its line and column");
        Assert.False(string.IsNullOrWhiteSpace(hits[0].Fix));
        return hits[0];
    }

    public static TheoryData<string> ShippedModels()
    {
        var data = new TheoryData<string>();
        // Every shipped file: planar models through the planar reader, building files (docs/plan.md) through the plan
        // reader, which runs the planar checks on each line's model and its own on the building file.
        foreach (var f in Directory.GetFiles(Path.Combine(StrictInputTests.Repo(), "models"), "*.json", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
            data.Add(Path.GetRelativePath(StrictInputTests.Repo(), f));
        return data;
    }

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public void NoShippedModelWarns(string relative)
    {
        string path = Path.Combine(Repo, relative);
        var warnings = ModelReader.IsPlanFile(path) ? ModelReader.ReadPlanFile(path).Warnings : ModelReader.ReadFile(path).Warnings;
        Assert.True(warnings.Count == 0, $"{relative}:\n{string.Join("\n", warnings)}");
    }

    // ---- buildings in plan -----------------------------------------------------------------------------------------

    private static IReadOnlyList<ModelWarning> PlanWarnings(JObject building) => ModelReader.ParsePlan(building.ToString(), Path.Combine(Repo, "models", "plausible-building.json")).Warnings;

    [Fact]
    public void ABuildingWithoutUnitsSaysSoAndItsStoryHeightsAndPlanSizeAreJudged()
    {
        // The demo building (kip–ft) with its "units" left out (and its inline lines' too, so that their levels still
        // match): read as kip–inch, its 14 ft stories become 14 in (0.36 m, below the 1.8 m floor of building stories)
        // and its plan a few feet become inches (derived: × 0.0254 m/in).
        var o = Load("models/demo-building.json");
        o.Remove("units");
        foreach (var l in ((JArray)o["plan"]!["lines"]!).OfType<JObject>()) (l["model"] as JObject)?.Remove("units");
        var w = PlanWarnings(o);
        Assert.Contains(w, x => x.Problem.Contains("building file has no \"units\" key") && x.JsonPath == "$");
        // The story height and the building's E are both out of range as kip–inch and both in range as kip–ft, so the
        // fix names kip and ft.
        Assert.Contains(w, x => x.Problem.Contains("the height of the story below level") && x.Line > 0 && x.Fix.Contains("\"force\": \"kip\", \"length\": \"ft\""));
        Assert.Contains(w, x => x.Problem.StartsWith("E of material", StringComparison.Ordinal) && x.JsonPath.StartsWith("$.materials", StringComparison.Ordinal));
    }

    [Fact]
    public void ABuildingPlanGivenInTheWrongLengthUnitWarnsOnItsSize()
    {
        // The demo's outline multiplied by 1000 (as if given in mm in a kip–ft file): 96 000 ft is no building.
        var o = Load("models/demo-building.json");
        var outline = o["plan"]!["outline"] as JArray ?? ((JArray)o["plan"]!["levels"]!).OfType<JObject>().Select(l => l["outline"]).OfType<JArray>().First();
        foreach (var pt in outline.OfType<JArray>()) { pt[0] = (double)pt[0]! * 1000; pt[1] = (double)pt[1]! * 1000; }
        foreach (var l in ((JArray)o["plan"]!["lines"]!).OfType<JObject>())
            if (l["at"] is JArray at) { at[0] = (double)at[0]! * 1000; at[1] = (double)at[1]! * 1000; }
        var w = PlanWarnings(o);
        Assert.Contains(w, x => x.Problem.Contains("the plan's largest dimension") && x.Problem.Contains("above the range of buildings"));
    }

    [Fact]
    public void ABuildingWallWithThicknessAndLengthSwappedWarns()
    {
        var o = Load("models/demo-building.json");
        var wall = (JObject)((JArray)o["plan"]!["lines"]!).OfType<JObject>().First(l => l["wall"] is JObject)["wall"]!;
        (wall["length"], wall["thickness"]) = (wall["thickness"]!.DeepClone(), wall["length"]!.DeepClone());
        var w = PlanWarnings(o);
        Assert.Contains(w, x => x.Problem.Contains("look swapped") && x.JsonPath.StartsWith("$.plan.lines[", StringComparison.Ordinal));
    }

    [Fact]
    public void ALineModelOfABuildingGetsThePlanarChecks()
    {
        // A line given as a planar model inside the building: its E set in psi instead of ksi is judged in the line's own
        // units, and the warning names the line.
        var o = Load("models/demo-building.json");
        var line = ((JArray)o["plan"]!["lines"]!).OfType<JObject>().First(l => l["model"] is JObject);
        var mat = (JObject)((JArray)line["model"]!["materials"]!)[0];
        mat["E"] = (double)mat["E"]! * 1000 * 144;   // ksf → psf-sized number read as ksf (derived: a factor 144 000 too large)
        var w = PlanWarnings(o);
        Assert.Contains(w, x => x.Problem.StartsWith($"line \"{line["id"]}\": E of material", StringComparison.Ordinal));
    }

    // ---- units -------------------------------------------------------------------------------------------------------

    [Fact]
    public void AnSiModelWithoutUnitsSaysOnceWhichUnitsItAssumedAndNamesTheLikelyOnes()
    {
        // The kN-m cantilever wall of models/verification with its "units" block left out: read as kip and inch.
        var o = Load("models/verification/cantilever-wall-kn-m.json");
        o.Remove("units");
        var m = Read(o);
        var units = One(m, "no \"units\" key");
        Assert.Contains("kip and inch", units.Problem);
        Assert.Equal("$", units.JsonPath);
        // E = 24 821 126 (kN/m², 24.8 GPa, concrete) read as ksi: 24 821 126 × 6.894757 MPa = 1.711E+05 GPa (derived;
        // 1 ksi = 6.894757 MPa, NIST SP 811).
        var e = One(m, "E of material");
        Assert.Equal("$.materials[0].E", e.JsonPath);
        Assert.Contains("read as kip/in² is 1.711E+05 GPa", e.Problem);
        Assert.Contains("in kN and m (kN/m²) it would be 24.82 GPa, concrete or masonry", e.Problem);
        // Height 3.6576 read as inches: 92.9 mm (derived: × 25.4 mm), not a building.
        var size = One(m, "largest dimension");
        Assert.Contains("92.9 mm", size.Problem);
        // kN and m make every flagged value plausible, so every units fix names them.
        Assert.All(new[] { e, size }, w => Assert.Contains("\"force\": \"kN\", \"length\": \"m\"", w.Fix));
    }

    [Fact]
    public void TheIssuesModulusReadsAsKsiAndWouldBeConcreteInNewtonsAndMetres()
    {
        // E = 2.5E10 read as ksi; in N and m, 2.5E10 Pa = 25 GPa, concrete (derived; 3,000-6,000 ksi = 21-41 GPa, common practice).
        var o = ToJObject(Cantilever(144, 10, new { id = "S", shape = "rectangle", b = 12.0, d = 120.0 }, new { id = "MAT", E = 2.5e10, nu = 0.2 }));
        o.Remove("units");
        var w = One(Read(o), "E of material");
        Assert.Contains("E of material \"MAT\" = 2.5E+10 read as kip/in²", w.Problem);
        Assert.Contains("in N and m (N/m²) it would be 25 GPa, concrete or masonry", w.Problem);
    }

    [Fact]
    public void WarningsNeverChangeTheAnswer()
    {
        // A kip-in cantilever whose E is 1000 times too high (3,605,000 ksi): it warns, and it is solved as written.
        // Derived (Timoshenko cantilever): Δ = P L³/(3 E I) + P L/(G A/1.2), with I = b d³/12, G = E/(2(1+ν)).
        double e = 3.605e6, nu = 0.2, b = 12, d = 120, L = 144, P = 10;
        var m = Read(ToJObject(Cantilever(L, P, new { id = "S", shape = "rectangle", b, d }, new { id = "MAT", E = e, nu })));
        One(m, "E of material");
        var r = LinearStaticAnalysis.Run(m);
        double i = b * d * d * d / 12, g = e / (2 * (1 + nu));
        double expected = P * L * L * L / (3 * e * i) + P * L / (g * b * d / 1.2);
        int top = m.NodeIndex("N1");
        Near(expected, m.Units.FromSI(r.Cases[0].Displacement(top, Dof.X), Quantity.Length), 1e-9, "top displacement, in");
    }

    [Fact]
    public void AStoryHeightOutsideTheRangeOfBuildingsNamesItsLevel()
    {
        // The demo in kip and inch, declared in feet: 156 ft stories (47.5 m), above the 15 m of the range.
        var o = Load("models/demo-clinic.json");
        o["units"] = JObject.Parse("{\"force\": \"kip\", \"length\": \"ft\"}");
        var w = One(Read(o), "the height of the story below level \"L1\"");
        Assert.Equal("$.levels[1].elevation", w.JsonPath);
        Assert.Contains("= 156 read as ft is 47.55 m", w.Problem);   // 156 × 0.3048 m (derived)
        Assert.Contains("in in it would be 3.962 m", w.Problem);     // 156 × 0.0254 m (derived)
    }

    [Fact]
    public void ASectionAreaOutsideTheRangeOfMembersIsNamed()
    {
        // A = 0.01 and I = 1e-4 (an SI section) read in inches: 6.45 mm² and 4.2E-11 m⁴, below any building member.
        var o = ToJObject(Cantilever(144, 10, new { id = "S", shape = "general", A = 0.01, I = 1e-4 }, new { id = "MAT", E = 29000.0, nu = 0.3 }));
        var m = Read(o);
        Assert.Equal("$.sections[0].A", One(m, "A of section \"S\"").JsonPath);
        Assert.Equal("$.sections[0].I", One(m, "I of section \"S\"").JsonPath);
    }

    [Fact]
    public void ALevelWeightOutsideTheRangeOfFloorsIsNamed()
    {
        // 200 kip per level written as 2e8: 8.9E+08 kN, above 10⁶ kN.
        var o = Load("models/demo-clinic.json");
        o["seismic"]!["weights"]![0]!["weight"] = 2e8;
        Assert.Equal("$.seismic.weights[0].weight", One(Read(o), "the weight of level \"L1\"").JsonPath);
    }

    // ---- slips -------------------------------------------------------------------------------------------------------

    [Fact]
    public void AWallRectangleWithThicknessAndLengthSwappedWarns()
    {
        var o = Load("models/demo-clinic.json");
        var s = o["sections"]![0]!;
        (s["b"], s["d"]) = (s["d"]!.DeepClone(), s["b"]!.DeepClone());
        var w = One(Read(o), "b and d look swapped");
        Assert.Equal("$.sections[0].b", w.JsonPath);
        // Derived: I = b d³/12, so swapping b = 12 and d = 240 divides I by (240/12)² = 400.
        Assert.Contains("400 times too flexible", w.Problem);
    }

    [Fact]
    public void APanelThickerThanItIsLongWarns()
    {
        var o = Load("models/panels/two-story-wall.json");
        var p = (JObject)o["panels"]![0]!;
        p.Remove("openings");
        p["length"] = 0.2;
        p["thickness"] = 6;
        Assert.Equal("$.panels[0].thickness", One(Read(o), "thickness and length look swapped").JsonPath);
    }

    [Fact]
    public void ABeamDeeperThanItsStoryWarns()
    {
        // W21X44 given as 207 in deep (a slipped decimal): deeper than the 156 in story below the beams.
        var o = Load("models/demo-clinic.json");
        o["sections"]![2]!["d"] = 207.0;
        var w = One(Read(o), "does not fit the story");
        Assert.Equal("$.sections[2].d", w.JsonPath);
        Assert.Contains("(156 in)", w.Problem);
    }

    [Fact]
    public void ALevelFarFromItsNodesWarns()
    {
        // Level L2 lists the nodes at y = 312 in but says elevation 250 in: the drift ratios would use 94 in and 218 in
        // stories where the columns are 156 in long.
        var o = Load("models/demo-clinic.json");
        var ids = o["nodes"]!.Where(n => (double)n["y"]! == 312.0).Select(n => (string)n["id"]!).ToArray();
        var level = (JObject)o["levels"]![2]!;
        level["elevation"] = 250.0;
        level["nodes"] = new JArray(ids);
        var w = One(Read(o), "is at elevation 250 in but its nodes stand at y = 312 in");
        Assert.Equal("$.levels[2].elevation", w.JsonPath);
    }

    [Fact]
    public void ALoadCaseWithNoLoadWarns()
    {
        var o = Load("models/demo-clinic.json");
        ((JArray)o["loadCases"]!).Add(JObject.Parse("{\"id\": \"L\", \"description\": \"live (to do)\", \"nodalLoads\": []}"));
        var w = One(Read(o), "load case \"L\" has no load");
        Assert.Equal("$.loadCases[4]", w.JsonPath);
    }

    [Fact]
    public void ALoadCaseOfZerosWarnsToo()
    {
        var o = Load("models/demo-clinic.json");
        foreach (var l in o["loadCases"]![0]!["nodalLoads"]!) l["fx"] = 0.0;
        One(Read(o), "load case \"W\" has no load");
    }

    [Fact]
    public void ALateralCaseWithNoLateralLoadWarns()
    {
        // Wind written as fy instead of fx.
        var o = Load("models/demo-clinic.json");
        foreach (var l in o["loadCases"]![0]!["nodalLoads"]!) { l["fy"] = l["fx"]; ((JObject)l).Remove("fx"); }
        var w = One(Read(o), "load case \"W\" is named as a lateral case but has no lateral (x) load");
        Assert.Equal("$.loadCases[0]", w.JsonPath);
    }

    [Fact]
    public void ADriftCheckOnAGravityCaseWarns()
    {
        var o = Load("models/demo-clinic.json");
        o["driftChecks"]![1]!["cases"] = new JArray("W", "D");
        var w = One(Read(o), "lists \"D\", which has no lateral load (a gravity case)");
        Assert.Equal("$.driftChecks[1].cases[1]", w.JsonPath);
    }

    [Fact]
    public void AWindCaseUnderTheSeismicDriftEquationWarns()
    {
        // The seismic drift check (C_d = 5, I_e = 1.25, ASCE 7-16 eq. 12.8-15, and the allowable drift of Table 12.12-1)
        // given the wind case.
        var o = Load("models/demo-clinic.json");
        o["driftChecks"]![0]!["cases"] = new JArray("E", "W");
        var w = One(Read(o), "applies the seismic drift equation to wind case \"W\"");
        Assert.Equal("$.driftChecks[0].cases[1]", w.JsonPath);
        Assert.Contains("C_d = 5 and I_e = 1.25", w.Problem);
    }

    // ---- where warnings go -------------------------------------------------------------------------------------------

    private string SiWithoutUnits()
    {
        var o = Load("models/verification/cantilever-wall-kn-m.json");
        o.Remove("units");
        o.Remove("$schema");
        string path = Path.Combine(_dir, "si-without-units.json");
        File.WriteAllText(path, o.ToString());
        return path;
    }

    [Fact]
    public void WarningsGoIntoResultsJson()
    {
        var m = ModelReader.ReadFile(SiWithoutUnits());
        var json = JObject.Parse(ResultFiles.Render(ModelRun.Run(m)).Single(f => f.Name == "results.json").Text);
        var warnings = (JArray)json["warnings"]!;
        Assert.Equal(m.Warnings.Count, warnings.Count);
        Assert.Contains(warnings, w => (string)w["path"]! == "$.materials[0].E" && (int)w["line"]! > 0 && ((string)w["problem"]!).Contains("kN and m"));
    }

    [Fact]
    public void WarningsPrintOnValidateSolveAndReportAndAreListedInTheReport()
    {
        string model = SiWithoutUnits();
        foreach (var command in new[] { "validate", "solve", "report" })
        {
            var o = new StringWriter(); var e = new StringWriter();
            string outDir = Path.Combine(_dir, command);
            int code = CliApp.Run(command == "validate" ? [command, model] : [command, model, "--out", outDir], o, e);
            Assert.True(code == ExitCodes.Success, $"{command}: exit {code}\n{o}\n{e}");
            Assert.Contains("warning: the model has no \"units\" key", e.ToString());
            Assert.Contains("at $.materials[0].E: warning: E of material", e.ToString());
            Assert.Single(e.ToString().Split('\n'), l => l.Contains("no \"units\" key"));   // said once
        }
        string report = File.ReadAllText(Directory.GetFiles(Path.Combine(_dir, "report"), "*.md").Single());
        Assert.Contains("Input warnings", report);
        Assert.Contains("$.materials[0].E", report);
    }
}
