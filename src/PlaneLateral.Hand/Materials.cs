namespace PlaneLateral.Hand;

/// <summary>Isotropic elastic constants. Units: any consistent set (stress F/L²).</summary>
public static class Elastic
{
    /// <summary>
    /// Shear modulus of an isotropic elastic material, G = E / (2(1 + ν)).
    /// Source: classical elasticity; e.g. Gere &amp; Timoshenko, Mechanics of Materials, section on shear stress and strain.
    /// </summary>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="nu">Poisson's ratio ν, strictly between −1 and 0.5.</param>
    public static HandValue ShearModulus(double e, double nu)
    {
        Guard.Positive(e, "Young's modulus E");
        Guard.Poisson(nu);
        return new HandValue(e / (2.0 * (1.0 + nu)), "shear modulus G",
            new HandMethod("Isotropic shear modulus G = E/(2(1+ν))",
                "Classical elasticity; Gere & Timoshenko, Mechanics of Materials",
                ["the material is linear elastic and isotropic"]));
    }
}

/// <summary>Shear form factors f (the reciprocal of the shear coefficient κ): shear area = A / f.</summary>
public static class ShearForm
{
    /// <summary>The common default shear form factor for a solid rectangle, f = 1.2 (Gere &amp; Timoshenko, Mechanics of Materials).</summary>
    public const double RectangleDefault = 1.2;

    /// <summary>
    /// Cowper's shear coefficient for a solid rectangle, κ = 10(1 + ν) / (12 + 11ν).
    /// Source: G. R. Cowper, "The shear coefficient in Timoshenko's beam theory", J. Appl. Mech. 33:335–340, 1966.
    /// </summary>
    /// <param name="nu">Poisson's ratio ν, strictly between −1 and 0.5.</param>
    public static HandValue CowperRectangleCoefficient(double nu)
    {
        Guard.Poisson(nu);
        return new HandValue(10.0 * (1.0 + nu) / (12.0 + 11.0 * nu), "shear coefficient κ (rectangle)", Cowper);
    }

    /// <summary>
    /// Cowper's shear form factor for a solid rectangle, f = 1/κ = (12 + 11ν) / (10(1 + ν)).
    /// Source: Cowper, J. Appl. Mech. 33:335–340, 1966.
    /// </summary>
    /// <param name="nu">Poisson's ratio ν, strictly between −1 and 0.5.</param>
    public static HandValue CowperRectangle(double nu)
    {
        Guard.Poisson(nu);
        return new HandValue((12.0 + 11.0 * nu) / (10.0 * (1.0 + nu)), "shear form factor f = 1/κ (rectangle)", Cowper);
    }

    /// <summary>
    /// A form factor the user supplies (e.g. from a section table), validated to be at least 1.
    /// </summary>
    public static HandValue UserValue(double f, string source)
    {
        Guard.FormFactor(f);
        return new HandValue(f, "shear form factor f",
            new HandMethod("User-supplied shear form factor", string.IsNullOrWhiteSpace(source) ? "user" : source,
                ["the user's value suits the section"]));
    }

    private static readonly HandMethod Cowper = new(
        "Cowper's shear coefficient for a rectangle",
        "G. R. Cowper, The shear coefficient in Timoshenko's beam theory, J. Appl. Mech. 33:335-340, 1966",
        ["the section is a solid rectangle", "the material is linear elastic and isotropic"]);
}

/// <summary>
/// Masonry moduli as given by the US masonry code (TMS 402 / MSJC), quoted via Taly,
/// Design of Reinforced Masonry Structures, p.128 and p.451. Units: those of f′m.
/// </summary>
public static class MasonryModuli
{
    /// <summary>E_m = 900 f′m for concrete masonry (TMS 402 / MSJC via Taly p.128).</summary>
    /// <param name="fm">Specified compressive strength of masonry f′m, positive.</param>
    public static HandValue ConcreteMasonry(double fm)
    {
        Guard.Positive(fm, "masonry compressive strength f'm");
        return new HandValue(900.0 * fm, "masonry modulus E_m (concrete masonry)", Source("E_m = 900 f'm, concrete masonry"));
    }

    /// <summary>E_m = 700 f′m for clay masonry (TMS 402 / MSJC via Taly p.128).</summary>
    /// <param name="fm">Specified compressive strength of masonry f′m, positive.</param>
    public static HandValue ClayMasonry(double fm)
    {
        Guard.Positive(fm, "masonry compressive strength f'm");
        return new HandValue(700.0 * fm, "masonry modulus E_m (clay masonry)", Source("E_m = 700 f'm, clay masonry"));
    }

    /// <summary>Masonry shear modulus E_v = 0.4 E_m (TMS 402 / MSJC via Taly p.128 and p.451).</summary>
    /// <param name="em">Masonry modulus E_m, positive.</param>
    public static HandValue ShearModulus(double em)
    {
        Guard.Positive(em, "masonry modulus E_m");
        return new HandValue(0.4 * em, "masonry shear modulus E_v", Source("E_v = 0.4 E_m"));
    }

    private static HandMethod Source(string name) => new(name,
        "TMS 402 / MSJC masonry code, via Taly, Design of Reinforced Masonry Structures, p.128 and p.451",
        ["code-prescribed secant moduli, not measured values", "the governing local code may prescribe other values"]);
}
