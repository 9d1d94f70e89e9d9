using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of the "panel-wall" comparison check: a panel declared under "panels", named by its id, beside the hand
// perforated-wall method and the equivalent frame (docs/comparisons.md).
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>Panel-wall checks read with the token of their "panel" key; resolved once the panels are read.</summary>
        private readonly List<(PanelWallCheck Check, JsonNode At)> _panelWalls = [];

        private PanelWallCheck? ReadPanelWall(JsonFields f, string? id, string desc, double? tol, CheckLocation at)
        {
            var panelId = f.RequiredString("panel", "give the id of a wall panel listed under \"panels\", e.g. \"panel\": \"north wall\"");
            double factor = ReadShearFactor(f);
            if (id is null || panelId is null || !(factor >= 1)) return null;
            var check = new PanelWallCheck(id, desc, tol, at, panelId, factor);
            _panelWalls.Add((check, f.Token("panel")!));
            return check;
        }

        /// <summary>
        /// Each panel-wall check names a panel that exists, is one story (no floor levels below its top), ties its top,
        /// and asks for three or more nested meshes (observed order and error estimate). Solid wall at both ends (the hand
        /// method's end piers) is already required of every panel (PanelLayout). The panel's story forces are not used:
        /// the check measures stiffness.
        /// </summary>
        private void CheckPanelWalls(JsonMap root, List<WallPanel> panels)
        {
            if (_panelWalls.Count == 0) return;
            // Ids of panels written in the file, read or not: a panel that failed to read is reported already.
            var written = root["panels"] is JsonList arr
                ? arr.OfType<JsonMap>().Select(o => o["id"]).Where(t => t?.Type == JsonKind.String).Select(t => (string)t!).ToHashSet(StringComparer.Ordinal)
                : [];
            foreach (var (c, tok) in _panelWalls)
            {
                var p = panels.FirstOrDefault(q => q.Id == c.PanelId);
                if (p is null)
                {
                    if (!written.Contains(c.PanelId))
                        sink.Add(tok, $"unknown panel \"{c.PanelId}\" in panel-wall check \"{c.Id}\"",
                            panels.Count == 0 ? "declare the wall under \"panels\" (docs/panels.md) and name its id here"
                                              : $"use the id of a panel listed under \"panels\"{Suggest(c.PanelId, panels.Select(q => q.Id))}");
                    continue;
                }
                string lu = _units.LengthSymbol;
                if (p.FloorLevels.Count > 0)
                    sink.Add(tok, $"panel \"{p.Id}\" has floor levels ({string.Join(", ", p.FloorLevels.Select(l => $"{_units.FromSI(l, Quantity.Length):G6} {lu}"))}) below its top; the panel-wall check compares one-story walls: the hand method and the line model are loaded at the top only, and a tie at a lower level would stiffen the panel where they cannot",
                        "check a panel without \"floorLevels\" (declare the one-story wall as a panel of its own), or remove the levels");
                if (!p.FloorTies)
                    sink.Add(tok, $"panel \"{p.Id}\" has \"floorTies\": false; the panel-wall check loads the wall through a tied top (a rigid floor), as the hand method and the line model assume",
                        "remove \"floorTies\": false from the panel, or check another panel");
                if (p.Top == PanelTop.Guided)
                    sink.Add(tok, $"panel \"{p.Id}\" has \"top\": \"guided\"; the panel-wall check compares a cantilever wall (top free to rotate), as its hand method and line model are set up",
                        "remove \"top\": \"guided\" from the panel, or check the wall fixed-fixed with a perforated-wall check (\"ends\": \"fixed-fixed\")");
                if (p.Links.Count > 0)
                    sink.Add(tok, $"panel \"{p.Id}\" is linked to frame nodes; the panel-wall check needs the wall standing alone, base held and top tied",
                        "check an unlinked copy of the wall as a panel of its own");
                if (p.Mesh.Refinements < 3)
                    sink.Add(tok, $"panel \"{p.Id}\" is solved on {p.Mesh.Refinements} mesh(es); the panel-wall check needs three or more nested meshes for an observed order, an extrapolated stiffness and its error estimate",
                        $"give the panel \"mesh\": {{..., \"refinements\": 3}} (or more)");
            }
        }
    }
}
