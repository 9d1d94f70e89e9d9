using System.Globalization;
using System.Text;

namespace PlaneLateral.Output;

/// <summary>
/// One file of an output set, given by name and by how its bytes are produced: a finished text or byte array, or a
/// writer that streams the text (UTF-8 without a byte-order mark, line feeds) straight into the file, so a results file
/// of any size is never held in memory as one string (docs/hardening.md, "Size limits"). <see cref="AtomicFiles"/>
/// writes a set of them all-or-nothing.
/// </summary>
public sealed class OutputFile
{
    internal static readonly UTF8Encoding Utf8NoBom = new(false);

    private readonly Action<Stream> _write;

    private OutputFile(string name, Action<Stream> write)
    {
        Name = name;
        _write = write;
    }

    /// <summary>The file's name inside the output folder.</summary>
    public string Name { get; }

    /// <summary>A finished text, written as UTF-8 without a byte-order mark.</summary>
    public static OutputFile Text(string name, string text) => new(name, s => s.Write(Utf8NoBom.GetBytes(text)));

    /// <summary>Finished bytes (text already encoded, a PNG, ...).</summary>
    public static OutputFile Bytes(string name, byte[] bytes) => new(name, s => s.Write(bytes));

    /// <summary>Bytes still being made (e.g. a figure drawn on another thread): waited for when the file is written, so
    /// the files before it in a set are written meanwhile. A fault of the task stops the set as a writer's exception does.</summary>
    public static OutputFile Bytes(string name, Task<byte[]> bytes) => new(name, s => s.Write(bytes.GetAwaiter().GetResult()));

    /// <summary>
    /// A text written by <paramref name="write"/> into a writer over the file itself (UTF-8 without a byte-order mark,
    /// <c>NewLine</c> a line feed, invariant culture); the writer is flushed after it returns. An exception thrown by
    /// <paramref name="write"/> stops the set: <see cref="AtomicFiles"/> removes what it had written and replaces nothing.
    /// </summary>
    public static OutputFile Streamed(string name, Action<TextWriter> write) => new(name, s =>
    {
        using var w = new InvariantStreamWriter(s);
        write(w);
        w.Flush();
    });

    /// <summary>Writes the file's bytes into <paramref name="stream"/> (left open).</summary>
    public void WriteTo(Stream stream) => _write(stream);

    /// <summary>The file's bytes, produced in memory: for tests and small files; a large streamed file should go
    /// to disk through <see cref="AtomicFiles"/>.</summary>
    public byte[] ToBytes()
    {
        using var ms = new MemoryStream();
        WriteTo(ms);
        return ms.ToArray();
    }

    /// <summary>The file's text (UTF-8), produced in memory: for tests and small files.</summary>
    public string ToText() => Utf8NoBom.GetString(ToBytes());

    /// <summary>A stream writer that keeps its stream open, ends lines with a line feed and formats in the invariant culture.</summary>
    private sealed class InvariantStreamWriter : StreamWriter
    {
        public InvariantStreamWriter(Stream s) : base(s, Utf8NoBom, 1 << 16, leaveOpen: true) => NewLine = "\n";

        public override IFormatProvider FormatProvider => CultureInfo.InvariantCulture;
    }
}
