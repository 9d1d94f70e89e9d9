using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>One vibration mode: period (s), circular frequency (rad/s), the level displacements of its shape (largest 1),
/// and its effective mass as a share of the total mass (for motion along x).</summary>
public sealed record Mode(int Number, double Period, double Omega, IReadOnlyList<double> LevelShape, double MassShare);

/// <summary>
/// The lumped masses of the levels on their diaphragm equations and the stiffness condensed to those equations: the
/// flexibility F (m/N) of the mass DOFs, from one solve per mass DOF on the factor of K. With masses only on those
/// DOFs, the condensation is exact: K·φ = ω²·M·φ becomes F·M·φ = φ/ω².
/// </summary>
public sealed class ModalModel
{
    /// <summary>Equations that carry mass.</summary>
    public required int[] MassEquations { get; init; }
    /// <summary>Mass at each of <see cref="MassEquations"/> (kg).</summary>
    public required double[] Masses { get; init; }
    /// <summary>Flexibility between the mass DOFs (m/N), symmetric.</summary>
    public required double[,] Flexibility { get; init; }
    /// <summary>For every level (index into the levels), the mass DOFs it spreads over and the share of each (Σ = 1); empty for the base.</summary>
    public required IReadOnlyList<IReadOnlyList<(int Dof, double Share)>> LevelDofs { get; init; }
    /// <summary>For every level, the number of its nodes (a level's displacement is the mean ux of its nodes).</summary>
    public required int[] LevelNodeCounts { get; init; }

    /// <summary>Displacements of the mass DOFs under forces at them: u = F·f.</summary>
    public double[] Deflect(double[] f)
    {
        int n = f.Length;
        var u = new double[n];
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) u[i] += Flexibility[i, j] * f[j];
        return u;
    }

    /// <summary>Forces at the mass DOFs of lateral level forces (N, one per level; spread by each level's shares).</summary>
    public double[] DofForces(IReadOnlyList<double> levelForces)
    {
        var f = new double[MassEquations.Length];
        for (int l = 0; l < LevelDofs.Count; l++)
            foreach (var (d, s) in LevelDofs[l]) f[d] += s * levelForces[l];
        return f;
    }

    /// <summary>Level displacement (mean ux of the level's nodes; held nodes move 0) of a mass-DOF vector.</summary>
    public double[] LevelValues(double[] u)
    {
        var v = new double[LevelDofs.Count];
        for (int l = 0; l < LevelDofs.Count; l++)
        {
            if (LevelDofs[l].Count == 0) continue;
            // A rigid level: one DOF with share 1. A level without a diaphragm: one DOF per free node, equal shares.
            v[l] = LevelDofs[l].Count == 1 ? u[LevelDofs[l][0].Dof] : LevelDofs[l].Sum(x => u[x.Dof]) / LevelNodeCounts[l];
        }
        return v;
    }

    /// <summary>
    /// Rayleigh's quotient for the static deflection u = F·f under level forces f: ω² = Σ f·u / Σ m·u², T = 2π/ω
    /// (Rayleigh's method; an upper bound on ω₁, so T is never longer than the first eigen period — common practice).
    /// </summary>
    public double RayleighPeriod(IReadOnlyList<double> levelForces)
    {
        var f = DofForces(levelForces);
        var u = Deflect(f);
        double work = 0, kinetic = 0;
        for (int i = 0; i < u.Length; i++) { work += f[i] * u[i]; kinetic += Masses[i] * u[i] * u[i]; }
        return 2 * Math.PI * Math.Sqrt(kinetic / work);
    }

    /// <summary>The first <paramref name="count"/> modes (longest period first).</summary>
    public IReadOnlyList<Mode> Modes(int count)
    {
        // Levels of zero weight carry no mass: the eigenproblem is on the DOFs with mass (condensing out the others is
        // exact), and their shape is the static response to the inertia forces, φ = ω²·F·M·φ.
        var massive = Enumerable.Range(0, Masses.Length).Where(i => Masses[i] > 0).ToArray();
        int n = massive.Length;
        var a = new double[n, n];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
            {
                int p = massive[i], q = massive[j];
                a[i, j] = Math.Sqrt(Masses[p]) * 0.5 * (Flexibility[p, q] + Flexibility[q, p]) * Math.Sqrt(Masses[q]);
            }
        var (mu, psi) = SymmetricEigen.Largest(a, Math.Min(count, n));   // only the modes reported: n² work per step, not n³
        double total = Masses.Sum();
        var modes = new List<Mode>();
        for (int k = 0; k < Math.Min(count, n); k++)
        {
            if (mu[k] <= 0) break;
            double omega = 1 / Math.Sqrt(mu[k]);
            var inertia = new double[Masses.Length];
            for (int i = 0; i < n; i++) inertia[massive[i]] = omega * omega * Masses[massive[i]] * psi[i, k] / Math.Sqrt(Masses[massive[i]]);
            var phi = Deflect(inertia);
            double mr = 0, mm = 0;
            for (int i = 0; i < phi.Length; i++) { mr += Masses[i] * phi[i]; mm += Masses[i] * phi[i] * phi[i]; }
            var shape = LevelValues(phi);
            double big = shape.OrderByDescending(Math.Abs).First();
            if (big != 0) for (int i = 0; i < shape.Length; i++) shape[i] /= big;
            modes.Add(new Mode(k + 1, 2 * Math.PI / omega, omega, shape, mr * mr / mm / total));
        }
        return modes;
    }
}

