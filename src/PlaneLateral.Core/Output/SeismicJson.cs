using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of seismic.json (docs/seismic.md), one record per JSON object, properties in the file's order. A number the
// seismic step cannot give is null (every scalar number is a double?); the second-order properties appear only when the
// model asks for the second-order step.

/// <summary>seismic.json: periods, the equivalent lateral forces and, when asked for, the second-order step.</summary>
public sealed record SeismicDocument(
    [property: JsonProperty("producedBy")] string ProducedBy,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("source")] string Source,
    [property: JsonProperty("units")] string Units,
    [property: JsonProperty("loadCase")] string LoadCase,
    [property: JsonProperty("modes")] IEnumerable<SeismicMode> Modes,
    [property: JsonProperty("rayleighPeriod")] double? RayleighPeriod,
    [property: JsonProperty("approximatePeriod")] double? ApproximatePeriod,
    [property: JsonProperty("Ct")] double? Ct,
    [property: JsonProperty("x")] double? X,
    [property: JsonProperty("structureRow")] string? StructureRow,
    [property: JsonProperty("hnFeet")] double? HnFeet,
    [property: JsonProperty("Cu")] double? Cu,
    [property: JsonProperty("periodUsed")] double? PeriodUsed,
    [property: JsonProperty("periodNote")] string? PeriodNote,
    [property: JsonProperty("Cs")] double? Cs,
    [property: JsonProperty("CsGovernedBy")] string? CsGovernedBy,
    [property: JsonProperty("totalWeight")] double? TotalWeight,
    [property: JsonProperty("baseShear")] double? BaseShear,
    [property: JsonProperty("k")] double? K,
    [property: JsonProperty("storyForces")] IEnumerable<SeismicStoryForce> StoryForces,
    [property: JsonProperty("gravity")] string? Gravity = null,
    [property: JsonProperty("Cd")] double? Cd = null,
    [property: JsonProperty("Ie")] double? Ie = null,
    [property: JsonProperty("beta")] double? Beta = null,
    [property: JsonProperty("gravityFactorToBuckling")] double? GravityFactorToBuckling = null,
    [property: JsonProperty("stability")] IEnumerable<SeismicStability>? Stability = null,
    [property: JsonProperty("secondOrderDriftChecks")] IEnumerable<SeismicSecondOrderDriftCheck>? SecondOrderDriftChecks = null)
{
    /// <summary>True when the model asks for the second-order step: its properties are written (a null among them
    /// meaning a number that cannot be given), otherwise left out.</summary>
    [JsonIgnore]
    public bool HasSecondOrder { get; init; }

    // Json.NET's ShouldSerialize<Property> convention: the second-order block is written whole or not at all.
    public bool ShouldSerializeGravity() => HasSecondOrder;
    public bool ShouldSerializeCd() => HasSecondOrder;
    public bool ShouldSerializeIe() => HasSecondOrder;
    public bool ShouldSerializeBeta() => HasSecondOrder;
    public bool ShouldSerializeGravityFactorToBuckling() => HasSecondOrder;
    public bool ShouldSerializeStability() => HasSecondOrder;
    public bool ShouldSerializeSecondOrderDriftChecks() => HasSecondOrder;
}

/// <summary>A mode: period, circular frequency, mass share and the shape at each level.</summary>
public sealed record SeismicMode(
    [property: JsonProperty("mode")] int Mode,
    [property: JsonProperty("period")] double? Period,
    [property: JsonProperty("omega")] double? Omega,
    [property: JsonProperty("massShare")] double? MassShare,
    [property: JsonProperty("levelShape")] IEnumerable<double> LevelShape);

/// <summary>A level's share of the base shear and its force.</summary>
public sealed record SeismicStoryForce(
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("Cvx")] double? Cvx,
    [property: JsonProperty("Fx")] double? Fx,
    [property: JsonProperty("storyShearBelow")] double? StoryShearBelow);

/// <summary>A story's stability coefficient beside its second-order drift.</summary>
public sealed record SeismicStability(
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("Px")] double? Px,
    [property: JsonProperty("Vx")] double? Vx,
    [property: JsonProperty("firstOrderDrift")] double? FirstOrderDrift,
    [property: JsonProperty("designDrift")] double? DesignDrift,
    [property: JsonProperty("theta")] double? Theta,
    [property: JsonProperty("thetaMax")] double? ThetaMax,
    [property: JsonProperty("status")] string? Status,
    [property: JsonProperty("secondOrderDrift")] double? SecondOrderDrift,
    [property: JsonProperty("secondOverFirst")] double? SecondOverFirst,
    [property: JsonProperty("oneOverOneMinusTheta")] double? OneOverOneMinusTheta);

/// <summary>The drift check on a story's second-order drift.</summary>
public sealed record SeismicSecondOrderDriftCheck(
    [property: JsonProperty("check")] string Check,
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("drift")] double? Drift,
    [property: JsonProperty("amplifiedDrift")] double? AmplifiedDrift,
    [property: JsonProperty("ratio")] double? Ratio,
    [property: JsonProperty("allowedRatio")] double? AllowedRatio,
    [property: JsonProperty("result")] string Result,
    [property: JsonProperty("margin")] double? Margin);
