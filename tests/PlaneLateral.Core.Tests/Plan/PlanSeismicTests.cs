using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.Plan.PlanJson;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Plan;

/// <summary>Masses and modes in plan, the equivalent lateral forces along X and Y, and the modal response spectrum analysis.</summary>
public class PlanSeismicTests
{
    private static readonly double[][] Box = [[0, 0], [60, 0], [60, 40], [0, 40]];

    /// <summary>A building (kip, ft) with floor weights, the given lines, an optional seismic block and no other load.</summary>
    private static object Building(object[] lines, double[] elevations, double[] weights, object? seismic, double[]? massAt = null, double ecc = 0.05)
    {
        var levels = elevations.Select((e, i) => i == 0
            ? (object)new { id = "base", elevation = e }
            : massAt is null ? new { id = $"L{i}", elevation = e, weight = weights[i - 1] } : (object)new { id = $"L{i}", elevation = e, weight = weights[i - 1], massAt })
            .ToArray();
        var plan = new Dictionary<string, object> { ["outline"] = Box, ["accidentalEccentricity"] = ecc, ["levels"] = levels, ["lines"] = lines };
        if (seismic is not null) plan["seismic"] = seismic;
        else plan["loads"] = new object[] { new { id = "EX", direction = "x", forces = weights.Select(_ => 1.0).ToArray() } };
        return new Dictionary<string, object>
        {
            ["formatVersion"] = 1, ["title"] = "modal test", ["units"] = new { force = "kip", length = "ft" },
            ["materials"] = new object[] { new { id = "C", E = 580464.0, nu = 0.2 } }, ["plan"] = plan,
        };
    }

    private static object Seismic(object? responseSpectrum = null, string period = "capped") => responseSpectrum is null
        ? new { loadCase = "E", structureType = "other", period, spectrum = new { SDS = 1.0, SD1 = 0.6, R = 5.0, Ie = 1.0, TL = 8.0 } }
        : new { loadCase = "E", structureType = "other", period, spectrum = new { SDS = 1.0, SD1 = 0.6, R = 5.0, Ie = 1.0, TL = 8.0 }, responseSpectrum };

    private const double Kip = KipN, FtM = Ft;
    private static double KipPerFt => KipN / Ft;   // N/m

    /// <summary>
    /// One story, symmetric plan b × d = 60 × 40 ft, uniform floor of weight W at the centroid: y-lines k at x = 0 and 60,
    /// x-lines k' at y = 0 and 40. About the centre of mass the floor stiffness is diagonal (derived): K_x = 2k',
    /// K_y = 2k, K_θ = 2k(b/2)² + 2k'(d/2)², and M = diag(m, m, J) with J = m(b² + d²)/12 (uniform rectangle — standard).
    /// So T_x = 2π√(m/2k'), T_y = 2π√(m/2k), T_θ = 2π√(J/K_θ), each mode wholly in its own direction.
    /// </summary>
    [Fact]
    public void SymmetricOneStoryHasTheUncoupledPeriods()
    {
        double k = 50, kp = 80, w = 400;   // kip/ft, kip
        var lines = new object[] { Springs("A", 0, 20, "y", k), Springs("B", 60, 20, "y", k), Springs("C", 30, 0, "x", kp), Springs("D", 30, 40, "x", kp) };
        var modal = PlanModal.Solve(Read(Building(lines, [0, 12], [w], null)));
        double m = w * Kip / SeismicPresets.Gravity;
        double j = m * (60 * 60 + 40 * 40) / 12 * FtM * FtM;
        double kth = (2 * k * 30 * 30 + 2 * kp * 20 * 20) * KipPerFt * FtM * FtM;
        var expected = new Dictionary<string, double>
        {
            ["x"] = 2 * Math.PI * Math.Sqrt(m / (2 * kp * KipPerFt)),
            ["y"] = 2 * Math.PI * Math.Sqrt(m / (2 * k * KipPerFt)),
            ["torsion"] = 2 * Math.PI * Math.Sqrt(j / kth),
        };
        Assert.Equal(3, modal.Modes.Count);
        foreach (var mode in modal.Modes)
        {
            Near(expected[mode.Dominant], mode.Period, 1e-8, $"T {mode.Dominant}");
            int d = mode.Dominant switch { "x" => 0, "y" => 1, _ => 2 };
            Near(1.0, mode.Share[d], 1e-8, $"mode {mode.Dominant} carries all of its direction's mass");
        }
        for (int d = 0; d < 3; d++) Near(1.0, modal.Modes[^1].Cumulative[d], 1e-9, "the shares add up to 1");
    }

