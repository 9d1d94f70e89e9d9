using System.CommandLine;
using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;

namespace PlaneLateral.Cli;

/// <summary>The "compare" command: every hand-method number beside its FE number, with the gap and the reason.</summary>
internal static class CompareCommand
{
    public static Command Build(TextWriter stdout, TextWriter stderr)
    {
        var modelArg = new Argument<string>("model") { Description = "Model file (JSON) with a \"comparisons\" list (docs/comparisons.md)." };
        var outOption = CommandSupport.OutOption("comparisons.json and comparisons.csv");
        var tolOption = new Option<string?>("--tolerance")
        {
            Description = "Band on FE/hand − 1 for checks that set none of their own, as a fraction (0.10) or a percentage (10%). Default 0.10.",
        };
        var detailOption = Summary.DetailOption();
        var strictOption = CommandSupport.StrictOption();
        var cmd = new Command("compare", "Set each hand-method number beside the finite-element number for the model's comparison checks, with the gap and its likely cause; print a table and write comparisons.json and comparisons.csv.")
        {
            modelArg, outOption, tolOption, detailOption, strictOption,
        };
        cmd.SetAction(p => Run(p.GetValue(modelArg)!, p.GetValue(outOption), p.GetValue(tolOption), p.GetValue(detailOption), p.GetValue(strictOption), stdout, stderr));
        return cmd;
    }

    internal static bool TryTolerance(string? text, out double tol, out string error)
    {
        tol = ComparisonStudy.DefaultTolerance;
        error = "";
        if (text is null) return true;
        string s = text.Trim();
        bool percent = s.EndsWith('%');
        if (percent) s = s[..^1];
        if (!double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
        {
            error = $"--tolerance '{text}' is not a number. Fix: give a fraction such as 0.10 or a percentage such as 10%.";
            return false;
        }
        if (percent) v /= 100;
        if (!(v > 0 && v < 1))
        {
            error = $"--tolerance '{text}' is outside (0, 1). Fix: give a fraction such as 0.10 (±10%) or a percentage such as 10%.";
            return false;
        }
        tol = v;
        return true;
    }

    private static int Run(string modelPath, string? outDir, string? tolText, string? detailText, bool strict, TextWriter stdout, TextWriter stderr)
    {
        if (!TryTolerance(tolText, out double tol, out string error) || !Summary.TryDetail(detailText, out var detail, out error))
        {
            stderr.Write(error + "\nNothing was written.\n");
            return ExitCodes.Usage;
        }
        if (!CommandSupport.TrySolve(() => ModelReader.ReadFile(modelPath), stderr, out var model, out int exit)) return exit;
        if (CommandSupport.RefusedAsStrict(strict, model.Warnings, stderr)) return ExitCodes.BadModel;
        stderr.Write(ModelWarning.Lines(model.Warnings));
        if (model.Comparisons.Count == 0)
        {
            stderr.Write($"{modelPath}: the model declares no comparison checks.\nFix: add \"comparisons\": [...] (see docs/comparisons.md), or run 'planelateral solve {modelPath}'.\nNothing was written.\n");
            return ExitCodes.BadModel;
        }
        if (!CommandSupport.TrySolve(() => ComparisonStudy.Run(model, tol), stderr, out var report, out exit)) return exit;
        string folder = outDir ?? CommandSupport.DefaultFolder(modelPath);
        if (!CommandSupport.TryWrite(() => AtomicFiles.WriteAll(folder, ComparisonFiles.Render(report, $"PlaneLateral {ResultFiles.Version}")), "comparison", stderr, out var written, out exit))
            return exit;
        var text = new StringBuilder($"PlaneLateral {ResultFiles.Version}: hand methods beside the finite-element model\n\n");
        text.Append(Summary.Compare(report, modelPath));
        if (detail != Detail.Summary) text.Append($"\nFile      {modelPath}\n\n").Append(CompareReport.Render(report));
        else text.Append($"\nCaution: {ComparisonReport.Caution}\n");
        text.Append($"\nComparisons written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        stdout.Write(ConsoleText.Fit(text.ToString()));
        return ExitCodes.Success;
    }
}

/// <summary>The comparison table the CLI prints.</summary>
internal static class CompareReport
{
    public static string Render(ComparisonReport r)
    {
        var sb = new StringBuilder();
        sb.Append($"Hand methods beside the FE model (default tolerance ±{Pct(r.DefaultTolerance)}; ratio = FE/hand for each row's reference FE model, the verdict's basis)\n");
        var t = new TextTable("check", "subject", "hand method", "unit", "hand", "reference FE model", "FE", "FE/hand", "beside it", "FE", "FE/hand", "flex/shear (hand)", "h/l", "verdict", "cause").Numeric(4, 6, 7, 9, 10, 12);
        int n = 0;
        var notes = new List<string>();
        foreach (var row in r.Rows)
        {
            n++;
            string shares = row.Hand.FlexuralShare is double fl && row.Hand.ShearShare is double sh ? $"{Pct(fl)} / {Pct(sh)}" : "-";
            var beside = row.Beside;
            t.Add(row.CheckId, row.Subject, Short(row.Hand.Method.Name), row.Unit, TextTable.Num(row.Hand.Value), ShortModel(row.Reference.Model), TextTable.Num(row.Reference.Value),
                row.Ratio.ToString("0.000", CultureInfo.InvariantCulture),
                beside is null ? "-" : ShortModel(beside.Model), beside is null ? "-" : TextTable.Num(beside.Value),
                beside is null ? "-" : (beside.Value / row.Hand.Value).ToString("0.000", CultureInfo.InvariantCulture), shares,
                row.AspectRatio is double a ? a.ToString("0.00", CultureInfo.InvariantCulture) : "-",
                row.Tolerance == r.DefaultTolerance ? row.VerdictText : $"{row.VerdictText} (±{Pct(row.Tolerance)})", $"[{n}]");
            notes.Add($"  [{n}] {row.Cause}");
            if (row.ReferenceBasis.Length > 0) notes.Add($"      reference: {row.ReferenceBasis}");
            foreach (var other in row.Fe.Skip(1))
                notes.Add($"      also: {other.Model}: {TextTable.Num(other.Value)} {row.Unit}, FE/hand {(other.Value / row.Hand.Value).ToString("0.000", CultureInfo.InvariantCulture)}{(other.EstimatedError is double e ? $" (estimated discretisation error {(100 * e).ToString("0.000", CultureInfo.InvariantCulture)}%)" : "")}");
        }
        sb.Append(t.Render());
        sb.Append("\nCauses\n");
        foreach (var line in notes) sb.Append(line).Append('\n');
        sb.Append("  Hand methods, sources and assumptions for every row are in comparisons.json.\n");
        sb.Append($"\nCaution: {ComparisonReport.Caution}\n");
        return sb.ToString();
    }

    private static string Pct(double f) => (100 * f).ToString("0.#", CultureInfo.InvariantCulture) + "%";

    /// <summary>An FE model's name for the table, whole (a long one moves to a lettered note when the table is fitted).</summary>
    private static string ShortModel(string name) => name;

    /// <summary>The method's name up to its first comma, for the table (the full name is in the JSON); never cut mid-word.</summary>
    private static string Short(string name)
    {
        int i = name.IndexOf(", ", StringComparison.Ordinal);
        return i > 0 ? name[..i] : name;
    }
}
