using System.Text;

namespace PlaneLateral.Output;

/// <summary>
/// Writes a set of files so that each appears whole or not at all: every file is first written beside its
/// target under a temporary name and only then renamed over it. If any file fails, no target is touched.
/// </summary>
public static class AtomicFiles
{
    private static readonly UTF8Encoding Utf8NoBom = new(false);

    /// <summary>Writes <paramref name="files"/> (file name → text, as UTF-8 without a byte-order mark) into <paramref name="directory"/>, creating it if needed.</summary>
    /// <returns>Full paths written, in the order given.</returns>
    /// <exception cref="IOException">The folder cannot be created or written; nothing was replaced.</exception>
    public static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<(string Name, string Text)> files) =>
        WriteAll(directory, files.Select(f => (f.Name, Utf8NoBom.GetBytes(f.Text))).ToArray());

    /// <summary>Writes <paramref name="files"/> (file name → bytes: text, PNG, ...) into <paramref name="directory"/>, creating it if needed.</summary>
    /// <returns>Full paths written, in the order given.</returns>
    /// <exception cref="IOException">The folder cannot be created or written; nothing was replaced.</exception>
    public static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<(string Name, byte[] Bytes)> files)
    {
        try
        {
            Directory.CreateDirectory(directory);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw new IOException($"cannot create the output folder '{directory}': {e.Message}", e);
        }

        var temps = new List<(string Temp, string Final)>();
        try
        {
            foreach (var (name, bytes) in files)
            {
                string final = Path.Combine(directory, name);
                // A folder standing where a file must go would stop the renames half-way: refuse before any target changes.
                if (Directory.Exists(final)) throw new IOException($"'{final}' is a folder, so the file {name} cannot be written there");
                string temp = Path.Combine(directory, $".{name}.{Guid.NewGuid():N}.partial");
                temps.Add((temp, final));
                using (var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
                {
                    fs.Write(bytes);
                    fs.Flush(flushToDisk: true);
                }
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            foreach (var (temp, _) in temps) TryDelete(temp);
            throw new IOException($"cannot write into the output folder '{directory}': {e.Message}", e);
        }

        int moved = 0;
        try
        {
            foreach (var (temp, final) in temps) { File.Move(temp, final, overwrite: true); moved++; }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            foreach (var (temp, _) in temps.Skip(moved)) TryDelete(temp);
            throw new IOException($"cannot put the files in place in '{directory}' ({moved} of {temps.Count} replaced): {e.Message}", e);
        }
        return temps.Select(t => t.Final).ToArray();
    }

    private static void TryDelete(string path)
    {
        try { File.Delete(path); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}
