using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.Plan.PlanJson;

namespace PlaneLateral.Tests.Plan;

/// <summary>
/// Floors that bend (docs/plan.md): rigid, semi-rigid and flexible floors against closed forms of statics and beam
/// theory (each check names its source), the code's flexibility test by hand, equilibrium in plan, and bad input.
/// </summary>
public sealed class DiaphragmTests
{
    /// <summary>A one-story building 0..L along X, 0..D along Y (kip, ft), with a floor block on its roof and a load along Y at the centroid.</summary>
    private static Dictionary<string, object> Building(object? floor, object[] lines, double length = 120, double depth = 40, double ecc = 0, double force = 100,
        object[]? loads = null, double[]? elevations = null, object?[]? floors = null)
    {
        var el = elevations ?? [0, 12];
        floors ??= [floor];
        return new Dictionary<string, object>
        {
            ["formatVersion"] = 1,
            ["title"] = "floor test",
            ["units"] = new { force = "kip", length = "ft" },
            ["materials"] = new[] { new { id = "C", E = 519119.0, nu = 0.2 } },
            ["plan"] = new
            {
                outline = new[] { new[] { 0.0, 0 }, new[] { length, 0 }, new[] { length, depth }, new[] { 0.0, depth } },
                accidentalEccentricity = ecc,
                levels = el.Select((e, i) => i == 0 ? (object)new { id = "base", elevation = e }
                    : floors[Math.Min(i - 1, floors.Length - 1)] is { } f ? new { id = $"L{i}", elevation = e, floor = f } : new { id = $"L{i}", elevation = e }).ToArray(),
                lines,
                loads = loads ?? [new { id = "EY", direction = "y", forces = el.Skip(1).Select(_ => force).ToArray() }],
            },
        };
    }

    /// <summary>Three equal lines along Y at 0, L/2, L and two along X on the long sides (story springs, kip/ft).</summary>
    private static object[] ThreeLines(double k, double length = 120, double depth = 40, double kx = 1000) =>
    [
        Springs("A", 0, depth / 2, "y", k), Springs("B", length / 2, depth / 2, "y", k), Springs("C", length, depth / 2, "y", k),
        Springs("S", length / 2, 0, "x", kx), Springs("N", length / 2, depth, "x", kx),
    ];

    private static double Shear(PlanResult r, string line, string c = "EY", int story = 1) => r.Case(c).LineStories.First(s => s.Line == line && s.Story == story).Shear;

    private static void InPlanEquilibrium(PlanResult r)
    {
        foreach (var c in r.Cases)
        {
            Assert.True(c.Equilibrium.RelativeError < 1e-10, $"case {c.Case.Id}: out of balance {c.Equilibrium.RelativeError:E2}");
            // Σ line shears along X and Y = the story shears, every story (statics).
            foreach (var st in c.Stories)
            {
                double vx = 0, vy = 0;
                foreach (var s in c.LineStories.Where(s => s.Story == st.Story))
                {
                    var line = r.Plan.Lines.First(l => l.Id == s.Line);
                    vx += line.Cos * s.Shear; vy += line.Sin * s.Shear;
                }
                double scale = Math.Max(Math.Abs(st.Vx), Math.Abs(st.Vy));
                Assert.True(Math.Abs(vx - st.Vx) <= 1e-9 * scale && Math.Abs(vy - st.Vy) <= 1e-9 * scale, $"case {c.Case.Id} story {st.Story}");
            }
        }
    }

    [Fact]
    public void ThreeEqualLinesUnderAFlexibleFloorTakeTheTributaryQuarterHalfQuarter()
    {
        // Derived (statics): a uniform load on two equal simple spans: each end line takes a quarter, the middle one half.
        var r = Solve(Building(new { kind = "flexible" }, ThreeLines(50)));
        double v = 100 * KipN;
        Assert.Equal(0.25, Shear(r, "A") / v, 12);
        Assert.Equal(0.50, Shear(r, "B") / v, 12);
        Assert.Equal(0.25, Shear(r, "C") / v, 12);
        InPlanEquilibrium(r);
        Assert.Empty(r.Irregularity);   // Table 12.3-1 Type 1: rigid and semi-rigid floors only
    }

