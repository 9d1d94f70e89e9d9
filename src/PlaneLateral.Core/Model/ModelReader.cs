using Newtonsoft.Json;
using Newtonsoft.Json.Linq;
using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>
/// Reads a PlaneLateral model file (JSON, format version 1; see docs/model-format.md) into a validated
/// <see cref="StructureModel"/> in SI units. Every problem in the file is collected and reported together
/// in one <see cref="ModelInputException"/>; the file is only read, never changed.
/// </summary>
public static partial class ModelReader
{
    /// <summary>The format version this reader understands.</summary>
    public const int FormatVersion = 1;

    /// <summary>Reads and validates a model file.</summary>
    /// <exception cref="ModelInputException">The file is missing, is not valid JSON, or describes an unusable model.</exception>
    public static StructureModel ReadFile(string path)
    {
        // Only a regular file, at most ModelLimits.MaxFileBytes counted while reading (ModelFile.cs).
        string text = ModelFile.ReadText(path, out var input);
        return Parse(text, path) with { Inputs = [input] };
    }

    /// <summary>Reads and validates a model from JSON text; <paramref name="fileName"/> is used in messages.</summary>
    public static StructureModel Parse(string json, string fileName = "<model>") => ParseTree(ReadTree(json, fileName), fileName);

    /// <summary>
    /// A model file read once (regular files only, bounded, its SHA-256 taken: ModelFile.cs) and parsed once into its
    /// JSON tree, strictly as every model is (<see cref="ReadTree"/>); <see cref="ModelSource.IsPlan"/> says which reader
    /// takes it: <see cref="Read(ModelSource)"/> or <see cref="ReadPlan(ModelSource)"/>. A command that accepts both a
    /// planar model and a building reads the file through this, not <see cref="IsPlanFile"/> and then the reader (which
    /// read, hashed and tokenised the file twice).
    /// </summary>
    /// <exception cref="ModelInputException">The file cannot be read, is too large or is not valid JSON (the same messages as <see cref="ReadFile"/>).</exception>
    public static ModelSource ReadSource(string path)
    {
        string text = ModelFile.ReadText(path, out var input);
        return new ModelSource(path, input, ReadTree(text, path));
    }

    /// <summary>Validates a planar model read by <see cref="ReadSource"/>; the same result as <see cref="ReadFile"/> on its path.</summary>
    public static StructureModel Read(ModelSource source) => ParseTree(source.Root, source.Path) with { Inputs = [source.Input] };

    private static StructureModel ParseTree(JsonNode root, string fileName)
    {
        var sink = new DiagnosticSink(fileName);
        if (root is not JsonMap obj)
        {
            sink.Add(root, $"the model must be a JSON object {{...}}, found {JsonFields.Describe(root)}", "wrap the model in { } with keys such as \"formatVersion\", \"nodes\" and \"members\"");
            throw new ModelInputException(sink.Items);
        }

        if (ModelLimits.CheckCounts(obj, sink)) throw new ModelInputException(sink.Items);
        SuggestBudget.Reset();
        var model = new Builder(sink, fileName).Build(obj);
        if (sink.Any) throw new ModelInputException(sink.Items);
        return model! with { Warnings = Plausibility.Check(model, obj, fileName) };
    }

    /// <summary>
    /// The JSON tree of a model text (a planar model, a building file or a line file), with line information: at most
    /// <see cref="ModelLimits.MaxFileBytes"/>, RFC 8259 only plus the comments the docs allow (the lenient forms the tree
    /// builder would accept are refused first, StrictJson.cs), no text after the top-level value, no duplicate keys.
    /// </summary>
    /// <exception cref="ModelInputException">The text is too large or not valid JSON, with line, column and path.</exception>
    internal static JsonNode ReadTree(string json, string fileName)
    {
        if (ModelLimits.CheckFileSize(fileName, json.Length) is { } tooLarge) throw new ModelInputException([tooLarge]);
        // Strict JSON in the common case: checked and built in one pass (JsonTreeReader.cs). Anything else, and every
        // error, takes the path below, so its messages, lines, columns and paths stay as they were.
        if (JsonTreeReader.TryRead(json) is { } tree) return tree;
        var strict = StrictJson.Check(json);
        if (strict is { Lenient: true }) throw NotJson(fileName, strict);
        JToken root;
        try
        {
            using var reader = new JsonTextReader(new StringReader(json)) { DateParseHandling = DateParseHandling.None, FloatParseHandling = FloatParseHandling.Double };
            root = JToken.ReadFrom(reader, new JsonLoadSettings
            {
                LineInfoHandling = LineInfoHandling.Load,
                DuplicatePropertyNameHandling = DuplicatePropertyNameHandling.Error,
                CommentHandling = CommentHandling.Ignore,
            });
            if (reader.Read() && reader.TokenType != JsonToken.Comment)
                throw new JsonReaderException("Additional text found after the end of the model object.", reader.Path, reader.LineNumber, reader.LinePosition, null);
        }
        catch (JsonReaderException e)
        {
            string path = string.IsNullOrEmpty(e.Path) ? "$" : (e.Path.StartsWith('[') ? "$" + e.Path : "$." + e.Path);
            throw new ModelInputException([new ModelDiagnostic(fileName, e.LineNumber, e.LinePosition, path,
                "the file is not valid JSON: " + StripLocation(e.Message), "correct the JSON syntax at that place (a missing comma, quote or bracket is the usual cause)")]);
        }
        if (strict is not null) throw NotJson(fileName, strict);
        return JsonTreeReader.FromReference(root);
    }

