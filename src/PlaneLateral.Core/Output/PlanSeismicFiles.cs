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

    public static IReadOnlyList<(string Name, string Text)> Render(PlanResult r, PlanSeismicResult s) =>
        [.. Tables(r, s).Select(t => (t.Name, t.Table.ToCsv())), ("plan-seismic.json", TypedJson.Write(Document(r, s)))];

    /// <summary>The seismic block's plan-*.csv tables by file name, in the order <see cref="Render"/> writes them: each file is its table's <see cref="ResultTable.ToCsv"/>.</summary>
    public static IReadOnlyList<(string Name, ResultTable Table)> Tables(PlanResult r, PlanSeismicResult s)
    {
        var tables = new List<(string, ResultTable)>
        {
            ("plan-modes.csv", ModesTable(r, s)),
            ("plan-elf.csv", ElfTable(r, s)),
            ("plan-elf-forces.csv", ElfForcesTable(r, s)),   // one table per file: the level forces apart from the per-direction figures
        };
        if (s.Amplification.Count > 0) tables.Add(("plan-amplification.csv", AmplificationTable(r, s)));
        if (s.Spectrum is { } sp)
        {
            tables.Add(("plan-spectrum-modes.csv", SpectrumModesTable(r, sp)));
            tables.Add(("plan-spectrum-stories.csv", SpectrumStoriesTable(r, sp)));
            tables.Add(("plan-spectrum-lines.csv", SpectrumLinesTable(r, sp)));
            tables.Add(("plan-spectrum-line-members.csv", SpectrumLineMembersTable(r, sp)));
            tables.Add(("plan-spectrum-line-reactions.csv", SpectrumLineReactionsTable(r, sp)));
        }
        return tables;
    }

    private static TableColumn Text(string name) => new(name, Kind: CellKind.Text);

    /// <summary>The modes in plan: period, effective mass shares (a fraction; shown as a percentage), participation and each floor's shape.</summary>
    public static ResultTable ModesTable(PlanResult r, PlanSeismicResult s)
    {
        var p = r.Plan;
        double perLength = p.Units.FromSI(1, Quantity.Length);
        return new ResultTable
        {
            Title = "Modes in plan",
            Columns =
            [
                new("mode"), new("period", "s"), new("omega", "rad/s"), Text("dominant"), new("share x", Kind: CellKind.Percent), new("share y", Kind: CellKind.Percent),
                new("share torsion", Kind: CellKind.Percent), new("cumulative x", Kind: CellKind.Percent), new("cumulative y", Kind: CellKind.Percent),
                new("cumulative torsion", Kind: CellKind.Percent), new("gamma x"), new("gamma y"),
                .. p.Levels.Skip(1).SelectMany(l => new TableColumn[] { new(l.Id + " Ux"), new(l.Id + " Uy"), new(l.Id + " Rz", "1/" + p.Units.LengthSymbol) }),
            ],
            Rows = s.Modal.Modes.Select(m => (IReadOnlyList<object>)[m.Number, m.Period, m.Omega, m.Dominant, m.Share[0], m.Share[1], m.Share[2],
                m.Cumulative[0], m.Cumulative[1], m.Cumulative[2], m.Participation[0], m.Participation[1],
                .. m.Display(p).SelectMany(x => new object[] { x.Item1, x.Item2, x.Item3 / perLength })]),
        };
    }

    /// <summary>The equivalent lateral force per direction: the period used and why, C_s and what set it, W, V and k.</summary>
    public static ResultTable ElfTable(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol;
        return new ResultTable
        {
            Title = "Equivalent lateral forces (ASCE 7-16 §12.8)",
            Columns =
            [
                Text("direction"), new("mode"), new("modal period", "s"), new("Ta", "s"), new("Cu"), new("Cu*Ta", "s"), new("period used", "s"), Text("period note"), new("Cs"),
                Text("Cs governed by"), new("W", fu), new("V", fu), new("k"), Text("cases"),
            ],
            Rows = s.Elf.Select(e => (IReadOnlyList<object>)[e.Direction, e.Mode, e.ModalPeriod, e.Ta, e.Cu, e.Cu * e.Ta, e.PeriodUsed, e.PeriodNote, e.Cs, e.CsNote,
                u.FromSI(e.Weight, Quantity.Force), u.FromSI(e.BaseShear, Quantity.Force), e.Exponent, string.Join(" ", e.Cases)]),
        };
    }

    /// <summary>The equivalent lateral force at each level per direction: C_vx and F_x.</summary>
    public static ResultTable ElfForcesTable(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        return new ResultTable
        {
            Title = "Equivalent lateral forces at the levels",
            Columns = [Text("direction"), Text("level"), new("Cvx"), new("Fx", u.ForceSymbol)],
            Rows = s.Elf.SelectMany(e => e.LevelForces.Select((f, l) => (IReadOnlyList<object>)[e.Direction, r.Plan.Levels[l + 1].Id, e.Cvx[l], u.FromSI(f, Quantity.Force)])),
        };
    }

    /// <summary>A_x per direction and level (ASCE 7-16 §12.8.4.3) and whether it was applied.</summary>
    public static ResultTable AmplificationTable(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        return new ResultTable
        {
            Title = "Amplification of the accidental torsion A_x = (δmax / 1.2 δavg)², 1 to 3 (ASCE 7-16 §12.8.4.3)",
            Columns = [Text("direction"), Text("level"), new("max displacement", u.LengthSymbol), new("average of the ends", u.LengthSymbol), new("Ax"), Text("applied")],
            Rows = s.Amplification.Select(a => (IReadOnlyList<object>)[a.Direction, r.Plan.Levels[a.Level].Id, u.FromSI(a.MaxDisplacement, Quantity.Length),
                u.FromSI(a.AverageDisplacement, Quantity.Length), a.Ax, a.Applied ? "yes" : "no"]),
        };
    }

    /// <summary>The response spectrum's modes per excitation direction: S_a, Γ and each mode's base shears and torque.</summary>
    public static ResultTable SpectrumModesTable(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol;
        return new ResultTable
        {
            Title = "Response spectrum: modes per excitation direction",
            Columns = [Text("direction"), new("mode"), new("period", "s"), new("Sa", "g"), new("gamma"), new("base shear x", fu), new("base shear y", fu), new("base torque", u.Label(Quantity.Moment))],
            Rows = sp.Directions.SelectMany(d => d.Modes.Select(m => (IReadOnlyList<object>)[d.Direction, m.Mode, m.Period, m.Sa, m.Gamma,
                u.FromSI(m.BaseShearX, Quantity.Force), u.FromSI(m.BaseShearY, Quantity.Force), u.FromSI(m.BaseTorque, Quantity.Moment)])),
        };
    }

    /// <summary>The response spectrum's stories per excitation direction: shears beside the ELF, drift at the worst corner, stability.</summary>
    public static ResultTable SpectrumStoriesTable(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, lu = u.LengthSymbol;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        return new ResultTable
        {
            Title = "Response spectrum: stories per excitation direction",
            Columns =
            [
                Text("direction"), new("story"), new("ELF shear", fu), new("modal shear", fu), new("scaled modal shear", fu), new("corner"), new("x", lu), new("y", lu),
                new("modal drift", lu), new("accidental torsion drift", lu), new("drift", lu), new("design drift Cd*drift/Ie", lu), new("height", lu), new("design drift ratio"),
                new("difference of combined displacements (not the drift)", lu), new("Px", fu), new("theta (modal)"), new("theta (ELF)"), new("theta max"),
                Text("governing shifted analysis"),
            ],
            Rows = sp.Directions.SelectMany(d => d.Stories.Select(st => (IReadOnlyList<object>)[d.Direction, st.Story, Fo(st.ElfShear), Fo(st.ModalShear), Fo(st.ScaledShear),
                st.Corner + 1, L(st.At.X), L(st.At.Y), L(st.ModalDrift), L(st.TorsionDrift), L(st.Drift), L(st.DesignDrift), L(st.Height), st.Ratio,
                L(st.DriftFromCombinedDisplacements), Fo(st.Px), st.Theta, st.ThetaElf, st.ThetaMax, st.Variant])),
        };
    }

    /// <summary>The response spectrum's line story shears and overturning per excitation direction: ELF, modal, scaled, accidental torsion and design.</summary>
    public static ResultTable SpectrumLinesTable(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        return new ResultTable
        {
            Title = "Response spectrum: line story shears per excitation direction",
            Columns =
            [
                Text("direction"), new("story"), Text("line"), new("ELF shear", fu), new("modal shear", fu), new("scaled modal shear", fu), new("accidental torsion", fu),
                new("design shear", fu), new("overturning (no sign)", mu), new("scaled overturning", mu), new("accidental torsion overturning", mu), new("design overturning", mu),
            ],
            Rows = sp.Directions.SelectMany(d => d.Lines.Select(l => (IReadOnlyList<object>)[d.Direction, l.Story, l.Line, Fo(l.Elf), Fo(l.Modal), Fo(l.Scaled), Fo(l.Torsion),
                Fo(l.Design), Mo(l.Overturning), Mo(l.ScaledOverturning), Mo(l.TorsionOverturning), Mo(l.DesignOverturning)])),
        };
    }

    private static readonly string[] Parts = ["modal", "scaled", "accidental torsion", "design"];

    /// <summary>Each line's member end forces combined mode by mode (no sign), scaled, the static torsion's and the design sum; one row per member end.</summary>
    public static ResultTable SpectrumLineMembersTable(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        return new ResultTable
        {
            Title = "Response spectrum: member end forces of each line",
            Columns = [Text("direction"), Text("line"), Text("member"), Text("end"), .. Parts.SelectMany(k => new TableColumn[] { new($"N {k}", fu), new($"V {k}", fu), new($"M {k}", mu) })],
            Rows = MemberRows(r, sp),
        };
    }

    private static IEnumerable<IReadOnlyList<object>> MemberRows(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        foreach (var d in sp.Directions)
            foreach (var lf in d.LineForces)
            {
                var model = r.Plan.Lines.First(l => l.Id == lf.Line).Model;
                var design = lf.Design;
                for (int m = 0; m < lf.Modal.Count; m++)
                    foreach (var start in new[] { true, false })
                    {
                        var row = new List<object>(16) { d.Direction, lf.Line, model.Members[lf.Modal[m].Member].Id, start ? "start" : "end" };
                        foreach (var e in new[] { lf.Modal[m], lf.Scaled[m], lf.Torsion[m], design[m] })
                        {
                            row.Add(u.FromSI(start ? e.N1 : e.N2, Quantity.Force));
                            row.Add(u.FromSI(start ? e.V1 : e.V2, Quantity.Force));
                            row.Add(u.FromSI(start ? e.M1 : e.M2, Quantity.Moment));
                        }
                        yield return row;
                    }
            }
    }

    /// <summary>Each line's support reactions combined mode by mode (no sign), scaled, the static torsion's and the design sum.</summary>
    public static ResultTable SpectrumLineReactionsTable(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        return new ResultTable
        {
            Title = "Response spectrum: support reactions of each line",
            Columns = [Text("direction"), Text("line"), Text("node"), .. Parts.SelectMany(k => new TableColumn[] { new($"Rx {k}", fu), new($"Ry {k}", fu), new($"Mz {k}", mu) })],
            Rows = ReactionRows(r, sp),
        };
    }

    private static IEnumerable<IReadOnlyList<object>> ReactionRows(PlanResult r, PlanSpectrumResult sp)
    {
        var u = r.Plan.Units;
        foreach (var d in sp.Directions)
            foreach (var lf in d.LineForces)
            {
                var model = r.Plan.Lines.First(l => l.Id == lf.Line).Model;
                var design = lf.DesignReactions;
                for (int j = 0; j < lf.ModalReactions.Count; j++)
                {
                    var row = new List<object>(15) { d.Direction, lf.Line, model.Nodes[lf.ModalReactions[j].Node].Id };
                    foreach (var e in new[] { lf.ModalReactions[j], lf.ScaledReactions[j], lf.TorsionReactions[j], design[j] })
                    {
                        row.Add(u.FromSI(e.Fx, Quantity.Force));
                        row.Add(u.FromSI(e.Fy, Quantity.Force));
                        row.Add(u.FromSI(e.Mz, Quantity.Moment));
                    }
                    yield return row;
                }
            }
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
