using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Analysis;

/// <summary>Unstable models are named by node and DOF, never solved into NaN (common practice).</summary>
public class MechanismTests
{
    private static object Frame(string baseType, string[]? beamReleases, bool withBrace = false)
    {
        var members = new List<object>
        {
            new { id = "C1", start = "A", end = "B", section = "col", material = "steel" },
            beamReleases is null
                ? new { id = "B1", start = "B", end = "C", section = "col", material = "steel" }
                : (object)new { id = "B1", start = "B", end = "C", section = "col", material = "steel", momentReleases = beamReleases },
            new { id = "C2", start = "D", end = "C", section = "col", material = "steel" },
        };
        if (withBrace) members.Add(new { id = "X1", start = "A", end = "C", section = "col", material = "steel", kind = "brace" });
        return new
        {
            formatVersion = 1,
            materials = new[] { new { id = "steel", E = 29000.0, nu = 0.3 } },
            sections = new[] { new { id = "col", shape = "general", A = 20.0, I = 500.0 } },
            nodes = new[] { new { id = "A", x = 0.0, y = 0.0 }, new { id = "B", x = 0.0, y = 144.0 }, new { id = "C", x = 240.0, y = 144.0 }, new { id = "D", x = 240.0, y = 0.0 } },
            members,
            supports = new[] { new { node = "A", type = baseType }, new { node = "D", type = baseType } },
            loadCases = new[] { new { id = "sway", nodalLoads = new[] { new { node = "B", fx = 1.0 } } } },
        };
    }

    [Fact]
    public void PinnedPortalWithPinnedBeamIsASwayMechanismNamedByNode()
    {
        var e = Assert.Throws<UnstableModelException>(() => LinearStaticAnalysis.Run(Parse(Frame("pinned", ["start", "end"]))));
        var m = Assert.Single(e.Mechanisms);
        // The sway moves B and C sideways together.
        Assert.Contains(new NamedDof("B", Dof.X), m.Moving);
        Assert.Contains(new NamedDof("C", Dof.X), m.Moving);
        Assert.Contains("B ux", e.Message);
        Assert.Contains("Fix:", e.Message);
    }

    [Fact]
    public void ABraceStabilisesTheSameFrame()
    {
        var r = Solve(Frame("pinned", ["start", "end"], withBrace: true));
        Assert.All(r.Cases[0].Displacements, v => Assert.True(double.IsFinite(v)));
    }

    [Fact]
    public void PinnedPortalWithRigidBeamIsStable() => Solve(Frame("pinned", null));

    [Fact]
    public void FloatingBeamOnRollersReportsTheSlidingDirection()
    {
        // A beam on two rollers that both let it slide along x: one mechanism, axial sliding.
        var model = new
        {
            formatVersion = 1,
            materials = new[] { new { id = "steel", E = 29000.0, nu = 0.3 } },
            sections = new[] { new { id = "b", shape = "general", A = 20.0, I = 500.0 } },
            nodes = new[] { new { id = "L", x = 0.0, y = 0.0 }, new { id = "R", x = 300.0, y = 0.0 } },
            members = new[] { new { id = "B", start = "L", end = "R", section = "b", material = "steel" } },
            supports = new[] { new { node = "L", type = "roller-x" }, new { node = "R", type = "roller-x" } },
            loadCases = new[] { new { id = "g", nodalLoads = new[] { new { node = "L", fy = -1.0 } } } },
        };
        var e = Assert.Throws<UnstableModelException>(() => LinearStaticAnalysis.Run(Parse(model)));
        var m = Assert.Single(e.Mechanisms);
        Assert.Equal(2, m.Moving.Count);
        Assert.All(m.Moving, d => Assert.Equal(Dof.X, d.Dof));
    }

    [Fact]
    public void MomentAtAJointThatCannotTakeMomentIsAnInputError()
    {
        var model = Newtonsoft.Json.Linq.JObject.FromObject(Frame("fixed", ["start", "end"]));
        model["members"]![0]!["momentReleases"] = new Newtonsoft.Json.Linq.JArray("end");
        model["loadCases"]![0]!["nodalLoads"] = Newtonsoft.Json.Linq.JArray.FromObject(new[] { new { node = "B", mz = 10.0 } });
        var e = Assert.Throws<ModelInputException>(() => LinearStaticAnalysis.Run(Parse(model)));
        Assert.Contains("no member, support or spring resists rotation", e.Message);
    }
}
