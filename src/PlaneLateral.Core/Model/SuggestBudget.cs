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

    /// <summary>" (did you mean \"x\"?)" for an id or key near one of <paramref name="known"/> (same but for case, or a typo or two away), else "".</summary>
    internal static string Suggest(string id, IEnumerable<string> known)
    {
        // Same id but for case, or a typo or two away (one for short ids); never every short id.
        int allowed = id.Length >= 5 ? 2 : 1;
        // Bounded work (SuggestBudget): long ids are not compared; an edit distance is at least the difference in length.
        var candidates = known as ICollection<string> ?? known.ToList();
        if (id.Length > SuggestBudget.MaxIdLength || !SuggestBudget.Spend(candidates.Count)) return "";
        var near = candidates.Where(k => string.Equals(k, id, StringComparison.OrdinalIgnoreCase)).ToList();
        if (near.Count == 0) near = candidates.Where(k => k.Length <= SuggestBudget.MaxIdLength && Math.Abs(k.Length - id.Length) <= allowed && SuggestBudget.Spend(2L * (k.Length + 1) * (id.Length + 1))
            && Distance(k, id) <= allowed && Distance(k, id) < Math.Min(k.Length, id.Length)).Take(3).ToList();
        return near.Count == 0 ? "" : $" (did you mean {string.Join(" or ", near.Select(n => $"\"{n}\""))}?)";
    }

    private static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (int j = 0; j <= b.Length; j++) d[0, j] = j;
        for (int i = 1; i <= a.Length; i++)
            for (int j = 1; j <= b.Length; j++)
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
        return d[a.Length, b.Length];
    }
}
