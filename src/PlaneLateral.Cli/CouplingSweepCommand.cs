using System.CommandLine;
using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Reports;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>
/// The "coupling-sweep" command: a coupled-wall check worked out over a range of coupling-beam depths, every model
/// side by side (closed form, both bounds, wide-column frame with and without shear deformation, plane-stress panel),
/// written as CSV with one top-deflection figure per load (PNG).
/// </summary>
internal static class CouplingSweepCommand
{
    public static Command Build(TextWriter stdout, TextWriter stderr)
    {
        var modelArg = new Argument<string>("model") { Description = "Model file (JSON) with at least one \"coupled-wall\" check (docs/coupled-walls.md)." };
        var checkOption = new Option<string?>("--check") { Description = "Id of the coupled-wall check to sweep. Default: the first one." };
        var depthsOption = new Option<string?>("--depths")
        {
            Description = "Beam depths in the model's length unit, comma-separated, each between 0 and the story height. Default: 12 depths from 5% to 90% of the story height.",
        };
        var outOption = new Option<string?>("--out", "-o")
        {
            Description = "Folder for coupling-sweep.csv and the figures coupling-sweep-uniform.png, coupling-sweep-top.png (created if missing). Default: planelateral-results/<model name> in the current folder.",
        };
        var cmd = new Command("coupling-sweep", "Work out a coupled-wall check over a range of coupling-beam depths and write how the hand methods and the FE models part (coupling-sweep.csv, one PNG per load).")
        {
            modelArg, checkOption, depthsOption, outOption,
        };
        cmd.SetAction(p => Run(p.GetValue(modelArg)!, p.GetValue(checkOption), p.GetValue(depthsOption), p.GetValue(outOption), stdout, stderr));
        return cmd;
    }

    private static int Run(string modelPath, string? checkId, string? depthsText, string? outDir, TextWriter stdout, TextWriter stderr)
    {
        StructureModel model;
        try { model = ModelReader.ReadFile(modelPath); }
        catch (ModelInputException e) { stderr.Write(e.Message + "\nNothing was written.\n"); return ExitCodes.BadModel; }
        var walls = model.Comparisons.OfType<CoupledWallCheck>().ToList();
        var check = checkId is null ? walls.FirstOrDefault() : walls.FirstOrDefault(w => w.Id == checkId);
        if (check is null)
        {
            stderr.Write(checkId is null
                ? $"{modelPath}: the model declares no coupled-wall check.\nFix: add a check with \"kind\": \"coupled-wall\" under \"comparisons\" (docs/coupled-walls.md).\nNothing was written.\n"
                : $"{modelPath}: no coupled-wall check \"{checkId}\".\nFix: name one of: {string.Join(", ", walls.Select(w => w.Id))}.\nNothing was written.\n");
            return ExitCodes.BadModel;
        }
        var u = model.Units;
        IReadOnlyList<double> depths = CoupledWallStudy.DefaultDepths(check);
        if (depthsText is not null)
        {
            var list = new List<double>();
            foreach (var part in depthsText.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
            {
                if (!double.TryParse(part, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !(v > 0) || !(u.ToSI(v, Quantity.Length) < check.StoryHeight))
                {
                    stderr.Write($"--depths: '{part}' is not a depth between 0 and the story height ({u.FromSI(check.StoryHeight, Quantity.Length):G6} {u.LengthSymbol}).\nFix: give depths such as 0.3,0.6,0.9 in {u.LengthSymbol}.\nNothing was written.\n");
                    return ExitCodes.Usage;
                }
                list.Add(u.ToSI(v, Quantity.Length));
            }
            if (list.Count == 0) { stderr.Write("--depths is empty.\nFix: give depths such as 0.3,0.6,0.9.\nNothing was written.\n"); return ExitCodes.Usage; }
            depths = list;
        }
        var files = new List<(string Name, byte[] Bytes)>();
        var figures = new List<(string Name, byte[] Bytes)>();
        var sweeps = new List<(CoupledWallLoad Load, IReadOnlyList<CoupledWallStudy.SweepPoint> Points)>();
        try
        {
            foreach (var (load, mag) in CoupledWallStudy.Loads(check))
            {
                var pts = CoupledWallStudy.OverBeamDepth(check, depths, load, mag, model.SourcePath, u);
                var figure = CouplingSweepFigures.Deflection(check, load, pts, u);
                figures.Add((figure.FileName, figure.Png));
                sweeps.Add((load, pts));
            }
        }
        catch (UnstableModelException e) { stderr.Write(e.Message + "\nNothing was written.\n"); return ExitCodes.Unstable; }
        files.Add(OutputSet.Text("coupling-sweep.csv", CoupledWallStudy.SweepTable(check, sweeps, u).ToCsv()));
        files.AddRange(figures);
        string folder = outDir ?? Path.Combine(Directory.GetCurrentDirectory(), "planelateral-results", Path.GetFileNameWithoutExtension(modelPath));
        try { OutputSet.WriteAll(folder, files); }
        catch (IOException e) { stderr.Write($"{e.Message}\nFix: choose a writable folder with --out. No file was replaced.\n"); return ExitCodes.OutputFailed; }
        stdout.Write($"PlaneLateral {ResultFiles.Version}: coupled wall \"{check.Id}\" over {depths.Count} beam depths\n");
        stdout.Write($"Sweep written to {folder}: {string.Join(", ", files.Select(f => f.Name))}\nCaution: {ComparisonReport.Caution}\n");
        return ExitCodes.Success;
    }
}
