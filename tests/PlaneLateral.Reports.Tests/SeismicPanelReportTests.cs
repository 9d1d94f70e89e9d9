using System.Globalization;
using System.Text.RegularExpressions;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The report's seismic section (demo clinic) and panels section (two-story wall).</summary>
[Collection("current directory")]
public class SeismicPanelReportTests
{
    private static string PanelPath => Path.Combine(AppContext.BaseDirectory, "models", "panels", "two-story-wall.json");

    private static (AnalysisResult Result, ReportDocument Doc) Demo()
    {
        var model = ModelReader.ReadFile(DemoPath);
        var run = ModelRun.Run(model);
        return (run.Analysis, ModelReport.Build(run, ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run), "demo-clinic.json", "test"));
    }

    /// <summary>The body rows of the Markdown table whose caption starts with <paramref name="caption"/>, cells trimmed.</summary>
    private static List<string[]> MdTable(string md, string caption)
    {
        var lines = md.Split('\n');
        int at = Array.FindIndex(lines, l => l.StartsWith("*" + caption, StringComparison.Ordinal));
        Assert.True(at >= 0, $"no table '{caption}' in the Markdown");
        var rows = new List<string[]>();
        // caption, blank, header, rule, then rows up to the blank line.
        for (int i = at + 4; i < lines.Length && lines[i].StartsWith('|'); i++)
            rows.Add(lines[i].Trim('|', ' ').Split(" | ").Select(c => c.Trim()).ToArray());
        return rows;
    }

    private static double Num(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);

    [Fact]
    public void The_demo_report_holds_the_seismic_tables_and_figures()
    {
        var (_, doc) = Demo();
        string html = doc.Html(), md = doc.Markdown();
        Assert.Contains("Seismic story forces, periods and second-order effects", md);
        foreach (var caption in new[] { "Base shear", "Vibration modes", "Period estimates side by side", "Vertical distribution of the base shear",
                     "First- and second-order drift and θ per story", "Drift check on the story forces" })
        {
            Assert.Contains(doc.Tables, t => t.Caption.StartsWith(caption, StringComparison.Ordinal));
            Assert.Contains("<caption>" + System.Net.WebUtility.HtmlEncode(caption), html);
        }
        var figures = doc.Blocks.OfType<FigureBlock>().ToList();
        foreach (var file in new[] { SeismicPlots.StoryForcesFile, SeismicPlots.DriftFile })
        {
            var f = Assert.Single(figures, x => x.Figure.FileName == file);
            ValidPng(f.Figure.Png, PlotStyle.Width, PlotStyle.Height, file);
            Assert.Contains($"<strong>Figure {f.Number}.</strong> {System.Net.WebUtility.HtmlEncode(f.Figure.Caption)}", html);
            Assert.Contains($"**Figure {f.Number}.** {f.Figure.Caption}", md);
        }
        // The methods table names the clauses the code cites (ASCE 7-16, from memory; docs/seismic.md).
        var methods = Assert.Single(doc.Tables, t => t.Caption == "Methods, formulas and their published sources");
        string sources = string.Join("\n", methods.Rows.Select(r => r[2]));
        foreach (var clause in new[] { "§12.8.1.1", "§12.8.2.1, Table 12.8-2", "Table 12.8-1", "§12.8.3", "§12.8.7", "McGuire, Gallagher & Ziemian" })
            Assert.Contains(clause, sources);
        // Verdicts and cautions speak of the new results; nothing claims compliance.
        Assert.Contains("Stability coefficient: θ", md);
        Assert.Contains("the governing code decides", md);
        Assert.DoesNotMatch("(?i)\\bcomplies\\b|is compliant|meets the code", md);
        // Sections numbered 1, 2, 3, ... without a gap (common practice for a report).
        var numbers = Regex.Matches(md, "^## (\\d+)\\. ", RegexOptions.Multiline).Select(m => int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture)).ToArray();
        Assert.Equal(Enumerable.Range(1, numbers.Length), numbers);
    }

    [Fact]
    public void The_report_story_forces_and_theta_are_the_core_values()
    {
        var (r, doc) = Demo();
        string md = doc.Markdown();
        var sr = SeismicResult.Of(r)!;
        var u = r.Model.Units;
        var levels = r.Model.Building.Levels;
        // Vertical distribution, top level first: level, w_x, h_x, w_x·h_x^k, C_vx, F_x, V_x; then the Σ row.
        var rows = MdTable(md, "Vertical distribution of the base shear");
        Assert.Equal(levels.Count, rows.Count);
        for (int i = levels.Count - 1, row = 0; i >= 1; i--, row++)
        {
            Assert.Equal(levels[i].Id, rows[row][0]);
            Near(u.FromSI(sr.Forces.LevelForces[i], Quantity.Force), Num(rows[row][5]), 5e-4, $"F_x at {levels[i].Id}");   // 4 significant figures
            Assert.True(Math.Abs(sr.Forces.Cvx[i] - Num(rows[row][4])) <= 5e-5, $"C_vx at {levels[i].Id}");   // printed to 4 decimals
            Near(u.FromSI(sr.Stories.Stories[i - 1].Shear, Quantity.Force), Num(rows[row][6]), 5e-4, $"V_x below {levels[i].Id}");
        }
        // ΣF_x = V and ΣC_vx = 1 (derived: the C_vx are the shares of V that the levels take).
        Near(u.FromSI(sr.Forces.BaseShear, Quantity.Force), Num(rows[^1][5]), 5e-4, "ΣF_x");
        Assert.Equal("1.0000", rows[^1][4]);
        // θ per story: story, P_x, V_x, δe, Δ, θ, δ 2nd, 2nd/1st, 1/(1−θ), status.
        var st = MdTable(md, "First- and second-order drift and θ per story");
        Assert.Equal(sr.Stability.Count, st.Count);
        for (int i = 0; i < st.Count; i++)
        {
            var x = sr.Stability[i];
            Assert.Equal($"{x.Story.Index}", st[i][0]);
            Assert.True(Math.Abs(Num(st[i][5]) - x.Theta) <= 5e-7 + 1e-3 * x.Theta, $"θ story {x.Story.Index}: {st[i][5]} against {x.Theta:R}");
            Near(x.Ratio, Num(st[i][7]), 1e-4, "2nd/1st");
            Near(x.Estimate, Num(st[i][8]), 1e-4, "1/(1−θ)");
            Assert.Equal(x.Status, st[i][9]);
            Near(u.FromSI(x.Px, Quantity.Force), Num(st[i][1]), 5e-4, "P_x");
        }
    }

    [Fact]
    public void The_panel_report_is_written_with_its_tables_and_coloured_mesh_figures()
    {
        string dir = TempDir("report-panel");
        var (code, _, err) = Run("report", PanelPath, "--out", dir);
        Assert.True(code == 0, err);
        string html = File.ReadAllText(Path.Combine(dir, "report.html"));
        string md = File.ReadAllText(Path.Combine(dir, "report.md"));
        foreach (var caption in new[] { "Panel geometry and mesh", "Panel openings", "Mesh convergence of the top stiffness, panel north wall", "Convergence estimate, panel north wall", "Panel level displacements", "Panel solution checks" })
        {
            Assert.Contains("<caption>" + System.Net.WebUtility.HtmlEncode(caption), html);
            Assert.Contains("*" + caption, md);
        }
        foreach (var field in new[] { PanelField.DisplacementMagnitude, PanelField.ShearStress })
        {
            string name = PanelPlots.FileName("north wall", "wind", field);
            ValidPng(File.ReadAllBytes(Path.Combine(dir, name)), PlotStyle.Width, PlotStyle.Height, name);
            Assert.Contains($"]({name})", md);
        }
        Assert.Contains("Taylor, Beresford & Wilson, IJNME 10:1211–1219, 1976", md);
        Assert.Contains("Richardson", md);
        Assert.Contains("licensed engineer", md);
        // The convergence table shows the Core study (three nested meshes of the model's "refinements": 3).
        var model = ModelReader.ReadFile(PanelPath);
        var p = LinearStaticAnalysis.Run(model).Panels[0];
        var conv = MdTable(md, "Mesh convergence of the top stiffness");
        Assert.Equal(p.Convergence!.Stiffness.Length, conv.Count);
        for (int i = 0; i < conv.Count; i++)
        {
            Assert.Equal($"{p.Convergence.Unknowns[i]}", conv[i][2]);
            Near(model.Units.FromSI(p.Convergence.Stiffness[i], Quantity.TranslationalStiffness), Num(conv[i][3]), 5e-4, $"k on mesh {i}");
        }
    }

    [Fact]
    public void The_panel_report_is_byte_identical_between_two_runs()
    {
        string a = TempDir("report-panel-a"), b = TempDir("report-panel-b");
        Assert.Equal(0, Run("report", PanelPath, "--out", a).Code);
        Assert.Equal(0, Run("report", PanelPath, "--out", b).Code);
        var names = Directory.GetFiles(a).Select(Path.GetFileName).Order().ToArray();
        Assert.Equal(names, Directory.GetFiles(b).Select(Path.GetFileName).Order().ToArray());
        Assert.Contains("report.html", names);
        foreach (var n in names)
            Assert.True(File.ReadAllBytes(Path.Combine(a, n!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, n!))), $"{n} differs");
    }

    [Theory]
    [InlineData("quad4")]
    [InlineData("quad9")]
    public void A_panel_mesh_figure_spans_the_field_from_its_min_to_its_max(string element)
    {
        // The shipped wall on its base mesh only (no study), with either element.
        string json = File.ReadAllText(PanelPath).Replace("\"quad4\"", $"\"{element}\"").Replace("\"refinements\": 3", "\"refinements\": 1");
        var model = ModelReader.Parse(json, "wall.json");
        var r = LinearStaticAnalysis.Run(model);
        var p = r.Panels[0];
        var c = p.Analysis.Cases[0];
        // The fields straight from the Core result, in the model's units (kN, m: 1 kN/m² = 1000 N/m², common practice).
        var magnitude = Enumerable.Range(0, c.Ux.Length).Select(i => Math.Sqrt(c.Ux[i] * c.Ux[i] + c.Uy[i] * c.Uy[i])).ToArray();
        var tau = Enumerable.Range(0, c.Ux.Length).Select(i => c.NodalStress[i, 2] / 1000).ToArray();
        var du = PanelPlots.Mesh(p, 0, "wind", PanelField.DisplacementMagnitude, model.Units);
        var ds = PanelPlots.Mesh(p, 0, "wind", PanelField.ShearStress, model.Units);
        Assert.Equal((magnitude.Min(), magnitude.Max()), (du.ColourMin, du.ColourMax));
        Near(tau.Min(), ds.ColourMin, 1e-12, "τxy min");
        Near(tau.Max(), ds.ColourMax, 1e-12, "τxy max");
        // The base is held, so the smallest displacement is 0 (docs/panels.md); the wall carries shear, so τxy is not nil.
        Assert.Equal(0, du.ColourMin);
        Assert.True(ds.ColourMax > ds.ColourMin);
        ValidPng(du.Figure.Png, du.Figure.Width, du.Figure.Height, du.Figure.FileName);
        ValidPng(ds.Figure.Png, ds.Figure.Width, ds.Figure.Height, ds.Figure.FileName);
        var doc = ModelReport.Build(ModelRun.Run(r.Model), null, "wall.json", "test");
        var methods = Assert.Single(doc.Tables, t => t.Caption == "Methods, formulas and their published sources");
        Assert.Contains(methods.Rows, row => row[0] == (element == "quad4" ? "4-node incompatible-mode quadrilateral (QM6)" : "9-node Lagrangian quadrilateral"));
    }
}
