using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of response-spectrum.json (docs/seismic.md), one record per JSON object, properties in the file's order.

/// <summary>response-spectrum.json: the planar response spectrum analysis, its scaling and its story results.</summary>
public sealed record SpectrumDocument(
    [property: JsonProperty("program")] string Program,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("source")] string Source,
    [property: JsonProperty("spectrum")] string Spectrum,
    [property: JsonProperty("combination")] string Combination,
    [property: JsonProperty("damping")] double Damping,
    [property: JsonProperty("R")] double R,
    [property: JsonProperty("Ie")] double Ie,
    [property: JsonProperty("Cd")] double Cd,
    [property: JsonProperty("modes")] int Modes,
    [property: JsonProperty("massShare")] double MassShare,
    [property: JsonProperty("Vt")] double Vt,
    [property: JsonProperty("V")] double V,
    [property: JsonProperty("forceFactor")] double ForceFactor,
    [property: JsonProperty("driftFactor")] double DriftFactor,
    [property: JsonProperty("scaling")] string? Scaling,
    [property: JsonProperty("stories")] IEnumerable<SpectrumStory> Stories,
    [property: JsonProperty("PxFrom")] string? PxFrom,
    [property: JsonProperty("combinedValues")] string CombinedValues);

/// <summary>A story's combined (modal) and equivalent-lateral-force results. The stability coefficients are null where
/// a story has none.</summary>
public sealed record SpectrumStory(
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("elfShear")] double ElfShear,
    [property: JsonProperty("modalShear")] double ModalShear,
    [property: JsonProperty("scaledShear")] double ScaledShear,
    [property: JsonProperty("drift")] double Drift,
    [property: JsonProperty("designDrift")] double DesignDrift,
    [property: JsonProperty("ratio")] double Ratio,
    [property: JsonProperty("overturning")] double Overturning,
    [property: JsonProperty("Px")] double Px,
    [property: JsonProperty("theta")] double? Theta,
    [property: JsonProperty("thetaElf")] double? ThetaElf,
    [property: JsonProperty("thetaMax")] double? ThetaMax);
