using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// The equivalent frame of a wall with openings (docs/comparisons.md §3), built exactly as the perforated-wall
/// comparison builds it, for callers outside Studies (the sweep): one call, the frame's lateral stiffness.
/// </summary>
public static class EquivalentFrameWall
{
    /// <summary>
    /// Lateral stiffness (N/m) of the wall's equivalent frame of Timoshenko line members, spandrels of their real depth:
    /// unit force shared by the top joints, stiffness 1/(mean top deflection). All inputs SI (m, N/m²).
    /// </summary>
    /// <param name="id">Name of the wall in the frame's model title.</param>
    /// <param name="length">Wall length, parallel to the force (m).</param>
    /// <param name="height">Wall height (m).</param>
    /// <param name="thickness">Wall thickness (m).</param>
    /// <param name="material">E, G and ν of the wall (N/m²).</param>
    /// <param name="formFactor">Shear form factor f ≥ 1.</param>
    /// <param name="fixedFixed">True: top held against rotation; false: cantilever.</param>
    /// <param name="openings">Rectangular openings, lower-left corner from the wall's left end and base (m).</param>
    /// <returns>The stiffness and the number of pier and spandrel members generated.</returns>
    public static (double Stiffness, int Piers, int Spandrels) Stiffness(string id, double length, double height, double thickness,
        Material material, double formFactor, bool fixedFixed, IReadOnlyList<OpeningSpec> openings)
    {
        var check = new PerforatedWallCheck(id, "", null, new CheckLocation("(sweep)", 0, 0, "$"), length, height, thickness, material,
            formFactor, fixedFixed ? CheckEnds.FixedFixed : CheckEnds.Cantilever, openings);
        var frame = EquivalentFrame.Build(check, UnitSystem.KilonewtonMetre, "(sweep)", rigidSpandrels: false);
        return (PerforatedWallStudy.Stiffness(frame), frame.PierCount, frame.SpandrelCount);
    }
}
