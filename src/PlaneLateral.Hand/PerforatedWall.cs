using System.Globalization;

namespace PlaneLateral.Hand;

/// <summary>A rectangular opening in a wall elevation. Units: any consistent length unit.</summary>
/// <param name="X">Distance of the opening's left edge from the wall's left end (L).</param>
/// <param name="Y">Height of the opening's bottom edge above the wall's base (L); zero for a door.</param>
/// <param name="Width">Opening width (L), positive.</param>
/// <param name="Height">Opening height (L), positive.</param>
/// <param name="Label">Name used in messages and in the breakdown; defaults to "opening N".</param>
public sealed record WallOpening(double X, double Y, double Width, double Height, string? Label = null);

/// <summary>What a breakdown line is.</summary>
public enum WallStepKind
{
    /// <summary>A solid rectangle of wall (the whole wall, or a sub-wall before its openings are cut), added.</summary>
    SolidRegion,

    /// <summary>The full-length solid strip that holds a band of openings, subtracted.</summary>
    StripRemoved,

    /// <summary>One solid pier of a band, acting in parallel with its neighbours (its rigidity adds).</summary>
    Pier,

    /// <summary>A pier that itself holds openings, worked out as a wall in its own right (lines above it, one level deeper).</summary>
    SubWall,

    /// <summary>A horizontal slice of a band whose piers act in parallel; slices act in series (deflections add).</summary>
    Slice,

    /// <summary>The combined deflection of a band's piers (and slices), added back.</summary>
    BandAdded,
}

/// <summary>One line of the perforated-wall breakdown, in the order a reviewer would write it by hand.</summary>
/// <param name="Depth">Nesting level: 0 for the wall, 1 for its bands' piers, 2 for a sub-wall's lines, and so on.</param>
/// <param name="Kind">What the line is.</param>
/// <param name="Label">Plain description of the piece.</param>
/// <param name="Left">Left edge, from the wall's left end (L).</param>
/// <param name="Right">Right edge (L).</param>
/// <param name="Bottom">Bottom edge, above the wall's base (L).</param>
/// <param name="Top">Top edge (L).</param>
/// <param name="Ends">End condition used for the piece.</param>
/// <param name="Deflection">Deflection of the piece under the wall load P (L).</param>
/// <param name="Rigidity">P / Deflection (F/L).</param>
/// <param name="Sign">+1 added to the running total at its depth, −1 subtracted, 0 a member of a parallel group (its rigidity adds).</param>
public sealed record WallStep(int Depth, WallStepKind Kind, string Label, double Left, double Right, double Bottom, double Top,
    EndFixity Ends, double Deflection, double Rigidity, int Sign)
{
    /// <summary>Piece height (L).</summary>
    public double Height => Top - Bottom;

    /// <summary>Piece length, parallel to the force (L).</summary>
    public double Length => Right - Left;

    /// <summary>The line as plain text.</summary>
    public string Text
    {
        get
        {
            var c = CultureInfo.InvariantCulture;
            string sign = Sign > 0 ? "+" : Sign < 0 ? "-" : " ";
            return string.Create(c,
                $"{new string(' ', 2 * Depth)}{sign} {Label}: x {Left:G6}..{Right:G6}, y {Bottom:G6}..{Top:G6} (l = {Length:G6}, h = {Height:G6}, h/l = {Height / Length:G4}), {Guard.Fixity(Ends)}, deflection {Deflection:G6}, rigidity {Rigidity:G6}");
        }
    }
}

/// <summary>The perforated-wall result.</summary>
/// <param name="Load">The lateral force P at the wall's top (F).</param>
/// <param name="Deflection">Top deflection of the wall (L).</param>
/// <param name="Steps">The line-by-line breakdown.</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record PerforatedWallResult(double Load, double Deflection, IReadOnlyList<WallStep> Steps, HandMethod Method)
{
    /// <summary>Wall stiffness (rigidity) P/Δ (F/L).</summary>
    public double Stiffness => Load / Deflection;

    /// <summary>The breakdown as plain text, one line per step ("\n" between lines), ending with the total.</summary>
    public string Breakdown => string.Join("\n", Steps.Select(s => s.Text)) + "\n" +
        string.Create(CultureInfo.InvariantCulture, $"= wall deflection {Deflection:G6}, rigidity {Stiffness:G6}");
}