    /// <summary>
    /// One-story unsymmetric plan (Chopra, <i>Dynamics of Structures</i>, the one-story unsymmetric-plan system; worked
    /// here — derived): y-lines k₁ at x = 0 and k₂ at x = b, x-lines k' at y = 0 and d, mass m at the centroid. About the
    /// centre of mass, K_yy = k₁ + k₂, K_yθ = (k₂ − k₁)·b/2, K_θθ = (k₁ + k₂)(b/2)² + 2k'(d/2)², M = diag(m, J); the
    /// coupled (Uy, Rz) frequencies are the roots of det(K − ω²M) = 0: ω² = ½[(a + c) ∓ √((a − c)² + 4e²)] with
    /// a = K_yy/m, c = K_θθ/J, e = K_yθ/√(mJ); ω_x² = 2k'/m alone.
    /// </summary>
    [Fact]
    public void EccentricOneStoryHasTheClosedFormCoupledFrequencies()
    {
        double k1 = 30, k2 = 90, kp = 60, w = 500, b = 60, d = 40;
        var lines = new object[] { Springs("A", 0, 20, "y", k1), Springs("B", 60, 20, "y", k2), Springs("C", 30, 0, "x", kp), Springs("D", 30, 40, "x", kp) };
        var modal = PlanModal.Solve(Read(Building(lines, [0, 12], [w], null)));
        double m = w * Kip / SeismicPresets.Gravity;
        double j = m * (b * b + d * d) / 12 * FtM * FtM;
        double kyy = (k1 + k2) * KipPerFt, kyt = (k2 - k1) * b / 2 * KipPerFt * FtM, ktt = ((k1 + k2) * b * b / 4 + 2 * kp * d * d / 4) * KipPerFt * FtM * FtM;
        double a = kyy / m, c = ktt / j, e = kyt / Math.Sqrt(m * j);
        double lo = 0.5 * (a + c - Math.Sqrt((a - c) * (a - c) + 4 * e * e)), hi = 0.5 * (a + c + Math.Sqrt((a - c) * (a - c) + 4 * e * e));
        double wx2 = 2 * kp * KipPerFt / m;
        var expected = new[] { lo, hi, wx2 }.OrderBy(x => x).ToArray();
        var got = modal.Modes.Select(x => x.Omega * x.Omega).OrderBy(x => x).ToArray();
        for (int i = 0; i < 3; i++) Near(expected[i], got[i], 1e-8, $"ω² {i + 1}");
        var coupled = modal.Modes.Where(x => x.Share[1] > 1e-6).ToList();
        Assert.Equal(2, coupled.Count);
        Assert.All(coupled, x => Assert.True(x.Share[2] > 1e-3, "the y modes twist"));
        Near(1.0, coupled.Sum(x => x.Share[1]), 1e-9, "the two coupled modes carry all of the y mass");
    }

