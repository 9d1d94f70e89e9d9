using System.Globalization;
using System.Text.RegularExpressions;
using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>
/// Plausibility of a model that has read without error: values outside the range of building materials and buildings
/// in the units in force (with their reading in those units and the units in which they would be plausible), and the
/// slips an engineer makes (a wall's thickness and length swapped, a beam deeper than its story, a level away from its
/// nodes, a load case without load, a lateral case without lateral load, a drift check on a gravity case, a wind case
/// under the seismic drift equation). Each gives a <see cref="ModelWarning"/>; none changes the model. The ranges and
/// their basis are in docs/model-format.md ("Plausibility warnings"): common practice, wide on purpose, so that a model
/// that is right does not warn.
/// </summary>
internal static partial class Plausibility
{
    // Ranges in SI (N, m). Basis, common practice: E of timber about 1,500 ksi (10 GPa), masonry 1,000-3,000 ksi
    // (7-21 GPa), concrete 3,000-6,000 ksi (21-41 GPa), steel 29,000 ksi (200 GPa); story heights 8-30 ft (2.4-9.1 m).
    internal const double MinModulus = 1e9, MaxModulus = 250e9;              // 145 ksi to 36,000 ksi
    internal const double MinStory = 1.8, MaxStory = 15.0;                   // about 6 ft to 50 ft
    internal const double MinExtent = 1.0, MaxExtent = 1000.0;               // the largest of the structure's width and height
    internal const double MaxMemberLength = 200.0;
    internal const double MinSectionSize = 0.005, MaxSectionSize = 50.0;     // rectangle b and d, a general section's depth
    internal const double MinRolledDepth = 0.05, MaxRolledDepth = 5.0;       // I-section d
    internal const double MinPlate = 0.002, MaxPlate = 2.0;                  // I-section bf, tf, tw
    internal const double MinArea = 1e-5, MaxArea = 200.0;                   // m²
    internal const double MinInertia = 1e-10, MaxInertia = 1e5;             // m⁴
    internal const double MinWallThickness = 0.025, MaxWallThickness = 3.0;  // panels and wall checks
    internal const double MinLevelWeight = 100.0, MaxLevelWeight = 1e9;      // N: 0.1 kN to 1,000,000 kN per level

    public static IReadOnlyList<ModelWarning> Check(StructureModel m, JsonMap root, string file) => new Checker(m, root, file).Run();

    [GeneratedRegex(@"^W([XYL]|\d)*([-_ .].*)?$")] private static partial Regex WindId();
    [GeneratedRegex(@"^(E|EQ|EX|EY|QE)\d*([-_ .].*)?$")] private static partial Regex SeismicId();

    internal static bool IsWind(LoadCase c) => WindId().IsMatch(c.Id) || Has(c.Id, "wind") || Has(c.Description, "wind");

    internal static bool IsLateralName(LoadCase c) =>
        IsWind(c) || SeismicId().IsMatch(c.Id) || new[] { "seism", "quake", "lateral", "sway" }.Any(w => Has(c.Id, w) || Has(c.Description, w));

    private static bool Has(string s, string w) => s.Contains(w, StringComparison.OrdinalIgnoreCase);

    private sealed partial class Checker(StructureModel m, JsonMap root, string file)
    {
        private readonly List<ModelWarning> _items = [];
        private readonly UnitSystem _u = m.Units;
        private readonly bool _hasUnits = root["units"] is JsonMap;

        public IReadOnlyList<ModelWarning> Run()
        {
            if (!_hasUnits)
                Add(root, $"the model has no \"units\" key, so every number is read in kip and inch (the documented default): E in ksi, lengths in inches",
                    "if the numbers are in other units, add \"units\": {\"force\": \"kN\", \"length\": \"m\"} (or the units they are in)");
            Materials();
            Sections();
            Extent();
            StoryHeights();
            Weights();
            OneUnitSystem();
            SwappedWalls();
            DepthInStory();
            LevelsAwayFromNodes();
            Loads();
            return _items;
        }

        private void Add(JsonNode? at, string problem, string fix)
        {
            int line = 0, col = 0;
            if (at is not null) { line = at.Line; col = at.Column; }
            _items.Add(new ModelWarning(file, line, col, at is null ? "" : DiagnosticSink.PathOf(at), problem, fix));
        }