/// <summary>
/// Lateral deflection of a wall with rectangular openings by the classic solid-minus-strip-plus-piers method.
/// Units: any consistent set (force F, length L).
/// </summary>
/// <remarks>
/// Procedure (Taly, Design of Reinforced Masonry Structures, ch. 7, and the masonry design literature):
/// the deflection of the solid wall, minus, for each band of openings, the deflection of the full-length solid strip
/// holding that band, plus the deflection of the band's piers acting in parallel (rigidities add); pieces stacked
/// one above the other act in series (deflections add). Each solid piece deflects as a shear-deformable rectangular
/// pier (flexure plus f·Ph/(AG)). Rules fixed here by common practice, where the source leaves them open:
/// <list type="number">
/// <item>A band is a height range over which openings overlap or touch vertically; bands are worked one by one.</item>
/// <item>A strip and its piers are fixed-fixed, except in a cantilever wall (or sub-wall) whose band reaches the free top:
/// there the strip and its piers are cantilevers.</item>
/// <item>Openings that span the band's full height cut the strip into piers. A pier between such cuts that holds shorter
/// openings is a sub-wall, worked by the same procedure (recursion): its solid deflection, minus its own strips, plus
/// its own piers. Where openings share a sill or a head this gives a pier between a tall and a short opening the height
/// of the shorter opening, the common rule.</item>
/// <item>If no opening spans the band's full height (staggered openings), the band is sliced at every opening edge;
/// in each slice the piers between openings act in parallel, and the slices act in series. In effect a pier beside
/// two staggered openings is taken over the height where it is free on both sides, the clear overlap of the openings.</item>
/// <item>Solid wall left above or below a pier within the strip is taken as rigid.</item>
/// </list>
/// </remarks>
public static class PerforatedWall
{
    /// <summary>
    /// Deflection and stiffness of a wall with openings, with a line-by-line breakdown.
    /// Source: Taly, Design of Reinforced Masonry Structures, ch. 7; the masonry design literature; common practice for
    /// the rules listed in the remarks.
    /// </summary>
    /// <param name="length">Wall length, parallel to the force (L), positive.</param>
    /// <param name="height">Wall height (L), positive.</param>
    /// <param name="thickness">Wall thickness (L), positive.</param>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="g">Shear modulus G (F/L²), positive (masonry: 0.4E).</param>
    /// <param name="ends">The whole wall's condition: cantilever, or fixed-fixed top and bottom.</param>
    /// <param name="openings">Any number of rectangular openings, not overlapping, inside the wall.</param>
    /// <param name="load">Lateral force P at the top (F), positive; the deflection is proportional to it.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1 (1.2 for a rectangle).</param>
    public static PerforatedWallResult Analyze(double length, double height, double thickness, double e, double g,
        EndFixity ends, IReadOnlyList<WallOpening> openings, double load = 1.0, double formFactor = ShearForm.RectangleDefault)
    {
        Guard.Positive(length, "The wall length");
        Guard.Positive(height, "The wall height");
        Guard.Positive(thickness, "The wall thickness");
        Guard.Positive(e, "Young's modulus E");
        Guard.Positive(g, "The shear modulus G");
        Guard.Positive(load, "The lateral force P");
        Guard.FormFactor(formFactor);
        if (ends != EndFixity.Cantilever && ends != EndFixity.FixedFixed)
            throw new ArgumentException($"Unknown end condition {ends}.");
        var ops = Validate(length, height, openings ?? []);
        var w = new Worker(thickness, e, g, load, formFactor, 1e-9 * Math.Max(length, height));
        double d = w.Region(0, length, 0, height, ends, ops, 0, "solid wall");
        return new PerforatedWallResult(load, d, w.Steps, new HandMethod(
            "Perforated wall: solid wall minus strips plus piers",
            "Taly, Design of Reinforced Masonry Structures, ch. 7; masonry design literature; common practice for pier heights and staggered openings",
            ["plane sections remain plane within each solid piece", $"whole wall {Guard.Fixity(ends)}",
             "strips and piers fixed-fixed, except cantilever where a cantilever wall's band reaches its free top",
             "solid wall above and below the piers of a strip is rigid",
             $"shear deformation with form factor {formFactor.ToString("0.####", CultureInfo.InvariantCulture)}",
             "piers in parallel share one deflection (rigidities add); pieces stacked vertically add deflections",
             "linear elastic, uncracked", "the force acts at the top of the wall"]));
    }