/// <summary>The equivalent lateral forces of the "seismic" block: period estimates, base shear and story forces.</summary>
/// <param name="HeightFeet">h_n (ft) for T_a: the top level above the base.</param>
/// <param name="Cu">C_u (NaN without S_D1).</param>
/// <param name="PeriodUsed">The period that sets k and C_s (s).</param>
/// <param name="PeriodNote">How <see cref="PeriodUsed"/> was chosen.</param>
/// <param name="Cs">C_s (NaN when the base shear was given).</param>
/// <param name="CsNote">Which expression governs C_s.</param>
/// <param name="BaseShear">V (N).</param>
/// <param name="Exponent">k of §12.8.3.</param>
/// <param name="LevelForces">F_x per level (N; 0 for the base), parallel to the levels.</param>
/// <param name="Cvx">C_vx per level.</param>
/// <param name="RayleighPeriod">Rayleigh's period from the static deflection under the story forces (s).</param>
public sealed record StoryForces(double TotalWeight, IReadOnlyList<Mode> Modes, double HeightFeet, double Ct, double X, string TypeRow, double Ta,
    double Cu, double PeriodUsed, string PeriodNote, double Cs, string CsNote, double BaseShear, double Exponent,
    IReadOnlyList<double> LevelForces, IReadOnlyList<double> Cvx, double RayleighPeriod);

/// <summary>
/// Periods and equivalent lateral forces (ASCE 7-16 §12.8, numbering and values from memory — confirm the edition;
/// the governing code decides).
/// </summary>
public static class SeismicAnalysis
{
    /// <summary>k of §12.8.3: 1 for T ≤ 0.5 s, 2 for T ≥ 2.5 s, linear between.</summary>
    public static double Exponent(double period) => period <= 0.5 ? 1.0 : period >= 2.5 ? 2.0 : 1.0 + (period - 0.5) / 2.0;

    /// <summary>C_vx = w_x·h_x^k / Σ w_i·h_i^k (§12.8.3), h above the base.</summary>
    public static double[] VerticalDistribution(IReadOnlyList<double> weights, IReadOnlyList<double> heights, double k)
    {
        var p = WeightedHeights(weights, heights, k);
        double sum = p.Sum();
        return p.Select(x => x / sum).ToArray();
    }

    /// <summary>w_x·h_x^k per level (N·m^k), the numerators of C_vx (§12.8.3), h above the base.</summary>
    public static double[] WeightedHeights(IReadOnlyList<double> weights, IReadOnlyList<double> heights, double k) =>
        weights.Select((w, i) => w * Math.Pow(heights[i], k)).ToArray();

    /// <summary>The expressions of §12.8.1.1 that bound C_s at a period T, each evaluated (see <see cref="ResponseTerms"/>).</summary>
    /// <param name="Basic">S_DS/(R/I_e).</param>
    /// <param name="Upper">S_D1/(T·R/I_e) for T ≤ T_L, S_D1·T_L/(T²·R/I_e) beyond.</param>
    /// <param name="UpperExpression">Which of the two upper limits applies.</param>
    /// <param name="Lower">0.044·S_DS·I_e, not below 0.01.</param>
    /// <param name="LowerNearFault">0.5·S_1/(R/I_e) where S_1 ≥ 0.6 g, else NaN.</param>
    public sealed record ResponseLimits(double Basic, double Upper, string UpperExpression, double Lower, double LowerNearFault);

    /// <summary>The bounding expressions of C_s (§12.8.1.1) at period <paramref name="t"/> (s).</summary>
    public static ResponseLimits ResponseTerms(SpectralValues s, double t)
    {
        double rie = s.R / s.Ie;
        double upper = t <= s.TL ? s.Sd1 / (t * rie) : s.Sd1 * s.TL / (t * t * rie);
        return new ResponseLimits(s.Sds / rie, upper, t <= s.TL ? "S_D1/(T·R/Ie)" : "S_D1·T_L/(T²·R/Ie)",
            Math.Max(0.044 * s.Sds * s.Ie, 0.01), s.S1 >= 0.6 ? 0.5 * s.S1 / rie : double.NaN);
    }

