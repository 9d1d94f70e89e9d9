using System.Globalization;
using System.Security.Cryptography;
using System.Text.RegularExpressions;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>
/// The planar report as a calculation package a checker can reproduce by hand (issue 20, item 4): the answers first, a
/// table of contents, provenance, every input as a table, the results (reactions, member end forces), the sources cited
/// by number, and deflected shapes drawn as the element's own shape.
/// </summary>
[Collection("current directory")]
public class CalculationPackageTests
{
    private static string ModelsDir => Path.Combine(AppContext.BaseDirectory, "models");

    /// <summary>Every shipped planar model (models/**.json that is not a building file in plan), by its path under models/.</summary>
    public static TheoryData<string> ShippedPlanarModels() => new(PlanarModels());

    private static List<string> PlanarModels() =>
        Directory.GetFiles(ModelsDir, "*.json", SearchOption.AllDirectories).Order(StringComparer.Ordinal)
            .Where(f => !ModelReader.IsPlanFile(f)).Select(f => Path.GetRelativePath(ModelsDir, f).Replace('\\', '/')).ToList();

    [Fact]
    public void The_shipped_planar_models_are_found()
    {
        var all = PlanarModels();
        Assert.Contains("demo-clinic.json", all);
        Assert.Contains("panels/squat-wall.json", all);
        Assert.Contains("footings/wall-on-footing.json", all);
        Assert.Contains("verification/portal-fixed-base.json", all);
        Assert.DoesNotContain("demo-building.json", all);
        Assert.True(all.Count >= 17, $"{all.Count} models");
    }

