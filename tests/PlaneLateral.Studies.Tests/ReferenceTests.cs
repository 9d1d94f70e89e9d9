using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Studies.Tests;

/// <summary>One reference per comparison row, stated, and the same in every output (docs/comparisons.md, "The reference").</summary>
public class ReferenceTests
{
    private static string DemoPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json");

    [Fact]
    public void Demo_perforated_wall_is_judged_by_its_converged_panel()
    {
        // Derived: where a converged plane-stress panel exists it is the reference, so the row's ratio is panel/hand and
        // its verdict is the one panel/hand implies under the row's tolerance, whatever the equivalent frame says.
        var model = ModelReader.ReadFile(DemoPath);
        var facade = model with { Comparisons = model.Comparisons.Where(c => c.Id == "FACADE-S").ToList() };
        var report = ComparisonStudy.Run(facade);
        var row = Assert.Single(report.Rows);
        var panel = row.Panel!;
        Assert.NotNull(panel.EstimatedError);
        Assert.True(panel.EstimatedError <= ReferenceChoice.MaxErrorShareOfTolerance * row.Tolerance, $"estimated error {panel.EstimatedError}");
        Assert.Same(panel, row.Reference);
        Assert.Equal(panel.Value / row.Hand.Value, row.Ratio, 15);
        Assert.Equal(ComparisonRow.Judge(panel.Value / row.Hand.Value, row.Tolerance), row.Verdict);
        Assert.StartsWith("converged plane-stress panel", row.ReferenceBasis);
        Assert.StartsWith("reference, converged plane-stress panel", row.Cause);
        // The equivalent frame stands beside it with its own ratio.
        var frame = row.Estimate("equivalent frame")!;
        Assert.Contains(frame, row.Fe.Skip(1));

        // The files name the same reference and the same ratio (console and report read the same row).
        var files = ComparisonFiles.Render(report, "test");
        var json = JObject.Parse(files.Single(f => f.Name == "comparisons.json").Text);
        var jr = (JObject)((JArray)json["rows"]!)[0];
        Assert.Equal(ComparisonRow.PanelModelName, (string)jr["reference"]!);
        Assert.Equal(row.Ratio, (double)jr["ratio"]!, 12);
        Assert.Equal(row.VerdictText, (string)jr["verdict"]!);
        var fe = (JArray)jr["fe"]!;
        Assert.True((bool)fe[0]["reference"]!);
        Assert.Equal(ComparisonRow.PanelModelName, (string)fe[0]["model"]!);
        Assert.All(fe.Skip(1), f => Assert.False((bool)f["reference"]!));
        var csv = files.Single(f => f.Name == "comparisons.csv").Text.Split('\n');
        Assert.StartsWith("# ", csv[0]);   // the caution leads as a comment line, then the one header row
        var header = csv[1].Split(',');
        int model_ = Array.IndexOf(header, "FE model"), isRef = Array.IndexOf(header, "reference");
        var refLines = csv.Skip(2).Where(l => l.StartsWith("FACADE-S,")).Select(SplitCsv).Where(c => c[isRef] == "yes").ToList();
        Assert.Equal(ComparisonRow.PanelModelName, Assert.Single(refLines)[model_]);
    }

    [Fact]
    public void A_row_without_a_panel_says_it_rests_on_line_models_only()
    {
        // Common practice: a frame story has no continuum counterpart here, so its reference is the line model, stated.
        var rows = Models.Compare(Models.Portal(156, 300, 999, 999)).Rows;
        Assert.All(rows, r =>
        {
            Assert.StartsWith("line models only", r.ReferenceBasis);
            Assert.Null(r.Panel);
        });
    }

    private static string[] SplitCsv(string line)
    {
        var cells = new List<string>();
        var cur = new System.Text.StringBuilder();
        bool q = false;
        for (int i = 0; i < line.Length; i++)
        {
            char ch = line[i];
            if (q) { if (ch == '"' && i + 1 < line.Length && line[i + 1] == '"') { cur.Append('"'); i++; } else if (ch == '"') q = false; else cur.Append(ch); }
            else if (ch == '"') q = true;
            else if (ch == ',') { cells.Add(cur.ToString()); cur.Clear(); }
            else cur.Append(ch);
        }
        cells.Add(cur.ToString());
        return [.. cells];
    }
}
