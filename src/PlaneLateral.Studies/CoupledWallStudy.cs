using PlaneLateral.Analysis;
using System.Globalization;
using System.Text;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// A coupled wall: the continuous-connection closed form (two piers) and the two hand bounds (independent cantilevers,
/// one solid wall) beside the wide-column frame with and without shear deformation and the plane-stress panel of the
/// same wall (docs/coupled-walls.md). Every FE model in <see cref="FeModels"/> is one more estimate in each row.
/// </summary>
public static class CoupledWallStudy
{
    /// <summary>The FE models, in order; the first is the reference for the verdicts.</summary>
    public static IReadOnlyList<ICoupledWallModel> FeModels { get; } = [new WideColumnFrame(true), new WideColumnFrame(false), new PanelCoupledWall()];

    /// <summary>The FE models that can represent the check (the panel cannot where <see cref="PanelCoupledWall.Unsupported"/> says why).</summary>
    public static IEnumerable<ICoupledWallModel> ModelsFor(CoupledWallCheck c) =>
        FeModels.Where(m => m is not PanelCoupledWall p || p.Unsupported(c) is null);

    private static string? PanelSkipped(CoupledWallCheck c) =>
        FeModels.OfType<PanelCoupledWall>().Select(p => p.Unsupported(c)).FirstOrDefault(w => w is not null);

    /// <summary>The loads the check asks for (SI magnitudes).</summary>
    public static IEnumerable<(CoupledWallLoad Load, double Magnitude)> Loads(CoupledWallCheck c)
    {
        if (c.UniformLoad is double w) yield return (CoupledWallLoad.Uniform, w);
        if (c.TopLoad is double p) yield return (CoupledWallLoad.TopPoint, p);
    }

    /// <summary>The two piers and their beams as the closed form takes them (SI); null unless the wall has exactly two piers.</summary>
    /// <param name="beamShear">True: the beams' shear rigidity G·A_s/f enters (I_c reduced); false: the classic form.</param>
    public static CoupledWallPair? Pair(CoupledWallCheck c, bool beamShear = false)
    {
        if (c.Piers.Count != 2) return null;
        double t = c.Thickness, l1 = c.Piers[0].Length, l2 = c.Piers[1].Length;
        double ic = c.BeamThickness * Math.Pow(c.BeamDepth, 3) / 12 * c.BeamInertiaFactor;
        double gas = c.Material.G * c.BeamDepth * c.BeamThickness / c.FormFactor;
        return new CoupledWallPair(c.Material.E, t * l1 * l1 * l1 / 12, t * l2 * l2 * l2 / 12, t * l1, t * l2,
            c.Piers[1].Centroid - c.Piers[0].Centroid, WideColumnFrame.BeamSpan(c, 0), c.StoryHeight, ic, c.Height,
            beamShear ? gas : double.PositiveInfinity);
    }

    /// <summary>Independent-cantilever and solid-wall top deflections (SI).</summary>
    public static (HandValue Cantilevers, HandValue Solid) Bounds(CoupledWallCheck c, CoupledWallLoad load, double magnitude)
    {
        var inertias = c.Piers.Select(p => c.Thickness * Math.Pow(p.Length, 3) / 12).ToArray();
        var areas = c.Piers.Select(p => c.Thickness * p.Length).ToArray();
        var xs = c.Piers.Select(p => p.Centroid).ToArray();
        return (CoupledWalls.IndependentCantilevers(c.Material.E, inertias, c.Height, load, magnitude),
                CoupledWalls.SolidWall(c.Material.E, areas, inertias, xs, c.Height, load, magnitude));
    }

