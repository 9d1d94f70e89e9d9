using MathNet.Numerics.LinearAlgebra.Double;
using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

// The modal response spectrum analysis of a building in plan (ASCE 7-16 §12.9.1, from memory; docs/plan.md, docs/seismic.md):
// per excitation direction, per mode the floor forces and displacements, every response worked out per mode (story
// shears, corner drifts, each line's level forces, its planar model's member end forces and reactions, overturning) and
// only then combined; scaled to the ELF base shear; accidental torsion static (§12.9.1.5) or by shifting the floor masses.
public static partial class PlanSeismic
{
    private static PlanSpectrumResult Spectrum(BuildingPlan plan, PlanSeismicData s, ResponseSpectrumSettings rs, PlanModal modal,
        IReadOnlyList<PlanAnalysis.Condensation> condensed, IReadOnlyList<PlanElfDirection> elf, PlanResult result, Dictionary<string, double[]> ax,
        AnalysisOptions? options)
    {
        options = AnalysisOptions.ForRun(options);
        var spec = rs.Table.Count > 0 ? new DesignSpectrum(rs.Table) : new DesignSpectrum(s.Spectrum.Sds, s.Spectrum.Sd1, s.Spectrum.TL);
        bool shift = rs.Torsion == AccidentalTorsion.ShiftedMasses && plan.EccentricityRatio > 0;
        string method = shift
            ? $"accidental torsion by shifting every floor's centre of mass ±{plan.EccentricityRatio:0.###} × the plan dimension across the motion, solving the modes again for each shift and enveloping the two analyses (ASCE 7-16 §12.9.1.5 allows the static torques instead)"
            : plan.EccentricityRatio > 0
                ? $"static accidental torsion (§12.9.1.5): floor torques ±F_x·{plan.EccentricityRatio:0.###}·(plan dimension across the motion)·A_x of the equivalent lateral forces, solved statically, their magnitude added to the modal results"
                : "no accidental torsion (\"accidentalEccentricity\" is 0)";
        var directions = new List<PlanSpectrumDirection>();
        foreach (var e in elf)
        {
            int d = e.Direction == "x" ? 0 : 1;
            if (!shift)
            {
                var torque = new double[3 * plan.FloorCount];
                for (int l = 0; l < plan.FloorCount; l++)
                    torque[3 * l + 2] = e.LevelForces[l] * plan.EccentricityRatio * Across(plan.Levels[l + 1], d) * (ax.TryGetValue(e.Direction, out var a) ? a[l] : 1);
                directions.Add(Direction(plan, s, rs, spec, modal, condensed, e, result, torque, "", 0, options));
                continue;
            }
            var variants = new List<PlanSpectrumDirection>();
            foreach (var (label, sign) in new[] { ("+e", 1.0), ("-e", -1.0) })
            {
                var levels = plan.Levels.Select((lv, i) => i == 0 ? lv : lv with
                {
                    CentreOfMass = d == 0 ? new PlanPoint(lv.CentreOfMass.X, lv.CentreOfMass.Y + sign * plan.EccentricityRatio * Across(lv, d))
                                          : new PlanPoint(lv.CentreOfMass.X + sign * plan.EccentricityRatio * Across(lv, d), lv.CentreOfMass.Y),
                }).ToList();
                var shifted = PlanModal.Solve(plan with { Levels = levels }, modal.Stiffness);
                variants.Add(Direction(plan, s, rs, spec, shifted, condensed, e, result, null, label, sign * plan.EccentricityRatio * Across(plan.Levels[^1], d), options));
            }
            directions.Add(Envelope(variants));
        }
        return new PlanSpectrumResult(spec, rs, s.Spectrum.R, s.Spectrum.Ie, directions) { TorsionMethod = method };
    }

    /// <summary>The plan dimension across the motion of direction <paramref name="d"/> (0 X: the Y extent; 1 Y: the X extent).</summary>
    private static double Across(PlanLevel lv, int d) =>
        d == 0 ? lv.Outline.Max(q => q.Y) - lv.Outline.Min(q => q.Y) : lv.Outline.Max(q => q.X) - lv.Outline.Min(q => q.X);

