using PlaneLateral.Cli;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// Every shipped model, solved (and compared, when it has checks) twice through the command line, the second time from a
/// copy in another folder: every results file byte-identical, no temporary file left, the input unchanged (common practice:
/// outputs depend only on the input, DEVELOPERS.md).
/// </summary>
public sealed class DeterminismTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-determinism-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    public static TheoryData<string> ShippedModels()
    {
        var data = new TheoryData<string>();
        string root = Path.Combine(AppContext.BaseDirectory, "models");
        foreach (var f in Directory.GetFiles(root, "*.json", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
            data.Add(Path.GetRelativePath(root, f));
        return data;
    }

    private static int Run(params string[] args) => CliApp.Run(args, new StringWriter(), new StringWriter());

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public void TwoRunsGiveByteIdenticalFiles(string relative)
    {
        string model = Path.Combine(AppContext.BaseDirectory, "models", relative);
        byte[] input = File.ReadAllBytes(model);
        string copyDir = Directory.CreateDirectory(Path.Combine(_dir, "copy")).FullName;
        string copy = Path.Combine(copyDir, Path.GetFileName(model));
        File.Copy(model, copy);

        foreach (var command in new[] { "solve", "compare" })
        {
            string out1 = Path.Combine(_dir, command + "1"), out2 = Path.Combine(_dir, command + "2");
            int c1 = Run(command, model, "--out", out1);
            int c2 = Run(command, copy, "--out", out2);
            Assert.Equal(c1, c2);
            if (command == "compare" && c1 != 0) continue;   // a model without comparison checks: refused both times, nothing written
            Assert.Equal(0, c1);
            var names1 = Directory.GetFiles(out1).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
            var names2 = Directory.GetFiles(out2).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
            Assert.Equal(names1, names2);
            Assert.NotEmpty(names1);
            Assert.DoesNotContain(names1, n => n!.StartsWith('.'));   // no temporary file left behind
            foreach (var n in names1)
                Assert.True(File.ReadAllBytes(Path.Combine(out1, n!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(out2, n!))), $"{relative}: {command}: {n} differs");
        }
        Assert.Equal(input, File.ReadAllBytes(model));
    }
}
