using System.Collections.Concurrent;
using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>How the sweep's h/l values are spaced between the ends of the range.</summary>
public enum SweepSpacing
{
    /// <summary>Equal steps in h/l.</summary>
    Linear,
    /// <summary>Equal ratios between neighbouring h/l values (even on a log axis).</summary>
    Geometric,
}

/// <summary>
/// What to sweep: a solid rectangular wall of fixed plan length and thickness whose height is varied so that h/l runs
/// over a range. All quantities are in <see cref="Units"/> (lengths L, moduli F/L²).
/// </summary>
/// <param name="From">Smallest h/l, &gt; 0.</param>
/// <param name="To">Largest h/l, &gt; From.</param>
/// <param name="Points">Number of h/l values, 2 to <see cref="AspectSweep.MaxPoints"/>.</param>
/// <param name="Length">Plan length l of the wall, the dimension parallel to the force (L).</param>
/// <param name="Thickness">Wall thickness t (L).</param>
/// <param name="E">Young's modulus (F/L²).</param>
/// <param name="G">Shear modulus (F/L²).</param>
/// <param name="MaterialName">The material's name for the outputs.</param>
/// <param name="FormFactor">Shear form factor f ≥ 1 (shear area A/f).</param>
/// <param name="Ends">End conditions to run, each a curve.</param>
/// <param name="Tolerance">Band on FE/hand − 1 for the verdict, in (0, 1).</param>
public sealed record SweepSpec(
    double From, double To, int Points, SweepSpacing Spacing, UnitSystem Units,
    double Length, double Thickness, double E, double G, string MaterialName, double FormFactor,
    IReadOnlyList<EndFixity> Ends, double Tolerance)
{
    /// <summary>One centred window at every point (its size as fractions of the wall's length and height), or null for the solid wall.</summary>
    public SweepOpening? Opening { get; init; }

    /// <summary>A footing on soil under the wall at every point (the FE models stand on its springs; the hand pier formula keeps the fixed base), or null.</summary>
    public SweepFooting? Footing { get; init; }

    /// <summary>The h/l values, smallest first.</summary>
    public double[] AspectRatios()
    {
        var a = new double[Points];
        for (int i = 0; i < Points; i++)
        {
            double s = (double)i / (Points - 1);
            a[i] = Spacing == SweepSpacing.Linear ? From + (To - From) * s : From * Math.Pow(To / From, s);
        }
        a[0] = From;
        a[^1] = To;
        return a;
    }
}

/// <summary>
/// One window centred in the wall's elevation, sized as fractions of the wall: width = <paramref name="WidthFraction"/>·l,
/// height = <paramref name="HeightFraction"/>·h, so the two piers beside it are each (1 − wf)·l/2 wide and the solid
/// wall above and below it each (1 − hf)·h/2 deep. Fractions in (0, 1).
/// </summary>
public sealed record SweepOpening(double WidthFraction, double HeightFraction)
{
    /// <summary>The window of a wall of length <paramref name="length"/> and height <paramref name="height"/> (any one length unit).</summary>
    public OpeningSpec For(double length, double height) =>
        new("window", (1 - WidthFraction) / 2 * length, (1 - HeightFraction) / 2 * height, WidthFraction * length, HeightFraction * height);

    /// <summary>"a centred window 0.3 l wide and 0.4 h high".</summary>
    public string Words => $"a centred window {WidthFraction.ToString("G4", CultureInfo.InvariantCulture)} l wide and {HeightFraction.ToString("G4", CultureInfo.InvariantCulture)} h high";
}

/// <summary>
/// A rigid rectangular surface or embedded footing under the sweep's wall, on soil (in the spec's units): plan length
/// along the wall (≥ the wall's length), width across it, embedment, soil shear modulus G and Poisson's ratio ν. Its
/// static springs are those of the model's footings (Pais &amp; Kausel 1988, docs/footings.md), the same at every point.
/// </summary>
public sealed record SweepFooting(double Length, double Width, double Embedment, double ShearModulus, double PoissonRatio)
{
    /// <summary>Sliding and rocking springs in the wall's plane (SI: N/m, N·m/rad) for the spec's units.</summary>
    public (double Sliding, double Rocking) Springs(UnitSystem u)
    {
        var k = FootingSoilSprings.Compute(FootingFormulaSet.PaisKausel, u.ToSI(Length, Quantity.Length), u.ToSI(Width, Quantity.Length),
            u.ToSI(Embedment, Quantity.Length), u.ToSI(ShearModulus, Quantity.Stress), PoissonRatio);
        return (k.Sliding, k.Rocking);
    }

