using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>One mode of the planar response spectrum analysis: S_a (g) at its period, Γ (mass-normalised shape), the
/// effective mass share and its cumulative sum, and its base shear (reduced by R/I_e, N).</summary>
public sealed record SpectrumModeRow(int Mode, double Period, double Omega, double Sa, double Gamma, double Share, double Cumulative, double BaseShear);

/// <summary>
/// One story: the ELF story shear (Σ F_x above the cut), the combined modal story shear before and after the force
/// scaling, the story drift combined from the per-mode drifts (reduced elastic, times the drift factor), the design
/// drift C_d·(that)/I_e, its ratio to the story height, and — for contrast only — the difference of the combined level
/// displacements, which is not the drift (N, m).
/// </summary>
public sealed record SpectrumStoryRow(int Story, double ElfShear, double ModalShear, double ScaledShear, double Drift, double DesignDrift, double Height, double Ratio,
    double DriftFromCombinedDisplacements, double Displacement)
{
    /// <summary>Overturning moment at the story's base (its lower level), per mode Σ F_l·(z_l − z_base) of the levels above, combined (N·m, no sign; before scaling).</summary>
    public double Overturning { get; init; } = double.NaN;
    /// <summary>The vertical load above the story's cut used for θ (N): the gravity case's (as for the ELF θ) or the story weights'.</summary>
    public double Px { get; init; } = double.NaN;
    /// <summary>θ = P_x·Δ·I_e/(V_x·h_sx·C_d) from the modal results: Δ the design drift, V_x the scaled story shear (ASCE 7-16 eq. 12.8-16, from memory).</summary>
    public double Theta { get; init; } = double.NaN;
    /// <summary>θ of the equivalent lateral forces beside it (NaN without <c>secondOrder</c>).</summary>
    public double ThetaElf { get; init; } = double.NaN;
    /// <summary>θ_max = 0.5/(β·C_d) ≤ 0.25 (β = 1 without <c>secondOrder</c>).</summary>
    public double ThetaMax { get; init; } = double.NaN;
}

/// <summary>The modal response spectrum analysis of a planar model with a seismic block (docs/seismic.md).</summary>
public sealed record PlanarSpectrumResult(DesignSpectrum Spectrum, ResponseSpectrumSettings Settings, double R, double Ie, int ModesUsed, double CumulativeShare,
    ModalScaling Scaling, IReadOnlyList<SpectrumModeRow> Modes, IReadOnlyList<SpectrumStoryRow> Stories, double TotalMass)
{
    /// <summary>Member end forces combined mode by mode (N, N·m; every value ≥ 0: a combined peak has no sign), before the
    /// force scaling; scaled = <see cref="ModalScaling.ForceFactor"/> × these. Empty when the run gave no frame system.</summary>
    public IReadOnlyList<MemberEndForces> MemberForces { get; init; } = [];
    /// <summary>Support reactions combined mode by mode (no sign), before the force scaling.</summary>
    public IReadOnlyList<Reaction> Reactions { get; init; } = [];
    /// <summary>The mode shapes at the levels (one list per mode used, one value per level, largest 1; the base 0).</summary>
    public IReadOnlyList<IReadOnlyList<double>> Shapes { get; init; } = [];
    /// <summary>Where P_x of θ comes from, in words.</summary>
    public string PxSource { get; init; } = "";
}

/// <summary>
/// Modal response spectrum analysis of a planar model (ASCE 7-16 §12.9.1, from memory): the modes on the mass DOFs of
/// <c>SeismicAnalysis.Modal(model)</c> (the stiffness condensed onto them exactly), enough of them for 90 % of the mass
/// (§12.9.1.1), per mode the forces f = M·φ·Γ·S_a·g/(R/I_e) and displacements u = F·f, the story shears and story
/// drifts per mode, combined by CQC or SRSS, then scaled to the ELF base shear (§12.9.1.4).
/// </summary>
public static class PlanarSpectrum
{
    /// <summary>Null when the model has no response spectrum block or its stiffness is singular (one whole run of the model).</summary>
    public static PlanarSpectrumResult? Run(StructureModel model) => ModelRun.Run(model).Spectrum;

