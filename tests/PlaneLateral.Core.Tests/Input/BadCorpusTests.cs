using System.Text.RegularExpressions;
using Newtonsoft.Json.Linq;
using PlaneLateral.Cli;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// Every bad model of tests/corpus/bad (manifest.json) through the command line as typed: its own message (the
/// fragment the manifest names, at the JSON path it names), a non-zero exit code, no stack trace, no output folder, and
/// the input file byte for byte as it was. The expected fragments are the reader's own wording of each problem, the
/// project's error contract (docs/model-format.md, docs/hardening.md): common practice, not a published source.
/// </summary>
public sealed class BadCorpusTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-corpus-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>tests/corpus/bad, found by walking up from the test binaries to the repository root.</summary>
    internal static string CorpusFolder
    {
        get
        {
            for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
            {
                string p = Path.Combine(d.FullName, "tests", "corpus", "bad");
                if (File.Exists(Path.Combine(p, "manifest.json"))) return p;
            }
            throw new DirectoryNotFoundException("tests/corpus/bad not found above " + AppContext.BaseDirectory);
        }
    }

    internal static IEnumerable<JObject> Manifest() =>
        ((JArray)JObject.Parse(File.ReadAllText(Path.Combine(CorpusFolder, "manifest.json")))["cases"]!).Cast<JObject>();

    public static TheoryData<string> Files()
    {
        var data = new TheoryData<string>();
        foreach (var c in Manifest()) data.Add((string)c["file"]!);
        return data;
    }

    // A .NET stack frame line ("   at Namespace.Type.Method(...)") or an exception type name in the output.
    private static readonly Regex StackTrace = new(@"^\s+at \S+\(|\w+Exception\b|--- End of", RegexOptions.Multiline);

    [Fact]
    public void TheCorpusCoversEveryCategoryTheIssueLists()
    {
        var cases = Manifest().ToList();
        Assert.True(cases.Count >= 40, $"{cases.Count} bad models; the issue asks for at least 40");
        var categories = cases.Select(c => (string)c["category"]!).ToHashSet();
        foreach (var need in new[] { "syntax", "wrong type", "missing key", "unknown reference", "duplicate", "non-positive", "non-finite",
                     "magnitude", "units", "disconnected", "mechanism", "levels", "drift checks", "comparisons", "size limit", "fuzz finding" })
            Assert.Contains(need, categories);
        foreach (var f in Directory.GetFiles(CorpusFolder, "*.json").Select(Path.GetFileName).Where(f => f != "manifest.json"))
            Assert.Contains(cases, c => (string)c["file"]! == f);   // no file without its expectation
    }

    [Fact]
    public void AFileAboveTheSizeLimitIsRefusedBeforeItIsRead()
    {
        // Limit 8 MiB = 8·1024·1024 = 8388608 bytes (derived from ModelLimits' documented value). A sparse file of one byte more.
        string big = Path.Combine(_dir, "huge.json");
        using (var fs = new FileStream(big, FileMode.CreateNew)) fs.SetLength(8388608 + 1);
        var e = new StringWriter();
        int code = CliApp.Run(["solve", big, "--out", Path.Combine(_dir, "out")], new StringWriter(), e);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("the file is 8388609 bytes, more than the 8388608 bytes", e.ToString());
        Assert.False(Directory.Exists(Path.Combine(_dir, "out")));
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void BadModelIsRefusedWithItsOwnMessage(string file)
    {
        var c = Manifest().Single(x => (string)x["file"]! == file);
        string input = Path.Combine(CorpusFolder, file);
        byte[] before = File.ReadAllBytes(input);
        string fragment = (string)c["expect"]!;
        string? path = (string?)c["path"];
        int exit = (int)c["exit"]!;

        // A case may name its commands (a building file: `compare` reads planar models only).
        var commands = c["commands"] is JArray named ? named.Select(t => (string)t!).ToArray()
            : exit == ExitCodes.BadModel ? new[] { "solve", "validate", "compare" } : ["solve"];
        foreach (var command in commands)
        {
            string outDir = Path.Combine(_dir, command);
            var o = new StringWriter();
            var e = new StringWriter();
            string[] args = command == "validate" ? [command, input] : [command, input, "--out", outDir];
            var clock = System.Diagnostics.Stopwatch.StartNew();
            int code = CliApp.Run(args, o, e);
            clock.Stop();
            string all = o + "\n" + e;

            // A hang guard, not a speed measurement (speed is measured under benchmarks/): a bad file must be refused
            // before any heavy work, so even on a loaded CI machine it never takes minutes. Each takes well under a second
            // alone; 120 s leaves room for the other test assemblies running beside this one.
            Assert.True(clock.Elapsed < TimeSpan.FromSeconds(120), $"{command} {file}: took {clock.Elapsed.TotalSeconds:0.0} s");
            Assert.True(code == exit, $"{command} {file}: exit {code}, expected {exit}\n{all}");
            Assert.DoesNotMatch(StackTrace, all);
            Assert.False(Directory.Exists(outDir), $"{command} {file}: created the output folder");
            string? line = e.ToString().Split('\n').FirstOrDefault(l => l.Contains(fragment, StringComparison.Ordinal));
            Assert.True(line is not null, $"{command} {file}: no line with \"{fragment}\" in\n{all}");
            if (path is not null)
            {
                string at = " at " + path + ((bool)c["pathIsPrefix"]! ? "" : ":");
                Assert.True(line!.Contains(at, StringComparison.Ordinal), $"{command} {file}: expected \"{at}\" in\n{line}");
            }
        }
        Assert.Equal(before, File.ReadAllBytes(input));
    }
}
