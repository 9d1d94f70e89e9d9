using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The results files of a building in plan (docs/plan.md), in the building's units: floor motions, outline corners,
/// line story shears with their direct and torsional parts, centres of rigidity, torsional irregularity, corner drift
/// checks, the checks of every solve, plan.json with everything and the caution, and each line's planar member forces,
/// reactions and displacements. The text depends only on the input.
/// </summary>
public static class PlanFiles
{
    /// <param name="tributary">Floors that bend: the hand tributary split beside the FE flexible floor (PlaneLateral.Studies.PlanTributarySplit), or null.</param>
    public static IReadOnlyList<(string Name, string Text)> Render(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        var files = new List<(string, string)> { ("plan.json", TypedJson.Write(Document(r, tributary))) };
        files.AddRange(Tables(r, tributary).Select(t => (t.Name, t.Table.ToCsv())));
        foreach (var line in r.Lines)
        {
            var own = ResultFiles.Planar(line.Recovered).ToDictionary(f => f.Name, f => f.Text);
            foreach (var name in new[] { "member-forces.csv", "reactions.csv", "displacements.csv", "panels.json", "panel-stresses.csv", "panel-checks.csv" })
                if (own.TryGetValue(name, out var text)) files.Add(($"line-{Safe(line.Line.Id)}-{name}", text));
        }
        return files;
    }

    /// <summary>
    /// Every plan-*.csv table of the building (without the seismic block's, <see cref="PlanSeismicFiles.Tables"/>), by file
    /// name, in the order <see cref="Render"/> writes them: each file is its table's <see cref="ResultTable.ToCsv"/>.
    /// </summary>
    public static IReadOnlyList<(string Name, ResultTable Table)> Tables(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        var tables = new List<(string, ResultTable)>
        {
            ("plan-floors.csv", FloorsTable(r)),
            ("plan-corners.csv", CornersTable(r)),
            ("plan-line-stories.csv", LineStoriesTable(r)),
            ("plan-rigidity.csv", RigidityTable(r)),
            ("plan-torsional-irregularity.csv", IrregularityTable(r)),
            ("plan-checks.csv", ChecksTable(r)),
        };
        if (r.Plan.Points.Count > 0) tables.Add(("plan-points.csv", PointsTable(r)));
        if (r.DriftChecks.Count > 0) tables.Add(("plan-drift-checks.csv", DriftChecksTable(r)));
        tables.AddRange(PlanDiaphragmFiles.Tables(r, tributary));   // floors that bend: with a "floor" block only
        return tables;
    }

    /// <summary>A line id as a file-name part: letters, digits, '-' and '_' kept, anything else '_'.</summary>
    public static string Safe(string id) => new(id.Select(ch => char.IsAsciiLetterOrDigit(ch) || ch is '-' or '_' ? ch : '_').ToArray());

    /// <summary>
    /// A number cell of a plan table; an empty text cell where the number is undefined (a share of a nil story shear), as
    /// plan.json writes null, rather than the table's "n/a".
    /// </summary>
    internal static object Defined(double v) => double.IsFinite(v) ? v : "";

    private static TableColumn Text(string name) => new(name, Kind: CellKind.Text);

