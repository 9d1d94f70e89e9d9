using System.CommandLine;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Reports;
using PlaneLateral.Studies;

namespace PlaneLateral.Cli;

/// <summary>The "report" command: one self-contained HTML report of a solved model, its Markdown twin and the figures.</summary>
internal static class ReportCommand
{
    public static Command Build(TextWriter stdout, TextWriter stderr)
    {
        var modelArg = CommandSupport.ModelArgument();
        var outOption = CommandSupport.OutOption("report.html, report.md and the PNG figures", "report");
        var tolOption = new Option<string?>("--tolerance")
        {
            Description = "Band on FE/hand − 1 for comparison checks that set none of their own, as 0.10 or 10%. Default 0.10.",
        };
        var detailOption = Summary.DetailOption();
        var cmd = new Command("report",
            "Solve a model and write a report: one self-contained HTML file with the figures embedded, a Markdown twin and the PNG figures (inputs, units, assumptions, formulas and sources, tables, drift checks, hand methods beside FE, verdicts, cautions).")
        {
            modelArg, outOption, tolOption, detailOption,
        };
        cmd.SetAction(p => Run(p.GetValue(modelArg)!, p.GetValue(outOption), p.GetValue(tolOption), p.GetValue(detailOption), stdout, stderr));
        return cmd;
    }

    private static int Run(string modelPath, string? outDir, string? tolText, string? detailText, TextWriter stdout, TextWriter stderr)
    {
        if (!CompareCommand.TryTolerance(tolText, out double tol, out string error) || !Summary.TryDetail(detailText, out var detail, out error))
        {
            stderr.Write(error + "\nNothing was written.\n");
            return ExitCodes.Usage;
        }
        if (ModelReader.IsPlanFile(modelPath)) return PlanSolve.Report(modelPath, outDir, stdout, stderr, detail);   // a building in plan (docs/reports.md)
        IReadOnlyList<ModelWarning> warnings = [];
        bool solved = CommandSupport.TrySolve(() =>
        {
            var model = ModelReader.ReadFile(modelPath);
            warnings = model.Warnings;
            var options = AnalysisOptions.ForRun(null);   // one solver for the run and its checks: each distinct matrix factorised once
            var run = ModelRun.Run(model, options);   // every result, computed once; the report only reads it
            var comparisons = model.Comparisons.Count > 0 ? ComparisonStudy.Run(model, tol, run.Analysis, options) : null;
            return (Summary.Planar(run, comparisons, modelPath), ModelReport.Build(run, comparisons, Path.GetFileName(modelPath), $"PlaneLateral {ResultFiles.Version}"));
        }, stderr, out var built, out int exit);
        if (!solved) return exit;
        var (summary, doc) = built;
        stderr.Write(ModelWarning.Lines(warnings));
        string folder = outDir ?? CommandSupport.DefaultFolder(modelPath, "report");
        if (!CommandSupport.TryWrite(() => OutputSet.WriteAll(folder, ModelReport.Render(doc)), "report", stderr, out var written, out exit))
            return exit;
        var text = new System.Text.StringBuilder($"PlaneLateral {ResultFiles.Version}: report\n\n");
        text.Append(summary);
        if (detail != Detail.Summary) text.Append($"\n{doc.Title}\n{doc.Tables.Count()} tables, {doc.Figures.Count()} figures.\n");
        text.Append($"\nCaution: {ModelReport.Caution}\n");
        text.Append($"\nReport written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        stdout.Write(ConsoleText.Fit(text.ToString()));
        return ExitCodes.Success;
    }
}
