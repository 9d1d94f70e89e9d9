using PlaneLateral.Analysis;
using PlaneLateral.Units;
using PlaneLateral.Hand;
using PlaneLateral.Model;

namespace PlaneLateral.Studies;

/// <summary>
/// A wall line against the shear-deformable pier formulas: hand Piers.General with the members' own E, G, A, I and
/// f = A/A_s, beside the same members as an isolated FE sub-model (base fixed; top free, or top held against rotation),
/// unit lateral force at the top, stiffness 1/Δ.
/// </summary>
internal static class WallLineStudy
{
    /// <summary>Below this h/l a pier is squat and plane sections are doubtful (common practice; docs/hand-methods.md §2).</summary>
    public const double SquatAspectRatio = 0.5;

    /// <summary>Name of the wall line's own FE estimate (its members alone).</summary>
    public const string LineModelName = "line members, isolated";

    public static IEnumerable<ComparisonRow> Rows(StructureModel model, WallLineCheck c, double tol, AnalysisOptions? options = null)
    {
        var u = model.Units;
        var m0 = model.Members[c.Members[0]];
        double h = model.Nodes[c.TopNode].Y - model.Nodes[c.BaseNode].Y;
        double f = m0.A / m0.ShearArea;
        double depth = model.Sections.FirstOrDefault(s => s.Id == m0.SectionId)?.Depth ?? double.NaN;
        double? aspect = double.IsFinite(depth) && depth > 0 ? h / depth : null;
        foreach (var ends in c.Ends)
        {
            var fixity = ends == CheckEnds.Cantilever ? EndFixity.Cantilever : EndFixity.FixedFixed;
            var hand = Piers.General(fixity, 1.0, h, m0.E, m0.I, m0.A, m0.G, f);
            double fe = ComparisonStudy.SolveStiffness(Isolated(model, c, ends, withShear: true));
            double feFlex = ComparisonStudy.SolveStiffness(Isolated(model, c, ends, withShear: false));
            double flexShare = fe / feFlex;   // Δ_flexure/Δ_total = (1/feFlex)/(1/fe)
            string top = ends == CheckEnds.Cantilever ? "top free" : "top held against rotation";
            var feEstimate = new FeEstimate(LineModelName, ComparisonStudy.Stiffness(u, fe),
                $"the check's {c.Members.Count} Timoshenko member(s) alone, base fixed, {top}, unit lateral force at the top node; stiffness 1/Δ; shares from a second solve without shear deformation",
                flexShare, 1 - flexShare);
            FeEstimate? panel = null;
            string? noPanel = null;
            double thickness = double.IsFinite(depth) && depth > 0 ? m0.A / m0.Modifiers.A / depth : double.NaN;
            if (!double.IsFinite(thickness))
                noPanel = "no plane-stress panel: the wall's section gives no depth to mesh";
            else if (m0.Modifiers != StiffnessModifiers.None)
                noPanel = "not modelled, because the wall's members carry stiffness modifiers (cracked-section I) that a continuum of the gross section cannot represent";
            else
                (panel, noPanel) = PanelEstimate.ForEnds(fixity, u, c.Id, depth, h, thickness, m0.E, m0.E / (2 * m0.G) - 1, [], options);
            var (ordered, basis, panelFirst) = ReferenceChoice.Order([feEstimate], panel, tol, noPanel);
            double ratio = fe / hand.Stiffness;
            double handValue = ComparisonStudy.Stiffness(u, hand.Stiffness);
            string lineCause = Cause(ratio, tol, aspect, hand.ShearShare);
            string cause = panelFirst
                ? ReferenceChoice.PanelFirstCause(PanelEstimate.Judgement(panel!.Value / handValue, tol, panel.EstimatedError!.Value), feEstimate, handValue, lineCause)
                : lineCause + (double.IsFinite(thickness) ? PanelEstimate.Verdict(panel is null ? double.NaN : panel.Value / handValue, tol, panel is null ? noPanel : null) : "");
            yield return new ComparisonRow(c.Id, "wall-line", ends == CheckEnds.Cantilever ? "cantilever" : "fixed-fixed",
                ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
                new HandEstimate(handValue, hand.Method.With(Inputs(m0)), hand.FlexuralShare, hand.ShearShare),
                ordered, aspect, tol, cause, basis);
        }
    }

    private static string Inputs(Member m)
    {
        var mods = m.Modifiers;
        string modText = mods == StiffnessModifiers.None ? "no stiffness modifiers"
            : $"the member's stiffness modifiers applied (I × {ComparisonStudy.G4(mods.I)}, A × {ComparisonStudy.G4(mods.A)}, shear area × {ComparisonStudy.G4(mods.ShearArea)})";
        return $"E, G, A, I and f = A/A_s are the wall members' own effective values, {modText}";
    }

    /// <summary>Cause rules for a wall line (docs/comparisons.md).</summary>
    internal static string Cause(double ratio, double tol, double? aspect, double handShearShare)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        string basis = v == Verdict.WithinTolerance
            ? "same beam theory on both sides (plane sections, shear area A/f), so agreement checks the arithmetic, not the theory"
            : "the FE members differ from the hand inputs (supports or loads of the sub-model); check the model";
        if (aspect is double r && r < SquatAspectRatio)
            return $"squat (h/l = {ComparisonStudy.G4(r)}): plane sections are doubtful; a panel model is the better reference. Here: {basis}";
        if (handShearShare < 0.1 && aspect is double s && s > 3)
            return $"slender (h/l = {ComparisonStudy.G4(s)}): flexure governs, so the cracked-section I decides the stiffness. Here: {basis}";
        return basis;
    }

    /// <summary>The wall line's members alone: base fixed, top free or held against rotation, unit force at the top.</summary>
    internal static StructureModel Isolated(StructureModel model, WallLineCheck c, CheckEnds ends, bool withShear)
    {
        var sub = new SubModel($"{c.Id}: wall line alone", model.SourcePath, model.Units);
        var map = new Dictionary<int, int>();
        int N(int n) => map.TryGetValue(n, out int k) ? k : map[n] = sub.NodeAt(model.Nodes[n].X, model.Nodes[n].Y, model.Nodes[n].Id);
        foreach (int mi in c.Members)
        {
            var m = model.Members[mi];
            // Without shear: an infinite shear area (Φ = 0), flexure only.
            sub.Copy(withShear ? m : m with { ShearArea = double.PositiveInfinity }, N(m.Start), N(m.End));
        }
        sub.Support(map[c.BaseNode], true, true, true);
        if (ends == CheckEnds.FixedFixed) sub.Support(map[c.TopNode], false, false, true);
        sub.StiffnessAt(map[c.TopNode], "top");
        return sub.Build();
    }
}