    /// <summary>Each floor's motion per case (Ux, Uy of the plan origin, Rz), and the same with the floors held against twist.</summary>
    public static ResultTable FloorsTable(PlanResult r)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        object L(double v) => Defined(u.FromSI(v, Quantity.Length));
        return new ResultTable
        {
            Title = "Floor motion per case",
            Columns = [Text("case"), Text("level"), new("Ux", len), new("Uy", len), new("Rz", "rad"), new("Ux locked", len), new("Uy locked", len)],
            Rows = r.Cases.SelectMany(c => c.Motion.Select((m, i) =>
            {
                var l = c.LockedMotion[i];
                return (IReadOnlyList<object>)[c.Case.Id, r.Plan.Levels[m.Level].Id, L(m.Ux), L(m.Uy), Defined(m.Rz), L(l.Ux), L(l.Uy)];
            })),
        };
    }

    /// <summary>Every outline corner's displacement and story drift, per case and level.</summary>
    public static ResultTable CornersTable(PlanResult r) =>
        Motions(r, "Outline corners per case and level", new("corner"),
            r.Cases.SelectMany(c => c.Vertices.Select(v => (c.Case.Id, v.Level, (object)(v.Vertex + 1), v.At, v.Ux, v.Uy, v.DriftX, v.DriftY))));

    /// <summary>The user's named points: displacement and drift per case and level (with "points" only).</summary>
    public static ResultTable PointsTable(PlanResult r) =>
        Motions(r, "Named points per case and level", Text("point"),
            r.Cases.SelectMany(c => c.Points.Select(q => (c.Case.Id, q.Level, (object)q.Point, q.At, q.Ux, q.Uy, q.DriftX, q.DriftY))));

    /// <summary>One row per case, level and plan place (an outline corner or a named point): where it is, its displacement and its story drift.</summary>
    private static ResultTable Motions(PlanResult r, string title, TableColumn place, IEnumerable<(string Case, int Level, object Name, PlanPoint At, double Ux, double Uy, double DriftX, double DriftY)> rows)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        object L(double si) => Defined(u.FromSI(si, Quantity.Length));
        return new ResultTable
        {
            Title = title,
            Columns = [Text("case"), Text("level"), place, new("x", len), new("y", len), new("ux", len), new("uy", len), new("drift x", len), new("drift y", len)],
            Rows = rows.Select(m => (IReadOnlyList<object>)[m.Case, r.Plan.Levels[m.Level].Id, m.Name, L(m.At.X), L(m.At.Y), L(m.Ux), L(m.Uy), L(m.DriftX), L(m.DriftY)]),
        };
    }

    /// <summary>Each line's story shear per case, with its direct and torsional parts, its share, the shear by its own member statics and its drift.</summary>
    public static ResultTable LineStoriesTable(PlanResult r)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol;
        object Fo(double v) => Defined(u.FromSI(v, Quantity.Force));
        return new ResultTable
        {
            Title = "Story shear per line",
            Columns =
            [
                Text("case"), new("story"), Text("line"), Text("direction"), new("shear", fu), new("share"), new("direct", fu), new("torsional", fu),
                new("shear by the line's member statics", fu), new("line drift", u.LengthSymbol),
            ],
            Rows = r.Cases.SelectMany(c => c.LineStories.Select(s => (IReadOnlyList<object>)[c.Case.Id, s.Story, s.Line, r.Plan.Lines.First(l => l.Id == s.Line).DirectionLabel,
                Fo(s.Shear), Defined(s.Share), Fo(s.Direct), Fo(s.Torsional), Fo(s.PlanarShear), Defined(u.FromSI(s.Drift, Quantity.Length))])),
        };
    }

    /// <summary>Each line's story stiffness alone per loading and story, beside the story's centre of rigidity.</summary>
    public static ResultTable RigidityTable(PlanResult r)
    {
        var u = r.Plan.Units;
        object L(double v) => Defined(u.FromSI(v, Quantity.Length));
        return new ResultTable
        {
            Title = "Centre of rigidity per story, with each line's story stiffness alone",
            Columns = [Text("loading"), new("story"), Text("line"), new("story stiffness alone", u.Label(Quantity.TranslationalStiffness)), new("x_R", u.LengthSymbol), new("y_R", u.LengthSymbol)],
            Rows = r.Rigidity.SelectMany(g => g.Lines.Select(l => (IReadOnlyList<object>)[g.Direction, g.Story, l.Line,
                Defined(u.FromSI(l.Stiffness, Quantity.TranslationalStiffness)), L(g.XR), L(g.YR)])),
        };
    }

    /// <summary>Torsional irregularity per loading and story (ASCE 7-16 Table 12.3-1) with A_x (eq. 12.8-14).</summary>
    public static ResultTable IrregularityTable(PlanResult r)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        object L(double v) => Defined(u.FromSI(v, Quantity.Length));
        return new ResultTable
        {
            Title = "Torsional irregularity (ASCE 7-16 Table 12.3-1: 1a above 1.2, 1b above 1.4; A_x eq. 12.8-14)",
            Columns =
            [
                Text("loading"), new("story"), Text("governing case"), Text("with accidental torsion"), new("max corner drift", len), new("average of the extreme corners", len),
                new("ratio"), Text("type (ASCE 7-16 Table 12.3-1)"), new("max corner displacement", len), new("average displacement", len), new("A_x (eq. 12.8-14)"),
            ],
            Rows = r.Irregularity.Select(t => (IReadOnlyList<object>)[t.Direction, t.Story, t.Case, t.WithAccidental ? "yes" : "no", L(t.MaxDrift), L(t.AverageDrift),
                Defined(t.Ratio), t.Type, L(t.MaxDisplacement), L(t.AverageDisplacement), Defined(t.Ax)]),
        };
    }

    /// <summary>The amplified corner drift against the allowable ratio, every corner (and named point) of every story in every case.</summary>
    public static ResultTable DriftChecksTable(PlanResult r)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        object L(double v) => Defined(u.FromSI(v, Quantity.Length));
        bool points = r.Plan.Points.Count > 0;   // a last column "point" (the named point's id) only when the building names points
        return new ResultTable
        {
            Title = "Corner drift check: δ = C_d·δ_e/I_e (ASCE 7-16 eq. 12.8-15) against the allowable ratio",
            Columns =
            [
                Text("case"), new("story"), new("corner"), new("x", len), new("y", len), new("elastic drift", len), new("amplified drift", len), new("height", len),
                new("ratio"), new("allowed"), Text("result"), .. points ? [Text("point")] : Array.Empty<TableColumn>(),
            ],
            Rows = r.DriftChecks.Select(d => (IReadOnlyList<object>)[d.Case, d.Story, d.Point is null ? d.Vertex + 1 : "", L(d.At.X), L(d.At.Y), L(d.Drift), L(d.Amplified), L(d.Height),
                Defined(d.Ratio), Defined(d.Allowed), d.Within ? "within" : "exceeds", .. points ? [d.Point ?? ""] : Array.Empty<object>()]),
        };
    }

    /// <summary>The checks of every solve: each case's floor loads against the line forces, each line's condensation and recovery.</summary>
    public static ResultTable ChecksTable(PlanResult r)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        object Fo(double v) => Defined(u.FromSI(v, Quantity.Force));
        object Mo(double v) => Defined(u.FromSI(v, Quantity.Moment));
        var rows = new List<IReadOnlyList<object>>();
        foreach (var c in r.Cases)
        {
            var e = c.Equilibrium;
            rows.Add([$"case {c.Case.Id}", Defined(c.BackwardError), Fo(e.AppliedFx), Fo(e.AppliedFy), Mo(e.AppliedMz), Fo(e.LinesFx), Fo(e.LinesFy), Mo(e.LinesMz), Defined(e.RelativeError)]);
        }
        foreach (var l in r.Lines)
        {
            // the recovery's backward error: the line's frame and, for a panel line, its panel
            rows.Add([$"condensation of line {l.Line.Id}", Defined(l.CondensationBackwardError), "", "", "", "", "", "", ""]);
            rows.Add([$"recovery of line {l.Line.Id}", Defined(l.RecoveryBackwardError), "", "", "", "", "", "", Defined(l.RecoveryError)]);
        }
        return new ResultTable
        {
            Title = "Checks of every solve",
            Columns =
            [
                Text("what"), new("backward error"), new("applied Fx", fu), new("applied Fy", fu), new("applied Mz about origin", mu),
                new("lines Fx", fu), new("lines Fy", fu), new("lines Mz about origin", mu), new("relative imbalance"),
            ],
            Rows = rows,
        };
    }

    /// <summary>plan.json as a typed document (the floors-that-bend block as PlanDiaphragmFiles builds it).</summary>
    public static PlanDocument Document(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        var u = r.Plan.Units;
        double? L(double v) => double.IsFinite(v) ? u.FromSI(v, Quantity.Length) : null;   // null where undefined, never "NaN"
        double? Fo(double v) => double.IsFinite(v) ? u.FromSI(v, Quantity.Force) : null;
        double? N(double v) => double.IsFinite(v) ? v : null;
        return new PlanDocument(
            Program: $"PlaneLateral {ResultFiles.Version}",
            Caution: ResultFiles.Caution,
            Title: r.Plan.Title,
            Units: new PlanUnits(u.ForceSymbol, u.LengthSymbol),
            Method: "each line condensed exactly on its level lateral DOFs (one factorisation per line), mapped to the floors' (Ux, Uy, Rz) and assembled; lines recovered under the level forces",
            AccidentalEccentricity: r.Plan.EccentricityRatio,
            // Plausibility of the input (Model/Plausibility.Plan.cs); they do not change any number.
            Warnings: r.Plan.Warnings.Select(x => new PlanWarning(Path.GetFileName(x.File), x.Line, x.Column, x.JsonPath, x.Problem, x.Fix)),
            Levels: r.Plan.Levels.Select(l => new PlanJsonLevel(l.Id, L(l.Elevation), Fo(l.Weight), [L(l.CentreOfMass.X), L(l.CentreOfMass.Y)])),
            Lines: r.Lines.Select(l => new PlanJsonLine(l.Line.Id, l.Line.Form.ToString(), [L(l.Line.X0), L(l.Line.Y0)], l.Line.DirectionLabel,
                l.CondensationBackwardError, l.SymmetryError, l.RecoveryError)),
            Cases: r.Cases.Select(c => new PlanJsonCase(c.Case.Id, c.Case.Description, c.BackwardError, c.Equilibrium.RelativeError,
                c.Motion.Select(m => new PlanJsonFloor(r.Plan.Levels[m.Level].Id, L(m.Ux), L(m.Uy), m.Rz)),
                c.LineStories.Select(s => new PlanJsonLineStory(s.Story, s.Line, Fo(s.Shear), N(s.Share), Fo(s.Direct), Fo(s.Torsional))))),
            Rigidity: r.Rigidity.Select(g => new PlanJsonRigidity(g.Direction, g.Story, L(g.XR), L(g.YR))),
            TorsionalIrregularity: r.Irregularity.Select(t => new PlanJsonTorsion(t.Direction, t.Story, t.Case, N(t.Ratio), t.Type, N(t.Ax), t.WithAccidental)),
            Floors: PlanDiaphragmFiles.Json(r, tributary),
            // The user's named points: per case and level, displacement and drift.
            Points: r.Plan.Points.Count == 0 ? null : r.Plan.Points.Select(q => new PlanJsonPoint(q.Id, [L(q.At.X), L(q.At.Y)],
                r.Cases.Select(c => new PlanJsonPointCase(c.Case.Id, c.Points.Where(m => m.Point == q.Id).Select(m =>
                    new PlanJsonPointLevel(r.Plan.Levels[m.Level].Id, L(m.Ux), L(m.Uy), L(m.DriftX), L(m.DriftY))))))));
    }
}
