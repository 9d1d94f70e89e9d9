using System.Globalization;

namespace PlaneLateral.Hand;

/// <summary>The lateral load on a coupled wall for the closed forms.</summary>
public enum CoupledWallLoad
{
    /// <summary>A uniformly distributed lateral load w per unit height over the whole height (F/L).</summary>
    Uniform,

    /// <summary>A point load P at the top (F).</summary>
    TopPoint,
}

/// <summary>
/// Two wall piers joined by coupling beams at every floor, as the continuous-connection method needs them.
/// Units: any consistent set (force F, length L).
/// </summary>
/// <param name="E">Young's modulus of walls and beams (F/L²), positive.</param>
/// <param name="I1">Second moment of area of pier 1 about its own centroid (L⁴), positive.</param>
/// <param name="I2">Second moment of area of pier 2 (L⁴), positive.</param>
/// <param name="A1">Area of pier 1 (L²), positive.</param>
/// <param name="A2">Area of pier 2 (L²), positive.</param>
/// <param name="CentroidSpacing">l, the distance between the two piers' centroids (L), positive.</param>
/// <param name="BeamSpan">b, the flexible span of a coupling beam (L), positive: the clear opening in the classic form
/// (some texts add part of the beam depth: that is the caller's choice, stated in the result).</param>
/// <param name="StoryHeight">h, the vertical spacing of the coupling beams (L), positive.</param>
/// <param name="BeamInertia">I_c, the coupling beam's second moment of area (L⁴), positive (cracked value if wanted).</param>
/// <param name="Height">H, the total height of the wall (L), positive.</param>
/// <param name="BeamShearRigidity">G·A_s of a coupling beam (F), or +∞ (the classic form): no beam shear deformation.</param>
public sealed record CoupledWallPair(double E, double I1, double I2, double A1, double A2, double CentroidSpacing,
    double BeamSpan, double StoryHeight, double BeamInertia, double Height, double BeamShearRigidity = double.PositiveInfinity)
{
    /// <summary>I = I₁ + I₂ (L⁴).</summary>
    public double I => I1 + I2;

    /// <summary>A = A₁ + A₂ (L²).</summary>
    public double A => A1 + A2;

    /// <summary>
    /// The coupling beam's I_c reduced for its own shear deformation, I_c/(1 + Φ_b), Φ_b = 12·E·I_c/(G·A_s·b²) (derived:
    /// a fixed-fixed beam of span b under end shear V sways V·b³/(12EI_c) + V·b/(G·A_s) = V·b³(1 + Φ_b)/(12EI_c)).
    /// Equal to I_c when <see cref="BeamShearRigidity"/> is +∞.
    /// </summary>
    public double EffectiveBeamInertia => double.IsPositiveInfinity(BeamShearRigidity)
        ? BeamInertia
        : BeamInertia / (1 + 12 * E * BeamInertia / (BeamShearRigidity * BeamSpan * BeamSpan));

    /// <summary>k² = 1 + A·I/(A₁A₂l²) (dimensionless, &gt; 1).</summary>
    public double K2 => 1 + A * I / (A1 * A2 * CentroidSpacing * CentroidSpacing);

    /// <summary>α² = 12·I_c·l²/(b³·h·I) (1/L²), with the effective I_c.</summary>
    public double Alpha2 => 12 * EffectiveBeamInertia * CentroidSpacing * CentroidSpacing / (BeamSpan * BeamSpan * BeamSpan * StoryHeight * I);

    /// <summary>The governing dimensionless parameter k·α·H.</summary>
    public double KAlphaH => Math.Sqrt(K2 * Alpha2) * Height;
}

