using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// <see cref="AtomicFiles"/> writes a set's temporary files on two threads at once (docs/hardening.md, "Outputs are
/// atomic"); the promise stays that of a lone writer (common practice for a results set): a failure in one file while
/// another is being written replaces nothing and leaves no temporary file, the bytes do not depend on how many threads
/// wrote them, and a writer on a helper thread formats in the caller's culture.
/// </summary>
public sealed class ConcurrentWritersTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(120);   // hang guard, not a timing

    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-writers-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>
    /// Two files in progress at the same time (each waits at a barrier for the other, having written half a megabyte);
    /// then the one named by <paramref name="failing"/> fails and the other finishes.
    /// </summary>
    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    public async Task AFailureInOneWriterWhileAnotherWritesReplacesNothing(int failing) => await Task.Run(() =>
    {
        AtomicFiles.WriteAll(_dir, [OutputFile.Text("results.json", "old results"), OutputFile.Text("displacements.csv", "old displacements"), OutputFile.Text("checks.csv", "old checks")], 1);
        using var both = new Barrier(2);
        bool met = true;
        OutputFile Writer(string name, int index) => OutputFile.Streamed(name, w =>
        {
            w.Write(new string('x', 1 << 19));
            w.Flush();
            met &= both.SignalAndWait(Guard);   // the other file is being written now
            if (index == failing) throw new InvalidOperationException($"the rows of {name} could not be produced");
            w.Write(new string('y', 1 << 19));
        });
        var e = Assert.Throws<InvalidOperationException>(() =>
            AtomicFiles.WriteAll(_dir, [Writer("results.json", 0), Writer("displacements.csv", 1), OutputFile.Text("checks.csv", "new checks")], 2));
        Assert.True(met, "the two writers were not in progress at the same time");
        Assert.Equal($"the rows of {(failing == 0 ? "results.json" : "displacements.csv")} could not be produced", e.Message);
        Assert.Equal("old results", File.ReadAllText(Path.Combine(_dir, "results.json")));
        Assert.Equal("old displacements", File.ReadAllText(Path.Combine(_dir, "displacements.csv")));
        Assert.Equal("old checks", File.ReadAllText(Path.Combine(_dir, "checks.csv")));
        Assert.Equal(["checks.csv", "displacements.csv", "results.json"], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }).WaitAsync(Guard);

    /// <summary>An I/O failure on the helper thread is reported as the folder's, as on the calling thread, and replaces nothing.</summary>
    [Fact]
    public async Task AnIoFailureOnTheHelperThreadIsTheFoldersAndReplacesNothing() => await Task.Run(() =>
    {
        AtomicFiles.WriteAll(_dir, [OutputFile.Text("a.csv", "old a"), OutputFile.Text("b.csv", "old b")], 1);
        using var both = new Barrier(2);
        var first = OutputFile.Streamed("a.csv", w => { w.Write("new a"); both.SignalAndWait(Guard); });
        var second = OutputFile.Streamed("b.csv", w => { both.SignalAndWait(Guard); throw new IOException("no space left on the device"); });
        var e = Assert.Throws<IOException>(() => AtomicFiles.WriteAll(_dir, [first, second], 2));
        Assert.Contains("cannot write into the output folder", e.Message);
        Assert.Contains("no space left on the device", e.Message);
        Assert.Equal("old a", File.ReadAllText(Path.Combine(_dir, "a.csv")));
        Assert.Equal("old b", File.ReadAllText(Path.Combine(_dir, "b.csv")));
        Assert.Equal(["a.csv", "b.csv"], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }).WaitAsync(Guard);

    /// <summary>Every results file of shipped models, written by one thread and by two: the same bytes (derived: each
    /// file is produced whole by one writer from results that are only read).</summary>
    [Theory]
    [InlineData("demo-clinic.json")]
    [InlineData("panels/masonry-wall-and-frame.json")]
    public async Task OneThreadAndTwoWriteTheSameBytes(string model) => await Task.Run(() =>
    {
        var run = ModelRun.Run(ModelReader.ReadFile(RepositoryFiles.ModelPath(model)));
        string one = Path.Combine(_dir, "one"), two = Path.Combine(_dir, "two");
        var names = AtomicFiles.WriteAll(one, ResultFiles.Files(run), 1).Select(Path.GetFileName).ToArray();
        Assert.Equal(names, AtomicFiles.WriteAll(two, ResultFiles.Files(run), 2).Select(Path.GetFileName).ToArray());
        Assert.True(names.Length > 2);
        foreach (var n in names)
            Assert.True(File.ReadAllBytes(Path.Combine(one, n!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(two, n!))), n);
    }).WaitAsync(Guard);

    /// <summary>A writer on the helper thread sees the caller's culture (the command line writes in the invariant
    /// culture whatever the host's: Output/CsvConventionTests).</summary>
    [Fact]
    public async Task AHelperThreadWritesInTheCallersCulture() => await Task.Run(() =>
    {
        var before = CultureInfo.CurrentCulture;
        // A culture with a decimal comma, as a host's may be (the tool is built with invariant globalization).
        var comma = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        comma.NumberFormat.NumberDecimalSeparator = ",";
        CultureInfo.CurrentCulture = comma;
        try
        {
            using var both = new Barrier(2);
            var first = OutputFile.Streamed("a.txt", w => { both.SignalAndWait(Guard); w.Write($"{0.5}"); });
            var second = OutputFile.Streamed("b.txt", w => { both.SignalAndWait(Guard); w.Write($"{0.5}"); });
            AtomicFiles.WriteAll(_dir, [first, second], 2);
            // The barrier holds each writer until the other has started, so they run on two threads; each formats 0.5
            // in the current culture of its thread.
            Assert.Equal("0,5", File.ReadAllText(Path.Combine(_dir, "a.txt")));
            Assert.Equal("0,5", File.ReadAllText(Path.Combine(_dir, "b.txt")));
        }
        finally { CultureInfo.CurrentCulture = before; }
    }).WaitAsync(Guard);
}