    private static (ModelResult Run, ComparisonReport? Comparisons, ReportDocument Doc) Report(string path)
    {
        var model = ModelReader.ReadFile(path);
        var run = ModelRun.Run(model);
        var comparisons = model.Comparisons.Count > 0 ? ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run) : null;
        return (run, comparisons, ModelReport.Build(run, comparisons, Path.GetFileName(path), "PlaneLateral test"));
    }

    private static double Num(string cell) => double.Parse(cell, NumberStyles.Float, CultureInfo.InvariantCulture);

    [Theory]
    [MemberData(nameof(ShippedPlanarModels))]
    public async Task Every_shipped_model_reports_its_inputs_reactions_and_hash(string relative)
    {
        string path = Path.Combine(ModelsDir, relative);
        var (run, comparisons, doc) = await Task.Run(() => Report(path)).WaitAsync(TimeSpan.FromSeconds(300));
        var m = run.Model;
        var tables = doc.Tables.ToList();
        string html = doc.Html(), md = doc.Markdown();

        // Provenance: the SHA-256 of the file's bytes, computed here independently (FIPS 180-4), and its size.
        byte[] bytes = File.ReadAllBytes(path);
        string sha = Convert.ToHexStringLower(SHA256.HashData(bytes));
        var prov = Assert.Single(tables, t => t.Caption.StartsWith("Provenance", StringComparison.Ordinal));
        Assert.Equal([Path.GetFileName(path), bytes.Length.ToString(CultureInfo.InvariantCulture), sha], prov.Rows[0]);
        Assert.Contains(sha, html);
        Assert.Contains(sha, md);
        Assert.DoesNotContain(Path.GetDirectoryName(path)!, html);   // the name only, no folder

        // Opens with the answers-first summary: the very rows RunSummary builds for the console.
        var rows = RunSummary.Planar(run, comparisons, path);
        Assert.IsType<Heading>(doc.Blocks[0]);
        var summary = Assert.IsType<Table>(doc.Blocks.First(b => b is Table));
        Assert.StartsWith("Summary", summary.Caption);
        Assert.Equal(rows.Select(x => $"{x.Label}|{x.Text}"), summary.Rows.Select(x => $"{x[0]}|{x[1]}"));

        // The table of contents lists every section and sub-section, in order, linked in both renderings.
        var headings = doc.Blocks.OfType<Heading>().Where(h => h.Level is 2 or 3).Select(h => h.Text).ToList();
        Assert.Equal(headings, doc.Contents.Select(c => c.Text));
        Assert.Contains(doc.Contents, c => c.Text.EndsWith("References", StringComparison.Ordinal));
        int contentsAt = html.IndexOf("<nav class=\"contents\">", StringComparison.Ordinal);
        Assert.True(contentsAt > 0 && contentsAt < html.IndexOf("<h2", StringComparison.Ordinal), "contents before the first section");
        foreach (var c in doc.Contents)
        {
            Assert.Contains($"<a href=\"#{c.Anchor}\">{System.Net.WebUtility.HtmlEncode(c.Text)}</a>", html);
            Assert.Contains($" id=\"{c.Anchor}\">{System.Net.WebUtility.HtmlEncode(c.Text)}</h", html);
            Assert.Contains($"](#{c.Anchor})", md);
            Assert.Contains($"<a id=\"{c.Anchor}\"></a>", md);
        }

        // Inputs as tables.
        Assert.Contains(tables, t => t.Caption == "Materials");
        Assert.Contains(tables, t => t.Caption.StartsWith("Load cases", StringComparison.Ordinal));
        if (m.Nodes.Count > 0)
        {
            var nodes = Assert.Single(tables, t => t.Caption.StartsWith("Nodes", StringComparison.Ordinal));
            Assert.Equal(m.Nodes.Select(n => n.Id), nodes.Rows.Select(r => r[0]));
        }
        if (m.Members.Count > 0)
        {
            Assert.Equal(m.Members.Select(x => x.Id), Assert.Single(tables, t => t.Caption.StartsWith("Members: ends", StringComparison.Ordinal)).Rows.Select(r => r[0]));
            Assert.Equal(m.Members.Select(x => x.Id), Assert.Single(tables, t => t.Caption.StartsWith("Members: stiffness", StringComparison.Ordinal)).Rows.Select(r => r[0]));
        }
        if (m.Supports.Count > 0)
            Assert.Equal(m.Supports.Count, Assert.Single(tables, t => t.Caption.StartsWith("Supports", StringComparison.Ordinal)).Rows.Count);
        int nodalLoads = m.LoadCases.Sum(c => c.NodalLoads.Count), memberLoads = m.LoadCases.Sum(c => c.MemberLoads.Count), panelLoads = m.Panels.Sum(p => p.Loads.Count);
        if (nodalLoads > 0) Assert.Equal(nodalLoads, Assert.Single(tables, t => t.Caption.StartsWith("Nodal loads", StringComparison.Ordinal)).Rows.Count);
        if (memberLoads > 0) Assert.Equal(memberLoads, Assert.Single(tables, t => t.Caption.StartsWith("Member loads", StringComparison.Ordinal)).Rows.Count);
        if (panelLoads > 0) Assert.Equal(panelLoads, Assert.Single(tables, t => t.Caption.StartsWith("Story forces on wall panels", StringComparison.Ordinal)).Rows.Count);
        if (m.Combinations.Count > 0) Assert.Equal(m.Combinations.Count, Assert.Single(tables, t => t.Caption.StartsWith("Combinations", StringComparison.Ordinal)).Rows.Count);
        if (m.Panels.Count > 0) Assert.Equal(m.Panels.Count, Assert.Single(tables, t => t.Caption.StartsWith("Wall panels", StringComparison.Ordinal)).Rows.Count);
        if (m.Comparisons.Count > 0) Assert.Equal(m.Comparisons.Count, Assert.Single(tables, t => t.Caption.StartsWith("Comparison checks declared", StringComparison.Ordinal)).Rows.Count);
        if (m.Building.DriftChecks.Count > 0) Assert.Contains(tables, t => t.Caption == "Drift checks asked for");

        // Reactions: every case shown has its table, and the report's own numbers balance (derived: Σ reactions = −Σ loads).
        var reactionTables = tables.Where(t => t.Caption.StartsWith("Reactions", StringComparison.Ordinal) || t.Caption.StartsWith("Wall panel reactions", StringComparison.Ordinal)).ToList();
        Assert.NotEmpty(reactionTables);
        foreach (var t in reactionTables.Where(t => t.Caption.StartsWith("Reactions", StringComparison.Ordinal)))
        {
            int fx = t.Header.ToList().FindIndex(h => h.StartsWith("Fx", StringComparison.Ordinal));
            var nodeRows = t.Rows.Where(r => !r[0].StartsWith("Σ", StringComparison.Ordinal) && r[0] != "applied load").ToList();
            double sum = nodeRows.Sum(r => Num(r[fx])), applied = Num(t.Rows.Single(r => r[0] == "applied load")[fx]);
            double scale = Math.Max(1e-12, nodeRows.Select(r => Math.Abs(Num(r[fx]))).Append(Math.Abs(applied)).Max());
            Assert.True(Math.Abs(sum + applied) <= 2e-3 * scale, $"{t.Caption}: Σ Fx {sum} against the load {applied}");
        }
        if (m.Members.Count > 0)
            Assert.Contains(tables, t => t.Caption.StartsWith("Member end forces", StringComparison.Ordinal) && t.Header.Contains($"M2 [{m.Units.Label(PlaneLateral.Units.Quantity.Moment)}]"));

        // Sources: every method names its published source by number in the references list, or says it is derived,
        // common practice or an input; no pointer into the project's docs folder.
        var methods = Assert.Single(tables, t => t.Caption.StartsWith("Methods, formulas", StringComparison.Ordinal));
        int refs = doc.Blocks.OfType<BulletList>().Last().Items.Count;
        foreach (var row in methods.Rows)
        {
            var cited = Regex.Match(row[2], @"\[(\d+(, \d+)*)\]$");
            Assert.True(cited.Success || Regex.IsMatch(row[2], "^(derived|common practice|input|user)", RegexOptions.IgnoreCase), $"{row[0]}: '{row[2]}' cites no source");
            if (cited.Success)
                foreach (var n in cited.Groups[1].Value.Split(", ").Select(int.Parse)) Assert.InRange(n, 1, refs);
        }
        Assert.DoesNotContain("docs/", html);
        Assert.DoesNotContain("docs/", md);
        Assert.Contains("@media print", html);
    }

    [Fact]
    public async Task The_report_opens_with_the_rows_the_console_prints()
    {
        string dir = TempDir("report-summary");
        var (code, output, err) = await Task.Run(() => Run("report", DemoPath, "--out", dir)).WaitAsync(TimeSpan.FromSeconds(300));
        Assert.True(code == 0, err);
        string md = File.ReadAllText(Path.Combine(dir, "report.md"));
        // The console wraps rows to its width; words and their order are the same.
        static string Words(string s) => Regex.Replace(s, @"\s+", " ").Trim();
        string console = Words(output);
        var doc = ReportTests_Demo();
        var summary = doc.Tables.First();
        Assert.StartsWith("Summary", summary.Caption);
        foreach (var row in summary.Rows)
        {
            Assert.Contains(Words($"{row[0]} {row[1]}"), console);
            Assert.Contains($"| {row[0]} | {row[1].Replace("|", "\\|")} |", md);
        }
        // The summary comes before the contents, the contents before the first section.
        int s = md.IndexOf("*Summary", StringComparison.Ordinal), c = md.IndexOf("**Contents**", StringComparison.Ordinal), first = md.IndexOf("\n## ", StringComparison.Ordinal);
        Assert.True(s > 0 && s < c && c < first, $"summary at {s}, contents at {c}, first section at {first}");
    }

    private static ReportDocument ReportTests_Demo() => Report(DemoPath).Doc;

    [Fact]
    public void A_document_lists_its_sections_before_the_first_one_unless_told_where()
    {
        // Generic: any report on ReportDocument (the planar report, a building report) gets the contents.
        Block[] blocks = [new Heading(1, "Title"), new Paragraph("intro"), new Heading(2, "1. One"), new Heading(3, "1.1 Part"), new Paragraph("x"), new Heading(2, "2. Two")];
        var doc = new ReportDocument("Title", blocks);
        Assert.Equal([(2, "1. One", "sec-1"), (3, "1.1 Part", "sec-2"), (2, "2. Two", "sec-3")], doc.Contents.Select(c => (c.Level, c.Text, c.Anchor)));
        string html = doc.Html();
        Assert.True(html.IndexOf("<p>intro</p>", StringComparison.Ordinal) < html.IndexOf("<nav class=\"contents\">", StringComparison.Ordinal));
        Assert.True(html.IndexOf("<nav class=\"contents\">", StringComparison.Ordinal) < html.IndexOf("<h2 id=\"sec-1\">1. One</h2>", StringComparison.Ordinal));
        Assert.Contains("<li class=\"toc3\"><a href=\"#sec-2\">1.1 Part</a></li>", html);
        Assert.Contains("<h1>Title</h1>", html);   // the title is not a section
        string md = doc.Markdown();
        Assert.Contains("- [1. One](#sec-1)\n  - [1.1 Part](#sec-2)\n- [2. Two](#sec-3)\n", md);
        Assert.Contains("<a id=\"sec-3\"></a>\n\n## 2. Two", md);
        // Told where: the contents stand at the placeholder, once.
        var placed = new ReportDocument("Title", [new Heading(1, "Title"), new ContentsBlock(), new Paragraph("intro"), new Heading(2, "1. One")]);
        string h2 = placed.Html();
        Assert.Single(Regex.Matches(h2, "<nav class=\"contents\">"));
        Assert.True(h2.IndexOf("<nav", StringComparison.Ordinal) < h2.IndexOf("<p>intro</p>", StringComparison.Ordinal));
        // Print styling: each section on a new page, rows and figures kept whole, headers repeated (CSS Paged Media).
        foreach (var rule in new[] { "@media print", "break-before: page", "break-inside: avoid", "display: table-header-group", "max-width: 100%" })
            Assert.Contains(rule, html);
    }

    private const double E = 30e9, Nu = 0.2, B = 0.3, D = 0.6;   // a concrete beam 0.3 × 0.6 m (invented)

    private static StructureModel Beam(string supports, string loads, double length, string member = "")
    {
        string json = $$"""
        {
          "formatVersion": 1,
          "units": { "force": "N", "length": "m" },
          "materials": [ { "id": "C", "E": {{E.ToString("R", CultureInfo.InvariantCulture)}}, "nu": {{Nu.ToString("R", CultureInfo.InvariantCulture)}} } ],
          "sections": [ { "id": "R", "shape": "rectangle", "b": {{B.ToString("R", CultureInfo.InvariantCulture)}}, "d": {{D.ToString("R", CultureInfo.InvariantCulture)}} } ],
          "nodes": [ { "id": "A", "x": 0, "y": 0 }, { "id": "B", "x": {{length.ToString("R", CultureInfo.InvariantCulture)}}, "y": 0 } ],
          "members": [ { "id": "M", "start": "A", "end": "B", "section": "R", "material": "C"{{member}} } ],
          "supports": [ {{supports}} ],
          "loadCases": [ { "id": "P", {{loads}} } ]
        }
        """;
        return ModelReader.Parse(json, "beam.json");
    }

    /// <summary>
    /// A cantilever under a tip load P, drawn by the report's deflected-shape curve: at every interior point it is
    /// v(x) = P·x²(3L − x)/(6EI) + P·x/(κGA), Timoshenko beam theory (the flexural part the textbook cantilever, e.g. Gere &amp;
    /// Timoshenko, Mechanics of Materials; the shear part P·x/(κGA) from the constant shear strain P/(κGA); at the tip
    /// PL³/3EI + PL/(κGA), /work/shared/REFERENCES.md "Beams with shear deformation"), κ = 1/1.2 the rectangle's form factor.
    /// </summary>
    [Fact]
    public void A_cantilever_is_drawn_as_its_exact_deflected_shape_between_the_nodes()
    {
        const double length = 3.0, p = 50e3;
        var model = Beam("""{ "node": "A", "type": "fixed" }""", """ "nodalLoads": [ { "node": "B", "fy": 50000 } ] """, length);
        var c = ModelRun.Run(model).Analysis.Cases[0];
        double ei = E * B * D * D * D / 12, kga = E / (2 * (1 + Nu)) * B * D / 1.2;
        var pts = MemberCurves.Shape(model, c, model.Members[0], 20);
        Assert.Equal(21, pts.Count);
        foreach (var pt in pts.Skip(1).SkipLast(1))
        {
            double x = pt.S, exact = p * x * x * (3 * length - x) / (6 * ei) + p * x / kga;
            Near(exact, pt.V, 1e-9, $"v at x = {x}");
            Near(exact, pt.Dy, 1e-9, $"global uy at x = {x}");
            Assert.True(Math.Abs(pt.Dx) < 1e-12 * exact, $"no axial displacement at x = {x}");
        }
        // Not the straight chord: at mid-length the curve is well below it (derived: v(L/2)/v(L) = 5/16 for flexure alone).
        Assert.True(pts[10].V < 0.45 * pts[^1].V);
    }

    /// <summary>
    /// A simply supported beam under a uniform load q, drawn from its end rotations and the span-load part: at x,
    /// v = q·x(L³ − 2Lx² + x³)/(24EI) + q·x(L − x)/(2κGA), mid-span 5qL⁴/(384EI) + qL²/(8κGA) (Timoshenko beam theory;
    /// the flexural part the textbook simply supported beam, e.g. Gere &amp; Timoshenko, Mechanics of Materials). Held
    /// two ways: pinned and roller supports; and fixed supports with both member ends released (the released rotations
    /// recovered from the condensation).
    /// </summary>
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_simply_supported_beam_under_a_span_load_is_drawn_exactly(bool released)
    {
        const double length = 6.0, q = -20e3;
        var model = released
            ? Beam("""{ "node": "A", "type": "fixed" }, { "node": "B", "type": "fixed" }""", """ "memberLoads": [ { "member": "M", "direction": "y", "w": -20000 } ] """, length, """, "momentReleases": ["start", "end"] """)
            : Beam("""{ "node": "A", "type": "pinned" }, { "node": "B", "type": "roller-x" }""", """ "memberLoads": [ { "member": "M", "direction": "y", "w": -20000 } ] """, length);
        Assert.Equal(released, model.Members[0].ReleaseStart && model.Members[0].ReleaseEnd);
        var c = ModelRun.Run(model).Analysis.Cases[0];
        double ei = E * B * D * D * D / 12, kga = E / (2 * (1 + Nu)) * B * D / 1.2;
        foreach (var pt in MemberCurves.Shape(model, c, model.Members[0], 12).Skip(1).SkipLast(1))
        {
            double x = pt.S, exact = q * x * (length * length * length - 2 * length * x * x + x * x * x) / (24 * ei) + q * x * (length - x) / (2 * kga);
            Near(exact, pt.V, 1e-9, $"v at x = {x}");
        }
        var mid = MemberCurves.Shape(model, c, model.Members[0], 2)[1];
        Near(5 * q * Math.Pow(length, 4) / (384 * ei) + q * length * length / (8 * kga), mid.V, 1e-9, "mid-span");
    }

    [Fact]
    public void A_rigid_zone_moves_as_a_rigid_body_with_its_node()
    {
        // Derived: a rigid zone of length a at the fixed base does not move; the flexible part is the cantilever of length L − a.
        const double length = 4.0, a = 1.0, p = 10e3;
        var model = Beam("""{ "node": "A", "type": "fixed" }""", """ "nodalLoads": [ { "node": "B", "fy": 10000 } ] """, length, """, "rigidZones": { "start": 1.0 } """);
        Assert.Equal(a, model.Members[0].RigidStart, 12);
        var c = ModelRun.Run(model).Analysis.Cases[0];
        var pts = MemberCurves.Shape(model, c, model.Members[0], 10);
        Assert.Equal(0, pts[0].V);
        Assert.Equal(a, pts[1].S, 12);
        Assert.True(Math.Abs(pts[1].V) < 1e-15);
        double ei = E * B * D * D * D / 12, kga = E / (2 * (1 + Nu)) * B * D / 1.2, lf = length - a;
        foreach (var pt in pts.Skip(2).SkipLast(1))
        {
            double x = pt.S - a;
            Near(p * x * x * (3 * lf - x) / (6 * ei) + p * x / kga, pt.V, 1e-9, $"v at s = {pt.S}");
        }
    }

    [Fact]
    public void A_drift_figure_far_from_its_allowable_is_scaled_to_the_drifts_and_names_the_allowable()
    {
        var doc = ReportTests_Demo();
        var run = ModelRun.Run(ModelReader.ReadFile(DemoPath));
        foreach (var check in run.Model.Building.DriftChecks)
        {
            var fig = Assert.Single(doc.Figures, f => f.Title == $"Story drift ratio profile, drift check '{check.Id}'");
            double worst = run.Building.DriftChecks.Where(d => d.Check == check).Max(d => d.Ratio);
            bool off = check.AllowedRatio > ModelPlots.OffScale * worst;
            Assert.Equal(off, fig.Caption.Contains("off the scale", StringComparison.Ordinal));
            Assert.Equal(!off, fig.Caption.Contains("beside the allowable", StringComparison.Ordinal));
        }
    }

    [Fact]
    public async Task A_report_of_a_frame_with_member_loads_is_byte_identical_twice()
    {
        string path = Path.Combine(ModelsDir, "verification", "inclined-member-loads.json");
        var (a, b) = await Task.Run(() => (Report(path).Doc, Report(path).Doc)).WaitAsync(TimeSpan.FromSeconds(120));
        Assert.Equal(a.Html(), b.Html());
        Assert.Equal(a.Markdown(), b.Markdown());
        foreach (var (x, y) in a.Figures.Zip(b.Figures)) Assert.True(x.Png.AsSpan().SequenceEqual(y.Png), x.FileName);
    }
}