    [Fact]
    public void ThreeEqualLinesUnderARigidFloorTakeAThirdEach()
    {
        // Derived: equal stiffnesses, load at the centre of rigidity: 1/3 each. The same from the envelope's rigid column.
        var r = Solve(Building(new { kind = "rigid", thickness = 0.5, material = "C" }, ThreeLines(50)));
        double v = 100 * KipN;
        foreach (var id in new[] { "A", "B", "C" }) Assert.Equal(1.0 / 3, Shear(r, id) / v, 12);
        var env = r.Diaphragms!.Envelope.Where(e => e.Case == "EY").ToDictionary(e => e.Line);
        foreach (var id in new[] { "A", "B", "C" }) Assert.Equal(Shear(r, id), env[id].Rigid, 9);
        Assert.Equal(0.25, env["A"].Flexible / v, 12);
        Assert.Equal(0.50, env["B"].Flexible / v, 12);
        Assert.Equal("flexible", env["B"].Governing);
        Assert.Equal(0.5 * v, env["B"].Envelope, 6);
        Assert.Equal(1.0 / 3 * v, env["A"].Envelope, 6);   // the rigid third beats the end's quarter and its semi-rigid share
        Assert.Equal(["rigid", "semi-rigid", "flexible"], r.Diaphragms.Variants);
    }

    [Fact]
    public void AFloorFlexibleInFlexureAndRigidInShearOnStiffLinesGivesTheContinuousBeamReactions()
    {
        // Derived (three-moment equation): a continuous beam of two equal spans L under w on unyielding supports has the
        // interior reaction 1.25·wL = 5/8 of the total load, the ends 3/16 each. The lines' finite stiffness leaves a
        // gap of the order of the floor's stiffness over theirs (1.2 kip/ft over 1e7): it shrinks as they stiffen.
        double v = 100 * KipN;
        var floor = new { kind = "semi-rigid", thickness = 1.0, E = 1.0, G = 1e9 };
        var gaps = new List<double>();
        foreach (double k in new[] { 1e3, 1e5, 1e7 })
        {
            var r = Solve(Building(floor, ThreeLines(k)));
            InPlanEquilibrium(r);
            gaps.Add(Math.Abs(Shear(r, "B") / v - 0.625));
            if (k == 1e7)
            {
                Assert.Equal(0.625, Shear(r, "B") / v, 6);
                Assert.Equal(0.1875, Shear(r, "A") / v, 6);
                Assert.Equal(0.1875, Shear(r, "C") / v, 6);
            }
        }
        Assert.True(gaps[1] < 0.05 * gaps[0] && gaps[2] < 0.05 * gaps[1], string.Join(", ", gaps));
    }

    [Fact]
    public void AFloorFlexibleInShearAndRigidInFlexureOnStiffLinesGivesTheTributarySplit()
    {
        // Derived: a shear beam (no bending deformation) on three unyielding supports carries each span by itself,
        // the tributary 1/4–1/2–1/4 (the pure shear beam is statically a chain of simple spans).
        var r = Solve(Building(new { kind = "semi-rigid", thickness = 1.0, E = 1e7, G = 1.0 }, ThreeLines(1e7)));
        double v = 100 * KipN;
        Assert.Equal(0.25, Shear(r, "A") / v, 6);
        Assert.Equal(0.50, Shear(r, "B") / v, 6);
        InPlanEquilibrium(r);
    }

