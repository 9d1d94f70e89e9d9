using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of "footings": a rigid footing on soil under a supported node, whose static stiffnesses become the support's
// springs (docs/footings.md).
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>Standard gravity (m/s²), for the soil's mass density from its unit weight.</summary>
        private const double StandardGravity = 9.80665;

        /// <summary>Embedment deeper than this many times the footing's smaller plan side is refused as implausible.</summary>
        private const double MaxEmbedmentRatio = 2.0;

        private static readonly string[] FootingFormulaNames = ["pais-kausel", "gazetas"];

        /// <summary>
        /// Reads "footings" and replaces, in <paramref name="supports"/>, the restraints of each footing's node by the
        /// footing's springs. Problems go to the sink; a footing that failed to read changes nothing.
        /// </summary>
        private List<Footing> ReadFootings(JsonFields top, List<Support> supports, List<Member> members, List<Node> nodes)
        {
            var list = new List<Footing>();
            var items = top.Objects("footings", false, "give \"footings\" as an array of {\"id\": \"...\", \"node\": \"...\", \"length\": ..., \"width\": ..., \"soil\": {...}} (docs/footings.md)");
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var onNode = new HashSet<int>();
            string len = _units.LengthSymbol;
            foreach (var o in items)
            {
                var f = new JsonFields(o, sink);
                var id = ReadId(f, seen, "footing");
                f.OptionalString("description", "give a description as a string");
                // Under a wall panel's base instead of a node: checked against the panel once the panels are read (CheckPanelFootings).
                string? panelId = f.Has("panel") ? f.RequiredString("panel", "give the id of the wall panel whose base stands on the footing") : null;
                if (f.Has("panel") && f.Has("node"))
                    sink.Add(o, "the footing names both a \"node\" and a \"panel\"", "give \"node\" for a footing under a supported node, or \"panel\" for one under a wall panel's base, not both");
                int n = f.Has("panel") ? -1 : NodeRef(f, "node", "supported node the footing stands under");
                double length = Positive(f, "length", Quantity.Length, "footing length", $"give the footing's plan side in the model's plane (along x) > 0 in {len}");
                double width = Positive(f, "width", Quantity.Length, "footing width", $"give the footing's plan side across the model's plane > 0 in {len}");
                const string dfix = "give the depth of the footing's base below grade ≥ 0, or leave \"embedment\" out for a surface footing";
                double embedment = SI(f.OptionalNumber("embedment", 0, dfix + $" ({len})"), Quantity.Length);
                if (embedment < 0) sink.Add(f.Token("embedment"), $"'embedment' is negative ({_units.FromSI(embedment, Quantity.Length):G6} {len})", dfix);
                var (g0, reduction, nu) = ReadSoil(f);
                var formulasText = f.OptionalString("formulas", "give \"formulas\": \"pais-kausel\" (the default) or \"gazetas\"") ?? "pais-kausel";
                var formulas = formulasText switch { "pais-kausel" => FootingFormulaSet.PaisKausel, "gazetas" => FootingFormulaSet.Gazetas, _ => (FootingFormulaSet)(-1) };
                if ((int)formulas < 0) sink.Add(f.Token("formulas"), $"unknown formulas \"{formulasText}\"", "use \"pais-kausel\" (Pais & Kausel 1988, the default) or \"gazetas\" (Gazetas 1991)");
                var directions = ReadSpringDirections(f);
                f.RejectUnknownKeys();

                if (id is null || (n < 0 && panelId is null) || (panelId is not null && f.Has("node")) || !(length > 0 && width > 0) || !(embedment >= 0) || !(g0 > 0) || !(reduction > 0 && reduction <= 1)
                    || !(nu > 0 && nu < 0.5) || (int)formulas < 0 || directions is null)
                    continue;
                if (panelId is not null)
                {
                    double smallerSide = Math.Min(length, width);
                    if (embedment > MaxEmbedmentRatio * smallerSide)
                    {
                        sink.Add(f.Token("embedment"), $"an embedment of {_units.FromSI(embedment, Quantity.Length):G6} {len} is more than {MaxEmbedmentRatio:0} times the footing's smaller side ({_units.FromSI(smallerSide, Quantity.Length):G6} {len}): outside the range of the shallow-footing formulas",
                            "check the embedment (the depth of the footing's base below grade, not its elevation)");
                        continue;
                    }
                    var panelSprings = FootingSoilSprings.Compute(formulas, length, width, embedment, g0 * reduction, nu);
                    list.Add(new Footing(id, -1, length, width, embedment, g0, reduction, nu, formulas, directions, panelSprings, []) { Panel = panelId, At = o });
                    continue;
                }
                if (!onNode.Add(n)) { sink.Add(o, $"a second footing under node \"{nodes[n].Id}\"", "give each supported node at most one footing"); continue; }
                int si = supports.FindIndex(s => s.Node == n);
                if (si < 0)
                {
                    sink.Add(f.Token("node"), $"node \"{nodes[n].Id}\" has no support, so there is nothing for the footing to stand under",
                        $"add {{\"node\": \"{nodes[n].Id}\", \"type\": \"fixed\"}} under \"supports\"; the footing then replaces its restraints by springs");
                    continue;
                }
                double smaller = Math.Min(length, width);
                if (embedment > MaxEmbedmentRatio * smaller)
                {
                    sink.Add(f.Token("embedment"), $"an embedment of {_units.FromSI(embedment, Quantity.Length):G6} {len} is more than {MaxEmbedmentRatio:0} times the footing's smaller side ({_units.FromSI(smaller, Quantity.Length):G6} {len}): that is a pier or caisson, outside the range of the shallow-footing formulas",
                        "check the embedment (the depth of the footing's base below grade, not its elevation); for a deep foundation give the support springs from a pile or caisson analysis instead");
                    continue;
                }
                if (!CheckFootingCarries(f, n, length, width, members, nodes)) continue;

                var springs = FootingSoilSprings.Compute(formulas, length, width, embedment, g0 * reduction, nu);
                var s = supports[si];
                bool ok = true;
                foreach (var d in directions)
                    if (s.Spring(d) > 0)
                    {
                        sink.Add(f.Token("node"), $"the support at node \"{nodes[n].Id}\" already has a spring on '{DirectionKey(d)}', and the footing would set another",
                            $"remove the support's own spring on '{DirectionKey(d)}', or leave '{DirectionKey(d)}' out of the footing's \"springs\"");
                        ok = false;
                    }
                if (!ok) continue;
                bool x = directions.Contains(Dof.X), y = directions.Contains(Dof.Y), rz = directions.Contains(Dof.RZ);
                supports[si] = s with
                {
                    Type = "footing",
                    RestrainX = s.RestrainX && !x, RestrainY = s.RestrainY && !y, RestrainRZ = s.RestrainRZ && !rz,
                    SpringX = x ? springs.Sliding : s.SpringX,
                    SpringY = y ? springs.Vertical : s.SpringY,
                    SpringRZ = rz ? springs.Rocking : s.SpringRZ,
                };
                var cautions = new List<string>();
                if (embedment > 0.5 * smaller)
                    cautions.Add("the embedment is more than half the footing's smaller side: the embedment factors count on sidewall contact that backfill often does not give; the surface footing is the lower bound (common practice)");
                if (reduction == 1)
                    cautions.Add("no strain-compatible reduction of the soil modulus was given (G/G₀ = 1): under strong shaking G is lower (give \"modulusReduction\" in the soil)");
                list.Add(new Footing(id, n, length, width, embedment, g0, reduction, nu, formulas, directions, springs, cautions));
            }
            _footingList = list;
            return list;
        }

        /// <summary>
        /// Each footing under a panel: the panel exists, stands alone (no links: a linked panel's base on a footing is not
        /// offered), has one footing at most, and the footing is at least as long as the wall it carries.
        /// </summary>
        private void CheckPanelFootings(List<Footing> footings, IReadOnlyList<WallPanel> panels)
        {
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var ft in footings.Where(x => x.Panel is not null))
            {
                var at = ft.At as JsonMap;
                var panel = panels.FirstOrDefault(p => p.Id == ft.Panel);
                if (panel is null) { sink.Add(at?["panel"] ?? at, $"no wall panel \"{ft.Panel}\" for footing \"{ft.Id}\" to stand under", $"give the id of one of the panels ({string.Join(", ", panels.Select(p => $"\"{p.Id}\""))})"); continue; }
                if (!seen.Add(panel.Id)) sink.Add(at, $"a second footing under panel \"{panel.Id}\"", "give each panel at most one footing");
                if (panel.Links.Count > 0)
                    sink.Add(at?["panel"] ?? at, $"panel \"{panel.Id}\" is linked to the frame; a linked panel's base on a footing is not offered",
                        "put the footing under a panel that stands alone, or remove the panel's links");
                if (panel.Mesh.Refinements > 1)
                    sink.Add(at?["panel"] ?? at, $"panel \"{panel.Id}\" asks for a mesh study (\"refinements\": {panel.Mesh.Refinements}), which is not run for a panel on a footing",
                        "give the panel \"refinements\": 1 (its results are then of the mesh given), or study the fixed-base panel in a model of its own");
                if (ft.Length < panel.Length * (1 - 1e-9))
                    sink.Add(at?["length"] ?? at, $"footing \"{ft.Id}\" is {_units.FromSI(ft.Length, Quantity.Length):G6} {_units.LengthSymbol} long, shorter than the {_units.FromSI(panel.Length, Quantity.Length):G6} {_units.LengthSymbol} wall panel \"{panel.Id}\" it carries",
                        "give the footing's length in the wall's plane at least the wall's length (a footing is as long as its wall or longer)");
            }
        }

        private static string DirectionKey(Dof d) => d switch { Dof.X => "x", Dof.Y => "y", _ => "rz" };

        /// <summary>G₀ (N/m²), G/G₀ and ν from "soil"; NaN where missing or wrong (reported).</summary>
        private (double G0, double Reduction, double Nu) ReadSoil(JsonFields f)
        {
            string stress = _units.Label(Quantity.Stress), len = _units.LengthSymbol, fu = _units.ForceSymbol;
            const string sfix = "give \"soil\": {\"shearModulus\": ..., \"poissonRatio\": ...} or {\"shearWaveVelocity\": ..., \"unitWeight\": ..., \"poissonRatio\": ...}";
            var so = f.OptionalObject("soil", sfix);
            if (so is null) { if (!f.Has("soil")) sink.Add(f.Object, "missing required key 'soil'", sfix); return (double.NaN, double.NaN, double.NaN); }
            var s = new JsonFields(so, sink);
            double g0 = double.NaN;
            bool hasG = s.Has("shearModulus"), hasVs = s.Has("shearWaveVelocity"), hasGamma = s.Has("unitWeight");
            if (hasG && (hasVs || hasGamma))
                sink.Add(so, "both 'shearModulus' and 'shearWaveVelocity'/'unitWeight' are given", "give the soil's shear modulus, or its shear-wave velocity and unit weight, not both");
            else if (hasG)
            {
                double g = s.RequiredNumber("shearModulus", $"give the soil's small-strain shear modulus G₀ > 0 in {stress}");
                if (double.IsFinite(g) && g <= 0)
                    sink.Add(s.Token("shearModulus"), $"the soil shear modulus is {g}; it must be greater than zero",
                        $"give G₀ > 0 in {stress} (the model's stress unit): e.g. 1000 ksf ≈ 6.9 ksi for a medium-dense sand; or give \"shearWaveVelocity\" and \"unitWeight\"");
                else g0 = SI(g, Quantity.Stress);
            }
            else if (hasVs || hasGamma)
            {
                double vs = s.RequiredNumber("shearWaveVelocity", $"give the shear-wave velocity Vs > 0 in {len}/s");
                double gamma = s.RequiredNumber("unitWeight", $"give the soil's unit weight γ > 0 in {fu}/{len}³");
                if (double.IsFinite(vs) && vs <= 0) sink.Add(s.Token("shearWaveVelocity"), $"the shear-wave velocity is {vs}; it must be greater than zero", $"give Vs > 0 in {len}/s");
                if (double.IsFinite(gamma) && gamma <= 0) sink.Add(s.Token("unitWeight"), $"the unit weight is {gamma}; it must be greater than zero", $"give γ > 0 in {fu}/{len}³");
                if (vs > 0 && gamma > 0)
                {
                    double vsSI = _units.ToSI(vs, Quantity.Length);                                   // m/s
                    double gammaSI = gamma * _units.ForceScale / Math.Pow(_units.LengthScale, 3);     // N/m³
                    g0 = gammaSI / StandardGravity * vsSI * vsSI;
                }
            }
            else sink.Add(so, "the soil has neither 'shearModulus' nor 'shearWaveVelocity'", sfix);
            const string nfix = "give the soil's Poisson's ratio strictly between 0 and 0.5 (about 0.3 for sand, 0.35–0.45 for clay; use 0.49 rather than 0.5 for saturated clay)";
            double nu = s.RequiredNumber("poissonRatio", nfix);
            if (double.IsFinite(nu) && !(nu > 0 && nu < 0.5)) { sink.Add(s.Token("poissonRatio"), $"the soil's Poisson's ratio {nu} is outside (0, 0.5)", nfix); nu = double.NaN; }
            const string rfix = "give \"modulusReduction\" G/G₀ in (0, 1] for the strain level of the design motion (e.g. 0.5), or leave it out for 1";
            double r = s.OptionalNumber("modulusReduction", 1.0, rfix);
            if (double.IsFinite(r) && !(r > 0 && r <= 1)) { sink.Add(s.Token("modulusReduction"), $"'modulusReduction' is {r}, outside (0, 1]", rfix); r = double.NaN; }
            s.RejectUnknownKeys();
            return (g0, r, nu);
        }

        private List<Dof>? ReadSpringDirections(JsonFields f)
        {
            const string fix = "give \"springs\": [\"x\", \"y\", \"rz\"] (any of them; the default is all three): the directions the footing's springs replace the support's restraint";
            var t = f.Token("springs");
            if (t is null) return [Dof.X, Dof.Y, Dof.RZ];
            if (t is not JsonList a || a.Count == 0) { sink.Add(t, "'springs' must be a non-empty array of directions", fix); return null; }
            var list = new List<Dof>();
            foreach (var item in a)
            {
                Dof? d = item.Type == JsonKind.String ? (string?)item switch { "x" => Dof.X, "y" => Dof.Y, "rz" => Dof.RZ, _ => null } : null;
                if (d is null) { sink.Add(item, $"unknown direction {JsonFields.Describe(item)} in 'springs'", fix); return null; }
                if (list.Contains(d.Value)) { sink.Add(item, $"direction \"{DirectionKey(d.Value)}\" is listed twice in 'springs'", fix); return null; }
                list.Add(d.Value);
            }
            return list;
        }

        /// <summary>A footing must be at least as large in plan as the vertical walls or columns it carries (their section's depth and thickness).</summary>
        private bool CheckFootingCarries(JsonFields f, int n, double length, double width, List<Member> members, List<Node> nodes)
        {
            string len = _units.LengthSymbol;
            foreach (var m in members)
            {
                if (m.Start != n && m.End != n) continue;
                var a = nodes[m.Start]; var b = nodes[m.End];
                if (Math.Abs(a.X - b.X) > 1e-9 * Math.Max(1, Math.Abs(a.Y - b.Y))) continue;   // vertical members only
                if (!_sections.TryGetValue(m.SectionId, out var sec) || !(sec.Section.Depth > 0)) continue;
                double depth = sec.Section.Depth, thickness = sec.Section.Shape == "rectangle" ? sec.Section.A / depth : double.NaN;
                if (depth > length * (1 + 1e-9))
                {
                    sink.Add(f.Token("length"), $"the footing ({_units.FromSI(length, Quantity.Length):G6} {len} long in the model's plane) is shorter than member \"{m.Id}\" it carries ({_units.FromSI(depth, Quantity.Length):G6} {len} deep)",
                        "make the footing at least as long as the wall, or check that 'length' is the side in the model's plane and 'width' the side across it");
                    return false;
                }
                if (thickness > width * (1 + 1e-9))
                {
                    sink.Add(f.Token("width"), $"the footing ({_units.FromSI(width, Quantity.Length):G6} {len} wide) is narrower than member \"{m.Id}\" it carries ({_units.FromSI(thickness, Quantity.Length):G6} {len} thick)",
                        "make the footing at least as wide as the wall is thick");
                    return false;
                }
            }
            return true;
        }
    }
}

