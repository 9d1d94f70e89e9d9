using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Studies;

/// <summary>
/// A load case's story shears shared among parallel lines: by relative rigidity (each line's hand stiffness at the
/// top under the case's level forces) beside the shear each line carries in the full FE model, story by story.
/// </summary>
internal static class ShearSplitStudy
{
    public static IEnumerable<ComparisonRow> Rows(StructureModel model, ShearSplitCheck c, double tol, AnalysisResult full, AnalysisOptions options)
    {
        var u = model.Units;
        var checks = c.Lines.Select(l => model.Comparisons.First(x => x.Id == l.CheckId)).ToList();
        var levels = checks.Select(x => Levels(model, x)).ToList();
        for (int i = 1; i < levels.Count; i++)
            if (levels[i].Count != levels[0].Count || levels[i].Zip(levels[0]).Any(p => !Near(p.First, p.Second)))
                throw ComparisonStudy.Problem(c, $"lines \"{c.Lines[0].Label}\" and \"{c.Lines[i].Label}\" have different floor levels; a story split needs the lines to share their floors",
                    "split lines that stand on the same base and meet the same floors");
        var lv = levels[0];
        int stories = lv.Count - 1;
        var lc = model.LoadCases[c.LoadCase];
        var forces = new double[stories];
        foreach (var nl in lc.NodalLoads.Where(l => l.Fx != 0))
        {
            double y = model.Nodes[nl.Node].Y;
            int k = lv.FindIndex(v => Near(v, y));
            if (k < 0) throw ComparisonStudy.Problem(c, $"load case \"{lc.Id}\" has a lateral force at node \"{model.Nodes[nl.Node].Id}\", which is not at one of the lines' floor levels",
                "put the lateral forces of the case at the floor levels the lines share");
            if (k > 0) forces[k - 1] += nl.Fx;
        }
        if (forces.All(f => f == 0))
            throw ComparisonStudy.Problem(c, $"load case \"{lc.Id}\" has no lateral nodal force above the base", "name a load case with lateral forces at the floors");
        var storyShear = Enumerable.Range(0, stories).Select(s => forces.Skip(s).Sum()).ToArray();
        double total = forces.Sum();

        // Hand stiffness of each line at the top under the case's level forces: fixed base, and where a wall line stands
        // on a footing, on its footing too (the wall's top deflection plus the base rotation M_base/K_θ times the height
        // and the base slide V_base/K_h, derived: the wall's own forces are statically determinate).
        var hand = new List<(double K, HandMethod Method)>();
        var handFooted = new List<(double K, HandMethod Method)>();
        foreach (var x in checks)
        {
            if (x is WallLineCheck w)
            {
                var m0 = model.Members[w.Members[0]];
                var heights = Enumerable.Range(0, stories).Select(s => lv[s + 1] - lv[s]).ToArray();
                var r = StoryWall.Uniform(heights, forces, m0.E * m0.I, m0.G * m0.A, m0.A / m0.ShearArea);
                hand.Add((total / r.Displacements[^1], r.Method));
                var footing = model.Footings.FirstOrDefault(f => f.Node == w.BaseNode);
                var support = model.Supports.FirstOrDefault(s => s.Node == w.BaseNode);
                if (footing is null || support is null) { handFooted.Add(hand[^1]); continue; }
                var (rock, slide) = FootingWallStudy.HandBaseSprings(footing, support);
                double moment = Enumerable.Range(0, stories).Sum(s => forces[s] * (lv[s + 1] - lv[0]));
                double top = r.Displacements[^1] + moment / rock * (lv[^1] - lv[0]) + total / slide;
                handFooted.Add((total / top, r.Method.With($"on footing \"{footing.Id}\": top deflection + M_base·H/K_θ + V_base/K_h with K_θ = {ComparisonStudy.G4(u.FromSI(rock, Quantity.RotationalStiffness))} {u.Label(Quantity.RotationalStiffness)}, K_h = {ComparisonStudy.G4(u.FromSI(slide, Quantity.TranslationalStiffness))} {u.Label(Quantity.TranslationalStiffness)} (hand footing formulas; derived)")));
            }
            else
            {
                var fr = (FrameStoriesCheck)x;
                var st = FrameStoryStudy.Stories(model, fr);
                double drift = 0;
                HandMethod? method = null;
                for (int s = 0; s < stories; s++)
                {
                    var dv = FrameStoryStudy.DValue(model, fr, st[s], FrameStoryStudy.Bases(model, fr, st[s]));
                    drift += storyShear[s] / dv.Stiffness;
                    method = dv.Method;
                }
                hand.Add((total / drift, method!.With("stories in series: top deflection = Σ story shear / ΣD of each story")));
                handFooted.Add(hand[^1]);
            }
        }
        var cr = full.Cases.First(r => r.Id == lc.Id && !r.IsCombination);
        bool footed = model.Footings.Count > 0;
        if (!footed)
        {
            foreach (var row in SplitRows(model, c, tol, checks, lv, storyShear, hand, cr, "", "full model", "shear carried by the line's vertical members in story {0} under load case \"{1}\" in the whole model", null))
                yield return row;
            yield break;
        }
        // On footings: the split as the model stands (hand with the base terms, FE with the footings' springs) and the
        // fixed-base split beside it (hand without them, FE of the same model with the footings' springs replaced by
        // restraints), so the engineer sees how the split moves.
        var fixedModel = FootingWallStudy.FixedBase(model);
        var fixedFull = LinearStaticAnalysis.Run(fixedModel, options);
        var crFixed = fixedFull.Cases.First(r => r.Id == lc.Id && !r.IsCombination);
        var fixedFe = FeShears(model, checks, crFixed, lv, stories);
        var footedFe = FeShears(model, checks, cr, lv, stories);
        foreach (var row in SplitRows(model, c, tol, checks, lv, storyShear, handFooted, cr, ", on footings", "full model, on footings",
            "shear carried by the line's vertical members in story {0} under load case \"{1}\" in the whole model on its footings' springs", (fixedFe, hand, "fixed base")))
            yield return row;
        foreach (var row in SplitRows(model, c, tol, checks, lv, storyShear, hand, crFixed, ", fixed base", "full model, fixed base",
            "shear carried by the line's vertical members in story {0} under load case \"{1}\" in the whole model with every footing's springs replaced by restraints", (footedFe, handFooted, "on footings")))
            yield return row;
    }

