using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of a panel's "links": rigid links from frame nodes to segments of the panel's edges (docs/panels.md,
// "Panels in a frame"). Every problem is reported at its key before any work.
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>Every link read, with its panel and its JSON object (for the checks that need the supports).</summary>
        private readonly List<(string Panel, PanelLink Link, JsonMap At)> _panelLinks = [];

        /// <summary>Reads a panel's "links" (before the panel's unknown-key check).</summary>
        private List<PanelLink> ReadPanelLinks(JsonFields panel, string? panelId, double length, double height)
        {
            var list = new List<PanelLink>();
            string lu = _units.LengthSymbol;
            foreach (var o in panel.Objects("links", false, "write \"links\": [ {\"node\": \"...\", \"edge\": \"top\"} ] or {\"node\": \"...\", \"edge\": \"right\", \"from\": ..., \"to\": ...}"))
            {
                var f = new JsonFields(o, sink);
                int node = NodeRef(f, "node", "frame node the panel edge is tied to");
                var edgeName = f.RequiredString("edge", "give \"left\", \"right\" or \"top\"");
                PanelEdge? edge = edgeName switch { "left" => PanelEdge.Left, "right" => PanelEdge.Right, "top" => PanelEdge.Top, null => null, _ => null };
                if (edgeName == "bottom")
                    sink.Add(f.Token("edge"), "a link cannot be on the bottom edge: the panel's base is held in x and y", "link the node to \"left\", \"right\" or \"top\", or support the frame node instead");
                else if (edgeName is not null && edge is null)
                    sink.Add(f.Token("edge"), $"unknown edge \"{edgeName}\"", "use \"left\", \"right\" or \"top\"");
                bool side = edge is PanelEdge.Left or PanelEdge.Right;
                double span = side ? height : length;
                string along = side ? "a height above the panel base" : "a distance from the panel's left end";
                double from = side
                    ? SI(f.RequiredNumber("from", $"give the segment's start as {along} in {lu}"), Quantity.Length)
                    : SI(f.OptionalNumber("from", 0, $"give the segment's start as {along} in {lu}"), Quantity.Length);
                double to = side
                    ? SI(f.RequiredNumber("to", $"give the segment's end as {along} in {lu}"), Quantity.Length)
                    : f.Has("to") ? SI(f.RequiredNumber("to", $"give the segment's end as {along} in {lu}"), Quantity.Length) : length;
                f.RejectUnknownKeys();
                if (edge is null || node < 0 || !double.IsFinite(from) || !double.IsFinite(to) || !(span > 0)) continue;
                double tol = 1e-9 * Math.Max(length, height);
                bool bad = false;
                if (from < -tol || from > span + tol)
                { sink.Add(f.Token("from") ?? o, $"the segment starts at {Show(from)} {lu}, off the panel's {edgeName} edge (0 to {Show(span)} {lu})", $"give {along} from 0 to {Show(span)} {lu}"); bad = true; }
                if (to < -tol || to > span + tol)
                { sink.Add(f.Token("to") ?? o, $"the segment ends at {Show(to)} {lu}, off the panel's {edgeName} edge (0 to {Show(span)} {lu})", $"give {along} from 0 to {Show(span)} {lu}"); bad = true; }
                if (!bad && to < from - tol)
                { sink.Add(f.Token("to") ?? o, $"the segment ends ({Show(to)} {lu}) before it starts ({Show(from)} {lu})", "give \"from\" at or below \"to\""); bad = true; }
                if (!bad && side && from <= tol)
                { sink.Add(f.Token("from") ?? o, "the segment reaches the panel's base, which is held in x and y: a held node cannot also follow the frame node", "start the segment above the base (\"from\" > 0)"); bad = true; }
                if (bad) continue;
                var link = new PanelLink(node, edge.Value, from, to);
                list.Add(link);
                _panelLinks.Add((panelId ?? "", link, o));
            }
            return list;
        }

        /// <summary>
        /// Reads a panel's optional "line": the line of resistance it belongs to in the story results (default: its own
        /// line, named by the panel's id). Text, as on members; blank is refused.
        /// </summary>
        private string? ReadPanelLine(JsonFields panel)
        {
            if (!panel.Has("line")) return null;
            var line = panel.OptionalString("line", "give the name of the panel's line of resistance, e.g. \"line\": \"grid 1\"")?.Trim();
            if (line is { Length: 0 })
            { sink.Add(panel.Token("line"), "the panel's \"line\" is blank", "name the line of resistance, or leave \"line\" out (the panel is then its own line, named by its id)"); return null; }
            return line;
        }

        /// <summary>
        /// The checks that need the panel's grid (run only when its layout is sound): a segment must hold a mesh node,
        /// may not share a node with a floor tie, another link of the panel or its held base, and a frame node is
        /// linked to a panel once.
        /// </summary>
        private void CheckPanelLinks(WallPanel panel, JsonMap panelObject)
        {
            if (panel.Links.Count == 0) return;
            var plan = PanelLayout.Plan(panel);
            if (plan.Problems.Count > 0 || plan.XLines is null || plan.YLines is null) return;
            string lu = _units.LengthSymbol;
            double tol = 1e-9 * Math.Max(panel.Length, panel.Height);
            var mine = _panelLinks.Where(l => l.Panel == panel.Id && panel.Links.Contains(l.Link)).ToList();
            var taken = new List<(int Index, double[] Positions)>();
            for (int i = 0; i < mine.Count; i++)
            {
                var (_, link, at) = mine[i];
                string node = _nodesList![link.Node].Id;
                var positions = SegmentPositions(panel, plan, link);
                if (positions.Length == 0)
                {
                    sink.Add(at, $"panel \"{panel.Id}\": the link of node \"{node}\" covers {Show(link.From)} to {Show(link.To)} {lu} of the {Edge(link.Edge)} edge, where the mesh has no node",
                        "widen the segment to reach a grid line (an end, a floor level or an opening edge), or refine the mesh");
                    continue;
                }
                if (panel.FloorTies && (link.Edge == PanelEdge.Top || panel.Levels.Any(l => l >= link.From - tol && l <= link.To + tol)))
                    sink.Add(at, $"panel \"{panel.Id}\": the link of node \"{node}\" holds a node of a floor tie ({(link.Edge == PanelEdge.Top ? "the top" : "a floor level")}), and a node cannot both share its level's displacement and follow the frame node",
                        "write \"floorTies\": false in the panel (the frame's beams then carry the floors), or keep the segment off the floor levels");
                for (int j = 0; j < i; j++)
                {
                    var (_, other, _) = mine[j];
                    if (other.Node == link.Node)
                        sink.Add(at, $"panel \"{panel.Id}\": node \"{node}\" is linked to this panel twice", "give one link per node and panel, with one segment covering both");
                    else if (Overlap(panel, link, other, tol))
                        sink.Add(at, $"panel \"{panel.Id}\": the link of node \"{node}\" overlaps the link of node \"{_nodesList[other.Node].Id}\" (a panel node would follow two frame nodes)",
                            "make the segments end apart from each other, with at least one element between them");
                }
            }
        }

        /// <summary>
        /// A restraint at a linked frame node would fight the link. (The seismic block, its second-order check included,
        /// sees the linked panels: condensed into K, their vertical loads in P_x and in the story P-delta terms.)
        /// </summary>
        private void CheckPanelLinkSupports(IReadOnlyList<Support> supports)
        {
            foreach (var (panel, link, at) in _panelLinks)
            {
                var s = supports.FirstOrDefault(x => x.Node == link.Node);
                if (s is null || !(s.RestrainX || s.RestrainY || s.RestrainRZ)) continue;
                sink.Add(at, $"panel \"{panel}\": node \"{_nodesList![link.Node].Id}\" is linked to the panel and also held by a support, which would hold the panel's edge segment against the frame",
                    "remove the support at that node (the panel's base is where the wall is held), or remove the link");
            }
        }

        /// <summary>Frame nodes tied to a panel edge (a node linked to a panel and nothing else is connected).</summary>
        private IEnumerable<int> PanelLinkedNodes() => _panelLinks.Select(l => l.Link.Node);

        /// <summary>Positions (m, along the edge) of the mesh nodes of a segment: grid lines, and mid-side nodes of the 9-node element.</summary>
        private static double[] SegmentPositions(WallPanel panel, PanelLayout.GridPlan plan, PanelLink link)
        {
            var lines = link.Edge == PanelEdge.Top ? plan.XLines! : plan.YLines!;
            var all = new List<double>(lines);
            if (panel.Mesh.Element == PanelElementKind.Quad9)
                for (int i = 0; i + 1 < lines.Length; i++) all.Add(0.5 * (lines[i] + lines[i + 1]));
            double tol = 1e-9 * Math.Max(panel.Length, panel.Height);
            return all.Where(v => v >= link.From - tol && v <= link.To + tol).Order().ToArray();
        }

        /// <summary>Two segments overlap when they share a stretch of one edge, or meet at a corner node.</summary>
        private static bool Overlap(WallPanel p, PanelLink a, PanelLink b, double tol)
        {
            if (a.Edge == b.Edge) return a.From <= b.To + tol && b.From <= a.To + tol;
            // A corner: the top of an end (height H) is the top edge's end (0 on the left, length on the right).
            static bool Holds(WallPanel p, PanelLink s, PanelEdge corner, double tol) => s.Edge switch
            {
                PanelEdge.Top => corner == PanelEdge.Left ? s.From <= tol : s.To >= p.Length - tol,
                _ => s.Edge == corner && s.To >= p.Height - tol,
            };
            var side = a.Edge == PanelEdge.Top ? b : a;
            var top = a.Edge == PanelEdge.Top ? a : b;
            return top.Edge == PanelEdge.Top && side.Edge != PanelEdge.Top && Holds(p, side, side.Edge, tol) && Holds(p, top, side.Edge, tol);
        }

        private static string Edge(PanelEdge e) => e.ToString().ToLowerInvariant();

        private string Show(double si) => _units.FromSI(si, Quantity.Length).ToString("G6", System.Globalization.CultureInfo.InvariantCulture);
    }
}