    [Fact]
    public void AStiffeningSemiRigidFloorTendsToTheRigidFloorWithTorsion()
    {
        // Derived (limit): as E and G grow the floor's deformation vanishes and the split is the rigid floor's, twist
        // included (unequal lines, accidental eccentricity, two stories).
        object[] lines =
        [
            Springs("A", 0, 20, "y", 40, 30), Springs("B", 50, 20, "y", 90, 60), Springs("C", 120, 20, "y", 20, 15),
            Springs("S", 60, 0, "x", 80, 50), Springs("N", 30, 40, "x", 30, 25),
        ];
        var rigid = Solve(Building(null, lines, ecc: 0.05, elevations: [0, 12, 24], floors: [null]));
        var gaps = new List<double>();
        foreach (double scale in new[] { 1e2, 1e5, 1e8 })
        {
            var semi = Solve(Building(new { kind = "semi-rigid", thickness = 1.0, E = 500.0 * scale, G = 200.0 * scale }, lines, ecc: 0.05, elevations: [0, 12, 24]));
            InPlanEquilibrium(semi);
            double gap = 0;
            foreach (var c in rigid.Cases)
                foreach (var s in c.LineStories)
                    gap = Math.Max(gap, Math.Abs(semi.Case(c.Case.Id).LineStories.First(x => x.Line == s.Line && x.Story == s.Story).Shear - s.Shear) / (100 * KipN));
            gaps.Add(gap);
            if (scale == 1e8)
            {
                // The floor's beam DOFs condensed out: the stiffness on (Ux, Uy, Rz) per floor tends to the rigid floors' (derived).
                Assert.Equal(6, semi.FloorStiffness.Size);
                double top = 0, diff = 0;
                for (int i = 0; i < 6; i++)
                    for (int j = 0; j < 6; j++)
                    {
                        double sc = (i % 3 == 2 ? 36.6 : 1) * (j % 3 == 2 ? 36.6 : 1);   // rotations times the plan size (120 ft in m)
                        top = Math.Max(top, Math.Abs(rigid.FloorStiffness[i, j]) * sc);
                        diff = Math.Max(diff, Math.Abs(semi.FloorStiffness[i, j] - rigid.FloorStiffness[i, j]) * sc);
                    }
                Assert.True(diff < 1e-6 * top, $"{diff / top:E2}");
            }
        }
        Assert.True(gaps[2] < 1e-6, string.Join(", ", gaps));
        Assert.True(gaps[0] > gaps[1] && gaps[1] > gaps[2], string.Join(", ", gaps));
    }

    [Fact]
    public void TheEnvelopesRigidColumnIsThePlanAnalysisOfRigidFloors()
    {
        // Consistency (derived): the floors-that-bend assembly with every floor rigid is the rigid-floor assembly.
        object[] lines = [Springs("A", 0, 20, "y", 40), Springs("B", 50, 20, "y", 90), Springs("C", 120, 20, "y", 20), Springs("S", 60, 0, "x", 80), Springs("N", 30, 40, "x", 30)];
        var r = Solve(Building(new { kind = "rigid", thickness = 1.0, material = "C" }, lines, ecc: 0.05));
        foreach (var e in r.Diaphragms!.Envelope)
            Assert.Equal(Shear(r, e.Line, e.Case, e.Story) / KipN, e.Rigid / KipN, 9);
    }