    /// <summary>
    /// Derived: two equal planar walls along y at x = 0 and 60, symmetric x-walls, floors of weight W at the centroid.
    /// The y modes cannot twist (symmetry), so each is a mode of one planar wall carrying W/2 per level: the plan's
    /// y periods must equal the planar seismic block's periods of that wall (both condense exactly).
    /// </summary>
    [Fact]
    public void YModesOfASymmetricPlanAreThePlanarLinesPeriods()
    {
        double[] el = [0, 14, 28, 42];
        double[] weights = [300, 300, 200];
        var wall = PlanarWall("WY", 0, 18, el);
        var lines = new object[]
        {
            new { id = "Y1", at = new[] { 0.0, 20 }, direction = "y", model = wall },
            new { id = "Y2", at = new[] { 60.0, 20 }, direction = "y", model = wall },
            Wall("X1", 30, 0, "x", 20), Wall("X2", 30, 40, "x", 20),
        };
        var modal = PlanModal.Solve(Read(Building(lines, el, weights, null)));
        var planar = (JObject)wall.DeepClone();
        planar["seismic"] = JObject.FromObject(new { loadCase = "ELF", baseShear = 10.0, modes = 3, weights = weights.Select((x, i) => new { level = $"L{i + 1}", weight = x / 2 }).ToArray() });
        planar["loadCases"] = new JArray();
        var line = SeismicAnalysis.Modal(ModelReader.Parse(planar.ToString(), "wall.json"))!.Modes(3);
        var ymodes = modal.Modes.Where(x => x.Dominant == "y").ToList();
        Assert.Equal(3, ymodes.Count);
        for (int i = 0; i < 3; i++)
        {
            Near(line[i].Period, ymodes[i].Period, 1e-8, $"y mode {i + 1}");
            Near(line[i].MassShare, ymodes[i].Share[1], 1e-8, $"y mode {i + 1} mass share");
        }
    }

    [Fact]
    public void ElfCasesComeFromThePlanModesAndBalance()
    {
        double[] el = [0, 14, 28, 42];
        double[] weights = [300, 300, 200];
        var lines = new object[] { Wall("Y1", 2, 20, "y", 16), Springs("Y2", 58, 20, "y", 40, 30, 20), Wall("X1", 20, 1, "x", 24), Wall("X2", 40, 39, "x", 12) };
        var plan = Read(Building(lines, el, weights, Seismic()));
        var (r, s) = PlanSeismic.Run(plan);
        Assert.NotNull(s);
        double wsum = weights.Sum() * Kip;
        foreach (var e in s!.Elf)
        {
            int d = e.Direction == "x" ? 0 : 1;
            var governing = s.Modal.Modes.First(m => m.Number == e.Mode);
            Assert.Equal(s.Modal.Modes.Max(m => m.Share[d]), governing.Share[d]);
            Near(Math.Min(governing.Period, e.Cu * e.Ta), e.PeriodUsed, 1e-12, "T capped at Cu·Ta");
            var spec = new SpectralValues(1.0, 0.6, 5.0, 1.0, 8.0, double.NaN);
            Near(SeismicAnalysis.ResponseCoefficient(spec, e.PeriodUsed).Cs * wsum, e.BaseShear, 1e-9, "V = Cs·W on the planar path");
            Near(e.BaseShear, e.LevelForces.Sum(), 1e-9, "Σ Fx = V");
            foreach (var id in e.Cases)
            {
                var c = r.Case(id);
                Assert.True(c.Equilibrium.RelativeError < 1e-9, $"{id} equilibrium {c.Equilibrium.RelativeError}");
                for (int st = 1; st <= 3; st++)
                {
                    double above = e.LevelForces.Skip(st - 1).Sum();
                    Near(above, d == 0 ? c.Stories[st - 1].Vx : c.Stories[st - 1].Vy, 1e-9, $"{id} story {st}: shear = load above the cut");
                    var along = c.LineStories.Where(x => x.Story == st).Sum(x => (plan.Lines.First(l => l.Id == x.Line).Cos * (d == 0 ? 1 : 0) + plan.Lines.First(l => l.Id == x.Line).Sin * d) * x.Shear);
                    Near(above, along, 1e-8, $"{id} story {st}: Σ line shears along the loading");
                }
            }
        }
        Assert.Contains(r.Irregularity, t => t.Case.StartsWith("E-", StringComparison.Ordinal));
    }