        private static IEnumerable<JsonMap> Array(JsonNode? t) => t is JsonList a ? a.OfType<JsonMap>() : [];

        private static double? Value(JsonNode? t) =>
            t is { Type: JsonKind.Integer or JsonKind.Float } && double.IsFinite((double)t) ? (double)t : null;

        // ---- values against the ranges -------------------------------------------------------------------------

        private void Materials()
        {
            foreach (var o in Array(root["materials"]))
                if (o["E"] is { } t && Value(t) is { } v)
                    Range(t, $"E of material \"{o["id"]}\"", v, Quantity.Stress, MinModulus, MaxModulus, "building materials (timber and masonry to steel)");
        }

        private void Sections()
        {
            foreach (var o in Array(root["sections"]))
            {
                string id = $"section \"{o["id"]}\"";
                var keys = (string?)o["shape"] switch
                {
                    "rectangle" => new[] { ("b", Quantity.Length, MinSectionSize, MaxSectionSize), ("d", Quantity.Length, MinSectionSize, MaxSectionSize) },
                    "I" => [("d", Quantity.Length, MinRolledDepth, MaxRolledDepth), ("bf", Quantity.Length, MinPlate, MaxPlate), ("tf", Quantity.Length, MinPlate, MaxPlate), ("tw", Quantity.Length, MinPlate, MaxPlate)],
                    _ => [("A", Quantity.Area, MinArea, MaxArea), ("I", Quantity.SecondMomentOfArea, MinInertia, MaxInertia), ("depth", Quantity.Length, MinSectionSize, MaxSectionSize)],
                };
                foreach (var (k, q, lo, hi) in keys)
                    if (o[k] is { } t && Value(t) is { } v) Range(t, $"{k} of {id}", v, q, lo, hi, "building members");
            }
        }

        private void Extent()
        {
            var xs = new List<double>(); var ys = new List<double>();
            foreach (var n in m.Nodes) { xs.Add(n.X); ys.Add(n.Y); }
            foreach (var p in m.Panels) { xs.Add(p.X0); xs.Add(p.X0 + p.Length); ys.Add(p.Y0); ys.Add(p.Y0 + p.Height); }
            if (xs.Count >= 2)
            {
                double size = Math.Max(xs.Max() - xs.Min(), ys.Max() - ys.Min());
                var at = root["nodes"] is JsonList { Count: > 0 } ? root["nodes"] : root["panels"];
                if (size > 0) Range(at, "the structure's largest dimension (width or height)", _u.FromSI(size, Quantity.Length), Quantity.Length, MinExtent, MaxExtent, "buildings");
            }
            var members = (root["members"] as JsonList)?.OfType<JsonMap>().ToList() ?? [];
            var longOnes = m.Members.Where(x => Length(x) > MaxMemberLength).ToList();
            if (longOnes.Count > 0 && longOnes[0].Index < members.Count)
            {
                var first = longOnes[0];
                Add(members[first.Index], $"member \"{first.Id}\" is {G(_u.FromSI(Length(first), Quantity.Length))} {_u.LengthSymbol} long ({Pretty(Length(first), Quantity.Length)}), longer than any member of a building ({Pretty(MaxMemberLength, Quantity.Length)})" +
                    (longOnes.Count > 1 ? $"; {longOnes.Count - 1} more member(s) too" : ""), UnitsFix());
            }
        }

        private double Length(Member x) => Math.Sqrt(Math.Pow(m.Nodes[x.End].X - m.Nodes[x.Start].X, 2) + Math.Pow(m.Nodes[x.End].Y - m.Nodes[x.Start].Y, 2));