    /// <summary>"a 288 × 72 in footing, embedment 24 in, on soil G = 4.9 ksi, ν = 0.35".</summary>
    public string Words(UnitSystem u) =>
        $"a {G(Length)} × {G(Width)} {u.LengthSymbol} footing, embedment {G(Embedment)} {u.LengthSymbol}, on soil G = {G(ShearModulus)} {u.Label(Quantity.Stress)}, ν = {G(PoissonRatio)} (Pais & Kausel 1988 springs)";

    private static string G(double v) => v.ToString("G4", CultureInfo.InvariantCulture);
}

/// <summary>One wall of the sweep, in SI (m, N/m²), handed to each FE model.</summary>
/// <param name="AspectRatio">h/l.</param>
/// <param name="Height">h (m).</param>
/// <param name="Length">l (m).</param>
/// <param name="Thickness">t (m).</param>
/// <param name="E">Young's modulus (N/m²).</param>
/// <param name="G">Shear modulus (N/m²).</param>
/// <param name="FormFactor">f, shear area A/f.</param>
public sealed record SweepWall(double AspectRatio, double Height, double Length, double Thickness, double E, double G, double FormFactor, EndFixity Ends)
{
    /// <summary>The spec's centred window, or null for the solid wall.</summary>
    public SweepOpening? Opening { get; init; }

    /// <summary>Sliding and rocking springs (N/m, N·m/rad) of a footing under the base, or null for a fixed base.</summary>
    public (double Sliding, double Rocking)? BaseSprings { get; init; }

    /// <summary>The window in SI (m), or none.</summary>
    public IReadOnlyList<OpeningSpec> Openings => Opening is null ? [] : [Opening.For(Length, Height)];
}

/// <summary>
/// A finite-element model of a sweep wall. The sweep holds an ordered list of these; the first is the reference for the
/// verdict. A plane-stress panel model is one more implementation, added to the list; nothing else changes.
/// </summary>
public interface ISweepFeModel
{
    /// <summary>Short name for tables and legends, e.g. "Timoshenko line members".</summary>
    string Name { get; }

    /// <summary>Lateral stiffness (N/m) of the wall under a force at its top, and the shear share of its deflection when the model can measure it.</summary>
    (double Stiffness, double? ShearShare) Solve(SweepWall wall);

    /// <summary>How the model is built and loaded, in plain words.</summary>
    string Description { get; }

    /// <summary>
    /// A rough relative cost of <see cref="Solve"/> for this wall (any unit, the same for every wall of one model), used
    /// only to start the dearest points first; it never changes a result. Default 1: every wall alike.
    /// </summary>
    double Cost(SweepWall wall) => 1;
}

/// <summary>
/// The wall as a vertical chain of exact Timoshenko beam-columns on the wall's centre line, base fixed, top free
/// (cantilever) or held against rotation (fixed-fixed), unit force at the top; stiffness 1/Δ through the normal
/// analysis path (<see cref="LinearStaticAnalysis"/>). The shear share comes from a second solve without shear deformation.
/// </summary>
public sealed class LineMemberWallModel(int segments = 4) : ISweepFeModel
{
    public string Name => "Timoshenko line members";

    public string Description =>
        $"the wall as {segments} exact Timoshenko beam-columns on its centre line (A = t·l, I = t·l³/12, shear area A/f), base fixed (or on the footing's sliding and rocking springs, when the sweep has a footing), top free or held against rotation, unit force at the top; stiffness 1/Δ; shear share from a second solve without shear deformation";

    public (double Stiffness, double? ShearShare) Solve(SweepWall w)
    {
        double k = LinearStaticAnalysis.Run(Build(w, withShear: true)).Stiffness[0].Stiffness;
        double kFlex = LinearStaticAnalysis.Run(Build(w, withShear: false)).Stiffness[0].Stiffness;
        return (k, 1 - k / kFlex);   // Δ_flexure/Δ_total = (1/kFlex)/(1/k)
    }

