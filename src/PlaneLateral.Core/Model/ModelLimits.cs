
namespace PlaneLateral.Model;

/// <summary>
/// Size limits checked before any heavy work (before the JSON is parsed for the file size, before any entry is read for
/// the counts), so a runaway or mistaken file is refused with a clear message instead of exhausting memory or time.
/// The limits are far above a planar lateral model of a building (hundreds of nodes); see docs/hardening.md.
/// </summary>
public static class ModelLimits
{
    /// <summary>Largest model file accepted, in bytes (8 MiB).</summary>
    public const long MaxFileBytes = 8L * 1024 * 1024;

    /// <summary>Most nodes accepted.</summary>
    public const int MaxNodes = 10_000;

    /// <summary>Most members accepted.</summary>
    public const int MaxMembers = 20_000;

    /// <summary>Most load cases and combinations together (each keeps a full set of results in memory).</summary>
    public const int MaxCasesAndCombinations = 200;

    /// <summary>Most stiffness points.</summary>
    public const int MaxStiffnessPoints = 200;

    /// <summary>Most comparison checks.</summary>
    public const int MaxComparisons = 200;

    /// <summary>Most openings in one perforated-wall check (their overlap test is quadratic).</summary>
    public const int MaxOpeningsPerWall = 100;

    /// <summary>Most DOFs that carry mass in a model with a seismic block (one per weighted level with a diaphragm,
    /// one per node of a weighted level without one): the periods need a dense eigen decomposition of that size, whose
    /// time grows as its cube (docs/hardening.md gives the measured cost).</summary>
    public const int MaxMassDofs = 2000;

    /// <summary>The most result entries, (nodes + members) × (load cases + combinations), a run has been measured at:
    /// the count limits' own edge, 10 000 nodes and 20 000 members under 200 load cases, which the streamed results
    /// files write in 0.8 GB of memory (docs/hardening.md, "Size limits"). No separate entry limit is checked: the count
    /// limits bound the entries to this product, and a test keeps that so (raising a count limit means measuring the new
    /// edge first).</summary>
    public const long MeasuredResultEntries = 6_000_000;

    /// <summary>Largest panel mesh a model may ask for with <c>mesh.maxNodes</c> (the aspect-ratio sweep's own finest
    /// mesh is this size too).</summary>
    public const int MaxPanelMeshNodes = 40_000;

    /// <summary>Most panel mesh entries, Σ over the panels of <c>mesh.maxNodes</c> × (load cases + combinations): every
    /// panel keeps its displacements and stresses at every node of its mesh for every case, and panel-stresses.csv has a
    /// row for each. One panel at the mesh ceiling under the most cases is the edge measured (6 GB of memory,
    /// docs/hardening.md, "Size limits"); two such panels made a panel-stresses.csv longer than one .NET string holds.</summary>
    public const long MaxPanelMeshEntries = 8_000_000;

    /// <summary>The most panel mesh entries a run has been measured at (<see cref="MaxPanelMeshEntries"/>'s edge: a
    /// 39 601-node panel under 200 load cases, and two under 100). A test keeps the limits within it: raising the mesh
    /// ceiling, the case limit or the entry limit means measuring the new edge first (benchmarks/edge/run.sh).</summary>
    public const long MeasuredPanelMeshEntries = 8_000_000;

    /// <summary>The largest panel mesh measured (<see cref="MaxPanelMeshNodes"/> asked, 39 601 nodes built); a test keeps
    /// the ceiling within it.</summary>
    public const int MeasuredPanelMeshNodes = 40_000;

    /// <summary>Most floors (levels above the base) of a building in plan: the floor system is dense on 3 DOFs per floor,
    /// and its modes are a dense eigen decomposition of that size (docs/hardening.md gives the measured cost).</summary>
    public const int MaxFloors = 300;

    /// <summary>Most lines of resistance in a building in plan.</summary>
    public const int MaxPlanLines = 500;

    /// <summary>Most named points in a building in plan.</summary>
    public const int MaxPlanPoints = 200;

    /// <summary>Most line result entries of a building in plan: Σ over its lines of (nodes + members + panel mesh nodes)
    /// × (floors + cases + modes): each line's model is solved once per floor for its condensation and once per case and
    /// mode for its recovery, every solve recovered over the whole line (docs/hardening.md gives the measured cost).</summary>
    public const long MaxPlanLineEntries = 20_000_000;

    /// <summary>The problem when a file of <paramref name="bytes"/> exceeds <see cref="MaxFileBytes"/>, or null.</summary>
    internal static ModelDiagnostic? CheckFileSize(string file, long bytes) => bytes <= MaxFileBytes ? null :
        new ModelDiagnostic(file, 0, 0, "", $"the file is {bytes} bytes, more than the {MaxFileBytes} bytes (8 MiB) this version reads",
            "check that this is the model file; split a very large model, or remove data the model does not need");

