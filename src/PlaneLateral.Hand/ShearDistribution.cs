namespace PlaneLateral.Hand;

/// <summary>A story shear shared among parallel lateral elements.</summary>
/// <param name="StoryShear">The story shear V shared (F).</param>
/// <param name="Stiffnesses">Each element's lateral stiffness k_i (F/L).</param>
/// <param name="Shares">Each element's share k_i / Σk (dimensionless, sums to 1).</param>
/// <param name="Forces">Each element's shear V_i = V·k_i/Σk (F).</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record ShearShareResult(
    double StoryShear, IReadOnlyList<double> Stiffnesses, IReadOnlyList<double> Shares, IReadOnlyList<double> Forces,
    HandMethod Method)
{
    /// <summary>Σk, the story's combined stiffness (F/L).</summary>
    public double TotalStiffness => Stiffnesses.Sum();

    /// <summary>The common story drift V/Σk (L).</summary>
    public double Drift => StoryShear / TotalStiffness;
}

/// <summary>Distribution of a story shear by relative rigidity. Units: any consistent set.</summary>
public static class ShearDistribution
{
    /// <summary>
    /// V_i = V·k_i/Σk: parallel walls and frames linked by a rigid diaphragm that translates without twist
    /// share the story shear in proportion to their stiffness.
    /// Source: common practice; e.g. Taly, Design of Reinforced Masonry Structures, ch. 7 (distribution of lateral loads).
    /// </summary>
    /// <param name="storyShear">Story shear V (F); any finite value.</param>
    /// <param name="stiffnesses">Lateral stiffness of each element (F/L), each positive.</param>
    public static ShearShareResult ByRelativeRigidity(double storyShear, IReadOnlyList<double> stiffnesses)
    {
        Guard.Finite(storyShear, "The story shear V");
        Guard.NotEmpty(stiffnesses, "The list of element stiffnesses");
        for (int i = 0; i < stiffnesses.Count; i++) Guard.Positive(stiffnesses[i], $"The stiffness of element {i + 1}");
        double sum = stiffnesses.Sum();
        var shares = stiffnesses.Select(k => k / sum).ToArray();
        return new ShearShareResult(storyShear, stiffnesses.ToArray(), shares, shares.Select(s => s * storyShear).ToArray(),
            new HandMethod("Story shear by relative rigidity, V_i = V·k_i/Σk",
                "Common practice; Taly, Design of Reinforced Masonry Structures, ch. 7",
                ["the diaphragm is rigid in its plane", "the story translates without twist (no torsion)",
                 "the elements act in parallel and share one drift", "linear elastic"]));
    }
}
