namespace PlaneLateral.Hand;

/// <summary>One column of a moment-frame story. Units: any consistent set.</summary>
/// <param name="E">Young's modulus (F/L²), positive.</param>
/// <param name="I">Second moment of area about the bending axis (L⁴), positive.</param>
/// <param name="G">Shear modulus (F/L²); give it together with <paramref name="ShearArea"/> to include shear deformation.</param>
/// <param name="ShearArea">Shear area A_s = A/f (L²); give it together with <paramref name="G"/>.</param>
/// <param name="PinnedBase">True: the column's lower end is free to rotate (a pinned base or a moment release there);
/// false: it is held against rotation (a fixed base, or a rigid beam below).</param>
public sealed record FrameColumn(double E, double I, double? G = null, double? ShearArea = null, bool PinnedBase = false);

/// <summary>Lateral stiffness of one moment-frame story.</summary>
/// <param name="Stiffness">Story stiffness: story shear per unit drift (F/L).</param>
/// <param name="ColumnStiffnesses">Each column's contribution (F/L), summing to <paramref name="Stiffness"/>.</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record FrameStoryResult(double Stiffness, IReadOnlyList<double> ColumnStiffnesses, HandMethod Method);

/// <summary>Per-column detail of a D-value computation.</summary>
/// <param name="StiffnessRatioColumn">k_c = I_c/h (L³).</param>
/// <param name="BeamToColumnRatio">k̄, the beam-to-column stiffness ratio as defined for the column's position.</param>
/// <param name="Coefficient">a, the fraction of 12EI_c/h³ the column keeps.</param>
/// <param name="DValue">D = a·12EI_c/h³ (F/L).</param>
public sealed record DValueColumn(double StiffnessRatioColumn, double BeamToColumnRatio, double Coefficient, double DValue);

/// <summary>The D-value result: story stiffness plus the per-column detail.</summary>
/// <param name="Stiffness">ΣD (F/L).</param>
/// <param name="Columns">Per-column detail, left to right.</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record DValueResult(double Stiffness, IReadOnlyList<DValueColumn> Columns, HandMethod Method);

/// <summary>Where a story sits, which decides the D-value coefficient.</summary>
public enum StoryPosition
{
    /// <summary>A story with beams at both its top and its bottom joints (any story above the ground story).</summary>
    Upper,

    /// <summary>Ground story, column bases fully fixed.</summary>
    FixedBase,

    /// <summary>Ground story, column bases pinned.</summary>
    PinnedBase,
}

/// <summary>Moment-frame story stiffness by hand methods. Units: any consistent set (force F, length L).</summary>
public static class FrameStory
{
    /// <summary>
    /// Rigid beams: the column tops translate without rotating. A column held against rotation at its base
    /// (fixed-guided) gives 12EI_c/(h³(1 + Φ)); a column free to rotate at its base (pinned, or released there) is a
    /// cantilever from its held top and gives 3EI_c/(h³(1 + Φ/4)); Φ = 12EI_c/(G·A_s·h²) for each column that gives G
    /// and A_s, else 0. k = Σ over the columns.
    /// Source: elementary beam theory (fixed-guided member 12EI/h³, cantilever 3EI/h³; a pinned-base portal with a rigid
    /// beam is 2 × 3EI/h³ = 6EI/h³, the β → ∞ limit of <see cref="PortalPinnedBase"/>); shear term after Timoshenko, as in
    /// Przemieniecki, Theory of Matrix Structural Analysis, 1968 (from memory for the reference). Derived: the cantilever
    /// with shear, Δ = Vh³/(3EI) + Vh/(G·A_s) = (Vh³/(3EI))(1 + 3EI/(G·A_s·h²)) = (Vh³/(3EI))(1 + Φ/4).
    /// </summary>
    /// <param name="height">Story height h (L), positive.</param>
    /// <param name="columns">The story's columns, each with its base condition.</param>
    public static FrameStoryResult RigidBeams(double height, IReadOnlyList<FrameColumn> columns)
    {
        Guard.Positive(height, "The story height h");
        Guard.NotEmpty(columns, "The list of columns");
        var ks = new double[columns.Count];
        bool anyShear = false;
        for (int j = 0; j < columns.Count; j++)
        {
            var c = columns[j];
            Guard.Positive(c.E, $"Young's modulus E of column {j + 1}");
            Guard.Positive(c.I, $"The second moment of area I of column {j + 1}");
            if ((c.G is null) != (c.ShearArea is null))
                throw new ArgumentException($"Column {j + 1}: give both G and the shear area A_s, or neither.");
            double phi = 0;
            if (c.G is double g && c.ShearArea is double a)
            {
                Guard.Positive(g, $"The shear modulus G of column {j + 1}");
                Guard.Positive(a, $"The shear area A_s of column {j + 1}");
                phi = 12 * c.E * c.I / (g * a * height * height);
                anyShear = true;
            }
            ks[j] = c.PinnedBase
                ? 3 * c.E * c.I / (height * height * height * (1 + phi / 4))
                : 12 * c.E * c.I / (height * height * height * (1 + phi));
        }
        int pinned = columns.Count(c => c.PinnedBase);
        string name = pinned == 0 ? "Rigid-beam story, fixed-base columns, k = Σ12EI/(h³(1+Φ))"
            : pinned == columns.Count ? "Rigid-beam story, pinned-base columns, k = Σ3EI/(h³(1+Φ/4))"
            : "Rigid-beam story, fixed-base columns 12EI/(h³(1+Φ)) and pinned-base columns 3EI/(h³(1+Φ/4)), summed";
        string bases = pinned == 0 ? "column bases held against rotation (fixed, or a rigid beam below)"
            : pinned == columns.Count ? "column bases free to rotate (pinned or released): each column a cantilever from its held top"
            : $"{columns.Count - pinned} column base(s) held against rotation, {pinned} free to rotate (pinned or released)";
        return new FrameStoryResult(ks.Sum(), ks, new HandMethod(name,
            "Elementary beam theory (fixed-guided 12EI/h³, cantilever 3EI/h³); shear parameter Φ = 12EI/(G·A_s·h²) after Timoshenko",
            ["beams infinitely stiff in bending, so column tops do not rotate", bases,
             anyShear ? "shear deformation included for columns given G and A_s, neglected for the others"
                      : "shear deformation neglected (flexure only)",
             "axial deformation and P-delta effects neglected", "linear elastic"]));
    }