        private void StoryHeights()
        {
            var levels = m.Building.Levels;
            var levelTokens = Array(root["levels"]).ToDictionary(o => (string?)o["id"] ?? "", o => o, StringComparer.Ordinal);
            for (int k = 1; k < levels.Count; k++)
            {
                double h = levels[k].Elevation - levels[k - 1].Elevation;
                levelTokens.TryGetValue(levels[k].Id, out var lo);
                if (Range(lo?["elevation"] ?? lo, $"the height of the story below level \"{levels[k].Id}\"", _u.FromSI(h, Quantity.Length), Quantity.Length, MinStory, MaxStory, "building stories")) break;
            }
            foreach (var o in Array(root["comparisons"]))
                if ((string?)o["kind"] == "coupled-wall" && o["storyHeight"] is { } t && Value(t) is { } v)
                    Range(t, $"storyHeight of check \"{o["id"]}\"", v, Quantity.Length, MinStory, MaxStory, "building stories");
            var panels = Array(root["panels"]).ToList();
            for (int i = 0; i < m.Panels.Count && i < panels.Count; i++)
            {
                var p = m.Panels[i];
                var tops = p.Levels;
                double below = 0;
                for (int k = 0; k < tops.Count; k++)
                {
                    double h = tops[k] - below;
                    below = tops[k];
                    // A panel without floor levels may be several stories tall: only a story too low is judged there.
                    if (p.FloorLevels.Count == 0 && h >= MinStory) continue;
                    var at = k < p.FloorLevels.Count ? (panels[i]["floorLevels"] as JsonList)?[k] : panels[i]["height"];
                    if (Range(at, $"the height of story {k + 1} of panel \"{p.Id}\"", _u.FromSI(h, Quantity.Length), Quantity.Length, MinStory, MaxStory, "building stories")) break;
                }
                if (panels[i]["thickness"] is { } tt && Value(tt) is { } tv)
                    Range(tt, $"thickness of panel \"{p.Id}\"", tv, Quantity.Length, MinWallThickness, MaxWallThickness, "walls");
            }
        }

        private void Weights()
        {
            if (root["seismic"] is not JsonMap s) return;
            foreach (var o in Array(s["weights"]))
                if (o["weight"] is { } t && Value(t) is { } v && v > 0)
                    if (Range(t, $"the weight of level \"{o["level"]}\"", v, Quantity.Force, MinLevelWeight, MaxLevelWeight, "building floors")) break;
        }

        /// <summary>Warns when <paramref name="value"/> (file units) is outside [lo, hi] (SI); true when it warned.</summary>
        private bool Range(JsonNode? at, string what, double value, Quantity q, double lo, double hi, string of)
        {
            double si = _u.ToSI(value, q);
            if (!double.IsFinite(si) || si == 0 || (Math.Abs(si) >= lo && Math.Abs(si) <= hi)) return false;
            string problem = $"{what} = {G(value)} read as {_u.Label(q)} is {Pretty(si, q)}, {(Math.Abs(si) < lo ? "below" : "above")} the range of {of} ({Pretty(lo, q)} to {Pretty(hi, q)})";
            var alt = Alternatives(value, q, lo, hi);
            if (alt.Count > 0) problem += "; " + string.Join("; ", alt.Select(a => $"in {a.Units} it would be {Pretty(a.SI, q)}{(q == Quantity.Stress ? $", {MaterialOf(a.SI)}" : "")}"));
            Add(at, problem, UnitsFix(alt.Count > 0 ? alt[0].System : null));
            _ranged.Add((_items.Count - 1, value, q, lo, hi));
            return true;
        }

        private readonly List<(int Warning, double Value, Quantity Q, double Lo, double Hi)> _ranged = [];

        /// <summary>When one set of units makes every value flagged as out of range plausible, every such fix names it.</summary>
        private void OneUnitSystem()
        {
            if (_ranged.Count < 2) return;
            var fits = Candidates.FirstOrDefault(c => c != _u && _ranged.All(r => Math.Abs(c.ToSI(r.Value, r.Q)) >= r.Lo && Math.Abs(c.ToSI(r.Value, r.Q)) <= r.Hi));
            if (fits is null) return;
            foreach (var r in _ranged)
                _items[r.Warning] = _items[r.Warning] with { Fix = UnitsFix(fits) + $" (in {fits.ForceSymbol} and {fits.LengthSymbol} every value flagged here is in range)" };
        }

        private string UnitsFix(UnitSystem? likely = null)
        {
            string named = likely is null ? "\"force\": \"kN\", \"length\": \"m\"" : $"\"force\": \"{likely.ForceSymbol}\", \"length\": \"{likely.LengthSymbol}\"";
            return _hasUnits
                ? $"check the value against the model's \"units\" ({_u}); if the numbers are in other units, change \"units\" to them (e.g. {{{named}}})"
                : $"add \"units\": {{{named}}} if the model is in those units (without it, kip and inch are assumed), or correct the value";
        }

