using System.Numerics;
using CsCheck;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Studies;
using PlaneLateral.Tests.Input;
using Xunit.Abstractions;

namespace PlaneLateral.Tests.Fuzz;

/// <summary>
/// Time-bounded fuzzing of the whole path the command line takes (read, solve, compare, render the files), seeded with
/// every shipped model and every bad model of the corpus, by structural mutations of the JSON tree (values swapped for
/// edge values or for ids used elsewhere, keys dropped or renamed, array entries duplicated or dropped) and by text edits.
/// The property (common practice for a reader): the only ways out are a model and its results, or
/// <see cref="ModelInputException"/> with every problem carrying a message and a fix, or <see cref="UnstableModelException"/>;
/// results are finite. Run long by tools/fuzz.sh (PLANELATERAL_FUZZ_SECONDS); in the ordinary test run a short
/// fixed-count sample keeps it a few seconds.
/// </summary>
public class ReaderFuzzCampaign(ITestOutputHelper output)
{
    private static readonly string[] Seeds = LoadSeeds();

    private static string[] LoadSeeds()
    {
        string corpus = BadCorpusTests.CorpusFolder;
        string root = Path.GetFullPath(Path.Combine(corpus, "..", "..", ".."));
        return Directory.GetFiles(Path.Combine(root, "models"), "*.json", SearchOption.AllDirectories)
            .Concat(Directory.GetFiles(corpus, "*.json").Where(f => !f.EndsWith("manifest.json", StringComparison.Ordinal)))
            .Order(StringComparer.Ordinal)
            .Select(File.ReadAllText)
            .Where(t => t.Length < 100_000)   // the node-count limit case is a seed too big to mutate usefully
            .ToArray();
    }

    private static (long Iter, int Time) Budget()
    {
        var s = Environment.GetEnvironmentVariable("PLANELATERAL_FUZZ_SECONDS");
        return int.TryParse(s, out int seconds) && seconds > 0 ? (-1, seconds) : (150, -1);
    }

    /// <summary>Everything the CLI does with a model, with the property checked at each step.</summary>
    internal static void Pipeline(string text)
    {
        if (text.Contains("\"plan\"", StringComparison.Ordinal)) BuildingPipeline(text);   // a building in plan, or a mutation of one
        StructureModel model;
        try { model = ModelReader.Parse(text, "fuzz.json"); }
        catch (ModelInputException e) { AssertClear(e); return; }
        try
        {
            var r = LinearStaticAnalysis.Run(model);
            foreach (var c in r.Cases) Assert.All(c.Displacements, v => Assert.True(double.IsFinite(v)));
            var run = ModelRun.Run(model);
            var files = ResultFiles.Render(run);
            Assert.All(files, f => Assert.DoesNotContain("NaN", f.Text));
            if (model.Comparisons.Count > 0)
            {
                var report = ComparisonStudy.Run(model, ComparisonStudy.DefaultTolerance, run);
                ComparisonFiles.Render(report, "fuzz");
            }
        }
        catch (UnstableModelException) { }
        catch (ModelInputException) { }
    }

    private static void AssertClear(ModelInputException e)
    {
        Assert.NotEmpty(e.Diagnostics);
        foreach (var d in e.Diagnostics)
        {
            Assert.False(string.IsNullOrWhiteSpace(d.Problem), "a diagnostic without a problem");
            Assert.False(string.IsNullOrWhiteSpace(d.Fix), $"no fix for: {d.Problem}");
        }
    }

    /// <summary>What `solve` does with a building file: read (line files beside it are not there: refused clearly), solve in plan, render.</summary>
    private static void BuildingPipeline(string text)
    {
        BuildingPlan plan;
        try { plan = ModelReader.ParsePlan(text, Path.Combine(Path.GetTempPath(), "planelateral-fuzz", "building.json")); }
        catch (ModelInputException e) { AssertClear(e); return; }
        try
        {
            var r = PlanAnalysis.Run(plan);
            Assert.All(PlanFiles.Render(r), f => Assert.DoesNotContain("NaN", f.Text));
        }
        catch (UnstableModelException) { }
        catch (ModelInputException) { }
    }

    private static readonly JToken[] Edge =
    [
        JValue.CreateNull(), new JValue(0), new JValue(-1), new JValue(1), new JValue(2), new JValue(0.5), new JValue(-0.5),
        new JValue(1e15), new JValue(-1e15), new JValue(1e-300), new JValue(1e-12), new JValue(3.5), new JValue(1e9), new JValue(long.MaxValue),
        new JValue(""), new JValue(" "), new JValue("x"), new JValue("y"), new JValue("rz"), new JValue("start"), new JValue("end"),
        new JValue("fixed"), new JValue("pinned"), new JValue("custom"), new JValue("brace"), new JValue("rigid"), new JValue("none"),
        new JValue("cantilever"), new JValue("fixed-fixed"), new JValue(true), new JValue(false), new JArray(), new JObject(),
        new JArray(new JValue("start"), new JValue("end")),
        // Numbers an integer key cannot hold: wider than 64 bits, fractional, negative, beyond any count.
        new JValue(BigInteger.Pow(10, 30)), new JValue(-BigInteger.Pow(2, 80)), new JValue(2.5), new JValue(-3000), new JValue(1e300),
    ];

