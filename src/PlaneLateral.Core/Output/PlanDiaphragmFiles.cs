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
    /// <param name="tributary">The hand tributary split beside the FE flexible floor (PlaneLateral.Studies.PlanTributarySplit), or null: its columns stay empty.</param>
    public static IEnumerable<(string Name, string Text)> Render(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null) =>
        Tables(r, tributary).Select(t => (t.Name, t.Table.ToCsv()));

    /// <summary>The two tables of floors that bend by file name (none without floor blocks): each file is its table's <see cref="ResultTable.ToCsv"/>.</summary>
    public static IEnumerable<(string Name, ResultTable Table)> Tables(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        if (r.Diaphragms is not { } d) yield break;
        yield return ("plan-floor-flexibility.csv", FlexibilityTable(r, d));
        yield return ("plan-shear-envelope.csv", EnvelopeTable(r, d, tributary));
    }

    private static Dictionary<(string, int, string), TributaryShear> Index(IReadOnlyList<TributaryShear>? tributary) =>
        (tributary ?? []).GroupBy(t => (t.Case, t.Story, t.Line)).ToDictionary(g => g.Key, g => g.First());

    private static object Defined(double v) => PlanFiles.Defined(v);

    /// <summary>The flexibility test of each floor span (ASCE 7-16 eq. 12.3-1): MDD, ADVE and their ratio.</summary>
    public static ResultTable FlexibilityTable(PlanResult r, DiaphragmStudy d)
    {
        var u = r.Plan.Units;
        string len = u.LengthSymbol;
        object L(double v) => Defined(u.FromSI(v, Quantity.Length));
        return new ResultTable
        {
            Title = "Floor flexibility test per span (ASCE 7-16 §12.3.1.3, eq. 12.3-1)",
            Columns =
            [
                new("level", Kind: CellKind.Text), new("loading", Kind: CellKind.Text), new("case", Kind: CellKind.Text), new("from line", Kind: CellKind.Text),
                new("to line", Kind: CellKind.Text), new("span from", len), new("span to", len), new("MDD", len), new("ADVE", len), new("MDD/ADVE"),
                new("flexible by eq. 12.3-1", Kind: CellKind.Text),
            ],
            Rows = d.Flexibility.Select(t => (IReadOnlyList<object>)[r.Plan.Levels[t.Level].Id, t.Direction, t.Case, t.From, t.To, L(t.SpanFrom), L(t.SpanTo),
                L(t.Mdd), L(t.Adve), Defined(t.Ratio), t.Flexible ? "yes" : "no"]),
        };
    }

    /// <summary>Each line's story shear under rigid, semi-rigid and flexible floors and their envelope, with the hand tributary split beside the flexible one when given.</summary>
    public static ResultTable EnvelopeTable(PlanResult r, DiaphragmStudy d, IReadOnlyList<TributaryShear>? tributary = null)
    {
        var u = r.Plan.Units;
        string force = u.ForceSymbol;
        object Fo(double v) => Defined(u.FromSI(v, Quantity.Force));
        var hand = Index(tributary);
        return new ResultTable
        {
            Title = "Line story shear under rigid, semi-rigid and flexible floors, and the envelope",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("story"), new("line", Kind: CellKind.Text), new("rigid", force), new("semi-rigid", force), new("flexible", force),
                new("envelope", force), new("governing", Kind: CellKind.Text), new("hand tributary", force), new("flexible/hand - 1"), new("gap cause", Kind: CellKind.Text),
            ],
            Rows = d.Envelope.Select(e => (IReadOnlyList<object>)[e.Case, e.Story, e.Line, Fo(e.Rigid), Fo(e.SemiRigid), Fo(e.Flexible), Fo(e.Envelope), e.Governing,
                .. hand.TryGetValue((e.Case, e.Story, e.Line), out var h) ? [Fo(h.Hand), Defined(h.Gap), h.Cause] : new object[] { "", "", "" }]),
        };
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