// Reading of the "footing-wall" comparison check (docs/footings.md).
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        private List<Footing> _footingList = [];

        private FootingWallCheck? ReadFootingWall(JsonFields f, string? id, string desc, double? tol, CheckLocation at, List<Member> members)
        {
            // The wall line itself reads as a "wall-line" check does (members base first, one section); only a cantilever
            // is meaningful on a rocking base.
            bool endsGiven = f.Has("ends");
            var line = ReadWallLine(f, id, desc, tol, at, members);
            if (endsGiven && line is not null && line.Ends.Any(e => e != CheckEnds.Cantilever))
            {
                sink.Add(f.Token("ends"), "a footing-wall check is a cantilever (top free); the base terms h²/K_θ and 1/K_h do not add to a pier held against rotation at the top",
                    "leave \"ends\" out (or give [\"cantilever\"])");
                return null;
            }
            var footingId = f.OptionalString("footing", "give the id of a footing listed under \"footings\", or leave it out to take the footing under the wall's base node");
            string fu = _units.ForceSymbol;
            double? weight = f.Has("topWeight")
                ? Positive(f, "topWeight", Quantity.Force, "weight at the top", $"give the weight lumped at the wall's top > 0 in {fu}, for the periods; or leave it out")
                : null;
            if (line is null || weight is <= 0) return null;
            Footing? footing = footingId is null
                ? _footingList.FirstOrDefault(x => x.Node == line.BaseNode)
                : _footingList.FirstOrDefault(x => x.Id == footingId);
            var nodes = _nodesList!;
            if (footing is null)
            {
                if (footingId is not null)
                    sink.Add(f.Token("footing"), $"unknown footing \"{footingId}\"", $"use the id of a footing listed under \"footings\"{Suggest(footingId, _footingList.Select(x => x.Id))}");
                else
                    sink.Add(f.Object, $"no footing stands under the wall's base node \"{nodes[line.BaseNode].Id}\"",
                        $"add a footing under \"{nodes[line.BaseNode].Id}\" (\"footings\": [{{\"id\": \"F1\", \"node\": \"{nodes[line.BaseNode].Id}\", ...}}], docs/footings.md), or check the wall as a \"wall-line\"");
                return null;
            }
            if (footing.Node != line.BaseNode)
            {
                sink.Add(f.Token("footing"), $"footing \"{footing.Id}\" stands under node \"{nodes[footing.Node].Id}\", not under the wall's base node \"{nodes[line.BaseNode].Id}\"",
                    "name the footing under the wall's lowest member, or list the wall's members from that footing up");
                return null;
            }
            return new FootingWallCheck(line.Id, desc, tol, at, line.Members, line.BaseNode, line.TopNode, footing.Id, weight);
        }
    }
}
