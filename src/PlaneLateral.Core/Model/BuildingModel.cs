namespace PlaneLateral.Model;

/// <summary>
/// The building layer of a model: levels with their rigid-diaphragm ties, the line of resistance of each member,
/// the stiffness modifier each member got and why, and the drift checks asked for. Empty when the model has no
/// "levels", "crackedSections" or "driftChecks" (the plain frame analysis is then unchanged).
/// </summary>
public sealed class BuildingData
{
    public static BuildingData Empty { get; } = new();

    /// <summary>Levels, lowest first (sorted by elevation whatever the file order).</summary>
    public IReadOnlyList<Level> Levels { get; init; } = [];

    /// <summary>Line of resistance of each member, parallel to the model's members ("" when the member has none).</summary>
    public IReadOnlyList<string> MemberLines { get; init; } = [];

    /// <summary>The distinct line names, in order of first appearance among the members.</summary>
    public IReadOnlyList<string> Lines { get; init; } = [];

    /// <summary>Which stiffness modifiers each member got and why, parallel to the model's members.</summary>
    public IReadOnlyList<ModifierAssignment> Modifiers { get; init; } = [];

    /// <summary>The cracked-section settings as read (null when the model has no "crackedSections").</summary>
    public CrackedSectionSettings? CrackedSections { get; init; }

    public IReadOnlyList<DriftCheckSpec> DriftChecks { get; init; } = [];

    /// <summary>Stories between consecutive levels: story i runs from Levels[i] to Levels[i+1].</summary>
    public int StoryCount => Math.Max(0, Levels.Count - 1);

    /// <summary>
    /// For every node, the node whose ux it shares through a rigid diaphragm (itself for the master), or −1 when it is
    /// tied to nothing. The master of a diaphragm is its lowest-numbered node.
    /// </summary>
    public int[] DiaphragmMasters(int nodeCount)
    {
        var master = Enumerable.Repeat(-1, nodeCount).ToArray();
        foreach (var l in Levels)
            if (l.TiedNodes.Count > 0)
                foreach (int n in l.TiedNodes) master[n] = l.TiedNodes[0];
        return master;
    }
}

/// <summary>
/// A floor level at <paramref name="Elevation"/> (m). <paramref name="Nodes"/> are the nodes that report the level's
/// displacement (node indices, ascending); <paramref name="TiedNodes"/> are the nodes whose ux a rigid diaphragm makes
/// equal (the same list for a rigid level, empty for a level without a diaphragm).
/// </summary>
/// <param name="Selection">How the nodes were chosen, for reports: "at elevation" or "listed".</param>
public sealed record Level(int Index, string Id, string Name, double Elevation, bool Rigid, IReadOnlyList<int> Nodes, IReadOnlyList<int> TiedNodes, string Selection);

/// <summary>The role of a member for cracked-section stiffness.</summary>
public enum StiffnessRole { Wall, Column, Beam, CouplingBeam }

/// <summary>
/// The "crackedSections" block: a preset (or none), whether walls are taken cracked, and user values per role.
/// </summary>
/// <param name="Preset">"aci318-strength", "aci318-service" or "" (user values only).</param>
/// <param name="WallsCracked">Walls take the cracked row of the preset (true) or the uncracked row.</param>
/// <param name="UserValues">Modifiers the user gave per role; they override the preset for that role.</param>
public sealed record CrackedSectionSettings(string Preset, bool WallsCracked, IReadOnlyDictionary<StiffnessRole, StiffnessModifiers> UserValues);

/// <summary>
/// The stiffness modifiers a member was given and where they came from: the member's own "modifiers", a user value
/// for its role, a preset row, or none.
/// </summary>
public sealed record ModifierAssignment(int Member, StiffnessModifiers Modifiers, string Source);

/// <summary>
/// A drift check: amplified drift δ = C_d·δ_e / I_e (ASCE 7-16 eq. 12.8-15) against an allowable drift ratio Δa/h_sx,
/// for the listed load cases and combinations.
/// </summary>
/// <param name="Cases">Ids of the load cases and combinations checked.</param>
/// <param name="Cd">Deflection amplification factor C_d.</param>
/// <param name="Ie">Importance factor I_e.</param>
/// <param name="AllowedRatio">Allowable story drift over story height.</param>
/// <param name="LimitSource">Where the allowable ratio comes from (user value, or the preset and its table).</param>
public sealed record DriftCheckSpec(string Id, IReadOnlyList<string> Cases, double Cd, double Ie, double AllowedRatio, string LimitSource);