    /// <summary>C_s of §12.8.1.1 for period <paramref name="t"/> (s) and the expression that governs.</summary>
    public static (double Cs, string Governs) ResponseCoefficient(SpectralValues s, double t)
    {
        var x = ResponseTerms(s, t);
        double cs = x.Basic;
        string why = "S_DS/(R/Ie)";
        if (x.Upper < cs) { cs = x.Upper; why = x.UpperExpression + ", upper limit"; }
        if (cs < x.Lower) { cs = x.Lower; why = "0.044·S_DS·Ie ≥ 0.01, lower limit"; }
        if (cs < x.LowerNearFault) { cs = x.LowerNearFault; why = "0.5·S_1/(R/Ie), lower limit where S_1 ≥ 0.6 g"; }
        return (cs, why);
    }

    /// <summary>The mass DOFs and condensed flexibility; null when K is singular (the static analysis reports the mechanism).</summary>
    public static ModalModel? Modal(StructureModel model, ISparseSpdSolver? solver = null)
    {
        var s = model.Seismic ?? throw new InvalidOperationException("the model has no seismic block");
        var system = LinearStaticAnalysis.Setup(model, AnalysisOptions.ForRun(new AnalysisOptions { Solver = solver }));   // linked wall panels condensed in
        return system.Singular ? null : Modal(model, s, system.Dofs, system.Factor);
    }

    private static ModalModel Modal(StructureModel model, SeismicData s, DofMap dofs, ISparseSpdFactor factor)
    {
        var levels = model.Building.Levels;
        var eqs = new List<int>();
        var slot = new Dictionary<int, int>();   // equation -> index in eqs (a list search here was quadratic in the levels)
        var masses = new List<double>();
        var levelDofs = levels.Select(_ => (IReadOnlyList<(int, double)>)[]).ToArray();
        foreach (var w in s.Weights)
        {
            var l = levels[w.Level];
            var free = l.TiedNodes.Count > 0
                ? [dofs.Equation(l.TiedNodes[0], Dof.X)]
                : l.Nodes.Select(n => dofs.Equation(n, Dof.X)).Where(e => e >= 0).Distinct().ToList();
            var list = new List<(int, double)>();
            foreach (int e in free)
            {
                if (!slot.TryGetValue(e, out int at)) { at = eqs.Count; slot[e] = at; eqs.Add(e); masses.Add(0); }
                masses[at] += w.Weight / SeismicPresets.Gravity / free.Count;
                list.Add((at, 1.0 / free.Count));
            }
            levelDofs[w.Level] = list;
        }
        int n = eqs.Count;
        if (n > ModelLimits.MaxMassDofs)   // levels without a diaphragm carry one mass DOF per node: bound the dense eigenproblem
            throw new ModelInputException([new ModelDiagnostic(model.SourcePath, 0, 0, "$.seismic.weights",
                $"the weighted levels carry {n} DOFs with mass (one per level with a diaphragm, one per free node of a level without one), more than the {ModelLimits.MaxMassDofs} whose periods this version computes",
                "give the weighted levels a rigid diaphragm, or weigh fewer levels")]);
        var flex = new double[n, n];
        var b = new double[dofs.FreeCount];
        var x = new double[dofs.FreeCount];
        for (int j = 0; j < n; j++)
        {
            Array.Clear(b);
            b[eqs[j]] = 1;
            factor.Solve(b, x);
            for (int i = 0; i < n; i++) flex[i, j] = x[eqs[i]];
        }
        return new ModalModel
        {
            MassEquations = eqs.ToArray(),
            Masses = masses.ToArray(),
            Flexibility = flex,
            LevelDofs = levelDofs,
            LevelNodeCounts = levels.Select(l => l.Nodes.Count).ToArray(),
        };
    }

    /// <summary>Periods, base shear and story forces of a model with a seismic block; null when K is singular.</summary>
    public static StoryForces? Forces(StructureModel model, AnalysisOptions? options = null)
    {
        if (model.Seismic is null) throw new InvalidOperationException("the model has no seismic block");
        return Stage(model, LinearStaticAnalysis.Setup(model, AnalysisOptions.ForRun(options))).Forces;
    }

