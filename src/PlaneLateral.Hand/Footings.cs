namespace PlaneLateral.Hand;

/// <summary>
/// The soil under a footing as the static stiffness formulas need it: the (strain-compatible) shear modulus G and
/// Poisson's ratio ν. Units: any consistent set (stress F/L²).
/// </summary>
/// <param name="ShearModulus">G used in the formulas (F/L²): the small-strain modulus times the reduction factor.</param>
/// <param name="PoissonRatio">ν, strictly between 0 and 0.5.</param>
/// <param name="SmallStrainModulus">G₀ before the reduction (F/L²).</param>
/// <param name="Reduction">G/G₀, the user's strain-compatible reduction factor, in (0, 1].</param>
/// <param name="Method">How G was found.</param>
public sealed record SoilProperties(double ShearModulus, double PoissonRatio, double SmallStrainModulus, double Reduction, HandMethod Method);

/// <summary>Soil shear modulus from a given value or from the shear-wave velocity.</summary>
public static class Soil
{
    /// <summary>G = reduction · G₀ with G₀ given.</summary>
    /// <param name="smallStrainModulus">G₀ (F/L²), positive.</param>
    /// <param name="nu">Poisson's ratio ν, strictly between 0 and 0.5.</param>
    /// <param name="reduction">G/G₀ for the strain level of the design motion, in (0, 1]; 1 uses G₀ as is.</param>
    public static SoilProperties FromShearModulus(double smallStrainModulus, double nu, double reduction = 1.0)
    {
        Guard.Positive(smallStrainModulus, "The soil shear modulus G");
        SoilPoisson(nu);
        Reduction(reduction);
        return new SoilProperties(reduction * smallStrainModulus, nu, smallStrainModulus, reduction,
            new HandMethod("Soil shear modulus given", "input", [ReductionSentence(reduction)]));
    }

    /// <summary>
    /// G₀ = ρ·Vs² = (γ/g)·Vs², then G = reduction · G₀. Source: elastic wave propagation (shear-wave speed
    /// Vs = √(G/ρ)); e.g. Kramer, Geotechnical Earthquake Engineering, 1996, ch. 5.
    /// </summary>
    /// <param name="shearWaveVelocity">Vs (L/s), positive.</param>
    /// <param name="unitWeight">γ (F/L³), positive.</param>
    /// <param name="gravity">g in the same units (L/s²): 386.09 in/s², 32.174 ft/s², 9.80665 m/s².</param>
    /// <param name="nu">Poisson's ratio ν, strictly between 0 and 0.5.</param>
    /// <param name="reduction">G/G₀ in (0, 1].</param>
    public static SoilProperties FromShearWaveVelocity(double shearWaveVelocity, double unitWeight, double gravity, double nu, double reduction = 1.0)
    {
        Guard.Positive(shearWaveVelocity, "The shear-wave velocity Vs");
        Guard.Positive(unitWeight, "The soil unit weight γ");
        Guard.Positive(gravity, "The acceleration of gravity g");
        SoilPoisson(nu);
        Reduction(reduction);
        double g0 = unitWeight / gravity * shearWaveVelocity * shearWaveVelocity;
        return new SoilProperties(reduction * g0, nu, g0, reduction,
            new HandMethod("Soil shear modulus from the shear-wave velocity, G₀ = (γ/g)·Vs²",
                "Elastic wave propagation, Vs = √(G/ρ); Kramer, Geotechnical Earthquake Engineering, 1996, ch. 5",
                ["the soil is a homogeneous elastic half-space", ReductionSentence(reduction)]));
    }

    internal static void SoilPoisson(double nu)
    {
        if (!(nu > 0 && nu < 0.5))
            throw new ArgumentException($"The soil's Poisson's ratio must lie strictly between 0 and 0.5 (0.25–0.35 for most sands and stiff clays, near 0.45 for saturated clay); got {nu}.");
    }

