using System.Globalization;
using System.Numerics;
using System.Text;
using Newtonsoft.Json;
using Newtonsoft.Json.Linq;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// The compact JSON tree the model readers validate (Model/JsonTree.cs, Model/JsonTreeReader.cs) against the reference
/// library, Newtonsoft.Json (JToken.ReadFrom with line information, the settings ModelReader.ReadTree used before it
/// had its own reader): for every shipped model, every file of the bad-input corpus and generated JSON, the same kinds,
/// keys, values bit for bit, lines and columns, key positions, paths (JToken.Path) and printed values. Text the reference
/// refuses (duplicate keys, integers it cannot hold) must be declined by the fast reader, so the reference's own error
/// is reported.
/// </summary>
public sealed class JsonTreeTests
{
    private static JToken? Reference(string text)
    {
        try
        {
            using var reader = new JsonTextReader(new StringReader(text)) { DateParseHandling = DateParseHandling.None, FloatParseHandling = FloatParseHandling.Double };
            var root = JToken.ReadFrom(reader, new JsonLoadSettings
            {
                LineInfoHandling = LineInfoHandling.Load,
                DuplicatePropertyNameHandling = DuplicatePropertyNameHandling.Error,
                CommentHandling = CommentHandling.Ignore,
            });
            return reader.Read() && reader.TokenType != JsonToken.Comment ? null : root;
        }
        catch (JsonReaderException) { return null; }
    }

    /// <summary>The fast tree (when it reads the text) and the tree converted from the reference both equal the reference.</summary>
    private static bool Check(string text, string what)
    {
        var reference = Reference(text);
        var fast = JsonTreeReader.TryRead(text);
        if (reference is null)
        {
            Assert.True(fast is null, $"{what}: the reference refuses the text, so the fast reader must decline it");
            return false;
        }
        bool strict = StrictJson.Check(text) is null;
        Assert.True(fast is null || strict, $"{what}: the fast reader read text that is not strict JSON: {StrictJson.Check(text)}");
        if (!strict) return false;   // refused before the reference's tree is used (ModelReader.ReadTree)
        Same(reference, JsonTreeReader.FromReference(reference), what);
        if (fast is null) return false;
        Same(reference, fast, what);
        return true;
    }

    private static void Same(JToken r, JsonNode n, string what)
    {
        string at = $"{what} at {r.Path}";
        Assert.True(r.Type.ToString() == n.Type.ToString(), $"{at}: kind {n.Type}, reference {r.Type}");
        var li = (IJsonLineInfo)r;
        Assert.True(li.LineNumber == n.Line && li.LinePosition == n.Column, $"{at}: ({n.Line}, {n.Column}), reference ({li.LineNumber}, {li.LinePosition})");
        Assert.Equal(r.Path, n.Path);
        switch (r)
        {
            case JObject o:
            {
                var m = (JsonMap)n;
                var props = o.Properties().ToList();
                var entries = m.Properties().ToList();
                Assert.Equal(props.Count, m.Count);
                for (int i = 0; i < props.Count; i++)
                {
                    Assert.Equal(props[i].Name, entries[i].Name);
                    var pl = (IJsonLineInfo)props[i];
                    Assert.True(pl.LineNumber == entries[i].Value.KeyLine && pl.LinePosition == entries[i].Value.KeyColumn,
                        $"{at}: key '{props[i].Name}' at ({entries[i].Value.KeyLine}, {entries[i].Value.KeyColumn}), reference ({pl.LineNumber}, {pl.LinePosition})");
                    Assert.Same(entries[i].Value, m[props[i].Name]);
                    Same(props[i].Value, entries[i].Value, what);
                }
                break;
            }
            case JArray a:
            {
                var l = (JsonList)n;
                Assert.Equal(a.Count, l.Count);
                for (int i = 0; i < a.Count; i++) Same(a[i], l[i], what);
                break;
            }
            case JValue v:
            {
                var s = (JsonScalar)n;
                if (v.Value is double d) Assert.Equal(BitConverter.DoubleToInt64Bits(d), BitConverter.DoubleToInt64Bits((double)s.Value!));
                else Assert.Equal(v.Value, s.Value);
                Assert.Equal(v.ToString(Formatting.None), n.ToCompactJson());
                Assert.Equal(v.ToString(), n.ToString());
                break;
            }
        }
    }