    /// <summary>Counts the top-level arrays (and the openings of each comparison) against the limits; reports each excess.</summary>
    /// <returns>True when a limit is exceeded.</returns>
    internal static bool CheckCounts(JsonMap root, DiagnosticSink sink)
    {
        bool over = false;
        void Limit(JsonNode? t, int max, string what)
        {
            if (t is JsonList a && a.Count > max)
            {
                sink.Add(a, $"the model has {a.Count} {what}, more than the {max} this version accepts",
                    $"keep to at most {max} {what}; a planar lateral model of a building needs far fewer");
                over = true;
            }
        }
        Limit(root["nodes"], MaxNodes, "nodes");
        Limit(root["members"], MaxMembers, "members");
        Limit(root["stiffnessAt"], MaxStiffnessPoints, "stiffness points");
        Limit(root["comparisons"], MaxComparisons, "comparison checks");
        int cases = (root["loadCases"] as JsonList)?.Count ?? 0, combos = (root["combinations"] as JsonList)?.Count ?? 0;
        if (cases + combos > MaxCasesAndCombinations)
        {
            sink.Add(root["loadCases"] ?? root["combinations"], $"the model has {cases} load cases and {combos} combinations, more than the {MaxCasesAndCombinations} together this version accepts",
                $"keep to at most {MaxCasesAndCombinations} load cases and combinations together; split the model's cases into several files");
            over = true;
        }
        if (root["panels"] is JsonList panels)
            foreach (var p in panels)
                if (p is JsonMap po && po["mesh"] is JsonMap mesh && mesh["maxNodes"] is JsonScalar { Value: long or int or double } mn
                    && Convert.ToDouble(mn.Value, System.Globalization.CultureInfo.InvariantCulture) > MaxPanelMeshNodes)
                {
                    sink.Add(mn, $"'maxNodes' asks for a mesh of up to {mn.Value} nodes, more than the {MaxPanelMeshNodes} this version builds (memory grows with the mesh: a 1 mm mesh of a 5 m × 6 m wall would need tens of GB)",
                        $"give 'maxNodes' at most {MaxPanelMeshNodes}, and a larger element size or fewer refinements");
                    over = true;
                }
        if (root["panels"] is JsonList meshed && meshed.Count > 0 && cases + combos > 0)
        {
            // Each panel's asked ceiling (the default when not given; a value out of range is reported at its own key).
            long nodes = meshed.Sum(p => p is JsonMap po && po["mesh"] is JsonMap mesh && mesh["maxNodes"] is JsonScalar { Value: long or int or double } mn
                && Convert.ToDouble(mn.Value, System.Globalization.CultureInfo.InvariantCulture) is var v && v >= 1 && v <= MaxPanelMeshNodes
                ? (long)v : PanelMeshSettings.Default.MaxNodes);
            long entries = nodes * (cases + combos);
            if (entries > MaxPanelMeshEntries)
            {
                sink.Add(meshed, $"the panels ask for meshes of up to {nodes} nodes in all under {cases + combos} load cases and combinations: {entries} panel mesh entries (Σ 'maxNodes' × cases), more than the {MaxPanelMeshEntries} this version accepts (each panel keeps every node's displacements and stresses for every case)",
                    $"keep Σ 'maxNodes' × (load cases + combinations) to at most {MaxPanelMeshEntries}: give the panels a lower 'maxNodes' (and a coarser mesh), or split the cases or the panels into several files");
                over = true;
            }
        }
        if (root["seismic"] is JsonMap seismic && seismic["weights"] is JsonList weights && weights.Count > MaxMassDofs)
        {
            sink.Add(weights, $"the seismic block weighs {weights.Count} levels, more than the {MaxMassDofs} whose periods this version computes (a dense eigenproblem of that size)",
                $"keep to at most {MaxMassDofs} weighted levels; lump the weights of neighbouring levels");
            over = true;
        }
        if (root["comparisons"] is JsonList checks)
            foreach (var c in checks)
                if (c is JsonMap co) Limit(co["openings"], MaxOpeningsPerWall, "openings in one wall");
        return over;
    }

    /// <summary>Counts the arrays of a building's <c>plan</c> against the limits before any line is read; reports each excess.</summary>
    /// <returns>True when a limit is exceeded.</returns>
    internal static bool CheckPlanCounts(JsonMap plan, DiagnosticSink sink)
    {
        bool over = false;
        void Limit(JsonNode? t, int max, string what, string fix)
        {
            if (t is JsonList a && a.Count > max)
            {
                sink.Add(a, $"the building has {a.Count} {what}, more than the {max} this version accepts", fix);
                over = true;
            }
        }
        Limit(plan["levels"], MaxFloors + 1, "levels (the base and the floors)", $"keep to at most {MaxFloors} floors above the base; a building in plan of more floors is beyond this version");
        Limit(plan["lines"], MaxPlanLines, "lines of resistance", $"keep to at most {MaxPlanLines} lines; merge parallel lines of one wall or frame into one line");
        Limit(plan["loads"], MaxCasesAndCombinations, "load cases", $"keep to at most {MaxCasesAndCombinations} load cases; split them into several building files");
        Limit(plan["points"], MaxPlanPoints, "named points", $"keep to at most {MaxPlanPoints} named points");
        return over;
    }

    /// <summary>
    /// The line result entries of a building (<see cref="MaxPlanLineEntries"/>) against the limit, once its lines are
    /// read and before any is condensed: reported at the plan's <c>lines</c> with the heaviest line named.
    /// </summary>
    /// <param name="solves">Solves per line: floors (condensation) + plan cases (recovery) + modes (spectrum), the generated cases counted.</param>
    internal static void CheckPlanWork(IReadOnlyList<PlanLine> lines, int solves, JsonNode? at, DiagnosticSink sink)
    {
        static long Size(PlanLine l) => l.Model.Nodes.Count + l.Model.Members.Count + l.Model.Panels.Sum(p => (long)p.Mesh.MaxNodes);
        long entries = lines.Sum(l => Size(l) * solves);
        if (entries <= MaxPlanLineEntries || lines.Count == 0) return;
        var heaviest = lines.MaxBy(Size)!;
        sink.Add(at, $"the building's lines hold {entries} result entries (Σ of each line's nodes, members and panel mesh nodes × {solves} solves: floors, cases and modes), more than the {MaxPlanLineEntries} this version accepts; the largest line is \"{heaviest.Id}\" ({Size(heaviest)} nodes, members and mesh nodes)",
            "model the large lines more simply (a compact wall, or story stiffnesses), give fewer load cases or modes, or split the building into parts");
    }
}

