using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The seismic files of a building in plan (docs/plan.md): modes, the equivalent lateral forces per direction, A_x, the
/// response spectrum's modes, stories and line shears, and plan-seismic.json with all of them, the caution and the
/// scaling rule that applied. Building units; the text depends only on the input.
/// </summary>
public static class PlanSeismicFiles
{
    public const string Source = "ASCE 7-16 §11.4.6, §12.8, §12.9.1 (numbering and values from memory: confirm the edition); the governing code decides";

    public static IReadOnlyList<(string Name, string Text)> Render(PlanResult r, PlanSeismicResult s)
    {
        var files = new List<(string, string)>
        {
            ("plan-modes.csv", Modes(r, s)),
            ("plan-elf.csv", Elf(r, s)),
            ("plan-elf-forces.csv", ElfForces(r, s)),   // one table per file: the level forces apart from the per-direction figures
        };
        if (s.Amplification.Count > 0) files.Add(("plan-amplification.csv", Amplification(r, s)));
        if (s.Spectrum is { } sp)
        {
            files.Add(("plan-spectrum-modes.csv", SpectrumModes(r, sp)));
            files.Add(("plan-spectrum-stories.csv", SpectrumStories(r, sp)));
            files.Add(("plan-spectrum-lines.csv", SpectrumLines(r, sp)));
            files.Add(("plan-spectrum-line-members.csv", SpectrumLineMembers(r, sp)));
            files.Add(("plan-spectrum-line-reactions.csv", SpectrumLineReactions(r, sp)));
        }
        files.Add(("plan-seismic.json", TypedJson.Write(Document(r, s))));
        return files;
    }

    private static string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "n/a";
    private static string Csv(string s) => CsvText.Cell(s);

    private static string Modes(PlanResult r, PlanSeismicResult s)
    {
        var p = r.Plan;
        var sb = new StringBuilder("mode,period [s],omega [rad/s],dominant,share x,share y,share torsion,cumulative x,cumulative y,cumulative torsion,gamma x,gamma y");
        foreach (var l in p.Levels.Skip(1)) sb.Append($",{Csv(l.Id + " Ux")},{Csv(l.Id + " Uy")},{Csv(l.Id + " Rz [1/" + p.Units.LengthSymbol + "]")}");
        sb.Append('\n');
        foreach (var m in s.Modal.Modes)
        {
            sb.Append($"{m.Number},{F(m.Period)},{F(m.Omega)},{m.Dominant},{F(m.Share[0])},{F(m.Share[1])},{F(m.Share[2])},{F(m.Cumulative[0])},{F(m.Cumulative[1])},{F(m.Cumulative[2])},{F(m.Participation[0])},{F(m.Participation[1])}");
            foreach (var (ux, uy, rz) in m.Display(p)) sb.Append($",{F(ux)},{F(uy)},{F(rz / p.Units.FromSI(1, Quantity.Length))}");
            sb.Append('\n');
        }
        return sb.ToString();
    }

    private static string Elf(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol;
        var sb = new StringBuilder($"direction,mode,modal period [s],Ta [s],Cu,Cu*Ta [s],period used [s],period note,Cs,Cs governed by,W [{fu}],V [{fu}],k,cases\n");
        foreach (var e in s.Elf)
            sb.Append($"{e.Direction},{e.Mode},{F(e.ModalPeriod)},{F(e.Ta)},{F(e.Cu)},{F(e.Cu * e.Ta)},{F(e.PeriodUsed)},{Csv(e.PeriodNote)},{F(e.Cs)},{Csv(e.CsNote)},{F(u.FromSI(e.Weight, Quantity.Force))},{F(u.FromSI(e.BaseShear, Quantity.Force))},{F(e.Exponent)},{Csv(string.Join(" ", e.Cases))}\n");
        return sb.ToString();
    }

    private static string ElfForces(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        var sb = new StringBuilder($"direction,level,Cvx,Fx [{u.ForceSymbol}]\n");
        foreach (var e in s.Elf)
            for (int l = 0; l < e.LevelForces.Count; l++)
                sb.Append($"{e.Direction},{Csv(r.Plan.Levels[l + 1].Id)},{F(e.Cvx[l])},{F(u.FromSI(e.LevelForces[l], Quantity.Force))}\n");
        return sb.ToString();
    }