    /// <summary>As <see cref="Analyze"/>, with G found from Poisson's ratio, G = E/(2(1+ν)).</summary>
    /// <param name="length">Wall length (L), positive.</param>
    /// <param name="height">Wall height (L), positive.</param>
    /// <param name="thickness">Wall thickness (L), positive.</param>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="nu">Poisson's ratio, strictly between −1 and 0.5.</param>
    /// <param name="ends">The whole wall's condition.</param>
    /// <param name="openings">Rectangular openings.</param>
    /// <param name="load">Lateral force P (F), positive.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1.</param>
    public static PerforatedWallResult AnalyzeWithPoisson(double length, double height, double thickness, double e, double nu,
        EndFixity ends, IReadOnlyList<WallOpening> openings, double load = 1.0, double formFactor = ShearForm.RectangleDefault)
        => Analyze(length, height, thickness, e, Elastic.ShearModulus(e, nu), ends, openings, load, formFactor);

    private sealed record Op(double X0, double X1, double Y0, double Y1, string Name);

    private static List<Op> Validate(double length, double height, IReadOnlyList<WallOpening> openings)
    {
        var ops = new List<Op>();
        double tol = 1e-9 * Math.Max(length, height);
        for (int i = 0; i < openings.Count; i++)
        {
            var o = openings[i] ?? throw new ArgumentException($"Opening {i + 1} is missing (null).");
            string name = string.IsNullOrWhiteSpace(o.Label) ? $"opening {i + 1}" : o.Label!;
            Guard.Finite(o.X, $"The x of '{name}'");
            Guard.Finite(o.Y, $"The y of '{name}'");
            Guard.Positive(o.Width, $"The width of '{name}'");
            Guard.Positive(o.Height, $"The height of '{name}'");
            if (o.X < -tol || o.Y < -tol || o.X + o.Width > length + tol || o.Y + o.Height > height + tol)
                throw new ArgumentException($"'{name}' lies (partly) outside the wall, which is {length} long and {height} high.");
            if (o.X <= tol || o.X + o.Width >= length - tol)
                throw new ArgumentException($"'{name}' reaches the wall's end, leaving a pier of zero width there.");
            ops.Add(new Op(o.X, o.X + o.Width, o.Y, o.Y + o.Height, name));
        }
        for (int i = 0; i < ops.Count; i++)
            for (int j = i + 1; j < ops.Count; j++)
            {
                var a = ops[i];
                var b = ops[j];
                double ox = Math.Min(a.X1, b.X1) - Math.Max(a.X0, b.X0);
                double oy = Math.Min(a.Y1, b.Y1) - Math.Max(a.Y0, b.Y0);
                if (ox > tol && oy > tol)
                    throw new ArgumentException($"'{a.Name}' and '{b.Name}' overlap.");
                if (Math.Abs(ox) <= tol && oy > tol)
                    throw new ArgumentException($"'{a.Name}' and '{b.Name}' touch side by side, leaving a pier of zero width between them.");
            }
        return ops;
    }

    private sealed class Worker(double t, double e, double g, double p, double f, double eps)
    {
        public List<WallStep> Steps { get; } = [];

        private double Solid(double len, double h, EndFixity ends) =>
            Piers.Rectangular(ends, p, h, len, t, e, g, f).TotalDeflection;

        private void Log(int depth, WallStepKind kind, string label, double x0, double x1, double y0, double y1,
            EndFixity ends, double d, int sign) =>
            Steps.Add(new WallStep(depth, kind, label, x0, x1, y0, y1, ends, d, p / d, sign));

        public double Region(double x0, double x1, double y0, double y1, EndFixity ends, List<Op> ops, int depth, string label,
            string? leftNeighbour = null, string? rightNeighbour = null)
        {
            double d = Solid(x1 - x0, y1 - y0, ends);
            Log(depth, WallStepKind.SolidRegion, label, x0, x1, y0, y1, ends, d, +1);
            foreach (var (b0, b1) in Bands(ops))
            {
                var bandEnds = ends == EndFixity.Cantilever && Math.Abs(b1 - y1) <= eps ? EndFixity.Cantilever : EndFixity.FixedFixed;
                var inBand = ops.Where(o => o.Y0 >= b0 - eps && o.Y1 <= b1 + eps).ToList();
                double ds = Solid(x1 - x0, b1 - b0, bandEnds);
                Log(depth, WallStepKind.StripRemoved, $"strip holding {Names(inBand)}", x0, x1, b0, b1, bandEnds, ds, -1);
                bool sliced = !inBand.Any(o => Math.Abs(o.Y0 - b0) <= eps && Math.Abs(o.Y1 - b1) <= eps);
                double db = Band(x0, x1, b0, b1, bandEnds, inBand, depth + 1, leftNeighbour, rightNeighbour);
                Log(depth, WallStepKind.BandAdded,
                    sliced ? "slices of that strip, in series (deflections add)" : "piers of that strip, in parallel (rigidities add)",
                    x0, x1, b0, b1, bandEnds, db, +1);
                d += db - ds;
            }
            return d;
        }