    [Fact]
    public void MddOverAdveOfASimpleSpanIsTheDeepBeamDeflectionOverTheLineDrift()
    {
        // Derived: two lines of stiffness k at the ends of a simply supported floor L × D (thickness t) under a
        // uniform load F = wL: each takes F/2 and drifts F/(2k) (ADVE); the floor's mid-span deflection relative to them
        // is 5wL⁴/(384EI) + wL²/(8·G·A_v), I = tD³/12, A_v = tD/1.2 (Timoshenko beam; MDD). ASCE 7-16 eq. 12.3-1.
        double L = 150, D = 50, t = 0.5, E = 400000, G = 160000, F = 80, k = 3000;
        object[] lines = [Springs("W", 0, D / 2, "y", k), Springs("E", L, D / 2, "y", k), Springs("S", L / 2, 0, "x", 500), Springs("N", L / 2, D, "x", 500)];
        var r = Solve(Building(new { kind = "semi-rigid", thickness = t, E, G }, lines, L, D, force: F));
        double w = F / L, I = t * D * D * D / 12, av = t * D / 1.2;
        double mdd = 5 * w * Math.Pow(L, 4) / (384 * E * I) + w * L * L / (8 * G * av);
        double adve = F / (2 * k);
        var test = Assert.Single(r.Diaphragms!.Flexibility, x => x.Direction == "y");
        Assert.True(Math.Abs(test.Mdd / Ft - mdd) <= 1e-9 * mdd, $"MDD {test.Mdd / Ft:R} against {mdd:R}");
        Assert.Equal(adve, test.Adve / Ft, 9);
        Assert.Equal(mdd / adve, test.Ratio, 9);
        Assert.Equal(mdd / adve > 2, test.Flexible);
        Assert.Equal("W", test.From);
        Assert.Equal("E", test.To);
        // A floor much softer in shear crosses the threshold.
        var soft = Solve(Building(new { kind = "semi-rigid", thickness = t, E, G = G / 1000 }, lines, L, D, force: F));
        var st = Assert.Single(soft.Diaphragms!.Flexibility, x => x.Direction == "y");
        Assert.True(st.Ratio > 2 && st.Flexible);
    }