    /// <summary>
    /// Single-bay portal, fixed bases, flexible beam, lateral force at beam level; two equal columns.
    /// k = (24EI_c/h³)·(1 + 6β)/(4 + 6β), β = (I_b/L)/(I_c/h). Limits: 24EI_c/h³ (rigid beam), 6EI_c/h³ (no beam).
    /// Source: derived by slope-deflection (antisymmetric sway, equal joint rotations).
    /// </summary>
    /// <param name="e">Young's modulus E, same for beam and columns (F/L²), positive.</param>
    /// <param name="columnI">I of each column (L⁴), positive.</param>
    /// <param name="height">Column height h (L), positive.</param>
    /// <param name="beamI">I of the beam (L⁴), zero or positive (zero: no beam).</param>
    /// <param name="span">Beam span L, centreline to centreline (L), positive.</param>
    public static FrameStoryResult PortalFixedBase(double e, double columnI, double height, double beamI, double span)
    {
        double beta = PortalBeta(e, columnI, height, beamI, span);
        double k = 24 * e * columnI / Math.Pow(height, 3) * (1 + 6 * beta) / (4 + 6 * beta);
        return new FrameStoryResult(k, [k / 2, k / 2], Portal("fixed", beta));
    }

    /// <summary>
    /// Single-bay portal, pinned bases, flexible beam, lateral force at beam level; two equal columns.
    /// k = (12EI_c/h³)·β/(2β + 1), β = (I_b/L)/(I_c/h). Limits: 6EI_c/h³ (rigid beam), 0 (no beam: a mechanism).
    /// Source: derived by slope-deflection (antisymmetric sway, equal joint rotations).
    /// </summary>
    /// <inheritdoc cref="PortalFixedBase" path="/param"/>
    public static FrameStoryResult PortalPinnedBase(double e, double columnI, double height, double beamI, double span)
    {
        double beta = PortalBeta(e, columnI, height, beamI, span);
        double k = 12 * e * columnI / Math.Pow(height, 3) * beta / (2 * beta + 1);
        return new FrameStoryResult(k, [k / 2, k / 2], Portal("pinned", beta));
    }

    private static double PortalBeta(double e, double columnI, double height, double beamI, double span)
    {
        Guard.Positive(e, "Young's modulus E");
        Guard.Positive(columnI, "The column second moment of area I_c");
        Guard.Positive(height, "The column height h");
        Guard.NonNegative(beamI, "The beam second moment of area I_b");
        Guard.Positive(span, "The beam span L");
        return (beamI / span) / (columnI / height);
    }

    private static HandMethod Portal(string bases, double beta) => new(
        $"Single-bay portal, {bases} bases, flexible beam (slope-deflection)",
        "Derived by hand by slope-deflection; see docs/hand-methods.md",
        [$"column bases {(bases == "fixed" ? "fully fixed" : "pinned")}", "two equal columns, one prismatic beam",
         "lateral force at beam level", "flexure only: shear and axial deformation neglected",
         "joints rigid, of zero size", "P-delta neglected", "linear elastic",
         $"beam-to-column stiffness ratio beta = {beta.ToString("G6", System.Globalization.CultureInfo.InvariantCulture)}"]);

