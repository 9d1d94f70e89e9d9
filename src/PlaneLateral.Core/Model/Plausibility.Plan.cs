using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Plausibility of a building in plan (docs/plan.md): the planar checks on each line given as a planar model (inline or
// in its own file, with that file's own units), and the building file's own slips: no "units", a material's E, a story
// height, the plan's size, a wall's thickness and its length swapped. Like the planar checks, warnings only.
internal static partial class Plausibility
{
    /// <summary>A line of a building given as a planar model: its id, the model read, its JSON object and the file it is in.</summary>
    internal sealed record PlanLineSource(string Id, StructureModel Model, JsonMap Root, string File);

    public static IReadOnlyList<ModelWarning> CheckPlan(BuildingPlan plan, JsonMap root, string file, IReadOnlyList<PlanLineSource> lines)
    {
        var shell = new StructureModel
        {
            Title = plan.Title, SourcePath = file, Units = plan.Units, Materials = [], Sections = [], Nodes = [], Members = [],
            Supports = [], LoadCases = [], Combinations = [], StiffnessPoints = [],
        };
        var items = new Checker(shell, root, file).RunPlan(plan).ToList();
        foreach (var l in lines)
            foreach (var w in Check(l.Model, l.Root, l.File))
                items.Add(w with { Problem = $"line \"{l.Id}\": {w.Problem}" });
        return items;
    }

    private sealed partial class Checker
    {
        public IReadOnlyList<ModelWarning> RunPlan(BuildingPlan plan)
        {
            if (!_hasUnits)
                Add(root, "the building file has no \"units\" key, so every number is read in kip and inch (the documented default): E in ksi, lengths in inches",
                    "if the numbers are in other units, add \"units\": {\"force\": \"kip\", \"length\": \"ft\"} (or the units they are in)");
            Materials();
            var p = root["plan"] as JsonMap;
            var levelTokens = Array(p?["levels"]).ToList();
            for (int k = 1; k < plan.Levels.Count; k++)
            {
                double h = plan.Levels[k].Elevation - plan.Levels[k - 1].Elevation;
                var at = levelTokens.FirstOrDefault(o => (string?)o["id"] == plan.Levels[k].Id);
                if (Range(at?["elevation"] ?? at, $"the height of the story below level \"{plan.Levels[k].Id}\"", _u.FromSI(h, Quantity.Length), Quantity.Length, MinStory, MaxStory, "building stories")) break;
            }
            if (plan.Levels.Count > 1 && plan.Levels.Skip(1).Any(l => l.Outline.Count > 0))
                Range(p?["outline"] ?? levelTokens.FirstOrDefault(o => o["outline"] is not null)?["outline"] ?? p, "the plan's largest dimension (the outline's width or depth)",
                    _u.FromSI(plan.Size, Quantity.Length), Quantity.Length, MinExtent, MaxExtent, "buildings");
            foreach (var line in Array(p?["lines"]))
            {
                if (line["wall"] is not JsonMap wall) continue;
                string id = (string?)line["id"] ?? "?";
                double? t = Value(wall["thickness"]), len = Value(wall["length"]);
                if (t is double tv) Range(wall["thickness"], $"thickness of wall line \"{id}\"", tv, Quantity.Length, MinWallThickness, MaxWallThickness, "wall thicknesses");
                if (t is double a && len is double b && a > b)
                    Add(wall, $"wall line \"{id}\" is {G(a)} {_u.LengthSymbol} thick and {G(b)} {_u.LengthSymbol} long: its thickness is larger than its length in plan, so \"thickness\" and \"length\" look swapped (the wall would resist mostly by its thickness)",
                        "give \"length\" as the wall's dimension along its line and \"thickness\" across it");
            }
            OneUnitSystem();
            return _items;
        }
    }
}