    /// <summary>One excitation direction on one set of modes; <paramref name="torque"/> the static accidental torques (null: none).</summary>
    private static PlanSpectrumDirection Direction(BuildingPlan plan, PlanSeismicData s, ResponseSpectrumSettings rs, DesignSpectrum spec, PlanModal modal,
        IReadOnlyList<PlanAnalysis.Condensation> condensed, PlanElfDirection e, PlanResult result, double[]? torque, string variant, double shift, AnalysisOptions options)
    {
        int n = plan.FloorCount;
        int d = e.Direction == "x" ? 0 : 1;
        double rie = s.Spectrum.R / s.Spectrum.Ie;
        int count = Math.Max(modal.ModesFor(rs.MassShare, 0, 1), Math.Min(rs.Modes, modal.Modes.Count));
        var modes = modal.Modes.Take(count).ToList();
        var rho = ModalCombination.Correlation(modes.Select(m => m.Omega).ToList(), rs.Damping, rs.Rule);

        // Per mode: reduced floor forces f = M·φ·Γ·S_a·g/(R/I_e) and displacements u = φ·Γ·S_a·g/(ω²·R/I_e).
        var perMode = new List<(double[] F, double[] U)>();
        var modeRows = new List<PlanSpectrumMode>();
        double eqErr = 0;
        foreach (var m in modes)
        {
            double sa = spec.Sa(m.Period), g = m.Participation[d];
            double scale = g * sa * SeismicPresets.Gravity / rie;
            var u = m.Shape.Select(x => x * scale / (m.Omega * m.Omega)).ToArray();
            var f = SmallMatrix.Times(modal.Mass, m.Shape.Select(x => x * scale).ToArray());
            perMode.Add((f, u));
            double fx = 0, fy = 0, mz = 0;
            for (int l = 0; l < n; l++) { fx += f[3 * l]; fy += f[3 * l + 1]; mz += f[3 * l + 2]; }
            modeRows.Add(new PlanSpectrumMode(e.Direction, m.Number, m.Period, sa, g, fx, fy, mz) { Variant = variant });
            eqErr = Math.Max(eqErr, Equilibrium(plan, condensed, u, fx, fy, mz));
        }
        var ut = torque is null ? new double[3 * n] : DenseMatrix.OfArray(modal.Stiffness).Cholesky().Solve(DenseVector.OfArray(torque)).ToArray();

        // Story shears along the direction, per mode; base shear V_t.
        var storyModal = new double[n];
        for (int st = 1; st <= n; st++)
            storyModal[st - 1] = ModalCombination.Combine(perMode.Select(p => Above(p.F, st, d)).ToList(), rho);
        var scaling = ModalScaling.Of(storyModal[0], e.BaseShear, e.Cs, e.CsNote, e.Weight);
        var elfCase = result.Case(e.Cases[0]);
        double thetaMax = SecondOrderAnalysis.ThetaMax(1.0, rs.Cd);

        var stories = new List<PlanSpectrumStory>();
        for (int st = 1; st <= n; st++)
        {
            var lv = plan.Levels[st];
            double h = lv.Elevation - plan.Levels[st - 1].Elevation;
            PlanSpectrumStory? worst = null;
            for (int vi = 0; vi < lv.Outline.Count; vi++)
            {
                var at = lv.Outline[vi];
                double Along(double[] u, int level) => level < 1 ? 0 : d == 0 ? u[3 * (level - 1)] - u[3 * (level - 1) + 2] * at.Y : u[3 * (level - 1) + 1] + u[3 * (level - 1) + 2] * at.X;
                double modalDrift = ModalCombination.Combine(perMode.Select(p => Along(p.U, st) - Along(p.U, st - 1)).ToList(), rho);
                double fromDisp = ModalCombination.Combine(perMode.Select(p => Along(p.U, st)).ToList(), rho)
                    - ModalCombination.Combine(perMode.Select(p => Along(p.U, st - 1)).ToList(), rho);
                double tors = Math.Abs(Along(ut, st) - Along(ut, st - 1));
                double drift = scaling.DriftFactor * modalDrift + tors;
                double design = rs.Cd * drift / s.Spectrum.Ie;
                var row = new PlanSpectrumStory(e.Direction, st, Math.Abs(d == 0 ? elfCase.Stories[st - 1].Vx : elfCase.Stories[st - 1].Vy), storyModal[st - 1],
                    scaling.ForceFactor * storyModal[st - 1], vi, at, modalDrift, tors, drift, design, h, design / h, fromDisp);
                if (worst is null || row.Drift > worst.Drift) worst = row;
            }
            // θ (eq. 12.8-16) beside the ELF's: P_x the floors' weights at and above the story; the ELF drift at the worst corner of the direction's cases.
            double px = plan.Levels.Skip(st).Sum(l => l.Weight);
            double elfDrift = e.Cases.Max(id => result.Case(id).Vertices.Where(v => v.Level == st).Max(v => Math.Abs(d == 0 ? v.DriftX : v.DriftY)));
            stories.Add(worst! with
            {
                Px = px,
                Theta = SecondOrderAnalysis.Theta(px, worst.DesignDrift, s.Spectrum.Ie, worst.ScaledShear, h, rs.Cd),
                ThetaElf = SecondOrderAnalysis.Theta(px, rs.Cd * elfDrift / s.Spectrum.Ie, s.Spectrum.Ie, worst.ElfShear, h, rs.Cd),
                ThetaMax = thetaMax,
                Variant = variant,
            });
        }

        // Each line: its level forces per mode (K̂·T·u), its planar model recovered under them, every response combined.
        var lines = new List<PlanSpectrumLine>();
        var lineForces = new List<PlanSpectrumLineForces>();
        for (int i = 0; i < plan.Lines.Count; i++)
        {
            var line = plan.Lines[i];
            var kh = condensed[i].K;
            var perModeForces = perMode.Select(p => SmallMatrix.Times(kh, PlanAnalysis.Project(line, p.U, n))).ToList();
            var torsForces = SmallMatrix.Times(kh, PlanAnalysis.Project(line, ut, n));
            for (int st = 1; st <= n; st++)
            {
                double modalShear = ModalCombination.Combine(perModeForces.Select(p => PlanAnalysis.Above(p, st)).ToList(), rho);
                double tors = Math.Abs(PlanAnalysis.Above(torsForces, st));
                double scaled = scaling.ForceFactor * modalShear;
                double elfShear = Math.Abs(elfCase.LineStories.First(x => x.Story == st && x.Line == line.Id).Shear);
                double ot = ModalCombination.Combine(perModeForces.Select(p => Overturning(plan, p, st)).ToList(), rho);
                lines.Add(new PlanSpectrumLine(e.Direction, st, line.Id, modalShear, scaled, tors, scaled + tors, elfShear)
                {
                    Overturning = ot, ScaledOverturning = scaling.ForceFactor * ot, TorsionOverturning = Math.Abs(Overturning(plan, torsForces, st)),
                });
            }
            lineForces.Add(LineForces(line, condensed[i], e.Direction, perMode.Select(p => PlanAnalysis.Project(line, p.U, n)).ToList(), perModeForces,
                PlanAnalysis.Project(line, ut, n), torsForces, rho, scaling.ForceFactor, options));
        }

        var dominant = modes.Select((m, k) => (m, k)).MaxBy(x => x.m.EffectiveMass[d]).k;
        var rotation = Enumerable.Range(0, n).Select(l => ModalCombination.Combine(perMode.Select(p => p.U[3 * l + 2]).ToList(), rho)).ToList();
        var dominantRotation = Enumerable.Range(0, n).Select(l => perMode[dominant].U[3 * l + 2]).ToList();
        return new PlanSpectrumDirection(e.Direction, count, modes[^1].Cumulative[d], scaling, modeRows, stories, lines, eqErr)
        {
            LineForces = lineForces,
            Variants = [new PlanSpectrumVariant(variant, shift, scaling, count, rotation, dominantRotation)],
        };
    }

