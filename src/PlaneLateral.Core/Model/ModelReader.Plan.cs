using Newtonsoft.Json;
using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>Reading a building in plan (docs/plan.md): a file whose top level has the key "plan".</summary>
public static partial class ModelReader
{
    /// <summary>The top-level key that only building files have.</summary>
    public const string PlanKey = "plan";

    /// <summary>
    /// True when the file is a JSON object with a top-level "plan" key (a building in plan), false otherwise, including
    /// when it cannot be read or parsed (the planar reader then reports why).
    /// </summary>
    public static bool IsPlanFile(string path)
    {
        // Read as every model is read (ModelFile: regular files only, bounded), never by an open stream: a device such
        // as /dev/zero would be read for ever and a named pipe would block before the planar reader could refuse it.
        string text;
        try { text = ModelFile.ReadText(path); }
        catch (ModelInputException) { return false; }
        try
        {
            using var reader = new JsonTextReader(new StringReader(text));
            if (!reader.Read() || reader.TokenType != JsonToken.StartObject) return false;
            while (reader.Read())
            {
                if (reader.TokenType == JsonToken.PropertyName)
                {
                    if ((string?)reader.Value == PlanKey) return true;
                    reader.Read();
                    reader.Skip();
                }
                else if (reader.TokenType == JsonToken.EndObject) return false;
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or JsonException or ArgumentException or NotSupportedException) { }
        return false;
    }

    /// <summary>Reads and validates a building file; its line files are read from its own folder.</summary>
    /// <exception cref="ModelInputException">Every problem found, in this file and in its line files.</exception>
    public static BuildingPlan ReadPlanFile(string path)
    {
        string text = ModelFile.ReadText(path, out var input);   // regular files only, bounded
        var plan = ParsePlan(text, path);
        return plan with { Inputs = [input, .. plan.Inputs] };
    }

    /// <summary>Reads a building from JSON text; <paramref name="fileName"/> names it in messages and fixes the folder line files are read from.</summary>
    public static BuildingPlan ParsePlan(string json, string fileName) => ParsePlanTree(ReadTree(json, fileName), fileName);   // strict JSON, as every model (ModelReader.cs)

    /// <summary>Validates a building read by <see cref="ReadSource"/>; the same result as <see cref="ReadPlanFile"/> on its path.</summary>
    public static BuildingPlan ReadPlan(ModelSource source)
    {
        var plan = ParsePlanTree(source.Root, source.Path);
        return plan with { Inputs = [source.Input, .. plan.Inputs] };
    }

    private static BuildingPlan ParsePlanTree(JsonNode root, string fileName)
    {
        SuggestBudget.Reset();
        var sink = new DiagnosticSink(fileName);
        if (root is not JsonMap obj)
        {
            sink.Add(root, "a building file must be a JSON object {...}", "wrap the building in { } with \"formatVersion\", \"materials\" and \"plan\"");
            throw new ModelInputException(sink.Items);
        }
        var builder = new Builder(sink, fileName);
        var plan = builder.BuildPlan(obj);
        var all = sink.Items.Concat(builder.LineFileProblems).ToList();
        if (all.Count > 0 || plan is null) throw new ModelInputException(all);
        return plan with { Warnings = Plausibility.CheckPlan(plan, obj, fileName, builder.LineSources), Inputs = builder.LineInputs };
    }

    /// <summary>Standard gravity (m/s²), turning a seismic weight into a mass.</summary>
    public const double StandardGravity = 9.80665;

    private sealed partial class Builder
    {
        /// <summary>
        /// Solves of each line's model in a run: one per floor (its condensation), one per plan case and generated
        /// seismic case (2 directions × the case and its two eccentric twins, and the A_x cases: 10 at most) for its
        /// recovery, and with a response spectrum one per mode and direction (the modes asked for; when left to 90 % of the
        /// mass, an allowance of 30 per direction), three times with shifted masses.
        /// </summary>
        private static int PlanSolves(int floors, int cases, PlanSeismicData? seismic)
        {
            if (seismic is null) return floors + cases;
            int solves = floors + cases + 10;
            if (seismic.ResponseSpectrum is { } rs)
                solves += 2 * Math.Min(3 * floors, rs.Modes > 0 ? rs.Modes : 30) * (rs.Torsion == AccidentalTorsion.ShiftedMasses ? 3 : 1);
            return solves;
        }

        /// <summary>True while reading a line of a building: its own load cases are not needed (the building loads it).</summary>
        private bool _partOfBuilding;

        /// <summary>Problems found in line files (each names its own file).</summary>
        private readonly List<ModelDiagnostic> _lineFileProblems = [];

        public IReadOnlyList<ModelDiagnostic> LineFileProblems => _lineFileProblems;

        /// <summary>The line files read, each once, in the order first read, with their SHA-256.</summary>
        private readonly List<InputFile> _lineInputs = [];

        public IReadOnlyList<InputFile> LineInputs => _lineInputs;

        /// <summary>The lines given as planar models, with their JSON and file, for the plausibility checks.</summary>
        private readonly List<Plausibility.PlanLineSource> _lineSources = [];

        public IReadOnlyList<Plausibility.PlanLineSource> LineSources => _lineSources;

        public BuildingPlan? BuildPlan(JsonMap root)
        {
            var f = new JsonFields(root, sink);
            f.OptionalString("$schema", "give \"$schema\" as the path or address of the schema file, a string");
            f.OptionalString("description", "give a short description as a string");
            f.OptionalObject("reference", "give \"reference\" as an object {\"source\": ..., \"values\": [...]}");
            var title = f.OptionalString("title", "give the building a title as a string") ?? Path.GetFileNameWithoutExtension(fileName);
            ReadFormatVersion(f);
            ReadUnits(f);
            ReadMaterials(f.Objects("materials", true, "add \"materials\": [ {\"id\": \"...\", \"E\": ..., \"nu\": ...} ] (an empty array when no wall uses one)"));
            var p = f.OptionalObject(PlanKey, "give \"plan\" as an object with \"levels\", \"lines\" and \"loads\" (docs/plan.md)");
            f.RejectUnknownKeys();
            if (p is null || ModelLimits.CheckPlanCounts(p, sink)) return null;

            var pf = new JsonFields(p, sink);
            var defaultOutline = pf.Has("outline") ? ReadOutline(pf.Token("outline")!) : null;
            double ecc = pf.OptionalNumber("accidentalEccentricity", 0.05, "give the accidental eccentricity as a fraction of the plan dimension, e.g. 0.05");
            if (double.IsFinite(ecc) && (ecc < 0 || ecc > 0.5))
                sink.Add(pf.Token("accidentalEccentricity"), $"'accidentalEccentricity' {ecc} is outside [0, 0.5]", "give a fraction such as 0.05 (5 % of the plan dimension), or 0 for none");
            var levels = ReadPlanLevels(pf, defaultOutline);
            var lines = levels is null ? [] : ReadPlanLines(pf, levels);
            var cases = levels is null ? [] : ReadPlanLoads(pf, levels, ecc);
            var floors = levels is null ? [] : ReadFloors(levels, lines);
            var points = levels is null ? [] : ReadPlanPoints(pf, levels);
            PlanDriftLimit? drift = null;
            if (pf.OptionalObject("driftCheck", "give \"driftCheck\": {\"Cd\": ..., \"Ie\": ..., \"allowedRatio\": ...}") is { } dc)
            {
                var d = new JsonFields(dc, sink);
                double cd = d.OptionalNumber("Cd", 1.0, "give C_d as a number (1 for the elastic drift)");
                double ie = d.OptionalNumber("Ie", 1.0, "give I_e as a number");
                double ratio = d.RequiredNumber("allowedRatio", "give the allowable story drift ratio, e.g. 0.02");
                if (double.IsFinite(cd) && !(cd >= 1 && cd <= 6.5)) sink.Add(d.Token("Cd"), $"'Cd' {cd} is outside [1, 6.5]", "give C_d from 1 to 6.5");
                if (double.IsFinite(ie) && !(ie >= 1 && ie <= 1.5)) sink.Add(d.Token("Ie"), $"'Ie' {ie} is outside [1, 1.5]", "give I_e from 1.0 to 1.5");
                if (double.IsFinite(ratio) && !(ratio > 0 && ratio <= 0.1)) sink.Add(d.Token("allowedRatio"), $"'allowedRatio' {ratio} is outside (0, 0.1]", "give the allowable drift ratio, e.g. 0.02");
                d.RejectUnknownKeys();
                drift = new PlanDriftLimit(cd, ie, ratio);
            }
            var seismic = ReadPlanSeismic(pf, levels);
            // The modes are solved on the rigid-floor system (three DOFs per floor, the floor's mass at its centre). The
            // equivalent lateral forces take their period from it (docs/plan.md, "Floors that bend": the shortest period,
            // so C_s is not underestimated) and are solved with the floors as given; the response spectrum needs the modes
            // of the floors as they bend, so it is refused beside a floor that bends.
            if (seismic?.ResponseSpectrum is not null && floors.FirstOrDefault(fl => fl.Kind != FloorKind.Rigid) is { } bent)
                sink.Add(pf.Token("seismic")?["responseSpectrum"] ?? pf.Token("seismic"), $"the response spectrum analysis cannot yet be used with the {(bent.Kind == FloorKind.Flexible ? "flexible" : "semi-rigid")} floor of level \"{levels![bent.Level].Id}\": its modes are those of rigid floors",
                    "remove \"responseSpectrum\" from the seismic block (the equivalent lateral forces are solved with the floors as given), or remove the level's \"floor\" block (rigid floors)");
            pf.RejectUnknownKeys();
            if (levels is not null && !sink.Any && _lineFileProblems.Count == 0)
                ModelLimits.CheckPlanWork(lines, PlanSolves(levels.Count - 1, cases.Count, seismic), pf.Token("lines"), sink);
            if (sink.Any || _lineFileProblems.Count > 0 || levels is null) return null;
            return new BuildingPlan
            {
                Title = title, SourcePath = fileName, Units = _units, Levels = levels, Lines = lines, Cases = cases,
                EccentricityRatio = ecc, DriftLimit = drift, Floors = floors, Seismic = seismic, Points = points,
            };
        }

        private PlanPoint? ReadPoint(JsonNode t, string what)
        {
            if (t is JsonList { Count: 2 } a && a.All(v => v.Type is JsonKind.Integer or JsonKind.Float))
            {
                double x = (double)a[0], y = (double)a[1];
                if (double.IsFinite(x) && double.IsFinite(y) && Math.Abs(x) <= JsonFields.MaxMagnitude && Math.Abs(y) <= JsonFields.MaxMagnitude)
                    return new PlanPoint(SI(x, Quantity.Length), SI(y, Quantity.Length));
            }
            sink.Add(t, $"{what} must be a point [x, y] of two numbers, found {JsonFields.Describe(t)}", $"write {what} as [x, y] in {_units.LengthSymbol}");
            return null;
        }

        private List<PlanPoint>? ReadOutline(JsonNode t)
        {
            const string fix = "give the outline as [[x, y], [x, y], [x, y], ...]: at least three corners in order around the floor";
            if (t is not JsonList a || a.Count < 3) { sink.Add(t, "'outline' must be an array of at least three points", fix); return null; }
            var pts = new List<PlanPoint>();
            foreach (var v in a) if (ReadPoint(v, "an outline corner") is { } q) pts.Add(q);
            if (pts.Count != a.Count) return null;
            double size = Math.Max(pts.Max(q => q.X) - pts.Min(q => q.X), pts.Max(q => q.Y) - pts.Min(q => q.Y));
            if (!(Math.Abs(PlanOutline.SignedArea(pts)) > 1e-9 * size * size)) { sink.Add(t, "the outline encloses no area", fix); return null; }
            return pts;
        }

        private List<PlanLevel>? ReadPlanLevels(JsonFields pf, List<PlanPoint>? defaultOutline)
        {
            var items = pf.Objects("levels", true, "add \"levels\": [{\"id\": \"base\", \"elevation\": 0}, {\"id\": \"roof\", \"elevation\": ..., \"weight\": ...}]");
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var raw = new List<(string Id, string Name, double Elevation, double Weight, PlanPoint? Mass, List<PlanPoint>? Outline, double Polar, JsonMap At)>();
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "level");
                string name = f.OptionalString("name", "give the level's name as a string") ?? id ?? "";
                double e = SI(f.RequiredNumber("elevation", $"give the level's elevation in {_units.LengthSymbol}"), Quantity.Length);
                double w = f.Has("weight") ? Positive(f, "weight", Quantity.Force, "seismic weight", $"give the floor's seismic weight in {_units.ForceSymbol}") : double.NaN;
                var mass = f.Token("massAt") is { } m ? ReadPoint(m, "'massAt'") : null;
                var outline = f.Token("outline") is { } ot ? ReadOutline(ot) : defaultOutline;
                double polar = f.Has("polarInertia") ? SI(SI(f.RequiredNumber("polarInertia", "give W·r² about the centre of mass"), Quantity.Force), Quantity.Area) : double.NaN;
                if (f.OptionalObject("floor", "give \"floor\" as {\"kind\": \"rigid\" | \"semi-rigid\" | \"flexible\", ...} (docs/plan.md)") is { } floor && id is not null) _floorBlocks.Add((id, floor));
                f.RejectUnknownKeys();
                if (id is not null) raw.Add((id, name, e, w, mass, outline, polar, o));
            }
            if (raw.Count < 2) { sink.Add(pf.Token("levels") ?? pf.Object, "a building needs the base and at least one floor level", "list the base (elevation 0) and every floor above it under \"levels\""); return null; }
            raw.Sort((a, b) => a.Elevation.CompareTo(b.Elevation));
            for (int i = 1; i < raw.Count; i++)
                if (raw[i].Elevation == raw[i - 1].Elevation)
                    sink.Add(raw[i].At, $"levels \"{raw[i - 1].Id}\" and \"{raw[i].Id}\" have the same elevation", "give each level its own elevation");
            var list = new List<PlanLevel>();
            for (int i = 0; i < raw.Count; i++)
            {
                var r = raw[i];
                if (i > 0 && r.Outline is null)
                {
                    sink.Add(r.At, $"level \"{r.Id}\" has no plan outline", "give \"outline\" under \"plan\" (for every floor) or on the level");
                    continue;
                }
                var outline = r.Outline ?? [];
                var cm = r.Mass ?? (outline.Count >= 3 ? PlanOutline.Centroid(outline) : new PlanPoint(0, 0));
                double polar = double.IsFinite(r.Polar) ? r.Polar / StandardGravity
                    : double.IsFinite(r.Weight) && outline.Count >= 3 ? r.Weight / StandardGravity * (PlanOutline.PolarRadiusSquared(outline) + Sq(cm.X - PlanOutline.Centroid(outline).X) + Sq(cm.Y - PlanOutline.Centroid(outline).Y))
                    : double.NaN;
                if (i > 0 && outline.Count >= 3 && !PlanOutline.Contains(outline, cm, 1e-9 * Math.Max(1, Extent(outline))))
                    sink.Add(r.At["massAt"] ?? r.At, $"the centre of mass of level \"{r.Id}\" lies outside its outline", "check 'massAt' and the outline's corners");
                list.Add(new PlanLevel(i, r.Id, r.Name, r.Elevation, r.Weight, cm, outline, polar));
            }
            return sink.Any ? null : list;
        }

