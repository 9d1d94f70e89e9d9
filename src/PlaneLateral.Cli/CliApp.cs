using System.CommandLine;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;

namespace PlaneLateral.Cli;

/// <summary>The command line: wires the library's steps together and prints; no engineering happens here.</summary>
public static class CliApp
{
    /// <summary>Path of the demo model shipped beside the program.</summary>
    public static string DemoModelPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json");

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        // Options are read and every text and file written in the invariant culture whatever the host's culture (the tool
        // is built with invariant globalization; a host that embeds Run may not be): "0.3" is never read as 3 and a file's
        // bytes never carry a decimal comma (Output/CsvConventionTests runs every command under a decimal-comma culture).
        var culture = System.Globalization.CultureInfo.CurrentCulture;
        System.Globalization.CultureInfo.CurrentCulture = System.Globalization.CultureInfo.InvariantCulture;
        try { return RunInvariant(args, stdout, stderr); }
        finally { System.Globalization.CultureInfo.CurrentCulture = culture; }
    }

    private static int RunInvariant(string[] args, TextWriter stdout, TextWriter stderr)
    {
        PhaseTimes.Start();   // off unless PLANELATERAL_PHASES is set
        using var inputs = CommandSupport.ProtectInputs(args);   // no output may replace a file named on the command line
        var root = BuildCommands(stdout, stderr);
        var widthOption = new Option<string?>("--width")
        {
            Description = $"Console width in columns the text and tables are fitted to ({TextTable.MinWidth} to {TextTable.MaxWidth}; default {TextTable.DefaultWidth}, whatever the terminal, so the same run prints the same text). The files are not affected.",
            Recursive = true,
        };
        root.Options.Add(widthOption);
        var parse = root.Parse(args);
        int? width = null;
        if (parse.Errors.Count == 0 && !TextTable.TryWidth(parse.GetValue(widthOption), out width, out string widthError))
        {
            stderr.Write(widthError + "\nNothing was written.\n");
            return ExitCodes.Usage;
        }
        TextTable.UseWidth(width);   // every table and line of prose of this run is fitted to it
        try
        {
            return parse.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // A last resort: a fault of ours, not of the input. Say so plainly, without a stack trace, and write nothing more.
            stderr.Write($"PlaneLateral stopped on an internal error ({e.GetType().Name}: {e.Message}).\n" +
                "This is a fault in the program, not in your model as far as it could tell. Nothing more was written.\n" +
                "Please report it with the model file that caused it.\n");
            return ExitCodes.InternalError;
        }
    }

    private static RootCommand BuildCommands(TextWriter stdout, TextWriter stderr)
    {
        var modelArg = CommandSupport.ModelArgument();
        var outOption = CommandSupport.OutOption("the results files");

        var detailOption = Summary.DetailOption();
        var strictOption = CommandSupport.StrictOption();
        var solve = new Command("solve", "Solve every load case and combination of a model; print a summary and write results (JSON and CSV).")
        {
            modelArg, outOption, detailOption, strictOption,
        };
        solve.SetAction(p => Solve(p.GetValue(modelArg)!, p.GetValue(outOption), p.GetValue(detailOption), p.GetValue(strictOption), stdout, stderr));

        var validateArg = new Argument<string>("model") { Description = "Model file to check." };
        var validateStrict = CommandSupport.StrictOption();
        var validate = new Command("validate", "Read and check a model file without solving it; list every problem found.") { validateArg, validateStrict };
        validate.SetAction(p => Validate(p.GetValue(validateArg)!, p.GetValue(validateStrict), stdout, stderr));

        var root = new RootCommand(
            "PlaneLateral: lateral stiffness, load sharing and drift of walls and frames by shear-deformable finite elements, " +
            "beside the hand methods. Run with no command to solve the shipped demo model and print its hand-method comparison.")
        {
            solve, validate, CompareCommand.Build(stdout, stderr), CouplingSweepCommand.Build(stdout, stderr), SweepCommand.Build(stdout, stderr), ReportCommand.Build(stdout, stderr),
            ExportCommand.Build(stdout, stderr),
        };
        var rootDetail = Summary.DetailOption();
        root.Options.Add(rootDetail);
        root.SetAction(p =>
        {
            if (!Summary.TryDetail(p.GetValue(rootDetail), out var detail, out string error)) { stderr.Write(error + "\n"); return ExitCodes.Usage; }
            return PlanSolve.RunDemo(stdout, stderr, detail);
        });
        return root;
    }

    private static int Solve(string modelPath, string? outDir, string? detailText, bool strict, TextWriter stdout, TextWriter stderr, bool withComparisons = false)
    {
        if (!Summary.TryDetail(detailText, out var detail, out string error))
        {
            stderr.Write(error + "\nNothing was written.\n");
            return ExitCodes.Usage;
        }
        PhaseTimes.Mark("command line");
        // The file is read, hashed and parsed once, whichever kind it is (a planar model or a building in plan).
        if (!CommandSupport.TrySolve(() => ModelReader.ReadSource(modelPath), stderr, out var source, out int exit)) return exit;
        PhaseTimes.Mark("read, hash, JSON tree");
        if (source.IsPlan) return PlanSolve.Run(modelPath, outDir, stdout, stderr, detail, strict: strict, source: source);   // a building in plan (docs/plan.md)
        if (!TryReadModel(source, stderr, out var model, out exit)) return exit;
        if (CommandSupport.RefusedAsStrict(strict, model.Warnings, stderr)) return ExitCodes.BadModel;
        PhaseTimes.Mark("model from the tree");
        bool solved = CommandSupport.TrySolve(() =>
        {
            var run = ModelRun.Run(model);   // every result, computed once; what follows only reads it
            var comparisons = withComparisons && model.Comparisons.Count > 0 ? ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run) : null;
            return (run, comparisons);
        }, stderr, out var solution, out exit);
        if (!solved) return exit;
        var (result, comparisons) = solution;
        PhaseTimes.Mark("analysis");

        string folder = outDir ?? CommandSupport.DefaultFolder(modelPath);
        bool wrote = CommandSupport.TryWrite(() =>
        {
            var files = ResultFiles.Files(result).ToList();
            if (comparisons is not null) files.AddRange(ComparisonFiles.Render(comparisons, $"PlaneLateral {ResultFiles.Version}").Select(f => OutputFile.Text(f.Name, f.Text)));
            return AtomicFiles.WriteAll(folder, files);
        }, "results", stderr, out var written, out exit);
        if (!wrote) return exit;
        PhaseTimes.Mark("results files");

        stderr.Write(ModelWarning.Lines(result.Model.Warnings));   // plausibility warnings (Model/Plausibility.cs)
        var text = new System.Text.StringBuilder($"PlaneLateral {ResultFiles.Version}: linear static analysis\n\n");
        text.Append(Summary.Planar(result, comparisons, modelPath));
        if (detail != Detail.Summary)
        {
            text.Append('\n').Append(SolveReport.Render(result, modelPath, detail));
            if (comparisons is not null) text.Append('\n').Append(CompareReport.Render(comparisons));
        }
        else text.Append($"\nCaution: {ResultFiles.Caution}\n");
        text.Append($"\nResults written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        stdout.Write(ConsoleText.Fit(text.ToString()));
        PhaseTimes.Mark("console summary");
        return ExitCodes.Success;
    }

    private static int Validate(string modelPath, bool strict, TextWriter stdout, TextWriter stderr)
    {
        if (ModelReader.IsPlanFile(modelPath)) return PlanSolve.Validate(modelPath, stdout, stderr, strict);
        try
        {
            var m = ModelReader.ReadFile(modelPath);
            if (CommandSupport.RefusedAsStrict(strict, m.Warnings, stderr, written: false)) return ExitCodes.BadModel;
            stdout.Write($"{modelPath}: valid. {m.Nodes.Count} nodes, {m.Members.Count} members, {m.Supports.Count} supports, {m.LoadCases.Count} load cases, {m.Combinations.Count} combinations, {m.Comparisons.Count} comparison checks, units {m.Units}.\n");
            stderr.Write(ModelWarning.Lines(m.Warnings));
            return ExitCodes.Success;
        }
        catch (ModelInputException e)
        {
            stderr.Write(e.Message + "\n");
            return ExitCodes.BadModel;
        }
    }

    /// <summary>
    /// The planar model read from <paramref name="source"/>'s tree. Its own method, so that no closure of the caller holds
    /// the source: the tree is garbage once the model is built, instead of being kept (and marked and moved by every
    /// collection) through the analysis and the writing of the files.
    /// </summary>
    private static bool TryReadModel(ModelSource source, TextWriter stderr, out StructureModel model, out int exit) =>
        CommandSupport.TrySolve(() => ModelReader.Read(source), stderr, out model, out exit);
}