    /// <summary>On a run's modes, story forces and frame system (<see cref="ModelRun"/>: no factorisation of its own);
    /// <paramref name="seismic"/> gives P_x and the ELF θ where the block has <c>secondOrder</c>.</summary>
    internal static PlanarSpectrumResult? Run(StructureModel model, ModalModel? modal, StoryForces? elf,
        LinearStaticAnalysis.FrameSystem? system = null, SeismicResult? seismic = null)
    {
        if (model.Seismic is not { ResponseSpectrum: { } rs, Spectrum: { } sv } s) return null;
        if (modal is null || elf is null) return null;
        var levels = model.Building.Levels;
        int nl = levels.Count;
        var spec = rs.Table.Count > 0 ? new DesignSpectrum(rs.Table) : new DesignSpectrum(sv.Sds, sv.Sd1, sv.TL);
        double rie = sv.R / sv.Ie;

        var massive = Enumerable.Range(0, modal.Masses.Length).Where(i => modal.Masses[i] > 0).ToArray();
        int n = massive.Length;
        var a = new double[n, n];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
            {
                int p = massive[i], q = massive[j];
                a[i, j] = Math.Sqrt(modal.Masses[p]) * 0.5 * (modal.Flexibility[p, q] + modal.Flexibility[q, p]) * Math.Sqrt(modal.Masses[q]);
            }
        var (mu, psi) = SymmetricEigen.Solve(a);   // μ = 1/ω², largest first = longest period first
        double total = modal.Masses.Sum();
        var all = new List<(double Omega, double Gamma, double Share, double[] Phi)>();
        for (int k = 0; k < n; k++)
        {
            if (!(mu[k] > 0)) break;
            double omega = 1 / Math.Sqrt(mu[k]);
            var phi = new double[modal.Masses.Length];
            for (int i = 0; i < n; i++) phi[massive[i]] = psi[i, k] / Math.Sqrt(modal.Masses[massive[i]]);   // φᵀMφ = 1
            double l = 0;
            for (int i = 0; i < phi.Length; i++) l += modal.Masses[i] * phi[i];
            all.Add((omega, l, l * l / total, phi));
        }
        int count = 0;
        double cumulative = 0;
        while (count < all.Count && (cumulative < rs.MassShare - 1e-12 || count < rs.Modes)) cumulative += all[count++].Share;
        var used = all.Take(count).ToList();
        var rho = ModalCombination.Correlation(used.Select(m => m.Omega).ToList(), rs.Damping, rs.Rule);

        var rows = new List<SpectrumModeRow>();
        var levelForces = new List<double[]>();
        var levelDisp = new List<double[]>();
        var modeForces = new List<double[]>();
        var shapes = new List<IReadOnlyList<double>>();
        double cum = 0;
        foreach (var (m, idx) in used.Select((m, i) => (m, i)))
        {
            double t = 2 * Math.PI / m.Omega, sa = spec.Sa(t);
            var f = modal.Masses.Select((mass, i) => mass * m.Phi[i] * m.Gamma * sa * SeismicPresets.Gravity / rie).ToArray();
            var u = modal.Deflect(f);   // = φ·Γ·S_a·g/(ω²·R/I_e) on the mass DOFs (K·φ = ω²·M·φ)
            var lf = new double[nl];
            for (int l = 0; l < nl; l++)
                foreach (var (d, _) in modal.LevelDofs[l]) lf[l] += f[d];
            levelForces.Add(lf);
            modeForces.Add(f);
            var lu = modal.LevelValues(u);
            levelDisp.Add(lu);
            double big = lu.MaxBy(Math.Abs);
            shapes.Add(lu.Select(x => big == 0 ? 0 : x / big).ToArray());
            cum += m.Share;
            rows.Add(new SpectrumModeRow(idx + 1, t, m.Omega, sa, m.Gamma, m.Share, cum, lf.Sum()));
        }

        double Above(double[] p, int story) { double v = 0; for (int l = story; l < nl; l++) v += p[l]; return v; }
        double Overturning(double[] p, int story) { double v = 0; for (int l = story; l < nl; l++) v += p[l] * (levels[l].Elevation - levels[story - 1].Elevation); return v; }
        var modalShear = Enumerable.Range(1, nl - 1).Select(st => ModalCombination.Combine(levelForces.Select(p => Above(p, st)).ToList(), rho)).ToArray();
        double vt = modalShear.Length > 0 ? modalShear[0] : 0;
        var scaling = ModalScaling.Of(vt, elf.BaseShear, elf.Cs, elf.CsNote, elf.TotalWeight);
        var so = s.SecondOrder;
        double thetaMax = SecondOrderAnalysis.ThetaMax(so?.Beta ?? 1.0, so?.Cd ?? rs.Cd);
        var stability = seismic?.Stability ?? [];
        var weights = new double[nl];
        foreach (var w in s.Weights) weights[w.Level] += w.Weight;
        var stories = new List<SpectrumStoryRow>();
        for (int st = 1; st < nl; st++)
        {
            double h = levels[st].Elevation - levels[st - 1].Elevation;
            double drift = scaling.DriftFactor * ModalCombination.Combine(levelDisp.Select(u => u[st] - u[st - 1]).ToList(), rho);
            double top = ModalCombination.Combine(levelDisp.Select(u => u[st]).ToList(), rho);
            double below = ModalCombination.Combine(levelDisp.Select(u => u[st - 1]).ToList(), rho);
            double design = rs.Cd * drift / sv.Ie;
            double elfShear = 0;
            for (int l = st; l < nl; l++) elfShear += elf.LevelForces[l];
            var elfRow = stability.FirstOrDefault(x => x.Story.Index == st);
            double px = elfRow?.Px ?? Above(weights, st);
            double scaled = scaling.ForceFactor * modalShear[st - 1];
            stories.Add(new SpectrumStoryRow(st, elfShear, modalShear[st - 1], scaled, drift, design, h, design / h,
                scaling.DriftFactor * (top - below), scaling.DriftFactor * top)
            {
                Overturning = ModalCombination.Combine(levelForces.Select(p => Overturning(p, st)).ToList(), rho),
                Px = px,
                Theta = SecondOrderAnalysis.Theta(px, design, sv.Ie, scaled, h, rs.Cd),
                ThetaElf = elfRow?.Theta ?? double.NaN,
                ThetaMax = thetaMax,
            });
        }
        var (members, reactions) = system is null ? ([], []) : CombinedForces(model, modal, system, modeForces, rho);
        return new PlanarSpectrumResult(spec, rs, sv.R, sv.Ie, count, cumulative, scaling, rows, stories, total)
        {
            MemberForces = members, Reactions = reactions, Shapes = shapes,
            PxSource = stability.Count > 0 ? $"the vertical load of the gravity case \"{so!.GravityCase}\" above each story's cut (as for the ELF θ)"
                : "the story weights above each story's cut (no secondOrder block: the design vertical load may be larger, and θ grows with it)",
        };
    }