    private static void Reduction(double r)
    {
        if (!(r > 0 && r <= 1))
            throw new ArgumentException($"The strain-compatible reduction G/G₀ must lie in (0, 1]; got {r}.");
    }

    private static string ReductionSentence(double r) => r == 1
        ? "the small-strain modulus is used as is (no strain-compatible reduction)"
        : $"strain-compatible reduction G/G₀ = {r.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)} given by the user";
}

/// <summary>Which published set of static stiffness formulas for a rigid rectangular footing.</summary>
public enum FootingFormulas
{
    /// <summary>Pais &amp; Kausel (1988), as tabulated in NIST GCR 12-917-21 (2012).</summary>
    PaisKausel,
    /// <summary>Gazetas (1991).</summary>
    Gazetas,
}

/// <summary>
/// Static stiffnesses of a rigid rectangular footing on (or embedded in) an elastic half-space, in the published axes:
/// x along the longer plan side (full length 2L), y along the shorter (full width 2B), z vertical.
/// Units: any consistent set (force F, length L): translations F/L, rotations F·L/rad.
/// </summary>
/// <param name="Formulas">Which published set.</param>
/// <param name="HalfLength">L, half the longer plan side (L).</param>
/// <param name="HalfWidth">B, half the shorter plan side (L).</param>
/// <param name="Embedment">D, depth of the footing's base below the ground surface (L); 0 for a surface footing.</param>
/// <param name="Vertical">K_z (F/L), embedment factor applied.</param>
/// <param name="SlidingX">K_x, sliding along the long side (F/L).</param>
/// <param name="SlidingY">K_y, sliding along the short side (F/L).</param>
/// <param name="RockingXX">K_xx, rocking about the long (x) axis: the weak axis (F·L/rad).</param>
/// <param name="RockingYY">K_yy, rocking about the short (y) axis: the strong axis (F·L/rad).</param>
/// <param name="SurfaceVertical">K_z of the same footing at the surface (F/L).</param>
/// <param name="SurfaceSlidingX">K_x at the surface.</param>
/// <param name="SurfaceSlidingY">K_y at the surface.</param>
/// <param name="SurfaceRockingXX">K_xx at the surface.</param>
/// <param name="SurfaceRockingYY">K_yy at the surface.</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record FootingStiffness(
    FootingFormulas Formulas, double HalfLength, double HalfWidth, double Embedment,
    double Vertical, double SlidingX, double SlidingY, double RockingXX, double RockingYY,
    double SurfaceVertical, double SurfaceSlidingX, double SurfaceSlidingY, double SurfaceRockingXX, double SurfaceRockingYY,
    HandMethod Method)
{
    /// <summary>
    /// The springs a planar model of a wall needs: sliding in the wall's plane and rocking in it, plus the vertical.
    /// A wall along the footing's long side (x) slides along x and rocks about y, the strong axis (K_yy); a wall along
    /// the short side slides along y and rocks about x (K_xx).
    /// </summary>
    /// <param name="wallAlongLongSide">True when the wall's plane contains the footing's longer side.</param>
    public (double Sliding, double Rocking, double Vertical) InPlane(bool wallAlongLongSide) =>
        wallAlongLongSide ? (SlidingX, RockingYY, Vertical) : (SlidingY, RockingXX, Vertical);
}

