using System.Globalization;
using System.CommandLine;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Reports;
using PlaneLateral.Studies;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>How much a command prints: the summary alone, the summary and the main tables, or every table.</summary>
internal enum Detail { Summary, Normal, Full }

/// <summary>
/// The answers first: the few lines every command prints before its tables (at most <see cref="MaxLines"/> lines of at
/// most <see cref="TextTable.Width"/> columns): the model, the solution checks, the governing drift and where, the worst
/// hand-against-FE gap with its verdict and reference, irregularities, warnings, and what solver ran. Reads results only.
/// </summary>
internal static class Summary
{
    public const int MaxLines = 15;

    /// <summary>Largest equilibrium imbalance and backward error the summary calls a passed check (see <see cref="RunSummary"/>).</summary>
    public const double ImbalanceLimit = RunSummary.ImbalanceLimit, BackwardErrorLimit = RunSummary.BackwardErrorLimit;

    public static Option<string?> DetailOption() => new("--detail")
    {
        Description = "How much to print: summary (the answers only), normal (the answers and the main tables; default) or full (every table). All tables always go to the files.",
    };

    /// <summary>Reads the --detail value; an unknown level is refused with a message naming the three.</summary>
    public static bool TryDetail(string? text, out Detail detail, out string error)
    {
        error = "";
        detail = Detail.Normal;
        switch (text?.Trim().ToLowerInvariant())
        {
            case null or "normal": return true;
            case "summary": detail = Detail.Summary; return true;
            case "full": detail = Detail.Full; return true;
            default:
                error = $"--detail \"{text}\" is not a detail level. Fix: use --detail summary, --detail normal (the default) or --detail full.";
                return false;
        }
    }

    /// <summary>The summary's rows as console text: a "Summary" heading, each row wrapped to the width, at most <see cref="MaxLines"/> lines.</summary>
    public static string Text(IReadOnlyList<SummaryRow> rows) => Fit(["Summary", .. rows.Select(r => $"  {r.Label,-12}{r.Text}")]);

    public static string Planar(ModelResult run, ComparisonReport? comparisons, string modelPath) => Text(RunSummary.Planar(run, comparisons, modelPath));

    public static string Plan(PlanResult r, IReadOnlyList<PlanSplitStory> hand, string path) => Text(RunSummary.Plan(r, hand, path));

    public static string Compare(ComparisonReport r, string path) => Text(RunSummary.Compare(r, path));

    /// <summary>Each line wrapped to the width (continuing under its text), at most <see cref="MaxLines"/> lines in all.</summary>
    private static string Fit(List<string> lines)
    {
        var text = ConsoleText.Fit(string.Join("\n", lines), TextTable.Width, 14).Split('\n');
        var sb = new StringBuilder();
        foreach (var l in text.Take(MaxLines)) sb.Append(l).Append('\n');
        return sb.ToString();
    }
}
