using PlaneLateral.Hand;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>A sweep material: E and G in the given units, with where the values come from.</summary>
public sealed record SweepMaterial(string Name, double E, double G, string Source);

/// <summary>
/// The two named materials the sweep offers (any other: give E and G or ν yourself). Values are typical uncracked
/// moduli for a first look, not design values; the governing code decides.
/// </summary>
public static class SweepMaterials
{
    /// <summary>Names accepted by <see cref="Get"/>.</summary>
    public static IReadOnlyList<string> Names { get; } = ["concrete", "masonry"];

    /// <summary>The named material in <paramref name="units"/>, or null for an unknown name.</summary>
    public static SweepMaterial? Get(string name, UnitSystem units)
    {
        const double ksi = 4448.2216152605 / (0.0254 * 0.0254);   // N/m² per kip/in²
        double ToUnits(double valueKsi) => units.FromSI(valueKsi * ksi, Quantity.Stress);
        switch (name)
        {
            case "concrete":
            {
                // E_c = 57000·√f'c psi with f'c = 4000 psi (ACI 318-19 §19.2.2.1, from memory) = 3605 ksi; ν = 0.2 (common practice).
                double e = 57.0 * Math.Sqrt(4000.0);   // ksi: 57000·√4000 psi / 1000
                double g = Elastic.ShearModulus(e, 0.2);
                return new SweepMaterial("concrete, f'c = 4000 psi (E = 57000·√f'c psi, ν = 0.2)", ToUnits(e), ToUnits(g),
                    "E_c = 57000·√f'c psi (ACI 318-19 §19.2.2.1, from memory); G = E/(2(1+ν)), ν = 0.2");
            }
            case "masonry":
            {
                double e = MasonryModuli.ConcreteMasonry(2.0);    // ksi, f'm = 2000 psi
                double g = MasonryModuli.ShearModulus(e);
                return new SweepMaterial("concrete masonry, f'm = 2000 psi (E_m = 900 f'm, E_v = 0.4 E_m)", ToUnits(e), ToUnits(g),
                    "E_m = 900 f'm and E_v = 0.4 E_m (TMS 402 via Taly, Design of Reinforced Masonry Structures, p.128)");
            }
            default:
                return null;
        }
    }
}
