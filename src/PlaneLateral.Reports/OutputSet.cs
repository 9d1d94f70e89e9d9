using System.Text;
using PlaneLateral.Output;

namespace PlaneLateral.Reports;

/// <summary>
/// A set of output files, text and binary (PNG), written so that each appears whole or not at all, by the one atomic
/// writer of the project (<see cref="AtomicFiles"/>: temporary files beside the targets, renamed over them only when all
/// are written).
/// </summary>
public static class OutputSet
{
    private static readonly UTF8Encoding Utf8NoBom = new(false);

    /// <summary>Text as UTF-8 without a byte-order mark, as <see cref="AtomicFiles"/> writes it.</summary>
    public static (string Name, byte[] Bytes) Text(string name, string text) => (name, Utf8NoBom.GetBytes(text));

    /// <summary>Writes the files into <paramref name="directory"/> (created if needed), by <see cref="AtomicFiles"/>.</summary>
    /// <returns>Full paths written, in the order given.</returns>
    /// <exception cref="IOException">The folder cannot be created or written; nothing was replaced.</exception>
    public static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<(string Name, byte[] Bytes)> files) =>
        AtomicFiles.WriteAll(directory, files);
}