/// <summary>
/// Preset values the building layer offers. Each is a table value as listed in the project's reference notes
/// (../shared/REFERENCES.md); the governing code decides.
/// </summary>
public static class BuildingPresets
{
    /// <summary>Caution carried wherever a preset value is used.</summary>
    public const string PresetCaution = "the governing code decides";

    /// <summary>
    /// Allowable story drift Δa/h_sx of ASCE 7-16 Table 12.12-1 (secondary: values from a secondary copy of the table),
    /// by structure type and risk category. Risk categories I and II share a column.
    /// Structure types: "four-stories-or-fewer" (structures, other than masonry shear wall structures, of four stories
    /// or fewer with interior walls, partitions, ceilings and exterior wall systems designed to accommodate the story
    /// drifts), "masonry-cantilever-wall", "masonry-wall-other", "other" (all other structures).
    /// </summary>
    public static IReadOnlyDictionary<string, (double I_II, double III, double IV)> AllowableDriftRatio { get; } =
        new Dictionary<string, (double, double, double)>(StringComparer.Ordinal)
        {
            ["four-stories-or-fewer"] = (0.025, 0.020, 0.015),
            ["masonry-cantilever-wall"] = (0.010, 0.010, 0.010),
            ["masonry-wall-other"] = (0.007, 0.007, 0.007),
            ["other"] = (0.020, 0.015, 0.010),
        };

    public static readonly string[] RiskCategories = ["I", "II", "III", "IV"];

    /// <summary>Allowable drift ratio for a structure type and risk category ("I" to "IV"); NaN when either is unknown.</summary>
    public static double AllowedDrift(string structure, string riskCategory)
    {
        if (!AllowableDriftRatio.TryGetValue(structure, out var row)) return double.NaN;
        return riskCategory switch { "I" or "II" => row.I_II, "III" => row.III, "IV" => row.IV, _ => double.NaN };
    }

    public const string DriftTable = "ASCE 7-16 Table 12.12-1 (values from a secondary copy)";

    /// <summary>Names of the roles in the cracked-section block.</summary>
    public static string RoleName(StiffnessRole r) => r switch
    {
        StiffnessRole.Wall => "wall",
        StiffnessRole.Column => "column",
        StiffnessRole.Beam => "beam",
        _ => "coupling-beam",
    };

    public static bool TryParseRole(string s, out StiffnessRole role)
    {
        foreach (StiffnessRole r in Enum.GetValues<StiffnessRole>())
            if (RoleName(r) == s) { role = r; return true; }
        role = default;
        return false;
    }

    public const string CrackedTable = "ACI 318 Table 6.6.3.1.1(a)";

    /// <summary>
    /// Moment-of-inertia multipliers of ACI 318 Table 6.6.3.1.1(a) for elastic analysis at factored load levels:
    /// columns 0.70, walls uncracked 0.70, walls cracked 0.35, beams 0.35; area 1.0 (confirmed, per REFERENCES).
    /// The table has no row of its own for coupling beams: the beams row is used and the source says so.
    /// "aci318-service" multiplies by 1.4, not above 1.0 (ACI 318 R6.6.3.2.2). Shear area: the table is silent; 1.0.
    /// </summary>
    public static (StiffnessModifiers Modifiers, string Source) Preset(string preset, StiffnessRole role, bool wallsCracked)
    {
        (double i, string row) = role switch
        {
            StiffnessRole.Column => (0.70, "columns"),
            StiffnessRole.Wall => wallsCracked ? (0.35, "walls, cracked") : (0.70, "walls, uncracked"),
            StiffnessRole.Beam => (0.35, "beams"),
            _ => (0.35, "beams (the table has no coupling-beam row; give a value of your own under \"roles\")"),
        };
        string source = $"preset values from {CrackedTable}, {row}: {i:0.00} I_g, 1.0 A_g";
        if (preset == "aci318-service")
        {
            double s = Math.Min(1.0, 1.4 * i);
            source += $"; service loads ×1.4 → {s:0.00} I_g, not above I_g (R6.6.3.2.2)";
            i = s;
        }
        return (new StiffnessModifiers(i, 1.0, 1.0), source + "; " + PresetCaution);
    }

    public static readonly string[] CrackedPresets = ["aci318-strength", "aci318-service"];
}