    private static ModelInputException NotJson(string fileName, StrictJson.Problem p) =>
        new([new ModelDiagnostic(fileName, p.Line, p.Column, p.Path, "the file is not valid JSON: " + p.Message, p.Fix)]);

    private static string StripLocation(string message)
    {
        int i = message.IndexOf(" Path '", StringComparison.Ordinal);
        if (i < 0) i = message.IndexOf(", line ", StringComparison.Ordinal);
        return (i > 0 ? message[..i] : message).TrimEnd('.', ' ');
    }

    private sealed partial class Builder(DiagnosticSink sink, string fileName)
    {
        private UnitSystem _units = UnitSystem.KipInch;
        private readonly Dictionary<string, Material> _materials = new(StringComparer.Ordinal);
        private readonly Dictionary<string, (Section Section, JsonMap At)> _sections = new(StringComparer.Ordinal);
        private readonly Dictionary<string, int> _nodes = new(StringComparer.Ordinal);
        private readonly Dictionary<string, int> _members = new(StringComparer.Ordinal);
        private readonly Dictionary<string, int> _cases = new(StringComparer.Ordinal);

        // Ids of entries that were declared but failed to read: references to them are not reported again.
        private readonly HashSet<string> _unusable = new(StringComparer.Ordinal);

        private double SI(double v, Quantity q) => _units.ToSI(v, q);

        public StructureModel? Build(JsonMap root)
        {
            var f = new JsonFields(root, sink);
            f.OptionalString("$schema", "give \"$schema\" as the path or address of the schema file, a string");
            f.OptionalString("description", "give a short description as a string");
            // Expected values and their published source, for verification models; read by the tests, not by the analysis.
            f.OptionalObject("reference", "give \"reference\" as an object {\"source\": ..., \"values\": [...]}");
            var title = f.OptionalString("title", "give the model a title as a string") ?? Path.GetFileNameWithoutExtension(fileName);
            ReadFormatVersion(f);
            ReadUnits(f);

            var materials = ReadMaterials(f.Objects("materials", true, "add \"materials\": [ {\"id\": \"...\", \"E\": ..., \"nu\": ...} ]"));
            bool checksOnly = ComparisonsOnly(root); // self-contained checks need no frame (ModelReader.Comparisons.cs)
            var sections = ReadSections(f.Objects("sections", !checksOnly, "add \"sections\": [ {\"id\": \"...\", \"shape\": \"rectangle\", \"b\": ..., \"d\": ...} ]"));
            bool hasPanels = HasPanels(root) || checksOnly; // a model with wall panels may have no nodes, members or supports (ModelReader.Panels.cs)
            var nodes = ReadNodes(f.Objects("nodes", !hasPanels, "add \"nodes\": [ {\"id\": \"...\", \"x\": ..., \"y\": ...} ]"));
            var members = ReadMembers(f.Objects("members", !hasPanels, "add \"members\": [ {\"id\": \"...\", \"start\": \"...\", \"end\": \"...\", \"section\": \"...\", \"material\": \"...\"} ]"), nodes);
            var supportsArr = f.Objects("supports", !hasPanels, "add \"supports\": [ {\"node\": \"...\", \"type\": \"fixed\"} ]");
            var supports = ReadSupports(supportsArr);
            CheckAxiallyRigid(members, supports, nodes);   // ModelReader.AxiallyRigid.cs
            var footings = ReadFootings(f, supports, members, nodes);   // footing springs replace support restraints (ModelReader.Footings.cs)
            if (f.Token("supports") is JsonList { Count: 0 } emptySupports && !hasPanels)
                sink.Add(emptySupports, "the model has no supports, so it is free to move as a rigid body", "add at least one support, e.g. {\"node\": \"<base node>\", \"type\": \"fixed\"}");
            var cases = ReadLoadCases(f.Objects("loadCases", false, "give \"loadCases\" as an array of objects"), members);
            ReadSeismicCase(f, cases);
            var combos = ReadCombinations(f.Objects("combinations", false, "give \"combinations\" as an array of objects"), cases);
            var points = ReadStiffnessPoints(f.Objects("stiffnessAt", false, "give \"stiffnessAt\" as an array of {\"node\": \"...\", \"direction\": \"x\"}"), supports);
            var building = ReadBuilding(f, root, nodes, members, supports, cases, combos);
            var seismic = ReadSeismic(f, building, nodes, supports, cases, combos);
            var comparisons = ReadComparisons(f.Objects("comparisons", false, "give \"comparisons\" as an array of checks, e.g. [{\"id\": \"...\", \"kind\": \"wall-line\", \"members\": [...]}] (docs/comparisons.md)"), members, supports, cases);
            var panels = ReadPanels(f.Objects("panels", false, "give \"panels\" as an array of objects"), materials);
            CheckPanelWalls(root, panels);
            CheckPanelFootings(footings, panels);   // ModelReader.Footings.cs
            CheckPanelLinkSupports(supports);   // ModelReader.PanelLinks.cs
            f.RejectUnknownKeys();

            CheckConnectivity(nodes, members);
            if (cases.Count == 0 && points.Count == 0 && panels.Count == 0 && !checksOnly && !_partOfBuilding)
                sink.Add(root, "the model has neither load cases nor stiffness points, so there is nothing to solve",
                    "add \"loadCases\" (e.g. a lateral load at the roof) or \"stiffnessAt\": [{\"node\": \"<roof node>\", \"direction\": \"x\"}]");

            if (sink.Any) return null;
            return new StructureModel
            {
                Title = title,
                SourcePath = fileName,
                Units = _units,
                Materials = materials,
                Sections = sections,
                Nodes = nodes,
                Members = members,
                Supports = supports,
                LoadCases = cases,
                Combinations = combos,
                StiffnessPoints = points,
                Building = building,
                Comparisons = comparisons,
                Panels = panels,
                Seismic = seismic,
                Footings = footings,
            };
        }