    /// <summary>
    /// Derived: one story, symmetric plan, y excitation: one mode carries all the y mass, so the modal base shear is
    /// S_a(T)·W/(R/I_e); with T beyond C_u·T_a the ELF uses C_u·T_a = 0.18 s (T_a = 0.02·12^0.75, C_u = 1.4), below
    /// T_S = 0.6 s, so C_s = S_DS/(R/I_e) and the forces are scaled by V/V_t = S_DS/S_a(T) (§12.9.1.4.1, 100 %); drifts
    /// are not scaled (C_s not from eq. 12.8-6).
    /// </summary>
    [Fact]
    public void OneModeBaseShearIsTheSpectralShearScaledToTheElf()
    {
        double k = 8, kp = 12, w = 400;   // soft: T beyond Cu·Ta
        var lines = new object[] { Springs("A", 0, 20, "y", k), Springs("B", 60, 20, "y", k), Springs("C", 30, 0, "x", kp), Springs("D", 30, 40, "x", kp) };
        var plan = Read(Building(lines, [0, 12], [w], Seismic(new { Cd = 4.0, combination = "CQC" })));
        var (_, s) = PlanSeismic.Run(plan);
        var y = s!.Spectrum!.Directions.Single(d => d.Direction == "y");
        var ty = s.Modal.Modes.Single(m => m.Dominant == "y").Period;
        var elf = s.Elf.Single(e => e.Direction == "y");
        Assert.True(ty > elf.Cu * elf.Ta, $"T {ty} beyond Cu·Ta {elf.Cu * elf.Ta}");
        double vt = new DesignSpectrum(1.0, 0.6, 8).Sa(ty) * w * Kip / 5.0;
        Near(vt, y.Scaling.BaseShearModal, 1e-8, "V_t = S_a·W/(R/Ie)");
        Assert.True(elf.Cu * elf.Ta < 0.6);
        Near(1.0 / new DesignSpectrum(1.0, 0.6, 8).Sa(ty), y.Scaling.ForceFactor, 1e-8, "V/V_t = S_DS/S_a(T)");
        Near(elf.BaseShear, y.Stories[0].ScaledShear, 1e-8, "scaled to V");
        Assert.Equal(1.0, y.Scaling.DriftFactor);
        Assert.True(y.EquilibriumError < 1e-9, $"per-mode equilibrium {y.EquilibriumError}");
    }

    [Fact]
    public void SrssIsNeverBelowTheLargestModeAndEveryModeBalances()
    {
        double[] el = [0, 14, 28, 42];
        var lines = new object[] { Wall("Y1", 2, 20, "y", 16), Springs("Y2", 58, 20, "y", 40, 30, 20), Wall("X1", 20, 1, "x", 24), Wall("X2", 40, 39, "x", 12) };
        var plan = Read(Building(lines, el, [300, 300, 200], Seismic(new { Cd = 4.0, combination = "SRSS" })));
        var (r, s) = PlanSeismic.Run(plan);
        foreach (var d in s!.Spectrum!.Directions)
        {
            int di = d.Direction == "x" ? 0 : 1;
            Assert.True(d.CumulativeShare >= 0.9, $"{d.Direction}: {d.CumulativeShare} of the mass (§12.9.1.1)");
            Assert.True(d.EquilibriumError < 1e-9, $"{d.Direction}: per-mode equilibrium {d.EquilibriumError}");
            double biggest = d.Modes.Max(m => Math.Abs(di == 0 ? m.BaseShearX : m.BaseShearY));
            Assert.True(d.Stories[0].ModalShear >= biggest - 1e-9 * biggest, "SRSS base shear ≥ the largest mode's");
            Assert.All(d.Stories, st => Assert.True(st.Drift > 0 && st.DesignDrift == 4.0 * st.Drift / 1.0));
            Assert.All(d.Lines, l => Assert.True(l.Design >= l.Scaled));
        }
        Assert.True(r.WorstEquilibriumError < 1e-9);
    }