        private static readonly UnitSystem[] Candidates =
        [
            new(ForceUnit.Kip, LengthUnit.Inch), new(ForceUnit.Kip, LengthUnit.Foot), new(ForceUnit.Kilonewton, LengthUnit.Metre),
            new(ForceUnit.Newton, LengthUnit.Millimetre), new(ForceUnit.Newton, LengthUnit.Metre), new(ForceUnit.Pound, LengthUnit.Inch),
            new(ForceUnit.Pound, LengthUnit.Foot), new(ForceUnit.Kilonewton, LengthUnit.Millimetre), new(ForceUnit.Meganewton, LengthUnit.Metre),
            new(ForceUnit.Kilonewton, LengthUnit.Centimetre),
        ];

        /// <summary>Unit systems in which <paramref name="value"/> would be in range, the usual ones first (at most two).</summary>
        private List<(string Units, double SI, UnitSystem System)> Alternatives(double value, Quantity q, double lo, double hi)
        {
            var list = new List<(string, double, UnitSystem)>();
            var scales = new List<double> { _u.Scale(q) };
            foreach (var c in Candidates)
            {
                double si = c.ToSI(value, q);
                if (Math.Abs(si) < lo || Math.Abs(si) > hi) continue;
                if (scales.Any(x => Math.Abs(x - c.Scale(q)) <= 1e-9 * x)) continue;
                scales.Add(c.Scale(q));
                string label = q switch
                {
                    Quantity.Length or Quantity.Area or Quantity.SecondMomentOfArea => c.LengthSymbol,
                    Quantity.Force => c.ForceSymbol,
                    _ => $"{c.ForceSymbol} and {c.LengthSymbol}",
                };
                list.Add((q == Quantity.Stress ? $"{label} ({c.Label(q)})" : label, si, c));
                if (list.Count == 2) break;
            }
            return list;
        }

        private static string MaterialOf(double e) => e switch
        {
            < 5e9 => "softer than timber",
            < 14e9 => "timber or masonry",
            < 45e9 => "concrete or masonry",
            >= 60e9 and <= 80e9 => "aluminium",
            >= 180e9 and <= 220e9 => "steel",
            _ => "a structural material",
        };

        private static string Pretty(double si, Quantity q) => q switch
        {
            Quantity.Stress => Math.Abs(si) >= 1e9 ? $"{G(si / 1e9)} GPa" : $"{G(si / 1e6)} MPa",
            Quantity.Length => Math.Abs(si) >= 1 ? $"{G(si)} m" : $"{G(si * 1000)} mm",
            Quantity.Area => $"{G(si)} m²",
            Quantity.SecondMomentOfArea => $"{G(si)} m⁴",
            Quantity.Force => $"{G(si / 1000)} kN",
            _ => G(si),
        };

        private static string G(double v) => v.ToString("G4", CultureInfo.InvariantCulture);

        private string L(double si) => $"{G(_u.FromSI(si, Quantity.Length))} {_u.LengthSymbol}";

        // ---- slips ------------------------------------------------------------------------------------------------

        private bool Vertical(Member x) => Math.Abs(m.Nodes[x.End].X - m.Nodes[x.Start].X) <= 1e-9 * Length(x);
        private bool Horizontal(Member x) => Math.Abs(m.Nodes[x.End].Y - m.Nodes[x.Start].Y) <= 1e-9 * Length(x);

        /// <summary>A rectangle whose out-of-plane width b is larger than its in-plane depth d on a wall: b and d swapped.</summary>
        private void SwappedWalls()
        {
            foreach (var o in Array(root["sections"]))
            {
                if ((string?)o["shape"] != "rectangle" || Value(o["b"]) is not { } b || Value(o["d"]) is not { } d || !(b > d)) continue;
                string id = (string?)o["id"] ?? "";
                var users = m.Members.Where(x => x.SectionId == id).ToList();
                var wall = users.FirstOrDefault(x => x.Role == "wall" || (Vertical(x) && x.Role != "column" && b >= 4 * d));
                if (wall is null) continue;
                Add(o["b"], $"rectangle \"{id}\" of wall member \"{wall.Id}\" is thicker out of plane (b = {G(b)} {_u.LengthSymbol}) than it is long in the plane (d = {G(d)} {_u.LengthSymbol}): b and d look swapped, which makes the wall {G(Math.Pow(b / d, 2))} times too flexible in bending",
                    "give b as the wall's thickness (out of plane) and d as its length in the plane of the frame");
            }
            foreach (var o in Array(root["panels"]))
                if (Value(o["thickness"]) is { } t && Value(o["length"]) is { } l && t > l)
                    Add(o["thickness"], $"panel \"{o["id"]}\" is thicker (thickness {G(t)} {_u.LengthSymbol}) than it is long (length {G(l)} {_u.LengthSymbol}): thickness and length look swapped",
                        "give \"length\" along the wall in its plane and \"thickness\" through the wall");
            foreach (var o in Array(root["comparisons"]))
                if (Value(o["thickness"]) is { } t && Value(o["length"]) is { } l && t > l)
                    Add(o["thickness"], $"check \"{o["id"]}\" has a wall thicker (thickness {G(t)} {_u.LengthSymbol}) than it is long (length {G(l)} {_u.LengthSymbol}): thickness and length look swapped",
                        "give \"length\" along the wall in its plane and \"thickness\" through the wall");
        }

