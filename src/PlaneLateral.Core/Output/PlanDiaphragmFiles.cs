using System.Globalization;
using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The files of floors that bend (docs/plan.md): plan-floor-flexibility.csv (MDD, ADVE, their ratio per floor span),
/// plan-shear-envelope.csv (each line's story shear under rigid, semi-rigid and flexible floors and the envelope, with
/// the hand tributary split beside the flexible one when given), and
/// the "floors" block of plan.json. In the building's units.
/// </summary>
public static class PlanDiaphragmFiles
{
    private static string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "";
    private static string Csv(string s) => CsvText.Cell(s);

    /// <param name="tributary">The hand tributary split beside the FE flexible floor (PlaneLateral.Studies.PlanTributarySplit), or null: its columns stay empty.</param>
    public static IEnumerable<(string Name, string Text)> Render(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        if (r.Diaphragms is not { } d) yield break;
        yield return ("plan-floor-flexibility.csv", Flexibility(r, d));
        yield return ("plan-shear-envelope.csv", Envelope(r, d, Index(tributary)));
    }

    private static Dictionary<(string, int, string), TributaryShear> Index(IReadOnlyList<TributaryShear>? tributary) =>
        (tributary ?? []).GroupBy(t => (t.Case, t.Story, t.Line)).ToDictionary(g => g.Key, g => g.First());

    private static string Flexibility(PlanResult r, DiaphragmStudy d)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        var sb = new StringBuilder($"level,loading,case,from line,to line,span from [{len}],span to [{len}],MDD [{len}],ADVE [{len}],MDD/ADVE,flexible by eq. 12.3-1\n");
        foreach (var t in d.Flexibility)
            sb.Append($"{Csv(r.Plan.Levels[t.Level].Id)},{t.Direction},{Csv(t.Case)},{Csv(t.From)},{Csv(t.To)},{F(u.FromSI(t.SpanFrom, Quantity.Length))},{F(u.FromSI(t.SpanTo, Quantity.Length))}," +
                $"{F(u.FromSI(t.Mdd, Quantity.Length))},{F(u.FromSI(t.Adve, Quantity.Length))},{F(t.Ratio)},{(t.Flexible ? "yes" : "no")}\n");
        return sb.ToString();
    }

    private static string Envelope(PlanResult r, DiaphragmStudy d, Dictionary<(string, int, string), TributaryShear> hand)
    {
        var u = r.Plan.Units;
        string force = u.ForceSymbol;
        var sb = new StringBuilder($"case,story,line,rigid [{force}],semi-rigid [{force}],flexible [{force}],envelope [{force}],governing,hand tributary [{force}],flexible/hand - 1,gap cause\n");
        foreach (var e in d.Envelope)
            sb.Append($"{Csv(e.Case)},{e.Story},{Csv(e.Line)},{F(u.FromSI(e.Rigid, Quantity.Force))},{F(u.FromSI(e.SemiRigid, Quantity.Force))},{F(u.FromSI(e.Flexible, Quantity.Force))}," +
                $"{F(u.FromSI(e.Envelope, Quantity.Force))},{e.Governing}," +
                (hand.TryGetValue((e.Case, e.Story, e.Line), out var h) ? $"{F(u.FromSI(h.Hand, Quantity.Force))},{F(h.Gap)},{Csv(h.Cause)}\n" : ",,\n"));
        return sb.ToString();
    }

    /// <summary>The "floors" block of plan.json, or null without floor blocks.</summary>
    public static PlanFloorsBlock? Json(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        if (r.Diaphragms is not { } d) return null;
        var hand = Index(tributary);
        var u = r.Plan.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        static double? N(double v) => double.IsFinite(v) ? v : null;
        return new PlanFloorsBlock(
            DiaphragmStudy.Caution,
            d.Kinds.Select((k, i) => new PlanFloorKind(r.Plan.Levels[i + 1].Id, PlanFloor.Word(k))),
            d.Variants,
            d.Notes,
            d.Flexibility.Select(t => new PlanFloorFlexibility(r.Plan.Levels[t.Level].Id, t.Direction, t.Case, t.From, t.To, [L(t.SpanFrom), L(t.SpanTo)],
                L(t.Mdd), L(t.Adve), N(t.Ratio), t.Flexible)),
            d.Envelope.Select(e =>
            {
                bool has = hand.TryGetValue((e.Case, e.Story, e.Line), out var h);
                return new PlanFloorEnvelope(e.Case, e.Story, e.Line, N(u.FromSI(e.Rigid, Quantity.Force)), N(u.FromSI(e.SemiRigid, Quantity.Force)),
                    N(u.FromSI(e.Flexible, Quantity.Force)), N(u.FromSI(e.Envelope, Quantity.Force)), e.Governing,
                    has ? N(u.FromSI(h!.Hand, Quantity.Force)) : null, has ? N(h!.Gap) : null, has ? h!.Cause : null) { HasHand = has };
            }));
    }
}
