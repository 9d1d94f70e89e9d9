using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>
/// A validated planar structural model. All quantities are in SI (N, m, rad) whatever units the file used;
/// <see cref="Units"/> remembers those units so results can be reported back in them.
/// Global axes: X to the right, Y up, rotations counter-clockwise positive.
/// </summary>
public sealed record StructureModel
{
    public required string Title { get; init; }
    public required string SourcePath { get; init; }
    public required UnitSystem Units { get; init; }
    public required IReadOnlyList<Material> Materials { get; init; }
    public required IReadOnlyList<Section> Sections { get; init; }
    public required IReadOnlyList<Node> Nodes { get; init; }
    public required IReadOnlyList<Member> Members { get; init; }
    public required IReadOnlyList<Support> Supports { get; init; }
    public required IReadOnlyList<LoadCase> LoadCases { get; init; }
    public required IReadOnlyList<Combination> Combinations { get; init; }
    public required IReadOnlyList<StiffnessPoint> StiffnessPoints { get; init; }

    /// <summary>Levels, diaphragms, lines of resistance, cracked-section assignments and drift checks (empty when absent).</summary>
    public BuildingData Building { get; init; } = BuildingData.Empty;
    /// <summary>Hand-method checks the engineer declared under "comparisons" (docs/comparisons.md); empty when none.</summary>
    public IReadOnlyList<ComparisonCheck> Comparisons { get; init; } = [];
    /// <summary>Wall panels analysed as plane-stress continua (see docs/panels.md); none by default.</summary>
    public IReadOnlyList<WallPanel> Panels { get; init; } = [];
    /// <summary>Story weights, base shear, periods and second-order settings under "seismic" (docs/seismic.md); null when absent.</summary>
    public SeismicData? Seismic { get; init; }
    /// <summary>Plausibility warnings about the input (Model/Plausibility.cs); they never change the answer. Empty when none.</summary>
    public IReadOnlyList<ModelWarning> Warnings { get; init; } = [];

    /// <summary>The files this model was read from, with their SHA-256 (empty when it was parsed from text).</summary>
    public IReadOnlyList<InputFile> Inputs { get; init; } = [];
    /// <summary>Footings on soil under supported nodes, whose springs are already in <see cref="Supports"/> (docs/footings.md); none by default.</summary>
    public IReadOnlyList<Footing> Footings { get; init; } = [];

    /// <summary>Index of the node with the given id, or −1.</summary>
    public int NodeIndex(string id)
    {
        for (int i = 0; i < Nodes.Count; i++) if (Nodes[i].Id == id) return i;
        return -1;
    }
}

/// <summary>A nodal degree of freedom: translation along X or Y, rotation about Z.</summary>
public enum Dof { X = 0, Y = 1, RZ = 2 }

public static class DofNames
{
    public static string Name(Dof d) => d switch { Dof.X => "ux", Dof.Y => "uy", _ => "rz" };
}

/// <summary>An isotropic linear elastic material. E and G in N/m².</summary>
/// <param name="Nu">Poisson's ratio (from E and G when the file gave G).</param>
public sealed record Material(string Id, double E, double G, double Nu);

/// <summary>How a section's shear area is found.</summary>
public enum ShearAreaRule
{
    /// <summary>Given directly (general section), or infinite when absent (no shear deformation).</summary>
    Given,
    /// <summary>A / f with a given shear form factor f (1.2 for a rectangle by default).</summary>
    FormFactor,
    /// <summary>κ·A with Cowper's κ = 10(1+ν)/(12+11ν) for a rectangle (Cowper, J. Appl. Mech. 33:335–340, 1966).</summary>
    CowperRectangle,
}