    internal static IEnumerable<ComparisonRow> Rows(StructureModel model, CoupledWallCheck c, double tol, PlaneLateral.Analysis.AnalysisOptions options)
    {
        var u = model.Units;
        string ku = ComparisonStudy.StiffnessUnit(u);
        string fu = u.ForceSymbol;
        foreach (var (load, mag) in Loads(c))
        {
            string lname = load == CoupledWallLoad.Uniform ? "uniform load" : "top load";
            double resultant = load == CoupledWallLoad.Uniform ? mag * c.Height : mag;
            var fe = ModelsFor(c).Select(m => m.Solve(c, load, mag, model.SourcePath, u, options)).ToList();
            var feShear = fe[0];
            var feFlex = fe.First(r => r.Model == new WideColumnFrame(false).Name);
            // Stiffness = total lateral load / top deflection: the same quantity as the other checks' rows.
            List<FeEstimate> Stiff() => fe.Select(r => new FeEstimate(r.Model, ComparisonStudy.Stiffness(u, resultant / r.TopDeflection),
                r.Description + "; stiffness = total lateral load / top deflection")).ToList();
            // The panel here is one mesh with no error estimate, so the wide-column frame stays the reference (ReferenceChoice).
            string basis = fe.Any(r => r.Model == PanelCoupledWall.ModelName)
                ? ReferenceChoice.LineModelsOnly(feShear.Model, "the plane-stress panel beside it is solved on one mesh, with no error estimate")
                : ReferenceChoice.LineModelsOnly(feShear.Model, PanelSkipped(c) is string w ? $"no plane-stress panel: {w}" : "no plane-stress panel for this check");
            string detail = FeDetail(u, fe) + (PanelSkipped(c) is string why ? $"\n{PanelCoupledWall.ModelName}: not built, {why}" : "");
            double docFe = feShear.DegreeOfCoupling, docFlex = feFlex.DegreeOfCoupling;
            var (cant, solid) = Bounds(c, load, mag);
            var pair = Pair(c);
            string aspect = $"{c.Stories} stories";
            if (pair is not null)
            {
                var cm = CoupledWalls.ContinuousMedium(pair, load, mag);
                var cmShear = CoupledWalls.ContinuousMedium(Pair(c, beamShear: true)!, load, mag);
                double kHand = resultant / cm.TopDeflection;
                double r = resultant / feShear.TopDeflection / kHand, r0 = resultant / feFlex.TopDeflection / kHand;
                string span = c.BeamSpan == BeamSpanRule.ClearOpening ? "beam span b = the clear opening" : "beam span b = the clear opening plus half the beam depth";
                var method = cm.Method.With(span, $"lengths and forces converted from SI for the row ({ku})");
                string cmDetail = string.Create(CultureInfo.InvariantCulture,
                    $"kαH = {cm.KAlphaH:G4}, k² = {cm.K2:G4}, degree of coupling {ComparisonStudy.Pct(cm.DegreeOfCoupling)} (rigid-beam limit 1/k² = {ComparisonStudy.Pct(1 / cm.K2)})\n" +
                    $"with the beams' shear deformation (I_c → I_c/(1 + 12EI_c/(G·A_s·b²))): kαH = {cmShear.KAlphaH:G4}, stiffness {G(ComparisonStudy.Stiffness(u, resultant / cmShear.TopDeflection))} {ku}, degree of coupling {ComparisonStudy.Pct(cmShear.DegreeOfCoupling)}");
                yield return new ComparisonRow(c.Id, "coupled-wall", $"{lname}: stiffness, continuous medium", ComparedQuantity.Stiffness, ku,
                    new HandEstimate(ComparisonStudy.Stiffness(u, kHand), method, Detail: cmDetail + "\n" + detail), Stiff(), null, tol,
                    CauseClosedForm(r, r0, tol, c, cm.KAlphaH, cmShear.TopDeflection / cm.TopDeflection), basis);
                double rd = docFe / cm.DegreeOfCoupling, rd0 = docFlex / cm.DegreeOfCoupling;
                yield return new ComparisonRow(c.Id, "coupled-wall", $"{lname}: degree of coupling, continuous medium", ComparedQuantity.Fraction, "-",
                    new HandEstimate(cm.DegreeOfCoupling, method, Detail: BeamShearDetail(u, cm, fe)),
                    fe.Select(x => new FeEstimate(x.Model, x.DegreeOfCoupling, x.Description + "; degree of coupling = axial-force couple / (couple + Σ pier base moments), from the base reactions")).ToList(),
                    null, tol, CauseCoupling(rd, rd0, tol, c, cmShear.DegreeOfCoupling / cm.DegreeOfCoupling), basis);
                double n0 = u.FromSI(cm.BaseAxialForce, Quantity.Force);
                yield return new ComparisonRow(c.Id, "coupled-wall", $"{lname}: pier axial force at the base, continuous medium", ComparedQuantity.Force, fu,
                    new HandEstimate(n0, method),
                    fe.Select(x => new FeEstimate(x.Model, u.FromSI(x.PierBaseAxialForces[0], Quantity.Force), x.Description + "; tension in pier 1 from its base reaction = the sum of the beam shears")).ToList(),
                    null, tol, CauseCoupling(feShear.PierBaseAxialForces[0] / cm.BaseAxialForce, feFlex.PierBaseAxialForces[0] / cm.BaseAxialForce, tol, c,
                        cmShear.BaseAxialForce / cm.BaseAxialForce), basis);
            }
            double kc = resultant / cant.Value, ks = resultant / solid.Value;
            yield return new ComparisonRow(c.Id, "coupled-wall", $"{lname}: stiffness, independent cantilevers", ComparedQuantity.Stiffness, ku,
                new HandEstimate(ComparisonStudy.Stiffness(u, kc), cant.Method, Detail: detail), Stiff(), null, tol,
                CauseCantilevers(resultant / feShear.TopDeflection / kc, resultant / feFlex.TopDeflection / kc, tol, docFe), basis);
            yield return new ComparisonRow(c.Id, "coupled-wall", $"{lname}: stiffness, one solid wall", ComparedQuantity.Stiffness, ku,
                new HandEstimate(ComparisonStudy.Stiffness(u, ks), solid.Method, Detail: detail), Stiff(), null, tol,
                CauseSolid(resultant / feShear.TopDeflection / ks, resultant / feFlex.TopDeflection / ks, tol, docFe, pair?.K2), basis);
        }
    }

