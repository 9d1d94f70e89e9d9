using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Verification;

/// <summary>
/// "axiallyRigid": true: a member exactly inextensible by equation sharing (its ends share the displacement along it),
/// without a large area. Checked against closed forms where an inextensible member is the textbook assumption.
/// </summary>
public class AxiallyRigidTests
{
    private const double H = 3.5, E = 200e9, G = 77e9;   // m, N/m² (steel, common practice)
    private const double I1 = 2e-4, I2 = 5e-5, A = 0.01;  // m⁴, m²: two columns of different stiffness

    /// <summary>Two cantilever columns 6 m apart, fixed at the base, tied at the top by a pin-ended link; load P at the top of A.</summary>
    private static JObject TwoColumns(bool axiallyRigid)
    {
        var link = new JObject { ["id"] = "link", ["start"] = "A1", ["end"] = "B1", ["section"] = "L", ["material"] = "S", ["kind"] = "brace" };
        if (axiallyRigid) link["axiallyRigid"] = true;
        return JObject.FromObject(new
        {
            formatVersion = 1,
            units = new { force = "N", length = "m" },
            materials = new[] { new { id = "S", E, nu = E / (2 * G) - 1 } },
            sections = new object[]
            {
                new { id = "C1", shape = "general", A, I = I1, shearArea = A / 2 },
                new { id = "C2", shape = "general", A, I = I2, shearArea = A / 2 },
                new { id = "L", shape = "general", A = 1e-4, I = 1e-8 },
            },
            nodes = new[]
            {
                new { id = "A0", x = 0.0, y = 0.0 }, new { id = "A1", x = 0.0, y = H },
                new { id = "B0", x = 6.0, y = 0.0 }, new { id = "B1", x = 6.0, y = H },
            },
            members = new object[]
            {
                new { id = "CA", start = "A0", end = "A1", section = "C1", material = "S" },
                new { id = "CB", start = "B0", end = "B1", section = "C2", material = "S" },
                link,
            },
            supports = new[] { new { node = "A0", type = "fixed" }, new { node = "B0", type = "fixed" } },
            loadCases = new[] { new { id = "P", nodalLoads = new[] { new { node = "A1", fx = 100e3 } } } },
        });
    }

    [Fact]
    public void TwoCantileversTiedByAnInextensibleLinkShareTheirTopDisplacementExactly()
    {
        // Derived: with the link inextensible both tops move by δ, each column a Timoshenko cantilever of stiffness
        // k_i = 1/(h³/(3EI_i) + h/(G·A_s)) (Gere & Timoshenko, Mechanics of Materials; the element is exact for it), so
        // δ = P/(k1 + k2) and column B carries P·k2/(k1 + k2).
        var r = Solve(TwoColumns(axiallyRigid: true));
        double K(double i) => 1 / (H * H * H / (3 * E * i) + H / (G * A / 2));
        double k1 = K(I1), k2 = K(I2), p = 100e3;
        var c = r.Cases[0];
        Near(p / (k1 + k2), c.Displacement(1, Dof.X), 1e-9, "top of A");
        Assert.Equal(c.Displacement(1, Dof.X), c.Displacement(3, Dof.X));   // the same equation: bit-identical
        var rb = c.Reactions.Where(x => x.Node == 2).Sum(x => x.Fx);
        Near(-p * k2 / (k1 + k2), rb, 1e-9, "base shear of B");
        // The same link with its finite area stretches: the tops differ and B carries less (the constraint is not a big number).
        var flexible = Solve(TwoColumns(axiallyRigid: false)).Cases[0];
        Assert.True(flexible.Displacement(1, Dof.X) > flexible.Displacement(3, Dof.X) * (1 + 1e-6), "a finite link stretches");
    }

    [Fact]
    public void AnInclinedOrSupportedAxiallyRigidMemberIsRefused()
    {
        var o = TwoColumns(true);
        ((JArray)o["nodes"]!)[3]!["y"] = H + 1;   // the link now inclined
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(o.ToString(), "inclined.json"));
        Assert.Contains(e.Diagnostics, d => d.Problem.Contains("is inclined") && d.JsonPath.EndsWith("axiallyRigid", StringComparison.Ordinal));

        var s = TwoColumns(false);
        ((JObject)((JArray)s["members"]!)[0]!)["axiallyRigid"] = true;   // column A, from its fixed base
        var e2 = Assert.Throws<ModelInputException>(() => ModelReader.Parse(s.ToString(), "supported.json"));
        Assert.Contains(e2.Diagnostics, d => d.Problem.Contains("supported along its axis") && d.Fix.Length > 0);
    }
}
