using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// A floor in plan as a deep beam spanning one direction (docs/plan.md, "Floors that bend"): nodes along the span at
/// the outline's corners, the openings' edges and the lines' plan positions, each interval cut into elements; each
/// element an exact Timoshenko beam (<see cref="TimoshenkoBeam"/>: bending E·t·I and shear G·t·d/f of the floor's net
/// section across the span at the element's middle). <see cref="AlongX"/>: the beam spans along X (its transverse
/// displacement is the floor's uy: it carries loads along Y); otherwise it spans along Y and carries loads along X.
/// <para>
/// The floor's displacement across the span is w(s) = rigid part + d(s): for the beam along X, uy = Uy + Rz·x + d, θ =
/// Rz + dθ; along Y, ux = Ux − Rz·y + d, θ = −Rz + dθ, with d = 0 at the two ends of the floor (the deformation is
/// measured from the chord through the floor's ends). The strain energy depends on d alone (the rigid part is the
/// beam's rigid-body motion), so the beam's stiffness is assembled on d only; the two directions share the floor's
/// Ux, Uy, Rz (its chords translate and turn together) and deform independently.
/// </para>
/// </summary>
internal sealed class FloorBeam
{
    /// <summary>Elements per floor length along the span (each interval between stops gets an even share, at least 2).</summary>
    public const int ElementsPerLength = 48;

    public required bool AlongX { get; init; }
    /// <summary>Node coordinates along the span (m), ascending; the first and last are the floor's extent.</summary>
    public required double[] S { get; init; }
    /// <summary>Net floor depth across the span at each element's ends (m): the floor's area per unit length, for its loads.</summary>
    public required double[] M0 { get; init; }
    public required double[] M1 { get; init; }
    /// <summary>Element bending stiffness E·t·I (N·m²) and shear stiffness G·t·d/f (N); NaN for a floor without a section.</summary>
    public required double[] EI { get; init; }
    public required double[] GA { get; init; }
    /// <summary>Global equation of each node's d (−1 at the ends) and dθ; −1 everywhere when the floor has no deformation DOFs.</summary>
    public int[] VDof { get; set; } = [];
    public int[] TDof { get; set; } = [];

    public int Nodes => S.Length;

    /// <summary>5-point Gauss–Legendre on [0, 1] (exact to degree 9).</summary>
    internal static readonly double[] GaussPoints = [0.5 - 0.4530899229693320, 0.5 - 0.2692346550528415, 0.5, 0.5 + 0.2692346550528415, 0.5 + 0.4530899229693320];
    internal static readonly double[] GaussWeights = [0.1184634425280945, 0.2393143352496832, 0.2844444444444444, 0.2393143352496832, 0.1184634425280945];

    /// <summary>∫m ds (m²), ∫m·s ds / ∫m ds (m) and ∫m·(s − c)² ds (m⁴) of the floor's net area along the span.</summary>
    public (double Area, double Centroid, double Inertia) Moments()
    {
        double a = 0, sa = 0, ss = 0;
        for (int e = 0; e + 1 < Nodes; e++)
        {
            double l = S[e + 1] - S[e];
            for (int g = 0; g < 5; g++)
            {
                double xi = GaussPoints[g], w = GaussWeights[g] * l, s = S[e] + xi * l, m = M0[e] + (M1[e] - M0[e]) * xi;
                a += w * m; sa += w * m * s; ss += w * m * s * s;
            }
        }
        double c = sa / a;
        return (a, c, ss - 2 * c * sa + c * c * a);
    }

    /// <summary>The node at coordinate <paramref name="s"/> (within <paramref name="tol"/>), or −1.</summary>
    public int NodeAt(double s, double tol)
    {
        for (int i = 0; i < Nodes; i++) if (Math.Abs(S[i] - s) <= tol) return i;
        return -1;
    }