    /// <summary>Whole-number keys of the format (counts, versions), which the integer mutation aims at first.</summary>
    private static readonly HashSet<string> IntegerKeys = ["formatVersion", "maxNodes", "refinements", "elementsAcrossNarrowest", "modes", "stories"];

    private static readonly JToken[] HugeIntegers =
    [
        new JValue(BigInteger.Pow(2, 64)), new JValue(BigInteger.Pow(10, 40)), new JValue(-BigInteger.Pow(2, 100)), new JValue(long.MaxValue),
        new JValue(long.MinValue), new JValue(2.5), new JValue(-1), new JValue(0), new JValue(1e300), new JValue(int.MaxValue + 1L),
    ];

    private static readonly Gen<string> Structural =
        Gen.Select(Gen.Int[0, Seeds.Length - 1], Gen.Int[1, 4], Gen.Int[0, int.MaxValue].Array[12])
            .Select(t => MutateTree(Seeds[t.Item1], t.Item2, t.Item3));

    private static string MutateTree(string seed, int count, int[] rnd)
    {
        JContainer root;
        try { if (JToken.Parse(seed) is JContainer c) root = c; else return seed; } catch (Newtonsoft.Json.JsonException) { return seed; }
        var ids = root.SelectTokens("$..id").Select(t => t.ToString()).Distinct().ToArray();
        int r = 0;
        int Next(int n) => n <= 0 ? 0 : rnd[r++ % rnd.Length] % n;
        for (int k = 0; k < count; k++)
        {
            var all = root.DescendantsAndSelf().Where(t => t is not JProperty).ToArray();
            var target = all[Next(all.Length)];
            if (target == root) continue;
            switch (Next(8))
            {
                case 7: // an integer key (or any integer) given a huge, negative or fractional number
                    {
                        var ints = root.Descendants().OfType<JProperty>().Where(q => IntegerKeys.Contains(q.Name) || q.Value.Type == JTokenType.Integer).ToArray();
                        if (ints.Length > 0) ints[Next(ints.Length)].Value = HugeIntegers[Next(HugeIntegers.Length)].DeepClone();
                    }
                    break;
                case 0: Replace(target, Edge[Next(Edge.Length)].DeepClone()); break;
                case 1: if (ids.Length > 0) Replace(target, new JValue(ids[Next(ids.Length)])); break;
                case 2: // drop the key or the array entry
                    if (target.Parent is JProperty p) p.Remove(); else target.Remove();
                    break;
                case 3: if (target.Parent is JArray) target.AddAfterSelf(target.DeepClone()); break;
                case 4: Replace(target, all[Next(all.Length)].DeepClone()); break;   // a value from elsewhere
                case 5: // rename a key to another key of the model
                    if (target.Parent is JProperty rp && rp.Parent is JObject owner)
                    {
                        var names = root.Descendants().OfType<JProperty>().Select(q => q.Name).Distinct().ToArray();
                        string name = names[Next(names.Length)];
                        if (owner.Property(name) is null) { var v = rp.Value; rp.Remove(); owner.Add(name, v); }
                    }
                    break;
                default: // scale a number
                    if (target is JValue { Type: JTokenType.Float or JTokenType.Integer } nv)
                        Replace(target, new JValue((double)nv * new[] { -1.0, 0.0, 1e-6, 1e6, 1e12, 1.0000001 }[Next(6)]));
                    break;
            }
        }
        return root.ToString();

        static void Replace(JToken t, JToken with)
        {
            if (t.Parent is JProperty p) p.Value = with;
            else if (t.Parent is JArray) t.Replace(with);
        }
    }

    private static readonly Gen<string> Textual =
        Gen.Select(Gen.Int[0, Seeds.Length - 1], Gen.Int[0, int.MaxValue], Gen.Char['\t', '~'], Gen.Int[0, 3])
            .Select(t =>
            {
                var (si, pos0, ch, op) = t;
                string s = Seeds[si];
                if (s.Length == 0) return ch.ToString();
                int pos = pos0 % s.Length;
                return op switch
                {
                    0 => s[..pos] + ch + s[(pos + 1)..],
                    1 => s.Remove(pos, 1),
                    2 => s.Insert(pos, ch.ToString()),
                    _ => s[..pos],   // truncated file
                };
            });

