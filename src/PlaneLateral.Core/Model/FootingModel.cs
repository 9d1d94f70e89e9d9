namespace PlaneLateral.Model;

/// <summary>Which published set of static stiffness formulas sets a footing's springs.</summary>
public enum FootingFormulaSet
{
    /// <summary>Pais &amp; Kausel (1988), as tabulated in NIST GCR 12-917-21 (2012) Table 2-2a (the default).</summary>
    PaisKausel,
    /// <summary>Gazetas (1991).</summary>
    Gazetas,
}

/// <summary>
/// Static stiffnesses of a rigid rectangular footing (SI: N/m and N·m/rad) in the published axes, x along the longer
/// plan side, y along the shorter, and the three springs a planar model takes from them.
/// </summary>
/// <param name="Kx">Sliding along the long side (N/m).</param>
/// <param name="Ky">Sliding along the short side (N/m).</param>
/// <param name="Kz">Vertical (N/m).</param>
/// <param name="Kxx">Rocking about the long axis, the weak axis (N·m/rad).</param>
/// <param name="Kyy">Rocking about the short axis, the strong axis (N·m/rad).</param>
/// <param name="AlongLongSide">True when the model's plane contains the footing's longer side (its "length" ≥ its "width").</param>
public sealed record FootingSprings(double Kx, double Ky, double Kz, double Kxx, double Kyy, bool AlongLongSide)
{
    /// <summary>Sliding in the model's plane (N/m): K_x for a footing whose long side lies in the plane, else K_y.</summary>
    public double Sliding => AlongLongSide ? Kx : Ky;
    /// <summary>Rocking in the model's plane (N·m/rad): about the axis normal to the plane, K_yy or K_xx.</summary>
    public double Rocking => AlongLongSide ? Kyy : Kxx;
    /// <summary>Vertical (N/m).</summary>
    public double Vertical => Kz;
}

/// <summary>
/// A rigid rectangular footing under a supported node, on soil; its springs replace the support's restraints in the
/// directions of <see cref="SpringDirections"/> (docs/footings.md). SI throughout.
/// </summary>
/// <param name="Id">The footing's id.</param>
/// <param name="Node">Index of the supported node.</param>
/// <param name="Length">Plan side in the model's plane (m).</param>
/// <param name="Width">Plan side across the model's plane (m).</param>
/// <param name="Embedment">Depth of the footing's base below grade (m).</param>
/// <param name="SmallStrainModulus">Soil G₀ (N/m²), given or from (γ/g)·Vs².</param>
/// <param name="Reduction">Strain-compatible G/G₀ in (0, 1].</param>
/// <param name="PoissonRatio">Soil ν in (0, 0.5).</param>
/// <param name="Formulas">Which published set sets the springs.</param>
/// <param name="SpringDirections">The directions given springs ("x", "y", "rz"); the others keep the support's restraint.</param>
/// <param name="Springs">The stiffnesses by <see cref="Formulas"/>.</param>
/// <param name="Cautions">Plain sentences on inputs that are accepted but at the edge of the formulas' range.</param>
public sealed record Footing(string Id, int Node, double Length, double Width, double Embedment,
    double SmallStrainModulus, double Reduction, double PoissonRatio, FootingFormulaSet Formulas,
    IReadOnlyList<Dof> SpringDirections, FootingSprings Springs, IReadOnlyList<string> Cautions)
{
    /// <summary>The wall panel whose base stands on the footing (a rigid footing under its base nodes), or null for a footing under a supported node (then <see cref="Node"/> ≥ 0; −1 here).</summary>
    public string? Panel { get; init; }

    /// <summary>Where the footing was declared (its JSON object), for messages; null when built in code.</summary>
    public object? At { get; init; }

    /// <summary>The soil shear modulus the formulas use, G = reduction·G₀ (N/m²).</summary>
    public double ShearModulus => Reduction * SmallStrainModulus;

    /// <summary>The same footing on soil whose modulus is scaled by <paramref name="factor"/> (bounds on uncertain soil).</summary>
    public Footing WithModulusScaled(double factor) => this with
    {
        SmallStrainModulus = SmallStrainModulus * factor,
        Springs = FootingSoilSprings.Compute(Formulas, Length, Width, Embedment, ShearModulus * factor, PoissonRatio),
    };
}