        /// <summary>A horizontal member whose section is as deep as the story below it (or deeper).</summary>
        private void DepthInStory()
        {
            var elevations = m.Nodes.Select(n => n.Y).Distinct().Order().ToArray();
            var sections = m.Sections.ToDictionary(s => s.Id, StringComparer.Ordinal);
            var sectionTokens = Array(root["sections"]).Where(o => o["id"] is { Type: JsonKind.String }).GroupBy(o => (string)o["id"]!).ToDictionary(g => g.Key, g => g.First(), StringComparer.Ordinal);
            var warned = new HashSet<string>(StringComparer.Ordinal);
            foreach (var x in m.Members)
            {
                if (!Horizontal(x) || !sections.TryGetValue(x.SectionId, out var s) || !(s.Depth > 0) || warned.Contains(s.Id)) continue;
                double y = m.Nodes[x.Start].Y;
                double tol = 1e-9 * Math.Max(1, Math.Abs(y));
                var below = elevations.Where(e => e < y - tol).ToArray();
                if (below.Length == 0) continue;
                double h = y - below[^1];
                if (s.Depth < h) continue;
                warned.Add(s.Id);
                sectionTokens.TryGetValue(s.Id, out var so);
                Add(so?["d"] ?? so?["depth"] ?? so, $"section \"{s.Id}\" of beam \"{x.Id}\" is {L(s.Depth)} deep, as deep as the story below it ({L(h)}) or deeper: it does not fit the story",
                    "check the section's depth and its units (a depth in feet or millimetres where inches or metres are meant), and the node elevations");
            }
        }

        /// <summary>A level whose elevation is far from the nodes it reports: story heights (drift ratios) then differ from the members' lengths.</summary>
        private void LevelsAwayFromNodes()
        {
            var levels = m.Building.Levels;
            var tokens = Array(root["levels"]).Where(o => o["id"] is { Type: JsonKind.String }).GroupBy(o => (string)o["id"]!).ToDictionary(g => g.Key, g => g.First(), StringComparer.Ordinal);
            for (int k = 0; k < levels.Count; k++)
            {
                var l = levels[k];
                if (l.Nodes.Count == 0) continue;
                double y = l.Nodes.Average(n => m.Nodes[n].Y);
                double story = double.PositiveInfinity;
                if (k > 0) story = Math.Min(story, l.Elevation - levels[k - 1].Elevation);
                if (k + 1 < levels.Count) story = Math.Min(story, levels[k + 1].Elevation - l.Elevation);
                if (!double.IsFinite(story) || Math.Abs(y - l.Elevation) <= 0.1 * story) continue;
                tokens.TryGetValue(l.Id, out var o);
                Add(o?["elevation"] ?? o, $"level \"{l.Id}\" is at elevation {L(l.Elevation)} but its nodes stand at y = {L(y)}: the story heights taken from the elevations (for drift ratios) are far from the lengths of the members between the levels",
                    "give the level the elevation of its nodes, or list the nodes that stand at that elevation");
            }
        }

        // ---- loads ------------------------------------------------------------------------------------------------

