using Newtonsoft.Json;

namespace PlaneLateral.Output;

// The shape of results.json (docs/reports.md, "results.json"), one record per JSON object, properties in the file's order.
// The per-case arrays are sequences produced while the file is written (ResultFiles), so the file streams object by
// object: nothing holds the whole document. Numbers are in the model's units.

/// <summary>results.json: the whole static result of a run.</summary>
public sealed record ResultsDocument(
    [property: JsonProperty("producedBy")] string ProducedBy,
    [property: JsonProperty("caution")] string Caution,
    [property: JsonProperty("model")] ResultsModel Model,
    [property: JsonProperty("units")] ResultsUnits Units,
    [property: JsonProperty("solver")] ResultsSolver Solver,
    [property: JsonProperty("conditioning", NullValueHandling = NullValueHandling.Ignore)] ResultsConditioning? Conditioning,
    [property: JsonProperty("notes")] IEnumerable<string> Notes,
    [property: JsonProperty("warnings")] IEnumerable<ResultsWarning> Warnings,
    [property: JsonProperty("signConvention")] string SignConvention,
    [property: JsonProperty("stiffness")] IEnumerable<ResultsStiffness> Stiffness,
    [property: JsonProperty("cases")] IEnumerable<ResultsCase> Cases);

/// <summary>The model a results file belongs to.</summary>
public sealed record ResultsModel(
    [property: JsonProperty("title")] string? Title,
    [property: JsonProperty("file")] string? File,
    [property: JsonProperty("nodes")] int Nodes,
    [property: JsonProperty("members")] int Members);

/// <summary>The unit symbols of the numbers in the file.</summary>
public sealed record ResultsUnits(
    [property: JsonProperty("length")] string Length,
    [property: JsonProperty("force")] string Force,
    [property: JsonProperty("moment")] string Moment,
    [property: JsonProperty("rotation")] string Rotation,
    [property: JsonProperty("stiffness")] string Stiffness);

/// <summary>The solve, without anything of the machine it ran on (<see cref="MachineFree"/>).</summary>
public sealed record ResultsSolver(
    [property: JsonProperty("method")] string Method,
    [property: JsonProperty("unknowns")] int Unknowns,
    [property: JsonProperty("matrixNonZerosLower")] int MatrixNonZerosLower,
    [property: JsonProperty("factorNonZeros")] long FactorNonZeros,
    [property: JsonProperty("rightHandSides")] int RightHandSides);

/// <summary>The condition estimate of the stiffness.</summary>
public sealed record ResultsConditioning(
    [property: JsonProperty("method")] string Method,
    [property: JsonProperty("kappa1")] double Kappa1,
    [property: JsonProperty("kappa1Scaled")] double Kappa1Scaled,
    [property: JsonProperty("scaling")] string Scaling,
    [property: JsonProperty("warningThreshold")] double WarningThreshold,
    [property: JsonProperty("illConditioned")] bool IllConditioned,
    [property: JsonProperty("likelyCause")] string? LikelyCause);

/// <summary>A plausibility warning of the input (Model/Plausibility.cs).</summary>
public sealed record ResultsWarning(
    [property: JsonProperty("line")] int Line,
    [property: JsonProperty("column")] int Column,
    [property: JsonProperty("path")] string Path,
    [property: JsonProperty("problem")] string Problem,
    [property: JsonProperty("fix")] string Fix);

/// <summary>A lateral stiffness point.</summary>
public sealed record ResultsStiffness(
    [property: JsonProperty("label")] string Label,
    [property: JsonProperty("node")] string Node,
    [property: JsonProperty("direction")] string Direction,
    [property: JsonProperty("stiffness")] double Stiffness,
    [property: JsonProperty("definition")] string Definition);

/// <summary>One load case or combination with its checks and every node's and member's numbers.</summary>
public sealed record ResultsCase(
    [property: JsonProperty("id")] string Id,
    [property: JsonProperty("kind")] string Kind,
    [property: JsonProperty("description")] string? Description,
    [property: JsonProperty("checks")] ResultsCaseChecks Checks,
    [property: JsonProperty("displacements")] IEnumerable<ResultsDisplacement> Displacements,
    [property: JsonProperty("reactions")] IEnumerable<ResultsReaction> Reactions,
    [property: JsonProperty("panelBaseReactions", NullValueHandling = NullValueHandling.Ignore)] IEnumerable<ResultsPanelBase>? PanelBaseReactions,
    [property: JsonProperty("memberForces")] IEnumerable<ResultsMemberForces> MemberForces);

/// <summary>A case's solution and equilibrium checks.</summary>
public sealed record ResultsCaseChecks(
    [property: JsonProperty("relativeResidual")] double RelativeResidual,
    [property: JsonProperty("backwardError")] double BackwardError,
    [property: JsonProperty("relativeForceImbalance")] double RelativeForceImbalance,
    [property: JsonProperty("relativeMomentImbalance")] double RelativeMomentImbalance,
    [property: JsonProperty("appliedFx")] double AppliedFx,
    [property: JsonProperty("appliedFy")] double AppliedFy,
    [property: JsonProperty("reactionFx")] double ReactionFx,
    [property: JsonProperty("reactionFy")] double ReactionFy);

/// <summary>A node's displacements in one case.</summary>
public sealed record ResultsDisplacement(
    [property: JsonProperty("node")] string Node,
    [property: JsonProperty("ux")] double Ux,
    [property: JsonProperty("uy")] double Uy,
    [property: JsonProperty("rz")] double Rz);

/// <summary>A support's reaction in one case.</summary>
public sealed record ResultsReaction(
    [property: JsonProperty("node")] string Node,
    [property: JsonProperty("Fx")] double Fx,
    [property: JsonProperty("Fy")] double Fy,
    [property: JsonProperty("Mz")] double Mz);

/// <summary>A wall panel's held base in one case: the resultant of its base reactions, Mz about the middle of its base.</summary>
public sealed record ResultsPanelBase(
    [property: JsonProperty("panel")] string Panel,
    [property: JsonProperty("Fx")] double Fx,
    [property: JsonProperty("Fy")] double Fy,
    [property: JsonProperty("Mz")] double Mz,
    [property: JsonProperty("momentAboutX")] double MomentAboutX,
    [property: JsonProperty("momentAboutY")] double MomentAboutY);

/// <summary>A member's end forces in one case (local axes; see the file's sign convention).</summary>
public sealed record ResultsMemberForces(
    [property: JsonProperty("member")] string Member,
    [property: JsonProperty("N1")] double N1,
    [property: JsonProperty("V1")] double V1,
    [property: JsonProperty("M1")] double M1,
    [property: JsonProperty("N2")] double N2,
    [property: JsonProperty("V2")] double V2,
    [property: JsonProperty("M2")] double M2);
