using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.Plan.PlanJson;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Plan;

/// <summary>The floor analysis of a building in plan against closed forms worked by hand (each derivation in its comment).</summary>
public class PlanDerivedTests
{
    private static readonly double[][] Box60x40 = [[0, 0], [60, 0], [60, 40], [0, 40]];

    private static void AssertSolveChecks(PlanResult r)
    {
        foreach (var c in r.Cases)
        {
            Assert.True(c.BackwardError < 1e-14, $"{c.Case.Id}: floor backward error {c.BackwardError}");
            Assert.True(c.Equilibrium.RelativeError < 1e-12, $"{c.Case.Id}: equilibrium {c.Equilibrium.RelativeError}");
        }
        foreach (var l in r.Lines)
        {
            Assert.True(l.CondensationBackwardError < 1e-13, $"{l.Line.Id}: condensation {l.CondensationBackwardError}");
            Assert.True(l.RecoveryError < 1e-9, $"{l.Line.Id}: recovery {l.RecoveryError}");
        }
    }

    [Fact]
    public void OneStoryOfCantileverWallsSplitsAsRelativeRigidityWithTorsion()
    {
        // Derived. One story, h = 12 ft, four solid walls (t = 1 ft, E = 580,464 ksf, ν = 0.2, G = E/2.4, shear area A/1.2):
        // k = 1 / (h³/3EI + 1.2h/GA), the Timoshenko cantilever (common practice). Each line has one DOF, so the floor
        // stiffness about the plan origin is K = Σ k t tᵀ with t = (c, s, r); for orthogonal lines about the centre of
        // rigidity (x_R = Σk_y x / Σk_y, y_R = Σk_x y / Σk_x) it is diagonal: diag(Σk_x, Σk_y, J), J = Σk_x (y − y_R)² + Σk_y (x − x_R)².
        // Hence V_i = V k_i/Σk_∥ + k_i d_i T / J exactly, T = the load's torque about the centre of rigidity.
        double h = 12, e = 580464, g = e / 2.4;
        double K(double l) => 1 / (h * h * h / (3 * e * l * l * l / 12) + 1.2 * h / (g * l));
        var walls = new (string Id, double X, double Y, string Dir, double L)[] { ("W1", 0, 20, "y", 20), ("W2", 60, 20, "y", 12), ("W3", 30, 0, "x", 16), ("W4", 30, 40, "x", 10) };
        var r = Solve(PlanBuilding(walls.Select(w => Wall(w.Id, w.X, w.Y, w.Dir, w.L)).ToArray(),
            [new { id = "EY", direction = "y", forces = new[] { 100.0 } }], [0, h], Box60x40));
        AssertSolveChecks(r);

        double ky = walls.Where(w => w.Dir == "y").Sum(w => K(w.L)), kx = walls.Where(w => w.Dir == "x").Sum(w => K(w.L));
        double xr = walls.Where(w => w.Dir == "y").Sum(w => K(w.L) * w.X) / ky, yr = walls.Where(w => w.Dir == "x").Sum(w => K(w.L) * w.Y) / kx;
        double j = walls.Sum(w => K(w.L) * (w.Dir == "y" ? (w.X - xr) * (w.X - xr) : (w.Y - yr) * (w.Y - yr)));
        foreach (var (id, xLoad) in new[] { ("EY", 30.0), ("EY+ecc", 33.0), ("EY-ecc", 27.0) })   // 5 % of 60 ft = 3 ft each way
        {
            double t = 100 * (xLoad - xr);   // torque about the CR of 100 kip along +y acting at x = xLoad (counter-clockwise positive)
            var c = r.Case(id);
            foreach (var w in walls)
            {
                // d: lever of the line about the CR with the sign of r = x sin α − y cos α: +(x − x_R) for y-lines, −(y − y_R) for x-lines.
                double d = w.Dir == "y" ? w.X - xr : -(w.Y - yr);
                double direct = w.Dir == "y" ? 100 * K(w.L) / ky : 0;
                double expected = direct + K(w.L) * d * t / j;
                var fe = c.LineStories.Single(s => s.Line == w.Id);
                Near(expected, fe.Shear / KipN, 1e-9, $"{id} {w.Id}");
                if (direct != 0) Near(direct, fe.Direct / KipN, 1e-9, $"{id} {w.Id} direct");
            }
            // The hand method of PlaneLateral.Hand gives the same split, through the comparison layer.
            var hand = Studies.PlanHandSplit.Run(r).Single(s => s.Case == id);
            foreach (var row in hand.Rows) Near(row.FeTotal, row.HandTotal, 1e-9, $"{id} {row.Line} hand");
        }
        var rig = r.Rigidity.Single(x => x.Direction == "y");
        Near(xr, rig.XR / Ft, 1e-9, "x_R");
        Near(yr, rig.YR / Ft, 1e-9, "y_R");
    }