    private static double[][] FeShears(StructureModel model, IReadOnlyList<ComparisonCheck> checks, CaseResult cr, List<double> lv, int stories) =>
        Enumerable.Range(0, stories).Select(s => checks.Select(x => LineShear(model, cr, Vertical(model, x), lv[s], lv[s + 1])).ToArray()).ToArray();

    private static IEnumerable<ComparisonRow> SplitRows(StructureModel model, ShearSplitCheck c, double tol, IReadOnlyList<ComparisonCheck> checks, List<double> lv,
        double[] storyShear, List<(double K, HandMethod Method)> hand, CaseResult cr, string suffix, string feName, string feWhat,
        (double[][] Fe, List<(double K, HandMethod Method)> Hand, string Label)? other)
    {
        var u = model.Units;
        var lc = model.LoadCases[c.LoadCase];
        for (int s = 0; s < storyShear.Length; s++)
        {
            var split = ShearDistribution.ByRelativeRigidity(storyShear[s], hand.Select(h => h.K).ToArray());
            var feShear = checks.Select(x => LineShear(model, cr, Vertical(model, x), lv[s], lv[s + 1])).ToArray();
            var otherSplit = other is { } o ? ShearDistribution.ByRelativeRigidity(storyShear[s], o.Hand.Select(h => h.K).ToArray()) : null;
            for (int i = 0; i < checks.Count; i++)
            {
                var method = split.Method.With(
                    $"line stiffness k = (total force)/(top deflection) by \"{hand[i].Method.Name}\" under the case's level forces: " +
                    string.Join(", ", checks.Select((_, j) => $"{c.Lines[j].Label} {ComparisonStudy.G4(ComparisonStudy.Stiffness(u, hand[j].K))} {ComparisonStudy.StiffnessUnit(u)}")));
                if (hand[i].Method.Assumptions.Count > 0 && hand[i].Method.Assumptions[^1].StartsWith("on footing", StringComparison.Ordinal)) method = method.With(hand[i].Method.Assumptions[^1]);
                double handV = u.FromSI(split.Forces[i], Quantity.Force), feV = u.FromSI(feShear[i], Quantity.Force);
                double ratio = feShear[i] / split.Forces[i];
                double feShare = feShear[i] / feShear.Sum();
                string beside = other is { } ot
                    ? $"; {ot.Label}: FE {ComparisonStudy.G4(u.FromSI(ot.Fe[s][i], Quantity.Force))} {u.ForceSymbol} ({ComparisonStudy.Pct(ot.Fe[s][i] / ot.Fe[s].Sum())}), hand {ComparisonStudy.G4(u.FromSI(otherSplit!.Forces[i], Quantity.Force))} {u.ForceSymbol} ({ComparisonStudy.Pct(otherSplit.Shares[i])})"
                    : "";
                yield return new ComparisonRow(c.Id, "shear-split", $"story {s + 1}: {c.Lines[i].Label}{suffix}", ComparedQuantity.StoryShear, u.ForceSymbol,
                    new HandEstimate(handV, method),
                    [new FeEstimate(feName, feV, string.Format(System.Globalization.CultureInfo.InvariantCulture, feWhat, s + 1, lc.Id) + $" ({ComparisonStudy.Pct(feShare)} of the lines' total; hand share {ComparisonStudy.Pct(split.Shares[i])}){beside}")],
                    null, tol, Cause(ratio, tol, checks.Select(x => x is WallLineCheck).Distinct().Count() > 1),
                    feName == "full model, fixed base"
                        ? "full model, fixed base: the whole model with every footing's springs replaced by restraints, under the case's loads; a story-shear split has no separate panel model"
                        : "full model: the whole model as given, under the case's loads; a story-shear split has no separate panel model");
            }
        }
    }