/// <summary>
/// Closed-form results of the continuous-connection method for a load case. Forces in F, lengths in L.
/// </summary>
/// <param name="Load">The load case.</param>
/// <param name="Magnitude">w (F/L) for a uniform load, P (F) for a top point load.</param>
/// <param name="TopDeflection">Lateral deflection at the top (L), flexure of the walls only.</param>
/// <param name="BaseAxialForce">N at the base: tension in one pier, compression in the other (F), the sum of all beam shears.</param>
/// <param name="BaseOverturningMoment">M₀, the overturning moment of the load about the base (F·L).</param>
/// <param name="DegreeOfCoupling">N·l/M₀ at the base: the share of the overturning moment resisted by the axial-force couple.</param>
/// <param name="KAlphaH">The parameter kαH the results depend on.</param>
/// <param name="K2">k² (the rigid-coupling limit of the degree of coupling is 1/k²).</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record CoupledWallResult(CoupledWallLoad Load, double Magnitude, double TopDeflection, double BaseAxialForce,
    double BaseOverturningMoment, double DegreeOfCoupling, double KAlphaH, double K2, HandMethod Method)
{
    /// <summary>The wall the result is for.</summary>
    public CoupledWallPair Pair { get; init; } = null!;

    /// <summary>
    /// Axial force N(ξ) in each pier at depth ξ below the top (F): the sum of the beam shears above (derived; see
    /// <see cref="CoupledWalls.ContinuousMedium"/>).
    /// </summary>
    public double AxialForceAt(double depthBelowTop) => CoupledWalls.AxialForce(Pair, Load, Magnitude, depthBelowTop);

    /// <summary>
    /// The shear one coupling beam carries, smeared over its story: the shear flow q = dN/dξ (F/L) at depth ξ below the
    /// top, times the beam spacing h (F).
    /// </summary>
    public double BeamShearAt(double depthBelowTop) => CoupledWalls.ShearFlow(Pair, Load, Magnitude, depthBelowTop) * Pair.StoryHeight;

    /// <summary>
    /// The shear of each discrete beam, bottom floor first (F): the medium's shear flow gathered over the beam's
    /// tributary height, half a story above and below it (half a story at the roof; the first floor's beam down to the
    /// base), N(ξ + h/2) − N(ξ − h/2) clipped to the wall (common practice for turning a smeared medium back into discrete beams). They sum to the base axial force.
    /// </summary>
    public IReadOnlyList<double> FloorBeamShears()
    {
        double h = Pair.StoryHeight, H = Pair.Height;
        int n = (int)Math.Round(H / h);
        var list = new double[n];
        for (int j = 1; j <= n; j++)
        {
            double xi = H - j * h;
            // The first floor's beam also takes the medium below it, down to the base (no beam stands lower).
            list[j - 1] = AxialForceAt(j == 1 ? H : xi + h / 2) - AxialForceAt(Math.Max(0, xi - h / 2));
        }
        return list;
    }
}