/// <summary>
/// Static stiffness formulas of rigid rectangular footings. Both sets take the plan sides in any order (the longer
/// becomes 2L) and report in the published axes (<see cref="FootingStiffness"/>). Units: any consistent set.
/// </summary>
public static class RigidFooting
{
    /// <summary>
    /// Pais &amp; Kausel (1988), "Approximate formulas for dynamic stiffnesses of rigid foundations", Soil Dyn. Earthq.
    /// Eng. 7(4):213–227, as tabulated in NIST GCR 12-917-21 (2012) Table 2-2a, with B and L half-dimensions:
    /// K_z = GB/(1−ν)·[3.1(L/B)^0.75 + 1.6]; K_y = GB/(2−ν)·[6.8(L/B)^0.65 + 0.8(L/B) + 1.6];
    /// K_x = GB/(2−ν)·[6.8(L/B)^0.65 + 2.4]; K_xx = GB³/(1−ν)·[3.2(L/B) + 0.8]; K_yy = GB³/(1−ν)·[3.73(L/B)^2.4 + 0.27].
    /// Embedment factors: η_z = 1 + (0.25 + 0.25/(L/B))(D/B)^0.8; η_x = η_y = 1 + (0.33 + 1.34/(1 + L/B))(D/B)^0.8;
    /// η_xx = 1 + D/B + 1.6/(0.35 + L/B)·(D/B)²; η_yy = 1 + D/B + 1.6/(0.35 + (L/B)⁴)·(D/B)².
    /// </summary>
    /// <param name="side1">One plan side (L), positive.</param>
    /// <param name="side2">The other plan side (L), positive.</param>
    /// <param name="embedment">Depth D of the base below grade (L), ≥ 0; the sidewalls are taken in contact with the soil.</param>
    /// <param name="soil">G and ν of the soil.</param>
    public static FootingStiffness PaisKausel(double side1, double side2, double embedment, SoilProperties soil)
    {
        var (l, b, d, g, nu) = Inputs(side1, side2, embedment, soil);
        double r = l / b, e = d / b;
        double kz = g * b / (1 - nu) * (3.1 * Math.Pow(r, 0.75) + 1.6);
        double ky = g * b / (2 - nu) * (6.8 * Math.Pow(r, 0.65) + 0.8 * r + 1.6);
        double kx = g * b / (2 - nu) * (6.8 * Math.Pow(r, 0.65) + 2.4);
        double kxx = g * b * b * b / (1 - nu) * (3.2 * r + 0.8);
        double kyy = g * b * b * b / (1 - nu) * (3.73 * Math.Pow(r, 2.4) + 0.27);
        double etaZ = 1 + (0.25 + 0.25 / r) * Math.Pow(e, 0.8);
        double etaH = 1 + (0.33 + 1.34 / (1 + r)) * Math.Pow(e, 0.8);
        double etaXX = 1 + e + 1.6 / (0.35 + r) * e * e;
        double etaYY = 1 + e + 1.6 / (0.35 + r * r * r * r) * e * e;
        var method = new HandMethod("Rigid rectangular footing, static stiffness by Pais & Kausel",
            "Pais & Kausel, Soil Dyn. Earthq. Eng. 7(4):213–227, 1988, as tabulated in NIST GCR 12-917-21 (2012) Table 2-2a (embedment factors from memory except η_yy)",
            Assumptions(d, "sidewalls in full contact with the soil over the embedment depth"));
        return new FootingStiffness(FootingFormulas.PaisKausel, l, b, d,
            kz * etaZ, kx * etaH, ky * etaH, kxx * etaXX, kyy * etaYY, kz, kx, ky, kxx, kyy, method);
    }