    [Fact]
    public void SymmetricPlanLoadedAtItsCentreOfMassDoesNotTurn()
    {
        // Derived: walls placed symmetrically about the centre of mass (30, 20) give K_xθ = K_yθ = 0 about it, so forces
        // there cause no rotation; three stories, so each line's condensed 3×3 stiffness is used.
        double[] el = [0, 12, 24, 36];
        var lines = new[] { Wall("W", 0, 20, "y", 16), Wall("E", 60, 20, "y", 16), Wall("S", 30, 0, "x", 12), Wall("N", 30, 40, "x", 12) };
        var r = Solve(PlanBuilding(lines, [new { id = "EX", direction = "x", forces = new[] { 10.0, 20, 30 }, accidentalTorsion = false },
            new { id = "EY", direction = "y", forces = new[] { 10.0, 20, 30 }, accidentalTorsion = false }], el, Box60x40));
        AssertSolveChecks(r);
        foreach (var c in r.Cases)
            foreach (var m in c.Motion)
            {
                double u = Math.Max(Math.Abs(m.Ux - (-m.Rz * 20 * Ft)), Math.Abs(m.Uy + m.Rz * 30 * Ft));
                Assert.True(Math.Abs(m.Rz) * 60 * Ft <= 1e-12 * u, $"{c.Case.Id} L{m.Level}: Rz = {m.Rz}");
            }
    }

    [Fact]
    public void LinesInOnePlaneGiveThePlanarRigidDiaphragmResult()
    {
        // Derived: a wall and a frame along x, both through y = 20 (the centre of mass), and two equal walls along y
        // symmetric about x = 30: K_xθ = −Σk_x·20 acts with Mz = −20·Fx, so Rz = 0 and Ux solves (Σ K̂_x) Ux = Fx, which is
        // exactly the planar model of the two x-lines side by side tied by rigid diaphragms (docs/building.md).
        double[] el = [0, 14, 28];
        double[] f = [30, 50];
        var wall = PlanarWall("WX", 0, 20, el);
        var frame = PlanarFrame("FX", 100, 25, el);
        var lines = new object[]
        {
            new { id = "WX", at = new[] { 30.0, 20 }, direction = "x", model = wall },
            new { id = "FX", at = new[] { 10.0, 20 }, direction = "x", model = frame },
            Wall("Y1", 0, 20, "y", 16), Wall("Y2", 60, 20, "y", 16),
        };
        var r = Solve(PlanBuilding(lines, [new { id = "EX", direction = "x", forces = f, accidentalTorsion = false }], el, Box60x40));
        AssertSolveChecks(r);
        var planar = LinearStaticAnalysis.Run(SideBySide([wall, frame], el, f));
        AssertChecks(planar);
        var stories = StoryAnalysis.ForCase(planar, planar.Cases[0]);
        var c = r.Case("EX");
        for (int s = 1; s <= 2; s++)
        {
            Near(stories.Levels[s].Ux, c.Motion[s - 1].Ux, 1e-9, $"level {s} Ux");
            foreach (var line in new[] { "WX", "FX" })
                Near(stories.Stories[s - 1].Lines.Single(l => l.Line == line).Shear, c.LineStories.Single(x => x.Story == s && x.Line == line).Shear, 1e-9, $"story {s} {line}");
        }
    }

    [Fact]
    public void LockingTheRotationGivesThePlanarResult()
    {
        // Derived: with every Rz held, the x-lines share the floor forces as the planar model of the x-lines tied by rigid
        // diaphragms does, wherever they stand in plan (the y-lines take nothing along x). Here the frame is 30 ft off the
        // wall, so the free floors do turn; the direct parts must still be the planar result.
        double[] el = [0, 14, 28];
        double[] f = [30, 50];
        var wall = PlanarWall("WX", 0, 20, el);
        var frame = PlanarFrame("FX", 100, 25, el);
        var lines = new object[]
        {
            new { id = "WX", at = new[] { 30.0, 40 }, direction = "x", model = wall },
            new { id = "FX", at = new[] { 10.0, 10 }, direction = "x", model = frame },
            Wall("Y1", 0, 20, "y", 16), Wall("Y2", 60, 20, "y", 10),
        };
        var r = Solve(PlanBuilding(lines, [new { id = "EX", direction = "x", forces = f, accidentalTorsion = false }], el, Box60x40));
        AssertSolveChecks(r);
        var planar = LinearStaticAnalysis.Run(SideBySide([wall, frame], el, f));
        var stories = StoryAnalysis.ForCase(planar, planar.Cases[0]);
        var c = r.Case("EX");
        Assert.True(c.Motion.Any(m => Math.Abs(m.Rz) > 1e-9), "the free floors turn");
        for (int s = 1; s <= 2; s++)
        {
            Near(stories.Levels[s].Ux, c.LockedMotion[s - 1].Ux, 1e-9, $"level {s} Ux locked");
            foreach (var line in new[] { "WX", "FX" })
                Near(stories.Stories[s - 1].Lines.Single(l => l.Line == line).Shear, c.LineStories.Single(x => x.Story == s && x.Line == line).Direct, 1e-9, $"story {s} {line}");
        }
    }

