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
        var cmd = new Command("report",
            "Solve a model and write a report: one self-contained HTML file with the figures embedded, a Markdown twin and the PNG figures (inputs, units, assumptions, formulas and sources, tables, drift checks, hand methods beside FE, verdicts, cautions).")
        {
            modelArg, outOption, tolOption,
        };
        cmd.SetAction(p => Run(p.GetValue(modelArg)!, p.GetValue(outOption), p.GetValue(tolOption), stdout, stderr));
        return cmd;
    }

    private static int Run(string modelPath, string? outDir, string? tolText, TextWriter stdout, TextWriter stderr)
    {
        if (!CompareCommand.TryTolerance(tolText, out double tol, out string error))
        {
            stderr.Write(error + "\nNothing was written.\n");
            return ExitCodes.Usage;
        }
        IReadOnlyList<ModelWarning> warnings = [];
        bool solved = CommandSupport.TrySolve(() =>
        {
            var model = ModelReader.ReadFile(modelPath);
            warnings = model.Warnings;
            var run = ModelRun.Run(model);   // every result, computed once; the report only reads it
            var comparisons = model.Comparisons.Count > 0 ? ComparisonStudy.Run(model, tol, run.Analysis) : null;
            return ModelReport.Build(run, comparisons, Path.GetFileName(modelPath), $"PlaneLateral {ResultFiles.Version}");
        }, stderr, out var doc, out int exit);
        if (!solved) return exit;
        stderr.Write(ModelWarning.Lines(warnings));
        string folder = outDir ?? CommandSupport.DefaultFolder(modelPath, "report");
        if (!CommandSupport.TryWrite(() => OutputSet.WriteAll(folder, ModelReport.Render(doc)), "report", stderr, out var written, out exit))
            return exit;
        stdout.Write($"PlaneLateral {ResultFiles.Version}: report\n\n{doc.Title}\n");
        stdout.Write($"{doc.Tables.Count()} tables, {doc.Figures.Count()} figures.\n");
        stdout.Write($"\nCaution: {ModelReport.Caution}\n");
        stdout.Write($"\nReport written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        return ExitCodes.Success;
    }
}
