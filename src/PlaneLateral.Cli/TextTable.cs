using System.Globalization;
using System.Text;

namespace PlaneLateral.Cli;

/// <summary>
/// A plain fixed-width text table: left-aligned text columns, right-aligned number columns, fitted to a width (the run's
/// <c>--width</c>, 100 columns unless told): headers wrap onto more lines at their spaces, long texts of a text column move to lettered
/// notes under the table ([a], [b], ...), and a table still too wide is printed in parts, each repeating the first column.
/// </summary>
internal sealed class TextTable(params string[] headers)
{
    /// <summary>The default console width (columns) when no <c>--width</c> is given.</summary>
    public const int DefaultWidth = 100;

    /// <summary>The narrowest and widest <c>--width</c> accepted.</summary>
    public const int MinWidth = 40, MaxWidth = 1000;

    private static readonly AsyncLocal<int?> Chosen = new();

    /// <summary>The console width every table and line of prose is fitted to: <c>--width</c> for this run, else 100.</summary>
    public static int Width => Chosen.Value ?? DefaultWidth;

    /// <summary>Sets <see cref="Width"/> for the rest of this run (the flow that called it); null restores the default.</summary>
    public static void UseWidth(int? columns) => Chosen.Value = columns;

    /// <summary>Reads a <c>--width</c> value: a whole number from 40 to 1000, else a message saying what to give.</summary>
    public static bool TryWidth(string? text, out int? width, out string error)
    {
        width = null;
        error = "";
        if (text is null) return true;
        if (!int.TryParse(text.Trim(), NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int w))
        {
            error = $"--width \"{text}\" is not a whole number of columns. Fix: give the console width, e.g. --width 120 (from {MinWidth} to {MaxWidth}; default {DefaultWidth}).";
            return false;
        }
        if (w < MinWidth || w > MaxWidth)
        {
            error = $"--width {w} is outside {MinWidth} to {MaxWidth} columns ({(w < MinWidth ? "too narrow for the tables" : "wider than any console")}). Fix: give the console width, e.g. --width 120 (default {DefaultWidth}).";
            return false;
        }
        width = w;
        return true;
    }

    /// <summary>A text cell at most this long stays in its column when the table must shrink.</summary>
    private const int ShortText = 12;

    private readonly List<string[]> _rows = [];
    private readonly bool[] _numeric = headers.Select(h => false).ToArray();

    public TextTable Numeric(params int[] columns)
    {
        foreach (int c in columns) _numeric[c] = true;
        return this;
    }

    public void Add(params string[] cells) => _rows.Add(cells);

    /// <summary>Rows added so far.</summary>
    public int Count => _rows.Count;

    public string Render(string indent = "  ", int width = 0)
    {
        if (width <= 0) width = Width;
        int n = headers.Length;
        var rows = _rows.Select(r => (string[])r.Clone()).ToList();
        var notes = new List<string>();
        int avail = Math.Max(20, width - indent.Length);

        int Natural(int c) => Math.Max(headers[c].Length, rows.Count == 0 ? 0 : rows.Max(r => r[c].Length));
        int Fitted(int c) => Math.Max(Longest(headers[c]), rows.Count == 0 ? 0 : rows.Max(r => r[c].Length));
        int Total(Func<int, int> w, IEnumerable<int> cols) => cols.Sum(w) + 2 * (cols.Count() - 1);
        var all = Enumerable.Range(0, n).ToList();

        // 1. Natural widths; 2. headers wrapped; 3. long texts to notes, widest text column first.
        bool wrap = Total(Natural, all) > avail;
        while (wrap && Total(Fitted, all) > avail)
        {
            var candidates = all.Where(c => !_numeric[c] && rows.Any(r => r[c].Length > ShortText)).ToList();
            if (candidates.Count == 0) break;
            int col = candidates.MaxBy(Fitted);
            foreach (var r in rows)
            {
                if (r[col].Length <= ShortText) continue;
                int k = notes.IndexOf(r[col]);
                if (k < 0) { notes.Add(r[col]); k = notes.Count - 1; }
                r[col] = $"[{Letter(k)}]";
            }
        }
        Func<int, int> w = wrap ? Fitted : Natural;

        // 4. Parts: the first column, then as many further columns as fit.
        var parts = new List<List<int>>();
        var part = new List<int> { 0 };
        for (int c = 1; c < n; c++)
        {
            if (part.Count > 1 && Total(w, part.Append(c)) > avail) { parts.Add(part); part = [0]; }
            part.Add(c);
        }
        parts.Add(part);

        var sb = new StringBuilder();
        foreach (var cols in parts)
        {
            if (parts.Count > 1 && cols != parts[0]) sb.Append(indent).Append("(continued)\n");
            var headLines = cols.Select(c => wrap ? WrapWords(headers[c], w(c)) : [headers[c]]).ToList();
            int depth = headLines.Max(h => h.Count);
            for (int line = 0; line < depth; line++)
                Line(sb, indent, cols.Select((c, i) => (c, headLines[i].Count > line ? headLines[i][line] : "")).ToList(), w);
            sb.Append(indent).Append(new string('-', Total(w, cols))).Append('\n');
            foreach (var r in rows) Line(sb, indent, cols.Select(c => (c, r[c])).ToList(), w);
        }
        for (int k = 0; k < notes.Count; k++) sb.Append(indent).Append($"[{Letter(k)}] {notes[k]}\n");
        return sb.ToString();
    }