    [Fact]
    public void AnOpeningIsAReducedSectionInTheDeflection()
    {
        // Derived (unit-load method on a simply supported Timoshenko beam): a centred opening of depth h over the middle
        // (a..L−a) leaves I = t(D³ − h³)/12 and A_v = t(D − h)/1.2 there; the floor's load follows its net area
        // (w ∝ net depth). δ_mid = 2∫₀^{L/2} (M·m/EI + V·v/GA_v) dx with m = x/2, v = 1/2, integrated exactly by
        // 5-point Gauss per piece (polynomial integrands). MDD is that deflection relative to the two lines.
        double L = 160, D = 50, h = 10, a = 40, t = 0.4, E = 300000, G = 9000, F = 90, k = 5000;
        object[] lines = [Springs("W", 0, D / 2, "y", k), Springs("E", L, D / 2, "y", k), Springs("S", L / 2, 0, "x", 500), Springs("N", L / 2, D, "x", 500)];
        var floor = new { kind = "semi-rigid", thickness = t, E, G, openings = new[] { new { from = new[] { a, D / 2 - h / 2 }, to = new[] { L - a, D / 2 + h / 2 } } } };
        var r = Solve(Building(floor, lines, L, D, force: F));
        double area = L * D - (L - 2 * a) * h;
        double W(double x) => F * (x > a && x < L - a ? D - h : D) / area;
        double EIx(double x) => E * t * (x > a && x < L - a ? D * D * D - h * h * h : D * D * D) / 12;
        double GAx(double x) => G * t * (x > a && x < L - a ? D - h : D) / 1.2;
        double Load(double x) => x <= a ? W(0) * x : W(0) * a + W(L / 2) * (x - a);                       // ∫₀ˣ w
        double LoadMoment(double x) => x <= a ? W(0) * x * x / 2 : W(0) * a * (x - a / 2) + W(L / 2) * (x - a) * (x - a) / 2;   // ∫₀ˣ w(s)(x − s) ds
        double Integrand(double x) => (F / 2 * x - LoadMoment(x)) * (x / 2) / EIx(x) + (F / 2 - Load(x)) * 0.5 / GAx(x);
        double[] gp = [-0.9061798459386640, -0.5384693101056831, 0, 0.5384693101056831, 0.9061798459386640];
        double[] gw = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];
        double Gauss(double x0, double x1) => Enumerable.Range(0, 5).Sum(i => gw[i] * (x1 - x0) / 2 * Integrand((x0 + x1) / 2 + gp[i] * (x1 - x0) / 2));
        double mdd = 2 * (Gauss(0, a) + Gauss(a, L / 2));
        var test = Assert.Single(r.Diaphragms!.Flexibility, x => x.Direction == "y");
        Assert.True(Math.Abs(test.Mdd / Ft - mdd) <= 1e-9 * mdd, $"MDD {test.Mdd / Ft:R} against {mdd:R}");
        Assert.Equal(F / (2 * k), test.Adve / Ft, 9);
        InPlanEquilibrium(r);
    }

    [Fact]
    public void MixedFloorsOverTwoStoriesKeepEquilibriumAndTheLinesRecoverTheirLevelForces()
    {
        // Derived: equilibrium in plan of every case (ΣFx, ΣFy, ΣMz), a flexible roof over a semi-rigid floor; each line's
        // planar model recovered under its level forces gives the floors' displacements back (round-off).
        object[] lines =
        [
            new { id = "A", at = new[] { 0.0, 20 }, direction = "y", wall = new { length = 16, thickness = 1, material = "C" } },
            Springs("B", 45, 20, "y", 300, 200), new { id = "C", at = new[] { 120.0, 20 }, direction = "y", wall = new { length = 24, thickness = 1, material = "C" } },
            Springs("S", 60, 0, "x", 400, 300), Springs("N", 60, 40, "x", 400, 300),
        ];
        object[] loads = [new { id = "EY", direction = "y", forces = new[] { 60.0, 90 } }, new { id = "EX", direction = "x", forces = new[] { 50.0, 70 } }];
        var r = Solve(Building(null, lines, ecc: 0.05, loads: loads, elevations: [0, 12, 24],
            floors: [new { kind = "semi-rigid", thickness = 0.5, material = "C", openings = new[] { new { from = new[] { 70.0, 10 }, to = new[] { 90.0, 25 } } } }, new { kind = "flexible" }]));
        InPlanEquilibrium(r);
        Assert.All(r.Lines, l => Assert.True(l.RecoveryError < 1e-8, $"{l.Line.Id}: {l.RecoveryError:E2}"));
        Assert.Equal([FloorKind.SemiRigid, FloorKind.Flexible], r.Diaphragms!.Kinds);
        Assert.All(r.Irregularity, t => Assert.Equal(1, t.Story));
        // The flexible roof's story 2 split is the tributary one whatever the floor below does (derived: statics).
        double v2 = 90 * KipN;
        Assert.Equal(v2 * (45.0 / 2) / 120, Shear(r, "A", "EY", 2), 6);
        Assert.Equal(v2 * (120.0 / 2) / 120, Shear(r, "B", "EY", 2), 6);
        // The envelope is at least each idealisation, line by line.
        foreach (var e in r.Diaphragms.Envelope)
            foreach (var v in new[] { e.Rigid, e.SemiRigid, e.Flexible }) Assert.True(Math.Abs(v) <= e.Envelope * (1 + 1e-12) + 1e-9);
    }

    [Fact]
    public void TheHandTributarySplitMissesTheOverhangStaticsByWaSquaredOverTwoL()
    {
        // Derived: floor 0..120 under w = 100/120 on lines at 10, 60, 110 (overhangs a = 10, spans L = 50). The hand
        // tributary split gives the end lines w(a + L/2) = 35w and the middle one wL = 50w; the FE flexible floor takes
        // each overhang by its end span's statics: ends w(a + L/2 + a²/2L) = 36w, middle w(L − a²/L) = 48w.
        object[] lines = [Springs("A", 10, 20, "y", 50), Springs("B", 60, 20, "y", 50), Springs("C", 110, 20, "y", 50), Springs("S", 60, 0, "x", 1000), Springs("N", 60, 40, "x", 1000)];
        var r = PlanAnalysis.Run(Read(Building(new { kind = "flexible" }, lines)));
        var hand = PlaneLateral.Studies.PlanTributarySplit.Run(r);
        double w = 100.0 / 120 * 4448.2216152605;   // kip → N (exact by definition of the pound-force)
        var a = hand.Single(h => h.Case == "EY" && h.Line == "A");
        var b = hand.Single(h => h.Case == "EY" && h.Line == "B");
        Assert.Equal(35 * w, a.Hand, 6);
        Assert.Equal(50 * w, b.Hand, 6);
        Assert.Equal(36 * w, a.Flexible, 6);
        Assert.Equal(48 * w, b.Flexible, 6);
        Assert.Equal(36.0 / 35 - 1, a.Gap, 9);
        Assert.Equal("overhang", a.Cause);
        Assert.Equal("overhang", b.Cause);
        Assert.Equal("", hand.Single(h => h.Case == "EY" && h.Line == "S").Cause);   // across the loading: both nil
    }

    private static ModelDiagnostic Refused(object building, string problem)
    {
        var e = Assert.Throws<ModelInputException>(() => Read(building));
        var d = e.Diagnostics.FirstOrDefault(x => x.Problem.Contains(problem, StringComparison.Ordinal));
        Assert.True(d is not null, $"no diagnostic with \"{problem}\" among:\n{e.Message}");
        Assert.False(string.IsNullOrWhiteSpace(d!.Fix));
        Assert.True(d.Line > 0);
        return d;
    }

    [Fact]
    public void BadFloorsAreRefusedAtTheirJsonPath()
    {
        // Common practice: a clear error at the key, with a fix.
        Assert.Equal("$.plan.levels[1].floor.kind", Refused(Building(new { kind = "bendy" }, ThreeLines(50)), "unknown floor kind").JsonPath);
        Assert.Equal("$.plan.levels[1].floor.thickness", Refused(Building(new { kind = "semi-rigid", thickness = -1.0, material = "C" }, ThreeLines(50)), "must be greater than zero").JsonPath);
        Assert.Equal("$.plan.levels[1].floor.G", Refused(Building(new { kind = "semi-rigid", thickness = 1.0, E = 100.0, G = 0.0 }, ThreeLines(50)), "must be greater than zero").JsonPath);
        Assert.Equal("$.plan.levels[1].floor", Refused(Building(new { kind = "semi-rigid" }, ThreeLines(50)), "has no section").JsonPath);
        object[] oneAlongY = [Springs("A", 0, 20, "y", 50), Springs("S", 60, 0, "x", 50), Springs("N", 60, 40, "x", 50)];
        Assert.Equal("$.plan.levels[1].floor", Refused(Building(new { kind = "semi-rigid", thickness = 1.0, material = "C" }, oneAlongY), "has 1 line along y").JsonPath);
        Refused(Building(new { kind = "flexible" }, oneAlongY), "has 1 line along y");
        object[] noneAlongX = [Springs("A", 0, 20, "y", 50), Springs("B", 120, 20, "y", 50)];
        Assert.Equal("$.plan.levels[1].floor", Refused(Building(new { kind = "semi-rigid", thickness = 1.0, material = "C" }, noneAlongX), "has 0 lines along x").JsonPath);
        object[] twoAtOnePlace = [Springs("A", 0, 10, "y", 50), Springs("B", 0, 30, "y", 50), Springs("S", 60, 0, "x", 50), Springs("N", 60, 40, "x", 50)];
        Refused(Building(new { kind = "flexible" }, twoAtOnePlace), "has 1 line along y (by position)");
        object[] slanted = [.. ThreeLines(50), Springs("D", 60, 20, 30.0, 50)];
        Refused(Building(new { kind = "flexible" }, slanted), "stands at an angle");
        var cut = new { kind = "semi-rigid", thickness = 1.0, material = "C", openings = new[] { new { from = new[] { 70.0, 0 }, to = new[] { 80.0, 40 } } } };
        Assert.Equal("$.plan.levels[1].floor.openings", Refused(Building(cut, ThreeLines(50)), "cut the floor of level \"L1\" in two").JsonPath);
        Refused(Building(new { kind = "rigid", thickness = 1.0 }, ThreeLines(50)), "gives part of its section");
        Refused(Building(new { kind = "semi-rigid", thickness = 1.0, material = "STEEL" }, ThreeLines(50)), "unknown material");
    }
}
