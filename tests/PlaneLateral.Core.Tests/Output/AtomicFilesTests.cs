using PlaneLateral.Output;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// All files or none (DEVELOPERS.md, Outputs; common practice for a results set): <see cref="AtomicFiles"/>.WriteAll
/// replaces every target or, when one cannot be written, none, and leaves no temporary file behind.
/// </summary>
public sealed class AtomicFilesTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-atomic-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void AFolderWhereAFileMustGoLeavesEveryEarlierFileAsItWas()
    {
        AtomicFiles.WriteAll(_dir, [("a.txt", "first a"), ("b.txt", "first b"), ("c.txt", "first c")]);
        // c.txt becomes a folder: the third file of the set cannot be put in place.
        File.Delete(Path.Combine(_dir, "c.txt"));
        Directory.CreateDirectory(Path.Combine(_dir, "c.txt"));
        var e = Assert.Throws<IOException>(() => AtomicFiles.WriteAll(_dir, [("a.txt", "second a"), ("b.txt", "second b"), ("c.txt", "second c")]));
        Assert.Contains("c.txt", e.Message);
        Assert.Equal("first a", File.ReadAllText(Path.Combine(_dir, "a.txt")));
        Assert.Equal("first b", File.ReadAllText(Path.Combine(_dir, "b.txt")));
        Assert.Equal(["a.txt", "b.txt", "c.txt"], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void ASuccessfulWriteReplacesEveryFileWholeWithoutAByteOrderMark()
    {
        AtomicFiles.WriteAll(_dir, [("a.txt", "old"), ("b.txt", "old")]);
        var written = AtomicFiles.WriteAll(_dir, [("a.txt", "new ä"), ("b.txt", "new b")]);
        Assert.Equal(2, written.Count);
        // UTF-8 without a byte-order mark: "new ä" is 6 bytes, ä being C3 A4 (Unicode Standard, UTF-8 encoding form).
        Assert.Equal([0x6E, 0x65, 0x77, 0x20, 0xC3, 0xA4], File.ReadAllBytes(Path.Combine(_dir, "a.txt")));
        Assert.Equal("new b", File.ReadAllText(Path.Combine(_dir, "b.txt")));
        Assert.DoesNotContain(Directory.GetFiles(_dir), f => f.EndsWith(".partial", StringComparison.Ordinal));
    }
}
