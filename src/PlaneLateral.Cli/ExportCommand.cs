using System.CommandLine;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;

namespace PlaneLateral.Cli;

/// <summary>
/// The "export-matrices" command: the assembled stiffness and load vectors of the frame model and of each wall panel,
/// in Matrix Market format with an equation index, so that anyone can check them with another tool (docs/export.md).
/// Core builds the matrices; this command only writes them.
/// </summary>
internal static class ExportCommand
{
    public static Command Build(TextWriter stdout, TextWriter stderr)
    {
        var modelArg = new Argument<string>("model") { Description = "Model file (JSON, format described in docs/model-format.md)." };
        var outOption = new Option<string?>("--out", "-o")
        {
            Description = "Folder for the matrix files (created if missing). Default: planelateral-results/<model name>/matrices in the current folder.",
        };
        var cmd = new Command("export-matrices",
            "Write the assembled stiffness K (Matrix Market, coordinate real symmetric, lower triangle), the load vectors (one column per load case) and an equation index (CSV) of the frame model and of each wall panel; SI units.")
        {
            modelArg, outOption,
        };
        cmd.SetAction(p => Run(p.GetValue(modelArg)!, p.GetValue(outOption), stdout, stderr));
        return cmd;
    }

    private static int Run(string modelPath, string? outDir, TextWriter stdout, TextWriter stderr)
    {
        IReadOnlyList<(string Name, string Text)> files;
        try
        {
            var model = ModelReader.ReadFile(modelPath);
            files = MatrixExportFiles.Render(LinearStaticAnalysis.Run(model));
        }
        catch (ModelInputException e)
        {
            stderr.Write(e.Message + "\nNothing was written.\n");
            return ExitCodes.BadModel;
        }
        catch (UnstableModelException e)
        {
            stderr.Write(e.Message + "\nNothing was written.\n");
            return ExitCodes.Unstable;
        }

        string folder = outDir ?? Path.Combine(Directory.GetCurrentDirectory(), "planelateral-results", Path.GetFileNameWithoutExtension(modelPath), "matrices");
        IReadOnlyList<string> written;
        try
        {
            written = AtomicFiles.WriteAll(folder, files);
        }
        catch (IOException e)
        {
            stderr.Write($"{e.Message}\nFix: choose a writable folder with --out. No matrix file was written or replaced.\n");
            return ExitCodes.OutputFailed;
        }
        stdout.Write($"PlaneLateral {ResultFiles.Version}: assembled systems in Matrix Market format, SI units (N, m, rad).\n");
        stdout.Write($"Written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        return ExitCodes.Success;
    }
}