    /// <summary>
    /// Multi-bay story with flexible beams by the D-value method (K. Muto; coefficients from memory).
    /// For each column, k_c = I_c/h and k_b = I_b/L for the beams framing into it:
    /// upper story k̄ = (k_b,top-left + k_b,top-right + k_b,bottom-left + k_b,bottom-right)/(2k_c), a = k̄/(2 + k̄);
    /// fixed-base ground story k̄ = (k_b,top-left + k_b,top-right)/k_c, a = (0.5 + k̄)/(2 + k̄);
    /// pinned-base ground story k̄ as fixed base, a = 0.5k̄/(1 + 2k̄).
    /// D = a·12EI_c/h³; story stiffness ΣD.
    /// Source: K. Muto, Aseismic Design Analysis of Buildings, Maruzen, Tokyo (the D-value method) — from memory:
    /// the coefficients are as commonly quoted, not checked against the original here.
    /// </summary>
    /// <param name="e">Young's modulus E, same for beams and columns (F/L²), positive.</param>
    /// <param name="height">Story height h (L), positive.</param>
    /// <param name="columnI">I of each column, left to right (L⁴); at least two columns.</param>
    /// <param name="spans">Span of each bay (L); one fewer than the columns.</param>
    /// <param name="beamIAbove">I of the beam at the story's top in each bay (L⁴), zero or positive.</param>
    /// <param name="beamIBelow">I of the beam at the story's bottom in each bay; required for <see cref="StoryPosition.Upper"/>, ignored otherwise.</param>
    /// <param name="position">Upper story, fixed-base ground story, or pinned-base ground story.</param>
    public static DValueResult DValues(double e, double height, IReadOnlyList<double> columnI, IReadOnlyList<double> spans,
        IReadOnlyList<double> beamIAbove, IReadOnlyList<double>? beamIBelow, StoryPosition position)
    {
        Guard.Positive(e, "Young's modulus E");
        Guard.Positive(height, "The story height h");
        if (columnI is null || columnI.Count < 2) throw new ArgumentException("Give at least two columns.");
        int bays = columnI.Count - 1;
        if (spans is null || spans.Count != bays) throw new ArgumentException($"Give one span per bay ({bays}).");
        if (beamIAbove is null || beamIAbove.Count != bays) throw new ArgumentException($"Give one beam I above per bay ({bays}).");
        if (position == StoryPosition.Upper && (beamIBelow is null || beamIBelow.Count != bays))
            throw new ArgumentException($"An upper story needs one beam I below per bay ({bays}).");
        for (int j = 0; j <= bays; j++) Guard.Positive(columnI[j], $"The second moment of area I of column {j + 1}");
        var kbTop = new double[bays];
        var kbBot = new double[bays];
        for (int b = 0; b < bays; b++)
        {
            Guard.Positive(spans[b], $"The span of bay {b + 1}");
            Guard.NonNegative(beamIAbove[b], $"The beam I above bay {b + 1}");
            kbTop[b] = beamIAbove[b] / spans[b];
            if (position == StoryPosition.Upper)
            {
                Guard.NonNegative(beamIBelow![b], $"The beam I below bay {b + 1}");
                kbBot[b] = beamIBelow[b] / spans[b];
            }
        }
        double Adj(double[] kb, int j) => (j > 0 ? kb[j - 1] : 0) + (j < bays ? kb[j] : 0);
        var cols = new DValueColumn[bays + 1];
        for (int j = 0; j <= bays; j++)
        {
            double kc = columnI[j] / height;
            double kbar, a;
            switch (position)
            {
                case StoryPosition.Upper:
                    kbar = (Adj(kbTop, j) + Adj(kbBot, j)) / (2 * kc);
                    a = kbar / (2 + kbar);
                    break;
                case StoryPosition.FixedBase:
                    kbar = Adj(kbTop, j) / kc;
                    a = (0.5 + kbar) / (2 + kbar);
                    break;
                case StoryPosition.PinnedBase:
                    kbar = Adj(kbTop, j) / kc;
                    a = 0.5 * kbar / (1 + 2 * kbar);
                    break;
                default: throw new ArgumentException($"Unknown story position {position}.");
            }
            cols[j] = new DValueColumn(kc, kbar, a, a * 12 * e * columnI[j] / Math.Pow(height, 3));
        }
        return new DValueResult(cols.Sum(c => c.DValue), cols, new HandMethod(
            "D-value method (Muto), story stiffness with flexible beams",
            "K. Muto, Aseismic Design Analysis of Buildings, Maruzen, Tokyo; coefficients from memory",
            ["all joints at a floor level rotate equally", "adjacent stories have the same drift angle as this one",
             "columns of the stories above and below are like this story's (upper story case)",
             "beams bend in double curvature with a point of contraflexure at midspan",
             position switch
             {
                 StoryPosition.Upper => "beams frame in at the story's top and bottom",
                 StoryPosition.FixedBase => "column bases fully fixed",
                 _ => "column bases pinned",
             },
             "flexure only: shear and axial deformation neglected", "joints rigid, of zero size",
             "P-delta neglected", "linear elastic", "one E for beams and columns"]));
    }
}
