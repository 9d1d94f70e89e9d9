using System.Diagnostics;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// Same bytes on any machine (docs/hardening.md): the shipped models solved, compared and reported by the command-line
/// program in child processes that see 1 and then 2 processors (DOTNET_PROCESSOR_COUNT, the runtime's documented
/// setting): every file byte-identical, and none names a thread count, a vector width or a folder (common practice:
/// outputs depend only on the input, DEVELOPERS.md). (With the vector instructions off, DOTNET_EnableAVX=0, one
/// plane-stress estimate of `compare` differs in its twelfth digit: docs/hardening.md records it as open.)
/// </summary>
public sealed class ProcessorCountTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-cpus-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static void RunChild(string processors, string command, string model, string outDir) =>
        RunChild(processors, [command, model, "--out", outDir], outDir);

    private static void RunChild(string processors, string[] args, string outDir)
    {
        string command = string.Join(' ', args);
        var psi = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
            WorkingDirectory = Path.GetDirectoryName(outDir)!,
        };
        psi.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "planelateral.dll"));
        foreach (var a in args) psi.ArgumentList.Add(a);
        psi.Environment["DOTNET_PROCESSOR_COUNT"] = processors;
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        string err = p.StandardError.ReadToEnd();
        Assert.True(p.WaitForExit(TimeSpan.FromMinutes(3)), "hang guard");
        _ = stdout.Result;
        Assert.True(p.ExitCode == 0, $"{command} with {processors} processors: exit {p.ExitCode}\n{err}");
    }

    [Theory]
    [InlineData("demo-clinic.json", "solve")]
    [InlineData("demo-clinic.json", "compare")]
    [InlineData("demo-clinic.json", "report")]
    [InlineData("panels/two-story-wall.json", "solve")]
    public void OneAndTwoProcessorsWriteTheSameBytes(string relative, string command)
    {
        string model = Path.Combine(AppContext.BaseDirectory, "models", relative);
        string one = Path.Combine(_dir, "one"), two = Path.Combine(_dir, "two");
        RunChild("1", command, model, one);
        RunChild("2", command, model, two);
        var files = Directory.GetFiles(one).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
        Assert.NotEmpty(files);
        Assert.Equal(files, Directory.GetFiles(two).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray());
        foreach (var f in files)
        {
            byte[] a = File.ReadAllBytes(Path.Combine(one, f!));
            Assert.True(a.SequenceEqual(File.ReadAllBytes(Path.Combine(two, f!))), $"{f} differs between 1 and 2 processors");
            if (f!.EndsWith(".png", StringComparison.Ordinal)) continue;
            string text = System.Text.Encoding.UTF8.GetString(a);
            Assert.DoesNotMatch(@"\b[0-9]+ threads?\b", text);
            Assert.DoesNotContain("256-bit", text);
            Assert.DoesNotContain(_dir, text);
            Assert.DoesNotContain(AppContext.BaseDirectory.TrimEnd('/'), text);
        }
    }

    [Fact]
    public void TheSweepWritesTheSameBytesOnOneAndTwoProcessors()
    {
        // The sweep's points run on every processor and its two figures are drawn at the same time; 6 h/l values × both
        // ends with the converged panel (the command's default models).
        string one = Path.Combine(_dir, "sweep-one"), two = Path.Combine(_dir, "sweep-two");
        RunChild("1", ["sweep", "--points", "6", "--out", one], one);
        RunChild("2", ["sweep", "--points", "6", "--out", two], two);
        foreach (var f in new[] { "sweep.csv", "sweep-ratio.png", "sweep-shear-share.png" })
            Assert.True(File.ReadAllBytes(Path.Combine(one, f)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(two, f))), $"{f} differs between 1 and 2 processors");
    }
}
