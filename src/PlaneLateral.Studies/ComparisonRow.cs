using PlaneLateral.Hand;

namespace PlaneLateral.Studies;

/// <summary>How the FE number stands against the hand number.</summary>
public enum Verdict
{
    /// <summary>|FE/hand − 1| ≤ tolerance.</summary>
    WithinTolerance,
    /// <summary>FE/hand &lt; 1 − tolerance: the hand value is the higher (for a stiffness: the hand method is stiffer).</summary>
    HandHigher,
    /// <summary>FE/hand &gt; 1 + tolerance: the hand value is the lower (for a stiffness: the hand method is softer).</summary>
    HandLower,
}

/// <summary>What a row compares.</summary>
public enum ComparedQuantity
{
    /// <summary>Lateral stiffness, force per length.</summary>
    Stiffness,
    /// <summary>Story shear carried by one line, force.</summary>
    StoryShear,
    /// <summary>A dimensionless share, e.g. a coupled wall's degree of coupling.</summary>
    Fraction,
    /// <summary>A force other than a story shear, e.g. a pier's axial force.</summary>
    Force,
}

/// <summary>The hand-method side of a row: the number (model units), its method (name, source, assumptions) and, for a pier, the flexural and shear shares of its deflection.</summary>
/// <param name="Detail">Extra lines a reviewer would want beside the number (e.g. the perforated-wall breakdown); may be empty.</param>
public sealed record HandEstimate(double Value, HandMethod Method, double? FlexuralShare = null, double? ShearShare = null, string Detail = "");

/// <summary>
/// One finite-element estimate of the same quantity, named by the model it came from. A row holds an ordered list of
/// these, the first being the reference the verdict uses (a converged plane-stress panel where the row has one,
/// <see cref="ReferenceChoice"/>); the others stand beside it with their own ratios.
/// </summary>
/// <param name="Model">Short name of the FE model, e.g. "line members, isolated".</param>
/// <param name="Value">The number, model units.</param>
/// <param name="Description">How the model was built and loaded, in plain words.</param>
/// <param name="EstimatedError">The estimated relative discretisation error of this very number (a panel's Richardson
/// estimate), or null where none is estimated (line models: exact elements, no discretisation error in the stiffness).</param>
public sealed record FeEstimate(string Model, double Value, string Description, double? FlexuralShare = null, double? ShearShare = null, double? EstimatedError = null);

/// <summary>
/// One line of the comparison: a hand number beside the FE numbers, with the gap and the reason for it.
/// Values are in the model's units (<see cref="Unit"/>).
/// </summary>
/// <param name="CheckId">The id of the check in the model file.</param>
/// <param name="Kind">The check's kind ("wall-line", "perforated-wall", "frame-stories", "shear-split").</param>
/// <param name="Subject">What this row is about within the check, e.g. "cantilever" or "story 2".</param>
/// <param name="AspectRatio">h/l where it applies (l = section depth or wall length), else null.</param>
/// <param name="Tolerance">The band on FE/hand − 1 used for the verdict.</param>
/// <param name="Cause">The reason for the gap (or for the agreement), in plain words, chosen by the rules in docs/comparisons.md.</param>
/// <param name="ReferenceBasis">Why <see cref="Reference"/> is the reference, in plain words: the converged panel, or
/// "line models only" with the reason the row has no converged panel (<see cref="ReferenceChoice"/>).</param>
public sealed record ComparisonRow(
    string CheckId, string Kind, string Subject, ComparedQuantity Quantity, string Unit,
    HandEstimate Hand, IReadOnlyList<FeEstimate> Fe, double? AspectRatio, double Tolerance, string Cause, string ReferenceBasis = "")
{
    /// <summary>The FE estimate the verdict, the headline ratio, the figures and the tables use (the first).</summary>
    public FeEstimate Reference => Fe[0];

    /// <summary>Name of the plane-stress panel estimate among <see cref="Fe"/>.</summary>
    public const string PanelModelName = PanelEstimate.ModelName;

    /// <summary>The plane-stress panel estimate, when the row has one (the reference when it is converged, <see cref="ReferenceChoice"/>).</summary>
    public FeEstimate? Panel => Fe.FirstOrDefault(f => f.Model == PanelModelName);

    /// <summary>The estimate of the named FE model, or null.</summary>
    public FeEstimate? Estimate(string model) => Fe.FirstOrDefault(f => f.Model == model);

    /// <summary>The first FE estimate other than the reference (shown beside it in tables and figures), or null.</summary>
    public FeEstimate? Beside => Fe.Count > 1 ? Fe[1] : null;

    /// <summary>FE/hand for the reference estimate.</summary>
    public double Ratio => Reference.Value / Hand.Value;

    public Verdict Verdict => Judge(Ratio, Tolerance);

    /// <summary>The verdict in words that suit the quantity.</summary>
    public string VerdictText => VerdictWords(Verdict, Quantity);

    public static Verdict Judge(double ratio, double tolerance) =>
        Math.Abs(ratio - 1) <= tolerance ? Verdict.WithinTolerance : ratio < 1 ? Verdict.HandHigher : Verdict.HandLower;

    public static string VerdictWords(Verdict v, ComparedQuantity q) => (v, q) switch
    {
        (Verdict.WithinTolerance, _) => "within tolerance",
        (Verdict.HandHigher, ComparedQuantity.Stiffness) => "hand stiffer",
        (Verdict.HandLower, ComparedQuantity.Stiffness) => "hand softer",
        (Verdict.HandHigher, _) => "hand gives more",
        _ => "hand gives less",
    };
}

/// <summary>Every row of a model's comparison checks.</summary>
public sealed class ComparisonReport
{
    /// <summary>The caution carried by every comparison output.</summary>
    public const string Caution =
        "Hand methods set beside finite-element numbers, for verification by a licensed engineer. Neither number shows compliance with any code; the governing local building code and the engineer of record decide.";

    public required string ModelTitle { get; init; }
    public required string ModelFile { get; init; }
    public required string ForceUnit { get; init; }
    public required string LengthUnit { get; init; }
    public required double DefaultTolerance { get; init; }
    public required IReadOnlyList<ComparisonRow> Rows { get; init; }
}
