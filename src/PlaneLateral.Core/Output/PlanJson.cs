using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of plan.json (docs/plan.md), one record per JSON object, properties in the file's order. A number that is
// undefined (a share of a nil story shear, a level without a weight) is null, never "NaN". A point's coordinates are a
// two-number array [x, y].

/// <summary>plan.json: a building in plan, its lines, cases, centres of rigidity and torsional irregularity.</summary>
public sealed record PlanDocument(
    [property: JsonProperty("program")] string Program,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("title")] string? Title,
    [property: JsonProperty("units")] PlanUnits Units,
    [property: JsonProperty("method")] string Method,
    [property: JsonProperty("accidentalEccentricity")] double AccidentalEccentricity,
    [property: JsonProperty("warnings")] IEnumerable<PlanWarning> Warnings,
    [property: JsonProperty("levels")] IEnumerable<PlanJsonLevel> Levels,
    [property: JsonProperty("lines")] IEnumerable<PlanJsonLine> Lines,
    [property: JsonProperty("cases")] IEnumerable<PlanJsonCase> Cases,
    [property: JsonProperty("rigidity")] IEnumerable<PlanJsonRigidity> Rigidity,
    [property: JsonProperty("torsionalIrregularity")] IEnumerable<PlanJsonTorsion> TorsionalIrregularity,
    // The floors that bend (docs/plan.md, "Floors that bend"): present only with them.
    [property: JsonProperty("floors", NullValueHandling = NullValueHandling.Ignore)] PlanFloorsBlock? Floors,
    [property: JsonProperty("points", NullValueHandling = NullValueHandling.Ignore)] IEnumerable<PlanJsonPoint>? Points);

/// <summary>The building's force and length units.</summary>
public sealed record PlanUnits(
    [property: JsonProperty("force")] string Force,
    [property: JsonProperty("length")] string Length);

/// <summary>A plausibility warning of an input file (Model/Plausibility.Plan.cs).</summary>
public sealed record PlanWarning(
    [property: JsonProperty("file")] string? File,
    [property: JsonProperty("line")] int Line,
    [property: JsonProperty("column")] int Column,
    [property: JsonProperty("path")] string Path,
    [property: JsonProperty("problem")] string Problem,
    [property: JsonProperty("fix")] string Fix);

/// <summary>A floor level: elevation, weight and centre of mass.</summary>
public sealed record PlanJsonLevel(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("elevation")] double? Elevation,
    [property: JsonProperty("weight")] double? Weight,
    [property: JsonProperty("massAt")] IEnumerable<double?> MassAt);

/// <summary>A lateral line and the checks of its condensation and recovery.</summary>
public sealed record PlanJsonLine(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("form")] string Form,
    [property: JsonProperty("at")] IEnumerable<double?> At,
    [property: JsonProperty("direction")] string Direction,
    [property: JsonProperty("condensationBackwardError")] double CondensationBackwardError,
    [property: JsonProperty("flexibilitySymmetryError")] double FlexibilitySymmetryError,
    [property: JsonProperty("recoveryError")] double RecoveryError);

/// <summary>A load case: its checks, floor motions and line story shears.</summary>
public sealed record PlanJsonCase(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("description")] string? Description,
    [property: JsonProperty("backwardError")] double BackwardError,
    [property: JsonProperty("equilibriumError")] double EquilibriumError,
    [property: JsonProperty("floors")] IEnumerable<PlanJsonFloor> Floors,
    [property: JsonProperty("lineStories")] IEnumerable<PlanJsonLineStory> LineStories);

/// <summary>A floor's motion in one case.</summary>
public sealed record PlanJsonFloor(
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("Ux")] double? Ux,
    [property: JsonProperty("Uy")] double? Uy,
    [property: JsonProperty("Rz")] double Rz);

/// <summary>A line's story shear, its share and its direct and torsional parts.</summary>
public sealed record PlanJsonLineStory(
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("line")] string Line,
    [property: JsonProperty("shear")] double? Shear,
    [property: JsonProperty("share")] double? Share,
    [property: JsonProperty("direct")] double? Direct,
    [property: JsonProperty("torsional")] double? Torsional);