/// <summary>
/// Coupled shear walls: the continuous-connection (continuous medium) closed form for two piers, and the two hand bounds
/// (independent cantilevers; one solid wall of the piers' combined section). Units: any consistent set (F, L).
/// </summary>
/// <remarks>
/// <para><b>Derivation</b> (derived here; the parameters as published by Stafford Smith &amp; Coull, <i>Tall Building
/// Structures: Analysis and Design</i>, 1991, ch. 7, after Rosman; equation numbers not checked). The beams, spacing h,
/// are smeared into a continuous connecting medium cut at its mid-span (the beams' point of contraflexure). With ξ the
/// depth below the top, N(ξ) the axial force in each pier (the sum of the beam shears above ξ), q = dN/dξ the shear flow
/// in the medium, M(ξ) the external overturning moment and y the lateral deflection common to both piers:</para>
/// <list type="number">
/// <item>Moment equilibrium of the cut wall: M₁ + M₂ + N·l = M, and both piers bend alike, E·I·y″ = M − N·l.</item>
/// <item>Compatibility at the cut: the piers' rotation opens a relative vertical movement l·y′; the beams' bending closes
/// q·h·b³/(12EI_c) (fixed-ended beam of span b under end shear q·h); the piers' axial strain closes
/// (1/E)(1/A₁ + 1/A₂)∫N dz from the base. Differentiating once and eliminating y″ with (1):
/// N″ − α²k²·N = −α²·M/l, with α² = 12I_c·l²/(b³·h·I) and k² = 1 + A·I/(A₁A₂l²).</item>
/// <item>Boundary conditions: N = 0 at the top (no beam above); q = N′ = 0 at the base (the piers neither rotate nor
/// strain there, so compatibility leaves the medium unstrained).</item>
/// </list>
/// <para>With β = αk: for a top point load P (M = P·ξ), N = (P/(k²l))·[ξ − sinh βξ/(β·cosh βH)]; for a uniform load w
/// (M = wξ²/2), N = (w/(k²l))·[ξ²/2 + (1 − cosh βξ)/β² + (tanh βH/β² − H/(β·cosh βH))·sinh βξ]. The top deflection is
/// the moment-area integral Δ = ∫₀ᴴ ξ·(M − N·l)/(EI) dξ. With x = kαH:</para>
/// <list type="bullet">
/// <item>top point load: Δ = (PH³/3EI)·[1 − (1/k²)(1 − 3/x² + 3·tanh x/x³)]; degree of coupling (1/k²)(1 − tanh x/x);</item>
/// <item>uniform load: Δ = (wH⁴/8EI)·[1 − (1/k²)(1 − 4/x² + 8(sech x − 1)/x⁴ + 8·tanh x/x³)];
/// degree of coupling (1/k²)(1 − 2·tanh x/x + 2(1 − sech x)/x²).</item>
/// </list>
/// <para>Limits (checked in the tests): x → 0 gives the independent cantilevers (ΣI) and no coupling; x → ∞ gives the
/// combined section I·k²/(k² − 1) = I + A₁A₂l²/A and the degree of coupling 1/k² (rigid beams).</para>
/// <para>Degree of coupling as a measure: Hoenderkamp, <i>Sādhanā</i> 37(4):481–492, 2012.</para>
/// </remarks>
public static class CoupledWalls
{
    /// <summary>
    /// The continuous-connection closed form for two piers coupled by uniform beams at every story.
    /// Source: Stafford Smith &amp; Coull, Tall Building Structures, 1991, ch. 7 (after Rosman) for the method and its
    /// parameters k² and α²; the closed forms derived here (see the remarks) and checked against their limits.
    /// </summary>
    /// <param name="pair">The geometry and stiffness of the two piers and their beams.</param>
    /// <param name="load">Uniform load or top point load.</param>
    /// <param name="magnitude">w (F/L) or P (F), positive.</param>
    public static CoupledWallResult ContinuousMedium(CoupledWallPair pair, CoupledWallLoad load, double magnitude)
    {
        Validate(pair);
        Guard.Positive(magnitude, "The load magnitude");
        double H = pair.Height, k2 = pair.K2, x = pair.KAlphaH, ei = pair.E * pair.I;
        double m0, delta, doc;
        if (load == CoupledWallLoad.TopPoint)
        {
            m0 = magnitude * H;
            delta = magnitude * H * H * H / (3 * ei) * (1 - PointShape(x) / k2);
            doc = (1 - TanhOver(x)) / k2;
        }
        else if (load == CoupledWallLoad.Uniform)
        {
            m0 = magnitude * H * H / 2;
            delta = magnitude * H * H * H * H / (8 * ei) * (1 - UniformShape(x) / k2);
            doc = (1 - 2 * TanhOver(x) + 2 * OneMinusSechOver2(x)) / k2;
        }
        else throw new ArgumentException($"Unknown load {load}.");
        var c = CultureInfo.InvariantCulture;
        bool beamShear = !double.IsPositiveInfinity(pair.BeamShearRigidity);
        var method = new HandMethod("Coupled walls, continuous-connection method",
            "Stafford Smith & Coull, Tall Building Structures: Analysis and Design, 1991, ch. 7 (after Rosman), parameters k² and α²; closed forms derived from the governing equation (docs/coupled-walls.md); degree of coupling as in Hoenderkamp, Sādhanā 37(4):481-492, 2012",
            ["the coupling beams are smeared into a continuous medium of the same stiffness per unit height",
             "the beams have a point of contraflexure at mid-span and are fixed at the pier faces (rigid within the piers)",
             "both piers deflect alike (axially rigid beams) and bend with plane sections",
             "walls: flexure and axial strain only, no shear deformation",
             beamShear ? "beams: bending and shear deformation (I_c reduced to I_c/(1 + 12EI_c/(G·A_s·b²)))" : "beams: bending only, no shear deformation",
             "uniform piers and beams over the height, fixed base",
             string.Create(c, $"k² = {k2:G4}, kαH = {x:G4}"),
             "linear elastic"]);
        return new CoupledWallResult(load, magnitude, delta, doc * m0 / pair.CentroidSpacing, m0, doc, x, k2, method) { Pair = pair };
    }