        private void ReadFormatVersion(JsonFields f)
        {
            var t = f.Token("formatVersion");
            const string fix = "add \"formatVersion\": 1 at the top of the model";
            if (t is null) { sink.Add(f.Object, "missing required key 'formatVersion'", fix); return; }
            // Compared as a JSON value: an integer wider than 64 bits is a BigInteger and must not be cast to long.
            if (t is not JsonScalar { Value: long v } || v != FormatVersion)
                sink.Add(t, $"'formatVersion' is {(t.Type is JsonKind.Integer or JsonKind.Float ? JsonFields.NumberText(t) : t.ToCompactJson())}; this version of PlaneLateral reads format version {FormatVersion}", fix);
        }

        private void ReadUnits(JsonFields f)
        {
            var o = f.OptionalObject("units", "write \"units\": {\"force\": \"kip\", \"length\": \"in\"}");
            if (o is null) return;
            var u = new JsonFields(o, sink);
            var force = ForceUnit.Kip;
            var length = LengthUnit.Inch;
            string fs = u.OptionalString("force", "use one of: " + string.Join(", ", UnitSystem.ForceSymbols)) ?? "kip";
            if (!UnitSystem.TryParseForce(fs, out force))
            {
                force = ForceUnit.Kip; // keep the default for the wording of later messages
                sink.Add(u.Token("force"), $"unknown force unit \"{fs}\"", "use one of: " + string.Join(", ", UnitSystem.ForceSymbols));
            }
            string ls = u.OptionalString("length", "use one of: " + string.Join(", ", UnitSystem.LengthSymbols)) ?? "in";
            if (!UnitSystem.TryParseLength(ls, out length))
            {
                length = LengthUnit.Inch;
                sink.Add(u.Token("length"), $"unknown length unit \"{ls}\"", "use one of: " + string.Join(", ", UnitSystem.LengthSymbols));
            }
            u.RejectUnknownKeys();
            _units = new UnitSystem(force, length);
        }

        private string? ReadId(JsonFields f, ISet<string> seen, string what)
        {
            var id = f.RequiredString("id", $"give every {what} a unique \"id\" string");
            if (id is not null && !seen.Add(id))
                sink.Add(f.Token("id"), $"duplicate {what} id \"{id}\"", $"give each {what} its own id");
            return id;
        }

        private double Positive(JsonFields f, string key, Quantity q, string what, string fix)
        {
            double v = f.RequiredNumber(key, fix);
            if (double.IsFinite(v) && v <= 0)
                sink.Add(f.Token(key), $"{what} '{key}' must be greater than zero, found {v}", fix);
            return SI(v, q);
        }