/// <summary>A story's centre of rigidity under one loading direction.</summary>
public sealed record PlanJsonRigidity(
    [property: JsonProperty("loading")] string Loading,
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("xR")] double? XR,
    [property: JsonProperty("yR")] double? YR);

/// <summary>A story's torsional irregularity ratio and amplification.</summary>
public sealed record PlanJsonTorsion(
    [property: JsonProperty("loading")] string Loading,
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("case")] string Case,
    [property: JsonProperty("ratio")] double? Ratio,
    [property: JsonProperty("type")] string Type,
    [property: JsonProperty("Ax")] double? Ax,
    [property: JsonProperty("withAccidentalTorsion")] bool WithAccidentalTorsion);

/// <summary>A named point: where it is and its motion per case and level.</summary>
public sealed record PlanJsonPoint(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("at")] IEnumerable<double?> At,
    [property: JsonProperty("cases")] IEnumerable<PlanJsonPointCase> Cases);

/// <summary>A named point's motion in one case.</summary>
public sealed record PlanJsonPointCase(
    [property: JsonProperty("case")] string Case,
    [property: JsonProperty("levels")] IEnumerable<PlanJsonPointLevel> Levels);

/// <summary>A named point's displacement and drift at one level.</summary>
public sealed record PlanJsonPointLevel(
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("ux")] double? Ux,
    [property: JsonProperty("uy")] double? Uy,
    [property: JsonProperty("driftX")] double? DriftX,
    [property: JsonProperty("driftY")] double? DriftY);

/// <summary>plan.json's "floors" block (floors that bend, docs/plan.md): each floor's kind, the flexibility test and the
/// line-shear envelope over the idealisations, with the hand tributary split beside it where there is one.</summary>
public sealed record PlanFloorsBlock(
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("kinds")] IEnumerable<PlanFloorKind> Kinds,
    [property: JsonProperty("idealisations")] IEnumerable<string> Idealisations,
    [property: JsonProperty("notes")] IEnumerable<string> Notes,
    [property: JsonProperty("flexibility")] IEnumerable<PlanFloorFlexibility> Flexibility,
    [property: JsonProperty("envelope")] IEnumerable<PlanFloorEnvelope> Envelope);

/// <summary>A floor's kind as modelled.</summary>
public sealed record PlanFloorKind(
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("kind")] string Kind);

/// <summary>The flexibility test of a floor (maximum diaphragm deflection against the average drift of the story below).</summary>
public sealed record PlanFloorFlexibility(
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("loading")] string Loading,
    [property: JsonProperty("case")] string Case,
    [property: JsonProperty("from")] string From,
    [property: JsonProperty("to")] string To,
    [property: JsonProperty("span")] IEnumerable<double> Span,
    [property: JsonProperty("MDD")] double Mdd,
    [property: JsonProperty("ADVE")] double Adve,
    [property: JsonProperty("ratio")] double? Ratio,
    [property: JsonProperty("flexible")] bool Flexible);

/// <summary>A line's story shear under each idealisation of the floors, and the hand tributary split beside it.</summary>
public sealed record PlanFloorEnvelope(
    [property: JsonProperty("case")] string Case,
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("line")] string Line,
    [property: JsonProperty("rigid")] double? Rigid,
    [property: JsonProperty("semiRigid")] double? SemiRigid,
    [property: JsonProperty("flexible")] double? Flexible,
    [property: JsonProperty("envelope")] double? Envelope,
    [property: JsonProperty("governing")] string Governing,
    [property: JsonProperty("handTributary")] double? HandTributary = null,
    [property: JsonProperty("flexibleOverHandMinusOne")] double? FlexibleOverHandMinusOne = null,
    [property: JsonProperty("gapCause")] string? GapCause = null)
{
    /// <summary>True when the row has a hand tributary value: its three properties are written (a null among them
    /// meaning a number that is undefined), otherwise left out.</summary>
    [JsonIgnore]
    public bool HasHand { get; init; }

    // Json.NET's ShouldSerialize convention.
    public bool ShouldSerializeHandTributary() => HasHand;
    public bool ShouldSerializeFlexibleOverHandMinusOne() => HasHand;
    public bool ShouldSerializeGapCause() => HasHand;
}
