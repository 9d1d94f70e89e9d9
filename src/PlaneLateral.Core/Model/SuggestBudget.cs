namespace PlaneLateral.Model;

/// <summary>
/// Bounds the work spent on "did you mean" suggestions for one file. Each suggestion compares the unknown id with every
/// known one by edit distance (cost: the product of the two lengths), so a file with very long ids, or thousands of unknown
/// references against thousands of ids, could otherwise take minutes and gigabytes (found in hardening: a 120 KB file with
/// one 30 000-character id ran past two minutes). Once the budget is spent, the messages simply carry no suggestion.
/// </summary>
internal static class SuggestBudget
{
    /// <summary>Edit-distance cells (and case-insensitive comparisons) allowed per file: some tens of milliseconds.</summary>
    public const long Cells = 20_000_000;

    /// <summary>Ids longer than this are not compared (no one types a suggestion-worthy id that long).</summary>
    public const int MaxIdLength = 64;

    [ThreadStatic] private static long t_left;

    /// <summary>Starts a file's budget (the reader runs one file on one thread).</summary>
    public static void Reset() => t_left = Cells;

    /// <summary>Takes <paramref name="cells"/> from the budget; false (and the budget spent) when there are not enough left.</summary>
    public static bool Spend(long cells)
    {
        if (t_left < cells) { t_left = 0; return false; }
        t_left -= cells;
        return true;
    }
}