    /// <summary>
    /// Every mode's forces at the mass DOFs solved as a static case on the run's factor of K (the mode's displacements
    /// u = F·f), its member end forces and reactions recovered, and each component combined mode by mode (CQC or SRSS:
    /// never the combination of a sum).
    /// </summary>
    private static (IReadOnlyList<MemberEndForces>, IReadOnlyList<Reaction>) CombinedForces(StructureModel model, ModalModel modal,
        LinearStaticAnalysis.FrameSystem system, IReadOnlyList<double[]> modeForces, double[,] rho)
    {
        var cases = modeForces.Select((f, k) => new LoadCase($"mode {k + 1}", "spectral forces of the mode",
            f.Select((v, i) => new NodalLoad(system.Dofs.DofOf(modal.MassEquations[i]).Node, v, 0, 0)).ToList(), [])).ToList();
        var per = LinearStaticAnalysis.Solve(model with { LoadCases = cases, Combinations = [], StiffnessPoints = [], Comparisons = [] }, system, system.Options);
        var members = new List<MemberEndForces>();
        for (int m = 0; m < model.Members.Count; m++)
        {
            var v = ModalCombination.CombineEach(per.Cases.Select(c => { var e = c.MemberForces[m]; return new[] { e.N1, e.V1, e.M1, e.N2, e.V2, e.M2 }; }).ToList(), rho);
            members.Add(new MemberEndForces(per.Cases[0].MemberForces[m].Member, v[0], v[1], v[2], v[3], v[4], v[5]));
        }
        var reactions = new List<Reaction>();
        for (int j = 0; j < per.Cases[0].Reactions.Count; j++)
        {
            var v = ModalCombination.CombineEach(per.Cases.Select(c => { var e = c.Reactions[j]; return new[] { e.Fx, e.Fy, e.Mz }; }).ToList(), rho);
            reactions.Add(new Reaction(per.Cases[0].Reactions[j].Node, v[0], v[1], v[2]));
        }
        return (members, reactions);
    }
}
