using System.Net;
using System.Text;

namespace PlaneLateral.Reports;

/// <summary>A block of a report, rendered alike to HTML and Markdown so the two stay twins.</summary>
public abstract record Block;

/// <summary>A heading, level 1 to 3.</summary>
public sealed record Heading(int Level, string Text) : Block;

/// <summary>A paragraph of plain text.</summary>
public sealed record Paragraph(string Text) : Block;

/// <summary>A boxed caution.</summary>
public sealed record CautionBox(string Text) : Block;

/// <summary>A bulleted list.</summary>
public sealed record BulletList(IReadOnlyList<string> Items) : Block;

/// <summary>A table; <paramref name="NumericColumns"/> are right-aligned.</summary>
public sealed record Table(string Caption, IReadOnlyList<string> Header, IReadOnlyList<IReadOnlyList<string>> Rows, IReadOnlyList<int> NumericColumns) : Block;

/// <summary>A figure (embedded in the HTML, a file beside the Markdown).</summary>
public sealed record FigureBlock(Figure Figure, int Number) : Block;

/// <summary>
/// Where the table of contents goes. Without one, a document puts its contents before its first level-2 heading; with
/// one, there. Either way every level-2 and level-3 heading is listed, linked to its anchor.
/// </summary>
public sealed record ContentsBlock : Block;

/// <summary>One entry of a document's table of contents: the heading's level (2 or 3), its text and its anchor.</summary>
public sealed record ContentsEntry(int Level, string Text, string Anchor);

/// <summary>
/// An ordered list of blocks with a title; renders one self-contained HTML file and its Markdown twin, each with a table of
/// contents (every level-2 and level-3 heading, linked) and, in the HTML, a print style: each level-2 section starts a
/// new page, rows, figures and cautions are not split across pages where the browser can avoid it, table headers repeat
/// on every page, figures fit the page width.
/// </summary>
public sealed class ReportDocument
{
    private readonly string title;
    private readonly IReadOnlyList<Block> blocks;
    private readonly Dictionary<Heading, string> anchors = new(ReferenceEqualityComparer.Instance);

    public ReportDocument(string title, IReadOnlyList<Block> blocks)
    {
        this.title = title;
        this.blocks = blocks;
        int n = 0;
        foreach (var h in blocks.OfType<Heading>())
            if (h.Level is 2 or 3 && !anchors.ContainsKey(h)) anchors[h] = $"sec-{++n}";
        Contents = blocks.OfType<Heading>().Where(anchors.ContainsKey).Select(h => new ContentsEntry(h.Level, h.Text, anchors[h])).ToList();
    }

    public string Title => title;
    public IReadOnlyList<Block> Blocks => blocks;
    public IEnumerable<Figure> Figures => blocks.OfType<FigureBlock>().Select(b => b.Figure);
    public IEnumerable<Table> Tables => blocks.OfType<Table>();

    /// <summary>The table of contents: every level-2 and level-3 heading in order, with the anchor both renderings give it.</summary>
    public IReadOnlyList<ContentsEntry> Contents { get; }

    /// <summary>The blocks with the contents placeholder where it goes (the document's own, or before the first section).</summary>
    private IEnumerable<Block> Laid()
    {
        if (blocks.Any(b => b is ContentsBlock) || Contents.Count == 0) return blocks;
        int first = blocks.ToList().FindIndex(b => b is Heading { Level: 2 });
        return first < 0 ? blocks : [.. blocks.Take(first), new ContentsBlock(), .. blocks.Skip(first)];
    }

    private static string H(string s) => WebUtility.HtmlEncode(s);