/// <summary>
/// Cross-section properties: area A (m²), second moment of area I (m⁴) about the bending axis and, for
/// shear deformation, the rule for the shear area.
/// </summary>
/// <param name="ShearAreaValue">Given shear area (m²) for <see cref="ShearAreaRule.Given"/>, +∞ for none.</param>
/// <param name="FormFactor">Shear form factor f for <see cref="ShearAreaRule.FormFactor"/>.</param>
/// <param name="Shape">"rectangle", "I" or "general", for reports.</param>
/// <param name="Depth">Depth in the plane of bending (m), NaN for a general section.</param>
public sealed record Section(string Id, string Shape, double A, double I, ShearAreaRule Rule, double ShearAreaValue, double FormFactor, double Depth)
{
    /// <summary>Shear area in m² for a material of Poisson's ratio <paramref name="nu"/>; +∞ when shear deformation is ignored.</summary>
    public double ShearArea(double nu) => Rule switch
    {
        ShearAreaRule.Given => ShearAreaValue,
        ShearAreaRule.FormFactor => A / FormFactor,
        ShearAreaRule.CowperRectangle => A * 10.0 * (1.0 + nu) / (12.0 + 11.0 * nu),
        _ => throw new InvalidOperationException(),
    };
}

/// <summary>A node at (X, Y) in metres.</summary>
public sealed record Node(int Index, string Id, double X, double Y);

/// <summary>How a member resists load.</summary>
public enum MemberKind
{
    /// <summary>Shear-deformable (Timoshenko) beam-column: axial, shear and bending.</summary>
    BeamColumn,
    /// <summary>Axial force only (pin-ended brace or link).</summary>
    Brace,
}

/// <summary>Multipliers on section properties, e.g. for cracked concrete (1 = as the section gives).</summary>
public sealed record StiffnessModifiers(double I, double A, double ShearArea)
{
    public static StiffnessModifiers None { get; } = new(1, 1, 1);
}

/// <summary>
/// A line member from node <see cref="Start"/> to node <see cref="End"/> (node indices).
/// Properties are effective values, modifiers applied, in SI.
/// </summary>
/// <param name="RigidStart">Length (m) of the rigid zone at the start, along the member axis.</param>
/// <param name="RigidEnd">Length (m) of the rigid zone at the end.</param>
/// <param name="Role">Free-text role for reports and later presets ("wall", "column", "beam", ...).</param>
public sealed record Member(
    int Index, string Id, int Start, int End, MemberKind Kind,
    string SectionId, string MaterialId,
    double E, double G, double A, double I, double ShearArea,
    bool ReleaseStart, bool ReleaseEnd, double RigidStart, double RigidEnd,
    StiffnessModifiers Modifiers, string Role)
{
    /// <summary>
    /// Exactly inextensible ("axiallyRigid": true; docs/model-format.md): its two end nodes share one equation for the
    /// displacement along its axis (a member along x or y), an exact constraint without a large stiffness. Its axial
    /// force is then a constraint force, not found from its own deformation (reported 0, as for a beam in a rigid diaphragm).
    /// </summary>
    public bool AxiallyRigid { get; init; }
}

/// <summary>A support at a node: restrained DOFs and elastic springs (N/m or N·m/rad) on the others.</summary>
public sealed record Support(int Node, string Type, bool RestrainX, bool RestrainY, bool RestrainRZ, double SpringX, double SpringY, double SpringRZ)
{
    public bool Restrains(Dof d) => d switch { Dof.X => RestrainX, Dof.Y => RestrainY, _ => RestrainRZ };
    public double Spring(Dof d) => d switch { Dof.X => SpringX, Dof.Y => SpringY, _ => SpringRZ };
}

/// <summary>Forces (N) and moment (N·m) applied at a node.</summary>
public sealed record NodalLoad(int Node, double Fx, double Fy, double Mz);

/// <summary>Axes a member load is given in.</summary>
public enum LoadAxes { Global, Local }

/// <summary>
/// A distributed load along a whole member, varying linearly from <see cref="WStart"/> at the start node to
/// <see cref="WEnd"/> at the end node (N/m, per unit length of the member axis, not of its projection).
/// Direction: Global → 0 = X, 1 = Y; Local → 0 = axial (local x), 1 = transverse (local y).
/// </summary>
public sealed record MemberLoad(int Member, LoadAxes Axes, int Direction, double WStart, double WEnd);