        private double Band(double x0, double x1, double y0, double y1, EndFixity ends, List<Op> ops, int depth,
            string? leftNeighbour, string? rightNeighbour)
        {
            var cuts = ops.Where(o => Math.Abs(o.Y0 - y0) <= eps && Math.Abs(o.Y1 - y1) <= eps).OrderBy(o => o.X0).ToList();
            if (cuts.Count > 0)
            {
                double sumR = 0;
                double start = x0;
                string? leftName = leftNeighbour;
                for (int k = 0; k <= cuts.Count; k++)
                {
                    double end = k < cuts.Count ? cuts[k].X0 : x1;
                    string? rightName = k < cuts.Count ? cuts[k].Name : rightNeighbour;
                    string where = PierPlace(leftName, rightName);
                    if (end - start <= eps)
                        throw new ArgumentException($"The pier {where} has zero width.");
                    var inner = ops.Where(o => !cuts.Contains(o) && o.X0 >= start - eps && o.X1 <= end + eps).ToList();
                    double dp;
                    if (inner.Count == 0)
                    {
                        dp = Solid(end - start, y1 - y0, ends);
                        Log(depth, WallStepKind.Pier, $"pier {where}", start, end, y0, y1, ends, dp, 0);
                    }
                    else
                    {
                        dp = Region(start, end, y0, y1, ends, inner, depth + 1, $"pier {where}, solid, before its openings {Names(inner)}",
                            leftName, rightName);
                        Log(depth, WallStepKind.SubWall, $"pier {where}, with its openings", start, end, y0, y1, ends, dp, 0);
                    }
                    sumR += p / dp;
                    if (k < cuts.Count) { start = cuts[k].X1; leftName = cuts[k].Name; }
                }
                return p / sumR;
            }

            // Staggered openings, none spanning the band: slice at every opening edge; slices act in series.
            var ys = ops.SelectMany(o => new[] { o.Y0, o.Y1 }).Append(y0).Append(y1).OrderBy(v => v).ToList();
            var levels = new List<double>();
            foreach (var v in ys) if (levels.Count == 0 || v - levels[^1] > eps) levels.Add(v);
            double total = 0;
            for (int s = 0; s + 1 < levels.Count; s++)
            {
                double s0 = levels[s], s1 = levels[s + 1];
                var sliceEnds = ends == EndFixity.Cantilever && Math.Abs(s1 - y1) <= eps ? EndFixity.Cantilever : EndFixity.FixedFixed;
                var across = ops.Where(o => o.Y0 < s1 - eps && o.Y1 > s0 + eps).OrderBy(o => o.X0).ToList();
                double sumR = 0, start = x0;
                string? leftName = leftNeighbour;
                for (int k = 0; k <= across.Count; k++)
                {
                    double end = k < across.Count ? across[k].X0 : x1;
                    string? rightName = k < across.Count ? across[k].Name : rightNeighbour;
                    string where = PierPlace(leftName, rightName);
                    if (end - start <= eps)
                        throw new ArgumentException($"The pier {where} has zero width.");
                    double dp = Solid(end - start, s1 - s0, sliceEnds);
                    Log(depth + 1, WallStepKind.Pier, $"pier {where}", start, end, s0, s1, sliceEnds, dp, 0);
                    sumR += p / dp;
                    if (k < across.Count) { start = across[k].X1; leftName = across[k].Name; }
                }
                double dsl = p / sumR;
                Log(depth, WallStepKind.Slice, $"slice across {Names(across)}, its piers in parallel", x0, x1, s0, s1, sliceEnds, dsl, +1);
                total += dsl;
            }
            return total;
        }

        private List<(double, double)> Bands(List<Op> ops)
        {
            var bands = new List<(double, double)>();
            foreach (var o in ops.OrderBy(o => o.Y0))
            {
                if (bands.Count > 0 && o.Y0 <= bands[^1].Item2 + eps)
                    bands[^1] = (bands[^1].Item1, Math.Max(bands[^1].Item2, o.Y1));
                else
                    bands.Add((o.Y0, o.Y1));
            }
            return bands;
        }

        private static string Names(IEnumerable<Op> ops) => string.Join(", ", ops.OrderBy(o => o.X0).Select(o => $"'{o.Name}'"));

        private static string PierPlace(string? left, string? right) => (left, right) switch
        {
            (null, null) => "across the strip",
            (null, _) => $"left of '{right}'",
            (_, null) => $"right of '{left}'",
            _ => $"between '{left}' and '{right}'",
        };
    }
}
