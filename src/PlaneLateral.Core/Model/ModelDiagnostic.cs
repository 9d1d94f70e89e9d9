namespace PlaneLateral.Model;

/// <summary>
/// One problem found in a model file: where it is (file, line, column, JSON path), what is wrong, and how to fix it.
/// Line and column are 1-based; 0 when unknown.
/// </summary>
public sealed record ModelDiagnostic(string File, int Line, int Column, string JsonPath, string Problem, string Fix)
{
    /// <summary>"file:line:col: at path: problem. Fix: fix." on one line.</summary>
    public override string ToString()
    {
        string where = Line > 0 ? $"{File}:{Line}:{Column}" : File;
        string path = string.IsNullOrEmpty(JsonPath) ? "" : $" at {JsonPath}";
        string fix = string.IsNullOrEmpty(Fix) ? "" : $" Fix: {Fix.TrimEnd('.')}.";
        return $"{where}:{path}: {Problem.TrimEnd('.')}.{fix}";
    }
}

/// <summary>A model file that cannot be used, with every problem found in it.</summary>
public sealed class ModelInputException : Exception
{
    public ModelInputException(IReadOnlyList<ModelDiagnostic> diagnostics)
        : base(Summarise(diagnostics)) => Diagnostics = diagnostics;

    public IReadOnlyList<ModelDiagnostic> Diagnostics { get; }

    private static string Summarise(IReadOnlyList<ModelDiagnostic> d) =>
        $"The model has {d.Count} problem{(d.Count == 1 ? "" : "s")}:" + Environment.NewLine +
        string.Join(Environment.NewLine, d.Select(x => "  " + x));
}