    /// <summary>
    /// The beam of one direction of a floor: stops at the outline's corners, the openings' edges and <paramref name="stops"/>
    /// (the lines' positions along the span), each interval cut into an even number of elements.
    /// </summary>
    public static FloorBeam Build(PlanLevel level, PlanFloor? floor, bool alongX, IEnumerable<double> stops)
    {
        var outline = level.Outline;
        var openings = floor?.Openings ?? [];
        double lo = outline.Min(p => alongX ? p.X : p.Y), hi = outline.Max(p => alongX ? p.X : p.Y), extent = hi - lo;
        double tol = 1e-9 * extent;
        var all = outline.Select(p => alongX ? p.X : p.Y)
            .Concat(openings.SelectMany(o => alongX ? new[] { o.Min.X, o.Max.X } : new[] { o.Min.Y, o.Max.Y }))
            .Concat(stops).Select(v => Math.Clamp(v, lo, hi)).Order().ToList();
        var merged = new List<double>();
        foreach (var v in all) if (merged.Count == 0 || v - merged[^1] > tol) merged.Add(v);
        merged[^1] = hi; merged[0] = lo;
        var s = new List<double> { merged[0] };
        for (int i = 0; i + 1 < merged.Count; i++)
        {
            double a = merged[i], b = merged[i + 1];
            int k = 2 * Math.Max(1, (int)Math.Ceiling(0.5 * ElementsPerLength * (b - a) / extent));
            for (int j = 1; j <= k; j++) s.Add(j == k ? b : a + (b - a) * j / k);
        }
        int ne = s.Count - 1;
        var m0 = new double[ne]; var m1 = new double[ne]; var ei = new double[ne]; var ga = new double[ne];
        for (int e = 0; e < ne; e++)
        {
            double a = s[e], b = s[e + 1];
            double q1 = Depth(outline, openings, a + 0.25 * (b - a), alongX), q3 = Depth(outline, openings, a + 0.75 * (b - a), alongX);
            m0[e] = Math.Max(0, 1.5 * q1 - 0.5 * q3); m1[e] = Math.Max(0, 1.5 * q3 - 0.5 * q1);   // exact: the depth is linear between stops
            var (d, i) = PlanFloorSection.Section(PlanFloorSection.Cut(outline, openings, 0.5 * (a + b), alongX));
            if (floor is { HasSection: true })
            {
                ei[e] = floor.E * floor.Thickness * i;
                ga[e] = floor.G * floor.Thickness * d / floor.ShearFactor;
            }
            else { ei[e] = double.NaN; ga[e] = double.NaN; }
        }
        return new FloorBeam { AlongX = alongX, S = s.ToArray(), M0 = m0, M1 = m1, EI = ei, GA = ga };
    }

    private static double Depth(IReadOnlyList<PlanPoint> outline, IReadOnlyList<PlanOpening> openings, double at, bool alongX) =>
        PlanFloorSection.Section(PlanFloorSection.Cut(outline, openings, at, alongX)).Depth;

    /// <summary>The element's 4×4 bending stiffness on (v1, θ1, v2, θ2) (exact Timoshenko beam).</summary>
    public double[,] ElementStiffness(int e, out double phi)
    {
        double l = S[e + 1] - S[e];
        phi = 12.0 * EI[e] / (GA[e] * l * l);
        var k6 = TimoshenkoBeam.LocalStiffness(EI[e], 1.0, 1.0, phi, l);   // E = EI, I = 1: the bending terms only are used
        int[] map = [1, 2, 4, 5];
        var k = new double[4, 4];
        for (int a = 0; a < 4; a++)
            for (int b = 0; b < 4; b++) k[a, b] = k6[map[a], map[b]];
        return k;
    }

    /// <summary>
    /// Equivalent nodal loads (v1, θ1, v2, θ2) of the load m(s)·(c0 + c1·s) on element e, by the element's exact shape
    /// functions (Friedman &amp; Kosmatka 1993, via <see cref="TimoshenkoBeam.TransverseShape"/>) and 5-point Gauss
    /// (exact: cubic shapes × quadratic load). With no section (NaN), the Hermite cubics (Φ = 0): statics is the same.
    /// </summary>
    public double[] ElementLoads(int e, double c0, double c1)
    {
        double l = S[e + 1] - S[e];
        double phi = double.IsFinite(EI[e]) ? 12.0 * EI[e] / (GA[e] * l * l) : 0;
        var f = new double[4];
        for (int g = 0; g < 5; g++)
        {
            double xi = GaussPoints[g], w = GaussWeights[g] * l, s = S[e] + xi * l;
            double q = (M0[e] + (M1[e] - M0[e]) * xi) * (c0 + c1 * s);
            var (v1, t1, v2, t2) = TimoshenkoBeam.TransverseShape(xi, phi, l);
            f[0] += w * q * v1; f[1] += w * q * t1; f[2] += w * q * v2; f[3] += w * q * t2;
        }
        return f;
    }
}
