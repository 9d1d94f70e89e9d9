using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

/// <summary>
/// The report of one solved model: inputs, units, assumptions, the formulas used with their sources, tables, figures,
/// verdicts and cautions, as one self-contained HTML file (figures embedded) and its Markdown twin (figures beside it).
/// Depends only on the model, so two runs give byte-identical files.
/// </summary>
public static partial class ModelReport
{
    /// <summary>At most this many load cases get a deflected-shape figure (the first lateral load cases in model order).</summary>
    public const int MaxShapeFigures = 6;

    /// <summary>The caution every report carries.</summary>
    public const string Caution =
        "PlaneLateral computes; it does not design or approve. Every number here is for verification by a licensed engineer; the governing local building code and the engineer of record decide what is required. Nothing in this report is a statement of code compliance.";

    private static string F(double v) => double.IsFinite(v) ? TextNum(v) : "n/a";

    /// <summary>Four significant figures, plain notation where it reads well.</summary>
    private static string TextNum(double v)
    {
        double a = Math.Abs(v);
        if (a == 0) return "0";
        if (a >= 1e-3 && a < 1e6) return v.ToString(a >= 1000 ? "0" : "G4", CultureInfo.InvariantCulture);
        return v.ToString("0.000E+0", CultureInfo.InvariantCulture);
    }

    private static string Pct(double f, string fmt = "0.00") => double.IsFinite(f) ? (100 * f).ToString(fmt, CultureInfo.InvariantCulture) + "%" : "n/a";

