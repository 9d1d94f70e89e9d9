using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of "comparisons": the checks that set hand methods beside the FE (docs/comparisons.md).
public static partial class ModelReader
{
    /// <summary>Check kinds built from their own dimensions, with no reference to the model's members, nodes or supports.</summary>
    private static readonly string[] SelfContainedKinds = ["perforated-wall", "coupled-wall"];

    /// <summary>
    /// True when the model declares comparison checks and every one is self-contained (a perforated-wall or coupled-wall
    /// check built from its own dimensions): such a model needs no frame, so nodes, members, supports and sections may be
    /// left out (docs/comparisons.md).
    /// </summary>
    private static bool ComparisonsOnly(JsonMap root) =>
        root.TryGetValue("comparisons", out var t) && t is JsonList { Count: > 0 } a
        && a.All(c => c is JsonMap o && o.TryGetValue("kind", out var k) && k.Type == JsonKind.String && SelfContainedKinds.Contains((string)k!))
        && !root.ContainsKey("nodes") && !root.ContainsKey("members");

    private sealed partial class Builder
    {
        // ---- comparisons (docs/comparisons.md) ----

        private static readonly string[] CheckKinds = ["wall-line", "perforated-wall", "frame-stories", "shear-split", "coupled-wall", "panel-wall", "footing-wall"];

        private CheckLocation Where(JsonNode t)
        {
            int line = 0, col = 0;
            line = t.Line; col = t.Column;
            return new CheckLocation(fileName, line, col, DiagnosticSink.PathOf(t));
        }

        /// <summary>An array of strings; each entry returned with its token for messages.</summary>
        private List<(string Value, JsonNode At)> Strings(JsonFields f, string key, bool required, string fix)
        {
            var list = new List<(string, JsonNode)>();
            var t = f.Token(key);
            if (t is null) { if (required) sink.Add(f.Object, $"missing required key '{key}'", fix); return list; }
            if (t is not JsonList arr) { sink.Add(t, $"'{key}' must be an array, found {JsonFields.Describe(t)}", fix); return list; }
            foreach (var item in arr)
            {
                if (item.Type == JsonKind.String && !string.IsNullOrWhiteSpace((string)item!)) list.Add(((string)item!, item));
                else sink.Add(item, $"each entry of '{key}' must be a non-empty string, found {JsonFields.Describe(item)}", fix);
            }
            if (arr.Count == 0 && required) sink.Add(arr, $"'{key}' is empty", fix);
            return list;
        }

        private List<(double Value, JsonNode At)> Numbers(JsonFields f, string key, string fix)
        {
            var list = new List<(double, JsonNode)>();
            var t = f.Token(key);
            if (t is null) return list;
            if (t is not JsonList arr) { sink.Add(t, $"'{key}' must be an array of numbers, found {JsonFields.Describe(t)}", fix); return list; }
            foreach (var item in arr)
            {
                if (item.Type is JsonKind.Integer or JsonKind.Float && double.IsFinite((double)item)) list.Add(((double)item, item));
                else sink.Add(item, $"each entry of '{key}' must be a finite number, found {JsonFields.Describe(item)}", fix);
            }
            return list;
        }

