using System.Globalization;
using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of the building layer: "levels" (with rigid-diaphragm ties), the members' "line" tag, "crackedSections"
// and "driftChecks". See docs/building.md.
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>Called from ReadMembers so the member's "line" key is known to its field reader.</summary>
        private void ReadLineTag(JsonFields f) =>
            f.OptionalString("line", "give the member's line of resistance as a string, e.g. \"line\": \"grid 1\"");

        private static string Num(double v) => v.ToString("G6", CultureInfo.InvariantCulture);

        /// <summary>
        /// Reads the building keys. Members are changed in place when a cracked-section rule gives them modifiers.
        /// Returns <see cref="BuildingData.Empty"/> when the model has none of the keys.
        /// </summary>
        private BuildingData ReadBuilding(JsonFields f, JsonMap root, List<Node> nodes, List<Member> members, List<Support> supports,
            List<LoadCase> cases, List<Combination> combos)
        {
            var levelItems = f.Objects("levels", false, "give \"levels\" as an array of {\"id\": \"...\", \"elevation\": ...}");
            var crackedObj = f.OptionalObject("crackedSections", "write \"crackedSections\": {\"preset\": \"aci318-strength\", \"walls\": \"cracked\"}");
            var driftItems = f.Objects("driftChecks", false, "give \"driftChecks\" as an array of {\"id\": \"...\", \"cases\": [...], \"Cd\": ..., \"Ie\": ..., \"allowedRatio\": ...}");

            // Lines of resistance, by member id (the member objects are read again here; their types were checked there).
            var memberObjects = new Dictionary<string, JsonMap>(StringComparer.Ordinal);
            if (root["members"] is JsonList ma)
                foreach (var t in ma)
                    if (t is JsonMap mo && mo["id"] is JsonScalar { Type: JsonKind.String } idv)
                        memberObjects.TryAdd((string)idv!, mo);
            var memberLines = members.Select(m => memberObjects.TryGetValue(m.Id, out var o) && o["line"] is JsonScalar { Type: JsonKind.String } lv ? ((string)lv!).Trim() : "").ToList();
            var lines = memberLines.Where(l => l.Length > 0).Distinct(StringComparer.Ordinal).ToList();

            var levels = ReadLevels(levelItems, f.Token("levels"), nodes, supports);
            var (cracked, modifiers) = ReadCrackedSections(crackedObj, members, memberObjects, lines, memberLines);
            var checks = ReadDriftChecks(driftItems, f.Token("driftChecks"), levels, cases, combos);

            if (levelItems.Count == 0 && crackedObj is null && driftItems.Count == 0 && lines.Count == 0) return BuildingData.Empty;
            return new BuildingData
            {
                Levels = levels,
                MemberLines = memberLines,
                Lines = lines,
                Modifiers = modifiers,
                CrackedSections = cracked,
                DriftChecks = checks,
            };
        }

        /// <summary>Elevation tolerance (m): a millionth of the model's size, at least a micrometre.</summary>
        private static double ElevationTolerance(List<Node> nodes)
        {
            if (nodes.Count == 0) return 1e-6;
            double size = Math.Max(nodes.Max(n => n.X) - nodes.Min(n => n.X), nodes.Max(n => n.Y) - nodes.Min(n => n.Y));
            return 1e-6 * Math.Max(size, 1.0);
        }

        private List<Level> ReadLevels(IReadOnlyList<JsonMap> items, JsonNode? arrayToken, List<Node> nodes, List<Support> supports)
        {
            var read = new List<(string Id, string Name, double Elev, bool Rigid, List<int> Nodes, string Selection, JsonMap At)>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            double tol = ElevationTolerance(nodes);
            string len = _units.LengthSymbol;
            foreach (var o in items)
            {
                var lf = new JsonFields(o, sink);
                var id = ReadId(lf, seen, "level");
                var name = lf.OptionalString("name", "give the level a name as a string") ?? id ?? "";
                double elev = SI(lf.RequiredNumber("elevation", $"give the level's elevation (its y coordinate) in {len}"), Quantity.Length);
                var dia = lf.OptionalString("diaphragm", "give \"diaphragm\": \"rigid\" (the default) or \"none\"") ?? "rigid";
                bool rigid = dia == "rigid";
                if (dia != "rigid" && dia != "none")
                    sink.Add(lf.Token("diaphragm"), $"unknown diaphragm \"{dia}\"", "use \"rigid\" (the level's nodes share their horizontal displacement) or \"none\" (no tie; e.g. the base)");
                var chosen = new List<int>();
                string selection = "at elevation";
                if (lf.Token("nodes") is { } nt)
                {
                    selection = "listed";
                    const string fix = "write \"nodes\": [\"<node id>\", ...], or leave it out to take every node at the level's elevation";
                    if (nt is not JsonList na) sink.Add(nt, "'nodes' must be an array of node ids", fix);
                    else
                    {
                        if (na.Count == 0) sink.Add(na, $"level \"{id}\" lists no nodes", fix);
                        foreach (var nv in na)
                        {
                            if (nv.Type != JsonKind.String) { sink.Add(nv, $"each entry of 'nodes' must be a node id string, found {JsonFields.Describe(nv)}", fix); continue; }
                            var nid = (string)nv!;
                            if (!_nodes.TryGetValue(nid, out int n)) { sink.Add(nv, $"unknown node \"{nid}\"", $"use the id of a node listed under \"nodes\"{Suggest(nid, _nodes.Keys)}"); continue; }
                            if (chosen.Contains(n)) { sink.Add(nv, $"node \"{nid}\" is listed twice in level \"{id}\"", "list each node once"); continue; }
                            chosen.Add(n);
                        }
                    }
                }
                else if (double.IsFinite(elev))
                {
                    chosen.AddRange(nodes.Where(n => Math.Abs(n.Y - elev) <= tol).Select(n => n.Index));
                    if (chosen.Count == 0)
                        sink.Add(lf.Token("elevation"), $"level \"{id}\" at elevation {Num(_units.FromSI(elev, Quantity.Length))} {len} has no nodes (no node stands at that y)",
                            $"give the elevation of a floor where nodes stand (node y values: {string.Join(", ", nodes.Select(n => n.Y).Distinct().Order().Take(12).Select(y => Num(_units.FromSI(y, Quantity.Length))))}), or list the level's \"nodes\"");
                }
                lf.RejectUnknownKeys();
                chosen.Sort();
                if (rigid)
                    foreach (int n in chosen)
                        if (supports.FirstOrDefault(s => s.Node == n) is { RestrainX: true })
                            sink.Add(o, $"the rigid diaphragm of level \"{id}\" ties node \"{nodes[n].Id}\", which a support holds in x; a tie across a support would hold the whole floor",
                                "give this level \"diaphragm\": \"none\" (usual for the base), or list its \"nodes\" without the supported ones");
                if (id is not null && double.IsFinite(elev)) read.Add((id, name, elev, rigid, chosen, selection, o));
            }

            // Duplicate elevations, and nodes tied by two diaphragms.
            for (int i = 0; i < read.Count; i++)
                for (int j = 0; j < i; j++)
                    if (Math.Abs(read[i].Elev - read[j].Elev) <= tol)
                        sink.Add(read[i].At, $"levels \"{read[j].Id}\" and \"{read[i].Id}\" have the same elevation {Num(_units.FromSI(read[i].Elev, Quantity.Length))} {len}",
                            "give each level its own elevation, or merge the two");
            var tiedBy = new Dictionary<int, string>();
            foreach (var l in read.Where(l => l.Rigid))
                foreach (int n in l.Nodes)
                    if (!tiedBy.TryAdd(n, l.Id))
                        sink.Add(l.At, $"node \"{nodes[n].Id}\" is tied by the diaphragms of both level \"{tiedBy[n]}\" and level \"{l.Id}\"",
                            "a node can belong to one diaphragm only: take it out of one level's \"nodes\"");
            if (arrayToken is JsonList { Count: 1 } && read.Count == 1 && !read[0].Rigid)
                sink.Add(read[0].At, "a single level without a diaphragm defines no story and ties nothing", "add the other levels, or remove \"levels\"");

            var sorted = read.OrderBy(l => l.Elev).ToList();
            return sorted.Select((l, i) => new Level(i, l.Id, l.Name, l.Elev, l.Rigid, l.Nodes, l.Rigid ? l.Nodes : [], l.Selection)).ToList();
        }

        private (CrackedSectionSettings?, List<ModifierAssignment>) ReadCrackedSections(JsonMap? o, List<Member> members,
            Dictionary<string, JsonMap> memberObjects, List<string> lines, List<string> memberLines)
        {
            var assignments = new List<ModifierAssignment>();
            bool Explicit(Member m) => memberObjects.TryGetValue(m.Id, out var mo) && mo["modifiers"] is JsonMap;
            if (o is null)
            {
                foreach (var m in members)
                    assignments.Add(new ModifierAssignment(m.Index, m.Modifiers, Explicit(m) ? "the member's own \"modifiers\"" : "none (section as given)"));
                return (null, assignments);
            }

            var cf = new JsonFields(o, sink);
            var preset = cf.OptionalString("preset", "give \"preset\": \"aci318-strength\" or \"aci318-service\", or leave it out and give \"roles\"") ?? "";
            if (preset.Length > 0 && !BuildingPresets.CrackedPresets.Contains(preset))
                sink.Add(cf.Token("preset"), $"unknown cracked-section preset \"{preset}\"",
                    $"use \"aci318-strength\" ({BuildingPresets.CrackedTable}, factored loads) or \"aci318-service\" (the same ×1.4, not above 1.0)");
            var walls = cf.OptionalString("walls", "give \"walls\": \"cracked\" or \"uncracked\"") ?? "cracked";
            if (walls != "cracked" && walls != "uncracked")
                sink.Add(cf.Token("walls"), $"unknown wall state \"{walls}\"", "use \"cracked\" or \"uncracked\"");
            bool wallsCracked = walls != "uncracked";

            var user = new Dictionary<StiffnessRole, StiffnessModifiers>();
            if (cf.OptionalObject("roles", "write \"roles\": {\"coupling-beam\": {\"I\": 0.2}, ...}") is { } ro)
                foreach (var p in ro.Properties())
                {
                    const string roleFix = "use one of: wall, column, beam, coupling-beam";
                    if (!BuildingPresets.TryParseRole(p.Name, out var role))
                    {
                        var near = Suggest(p.Name, Enum.GetValues<StiffnessRole>().Select(BuildingPresets.RoleName));
                        sink.Add(p, $"unknown role \"{p.Name}\" in 'crackedSections.roles'", roleFix + near);
                        continue;
                    }
                    if (!members.Any(m => m.Role == p.Name))
                        sink.Add(p, $"no member has the role \"{p.Name}\"", $"give members \"role\": \"{p.Name}\", or remove this entry");
                    if (p.Value is not JsonMap vo) { sink.Add(p.Value, $"'{p.Name}' must be an object such as {{\"I\": 0.35}}", "write {\"I\": ..., \"A\": ..., \"shearArea\": ...}"); continue; }
                    var vf = new JsonFields(vo, sink);
                    const string fix = "give a stiffness modifier > 0 and ≤ 1 (1 = as the section gives; e.g. 0.35 for a cracked wall's I)";
                    var mods = new StiffnessModifiers(vf.OptionalNumber("I", 1, fix), vf.OptionalNumber("A", 1, fix), vf.OptionalNumber("shearArea", 1, fix));
                    foreach (var k in new[] { "I", "A", "shearArea" })
                        if (vf.Token(k) is { Type: JsonKind.Integer or JsonKind.Float } t && !((double)t > 0 && (double)t <= 1))
                            sink.Add(t, $"stiffness modifier '{k}' for role \"{p.Name}\" must be greater than zero and not above 1, found {t}", fix);
                    vf.RejectUnknownKeys();
                    user[role] = mods;
                }
            if (preset.Length == 0 && user.Count == 0)
                sink.Add(o, "'crackedSections' has neither a preset nor role values", "give \"preset\": \"aci318-strength\" or \"roles\": {\"wall\": {\"I\": 0.35}}, or remove the block");

            HashSet<string>? onLines = null;
            if (cf.Token("lines") is { } lt)
            {
                const string fix = "write \"lines\": [\"<line of resistance>\", ...] naming lines given to members with \"line\"";
                onLines = new HashSet<string>(StringComparer.Ordinal);
                if (lt is not JsonList la) sink.Add(lt, "'lines' must be an array of line names", fix);
                else
                    foreach (var lv in la)
                    {
                        if (lv.Type != JsonKind.String) { sink.Add(lv, $"each entry of 'lines' must be a string, found {JsonFields.Describe(lv)}", fix); continue; }
                        var name = (string)lv!;
                        if (!lines.Contains(name))
                            sink.Add(lv, $"unknown line \"{name}\": no member has \"line\": \"{name}\"",
                                lines.Count == 0 ? "give members a \"line\" tag first" : $"use one of: {string.Join(", ", lines.Select(l => $"\"{l}\""))}{Suggest(name, lines)}");
                        onLines.Add(name);
                    }
            }
            cf.RejectUnknownKeys();

            var settings = new CrackedSectionSettings(preset, wallsCracked, user);
            for (int i = 0; i < members.Count; i++)
            {
                var m = members[i];
                if (Explicit(m)) { assignments.Add(new ModifierAssignment(m.Index, m.Modifiers, "the member's own \"modifiers\" (they take precedence over \"crackedSections\")")); continue; }
                if (m.Kind == MemberKind.Brace || !BuildingPresets.TryParseRole(m.Role, out var role))
                {
                    assignments.Add(new ModifierAssignment(m.Index, m.Modifiers, m.Role.Length == 0 ? "none (no role)" : $"none (role \"{m.Role}\" has no cracked-section rule)"));
                    continue;
                }
                if (onLines is not null && !onLines.Contains(memberLines[i]))
                {
                    assignments.Add(new ModifierAssignment(m.Index, m.Modifiers, memberLines[i].Length == 0 ? "none (no line; \"crackedSections\" applies to its listed lines)" : $"none (line \"{memberLines[i]}\" is not among the lines of \"crackedSections\")"));
                    continue;
                }
                StiffnessModifiers mods;
                string source;
                if (user.TryGetValue(role, out var u)) { mods = u; source = $"user value for role \"{BuildingPresets.RoleName(role)}\""; }
                else if (preset.Length > 0 && BuildingPresets.CrackedPresets.Contains(preset)) (mods, source) = BuildingPresets.Preset(preset, role, wallsCracked);
                else { assignments.Add(new ModifierAssignment(m.Index, m.Modifiers, $"none (no value for role \"{m.Role}\")")); continue; }
                if (_sections.TryGetValue(m.SectionId, out var sec) && _materials.TryGetValue(m.MaterialId, out var mat))
                    members[i] = m with { A = sec.Section.A * mods.A, I = sec.Section.I * mods.I, ShearArea = sec.Section.ShearArea(mat.Nu) * mods.ShearArea, Modifiers = mods };
                assignments.Add(new ModifierAssignment(m.Index, mods, source));
            }
            return (settings, assignments);
        }

        private List<DriftCheckSpec> ReadDriftChecks(IReadOnlyList<JsonMap> items, JsonNode? arrayToken, List<Level> levels, List<LoadCase> cases, List<Combination> combos)
        {
            var list = new List<DriftCheckSpec>();
            if (items.Count == 0) return list;
            if (levels.Count < 2)
                sink.Add(arrayToken, "drift checks need stories, and the model has fewer than two levels",
                    "add \"levels\" with the base (\"diaphragm\": \"none\") and every floor above it");
            var ids = cases.Select(c => c.Id).Concat(combos.Select(c => c.Id)).ToList();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "drift check");
                var chosen = new List<string>();
                const string casesFix = "write \"cases\": [\"<load case or combination id>\", ...] (the cases whose elastic drift is amplified, usually the earthquake ones)";
                var ct = f.Token("cases");
                if (ct is null) sink.Add(o, "missing required key 'cases'", casesFix);
                else if (ct is not JsonList ca || ca.Count == 0) sink.Add(ct, "'cases' must be a non-empty array of ids", casesFix);
                else
                    foreach (var cv in ca)
                    {
                        if (cv.Type != JsonKind.String) { sink.Add(cv, $"each entry of 'cases' must be an id string, found {JsonFields.Describe(cv)}", casesFix); continue; }
                        var cid = (string)cv!;
                        if (!ids.Contains(cid)) sink.Add(cv, $"unknown load case or combination \"{cid}\"", $"use one of: {string.Join(", ", ids.Select(i => $"\"{i}\""))}{Suggest(cid, ids)}");
                        else if (chosen.Contains(cid)) sink.Add(cv, $"\"{cid}\" is listed twice", "list each case once");
                        else chosen.Add(cid);
                    }

                // C_d: ASCE 7-16 Table 12.2-1 lists values from 1.25 to 6.5 (from memory); 1 is accepted so a check can use the elastic drift.
                const string cdFix = "give the deflection amplification factor C_d of the seismic force-resisting system, between 1 and 6.5 (1 = elastic drift)";
                double cd = f.RequiredNumber("Cd", cdFix);
                if (double.IsFinite(cd) && !(cd >= 1.0 && cd <= 6.5)) sink.Add(f.Token("Cd"), $"C_d = {Num(cd)} is out of range", cdFix);
                // I_e: ASCE 7-16 Table 1.5-2 gives 1.0, 1.25 and 1.5 (from memory).
                const string ieFix = "give the seismic importance factor I_e between 1.0 and 1.5 (1.0, 1.25 or 1.5 by risk category)";
                double ie = f.OptionalNumber("Ie", 1.0, ieFix);
                if (double.IsFinite(ie) && !(ie >= 1.0 && ie <= 1.5)) sink.Add(f.Token("Ie"), $"I_e = {Num(ie)} is out of range", ieFix);

                double allowed = double.NaN;
                string source = "";
                bool hasRatio = f.Has("allowedRatio"), hasPreset = f.Has("allowed");
                const string limitFix = "give \"allowedRatio\": <Δa/h_sx, e.g. 0.020>, or \"allowed\": {\"structure\": \"other\", \"riskCategory\": \"II\"} for the preset";
                if (hasRatio && hasPreset) sink.Add(o, "both 'allowedRatio' and 'allowed' are given", "give one: a ratio of your own or the preset");
                else if (!hasRatio && !hasPreset) sink.Add(o, "the drift check has no allowable drift", limitFix);
                else if (hasRatio)
                {
                    allowed = f.RequiredNumber("allowedRatio", limitFix);
                    if (double.IsFinite(allowed) && !(allowed > 0 && allowed <= 0.1))
                        sink.Add(f.Token("allowedRatio"), $"allowable drift ratio {Num(allowed)} is out of range (it is Δa/h_sx, a small fraction)", "give a ratio above 0 and not above 0.1, e.g. 0.020 for 2 % of the story height");
                    source = "user value";
                }
                else if (f.OptionalObject("allowed", limitFix) is { } po)
                {
                    var pf = new JsonFields(po, sink);
                    var types = BuildingPresets.AllowableDriftRatio.Keys.ToList();
                    var st = pf.RequiredString("structure", $"give \"structure\": one of {string.Join(", ", types)}");
                    var rc = pf.RequiredString("riskCategory", "give \"riskCategory\": \"I\", \"II\", \"III\" or \"IV\"");
                    if (st is not null && !types.Contains(st)) sink.Add(pf.Token("structure"), $"unknown structure type \"{st}\"", $"use one of: {string.Join(", ", types)}{Suggest(st, types)}");
                    if (rc is not null && !BuildingPresets.RiskCategories.Contains(rc)) sink.Add(pf.Token("riskCategory"), $"unknown risk category \"{rc}\"", "use \"I\", \"II\", \"III\" or \"IV\"");
                    pf.RejectUnknownKeys();
                    if (st is not null && rc is not null)
                    {
                        allowed = BuildingPresets.AllowedDrift(st, rc);
                        source = $"preset values from {BuildingPresets.DriftTable}, {st}, risk category {rc}; {BuildingPresets.PresetCaution}";
                        int stories = Math.Max(0, levels.Count - 1);
                        if (st == "four-stories-or-fewer" && stories > 4)
                            sink.Add(pf.Token("structure"), $"the preset \"four-stories-or-fewer\" is for structures of four stories or fewer; the model has {stories} stories", "use \"other\" or a ratio of your own");
                    }
                }
                f.RejectUnknownKeys();
                if (id is not null) list.Add(new DriftCheckSpec(id, chosen, cd, ie, allowed, source));
            }
            return list;
        }
    }
}