    private static StoryForces Forces(StructureModel model, ModalModel modal)
    {
        var s = model.Seismic!;
        var levels = model.Building.Levels;
        var modes = modal.Modes(s.Modes);
        double t1 = modes.Count > 0 ? modes[0].Period : double.NaN;
        double hn = levels[^1].Elevation - levels[0].Elevation;
        double hft = hn / 0.3048;
        var (ct, xx, row) = SeismicPresets.PeriodCoefficients[s.StructureType];
        double ta = ct * Math.Pow(hft, xx);
        double cu = s.Spectrum is { } sp ? SeismicPresets.UpperLimitCoefficient(sp.Sd1) : double.NaN;
        (double t, string note) = s.Period switch
        {
            PeriodUse.Given => (s.GivenPeriod, "given"),
            PeriodUse.Approximate => (ta, "approximate period Ta"),
            PeriodUse.Computed => (t1, "first eigen period"),
            _ when double.IsNaN(cu) => (t1, "first eigen period (no S_D1, so no upper limit Cu·Ta applied)"),
            _ => t1 <= cu * ta ? (t1, "first eigen period (below Cu·Ta)") : (cu * ta, "upper limit Cu·Ta (the eigen period is longer)"),
        };
        double w = s.Weights.Sum(x => x.Weight);
        double cs = double.NaN, v = s.BaseShear;
        string csNote = "base shear given";
        if (s.Spectrum is { } spec)
        {
            (cs, csNote) = ResponseCoefficient(spec, t);
            v = cs * w;
        }
        double k = Exponent(t);
        var weights = levels.Select(_ => 0.0).ToArray();
        foreach (var lw in s.Weights) weights[lw.Level] = lw.Weight;
        var heights = levels.Select(l => l.Elevation - levels[0].Elevation).ToArray();
        var cvx = VerticalDistribution(weights, heights, k);
        var f = cvx.Select(c => c * v).ToArray();
        double tr = modal.RayleighPeriod(f);
        return new StoryForces(w, modes, hft, ct, xx, row, ta, cu, t, note, cs, csNote, v, k, f, cvx, tr);
    }

    /// <summary>
    /// Stage 2 of a run, on the frame's one factor of K: periods and story forces, the model with the generated
    /// story-force case filled in, and, with second-order settings, K + K_G factorised once (which also checks that the
    /// gravity load does not buckle the structure).
    /// </summary>
    /// <param name="Model">The model with the generated case filled in (the model itself when it has no seismic block).</param>
    /// <param name="Forces">Periods and story forces; null without a seismic block or when K is singular.</param>
    /// <param name="SecondOrder">The factor of K + K_G of the gravity case; null without second-order settings.</param>
    internal sealed record SeismicStage(StructureModel Model, StoryForces? Forces, ISparseSpdFactor? SecondOrder, ModalModel? Modal = null);

    /// <summary>
    /// The model with the generated story-force case filled in (nodal loads in +x at each level's diaphragm; at a level
    /// without a diaphragm, shared equally among its nodes free in x). Unchanged when it has no seismic block or K is
    /// singular (the static analysis then reports the mechanism).
    /// </summary>
    /// <exception cref="ModelInputException">The gravity load of the second-order settings buckles the structure.</exception>
    public static StructureModel Prepare(StructureModel model, AnalysisOptions? options = null)
    {
        if (model.Seismic is null) return model;
        return Stage(model, LinearStaticAnalysis.Setup(model, AnalysisOptions.ForRun(options))).Model;
    }

    /// <summary>The seismic stage of a run (see <see cref="SeismicStage"/>), on the run's frame system.</summary>
    /// <exception cref="ModelInputException">The gravity load of the second-order settings buckles the structure.</exception>
    internal static SeismicStage Stage(StructureModel model, LinearStaticAnalysis.FrameSystem system)
    {
        if (model.Seismic is not { } s || system.Singular) return new SeismicStage(model, null, null);
        var (elements, dofs, factor) = (system.Elements, system.Dofs, system.Factor);
        var modal = Modal(model, s, dofs, factor);
        var forces = Forces(model, modal);
        var loads = new List<NodalLoad>();
        var levels = model.Building.Levels;
        for (int l = 1; l < levels.Count; l++)
        {
            var lv = levels[l];
            var at = lv.TiedNodes.Count > 0 ? [lv.TiedNodes[0]] : lv.Nodes.Where(n => dofs.Equation(n, Dof.X) >= 0).ToList();
            foreach (int n in at) loads.Add(new NodalLoad(n, forces.LevelForces[l] / at.Count, 0, 0));
        }
        var cases = model.LoadCases.Select(c => c.Id == s.CaseId ? c with { NodalLoads = loads } : c).ToList();
        var prepared = model with { LoadCases = cases };
        var secondOrder = s.SecondOrder is { } so ? SecondOrderAnalysis.CheckStable(new LinearStaticAnalysis.CondensedFrame(prepared, system), factor, so.GravityCase, system.Solver) : null;
        return new SeismicStage(prepared, forces, secondOrder, modal);
    }
}