    /// <summary>
    /// One lenient-JSON form (leading zero, hexadecimal, single quotes, an unquoted or single-quoted key, a trailing comma,
    /// a NUL byte, NaN/Infinity, a plus sign) written at a random place of a seed, built on the tree so that it stands
    /// where a value or key stands, never inside a string. Index of the form, text.
    /// </summary>
    private static readonly Gen<(int Form, string Text)> LenientText =
        Gen.Select(Gen.Int[0, Seeds.Length - 1], Gen.Int[0, 9], Gen.Int[0, int.MaxValue])
            .Select(t => (t.Item2, WriteLenient(Seeds[t.Item1], t.Item2, t.Item3)));

    internal const string Mark = "@@lenient@@";

    internal static string WriteLenient(string seed, int form, int pick)
    {
        JContainer root;
        try { if (JToken.Parse(seed) is JObject o) root = o; else return ""; } catch (Newtonsoft.Json.JsonException) { return ""; }
        var values = root.Descendants().OfType<JValue>().Where(v => v.Parent is JProperty or JArray).ToArray();
        var props = root.Descendants().OfType<JProperty>().ToArray();
        var containers = root.DescendantsAndSelf().OfType<JContainer>().Where(c => c is JObject { Count: > 0 } or JArray { Count: > 0 }).ToArray();
        if (values.Length == 0 || props.Length == 0) return "";
        var v = values[pick % values.Length];
        string Swap(string lenient)
        {
            if (v.Parent is JProperty p) p.Value = new JValue(Mark); else v.Replace(new JValue(Mark));
            return root.ToString().Replace("\"" + Mark + "\"", lenient, StringComparison.Ordinal);
        }
        switch (form)
        {
            case 0: return Swap("0" + (pick % 900 + 100));                  // leading zero: 0144
            case 1: return Swap("0x" + (pick % 4096).ToString("X"));          // hexadecimal
            case 2: return Swap("'text'");                                    // single-quoted string
            case 3:
            case 4:
                {
                    var p = props[pick % props.Length];
                    string name = p.Name.All(char.IsAsciiLetterOrDigit) && p.Name.Length > 0 && char.IsAsciiLetter(p.Name[0]) ? p.Name : "key";
                    var owner = (JObject)p.Parent!;
                    if (owner.Property(name) is not null && owner.Property(name) != p) return "";
                    var value = p.Value;
                    p.Replace(new JProperty(Mark, value));
                    return root.ToString().Replace("\"" + Mark + "\"", form == 3 ? name : "'" + name + "'", StringComparison.Ordinal);
                }
            case 5: // trailing comma after the last entry of an array or object
                {
                    var c = containers[pick % containers.Length];
                    if (c is JArray a) a.Add(new JValue(Mark)); else ((JObject)c).Add(Mark, 0);
                    return System.Text.RegularExpressions.Regex.Replace(root.ToString(), "\\s*\"" + Mark + "\"(: 0)?", "");
                }
            case 6: return Swap("\0" + v.ToString(Newtonsoft.Json.Formatting.None)); // a NUL byte before a value
            case 7: return Swap(new[] { "NaN", "Infinity", "-Infinity" }[pick % 3]);
            case 8: return Swap("+" + (pick % 1000));                         // a plus sign
            default: return Swap("." + (pick % 1000));                        // a number without its leading digit
        }
    }

    [Fact]
    public void LenientJsonFormsOfEveryShippedAndCorpusModelAreRefusedWithTheirPlace()
    {
        // RFC 8259 (Bray 2017) has none of these forms: each text must be refused as "not valid JSON", with line and column.
        var (iter, time) = Budget();
        LenientText.Sample(t =>
        {
            if (t.Text.Length == 0) return;
            var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(t.Text, "lenient.json"));
            var d = Assert.Single(e.Diagnostics);
            Assert.True(d.Problem.Contains("not valid JSON", StringComparison.Ordinal), $"form {t.Form}: {d}");
            Assert.True(d.Line > 0 && d.Column > 0, $"form {t.Form}: no place in {d}");
        }, writeLine: output.WriteLine, iter: iter, time: time);
    }

    [Fact]
    public void StructuralMutationsOfEveryShippedAndCorpusModel()
    {
        var (iter, time) = Budget();
        Structural.Sample(Pipeline, writeLine: output.WriteLine, iter: iter, time: time);
    }

    [Fact]
    public void TextMutationsOfEveryShippedAndCorpusModel()
    {
        var (iter, time) = Budget();
        Textual.Sample(Pipeline, writeLine: output.WriteLine, iter: iter, time: time);
    }
}
