namespace PlaneLateral.Model;

/// <summary>How modal responses are combined.</summary>
public enum ModalRule
{
    /// <summary>Complete quadratic combination (Der Kiureghian 1981), the default.</summary>
    Cqc,
    /// <summary>Square root of the sum of the squares.</summary>
    Srss,
}

/// <summary>
/// The "responseSpectrum" block (docs/seismic.md): modal response spectrum analysis beside the equivalent lateral forces.
/// </summary>
/// <param name="Rule">CQC (default) or SRSS.</param>
/// <param name="Damping">Damping ratio ζ for the CQC correlation (0.05 by default; the spectrum itself is taken as given).</param>
/// <param name="Table">The user's (T s, S_a g) points, or empty for the §11.4.6 shape from the seismic block's spectral values.</param>
/// <param name="Cd">C_d for the design displacements and drifts, δ = C_d·δ_e/I_e.</param>
/// <param name="Modes">At least this many modes (0: just enough for <see cref="MassShare"/>).</param>
/// <param name="MassShare">Cumulative effective mass share to reach in each excited direction (0.9, §12.9.1.1).</param>
public sealed record ResponseSpectrumSettings(ModalRule Rule, double Damping, IReadOnlyList<(double T, double Sa)> Table, double Cd, int Modes, double MassShare = 0.9)
{
    /// <summary>How a building in plan takes the accidental torsion (key "accidentalTorsion"; planar models have none).</summary>
    public AccidentalTorsion Torsion { get; init; } = AccidentalTorsion.Static;
}

/// <summary>Accidental torsion in the modal analysis of a building in plan (ASCE 7-16 §12.9.1.5, from memory).</summary>
public enum AccidentalTorsion
{
    /// <summary>"static" (the default): floor torques ±F_x·e·A_x of the equivalent lateral forces, solved statically and added to the modal results.</summary>
    Static,
    /// <summary>"shifted-masses": every floor's centre of mass moved by +e and by −e across the motion, the modes solved again for each, and the two results enveloped.</summary>
    ShiftedMasses,
}

/// <summary>
/// The "seismic" block of a building in plan (docs/plan.md): the equivalent lateral forces along X and Y from the
/// spectral values and the plan modes, applied at the centres of mass with the accidental eccentricity, and optionally
/// the modal response spectrum analysis. SI inside.
/// </summary>
public sealed class PlanSeismicData
{
    /// <summary>Prefix of the generated cases: "&lt;id&gt;-x", "&lt;id&gt;-y" and their "+ecc"/"-ecc" twins.</summary>
    public required string CaseId { get; init; }
    public required string StructureType { get; init; }
    public required SpectralValues Spectrum { get; init; }
    public PeriodUse Period { get; init; } = PeriodUse.Capped;
    public double GivenPeriod { get; init; } = double.NaN;
    public ResponseSpectrumSettings? ResponseSpectrum { get; init; }
}
