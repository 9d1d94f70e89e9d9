namespace PlaneLateral.Model;

/// <summary>Which plane-stress element a wall panel is meshed with.</summary>
public enum PanelElementKind
{
    /// <summary>4-node incompatible-mode quadrilateral (QM6, Taylor, Beresford &amp; Wilson 1976).</summary>
    Quad4,
    /// <summary>9-node Lagrangian quadrilateral.</summary>
    Quad9,
}

/// <summary>
/// How a wall panel is meshed. Give either a target element size or a number of elements across the narrowest solid
/// strip (pier between openings, or the wall beside, above or below an opening); the other is 0.
/// </summary>
/// <param name="ElementSize">Target element side (m); 0 when <paramref name="ElementsAcrossNarrowest"/> decides.</param>
/// <param name="ElementsAcrossNarrowest">Elements across the narrowest solid strip; 0 when <paramref name="ElementSize"/> decides.</param>
/// <param name="MaxAspect">Largest element side ratio the mesher may produce (the element size is reduced to keep it).</param>
/// <param name="MaxNodes">Largest mesh the analysis accepts (nodes); bigger meshes are refused before any work.</param>
/// <param name="Refinements">Meshes solved for the convergence study (h, h/2, ...); 1 = no study.</param>
public sealed record PanelMeshSettings(PanelElementKind Element, double ElementSize, int ElementsAcrossNarrowest, double MaxAspect = 4, int MaxNodes = 3000, int Refinements = 1)
{
    public static PanelMeshSettings Default { get; } = new(PanelElementKind.Quad9, 0, 2);
}

/// <summary>A rectangular opening (door or window) in a wall panel; positions from the panel's bottom-left corner (m).</summary>
/// <param name="Left">Distance from the panel's left end to the opening's left edge (m).</param>
/// <param name="Bottom">Height of the opening's bottom edge (sill) above the panel base (m); 0 for a door.</param>
public sealed record PanelOpening(string Id, double Left, double Bottom, double Width, double Height);

/// <summary>How the top edge of a wall panel is held.</summary>
public enum PanelTop
{
    /// <summary>Free (the cantilever): only the top floor tie, every top node sharing one horizontal displacement.</summary>
    Free,
    /// <summary>
    /// Guided (the continuum counterpart of the fixed-guided, "fixed-fixed" pier): the top edge moves as a rigid body
    /// that translates but does not rotate. Every top node shares one horizontal displacement (the floor tie) and one
    /// vertical displacement (equation sharing, exact), so the top edge stays straight and level while the wall may still
    /// shorten or lengthen as a whole.
    /// </summary>
    Guided,
}

/// <summary>How a story force reaches the panel.</summary>
public enum PanelLoadPath
{
    /// <summary>Through the floor tie: all panel nodes at the level share one horizontal displacement; the force acts on it.</summary>
    Tie,
    /// <summary>Spread as a uniform line load along the solid length of the level (consistent edge forces).</summary>
    Spread,
}

/// <summary>A story force on a wall panel in one load case (N), at a floor level (m above the panel base).</summary>
/// <param name="Case">Index of the model load case.</param>
/// <param name="Fx">Horizontal force (N), positive to the right; by <paramref name="Path"/>.</param>
/// <param name="Fy">Vertical force (N), positive up; always spread uniformly along the level.</param>
public sealed record PanelLoad(int Case, double Level, double Fx, double Fy, PanelLoadPath Path);

/// <summary>
/// A wall panel analysed as a plane-stress continuum: a rectangle of length × height (m) and thickness (m) with its
/// bottom-left corner at (X0, Y0), rectangular openings, floor levels, a fixed base, story forces. The reference against
/// which the hand methods' plane-section assumption is judged (squat walls, walls with openings).
/// </summary>
public sealed record WallPanel
{
    public required string Id { get; init; }
    public required double X0 { get; init; }
    public required double Y0 { get; init; }
    public required double Length { get; init; }
    public required double Height { get; init; }
    public required double Thickness { get; init; }
    public required string MaterialId { get; init; }

    /// <summary>Young's modulus (N/m²) and Poisson's ratio of the material.</summary>
    public required double E { get; init; }
    public required double Nu { get; init; }

    public IReadOnlyList<PanelOpening> Openings { get; init; } = [];

    /// <summary>Floor levels strictly between base and top (m above the base), ascending; the top is always a level.</summary>
    public IReadOnlyList<double> FloorLevels { get; init; } = [];

    /// <summary>True: every level (and the top) has a floor tie. False: levels are only lines of the mesh.</summary>
    public bool FloorTies { get; init; } = true;

    public PanelMeshSettings Mesh { get; init; } = PanelMeshSettings.Default;

    /// <summary>How the top edge is held: free (cantilever, the default) or guided (translates without rotating; needs the floor ties).</summary>
    public PanelTop Top { get; init; } = PanelTop.Free;

    public IReadOnlyList<PanelLoad> Loads { get; init; } = [];

    /// <summary>Rigid links from frame nodes to segments of the panel's edges (none: the panel is solved on its own).</summary>
    public IReadOnlyList<PanelLink> Links { get; init; } = [];

    /// <summary>The line of resistance a linked panel belongs to in the story results (docs/building.md); null: its own line, named by its id.</summary>
    public string? Line { get; init; }

    /// <summary>All levels, the top included (m above the base), ascending.</summary>
    public IReadOnlyList<double> Levels => [.. FloorLevels, Height];
}

/// <summary>An edge of a wall panel that a frame node may be linked to (the base is held, so it takes no link).</summary>
public enum PanelEdge
{
    /// <summary>The left end (x = 0 of the panel); positions are heights above the base.</summary>
    Left,
    /// <summary>The right end (x = length); positions are heights above the base.</summary>
    Right,
    /// <summary>The top (y = height); positions are distances from the panel's left end.</summary>
    Top,
}

/// <summary>
/// A rigid link from a frame node to a segment of a panel edge: every panel node on the segment follows the node's
/// rigid-body motion exactly, u_i = u_n − θ·(y_i − y_n), v_i = v_n + θ·(x_i − x_n) (docs/panels.md, "Panels in a frame").
/// </summary>
/// <param name="Node">Index of the frame node (the master).</param>
/// <param name="From">Start of the segment along the edge (m, from the panel's bottom-left corner: a height on an end, a distance on the top).</param>
/// <param name="To">End of the segment (m), at or after <paramref name="From"/>.</param>
public sealed record PanelLink(int Node, PanelEdge Edge, double From, double To);
