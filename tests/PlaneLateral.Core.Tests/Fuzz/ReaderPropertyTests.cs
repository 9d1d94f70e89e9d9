using CsCheck;
using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Fuzz;

/// <summary>
/// Property-based fuzzing of the reader and the analysis (CsCheck): whatever the text, the reader either returns a
/// model or throws <see cref="ModelInputException"/>; whatever model it returns, the analysis either gives finite
/// results or throws one of the two documented exceptions. Seeds are fixed in CI by CsCheck's default settings.
/// </summary>
public class ReaderPropertyTests
{
    private static readonly string Seed = Json(Cantilever(144, 10, new { id = "S", shape = "rectangle", b = 12.0, d = 120.0 },
        new { id = "MAT", E = 3605.0, nu = 0.2 }, 3));

    private static void ReadAndSolve(string text)
    {
        StructureModel model;
        try { model = ModelReader.Parse(text, "fuzz.json"); }
        catch (ModelInputException e)
        {
            Assert.NotEmpty(e.Diagnostics);
            return;
        }
        try
        {
            var r = LinearStaticAnalysis.Run(model);
            foreach (var c in r.Cases) Assert.All(c.Displacements, v => Assert.True(double.IsFinite(v)));
        }
        catch (UnstableModelException) { }
        catch (ModelInputException) { }
    }

    [Fact]
    public void ByteMutationsNeverCrash() =>
        Gen.Select(Gen.Int[0, Seed.Length - 1], Gen.Char['\t', '~'], Gen.Int[0, 2])
            .Sample(t =>
            {
                var (pos, ch, op) = t;
                string text = op switch
                {
                    0 => Seed[..pos] + ch + Seed[(pos + 1)..],
                    1 => Seed.Remove(pos, 1),
                    _ => Seed.Insert(pos, ch.ToString()),
                };
                ReadAndSolve(text);
            }, iter: 3000);

    private static readonly JToken[] Replacements =
    [
        JValue.CreateNull(), new JValue(0), new JValue(-1), new JValue(1e308), new JValue(-1e-308), new JValue(""),
        new JValue("N0"), new JValue(true), new JArray(), new JObject(), new JValue(0.5), new JValue(1e-30), new JValue("x"),
    ];

    [Fact]
    public void ValueReplacementsNeverCrash()
    {
        var seed = JObject.Parse(Seed);
        var leaves = seed.SelectTokens("$..*").Where(t => t is JValue || t is JArray || t is JObject).Select(t => t.Path).Distinct().ToArray();
        Gen.Select(Gen.Int[0, leaves.Length - 1], Gen.Int[0, Replacements.Length - 1], Gen.Int[0, leaves.Length - 1], Gen.Int[0, Replacements.Length - 1])
            .Sample(t =>
            {
                var m = (JObject)seed.DeepClone();
                foreach (var (leaf, rep) in new[] { (t.Item1, t.Item2), (t.Item3, t.Item4) })
                {
                    var target = m.SelectToken(leaves[leaf]);
                    if (target is null) continue;
                    if (target.Parent is JProperty p) p.Value = Replacements[rep].DeepClone();
                    else if (target.Parent is JArray) target.Replace(Replacements[rep].DeepClone());
                }
                ReadAndSolve(m.ToString());
            }, iter: 3000);
    }
}
