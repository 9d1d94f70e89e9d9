using System.CommandLine;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;

namespace PlaneLateral.Cli;

/// <summary>
/// What the model-reading commands share: the model argument, the --out option, the folder the results go to by
/// default, and the two ways reading and solving can end without output (a bad model, a mechanism), each reported the
/// same way with its exit code.
/// </summary>
internal static class CommandSupport
{
    /// <summary>
    /// Marks every argument that names an existing file as an input of this run, so that no output set can replace it
    /// (<see cref="AtomicFiles.ProtectInputs"/>; refused with exit 4). Dispose at the end of the run.
    /// </summary>
    public static IDisposable ProtectInputs(IEnumerable<string> args) => AtomicFiles.ProtectInputs(args);

    public static Argument<string> ModelArgument() =>
        new("model") { Description = "Model file (JSON, format described in docs/model-format.md)." };

    /// <param name="contents">What the folder receives, e.g. "report.html, report.md and the PNG figures".</param>
    /// <param name="subfolder">Folder below planelateral-results/&lt;model name&gt;/ by default, or null for that folder itself.</param>
    public static Option<string?> OutOption(string contents, string? subfolder = null) => new("--out", "-o")
    {
        Description = $"Folder for {contents} (created if missing). Default: planelateral-results/<model name>{(subfolder is null ? "" : "/" + subfolder)} in the current folder.",
    };

    /// <summary>--strict: input warnings refuse the model (solve, validate, compare, report).</summary>
    public static Option<bool> StrictOption() => new("--strict")
    {
        Description = "Treat every warning about the input (e.g. no \"units\" key, so kip and inch are assumed) as a problem: the model is refused with exit 2 and nothing is written.",
    };

    /// <summary>
    /// Under --strict, a model read with warnings is refused: each warning is listed as a problem, with its place in the
    /// file and its fix, as a bad model's problems are, and true is returned (exit 2). Without --strict, or without
    /// warnings, nothing is written and false is returned.
    /// </summary>
    /// <param name="written">True when the command would have written files ("Nothing was written." follows).</param>
    public static bool RefusedAsStrict(bool strict, IReadOnlyList<ModelWarning> warnings, TextWriter stderr, bool written = true)
    {
        if (!strict || warnings.Count == 0) return false;
        var problems = warnings.Select(w => new ModelDiagnostic(w.File, w.Line, w.Column, w.JsonPath, w.Problem, w.Fix));
        stderr.Write($"The model has {warnings.Count} warning{(warnings.Count == 1 ? "" : "s")}, refused under --strict (each counts as a problem):\n" +
            string.Concat(problems.Select(d => "  " + d + "\n")) + (written ? "Nothing was written.\n" : ""));
        return true;
    }

    /// <summary>planelateral-results/&lt;model name&gt;[/subfolder] below the current folder.</summary>
    public static string DefaultFolder(string modelPath, string? subfolder = null)
    {
        string f = Path.Combine(Directory.GetCurrentDirectory(), "planelateral-results", Path.GetFileNameWithoutExtension(modelPath));
        return subfolder is null ? f : Path.Combine(f, subfolder);
    }

    /// <summary>
    /// Runs a command's reading and solving step. A bad model (exit 2) or a mechanism (exit 3) is written to
    /// <paramref name="stderr"/> with "Nothing was written." and false is returned with the exit code.
    /// </summary>
    public static bool TrySolve<T>(Func<T> work, TextWriter stderr, out T value, out int exitCode)
    {
        try
        {
            value = work();
            exitCode = ExitCodes.Success;
            return true;
        }
        catch (ModelInputException e)
        {
            stderr.Write(e.Message + "\nNothing was written.\n");
            exitCode = ExitCodes.BadModel;
        }
        catch (UnstableModelException e)
        {
            stderr.Write(e.Message + "\nNothing was written.\n");
            exitCode = ExitCodes.Unstable;
        }
        value = default!;
        return false;
    }

    /// <summary>
    /// Writes the files atomically (<see cref="AtomicFiles"/>); an unwritable folder is reported (exit 4) saying that no
    /// <paramref name="kind"/> file was replaced.
    /// </summary>
    public static bool TryWrite(Func<IReadOnlyList<string>> write, string kind, TextWriter stderr, out IReadOnlyList<string> written, out int exitCode)
    {
        try
        {
            written = write();
            exitCode = ExitCodes.Success;
            return true;
        }
        catch (OutputOverwritesInputException e)
        {
            stderr.Write($"{e.Message}\nFix: give --out a folder of its own (not the model's folder when a results file has the model's name). No {kind} file was written or replaced.\n");
            written = [];
            exitCode = ExitCodes.OutputFailed;
            return false;
        }
        catch (IOException e)
        {
            stderr.Write($"{e.Message}\nFix: choose a writable folder with --out. No {kind} file was written or replaced.\n");
            written = [];
            exitCode = ExitCodes.OutputFailed;
            return false;
        }
    }
}
