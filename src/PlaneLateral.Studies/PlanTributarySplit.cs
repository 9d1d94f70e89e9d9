using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;

namespace PlaneLateral.Studies;

/// <summary>
/// Floors that bend (docs/plan.md): the hand tributary split (PlaneLateral.Hand.TributarySplit: each floor as simple
/// spans between its lines, uniform load over the floor's extent, overhangs to the end lines, torque not distributed,
/// lines at one position by their story stiffnesses) beside the FE flexible floor of the envelope, for every line, story
/// and case. Each floor's force along X goes to the lines along X (spanning along Y), its force along Y to the lines
/// along Y; a line's story shear is the sum over the floors above the cut. Where the two differ the cause is named from
/// the features the two treat differently: the floor's torque about its net area's centroid (the FE spreads it over the
/// floor), a floor depth that varies along the span (openings, an outline that is not a rectangle: the FE load follows
/// the net area), an overhang (the FE takes it by the statics of the end span, so the end line takes w·a²/(2L) more and
/// its neighbour as much less), lines at one position (the FE shares their load equally, the hand by stiffness).
/// </summary>
public static class PlanTributarySplit
{
    /// <summary>The hand split beside the envelope's flexible column; empty without floor blocks, with a line at an angle, or with fewer than two line positions in a direction.</summary>
    public static IReadOnlyList<TributaryShear> Run(PlanResult r)
    {
        if (r.Diaphragms is not { } d) return [];
        var plan = r.Plan;
        var lines = plan.Lines;
        if (lines.Any(l => l.Cos != 0 && l.Sin != 0)) return [];
        int n = plan.FloorCount;
        // share[l][li]: the line's force along its own direction per unit floor force along its axis, floor l (1-based).
        var share = new double[n + 1][];
        var causes = new List<string>[n + 1][];
        for (int l = 1; l <= n; l++)
        {
            share[l] = new double[lines.Count];
            causes[l] = lines.Select(_ => new List<string>()).ToArray();
            var outline = plan.Levels[l].Outline;
            var openings = plan.FloorOf(l)?.Openings ?? [];
            bool rectangle = outline.Count == 4 && outline.All(p => (p.X == outline.Min(q => q.X) || p.X == outline.Max(q => q.X)) && (p.Y == outline.Min(q => q.Y) || p.Y == outline.Max(q => q.Y)));
            foreach (bool alongX in new[] { true, false })   // alongX: the lines along X (positions in y)
            {
                var idx = Enumerable.Range(0, lines.Count).Where(i => alongX ? lines[i].Cos != 0 : lines[i].Sin != 0).ToList();
                double lo = outline.Min(p => alongX ? p.Y : p.X), hi = outline.Max(p => alongX ? p.Y : p.X);
                var rig = r.Rigidity.FirstOrDefault(g => g.Direction == (alongX ? "x" : "y") && g.Story == l);
                var hand = idx.Select(i => new TributaryLine(lines[i].Id, alongX ? lines[i].Y0 : lines[i].X0, rig?.Lines[i].Stiffness ?? double.NaN)).ToList();
                TributarySplitResult split;
                try { split = TributarySplit.Uniform(hand, lo, hi, 1.0); }
                catch (ArgumentException) { return []; }
                double tol = 1e-9 * (hi - lo);
                var positions = hand.Select(h => h.At).Order().Aggregate(new List<double>(), (a, p) => { if (a.Count == 0 || p - a[^1] > tol) a.Add(p); return a; });
                for (int j = 0; j < idx.Count; j++)
                {
                    int i = idx[j];
                    share[l][i] = split.Lines[j].Force * (alongX ? lines[i].Cos : lines[i].Sin);
                    int k = positions.FindIndex(p => Math.Abs(p - hand[j].At) <= tol);
                    if ((positions[0] - lo > tol && k <= 1) || (hi - positions[^1] > tol && k >= positions.Count - 2)) causes[l][i].Add("overhang");
                    if (hand.Count(h => Math.Abs(h.At - hand[j].At) <= tol) > 1) causes[l][i].Add("one position");
                    if (!rectangle || openings.Count > 0) causes[l][i].Add("net area");
                }
            }
        }
        var list = new List<TributaryShear>();
        var cases = plan.Cases.ToDictionary(c => c.Id);
        foreach (var e in d.Envelope)
        {
            if (!cases.TryGetValue(e.Case, out var c)) continue;
            int li = lines.ToList().FindIndex(x => x.Id == e.Line);
            double h = 0, scale = 0;
            var why = new SortedSet<string>(StringComparer.Ordinal);
            for (int l = e.Story; l <= n; l++)
            {
                double fx = c.Loads.Where(q => q.Level == l).Sum(q => q.Fx), fy = c.Loads.Where(q => q.Level == l).Sum(q => q.Fy);
                double mz = c.Loads.Where(q => q.Level == l).Sum(q => q.Mz);
                h += (lines[li].Sin == 0 ? fx : fy) * share[l][li];
                scale += Math.Abs(fx) + Math.Abs(fy);
                foreach (var w in causes[l][li]) why.Add(w);
                var g = NetCentroid(plan.Levels[l].Outline, plan.FloorOf(l)?.Openings ?? []);
                if (Math.Abs(mz - (g.X * fy - g.Y * fx)) > 1e-9 * (Math.Abs(fx) + Math.Abs(fy)) * plan.Size) why.Add("torque");
            }
            double gap = Math.Abs(h) > 1e-12 * scale ? e.Flexible / h - 1 : double.NaN;
            bool differ = double.IsFinite(e.Flexible) && Math.Abs(e.Flexible - h) > 1e-6 * scale;
            string cause = !differ ? "" : why.Count > 0 ? string.Join("; ", why) : "other";
            list.Add(new TributaryShear(e.Case, e.Story, e.Line, h, e.Flexible, gap, cause));
        }
        return list;
    }

    /// <summary>The centroid of a floor's net area: the outline less its rectangular openings (standard area moments).</summary>
    private static PlanPoint NetCentroid(IReadOnlyList<PlanPoint> outline, IReadOnlyList<PlanOpening> openings)
    {
        double a = Math.Abs(PlanOutline.SignedArea(outline));
        var c = PlanOutline.Centroid(outline);
        double sx = a * c.X, sy = a * c.Y;
        foreach (var o in openings)
        {
            double ao = (o.Max.X - o.Min.X) * (o.Max.Y - o.Min.Y);
            a -= ao; sx -= ao * 0.5 * (o.Min.X + o.Max.X); sy -= ao * 0.5 * (o.Min.Y + o.Max.Y);
        }
        return new PlanPoint(sx / a, sy / a);
    }
}
