using PlaneLateral.Elements;
using MathNet.Numerics.LinearAlgebra.Double;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// The equivalent lateral forces of one direction of a building in plan (ASCE 7-16 §12.8, from memory): the period of
/// the mode with the largest effective mass along the direction, capped at C_u·T_a; C_s, V = C_s·W and
/// F_x = C_vx·V from the planar code path (<see cref="SeismicAnalysis.ResponseCoefficient"/>,
/// <see cref="SeismicAnalysis.VerticalDistribution"/>).
/// </summary>
/// <param name="Mode">The mode whose period is the modal period (largest effective mass along the direction).</param>
/// <param name="LevelForces">F_x per floor (N), lowest first.</param>
/// <param name="Cases">Ids of the generated cases: at the centres of mass, then +ecc and −ecc.</param>
public sealed record PlanElfDirection(string Direction, int Mode, double ModalPeriod, double HeightFeet, double Ta, double Cu, double PeriodUsed, string PeriodNote,
    double Cs, string CsNote, double Weight, double BaseShear, double Exponent, IReadOnlyList<double> Cvx, IReadOnlyList<double> LevelForces, IReadOnlyList<string> Cases);

/// <summary>A_x of one floor and direction from the generated ±ecc cases (eq. 12.8-14), and whether it was applied.</summary>
public sealed record PlanAmplification(string Direction, int Level, double MaxDisplacement, double AverageDisplacement, double Ax, bool Applied);

/// <summary>One mode's contribution along an excitation direction: S_a (g) at its period, Γ, its base shears (reduced by R/I_e, N).</summary>
public sealed record PlanSpectrumMode(string Direction, int Mode, double Period, double Sa, double Gamma, double BaseShearX, double BaseShearY, double BaseTorque)
{
    /// <summary>The analysis the mode belongs to: "" with static accidental torsion, "+e" or "-e" with the floor masses shifted.</summary>
    public string Variant { get; init; } = "";
}

/// <summary>
/// One story for an excitation direction: the ELF story shear (the generated case at the centres of mass), the combined
/// modal story shear along the direction before and after the §12.9.1.4 force scaling, and the corner drift along the
/// direction: per mode at each outline corner, combined, times the drift factor; plus the static accidental torsion's
/// drift at that corner; δ = C_d·(that)/I_e. <see cref="DriftFromCombinedDisplacements"/> is the difference of the
/// combined displacements at the same corner, shown only to make plain that it is not the drift.
/// </summary>
public sealed record PlanSpectrumStory(string Direction, int Story, double ElfShear, double ModalShear, double ScaledShear, int Corner, PlanPoint At,
    double ModalDrift, double TorsionDrift, double Drift, double DesignDrift, double Height, double Ratio, double DriftFromCombinedDisplacements)
{
    /// <summary>P_x: the floors' seismic weights at and above the story (N).</summary>
    public double Px { get; init; } = double.NaN;
    /// <summary>θ = P_x·Δ·I_e/(V_x·h_sx·C_d), Δ = <see cref="DesignDrift"/>, V_x = <see cref="ScaledShear"/> (ASCE 7-16 eq. 12.8-16, from memory).</summary>
    public double Theta { get; init; } = double.NaN;
    /// <summary>θ of the equivalent lateral forces: the worst corner drift of the direction's ELF cases (± eccentricity) and the ELF story shear.</summary>
    public double ThetaElf { get; init; } = double.NaN;
    /// <summary>θ_max = 0.5/(β·C_d) ≤ 0.25 with β = 1 (no gravity analysis in plan: β = 1 is the conservative value).</summary>
    public double ThetaMax { get; init; } = double.NaN;
    /// <summary>With shifted masses, the shifted analysis ("+e" or "-e") whose drift governs this row; "" otherwise.</summary>
    public string Variant { get; init; } = "";
}

