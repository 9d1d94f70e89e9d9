using PlaneLateral.Analysis;
using PlaneLateral.Cli;
using static PlaneLateral.Tests.CliRun;
using PlaneLateral.Model;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Seismic;

/// <summary>The shipped demo's seismic block end to end: tables printed, files written, bad input writes nothing (common practice).</summary>
public sealed class SeismicCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-seismic-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void DemoPrintsAndWritesTheSeismicTables()
    {
        string outDir = Path.Combine(_dir, "r");
        var (code, stdout, stderr) = Run("solve", CliApp.DemoModelPath, "--out", outDir);
        Assert.True(code == 0, stderr);
        foreach (var heading in new[] { "Periods", "Rayleigh", "Ta = Ct·hn^x", "Story forces, case \"E-forces\"", "Second-order effects", "Drift check on the second-order drift", "confirm the edition" })
            Assert.Contains(heading, stdout);
        foreach (var f in new[] { "periods.csv", "story-forces.csv", "second-order.csv", "seismic.json" })
            Assert.True(new FileInfo(Path.Combine(outDir, f)).Length > 0, f);
        Assert.Contains("caution", File.ReadAllText(Path.Combine(outDir, "seismic.json")));
    }

    [Fact]
    public void TwoRunsWriteTheSameBytes()
    {
        string a = Path.Combine(_dir, "a"), b = Path.Combine(_dir, "b");
        Assert.Equal(0, Run("solve", CliApp.DemoModelPath, "--out", a).Code);
        Assert.Equal(0, Run("solve", CliApp.DemoModelPath, "--out", b).Code);
        foreach (var f in new[] { "periods.csv", "story-forces.csv", "second-order.csv", "seismic.json" })
            Assert.Equal(File.ReadAllBytes(Path.Combine(a, f)), File.ReadAllBytes(Path.Combine(b, f)));
    }

    [Fact]
    public void DemoStoryForcesAddUpToTheBaseShear()
    {
        // Demo: S_DS = 0.8, R = 5, I_e = 1.25 → C_s = 0.8/4 = 0.2 unless the period is long (it is short: k = 1);
        // W = 200 + 200 + 160 = 560 kip → V = 112 kip; C_vx ∝ w·h = 200·156, 200·312, 160·468 = 31200, 62400, 74880 of
        // 168480 (derived by hand; holds while T ≤ 0.5 s, which the test asserts first).
        var r = LinearStaticAnalysis.Run(ModelReader.ReadFile(CliApp.DemoModelPath));
        AssertChecks(r);
        var s = SeismicResult.Of(r)!;
        Assert.True(s.Forces.PeriodUsed <= 0.5, "short period: k = 1");
        Near(0.2, s.Forces.Cs, 1e-12, "C_s = S_DS/(R/I_e)");
        var u = r.Model.Units;
        Near(112, u.FromSI(s.Forces.BaseShear, Quantity.Force), 1e-12, "V");
        double[] f = [112 * 31200 / 168480.0, 112 * 62400 / 168480.0, 112 * 74880 / 168480.0];
        for (int i = 0; i < 3; i++) Near(f[i], u.FromSI(s.Forces.LevelForces[i + 1], Quantity.Force), 1e-12, $"F at L{i + 1}");
        Near(112, u.FromSI(s.Stories.Stories[0].Shear, Quantity.Force), 1e-9, "base story shear = V (statics)");
        // P_x of story 1: the gravity "D+G" is 0.12 kip/in on 6 beams of 300 in (216 kip) plus G's 190 + 190 + 145 kip
        // at the nodes = 741 kip (derived from the demo file).
        Near(741, u.FromSI(s.Stability[0].Px, Quantity.Force), 1e-9, "P_x, story 1");
        Assert.All(s.Stability, x => Assert.True(x.Ratio > 1, "gravity compression softens: second-order drift is larger"));
    }

    [Fact]
    public void BucklingGravityIsRefusedAndNothingIsWritten()
    {
        var json = Newtonsoft.Json.Linq.JObject.Parse(File.ReadAllText(CliApp.DemoModelPath));
        var g = (Newtonsoft.Json.Linq.JArray)json["loadCases"]!.First(c => (string)c["id"]! == "G")["nodalLoads"]!;
        foreach (var l in g) l["fy"] = (double)l["fy"]! * 1e4;
        string model = Path.Combine(_dir, "buckles.json"), outDir = Path.Combine(_dir, "out");
        File.WriteAllText(model, json.ToString());
        var (code, _, stderr) = Run("solve", model, "--out", outDir);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("buckles the structure", stderr);
        Assert.Contains("story", stderr);
        Assert.False(Directory.Exists(outDir), "nothing written");
    }
}
