using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// A wall line on a footing ("footing-wall" check, docs/footings.md): the cantilever formula with the base terms
/// 1/k = h³/(3EI) + h/(κGA) + h²/K_θ + 1/K_h (hand springs from PlaneLateral.Hand's own footing formulas) beside the
/// wall's members alone on the support springs the engine computed, fixed base and on the footing side by side, with
/// each term's share; the soil modulus × 0.5 and × 2 as bounds; the other formula set as a second opinion; and, with a
/// weight at the top, the period lengthening by the single-mode expression beside the FE eigen periods.
/// </summary>
internal static class FootingWallStudy
{
    public const string Kind = "footing-wall";
    public const string PeriodKind = "footing-period";

    /// <summary>Bounds on the soil modulus (common practice for uncertain soil; ASCE 7-16 §12.13.3 uses a similar ±range, from memory).</summary>
    private static readonly double[] Bounds = [0.5, 2.0];

    public static IEnumerable<ComparisonRow> Rows(StructureModel model, FootingWallCheck c, double tol, AnalysisOptions options)
    {
        var u = model.Units;
        var footing = model.Footings.First(f => f.Id == c.FootingId);
        var support = model.Supports.First(s => s.Node == c.BaseNode);
        var m0 = model.Members[c.Members[0]];
        double h = model.Nodes[c.TopNode].Y - model.Nodes[c.BaseNode].Y;
        double formFactor = m0.A / m0.ShearArea;
        double depth = model.Sections.FirstOrDefault(s => s.Id == m0.SectionId)?.Depth ?? double.NaN;
        double? aspect = double.IsFinite(depth) && depth > 0 ? h / depth : null;
        var handFixed = Piers.Cantilever(1.0, h, m0.E, m0.I, m0.A, m0.G, formFactor);
        string unit = ComparisonStudy.StiffnessUnit(u);
        var notes = footing.Cautions.Count == 0 ? "" : " Cautions: " + string.Join("; ", footing.Cautions) + ".";

        // FE: the wall's members alone, (a) fixed base with and (b) without shear, (c) rocking spring only, (d) all the footing's springs.
        var fixedBase = new Support(0, "fixed", true, true, true, 0, 0, 0);
        double dFixed = Deflection(model, c, fixedBase, withShear: true, options);
        double dFlexure = Deflection(model, c, fixedBase, withShear: false, options);
        var feFixed = new FeEstimate("line members, fixed base", ComparisonStudy.Stiffness(u, 1 / dFixed),
            $"the check's {c.Members.Count} Timoshenko member(s) alone, base fixed, top free, unit lateral force at the top; shares from a second solve without shear deformation",
            dFlexure / dFixed, 1 - dFlexure / dFixed);
        yield return new ComparisonRow(c.Id, Kind, "fixed base", ComparedQuantity.Stiffness, unit,
            new HandEstimate(ComparisonStudy.Stiffness(u, handFixed.Stiffness), handFixed.Method, handFixed.FlexuralShare, handFixed.ShearShare),
            [feFixed], aspect, tol, "the wall alone on a fixed base, for reference: same beam theory on both sides");

        var cases = new List<(string Subject, Footing F, FootingFormulas Set)>
        {
            ("on footing", footing, Set(footing.Formulas)),
        };
        foreach (double b in Bounds)
            cases.Add(($"on footing, soil G × {b.ToString("0.#", CultureInfo.InvariantCulture)}", footing.WithModulusScaled(b), Set(footing.Formulas)));
        var otherSet = footing.Formulas == FootingFormulaSet.PaisKausel ? FootingFormulaSet.Gazetas : FootingFormulaSet.PaisKausel;
        var other = footing with { Formulas = otherSet, Springs = FootingSoilSprings.Compute(otherSet, footing.Length, footing.Width, footing.Embedment, footing.ShearModulus, footing.PoissonRatio) };
        cases.Add(($"on footing, {SetName(otherSet)} formulas", other, Set(otherSet)));

        FlexibleBaseDeflection? best = null;
        double bestFe = double.NaN;
        foreach (var (subject, f, set) in cases)
        {
            var hand = HandOnFooting(handFixed, f, set, support);
            var springs = SupportOn(support, f);
            double dRock = Deflection(model, c, springs with { RestrainX = true, SpringX = 0 }, withShear: true, options);
            double dAll = Deflection(model, c, springs, withShear: true, options);
            var fe = new FeEstimate("line members on the footing springs", ComparisonStudy.Stiffness(u, 1 / dAll),
                $"the check's member(s) alone on the support springs the engine computed by {SetName(f.Formulas)} (sliding {Springs(u, f.Springs.Sliding, Quantity.TranslationalStiffness)}, rocking {Springs(u, f.Springs.Rocking, Quantity.RotationalStiffness)}); "
                + $"shares from solves on a fixed base without shear, fixed base, rocking spring only: flexure {ComparisonStudy.Pct(dFlexure / dAll)}, shear {ComparisonStudy.Pct((dFixed - dFlexure) / dAll)}, rocking {ComparisonStudy.Pct((dRock - dFixed) / dAll)}, sliding {ComparisonStudy.Pct((dAll - dRock) / dAll)}",
                dFlexure / dAll, (dFixed - dFlexure) / dAll);
            string detail = $"hand shares of the top deflection: flexure {ComparisonStudy.Pct(hand.FlexuralShare)}, shear {ComparisonStudy.Pct(hand.ShearShare)}, rocking {ComparisonStudy.Pct(hand.RockingShare)}, sliding {ComparisonStudy.Pct(hand.SlidingShare)}\n"
                + $"hand springs ({SetName(f.Formulas)}): K_θ = {Springs(u, HandSprings(f, set).Rocking, Quantity.RotationalStiffness)}, K_h = {Springs(u, HandSprings(f, set).Sliding, Quantity.TranslationalStiffness)}\n"
                + $"stiffness kept on the footing: {ComparisonStudy.Pct(hand.Stiffness / handFixed.Stiffness)} of the fixed-base value (hand), {ComparisonStudy.Pct(dFixed / dAll)} (FE)";
            double ratio = (1 / dAll) / hand.Stiffness;
            string cause = (ComparisonRow.Judge(ratio, tol) == Verdict.WithinTolerance
                    ? "same beam theory and the same published footing formulas on both sides (evaluated apart), so agreement checks the arithmetic, not the soil model"
                    : "the FE sub-model differs from the hand inputs; check the footing and the wall's members")
                + $". The footing's rocking gives {ComparisonStudy.Pct(hand.RockingShare)} and its sliding {ComparisonStudy.Pct(hand.SlidingShare)} of the top deflection (hand); the wall keeps {ComparisonStudy.Pct(hand.Stiffness / handFixed.Stiffness)} of its fixed-base stiffness."
                + (subject == "on footing" ? notes : "");
            yield return new ComparisonRow(c.Id, Kind, subject, ComparedQuantity.Stiffness, unit,
                new HandEstimate(ComparisonStudy.Stiffness(u, hand.Stiffness), hand.Method.With(Inputs(u, f)), hand.FlexuralShare, hand.ShearShare, detail),
                [fe], aspect, tol, cause);
            if (best is null) { best = hand; bestFe = dAll; }
        }

        if (c.TopWeight is double w && best is not null)
        {
            double mass = w / SeismicPresets.Gravity;
            double tFixedFe = Period(mass, dFixed), tFlexFe = Period(mass, bestFe);
            var hs = HandSprings(footing, Set(footing.Formulas));
            var handRatio = FlexibleBase.PeriodRatio(handFixed.Stiffness, Finite(hs.Sliding, support.RestrainX), Finite(hs.Rocking, support.RestrainRZ), h);
            double tFixedHand = 2 * Math.PI * Math.Sqrt(mass / handFixed.Stiffness);
            string detail = $"fixed-base period T = {S(tFixedHand)} s (hand, 2π√(m/k)); flexible-base T̃ = {S(tFixedHand * handRatio.Value)} s";
            var fe = new FeEstimate("eigen periods of the line members, one mass at the top", tFlexFe / tFixedFe,
                $"first eigen period with the mass {Springs(u, mass * SeismicPresets.Gravity, Quantity.Force)} (weight) at the top: fixed base T = {S(tFixedFe)} s, on the footing springs T̃ = {S(tFlexFe)} s; the footing has no mass");
            yield return new ComparisonRow(c.Id, PeriodKind, "period lengthening T̃/T", ComparedQuantity.Fraction, "",
                new HandEstimate(handRatio.Value, handRatio.Method, null, null, detail), [fe], aspect, tol,
                "the single-mode expression is exact for one mass on a massless footing (springs in series), so agreement checks the arithmetic; with several masses or a heavy footing the eigen solution is the better number. Soil properties are uncertain: see the G × 0.5 and × 2 rows");
        }
    }

    /// <summary>Top deflection (m) under a unit force of the check's members alone on <paramref name="baseSupport"/>.</summary>
    internal static double Deflection(StructureModel model, FootingWallCheck c, Support baseSupport, bool withShear, AnalysisOptions options)
    {
        var sub = new SubModel($"{c.Id}: wall on its base", model.SourcePath, model.Units);
        var map = new Dictionary<int, int>();
        int N(int n) => map.TryGetValue(n, out int k) ? k : map[n] = sub.NodeAt(model.Nodes[n].X, model.Nodes[n].Y, model.Nodes[n].Id);
        foreach (int mi in c.Members)
        {
            var m = model.Members[mi];
            sub.Copy(withShear ? m : m with { ShearArea = double.PositiveInfinity }, N(m.Start), N(m.End));
        }
        sub.StiffnessAt(map[c.TopNode], "top");
        var built = sub.Build() with { Supports = [baseSupport with { Node = map[c.BaseNode] }] };
        return 1 / ComparisonStudy.SolveStiffness(built, options);
    }

    /// <summary>First period (s) of one mass m (kg) on a flexibility δ (m/N), through the modal solution the seismic analysis uses.</summary>
    internal static double Period(double mass, double flexibility)
    {
        var modal = new ModalModel
        {
            MassEquations = [0], Masses = [mass], Flexibility = new double[,] { { flexibility } },
            LevelDofs = [[(0, 1.0)]], LevelNodeCounts = [1],
        };
        return modal.Modes(1)[0].Period;
    }

    /// <summary>The support with the footing's springs in the footing's directions (the model's own support, or the same with scaled soil).</summary>
    private static Support SupportOn(Support s, Footing f) => s with
    {
        SpringX = f.SpringDirections.Contains(Dof.X) ? f.Springs.Sliding : s.SpringX,
        SpringY = f.SpringDirections.Contains(Dof.Y) ? f.Springs.Vertical : s.SpringY,
        SpringRZ = f.SpringDirections.Contains(Dof.RZ) ? f.Springs.Rocking : s.SpringRZ,
    };

    /// <summary>
    /// The hand rocking and sliding springs (N·m/rad, N/m) under a supported node with a footing, in the footing's own
    /// formula set: the footing's spring in each direction it replaces, +∞ where the support keeps its restraint.
    /// </summary>
    internal static (double Rocking, double Sliding) HandBaseSprings(Footing f, Support s)
    {
        var k = HandSprings(f, Set(f.Formulas));
        return (f.SpringDirections.Contains(Dof.RZ) ? k.Rocking : Finite(double.PositiveInfinity, s.RestrainRZ),
            f.SpringDirections.Contains(Dof.X) ? k.Sliding : Finite(double.PositiveInfinity, s.RestrainX));
    }

    /// <summary>The model with every footing's springs replaced by restraints in the directions they replaced: the fixed-base model.</summary>
    internal static StructureModel FixedBase(StructureModel model) => model with
    {
        Footings = [],
        Supports = model.Supports.Select(s => model.Footings.FirstOrDefault(f => f.Node == s.Node) is not { } f ? s : s with
        {
            RestrainX = s.RestrainX || f.SpringDirections.Contains(Dof.X), SpringX = f.SpringDirections.Contains(Dof.X) ? 0 : s.SpringX,
            RestrainY = s.RestrainY || f.SpringDirections.Contains(Dof.Y), SpringY = f.SpringDirections.Contains(Dof.Y) ? 0 : s.SpringY,
            RestrainRZ = s.RestrainRZ || f.SpringDirections.Contains(Dof.RZ), SpringRZ = f.SpringDirections.Contains(Dof.RZ) ? 0 : s.SpringRZ,
        }).ToList(),
    };

    private static FlexibleBaseDeflection HandOnFooting(MemberDeflection handFixed, Footing f, FootingFormulas set, Support s)
    {
        var k = HandSprings(f, set);
        double rock = f.SpringDirections.Contains(Dof.RZ) ? k.Rocking : Finite(double.PositiveInfinity, s.RestrainRZ);
        double slide = f.SpringDirections.Contains(Dof.X) ? k.Sliding : Finite(double.PositiveInfinity, s.RestrainX);
        return FlexibleBase.Cantilever(handFixed, rock, slide);
    }

    /// <summary>The hand library's springs for the footing (its own evaluation of the published formulas, SI).</summary>
    internal static (double Sliding, double Rocking, double Vertical) HandSprings(Footing f, FootingFormulas set)
    {
        var soil = Soil.FromShearModulus(f.SmallStrainModulus, f.PoissonRatio, f.Reduction);
        return RigidFooting.By(set, f.Length, f.Width, f.Embedment, soil).InPlane(wallAlongLongSide: f.Length >= f.Width);
    }

    internal static double Finite(double k, bool restrained) => restrained ? double.PositiveInfinity : k;

    internal static FootingFormulas Set(FootingFormulaSet s) => s == FootingFormulaSet.Gazetas ? FootingFormulas.Gazetas : FootingFormulas.PaisKausel;

    private static string SetName(FootingFormulaSet s) => s == FootingFormulaSet.Gazetas ? "Gazetas (1991)" : "Pais & Kausel (1988)";

    private static string Inputs(UnitSystem u, Footing f) =>
        $"footing {ComparisonStudy.G4(u.FromSI(f.Length, Quantity.Length))} × {ComparisonStudy.G4(u.FromSI(f.Width, Quantity.Length))} {u.LengthSymbol} (length in the wall's plane × width), embedment {ComparisonStudy.G4(u.FromSI(f.Embedment, Quantity.Length))} {u.LengthSymbol}; "
        + $"soil G = {ComparisonStudy.G4(u.FromSI(f.ShearModulus, Quantity.Stress))} {u.Label(Quantity.Stress)} (G₀ × {ComparisonStudy.G4(f.Reduction)}), ν = {ComparisonStudy.G4(f.PoissonRatio)}; "
        + (f.Length >= f.Width ? "the wall lies along the footing's long side, so it rocks about the strong axis (K_yy)" : "the wall lies across the footing (along its short side), so it rocks about the weak axis (K_xx)");

    private static string Springs(UnitSystem u, double si, Quantity q) => $"{ComparisonStudy.G4(u.FromSI(si, q))} {u.Label(q)}";

    private static string S(double seconds) => seconds.ToString("0.000", CultureInfo.InvariantCulture);
}