        private List<Material> ReadMaterials(IReadOnlyList<JsonMap> items)
        {
            var list = new List<Material>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "material");
                double e = Positive(f, "E", Quantity.Stress, "Young's modulus", $"give E > 0 in {_units.Label(Quantity.Stress)}");
                bool hasNu = f.Has("nu"), hasG = f.Has("G");
                double nu = double.NaN, g = double.NaN;
                if (hasNu && hasG)
                    sink.Add(o, "both 'nu' and 'G' are given", "give Poisson's ratio 'nu' or the shear modulus 'G', not both");
                else if (hasG)
                {
                    g = Positive(f, "G", Quantity.Stress, "shear modulus", $"give G > 0 in {_units.Label(Quantity.Stress)}");
                    nu = e / (2 * g) - 1;
                    if (double.IsFinite(nu) && !(nu > -1 && nu < 0.5))
                        sink.Add(f.Token("G"), $"E and G imply Poisson's ratio {nu:0.###}, outside (−1, 0.5)", "check E and G: an isotropic material needs G > E/3 (Poisson's ratio E/(2G) − 1 between −1 and 0.5)");
                }
                else if (hasNu)
                {
                    nu = f.RequiredNumber("nu", "give Poisson's ratio as a number");
                    if (double.IsFinite(nu) && !(nu > -1 && nu < 0.5))
                        sink.Add(f.Token("nu"), $"Poisson's ratio {nu} is outside (−1, 0.5)", "give nu between −1 and 0.5 (0.2 concrete, 0.25 masonry, 0.3 steel are usual)");
                    g = e / (2 * (1 + nu));
                }
                else
                    sink.Add(o, "the material has neither 'nu' nor 'G'", "add Poisson's ratio \"nu\" (G = E/(2(1+nu)) is then used) or the shear modulus \"G\"");
                f.OptionalString("description", "give a description as a string");
                f.RejectUnknownKeys();
                if (id is not null)
                {
                    var m = new Material(id, e, g, nu);
                    _materials[id] = m;
                    list.Add(m);
                }
            }
            return list;
        }

        private List<Section> ReadSections(IReadOnlyList<JsonMap> items)
        {
            var list = new List<Section>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "section");
                var shape = f.RequiredString("shape", "give \"shape\": \"rectangle\", \"I\" or \"general\"");
                f.OptionalString("description", "give a description as a string");
                Section? s = shape switch
                {
                    "rectangle" => Rectangle(f, id),
                    "I" => IShape(f, id),
                    "general" => General(f, id),
                    null => null,
                    _ => Unknown(f, shape),
                };
                if (s is not null) f.RejectUnknownKeys(); // with an unknown shape, its keys cannot be judged
                else if (id is not null) _unusable.Add("section:" + id);
                if (id is not null && s is not null)
                {
                    _sections[id] = (s, o);
                    list.Add(s);
                }
            }
            return list;
        }

        private Section? Unknown(JsonFields f, string shape)
        {
            sink.Add(f.Token("shape"), $"unknown section shape \"{shape}\"", "use \"rectangle\" (b, d), \"I\" (d, bf, tf, tw) or \"general\" (A, I, shearArea)");
            return null;
        }

        private Section Rectangle(JsonFields f, string? id)
        {
            string len = _units.Label(Quantity.Length);
            double b = Positive(f, "b", Quantity.Length, "rectangle width", $"give the width b (out of plane, e.g. wall thickness) > 0 in {len}");
            double d = Positive(f, "d", Quantity.Length, "rectangle depth", $"give the depth d (in the plane of bending, e.g. wall length) > 0 in {len}");
            var rule = ShearAreaRule.FormFactor;
            double factor = 1.2;
            var t = f.Token("shearFactor");
            const string fix = "give \"shearFactor\" as a number ≥ 1 (1.2 is the usual value for a rectangle) or the string \"cowper\"";
            if (t is not null)
            {
                if (t.Type == JsonKind.String && (string)t! == "cowper") rule = ShearAreaRule.CowperRectangle;
                else if (t.Type is JsonKind.Integer or JsonKind.Float && (double)t >= 1.0 && double.IsFinite((double)t)) factor = (double)t;
                else sink.Add(t, $"'shearFactor' must be a number ≥ 1 or \"cowper\", found {JsonFields.Describe(t)}", fix);
            }
            return new Section(id ?? "", "rectangle", b * d, b * d * d * d / 12.0, rule, double.NaN, factor, d);
        }

        private Section IShape(JsonFields f, string? id)
        {
            string len = _units.Label(Quantity.Length);
            double d = Positive(f, "d", Quantity.Length, "overall depth", $"give d > 0 in {len}");
            double bf = Positive(f, "bf", Quantity.Length, "flange width", $"give bf > 0 in {len}");
            double tf = Positive(f, "tf", Quantity.Length, "flange thickness", $"give tf > 0 in {len}");
            double tw = Positive(f, "tw", Quantity.Length, "web thickness", $"give tw > 0 in {len}");
            if (d <= 2 * tf) sink.Add(f.Token("tf"), "two flanges are as deep as the whole section (2·tf ≥ d)", "check d and tf");
            if (tw > bf) sink.Add(f.Token("tw"), "the web is wider than the flanges (tw > bf)", "check tw and bf");
            double hw = d - 2 * tf;
            double a = 2 * bf * tf + hw * tw;
            double i = (bf * d * d * d - (bf - tw) * hw * hw * hw) / 12.0;
            // Shear area of a wide-flange section taken as d·tw: common practice.
            double asv = d * tw;
            if (f.Has("shearArea")) asv = Positive(f, "shearArea", Quantity.Area, "shear area", $"give shearArea > 0 in {_units.Label(Quantity.Area)}");
            return new Section(id ?? "", "I", a, i, ShearAreaRule.Given, asv, double.NaN, d);
        }

        private Section General(JsonFields f, string? id)
        {
            double a = Positive(f, "A", Quantity.Area, "area", $"give A > 0 in {_units.Label(Quantity.Area)}");
            double i = Positive(f, "I", Quantity.SecondMomentOfArea, "second moment of area", $"give I > 0 in {_units.Label(Quantity.SecondMomentOfArea)}");
            double asv = double.PositiveInfinity;
            if (f.Has("shearArea")) asv = Positive(f, "shearArea", Quantity.Area, "shear area", $"give shearArea > 0 in {_units.Label(Quantity.Area)}, or leave it out to ignore shear deformation");
            double depth = f.Has("depth") ? Positive(f, "depth", Quantity.Length, "depth", "give the section depth > 0, or leave it out") : double.NaN;
            return new Section(id ?? "", "general", a, i, ShearAreaRule.Given, asv, double.NaN, depth);
        }

        private List<Node> ReadNodes(IReadOnlyList<JsonMap> items)
        {
            var list = new List<Node>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var positions = new Dictionary<(double, double), string>();
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "node");
                double x = SI(f.RequiredNumber("x", $"give the x coordinate in {_units.LengthSymbol}"), Quantity.Length);
                double y = SI(f.RequiredNumber("y", $"give the y coordinate in {_units.LengthSymbol}"), Quantity.Length);
                f.RejectUnknownKeys();
                if (id is null || _nodes.ContainsKey(id)) continue;
                if (double.IsFinite(x) && double.IsFinite(y) && !positions.TryAdd((x, y), id))
                    sink.Add(o, $"node \"{id}\" stands at the same point as node \"{positions[(x, y)]}\"", "merge the two nodes, or move one of them; coincident nodes are not connected to each other");
                _nodes[id] = list.Count;
                _nodeObjects.Add(o);
                list.Add(new Node(list.Count, id, x, y));
            }
            _nodesList = list;
            return list;
        }

        private int NodeRef(JsonFields f, string key, string what)
        {
            var id = f.RequiredString(key, $"give the {what} as a node id");
            if (id is null) return -1;
            if (_nodes.TryGetValue(id, out int n)) return n;
            sink.Add(f.Token(key), $"unknown node \"{id}\"", $"use the id of a node listed under \"nodes\"{Suggest(id, _nodes.Keys)}");
            return -1;
        }

        /// <summary>The material named at "material" (required), or null with the problem reported (unknown id, with a suggestion).</summary>
        private Material? ReadMaterialRef(JsonFields f)
        {
            var id = f.RequiredString("material", "give the id of a material listed under \"materials\"");
            if (id is null) return null;
            if (_materials.TryGetValue(id, out var mat)) return mat;
            sink.Add(f.Token("material"), $"unknown material \"{id}\"", $"use the id of a material listed under \"materials\"{Suggest(id, _materials.Keys)}");
            return null;
        }

        /// <summary>The optional "shearFactor" of a check (default 1.2, a rectangle); a value below 1 is reported and read as NaN.</summary>
        private double ReadShearFactor(JsonFields f)
        {
            const string fix = "give \"shearFactor\" as a number ≥ 1 (1.2, the default, for a rectangle)";
            double factor = f.OptionalNumber("shearFactor", 1.2, fix);
            if (double.IsFinite(factor) && factor < 1) { sink.Add(f.Token("shearFactor"), $"'shearFactor' is {factor}, below 1", fix); return double.NaN; }
            return factor;
        }

        private static string Suggest(string id, IEnumerable<string> known) => SuggestBudget.Suggest(id, known);

        private List<Member> ReadMembers(IReadOnlyList<JsonMap> items, List<Node> nodes)
        {
            var list = new List<Member>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "member");
                int a = NodeRef(f, "start", "start node");
                int b = NodeRef(f, "end", "end node");
                var kindText = f.OptionalString("kind", "give \"kind\": \"beam-column\" or \"brace\"") ?? "beam-column";
                var kind = MemberKind.BeamColumn;
                if (kindText == "brace") kind = MemberKind.Brace;
                else if (kindText != "beam-column")
                    sink.Add(f.Token("kind"), $"unknown member kind \"{kindText}\"", "use \"beam-column\" (axial, shear and bending; the default) or \"brace\" (axial only)");

                var secId = f.RequiredString("section", "give the id of a section listed under \"sections\"");
                (Section Section, JsonMap At) sec = default;
                if (secId is not null && !_sections.TryGetValue(secId, out sec) && !_unusable.Contains("section:" + secId))
                    sink.Add(f.Token("section"), $"unknown section \"{secId}\"", $"use the id of a section listed under \"sections\"{Suggest(secId, _sections.Keys)}");
                var mat = ReadMaterialRef(f);

                bool relStart = false, relEnd = false;
                if (f.Token("momentReleases") is { } rel)
                {
                    const string fix = "write \"momentReleases\": [\"start\"], [\"end\"] or [\"start\", \"end\"]";
                    if (rel is not JsonList ra) sink.Add(rel, "'momentReleases' must be an array", fix);
                    else
                        foreach (var r in ra)
                        {
                            if (r.Type == JsonKind.String && (string)r! == "start") relStart = true;
                            else if (r.Type == JsonKind.String && (string)r! == "end") relEnd = true;
                            else sink.Add(r, $"unknown end {JsonFields.Describe(r)} in 'momentReleases'", fix);
                        }
                }

                double rigidStart = 0, rigidEnd = 0;
                if (f.OptionalObject("rigidZones", "write \"rigidZones\": {\"start\": <length>, \"end\": <length>}") is { } rz)
                {
                    var rf = new JsonFields(rz, sink);
                    rigidStart = SI(rf.OptionalNumber("start", 0, $"give the rigid length at the start in {_units.LengthSymbol}"), Quantity.Length);
                    rigidEnd = SI(rf.OptionalNumber("end", 0, $"give the rigid length at the end in {_units.LengthSymbol}"), Quantity.Length);
                    if (rigidStart < 0 || rigidEnd < 0) sink.Add(rz, "a rigid zone length is negative", "give rigid zone lengths ≥ 0");
                    rf.RejectUnknownKeys();
                }

                var mods = StiffnessModifiers.None;
                if (f.OptionalObject("modifiers", "write \"modifiers\": {\"I\": 0.35, \"A\": 1.0, \"shearArea\": 1.0}") is { } mo)
                {
                    var mf = new JsonFields(mo, sink);
                    const string fix = "give a stiffness modifier > 0 (1 = as the section gives; e.g. 0.35 for a cracked wall's I)";
                    mods = new StiffnessModifiers(mf.OptionalNumber("I", 1, fix), mf.OptionalNumber("A", 1, fix), mf.OptionalNumber("shearArea", 1, fix));
                    foreach (var k in new[] { "I", "A", "shearArea" })
                        if (mf.Token(k) is { } mt && mt.Type is JsonKind.Integer or JsonKind.Float && !((double)mt > 0))
                            sink.Add(mt, $"stiffness modifier '{k}' must be greater than zero, found {mt}", fix);
                    mf.RejectUnknownKeys();
                }
                ReadLineTag(f);
                var role = f.OptionalString("role", "give a role such as \"wall\", \"column\", \"beam\", \"coupling-beam\" or \"brace\"") ?? (kind == MemberKind.Brace ? "brace" : "");
                bool axiallyRigid = f.OptionalBool("axiallyRigid", false, "give \"axiallyRigid\": true (exactly inextensible, along x or y) or false");   // ModelReader.AxiallyRigid.cs
                f.RejectUnknownKeys();

                if (id is not null) _unusable.Add("member:" + id); // until it reads whole
                if (id is null || a < 0 || b < 0 || sec.Section is null || mat is null) continue;
                double length = Math.Sqrt(Math.Pow(nodes[b].X - nodes[a].X, 2) + Math.Pow(nodes[b].Y - nodes[a].Y, 2));
                if (a == b || length == 0)
                {
                    sink.Add(o, $"member \"{id}\" has zero length (its start and end are at the same point)", "connect two different nodes at different positions");
                    continue;
                }
                if (rigidStart + rigidEnd >= length)
                {
                    sink.Add(f.Token("rigidZones"), $"the rigid zones of member \"{id}\" ({_units.FromSI(rigidStart + rigidEnd, Quantity.Length):G6} {_units.LengthSymbol} together) leave no flexible length (member length {_units.FromSI(length, Quantity.Length):G6} {_units.LengthSymbol})",
                        "make the rigid zones shorter than the member");
                    continue;
                }
                _unusable.Remove("member:" + id);
                var s = sec.Section;
                double shearArea = s.ShearArea(mat.Nu) * mods.ShearArea;
                _members[id] = list.Count;
                if (axiallyRigid && !AlongAnAxis(nodes[a], nodes[b], f.Token("axiallyRigid")!, id)) continue;
                list.Add(new Member(list.Count, id, a, b, kind, s.Id, mat.Id, mat.E, mat.G,
                    s.A * mods.A, s.I * mods.I, shearArea, relStart, relEnd, rigidStart, rigidEnd, mods, role) { AxiallyRigid = axiallyRigid });
                if (axiallyRigid) _axiallyRigidTokens[list.Count - 1] = f.Token("axiallyRigid")!;
            }
            return list;
        }

        private List<Support> ReadSupports(IReadOnlyList<JsonMap> items)
        {
            var list = new List<Support>();
            var seen = new HashSet<int>();
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                int n = NodeRef(f, "node", "supported node");
                var type = f.RequiredString("type", "give \"type\": \"fixed\", \"pinned\", \"roller-x\", \"roller-y\" or \"custom\"");
                bool rx = false, ry = false, rr = false, knownType = true;
                switch (type)
                {
                    case "fixed": rx = ry = rr = true; break;
                    case "pinned": rx = ry = true; break;
                    case "roller-x": ry = true; break;  // rolls along X: holds Y only
                    case "roller-y": rx = true; break;  // rolls along Y: holds X only
                    case "custom": break;
                    case null: break;
                    default:
                        knownType = false;
                        sink.Add(f.Token("type"), $"unknown support type \"{type}\"",
                            "use \"fixed\", \"pinned\", \"roller-x\" (free to move along x), \"roller-y\" (free along y) or \"custom\" (with \"restrain\" and/or \"springs\")");
                        break;
                }
                if (f.Token("restrain") is { } rt)
                {
                    const string fix = "write \"restrain\": [\"x\", \"y\", \"rz\"] (any of them), with \"type\": \"custom\"";
                    if (type != "custom") sink.Add(rt, "'restrain' is only read with \"type\": \"custom\"", fix);
                    else if (rt is not JsonList ra) sink.Add(rt, "'restrain' must be an array", fix);
                    else
                        foreach (var d in ra)
                            switch (d.Type == JsonKind.String ? (string?)d : null)
                            {
                                case "x": rx = true; break;
                                case "y": ry = true; break;
                                case "rz": rr = true; break;
                                default: sink.Add(d, $"unknown direction {JsonFields.Describe(d)} in 'restrain'", fix); break;
                            }
                }
                double kx = 0, ky = 0, kr = 0;
                if (f.OptionalObject("springs", "write \"springs\": {\"x\": <force/length>, \"y\": ..., \"rz\": <moment/rad>}") is { } so)
                {
                    var sf = new JsonFields(so, sink);
                    string fix = $"give spring stiffness ≥ 0 ({_units.Label(Quantity.TranslationalStiffness)} for x and y, {_units.Label(Quantity.RotationalStiffness)} for rz)";
                    kx = SI(sf.OptionalNumber("x", 0, fix), Quantity.TranslationalStiffness);
                    ky = SI(sf.OptionalNumber("y", 0, fix), Quantity.TranslationalStiffness);
                    kr = SI(sf.OptionalNumber("rz", 0, fix), Quantity.RotationalStiffness);
                    foreach (var (k, v, held) in new[] { ("x", kx, rx), ("y", ky, ry), ("rz", kr, rr) })
                    {
                        if (v < 0) sink.Add(sf.Token(k), $"spring '{k}' is negative", fix);
                        if (v != 0 && held) sink.Add(sf.Token(k), $"a spring on '{k}', which the support already holds rigidly", $"remove the spring, or release '{k}' (use \"type\": \"custom\" with \"restrain\")");
                    }
                    sf.RejectUnknownKeys();
                }
                f.RejectUnknownKeys();
                if (n < 0 || type is null || !knownType) continue;
                if (!seen.Add(n)) { sink.Add(o, "a second support on the same node", "give each node at most one support entry; combine the restraints in one"); continue; }
                if (!(rx || ry || rr) && kx == 0 && ky == 0 && kr == 0)
                    sink.Add(o, "this support holds nothing (no restraint, no spring)", "restrain at least one direction or give a spring, or remove the entry");
                list.Add(new Support(n, type, rx, ry, rr, kx, ky, kr));
            }
            return list;
        }

        private List<LoadCase> ReadLoadCases(IReadOnlyList<JsonMap> items, List<Member> members)
        {
            var list = new List<LoadCase>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "load case");
                var desc = f.OptionalString("description", "give a description as a string") ?? "";
                var nodal = new List<NodalLoad>();
                foreach (var lo in f.Objects("nodalLoads", false, "write \"nodalLoads\": [ {\"node\": \"...\", \"fx\": ...} ]"))
                {
                    var lf = new JsonFields(lo, sink);
                    int n = NodeRef(lf, "node", "loaded node");
                    string fu = _units.ForceSymbol, mu = _units.Label(Quantity.Moment);
                    double fx = SI(lf.OptionalNumber("fx", 0, $"give fx in {fu}"), Quantity.Force);
                    double fy = SI(lf.OptionalNumber("fy", 0, $"give fy in {fu}"), Quantity.Force);
                    double mz = SI(lf.OptionalNumber("mz", 0, $"give mz in {mu}"), Quantity.Moment);
                    lf.RejectUnknownKeys();
                    if (n >= 0) nodal.Add(new NodalLoad(n, fx, fy, mz));
                }
                var mloads = new List<MemberLoad>();
                foreach (var lo in f.Objects("memberLoads", false, "write \"memberLoads\": [ {\"member\": \"...\", \"direction\": \"y\", \"w\": ...} ]"))
                    if (ReadMemberLoad(new JsonFields(lo, sink), members) is { } ml) mloads.Add(ml);
                f.RejectUnknownKeys();
                if (id is null) continue;
                _cases[id] = list.Count;
                list.Add(new LoadCase(id, desc, nodal, mloads));
            }
            return list;
        }

        private MemberLoad? ReadMemberLoad(JsonFields f, List<Member> members)
        {
            var mid = f.RequiredString("member", "give the id of the loaded member");
            int m = -1;
            if (mid is not null && !_members.TryGetValue(mid, out m) && _unusable.Contains("member:" + mid)) m = -1;
            else if (mid is not null && !_members.TryGetValue(mid, out m))
            {
                sink.Add(f.Token("member"), $"unknown member \"{mid}\"", $"use the id of a member listed under \"members\"{Suggest(mid, _members.Keys)}");
                m = -1;
            }
            var axesText = f.OptionalString("axes", "give \"axes\": \"global\" or \"local\"") ?? "global";
            var axes = axesText switch { "global" => LoadAxes.Global, "local" => LoadAxes.Local, _ => (LoadAxes)(-1) };
            if ((int)axes < 0) sink.Add(f.Token("axes"), $"unknown axes \"{axesText}\"", "use \"global\" (x, y) or \"local\" (axial, transverse)");
            var dirText = f.RequiredString("direction", "give \"direction\": \"x\" or \"y\" (global axes) or \"axial\" or \"transverse\" (local axes)");
            int dir = (axes, dirText) switch
            {
                (LoadAxes.Global, "x") => 0, (LoadAxes.Global, "y") => 1,
                (LoadAxes.Local, "axial") => 0, (LoadAxes.Local, "transverse") => 1,
                _ => -1,
            };
            if (dir < 0 && dirText is not null && (int)axes >= 0)
                sink.Add(f.Token("direction"), $"direction \"{dirText}\" does not go with {axesText} axes",
                    axes == LoadAxes.Global ? "use \"x\" or \"y\" with global axes" : "use \"axial\" or \"transverse\" with local axes");
            string wu = _units.Label(Quantity.ForcePerLength);
            double w1, w2;
            if (f.Has("w"))
            {
                if (f.Has("wStart") || f.Has("wEnd")) sink.Add(f.Object, "both 'w' and 'wStart'/'wEnd' are given", "give 'w' for a uniform load, or 'wStart' and 'wEnd' for a linearly varying one");
                w1 = w2 = SI(f.RequiredNumber("w", $"give w in {wu}"), Quantity.ForcePerLength);
            }
            else
            {
                if (!f.Has("wStart") && !f.Has("wEnd"))
                    sink.Add(f.Object, "the member load has no intensity", $"give \"w\" (uniform) or \"wStart\" and \"wEnd\" (linear) in {wu}");
                w1 = SI(f.OptionalNumber("wStart", 0, $"give wStart in {wu}"), Quantity.ForcePerLength);
                w2 = SI(f.OptionalNumber("wEnd", 0, $"give wEnd in {wu}"), Quantity.ForcePerLength);
            }
            f.RejectUnknownKeys();
            if (m < 0 || dir < 0 || (int)axes < 0) return null;
            var mem = members[m];
            if (mem.Kind == MemberKind.Brace)
            {
                bool transverse = axes == LoadAxes.Local ? dir == 1 : !IsAlongAxis(mem, dir);
                if (transverse)
                {
                    sink.Add(f.Object, $"member \"{mem.Id}\" is a brace and carries axial force only; a transverse load on it cannot be carried",
                        "make it a \"beam-column\" with \"momentReleases\": [\"start\", \"end\"] (a pin-ended member that takes transverse load), or apply the load at its nodes");
                    return null;
                }
            }
            return new MemberLoad(m, axes, dir, w1, w2);

            bool IsAlongAxis(Member me, int globalDir)
            {
                // A global-direction load is axial only if the member lies along that axis.
                var n1 = _nodesList![me.Start]; var n2 = _nodesList[me.End];
                double dx = n2.X - n1.X, dy = n2.Y - n1.Y, len = Math.Sqrt(dx * dx + dy * dy);
                double across = globalDir == 0 ? Math.Abs(dy) / len : Math.Abs(dx) / len;
                return across < 1e-12;
            }
        }

        private List<Node>? _nodesList;
        private readonly List<JsonMap> _nodeObjects = [];

        private List<Combination> ReadCombinations(IReadOnlyList<JsonMap> items, List<LoadCase> cases)
        {
            var list = new List<Combination>();
            var seen = new HashSet<string>(cases.Select(c => c.Id), StringComparer.Ordinal);
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = f.RequiredString("id", "give every combination a unique \"id\" string");
                if (id is not null && !seen.Add(id))
                    sink.Add(f.Token("id"), $"combination id \"{id}\" is already used by a load case or another combination", "give each load case and combination its own id");
                var desc = f.OptionalString("description", "give a description as a string") ?? "";
                var factors = new List<(int, double)>();
                const string fix = "write \"factors\": {\"<load case id>\": <factor>, ...}";
                var fo = f.OptionalObject("factors", fix);
                if (fo is null && !f.Has("factors")) sink.Add(o, "missing required key 'factors'", fix);
                if (fo is not null)
                {
                    foreach (var p in fo.Properties())
                    {
                        if (!_cases.TryGetValue(p.Name, out int ci))
                        {
                            sink.Add(p, $"unknown load case \"{p.Name}\"", $"use the id of a load case listed under \"loadCases\"{Suggest(p.Name, _cases.Keys)}");
                            continue;
                        }
                        if (p.Value.Type is not (JsonKind.Integer or JsonKind.Float) || !double.IsFinite((double)p.Value))
                        {
                            sink.Add(p.Value, $"the factor on \"{p.Name}\" must be a finite number, found {JsonFields.Describe(p.Value)}", fix);
                            continue;
                        }
                        factors.Add((ci, (double)p.Value));
                    }
                    if (fo.Count == 0) sink.Add(fo, "the combination has no factors", fix);
                }
                f.RejectUnknownKeys();
                if (id is not null) list.Add(new Combination(id, desc, factors));
            }
            return list;
        }

        private List<StiffnessPoint> ReadStiffnessPoints(IReadOnlyList<JsonMap> items, List<Support> supports)
        {
            var list = new List<StiffnessPoint>();
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                int n = NodeRef(f, "node", "node where the stiffness is wanted");
                var d = f.OptionalString("direction", "give \"direction\": \"x\" or \"y\"") ?? "x";
                var label = f.OptionalString("label", "give a label as a string");
                Dof dof = Dof.X;
                if (d == "y") dof = Dof.Y;
                else if (d != "x") sink.Add(f.Token("direction"), $"unknown direction \"{d}\"", "use \"x\" or \"y\"");
                f.RejectUnknownKeys();
                if (n < 0) continue;
                if (supports.Any(s => s.Node == n && s.Restrains(dof)))
                    sink.Add(o, $"the support at node \"{_nodesList![n].Id}\" holds '{d}' rigidly, so its stiffness there is infinite", "name a node that is free to move in that direction");
                list.Add(new StiffnessPoint(label ?? $"{_nodesList![n].Id} {d}", n, dof));
            }
            return list;
        }

        private void CheckConnectivity(List<Node> nodes, List<Member> members)
        {
            if (sink.Any) return; // members that failed to read would make this report false alarms
            var used = new bool[nodes.Count];
            foreach (var m in members) { used[m.Start] = true; used[m.End] = true; }
            foreach (var n in PanelLinkedNodes()) used[n] = true;   // tied to a wall panel (ModelReader.PanelLinks.cs)
            for (int i = 0; i < nodes.Count; i++)
                if (!used[i])
                    sink.Add(_nodeObjects[i], $"node \"{nodes[i].Id}\" is not connected to any member", "connect it with a member, or remove it");
        }
    }
}
