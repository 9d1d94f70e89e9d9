using System.Globalization;

namespace PlaneLateral.Output;

/// <summary>
/// The one CSV text-cell writer every results file uses (RFC 4180, Shafranovich 2005, for the quoting). A text cell
/// (an id, a label, a note; never a number, which the writers format themselves) is
/// <list type="bullet">
/// <item>neutralised when a spreadsheet would run it: text beginning with <c>=</c>, <c>+</c>, <c>-</c>, <c>@</c>, a tab
/// or a carriage return gets a leading apostrophe (the OWASP advice on CSV injection — common practice), unless the
/// whole cell reads as a number (an id "-1" stays "-1": a number cannot execute);</item>
/// <item>quoted, with inner quotes doubled, when it holds a comma, a quote, a line feed, a carriage return or any other
/// control character (U+0000–U+001F, U+007F), so a row never breaks and a standard reader gets the text back whole; and
/// when it holds a <c>#</c>, so no data line starts with the comment mark and a reader told to skip <c>#</c> comments
/// (pandas cuts a line at an unquoted <c>#</c>) loses no cell.</item>
/// </list>
/// docs/hardening.md, "Text that cannot inject", states the promise.
/// </summary>
public static class CsvText
{
    /// <summary>The cell for <paramref name="text"/> (null is the empty cell).</summary>
    public static string Cell(string? text)
    {
        if (string.IsNullOrEmpty(text)) return "";
        string s = text;
        if (IsFormulaStart(s[0]) && !IsNumber(s)) s = "'" + s;
        bool quote = false;
        foreach (char c in s)
            if (c == ',' || c == '"' || c == '#' || c < 0x20 || c == 0x7F) { quote = true; break; }
        return quote ? "\"" + s.Replace("\"", "\"\"") + "\"" : s;
    }

    /// <summary>
    /// One leading comment line, <c># text</c>, for the lines a file opens with before its header (the caution, notes):
    /// the only place the tool's CSV files carry anything but the table (docs/model-format.md, "CSV files"). Line breaks
    /// and other control characters in <paramref name="text"/> become spaces, so the comment stays one line and a reader
    /// told to skip lines starting with <c>#</c> (CsvHelper's comment prefix, pandas' <c>comment='#'</c>) skips it whole.
    /// </summary>
    public static string Comment(string text)
    {
        var sb = new System.Text.StringBuilder("# ", text.Length + 3);
        foreach (char c in text) sb.Append(c < 0x20 || c == 0x7F ? ' ' : c);
        return sb.Append('\n').ToString();
    }

    /// <summary>True when a spreadsheet treats a cell starting with <paramref name="c"/> as a formula (OWASP).</summary>
    public static bool IsFormulaStart(char c) => c is '=' or '+' or '-' or '@' or '\t' or '\r';

    private static bool IsNumber(string s) =>
        double.TryParse(s, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent,
            CultureInfo.InvariantCulture, out _);
}
