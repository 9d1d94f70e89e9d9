using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>
/// The report of a building in plan (docs/reports.md): the answers-first summary, provenance of every input file,
/// the inputs as tables, the method with its published sources, the results of the floors and lines (checks, floor
/// motions, story shear per line, centre of rigidity, the hand split beside the FE, corner drifts, torsional
/// irregularity), the seismic block (modes, equivalent lateral forces, response spectrum) and floors that bend where
/// the file has them, the plan figures, verdicts and cautions; one self-contained HTML file and its Markdown twin.
/// Reads a <see cref="PlanRun"/> only (computed once by the caller); depends only on the input, so two runs give
/// byte-identical files. Sections live in partial files by topic (Inputs, Method, Results, Seismic, Floors).
/// </summary>
public static partial class BuildingReport
{
    /// <summary>The caution every report carries (the planar report's words).</summary>
    public const string Caution = ModelReport.Caution;

    /// <summary>Relative residual of Σ line shears against the story shear above which the equilibrium table says "check".</summary>
    public const double BalanceLimit = 1e-9;

    /// <summary>What a section builder needs: the run, the blocks so far, unit conversions and the numbering of sections and figures.</summary>
    private sealed class Doc(PlanRun run)
    {
        private int _section, _figure;
        private readonly HashSet<string> _figureNames = new(StringComparer.Ordinal);

        public PlanRun Run { get; } = run;
        public PlanResult R => Run.Result;
        public BuildingPlan P => Run.Result.Plan;
        public UnitSystem U => Run.Result.Plan.Units;
        public List<Block> Blocks { get; } = [];

        public string Len => U.LengthSymbol;
        public string Force => U.ForceSymbol;
        public string MomentUnit => U.Label(Quantity.Moment);
        public string StiffUnit => U.Label(Quantity.TranslationalStiffness);

        public string L(double si) => Num(U.FromSI(si, Quantity.Length));
        public string Fo(double si) => Num(U.FromSI(si, Quantity.Force));
        public string M(double si) => Num(U.FromSI(si, Quantity.Moment));
        public string K(double si) => Num(U.FromSI(si, Quantity.TranslationalStiffness));
        public string S(double si) => Num(U.FromSI(si, Quantity.Stress));

        public void Add(Block b) => Blocks.Add(b);
        public void Heading(string name) => Blocks.Add(new Heading(2, $"{++_section}. {name}"));
        public void Sub(string name) => Blocks.Add(new Heading(3, name));
        public void Text(string text) => Blocks.Add(new Paragraph(text));
        public void Table(string caption, IReadOnlyList<string> header, IEnumerable<IReadOnlyList<string>> rows, params int[] numeric) =>
            Blocks.Add(new Table(caption, header, rows.ToList(), numeric));
        public void Figure(Figure f) => Blocks.Add(new FigureBlock(FigureNames.Unique(f, _figureNames), ++_figure));

        /// <summary>The level's id with its name where it has one.</summary>
        public string Level(int index) => P.Levels[index].Name is { Length: > 0 } n && n != P.Levels[index].Id ? $"{P.Levels[index].Id} ({n})" : P.Levels[index].Id;

        public PlanLine Line(string id) => P.Lines.First(l => l.Id == id);
    }

    /// <summary>Four significant figures, plain notation where it reads well; "n/a" for a number that is not finite.</summary>
    internal static string Num(double v)
    {
        if (!double.IsFinite(v)) return "n/a";
        double a = Math.Abs(v);
        if (a == 0) return "0";
        if (a >= 1e-3 && a < 1e6) return v.ToString(a >= 1000 ? "0" : "G4", CultureInfo.InvariantCulture);
        return v.ToString("0.000E+0", CultureInfo.InvariantCulture);
    }

    /// <summary>Scientific notation for small checks (imbalances, backward errors).</summary>
    internal static string Sci(double v) => double.IsFinite(v) ? v.ToString("0.0E+0", CultureInfo.InvariantCulture) : "n/a";

    internal static string Pct(double f, string fmt = "0.0") => double.IsFinite(f) ? (100 * f).ToString(fmt, CultureInfo.InvariantCulture) + " %" : "n/a";

    internal static string Ratio(double v, string fmt = "0.000") => double.IsFinite(v) ? v.ToString(fmt, CultureInfo.InvariantCulture) : "n/a";

    internal static string I(int v) => v.ToString(CultureInfo.InvariantCulture);