    [Fact]
    public void ALineAt45DegreesTakesTheProjectionOfTheFloorMotion()
    {
        // Derived. One story, three spring lines of stiffness k: A along x through the origin, B along y through the origin,
        // C at 45° through (a, 0), a = 20 ft, so r_C = a·sin 45° = a/√2 and only C resists Mz about the origin.
        // Load: P = 10 kip along x at (0, −d), d = 8 ft (inside the outline below): Mz = d·P about the origin.
        // Moments: r_C·p_C = d·P → p_C = √2·d·P/a. x: p_A + p_C/√2 = P → p_A = P(1 − d/a). y: p_B + p_C/√2 = 0 → p_B = −P·d/a.
        // Motion: Ux = p_A/k, Uy = p_B/k, and C's elongation p_C/k = (Ux + Uy)/√2 + r_C·Rz gives Rz.
        double k = 50, a = 20, d = 8, p = 10;
        double[][] outline = [[-10, -10], [30, -10], [30, 10], [-10, 10]];
        var r = Solve(PlanBuilding([Springs("A", 0, 0, "x", k), Springs("B", 0, 0, "y", k), Springs("C", a, 0, 45, k)],
            [new { id = "P", points = new[] { new { level = "L1", at = new[] { 0, -d }, fx = p } } }], [0, 10], outline));
        AssertSolveChecks(r);
        var c = r.Case("P");
        double pA = p * (1 - d / a), pB = -p * d / a, pC = Math.Sqrt(2) * d * p / a;
        Near(pA, c.LineStories.Single(x => x.Line == "A").Shear / KipN, 1e-9, "A");
        Near(pB, c.LineStories.Single(x => x.Line == "B").Shear / KipN, 1e-9, "B");
        Near(pC, c.LineStories.Single(x => x.Line == "C").Shear / KipN, 1e-9, "C");
        double ux = pA / k, uy = pB / k, rz = (pC / k - (ux + uy) / Math.Sqrt(2)) / (a / Math.Sqrt(2));
        Near(ux, c.Motion[0].Ux / Ft, 1e-9, "Ux");
        Near(uy, c.Motion[0].Uy / Ft, 1e-9, "Uy");
        Near(rz, c.Motion[0].Rz, 1e-9, "Rz");
        // The recovered planar line C moves by the projection cos 45°·Ux + sin 45°·Uy + r·Rz at its level.
        var line = r.Lines.Single(l => l.Line.Id == "C");
        Near(pC / k, line.Recovered.Cases[0].Displacement(line.Line.LevelNodes[0], Dof.X) / Ft, 1e-9, "C's own displacement");
    }

    [Fact]
    public void LineShearsBalanceTheFloorForcesAndTorquesOnEveryShippedBuilding()
    {
        // Common practice (statics of the part above a cut): in every story Σ cos α·V = V_x, Σ sin α·V = V_y and Σ r·V = M_z
        // of the floor loads above the cut, for every case of every building file under models/.
        var files = Directory.EnumerateFiles(Input.RepositoryFiles.ModelPath(""), "*.json", SearchOption.AllDirectories).Where(ModelReader.IsPlanFile).Order().ToList();
        Assert.True(files.Count >= 2, "the demo and Taly's example");
        foreach (var file in files)
        {
            var r = PlanSeismic.Run(ModelReader.ReadPlanFile(file)).Result;   // with the ELF cases of a seismic block
            AssertSolveChecks(r);
            double size = r.Plan.Size;
            foreach (var c in r.Cases)
                foreach (var st in c.Stories)
                {
                    var v = c.LineStories.Where(x => x.Story == st.Story).ToList();
                    var lines = v.Select(x => r.Plan.Lines.Single(l => l.Id == x.Line)).ToList();
                    double sx = v.Select((x, i) => lines[i].Cos * x.Shear).Sum(), sy = v.Select((x, i) => lines[i].Sin * x.Shear).Sum();
                    double sm = v.Select((x, i) => lines[i].Lever * x.Shear).Sum();
                    double scale = Math.Max(Math.Abs(st.Vx), Math.Abs(st.Vy));
                    string what = $"{Path.GetFileName(file)} {c.Case.Id} story {st.Story}";
                    Assert.True(Math.Abs(sx - st.Vx) <= 1e-10 * scale, $"{what}: ΣVx {sx} vs {st.Vx}");
                    Assert.True(Math.Abs(sy - st.Vy) <= 1e-10 * scale, $"{what}: ΣVy {sy} vs {st.Vy}");
                    Assert.True(Math.Abs(sm - st.Mz) <= 1e-10 * scale * size, $"{what}: ΣMz {sm} vs {st.Mz}");
                    // Each line's shear by the statics of its own members equals the sum of its level forces above the cut.
                    foreach (var x in v) Assert.True(Math.Abs(x.PlanarShear - x.Shear) <= 1e-9 * scale, $"{what} {x.Line}: member statics {x.PlanarShear} vs {x.Shear}");
                }
        }
    }
}