    /// <summary>
    /// Lower bound: the piers as independent cantilevers sharing one deflection (no coupling beams): flexure only,
    /// Δ = PH³/(3EΣI) or wH⁴/(8EΣI). Source: elementary beam theory (Gere &amp; Timoshenko, Mechanics of Materials).
    /// </summary>
    /// <param name="e">Young's modulus (F/L²).</param>
    /// <param name="inertias">Each pier's I about its own centroid (L⁴).</param>
    /// <param name="height">H (L).</param>
    /// <param name="load">Uniform or top point load.</param>
    /// <param name="magnitude">w (F/L) or P (F).</param>
    public static HandValue IndependentCantilevers(double e, IReadOnlyList<double> inertias, double height, CoupledWallLoad load, double magnitude)
    {
        Guard.Positive(e, "Young's modulus E");
        Guard.NotEmpty(inertias, "The piers' second moments of area");
        foreach (var i in inertias) Guard.Positive(i, "A pier's second moment of area");
        Guard.Positive(height, "The wall height");
        Guard.Positive(magnitude, "The load magnitude");
        double sumI = inertias.Sum();
        return new HandValue(Cantilever(e * sumI, height, load, magnitude), "top deflection",
            new HandMethod("Coupled walls, lower bound: independent cantilevers",
                "elementary beam theory, cantilever deflection (Gere & Timoshenko, Mechanics of Materials); bound: common practice",
                ["the coupling beams are left out: each pier bends about its own centroid",
                 "the piers share one deflection at every height (floors rigid in their plane)",
                 "flexure only, no shear deformation", "fixed base, linear elastic"]));
    }

    /// <summary>
    /// Upper bound: the piers as one solid wall whose section is the piers' combined section (the opening not filled):
    /// I_s = Σ(I_i + A_i·(x_i − x̄)²), x̄ = ΣA_i x_i/ΣA_i; flexure only. For two piers I_s = I + A₁A₂l²/A = I·k²/(k² − 1).
    /// Source: elementary beam theory, plane sections across the whole wall (parallel-axis theorem); bound: common practice.
    /// </summary>
    /// <param name="e">Young's modulus (F/L²).</param>
    /// <param name="areas">Each pier's area (L²).</param>
    /// <param name="inertias">Each pier's I about its own centroid (L⁴).</param>
    /// <param name="centroids">Each pier centroid's position along the wall (L).</param>
    /// <param name="height">H (L).</param>
    /// <param name="load">Uniform or top point load.</param>
    /// <param name="magnitude">w (F/L) or P (F).</param>
    public static HandValue SolidWall(double e, IReadOnlyList<double> areas, IReadOnlyList<double> inertias, IReadOnlyList<double> centroids,
        double height, CoupledWallLoad load, double magnitude)
    {
        Guard.Positive(e, "Young's modulus E");
        Guard.NotEmpty(areas, "The piers' areas");
        if (inertias.Count != areas.Count || centroids.Count != areas.Count)
            throw new ArgumentException("Give one area, one second moment of area and one centroid per pier.");
        Guard.Positive(height, "The wall height");
        Guard.Positive(magnitude, "The load magnitude");
        double sumA = areas.Sum();
        double xbar = areas.Select((a, i) => a * centroids[i]).Sum() / sumA;
        double iS = inertias.Select((ii, k) => ii + areas[k] * (centroids[k] - xbar) * (centroids[k] - xbar)).Sum();
        return new HandValue(Cantilever(e * iS, height, load, magnitude), "top deflection",
            new HandMethod("Coupled walls, upper bound: one solid wall of the piers' combined section",
                "elementary beam theory with the parallel-axis theorem (Gere & Timoshenko, Mechanics of Materials); the rigid-beam limit of the continuous-connection method (Stafford Smith & Coull, 1991, ch. 7); bound: common practice",
                ["the coupling beams are rigid: plane sections remain plane across the whole wall",
                 "the section is the piers' own (openings not filled)", "flexure only, no shear deformation", "fixed base, linear elastic"]));
    }

    /// <summary>Cantilever top deflection under the load, flexure only (L).</summary>
    private static double Cantilever(double ei, double h, CoupledWallLoad load, double mag) => load switch
    {
        CoupledWallLoad.TopPoint => mag * h * h * h / (3 * ei),
        CoupledWallLoad.Uniform => mag * h * h * h * h / (8 * ei),
        _ => throw new ArgumentException($"Unknown load {load}."),
    };

    internal static double AxialForce(CoupledWallPair p, CoupledWallLoad load, double mag, double xi)
    {
        double b = Math.Sqrt(p.K2 * p.Alpha2), H = p.Height, f = mag / (p.K2 * p.CentroidSpacing);
        return load switch
        {
            // N = f·[ξ − sinh βξ/(β cosh βH)]
            CoupledWallLoad.TopPoint => f * (xi - Ratio(b, xi, H, -1) / b),
            // N = f·[ξ²/2 + (1 − cosh β(H−ξ)/cosh βH)/β² − H·sinh βξ/(β cosh βH)]
            // (the uniform-load solution with −cosh βξ + tanh βH·sinh βξ = −cosh β(H−ξ)/cosh βH)
            CoupledWallLoad.Uniform => f * (xi * xi / 2 + (1 - Ratio(b, H - xi, H, +1)) / (b * b) - H * Ratio(b, xi, H, -1) / b),
            _ => throw new ArgumentException($"Unknown load {load}."),
        };
    }

