using System.Security.Cryptography;

namespace PlaneLateral.Model;

/// <summary>
/// One input file as it was read: its name as given, its size and the SHA-256 of its bytes (lower-case hex, the form
/// <c>sha256sum</c> prints), so a report can say exactly which file it came from and a checker can confirm it.
/// </summary>
public sealed record InputFile(string Path, long Bytes, string Sha256)
{
    /// <summary>The provenance of bytes read from <paramref name="path"/>.</summary>
    public static InputFile Of(string path, byte[] bytes) => new(path, bytes.LongLength, Convert.ToHexStringLower(SHA256.HashData(bytes)));
}
