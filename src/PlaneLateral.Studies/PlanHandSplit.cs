using PlaneLateral.Analysis;
using PlaneLateral.Hand;

namespace PlaneLateral.Studies;

/// <summary>
/// One line in one story of one case: the hand split by relative rigidity with torsion beside the building's FE split.
/// Forces in N along the line. <see cref="Gap"/> = FE total / hand total − 1 (NaN when the hand total is nil).
/// </summary>
public sealed record PlanSplitRow(string Case, int Story, string Line, double LineStiffness, double Distance,
    double HandDirect, double HandTorsional, double HandTotal, double HandDesign,
    double FeDirect, double FeTorsional, double FeTotal, double Gap);

/// <summary>The hand split of one story of one case: centre of rigidity (m), J (N·m), torque about the centre of rigidity (N·m).</summary>
public sealed record PlanSplitStory(string Case, int Story, double XR, double YR, double J, double Torque, IReadOnlyList<PlanSplitRow> Rows);

/// <summary>
/// Sets the relative-rigidity-with-torsion split (PlaneLateral.Hand.TorsionSplit: each line's story stiffness from the
/// line alone under the direction's floor-force pattern) beside the FE split of the building, for every case loaded
/// along X or Y, and the split with the floor held against twist beside the FE with rotation locked. Where they differ
/// the causes are the line stiffness that changes with the story (wall–frame interaction: the line alone is not the line
/// in the building), the centre of rigidity that depends on the story and the load, and the coupling of stories through
/// each line (Goel &amp; Chopra, J. Struct. Eng. 119(10):3039–3055, 1993); for one story of lines with one stiffness each
/// the two agree.
/// </summary>
public static class PlanHandSplit
{
    public static IReadOnlyList<PlanSplitStory> Run(PlanResult r)
    {
        var list = new List<PlanSplitStory>();
        foreach (var c in r.Cases)
        {
            if (c.Case.Direction is not ("x" or "y")) continue;
            foreach (var st in c.Stories)
            {
                var rig = r.Rigidity.FirstOrDefault(x => x.Direction == c.Case.Direction && x.Story == st.Story);
                if (rig is null || rig.Lines.Any(l => !(l.Stiffness > 0))) continue;
                var lines = rig.Lines.Select(l => new TorsionLine(l.Line, l.X0, l.Y0, l.Angle, l.Stiffness)).ToList();
                TorsionSplitResult hand;
                try { hand = TorsionSplit.Split(lines, st.Vx, st.Vy, st.Mz); }
                catch (ArgumentException) { continue; }
                var rows = new List<PlanSplitRow>();
                for (int i = 0; i < lines.Count; i++)
                {
                    var fe = c.LineStories.First(x => x.Story == st.Story && x.Line == lines[i].Id);
                    var h = hand.Lines[i];
                    double gap = Math.Abs(h.Total) > 1e-12 * Math.Max(Math.Abs(st.Vx), Math.Abs(st.Vy)) ? fe.Shear / h.Total - 1 : double.NaN;
                    rows.Add(new PlanSplitRow(c.Case.Id, st.Story, h.Id, lines[i].Stiffness, h.Distance, h.Direct, h.Torsional, h.Total, h.Design,
                        fe.Direct, fe.Torsional, fe.Shear, gap));
                }
                list.Add(new PlanSplitStory(c.Case.Id, st.Story, hand.XR, hand.YR, hand.J, hand.Torque, rows));
            }
        }
        return list;
    }
}
