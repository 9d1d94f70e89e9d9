using System.Net.Sockets;
using System.Numerics;
using Newtonsoft.Json.Linq;
using PlaneLateral.Cli;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// Strict JSON (RFC 8259, Bray 2017, sections 2-7: the grammar of values, numbers without leading zeros, strings in double
/// quotes, no trailing commas, control characters escaped; plus the comments docs/model-format.md allows), whole-number
/// keys that read any JSON number, and only regular files as models. The expected line and column are derived from the
/// test's own text (the place where the departure was written), not from running the reader.
/// </summary>
public sealed class StrictInputTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-strict-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    // A one-bay portal in kN and m (invented), written by hand so the places below can be found in the text.
    private const string Good = """
        {
          "formatVersion": 1,
          "title": "strict JSON base (invented)",
          "units": { "force": "kN", "length": "m" },
          "materials": [ { "id": "steel", "E": 2.0e8, "nu": 0.3 } ],
          "sections": [ { "id": "col", "shape": "general", "A": 0.01, "I": 1.0e-4, "shearArea": 0.005 } ],
          "nodes": [ { "id": "A", "x": 0, "y": 0 }, { "id": "B", "x": 0, "y": 3.5 }, { "id": "C", "x": 6.0, "y": 3.5 }, { "id": "D", "x": 6.0, "y": 0 } ],
          "members": [
            { "id": "c1", "start": "A", "end": "B", "section": "col", "material": "steel" },
            { "id": "b1", "start": "B", "end": "C", "section": "col", "material": "steel" },
            { "id": "c2", "start": "D", "end": "C", "section": "col", "material": "steel" }
          ],
          "supports": [ { "node": "A", "type": "fixed" }, { "node": "D", "type": "fixed" } ],
          "loadCases": [ { "id": "wind", "nodalLoads": [ { "node": "B", "fx": 10.0 } ] } ]
        }
        """;

    [Fact]
    public void TheBaseIsStrictJsonAndReads() => Assert.Equal(4, ModelReader.Parse(Good, "good.json").Nodes.Count);

    public static TheoryData<string, string, string, string> Lenient() => new()
    {
        // name, text replaced, replacement (its first character is where the reader must point), message fragment
        { "leading zero (read as octal 100 before)", "\"y\": 3.5 }, { \"id\": \"C\"", "\"y\": 0144 }, { \"id\": \"C\"", "a number with a leading zero (0144)" },
        { "zero-padded decimal", "\"fx\": 10.0", "\"fx\": 010.0", "a number with a leading zero" },
        { "hexadecimal", "\"x\": 6.0, \"y\": 3.5", "\"x\": 0x6, \"y\": 3.5", "a hexadecimal number (0x6)" },
        { "single-quoted string", "\"strict JSON base (invented)\"", "'strict JSON base (invented)'", "a string in single quotes" },
        { "single-quoted key", "\"title\":", "'title':", "a key in single quotes" },
        { "unquoted key", "\"title\":", "title:", "a key without quotes (title)" },
        { "trailing comma in an array", "{ \"node\": \"D\", \"type\": \"fixed\" } ]", "{ \"node\": \"D\", \"type\": \"fixed\" }, ]", "a comma before ']'" },
        { "trailing comma in an object", "\"type\": \"fixed\" } ]", "\"type\": \"fixed\", } ]", "a comma before '}'" },
        { "NUL byte between values", "\"title\":", "\0\"title\":", "a NUL byte" },
        { "NUL byte in a string", "strict JSON base", "strict\0JSON base", "a NUL byte (character 0) inside a string" },
        { "raw line break in a string", "strict JSON base", "strict\nJSON base", "the control character U+000A inside a string" },
        { "NaN", "\"E\": 2.0e8", "\"E\": NaN", "NaN is not a finite number" },
        { "Infinity", "\"A\": 0.01", "\"A\": Infinity", "Infinity is not a finite number" },
        { "minus Infinity", "\"fx\": 10.0", "\"fx\": -Infinity", "-Infinity is not a finite number" },
        { "plus sign", "\"fx\": 10.0", "\"fx\": +10.0", "a number with a plus sign" },
        { "leading point", "\"nu\": 0.3", "\"nu\": .3", "a number that starts with a point" },
        { "trailing point", "\"x\": 6.0, \"y\": 3.5", "\"x\": 6., \"y\": 3.5", "a number that ends with a point" },
        { "bare word", "\"fixed\" }, { \"node\": \"D\"", "fixed }, { \"node\": \"D\"", "a bare word (fixed)" },
        { "capitalised literal", "\"fx\": 10.0", "\"fx\": True", "'True' is not a JSON value" },
        { "bad escape", "strict JSON base", "strict \\q JSON base", "the escape \\q" },
        { "non-breaking space between values", "\"title\":", "\u00A0\"title\":", "the character U+00A0" },
    };

    [Theory]
    [MemberData(nameof(Lenient))]
    public void EachLenientFormIsRefusedWhereItStands(string name, string from, string to, string fragment)
    {
        Assert.Contains(from, Good);
        string text = Good.Replace(from, to, StringComparison.Ordinal);
        // Derived: the place of the departure is the first character where the edited text differs from the original.
        int at = 0;
        while (at < Good.Length && Good[at] == text[at]) at++;
        int line = 1 + text[..at].Count(c => c == '\n');
        int lineStart = text.LastIndexOf('\n', Math.Max(0, at - 1)) + 1;

        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(text, "lenient.json"));
        var d = Assert.Single(e.Diagnostics);
        Assert.Contains("not valid JSON", d.Problem);
        Assert.True(d.Problem.Contains(fragment, StringComparison.Ordinal), $"{name}: {d}");
        Assert.Equal(line, d.Line);
        // The column points at the offending token: at or after the first changed character, on its line.
        Assert.InRange(d.Column, 1, text.Length);
        Assert.True(Math.Abs(d.Column - (at - lineStart + 1)) <= 2, $"{name}: column {d.Column}, the change is at column {at - lineStart + 1}");
        Assert.False(string.IsNullOrWhiteSpace(d.Fix));
        Assert.StartsWith("$", d.JsonPath);
    }

    [Fact]
    public void TheLeadingZeroCaseNamesItsJsonPath()
    {
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(Good.Replace("\"y\": 3.5 }, { \"id\": \"C\"", "\"y\": 0144 }, { \"id\": \"C\""), "z.json"));
        Assert.Equal("$.nodes[1].y", Assert.Single(e.Diagnostics).JsonPath);
    }

    [Fact]
    public void AnEscapedKeyIsUnescapedInTheJsonPath()
    {
        // RFC 8259 §7: "n\u006fdes" is the key "nodes". The path of a refusal inside it names the unescaped key (the
        // unescaping does not use reflection, so a Native AOT build gives the same message: docs/benchmarks.md).
        string text = Good.Replace("\"nodes\": [ { \"id\": \"A\", \"x\": 0, \"y\": 0 }", "\"n\\u006fdes\": [ { \"id\": \"A\", \"x\": 00, \"y\": 0 }", StringComparison.Ordinal);
        Assert.NotEqual(Good, text);
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(text, "escaped.json"));
        Assert.Equal("$.nodes[0].x", Assert.Single(e.Diagnostics).JsonPath);
    }

    [Fact]
    public void CommentsTheDocsAllowAndEveryRfcNumberFormRead()
    {
        // docs/model-format.md: "//" and "/* */" comments are ignored. RFC 8259 §6: -0.5, 1E+3, 2e-1, 0 and escapes are JSON.
        string text = "// a model with comments\n" + Good
            .Replace("\"nu\": 0.3", "\"nu\": 3E-1 /* Poisson */", StringComparison.Ordinal)
            .Replace("\"fx\": 10.0", "\"fx\": 1.0e+1, \"fy\": -0.0", StringComparison.Ordinal)
            .Replace("strict JSON base", "strict \\u004aSON \\\"base\\\" \\/", StringComparison.Ordinal);
        var m = ModelReader.Parse(text, "comments.json");
        Assert.Equal(0.3, m.Materials[0].Nu, 12);
        Assert.Equal(10e3, m.LoadCases[0].NodalLoads[0].Fx, 9);   // 10 kN in N (kN = 1000 N, SI definition)
        Assert.Contains("JSON \"base\" /", m.Title);
    }

    [Fact]
    public void AnUnclosedCommentAndPlainSyntaxErrorsStillGiveLineAndColumn()
    {
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(Good + "\n/* never closed", "c.json"));
        var d = Assert.Single(e.Diagnostics);
        Assert.Contains("not valid JSON", d.Problem);
        Assert.True(d.Line > 1);
    }

    [Fact]
    public void DeepNestingIsRefusedWithoutExhaustingTheStack()
    {
        // 100 000 nested arrays: a recursive checker would overflow the stack (common practice: bound the nesting).
        string text = "{\"formatVersion\": 1, \"description\": " + new string('[', 100_000) + new string(']', 100_000) + "}";
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(text, "deep.json"));
        Assert.NotEmpty(e.Diagnostics);
    }

    // ---- whole-number keys ----------------------------------------------------------------------------------------

    private static string PanelModel(Action<JObject> change)
    {
        var d = JObject.Parse(File.ReadAllText(Path.Combine(Repo(), "models", "panels", "two-story-wall.json")));
        change((JObject)d["panels"]![0]!);
        return d.ToString();
    }

    internal static string Repo() => Path.GetFullPath(Path.Combine(BadCorpusTests.CorpusFolder, "..", "..", ".."));

    [Fact]
    public void AFormatVersionWiderThan64BitsIsItsOwnMessageAndTheOtherProblemsAreStillListed()
    {
        // 2^100 does not fit in a 64-bit integer (2^63 - 1 is the largest): it crashed every command with exit 5 before.
        var o = JObject.Parse(Good);
        o["formatVersion"] = new JValue(BigInteger.Pow(2, 100));
        o["nodes"]![3]!["x"] = "six";
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(o.ToString(), "v.json"));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.formatVersion" && d.Problem.Contains("1267650600228229401496703205376"));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.nodes[3].x");
    }

    public static TheoryData<string, object, string> MeshNumbers() => new()
    {
        { "maxNodes", BigInteger.Pow(10, 30), "far outside the range" },
        { "maxNodes", -3000, "it must be a whole number from 1" },
        { "maxNodes", 0, "it must be a whole number from 1" },
        { "refinements", 2.5, "not a whole number" },
        { "refinements", 1e300, "out of range" },
        { "elementsAcrossNarrowest", BigInteger.Pow(2, 64), "far outside the range" },
    };

    [Theory]
    [MemberData(nameof(MeshNumbers))]
    public void APanelMeshKeyReadsAnyJsonNumberSafely(string key, object value, string fragment)
    {
        string text = PanelModel(p =>
        {
            p["mesh"]![key] = new JValue(value);
            p["thickness"] = "thick";   // a second problem, which must still be listed
        });
        var e = Assert.Throws<ModelInputException>(() => ModelReader.Parse(text, "mesh.json"));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == $"$.panels[0].mesh.{key}" && d.Problem.Contains(fragment));
        Assert.Contains(e.Diagnostics, d => d.JsonPath == "$.panels[0].thickness");
    }

    // ---- only regular files ----------------------------------------------------------------------------------------

    private static (int Code, string Err) Validate(string path)
    {
        var o = new StringWriter(); var e = new StringWriter();
        int code = CliApp.Run(["validate", path], o, e);
        return (code, e.ToString());
    }

    [Fact]
    public void AFolderIsRefusedAsAModel()
    {
        var (code, err) = Validate(_dir);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("this is a folder, not a model file", err);
    }

    [Fact]
    public async Task ADeviceIsRefusedBeforeItIsRead()
    {
        if (!File.Exists("/dev/zero")) return;   // a Unix device; Windows has none at that path
        // /dev/zero reports a length of 0 and never ends: read, it grew to 4 GB before (exit 134), and a check that
        // opened it to look for a building's "plan" key once spun on it for ever. A hang guard, not a timing.
        var (code, err) = await Task.Run(() => Validate("/dev/zero")).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("this is a character device, not a regular file", err);
    }

    [Fact]
    public async Task ASocketIsRefusedBeforeItIsRead()
    {
        if (OperatingSystem.IsWindows()) return;
        string path = Path.Combine(_dir, "model.sock");
        using var s = new Socket(AddressFamily.Unix, SocketType.Stream, ProtocolType.Unspecified);
        s.Bind(new UnixDomainSocketEndPoint(path));
        var (code, err) = await Task.Run(() => Validate(path)).WaitAsync(TimeSpan.FromSeconds(60));   // hang guard
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("this is a socket, not a regular file", err);
    }

    [Fact]
    public async Task ANamedPipeIsRefusedWithoutBlocking()
    {
        if (OperatingSystem.IsWindows()) return;
        string path = Path.Combine(_dir, "model.fifo");
        try
        {
            using var p = System.Diagnostics.Process.Start(new System.Diagnostics.ProcessStartInfo("mkfifo", [path]) { UseShellExecute = false });
            p!.WaitForExit();
            if (p.ExitCode != 0) return;
        }
        catch (System.ComponentModel.Win32Exception) { return; }   // no mkfifo on this machine
        // Opened for reading, a named pipe waits for a writer for ever: the type must be judged before opening.
        // A hang guard, not a timing: WaitAsync throws TimeoutException if validate blocks on the pipe.
        var (code, err) = await Task.Run(() => Validate(path)).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("this is a named pipe (FIFO), not a regular file", err);
        // solve looks at the file first to tell a building in plan from a planar model: that look must not block either.
        var o = new StringWriter(); var e = new StringWriter();
        int solveCode = await Task.Run(() => CliApp.Run(["solve", path, "--out", Path.Combine(_dir, "out")], o, e)).WaitAsync(TimeSpan.FromSeconds(60));
        Assert.Equal(ExitCodes.BadModel, solveCode);
        Assert.Contains("this is a named pipe (FIFO), not a regular file", e.ToString());
    }

    /// <summary>A stream that never ends, as a device or a growing file may be.</summary>
    private sealed class Endless : Stream
    {
        public long Served;
        public override int Read(byte[] buffer, int offset, int count) { Array.Fill(buffer, (byte)' ', offset, count); Served += count; return count; }
        public override bool CanRead => true; public override bool CanSeek => false; public override bool CanWrite => false;
        public override long Length => 0; public override long Position { get => 0; set { } }
        public override void Flush() { } public override long Seek(long o, SeekOrigin s) => 0; public override void SetLength(long v) { } public override void Write(byte[] b, int o, int c) { }
    }

    [Fact]
    public void TheSizeLimitIsCountedWhileReadingNotTakenFromTheReportedLength()
    {
        // The stream reports a length of 0 (as /dev/zero does) and never ends: the read stops one byte past the limit.
        var s = new Endless();
        Assert.Null(ModelFile.ReadBounded(s, ModelLimits.MaxFileBytes));
        Assert.InRange(s.Served, ModelLimits.MaxFileBytes + 1, ModelLimits.MaxFileBytes + 81920);
        // And a stream within the limit is read whole (derived: 3 bytes in, 3 bytes out).
        Assert.Equal([1, 2, 3], ModelFile.ReadBounded(new MemoryStream([1, 2, 3]), ModelLimits.MaxFileBytes));
    }
}
