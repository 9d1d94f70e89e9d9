using Newtonsoft.Json.Linq;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies.Tests;

/// <summary>
/// A wall on a footing: the engine's footing springs against the hand library's (each evaluates the published formulas
/// on its own), and the "footing-wall" check's hand and FE sides. Sources: Pais &amp; Kausel (1988) and Gazetas (1991)
/// for the springs; the base terms and the period expression are derived (docs/footings.md).
/// </summary>
public class FootingWallTests
{
    // Kip–ft: a 20 ft long, 40 ft tall, 1 ft thick concrete wall in two members on the 24 × 6 ft footing, G = 1000 ksf, ν = 0.35.
    private static JObject Wall(string? ends = null, bool withFooting = true, double? topWeight = 400, string[]? springs = null)
    {
        var check = new JObject { ["id"] = "K", ["kind"] = "footing-wall", ["members"] = new JArray("M1", "M2") };
        if (ends is not null) check["ends"] = new JArray(ends);
        if (topWeight is double w) check["topWeight"] = w;
        var model = JObject.FromObject(new
        {
            formatVersion = 1,
            units = new { force = "kip", length = "ft" },
            materials = new[] { new { id = "C", E = 518_400.0, nu = 0.2 } },
            sections = new[] { new { id = "W", shape = "rectangle", b = 1.0, d = 20.0 } },
            nodes = new[] { new { id = "B", x = 0.0, y = 0.0 }, new { id = "M", x = 0.0, y = 20.0 }, new { id = "T", x = 0.0, y = 40.0 } },
            members = new[]
            {
                new { id = "M1", start = "B", end = "M", section = "W", material = "C" },
                new { id = "M2", start = "M", end = "T", section = "W", material = "C" },
            },
            supports = new[] { new { node = "B", type = "fixed" } },
            stiffnessAt = new[] { new { node = "T", direction = "x" } },
        });
        model["comparisons"] = new JArray(check);
        if (withFooting)
        {
            var footing = new JObject
            {
                ["id"] = "F1", ["node"] = "B", ["length"] = 24, ["width"] = 6,
                ["soil"] = new JObject { ["shearModulus"] = 1000, ["poissonRatio"] = 0.35 },
            };
            if (springs is not null) footing["springs"] = new JArray(springs);
            model["footings"] = new JArray(footing);
        }
        return model;
    }

    private static StructureModel Read(JObject m) => ModelReader.Parse(m.ToString(), "wall.json");

    public static TheoryData<double, double, double, double> Footings() => new()
    {
        { 24, 6, 0, 0.35 }, { 6, 24, 0, 0.35 }, { 24, 6, 3, 0.35 }, { 10, 10, 2, 0.25 }, { 3, 40, 1.5, 0.45 }, { 12, 8, 9, 0.3 },
    };

    [Theory]
    [MemberData(nameof(Footings))]
    public void EngineAndHandFootingFormulasAgree(double length, double width, double embedment, double nu)
    {
        // Two independent evaluations of the same published formulas (Pais & Kausel 1988 via NIST GCR 12-917-21;
        // Gazetas 1991) must agree to rounding; the in-plane mapping too (common practice: the wall along the long side
        // rocks about the strong axis).
        const double g = 5.0e7;
        foreach (var (core, hand) in new[] { (FootingFormulaSet.PaisKausel, FootingFormulas.PaisKausel), (FootingFormulaSet.Gazetas, FootingFormulas.Gazetas) })
        {
            var a = FootingSoilSprings.Compute(core, length, width, embedment, g, nu);
            var b = RigidFooting.By(hand, length, width, embedment, Soil.FromShearModulus(g, nu));
            Models.Near(b.SlidingX, a.Kx, 1e-12, $"{core} K_x");
            Models.Near(b.SlidingY, a.Ky, 1e-12, $"{core} K_y");
            Models.Near(b.Vertical, a.Kz, 1e-12, $"{core} K_z");
            Models.Near(b.RockingXX, a.Kxx, 1e-12, $"{core} K_xx");
            Models.Near(b.RockingYY, a.Kyy, 1e-12, $"{core} K_yy");
            var inPlane = b.InPlane(wallAlongLongSide: length >= width);
            Models.Near(inPlane.Rocking, a.Rocking, 1e-12, $"{core} in-plane rocking");
            Models.Near(inPlane.Sliding, a.Sliding, 1e-12, $"{core} in-plane sliding");
        }
    }

    [Fact]
    public void FixedBaseAndFootingRowsAgreeHandAndFEWithEachTermsShare()
    {
        // Derived: the exact Timoshenko members on the engine's springs reproduce h³/(3EI) + f·h/(GA) + h²/K_θ + 1/K_h
        // with the hand library's springs (same published formulas), so hand and FE agree to rounding, term by term.
        var report = ComparisonStudy.Run(Read(Wall()));
        var rows = report.Rows.Where(r => r.Kind == "footing-wall").ToList();
        Assert.Equal(["fixed base", "on footing", "on footing, soil G × 0.5", "on footing, soil G × 2", "on footing, Gazetas (1991) formulas"], rows.Select(r => r.Subject));
        foreach (var row in rows)
        {
            Models.Near(row.Hand.Value, row.Reference.Value, 1e-9, row.Subject);
            Models.Near(row.Hand.FlexuralShare!.Value, row.Reference.FlexuralShare!.Value, 1e-9, row.Subject + " flexural share");
            Models.Near(row.Hand.ShearShare!.Value, row.Reference.ShearShare!.Value, 1e-9, row.Subject + " shear share");
            Assert.Equal(Verdict.WithinTolerance, row.Verdict);
        }
        // Bounds: a softer soil gives a softer wall, a stiffer soil a stiffer one, all below the fixed base.
        double k(string s) => rows.Single(r => r.Subject == s).Hand.Value;
        Assert.True(k("on footing, soil G × 0.5") < k("on footing") && k("on footing") < k("on footing, soil G × 2") && k("on footing, soil G × 2") < k("fixed base"));
        // The hand shares are given in the row's detail: four terms.
        var detail = rows[1].Hand.Detail;
        Assert.Contains("rocking", detail);
        Assert.Contains("sliding", detail);
        Assert.Contains("stiffness kept on the footing", detail);
    }