    /// <summary>
    /// Gazetas (1991), "Formulas and charts for impedances of surface and embedded foundations", J. Geotech. Eng.
    /// 117(9):1363–1381, static stiffness of a rectangle 2L × 2B (χ = A_b/4L² = B/L):
    /// K_z = 2GL/(1−ν)·(0.73 + 1.54χ^0.75); K_y = 2GL/(2−ν)·(2 + 2.5χ^0.85); K_x = K_y − 0.2/(0.75−ν)·GL·(1 − B/L);
    /// K_xx = G/(1−ν)·I_bx^0.75·(L/B)^0.25·(2.4 + 0.5B/L); K_yy = 3G/(1−ν)·I_by^0.75·(L/B)^0.15,
    /// I_bx = (2L)(2B)³/12 and I_by = (2B)(2L)³/12 the base's second moments. Embedment with the sidewall in contact
    /// over the full depth (d = D, sidewall area A_w = 2D(2L + 2B), its centroid at D/2):
    /// η_z = [1 + D/(21B)·(1 + 1.3χ)]·[1 + 0.2(A_w/A_b)^(2/3)]; η_y = [1 + 0.15√(D/B)]·[1 + 0.52(D/2·A_w/(B·L²))^0.4];
    /// η_x the same with L·B² for B·L²; η_xx = 1 + 1.26(d/B)·[1 + (d/B)(d/D)^−0.2·√(B/L)];
    /// η_yy = 1 + 0.92(d/L)^0.6·[1.5 + (d/L)^1.9·(d/D)^−0.6]. Surface K_yy as cited in the project's references;
    /// the other terms from memory, cross-read against a public implementation.
    /// </summary>
    /// <inheritdoc cref="PaisKausel" path="/param"/>
    public static FootingStiffness Gazetas(double side1, double side2, double embedment, SoilProperties soil)
    {
        var (l, b, d, g, nu) = Inputs(side1, side2, embedment, soil);
        double chi = b / l;
        double ibx = 2 * l * Math.Pow(2 * b, 3) / 12, iby = 2 * b * Math.Pow(2 * l, 3) / 12;
        double kz = 2 * g * l / (1 - nu) * (0.73 + 1.54 * Math.Pow(chi, 0.75));
        double ky = 2 * g * l / (2 - nu) * (2 + 2.5 * Math.Pow(chi, 0.85));
        double kx = ky - 0.2 / (0.75 - nu) * g * l * (1 - b / l);
        double kxx = g / (1 - nu) * Math.Pow(ibx, 0.75) * Math.Pow(l / b, 0.25) * (2.4 + 0.5 * b / l);
        double kyy = 3 * g / (1 - nu) * Math.Pow(iby, 0.75) * Math.Pow(l / b, 0.15);
        double etaZ = 1, etaX = 1, etaY = 1, etaXX = 1, etaYY = 1;
        if (d > 0)
        {
            double aw = 2 * d * (2 * l + 2 * b), ab = 4 * b * l, zw = d / 2;
            etaZ = (1 + d / (21 * b) * (1 + 1.3 * chi)) * (1 + 0.2 * Math.Pow(aw / ab, 2.0 / 3.0));
            etaY = (1 + 0.15 * Math.Sqrt(d / b)) * (1 + 0.52 * Math.Pow(zw * aw / (b * l * l), 0.4));
            etaX = (1 + 0.15 * Math.Sqrt(d / b)) * (1 + 0.52 * Math.Pow(zw * aw / (l * b * b), 0.4));
            etaXX = 1 + 1.26 * d / b * (1 + d / b * Math.Sqrt(b / l));             // (d/D)^−0.2 = 1 with d = D
            etaYY = 1 + 0.92 * Math.Pow(d / l, 0.6) * (1.5 + Math.Pow(d / l, 1.9)); // (d/D)^−0.6 = 1 with d = D
        }
        var method = new HandMethod("Rigid rectangular footing, static stiffness by Gazetas",
            "Gazetas, J. Geotech. Eng. 117(9):1363–1381, 1991 (surface K_yy as cited; the other terms and the embedment factors from memory)",
            Assumptions(d, "sidewalls in contact with the soil over the full embedment depth (d = D)"));
        return new FootingStiffness(FootingFormulas.Gazetas, l, b, d,
            kz * etaZ, kx * etaX, ky * etaY, kxx * etaXX, kyy * etaYY, kz, kx, ky, kxx, kyy, method);
    }

    /// <summary>Either set, by name.</summary>
    public static FootingStiffness By(FootingFormulas formulas, double side1, double side2, double embedment, SoilProperties soil) =>
        formulas == FootingFormulas.Gazetas ? Gazetas(side1, side2, embedment, soil) : PaisKausel(side1, side2, embedment, soil);