    private static string Amplification(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        var sb = new StringBuilder($"direction,level,max displacement [{u.LengthSymbol}],average of the ends [{u.LengthSymbol}],Ax,applied\n");
        foreach (var a in s.Amplification)
            sb.Append($"{a.Direction},{Csv(r.Plan.Levels[a.Level].Id)},{F(u.FromSI(a.MaxDisplacement, Quantity.Length))},{F(u.FromSI(a.AverageDisplacement, Quantity.Length))},{F(a.Ax)},{(a.Applied ? "yes" : "no")}\n");
        return sb.ToString();
    }

    private static string SpectrumModes(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol;
        var sb = new StringBuilder($"direction,mode,period [s],Sa [g],gamma,base shear x [{fu}],base shear y [{fu}],base torque [{u.Label(Quantity.Moment)}]\n");
        foreach (var d in sp.Directions)
            foreach (var m in d.Modes)
                sb.Append($"{d.Direction},{m.Mode},{F(m.Period)},{F(m.Sa)},{F(m.Gamma)},{F(u.FromSI(m.BaseShearX, Quantity.Force))},{F(u.FromSI(m.BaseShearY, Quantity.Force))},{F(u.FromSI(m.BaseTorque, Quantity.Moment))}\n");
        return sb.ToString();
    }

    private static string SpectrumStories(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, lu = u.LengthSymbol;
        double L(double v) => u.FromSI(v, Quantity.Length);
        var sb = new StringBuilder($"direction,story,ELF shear [{fu}],modal shear [{fu}],scaled modal shear [{fu}],corner,x [{lu}],y [{lu}],modal drift [{lu}],accidental torsion drift [{lu}],drift [{lu}],design drift Cd*drift/Ie [{lu}],height [{lu}],design drift ratio,difference of combined displacements (not the drift) [{lu}],Px [{fu}],theta (modal),theta (ELF),theta max,governing shifted analysis\n");
        foreach (var d in sp.Directions)
            foreach (var st in d.Stories)
                sb.Append($"{d.Direction},{st.Story},{F(u.FromSI(st.ElfShear, Quantity.Force))},{F(u.FromSI(st.ModalShear, Quantity.Force))},{F(u.FromSI(st.ScaledShear, Quantity.Force))},{st.Corner + 1},{F(L(st.At.X))},{F(L(st.At.Y))},{F(L(st.ModalDrift))},{F(L(st.TorsionDrift))},{F(L(st.Drift))},{F(L(st.DesignDrift))},{F(L(st.Height))},{F(st.Ratio)},{F(L(st.DriftFromCombinedDisplacements))},{F(u.FromSI(st.Px, Quantity.Force))},{F(st.Theta)},{F(st.ThetaElf)},{F(st.ThetaMax)},{st.Variant}\n");
        return sb.ToString();
    }

    private static string SpectrumLines(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        var sb = new StringBuilder($"direction,story,line,ELF shear [{fu}],modal shear [{fu}],scaled modal shear [{fu}],accidental torsion [{fu}],design shear [{fu}],overturning (no sign) [{mu}],scaled overturning [{mu}],accidental torsion overturning [{mu}],design overturning [{mu}]\n");
        foreach (var d in sp.Directions)
            foreach (var l in d.Lines)
                sb.Append($"{d.Direction},{l.Story},{Csv(l.Line)},{F(Fo(l.Elf))},{F(Fo(l.Modal))},{F(Fo(l.Scaled))},{F(Fo(l.Torsion))},{F(Fo(l.Design))},{F(Mo(l.Overturning))},{F(Mo(l.ScaledOverturning))},{F(Mo(l.TorsionOverturning))},{F(Mo(l.DesignOverturning))}\n");
        return sb.ToString();
    }

    /// <summary>Each line's member end forces combined mode by mode (no sign), scaled, the static torsion's and the design sum; one row per member end.</summary>
    private static string SpectrumLineMembers(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        var sb = new StringBuilder("direction,line,member,end");
        foreach (var k in new[] { "modal", "scaled", "accidental torsion", "design" }) sb.Append($",N {k} [{fu}],V {k} [{fu}],M {k} [{mu}]");
        sb.Append('\n');
        foreach (var d in sp.Directions)
            foreach (var lf in d.LineForces)
            {
                var model = r.Plan.Lines.First(l => l.Id == lf.Line).Model;
                var design = lf.Design;
                for (int m = 0; m < lf.Modal.Count; m++)
                    foreach (var start in new[] { true, false })
                    {
                        sb.Append($"{d.Direction},{Csv(lf.Line)},{Csv(model.Members[lf.Modal[m].Member].Id)},{(start ? "start" : "end")}");
                        foreach (var e in new[] { lf.Modal[m], lf.Scaled[m], lf.Torsion[m], design[m] })
                            sb.Append(start ? $",{F(u.FromSI(e.N1, Quantity.Force))},{F(u.FromSI(e.V1, Quantity.Force))},{F(u.FromSI(e.M1, Quantity.Moment))}"
                                            : $",{F(u.FromSI(e.N2, Quantity.Force))},{F(u.FromSI(e.V2, Quantity.Force))},{F(u.FromSI(e.M2, Quantity.Moment))}");
                        sb.Append('\n');
                    }
            }
        return sb.ToString();
    }

