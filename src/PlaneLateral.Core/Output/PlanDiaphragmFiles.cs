using System.Globalization;
using System.Text;
using Newtonsoft.Json.Linq;
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
    public static JObject? Json(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        if (r.Diaphragms is not { } d) return null;
        var hand = Index(tributary);
        var u = r.Plan.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        JToken N(double v) => double.IsFinite(v) ? v : JValue.CreateNull();
        return new JObject
        {
            ["caution"] = DiaphragmStudy.Caution,
            ["kinds"] = new JArray(d.Kinds.Select((k, i) => new JObject { ["level"] = r.Plan.Levels[i + 1].Id, ["kind"] = PlanFloor.Word(k) })),
            ["idealisations"] = new JArray(d.Variants),
            ["notes"] = new JArray(d.Notes),
            ["flexibility"] = new JArray(d.Flexibility.Select(t => new JObject
            {
                ["level"] = r.Plan.Levels[t.Level].Id, ["loading"] = t.Direction, ["case"] = t.Case, ["from"] = t.From, ["to"] = t.To,
                ["span"] = new JArray(L(t.SpanFrom), L(t.SpanTo)), ["MDD"] = L(t.Mdd), ["ADVE"] = L(t.Adve), ["ratio"] = N(t.Ratio), ["flexible"] = t.Flexible,
            })),
            ["envelope"] = new JArray(d.Envelope.Select(e =>
            {
                var o = new JObject
                {
                    ["case"] = e.Case, ["story"] = e.Story, ["line"] = e.Line, ["rigid"] = N(u.FromSI(e.Rigid, Quantity.Force)),
                    ["semiRigid"] = N(u.FromSI(e.SemiRigid, Quantity.Force)), ["flexible"] = N(u.FromSI(e.Flexible, Quantity.Force)),
                    ["envelope"] = N(u.FromSI(e.Envelope, Quantity.Force)), ["governing"] = e.Governing,
                };
                if (hand.TryGetValue((e.Case, e.Story, e.Line), out var h))
                {
                    o["handTributary"] = N(u.FromSI(h.Hand, Quantity.Force));
                    o["flexibleOverHandMinusOne"] = N(h.Gap);
                    o["gapCause"] = h.Cause;
                }
                return o;
            })),
        };
    }
}