    private static (double L, double B, double D, double G, double Nu) Inputs(double side1, double side2, double embedment, SoilProperties soil)
    {
        Guard.Positive(side1, "A footing's plan side");
        Guard.Positive(side2, "A footing's plan side");
        Guard.NonNegative(embedment, "The embedment depth D");
        Guard.Positive(soil.ShearModulus, "The soil shear modulus G");
        Soil.SoilPoisson(soil.PoissonRatio);
        return (Math.Max(side1, side2) / 2, Math.Min(side1, side2) / 2, embedment, soil.ShearModulus, soil.PoissonRatio);
    }

    private static string[] Assumptions(double d, string sidewall) =>
    [
        "rigid footing (plane base that translates and rotates as a body)",
        "homogeneous elastic half-space, no soil layering or bedrock at shallow depth",
        "static (zero-frequency) stiffness: no radiation damping, no frequency dependence",
        "full contact, no uplift: linear only while the overturning moment stays below the weight's restoring moment",
        d > 0 ? sidewall : "surface footing (no embedment)",
    ];
}

/// <summary>
/// A cantilever wall or pier on a flexible base (rocking spring K_θ and sliding spring K_h at the base): the fixed-base
/// terms plus the base terms, 1/k = h³/(3EI) + h/(κGA) + h²/K_θ + 1/K_h (derived: the base rotates by P·h/K_θ, which
/// carries the top over by P·h²/K_θ, and slides by P/K_h; the wall bends and shears as before, since its internal forces
/// are statically determinate). Units: any consistent set.
/// </summary>
/// <param name="Load">Lateral force P at the top (F).</param>
/// <param name="Height">h (L), the lever arm of P about the base.</param>
/// <param name="FlexuralDeflection">P·h³/(3EI) (L).</param>
/// <param name="ShearDeflection">P·h/(κGA) (L).</param>
/// <param name="RockingDeflection">P·h²/K_θ (L).</param>
/// <param name="SlidingDeflection">P/K_h (L).</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record FlexibleBaseDeflection(double Load, double Height, double FlexuralDeflection, double ShearDeflection,
    double RockingDeflection, double SlidingDeflection, HandMethod Method)
{
    /// <summary>Sum of the four terms (L).</summary>
    public double TotalDeflection => FlexuralDeflection + ShearDeflection + RockingDeflection + SlidingDeflection;
    /// <summary>P/Δ (F/L).</summary>
    public double Stiffness => Load / TotalDeflection;
    /// <summary>Stiffness of the same wall on a fixed base (F/L).</summary>
    public double FixedBaseStiffness => Load / (FlexuralDeflection + ShearDeflection);
    public double FlexuralShare => FlexuralDeflection / TotalDeflection;
    public double ShearShare => ShearDeflection / TotalDeflection;
    public double RockingShare => RockingDeflection / TotalDeflection;
    public double SlidingShare => SlidingDeflection / TotalDeflection;
}