    /// <summary>One HTML file, figures embedded as base64 PNG, no external resource.</summary>
    public string Html()
    {
        var sb = new StringBuilder();
        sb.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        sb.Append($"<title>{H(title)}</title>\n<style>\n{Css}</style>\n</head>\n<body>\n<main>\n");
        foreach (var b in Laid())
        {
            switch (b)
            {
                case Heading h:
                    sb.Append(anchors.TryGetValue(h, out var id) ? $"<h{h.Level} id=\"{id}\">{H(h.Text)}</h{h.Level}>\n" : $"<h{h.Level}>{H(h.Text)}</h{h.Level}>\n");
                    break;
                case ContentsBlock:
                    sb.Append("<nav class=\"contents\">\n<p class=\"contents-title\">Contents</p>\n<ul>\n");
                    foreach (var e in Contents)
                        sb.Append($"<li class=\"toc{e.Level}\"><a href=\"#{e.Anchor}\">{H(e.Text)}</a></li>\n");
                    sb.Append("</ul>\n</nav>\n");
                    break;
                case Paragraph p:
                    sb.Append($"<p>{H(p.Text)}</p>\n");
                    break;
                case CautionBox c:
                    sb.Append($"<div class=\"caution\"><strong>Caution.</strong> {H(c.Text)}</div>\n");
                    break;
                case BulletList l:
                    sb.Append("<ul>\n");
                    foreach (var i in l.Items) sb.Append($"<li>{H(i)}</li>\n");
                    sb.Append("</ul>\n");
                    break;
                case Table t:
                    sb.Append($"<table>\n<caption>{H(t.Caption)}</caption>\n<thead><tr>");
                    for (int i = 0; i < t.Header.Count; i++) sb.Append($"<th{(t.NumericColumns.Contains(i) ? " class=\"n\"" : "")}>{H(t.Header[i])}</th>");
                    sb.Append("</tr></thead>\n<tbody>\n");
                    foreach (var row in t.Rows)
                    {
                        sb.Append("<tr>");
                        for (int i = 0; i < row.Count; i++) sb.Append($"<td{(t.NumericColumns.Contains(i) ? " class=\"n\"" : "")}>{H(row[i])}</td>");
                        sb.Append("</tr>\n");
                    }
                    sb.Append("</tbody>\n</table>\n");
                    break;
                case FigureBlock f:
                    sb.Append($"<figure>\n<img src=\"data:image/png;base64,{Convert.ToBase64String(f.Figure.Png)}\" width=\"{f.Figure.Width}\" height=\"{f.Figure.Height}\" alt=\"{H(f.Figure.Title)}\">\n");
                    sb.Append($"<figcaption><strong>Figure {f.Number}.</strong> {H(f.Figure.Caption)}</figcaption>\n</figure>\n");
                    break;
            }
        }
        sb.Append("</main>\n</body>\n</html>\n");
        return sb.ToString();
    }

    private static string Md(string s) => s.Replace("|", "\\|").Replace("\n", " ");

    /// <summary>The Markdown twin; figures are the PNG files written beside it.</summary>
    public string Markdown()
    {
        var sb = new StringBuilder();
        foreach (var b in Laid())
        {
            switch (b)
            {
                case Heading h:
                    if (anchors.TryGetValue(h, out var id)) sb.Append($"<a id=\"{id}\"></a>\n\n");
                    sb.Append(new string('#', h.Level)).Append(' ').Append(h.Text).Append("\n\n");
                    break;
                case ContentsBlock:
                    sb.Append("**Contents**\n\n");
                    foreach (var e in Contents)
                        sb.Append(e.Level == 3 ? "  - " : "- ").Append($"[{Md(e.Text).Replace("[", "\\[").Replace("]", "\\]")}](#{e.Anchor})\n");
                    sb.Append('\n');
                    break;
                case Paragraph p:
                    sb.Append(p.Text).Append("\n\n");
                    break;
                case CautionBox c:
                    sb.Append("> **Caution.** ").Append(c.Text).Append("\n\n");
                    break;
                case BulletList l:
                    foreach (var i in l.Items) sb.Append("- ").Append(i).Append('\n');
                    sb.Append('\n');
                    break;
                case Table t:
                    sb.Append($"*{Md(t.Caption)}*\n\n");
                    sb.Append("| ").Append(string.Join(" | ", t.Header.Select(Md))).Append(" |\n|");
                    for (int i = 0; i < t.Header.Count; i++) sb.Append(t.NumericColumns.Contains(i) ? "---:|" : "---|");
                    sb.Append('\n');
                    foreach (var row in t.Rows) sb.Append("| ").Append(string.Join(" | ", row.Select(Md))).Append(" |\n");
                    sb.Append('\n');
                    break;
                case FigureBlock f:
                    sb.Append($"![{Md(f.Figure.Title)}]({f.Figure.FileName})\n\n**Figure {f.Number}.** {f.Figure.Caption}\n\n");
                    break;
            }
        }
        return sb.ToString();
    }

    private const string Css = """
        body { font-family: "DejaVu Sans", "Helvetica Neue", Arial, sans-serif; color: #1d1d1d; background: #fff; margin: 0; }
        main { max-width: 1040px; margin: 0 auto; padding: 24px 28px 48px; line-height: 1.45; font-size: 15px; }
        h1 { font-size: 26px; border-bottom: 3px solid #1F3A5F; padding-bottom: 6px; margin-bottom: 4px; }
        h2 { font-size: 20px; color: #1F3A5F; margin-top: 34px; border-bottom: 1px solid #ccd3dc; padding-bottom: 3px; }
        h3 { font-size: 16px; margin-top: 22px; }
        .caution { border-left: 5px solid #B3261E; background: #fbf1ef; padding: 10px 14px; margin: 14px 0; }
        table { border-collapse: collapse; margin: 10px 0 18px; font-size: 13px; }
        caption { text-align: left; font-weight: bold; padding: 4px 0; }
        th, td { border: 1px solid #d5d9df; padding: 4px 7px; vertical-align: top; text-align: left; }
        th { background: #eef1f5; }
        td.n, th.n { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        tbody tr:nth-child(even) { background: #fafbfc; }
        figure { margin: 16px 0 24px; }
        figure img { max-width: 100%; height: auto; border: 1px solid #e2e2e2; }
        figcaption { font-size: 13px; color: #333; margin-top: 4px; }
        nav.contents { border: 1px solid #d5d9df; background: #f7f8fa; padding: 8px 16px; margin: 16px 0; }
        nav.contents .contents-title { font-weight: bold; margin: 4px 0; }
        nav.contents ul { list-style: none; padding-left: 0; margin: 4px 0; columns: 2; column-gap: 32px; }
        nav.contents li.toc3 { padding-left: 18px; font-size: 13px; }
        nav.contents a { color: #1F3A5F; text-decoration: none; }
        @page { margin: 15mm 12mm 16mm 12mm; }
        @media print {
          * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
          body { font-size: 9.5pt; }
          main { max-width: none; padding: 0; font-size: 9.5pt; line-height: 1.3; }
          h1 { font-size: 17pt; }
          h2 { font-size: 13pt; margin-top: 0; break-before: page; page-break-before: always; }
          h2, h3, caption { break-after: avoid; page-break-after: avoid; }
          table { font-size: 7.5pt; width: 100%; max-width: 100%; }
          thead { display: table-header-group; }
          tr, th, td, li, figure, figure img, .caution { break-inside: avoid; page-break-inside: avoid; }
          td, th { padding: 2px 4px; overflow-wrap: break-word; }
          th.n { white-space: normal; }
          figure { margin: 8px 0 12px; }
          figure img { max-width: 100%; max-height: 215mm; width: auto; height: auto; border: none; }
          nav.contents { break-inside: avoid; background: none; }
          nav.contents a { color: inherit; }
        }

        """;
}
