using System.Diagnostics;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// Same bytes on any machine (docs/hardening.md): the shipped models solved, compared and reported by the command-line
/// program in child processes that see 1 and then 2 processors (DOTNET_PROCESSOR_COUNT, the runtime's documented
/// setting): every file byte-identical, and none names a thread count, a vector width or a folder (common practice:
/// outputs depend only on the input, DEVELOPERS.md). Likewise with the vector instructions switched off
/// (DOTNET_EnableAVX=0, the runtime's documented setting): the dense kernels then run on 128-bit vectors, in the same
/// operation order and without fused multiply-add, so every file is byte-identical to the normal run's.
/// </summary>
public sealed class ProcessorCountTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-cpus-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static Task RunChild(string variable, string value, string command, string model, string outDir) =>
        RunChild(variable, value, [command, model, "--out", outDir], outDir);

    private static async Task RunChild(string variable, string value, string[] args, string outDir)
    {
        string command = string.Join(' ', args), model = "";
        var psi = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
            WorkingDirectory = Path.GetDirectoryName(outDir)!,
        };
        psi.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "planelateral.dll"));
        foreach (var a in args) psi.ArgumentList.Add(a);
        psi.Environment[variable] = value;
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        try
        {
            await p.WaitForExitAsync().WaitAsync(TimeSpan.FromMinutes(3)); // hang guard
        }
        catch (TimeoutException)
        {
            p.Kill(entireProcessTree: true);
            throw;
        }
        _ = await stdout;
        string err = await stderr;
        Assert.True(p.ExitCode == 0, $"{command} {model} with {variable}={value}: exit {p.ExitCode}\n{err}");
    }

    /// <summary>Runs <paramref name="command"/> once under each setting of <paramref name="variable"/> and compares every
    /// file written, byte for byte; none may name a thread count, a vector width or a folder.</summary>
    private async Task AssertSameBytes(string relative, string command, string variable, string first, string second)
    {
        string model = Path.Combine(AppContext.BaseDirectory, "models", relative);
        string one = Path.Combine(_dir, "one"), two = Path.Combine(_dir, "two");
        await RunChild(variable, first, command, model, one);
        await RunChild(variable, second, command, model, two);
        var files = Directory.GetFiles(one).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
        Assert.NotEmpty(files);
        Assert.Equal(files, Directory.GetFiles(two).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray());
        foreach (var f in files)
        {
            byte[] a = File.ReadAllBytes(Path.Combine(one, f!));
            Assert.True(a.SequenceEqual(File.ReadAllBytes(Path.Combine(two, f!))), $"{f} differs between {variable}={first} and {second}");
            if (f!.EndsWith(".png", StringComparison.Ordinal)) continue;
            string text = System.Text.Encoding.UTF8.GetString(a);
            Assert.DoesNotMatch(@"\b[0-9]+ threads?\b", text);
            Assert.DoesNotContain("-bit vector", text);
            Assert.DoesNotContain(_dir, text);
            Assert.DoesNotContain(AppContext.BaseDirectory.TrimEnd('/'), text);
        }
    }

    [Theory]
    [InlineData("demo-clinic.json", "solve")]
    [InlineData("demo-clinic.json", "compare")]
    [InlineData("demo-clinic.json", "report")]
    [InlineData("panels/two-story-wall.json", "solve")]
    public Task OneAndTwoProcessorsWriteTheSameBytes(string relative, string command) =>
        AssertSameBytes(relative, command, "DOTNET_PROCESSOR_COUNT", "1", "2");

    // demo-clinic's `compare` holds the plane-stress estimate (FACADE-N) whose twelfth digit used to change with the
    // vector instructions off (a fused multiply-add on the 256-bit path only).
    [Theory]
    [InlineData("demo-clinic.json", "compare")]
    [InlineData("panels/two-story-wall.json", "solve")]
    public Task VectorInstructionsOnAndOffWriteTheSameBytes(string relative, string command) =>
        AssertSameBytes(relative, command, "DOTNET_EnableAVX", "1", "0");

    [Fact]
    public async Task TheSweepWritesTheSameBytesOnOneAndTwoProcessors()
    {
        // The sweep's points run on every processor and its two figures are drawn at the same time; 6 h/l values × both
        // ends with the converged panel (the command's default models).
        string one = Path.Combine(_dir, "sweep-one"), two = Path.Combine(_dir, "sweep-two");
        await RunChild("DOTNET_PROCESSOR_COUNT", "1", ["sweep", "--points", "6", "--out", one], one);
        await RunChild("DOTNET_PROCESSOR_COUNT", "2", ["sweep", "--points", "6", "--out", two], two);
        foreach (var f in new[] { "sweep.csv", "sweep-ratio.png", "sweep-shear-share.png" })
            Assert.True(File.ReadAllBytes(Path.Combine(one, f)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(two, f))), $"{f} differs between 1 and 2 processors");
    }
}