    private static string G(double v) => ComparisonStudy.G4(v);

    /// <summary>Floor-by-floor FE results: displacement, drift, and each pier's base moment beside the axial couple.</summary>
    private static string FeDetail(UnitSystem u, IReadOnlyList<CoupledWallResponse> fe)
    {
        var sb = new StringBuilder();
        string lu = u.LengthSymbol, mu = u.Label(Quantity.Moment);
        foreach (var r in fe)
        {
            sb.Append($"{r.Model}: top deflection {G(u.FromSI(r.TopDeflection, Quantity.Length))} {lu}; base: pier moments ")
              .Append(string.Join(", ", r.PierBaseMoments.Select(m => G(u.FromSI(m, Quantity.Moment)))))
              .Append($" {mu}, axial-force couple {G(u.FromSI(r.AxialCouple, Quantity.Moment))} {mu}, overturning moment {G(u.FromSI(r.BaseOverturningMoment, Quantity.Moment))} {mu}, degree of coupling {ComparisonStudy.Pct(r.DegreeOfCoupling)}\n");
            sb.Append($"  story drifts ({lu}, story 1 first): ").Append(string.Join(", ", r.StoryDrifts.Select(d => G(u.FromSI(d, Quantity.Length))))).Append('\n');
        }
        return sb.ToString().TrimEnd('\n');
    }

    /// <summary>Coupling-beam shear floor by floor: closed form (tributary height) beside each FE model.</summary>
    private static string BeamShearDetail(UnitSystem u, CoupledWallResult cm, IReadOnlyList<CoupledWallResponse> fe)
    {
        var sb = new StringBuilder();
        string fu = u.ForceSymbol;
        sb.Append($"coupling-beam shear per floor ({fu}): floor, continuous medium (shear flow over the beam's tributary height), ")
          .Append(string.Join(", ", fe.Select(r => r.Model))).Append('\n');
        var cmShears = cm.FloorBeamShears();
        for (int j = cmShears.Count - 1; j >= 0; j--)
            sb.Append($"  {j + 1}: {G(u.FromSI(cmShears[j], Quantity.Force))}, ")
              .Append(string.Join(", ", fe.Select(r => G(u.FromSI(r.BeamShears[j][0], Quantity.Force))))).Append('\n');
        return sb.ToString().TrimEnd('\n');
    }

    private static string Smear(CoupledWallCheck c) =>
        $"the continuous medium smears the {c.Stories} discrete beams over the height; that gap shrinks as the story count grows";