    internal StructureModel Build(SweepWall w, bool withShear)
    {
        var mat = new Material("wall", w.E, w.G, w.E / (2 * w.G) - 1);
        double a = w.Thickness * w.Length, i = w.Thickness * w.Length * w.Length * w.Length / 12.0;
        double shearArea = withShear ? a / w.FormFactor : double.PositiveInfinity;
        var nodes = new List<Node>();
        for (int n = 0; n <= segments; n++) nodes.Add(new Node(n, $"n{n}", 0, w.Height * n / segments));
        var members = new List<Member>();
        for (int m = 0; m < segments; m++)
            members.Add(new Member(m, $"wall-{m + 1}", m, m + 1, MemberKind.BeamColumn, "wall", mat.Id, w.E, w.G, a, i, shearArea,
                false, false, 0, 0, StiffnessModifiers.None, "wall"));
        var supports = new List<Support>
        {
            w.BaseSprings is { } k ? new(0, "footing", false, true, false, k.Sliding, 0, k.Rocking) : new(0, "fixed", true, true, true, 0, 0, 0),
        };
        if (w.Ends == EndFixity.FixedFixed) supports.Add(new Support(segments, "custom", false, false, true, 0, 0, 0));
        return new StructureModel
        {
            Title = $"sweep wall h/l = {w.AspectRatio.ToString("G6", CultureInfo.InvariantCulture)}",
            SourcePath = "(sweep)",
            Units = UnitSystem.KilonewtonMetre,
            Materials = [mat],
            Sections = [new Section("wall", "rectangle", a, i, ShearAreaRule.Given, shearArea, w.FormFactor, w.Length)],
            Nodes = nodes,
            Members = members,
            Supports = supports,
            LoadCases = [],
            Combinations = [],
            StiffnessPoints = [new StiffnessPoint("top", segments, Dof.X)],
        };
    }
}

/// <summary>One point of the sweep: the hand pier formula and every FE estimate for one wall and end condition. Values in the spec's units.</summary>
/// <param name="Hand">Piers.Rectangular under a unit force: flexural and shear deflections (L per unit force F), total, stiffness (F/L), shares.</param>
/// <param name="Fe">FE estimates in the order of the sweep's models; the first is the reference.</param>
public sealed record SweepPoint(int Index, EndFixity Ends, double AspectRatio, double Height, MemberDeflection Hand, IReadOnlyList<FeEstimate> Fe, double Tolerance)
{
    /// <summary>FE/hand stiffness for the reference FE estimate.</summary>
    public double Ratio => Fe[0].Value / Hand.Stiffness;

    public Verdict Verdict => ComparisonRow.Judge(Ratio, Tolerance);

    /// <summary>Hand stiffness from the flexural term alone (F/L): 1 / flexural deflection under the unit force.</summary>
    public double HandFlexuralStiffness => 1 / Hand.FlexuralDeflection;

    /// <summary>
    /// Estimated relative discretisation error of each FE estimate, in the order of <see cref="Fe"/>: null for a model
    /// that is exact for its own theory or does not report one (empty when no model reports one).
    /// </summary>
    public IReadOnlyList<double?> FeErrors { get; init; } = [];
}

/// <summary>A finished sweep: the spec, the FE model names in order, and the points (for each end condition in the spec's order, h/l ascending).</summary>
public sealed record SweepResult(SweepSpec Spec, IReadOnlyList<string> FeModels, IReadOnlyList<string> FeDescriptions, IReadOnlyList<SweepPoint> Points);

/// <summary>
/// Varies a solid wall's aspect ratio h/l and sets the hand pier formula (flexural, shear, total) beside each FE model at
/// every point. Points run in parallel; the result depends only on the spec (each point is computed on its own, stored by
/// its index), so two runs give identical numbers.
/// </summary>
public static class AspectSweep
{
    /// <summary>The stated limit on h/l values per sweep (each runs once per end condition and FE model).</summary>
    public const int MaxPoints = 400;