    /// <summary>Builds the report document from one run of the building.</summary>
    /// <param name="producedBy">The tool and its version, e.g. "PlaneLateral 1.2.3".</param>
    public static ReportDocument Build(PlanRun run, string producedBy)
    {
        var d = new Doc(run);
        var p = d.P;
        string title = $"Lateral analysis report, building in plan: {p.Title}";
        d.Add(new Heading(1, title));
        string building = p.Inputs.Count > 0 ? Path.GetFileName(p.Inputs[0].Path) : Path.GetFileName(p.SourcePath);
        d.Text($"Building file {building}. Produced by {producedBy}: every line of resistance condensed exactly onto its floors, the floors solved " +
            $"on (Ux, Uy, Rz), each line's planar model recovered under the forces the floors put on it{(run.Seismic is null ? "" : "; modes, equivalent lateral forces" + (run.Seismic.Spectrum is null ? "" : " and the modal response spectrum"))}" +
            $"{(p.Floors.Count > 0 ? "; floors that bend" : "")}; the hand split by relative rigidity with torsion beside the finite-element numbers.");
        d.Add(new CautionBox(Caution));
        Summary(d);
        Provenance(d, producedBy);
        Inputs(d);
        Method(d);
        Results(d);
        Figures(d);
        if (run.Seismic is not null) Seismic(d);
        if (d.R.Diaphragms is not null) Floors(d);
        Verdicts(d);
        Cautions(d);
        return new ReportDocument(title, d.Blocks);
    }

    /// <summary>File name → bytes: report.html (self-contained), report.md and the PNG figures the Markdown shows.</summary>
    public static IReadOnlyList<(string Name, byte[] Bytes)> Render(ReportDocument doc) => ModelReport.Render(doc);

    private static void Summary(Doc d)
    {
        string path = d.P.Inputs.Count > 0 ? d.P.Inputs[0].Path : d.P.SourcePath;
        d.Table("Summary: the answers first (the rows the solve command prints)", ["item", "answer"],
            RunSummary.Plan(d.R, d.Run.Hand, path).Select(r => (IReadOnlyList<string>)[r.Label, r.Text]));
        if (d.P.Warnings.Count > 0)
        {
            d.Text($"Input warnings ({d.P.Warnings.Count}): the numbers in this report are as the file gives them; check each.");
            d.Add(new BulletList(d.P.Warnings.Select(w => w.Text).ToList()));
        }
    }

    private static void Provenance(Doc d, string producedBy)
    {
        d.Heading("Provenance");
        d.Text($"Computed by {producedBy}. Each file read is listed with its size and the SHA-256 of the bytes read (as sha256sum prints it), " +
            "so a checker can confirm that this report belongs to those very files; names only, without folders, so the report does not depend on where it was run.");
        d.Table("Input files", ["file", "role", "bytes", "SHA-256"],
            d.P.Inputs.Select((f, i) => (IReadOnlyList<string>)[Path.GetFileName(f.Path), i == 0 ? "building file" : "line model file",
                f.Bytes.ToString(CultureInfo.InvariantCulture), f.Sha256]), 2);
    }

    private static void Figures(Doc d)
    {
        var figures = PlanPlots.Governing(d.R);
        if (figures.Count == 0) return;
        d.Heading("Stories in plan");
        var g = PlanPlots.GoverningDriftCase(d.R)!.Value;
        int n = d.R.Plan.FloorCount;
        string which = figures.Count == n ? "One figure per story" :
            $"One figure for each of the {figures.Count} stories (of {n}) with the largest corner drift ratio";
        d.Text($"{which} under case {g.Case.Case.Id}, the case of the largest corner drift ratio ({Sci(g.Ratio)} at story {g.Story}), " +
            "all drawn to one displacement scale so that they compare. The same figures are written by the solve command.");
        foreach (var f in figures) d.Figure(f);
        var floors = PlanFloorPlots.All(d.R, d.Run.Tributary);
        if (floors.Count == 0) return;
        d.Heading("Floors that bend, in pictures");
        d.Text("Each floor that bends, deflected in its plane under each direction's case at the centres of mass (scale on the figure), and each line's share of the story shear " +
            "under a rigid, a semi-rigid and a flexible floor beside the hand tributary split. The same figures are written by the solve command.");
        foreach (var f in floors) d.Figure(f);
    }

