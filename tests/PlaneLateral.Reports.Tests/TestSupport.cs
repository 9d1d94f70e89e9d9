using PlaneLateral.Cli;
using SkiaSharp;

namespace PlaneLateral.Reports.Tests;

internal static class TestSupport
{
    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter(); var e = new StringWriter();
        int code = CliApp.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    public static string TempDir(string tag) => Path.Combine(Path.GetTempPath(), $"pl-{tag}-" + Guid.NewGuid().ToString("N"));

    public static string DemoPath => Path.Combine(AppContext.BaseDirectory, "models", "demo-clinic.json");

    public static void Near(double expected, double actual, double relTol, string? what = null)
    {
        double err = Math.Abs(actual - expected) / Math.Max(Math.Abs(expected), 1e-300);
        Assert.True(err <= relTol, $"{what}: expected {expected:R}, got {actual:R}, relative error {err:E2} > {relTol:E1}");
    }

    /// <summary>
    /// Checks a PNG: the 8-byte signature and the IHDR chunk's width and height (PNG specification, W3C/ISO 15948, §5.2
    /// and §11.2.2), that it decodes, and that it is not blank (more than one colour among its pixels).
    /// </summary>
    public static void ValidPng(byte[] png, int width, int height, string what)
    {
        byte[] signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];
        Assert.True(png.Length > 1000, $"{what}: only {png.Length} bytes");
        Assert.True(png.AsSpan(0, 8).SequenceEqual(signature), $"{what}: no PNG signature");
        Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(png, 12, 4));
        int w = (png[16] << 24) | (png[17] << 16) | (png[18] << 8) | png[19];
        int h = (png[20] << 24) | (png[21] << 16) | (png[22] << 8) | png[23];
        Assert.Equal((width, height), (w, h));
        using var bmp = SKBitmap.Decode(png);
        Assert.NotNull(bmp);
        Assert.Equal((width, height), (bmp.Width, bmp.Height));
        var colours = new HashSet<uint>();
        for (int y = 0; y < bmp.Height; y += 7)
            for (int x = 0; x < bmp.Width; x += 7)
                colours.Add((uint)bmp.GetPixel(x, y));
        Assert.True(colours.Count > 2, $"{what}: blank image ({colours.Count} colours)");
    }
}
