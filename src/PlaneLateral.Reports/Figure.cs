using ScottPlot;
using SkiaSharp;

namespace PlaneLateral.Reports;

/// <summary>A rendered figure: a PNG of a stated pixel size, with the file name and caption a report gives it.</summary>
/// <param name="FileName">File name of the PNG (no folder), e.g. "sweep-ratio.png".</param>
/// <param name="Title">Short title.</param>
/// <param name="Caption">One or two sentences saying what the figure shows and how it was made.</param>
/// <param name="Png">The PNG bytes.</param>
/// <param name="Width">Pixel width.</param>
/// <param name="Height">Pixel height.</param>
public sealed record Figure(string FileName, string Title, string Caption, byte[] Png, int Width, int Height);

/// <summary>
/// Our own plain figure style: white ground, thin grey grid, a small palette of our choosing, solid lines for hand
/// methods, dashed or marker-only series for finite-element results, a footer strip carrying the caution.
/// </summary>
public static class PlotStyle
{
    /// <summary>Default figure size in pixels.</summary>
    public const int Width = 1000, Height = 640;

    /// <summary>Height of the footer strip (pixels) under the plot area that carries the caution.</summary>
    public const int FooterHeight = 34;

    /// <summary>The text printed under every figure.</summary>
    public const string FooterText =
        "PlaneLateral: computed for verification by a licensed engineer; the governing local code decides. Not a statement of code compliance.";

    /// <summary>Font family used for every label (a family shipped with common Linux systems).</summary>
    public const string FontFamily = "DejaVu Sans";

    // Palette of our own: ink blue, brick, moss, ochre, slate, plum.
    public static readonly Color Ink = Color.FromHex("#1F3A5F");
    public static readonly Color Brick = Color.FromHex("#A4452C");
    public static readonly Color Moss = Color.FromHex("#4E6B2F");
    public static readonly Color Ochre = Color.FromHex("#B07D1A");
    public static readonly Color Slate = Color.FromHex("#6B7280");
    public static readonly Color Plum = Color.FromHex("#6A3D6B");
    public static readonly Color Band = Color.FromHex("#D9E4D0");
    public static readonly Color Limit = Color.FromHex("#B3261E");

    /// <summary>Series colours in order.</summary>
    public static readonly Color[] Series = [Ink, Brick, Moss, Ochre, Plum, Slate];

    /// <summary>A new plot in our style with its title and axis labels (labels must carry units).</summary>
    public static Plot New(string title, string xLabel, string yLabel)
    {
        var p = new Plot();
        p.Font.Set(FontFamily);
        p.FigureBackground.Color = Colors.White;
        p.DataBackground.Color = Colors.White;
        p.Grid.MajorLineColor = Color.FromHex("#E3E3E3");
        p.Grid.MinorLineColor = Colors.Transparent;
        p.Axes.Color(Color.FromHex("#333333"));
        p.Title(title, size: 18);
        p.XLabel(xLabel, size: 15);
        p.YLabel(yLabel, size: 15);
        return p;
    }

    /// <summary>Renders the plot with the caution strip beneath it into a PNG of exactly width × height pixels.</summary>
    public static byte[] Png(Plot plot, int width = Width, int height = Height)
    {
        var info = new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Premul);
        using var surface = SKSurface.Create(info) ?? throw new InvalidOperationException("cannot create a drawing surface");
        var canvas = surface.Canvas;
        canvas.Clear(SKColors.White);
        plot.Render(canvas, new PixelRect(0, width, height - FooterHeight, 0));
        using var typeface = SKTypeface.FromFamilyName(FontFamily) ?? SKTypeface.Default;
        using var font = new SKFont(typeface, 12);
        using var paint = new SKPaint { Color = new SKColor(0x55, 0x55, 0x55), IsAntialias = true };
        using var rule = new SKPaint { Color = new SKColor(0xCC, 0xCC, 0xCC), StrokeWidth = 1 };
        canvas.DrawLine(8, height - FooterHeight + 4, width - 8, height - FooterHeight + 4, rule);
        canvas.DrawText(FooterText, 10, height - 12, SKTextAlign.Left, font, paint);
        canvas.Flush();
        using var image = surface.Snapshot();
        using var data = image.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }
}

/// <summary>
/// File names of figures that stay unique and short whatever the ids in them: an id that is already a safe short name
/// (ASCII letters, digits, '-', '.', '_'; at most <see cref="MaxIdChars"/> characters; not starting with '.') is used as it
/// is; any other id becomes its safe characters, cut to that length, plus '-' and the first 8 hex digits of the SHA-256
/// of the id (so "wind A", "wind_A" and "wind/A" get three names). Within one report, names equal but for letter case
/// get "-2", "-3", ... (<see cref="Unique"/>), so they differ on case-insensitive file systems too. The report's Markdown
/// names the file beside each figure.
/// </summary>
public static class FigureNames
{
    /// <summary>Longest id part of a figure name (characters); whole names stay far under the 255-byte limit of common file systems.</summary>
    public const int MaxIdChars = 40;

    /// <summary>The file-name part for <paramref name="id"/>.</summary>
    public static string Slug(string id)
    {
        bool safe = id.Length > 0 && id.Length <= MaxIdChars && id[0] != '.' && id.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '.' or '_');
        if (safe) return id;
        var chars = id.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '.' ? c : '_').Take(MaxIdChars).ToArray();
        if (chars.Length > 0 && chars[0] == '.') chars[0] = '_';
        byte[] hash = System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(id));
        return new string(chars) + "-" + Convert.ToHexString(hash, 0, 4).ToLowerInvariant();
    }

    /// <summary><paramref name="figure"/> with a file name no earlier figure of <paramref name="used"/> has (compared
    /// ignoring case); the name is added to <paramref name="used"/>.</summary>
    public static Figure Unique(Figure figure, ISet<string> used)
    {
        string name = figure.FileName;
        string stem = Path.GetFileNameWithoutExtension(name), ext = Path.GetExtension(name);
        for (int k = 2; !used.Add(name.ToLowerInvariant()); k++) name = $"{stem}-{k}{ext}";
        return name == figure.FileName ? figure : figure with { FileName = name };
    }
}
