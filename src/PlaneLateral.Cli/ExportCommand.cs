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
        var modelArg = CommandSupport.ModelArgument();
        var outOption = CommandSupport.OutOption("the matrix files", "matrices");
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
        if (!CommandSupport.TrySolve(() => MatrixExportFiles.Render(LinearStaticAnalysis.Run(ModelReader.ReadFile(modelPath))), stderr, out var files, out int exit))
            return exit;
        string folder = outDir ?? CommandSupport.DefaultFolder(modelPath, "matrices");
        if (!CommandSupport.TryWrite(() => AtomicFiles.WriteAll(folder, files), "matrix", stderr, out var written, out exit))
            return exit;
        stdout.Write($"PlaneLateral {ResultFiles.Version}: assembled systems in Matrix Market format, SI units (N, m, rad).\n");
        stdout.Write($"Written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        return ExitCodes.Success;
    }
}
