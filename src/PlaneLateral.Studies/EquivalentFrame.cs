using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// Generates an equivalent frame of line members from a wall's elevation (docs/comparisons.md, "equivalent frame"):
/// <list type="bullet">
/// <item>Bands of openings (height ranges where openings overlap) are sliced at every opening edge; in each slice the
/// solid runs between openings are Timoshenko pier members at the run's centre, as wide as the run.</item>
/// <item>The solid strip between two bands, and a cantilever wall's strip above its top band, is a spandrel level:
/// horizontal beams at the strip's mid-height with the strip's real depth, rigid over the width of the piers they
/// join; pier ends are rigid over the half-depth of the strip (piers and spandrels overlap there).</item>
/// <item>The solid region below the lowest band (and, in a fixed-fixed wall, above the top band) is one wall member
/// of the wall's full length, joined to the piers by a rigid line along its face.</item>
/// <item>Where solid wall continues across a slice boundary (piers of different width meeting), and where two pier
/// joints overlap along a spandrel, the joints are joined by rigid links (members rigid over 99.8% of their length).</item>
/// <item>A cantilever wall whose openings reach its top has its pier tops tied by stiff axial links (the floor).</item>
/// </list>
/// The unit lateral force is shared equally by the top joints; the reported deflection is their mean.
/// </summary>
internal sealed class EquivalentFrame
{
    /// <summary>Factor on spandrel I and A_s for the "spandrels made rigid" estimate.</summary>
    public const double RigidFactor = 1e4;

    private const double RigidLinkFraction = 0.499; // each end; 0.2% flexible in the middle

    private sealed record Op(double X0, double X1, double Y0, double Y1);

    private enum LineKind { Ground, SolidFace, Internal, Spandrel, FreeTop, HeldTop }

    private sealed class JointLine(double y, LineKind kind, double depth)
    {
        public double Y { get; } = y;
        public LineKind Kind { get; } = kind;
        public double Depth { get; } = depth;
        public List<(int Node, double X, double Xa, double Xb)> Entries { get; } = [];
    }

    public StructureModel Model { get; }

    /// <summary>Nodes that carry the unit load (equal shares).</summary>
    public IReadOnlyList<int> LoadNodes { get; }

    /// <summary>Number of flexible spandrel members generated.</summary>
    public int SpandrelCount { get; }

    /// <summary>The shallowest spandrel's depth over its clear span (∞ when there are none).</summary>
    public double MinSpandrelDepthToSpan { get; }

    public int PierCount { get; }

    private EquivalentFrame(StructureModel model, IReadOnlyList<int> loadNodes, int spandrels, double minDepthToSpan, int piers)
    {
        Model = model; LoadNodes = loadNodes; SpandrelCount = spandrels; MinSpandrelDepthToSpan = minDepthToSpan; PierCount = piers;
    }

