using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of plan-seismic.json (docs/plan.md, "Seismic"), one record per JSON object, properties in the file's order.
// A number the step cannot give is written as it always was: "NaN" (the stability coefficients, Px), null only for the
// allowable drift and its verdict when the building sets no drift limit.

/// <summary>plan-seismic.json: the plan's modes, equivalent lateral forces, torsional amplification and, when asked
/// for, the response spectrum analysis.</summary>
public sealed record PlanSeismicDocument(
    [property: JsonProperty("program")] string Program,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("source")] string Source,
    [property: JsonProperty("units")] PlanUnits Units,
    [property: JsonProperty("modes")] IEnumerable<PlanSeismicMode> Modes,
    [property: JsonProperty("rotationPivot")] IEnumerable<double> RotationPivot,
    [property: JsonProperty("equivalentLateralForces")] IEnumerable<PlanSeismicElf> EquivalentLateralForces,
    [property: JsonProperty("amplification")] IEnumerable<PlanSeismicAmplification> Amplification,
    [property: JsonProperty("responseSpectrum", NullValueHandling = NullValueHandling.Ignore)] PlanSeismicSpectrum? ResponseSpectrum);

/// <summary>A mode of the building in plan.</summary>
public sealed record PlanSeismicMode(
    [property: JsonProperty("mode")] int Mode,
    [property: JsonProperty("period")] double Period,
    [property: JsonProperty("dominant")] string Dominant,
    [property: JsonProperty("share")] IEnumerable<double> Share,
    [property: JsonProperty("cumulative")] IEnumerable<double> Cumulative,
    [property: JsonProperty("gamma")] IEnumerable<double> Gamma);

/// <summary>The equivalent lateral forces along one direction.</summary>
public sealed record PlanSeismicElf(
    [property: JsonProperty("direction")] string Direction,
    [property: JsonProperty("mode")] int Mode,
    [property: JsonProperty("modalPeriod")] double ModalPeriod,
    [property: JsonProperty("Ta")] double Ta,
    [property: JsonProperty("Cu")] double Cu,
    [property: JsonProperty("periodUsed")] double PeriodUsed,
    [property: JsonProperty("periodNote")] string? PeriodNote,
    [property: JsonProperty("Cs")] double Cs,
    [property: JsonProperty("CsGovernedBy")] string? CsGovernedBy,
    [property: JsonProperty("W")] double W,
    [property: JsonProperty("V")] double V,
    [property: JsonProperty("k")] double K,
    [property: JsonProperty("forces")] IEnumerable<double> Forces,
    [property: JsonProperty("cases")] IEnumerable<string> Cases);

/// <summary>A floor's torsional amplification A_x along one direction.</summary>
public sealed record PlanSeismicAmplification(
    [property: JsonProperty("direction")] string Direction,
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("Ax")] double Ax,
    [property: JsonProperty("applied")] bool Applied);

/// <summary>The response spectrum analysis of the building in plan.</summary>
public sealed record PlanSeismicSpectrum(
    [property: JsonProperty("spectrum")] string Spectrum,
    [property: JsonProperty("combination")] string Combination,
    [property: JsonProperty("damping")] double Damping,
    [property: JsonProperty("R")] double R,
    [property: JsonProperty("Ie")] double Ie,
    [property: JsonProperty("Cd")] double Cd,
    [property: JsonProperty("accidentalTorsion")] string AccidentalTorsion,
    [property: JsonProperty("combinedValues")] string CombinedValues,
    [property: JsonProperty("directions")] IEnumerable<PlanSeismicSpectrumDirection> Directions);

/// <summary>The response spectrum along one direction.</summary>
public sealed record PlanSeismicSpectrumDirection(
    [property: JsonProperty("direction")] string Direction,
    [property: JsonProperty("modes")] int Modes,
    [property: JsonProperty("massShare")] double MassShare,
    [property: JsonProperty("Vt")] double Vt,
    [property: JsonProperty("V")] double V,
    [property: JsonProperty("forceFactor")] double ForceFactor,
    [property: JsonProperty("driftFactor")] double DriftFactor,
    [property: JsonProperty("scaling")] string? Scaling,
    [property: JsonProperty("modalEquilibriumError")] double ModalEquilibriumError,
    [property: JsonProperty("analyses")] IEnumerable<PlanSeismicSpectrumAnalysis> Analyses,
    [property: JsonProperty("stories")] IEnumerable<PlanSeismicSpectrumStory> Stories);

/// <summary>One analysis of a direction (the mass in place or shifted by the accidental eccentricity).</summary>
public sealed record PlanSeismicSpectrumAnalysis(
    [property: JsonProperty("label")] string Label,
    [property: JsonProperty("massShift")] double MassShift,
    [property: JsonProperty("modes")] int Modes,
    [property: JsonProperty("Vt")] double Vt,
    [property: JsonProperty("forceFactor")] double ForceFactor,
    [property: JsonProperty("driftFactor")] double DriftFactor,
    [property: JsonProperty("floorRotation")] IEnumerable<double> FloorRotation);

/// <summary>A story's combined results along one direction.</summary>
public sealed record PlanSeismicSpectrumStory(
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("elfShear")] double ElfShear,
    [property: JsonProperty("modalShear")] double ModalShear,
    [property: JsonProperty("scaledShear")] double ScaledShear,
    [property: JsonProperty("corner")] int Corner,
    [property: JsonProperty("drift")] double Drift,
    [property: JsonProperty("designDrift")] double DesignDrift,
    [property: JsonProperty("ratio")] double Ratio,
    [property: JsonProperty("allowedRatio")] double? AllowedRatio,
    [property: JsonProperty("within")] bool? Within,
    [property: JsonProperty("Px")] double Px,
    [property: JsonProperty("theta")] double Theta,
    [property: JsonProperty("thetaElf")] double ThetaElf,
    [property: JsonProperty("thetaMax")] double ThetaMax);
