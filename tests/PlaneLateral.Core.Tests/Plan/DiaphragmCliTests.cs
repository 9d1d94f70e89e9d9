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
}