    /// <summary>Each line's support reactions combined mode by mode (no sign), scaled, the static torsion's and the design sum.</summary>
    private static string SpectrumLineReactions(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        var sb = new StringBuilder("direction,line,node");
        foreach (var k in new[] { "modal", "scaled", "accidental torsion", "design" }) sb.Append($",Rx {k} [{fu}],Ry {k} [{fu}],Mz {k} [{mu}]");
        sb.Append('\n');
        foreach (var d in sp.Directions)
            foreach (var lf in d.LineForces)
            {
                var model = r.Plan.Lines.First(l => l.Id == lf.Line).Model;
                var design = lf.DesignReactions;
                for (int j = 0; j < lf.ModalReactions.Count; j++)
                {
                    sb.Append($"{d.Direction},{Csv(lf.Line)},{Csv(model.Nodes[lf.ModalReactions[j].Node].Id)}");
                    foreach (var e in new[] { lf.ModalReactions[j], lf.ScaledReactions[j], lf.TorsionReactions[j], design[j] })
                        sb.Append($",{F(u.FromSI(e.Fx, Quantity.Force))},{F(u.FromSI(e.Fy, Quantity.Force))},{F(u.FromSI(e.Mz, Quantity.Moment))}");
                    sb.Append('\n');
                }
            }
        return sb.ToString();
    }

    /// <summary>plan-seismic.json as a typed document.</summary>
    public static PlanSeismicDocument Document(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        var limit = r.Plan.DriftLimit;
        return new PlanSeismicDocument(
            Program: $"PlaneLateral {ResultFiles.Version}",
            Caution: ResultFiles.Caution,
            Source: Source,
            Units: new PlanUnits(u.ForceSymbol, u.LengthSymbol),
            Modes: s.Modal.Modes.Select(m => new PlanSeismicMode(m.Number, m.Period, m.Dominant, m.Share, m.Cumulative, [m.Participation[0], m.Participation[1]])),
            RotationPivot: [L(s.Modal.Pivot.X), L(s.Modal.Pivot.Y)],
            EquivalentLateralForces: s.Elf.Select(e => new PlanSeismicElf(e.Direction, e.Mode, e.ModalPeriod, e.Ta, e.Cu, e.PeriodUsed, e.PeriodNote,
                e.Cs, e.CsNote, Fo(e.Weight), Fo(e.BaseShear), e.Exponent, e.LevelForces.Select(Fo), e.Cases)),
            Amplification: s.Amplification.Select(a => new PlanSeismicAmplification(a.Direction, r.Plan.Levels[a.Level].Id, a.Ax, a.Applied)),
            ResponseSpectrum: s.Spectrum is not { } sp ? null : new PlanSeismicSpectrum(
                sp.Spectrum.Describe(), sp.Settings.Rule.ToString().ToUpperInvariant(), sp.Settings.Damping, sp.R, sp.Ie, sp.Settings.Cd,
                sp.TorsionMethod, SpectrumFiles.CombinedNote,
                sp.Directions.Select(d => new PlanSeismicSpectrumDirection(d.Direction, d.ModesUsed, d.CumulativeShare,
                    Fo(d.Scaling.BaseShearModal), Fo(d.Scaling.BaseShearElf), d.Scaling.ForceFactor, d.Scaling.DriftFactor, d.Scaling.Why, d.EquilibriumError,
                    d.Variants.Select(v => new PlanSeismicSpectrumAnalysis(v.Label, L(v.Shift), v.ModesUsed, Fo(v.Scaling.BaseShearModal),
                        v.Scaling.ForceFactor, v.Scaling.DriftFactor, v.FloorRotation)),
                    d.Stories.Select(st => new PlanSeismicSpectrumStory(st.Story, Fo(st.ElfShear), Fo(st.ModalShear), Fo(st.ScaledShear),
                        st.Corner + 1, L(st.Drift), L(st.DesignDrift), st.Ratio, limit?.AllowedRatio, limit is null ? null : st.Ratio <= limit.AllowedRatio,
                        Fo(st.Px), st.Theta, st.ThetaElf, st.ThetaMax))))));
    }
}