    /// <summary>The problems with a spec, in plain words with a fix each; empty when it can run.</summary>
    public static IReadOnlyList<string> Problems(SweepSpec s)
    {
        var p = new List<string>();
        if (!(double.IsFinite(s.From) && s.From > 0)) p.Add($"the range start h/l = {G(s.From)} is not a positive number. Fix: give --from above 0, e.g. 0.25.");
        if (!double.IsFinite(s.To)) p.Add($"the range end h/l = {G(s.To)} is not a number. Fix: give --to, e.g. 4.");
        if (double.IsFinite(s.From) && double.IsFinite(s.To))
        {
            if (s.To == s.From) p.Add($"the range {G(s.From)} to {G(s.To)} is empty. Fix: give --to larger than --from.");
            else if (s.To < s.From) p.Add($"the range is inverted: --from {G(s.From)} is larger than --to {G(s.To)}. Fix: swap them.");
        }
        if (s.Points < 2) p.Add($"{s.Points} point(s) cannot span a range. Fix: give --points 2 or more.");
        if (s.Points > MaxPoints) p.Add($"{s.Points} points is more than the limit of {MaxPoints}. Fix: give --points {MaxPoints} or fewer.");
        if (!(double.IsFinite(s.Length) && s.Length > 0)) p.Add($"the wall length {G(s.Length)} is not positive. Fix: give --length above 0.");
        if (!(double.IsFinite(s.Thickness) && s.Thickness > 0)) p.Add($"the wall thickness {G(s.Thickness)} is not positive. Fix: give --thickness above 0.");
        if (!(double.IsFinite(s.E) && s.E > 0)) p.Add($"Young's modulus {G(s.E)} is not positive. Fix: give --E above 0 or a --material.");
        if (!(double.IsFinite(s.G) && s.G > 0)) p.Add($"the shear modulus {G(s.G)} is not positive. Fix: give --G above 0, or --nu in (-1, 0.5).");
        if (!(double.IsFinite(s.FormFactor) && s.FormFactor >= 1)) p.Add($"the shear form factor {G(s.FormFactor)} is below 1. Fix: give --shear-factor 1 or more (1.2 for a rectangle).");
        if (s.Ends.Count == 0) p.Add("no end condition. Fix: give --ends cantilever, fixed-fixed or both.");
        if (!(s.Tolerance > 0 && s.Tolerance < 1)) p.Add($"the tolerance {G(s.Tolerance)} is outside (0, 1). Fix: give a fraction such as 0.10.");
        if (s.Opening is { } o)
        {
            if (!(o.WidthFraction > 0 && o.WidthFraction < 1))
                p.Add($"the opening width fraction {G(o.WidthFraction)} is outside (0, 1): the window would leave no pier beside it. Fix: give --opening-width as a fraction of the wall length, e.g. 0.3.");
            if (!(o.HeightFraction > 0 && o.HeightFraction < 1))
                p.Add($"the opening height fraction {G(o.HeightFraction)} is outside (0, 1): the window would leave no wall above or below it. Fix: give --opening-height as a fraction of the wall height, e.g. 0.4.");
            // Within a millionth of 1 the pieces left are below what the perforated-wall method and the frame can tell from zero.
            if (o.WidthFraction >= 1 - 1e-6 && o.WidthFraction < 1)
                p.Add($"the opening width fraction {G(o.WidthFraction)} leaves piers thinner than a millionth of the wall length. Fix: give --opening-width below 0.999999.");
            if (o.HeightFraction >= 1 - 1e-6 && o.HeightFraction < 1)
                p.Add($"the opening height fraction {G(o.HeightFraction)} leaves wall above and below thinner than a millionth of the wall height. Fix: give --opening-height below 0.999999.");
        }
        if (s.Footing is { } f)
        {
            if (!(double.IsFinite(f.Length) && f.Length > 0 && double.IsFinite(f.Width) && f.Width > 0))
                p.Add($"the footing {G(f.Length)} × {G(f.Width)} is not positive. Fix: give --footing-length and --footing-width above 0.");
            else if (f.Length < s.Length)
                p.Add($"the footing length {G(f.Length)} is shorter than the wall length {G(s.Length)} it carries. Fix: give --footing-length at least the wall's length.");
            if (!(double.IsFinite(f.Embedment) && f.Embedment >= 0)) p.Add($"the footing embedment {G(f.Embedment)} is negative. Fix: give --footing-embedment 0 or more.");
            else if (double.IsFinite(f.Width) && f.Width > 0 && f.Embedment > 2 * Math.Min(f.Length, f.Width))
                p.Add($"the footing embedment {G(f.Embedment)} is more than twice the footing's smaller side {G(Math.Min(f.Length, f.Width))}: beyond the range of the footing formulas. Fix: check --footing-embedment.");
            if (!(double.IsFinite(f.ShearModulus) && f.ShearModulus > 0)) p.Add($"the soil shear modulus {G(f.ShearModulus)} is not positive. Fix: give --soil-shear-modulus above 0.");
            if (!(f.PoissonRatio > 0 && f.PoissonRatio < 0.5)) p.Add($"the soil Poisson's ratio {G(f.PoissonRatio)} is outside (0, 0.5). Fix: give --soil-poisson such as 0.35.");
            if (s.Opening is not null) p.Add("a footing with a window is not swept (the perforated-wall method and the equivalent frame take a fixed base). Fix: give the footing or the window, not both.");
        }
        return p;
    }

