using System.Globalization;
using System.Text;
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
        var files = new List<(string, string)>
        {
            ("plan.json", TypedJson.Write(Document(r, tributary))),
            ("plan-floors.csv", Floors(r)),
            ("plan-corners.csv", Corners(r)),
            ("plan-line-stories.csv", LineStories(r)),
            ("plan-rigidity.csv", Rigidity(r)),
            ("plan-torsional-irregularity.csv", Irregularity(r)),
            ("plan-checks.csv", Checks(r)),
        };
        if (r.Plan.Points.Count > 0) files.Add(("plan-points.csv", Points(r)));
        if (r.DriftChecks.Count > 0) files.Add(("plan-drift-checks.csv", Drifts(r)));
        files.AddRange(PlanDiaphragmFiles.Render(r, tributary));   // floors that bend: with a "floor" block only
        foreach (var line in r.Lines)
        {
            var own = ResultFiles.Planar(line.Recovered).ToDictionary(f => f.Name, f => f.Text);
            foreach (var name in new[] { "member-forces.csv", "reactions.csv", "displacements.csv", "panels.json", "panel-stresses.csv", "panel-checks.csv" })
                if (own.TryGetValue(name, out var text)) files.Add(($"line-{Safe(line.Line.Id)}-{name}", text));
        }
        return files;
    }

    /// <summary>A line id as a file-name part: letters, digits, '-' and '_' kept, anything else '_'.</summary>
    public static string Safe(string id) => new(id.Select(ch => char.IsAsciiLetterOrDigit(ch) || ch is '-' or '_' ? ch : '_').ToArray());

    /// <summary>A number cell; empty where the number is undefined (a share of a nil story shear), as plan.json writes null.</summary>
    private static string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "";
    private static string Csv(string s) => CsvText.Cell(s);   // the tool's one CSV escaper (quoting, control characters, formula-like text)

    private static string Floors(PlanResult r)
    {
        var u = r.Plan.Units;
        var sb = new StringBuilder($"case,level,Ux [{u.LengthSymbol}],Uy [{u.LengthSymbol}],Rz [rad],Ux locked [{u.LengthSymbol}],Uy locked [{u.LengthSymbol}]\n");
        foreach (var c in r.Cases)
            for (int i = 0; i < c.Motion.Count; i++)
            {
                var m = c.Motion[i]; var l = c.LockedMotion[i];
                sb.Append($"{Csv(c.Case.Id)},{Csv(r.Plan.Levels[m.Level].Id)},{F(u.FromSI(m.Ux, Quantity.Length))},{F(u.FromSI(m.Uy, Quantity.Length))},{F(m.Rz)},{F(u.FromSI(l.Ux, Quantity.Length))},{F(u.FromSI(l.Uy, Quantity.Length))}\n");
            }
        return sb.ToString();
    }

    private static string Corners(PlanResult r) =>
        Motions(r, "corner", r.Cases.SelectMany(c => c.Vertices.Select(v => (c.Case.Id, v.Level, $"{v.Vertex + 1}", v.At, v.Ux, v.Uy, v.DriftX, v.DriftY))));

    /// <summary>The user's named points: displacement and drift per case and level (with "points" only).</summary>
    private static string Points(PlanResult r) =>
        Motions(r, "point", r.Cases.SelectMany(c => c.Points.Select(q => (c.Case.Id, q.Level, Csv(q.Point), q.At, q.Ux, q.Uy, q.DriftX, q.DriftY))));

    /// <summary>One row per case, level and plan place (an outline corner or a named point): where it is, its displacement and its story drift.</summary>
    private static string Motions(PlanResult r, string place, IEnumerable<(string Case, int Level, string Name, PlanPoint At, double Ux, double Uy, double DriftX, double DriftY)> rows)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        string L(double si) => F(u.FromSI(si, Quantity.Length));
        var sb = new StringBuilder($"case,level,{place},x [{len}],y [{len}],ux [{len}],uy [{len}],drift x [{len}],drift y [{len}]\n");
        foreach (var m in rows)
            sb.Append($"{Csv(m.Case)},{Csv(r.Plan.Levels[m.Level].Id)},{m.Name},{L(m.At.X)},{L(m.At.Y)},{L(m.Ux)},{L(m.Uy)},{L(m.DriftX)},{L(m.DriftY)}\n");
        return sb.ToString();
    }

    private static string LineStories(PlanResult r)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol;
        var sb = new StringBuilder($"case,story,line,direction,shear [{fu}],share,direct [{fu}],torsional [{fu}],shear by the line's member statics [{fu}],line drift [{u.LengthSymbol}]\n");
        foreach (var c in r.Cases)
            foreach (var s in c.LineStories)
            {
                var line = r.Plan.Lines.First(l => l.Id == s.Line);
                sb.Append($"{Csv(c.Case.Id)},{s.Story},{Csv(s.Line)},{line.DirectionLabel},{F(u.FromSI(s.Shear, Quantity.Force))},{F(s.Share)},{F(u.FromSI(s.Direct, Quantity.Force))},{F(u.FromSI(s.Torsional, Quantity.Force))},{F(u.FromSI(s.PlanarShear, Quantity.Force))},{F(u.FromSI(s.Drift, Quantity.Length))}\n");
            }
        return sb.ToString();
    }

    private static string Rigidity(PlanResult r)
    {
        var u = r.Plan.Units;
        var sb = new StringBuilder($"loading,story,line,story stiffness alone [{u.Label(Quantity.TranslationalStiffness)}],x_R [{u.LengthSymbol}],y_R [{u.LengthSymbol}]\n");
        foreach (var g in r.Rigidity)
            foreach (var l in g.Lines)
                sb.Append($"{g.Direction},{g.Story},{Csv(l.Line)},{F(u.FromSI(l.Stiffness, Quantity.TranslationalStiffness))},{F(u.FromSI(g.XR, Quantity.Length))},{F(u.FromSI(g.YR, Quantity.Length))}\n");
        return sb.ToString();
    }

    private static string Irregularity(PlanResult r)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        var sb = new StringBuilder($"loading,story,governing case,with accidental torsion,max corner drift [{len}],average of the extreme corners [{len}],ratio,type (ASCE 7-16 Table 12.3-1),max corner displacement [{len}],average displacement [{len}],A_x (eq. 12.8-14)\n");
        foreach (var t in r.Irregularity)
            sb.Append($"{t.Direction},{t.Story},{Csv(t.Case)},{(t.WithAccidental ? "yes" : "no")},{F(u.FromSI(t.MaxDrift, Quantity.Length))},{F(u.FromSI(t.AverageDrift, Quantity.Length))},{F(t.Ratio)},{t.Type},{F(u.FromSI(t.MaxDisplacement, Quantity.Length))},{F(u.FromSI(t.AverageDisplacement, Quantity.Length))},{F(t.Ax)}\n");
        return sb.ToString();
    }

    private static string Drifts(PlanResult r)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        bool points = r.Plan.Points.Count > 0;   // a last column "point" (the named point's id) only when the building names points
        var sb = new StringBuilder($"case,story,corner,x [{len}],y [{len}],elastic drift [{len}],amplified drift [{len}],height [{len}],ratio,allowed,result{(points ? ",point" : "")}\n");
        foreach (var d in r.DriftChecks)
            sb.Append($"{Csv(d.Case)},{d.Story},{(d.Point is null ? (d.Vertex + 1).ToString(CultureInfo.InvariantCulture) : "")},{F(u.FromSI(d.At.X, Quantity.Length))},{F(u.FromSI(d.At.Y, Quantity.Length))},{F(u.FromSI(d.Drift, Quantity.Length))},{F(u.FromSI(d.Amplified, Quantity.Length))},{F(u.FromSI(d.Height, Quantity.Length))},{F(d.Ratio)},{F(d.Allowed)},{(d.Within ? "within" : "exceeds")}{(points ? "," + Csv(d.Point ?? "") : "")}\n");
        return sb.ToString();
    }

    private static string Checks(PlanResult r)
    {
        var u = r.Plan.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        var sb = new StringBuilder($"what,backward error,applied Fx [{fu}],applied Fy [{fu}],applied Mz about origin [{mu}],lines Fx [{fu}],lines Fy [{fu}],lines Mz about origin [{mu}],relative imbalance\n");
        foreach (var c in r.Cases)
        {
            var e = c.Equilibrium;
            sb.Append($"case {Csv(c.Case.Id)},{F(c.BackwardError)},{F(u.FromSI(e.AppliedFx, Quantity.Force))},{F(u.FromSI(e.AppliedFy, Quantity.Force))},{F(u.FromSI(e.AppliedMz, Quantity.Moment))},{F(u.FromSI(e.LinesFx, Quantity.Force))},{F(u.FromSI(e.LinesFy, Quantity.Force))},{F(u.FromSI(e.LinesMz, Quantity.Moment))},{F(e.RelativeError)}\n");
        }
        foreach (var l in r.Lines)
        {
            double worst = l.RecoveryBackwardError;   // the line's frame and, for a panel line, its panel
            sb.Append($"condensation of line {Csv(l.Line.Id)},{F(l.CondensationBackwardError)},,,,,,,\n");
            sb.Append($"recovery of line {Csv(l.Line.Id)},{F(worst)},,,,,,,{F(l.RecoveryError)}\n");
        }
        return sb.ToString();
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