    internal static double ShearFlow(CoupledWallPair p, CoupledWallLoad load, double mag, double xi)
    {
        double b = Math.Sqrt(p.K2 * p.Alpha2), H = p.Height, f = mag / (p.K2 * p.CentroidSpacing);
        return load switch
        {
            // q = dN/dξ = f·[1 − cosh βξ/cosh βH]
            CoupledWallLoad.TopPoint => f * (1 - Ratio(b, xi, H, +1)),
            // q = f·[ξ + sinh β(H−ξ)/(β cosh βH) − H·cosh βξ/cosh βH]
            CoupledWallLoad.Uniform => f * (xi + Ratio(b, H - xi, H, -1) / b - H * Ratio(b, xi, H, +1)),
            _ => throw new ArgumentException($"Unknown load {load}."),
        };
    }

    /// <summary>cosh(βs)/cosh(βH) (sign +1) or sinh(βs)/cosh(βH) (sign −1) for 0 ≤ s ≤ H, written with exponentials of
    /// non-positive arguments so that a large βH does not overflow.</summary>
    private static double Ratio(double b, double s, double h, int sign) =>
        (Math.Exp(b * (s - h)) + sign * Math.Exp(-b * (s + h))) / (1 + Math.Exp(-2 * b * h));

    /// <summary>tanh x / x, with the series near 0.</summary>
    private static double TanhOver(double x) => x < 1e-4 ? 1 - x * x / 3 : Math.Tanh(x) / x;

    /// <summary>(1 − sech x)/x², with the series near 0.</summary>
    private static double OneMinusSechOver2(double x) => x < 1e-3 ? 0.5 - 5 * x * x / 24 : (1 - 1 / Math.Cosh(x)) / (x * x);

    /// <summary>1 − 3/x² + 3 tanh x/x³ (→ 0 as x → 0, → 1 as x → ∞); series 2x²/5 − 17x⁴/105 near 0.</summary>
    internal static double PointShape(double x) =>
        x < 0.05 ? 2 * x * x / 5 - 17 * x * x * x * x / 105 : 1 - 3 / (x * x) + 3 * Math.Tanh(x) / (x * x * x);

    /// <summary>1 − 4/x² + 8(sech x − 1)/x⁴ + 8 tanh x/x³ (→ 0 as x → 0, → 1 as x → ∞); series near 0.</summary>
    internal static double UniformShape(double x)
    {
        if (x < 0.03)
        {
            // sech x − 1 = −x²/2 + 5x⁴/24 − 61x⁶/720 + 277x⁸/8064; tanh x = x − x³/3 + 2x⁵/15 − 17x⁷/315 + 62x⁹/2835
            double x2 = x * x;
            return x2 * (-8.0 * 61 / 720 + 8.0 * 2 / 15) + x2 * x2 * (8.0 * 277 / 8064 - 8.0 * 17 / 315);
        }
        return 1 - 4 / (x * x) + 8 * (1 / Math.Cosh(x) - 1) / (x * x * x * x) + 8 * Math.Tanh(x) / (x * x * x);
    }

    private static void Validate(CoupledWallPair p)
    {
        if (p is null) throw new ArgumentException("The coupled wall is missing (null).");
        Guard.Positive(p.E, "Young's modulus E");
        Guard.Positive(p.I1, "I₁ of pier 1");
        Guard.Positive(p.I2, "I₂ of pier 2");
        Guard.Positive(p.A1, "A₁ of pier 1");
        Guard.Positive(p.A2, "A₂ of pier 2");
        Guard.Positive(p.CentroidSpacing, "The centroid spacing l");
        Guard.Positive(p.BeamSpan, "The beam span b");
        Guard.Positive(p.StoryHeight, "The story height h");
        Guard.Positive(p.BeamInertia, "The coupling beam's I_c");
        Guard.Positive(p.Height, "The wall height H");
        if (!(p.BeamShearRigidity > 0)) throw new ArgumentException($"The beam's shear rigidity G·A_s must be positive (or +∞ for none); got {p.BeamShearRigidity}.");
        if (p.Height < p.StoryHeight) throw new ArgumentException("The wall height H must be at least one story height h.");
    }
}
