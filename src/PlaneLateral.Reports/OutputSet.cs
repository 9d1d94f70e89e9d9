using System.Text;
using PlaneLateral.Output;

namespace PlaneLateral.Reports;

/// <summary>
/// A set of output files, text and binary (PNG), written so that each appears whole or not at all: every file is
/// first written beside its target under a temporary name and only then renamed over it; if any write fails, every
/// temporary file is removed and no target is touched. The binary counterpart of <see cref="AtomicFiles"/>.
/// </summary>
public static class OutputSet
{
    private static readonly UTF8Encoding Utf8NoBom = new(false);

    /// <summary>Text as UTF-8 without a byte-order mark, as <see cref="AtomicFiles"/> writes it.</summary>
    public static (string Name, byte[] Bytes) Text(string name, string text) => (name, Utf8NoBom.GetBytes(text));

    /// <summary>Writes the files into <paramref name="directory"/> (created if needed).</summary>
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
                using var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None);
                fs.Write(bytes);
                fs.Flush(flushToDisk: true);
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
