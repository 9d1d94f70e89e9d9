using System.Diagnostics;
using System.Runtime.ExceptionServices;
using System.Text;
using System.Text.RegularExpressions;

namespace PlaneLateral.Output;

/// <summary>
/// Writes a set of files so that each appears whole or not at all: every file is first written beside its
/// target under a temporary name and only then renamed over it. If any file fails, no target is touched.
/// A set that would replace a file the run reads (<see cref="ProtectInputs"/>) is refused before anything is written,
/// and temporary files that a stopped run left in the folder are removed first (docs/hardening.md, "Outputs are
/// atomic").
/// </summary>
public static partial class AtomicFiles
{
    private static readonly AsyncLocal<IReadOnlyList<string>?> Inputs = new();

    /// <summary>
    /// Marks <paramref name="paths"/> (those that name existing files; the rest are ignored) as inputs of the work that
    /// follows on this flow, until the result is disposed: <see cref="WriteAll(string, IReadOnlyList{ValueTuple{string, byte[]}})"/>
    /// then refuses any set that would replace one of them, through a link too.
    /// </summary>
    public static IDisposable ProtectInputs(IEnumerable<string> paths)
    {
        var before = Inputs.Value;
        var list = new List<string>(before ?? []);
        foreach (var p in paths)
        {
            if (string.IsNullOrEmpty(p)) continue;
            try { if (File.Exists(p)) list.Add(Identity(p)); }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException) { }
        }
        Inputs.Value = list;
        return new Restore(() => Inputs.Value = before);
    }

    private sealed class Restore(Action undo) : IDisposable
    {
        public void Dispose() => undo();
    }

    /// <summary>The full path of the file a path finally names (links followed).</summary>
    private static string Identity(string path)
    {
        string full = Path.GetFullPath(path);
        try
        {
            if (new FileInfo(full).ResolveLinkTarget(returnFinalTarget: true) is { } target) full = Path.GetFullPath(target.FullName);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
        // The folder may be reached through a link as well.
        string? dir = Path.GetDirectoryName(full);
        if (dir is not null)
            try
            {
                if (new DirectoryInfo(dir).ResolveLinkTarget(returnFinalTarget: true) is { } d) full = Path.Combine(Path.GetFullPath(d.FullName), Path.GetFileName(full));
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
        return full;
    }

    private static readonly StringComparison PathComparison =
        OperatingSystem.IsWindows() || OperatingSystem.IsMacOS() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;

    /// <summary>The temporary name of this version: .&lt;name&gt;.&lt;process id&gt;-&lt;32 hex digits&gt;.partial.</summary>
    [GeneratedRegex(@"^\..+\.(?<pid>[0-9]+)-[0-9a-f]{32}\.partial$")]
    private static partial Regex PartialName();

    /// <summary>The temporary name of earlier versions: .&lt;name&gt;.&lt;32 hex digits&gt;.partial.</summary>
    [GeneratedRegex(@"^\..+\.[0-9a-f]{32}\.partial$")]
    private static partial Regex EarlierPartialName();

    /// <summary>A temporary file of another run is left over when that run has ended: its process no longer runs, or
    /// the file is older than a day (a process id can be reused), or it has an earlier version's name.</summary>
    internal static bool IsStale(string fileName, DateTime lastWriteUtc, DateTime nowUtc)
    {
        var m = PartialName().Match(fileName);
        if (!m.Success) return EarlierPartialName().IsMatch(fileName);
        if (nowUtc - lastWriteUtc > TimeSpan.FromDays(1)) return true;
        if (!int.TryParse(m.Groups["pid"].Value, out int pid)) return true;
        if (pid == Environment.ProcessId) return false;
        try
        {
            using var p = Process.GetProcessById(pid);
            return p.HasExited;
        }
        catch (ArgumentException) { return true; }           // no such process
        catch (InvalidOperationException) { return true; }
        catch (System.ComponentModel.Win32Exception) { return false; }   // cannot tell: keep it
    }

    /// <summary>Removes the tool's temporary files that an ended run left in <paramref name="directory"/>; never
    /// another file, never one of a run still going.</summary>
    /// <returns>How many were removed.</returns>
    public static int RemoveStalePartials(string directory)
    {
        int removed = 0;
        IEnumerable<string> candidates;
        try { candidates = Directory.EnumerateFiles(directory, ".*.partial").ToArray(); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException) { return 0; }
        var now = DateTime.UtcNow;
        foreach (var f in candidates)
        {
            try
            {
                if (!IsStale(Path.GetFileName(f), File.GetLastWriteTimeUtc(f), now)) continue;
                File.Delete(f);
                removed++;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
        }
        return removed;
    }

    /// <summary>Writes <paramref name="files"/> (file name → text, as UTF-8 without a byte-order mark) into <paramref name="directory"/>, creating it if needed.</summary>
    /// <returns>Full paths written, in the order given.</returns>
    /// <exception cref="IOException">The folder cannot be created or written; nothing was replaced.</exception>
    public static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<(string Name, string Text)> files) =>
        WriteAll(directory, files.Select(f => OutputFile.Text(f.Name, f.Text)).ToArray());

    /// <summary>Writes <paramref name="files"/> (file name → bytes: text, PNG, ...) into <paramref name="directory"/>, creating it if needed.</summary>
    /// <returns>Full paths written, in the order given.</returns>
    /// <exception cref="IOException">The folder cannot be created or written; nothing was replaced.</exception>
    public static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<(string Name, byte[] Bytes)> files) =>
        WriteAll(directory, files.Select(f => OutputFile.Bytes(f.Name, f.Bytes)).ToArray());

    /// <summary>
    /// Writes <paramref name="files"/> into <paramref name="directory"/>, creating it if needed: each file's bytes go
    /// straight into its temporary file as they are produced (a streamed file is never held whole in memory), every
    /// temporary file is flushed to disk, and only then are they renamed over their targets, in the order given.
    /// </summary>
    /// <returns>Full paths written, in the order given.</returns>
    /// <exception cref="IOException">The folder cannot be created or written; nothing was replaced.</exception>
    /// <remarks>An exception from a file's writer (any kind) removes every temporary file and replaces nothing; it is
    /// passed on as it is, unless it is an I/O failure, which is reported as the folder's. The temporary files are
    /// written by up to <see cref="DefaultWriters"/> threads at once (each file whole by one thread, so its bytes are those of
    /// a lone write); the renames follow on the calling thread, in the order given.</remarks>
    public static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<OutputFile> files) =>
        WriteAllWith(directory, files, DefaultWriters);

    private static IReadOnlyList<string> WriteAllWith(string directory, IReadOnlyList<OutputFile> files, int writers)
    {
        try
        {
            Directory.CreateDirectory(directory);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw new IOException($"cannot create the output folder '{directory}': {e.Message}", e);
        }

        if (Inputs.Value is { Count: > 0 } inputs)
            foreach (var f in files)
            {
                string target = Identity(Path.Combine(directory, f.Name));
                if (inputs.Any(i => string.Equals(i, target, PathComparison)))
                    throw new OutputOverwritesInputException(target, f.Name);
            }
        RemoveStalePartials(directory);

        // A folder standing where a file must go would stop the renames half-way: refuse before any target changes.
        foreach (var f in files)
        {
            string final = Path.Combine(directory, f.Name);
            if (Directory.Exists(final)) throw new IOException($"'{final}' is a folder, so the file {f.Name} cannot be written there");
        }
        var temps = files.Select(f => (Temp: Path.Combine(directory, $".{f.Name}.{Environment.ProcessId}-{Guid.NewGuid():N}.partial"), Final: Path.Combine(directory, f.Name))).ToArray();
        var failure = WriteTemporaries(files, temps.Select(t => t.Temp).ToArray(), writers);
        if (failure is not null)
        {
            foreach (var (temp, _) in temps) TryDelete(temp);
            if (failure is IOException or UnauthorizedAccessException)
                throw new IOException($"cannot write into the output folder '{directory}': {failure.Message}", failure);
            ExceptionDispatchInfo.Throw(failure);
        }

        int moved = 0;
        try
        {
            foreach (var (temp, final) in temps) { File.Move(temp, final, overwrite: true); moved++; }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            foreach (var (temp, _) in temps.Skip(moved)) TryDelete(temp);
            throw new IOException($"cannot put the files in place in '{directory}' ({moved} of {temps.Length} replaced): {e.Message}", e);
        }
        return temps.Select(t => t.Final).ToArray();
    }

    private static void TryDelete(string path)
    {
        try { File.Delete(path); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}

/// <summary>An output set would replace a file the run reads (the model, or another input): refused before anything
/// is written.</summary>
public sealed class OutputOverwritesInputException(string path, string name)
    : IOException($"the output file {name} would replace '{path}', which this run reads")
{
    /// <summary>The input that would have been replaced.</summary>
    public string InputPath => path;
}