/// <summary>A line's story shear for an excitation direction: combined modal (reduced), scaled, the static accidental torsion's share (its magnitude), design = scaled + torsion.</summary>
public sealed record PlanSpectrumLine(string Direction, int Story, string Line, double Modal, double Scaled, double Torsion, double Design, double Elf)
{
    /// <summary>Overturning moment of the line at the story's base, combined mode by mode (N·m, no sign), before scaling.</summary>
    public double Overturning { get; init; } = double.NaN;
    /// <summary>The same after the force scaling.</summary>
    public double ScaledOverturning { get; init; } = double.NaN;
    /// <summary>The static accidental torsion's overturning moment (magnitude; 0 with shifted masses).</summary>
    public double TorsionOverturning { get; init; } = double.NaN;
    /// <summary>Scaled + torsion.</summary>
    public double DesignOverturning => ScaledOverturning + TorsionOverturning;
}

/// <summary>
/// A line's planar model recovered under each mode's level forces (the line's share of the floor motion of the mode)
/// and, with static accidental torsion, under the torsion's: member end forces and reactions combined mode by mode
/// (no sign), scaled, and the torsion's magnitudes; design = scaled + torsion, component by component.
/// </summary>
public sealed record PlanSpectrumLineForces(string Direction, string Line, IReadOnlyList<MemberEndForces> Modal, IReadOnlyList<MemberEndForces> Scaled,
    IReadOnlyList<MemberEndForces> Torsion, IReadOnlyList<Reaction> ModalReactions, IReadOnlyList<Reaction> ScaledReactions, IReadOnlyList<Reaction> TorsionReactions)
{
    public IReadOnlyList<MemberEndForces> Design => Scaled.Zip(Torsion, (a, b) => new MemberEndForces(a.Member, a.N1 + b.N1, a.V1 + b.V1, a.M1 + b.M1, a.N2 + b.N2, a.V2 + b.V2, a.M2 + b.M2)).ToList();
    public IReadOnlyList<Reaction> DesignReactions => ScaledReactions.Zip(TorsionReactions, (a, b) => new Reaction(a.Node, a.Fx + b.Fx, a.Fy + b.Fy, a.Mz + b.Mz)).ToList();
}

/// <summary>One of the analyses a direction's results come from: with shifted masses "+e" and "-e" (the floors' centres of
/// mass moved by <see cref="Shift"/>, m, across the direction), else one "" at the centres of mass.</summary>
/// <param name="FloorRotation">Rz per floor combined mode by mode (rad, no sign), before scaling.</param>
/// <param name="DominantModeRotation">Rz per floor of the mode with the largest effective mass along the direction (signed: Γ·φ·S_a·g/(ω²·R/I_e)).</param>
public sealed record PlanSpectrumVariant(string Label, double Shift, ModalScaling Scaling, int ModesUsed, IReadOnlyList<double> FloorRotation, IReadOnlyList<double> DominantModeRotation);

/// <summary>The response spectrum analysis of one excitation direction.</summary>
public sealed record PlanSpectrumDirection(string Direction, int ModesUsed, double CumulativeShare, ModalScaling Scaling,
    IReadOnlyList<PlanSpectrumMode> Modes, IReadOnlyList<PlanSpectrumStory> Stories, IReadOnlyList<PlanSpectrumLine> Lines, double EquilibriumError)
{
    /// <summary>Each line's member end forces and reactions (one entry per line).</summary>
    public IReadOnlyList<PlanSpectrumLineForces> LineForces { get; init; } = [];
    /// <summary>The analyses enveloped (one with static accidental torsion).</summary>
    public IReadOnlyList<PlanSpectrumVariant> Variants { get; init; } = [];
}

/// <summary>Modal response spectrum analysis of a building in plan (docs/plan.md, docs/seismic.md).</summary>
public sealed record PlanSpectrumResult(DesignSpectrum Spectrum, ResponseSpectrumSettings Settings, double R, double Ie, IReadOnlyList<PlanSpectrumDirection> Directions)
{
    /// <summary>How the accidental torsion was applied, in words (the tool says which it used).</summary>
    public string TorsionMethod { get; init; } = "";
}

/// <summary>Everything the seismic block of a building adds.</summary>
public sealed record PlanSeismicResult(PlanModal Modal, IReadOnlyList<PlanElfDirection> Elf, IReadOnlyList<PlanAmplification> Amplification, PlanSpectrumResult? Spectrum);