    /// <summary>Cause rules for a story-shear split (docs/comparisons.md).</summary>
    internal static string Cause(double ratio, double tol, bool wallsAndFrames)
    {
        if (ComparisonRow.Judge(ratio, tol) == Verdict.WithinTolerance) return "relative rigidity holds at this story";
        return wallsAndFrames
            ? "wall-frame interaction: the wall bends as a cantilever and the frame sways in shear; tied at every floor they push and pull on each other, so the share changes from story to story and one relative-rigidity split cannot hold at every story"
            : "the lines deflect in different shapes, so their stiffness ratio changes with height; one relative-rigidity split cannot hold at every story";
    }

    private static bool Near(double a, double b) => Math.Abs(a - b) <= 1e-9 * Math.Max(1.0, Math.Abs(a));

    private static List<double> Levels(StructureModel model, ComparisonCheck x) => x switch
    {
        WallLineCheck w => new[] { w.BaseNode }.Concat(w.Members.Select(m => FrameStoryStudy.UpperNode(model, model.Members[m]))).Select(n => model.Nodes[n].Y).ToList(),
        FrameStoriesCheck f => f.Levels.ToList(),
        _ => throw new InvalidOperationException(),
    };

    private static IEnumerable<Member> Vertical(StructureModel model, ComparisonCheck x) => x switch
    {
        WallLineCheck w => w.Members.Select(m => model.Members[m]),
        FrameStoriesCheck f => FrameStoryStudy.Stories(model, f).SelectMany(s => s.Columns),
        _ => throw new InvalidOperationException(),
    };

    /// <summary>Σ global Fx on the upper ends of the members spanning the story: the story shear the line carries (N).</summary>
    private static double LineShear(StructureModel model, CaseResult r, IEnumerable<Member> members, double y0, double y1)
    {
        double sum = 0;
        foreach (var m in members)
        {
            var a = model.Nodes[m.Start]; var b = model.Nodes[m.End];
            if (!(Math.Min(a.Y, b.Y) <= y0 + 1e-9 && Math.Max(a.Y, b.Y) >= y1 - 1e-9)) continue;
            double len = Math.Sqrt((b.X - a.X) * (b.X - a.X) + (b.Y - a.Y) * (b.Y - a.Y));
            double cs = (b.X - a.X) / len, sn = (b.Y - a.Y) / len;
            var fo = r.MemberForces[m.Index];
            // Force on the member at its upper end, global x: local x = (c, s), local y = (−s, c).
            sum += b.Y >= a.Y ? fo.N2 * cs - fo.V2 * sn : fo.N1 * cs - fo.V1 * sn;
        }
        return sum;
    }
}
