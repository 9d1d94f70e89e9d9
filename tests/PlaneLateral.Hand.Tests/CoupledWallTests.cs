using PlaneLateral.Hand;

namespace PlaneLateral.Hand.Tests;

/// <summary>
/// The continuous-connection closed form for two coupled piers (parameters k², α² as in Stafford Smith &amp; Coull,
/// Tall Building Structures, 1991, ch. 7; closed forms derived in docs/coupled-walls.md), checked against its two limits
/// and against an independent numerical solution of the same governing equation.
/// </summary>
public class CoupledWallTests
{
    private static void Near(double expected, double actual, double relTol, string what)
    {
        double err = Math.Abs(actual - expected) / Math.Max(Math.Abs(expected), 1e-300);
        Assert.True(err <= relTol, $"{what}: expected {expected:R}, got {actual:R}, relative error {err:E2} > {relTol:E1}");
    }

    // Invented wall (SI): two 4 m and 6 m piers, 0.3 m thick, 1.5 m opening, 12 stories of 3 m, concrete E = 30 GPa.
    private const double E = 30e9, T = 0.3, L1 = 4.0, L2 = 6.0, Opening = 1.5, StoryH = 3.0, H = 36.0;

    private static CoupledWallPair Pair(double beamDepth, double beamShearRigidity = double.PositiveInfinity) => new(
        E, T * L1 * L1 * L1 / 12, T * L2 * L2 * L2 / 12, T * L1, T * L2, L1 / 2 + Opening + L2 / 2, Opening, StoryH,
        T * beamDepth * beamDepth * beamDepth / 12, H, beamShearRigidity);

    private static double CombinedI(CoupledWallPair p) => p.I + p.A1 * p.A2 * p.CentroidSpacing * p.CentroidSpacing / p.A;

    [Theory]
    [InlineData(CoupledWallLoad.TopPoint)]
    [InlineData(CoupledWallLoad.Uniform)]
    public void Vanishing_beams_give_independent_cantilevers(CoupledWallLoad load)
    {
        // Derived: α → 0 leaves N = 0 and E·I·y″ = M, the two piers as cantilevers of ΣI (elementary beam theory).
        foreach (double d in new[] { 1e-3, 1e-5 })
        {
            var p = Pair(d);
            var r = CoupledWalls.ContinuousMedium(p, load, 100e3);
            var cant = CoupledWalls.IndependentCantilevers(E, [p.I1, p.I2], H, load, 100e3);
            Assert.True(r.KAlphaH < 1e-2, $"kαH {r.KAlphaH}");
            Near(cant.Value, r.TopDeflection, 1e-4, "top deflection against independent cantilevers");
            Assert.True(r.DegreeOfCoupling < 1e-4, $"degree of coupling {r.DegreeOfCoupling}");
        }
    }

    [Theory]
    [InlineData(CoupledWallLoad.TopPoint)]
    [InlineData(CoupledWallLoad.Uniform)]
    public void Rigid_beams_give_the_combined_section_and_coupling_one_over_k2(CoupledWallLoad load)
    {
        // Derived: α → ∞ gives N·l = M/k² and E·I·y″ = M(1 − 1/k²) = M·I/I_s with I_s = I + A₁A₂l²/A (parallel axes):
        // plane sections across both piers, the solid-wall limit with the k² effect (the couple takes 1/k², not all).
        var p = Pair(1e4);   // an absurdly deep beam: kαH in the thousands
        var r = CoupledWalls.ContinuousMedium(p, load, 100e3);
        Assert.True(r.KAlphaH > 1e3, $"kαH {r.KAlphaH}");
        Near(1 / p.K2, r.DegreeOfCoupling, 3e-3, "degree of coupling against 1/k²");
        var solid = CoupledWalls.SolidWall(E, [p.A1, p.A2], [p.I1, p.I2], [L1 / 2, L1 + Opening + L2 / 2], H, load, 100e3);
        Near(solid.Value, r.TopDeflection, 1e-4, "top deflection against the combined section");
        // The solid wall's I_s equals I·k²/(k² − 1) (derived from the definition of k²).
        double expected = load == CoupledWallLoad.TopPoint ? 100e3 * H * H * H / (3 * E * CombinedI(p)) : 100e3 * Math.Pow(H, 4) / (8 * E * CombinedI(p));
        Near(expected, solid.Value, 1e-12, "solid wall against the parallel-axis section");
        Near(CombinedI(p), p.I * p.K2 / (p.K2 - 1), 1e-12, "I_s = I·k²/(k² − 1)");
    }

