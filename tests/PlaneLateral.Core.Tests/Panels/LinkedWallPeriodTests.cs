using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Tests.Building;
using PlaneLateral.Tests.Input;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Panels;

/// <summary>
/// Periods and story forces of a model whose wall is a linked panel: the seismic block sees the wall's stiffness
/// (condensed onto the frame nodes it is tied to), not the frame's alone.
/// </summary>
public class LinkedWallPeriodTests
{
    private const double WeightL1 = 60.0, WeightL2 = 40.0;   // kip (invented)

    /// <summary>
    /// The shipped masonry wall and frame with a seismic block (weights at both floors, a given base shear of 10 kip,
    /// the eigen period) and two unit-load cases at the floors for the flexibility (derived check below).
    /// </summary>
    internal static JObject WithSeismic()
    {
        var m = JObject.Parse(File.ReadAllText(RepositoryFiles.ModelPath("panels/masonry-wall-and-frame.json")));
        var cases = (JArray)m["loadCases"]!;
        cases.Add(JObject.FromObject(new { id = "unit L1", nodalLoads = new[] { new { node = "A1", fx = 1.0 } } }));
        cases.Add(JObject.FromObject(new { id = "unit L2", nodalLoads = new[] { new { node = "A2", fx = 1.0 } } }));
        m["seismic"] = JObject.FromObject(new
        {
            loadCase = "ELF",
            weights = new[] { new { level = "L1", weight = WeightL1 }, new { level = "L2", weight = WeightL2 } },
            baseShear = 10.0,
            period = "computed",
            modes = 2,
        });
        return m;
    }

    [Fact]
    public void TheEigenPeriodsAreThoseOfTheWallAndFrameTogether()
    {
        var r = LinearStaticAnalysis.Run(ModelReader.Parse(WithSeismic().ToString(), "test.json"));
        AssertChecks(r);
        // Derived (two lumped masses on the rigid floors): the flexibility F_ij = ux of level i under a unit force at
        // level j, from the static solves of the whole (frame and recovered wall); K·φ = ω²·M·φ ⇔ F·M·φ = φ/ω², so
        // 1/ω² are the eigenvalues of the 2×2 matrix D = F·M: λ = (tr D ± √(tr² D − 4 det D))/2, T = 2π·√λ.
        var levels = r.Model.Building.Levels;
        double Ux(string caseId, int level) => r.Case(caseId).Displacement(levels[level].Nodes[0], Dof.X);
        double f11 = Ux("unit L1", 1), f21 = Ux("unit L1", 2), f12 = Ux("unit L2", 1), f22 = Ux("unit L2", 2);
        double kip = r.Model.Units.ToSI(1.0, Units.Quantity.Force);   // N per kip
        f11 /= kip; f21 /= kip; f12 /= kip; f22 /= kip;                   // m/N
        const double g = 9.80665;                                         // m/s², the standard gravity the seismic block uses (docs/seismic.md)
        double m1 = WeightL1 * kip / g, m2 = WeightL2 * kip / g;
        double d11 = f11 * m1, d12 = f12 * m2, d21 = f21 * m1, d22 = f22 * m2;
        double tr = d11 + d22, det = d11 * d22 - d12 * d21;
        double l1 = 0.5 * (tr + Math.Sqrt(tr * tr - 4 * det)), l2 = 0.5 * (tr - Math.Sqrt(tr * tr - 4 * det));
        var modes = SeismicAnalysis.Forces(r.Model)!.Modes;
        Near(2 * Math.PI * Math.Sqrt(l1), modes[0].Period, 1e-8, "first period, s");
        Near(2 * Math.PI * Math.Sqrt(l2), modes[1].Period, 1e-8, "second period, s");

        // Derived (statics): the generated story forces add up to the 10 kip base shear, and the story shears of the
        // generated case, wall included, equal it in story 1.
        var elf = StoryAnalysis.ForCase(r, r.Case("ELF"));
        Near(10.0, r.Model.Units.FromSI(elf.Stories[0].Shear, Units.Quantity.Force), 1e-9, "ELF story 1 shear, kip");
        StoryInvariantTests.AssertInvariants(r, "masonry wall and frame with a seismic block");
    }
}
