using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of stories.json (docs/buildings.md), one record per JSON object, properties in the file's order. A number
// the building layer cannot give (a story that carries no shear has no stiffness) is null: every number here is a double?.

/// <summary>stories.json: the building layer's results.</summary>
public sealed record StoriesDocument(
    [property: JsonProperty("producedBy")] string ProducedBy,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("units")] string Units,
    [property: JsonProperty("definitions")] string Definitions,
    [property: JsonProperty("levels")] IEnumerable<StoriesLevel> Levels,
    [property: JsonProperty("cases")] IEnumerable<StoriesCase> Cases,
    [property: JsonProperty("driftChecks")] IEnumerable<StoriesDriftCheck> DriftChecks,
    [property: JsonProperty("stiffnessIrregularity")] IEnumerable<StoriesIrregularity> StiffnessIrregularity,
    [property: JsonProperty("irregularitySource")] string IrregularitySource,
    [property: JsonProperty("memberStiffness")] IEnumerable<StoriesMemberStiffness> MemberStiffness);

/// <summary>A level: where it is, its diaphragm and the nodes that make it.</summary>
public sealed record StoriesLevel(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("name")] string? Name,
    [property: JsonProperty("elevation")] double? Elevation,
    [property: JsonProperty("diaphragm")] string Diaphragm,
    [property: JsonProperty("nodesChosen")] string? NodesChosen,
    [property: JsonProperty("nodes")] IEnumerable<string> Nodes);

/// <summary>One case's level displacements and stories.</summary>
public sealed record StoriesCase(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("kind")] string Kind,
    [property: JsonProperty("lateral")] bool Lateral,
    [property: JsonProperty("levels")] IEnumerable<StoriesLevelDisplacement> Levels,
    [property: JsonProperty("stories")] IEnumerable<StoriesStory> Stories);

/// <summary>A level's mean lateral displacement and the spread of its nodes' displacements.</summary>
public sealed record StoriesLevelDisplacement(
    [property: JsonProperty("level")] string Level,
    [property: JsonProperty("ux")] double? Ux,
    [property: JsonProperty("spread")] double? Spread);

/// <summary>One story of a case.</summary>
public sealed record StoriesStory(
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("bottom")] string Bottom,
    [property: JsonProperty("top")] string Top,
    [property: JsonProperty("height")] double? Height,
    [property: JsonProperty("topDisplacement")] double? TopDisplacement,
    [property: JsonProperty("drift")] double? Drift,
    [property: JsonProperty("driftRatio")] double? DriftRatio,
    [property: JsonProperty("cutAt")] double? CutAt,
    [property: JsonProperty("shear")] double? Shear,
    [property: JsonProperty("stiffness")] double? Stiffness,
    [property: JsonProperty("lines")] IEnumerable<StoriesLine> Lines);

/// <summary>A line's part of a story.</summary>
public sealed record StoriesLine(
    [property: JsonProperty("line")] string Line,
    [property: JsonProperty("shear")] double? Shear,
    [property: JsonProperty("share")] double? Share,
    [property: JsonProperty("drift")] double? Drift,
    [property: JsonProperty("stiffnessInStructure")] double? StiffnessInStructure);

/// <summary>An amplified drift against the allowable ratio.</summary>
public sealed record StoriesDriftCheck(
    [property: JsonProperty("check")] string Check,
    [property: JsonProperty("case")] string Case,
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("Cd")] double? Cd,
    [property: JsonProperty("Ie")] double? Ie,
    [property: JsonProperty("elasticDrift")] double? ElasticDrift,
    [property: JsonProperty("amplifiedDrift")] double? AmplifiedDrift,
    [property: JsonProperty("ratio")] double? Ratio,
    [property: JsonProperty("allowedRatio")] double? AllowedRatio,
    [property: JsonProperty("result")] string Result,
    [property: JsonProperty("margin")] double? Margin,
    [property: JsonProperty("limitSource")] string? LimitSource,
    [property: JsonProperty("method")] string Method);

/// <summary>A story's stiffness against the stories above (ASCE 7-16 Table 12.3-2, Types 1a and 1b).</summary>
public sealed record StoriesIrregularity(
    [property: JsonProperty("case")] string Case,
    [property: JsonProperty("story")] int Story,
    [property: JsonProperty("stiffness")] double? Stiffness,
    [property: JsonProperty("ratioToAbove")] double? RatioToAbove,
    [property: JsonProperty("ratioToMeanOfThreeAbove")] double? RatioToMeanOfThreeAbove,
    [property: JsonProperty("type1aSoft")] bool Type1aSoft,
    [property: JsonProperty("type1bExtremelySoft")] bool Type1bExtremelySoft,
    [property: JsonProperty("windCaseRatiosOnly")] bool WindCaseRatiosOnly);

/// <summary>A member's stiffness modifiers and where they came from.</summary>
public sealed record StoriesMemberStiffness(
    [property: JsonProperty("member")] string Member,
    [property: JsonProperty("I")] double? I,
    [property: JsonProperty("A")] double? A,
    [property: JsonProperty("shearArea")] double? ShearArea,
    [property: JsonProperty("source")] string? Source);