    /// <summary>
    /// The line's planar model solved once per mode under the mode's level forces (and once under the static torsion's),
    /// its member end forces and reactions combined component by component.
    /// </summary>
    private static PlanSpectrumLineForces LineForces(PlanLine line, PlanAnalysis.Condensation c, string direction, IReadOnlyList<double[]> perModeU,
        IReadOnlyList<double[]> perModeForces, double[] torsionU, double[] torsionForces, double[,] rho, double factor, AnalysisOptions options)
    {
        int modes = perModeForces.Count;
        var ids = Enumerable.Range(1, modes).Select(k => $"mode {k}").Append("accidental torsion").ToList();
        var recovered = PlanAnalysis.Recover(line, c, ids, [.. perModeForces, torsionForces], [.. perModeU, torsionU], options).Recovered;
        var modeCases = recovered.Cases.Take(modes).ToList();
        var tc = recovered.Cases[modes];
        var modal = new List<MemberEndForces>();
        var torsion = new List<MemberEndForces>();
        for (int m = 0; m < line.Model.Members.Count; m++)
        {
            var v = ModalCombination.CombineEach(modeCases.Select(x => { var q = x.MemberForces[m]; return new[] { q.N1, q.V1, q.M1, q.N2, q.V2, q.M2 }; }).ToList(), rho);
            modal.Add(new MemberEndForces(tc.MemberForces[m].Member, v[0], v[1], v[2], v[3], v[4], v[5]));
            var t = tc.MemberForces[m];
            torsion.Add(new MemberEndForces(t.Member, Math.Abs(t.N1), Math.Abs(t.V1), Math.Abs(t.M1), Math.Abs(t.N2), Math.Abs(t.V2), Math.Abs(t.M2)));
        }
        var reactions = new List<Reaction>();
        var torsionReactions = new List<Reaction>();
        for (int j = 0; j < tc.Reactions.Count; j++)
        {
            var v = ModalCombination.CombineEach(modeCases.Select(x => { var q = x.Reactions[j]; return new[] { q.Fx, q.Fy, q.Mz }; }).ToList(), rho);
            reactions.Add(new Reaction(tc.Reactions[j].Node, v[0], v[1], v[2]));
            var t = tc.Reactions[j];
            torsionReactions.Add(new Reaction(t.Node, Math.Abs(t.Fx), Math.Abs(t.Fy), Math.Abs(t.Mz)));
        }
        return new PlanSpectrumLineForces(direction, line.Id, modal, Scale(modal, factor), torsion, reactions, Scale(reactions, factor), torsionReactions);
    }