    /// <summary>Runs the sweep with the Timoshenko line-member model only.</summary>
    public static SweepResult Run(SweepSpec spec, IProgress<int>? progress = null) => Run(spec, [new LineMemberWallModel()], progress);

    /// <summary>
    /// The sweep command's models: the converged plane-stress panel (the reference), then the Timoshenko line members;
    /// without the panel, the line members alone.
    /// </summary>
    public static IReadOnlyList<ISweepFeModel> DefaultModels(bool panel = true) =>
        panel ? [new PanelWallModel(), new LineMemberWallModel()] : [new LineMemberWallModel()];

    /// <summary>
    /// The models for a spec: <see cref="DefaultModels(bool)"/> for the solid wall; with an opening, the converged
    /// plane-stress panel with the window (the reference), then the equivalent frame of Timoshenko line members.
    /// </summary>
    public static IReadOnlyList<ISweepFeModel> DefaultModels(SweepSpec spec, bool panel = true) =>
        spec.Footing is not null ? DefaultModels(panel: false) : DefaultModels(spec.Opening, panel);

    /// <summary>As <see cref="DefaultModels(SweepSpec, bool)"/>, for a spec with this opening (null: the solid wall).</summary>
    public static IReadOnlyList<ISweepFeModel> DefaultModels(SweepOpening? opening, bool panel = true) =>
        opening is null ? DefaultModels(panel)
        : panel ? [new PanelWallModel(), new EquivalentFrameWallModel()] : [new EquivalentFrameWallModel()];

    /// <summary>The problems with a spec for these models: <see cref="Problems(SweepSpec)"/> and each converged model's own.</summary>
    public static IReadOnlyList<string> Problems(SweepSpec s, IReadOnlyList<ISweepFeModel> models)
    {
        var p = Problems(s).ToList();
        if (p.Count == 0)
            foreach (var m in models.OfType<IConvergedSweepFeModel>()) p.AddRange(m.Problems(s));
        return p;
    }