    public static EquivalentFrame Build(PerforatedWallCheck c, UnitSystem units, string source, bool rigidSpandrels)
    {
        double L = c.Length, H = c.Height, t = c.Thickness, f = c.FormFactor;
        var mat = c.Material;
        double eps = 1e-9 * Math.Max(L, H);
        var sub = new SubModel($"{c.Id}: equivalent frame", source, units);
        sub.Uses(mat);
        int spandrels = 0, piers = 0;
        double minRatio = double.PositiveInfinity;
        var ops = c.Openings.Select(o => new Op(o.X, o.X + o.Width, o.Y, o.Y + o.Height)).ToList();
        bool held = c.Ends == CheckEnds.FixedFixed;

        if (ops.Count == 0)
        {
            int b = sub.NodeAt(L / 2, 0), top = sub.NodeAt(L / 2, H);
            sub.Rectangle("wall", b, top, mat, L, t, f, 0, 0, "wall");
            sub.Support(b, true, true, true);
            if (held) sub.Support(top, false, false, true);
            sub.Load(top, 1.0);
            return new EquivalentFrame(sub.Build(), [top], 0, minRatio, 0);
        }

        // Bands: openings overlapping or touching in height.
        var bands = new List<(double Y0, double Y1, List<Op> Ops)>();
        foreach (var o in ops.OrderBy(o => o.Y0))
        {
            if (bands.Count > 0 && o.Y0 <= bands[^1].Y1 + eps) { var b = bands[^1]; b.Ops.Add(o); bands[^1] = (b.Y0, Math.Max(b.Y1, o.Y1), b.Ops); }
            else bands.Add((o.Y0, o.Y1, [o]));
        }

        // Joint lines below, between and above the bands.
        var lines = new List<JointLine>();
        var below = new JointLine[bands.Count];
        var above = new JointLine[bands.Count];
        double baseDepth = bands[0].Y0;
        below[0] = baseDepth <= eps ? new JointLine(0, LineKind.Ground, 0) : new JointLine(bands[0].Y0, LineKind.SolidFace, baseDepth);
        lines.Add(below[0]);
        for (int k = 1; k < bands.Count; k++)
        {
            double d = bands[k].Y0 - bands[k - 1].Y1;
            var sp = new JointLine((bands[k - 1].Y1 + bands[k].Y0) / 2, LineKind.Spandrel, d);
            above[k - 1] = below[k] = sp;
            lines.Add(sp);
        }
        double topDepth = H - bands[^1].Y1;
        above[^1] = (held, topDepth <= eps) switch
        {
            (false, true) => new JointLine(H, LineKind.FreeTop, 0),
            (false, false) => new JointLine((bands[^1].Y1 + H) / 2, LineKind.Spandrel, topDepth),
            (true, true) => new JointLine(H, LineKind.HeldTop, 0),
            (true, false) => new JointLine(bands[^1].Y1, LineKind.SolidFace, topDepth),
        };
        lines.Add(above[^1]);

        // Piers, slice by slice.
        for (int k = 0; k < bands.Count; k++)
        {
            var (y0, y1, bandOps) = bands[k];
            var levels = new List<double>();
            foreach (var v in bandOps.SelectMany(o => new[] { o.Y0, o.Y1 }).Append(y0).Append(y1).Order())
                if (levels.Count == 0 || v - levels[^1] > eps) levels.Add(v);
            var internalLines = new Dictionary<int, JointLine>();
            for (int s = 0; s + 1 < levels.Count; s++)
            {
                double s0 = levels[s], s1 = levels[s + 1];
                var bottomLine = s == 0 ? below[k] : internalLines[s];
                if (s + 2 < levels.Count && !internalLines.ContainsKey(s + 1))
                {
                    internalLines[s + 1] = new JointLine(s1, LineKind.Internal, 0);
                    lines.Add(internalLines[s + 1]);
                }
                var topLine = s + 2 < levels.Count ? internalLines[s + 1] : above[k];
                var across = bandOps.Where(o => o.Y0 < s1 - eps && o.Y1 > s0 + eps).OrderBy(o => o.X0).ToList();
                double start = 0;
                for (int j = 0; j <= across.Count; j++)
                {
                    double end = j < across.Count ? across[j].X0 : L;
                    double xc = (start + end) / 2;
                    double yb = s == 0 ? bottomLine.Y : s0, yt = s + 2 < levels.Count ? s1 : topLine.Y;
                    int nb = sub.NodeAt(xc, yb), nt = sub.NodeAt(xc, yt);
                    double rigidBottom = s == 0 ? Math.Max(0, y0 - yb) : 0, rigidTop = s + 2 < levels.Count ? 0 : Math.Max(0, yt - y1);
                    sub.Rectangle($"pier {piers + 1}", nb, nt, mat, end - start, t, f, rigidBottom, rigidTop, "pier");
                    piers++;
                    bottomLine.Entries.Add((nb, xc, start, end));
                    topLine.Entries.Add((nt, xc, start, end));
                    if (j < across.Count) start = across[j].X1;
                }
            }
        }

        // Wall regions without openings.
        if (below[0].Kind == LineKind.SolidFace)
        {
            int b = sub.NodeAt(L / 2, 0), top = sub.NodeAt(L / 2, below[0].Y);
            sub.Rectangle("wall below the openings", b, top, mat, L, t, f, 0, 0, "wall");
            sub.Support(b, true, true, true);
            below[0].Entries.Add((top, L / 2, 0, L));
        }
        var loadNodes = new List<int>();
        if (above[^1].Kind == LineKind.SolidFace)
        {
            int b = sub.NodeAt(L / 2, above[^1].Y), top = sub.NodeAt(L / 2, H);
            sub.Rectangle("wall above the openings", b, top, mat, L, t, f, 0, 0, "wall");
            sub.Support(top, false, false, true);
            above[^1].Entries.Add((b, L / 2, 0, L));
            loadNodes.Add(top);
        }

        int links = 0;
        void RigidLink(int a, int b, double depth)
        {
            double len = Math.Abs(sub.Nodes[b].X - sub.Nodes[a].X);
            sub.Rectangle($"rigid link {++links}", a, b, mat, Math.Max(depth, H), t, f, RigidLinkFraction * len, RigidLinkFraction * len, "rigid link");
        }

        foreach (var line in lines)
        {
            // One entry per node, its x-range the union of the pier runs that meet there.
            var nodes = line.Entries.GroupBy(e => e.Node)
                .Select(g => (Node: g.Key, X: g.First().X, Xa: g.Min(e => e.Xa), Xb: g.Max(e => e.Xb))).OrderBy(e => e.X).ToList();
            switch (line.Kind)
            {
                case LineKind.Ground:
                    foreach (var e in nodes) sub.Support(e.Node, true, true, true);
                    break;
                case LineKind.SolidFace:
                    for (int i = 0; i + 1 < nodes.Count; i++) RigidLink(nodes[i].Node, nodes[i + 1].Node, line.Depth);
                    break;
                case LineKind.HeldTop:
                    foreach (var e in nodes) { sub.Support(e.Node, false, false, true); loadNodes.Add(e.Node); }
                    for (int i = 0; i + 1 < nodes.Count; i++) RigidLink(nodes[i].Node, nodes[i + 1].Node, 0);
                    break;
                case LineKind.FreeTop:
                    foreach (var e in nodes) loadNodes.Add(e.Node);
                    for (int i = 0; i + 1 < nodes.Count; i++) sub.Link($"floor tie {i + 1}", nodes[i].Node, nodes[i + 1].Node, mat, RigidFactor * t * L, "floor tie");
                    break;
                case LineKind.Internal:
                    for (int i = 0; i + 1 < nodes.Count; i++)
                    {
                        var (a, b) = (nodes[i], nodes[i + 1]);
                        // Solid material spans between the two joints if one pier run holds both.
                        if (line.Entries.Any(e => e.Xa <= a.X + eps && e.Xb >= b.X - eps)) RigidLink(a.Node, b.Node, 0);
                    }
                    break;
                case LineKind.Spandrel:
                    if (line == above[^1])
                        foreach (var e in nodes)
                        {
                            // The force acts at the wall's top edge: a rigid arm carries it down to the spandrel's joint.
                            int top = sub.NodeAt(e.X, H);
                            double arm = H - line.Y;
                            sub.Rectangle($"rigid arm {++links}", e.Node, top, mat, e.Xb - e.Xa, t, f, RigidLinkFraction * arm, RigidLinkFraction * arm, "rigid link");
                            loadNodes.Add(top);
                        }
                    for (int i = 0; i + 1 < nodes.Count; i++)
                    {
                        var (a, b) = (nodes[i], nodes[i + 1]);
                        if (a.Xb >= b.Xa - eps) { RigidLink(a.Node, b.Node, line.Depth); continue; }  // joints overlap: solid wall
                        double span = b.X - a.X;
                        sub.Rectangle($"spandrel {++spandrels}", a.Node, b.Node, mat, line.Depth, t, f, a.Xb - a.X, b.X - b.Xa, "spandrel",
                            rigidSpandrels ? RigidFactor : 1.0);
                        minRatio = Math.Min(minRatio, line.Depth / (b.Xa - a.Xb));
                    }
                    break;
            }
        }
        foreach (int n in loadNodes) sub.Load(n, 1.0 / loadNodes.Count);
        return new EquivalentFrame(sub.Build(), loadNodes, spandrels, minRatio, piers);
    }
}
