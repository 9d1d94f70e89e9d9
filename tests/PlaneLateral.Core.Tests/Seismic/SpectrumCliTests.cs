using PlaneLateral.Tests.Input;
using static PlaneLateral.Tests.CliRun;

namespace PlaneLateral.Tests.Seismic;

/// <summary>The response spectrum and the seismic block in plan through the command line (common practice: tables fit
/// 100 columns, files written, bad input writes nothing).</summary>
public sealed class SpectrumCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-spectrum-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static void Fits(string stdout)
    {
        foreach (var line in stdout.Split('\n').Where(l => !l.StartsWith("File ") && !l.StartsWith("Results written")))
            Assert.True(line.Length <= 100, $"{line.Length} columns: {line}");
    }

    [Fact]
    public void DemoBuildingShowsModesElfAndTheSpectrumBesideTheElf()
    {
        string outDir = Path.Combine(_dir, "b");
        var (code, stdout, stderr) = Run("solve", RepositoryFiles.ModelPath("demo-building.json"), "--out", outDir);
        Assert.True(code == 0, stderr);
        Fits(stdout);
        foreach (var heading in new[] { "Modes in plan", "Equivalent lateral forces", "Modal response spectrum", "Scaling:", "Δ comb.", "Modal drift check" })
            Assert.Contains(heading, stdout);
        foreach (var f in new[] { "plan-modes.csv", "plan-elf.csv", "plan-spectrum-stories.csv", "plan-spectrum-lines.csv", "plan-spectrum-modes.csv", "plan-seismic.json" })
            Assert.True(new FileInfo(Path.Combine(outDir, f)).Length > 0, f);
        Assert.Contains("E-y+ecc", File.ReadAllText(Path.Combine(outDir, "plan-line-stories.csv")));
    }

    [Fact]
    public void PlanarModelWithAResponseSpectrumPrintsAndWritesIt()
    {
        var m = SeismicModels.ShearBuilding(3.5, [800, 400, 400], [600e3, 500e3, 400e3], new
        {
            spectrum = new { SDS = 1.0, SD1 = 0.6, R = 5.0, Ie = 1.0, TL = 8.0 },
            responseSpectrum = new { Cd = 4.0 },
        });
        string model = Path.Combine(_dir, "frame.json");
        File.WriteAllText(model, m.ToString());
        string outDir = Path.Combine(_dir, "p");
        var (code, stdout, stderr) = Run("solve", model, "--out", outDir);
        Assert.True(code == 0, stderr);
        Assert.Contains("Modal response spectrum", stdout);
        int from = stdout.IndexOf("Modal response spectrum", StringComparison.Ordinal), to = stdout.IndexOf("Periods, Cs, k and θ", from, StringComparison.Ordinal);
        Fits(stdout[from..to]);   // this section only: the planar solve's older header and status lines are wider
        Assert.True(new FileInfo(Path.Combine(outDir, "response-spectrum-modes.csv")).Length > 0);
        Assert.True(new FileInfo(Path.Combine(outDir, "response-spectrum-stories.csv")).Length > 0);
        Assert.Contains("\"forceFactor\"", File.ReadAllText(Path.Combine(outDir, "response-spectrum.json")));
    }

    [Fact]
    public void ABadSpectrumTableWritesNothing()
    {
        var m = SeismicModels.ShearBuilding(3.5, [800, 400], [600e3, 400e3], new
        {
            spectrum = new { SDS = 1.0, SD1 = 0.6, R = 5.0, Ie = 1.0, TL = 8.0 },
            responseSpectrum = new { Cd = 4.0, points = new[] { new[] { 1.0, 0.5 }, new[] { 0.5, 0.8 } } },
        });
        string model = Path.Combine(_dir, "bad.json");
        File.WriteAllText(model, m.ToString());
        string outDir = Path.Combine(_dir, "x");
        var (code, _, stderr) = Run("solve", model, "--out", outDir);
        Assert.Equal(2, code);
        Assert.Contains("not increasing", stderr);
        Assert.Contains("responseSpectrum.points", stderr);
        Assert.False(Directory.Exists(outDir));
    }
}