/// <summary>
/// The engine's own evaluation of the published static stiffness formulas of a rigid rectangular footing (kept apart
/// from the hand-method library on purpose: a test checks that the two agree). B and L are half the shorter and longer
/// plan sides, D the embedment, G and ν the soil's.
/// </summary>
public static class FootingSoilSprings
{
    /// <summary>
    /// Stiffnesses (SI) by the chosen set. Pais &amp; Kausel 1988 (NIST GCR 12-917-21 Table 2-2a):
    /// K_z = GB/(1−ν)[3.1(L/B)^0.75 + 1.6], K_y = GB/(2−ν)[6.8(L/B)^0.65 + 0.8L/B + 1.6], K_x = GB/(2−ν)[6.8(L/B)^0.65 + 2.4],
    /// K_xx = GB³/(1−ν)[3.2L/B + 0.8], K_yy = GB³/(1−ν)[3.73(L/B)^2.4 + 0.27], times the embedment factors
    /// η_z = 1 + (0.25 + 0.25B/L)(D/B)^0.8, η_x = η_y = 1 + (0.33 + 1.34/(1 + L/B))(D/B)^0.8,
    /// η_xx = 1 + D/B + 1.6/(0.35 + L/B)(D/B)², η_yy = 1 + D/B + 1.6/(0.35 + (L/B)⁴)(D/B)².
    /// Gazetas 1991 (J. Geotech. Eng. 117(9)), with the sidewall in contact over the whole embedment: see docs/footings.md.
    /// </summary>
    /// <param name="set">Which formulas.</param>
    /// <param name="length">Plan side in the model's plane (m).</param>
    /// <param name="width">Plan side across the plane (m).</param>
    /// <param name="embedment">D (m), ≥ 0.</param>
    /// <param name="g">Soil shear modulus (N/m²), &gt; 0.</param>
    /// <param name="nu">Soil Poisson's ratio, in (0, 0.5).</param>
    public static FootingSprings Compute(FootingFormulaSet set, double length, double width, double embedment, double g, double nu)
    {
        if (!(length > 0 && width > 0 && embedment >= 0 && g > 0 && nu > 0 && nu < 0.5))
            throw new ArgumentOutOfRangeException(nameof(length), "footing sides and soil modulus must be positive, embedment ≥ 0, ν in (0, 0.5)");
        double l = Math.Max(length, width) / 2, b = Math.Min(length, width) / 2, d = embedment;
        bool along = length >= width;
        return set == FootingFormulaSet.Gazetas ? Gazetas(l, b, d, g, nu, along) : PaisKausel(l, b, d, g, nu, along);
    }

    private static FootingSprings PaisKausel(double l, double b, double d, double g, double nu, bool along)
    {
        double r = l / b, e = d / b, b3 = b * b * b;
        double ePow = Math.Pow(e, 0.8);
        double ez = 1 + (0.25 + 0.25 / r) * ePow;
        double eh = 1 + (0.33 + 1.34 / (1 + r)) * ePow;
        double exx = 1 + e + 1.6 / (0.35 + r) * e * e;
        double eyy = 1 + e + 1.6 / (0.35 + Math.Pow(r, 4)) * e * e;
        double r65 = Math.Pow(r, 0.65);
        return new FootingSprings(
            Kx: g * b / (2 - nu) * (6.8 * r65 + 2.4) * eh,
            Ky: g * b / (2 - nu) * (6.8 * r65 + 0.8 * r + 1.6) * eh,
            Kz: g * b / (1 - nu) * (3.1 * Math.Pow(r, 0.75) + 1.6) * ez,
            Kxx: g * b3 / (1 - nu) * (3.2 * r + 0.8) * exx,
            Kyy: g * b3 / (1 - nu) * (3.73 * Math.Pow(r, 2.4) + 0.27) * eyy,
            AlongLongSide: along);
    }

    private static FootingSprings Gazetas(double l, double b, double d, double g, double nu, bool along)
    {
        double chi = b / l;
        double ibx = 2 * l * 8 * b * b * b / 12, iby = 2 * b * 8 * l * l * l / 12;
        double ky = 2 * g * l / (2 - nu) * (2 + 2.5 * Math.Pow(chi, 0.85));
        double kx = ky - 0.2 / (0.75 - nu) * g * l * (1 - chi);
        double kz = 2 * g * l / (1 - nu) * (0.73 + 1.54 * Math.Pow(chi, 0.75));
        double kxx = g / (1 - nu) * Math.Pow(ibx, 0.75) * Math.Pow(l / b, 0.25) * (2.4 + 0.5 * chi);
        double kyy = 3 * g / (1 - nu) * Math.Pow(iby, 0.75) * Math.Pow(l / b, 0.15);
        if (d > 0)
        {
            double sideArea = 4 * d * (l + b), baseArea = 4 * b * l, armArea = d / 2 * sideArea;
            double common = 1 + 0.15 * Math.Sqrt(d / b);
            kz *= (1 + d / (21 * b) * (1 + 1.3 * chi)) * (1 + 0.2 * Math.Pow(sideArea / baseArea, 2.0 / 3.0));
            ky *= common * (1 + 0.52 * Math.Pow(armArea / (b * l * l), 0.4));
            kx *= common * (1 + 0.52 * Math.Pow(armArea / (l * b * b), 0.4));
            kxx *= 1 + 1.26 * d / b * (1 + d / b * Math.Sqrt(chi));
            kyy *= 1 + 0.92 * Math.Pow(d / l, 0.6) * (1.5 + Math.Pow(d / l, 1.9));
        }
        return new FootingSprings(kx, ky, kz, kxx, kyy, along);
    }
}

/// <summary>
/// A wall line standing on a footing, checked fixed-base and on the footing's springs side by side (the "footing-wall"
/// comparison, docs/footings.md): a vertical chain of line members of one section, base first, whose base node has
/// the footing <see cref="FootingId"/> under it.
/// </summary>
/// <param name="TopWeight">Weight lumped at the top (N) for the periods, or null for stiffness rows only.</param>
public sealed record FootingWallCheck(string Id, string Description, double? Tolerance, CheckLocation At,
    IReadOnlyList<int> Members, int BaseNode, int TopNode, string FootingId, double? TopWeight)
    : ComparisonCheck(Id, Description, Tolerance, At);