    [Fact]
    public void MissingWeightsBadModesAndBadSpectrumTablesAreRefusedNamingTheKey()
    {
        var lines = new object[] { Springs("A", 0, 20, "y", 5, 5), Springs("B", 60, 20, "y", 5, 5), Springs("C", 30, 0, "x", 5, 5) };
        var o = (Dictionary<string, object>)Building(lines, [0, 12, 24], [100, 100], Seismic(new { Cd = 4.0, modes = 7, damping = 0.6, points = new[] { new[] { 0.5, 1.0 }, new[] { 0.2, 0.5 }, new[] { 1.0, -0.1 } } }));
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ParsePlan(Text(o), "b.json"));
        Assert.Contains(e.Diagnostics, x => x.JsonPath.EndsWith("responseSpectrum.modes", StringComparison.Ordinal) && x.Problem.Contains("has 6"));
        Assert.Contains(e.Diagnostics, x => x.JsonPath.EndsWith("damping", StringComparison.Ordinal));
        Assert.Contains(e.Diagnostics, x => x.Problem.Contains("not increasing"));
        Assert.Contains(e.Diagnostics, x => x.Problem.Contains("negative"));
        var noWeight = JObject.Parse(Text(Building(lines, [0, 12, 24], [100, 100], Seismic())));
        ((JObject)noWeight["plan"]!["levels"]![2]!).Remove("weight");
        var e2 = Assert.Throws<ModelInputException>(() => ModelReader.ParsePlan(noWeight.ToString(), "b.json"));
        Assert.Contains(e2.Diagnostics, x => x.Problem.Contains("level \"L2\" has no \"weight\""));
    }

    [Fact]
    public void EveryShippedBuildingWithASeismicBlockBalancesModeByMode()
    {
        // Common practice: in each mode the lines' forces balance the mode's floor forces (ΣFx, ΣFy, ΣMz); every ELF case
        // balances its floor loads; the modes reach 90 % of the mass in X and Y (§12.9.1.1).
        var files = Directory.EnumerateFiles(Input.RepositoryFiles.ModelPath(""), "*.json", SearchOption.AllDirectories).Where(ModelReader.IsPlanFile).Order().ToList();
        int seen = 0;
        foreach (var file in files)
        {
            var (r, s) = PlanSeismic.Run(ModelReader.ReadPlanFile(file));
            if (s is null) continue;
            seen++;
            Assert.True(r.WorstEquilibriumError < 1e-9, $"{file}: {r.WorstEquilibriumError}");
            Assert.All(s.Elf.SelectMany(e => e.Cases), id => Assert.True(r.Case(id).Equilibrium.RelativeError < 1e-9));
            // §12.8.4.3: where A_x is applied, the amplified twins exist, balance, and twist more than the plain ±ecc cases.
            foreach (var e in s.Elf.Where(e => s.Amplification.Any(a => a.Direction == e.Direction && a.Applied)))
                foreach (var sign in new[] { "+", "-" })
                {
                    var amp = r.Case(e.Cases[0] + sign + "ecc·Ax");
                    var plain = r.Case(e.Cases[0] + sign + "ecc");
                    Assert.True(amp.Equilibrium.RelativeError < 1e-9);
                    Assert.True(Math.Abs(amp.Stories[0].Mz - r.Case(e.Cases[0]).Stories[0].Mz) > Math.Abs(plain.Stories[0].Mz - r.Case(e.Cases[0]).Stories[0].Mz),
                        "the amplified eccentricity gives the larger accidental torque");
                }
            if (s.Spectrum is { } sp)
                foreach (var d in sp.Directions)
                {
                    Assert.True(d.EquilibriumError < 1e-9, $"{file} {d.Direction}: {d.EquilibriumError}");
                    Assert.True(d.CumulativeShare >= 0.9, $"{file} {d.Direction}: {d.CumulativeShare}");
                    Assert.True(d.Stories[0].ScaledShear >= d.Scaling.BaseShearElf * (1 - 1e-12), "scaled base shear not below V (§12.9.1.4.1)");
                }
        }
        Assert.True(seen >= 1, "the demo building has a seismic block");
    }

    /// <summary>
    /// Published (Chopra, <i>Dynamics of Structures</i>, the uniform five-story shear frame of the MDOF chapter: floor
    /// weight 100 kip, story stiffness 31.54 kip/in, h = 12 ft; periods 2.00, 0.6852, 0.4346, 0.3383, 0.2966 s — from
    /// memory of the book, ../shared/REFERENCES.md) and derived (ω_n = 2√(k/m)·sin[(2n−1)π/(2(2N+1))]): the frame is
    /// split into two equal story-stiffness lines along y at the ends of a symmetric plan, so the y modes do not twist.
    /// </summary>
    [Fact]
    public void FiveStoryShearFrameInPlanHasThePublishedPeriods()
    {
        double k = 31.54 * 12;   // kip/ft per story
        double[] el = [0, 12, 24, 36, 48, 60];
        double[] half = Enumerable.Repeat(k / 2, 5).ToArray();
        double[] stiffer = half.Select(v => 2 * v).ToArray();   // x unlike y: no repeated periods to mix the directions
        var lines = new object[] { Springs("A", 0, 20, "y", half), Springs("B", 60, 20, "y", half), Springs("C", 30, 0, "x", stiffer), Springs("D", 30, 40, "x", stiffer) };
        var modal = PlanModal.Solve(Read(Building(lines, el, Enumerable.Repeat(100.0, 5).ToArray(), null)));
        var y = modal.Modes.Where(m => m.Dominant == "y").ToList();
        Assert.Equal(5, y.Count);
        double[] book = [2.00, 0.6852, 0.4346, 0.3383, 0.2966];
        double m1 = 100 * Kip / SeismicPresets.Gravity, k1 = k * KipPerFt;
        for (int n = 0; n < 5; n++)
        {
            Near(book[n], y[n].Period, n == 0 ? 5e-3 : 5e-4, $"mode {n + 1}, book");
            double omega = 2 * Math.Sqrt(k1 / m1) * Math.Sin((2 * n + 1) * Math.PI / (2 * 11));
            Near(omega, y[n].Omega, 1e-8, $"mode {n + 1}, closed form");
        }
        Near(1.0, y.Sum(m => m.Share[1]), 1e-9, "the y modes carry all the y mass");
    }

    [Theory]
    [InlineData("flexible")]
    [InlineData("semi-rigid")]
    public void TheResponseSpectrumBesideAFloorThatBendsIsRefusedNotSolvedAsRigid(string kind)
    {
        // The modes are solved on rigid floors (three DOFs per floor); a response spectrum on them beside a bending floor
        // would be silently wrong (common practice: a floor that bends changes the periods and the split), so the reader
        // refuses it. The equivalent lateral forces stay (their period from the rigid-floor model, docs/plan.md).
        var d = JObject.Parse(File.ReadAllText(Input.RepositoryFiles.ModelPath("demo-building.json")));
        d["plan"]!["levels"]![3]!["floor"] = kind == "flexible" ? new JObject { ["kind"] = "flexible" }
            : new JObject { ["kind"] = "semi-rigid", ["thickness"] = 0.5, ["material"] = "CONCRETE" };
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ParsePlan(d.ToString(), Input.RepositoryFiles.ModelPath("demo-building.json")));
        Assert.Contains(e.Diagnostics, x => x.JsonPath == "$.plan.seismic.responseSpectrum" && x.Problem.Contains("its modes are those of rigid floors") && x.Problem.Contains("\"L3\""));
        ((JObject)d["plan"]!["seismic"]!).Remove("responseSpectrum");
        Assert.NotNull(ModelReader.ParsePlan(d.ToString(), Input.RepositoryFiles.ModelPath("demo-building.json")).Seismic);
    }
}
