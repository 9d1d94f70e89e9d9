using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>One story of one case in a drift check. Drifts in m.</summary>
/// <param name="ElasticDrift">δ_e: the story drift from the analysis (m).</param>
/// <param name="AmplifiedDrift">δ = C_d·δ_e / I_e (m), ASCE 7-16 eq. 12.8-15.</param>
/// <param name="Ratio">|δ| / story height.</param>
/// <param name="Allowed">Allowable Δa/h_sx.</param>
/// <param name="Margin">1 − Ratio/Allowed: the fraction of the allowable drift left (negative when exceeded).</param>
public sealed record DriftCheckRow(DriftCheckSpec Check, string CaseId, StoryResult Story, double ElasticDrift, double AmplifiedDrift,
    double Ratio, double Allowed, bool Passes, double Margin);

/// <summary>
/// Amplified story drift against an allowable drift ratio: δ = C_d·δ_e / I_e (ASCE 7-16 eq. 12.8-15), checked as
/// |δ|/h_sx ≤ Δa/h_sx (Δa from ASCE 7-16 Table 12.12-1 when the preset is used). A computed aid: the governing code
/// decides the drift definition (e.g. at which points drift is taken), the limit and the factors.
/// </summary>
public static class DriftCheck
{
    /// <summary>δ = C_d·δ_e / I_e (ASCE 7-16 eq. 12.8-15).</summary>
    public static double Amplified(double elasticDrift, double cd, double ie) => cd * elasticDrift / ie;

    public static IReadOnlyList<DriftCheckRow> Run(AnalysisResult r, IReadOnlyList<CaseStories> stories)
    {
        var rows = new List<DriftCheckRow>();
        foreach (var check in r.Model.Building.DriftChecks)
            foreach (var id in check.Cases)
            {
                var cs = stories.First(s => s.CaseId == id);
                foreach (var s in cs.Stories)
                {
                    double d = Amplified(s.Drift, check.Cd, check.Ie);
                    double ratio = Math.Abs(d) / s.Height;
                    rows.Add(new DriftCheckRow(check, id, s, s.Drift, d, ratio, check.AllowedRatio, ratio <= check.AllowedRatio, 1 - ratio / check.AllowedRatio));
                }
            }
        return rows;
    }
}

/// <summary>One story of one case in the stiffness (soft story) irregularity check.</summary>
/// <param name="Stiffness">Story stiffness (N/m).</param>
/// <param name="RatioToAbove">k / k of the story above (NaN for the top story or when not defined).</param>
/// <param name="RatioToAverageAbove">k / mean k of the three stories above (NaN when fewer than three stories are above).</param>
/// <param name="Soft">Type 1a: ratio to above &lt; 0.70 or to the average &lt; 0.80.</param>
/// <param name="ExtremelySoft">Type 1b: ratio to above &lt; 0.60 or to the average &lt; 0.70.</param>
/// <remarks>On a wind case (<see cref="WindCase"/>) the ratios are given but the seismic irregularity is not applied:
/// Soft and ExtremelySoft are false and the outputs say "wind case: ratios only".</remarks>
public sealed record StiffnessIrregularityRow(string CaseId, StoryResult Story, double Stiffness, double RatioToAbove, double RatioToAverageAbove,
    bool Soft, bool ExtremelySoft)
{
    /// <summary>The case is a wind case (by its id or description, as the plausibility checks read it): Table 12.3-2 is a
    /// seismic irregularity, so it is not applied and the row is not labelled with it.</summary>
    public bool WindCase { get; init; }

    /// <summary>The row's result in words: the Type 1a/1b label on an earthquake or other lateral case, "ratios only" on a wind case.</summary>
    public string Label => WindCase ? "wind case: ratios only (Table 12.3-2 is a seismic check)" : ExtremelySoft ? "extreme soft story (1b)" : Soft ? "soft story (1a)" : "regular";
}

/// <summary>
/// Stiffness–soft story irregularity (ASCE 7-16 Table 12.3-2, Types 1a and 1b): a story whose lateral stiffness is
/// less than 70 % of the story above or less than 80 % of the average of the three stories above (Type 1a); extreme
/// when less than 60 % or 70 % (Type 1b). The stiffness is the story's shear over its drift in the case analysed, so
/// it depends on the load pattern. Where fewer than three stories stand above, the average test is not made.
/// </summary>
public static class StiffnessIrregularity
{
    public const double SoftToAbove = 0.70, SoftToAverage = 0.80, ExtremeToAbove = 0.60, ExtremeToAverage = 0.70;

    /// <param name="stories">The story results of every case.</param>
    /// <param name="isWind">Whether a case id is a wind case; its rows carry the ratios only (no Type 1a/1b flag).</param>
    public static IReadOnlyList<StiffnessIrregularityRow> Run(IReadOnlyList<CaseStories> stories, Func<string, bool>? isWind = null)
    {
        var rows = new List<StiffnessIrregularityRow>();
        foreach (var cs in stories.Where(c => c.Lateral))
        {
            bool wind = isWind?.Invoke(cs.CaseId) == true;
            var k = cs.Stories.Select(s => s.Stiffness).ToList();
            for (int i = 0; i < k.Count; i++)
            {
                double above = i + 1 < k.Count ? k[i] / k[i + 1] : double.NaN;
                double avg = i + 3 < k.Count ? k[i] / ((k[i + 1] + k[i + 2] + k[i + 3]) / 3) : double.NaN;
                // NaN compares false, so a ratio that is not defined never flags.
                bool soft = above < SoftToAbove || avg < SoftToAverage;
                bool extreme = above < ExtremeToAbove || avg < ExtremeToAverage;
                rows.Add(new StiffnessIrregularityRow(cs.CaseId, cs.Stories[i], k[i], above, avg, soft && !wind, extreme && !wind) { WindCase = wind });
            }
        }
        return rows;
    }
}

/// <summary>Everything the building layer adds to an analysis: story results, drift checks, stiffness irregularity.</summary>
public sealed class BuildingResult
{
    public required IReadOnlyList<CaseStories> Cases { get; init; }
    public required IReadOnlyList<DriftCheckRow> DriftChecks { get; init; }
    public required IReadOnlyList<StiffnessIrregularityRow> Irregularity { get; init; }

    /// <summary>True when the model has levels enough for stories (two or more).</summary>
    public bool HasStories => Cases.Any(c => c.Stories.Count > 0);

    /// <summary>Story results of every case, drift checks and irregularity check of a solved model.</summary>
    public static BuildingResult Of(AnalysisResult r)
    {
        var cases = StoryAnalysis.All(r);
        return new BuildingResult { Cases = cases, DriftChecks = DriftCheck.Run(r, cases), Irregularity = StiffnessIrregularity.Run(cases, id => IsWindCase(r.Model, id)) };
    }

    /// <summary>A wind case by its id or description (the plausibility checks' reading); a combination when one of its cases is.</summary>
    public static bool IsWindCase(StructureModel model, string id)
    {
        if (model.LoadCases.FirstOrDefault(c => c.Id == id) is { } lc) return Plausibility.IsWind(lc);
        return model.Combinations.FirstOrDefault(c => c.Id == id) is { } combo && combo.Factors.Any(f => f.Factor != 0 && Plausibility.IsWind(model.LoadCases[f.Case]));
    }
}
