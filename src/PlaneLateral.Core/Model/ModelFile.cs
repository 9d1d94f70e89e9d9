using System.Runtime.InteropServices;
using System.Text;

namespace PlaneLateral.Model;

/// <summary>
/// Reads a model file's text: only a regular file (a folder, device, named pipe or socket is refused with a clear
/// message before it is opened, since /dev/zero reports a length of 0 and never ends, and a named pipe blocks until a
/// writer comes), and never more than <see cref="ModelLimits.MaxFileBytes"/>, counted while reading, not only from the
/// length the file system reports. Text is decoded as File.ReadAllText does (UTF-8 unless a byte-order mark says otherwise).
/// </summary>
internal static class ModelFile
{
    private const string PathFix = "give the path of a model file (a .json text file), not a folder, device, pipe or socket";

    public static string ReadText(string path) => ReadText(path, out _);

    /// <summary>The file's text and its provenance: the SHA-256 of the very bytes read (what <c>sha256sum</c> prints for the file).</summary>
    public static string ReadText(string path, out InputFile input)
    {
        if (Directory.Exists(path))
            throw Refuse(path, "this is a folder, not a model file", PathFix);
        if (NotRegular(path) is { } kind)
            throw Refuse(path, $"this is {kind}, not a regular file; a model is read only from a regular file", PathFix);
        try
        {
            if (ModelLimits.CheckFileSize(path, new FileInfo(path).Length) is { } tooLarge) throw new ModelInputException([tooLarge]);
            using var fs = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1, FileOptions.SequentialScan);
            var bytes = ReadBounded(fs, ModelLimits.MaxFileBytes);
            if (bytes is null)
                throw Refuse(path, $"the file holds more than the {ModelLimits.MaxFileBytes} bytes (8 MiB) this version reads (counted while reading: the file grew, or its length was not reported)",
                    "check that this is the model file; split a very large model, or remove data the model does not need");
            input = InputFile.Of(path, bytes);
            using var reader = new StreamReader(new MemoryStream(bytes), new UTF8Encoding(false), detectEncodingFromByteOrderMarks: true);
            return reader.ReadToEnd();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw Refuse(path, $"cannot read the file: {e.Message}", "check the path and that the file is readable");
        }
    }

    /// <summary>Every byte of the stream, or null when there are more than <paramref name="limit"/>.</summary>
    internal static byte[]? ReadBounded(Stream s, long limit)
    {
        using var ms = new MemoryStream();
        var buffer = new byte[81920];
        long total = 0;
        int n;
        while ((n = s.Read(buffer, 0, (int)Math.Min(buffer.Length, limit + 1 - total))) > 0)
        {
            total += n;
            if (total > limit) return null;
            ms.Write(buffer, 0, n);
        }
        return ms.ToArray();
    }

    private static ModelInputException Refuse(string path, string problem, string fix) =>
        new([new ModelDiagnostic(path, 0, 0, "", problem, fix)]);

    /// <summary>What the path is when it is not a regular file ("a named pipe (FIFO)", ...), or null (regular, missing or unknown).</summary>
    internal static string? NotRegular(string path)
    {
        if (OperatingSystem.IsWindows())
        {
            try { return File.Exists(path) && (File.GetAttributes(path) & FileAttributes.Device) != 0 ? "a device" : null; }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException) { return null; }
        }
        int mode = UnixMode(path);
        if (mode < 0) return null;
        return (mode & 0xF000) switch
        {
            0x8000 => null,                              // S_IFREG
            0x4000 => "a folder",                        // S_IFDIR
            0x2000 => "a character device",              // S_IFCHR, e.g. /dev/zero
            0x6000 => "a block device",                  // S_IFBLK
            0x1000 => "a named pipe (FIFO)",             // S_IFIFO
            0xC000 => "a socket",                        // S_IFSOCK
            _ => null,
        };
    }

    // The runtime's own stat shim (libSystem.Native, shipped with every .NET on Linux and macOS): its FileStatus record
    // starts { int32 Flags; int32 Mode; ... }, with the POSIX S_IFMT bits in Mode. It follows symbolic links, as opening does.
    [DllImport("libSystem.Native", EntryPoint = "SystemNative_Stat", CharSet = CharSet.Ansi, BestFitMapping = false, ThrowOnUnmappableChar = true)]
    private static extern int SystemStat([MarshalAs(UnmanagedType.LPUTF8Str)] string path, [In, Out] byte[] status);

    private static int UnixMode(string path)
    {
        try
        {
            var status = new byte[512];   // larger than the record on every runtime so far
            return SystemStat(path, status) == 0 ? BitConverter.ToInt32(status, 4) : -1;
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException or MarshalDirectiveException or ArgumentException)
        {
            return -1;   // unknown: the bounded read below still keeps memory in check
        }
    }
}