    /// <summary>
    /// Runs the sweep on every core (or on <paramref name="threads"/>). The points are handed out one at a time, the
    /// dearest first (by the models' <see cref="ISweepFeModel.Cost"/>), so that no thread is left with a long point at
    /// the end; each is stored at its own index, so the result does not depend on the threads or the order they ran in.
    /// </summary>
    /// <param name="models">FE models in order (the first is the reference); at least one.</param>
    /// <param name="progress">Told the number of finished points (of Points × Ends) as they finish; may be called from any thread.</param>
    /// <param name="threads">Threads to run the points on; 0 (default): <see cref="Environment.ProcessorCount"/>.</param>
    /// <exception cref="ArgumentException">The spec has problems (<see cref="Problems(SweepSpec, IReadOnlyList{ISweepFeModel})"/>), all listed.</exception>
    public static SweepResult Run(SweepSpec spec, IReadOnlyList<ISweepFeModel> models, IProgress<int>? progress = null, int threads = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(threads);
        var problems = Problems(spec, models);
        if (problems.Count > 0) throw new ArgumentException(string.Join("\n", problems));
        if (models.Count == 0) throw new ArgumentException("the sweep needs at least one FE model.");
        var u = spec.Units;
        double l = u.ToSI(spec.Length, Quantity.Length), t = u.ToSI(spec.Thickness, Quantity.Length);
        double e = u.ToSI(spec.E, Quantity.Stress), g = u.ToSI(spec.G, Quantity.Stress);
        var ratios = spec.AspectRatios();
        (double, double)? springs = spec.Footing?.Springs(u);
        if (springs is not null && models.Any(m => m is not LineMemberWallModel))
            throw new ArgumentException("a sweep with a footing runs the Timoshenko line members only (the panel and the equivalent frame take a fixed base).");
        int n = ratios.Length * spec.Ends.Count;
        var points = new SweepPoint[n];
        int done = 0;
        SweepWall Wall(int k)
        {
            double aspect = ratios[k % ratios.Length];
            return new SweepWall(aspect, aspect * l, l, t, e, g, spec.FormFactor, spec.Ends[k / ratios.Length]) { Opening = spec.Opening, BaseSprings = springs };
        }
        // Dearest first, ties in index order; handed out one by one (no chunks), so the threads finish together.
        var cost = new double[n];
        for (int k = 0; k < n; k++)
        {
            var w = Wall(k);
            foreach (var m in models) cost[k] += m.Cost(w);
        }
        var order = Enumerable.Range(0, n).OrderByDescending(k => cost[k]).ThenBy(k => k).ToArray();
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = threads > 0 ? threads : Environment.ProcessorCount };
        Parallel.ForEach(Partitioner.Create(order, EnumerablePartitionerOptions.NoBuffering), parallel, k =>
        {
            var wall = Wall(k);
            var ends = wall.Ends;
            double aspect = wall.AspectRatio;
            double hUser = aspect * spec.Length;
            // Hand side in the user's units (the library takes any consistent set): a unit force at the top.
            var hand = spec.Opening is null
                ? Piers.Rectangular(ends, 1.0, hUser, spec.Length, spec.Thickness, spec.E, spec.G, spec.FormFactor)
                : PerforatedHand(spec, ends, hUser);
            var fe = new FeEstimate[models.Count];
            var errors = new double?[models.Count];
            for (int m = 0; m < models.Count; m++)
            {
                double k1;
                double? share;
                if (models[m] is IConvergedSweepFeModel converged)
                {
                    var sol = converged.SolveConverged(wall);
                    (k1, share, errors[m]) = (sol.Stiffness, sol.ShearShare, sol.EstimatedError);
                }
                else (k1, share) = models[m].Solve(wall);
                fe[m] = new FeEstimate(models[m].Name, u.FromSI(k1, Quantity.TranslationalStiffness), models[m].Description,
                    share is double s ? 1 - s : null, share);
            }
            points[k] = new SweepPoint(k, ends, aspect, hUser, hand, fe, spec.Tolerance) { FeErrors = errors };
            progress?.Report(Interlocked.Increment(ref done));
        });
        return new SweepResult(spec, models.Select(m => m.Name).ToArray(), models.Select(m => m.Description).ToArray(), points);
    }

    /// <summary>
    /// Shear modulus over E standing for "no shear deformation" in the perforated-wall method's flexure-only value: the
    /// shear terms f·P·h/(A·G) then fall to 1e-12 of their size, below round-off.
    /// </summary>
    public const double FlexureOnlyShearModulusRatio = 1e12;

    /// <summary>
    /// The perforated-wall method (<see cref="PerforatedWall"/>) for the point's wall with its window, unit force, in the
    /// spec's units, as a <see cref="MemberDeflection"/>: the total is the method's deflection; the "flexural" part is the
    /// same method with shear deformation left out (G = 1e12·E), the "shear" part the rest. In a wall with openings the
    /// two do not separate exactly (pieces in parallel combine rigidities, not deflections), so the shear part is the
    /// increase the shear terms cause.
    /// </summary>
    public static MemberDeflection PerforatedHand(SweepSpec spec, EndFixity ends, double height)
    {
        var o = spec.Opening!.For(spec.Length, height);
        WallOpening[] ops = [new WallOpening(o.X, o.Y, o.Width, o.Height, o.Label)];
        var full = PerforatedWall.Analyze(spec.Length, height, spec.Thickness, spec.E, spec.G, ends, ops, 1.0, spec.FormFactor);
        var flex = PerforatedWall.Analyze(spec.Length, height, spec.Thickness, spec.E, FlexureOnlyShearModulusRatio * spec.E, ends, ops, 1.0, spec.FormFactor);
        return new MemberDeflection(1.0, height, ends, flex.Deflection, full.Deflection - flex.Deflection, true, full.Method);
    }

    private static string G(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
