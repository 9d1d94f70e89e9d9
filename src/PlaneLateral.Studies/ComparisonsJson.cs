using Newtonsoft.Json;

namespace PlaneLateral.Studies;

// The shape of comparisons.json (docs/comparisons.md), one record per JSON object, properties in the file's order. An
// optional number (a share, an estimated error, an aspect ratio) is left out when the row has none.

/// <summary>comparisons.json: every hand-versus-FE row with its methods, sources, assumptions and verdict.</summary>
public sealed record ComparisonsDocument(
    [property: JsonProperty("producedBy")] string ProducedBy,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("model")] ComparisonsModel Model,
    [property: JsonProperty("units")] ComparisonsUnits Units,
    [property: JsonProperty("defaultTolerance")] double DefaultTolerance,
    [property: JsonProperty("verdicts")] string Verdicts,
    [property: JsonProperty("rows")] IEnumerable<ComparisonsRow> Rows);

/// <summary>The model compared.</summary>
public sealed record ComparisonsModel(
    [property: JsonProperty("title")] string? Title,
    [property: JsonProperty("file")] string? File);

/// <summary>The model's force and length units.</summary>
public sealed record ComparisonsUnits(
    [property: JsonProperty("force")] string Force,
    [property: JsonProperty("length")] string Length);

/// <summary>One hand value beside its FE estimates.</summary>
public sealed record ComparisonsRow(
    [property: JsonProperty("check")] string Check,
    [property: JsonProperty("kind")] string Kind,
    [property: JsonProperty("subject")] string Subject,
    [property: JsonProperty("quantity")] string Quantity,
    [property: JsonProperty("unit")] string Unit,
    [property: JsonProperty("hand")] ComparisonsHand Hand,
    [property: JsonProperty("fe")] IEnumerable<ComparisonsFe> Fe,
    [property: JsonProperty("reference")] string Reference,
    [property: JsonProperty("referenceBasis")] string ReferenceBasis,
    [property: JsonProperty("ratio")] double Ratio,
    [property: JsonProperty("aspectRatio", NullValueHandling = NullValueHandling.Ignore)] double? AspectRatio,
    [property: JsonProperty("tolerance")] double Tolerance,
    [property: JsonProperty("verdict")] string Verdict,
    [property: JsonProperty("cause")] string Cause);

/// <summary>The hand value, its method, source and assumptions.</summary>
public sealed record ComparisonsHand(
    [property: JsonProperty("value")] double Value,
    [property: JsonProperty("method")] string Method,
    [property: JsonProperty("source")] string Source,
    [property: JsonProperty("assumptions")] IEnumerable<string> Assumptions,
    [property: JsonProperty("flexuralShare", NullValueHandling = NullValueHandling.Ignore)] double? FlexuralShare,
    [property: JsonProperty("shearShare", NullValueHandling = NullValueHandling.Ignore)] double? ShearShare,
    [property: JsonProperty("detail", NullValueHandling = NullValueHandling.Ignore)] IEnumerable<string>? Detail);

/// <summary>One FE estimate of a row.</summary>
public sealed record ComparisonsFe(
    [property: JsonProperty("model")] string Model,
    [property: JsonProperty("value")] double Value,
    [property: JsonProperty("reference")] bool Reference,
    [property: JsonProperty("ratioToHand")] double RatioToHand,
    [property: JsonProperty("estimatedError", NullValueHandling = NullValueHandling.Ignore)] double? EstimatedError,
    [property: JsonProperty("description")] string Description,
    [property: JsonProperty("flexuralShare", NullValueHandling = NullValueHandling.Ignore)] double? FlexuralShare,
    [property: JsonProperty("shearShare", NullValueHandling = NullValueHandling.Ignore)] double? ShearShare);