    private static void Verdicts(Doc d)
    {
        var r = d.R;
        d.Heading("Verdicts");
        var v = new List<string>();
        bool ok = r.WorstEquilibriumError <= RunSummary.ImbalanceLimit && r.WorstBackwardError <= RunSummary.BackwardErrorLimit;
        v.Add(ok ? $"All {r.Cases.Count} floor solves balance (worst imbalance {Sci(r.WorstEquilibriumError)}, worst backward error {Sci(r.WorstBackwardError)})."
            : $"A floor solve misses the limits (worst imbalance {Sci(r.WorstEquilibriumError)}, worst backward error {Sci(r.WorstBackwardError)}): check the model before using its numbers.");
        double worstBalance = StoryBalance(d).Select(x => x.Residual).DefaultIfEmpty(0).Max();
        v.Add(worstBalance <= BalanceLimit
            ? $"Σ line story shears equal the story shears and torques in every story of every case (worst relative residual {Sci(worstBalance)})."
            : $"Σ line story shears depart from the story shear by {Sci(worstBalance)} (relative) somewhere: check the model.");
        if (r.DriftChecks.Count > 0)
        {
            var w = r.DriftChecks.MaxBy(x => x.Ratio / x.Allowed)!;
            int over = r.DriftChecks.Count(x => !x.Within);
            v.Add(over == 0
                ? $"Corner drift check: every corner of every story in every case within the allowable {Ratio(w.Allowed)}; the largest δ/h is {Ratio(w.Ratio, "0.00000")} (case {w.Case}, story {w.Story}, corner {w.Vertex + 1})."
                : $"Corner drift check: {over} of {r.DriftChecks.Count} corner results exceed the allowable {Ratio(w.Allowed)}; the largest δ/h is {Ratio(w.Ratio, "0.00000")} (case {w.Case}, story {w.Story}, corner {w.Vertex + 1}).");
        }
        var flagged = r.Irregularity.Where(i => i.Type != "none").ToList();
        v.Add(flagged.Count == 0 ? "Torsional irregularity (ASCE 7-16 Table 12.3-1): none flagged in any story or direction."
            : $"Torsional irregularity flagged in {flagged.Count} story-direction(s): {string.Join("; ", flagged.Select(i => $"story {i.Story} along {i.Direction}, Type {i.Type}, ratio {Ratio(i.Ratio)}"))}.");
        var rows = d.Run.Hand.SelectMany(s => s.Rows).Where(x => double.IsFinite(x.Gap) && x.HandDirect != 0).ToList();
        if (rows.MaxBy(x => Math.Abs(x.Gap)) is { } g)
            v.Add($"Hand split by relative rigidity with torsion beside the FE building (the reference): worst gap on a line along the loading {Pct(g.Gap, "+0.0;-0.0;0.0")} " +
                $"(line {g.Line}, story {g.Story}, case {g.Case}); cause: {Cause(g)}.");
        if (d.Run.Seismic?.Spectrum is { } sp && d.P.DriftLimit is { } lim)
            foreach (var dir in sp.Directions)
            {
                var worst = dir.Stories.MaxBy(s => s.Ratio)!;
                v.Add($"Modal drift check along {dir.Direction}: largest δ/h {Ratio(worst.Ratio, "0.00000")} (story {worst.Story}) against {Ratio(lim.AllowedRatio)}: {(dir.Stories.All(s => s.Ratio <= lim.AllowedRatio) ? "within" : "exceeds")}.");
            }
        if (d.R.Diaphragms is { } dg)
            foreach (var t in dg.Flexibility.GroupBy(x => (x.Level, x.Direction)).Select(x => x.Where(y => double.IsFinite(y.Ratio)).MaxBy(y => y.Ratio)).OfType<FloorFlexibilityTest>())
                v.Add($"Floor {d.P.Levels[t.Level].Id}, loads along {t.Direction}: largest MDD/ADVE {Ratio(t.Ratio)}: {(t.Flexible ? "flexible" : "not flexible")} by eq. 12.3-1 (the governing code decides the idealisation).");
        d.Add(new BulletList(v));
    }

    private static void Cautions(Doc d)
    {
        d.Heading("Cautions");
        var c = new List<string>
        {
            Caution,
            "The analysis is linear elastic. Each line is a planar model loaded only in its own plane at its floors; out-of-plane stiffness of the lines and torsional stiffness of single members are not counted (common practice).",
            "The hand split uses each line's story stiffness from the line alone under one floor-force pattern; in a building of several stories or of walls beside frames the line in the building differs, which is why the FE building is the reference.",
            "Code values (accidental eccentricity, Table 12.3-1 limits, A_x, C_d, I_e, the allowable drift) are those the file gives or the defaults named beside them; the governing code decides which apply.",
        };
        if (d.Run.Seismic is not null) c.Add($"Seismic block: {SeismicPresets.Status}. None of the exceptions of ASCE 7-16 §12.8 and §12.9 is applied.");
        if (d.R.Diaphragms is not null) c.Add(DiaphragmStudy.Caution);
        if (d.P.Floors.Count == 0) c.Add("Every floor is taken as a rigid diaphragm (no floor block in the file); whether that idealisation holds is for the engineer and the governing code (ASCE 7-16 §12.3.1).");
        d.Add(new BulletList(c));
    }
}