/// <summary>
/// The seismic block of a building in plan: the modes on the floors' (Ux, Uy, Rz) (<see cref="PlanModal"/>), the
/// equivalent lateral forces along X and Y as plan load cases at the centres of mass ± the accidental eccentricity
/// (their results go through <see cref="PlanAnalysis.Run"/> like any case), A_x of the accidental torsion
/// (§12.8.4.3) where a torsional irregularity is found, and the modal response spectrum analysis (§12.9.1).
/// Every number from memory of ASCE 7-16 (confirm the edition); the governing code decides.
/// </summary>
public static partial class PlanSeismic
{
    /// <summary>Solves the building with its seismic cases (without a seismic block: <see cref="PlanAnalysis.Run"/>, and null).</summary>
    /// <exception cref="UnstableModelException">The lines cannot hold a floor.</exception>
    /// <exception cref="ModelInputException">A floor has no weight.</exception>
    public static (PlanResult Result, PlanSeismicResult? Seismic) Run(BuildingPlan plan, AnalysisOptions? options = null)
    {
        if (plan.Seismic is not { } s) return (PlanAnalysis.Run(plan, options), null);
        int n = plan.FloorCount;
        var condensed = plan.Lines.Select(l => PlanAnalysis.Condense(l, n, options)).ToList();
        var k = PlanAnalysis.Assemble(plan.Lines, condensed.Select(c => c.K).ToList(), n);
        PlanAnalysis.CheckStable(plan, k, plan.Size);   // a free floor motion is refused with the DOF named
        var modal = PlanModal.Solve(plan, k);

        var elf = new[] { "x", "y" }.Select(d => Elf(plan, s, modal, d)).ToList();
        var cases = plan.Cases.ToList();
        foreach (var e in elf)
        {
            cases.Add(PlanLoads.AtCentreOfMass(e.Cases[0], s.CaseId, "equivalent lateral forces", e.Direction, 0, plan.Levels, e.LevelForces, 0));
            if (plan.EccentricityRatio > 0)
            {
                cases.Add(PlanLoads.AtCentreOfMass(e.Cases[1], s.CaseId, "equivalent lateral forces", e.Direction, +1, plan.Levels, e.LevelForces, plan.EccentricityRatio));
                cases.Add(PlanLoads.AtCentreOfMass(e.Cases[2], s.CaseId, "equivalent lateral forces", e.Direction, -1, plan.Levels, e.LevelForces, plan.EccentricityRatio));
            }
        }
        var withElf = plan with { Cases = cases };
        var result = PlanAnalysis.Run(withElf, options, condensed);

        // A_x (§12.8.4.3): from the ELF ±ecc cases; applied where the direction has a Type 1a or 1b irregularity.
        var amplification = new List<PlanAmplification>();
        var ax = new Dictionary<string, double[]>();
        if (plan.EccentricityRatio > 0)
        {
            foreach (var e in elf)
            {
                bool irregular = result.Irregularity.Any(t => t.Direction == e.Direction && t.Type != "none");
                var a = new double[n];
                for (int l = 1; l <= n; l++)
                {
                    double best = double.NaN, umax = double.NaN, uavg = double.NaN;
                    foreach (var id in e.Cases.Skip(1))
                    {
                        var c = result.Case(id);
                        var disp = c.Vertices.Where(v => v.Level == l).Select(v => e.Direction == "x" ? v.Ux : v.Uy).ToList();
                        double mx = disp.Max(), mn = disp.Min(), avg = 0.5 * (mx + mn);
                        double x = avg > 0 ? Math.Clamp(Math.Pow(mx / (1.2 * avg), 2), 1, 3) : 1;
                        if (double.IsNaN(best) || x > best) { best = x; umax = mx; uavg = avg; }
                    }
                    a[l - 1] = irregular ? best : 1;
                    amplification.Add(new PlanAmplification(e.Direction, l, umax, uavg, best, irregular && best > 1));
                }
                ax[e.Direction] = a;
            }
            var amplified = elf.Where(e => ax[e.Direction].Any(v => v > 1)).ToList();
            if (amplified.Count > 0)
            {
                foreach (var e in amplified)
                {
                    cases.Add(PlanLoads.AtCentreOfMass(e.Cases[0] + "+ecc·Ax", s.CaseId, "equivalent lateral forces", e.Direction, +1, plan.Levels, e.LevelForces, plan.EccentricityRatio, ax[e.Direction], ""));
                    cases.Add(PlanLoads.AtCentreOfMass(e.Cases[0] + "-ecc·Ax", s.CaseId, "equivalent lateral forces", e.Direction, -1, plan.Levels, e.LevelForces, plan.EccentricityRatio, ax[e.Direction], ""));
                }
                withElf = plan with { Cases = cases };
                result = PlanAnalysis.Run(withElf, options, condensed);
            }
        }

        PlanSpectrumResult? spectrum = null;
        if (s.ResponseSpectrum is { } rs)
            spectrum = Spectrum(withElf, s, rs, modal, condensed, elf, result, ax, options);
        return (result, new PlanSeismicResult(modal, elf, amplification, spectrum));
    }