    private static IReadOnlyList<MemberEndForces> Scale(IReadOnlyList<MemberEndForces> f, double k) =>
        f.Select(a => new MemberEndForces(a.Member, k * a.N1, k * a.V1, k * a.M1, k * a.N2, k * a.V2, k * a.M2)).ToList();

    private static IReadOnlyList<Reaction> Scale(IReadOnlyList<Reaction> r, double k) => r.Select(a => new Reaction(a.Node, k * a.Fx, k * a.Fy, k * a.Mz)).ToList();

    /// <summary>Σ of the floor forces above the cut of a story along direction <paramref name="d"/> (0 X, 1 Y).</summary>
    private static double Above(double[] f, int story, int d)
    {
        double v = 0;
        for (int l = story - 1; 3 * l < f.Length; l++) v += f[3 * l + d];
        return v;
    }

    /// <summary>Σ p_l·(z_l − z_base) of a line's level forces above the cut of a story, about the story's lower level (N·m).</summary>
    private static double Overturning(BuildingPlan plan, double[] p, int story)
    {
        double v = 0, zb = plan.Levels[story - 1].Elevation;
        for (int l = story; l <= p.Length; l++) v += p[l - 1] * (plan.Levels[l].Elevation - zb);
        return v;
    }

    /// <summary>
    /// The envelope of the two shifted-mass analyses: per story the row whose drift governs (its corner and θ), the
    /// larger shears; per line and member the larger of each value. Each analysis is scaled by its own V/V_t.
    /// </summary>
    private static PlanSpectrumDirection Envelope(IReadOnlyList<PlanSpectrumDirection> v)
    {
        var a = v[0];
        var stories = a.Stories.Select((st, i) =>
        {
            var rows = v.Select(x => x.Stories[i]).ToList();
            var gov = rows.MaxBy(r => r.Drift)!;
            return gov with { ModalShear = rows.Max(r => r.ModalShear), ScaledShear = rows.Max(r => r.ScaledShear), Theta = rows.Max(r => r.Theta) };
        }).ToList();
        var lines = a.Lines.Select((l, i) =>
        {
            var rows = v.Select(x => x.Lines[i]).ToList();
            return l with
            {
                Modal = rows.Max(r => r.Modal), Scaled = rows.Max(r => r.Scaled), Torsion = 0, Design = rows.Max(r => r.Scaled),
                Overturning = rows.Max(r => r.Overturning), ScaledOverturning = rows.Max(r => r.ScaledOverturning), TorsionOverturning = 0,
            };
        }).ToList();
        static MemberEndForces MaxF(IEnumerable<MemberEndForces> f)
        {
            var l = f.ToList();
            return new MemberEndForces(l[0].Member, l.Max(x => x.N1), l.Max(x => x.V1), l.Max(x => x.M1), l.Max(x => x.N2), l.Max(x => x.V2), l.Max(x => x.M2));
        }
        static Reaction MaxR(IEnumerable<Reaction> r)
        {
            var l = r.ToList();
            return new Reaction(l[0].Node, l.Max(x => x.Fx), l.Max(x => x.Fy), l.Max(x => x.Mz));
        }
        var forces = a.LineForces.Select((lf, i) =>
        {
            var all = v.Select(x => x.LineForces[i]).ToList();
            return lf with
            {
                Modal = lf.Modal.Select((_, m) => MaxF(all.Select(x => x.Modal[m]))).ToList(),
                Scaled = lf.Scaled.Select((_, m) => MaxF(all.Select(x => x.Scaled[m]))).ToList(),
                ModalReactions = lf.ModalReactions.Select((_, j) => MaxR(all.Select(x => x.ModalReactions[j]))).ToList(),
                ScaledReactions = lf.ScaledReactions.Select((_, j) => MaxR(all.Select(x => x.ScaledReactions[j]))).ToList(),
            };
        }).ToList();
        var low = v.MinBy(x => x.Scaling.BaseShearModal)!.Scaling;
        var why = string.Join("; ", v.Select(x => $"{x.Variants[0].Label}: {x.Scaling.Why}"));
        return new PlanSpectrumDirection(a.Direction, v.Max(x => x.ModesUsed), v.Min(x => x.CumulativeShare), low with { Why = $"each shifted analysis scaled by its own rule, then enveloped ({why})" },
            v.SelectMany(x => x.Modes).ToList(), stories, lines, v.Max(x => x.EquilibriumError))
        {
            LineForces = forces,
            Variants = v.SelectMany(x => x.Variants).ToList(),
        };
    }
}
