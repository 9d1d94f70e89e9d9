using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// Works out every comparison check of a model: the hand method on one side, the finite-element model on the other,
/// and a verdict with its cause. The rules that choose the cause are listed in docs/comparisons.md.
/// </summary>
public static class ComparisonStudy
{
    /// <summary>The default band on FE/hand − 1: ±10%.</summary>
    public const double DefaultTolerance = 0.10;

    /// <summary>
    /// Runs every check of <paramref name="model"/> on its own: the whole model's static analysis is solved at most once,
    /// and only when a check reads it (a shear split); it and every sub-model a check builds are solved with one run's
    /// options (<see cref="AnalysisOptions.ForRun"/>: the solver in <paramref name="options"/>, the default when none), so a
    /// matrix met twice is factorised once.
    /// </summary>
    /// <param name="model">A model read by <see cref="ModelReader"/>.</param>
    /// <param name="defaultTolerance">Band used by checks that give no "tolerance" of their own.</param>
    /// <param name="options">The analysis options (the user's solver); null for the default solver.</param>
    /// <exception cref="ModelInputException">A check cannot be worked out (e.g. its levels do not match); names the check's place in the file.</exception>
    public static ComparisonReport Run(StructureModel model, double defaultTolerance = DefaultTolerance, AnalysisOptions? options = null)
    {
        options = AnalysisOptions.ForRun(options);
        return Run(model, defaultTolerance, null, options);
    }

    /// <summary>
    /// Runs every check of <paramref name="model"/> on what <paramref name="run"/> computed: the whole model's static
    /// results are read from it (never solved again), and every sub-model a check builds is solved with the run's options
    /// (<see cref="ModelResult.Options"/>: the user's solver, through the run's factor-once solver, so a matrix the run
    /// already factorised is not factorised again).
    /// </summary>
    /// <param name="model">The model as read (the run's <see cref="ModelResult.Model"/> carries generated cases besides).</param>
    /// <param name="run">The model's run (<see cref="ModelRun.Run"/>).</param>
    /// <exception cref="ModelInputException">A check cannot be worked out; names the check's place in the file.</exception>
    public static ComparisonReport Run(StructureModel model, double defaultTolerance, ModelResult run)
    {
        ArgumentNullException.ThrowIfNull(run);
        return Run(model, defaultTolerance, run.Analysis, run.Options);
    }

    private static ComparisonReport Run(StructureModel model, double defaultTolerance, AnalysisResult? full, AnalysisOptions options)
    {
        options = AnalysisOptions.ForRun(options);
        if (!(defaultTolerance > 0 && defaultTolerance < 1))
            throw new ArgumentOutOfRangeException(nameof(defaultTolerance), "The tolerance must be a fraction between 0 and 1, e.g. 0.10.");
        var rows = new List<ComparisonRow>();
        foreach (var check in model.Comparisons)
        {
            double tol = check.Tolerance ?? defaultTolerance;
            try
            {
                rows.AddRange(check switch
                {
                    WallLineCheck w => WallLineStudy.Rows(model, w, tol, options),
                    PerforatedWallCheck p => PerforatedWallStudy.Rows(model, p, tol, options),
                    FrameStoriesCheck fr => FrameStoryStudy.Rows(model, fr, tol, options),
                    ShearSplitCheck s => ShearSplitStudy.Rows(model, s, tol, full ??= LinearStaticAnalysis.Run(model, options), options),
                    CoupledWallCheck cw => CoupledWallStudy.Rows(model, cw, tol, options),
                    PanelWallCheck pw => PanelWallStudy.Rows(model, pw, tol, options),
                    FootingWallCheck fw => FootingWallStudy.Rows(model, fw, tol, options),
                    _ => throw new InvalidOperationException($"unknown check type {check.GetType().Name}"),
                });
            }
            catch (UnstableModelException e) when (check is not ShearSplitCheck)
            {
                throw Problem(check, $"the check's FE sub-model (its members alone, with the supports the check implies) is unstable: {e.Message.Split('\n')[0]}",
                    "list every member the wall or frame needs to stand on its own supports (e.g. all columns and beams of the frame)");
            }
            catch (ArgumentException e)
            {
                throw Problem(check, $"the hand method cannot take this check's inputs: {e.Message}", "check the sizes and properties of the members or wall the check names");
            }
        }
        return new ComparisonReport
        {
            ModelTitle = model.Title,
            ModelFile = Path.GetFileName(model.SourcePath),
            ForceUnit = model.Units.ForceSymbol,
            LengthUnit = model.Units.LengthSymbol,
            DefaultTolerance = defaultTolerance,
            Rows = rows,
        };
    }

    /// <summary>An input problem found while working out a check, placed at the check in the file.</summary>
    internal static ModelInputException Problem(ComparisonCheck c, string problem, string fix) =>
        new([new ModelDiagnostic(c.At.File, c.At.Line, c.At.Column, c.At.JsonPath, $"comparison check \"{c.Id}\": {problem}", fix)]);

    internal static double Stiffness(UnitSystem u, double si) => u.FromSI(si, Quantity.TranslationalStiffness);

    internal static string StiffnessUnit(UnitSystem u) => u.Label(Quantity.TranslationalStiffness);

    /// <summary>The stiffness at the stiffness point of a sub-model: 1/Δ under a unit force, solved with the run's options.</summary>
    internal static double SolveStiffness(StructureModel m, AnalysisOptions options) => LinearStaticAnalysis.Run(m, options).Stiffness[0].Stiffness;

    internal static string Pct(double fraction) => (100 * fraction).ToString("0.#", System.Globalization.CultureInfo.InvariantCulture) + "%";

    internal static string G4(double v) => v.ToString("G4", System.Globalization.CultureInfo.InvariantCulture);
}
