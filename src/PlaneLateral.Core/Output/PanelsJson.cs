using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of panels.json (docs/panels.md), one record per JSON object, properties in the file's order. A number that
// could not be determined (e.g. no observed order from a non-monotone mesh sequence) is null, never "NaN": every number
// is a double?. Properties that belong to a convergence study or a guided top appear only with them.

/// <summary>panels.json: every wall panel's mesh, top stiffness, level displacements and checks.</summary>
public sealed record PanelsDocument(
    [property: JsonProperty("producedBy")] string ProducedBy,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("method")] string Method,
    [property: JsonProperty("units")] PanelsUnits Units,
    [property: JsonProperty("panels")] IEnumerable<PanelsPanel> Panels);

/// <summary>The unit symbols of the numbers in the file.</summary>
public sealed record PanelsUnits(
    [property: JsonProperty("length")] string Length,
    [property: JsonProperty("force")] string Force,
    [property: JsonProperty("stress")] string Stress,
    [property: JsonProperty("stiffness")] string Stiffness);

/// <summary>One wall panel.</summary>
public sealed record PanelsPanel(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("element")] string Element,
    [property: JsonProperty("mesh")] PanelsMesh Mesh,
    [property: JsonProperty("floorTies")] bool FloorTies,
    [property: JsonProperty("top", NullValueHandling = NullValueHandling.Ignore)] string? Top,
    [property: JsonProperty("topStiffness")] double? TopStiffness,
    [property: JsonProperty("topStiffnessEstimatedError")] double? TopStiffnessEstimatedError,
    [property: JsonProperty("topStiffnessOn")] string TopStiffnessOn,
    [property: JsonProperty("topStiffnessBaseMesh")] double? TopStiffnessBaseMesh,
    [property: JsonProperty("nodalResults", NullValueHandling = NullValueHandling.Ignore)] string? NodalResults,
    [property: JsonProperty("convergence", NullValueHandling = NullValueHandling.Ignore)] PanelsConvergence? Convergence,
    [property: JsonProperty("cases")] IEnumerable<PanelsCase> Cases);

/// <summary>A panel's mesh facts.</summary>
public sealed record PanelsMesh(
    [property: JsonProperty("elements")] int Elements,
    [property: JsonProperty("nodes")] int Nodes,
    [property: JsonProperty("unknowns")] int Unknowns,
    [property: JsonProperty("elementSize")] double? ElementSize,
    [property: JsonProperty("narrowestStrip")] double? NarrowestStrip,
    [property: JsonProperty("largestAspect")] double? LargestAspect,
    [property: JsonProperty("solver")] string Solver);

/// <summary>A panel's mesh convergence study.</summary>
public sealed record PanelsConvergence(
    [property: JsonProperty("meshes")] IEnumerable<PanelsConvergenceMesh> Meshes,
    [property: JsonProperty("observedOrder")] double? ObservedOrder,
    [property: JsonProperty("extrapolatedStiffness")] double? ExtrapolatedStiffness,
    [property: JsonProperty("estimatedRelativeError")] double? EstimatedRelativeError,
    [property: JsonProperty("note")] string? Note);

/// <summary>One mesh of a convergence study.</summary>
public sealed record PanelsConvergenceMesh(
    [property: JsonProperty("elementSize")] double? ElementSize,
    [property: JsonProperty("unknowns")] int Unknowns,
    [property: JsonProperty("topStiffness")] double? TopStiffness);

/// <summary>A panel's results in one case.</summary>
public sealed record PanelsCase(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("topDisplacement")] double? TopDisplacement,
    [property: JsonProperty("topDisplacementEstimatedError")] double? TopDisplacementEstimatedError,
    [property: JsonProperty("levels")] IEnumerable<PanelsLevel> Levels,
    [property: JsonProperty("backwardError")] double? BackwardError,
    [property: JsonProperty("relativeForceImbalance")] double? RelativeForceImbalance,
    [property: JsonProperty("relativeMomentImbalance")] double? RelativeMomentImbalance)
{
    /// <summary>True when the level displacements carry error estimates (a convergence study): the top's estimate is
    /// then written, a null meaning one that could not be determined.</summary>
    [JsonIgnore]
    public bool HasErrors { get; init; }

    public bool ShouldSerializeTopDisplacementEstimatedError() => HasErrors;   // Json.NET's ShouldSerialize convention
}

/// <summary>A level of a panel in one case.</summary>
public sealed record PanelsLevel(
    [property: JsonProperty("height")] double? Height,
    [property: JsonProperty("ux")] double? Ux,
    [property: JsonProperty("uxEstimatedError")] double? UxEstimatedError)
{
    /// <summary>True when the level displacement carries an error estimate (see <see cref="PanelsCase.HasErrors"/>).</summary>
    [JsonIgnore]
    public bool HasError { get; init; }

    public bool ShouldSerializeUxEstimatedError() => HasError;
}
