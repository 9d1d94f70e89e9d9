using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>
/// Turns the compact line forms of a building file into planar models in the existing format (docs/plan.md): a wall
/// becomes a fixed-base vertical chain of Timoshenko members, one per story; a line given by story stiffnesses becomes
/// exact horizontal story springs. Every generated model has one node per level above the base, a rigid level there,
/// and its members in one line named after the line.
/// </summary>
public static class PlanLineModels
{
    /// <summary>
    /// A solid rectangular wall of length <paramref name="length"/> and thickness <paramref name="thickness"/> (m), one
    /// Timoshenko member per story between the building's levels (<paramref name="elevations"/>, base first, m), fixed at
    /// the base; shear area A / <paramref name="shearFactor"/>. Its top-level stiffness alone is the cantilever's,
    /// 1 / (h³/3EI + f·h/GA) for one story (Timoshenko beam theory — common practice).
    /// </summary>
    public static StructureModel Wall(string lineId, string source, IReadOnlyList<double> elevations, double length, double thickness,
        Material material, double shearFactor, UnitSystem units)
    {
        var section = new Section(lineId + " wall", "rectangle", thickness * length, thickness * Math.Pow(length, 3) / 12,
            ShearAreaRule.FormFactor, double.NaN, shearFactor, length);
        var nodes = elevations.Select((e, i) => new Node(i, $"{lineId}-{i}", 0, e)).ToList();
        var members = new List<Member>();
        for (int s = 1; s < elevations.Count; s++)
            members.Add(new Member(s - 1, $"{lineId}-S{s}", s - 1, s, MemberKind.BeamColumn, section.Id, material.Id,
                material.E, material.G, section.A, section.I, section.ShearArea(material.Nu), false, false, 0, 0, StiffnessModifiers.None, "wall"));
        return Make(lineId, source, units, [material], [section], nodes, members,
            [new Support(0, "fixed", true, true, true, 0, 0, 0)], elevations);
    }

    /// <summary>
    /// A compact wall as a plane-stress panel (docs/panels.md): <paramref name="length"/> long, centred on the line's
    /// point (x from −length/2 to +length/2 in the line's plane), from the base to the top level, with a floor level at
    /// every building level between and a floor tie at each level and the top (the floors hold the line there), the
    /// base held, the top free. <paramref name="openings"/> are measured from the wall's start end (x = −length/2) and
    /// from the base (m). The model holds the panel alone: no nodes, members or supports.
    /// </summary>
    public static StructureModel WallPanel(string lineId, string source, IReadOnlyList<double> elevations, double length, double thickness,
        Material material, IReadOnlyList<PanelOpening> openings, PanelMeshSettings mesh, UnitSystem units)
    {
        double b = elevations[0];
        var panel = new WallPanel
        {
            Id = lineId, X0 = -length / 2, Y0 = b, Length = length, Height = elevations[^1] - b, Thickness = thickness,
            MaterialId = material.Id, E = material.E, Nu = material.Nu, Openings = openings,
            FloorLevels = elevations.Skip(1).SkipLast(1).Select(e => e - b).ToList(), FloorTies = true, Mesh = mesh,
        };
        return new StructureModel
        {
            Title = lineId, SourcePath = source, Units = units, Materials = [material], Sections = [], Nodes = [], Members = [],
            Supports = [], LoadCases = [], Combinations = [], StiffnessPoints = [], Panels = [panel],
        };
    }

    /// <summary>
    /// A line known by its story stiffnesses <paramref name="stiffness"/> (N/m, story 1 first): story s is an axial-only
    /// member from the node at level s − 1 to the node at level s, offset sideways by one story height so that it slopes
    /// at 45°, with E·A = k·L/cos²θ; every level node is held vertically and against rotation. Its horizontal stiffness is
    /// then exactly k (a bar of axial stiffness EA/L inclined at θ resists EA·cos²θ/L along X when its ends do not move
    /// vertically — derived).
    /// </summary>
    public static StructureModel StoryStiffness(string lineId, string source, IReadOnlyList<double> elevations, IReadOnlyList<double> stiffness, UnitSystem units)
    {
        var nodes = new List<Node>();
        double offset = 0;
        for (int i = 0; i < elevations.Count; i++)
        {
            if (i > 0) offset = (i % 2 == 1) ? elevations[i] - elevations[i - 1] : 0;
            nodes.Add(new Node(i, $"{lineId}-{i}", offset, elevations[i]));
        }
        var material = new Material(lineId + " spring", 1.0, 0.5, 0.0);
        var sections = new List<Section>();
        var members = new List<Member>();
        for (int s = 1; s < elevations.Count; s++)
        {
            double dx = nodes[s].X - nodes[s - 1].X, dy = elevations[s] - elevations[s - 1];
            double l = Math.Sqrt(dx * dx + dy * dy), cos2 = dx * dx / (l * l);
            double a = stiffness[s - 1] * l / cos2;
            var sec = new Section($"{lineId} story {s}", "general", a, 1.0, ShearAreaRule.Given, double.PositiveInfinity, 1, double.NaN);
            sections.Add(sec);
            members.Add(new Member(s - 1, $"{lineId}-S{s}", s - 1, s, MemberKind.Brace, sec.Id, material.Id,
                material.E, material.G, a, 1.0, double.PositiveInfinity, false, false, 0, 0, StiffnessModifiers.None, "spring"));
        }
        var supports = new List<Support> { new(0, "fixed", true, true, true, 0, 0, 0) };
        for (int i = 1; i < elevations.Count; i++) supports.Add(new Support(i, "custom", false, true, true, 0, 0, 0));
        return Make(lineId, source, units, [material], sections, nodes, members, supports, elevations);
    }

    private static StructureModel Make(string lineId, string source, UnitSystem units, IReadOnlyList<Material> materials, IReadOnlyList<Section> sections,
        IReadOnlyList<Node> nodes, IReadOnlyList<Member> members, IReadOnlyList<Support> supports, IReadOnlyList<double> elevations)
    {
        var levels = elevations.Select((e, i) => new Level(i, i == 0 ? "base" : $"L{i}", i == 0 ? "base" : $"L{i}", e, i > 0,
            [i], i > 0 ? [i] : [], "generated")).ToList();
        return new StructureModel
        {
            Title = lineId,
            SourcePath = source,
            Units = units,
            Materials = materials,
            Sections = sections,
            Nodes = nodes,
            Members = members,
            Supports = supports,
            LoadCases = [],
            Combinations = [],
            StiffnessPoints = [],
            Building = new BuildingData
            {
                Levels = levels,
                MemberLines = members.Select(_ => lineId).ToList(),
                Lines = [lineId],
                Modifiers = members.Select(m => new ModifierAssignment(m.Index, StiffnessModifiers.None, "none")).ToList(),
            },
        };
    }
}