    [Fact]
    public void TheRockingTermIsTheClosedFormWithThePublishedStiffness()
    {
        // Pais & Kausel (1988): K_yy = 4.3274E6 kip·ft/rad for this footing (published check 4.33E6). Rocking only
        // (sliding held): 1/k = 1/k_fixed + h²/K_yy (derived), h = 40 ft.
        var report = ComparisonStudy.Run(Read(Wall(springs: ["rz"])));
        double kFixed = report.Rows[0].Hand.Value, kOn = report.Rows[1].Reference.Value;
        Models.Near(1 / kFixed + 1600 / 4.32743e6, 1 / kOn, 1e-5, "flexibility on a rocking base");
    }

    [Fact]
    public void FlexibleBasePeriodOfOneMassEqualsTheSingleModeExpression()
    {
        // Derived: one mass m at the top of a massless wall on a massless footing is one degree of freedom whose
        // flexibility is the sum 1/k + 1/K_y + h²/K_θ, so the FE eigen period ratio T̃/T equals
        // √(1 + k/K_y·(1 + K_y·h̄²/K_θ)) (ASCE 7-16 eq. 19.2-3, from memory) with the FE fixed-base k, the engine's
        // springs and h̄ = h, to rounding.
        var model = Read(Wall());
        var report = ComparisonStudy.Run(model);
        var period = Assert.Single(report.Rows, r => r.Kind == "footing-period");
        double kFixed = model.Units.ToSI(report.Rows[0].Reference.Value, Quantity.TranslationalStiffness);
        var s = model.Supports[0];
        double expected = Math.Sqrt(1 + kFixed / s.SpringX * (1 + s.SpringX * Math.Pow(model.Nodes[2].Y, 2) / s.SpringRZ));
        Models.Near(expected, period.Reference.Value, 1e-9, "FE period ratio against the single-mode expression");
        Models.Near(period.Hand.Value, period.Reference.Value, 1e-9, "hand row");
        Assert.True(period.Reference.Value > 1);
        // The FE period itself: T = 2π√(m/k) for the fixed base (one mass, common practice), m = 400 kip / g.
        double m = model.Units.ToSI(400, Quantity.Force) / 9.80665;
        Assert.Contains($"fixed base T = {(2 * Math.PI * Math.Sqrt(m / kFixed)).ToString("0.000", System.Globalization.CultureInfo.InvariantCulture)} s", period.Reference.Description);
    }

    [Fact]
    public void WithoutATopWeightThereIsNoPeriodRow()
    {
        var report = ComparisonStudy.Run(Read(Wall(topWeight: null)));
        Assert.DoesNotContain(report.Rows, r => r.Kind == "footing-period");
    }

    [Fact]
    public void AFixedFixedFootingWallIsRefused()
    {
        var e = Assert.Throws<ModelInputException>(() => Read(Wall(ends: "fixed-fixed")));
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("footing-wall check is a cantilever"));
    }

    [Fact]
    public void AFootingWallWithoutAFootingIsRefused()
    {
        var e = Assert.Throws<ModelInputException>(() => Read(Wall(withFooting: false)));
        var d = Assert.Single(e.Diagnostics);
        Assert.Contains("no footing stands under the wall's base node", d.Problem);
        Assert.Contains("\"footings\"", d.Fix);
    }
}

/// <summary>The shipped footing examples (models/footings/*.json, invented data) read, solve and compare.</summary>
public class ShippedFootingModelTests
{
    private static string Root()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "PlaneLateral.sln"))) return dir.FullName;
        throw new InvalidOperationException("no folder above the test binary holds PlaneLateral.sln");
    }

    [Theory]
    [InlineData("wall-on-footing.json")]
    [InlineData("clinic-on-footing.json")]
    public void FootingWallRowsAgreeHandAndFE(string file)
    {
        // Derived (see FootingWallTests): same beam theory and the same published footing formulas on both sides.
        var model = ModelReader.ReadFile(Path.Combine(Root(), "models", "footings", file));
        var footing = Assert.Single(model.Footings);
        var support = model.Supports.Single(s => s.Node == footing.Node);
        Assert.Equal(footing.Springs.Rocking, support.SpringRZ);
        Assert.Equal(footing.Springs.Sliding, support.SpringX);
        var rows = ComparisonStudy.Run(model).Rows.Where(r => r.Kind is "footing-wall" or "footing-period").ToList();
        Assert.True(rows.Count >= 5);
        foreach (var row in rows) Models.Near(row.Hand.Value, row.Reference.Value, 1e-9, $"{file} {row.Subject}");
    }

    [Fact]
    public void TheWallOnFootingModelTakesItsSoilFromTheWaveVelocity()
    {
        // G₀ = (γ/g)·Vs² (Kramer 1996, ch. 5): 0.12 kcf / 32.174 ft/s² · (700 ft/s)² = 1827.6 ksf; × 0.7 = 1279.3 ksf.
        var model = ModelReader.ReadFile(Path.Combine(Root(), "models", "footings", "wall-on-footing.json"));
        var f = model.Footings[0];
        Models.Near(0.12 / 32.174 * 700 * 700 * 0.7, model.Units.FromSI(f.ShearModulus, Quantity.Stress), 1e-5, "G");
    }
}