    [Theory]
    [InlineData(CoupledWallLoad.TopPoint, 0.6)]
    [InlineData(CoupledWallLoad.Uniform, 0.6)]
    [InlineData(CoupledWallLoad.TopPoint, 1.2)]
    [InlineData(CoupledWallLoad.Uniform, 0.3)]
    public void Closed_form_matches_a_finite_difference_solution_of_the_governing_equation(CoupledWallLoad load, double beamDepth)
    {
        // Derived check: N″ − α²k²N = −α²M/l with N(0) = 0, N′(H) = 0 (ξ from the top), solved by central differences
        // (second order, one-sided second-order condition at the base), and Δ = ∫ ξ(M − N·l)/(EI) dξ by the trapezoid
        // rule. 4000 intervals: the discretisation error is of order (H/4000)²·β² ≈ 1e-6 relative; held to 1e-4.
        var p = Pair(beamDepth);
        double w = 50e3;
        var r = CoupledWalls.ContinuousMedium(p, load, w);
        int n = 4000;
        double dx = H / n, b2 = p.K2 * p.Alpha2, l = p.CentroidSpacing;
        double M(double xi) => load == CoupledWallLoad.TopPoint ? w * xi : w * xi * xi / 2;
        // Unknowns N_1..N_n (N_0 = 0). Rows i = 1..n−1: (N_{i−1} − 2N_i + N_{i+1})/dx² − b2·N_i = −α²M/l.
        // Row n (base, N′ = 0 with a ghost node N_{n+1} = N_{n−1}): (2N_{n−1} − 2N_n)/dx² − b2·N_n = −α²M/l.
        var sub = new double[n + 1]; var diag = new double[n + 1]; var sup = new double[n + 1]; var rhs = new double[n + 1];
        for (int i = 1; i <= n; i++)
        {
            sub[i] = i == n ? 2 / (dx * dx) : 1 / (dx * dx);
            diag[i] = -2 / (dx * dx) - b2;
            sup[i] = 1 / (dx * dx);
            rhs[i] = -p.Alpha2 * M(i * dx) / l;
        }
        // Thomas algorithm (tridiagonal), N_0 = 0 drops out of row 1.
        for (int i = 2; i <= n; i++)
        {
            double m = sub[i] / diag[i - 1];
            diag[i] -= m * sup[i - 1];
            rhs[i] -= m * rhs[i - 1];
        }
        var N = new double[n + 1];
        N[n] = rhs[n] / diag[n];
        for (int i = n - 1; i >= 1; i--) N[i] = (rhs[i] - sup[i] * N[i + 1]) / diag[i];
        Near(N[n], r.BaseAxialForce, 1e-4, "base axial force against finite differences");
        Near(N[n / 2], r.AxialForceAt(H / 2), 1e-4, "mid-height axial force against finite differences");
        double delta = 0;
        for (int i = 0; i <= n; i++)
        {
            double xi = i * dx, f = xi * (M(xi) - N[i] * l) / (p.E * p.I);
            delta += (i == 0 || i == n ? 0.5 : 1.0) * f * dx;
        }
        Near(delta, r.TopDeflection, 1e-4, "top deflection against finite differences");
    }

    [Theory]
    [InlineData(CoupledWallLoad.TopPoint)]
    [InlineData(CoupledWallLoad.Uniform)]
    public void Floor_beam_shears_sum_to_the_base_axial_force(CoupledWallLoad load)
    {
        // Equilibrium of a pier (vertical forces): the beams' shears are all that load it axially (derived).
        var r = CoupledWalls.ContinuousMedium(Pair(0.6), load, 10e3);
        var shears = r.FloorBeamShears();
        Assert.Equal(12, shears.Count);
        Near(r.BaseAxialForce, shears.Sum(), 1e-12, "sum of beam shears");
        Near(r.BaseAxialForce * r.Pair.CentroidSpacing / r.BaseOverturningMoment, r.DegreeOfCoupling, 1e-12, "degree of coupling = N·l/M₀");
        // The shear flow vanishes at the base (boundary condition q(H) = 0) and is its derivative: check by a difference.
        Assert.True(Math.Abs(r.BeamShearAt(H)) < 1e-9 * r.BaseAxialForce);
        double dxi = 1e-4;
        Near((r.AxialForceAt(18 + dxi) - r.AxialForceAt(18 - dxi)) / (2 * dxi) * StoryH, r.BeamShearAt(18), 1e-6, "q = dN/dξ");
    }

    [Fact]
    public void Beam_shear_deformation_softens_the_coupling()
    {
        // Derived: shear deformation of a deep, short beam (depth 1.2 m over a 1.5 m span) adds Φ_b = 12EI_c/(G·A_s·b²) = f·(E/G)·(d/b)² = 1.84
        // to its flexibility factor, so I_c drops to I_c/(1 + Φ_b) and the wall is softer and less coupled.
        double g = E / 2.4, d = 1.2;
        var classic = CoupledWalls.ContinuousMedium(Pair(d), CoupledWallLoad.Uniform, 10e3);
        var withShear = CoupledWalls.ContinuousMedium(Pair(d, g * T * d / 1.2), CoupledWallLoad.Uniform, 10e3);
        double phi = 12 * E * (T * d * d * d / 12) / (g * T * d / 1.2 * Opening * Opening);
        Near(Pair(d).BeamInertia / (1 + phi), Pair(d, g * T * d / 1.2).EffectiveBeamInertia, 1e-12, "effective I_c");
        Near(1.2 * 2.4 * (d / Opening) * (d / Opening), phi, 1e-12, "Φ_b = f(E/G)(d/b)²");
        Assert.True(phi > 1.5, $"Φ_b {phi}");
        Assert.True(withShear.TopDeflection > classic.TopDeflection && withShear.DegreeOfCoupling < classic.DegreeOfCoupling);
    }

    [Fact]
    public void Bad_input_is_refused()
    {
        Assert.Throws<ArgumentException>(() => CoupledWalls.ContinuousMedium(Pair(0.6) with { BeamSpan = 0 }, CoupledWallLoad.Uniform, 1));
        Assert.Throws<ArgumentException>(() => CoupledWalls.ContinuousMedium(Pair(0.6) with { Height = 1 }, CoupledWallLoad.Uniform, 1));
        Assert.Throws<ArgumentException>(() => CoupledWalls.ContinuousMedium(Pair(0.6), CoupledWallLoad.TopPoint, -1));
    }
}