    /// <summary>Builds the report document.</summary>
    /// <param name="comparisons">The model's hand-vs-FE rows, or null when it declares none.</param>
    /// <param name="modelFileName">The model's file name as shown in the report (no folder, so the report does not depend on where it was run).</param>
    public static ReportDocument Build(ModelResult run, ComparisonReport? comparisons, string modelFileName, string producedBy)
    {
        var r = run.Analysis;
        var m = r.Model;
        var u = m.Units;
        var b = run.Building;
        var blocks = new List<Block>();
        int fig = 0, sec = 0;
        var figureNames = new HashSet<string>(StringComparer.Ordinal);
        void Figure(Figure f) => blocks.Add(new FigureBlock(FigureNames.Unique(f, figureNames), ++fig));   // no two figures share a file
        string Section(string name) => $"{++sec}. {name}";
        var sr = run.Seismic;
        bool frame = m.Members.Count > 0;
        string L(double si) => F(u.FromSI(si, Quantity.Length));
        string Fo(double si) => F(u.FromSI(si, Quantity.Force));
        string K(double si) => F(u.FromSI(si, Quantity.TranslationalStiffness));
        string S(double si) => F(u.FromSI(si, Quantity.Stress));
        string len = u.LengthSymbol, force = u.ForceSymbol, stiff = u.Label(Quantity.TranslationalStiffness);

        string title = $"Lateral analysis report: {m.Title}";
        blocks.Add(new Heading(1, title));
        string engine = string.Join(" and ", new[] { frame ? "exact Timoshenko beam-columns" : "", r.Panels.Count > 0 ? "plane-stress wall panels" : "" }.Where(x => x != ""));
        blocks.Add(new Paragraph($"Model file {modelFileName}. Produced by {producedBy}: linear static analysis with {engine}{(b.HasStories ? ", story results" : "")}{(sr is null ? "" : ", seismic story forces and second-order effects")}{(comparisons is null ? "" : " and hand methods beside the finite-element numbers")}."));
        blocks.Add(new CautionBox(Caution));
        blocks.Add(new Table("Summary: the answers first (the rows the console prints)", ["item", "answer"],
            RunSummary.Planar(run, comparisons, modelFileName).Select(x => (IReadOnlyList<string>)[x.Label, x.Text]).ToList(), []));
        blocks.Add(Provenance(m, modelFileName, producedBy));
        blocks.Add(new ContentsBlock());

        // 1. Inputs and units
        blocks.Add(new Heading(2, Section("Inputs and units")));
        blocks.Add(new Paragraph($"Units: force {force}, length {len}; stress {u.Label(Quantity.Stress)}, stiffness {stiff}, moment {u.Label(Quantity.Moment)}. Every number in this report is in these units unless it says otherwise; ratios are dimensionless."));
        if (m.Warnings.Count > 0)   // plausibility of the input (Model/Plausibility.cs)
        { blocks.Add(new Paragraph($"Input warnings ({m.Warnings.Count}): the numbers in this report are as the file gives them; check each.")); blocks.Add(new BulletList(m.Warnings.Select(x => x.Text).ToList())); }
        blocks.Add(new Table("Model size", ["item", "count"],
            [["nodes", $"{m.Nodes.Count}"], ["members", $"{m.Members.Count}"], ["supports", $"{m.Supports.Count}"], ["load cases", $"{m.LoadCases.Count}"],
             ["combinations", $"{m.Combinations.Count}"], ["levels", $"{m.Building.Levels.Count}"], ["comparison checks", $"{m.Comparisons.Count}"], .. (r.Panels.Count > 0 ? new[] { new[] { "wall panels", $"{r.Panels.Count}" } } : [])], [1]));
        blocks.Add(new Table("Materials", ["material", $"E [{u.Label(Quantity.Stress)}]", $"G [{u.Label(Quantity.Stress)}]", "ν"],
            m.Materials.Select(x => (IReadOnlyList<string>)[x.Id, S(x.E), S(x.G), F(x.Nu)]).ToList(), [1, 2, 3]));
        if (m.Sections.Count > 0)
        blocks.Add(new Table("Sections (gross values, before stiffness modifiers)", ["section", "shape", $"A [{u.Label(Quantity.Area)}]", $"I [{u.Label(Quantity.SecondMomentOfArea)}]", $"depth [{len}]"],
            m.Sections.Select(x => (IReadOnlyList<string>)[x.Id, x.Shape, F(u.FromSI(x.A, Quantity.Area)), F(u.FromSI(x.I, Quantity.SecondMomentOfArea)), double.IsFinite(x.Depth) && x.Depth > 0 ? L(x.Depth) : "-"]).ToList(), [2, 3, 4]));
        AddInputTables(blocks, run);
        if (m.Building.Levels.Count > 0)
            blocks.Add(new Table("Levels", ["level", "name", $"elevation [{len}]", "diaphragm", "nodes"],
                m.Building.Levels.Select(l => (IReadOnlyList<string>)[l.Id, l.Name, L(l.Elevation), l.Rigid ? "rigid (exact tie)" : "none", $"{l.Nodes.Count}"]).ToList(), [2, 4]));
        if (m.Building.DriftChecks.Count > 0)
            blocks.Add(new Table("Drift checks asked for", ["check", "cases", "C_d", "I_e", "allowable Δa/h", "limit from"],
                m.Building.DriftChecks.Select(d => (IReadOnlyList<string>)[d.Id, string.Join(", ", d.Cases), F(d.Cd), F(d.Ie), Pct(d.AllowedRatio, "0.##"), d.LimitSource]).ToList(), [2, 3, 4]));

        // 2. Assumptions
        blocks.Add(new Heading(2, Section("Assumptions")));
        if (!frame)
            blocks.Add(new BulletList(["Linear elastic, small displacements, one plane; no second-order (P-delta) effects.", "The wall panels are plane-stress continua with the base held, floor ties as each panel declares (see the panels section).", "Loads are the model's load cases; combinations are formed by superposition."]));
        else
        blocks.Add(new BulletList([
            m.Seismic?.SecondOrder is { } so
                ? $"Linear elastic, small displacements, one plane. The tables are first-order except the second-order (P-delta) drifts of the seismic section, under gravity case \"{so.GravityCase}\"."
                : "Linear elastic, small displacements, one plane; no second-order (P-delta) effects.",
            "Member stiffness is what the model gives: section properties times the stiffness modifiers listed in member-stiffness.csv (cracked sections, if any, are the modeller's decision).",
            "Walls modelled as line members follow plane-section beam theory with a shear area; for squat walls and walls with openings that is doubtful.",
            "Supports are as modelled: fully fixed, pinned, rollers or springs. Foundation flexibility appears only where the model has springs.",
            "A rigid diaphragm ties the horizontal displacement of a level's nodes exactly (shared equation, not a penalty spring); diaphragm flexibility is not modelled.",
            "Loads are the model's load cases; combinations are formed by superposition.",
        ]));

        // 3. Methods and formulas
        blocks.Add(new Heading(2, Section("Methods and formulas")));
        var methods = !frame ? new List<IReadOnlyList<string>>() : new List<IReadOnlyList<string>>
        {
            new[] { "Timoshenko beam-column, exact two-node element", "bending block EI/(L³(1+Φ))·[12, 6L, −12, 6L; 6L, (4+Φ)L², −6L, (2−Φ)L²; …], Φ = 12EI/(G·A_s·L²), plus EA/L axially", "Przemieniecki, Theory of Matrix Structural Analysis, 1968, §5.6" },
            new[] { "Shear area of a rectangle", "A_s = A/f, f = 1.2 by default (1/f = κ = 5/6, Cowper's value at ν = 0); or Cowper's κ = 10(1+ν)/(12+11ν)", "Cowper 1966, the rectangle's coefficient; Gere & Timoshenko, shear form factor of a rectangle" },
            new[] { "Deflected shape between the nodes (figures)", "v(ξ) = N₁·v₁ + N₂·θ₁ + N₃·v₂ + N₄·θ₂, N_i the cubic Hermite functions with the shear parameter Φ; u linear; plus the fixed-end deflection of the segment under its span load", "Friedman & Kosmatka 1993, eq. 19; the span-load part derived" },
            new[] { "Backward error of the solve", "η = ‖K·u − f‖∞ / (‖K‖∞·‖u‖∞ + ‖f‖∞); the solve is judged good when η < 1E-10", "Higham 2002, Theorem 7.1 (normwise backward error)" },
            new[] { "Equilibrium of the whole", "Σ reactions + Σ applied loads = 0 in x, y and moment about the origin (member loads integrated along the members, not taken from the element load vectors), relative to the largest force", "derived: equilibrium of the free body" },
            new[] { "Story drift and drift ratio", "drift = u_top − u_bottom (mean ux of each level); ratio = drift / story height", "ASCE 7-16 §12.8.6 (story drift as the difference of the deflections at the top and bottom of the story)" },
            new[] { "Story shear by statics", "Σ over members crossing a horizontal cut of N·cos α − V·sin α (plus member loads between cut and face)", "derived: equilibrium of the part above the cut" },
        };
        if (frame && m.Members.Any(x => x.RigidStart > 0 || x.RigidEnd > 0))
            methods.Add(["Rigid end zones", "v_f1 = v₁ + a·θ₁, v_f2 = v₂ − b·θ₂ (local axes): the flexible segment's ends follow the nodes as rigid bodies; K = Tᵀ·K_f·T", "McGuire, Gallagher & Ziemian 2000, §13.3 (rigid end offsets)"]);
        if (frame && m.Members.Any(x => x.Kind == MemberKind.BeamColumn && (x.ReleaseStart || x.ReleaseEnd)))
            methods.Add(["Moment releases", "the released rotation condensed out: K_c = K_cc − K_cr·K_rr⁻¹·K_rc, its load vector alike; M = 0 at the release", "Guyan 1965 (static condensation)"]);
        if (m.Building.CrackedSections is not null)
            methods.Add(["Cracked-section stiffness modifiers", "I_eff = factor × I_g by member role (walls, columns, beams) as the members tables show", "ACI 318 Table 6.6.3.1.1(a); factors from a secondary copy"]);
        if (m.Building.DriftChecks.Count > 0)
            methods.Add(["Amplified drift", "δ = C_d·δe / I_e, checked as |δ|/h_sx ≤ Δa/h_sx", "ASCE 7-16 eq. 12.8-15; allowable from Table 12.12-1 or the user"]);
        if (m.Building.Levels.Count > 2)
            methods.Add(["Stiffness (soft story) irregularity", "k_i < 70% k_(i+1) or < 80% of the mean of the three above (Type 1a); 60% / 70% (Type 1b)", "ASCE 7-16 Table 12.3-2"]);
        methods.AddRange(SeismicMethods(m));
        methods.AddRange(PanelMethods(r));
        if (comparisons is not null)
            foreach (var hm in comparisons.Rows.Select(x => x.Hand.Method).DistinctBy(x => x.Name))
                methods.Add(["Hand method", hm.Name, hm.Source]);
        blocks.Add(new Table("Methods, formulas and their published sources", ["method", "formula", "source"], methods, []));

        // 4. Solution checks (of the frame; panels have their own in the panels section)
        if (frame)
        {
        blocks.Add(new Heading(2, Section("Solution checks")));
        blocks.Add(new Paragraph($"Solver {PlaneLateral.Output.MachineFree.Solver(r.Solve.Solver)}, {r.Solve.Unknowns} unknowns. The backward error measures how well the computed displacements satisfy K·u = f relative to the sizes of K, u and f; equilibrium compares reactions with applied loads."));
        blocks.Add(new Table("Backward error and equilibrium per case", ["case", "kind", "backward error", "force imbalance", "moment imbalance", "verdict"],
            r.Cases.Select(c => (IReadOnlyList<string>)[c.Id, c.IsCombination ? "combination" : "load case", c.BackwardError.ToString("0.0E+0", CultureInfo.InvariantCulture),
                c.Equilibrium.RelativeForceError.ToString("0.0E+0", CultureInfo.InvariantCulture), c.Equilibrium.RelativeMomentError.ToString("0.0E+0", CultureInfo.InvariantCulture),
                c.BackwardError < 1e-10 && c.Equilibrium.RelativeForceError < 1e-8 ? "solved" : "check the model"]).ToList(), [2, 3, 4]));
        }
        if (frame || r.Panels.Count > 0)
        {
            blocks.Add(new Heading(2, Section(frame ? "Results: displacements, reactions and member end forces" : "Results: panel reactions")));
            if (frame) AddResultTables(blocks, r);
            if (r.Panels.Count > 0) AddPanelReactions(blocks, r);
        }

        // 5. Deflected shapes
        var lateralLoadCases = b.Cases.Where(c => c.Lateral && !c.IsCombination).Select(c => c.CaseId).ToList();
        if (lateralLoadCases.Count == 0 && !b.HasStories)
            lateralLoadCases = r.Cases.Where(c => !c.IsCombination).Select(c => c.Id).ToList();
        if (!frame) lateralLoadCases = [];
        else blocks.Add(new Heading(2, Section("Deflected shapes")));
        foreach (var id in lateralLoadCases.Take(MaxShapeFigures)) Figure(ModelPlots.DeflectedShape(r, id));
        if (lateralLoadCases.Count > MaxShapeFigures)
            blocks.Add(new Paragraph($"Only the first {MaxShapeFigures} of {lateralLoadCases.Count} lateral load cases are drawn."));

        // 6. Stories
        var lateral = b.Cases.Where(c => c.Lateral && c.Stories.Count > 0).ToList();
        if (lateral.Count > 0)
        {
            blocks.Add(new Heading(2, Section("Story displacements, drifts and shears")));
            foreach (var cs in lateral)
                blocks.Add(new Table($"Stories (story 1 is the lowest), {(cs.IsCombination ? "combination" : "load case")} {cs.CaseId}",
                    ["story", "levels", $"height [{len}]", $"top displacement [{len}]", $"drift [{len}]", "drift ratio", $"shear [{force}]", $"stiffness [{stiff}]"],
                    cs.Stories.Select(s => (IReadOnlyList<string>)[$"{s.Index}", $"{s.Bottom.Id}–{s.Top.Id}", L(s.Height), L(s.TopDisplacement), L(s.Drift), Pct(s.DriftRatio, "0.000"), Fo(s.Shear), K(s.Stiffness)]).ToList(),
                    [0, 2, 3, 4, 5, 6, 7]));
            AddStoryLines(blocks, lateral, u);
            Figure(ModelPlots.DisplacementProfile(r, lateral));
            if (m.Building.DriftChecks.Count == 0) Figure(ModelPlots.DriftProfile(lateral, b.DriftChecks, null, u));
        }

        // 7. Drift checks
        if (b.DriftChecks.Count > 0)
        {
            blocks.Add(new Heading(2, Section("Drift checks")));
            blocks.Add(new Paragraph("δ = C_d·δe/I_e per story (ASCE 7-16 eq. 12.8-15), ratio |δ|/h against the allowable ratio; margin = 1 − ratio/allowable; every row as in drift-checks.csv. The table's footnotes and the rules around it are not applied: check them against the governing code."));
            blocks.Add(ReportTables.From(BuildingTables.DriftChecks(run), "Drift check results",
                ["check", "case", "story", "elastic drift", "amplified drift", "drift ratio", "allowed ratio", "margin", "result"]));
            foreach (var check in m.Building.DriftChecks)
                Figure(ModelPlots.DriftProfile(lateral.Where(c => check.Cases.Contains(c.CaseId)).ToList(), b.DriftChecks, check, u));
        }
        if (b.Irregularity.Count > 0)
        {
            blocks.Add(new Table("Stiffness (soft story) irregularity, ASCE 7-16 Table 12.3-2", ["case", "story", $"stiffness [{stiff}]", "k / k above", "k / mean of 3 above", "result"],
                b.Irregularity.Select(x => (IReadOnlyList<string>)[x.CaseId, $"{x.Story.Index}", K(x.Stiffness), Pct(x.RatioToAbove, "0"), Pct(x.RatioToAverageAbove, "0"),
                    x.Label]).ToList(), [1, 2, 3, 4]));
        }

        if (sr is not null) AddSeismic(blocks, Figure, r, b, sr, Section("Seismic story forces, periods and second-order effects"), run.Spectrum);
        if (r.Panels.Count > 0) AddPanels(blocks, Figure, r, Section("Wall panels (plane-stress continuum)"));

        // 8. Hand methods beside FE
        int handSection = 0;
        if (comparisons is not null && comparisons.Rows.Count > 0)
        {
            handSection = sec + 1;
            blocks.Add(new Heading(2, Section("Hand methods beside the finite-element model")));
            blocks.Add(new Paragraph($"ratio = FE/hand for the row's reference FE model, named in the table with the reason it is the reference: a converged plane-stress panel where the row has one, else the first line model; the next FE model stands beside it with its own ratio. Within tolerance when |ratio − 1| ≤ the row's tolerance (default ±{Pct(comparisons.DefaultTolerance, "0.#")}). The cause column names the assumption the gap points to, chosen by the tool's fixed rules on the subject's proportions and model."));
            blocks.Add(new Table("Hand method beside FE", ["check", "subject", "hand method", "unit", "hand", "reference FE model", "FE", "FE/hand", "beside it", "FE/hand", "h/l", "verdict", "cause"],
                comparisons.Rows.Select(x => (IReadOnlyList<string>)[x.CheckId, x.Subject, x.Hand.Method.Name, x.Unit, F(x.Hand.Value),
                    x.ReferenceBasis.Length > 0 ? $"{x.Reference.Model} ({x.ReferenceBasis})" : x.Reference.Model, F(x.Reference.Value), x.Ratio.ToString("0.000", CultureInfo.InvariantCulture),
                    x.Beside is { } o ? $"{o.Model}: {F(o.Value)}" : "-", x.Beside is { } o2 ? (o2.Value / x.Hand.Value).ToString("0.000", CultureInfo.InvariantCulture) : "-",
                    x.AspectRatio is double a ? a.ToString("0.00", CultureInfo.InvariantCulture) : "-", x.VerdictText, x.Cause]).ToList(), [4, 6, 7, 9, 10]));
            foreach (var kind in comparisons.Rows.Select(x => x.Kind).Distinct()) Figure(ModelPlots.HandVsFe(comparisons, kind));
        }

        // 9. Verdicts
        blocks.Add(new Heading(2, Section("Verdicts")));
        var verdicts = new List<string>();
        foreach (var c in r.Cases.Where(c => frame && !(c.BackwardError < 1e-10 && c.Equilibrium.RelativeForceError < 1e-8)))
            verdicts.Add($"Case {c.Id}: the solution check is not met (backward error {c.BackwardError:E1}); check the model before using its numbers.");
        if (verdicts.Count == 0 && frame) verdicts.Add($"All {r.Cases.Count} cases solved with backward error below 1E-10 and reactions balancing the loads.");
        foreach (var g in b.DriftChecks.GroupBy(d => d.Check.Id))
        {
            var worst = g.MaxBy(d => d.Ratio)!;
            int over = g.Count(d => !d.Passes);
            verdicts.Add(over == 0
                ? $"Drift check '{g.Key}': every story within the allowable {Pct(worst.Allowed, "0.##")}; the largest δ/h is {Pct(worst.Ratio, "0.000")} (case {worst.CaseId}, story {worst.Story.Index})."
                : $"Drift check '{g.Key}': {over} of {g.Count()} story results exceed the allowable {Pct(worst.Allowed, "0.##")}; the largest δ/h is {Pct(worst.Ratio, "0.000")} (case {worst.CaseId}, story {worst.Story.Index}).");
        }
        if (b.Irregularity.Any(x => x.Soft))
            verdicts.Add($"Soft story flagged in {b.Irregularity.Count(x => x.Soft)} story result(s); see the irregularity table.");
        if (comparisons is not null && comparisons.Rows.Count > 0)
        {
            int within = comparisons.Rows.Count(x => x.Verdict == Verdict.WithinTolerance);
            verdicts.Add($"Hand methods: {within} of {comparisons.Rows.Count} rows within tolerance; {comparisons.Rows.Count(x => x.Verdict == Verdict.HandHigher)} with the hand value higher, {comparisons.Rows.Count(x => x.Verdict == Verdict.HandLower)} lower (causes in section {handSection}).");
        }
        verdicts.AddRange(SeismicVerdicts(r, sr));
        verdicts.AddRange(PanelVerdicts(r));
        blocks.Add(new BulletList(verdicts));

        // 10. Cautions
        blocks.Add(new Heading(2, Section("Cautions")));
        var cautions = new List<string>
        {
            Caution,
            "The analysis is linear elastic and planar. Cracked-section modifiers, joint flexibility, foundation flexibility and diaphragm flexibility are modelling decisions made in the model file.",
            "Walls modelled as line members follow plane-section (beam) theory; for squat walls (h/l below about 0.5) and walls with openings that assumption is doubtful, and a panel model is the better reference.",
            "Preset drift limits and stiffness modifiers are table values quoted from the sources named beside them; the governing local code decides which values and definitions apply.",
        };
        cautions.AddRange(SeismicCautions(sr));
        cautions.AddRange(PanelCautions(r));
        cautions.AddRange(r.Notes.Select(n => $"Model note: {n}"));
        if (comparisons is not null) cautions.Add(ComparisonReport.Caution);
        blocks.Add(new BulletList(cautions));

        // 11. References: every source cell cites its source by number; the list gives author, title and year.
        var refs = new ReportReferences();
        for (int i = 0; i < blocks.Count; i++)
            if (blocks[i] is Table t && t.Header.Select((h, k) => (h, k)).Where(x => IsSourceColumn(x.h)).Select(x => x.k).ToList() is { Count: > 0 } cols)
                blocks[i] = t with { Rows = t.Rows.Select(row => (IReadOnlyList<string>)row.Select((cell, k) => cols.Contains(k) ? refs.Cite(cell) : cell).ToList()).ToList() };
        // Prose that points into the project's docs folder names the documentation in words instead (a reader of the
        // package has no checkout); the published sources are the numbered references.
        for (int i = 0; i < blocks.Count; i++)
            blocks[i] = blocks[i] switch
            {
                Paragraph p => new Paragraph(ReportReferences.NoDocsPath(p.Text)),
                BulletList l => new BulletList(l.Items.Select(ReportReferences.NoDocsPath).ToList()),
                Table t => t with { Caption = ReportReferences.NoDocsPath(t.Caption), Rows = t.Rows.Select(row => (IReadOnlyList<string>)row.Select(ReportReferences.NoDocsPath).ToList()).ToList() },
                var other => other,
            };
        if (refs.Used.Count > 0)
        {
            blocks.Add(new Heading(2, Section("References")));
            blocks.Add(new Paragraph("The sources the methods, checks and hand methods above cite by number. A value or clause marked \"from memory\" or \"secondary\" beside its citation was not read in the source itself: check it there."));
            blocks.Add(new BulletList(refs.List()));
        }
        return new ReportDocument(title, blocks);
    }

    /// <summary>The columns that hold sources: "source", "limit from", "expression, source or note".</summary>
    private static bool IsSourceColumn(string header) => header.Contains("source", StringComparison.Ordinal) || header == "limit from";

    /// <summary>File name → bytes: report.html (self-contained), report.md and the PNG figures the Markdown shows.</summary>
    public static IReadOnlyList<(string Name, byte[] Bytes)> Render(ReportDocument doc) =>
    [
        OutputSet.Text("report.html", doc.Html()),
        OutputSet.Text("report.md", doc.Markdown()),
        .. doc.Figures.Select(f => (f.FileName, f.Png)),
    ];
}
