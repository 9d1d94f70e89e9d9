using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of "panels": wall panels analysed as plane-stress continua (docs/panels.md).
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>True when the file has a "panels" array: then nodes, members and supports may be absent.</summary>
        private static bool HasPanels(JsonMap root) => root.TryGetValue("panels", out var t) && t is JsonList { Count: > 0 };

        private List<WallPanel> ReadPanels(IReadOnlyList<JsonMap> items, List<Material> materials)
        {
            var list = new List<WallPanel>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            string lu = _units.LengthSymbol, fu = _units.ForceSymbol;
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "panel");
                double x0 = SI(f.OptionalNumber("x", 0, $"give the x of the panel's bottom-left corner in {lu}"), Quantity.Length);
                double y0 = SI(f.OptionalNumber("y", 0, $"give the y of the panel's base in {lu}"), Quantity.Length);
                double length = Positive(f, "length", Quantity.Length, "panel", $"give the panel's length along its base in {lu}");
                double height = Positive(f, "height", Quantity.Length, "panel", $"give the panel's height in {lu}");
                double thickness = Positive(f, "thickness", Quantity.Length, "panel", $"give the panel's thickness in {lu}");
                var matId = f.RequiredString("material", "give the id of one of the \"materials\"");
                var material = matId is null ? null : materials.FirstOrDefault(m => m.Id == matId);
                if (matId is not null && material is null)
                    sink.Add(f.Token("material"), $"unknown material \"{matId}\"", $"use one of: {string.Join(", ", materials.Select(m => m.Id))}");

                var openings = new List<PanelOpening>();
                var openingIds = new HashSet<string>(StringComparer.Ordinal);
                foreach (var oo in f.Objects("openings", false, "write \"openings\": [ {\"id\": \"...\", \"left\": ..., \"bottom\": ..., \"width\": ..., \"height\": ...} ]"))
                {
                    var of = new JsonFields(oo, sink);
                    var oid = ReadId(of, openingIds, "opening");
                    double left = SI(of.RequiredNumber("left", $"give the distance from the panel's left end to the opening in {lu}"), Quantity.Length);
                    double bottom = SI(of.OptionalNumber("bottom", 0, $"give the opening's bottom above the panel base in {lu} (0 for a door)"), Quantity.Length);
                    double w = Positive(of, "width", Quantity.Length, "opening", $"give the opening's width in {lu}");
                    double h = Positive(of, "height", Quantity.Length, "opening", $"give the opening's height in {lu}");
                    of.RejectUnknownKeys();
                    openings.Add(new PanelOpening(oid ?? "", left, bottom, w, h));
                }

                var levels = new List<double>();
                if (f.Token("floorLevels") is { } lt)
                {
                    if (lt is JsonList la)
                        foreach (var v in la)
                        {
                            if (v.Type is JsonKind.Integer or JsonKind.Float) levels.Add(SI((double)v, Quantity.Length));
                            else sink.Add(v, $"a floor level must be a number, found {JsonFields.Describe(v)}", $"give heights above the panel base in {lu}");
                        }
                    else sink.Add(lt, $"'floorLevels' must be an array of heights, found {JsonFields.Describe(lt)}", $"write \"floorLevels\": [<height>, ...] in {lu}, above the base");
                }
                bool ties = f.OptionalBool("floorTies", true, "give true (each level moves as one in x) or false");
                var topWord = f.OptionalString("top", "give \"free\" (cantilever) or \"guided\" (top translates without rotating)") ?? "free";
                var top = topWord switch { "free" => PanelTop.Free, "guided" => PanelTop.Guided, _ => (PanelTop?)null };
                if (top is null) sink.Add(f.Token("top"), $"unknown top \"{topWord}\"", "use \"free\" (cantilever: the top only tied) or \"guided\" (fixed-guided: the top edge translates without rotating)");
                var mesh = ReadPanelMesh(f.OptionalObject("mesh", "write \"mesh\": {\"element\": \"quad9\", \"elementsAcrossNarrowest\": 2}"));

                var loads = new List<PanelLoad>();
                foreach (var lo in f.Objects("storyForces", false, "write \"storyForces\": [ {\"case\": \"...\", \"level\": \"top\", \"fx\": ...} ]"))
                {
                    var lf = new JsonFields(lo, sink);
                    var caseId = lf.RequiredString("case", "give the id of one of the \"loadCases\"");
                    int ci = -1;
                    if (caseId is not null && !_cases.TryGetValue(caseId, out ci))
                    {
                        sink.Add(lf.Token("case"), $"unknown load case \"{caseId}\"", _cases.Count == 0 ? "add it to \"loadCases\": [{\"id\": \"" + caseId + "\"}]" : $"use one of: {string.Join(", ", _cases.Keys.Order(StringComparer.Ordinal))}");
                        ci = -1;
                    }
                    double level = height;
                    var lv = lf.Token("level");
                    if (lv is { Type: JsonKind.String } && (string)lv! == "top") level = height;
                    else if (lv is { Type: JsonKind.Integer or JsonKind.Float })
                    {
                        level = SI((double)lv, Quantity.Length);
                        if (!(Math.Abs(level - height) <= 1e-9 * height || levels.Any(l => Math.Abs(l - level) <= 1e-9 * height)))
                            sink.Add(lv, $"no floor level at {(double)lv} {lu} in panel \"{id}\"", $"use \"top\" or one of the panel's \"floorLevels\"");
                    }
                    else if (lv is not null) sink.Add(lv, $"'level' must be \"top\" or a height, found {JsonFields.Describe(lv)}", $"give \"top\" or one of the \"floorLevels\" in {lu}");
                    double fx = SI(lf.OptionalNumber("fx", 0, $"give fx in {fu}"), Quantity.Force);
                    double fy = SI(lf.OptionalNumber("fy", 0, $"give fy in {fu}"), Quantity.Force);
                    var path = lf.OptionalString("path", "give \"tie\" or \"spread\"") ?? "tie";
                    var how = path switch { "tie" => PanelLoadPath.Tie, "spread" => PanelLoadPath.Spread, _ => (PanelLoadPath?)null };
                    if (how is null) sink.Add(lf.Token("path"), $"unknown load path \"{path}\"", "use \"tie\" (through the floor tie) or \"spread\" (uniform along the level)");
                    else if (how == PanelLoadPath.Tie && !ties && fx != 0)
                        sink.Add(lf.Token("path") ?? lo, "the story force goes through a floor tie, but the panel has \"floorTies\": false", "write \"path\": \"spread\", or remove \"floorTies\": false");
                    lf.RejectUnknownKeys();
                    if (ci >= 0 && how is not null) loads.Add(new PanelLoad(ci, level, fx, fy, how.Value));
                }
                var links = ReadPanelLinks(f, id, length, height);   // ModelReader.PanelLinks.cs
                var line = ReadPanelLine(f);                          // ModelReader.PanelLinks.cs
                f.RejectUnknownKeys();
                if (id is null || material is null || mesh is null || top is null || !(length > 0 && height > 0 && thickness > 0)) continue;

                var panel = new WallPanel
                {
                    Id = id, X0 = x0, Y0 = y0, Length = length, Height = height, Thickness = thickness,
                    MaterialId = material.Id, E = material.E, Nu = material.Nu,
                    Openings = openings, FloorLevels = levels, FloorTies = ties, Top = top.Value, Mesh = mesh, Loads = loads, Links = links, Line = line,
                };
                // Geometry and mesh problems, each at its own key, before any work — unless a number of the geometry
                // itself failed to read (it would make the layout meaningless; found by the reader fuzzer).
                bool geometryRead = double.IsFinite(x0) && double.IsFinite(y0)
                    && openings.All(q => double.IsFinite(q.Left) && double.IsFinite(q.Bottom) && double.IsFinite(q.Width) && double.IsFinite(q.Height))
                    && levels.All(double.IsFinite);
                if (!geometryRead) continue;
                foreach (var q in PanelLayout.Check(panel, _units))   // lengths in the model's units
                    sink.Add(o.SelectPath(q.Key) ?? o, $"panel \"{id}\": {q.Problem}", q.Fix);
                CheckPanelLinks(panel, o);
                list.Add(panel);
            }
            return list;
        }

        private PanelMeshSettings? ReadPanelMesh(JsonMap? o)
        {
            if (o is null) return PanelMeshSettings.Default;
            var f = new JsonFields(o, sink);
            var element = f.OptionalString("element", "give \"quad4\" or \"quad9\"") ?? "quad9";
            var kind = element switch { "quad4" => PanelElementKind.Quad4, "quad9" => PanelElementKind.Quad9, _ => (PanelElementKind?)null };
            if (kind is null) sink.Add(f.Token("element"), $"unknown element \"{element}\"", "use \"quad4\" (4-node incompatible modes) or \"quad9\" (9-node)");
            bool hasSize = f.Has("elementSize"), hasAcross = f.Has("elementsAcrossNarrowest");
            double size = hasSize ? SI(f.RequiredNumber("elementSize", $"give the element size in {_units.LengthSymbol}"), Quantity.Length) : 0;
            int across = hasAcross ? WholeNumber(f, "elementsAcrossNarrowest", "give a whole number of elements, 1 or more") : (hasSize ? 0 : 2);
            double aspect = f.OptionalNumber("maxAspect", 4, "give the largest element side ratio, e.g. 4");
            int maxNodes = f.Has("maxNodes") ? WholeNumber(f, "maxNodes", "give the largest mesh in nodes, e.g. 3000") : 3000;
            int refinements = f.Has("refinements") ? WholeNumber(f, "refinements", "give the number of nested meshes, 1 to 6") : 1;
            f.RejectUnknownKeys();
            if (hasSize && !(size > 0)) { sink.Add(f.Token("elementSize"), "'elementSize' must be greater than zero", $"give the element size in {_units.LengthSymbol}"); return null; }
            return kind is null ? null : new PanelMeshSettings(kind.Value, size, across, aspect, maxNodes, refinements);
        }

        private int WholeNumber(JsonFields f, string key, string fix)
        {
            // Any JSON number is read safely (wider than 64 bits, fractional, negative: the key's own message; JsonFields).
            return (int)(f.WholeNumber(key, 1, int.MaxValue, fix) ?? 1);
        }
    }
}
