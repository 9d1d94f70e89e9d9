using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Tests.Input;
using static PlaneLateral.Tests.CliRun;

namespace PlaneLateral.Tests.Plan;

/// <summary>The shipped warehouse with a semi-rigid roof through the command line and the library (common practice: tables fit 100 columns; equilibrium in plan).</summary>
public sealed class DiaphragmCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-floors-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task TheWarehouseShowsTheFlexibilityTestAndTheEnvelopeWithinAHundredColumns()
    {
        string model = RepositoryFiles.ModelPath("plan/long-warehouse.json");
        var (code, stdout, stderr) = await Task.Run(() => Run("solve", model, "--out", _dir)).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.True(code == 0, stderr);
        foreach (var line in stdout.Split('\n').Where(l => !l.StartsWith("File ") && !l.StartsWith("Results written")))
            Assert.True(line.Length <= 100, $"{line.Length} columns: {line}");
        Assert.Contains("Floor flexibility test", stdout);
        Assert.Contains("Line shear envelope, loads NS", stdout);
        var csv = await File.ReadAllLinesAsync(Path.Combine(_dir, "plan-shear-envelope.csv")).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.StartsWith("case,story,line,rigid [kip],semi-rigid [kip],flexible [kip],envelope [kip],governing", csv[0]);
        Assert.True(File.Exists(Path.Combine(_dir, "plan-floor-flexibility.csv")));
        var json = JObject.Parse(await File.ReadAllTextAsync(Path.Combine(_dir, "plan.json")).WaitAsync(TimeSpan.FromSeconds(60)));
        Assert.Equal("semi-rigid", (string?)json["floors"]!["kinds"]![0]!["kind"]);
        Assert.NotEmpty((JArray)json["floors"]!["envelope"]!);
    }

    [Fact]
    public async Task TheWarehouseIsInEquilibriumUnderEveryIdealisation()
    {
        // Derived (statics): Σ line forces = applied, every case; each idealisation's line shears add up to the story shear.
        var r = await Task.Run(() => PlanAnalysis.Run(ModelReader.ReadPlanFile(RepositoryFiles.ModelPath("plan/long-warehouse.json")))).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.All(r.Cases, c => Assert.True(c.Equilibrium.RelativeError < 1e-10, c.Case.Id));
        var d = r.Diaphragms!;
        Assert.Equal(["rigid", "semi-rigid", "flexible"], d.Variants);
        foreach (var c in r.Cases)
        {
            double vy = c.Stories[0].Vy, vx = c.Stories[0].Vx;
            foreach (var pick in new Func<LineShearEnvelope, double>[] { e => e.Rigid, e => e.SemiRigid, e => e.Flexible })
            {
                double sx = 0, sy = 0;
                foreach (var e in d.Envelope.Where(e => e.Case == c.Case.Id))
                {
                    var line = r.Plan.Lines.First(l => l.Id == e.Line);
                    sx += line.Cos * pick(e); sy += line.Sin * pick(e);
                }
                Assert.Equal(vx / 1e3, sx / 1e3, 6);
                Assert.Equal(vy / 1e3, sy / 1e3, 6);
            }
        }
        Assert.Equal(4, d.Flexibility.Count);
    }

    /// <summary>
    /// The demo building with its roof switched to a semi-rigid steel deck (the worked snippet of docs/plan.md, "Floors
    /// that bend"): effective E·t·I of the perimeter chords and G·t of the deck, the response spectrum removed (refused
    /// beside a floor that bends).
    /// </summary>
    private string DemoWithASemiRigidRoof(bool keepSpectrum = false)
    {
        var demo = JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("demo-building.json")));
        demo.Remove("$schema");
        var roof = (JObject)demo["plan"]!["levels"]![3]!;
        Assert.Equal("L3", (string?)roof["id"]);
        roof["floor"] = JObject.Parse("""{ "kind": "semi-rigid", "thickness": 1, "E": 37600, "G": 600, "shearFactor": 1 }""");
        if (!keepSpectrum) ((JObject)demo["plan"]!["seismic"]!).Remove("responseSpectrum");
        string path = Path.Combine(_dir, keepSpectrum ? "demo-roof-spectrum.json" : "demo-roof.json");
        File.WriteAllText(path, demo.ToString());
        return path;
    }

    [Fact]
    public async Task TheDemoWithASemiRigidRoofShowsMddOverAdveItsClassAndTheEnvelope()
    {
        string model = DemoWithASemiRigidRoof();
        string outDir = Path.Combine(_dir, "out");
        var (code, stdout, stderr) = await Task.Run(() => Run("solve", model, "--out", outDir)).WaitAsync(TimeSpan.FromSeconds(120));
        Assert.True(code == 0, stderr);
        Assert.Contains("Floors in plan: L1 rigid, L2 rigid, L3 semi-rigid", stdout);
        Assert.Contains("Floor flexibility test", stdout);
        Assert.Contains("MDD/ADVE", stdout);
        Assert.Contains("L3, loads along y: largest MDD/ADVE", stdout);
        Assert.Contains("by eq. 12.3-1", stdout);
        Assert.Contains("Line shear envelope, loads EY", stdout);
        Assert.Contains("Line shear envelope, loads E (E-x", stdout);   // the ELF cases too
        Assert.Contains("Hand tributary split beside the FE flexible floor, case EY", stdout);
        Assert.Contains("modes of the rigid-floor model", File.ReadAllText(Path.Combine(outDir, "plan-elf.csv")) + stdout);
        var json = JObject.Parse(await File.ReadAllTextAsync(Path.Combine(outDir, "plan.json")).WaitAsync(TimeSpan.FromSeconds(60)));
        var floors = json["floors"]!;
        Assert.Equal(["rigid", "semi-rigid", "flexible"], floors["idealisations"]!.Select(t => (string)t!).ToArray());
        Assert.Contains(floors["flexibility"]!, t => (string?)t["level"] == "L3" && (string?)t["loading"] == "y" && t["ratio"]!.Type == JTokenType.Float);
        Assert.All(floors["envelope"]!, t => Assert.NotNull(t["handTributary"]));
        var csv = await File.ReadAllLinesAsync(Path.Combine(outDir, "plan-shear-envelope.csv")).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.Equal("case,story,line,rigid [kip],semi-rigid [kip],flexible [kip],envelope [kip],governing,hand tributary [kip],flexible/hand - 1,gap cause", csv[0]);
        Assert.True(File.Exists(Path.Combine(outDir, "plan-floor-L3-EY.png")));
        Assert.True(File.Exists(Path.Combine(outDir, "plan-floor-shares-story1-EY.png")));
    }

    [Fact]
    public async Task TheDemoWithASemiRigidRoofKeepsEveryStaticsCheck()
    {
        // Derived (statics): Σ line forces = applied (ΣFx, ΣFy, ΣMz) in every case, the ELF cases included; in every story
        // the lines' shears add up to the story force above the cut, for the floors as given and each idealisation.
        string model = DemoWithASemiRigidRoof();
        var (r, seismic) = await Task.Run(() => PlanSeismic.Run(ModelReader.ReadPlanFile(model))).WaitAsync(TimeSpan.FromSeconds(120));
        Assert.NotNull(seismic);
        Assert.Null(seismic!.Spectrum);
        Assert.Contains(r.Cases, c => c.Case.Id == "E-y+ecc");
        foreach (var c in r.Cases)
        {
            Assert.True(c.Equilibrium.RelativeError < 1e-10, $"{c.Case.Id}: {c.Equilibrium.RelativeError:E2}");
            foreach (var st in c.Stories)
            {
                double sx = 0, sy = 0;
                foreach (var ls in c.LineStories.Where(x => x.Story == st.Story))
                {
                    var line = r.Plan.Lines.First(l => l.Id == ls.Line);
                    sx += line.Cos * ls.Shear; sy += line.Sin * ls.Shear;
                }
                Assert.Equal(st.Vx / 1e3, sx / 1e3, 6);
                Assert.Equal(st.Vy / 1e3, sy / 1e3, 6);
                foreach (var pick in new Func<LineShearEnvelope, double>[] { e => e.Rigid, e => e.SemiRigid, e => e.Flexible })
                {
                    double ex = 0, ey = 0;
                    foreach (var e in r.Diaphragms!.Envelope.Where(e => e.Case == c.Case.Id && e.Story == st.Story))
                    {
                        var line = r.Plan.Lines.First(l => l.Id == e.Line);
                        ex += line.Cos * pick(e); ey += line.Sin * pick(e);
                    }
                    Assert.Equal(st.Vx / 1e3, ex / 1e3, 6);
                    Assert.Equal(st.Vy / 1e3, ey / 1e3, 6);
                }
            }
        }
        // The hand tributary split carries the same story force (derived: the strips cover the floor).
        var hand = PlaneLateral.Studies.PlanTributarySplit.Run(r);
        foreach (var g in hand.GroupBy(h => (h.Case, h.Story)))
        {
            var st = r.Case(g.Key.Case).Stories[g.Key.Story - 1];
            double hx = 0, hy = 0;
            foreach (var h in g) { var line = r.Plan.Lines.First(l => l.Id == h.Line); hx += line.Cos * h.Hand; hy += line.Sin * h.Hand; }
            Assert.Equal(st.Vx / 1e3, hx / 1e3, 6);
            Assert.Equal(st.Vy / 1e3, hy / 1e3, 6);
        }
    }

    [Fact]
    public void TheResponseSpectrumBesideAFloorThatBendsIsRefusedWithAFix()
    {
        // Common practice: a clear error at the key, with a fix.
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ReadPlanFile(DemoWithASemiRigidRoof(keepSpectrum: true)));
        var d = Assert.Single(e.Diagnostics, x => x.Problem.Contains("response spectrum analysis cannot yet be used with the semi-rigid floor of level \"L3\"", StringComparison.Ordinal));
        Assert.Equal("$.plan.seismic.responseSpectrum", d.JsonPath);
        Assert.Contains("remove \"responseSpectrum\"", d.Fix);
    }
}
