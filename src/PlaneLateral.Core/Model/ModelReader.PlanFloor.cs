using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>Reading a level's "floor" block of a building file (docs/plan.md, "Floors that bend").</summary>
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>The "floor" blocks of the building's levels, by level id, in file order.</summary>
        private readonly List<(string Level, JsonMap Block)> _floorBlocks = [];

        private List<PlanFloor> ReadFloors(List<PlanLevel> levels, List<PlanLine> lines)
        {
            var list = new List<PlanFloor>();
            foreach (var (levelId, o) in _floorBlocks)
            {
                int li = levels.FindIndex(l => l.Id == levelId);
                var f = new JsonFields(o, sink);
                const string kindFix = "give \"kind\": \"rigid\" (the default), \"semi-rigid\" (the floor as a deep beam in its plane) or \"flexible\" (simple spans between the lines)";
                var word = f.OptionalString("kind", kindFix) ?? "rigid";
                FloorKind? kind = word switch { "rigid" => FloorKind.Rigid, "semi-rigid" => FloorKind.SemiRigid, "flexible" => FloorKind.Flexible, _ => null };
                if (kind is null) sink.Add(f.Token("kind"), $"unknown floor kind \"{word}\"", kindFix);
                string stress = _units.Label(Quantity.Stress);
                double t = f.Has("thickness") ? Positive(f, "thickness", Quantity.Length, "floor", $"give the floor's thickness (its slab or effective thickness) in {_units.LengthSymbol}") : double.NaN;
                double e = double.NaN, g = double.NaN;
                bool hasMaterial = f.Has("material"), hasModuli = f.Has("E") || f.Has("G");
                if (hasMaterial && hasModuli)
                    sink.Add(o, "the floor has both 'material' and 'E'/'G'", "give the floor's \"material\" (an id under \"materials\") or its own \"E\" and \"G\", not both");
                else if (hasMaterial)
                {
                    var id = f.RequiredString("material", "give the id of a material listed under \"materials\"");
                    if (id is not null && _materials.TryGetValue(id, out var m)) { e = m.E; g = m.G; }
                    else if (id is not null) sink.Add(f.Token("material"), $"unknown material \"{id}\"", $"use one of: {string.Join(", ", _materials.Keys)}; or add it under \"materials\"");
                }
                else if (hasModuli)
                {
                    e = Positive(f, "E", Quantity.Stress, "floor", $"give the floor's in-plane modulus E > 0 in {stress}");
                    g = Positive(f, "G", Quantity.Stress, "floor", $"give the floor's in-plane shear modulus G > 0 in {stress} (an effective G for a deck)");
                }
                double shear = f.OptionalNumber("shearFactor", 1.2, "give the shear form factor of the floor's section, 1.2 for a solid rectangle");
                if (double.IsFinite(shear) && !(shear >= 1 && shear <= 10))
                    sink.Add(f.Token("shearFactor"), $"'shearFactor' {shear} is outside [1, 10]", "give 1.2 for a solid rectangular floor section");
                var openings = new List<PlanOpening>();
                foreach (var oo in f.Objects("openings", false, "give \"openings\": [{\"from\": [x, y], \"to\": [x, y]}] (rectangles with sides along X and Y)"))
                {
                    var of = new JsonFields(oo, sink);
                    var a = of.Token("from") is { } ta ? ReadPoint(ta, "'from'") : null;
                    var b = of.Token("to") is { } tb ? ReadPoint(tb, "'to'") : null;
                    if (!of.Has("from") || !of.Has("to")) sink.Add(oo, "an opening needs 'from' and 'to'", "give two opposite corners: {\"from\": [x1, y1], \"to\": [x2, y2]}");
                    of.RejectUnknownKeys();
                    if (a is null || b is null) continue;
                    var op = new PlanOpening(new PlanPoint(Math.Min(a.Value.X, b.Value.X), Math.Min(a.Value.Y, b.Value.Y)), new PlanPoint(Math.Max(a.Value.X, b.Value.X), Math.Max(a.Value.Y, b.Value.Y)));
                    if (!(op.Max.X > op.Min.X && op.Max.Y > op.Min.Y)) sink.Add(oo, "the opening has no area", "give two opposite corners of the hole");
                    else openings.Add(op);
                }
                f.RejectUnknownKeys();
                if (li == 0) sink.Add(o, $"level \"{levelId}\" is the base, which carries no floor", "give \"floor\" on the levels above the base");
                if (kind is null || li < 1) continue;
                var loc = new CheckLocation(fileName, o.Line, o.Column, DiagnosticSink.PathOf(o));
                var floor = new PlanFloor(li, kind.Value, t, e, g, shear, openings, loc);
                bool hasSection = double.IsFinite(t) || double.IsFinite(e);
                if (hasSection && !(double.IsFinite(t) && double.IsFinite(e) && double.IsFinite(g)))
                    sink.Add(o, $"the floor of level \"{levelId}\" gives part of its section", "give \"thickness\" and \"material\" (or \"E\" and \"G\") together");
                if (kind == FloorKind.SemiRigid && !hasSection)
                    sink.Add(o, $"the semi-rigid floor of level \"{levelId}\" has no section", "give the floor's \"thickness\" and \"material\" (or \"E\" and \"G\"): it is modelled as a deep beam in its plane");
                if (kind != FloorKind.Rigid || hasSection) CheckFloorLines(o, levelId, kind.Value, lines, hasSection);
                CheckOpenings(o, levels[li], openings);
                list.Add(floor);
            }
            return list;
        }

        /// <summary>
        /// A floor that bends spans between the lines in each direction: at least two lines along X and two along Y
        /// (lines at an angle count for both in the semi-rigid floor; the flexible floor's tributary split needs lines
        /// along X or Y).
        /// </summary>
        private void CheckFloorLines(JsonMap o, string levelId, FloorKind kind, List<PlanLine> lines, bool hasSection)
        {
            if (kind == FloorKind.Flexible && lines.FirstOrDefault(l => l.Cos != 0 && l.Sin != 0) is { } slanted)
                sink.Add(o, $"line \"{slanted.Id}\" stands at an angle under the flexible floor of level \"{levelId}\"", "a flexible floor shares its load by simple spans between lines along X or Y: turn the line to \"x\" or \"y\", or make the floor rigid or semi-rigid");
            string what = kind == FloorKind.Rigid ? "the floor's section (for the semi-rigid alternative)" : $"a {PlanFloor.Word(kind)} floor";
            // Lines at one position count once: a floor spans between two different positions at least.
            int Count(bool alongY) => lines.Where(l => alongY ? l.Sin != 0 : l.Cos != 0).Select(l => Math.Round(alongY ? l.X0 : l.Y0, 6)).Distinct().Count();
            foreach (var (dir, count) in new[] { ("x", Count(false)), ("y", Count(true)) })
                if (count < 2)
                    sink.Add(o, $"{what} of level \"{levelId}\" has {count} line{(count == 1 ? "" : "s")} along {dir} (by position); it spans between at least two",
                        $"add a line along {dir}, or make the floor rigid{(hasSection && kind == FloorKind.Rigid ? " without a section" : "")} (a rigid floor turns onto the other lines)");
        }

        /// <summary>Openings lie inside the floor's extent, and the floor stays whole across every cut.</summary>
        private void CheckOpenings(JsonMap o, PlanLevel level, List<PlanOpening> openings)
        {
            if (openings.Count == 0) return;
            var outline = level.Outline;
            double x0 = outline.Min(p => p.X), x1 = outline.Max(p => p.X), y0 = outline.Min(p => p.Y), y1 = outline.Max(p => p.Y);
            foreach (var op in openings)
                if (op.Min.X < x0 || op.Max.X > x1 || op.Min.Y < y0 || op.Max.Y > y1)
                {
                    sink.Add(o["openings"] ?? o, $"an opening of the floor of level \"{level.Id}\" lies outside the outline", "check the opening's corners against the outline");
                    return;
                }
            foreach (bool acrossX in new[] { true, false })
            {
                var stops = outline.Select(p => acrossX ? p.X : p.Y).Concat(openings.SelectMany(p => acrossX ? new[] { p.Min.X, p.Max.X } : new[] { p.Min.Y, p.Max.Y })).Distinct().Order().ToList();
                for (int i = 0; i + 1 < stops.Count; i++)
                {
                    double mid = 0.5 * (stops[i] + stops[i + 1]);
                    if (PlanFloorSection.Cut(outline, openings, mid, acrossX).Count == 0)
                    {
                        sink.Add(o["openings"] ?? o, $"the openings cut the floor of level \"{level.Id}\" in two along {(acrossX ? "x" : "y")} = {_units.FromSI(mid, Quantity.Length):0.###} {_units.LengthSymbol}",
                            "leave a strip of floor across every opening, or model the two parts as separate buildings");
                        return;
                    }
                }
            }
        }
    }
}
