namespace PlaneLateral.Model;

/// <summary>
/// Something in a model file that reads and solves but is probably not what the engineer meant: a value outside the
/// range of building materials and buildings in the units in force, or a slip such as a wall's thickness and length
/// swapped. Same location as a <see cref="ModelDiagnostic"/> (file, 1-based line and column, 0 when unknown; JSON path).
/// A warning never changes the answer; it is printed, written to results.json and listed in the report
/// (Model/Plausibility.cs; docs/model-format.md, "Plausibility warnings").
/// </summary>
public sealed record ModelWarning(string File, int Line, int Column, string JsonPath, string Problem, string Fix)
{
    /// <summary>"line:col at path: problem. Fix: fix." without the file name (for result files, which must not depend on paths).</summary>
    public string Text
    {
        get
        {
            string where = Line > 0 ? $"line {Line}, column {Column}" : "";
            string path = string.IsNullOrEmpty(JsonPath) ? "" : (where.Length > 0 ? $", at {JsonPath}" : $"at {JsonPath}");
            string fix = string.IsNullOrEmpty(Fix) ? "" : $" Fix: {Fix.TrimEnd('.')}.";
            return $"{where}{path}: {Problem.TrimEnd('.')}.{fix}";
        }
    }

    /// <summary>"file:line:col: at path: warning: problem. Fix: fix." on one line, as a compiler prints it.</summary>
    public override string ToString()
    {
        string where = Line > 0 ? $"{File}:{Line}:{Column}" : File;
        string path = string.IsNullOrEmpty(JsonPath) ? "" : $" at {JsonPath}";
        string fix = string.IsNullOrEmpty(Fix) ? "" : $" Fix: {Fix.TrimEnd('.')}.";
        return $"{where}:{path}: warning: {Problem.TrimEnd('.')}.{fix}";
    }

    /// <summary>The warnings as lines for a screen ("" when there are none), each ending in a newline.</summary>
    public static string Lines(IReadOnlyList<ModelWarning> warnings) =>
        warnings.Count == 0 ? "" :
        $"The model has {warnings.Count} warning{(warnings.Count == 1 ? "" : "s")} (the answer is as the file says; check these):\n" +
        string.Concat(warnings.Select(w => "  " + w + "\n"));
}