    private static string RepositoryFolder(string name)
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
            if (File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) return Path.Combine(d.FullName, name);
        throw new DirectoryNotFoundException("the repository root above " + AppContext.BaseDirectory);
    }

    [Fact]
    public void EveryShippedModelReadsFastAndAsTheReferenceLibraryDoes()
    {
        var files = Directory.GetFiles(RepositoryFolder("models"), "*.json", SearchOption.AllDirectories);
        Assert.True(files.Length >= 20, $"{files.Length} shipped models");
        foreach (var f in files)
            Assert.True(Check(File.ReadAllText(f), f), $"{f}: the fast reader declined a shipped model");
    }

    [Fact]
    public void EveryCorpusFileReadsAsTheReferenceLibraryDoes()
    {
        int fast = 0;
        var files = Directory.GetFiles(RepositoryFolder(Path.Combine("tests", "corpus")), "*.json", SearchOption.AllDirectories);
        foreach (var f in files)
        {
            string text = File.ReadAllText(f);
            if (Check(text, f)) fast++;
        }
        Assert.True(fast > files.Length / 2, $"the fast reader read {fast} of {files.Length} corpus files");
        Assert.True(fast < files.Length, "the corpus has syntax errors, which the fast reader must decline");
    }

    /// <summary>Shipped models with one character deleted, inserted or replaced: whatever the fast reader reads is
    /// strict JSON (StrictJson passes it) and the reference library's tree; everything else it declines.</summary>
    [Fact]
    public void MutatedModelsAreReadAsTheReferenceLibraryReadsThemOrDeclined()
    {
        const string alphabet = "\",:{}[]0123456789.-+eE/ \t\r\nx'\\u";
        var rng = new Random(19);
        int declined = 0;
        foreach (var f in Directory.GetFiles(RepositoryFolder("models"), "*.json", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            string text = File.ReadAllText(f);
            for (int k = 0; k < 60; k++)
            {
                int at = rng.Next(text.Length);
                char c = alphabet[rng.Next(alphabet.Length)];
                string mutated = rng.Next(3) switch
                {
                    0 => text.Remove(at, 1),
                    1 => text.Insert(at, c.ToString()),
                    _ => text.Remove(at, 1).Insert(at, c.ToString()),
                };
                if (!Check(mutated, $"{f} mutated at {at}")) declined++;
            }
        }
        Assert.True(declined > 0, "no mutation was declined");
    }

    [Fact]
    public void GeneratedJsonReadsAsTheReferenceLibraryDoes()
    {
        int fast = 0, total = 0;
        for (int seed = 1; seed <= 400; seed++)
        {
            var rng = new Random(seed);
            var sb = new StringBuilder();
            Space(rng, sb);
            Value(rng, sb, 0);
            Space(rng, sb);
            string text = sb.ToString();
            Assert.True(StrictJson.Check(text) is null, $"seed {seed}: the generator wrote text that is not strict JSON: {StrictJson.Check(text)}");
            total++;
            if (Check(text, $"seed {seed}")) fast++;
        }
        Assert.True(fast > total / 2, $"the fast reader read {fast} of {total} generated texts");
    }

    [Theory]
    [InlineData("{\"a\": 1, \"a\": 2}", "Property with the name 'a' already exists")]   // Newtonsoft's DuplicatePropertyNameHandling.Error
    [InlineData("{\"k\": [1, 2], \"b\": 3, \"k\": {}}", "Property with the name 'k' already exists")]
    public void ADuplicateKeyIsReportedInTheReferenceLibrarysWords(string text, string fragment)
    {
        var e = Assert.Throws<ModelInputException>(() => ModelReader.ReadTree(text, "dup.json"));
        Assert.Contains(fragment, e.Diagnostics[0].Problem);
        Assert.Null(JsonTreeReader.TryRead(text));
    }

    /// <summary>Departures from RFC 8259 (Bray 2017: section 2 grammar and whitespace, section 6 numbers, section 7
    /// strings), truncated text, and comments (allowed, but read on the library path): the fast reader declines each,
    /// so StrictJson and the JSON library report or read it as before.</summary>
    [Theory]
    [InlineData("0144")]
    [InlineData("[0144]")]
    [InlineData("{\"a\": 01}")]
    [InlineData("{\"a\": -01}")]
    [InlineData("{'a': 1}")]
    [InlineData("{\"a\": 'x'}")]
    [InlineData("{a: 1}")]
    [InlineData("{\"a\": 0x10}")]
    [InlineData("{\"a\": +1}")]
    [InlineData("{\"a\": .5}")]
    [InlineData("{\"a\": 1.}")]
    [InlineData("{\"a\": 1.e5}")]
    [InlineData("{\"a\": 1e}")]
    [InlineData("{\"a\": 1e+}")]
    [InlineData("{\"a\": -}")]
    [InlineData("{\"a\": 1.5.2}")]
    [InlineData("{\"a\": 12abc}")]
    [InlineData("{\"a\": NaN}")]
    [InlineData("{\"a\": -Infinity}")]
    [InlineData("{\"a\": True}")]
    [InlineData("{\"a\": tru}")]
    [InlineData("{\"a\": truex}")]
    [InlineData("{\"a\": nul}")]
    [InlineData("{\"a\": undefined}")]
    [InlineData("[1,]")]
    [InlineData("[1,,2]")]
    [InlineData("[,1]")]
    [InlineData("{\"a\": 1,}")]
    [InlineData("{,}")]
    [InlineData("{\"a\" 1}")]
    [InlineData("{\"a\": 1 \"b\": 2}")]
    [InlineData("{\"a\": \"x\ty\"}")]
    [InlineData("{\"a\": \"x\u0000y\"}")]
    [InlineData("{\"a\": \"x\\qy\"}")]
    [InlineData("{\"a\": \"\\u12G4\"}")]
    [InlineData("{\"a\": \"\\u12\"}")]
    [InlineData("{\"a\": \"never closed}")]
    [InlineData("{\"a\": 1} x")]
    [InlineData("{\"a\": 1}{}")]
    [InlineData("{\"a\": [1, 2}")]
    [InlineData("{\"a\": 1")]
    [InlineData("{\"a\": ")]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData("\u00A0{\"a\": 1}")]
    [InlineData("{\"a\":\u00A01}")]
    [InlineData("{\"a\": 1}\u000B")]
    [InlineData("// c\n{\"a\": 1}")]
    [InlineData("{\"a\": 1 /* c */}")]
    [InlineData("{\"a\": 1}\r")]
    public void TextThatIsNotStrictJsonIsDeclined(string text) => Assert.Null(JsonTreeReader.TryRead(text));

    [Fact]
    public void TextOutsideTheCommonCaseTakesTheReferencePathAndGivesTheSameTree()
    {
        // Comments, an integer wider than 64 bits, a lone surrogate escape, a byte-order mark, nesting of 62 levels.
        string[] texts =
        [
            "{\"a\": 1 /* note */, // line\n \"b\": [2, 3]}",
            "{\"big\": 123456789012345678901234567890, \"neg\": -99999999999999999999}",
            "{\"s\": \"\\ud800 alone\"}",
            "\uFEFF{\"a\": 1}",
            new string('[', 62) + "1" + new string(']', 62),
        ];
        foreach (var t in texts)
        {
            Assert.Null(JsonTreeReader.TryRead(t));
            var reference = Reference(t);
            if (reference is null) continue;
            Same(reference, ModelReader.ReadTree(t, "x.json"), t);
        }
    }

    // ---- a generator of strict JSON with the forms that matter to the reader --------------------------------------

    private static readonly string[] Names =
        ["id", "x", "y", "nodes", "a b", "a.b", "it's", "back\\\\slash", "[0]", "", "tab\\there", "caf\\u00e9", "line\\u2028sep", "q\\\"uote", "slash\\/", "(p)", "ünï", "$ref", "_u", "k9"];

    private static readonly string[] Numbers =
        ["0", "-0", "1", "-1", "12", "1.0", "-0.0", "0.5", "1e5", "1E5", "2.5e-3", "2.5E+3", "1e400", "-1e400", "4.9e-324", "1e-400",
         "9223372036854775807", "-9223372036854775808", "9223372036854775808", "123456789012345678901234567890", "3.141592653589793238462643",
         "0.1", "100000000000000000000.0", "17976931348623157e292"];

    private static readonly string[] Strings =
        ["", "N1", "plain text", "esc \\\" \\\\ \\/ \\b \\f \\n \\r \\t", "\\u00e9\\u00E9\\u0041", "pair \\ud83d\\ude00", "é ü ∞", "rectangle", "N1"];

    private static void Space(Random rng, StringBuilder sb) =>
        sb.Append(rng.Next(8) switch { 0 => "", 1 => " ", 2 => "\n", 3 => "\r\n", 4 => "\t", 5 => "  \n    ", 6 => "\n\n ", _ => " " });

    private static void Value(Random rng, StringBuilder sb, int depth)
    {
        int pick = depth >= 5 ? 2 + rng.Next(6) : rng.Next(8);
        switch (pick)
        {
            case 0:
            {
                sb.Append('{');
                int n = rng.Next(depth == 0 ? 25 : 6);
                var used = new HashSet<string>();
                for (int i = 0; i < n; i++)
                {
                    string name = rng.Next(60) == 0 ? "dup" : Names[rng.Next(Names.Length)] + (rng.Next(3) == 0 ? "" : i.ToString(CultureInfo.InvariantCulture));
                    if (!used.Add(name) && name != "dup") continue;
                    if (sb[^1] != '{') sb.Append(',');
                    Space(rng, sb);
                    sb.Append('"').Append(name).Append('"');
                    if (rng.Next(3) == 0) Space(rng, sb);
                    sb.Append(':');
                    Space(rng, sb);
                    Value(rng, sb, depth + 1);
                    if (rng.Next(3) == 0) Space(rng, sb);
                }
                Space(rng, sb);
                sb.Append('}');
                break;
            }
            case 1:
            {
                sb.Append('[');
                int n = rng.Next(depth == 0 ? 40 : 8);
                for (int i = 0; i < n; i++)
                {
                    if (i > 0) sb.Append(',');
                    Space(rng, sb);
                    Value(rng, sb, depth + 1);
                }
                Space(rng, sb);
                sb.Append(']');
                break;
            }
            case 2:
            case 3:
                sb.Append(rng.Next(3) == 0
                    ? Numbers[rng.Next(Numbers.Length)]
                    : rng.Next(2) == 0
                        ? ((long)(rng.NextDouble() * 2e6) - 1_000_000).ToString(CultureInfo.InvariantCulture)
                        : ((rng.NextDouble() - 0.5) * Math.Pow(10, rng.Next(-8, 12))).ToString("R", CultureInfo.InvariantCulture));
                break;
            case 4:
            case 5:
                sb.Append('"').Append(Strings[rng.Next(Strings.Length)]).Append('"');
                break;
            case 6: sb.Append(rng.Next(2) == 0 ? "true" : "false"); break;
            default: sb.Append("null"); break;
        }
    }
}
