using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Reports;
using PlaneLateral.Studies;

namespace PlaneLateral.Cli;

/// <summary>Solving a building in plan from the command line: read, solve, write the files, print <see cref="PlanReport"/>.</summary>
internal static class PlanSolve
{
    /// <summary>The shipped demo building in plan.</summary>
    public static string DemoPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-building.json");

    /// <summary>The no-argument run: the demo building, with a pointer to the planar demo.</summary>
    public static int RunDemo(TextWriter stdout, TextWriter stderr, Detail detail = Detail.Normal) =>
        Run(DemoPath, null, stdout, stderr, detail,
            $"No model given: this is the shipped demo building in plan ({DemoPath}).\n" +
            "Use 'planelateral solve <model.json>' for your own model or building, 'planelateral solve models/demo-clinic.json' for the planar demo,\n" +
            "'planelateral --help' for all commands (from the source tree: 'dotnet run --project src/PlaneLateral.Cli -- <command> ...').\n");

    /// <param name="source">The file already read by <see cref="ModelReader.ReadSource"/>, or null to read <paramref name="path"/>.</param>
    public static int Run(string path, string? outDir, TextWriter stdout, TextWriter stderr, Detail detail = Detail.Normal, string? note = null, bool strict = false, ModelSource? source = null)
    {
        if (!CommandSupport.TrySolve(() => source is null ? ModelReader.ReadPlanFile(path) : ModelReader.ReadPlan(source), stderr, out var plan, out int exit)) return exit;
        if (CommandSupport.RefusedAsStrict(strict, plan.Warnings, stderr)) return ExitCodes.BadModel;
        bool solved = CommandSupport.TrySolve(() => PlanRun.Run(plan), stderr, out var run, out exit);   // every result, once
        if (!solved) return exit;
        var (r, seismic, hand, tributary) = run;   // tributary: floors that bend, the hand split beside the FE flexible floor
        string folder = outDir ?? CommandSupport.DefaultFolder(path);
        var texts = seismic is null ? PlanFiles.Render(r, tributary) : [.. PlanFiles.Render(r, tributary), .. PlanSeismicFiles.Render(r, seismic)];
        // One plan figure per story under the case of the largest corner drift ratio, beside the CSV files; with a floor
        // block, each bending floor's deflected shape and the line shares under the idealisations.
        IReadOnlyList<Figure> figures = [.. PlanPlots.Governing(r), .. PlanFloorPlots.All(r, tributary)];
        (string Name, byte[] Bytes)[] files = [.. texts.Select(f => (f.Name, System.Text.Encoding.UTF8.GetBytes(f.Text))), .. figures.Select(f => (f.FileName, f.Png))];
        if (!CommandSupport.TryWrite(() => AtomicFiles.WriteAll(folder, files), "results", stderr, out var written, out exit)) return exit;
        stderr.Write(ModelWarning.Lines(r.Plan.Warnings));   // plausibility warnings (Model/Plausibility.Plan.cs)
        var text = new System.Text.StringBuilder($"PlaneLateral {ResultFiles.Version}: building in plan, linear static analysis{(seismic is null ? "" : ", modes and seismic forces")}\n\n");
        text.Append(Summary.Plan(r, hand, path));
        if (note is not null) text.Append('\n').Append(note);
        if (detail != Detail.Summary)
        {
            text.Append('\n').Append(PlanReport.Render(r, hand, tributary, path, detail));
            if (seismic is not null) text.Append(PlanSeismicReport.Render(r, seismic));
        }
        else text.Append($"\nCaution: {ResultFiles.Caution}\n");
        text.Append($"\nResults written to {folder}: {written.Count} files (plan-*.csv, plan.json, line-*-*.csv{(figures.Count > 0 ? ", plan-story*.png" : "")}{(r.Diaphragms is null ? "" : ", plan-floor-*.png")})\n");
        stdout.Write(ConsoleText.Fit(text.ToString()));
        return ExitCodes.Success;
    }

    /// <summary>
    /// The report of a building (docs/reports.md): the same run as <see cref="Run"/> (<see cref="PlanRun"/>), rendered by
    /// <see cref="Reports.BuildingReport"/> to report.html, report.md and the figures; the console prints the summary of
    /// <see cref="Run"/> and where the report went.
    /// </summary>
    public static int Report(string path, string? outDir, TextWriter stdout, TextWriter stderr, Detail detail, bool strict = false, ModelSource? source = null)
    {
        if (!CommandSupport.TrySolve(() => source is null ? ModelReader.ReadPlanFile(path) : ModelReader.ReadPlan(source), stderr, out var plan, out int exit)) return exit;
        if (CommandSupport.RefusedAsStrict(strict, plan.Warnings, stderr)) return ExitCodes.BadModel;
        bool solved = CommandSupport.TrySolve(() =>
        {
            var run = PlanRun.Run(plan);   // every result, computed once; the report only reads it
            return (run, Reports.BuildingReport.Build(run, $"PlaneLateral {ResultFiles.Version}"));
        }, stderr, out var built, out exit);
        if (!solved) return exit;
        var (run, doc) = built;
        string folder = outDir ?? CommandSupport.DefaultFolder(path, "report");
        if (!CommandSupport.TryWrite(() => OutputSet.WriteAll(folder, Reports.BuildingReport.Render(doc)), "report", stderr, out var written, out exit))
            return exit;
        stderr.Write(ModelWarning.Lines(run.Result.Plan.Warnings));
        var text = new System.Text.StringBuilder($"PlaneLateral {ResultFiles.Version}: report of a building in plan\n\n");
        text.Append(Summary.Plan(run.Result, run.Hand, path));
        if (detail != Detail.Summary) text.Append($"\n{doc.Title}\n{doc.Tables.Count()} tables, {doc.Figures.Count()} figures.\n");
        text.Append($"\nCaution: {Reports.BuildingReport.Caution}\n");
        text.Append($"\nReport written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        stdout.Write(ConsoleText.Fit(text.ToString()));
        return ExitCodes.Success;
    }

    public static int Validate(string path, TextWriter stdout, TextWriter stderr, bool strict = false)
    {
        try
        {
            var p = ModelReader.ReadPlanFile(path);
            if (CommandSupport.RefusedAsStrict(strict, p.Warnings, stderr, written: false)) return ExitCodes.BadModel;
            stdout.Write($"{path}: valid building in plan. {p.FloorCount} floors, {p.Lines.Count} lines, {p.Cases.Count} load cases, units {p.Units}.\n");
            stderr.Write(ModelWarning.Lines(p.Warnings));
            return ExitCodes.Success;
        }
        catch (ModelInputException e)
        {
            stderr.Write(e.Message + "\n");
            return ExitCodes.BadModel;
        }
    }
}