/// <summary>Fixed-base formulas extended by the base terms of a footing; period lengthening by the single-mode expression.</summary>
public static class FlexibleBase
{
    /// <summary>
    /// A cantilever (top free) on base springs: <see cref="FlexibleBaseDeflection"/>. A fixed-fixed pier is not
    /// covered (with the top held against rotation the base rotation no longer adds a separate term).
    /// </summary>
    /// <param name="fixedBase">The cantilever's fixed-base deflection (e.g. <see cref="Piers.Cantilever"/>).</param>
    /// <param name="rockingStiffness">K_θ (F·L/rad), positive; +∞ for a base held against rotation.</param>
    /// <param name="slidingStiffness">K_h (F/L), positive; +∞ for a base held against sliding.</param>
    public static FlexibleBaseDeflection Cantilever(MemberDeflection fixedBase, double rockingStiffness, double slidingStiffness)
    {
        if (fixedBase.Ends != EndFixity.Cantilever)
            throw new ArgumentException("The base terms h²/K_θ and 1/K_h add to a cantilever only; a pier held against rotation at the top is not covered.");
        if (!(rockingStiffness > 0)) throw new ArgumentException($"The rocking stiffness K_θ must be positive (+∞ for a fixed base); got {rockingStiffness}.");
        if (!(slidingStiffness > 0)) throw new ArgumentException($"The sliding stiffness K_h must be positive (+∞ for a fixed base); got {slidingStiffness}.");
        double p = fixedBase.Load, h = fixedBase.Height;
        double rock = p * h * h / rockingStiffness, slide = p / slidingStiffness;
        var method = fixedBase.Method with
        {
            Name = "Cantilever on base springs, flexure and shear of the fixed-base pier plus rocking P·h²/K_θ and sliding P/K_h",
            Source = fixedBase.Method.Source + "; base terms derived (rigid-body rotation and translation of the base)",
            Assumptions = [.. fixedBase.Method.Assumptions.Where(a => a != "base fully fixed"),
                "base on a rocking spring K_θ and a sliding spring K_h (a rigid footing on elastic soil)",
                "the footing's own mass and the soil's damping are left out"],
        };
        return new FlexibleBaseDeflection(p, h, fixedBase.FlexuralDeflection, fixedBase.ShearDeflection, rock, slide, method);
    }

    /// <summary>
    /// Period lengthening of a single-mode structure on a flexible base, T̃/T = √(1 + k/K_y·(1 + K_y·h̄²/K_θ))
    /// (ASCE 7-16 §19.2.1.1, eq. 19.2-3, from memory). The same follows by hand (derived): with the footing massless the
    /// flexibilities add in series, 1/k̃ = 1/k + 1/K_y + h̄²/K_θ, and T ∝ 1/√k, so T̃/T = √(k/k̃).
    /// </summary>
    /// <param name="structureStiffness">k, the fixed-base lateral stiffness at the effective height (F/L), positive.</param>
    /// <param name="slidingStiffness">K_y, the footing's lateral stiffness (F/L), positive; +∞ for a base held against sliding.</param>
    /// <param name="rockingStiffness">K_θ, the footing's rocking stiffness (F·L/rad), positive; +∞ for a base held against rocking.</param>
    /// <param name="effectiveHeight">h̄, the effective height of the mode (L), positive.</param>
    public static HandValue PeriodRatio(double structureStiffness, double slidingStiffness, double rockingStiffness, double effectiveHeight)
    {
        Guard.Positive(structureStiffness, "The fixed-base stiffness k");
        Guard.Positive(effectiveHeight, "The effective height h̄");
        if (!(slidingStiffness > 0)) throw new ArgumentException($"The footing's lateral stiffness K_y must be positive (+∞ for a base held against sliding); got {slidingStiffness}.");
        if (!(rockingStiffness > 0)) throw new ArgumentException($"The footing's rocking stiffness K_θ must be positive (+∞ for a base held against rocking); got {rockingStiffness}.");
        double k = structureStiffness, ky = slidingStiffness, kt = rockingStiffness, h = effectiveHeight;
        // k/K_y·(1 + K_y·h̄²/K_θ) multiplied out, so that a rigid direction (K = +∞) drops its term.
        return new HandValue(Math.Sqrt(1 + k / ky + k * h * h / kt), "period ratio T̃/T",
            new HandMethod("Period lengthening of a single-mode structure on a flexible base",
                "ASCE 7-16 §19.2.1.1, eq. 19.2-3 (from memory); the series-spring derivation gives the same",
                ["one mode, the structure's mass lumped at the effective height h̄", "the footing's mass left out",
                 "static foundation stiffnesses, no damping", "for verification by a licensed engineer; the governing local code decides"]));
    }
}
