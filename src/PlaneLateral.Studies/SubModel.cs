using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// Builds a small <see cref="StructureModel"/> in code (SI units) for an isolated check: a wall line on its own,
/// a frame with its supports, or an equivalent frame generated from a wall's geometry.
/// </summary>
internal sealed class SubModel(string title, string source, UnitSystem units)
{
    private readonly List<Node> _nodes = [];
    private readonly Dictionary<(long, long), int> _byPosition = [];
    private readonly List<Member> _members = [];
    private readonly List<Support> _supports = [];
    private readonly List<NodalLoad> _loads = [];
    private readonly List<StiffnessPoint> _points = [];
    private readonly List<Material> _materials = [];
    private readonly List<Section> _sections = [];

    public IReadOnlyList<Node> Nodes => _nodes;
    public IReadOnlyList<Member> Members => _members;

    /// <summary>The node at (x, y), created if none stands there (positions matched to 1e-9 m).</summary>
    public int NodeAt(double x, double y, string? id = null)
    {
        var key = ((long)Math.Round(x * 1e9), (long)Math.Round(y * 1e9));
        if (_byPosition.TryGetValue(key, out int n)) return n;
        n = _nodes.Count;
        _nodes.Add(new Node(n, id ?? $"n{n + 1}", x, y));
        _byPosition[key] = n;
        return n;
    }

    /// <summary>Adds a copy of a model member between new nodes, keeping its properties.</summary>
    public int Copy(Member m, int start, int end)
    {
        int i = _members.Count;
        _members.Add(m with { Index = i, Start = start, End = end });
        return i;
    }

    /// <summary>Adds a rectangular beam-column of depth d (in the plane) and thickness t; <paramref name="stiffnessFactor"/> multiplies I and the shear area (not A).</summary>
    public int Rectangle(string id, int start, int end, Material mat, double depth, double thickness, double formFactor,
        double rigidStart, double rigidEnd, string role, double stiffnessFactor = 1.0)
    {
        double a = depth * thickness, i = thickness * depth * depth * depth / 12.0;
        int k = _members.Count;
        _members.Add(new Member(k, id, start, end, MemberKind.BeamColumn, "rectangle", mat.Id, mat.E, mat.G,
            a, i * stiffnessFactor, a / formFactor * stiffnessFactor, false, false, rigidStart, rigidEnd,
            StiffnessModifiers.None, role));
        return k;
    }

    /// <summary>Adds an axial-only link.</summary>
    public int Link(string id, int start, int end, Material mat, double area, string role)
    {
        int k = _members.Count;
        _members.Add(new Member(k, id, start, end, MemberKind.Brace, "link", mat.Id, mat.E, mat.G, area, 0, double.PositiveInfinity,
            false, false, 0, 0, StiffnessModifiers.None, role));
        return k;
    }

    public void Support(int node, bool x, bool y, bool rz) =>
        _supports.Add(new Support(node, x && y && rz ? "fixed" : x && y ? "pinned" : "custom", x, y, rz, 0, 0, 0));

    public void Load(int node, double fx) => _loads.Add(new NodalLoad(node, fx, 0, 0));

    public void StiffnessAt(int node, string label) => _points.Add(new StiffnessPoint(label, node, Dof.X));

    public void Uses(Material m) { if (!_materials.Contains(m)) _materials.Add(m); }

    public StructureModel Build() => new()
    {
        Title = title,
        SourcePath = source,
        Units = units,
        Materials = _materials,
        Sections = _sections,
        Nodes = _nodes,
        Members = _members,
        Supports = _supports,
        LoadCases = _loads.Count == 0 ? [] : [new LoadCase("unit", "lateral force for the check", _loads, [])],
        Combinations = [],
        StiffnessPoints = _points,
    };
}