        private void Loads()
        {
            int n = m.LoadCases.Count;
            var any = new bool[n];
            var lateral = new bool[n];
            for (int i = 0; i < n; i++)
            {
                var c = m.LoadCases[i];
                foreach (var l in c.NodalLoads)
                {
                    if (l.Fx != 0 || l.Fy != 0 || l.Mz != 0) any[i] = true;
                    if (l.Fx != 0) lateral[i] = true;
                }
                foreach (var l in c.MemberLoads)
                {
                    if (l.WStart == 0 && l.WEnd == 0) continue;
                    any[i] = true;
                    var x = m.Members[l.Member];
                    double len = Length(x), cos = (m.Nodes[x.End].X - m.Nodes[x.Start].X) / len, sin = (m.Nodes[x.End].Y - m.Nodes[x.Start].Y) / len;
                    double towardsX = l.Axes == LoadAxes.Global ? (l.Direction == 0 ? 1 : 0) : (l.Direction == 0 ? cos : sin);
                    if (Math.Abs(towardsX) > 1e-9) lateral[i] = true;
                }
            }
            foreach (var p in m.Panels)
                foreach (var l in p.Loads)
                    if (l.Case >= 0 && l.Case < n)
                    {
                        if (l.Fx != 0 || l.Fy != 0) any[l.Case] = true;
                        if (l.Fx != 0) lateral[l.Case] = true;
                    }
            string? generated = m.Seismic?.CaseId;   // its story forces are filled in by the analysis: lateral
            for (int i = 0; i < n; i++) if (m.LoadCases[i].Id == generated) any[i] = lateral[i] = true;
            var caseTokens = Array(root["loadCases"]).ToList();
            for (int i = 0; i < n && i < caseTokens.Count; i++)
            {
                var c = m.LoadCases[i];
                if (c.Id == generated) { any[i] = lateral[i] = true; continue; }
                if (!any[i])
                    Add(caseTokens[i], $"load case \"{c.Id}\" has no load (it lists none, or every load in it is zero): its results are all zero",
                        "add the case's loads, or remove the case");
                else if (!lateral[i] && IsLateralName(c))
                    Add(caseTokens[i], $"load case \"{c.Id}\" is named as a lateral case but has no lateral (x) load: every load in it is vertical or a moment",
                        "give the lateral loads as \"fx\" (nodal) or as member loads in x; or rename the case if it is a gravity case");
            }

            var ids = m.LoadCases.Select((c, i) => (c.Id, i)).ToDictionary(t => t.Id, t => t.i, StringComparer.Ordinal);
            foreach (var check in Array(root["driftChecks"]))
            {
                string cid = (string?)check["id"] ?? "";
                var spec = m.Building.DriftChecks.FirstOrDefault(d => d.Id == cid);
                if (spec is null || check["cases"] is not JsonList cases) continue;
                bool seismicEquation = spec.Cd != 1 || spec.Ie != 1 || spec.LimitSource.Contains(BuildingPresets.DriftTable, StringComparison.Ordinal);
                foreach (var t in cases)
                {
                    if (t.Type != JsonKind.String) continue;
                    string name = (string)t!;
                    // The load cases in it, with a non-zero factor.
                    var parts = ids.TryGetValue(name, out int ci) ? [ci]
                        : m.Combinations.FirstOrDefault(x => x.Id == name) is { } combo ? combo.Factors.Where(f => f.Factor != 0).Select(f => f.Case).ToList() : [];
                    if (parts.Count == 0) continue;
                    if (!parts.Any(p => lateral[p]))
                        Add(t, $"drift check \"{cid}\" lists \"{name}\", which has no lateral load (a gravity case): its story drifts are not lateral drifts",
                            "list the lateral load cases or combinations (wind, earthquake) in the drift check");
                    else if (seismicEquation && parts.Where(p => lateral[p]).All(p => IsWind(m.LoadCases[p])))
                        Add(t, $"drift check \"{cid}\" applies the seismic drift equation to wind case \"{name}\": {(spec.Cd != 1 || spec.Ie != 1 ? $"C_d = {G(spec.Cd)} and I_e = {G(spec.Ie)} amplify the drift (ASCE 7-16 eq. 12.8-15, for earthquake loads)" : "")}{(spec.LimitSource.Contains(BuildingPresets.DriftTable, StringComparison.Ordinal) ? $"{(spec.Cd != 1 || spec.Ie != 1 ? ", and " : "")}the allowable drift is the seismic table's" : "")}",
                            "check wind drift in a drift check of its own with \"Cd\": 1, \"Ie\": 1 and a serviceability \"allowedRatio\" (e.g. 0.0025, common practice); keep the seismic check for the earthquake cases");
                }
            }
        }
    }
}