    /// <summary>a, b, …, z, aa, ab, …: the table's own notes, apart from any numbered notes of the text around it.</summary>
    private static string Letter(int k) => k < 26 ? ((char)('a' + k)).ToString() : Letter(k / 26 - 1) + (char)('a' + k % 26);

    private void Line(StringBuilder sb, string indent, List<(int Col, string Text)> cells, Func<int, int> width)
    {
        var line = new StringBuilder(indent);
        for (int i = 0; i < cells.Count; i++)
        {
            var (c, text) = cells[i];
            line.Append(_numeric[c] ? text.PadLeft(width(c)) : text.PadRight(width(c)));
            if (i < cells.Count - 1) line.Append("  ");
        }
        sb.Append(line.ToString().TrimEnd()).Append('\n');
    }

    private static int Longest(string header) => header.Split(' ').Max(x => x.Length);

    /// <summary>Words of <paramref name="text"/> on lines of at most <paramref name="width"/> characters (a longer word keeps its own line).</summary>
    private static List<string> WrapWords(string text, int width)
    {
        var lines = new List<string>();
        var current = "";
        foreach (var word in text.Split(' '))
        {
            if (current.Length == 0) current = word;
            else if (current.Length + 1 + word.Length <= width) current += " " + word;
            else { lines.Add(current); current = word; }
        }
        lines.Add(current);
        return lines;
    }

    /// <summary>Four significant figures; exponent form only for very small or very large magnitudes.</summary>
    public static string Num(double v) => PlaneLateral.Output.ResultTable.Number(v);   // one number format for console and report

    public static string Sci(double v) => v.ToString("0.0E+0", CultureInfo.InvariantCulture);
}

/// <summary>Console prose fitted to <see cref="TextTable.Width"/> columns: a longer line wraps at its spaces, continuing indented; a
/// word longer than the width (a path) stands whole on its own line.</summary>
internal static class ConsoleText
{
    /// <param name="hanging">Indent of the continuation lines; by default the line's own indent plus two.</param>
    public static string Fit(string text, int width = 0, int? hanging = null)
    {
        if (width <= 0) width = TextTable.Width;
        var sb = new StringBuilder();
        var lines = text.Split('\n');
        for (int i = 0; i < lines.Length; i++)
        {
            string line = lines[i];
            if (line.Length <= width) sb.Append(line);
            else
            {
                int lead = line.Length - line.TrimStart(' ').Length;
                string more = new(' ', Math.Min(hanging ?? lead + 2, width / 2));
                string rest = line;
                bool first = true;
                while (rest.Length > width)
                {
                    int cut = rest.LastIndexOf(' ', width);
                    if (cut <= (first ? lead : more.Length))
                    {
                        // One word longer than the line (a long path): kept whole on its own line, never cut mid-word.
                        cut = rest.IndexOf(' ', width);
                        if (cut < 0) break;
                    }
                    sb.Append(rest[..cut].TrimEnd()).Append('\n');
                    rest = more + rest[cut..].TrimStart(' ');
                    first = false;
                }
                sb.Append(rest);
            }
            if (i < lines.Length - 1) sb.Append('\n');
        }
        return sb.ToString();
    }
}