/// <summary>A load case: loads applied together.</summary>
public sealed record LoadCase(string Id, string Description, IReadOnlyList<NodalLoad> NodalLoads, IReadOnlyList<MemberLoad> MemberLoads);

/// <summary>A combination: a factored sum of load cases (index into the model's load cases, factor).</summary>
public sealed record Combination(string Id, string Description, IReadOnlyList<(int Case, double Factor)> Factors);

/// <summary>A point where the lateral stiffness is reported: 1 / displacement under a unit force there.</summary>
public sealed record StiffnessPoint(string Label, int Node, Dof Direction);

/// <summary>Where in the model file a comparison check was declared, for messages raised when it is worked out.</summary>
public sealed record CheckLocation(string File, int Line, int Column, string JsonPath);

/// <summary>How the ends of a wall checked against a hand formula are held.</summary>
public enum CheckEnds
{
    /// <summary>Base fixed, top free to translate and rotate.</summary>
    Cantilever,
    /// <summary>Base fixed, top free to translate but held against rotation.</summary>
    FixedFixed,
}

/// <summary>
/// One check declared under "comparisons": a hand method set beside the finite-element number.
/// <paramref name="Tolerance"/> is the check's own band on FE/hand − 1 (null: the run's default).
/// </summary>
public abstract record ComparisonCheck(string Id, string Description, double? Tolerance, CheckLocation At);

/// <summary>
/// A wall line: vertical chain of line members from <see cref="BaseNode"/> to <see cref="TopNode"/>, one section
/// over the height, checked as a cantilever and/or fixed-fixed pier. Members are listed base first.
/// </summary>
public sealed record WallLineCheck(string Id, string Description, double? Tolerance, CheckLocation At,
    IReadOnlyList<int> Members, int BaseNode, int TopNode, IReadOnlyList<CheckEnds> Ends)
    : ComparisonCheck(Id, Description, Tolerance, At);

/// <summary>A rectangular opening in a wall elevation: lower-left corner (X, Y) from the wall's left end and base, SI.</summary>
public sealed record OpeningSpec(string Label, double X, double Y, double Width, double Height);

/// <summary>A wall with openings described by its geometry (SI), checked against the perforated-wall hand method.</summary>
public sealed record PerforatedWallCheck(string Id, string Description, double? Tolerance, CheckLocation At,
    double Length, double Height, double Thickness, Material Material, double FormFactor, CheckEnds Ends,
    IReadOnlyList<OpeningSpec> Openings)
    : ComparisonCheck(Id, Description, Tolerance, At);

/// <summary>
/// The stories of a moment frame made of the listed members (vertical columns, horizontal beams).
/// <see cref="Levels"/> are the floor heights (SI, base first); <see cref="Stories"/> the 1-based stories to check;
/// <see cref="Pattern"/> the lateral force at each level above the base (SI), for the FE story stiffness.
/// </summary>
public sealed record FrameStoriesCheck(string Id, string Description, double? Tolerance, CheckLocation At,
    IReadOnlyList<int> Members, IReadOnlyList<double> Levels, IReadOnlyList<int> Stories, IReadOnlyList<double> Pattern)
    : ComparisonCheck(Id, Description, Tolerance, At);

/// <summary>One line of a story-shear split: a label and the id of the wall-line or frame-stories check that describes it.</summary>
public sealed record SplitLine(string Label, string CheckId);

/// <summary>The story shear of a load case shared among parallel lines, by relative rigidity and by the full FE model.</summary>
public sealed record ShearSplitCheck(string Id, string Description, double? Tolerance, CheckLocation At,
    int LoadCase, IReadOnlyList<SplitLine> Lines)
    : ComparisonCheck(Id, Description, Tolerance, At);