        private List<ComparisonCheck> ReadComparisons(IReadOnlyList<JsonMap> items, List<Member> members, List<Support> supports, List<LoadCase> cases)
        {
            var list = new List<ComparisonCheck>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var splits = new List<(ShearSplitCheck Check, List<JsonNode> LineTokens)>();
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "comparison check");
                var kind = f.RequiredString("kind", $"give \"kind\": one of {string.Join(", ", CheckKinds.Select(k => $"\"{k}\""))}");
                var desc = f.OptionalString("description", "give a description as a string") ?? "";
                double? tol = null;
                if (f.Has("tolerance"))
                {
                    const string tfix = "give \"tolerance\" as a fraction between 0 and 1, e.g. 0.10 for ±10%";
                    double tv = f.RequiredNumber("tolerance", tfix);
                    if (double.IsFinite(tv) && !(tv > 0 && tv < 1)) sink.Add(f.Token("tolerance"), $"'tolerance' is {tv}, outside (0, 1)", tfix);
                    else tol = tv;
                }
                var at = Where(o);
                ComparisonCheck? check = kind switch
                {
                    "wall-line" => ReadWallLine(f, id, desc, tol, at, members),
                    "perforated-wall" => ReadPerforatedWall(f, id, desc, tol, at),
                    "frame-stories" => ReadFrameStories(f, id, desc, tol, at, members, supports),
                    "shear-split" => ReadShearSplit(f, id, desc, tol, at, splits),
                    "coupled-wall" => ReadCoupledWall(f, id, desc, tol, at),
                    "panel-wall" => ReadPanelWall(f, id, desc, tol, at),
                    "footing-wall" => ReadFootingWall(f, id, desc, tol, at, members),   // ModelReader.Footings.cs
                    null => SkipRest(f),
                    _ => UnknownKind(f, kind),
                };
                f.RejectUnknownKeys();
                if (id is not null && check is not null) list.Add(check);
            }
            // Lines of a split name other checks: resolve once all are read.
            var byId = new Dictionary<string, ComparisonCheck>(StringComparer.Ordinal);
            foreach (var c in list) byId.TryAdd(c.Id, c);   // a duplicate id is already reported (ReadId); keep the first
            foreach (var (split, tokens) in splits)
                for (int i = 0; i < split.Lines.Count; i++)
                {
                    var cid = split.Lines[i].CheckId;
                    if (!byId.TryGetValue(cid, out var target))
                        sink.Add(tokens[i], $"unknown check \"{cid}\" in a shear split", $"name the id of a \"wall-line\" or \"frame-stories\" check listed under \"comparisons\"{Suggest(cid, byId.Keys)}");
                    else if (target is not (WallLineCheck or FrameStoriesCheck))
                        sink.Add(tokens[i], $"check \"{cid}\" is a {KindOf(target)} check; a shear split needs lines described by \"wall-line\" or \"frame-stories\" checks", "name a wall-line or frame-stories check");
                }
            return list;
        }

        private static string KindOf(ComparisonCheck c) => c switch
        {
            WallLineCheck => "wall-line", PerforatedWallCheck => "perforated-wall", FrameStoriesCheck => "frame-stories", CoupledWallCheck => "coupled-wall", PanelWallCheck => "panel-wall", FootingWallCheck => "footing-wall", _ => "shear-split",
        };

        private ComparisonCheck? UnknownKind(JsonFields f, string kind)
        {
            sink.Add(f.Token("kind"), $"unknown check kind \"{kind}\"", $"use one of {string.Join(", ", CheckKinds.Select(k => $"\"{k}\""))} (docs/comparisons.md)");
            return SkipRest(f);
        }

        /// <summary>Without a known kind the other keys cannot be judged: mark them read, so only the kind is reported.</summary>
        private static ComparisonCheck? SkipRest(JsonFields f)
        {
            foreach (var p in f.Object.Properties()) f.Has(p.Name);
            return null;
        }

        private List<(int Member, JsonNode At)> MemberRefs(JsonFields f, string key, string what)
        {
            var refs = new List<(int, JsonNode)>();
            foreach (var (mid, tok) in Strings(f, key, true, $"list the ids of the {what} as strings, e.g. \"{key}\": [\"M1\", \"M2\"]"))
            {
                if (_members.TryGetValue(mid, out int m)) refs.Add((m, tok));
                else sink.Add(tok, $"unknown member \"{mid}\"", $"use the id of a member listed under \"members\"{Suggest(mid, _members.Keys)}");
            }
            return refs;
        }

        private WallLineCheck? ReadWallLine(JsonFields f, string? id, string desc, double? tol, CheckLocation at, List<Member> members)
        {
            var refs = MemberRefs(f, "members", "wall line's members, base first");
            var ends = new List<CheckEnds>();
            const string efix = "give \"ends\": [\"cantilever\"], [\"fixed-fixed\"] or [\"cantilever\", \"fixed-fixed\"] (the default)";
            foreach (var (e, tok) in Strings(f, "ends", false, efix))
            {
                var ce = e switch { "cantilever" => CheckEnds.Cantilever, "fixed-fixed" => CheckEnds.FixedFixed, _ => (CheckEnds)(-1) };
                if ((int)ce < 0) sink.Add(tok, $"unknown end condition \"{e}\"", efix);
                else if (ends.Contains(ce)) sink.Add(tok, $"end condition \"{e}\" is listed twice", efix);
                else ends.Add(ce);
            }
            if (!f.Has("ends")) ends.AddRange([CheckEnds.Cantilever, CheckEnds.FixedFixed]);
            else if (f.Token("ends") is JsonList { Count: 0 } noEnds) sink.Add(noEnds, "'ends' is empty, so the check would report nothing", efix);
            if (id is null || refs.Count == 0) return null;

            var nodes = _nodesList!;
            bool ok = true;
            int baseNode = -1, top = -1;
            double x0 = double.NaN;
            foreach (var (m, tok) in refs)
            {
                var mem = members[m];
                if (mem.Kind != MemberKind.BeamColumn || mem.ReleaseStart || mem.ReleaseEnd || mem.RigidStart > 0 || mem.RigidEnd > 0)
                {
                    sink.Add(tok, $"member \"{mem.Id}\" is a brace, or has a moment release or a rigid zone; a wall line is a plain chain of beam-columns",
                        "list only the wall's own members (beam-columns without releases or rigid zones)");
                    ok = false; continue;
                }
                var (lo, hi) = nodes[mem.Start].Y <= nodes[mem.End].Y ? (mem.Start, mem.End) : (mem.End, mem.Start);
                double tolx = 1e-9 * Math.Max(1.0, Math.Abs(nodes[hi].Y - nodes[lo].Y));
                if (Math.Abs(nodes[lo].X - nodes[hi].X) > tolx || (!double.IsNaN(x0) && Math.Abs(nodes[lo].X - x0) > tolx))
                {
                    sink.Add(tok, $"member \"{mem.Id}\" is not on the same vertical line as the rest of the wall line", "list only vertical members that stand one on top of the other");
                    ok = false; continue;
                }
                x0 = nodes[lo].X;
                if (top >= 0 && lo != top)
                {
                    sink.Add(tok, $"member \"{mem.Id}\" does not start where the previous member of the wall line ends (node \"{nodes[top].Id}\")",
                        "list the members from the base up, each starting at the node where the one before it ends");
                    ok = false; continue;
                }
                if (baseNode < 0) baseNode = lo;
                top = hi;
            }
            if (!ok) return null;
            var first = members[refs[0].Member];
            foreach (var (m, tok) in refs.Skip(1))
            {
                var mem = members[m];
                if (!Same(mem.E, first.E) || !Same(mem.G, first.G) || !Same(mem.A, first.A) || !Same(mem.I, first.I) || !Same(mem.ShearArea, first.ShearArea))
                {
                    sink.Add(tok, $"member \"{mem.Id}\" has other properties (section, material or modifiers) than \"{first.Id}\"; the hand pier formula needs one section over the height",
                        "check a wall line of one section, or split the line into checks of one section each");
                    return null;
                }
            }
            if (!double.IsFinite(first.ShearArea) || first.A / first.ShearArea < 1 - 1e-12)
            {
                sink.Add(refs[0].At, $"member \"{first.Id}\" has {(double.IsFinite(first.ShearArea) ? "a shear area larger than its area" : "no shear area")}; the hand pier formula needs a shear form factor f = A/A_s ≥ 1",
                    "give the wall a rectangle section (shear area A/1.2 or Cowper's) or a general section with \"shearArea\" ≤ A");
                return null;
            }
            return new WallLineCheck(id, desc, tol, at, refs.Select(r => r.Member).ToArray(), baseNode, top, ends);

            static bool Same(double a, double b) => a == b || Math.Abs(a - b) <= 1e-12 * Math.Max(Math.Abs(a), Math.Abs(b));
        }

        private PerforatedWallCheck? ReadPerforatedWall(JsonFields f, string? id, string desc, double? tol, CheckLocation at)
        {
            string len = _units.LengthSymbol;
            double length = Positive(f, "length", Quantity.Length, "wall length", $"give the wall's length (parallel to the force) > 0 in {len}");
            double height = Positive(f, "height", Quantity.Length, "wall height", $"give the wall's height > 0 in {len}");
            double thick = Positive(f, "thickness", Quantity.Length, "wall thickness", $"give the wall's thickness > 0 in {len}");
            var mat = ReadMaterialRef(f);
            double factor = ReadShearFactor(f);
            const string efix = "give \"ends\": \"cantilever\" (the default) or \"fixed-fixed\"";
            var endsText = f.OptionalString("ends", efix) ?? "cantilever";
            var ends = endsText switch { "cantilever" => CheckEnds.Cantilever, "fixed-fixed" => CheckEnds.FixedFixed, _ => (CheckEnds)(-1) };
            if ((int)ends < 0) sink.Add(f.Token("ends"), $"unknown end condition \"{endsText}\"", efix);

            var openings = new List<(OpeningSpec Spec, JsonMap At)>();
            int n = 0;
            foreach (var oo in f.Objects("openings", false, "write \"openings\": [ {\"label\": \"door\", \"x\": ..., \"y\": 0, \"width\": ..., \"height\": ...} ]"))
            {
                n++;
                var of = new JsonFields(oo, sink);
                var label = of.OptionalString("label", "give the opening a label as a string") ?? $"opening {n}";
                double x = SI(of.RequiredNumber("x", $"give x, the opening's left edge from the wall's left end, in {len}"), Quantity.Length);
                double y = SI(of.RequiredNumber("y", $"give y, the opening's bottom edge above the wall's base (0 for a door), in {len}"), Quantity.Length);
                double w = Positive(of, "width", Quantity.Length, "opening width", $"give the opening's width > 0 in {len}");
                double h = Positive(of, "height", Quantity.Length, "opening height", $"give the opening's height > 0 in {len}");
                of.RejectUnknownKeys();
                if (!(double.IsFinite(x) && double.IsFinite(y) && w > 0 && h > 0)) continue;
                openings.Add((new OpeningSpec(label, x, y, w, h), oo));
            }
            if (id is null || mat is null || !(length > 0 && height > 0 && thick > 0) || (int)ends < 0 || !(factor >= 1)) return null;

            bool ok = true;
            double eps = 1e-9 * Math.Max(length, height);
            string L(double v) => $"{_units.FromSI(v, Quantity.Length):G6} {len}";
            foreach (var (o, tok) in openings)
            {
                if (o.X < -eps || o.Y < -eps || o.X + o.Width > length + eps || o.Y + o.Height > height + eps)
                {
                    sink.Add(tok, $"opening '{o.Label}' (x {L(o.X)} to {L(o.X + o.Width)}, y {L(o.Y)} to {L(o.Y + o.Height)}) lies partly outside the wall ({L(length)} long, {L(height)} high)",
                        "move or resize the opening so that it lies within the wall");
                    ok = false;
                }
                else if (o.X <= eps || o.X + o.Width >= length - eps)
                {
                    sink.Add(tok, $"opening '{o.Label}' reaches the end of the wall, leaving a pier of zero width there",
                        "leave solid wall between the opening and the wall's end, or shorten the wall to end at the opening");
                    ok = false;
                }
            }
            for (int i = 0; i < openings.Count; i++)
                for (int j = i + 1; j < openings.Count; j++)
                {
                    var (a, _) = openings[i];
                    var (b, tb) = openings[j];
                    double ox = Math.Min(a.X + a.Width, b.X + b.Width) - Math.Max(a.X, b.X);
                    double oy = Math.Min(a.Y + a.Height, b.Y + b.Height) - Math.Max(a.Y, b.Y);
                    if (ox > eps && oy > eps)
                    {
                        sink.Add(tb, $"openings '{a.Label}' and '{b.Label}' overlap", "describe the combined hole as one opening, or move them apart");
                        ok = false;
                    }
                    else if (Math.Abs(ox) <= eps && oy > eps)
                    {
                        sink.Add(tb, $"openings '{a.Label}' and '{b.Label}' touch side by side, leaving a pier of zero width between them",
                            "merge them into one opening, or leave solid wall between them");
                        ok = false;
                    }
                }
            if (!ok) return null;
            return new PerforatedWallCheck(id, desc, tol, at, length, height, thick, mat, factor, ends, openings.Select(o => o.Spec).ToArray());
        }

        private FrameStoriesCheck? ReadFrameStories(JsonFields f, string? id, string desc, double? tol, CheckLocation at, List<Member> members, List<Support> supports)
        {
            var refs = MemberRefs(f, "members", "frame's columns and beams");
            var storyList = new List<(double, JsonNode)>();
            const string sfix = "give \"stories\": [1, 2, ...], story numbers counted from the base (1 = ground story); leave it out to check every story";
            storyList = Numbers(f, "stories", sfix);
            string fu = _units.ForceSymbol;
            string pfix = $"give \"pattern\": one lateral force per level above the base, bottom first, in {fu} (each ≥ 0); leave it out for a unit force at every level";
            var pattern = Numbers(f, "pattern", pfix);
            if (id is null || refs.Count == 0) return null;

            var nodes = _nodesList!;
            bool ok = true;
            var seenMembers = new HashSet<int>();
            var columns = new List<(Member M, JsonNode At)>();
            var beams = new List<(Member M, JsonNode At)>();
            foreach (var (m, tok) in refs)
            {
                var mem = members[m];
                if (!seenMembers.Add(m)) { sink.Add(tok, $"member \"{mem.Id}\" is listed twice", "list each member once"); ok = false; continue; }
                if (mem.Kind != MemberKind.BeamColumn)
                {
                    sink.Add(tok, $"member \"{mem.Id}\" is a brace; a moment-frame check takes beam-columns only", "leave braces out of the frame's member list");
                    ok = false; continue;
                }
                var a = nodes[mem.Start]; var b = nodes[mem.End];
                double scale = Math.Max(Math.Abs(b.X - a.X), Math.Abs(b.Y - a.Y));
                if (Math.Abs(b.X - a.X) <= 1e-9 * scale) columns.Add((mem, tok));
                else if (Math.Abs(b.Y - a.Y) <= 1e-9 * scale) beams.Add((mem, tok));
                else { sink.Add(tok, $"member \"{mem.Id}\" is neither vertical (a column) nor horizontal (a beam)", "list only the frame's columns and beams"); ok = false; }
            }
            if (!ok) return null;
            if (columns.Count == 0) { sink.Add(f.Token("members"), "the frame has no columns (vertical members)", "list the frame's columns and beams"); return null; }

            var levels = new List<double>();
            foreach (var y in columns.SelectMany(c => new[] { nodes[c.M.Start].Y, nodes[c.M.End].Y }).Order())
                if (levels.Count == 0 || y - levels[^1] > 1e-9 * Math.Max(1.0, Math.Abs(y))) levels.Add(y);
            int Level(double y) => levels.FindIndex(l => Math.Abs(l - y) <= 1e-9 * Math.Max(1.0, Math.Abs(y)));
            int stories = levels.Count - 1;
            var perStory = new int[Math.Max(stories, 0)];
            foreach (var (c, tok) in columns)
            {
                int l0 = Level(Math.Min(nodes[c.Start].Y, nodes[c.End].Y)), l1 = Level(Math.Max(nodes[c.Start].Y, nodes[c.End].Y));
                if (l1 != l0 + 1)
                {
                    sink.Add(tok, $"column \"{c.Id}\" spans {l1 - l0} stories; story checks need one column member per story",
                        "split the column at every floor level the frame has (add a node there)");
                    ok = false;
                }
                else perStory[l0]++;
            }
            // Column joints at each level, left to right: a beam must join two neighbours (one beam member per bay).
            var joints = new List<int>[levels.Count];
            for (int l = 0; l < levels.Count; l++) joints[l] = [];
            foreach (var (c, _) in columns)
                foreach (int nn in new[] { c.Start, c.End })
                {
                    int l = Level(nodes[nn].Y);
                    if (l >= 0 && !joints[l].Contains(nn)) joints[l].Add(nn);
                }
            foreach (var j in joints) j.Sort((p, q) => nodes[p].X.CompareTo(nodes[q].X));
            foreach (var (bm, tok) in beams)
            {
                int l = Level(nodes[bm.Start].Y);
                if (l <= 0)
                {
                    sink.Add(tok, $"beam \"{bm.Id}\" is not at a floor level above the base of the frame's columns", "list only the beams that frame into the columns' tops");
                    ok = false;
                    continue;
                }
                int i1 = joints[l].IndexOf(bm.Start), i2 = joints[l].IndexOf(bm.End);
                if (i1 < 0 || i2 < 0 || Math.Abs(i1 - i2) != 1)
                {
                    sink.Add(tok, $"beam \"{bm.Id}\" does not join two neighbouring column joints; the story methods need one beam member per bay, from column to column",
                        "model each bay's beam as one member from one column's joint to the next");
                    ok = false;
                }
            }
            for (int s = 0; s < stories; s++)
                if (perStory[s] < 2)
                {
                    sink.Add(f.Token("members"), $"story {s + 1} of the frame has {perStory[s]} column(s); the story methods need at least two", "list every column of the frame, story by story");
                    ok = false;
                }
            // Column bases: all fixed or all pinned.
            var baseNodes = columns.Select(c => nodes[c.M.Start].Y <= nodes[c.M.End].Y ? c.M.Start : c.M.End).Where(nn => Level(nodes[nn].Y) == 0).Distinct().ToList();
            var kinds = new HashSet<string>();
            foreach (var bn in baseNodes)
            {
                var sup = supports.FirstOrDefault(s => s.Node == bn);
                string k = sup is null ? "none" : sup.RestrainX && sup.RestrainY && sup.RestrainRZ && sup.SpringRZ == 0 ? "fixed" : sup.RestrainX && sup.RestrainY && !sup.RestrainRZ && sup.SpringRZ == 0 ? "pinned" : "other";
                if (k is "none" or "other")
                {
                    sink.Add(f.Token("members"), $"the frame's column base at node \"{nodes[bn].Id}\" is {(k == "none" ? "not supported" : "neither fixed nor pinned")}; the story checks need fixed or pinned column bases",
                        "give each column base a \"fixed\" or \"pinned\" support");
                    ok = false;
                }
                kinds.Add(k);
            }
            if (kinds.Count > 1 && !kinds.Contains("none") && !kinds.Contains("other"))
            {
                sink.Add(f.Token("members"), "the frame mixes fixed and pinned column bases; the D-value method takes one kind per story", "use one kind of base support for the frame's columns");
                ok = false;
            }
            var frameMembers = columns.Concat(beams).ToList();
            if (frameMembers.Any(c => c.M.E != frameMembers[0].M.E))
            {
                sink.Add(f.Token("members"), "the frame's members have different Young's moduli; the D-value method takes one E", "check a frame of one material");
                ok = false;
            }
            var storyNumbers = new List<int>();
            foreach (var (v, tok) in storyList)
            {
                if (v != Math.Floor(v) || v < 1 || v > stories) { sink.Add(tok, $"story {v} does not exist; the frame has stories 1 to {stories}", sfix); ok = false; }
                else if (storyNumbers.Contains((int)v)) { sink.Add(tok, $"story {v} is listed twice", sfix); ok = false; }
                else storyNumbers.Add((int)v);
            }
            if (!f.Has("stories")) storyNumbers.AddRange(Enumerable.Range(1, stories));
            else if (f.Token("stories") is JsonList { Count: 0 } noStories) { sink.Add(noStories, "'stories' is empty, so the check would report nothing", sfix); ok = false; }
            var forces = new List<double>();
            if (f.Has("pattern"))
            {
                if (pattern.Count != stories) { sink.Add(f.Token("pattern"), $"'pattern' has {pattern.Count} forces; the frame has {stories} levels above its base", pfix); ok = false; }
                foreach (var (v, tok) in pattern) if (v < 0) { sink.Add(tok, $"a negative force {v} in 'pattern'", pfix); ok = false; }
                if (pattern.Count > 0 && pattern.All(p => p.Value == 0)) { sink.Add(f.Token("pattern"), "every force in 'pattern' is zero", pfix); ok = false; }
                forces.AddRange(pattern.Select(p => SI(p.Value, Quantity.Force)));
            }
            else forces.AddRange(Enumerable.Repeat(SI(1.0, Quantity.Force), stories));
            if (!ok) return null;
            return new FrameStoriesCheck(id, desc, tol, at, frameMembers.Select(c => c.M.Index).ToArray(), levels, storyNumbers.Order().ToArray(), forces);
        }

        private ShearSplitCheck? ReadShearSplit(JsonFields f, string? id, string desc, double? tol, CheckLocation at, List<(ShearSplitCheck, List<JsonNode>)> splits)
        {
            var caseId = f.RequiredString("loadCase", "give the id of the load case whose story shears are split");
            int ci = -1;
            if (caseId is not null && !_cases.TryGetValue(caseId, out ci))
            {
                sink.Add(f.Token("loadCase"), $"unknown load case \"{caseId}\"", $"use the id of a load case listed under \"loadCases\"{Suggest(caseId, _cases.Keys)}");
                ci = -1;
            }
            const string lfix = "write \"lines\": [ {\"label\": \"wall grid 1\", \"check\": \"<wall-line check id>\"}, {\"label\": \"frame grid 3\", \"check\": \"<frame-stories check id>\"} ]";
            var lines = new List<SplitLine>();
            var tokens = new List<JsonNode>();
            var lineObjects = f.Objects("lines", true, lfix);
            foreach (var lo in lineObjects)
            {
                var lf = new JsonFields(lo, sink);
                var cid = lf.RequiredString("check", "give the id of the wall-line or frame-stories check that describes this line");
                var label = lf.OptionalString("label", "give the line a label as a string");
                lf.RejectUnknownKeys();
                if (cid is null) continue;
                if (lines.Any(l => l.CheckId == cid)) { sink.Add(lf.Token("check"), $"check \"{cid}\" is named by two lines", "name each line's check once"); continue; }
                lines.Add(new SplitLine(label ?? cid, cid));
                tokens.Add(lf.Token("check")!);
            }
            if (f.Token("lines") is JsonList && lineObjects.Count < 2) sink.Add(f.Token("lines"), "a shear split needs at least two lines", lfix);
            if (id is null || ci < 0 || lines.Count < 2) return null;
            var check = new ShearSplitCheck(id, desc, tol, at, ci, lines);
            splits.Add((check, tokens));
            return check;
        }
    }
}