    /// <summary>Cause rules for the closed-form stiffness row (docs/comparisons.md).</summary>
    /// <param name="ratio">FE (with shear deformation) / closed form.</param>
    /// <param name="ratioNoShear">FE without shear deformation / closed form.</param>
    /// <param name="beamShearFactor">Closed-form deflection with the beams' shear deformation over the classic one.</param>
    internal static string CauseClosedForm(double ratio, double ratioNoShear, double tol, CoupledWallCheck c, double kAlphaH, double beamShearFactor)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        var v0 = ComparisonRow.Judge(ratioNoShear, tol);
        double spanToDepth = 0; // b/d of the first opening, for the text
        if (c.Piers.Count >= 2) spanToDepth = (c.Piers[1].X - c.Piers[0].X - c.Piers[0].Length) / c.BeamDepth;
        string shear = $"shear deformation of walls and beams, which the classic closed form leaves out, changes the frame's stiffness to {ComparisonStudy.Pct(ratio / ratioNoShear)} of its flexure-only value (clear span/depth of the beams {G(spanToDepth)}; the beams' shear alone makes the closed-form deflection {ComparisonStudy.Pct(beamShearFactor)} of the classic one)";
        if (v == Verdict.WithinTolerance && v0 == Verdict.WithinTolerance)
            return $"same theory on both sides (kαH = {G(kAlphaH)}): the frame without shear deformation gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form, {Smear(c)}; {shear}";
        if (v0 == Verdict.WithinTolerance)
            return $"{shear}; without it the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form";
        if (v == Verdict.WithinTolerance)
            return $"agreement by offsetting effects: without shear deformation the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form ({Smear(c)}); {shear}";
        return $"{Smear(c)}: without shear deformation the frame still gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form; {shear}";
    }

    /// <summary>Cause rules for the degree-of-coupling and axial-force rows.</summary>
    internal static string CauseCoupling(double ratio, double ratioNoShear, double tol, CoupledWallCheck c, double beamShearFactor)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        var v0 = ComparisonRow.Judge(ratioNoShear, tol);
        string shear = $"shear deformation of the beams softens the coupling (the closed form with it gives {ComparisonStudy.Pct(beamShearFactor)} of the classic value)";
        if (v == Verdict.WithinTolerance && v0 == Verdict.WithinTolerance)
            return $"same theory on both sides: without shear deformation the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form; {Smear(c)}";
        if (v0 == Verdict.WithinTolerance)
            return $"{shear}; without shear deformation the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form";
        return $"{Smear(c)}: without shear deformation the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the closed form; {shear}";
    }

    internal static string CauseCantilevers(double ratio, double ratioNoShear, double tol, double doc)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        if (v == Verdict.WithinTolerance)
            return $"weak coupling: the frame's degree of coupling is {ComparisonStudy.Pct(doc)}, so the piers act nearly as independent cantilevers";
        if (v == Verdict.HandLower)
            return $"the coupling beams tie the piers: the axial-force couple resists {ComparisonStudy.Pct(doc)} of the overturning moment, which independent cantilevers leave out (without shear deformation the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the cantilevers' stiffness)";
        return $"shear deformation of the piers, which the flexure-only bound leaves out, outweighs the coupling (without it the frame gives {ComparisonStudy.Pct(ratioNoShear)}); degree of coupling {ComparisonStudy.Pct(doc)}";
    }

    internal static string CauseSolid(double ratio, double ratioNoShear, double tol, double doc, double? k2)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        string limit = k2 is double k ? $" of the rigid-beam limit 1/k² = {ComparisonStudy.Pct(1 / k)}" : "";
        if (v == Verdict.WithinTolerance)
            return $"beams stiff enough to make the piers act nearly as one section: degree of coupling {ComparisonStudy.Pct(doc)}{(k2 is double k1 ? $" against 1/k² = {ComparisonStudy.Pct(1 / k1)}" : "")}";
        if (v == Verdict.HandHigher)
            return $"the coupling beams are not rigid: they bend{(ratioNoShear > ratio ? " and shear" : "")}, so plane sections do not hold across the wall; degree of coupling {ComparisonStudy.Pct(doc)}{(k2 is double k2v ? $" (the axial-force couple of a solid section would be 1/k² = {ComparisonStudy.Pct(1 / k2v)})" : "")}; without shear deformation the frame gives {ComparisonStudy.Pct(ratioNoShear)} of the solid wall's stiffness";
        return $"frame stiffer than the one-section bound, which a frame of these members cannot be unless the loads differ; check the model{limit}";
    }

    // ---- sweep over the coupling-beam depth ----

    /// <summary>One point of the sweep, SI.</summary>
    public sealed record SweepPoint(double BeamDepth, double SpanToDepth, double KAlphaH, double ClosedForm, double ClosedFormBeamShear,
        double Cantilevers, double Solid, double FeShear, double FeNoShear, double DocClosedForm, double DocClosedFormBeamShear, double DocFeShear, double DocFeNoShear,
        double FePanel = double.NaN, double DocPanel = double.NaN);

    /// <summary>Default depths: 12 from 5% to 90% of the story height.</summary>
    public static IReadOnlyList<double> DefaultDepths(CoupledWallCheck c) =>
        Enumerable.Range(0, 12).Select(k => c.StoryHeight * (0.05 + 0.85 * k / 11.0)).ToArray();

    /// <summary>
    /// Top deflections and degrees of coupling of every model as the coupling beams deepen (everything else as the check
    /// gives it). Closed-form columns are NaN when the wall has more than two piers.
    /// </summary>
    /// <exception cref="ArgumentException">A depth not in (0, story height).</exception>
    public static IReadOnlyList<SweepPoint> OverBeamDepth(CoupledWallCheck c, IReadOnlyList<double> depths, CoupledWallLoad load, double magnitude, string source, UnitSystem units)
    {
        var list = new List<SweepPoint>();
        foreach (double d in depths)
        {
            if (!(d > 0 && d < c.StoryHeight)) throw new ArgumentException($"A beam depth of {d} m is not between 0 and the story height {c.StoryHeight} m.");
            var w = c with { BeamDepth = d };
            var fe = ModelsFor(w).Select(m => m.Solve(w, load, magnitude, source, units)).ToList();
            var panel = fe.FirstOrDefault(r => r.Model == PanelCoupledWall.ModelName);
            var (cant, solid) = Bounds(w, load, magnitude);
            var pair = Pair(w);
            double nan = double.NaN;
            CoupledWallResult? cm = pair is null ? null : CoupledWalls.ContinuousMedium(pair, load, magnitude);
            CoupledWallResult? cms = pair is null ? null : CoupledWalls.ContinuousMedium(Pair(w, true)!, load, magnitude);
            double clear = w.Piers[1].X - w.Piers[0].X - w.Piers[0].Length;
            list.Add(new SweepPoint(d, clear / d, cm?.KAlphaH ?? nan, cm?.TopDeflection ?? nan, cms?.TopDeflection ?? nan, cant.Value, solid.Value,
                fe[0].TopDeflection, fe[1].TopDeflection, cm?.DegreeOfCoupling ?? nan, cms?.DegreeOfCoupling ?? nan, fe[0].DegreeOfCoupling, fe[1].DegreeOfCoupling,
                panel?.TopDeflection ?? nan, panel?.DegreeOfCoupling ?? nan));
        }
        return list;
    }

    /// <summary>The sweep as CSV in the model's units: the caution as a leading comment line, one header, one line per depth.</summary>
    public static string SweepCsv(CoupledWallCheck c, CoupledWallLoad load, IReadOnlyList<SweepPoint> points, UnitSystem u) =>
        SweepTable(c, [(load, points)], u).ToCsv();

    /// <summary>The sweep of every load in one table as CSV (one line per load and depth), the caution leading as a comment.</summary>
    public static string SweepCsv(CoupledWallCheck c, IReadOnlyList<(CoupledWallLoad Load, IReadOnlyList<SweepPoint> Points)> sweeps, UnitSystem u) =>
        SweepTable(c, sweeps, u).ToCsv();

    /// <summary>
    /// The sweep of every load in one table (coupling-sweep.csv), one row per load and depth, in the model's units, the
    /// caution as the CSV's leading comment; a value a model cannot give (NaN) is an empty cell.
    /// </summary>
    public static ResultTable SweepTable(CoupledWallCheck c, IReadOnlyList<(CoupledWallLoad Load, IReadOnlyList<SweepPoint> Points)> sweeps, UnitSystem u)
    {
        object N(double v) => double.IsNaN(v) ? null! : v;
        object L(double v) => N(u.FromSI(v, Quantity.Length));
        string lu = u.LengthSymbol;
        TableColumn Len(string name) => new(name, lu);
        TableColumn Ratio(string name) => new(name);
        return new ResultTable
        {
            Title = $"Coupled wall \"{c.Id}\" over the coupling-beam depth",
            Columns =
            [
                new("check", Kind: CellKind.Text), new("load", Kind: CellKind.Text), Len("beam depth"), Ratio("clear span/depth"), Ratio("k alpha H"),
                Len("top deflection continuous medium"), Len("top deflection continuous medium with beam shear"), Len("top deflection independent cantilevers"),
                Len("top deflection one solid wall"), Len("top deflection wide column"), Len("top deflection wide column without shear"),
                Ratio("coupling continuous medium"), Ratio("coupling continuous medium with beam shear"), Ratio("coupling wide column"),
                Ratio("coupling wide column without shear"), Len("top deflection plane-stress panel"), Ratio("coupling plane-stress panel"),
            ],
            Rows = sweeps.SelectMany(s => s.Points.Select(p => (IReadOnlyList<object>)
                [c.Id, s.Load == CoupledWallLoad.Uniform ? "uniform" : "top", L(p.BeamDepth), N(p.SpanToDepth), N(p.KAlphaH),
                 L(p.ClosedForm), L(p.ClosedFormBeamShear), L(p.Cantilevers), L(p.Solid), L(p.FeShear), L(p.FeNoShear),
                 N(p.DocClosedForm), N(p.DocClosedFormBeamShear), N(p.DocFeShear), N(p.DocFeNoShear), L(p.FePanel), N(p.DocPanel)])).ToList(),
            Comments = [ComparisonReport.Caution],
        };
    }
}
