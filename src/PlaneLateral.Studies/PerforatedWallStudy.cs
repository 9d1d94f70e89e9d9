using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// A wall with openings: the hand perforated-wall method (solid minus strips plus piers; rigid spandrels) beside an
/// equivalent frame generated from the same geometry, once with the spandrels as built and once made rigid, so the
/// gap can be split into spandrel flexibility and the frame's other idealisations.
/// </summary>
internal static class PerforatedWallStudy
{
    public static IEnumerable<ComparisonRow> Rows(StructureModel model, PerforatedWallCheck c, double tol, AnalysisOptions? options = null)
    {
        var u = model.Units;
        var fixity = c.Ends == CheckEnds.Cantilever ? EndFixity.Cantilever : EndFixity.FixedFixed;
        // The hand method takes any consistent units: work it in the model's own, so its breakdown reads in them.
        double Len(double v) => u.FromSI(v, Quantity.Length);
        double Stress(double v) => u.FromSI(v, Quantity.Stress);
        var hand = PerforatedWall.Analyze(Len(c.Length), Len(c.Height), Len(c.Thickness), Stress(c.Material.E), Stress(c.Material.G), fixity,
            c.Openings.Select(o => new WallOpening(Len(o.X), Len(o.Y), Len(o.Width), Len(o.Height), o.Label)).ToArray(), 1.0, c.FormFactor);
        double handSI = u.ToSI(hand.Stiffness, Quantity.TranslationalStiffness);
        var asBuilt = EquivalentFrame.Build(c, u, model.SourcePath, rigidSpandrels: false);
        var rigid = EquivalentFrame.Build(c, u, model.SourcePath, rigidSpandrels: true);
        double fe = Stiffness(asBuilt), feRigid = Stiffness(rigid);
        string how = $"generated from the wall's geometry: {asBuilt.PierCount} pier member(s), {asBuilt.SpandrelCount} spandrel(s) of their real depth, rigid zones where piers and spandrels overlap; {(c.Ends == CheckEnds.Cantilever ? "base fixed, top free" : "base fixed, top held against rotation")}; unit force shared by the top joints, stiffness 1/(mean top deflection)";
        var estimates = new List<FeEstimate>
        {
            new("equivalent frame", ComparisonStudy.Stiffness(u, fe), how),
        };
        if (asBuilt.SpandrelCount > 0)
            estimates.Add(new FeEstimate("equivalent frame, spandrels made rigid", ComparisonStudy.Stiffness(u, feRigid),
                $"the same frame with every spandrel's I and shear area multiplied by {EquivalentFrame.RigidFactor:G3}: the gap left is the frame's own idealisation (pier heights, joints), not spandrel bending"));
        var (panel, skipped) = PanelEstimate.ForEnds(fixity, u, c.Id, c.Length, c.Height, c.Thickness, c.Material.E, c.Material.Nu, c.Openings, options);
        var (ordered, basis, panelFirst) = ReferenceChoice.Order(estimates, panel, tol, skipped);
        double aspect = c.Height / c.Length;
        // The same wall without openings bounds any wall with openings from above (removing material cannot stiffen an elastic body).
        double solid = Piers.Rectangular(fixity, 1.0, c.Height, c.Length, c.Thickness, c.Material.E, c.Material.G, c.FormFactor).Stiffness;
        string frameCause = Cause(fe / handSI, feRigid / handSI, tol, asBuilt.SpandrelCount, c.Openings.Count == 0 ? aspect : double.NaN, c.Openings.Count == 0 ? 0 : fe / solid);
        string cause = panelFirst
            ? ReferenceChoice.PanelFirstCause(PanelEstimate.Judgement(panel!.Value / hand.Stiffness, tol, panel.EstimatedError!.Value), estimates[0], hand.Stiffness, frameCause)
            : frameCause + PanelEstimate.Verdict(panel is null ? double.NaN : panel.Value / hand.Stiffness, tol, skipped);
        yield return new ComparisonRow(c.Id, "perforated-wall", c.Ends == CheckEnds.Cantilever ? "cantilever" : "fixed-fixed",
            ComparedQuantity.Stiffness, ComparisonStudy.StiffnessUnit(u),
            new HandEstimate(hand.Stiffness, hand.Method.With($"lengths in {u.LengthSymbol}, forces in {u.ForceSymbol} (the breakdown's units)"), Detail: hand.Breakdown),
            ordered, aspect, tol, cause, basis);
    }

    internal static double Stiffness(EquivalentFrame frame)
    {
        var r = LinearStaticAnalysis.Run(frame.Model).Cases[0];
        double mean = frame.LoadNodes.Average(n => r.Displacement(n, Dof.X));
        return 1.0 / mean;
    }

    /// <summary>Cause rules for a perforated wall (docs/comparisons.md).</summary>
    /// <param name="solidAspect">h/l of a wall without openings (NaN otherwise: then the piers, not the wall, decide whether plane sections hold).</param>
    /// <param name="ratioToSolid">FE frame stiffness over the same wall without openings (0 when the wall has none).</param>
    internal static string Cause(double ratio, double ratioRigidSpandrels, double tol, int spandrels, double solidAspect, double ratioToSolid)
    {
        var v = ComparisonRow.Judge(ratio, tol);
        if (ratioToSolid > 1)
            return $"frame stiffer than the same wall without openings ({ComparisonStudy.Pct(ratioToSolid)} of it), which no wall with openings can be: the frame takes the solid wall around the openings as rigid joints and links, and here that wall is large; a panel model is needed";
        string squat = solidAspect < WallLineStudy.SquatAspectRatio ? $"; squat (h/l = {ComparisonStudy.G4(solidAspect)}): plane sections are doubtful, a panel model is the better reference" : "";
        if (v == Verdict.WithinTolerance)
        {
            if (spandrels == 0) return "no spandrel above the piers to bend; the frame and the hand method idealise the wall alike" + squat;
            if (ratioRigidSpandrels - ratio <= tol) return "spandrels deep enough to hold the piers nearly fixed-fixed, as the hand method assumes" + squat;
            return $"agreement by offsetting idealisations: the spandrels bend (made rigid, the frame gives {ComparisonStudy.Pct(ratioRigidSpandrels)} of the hand value) while the frame's rigid joints hold wall the hand method lets deform; a panel model is the better reference" + squat;
        }
        if (v == Verdict.HandHigher)
        {
            double spandrelPart = ratioRigidSpandrels - ratio, otherPart = 1 - ratioRigidSpandrels;
            if (spandrels > 0 && spandrelPart >= otherPart)
                return $"spandrel flexibility: the fixed-fixed pier assumption is too stiff; the piers interact through the coupling of flexible spandrels (with rigid spandrels the frame gives {ComparisonStudy.Pct(ratioRigidSpandrels)} of the hand value)" + squat;
            return $"frame idealisation: the frame's piers bend over the full height beside their openings, where the hand method takes shorter piers and rigid wall around them{(spandrels > 0 ? $" (with rigid spandrels the frame still gives {ComparisonStudy.Pct(ratioRigidSpandrels)})" : "")}; a panel model is the better reference" + squat;
        }
        return "frame stiffer than the hand method: the frame holds the solid wall around the openings rigid (pier-spandrel joints, rigid zones and links), where the hand method lets that wall shear and bend; a panel model is the better reference" + squat;
    }
}