        private static double Sq(double v) => v * v;

        private static double Extent(IReadOnlyList<PlanPoint> o) =>
            Math.Max(o.Max(q => q.X) - o.Min(q => q.X), o.Max(q => q.Y) - o.Min(q => q.Y));

        private List<PlanLine> ReadPlanLines(JsonFields pf, List<PlanLevel> levels)
        {
            var items = pf.Objects("lines", true, "add \"lines\": [{\"id\": \"A\", \"at\": [x, y], \"direction\": \"y\", \"wall\": {...}}] (docs/plan.md)");
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var list = new List<PlanLine>();
            var elevations = levels.Select(l => l.Elevation).ToArray();
            double height = elevations[^1] - elevations[0];
            double size = levels.Skip(1).Max(l => Extent(l.Outline));
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "line");
                var at = f.Token("at") is { } t ? ReadPoint(t, "'at'") : null;
                if (!f.Has("at")) sink.Add(o, "missing required key 'at'", $"give the line's plan position as \"at\": [x, y] in {_units.LengthSymbol}");
                double angle = ReadDirection(f);
                var forms = new[] { "model", "wall", "storyStiffness" }.Where(f.Has).ToList();
                if (forms.Count != 1)
                    sink.Add(o, forms.Count == 0 ? "the line has no structure" : $"the line has {string.Join(" and ", forms)}; give one",
                        "give exactly one of \"model\" (a planar model, inline or a file name), \"wall\" or \"storyStiffness\"");
                var loc = new CheckLocation(fileName, o.Line, o.Column, DiagnosticSink.PathOf(o));
                if (id is null || at is null || !double.IsFinite(angle) || forms.Count != 1) { f.RejectUnknownKeys(); continue; }
                string lid = id;
                var units = _units;
                StructureModel? model = null;
                PlanLineForm form = PlanLineForm.Inline;
                string source = fileName;
                switch (forms[0])
                {
                    case "wall":
                        form = PlanLineForm.Wall;
                        model = ReadWall(f.OptionalObject("wall", "give \"wall\" as {\"length\": ..., \"thickness\": ..., \"material\": \"...\"}"), lid, elevations, at.Value, angle, levels);
                        break;
                    case "storyStiffness":
                        form = PlanLineForm.StoryStiffness;
                        model = ReadStoryStiffness(f.Token("storyStiffness")!, lid, elevations);
                        break;
                    default:
                        var mt = f.Token("model")!;
                        if (mt.Type == JsonKind.String)
                        {
                            form = PlanLineForm.File;
                            model = ReadLineFile(mt, (string)mt!, out source, out var lineRoot);
                            if (model is not null && lineRoot is not null) _lineSources.Add(new(lid, model, lineRoot, source));
                        }
                        else if (mt is JsonMap mo)
                        {
                            model = ModelLimits.CheckCounts(mo, sink) ? null : new Builder(sink, fileName) { _partOfBuilding = true }.Build(mo);
                            if (model is not null) _lineSources.Add(new(lid, model, mo, fileName));
                        }
                        else sink.Add(mt, $"'model' must be a planar model {{...}} or the name of a file beside the building file, found {JsonFields.Describe(mt)}", "give the model inline or as \"line-a.json\"");
                        break;
                }
                f.RejectUnknownKeys();
                int panelIndex = -1;
                double tolLevels = 1e-6 * Math.Max(height, 1);
                var levelNodes = model is null ? null : model.Members.Count == 0 && model.Panels.Count > 0
                    ? MatchPanelLevels(model, levels, f.Object, lid, tolLevels, out panelIndex)
                    : MatchLineLevels(model, levels, f.Object, lid, tolLevels);
                if (!levels.Skip(1).All(l => PlanOutline.Contains(l.Outline, at.Value, 1e-6 * Math.Max(size, 1))))
                    sink.Add(f.Token("at"), $"line \"{lid}\" stands outside the plan outline", "check 'at' against the outline's corners (a line stands on the floor it resists)");
                if (model is not null && levelNodes is not null)
                    list.Add(new PlanLine(lid, form, source, at.Value.X, at.Value.Y, angle, model, levelNodes, loc)
                    {
                        Panel = panelIndex,
                        PlanLength = form != PlanLineForm.Wall ? double.NaN : panelIndex >= 0 ? model.Panels[panelIndex].Length : model.Sections[0].Depth,
                    });
            }
            return list;
        }

        /// <summary>"points": plan points the user names, each on every floor, reported beside the outline corners.</summary>
        private List<PlanNamedPoint> ReadPlanPoints(JsonFields pf, List<PlanLevel> levels)
        {
            var list = new List<PlanNamedPoint>();
            var seen = new HashSet<string>(StringComparer.Ordinal);
            double tol = 1e-6 * Math.Max(1, levels.Skip(1).Max(l => Extent(l.Outline)));
            foreach (var o in pf.Objects("points", false, $"write \"points\": [{{\"id\": \"stair core NE\", \"at\": [x, y]}}] in {_units.LengthSymbol}"))
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "point");
                var at = f.Token("at") is { } t ? ReadPoint(t, "'at'") : null;
                if (!f.Has("at")) sink.Add(o, "missing required key 'at'", $"give the point's plan position as \"at\": [x, y] in {_units.LengthSymbol}");
                f.RejectUnknownKeys();
                if (id is null || at is null) continue;
                if (levels.Skip(1).FirstOrDefault(l => !PlanOutline.Contains(l.Outline, at.Value, tol)) is { } off)
                {
                    sink.Add(f.Token("at"), $"point \"{id}\" lies outside the outline of level \"{off.Id}\"", "give a point on every floor (inside or on each level's outline)");
                    continue;
                }
                list.Add(new PlanNamedPoint(id, at.Value));
            }
            return list;
        }

        private double ReadDirection(JsonFields f)
        {
            var t = f.Token("direction");
            const string fix = "give \"direction\": \"x\", \"y\" or an angle in degrees from plan X towards plan Y (e.g. 45)";
            if (t is null) { sink.Add(f.Object, "missing required key 'direction'", fix); return double.NaN; }
            if (t.Type == JsonKind.String)
                return (string)t! switch { "x" => 0, "y" => Math.PI / 2, _ => Bad() };
            if (t.Type is JsonKind.Integer or JsonKind.Float)
            {
                double deg = (double)t;
                if (double.IsFinite(deg) && Math.Abs(deg) <= 360) return deg * Math.PI / 180;
            }
            return Bad();
            double Bad() { sink.Add(t, $"unknown direction {t.ToCompactJson()}", fix); return double.NaN; }
        }

        private StructureModel? ReadWall(JsonMap? o, string id, double[] elevations, PlanPoint at, double angle, List<PlanLevel> levels)
        {
            if (o is null) return null;
            var f = new JsonFields(o, sink);
            double length = Positive(f, "length", Quantity.Length, "wall length", $"give the wall's length in plan in {_units.LengthSymbol}");
            double thickness = Positive(f, "thickness", Quantity.Length, "wall thickness", $"give the wall's thickness in {_units.LengthSymbol}");
            var mat = f.RequiredString("material", "give the id of a material listed under \"materials\"");
            // "as": how the wall is modelled. Members by default for a solid wall; a wall with openings needs the panel.
            var asWord = f.OptionalString("as", "give \"as\": \"members\" (one Timoshenko member per story) or \"panel\" (a plane-stress panel)")
                ?? (f.Has("openings") ? "panel" : "members");
            bool panel = asWord == "panel";
            if (asWord is not ("members" or "panel"))
                sink.Add(f.Token("as"), $"unknown wall model \"{asWord}\"", "give \"members\" (one Timoshenko member per story) or \"panel\" (a plane-stress panel with floor ties)");
            double shear = f.OptionalNumber("shearFactor", 1.2, "give the shear form factor, 1.2 for a rectangle");
            if (double.IsFinite(shear) && !(shear >= 1 && shear <= 2)) sink.Add(f.Token("shearFactor"), $"'shearFactor' {shear} is outside [1, 2]", "give 1.2 for a solid rectangle");
            if (panel && f.Has("shearFactor"))
                sink.Add(f.Token("shearFactor"), "'shearFactor' belongs to the member form, but the wall is a panel", "remove \"shearFactor\" (the panel's shear stiffness comes from the continuum), or write \"as\": \"members\"");
            if (!panel && f.Has("openings") && asWord == "members")
                sink.Add(f.Token("openings"), "a wall with openings cannot be one member per story", "write \"as\": \"panel\" (a plane-stress panel with its openings), or remove \"openings\"");
            if (!panel && f.Has("mesh") && asWord == "members")
                sink.Add(f.Token("mesh"), "'mesh' belongs to the panel form, but the wall is members", "write \"as\": \"panel\", or remove \"mesh\"");
            List<(PanelOpening Opening, JsonNode At)>? openings = panel ? ReadWallOpenings(f, elevations, length) : [];
            var mesh = panel ? ReadPanelMesh(f.OptionalObject("mesh", "write \"mesh\": {\"element\": \"quad9\", \"elementsAcrossNarrowest\": 2}")) : null;
            f.RejectUnknownKeys();
            Material? material = null;
            if (mat is not null && !_materials.TryGetValue(mat, out material))
                sink.Add(f.Token("material"), $"unknown material \"{mat}\"", $"use one of: {string.Join(", ", _materials.Keys)}; or add it under \"materials\"");
            if (material is null || !double.IsFinite(length) || !double.IsFinite(thickness) || !double.IsFinite(shear) || asWord is not ("members" or "panel")) return null;
            double tol = 1e-6 * Math.Max(1, levels.Skip(1).Max(l => Extent(l.Outline)));
            foreach (int end in new[] { -1, 1 })
            {
                var p = new PlanPoint(at.X + end * length / 2 * Math.Cos(angle), at.Y + end * length / 2 * Math.Sin(angle));
                if (!levels.Skip(1).All(l => PlanOutline.Contains(l.Outline, p, tol)))
                    sink.Add(f.Token("length"), $"an end of wall \"{id}\" stands outside the plan outline", "shorten the wall or move its centre 'at' (the wall is centred on 'at')");
            }
            if (!panel) return PlanLineModels.Wall(id, fileName, elevations, length, thickness, material, shear, _units);
            if (openings is null || mesh is null || !(length > 0 && thickness > 0)) return null;
            var model = PlanLineModels.WallPanel(id, fileName, elevations, length, thickness, material, openings.Select(x => x.Opening).ToList(), mesh, _units);
            // The panel's own layout checks (openings overlapping, strips narrower than an element, mesh too big...), each
            // at the compact wall's key that causes it: an opening's problem at that opening, a mesh problem at "mesh".
            foreach (var q in PanelLayout.Check(model.Panels[0], _units))   // lengths in the building file's units
            {
                JsonNode where = o;
                if (q.Key.StartsWith("openings[", StringComparison.Ordinal) && int.TryParse(q.Key[9..q.Key.IndexOf(']')], out int k) && k < openings.Count) where = openings[k].At;
                else if (q.Key.StartsWith("mesh", StringComparison.Ordinal)) where = f.Token("mesh") ?? o;
                sink.Add(where, $"wall \"{id}\" as a panel: {q.Problem}", q.Fix);
            }
            return model;
        }

        /// <summary>
        /// The openings of a compact wall: "left" from the wall's start end (the end first along the line's direction),
        /// "bottom" above the wall's base, or above the floor of each story listed in "stories". Checked here, in the
        /// file's units, at the opening's keys: inside the wall's length with solid wall at both ends, below the top,
        /// within its story (not crossing a floor level). Null when one could not be read.
        /// </summary>
        private List<(PanelOpening Opening, JsonNode At)>? ReadWallOpenings(JsonFields f, double[] elevations, double length)
        {
            string lu = _units.LengthSymbol;
            string L(double si) => _units.FromSI(si, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture) + " " + lu;
            var list = new List<(PanelOpening, JsonNode)>();
            bool ok = true;
            var ids = new HashSet<string>(StringComparer.Ordinal);
            int n = elevations.Length - 1;
            double b0 = elevations[0], top = elevations[^1] - b0, tol = 1e-9 * Math.Max(top, length);
            var items = f.Objects("openings", false, "write \"openings\": [ {\"id\": \"door\", \"left\": ..., \"bottom\": 0, \"width\": ..., \"height\": ..., \"stories\": [1]} ]");
            for (int k = 0; k < items.Count; k++)
            {
                var oo = items[k];
                var g = new JsonFields(oo, sink);
                string oid = g.Has("id") ? g.RequiredString("id", "give the opening an id string") ?? "" : $"opening {k + 1}";
                if (oid != "" && !ids.Add(oid)) sink.Add(g.Token("id"), $"duplicate opening id \"{oid}\"", "give each opening its own id");
                double left = SI(g.RequiredNumber("left", $"give the distance from the wall's start end (the end first along the line's direction) to the opening, in {lu}"), Quantity.Length);
                double bottom = SI(g.OptionalNumber("bottom", 0, $"give the opening's bottom above the floor of its story (with \"stories\") or above the base, in {lu}; 0 for a door"), Quantity.Length);
                double w = Positive(g, "width", Quantity.Length, "opening", $"give the opening's width in {lu}");
                double h = Positive(g, "height", Quantity.Length, "opening", $"give the opening's height in {lu}");
                var stories = new List<int>();
                if (g.Token("stories") is { } st)
                {
                    if (st is JsonList sa && sa.Count > 0)
                        foreach (var v in sa)
                        {
                            if (v.Type == JsonKind.Integer && (long)v >= 1 && (long)v <= n) stories.Add((int)(long)v);
                            else { ok = false; sink.Add(v, $"story {v.ToCompactJson()} is not a story of the building (1 to {n})", $"list story numbers from 1 (the lowest) to {n}"); }
                        }
                    else if (st.Type == JsonKind.String && (string)st! == "all") stories.AddRange(Enumerable.Range(1, n));
                    else { ok = false; sink.Add(st, $"'stories' must be a list of story numbers or \"all\", found {JsonFields.Describe(st)}", $"write \"stories\": [1, 2] (1 = the lowest) or \"all\""); }
                }
                g.RejectUnknownKeys();
                if (!(double.IsFinite(left) && double.IsFinite(bottom) && w > 0 && h > 0)) { ok = false; continue; }
                if (left <= tol || left + w >= length - tol)
                {
                    ok = false;
                    sink.Add(g.Token("left") ?? oo, $"opening \"{oid}\" runs from {L(left)} to {L(left + w)} along the {L(length)} wall: it reaches or passes an end of the wall",
                        "keep solid wall at both ends (0 < left and left + width < length); a wall with a full-height gap is two walls: give two lines");
                    continue;
                }
                if (bottom < -tol) { ok = false; sink.Add(g.Token("bottom"), $"opening \"{oid}\" starts {L(-bottom)} below {(stories.Count > 0 ? "the floor of its story" : "the base")}", "give \"bottom\" ≥ 0 (0 for a door)"); continue; }
                foreach (var s in stories.Count > 0 ? stories : [0])
                {
                    double lo = (s == 0 ? 0 : elevations[s - 1] - b0) + bottom, hi = lo + h;
                    string where = s == 0 ? "" : $" in story {s}";
                    if (hi >= top - tol)
                    {
                        ok = false;
                        sink.Add(g.Token("height") ?? oo, $"opening \"{oid}\"{where} reaches {L(hi)} above the base, at or above the wall's top ({L(top)})",
                            "lower the opening or its height: solid wall must remain above every opening, under the roof");
                        continue;
                    }
                    if (Enumerable.Range(1, n - 1).Select(i => elevations[i] - b0).FirstOrDefault(e => e > lo + tol && e < hi - tol, double.NaN) is var crossed && double.IsFinite(crossed))
                    {
                        ok = false;
                        sink.Add(g.Token("height") ?? oo, $"opening \"{oid}\"{where} runs from {L(lo)} to {L(hi)} above the base and crosses the floor level at {L(crossed)}",
                            s == 0 ? "a floor meets the wall in solid wall: keep the opening within one story, or give \"stories\" and the bottom above that story's floor"
                                   : "keep bottom + height within the story's height, so the floor meets the wall in solid wall");
                        continue;
                    }
                    list.Add((new PanelOpening(s == 0 || stories.Count == 1 ? oid : $"{oid} (story {s})", left, lo, w, h), oo));
                }
            }
            return ok ? list : null;
        }

        private StructureModel? ReadStoryStiffness(JsonNode t, string id, double[] elevations)
        {
            string fix = $"give one stiffness per story ({elevations.Length - 1}), story 1 first, in {_units.Label(Quantity.TranslationalStiffness)}";
            if (t is not JsonList a) { sink.Add(t, "'storyStiffness' must be an array of numbers", fix); return null; }
            if (a.Count != elevations.Length - 1) { sink.Add(t, $"'storyStiffness' has {a.Count} values for {elevations.Length - 1} stories", fix); return null; }
            var k = new List<double>();
            foreach (var v in a)
            {
                if (v.Type is JsonKind.Integer or JsonKind.Float && (double)v > 0 && (double)v <= JsonFields.MaxMagnitude) k.Add(SI((double)v, Quantity.TranslationalStiffness));
                else sink.Add(v, $"a story stiffness must be a number greater than zero, found {JsonFields.Describe(v)}", fix);
            }
            return k.Count == a.Count ? PlanLineModels.StoryStiffness(id, fileName, elevations, k, _units) : null;
        }

        private StructureModel? ReadLineFile(JsonNode at, string relative, out string full, out JsonMap? lineRoot)
        {
            full = relative;
            lineRoot = null;
            string folder = Path.GetDirectoryName(Path.GetFullPath(fileName)) ?? ".";
            string candidate;
            try { candidate = Path.GetFullPath(Path.Combine(folder, relative)); }
            catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
            {
                sink.Add(at, $"\"{relative}\" is not a usable file name", "give the name of a file in the building file's folder, e.g. \"line-a.json\"");
                return null;
            }
            string rel = Path.GetRelativePath(folder, candidate);
            if (Path.IsPathRooted(relative) || Path.IsPathRooted(rel) || rel == ".." || rel.StartsWith(".." + Path.DirectorySeparatorChar, StringComparison.Ordinal) || rel.StartsWith("../", StringComparison.Ordinal))
            {
                sink.Add(at, $"the line file \"{relative}\" lies outside the building file's folder", "put the line's model in the building file's folder (or below it) and give its path relative to the building file");
                return null;
            }
            full = candidate;
            if (!File.Exists(candidate))
            {
                sink.Add(at, $"the line file \"{relative}\" does not exist (looked for {candidate})", "check the file name; it is read relative to the building file");
                return null;
            }
            JsonNode root;
            try
            {
                string text = ModelFile.ReadText(candidate, out var input);   // as every model: regular file, bounded, strict JSON
                if (!_lineInputs.Any(x => x.Path == input.Path)) _lineInputs.Add(input);
                root = ReadTree(text, candidate);
            }
            catch (ModelInputException e)
            {
                sink.Add(at, $"cannot read the line file \"{relative}\" (its problems are listed under its own name)", "correct the line file");
                _lineFileProblems.AddRange(e.Diagnostics);
                return null;
            }
            if (root is not JsonMap o) { sink.Add(at, $"the line file \"{relative}\" is not a JSON object", "give a planar model {...} in the file"); return null; }
            var lineSink = new DiagnosticSink(candidate);
            if (ModelLimits.CheckCounts(o, lineSink)) { _lineFileProblems.AddRange(lineSink.Items); return null; }
            var m = new Builder(lineSink, candidate) { _partOfBuilding = true }.Build(o);
            _lineFileProblems.AddRange(lineSink.Items);
            lineRoot = o;
            return m;
        }

        /// <summary>
        /// A line whose model is one plane-stress panel and nothing else: the panel's floor ties are where the floors
        /// hold it, so its base must stand at the building's base and its floor levels and top at the building's levels.
        /// The tie index at each building level above the base, or null (with a diagnostic).
        /// </summary>
        private int[]? MatchPanelLevels(StructureModel m, List<PlanLevel> levels, JsonMap at, string id, double tol, out int panel)
        {
            panel = -1;
            string want = string.Join(", ", levels.Skip(1).Select(l => _units.FromSI(l.Elevation - levels[0].Elevation, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)));
            if (m.Panels.Count != 1 || m.Nodes.Count > 0)
            {
                sink.Add(at, $"line \"{id}\" is given by {m.Panels.Count} panel(s){(m.Nodes.Count > 0 ? " and nodes without members" : "")}: a line of panels alone holds one panel",
                    "give each wall panel its own line, or link the panels to a frame of the line (\"links\", docs/panels.md)");
                return null;
            }
            var p = m.Panels[0];
            if (p.Links.Count > 0 || !p.FloorTies)
            {
                sink.Add(at, $"the panel of line \"{id}\" has {(p.Links.Count > 0 ? "links" : "\"floorTies\": false")}, so the floors cannot hold it by its floor ties",
                    "give the panel \"floorTies\": true (the default) and no links: the floors hold a panel line at its floor levels and top");
                return null;
            }
            var own = p.Levels.Select(l => p.Y0 + l).Prepend(p.Y0).ToList();
            if (own.Count != levels.Count || own.Zip(levels).Any(q => Math.Abs(q.First - q.Second.Elevation) > tol))
            {
                string got = string.Join(", ", p.Levels.Select(l => _units.FromSI(l, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)));
                sink.Add(at, $"the panel of line \"{id}\" stands at y = {_units.FromSI(p.Y0, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)} with floor levels and top at {got} above its base, not at the building's levels",
                    $"give the panel \"y\" at the base's elevation ({_units.FromSI(levels[0].Elevation, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)} {_units.LengthSymbol}), \"floorLevels\" and \"height\" so that its levels are the building's: {want} {_units.LengthSymbol} above the base");
                return null;
            }
            panel = 0;
            return Enumerable.Range(0, levels.Count - 1).ToArray();
        }

        /// <summary>The line's node at each building level above the base, or null (with a diagnostic) when its levels do not match.</summary>
        private int[]? MatchLineLevels(StructureModel m, List<PlanLevel> levels, JsonMap at, string id, double tol)
        {
            // A panel without links stands beside the line's frame as a structure of its own (docs/panels.md): the floors
            // could not reach it through the frame's levels, and its stiffness would be silently left out.
            if (m.Panels.FirstOrDefault(p => p.Links.Count == 0) is { } loose)
            {
                sink.Add(at, $"panel \"{loose.Id}\" of line \"{id}\" has no links to the line's frame, so it would stand beside the line without being part of it",
                    "link the panel to the frame's nodes (\"links\", docs/panels.md), or give it as a line of its own (a planar model of that panel alone)");
                return null;
            }
            var own = m.Building.Levels;
            string want = string.Join(", ", levels.Select(l => _units.FromSI(l.Elevation, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)));
            string fix = $"give the line's model \"levels\" at the building's elevations ({want} {_units.LengthSymbol}), the base first";
            if (own.Count != levels.Count || own.Zip(levels).Any(p => Math.Abs(p.First.Elevation - p.Second.Elevation) > tol))
            {
                string got = string.Join(", ", own.Select(l => _units.FromSI(l.Elevation, Quantity.Length).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)));
                sink.Add(at, $"the levels of line \"{id}\" ({(own.Count == 0 ? "none" : got)}) do not match the building's levels", fix);
                return null;
            }
            var nodes = new int[levels.Count - 1];
            for (int i = 1; i < levels.Count; i++)
            {
                var l = own[i];
                if (l.TiedNodes.Count > 0) nodes[i - 1] = l.TiedNodes[0];
                else if (l.Nodes.Count == 1) nodes[i - 1] = l.Nodes[0];
                else
                {
                    sink.Add(at, $"level \"{l.Id}\" of line \"{id}\" has {l.Nodes.Count} nodes and no rigid diaphragm, so the floor cannot be tied to it", "give the line's level \"diaphragm\": \"rigid\" (the default)");
                    return null;
                }
            }
            return nodes;
        }

        private List<PlanLoadCase> ReadPlanLoads(JsonFields pf, List<PlanLevel> levels, double ecc)
        {
            var items = pf.Objects("loads", !pf.Has("seismic"), "add \"loads\": [{\"id\": \"EX\", \"direction\": \"x\", \"forces\": [...]}] (docs/plan.md)");
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var list = new List<PlanLoadCase>();
            int floors = levels.Count - 1;
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "load");
                string desc = f.OptionalString("description", "give a description as a string") ?? "";
                bool hasForces = f.Has("forces"), hasPoints = f.Has("points");
                if (hasForces == hasPoints)
                {
                    sink.Add(o, hasForces ? "the load has both 'forces' and 'points'" : "the load has neither 'forces' nor 'points'",
                        "give \"direction\" with \"forces\" (one per floor, at the centres of mass) or \"points\" (forces and torques at given points)");
                    f.RejectUnknownKeys();
                    continue;
                }
                if (hasForces)
                {
                    string? dir = f.RequiredString("direction", "give \"direction\": \"x\" or \"y\"");
                    if (dir is not null and not ("x" or "y")) { sink.Add(f.Token("direction"), $"unknown direction \"{dir}\"", "give \"x\" or \"y\""); dir = null; }
                    bool accidental = f.OptionalBool("accidentalTorsion", true, "give true (the default: also the two cases with the centre of mass shifted) or false");
                    var t = f.Token("forces")!;
                    var forces = new List<double>();
                    if (t is JsonList a && a.Count == floors)
                    {
                        foreach (var v in a)
                            if (v.Type is JsonKind.Integer or JsonKind.Float && double.IsFinite((double)v) && Math.Abs((double)v) <= JsonFields.MaxMagnitude) forces.Add(SI((double)v, Quantity.Force));
                            else sink.Add(v, $"a floor force must be a number, found {JsonFields.Describe(v)}", $"give the force in {_units.ForceSymbol}");
                    }
                    else sink.Add(t, $"'forces' must be an array of {floors} numbers (one per floor, lowest first)", $"give one force per level above the base, in {_units.ForceSymbol}");
                    f.RejectUnknownKeys();
                    if (id is null || dir is null || forces.Count != floors) continue;
                    list.Add(PlanLoads.AtCentreOfMass(id, id, desc, dir, 0, levels, forces, 0));
                    if (accidental && ecc > 0)
                    {
                        list.Add(PlanLoads.AtCentreOfMass(id + "+ecc", id, desc, dir, +1, levels, forces, ecc));
                        list.Add(PlanLoads.AtCentreOfMass(id + "-ecc", id, desc, dir, -1, levels, forces, ecc));
                    }
                }
                else
                {
                    var loads = new List<PlanFloorLoad>();
                    foreach (var po in f.Objects("points", true, "give \"points\": [{\"level\": \"...\", \"at\": [x, y], \"fx\": ..., \"fy\": ..., \"torque\": ...}]"))
                    {
                        var g = new JsonFields(po, sink);
                        var lid = g.RequiredString("level", "give the id of a level above the base");
                        var p = g.Token("at") is { } at ? ReadPoint(at, "'at'") : null;
                        double fx = SI(g.OptionalNumber("fx", 0, $"give the force along X in {_units.ForceSymbol}"), Quantity.Force);
                        double fy = SI(g.OptionalNumber("fy", 0, $"give the force along Y in {_units.ForceSymbol}"), Quantity.Force);
                        double tz = SI(g.OptionalNumber("torque", 0, $"give the torque in {_units.Label(Quantity.Moment)}, counter-clockwise positive"), Quantity.Moment);
                        g.RejectUnknownKeys();
                        int li = levels.FindIndex(l => l.Id == lid);
                        if (lid is not null && li < 1) { sink.Add(g.Token("level"), $"\"{lid}\" is not a level above the base", $"use one of: {string.Join(", ", levels.Skip(1).Select(l => l.Id))}"); continue; }
                        if (li < 1) continue;
                        var q = p ?? levels[li].CentreOfMass;
                        loads.Add(new PlanFloorLoad(li, fx, fy, tz + q.X * fy - q.Y * fx));
                    }
                    f.RejectUnknownKeys();
                    if (id is not null) list.Add(new PlanLoadCase(id, id, desc, "", 0, loads));
                }
            }
            if (items.Count > 0 && list.Count == 0 && !sink.Any) sink.Add(pf.Object, "the building has no usable load", "add a load under \"loads\"");
            return list;
        }
    }
}