    private static PlanElfDirection Elf(BuildingPlan plan, PlanSeismicData s, PlanModal modal, string dir)
    {
        int d = dir == "x" ? 0 : 1;
        var levels = plan.Levels;
        var governing = modal.Modes.OrderByDescending(m => m.Share[d]).ThenBy(m => m.Number).First();
        double t1 = governing.Period;
        double hn = levels[^1].Elevation - levels[0].Elevation, hft = hn / 0.3048;
        var (ct, xx, _) = SeismicPresets.PeriodCoefficients[s.StructureType];
        double ta = ct * Math.Pow(hft, xx);
        double cu = SeismicPresets.UpperLimitCoefficient(s.Spectrum.Sd1);
        (double t, string note) = s.Period switch
        {
            PeriodUse.Given => (s.GivenPeriod, "given"),
            PeriodUse.Approximate => (ta, "approximate period Ta"),
            PeriodUse.Computed => (t1, $"period of mode {governing.Number}"),
            _ => t1 <= cu * ta ? (t1, $"period of mode {governing.Number} (below Cu·Ta)") : (cu * ta, $"upper limit Cu·Ta (mode {governing.Number} is longer)"),
        };
        // Floors that bend: the modes are of the rigid-floor model (its periods are the shortest, so C_s is not taken low).
        if (plan.Floors.Any(f => f.Kind != FloorKind.Rigid) && s.Period is not (PeriodUse.Given or PeriodUse.Approximate)) note += "; modes of the rigid-floor model";
        var (cs, csNote) = SeismicAnalysis.ResponseCoefficient(s.Spectrum, t);
        var weights = levels.Select((l, i) => i == 0 ? 0 : l.Weight).ToArray();
        double w = weights.Sum();
        double v = cs * w;
        double k = SeismicAnalysis.Exponent(t);
        var heights = levels.Select(l => l.Elevation - levels[0].Elevation).ToArray();
        var cvx = SeismicAnalysis.VerticalDistribution(weights, heights, k);
        var f = cvx.Skip(1).Select(c => c * v).ToArray();
        string id = $"{s.CaseId}-{dir}";
        return new PlanElfDirection(dir, governing.Number, t1, hft, ta, cu, t, note, cs, csNote, w, v, k, cvx.Skip(1).ToArray(), f,
            plan.EccentricityRatio > 0 ? [id, id + "+ecc", id + "-ecc"] : [id]);
    }

    /// <summary>Relative out-of-balance of the lines' forces against the mode's floor forces (ΣFx, ΣFy, ΣMz about the origin).</summary>
    private static double Equilibrium(BuildingPlan plan, IReadOnlyList<PlanAnalysis.Condensation> condensed, double[] u, double fx, double fy, double mz)
    {
        int n = plan.FloorCount;
        double lx = 0, ly = 0, lm = 0;
        for (int i = 0; i < plan.Lines.Count; i++)
        {
            var line = plan.Lines[i];
            double p = SmallMatrix.Times(condensed[i].K, PlanAnalysis.Project(line, u, n)).Sum();
            lx += line.Cos * p; ly += line.Sin * p; lm += line.Lever * p;
        }
        double size = plan.Size;
        double scale = new[] { fx, fy, mz / size, lx, ly, lm / size }.Max(Math.Abs);
        double err = new[] { fx - lx, fy - ly, (mz - lm) / size }.Max(Math.Abs);
        return scale == 0 ? err : err / scale;
    }
}
