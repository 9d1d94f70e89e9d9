using System.Globalization;
using System.Text;

namespace PlaneLateral.Model;

/// <summary>
/// Checks that a model text is JSON as RFC 8259 defines it, plus the comments the model format allows (<c>//</c> to the
/// end of the line and <c>/* ... */</c>; docs/model-format.md). The JSON library the reader builds its tree with is
/// lenient: it reads <c>0144</c> as octal 100, and takes single quotes, unquoted keys, hexadecimal numbers, trailing
/// commas, NaN and Infinity, and control characters. Each of those is refused here, before the tree is built, with the
/// line, column and JSON path where it stands. Iterative (an explicit stack), so deep nesting cannot exhaust the stack.
/// </summary>
internal static class StrictJson
{
    /// <summary>A departure from RFC 8259. <see cref="Lenient"/>: a form some readers accept (named by its own message);
    /// false: a plain syntax error, which the tree builder reports in its own words.</summary>
    internal sealed record Problem(int Line, int Column, string Path, string Message, string Fix, bool Lenient);

    private sealed class Frame(bool isObject)
    {
        public readonly bool IsObject = isObject;
        public int Index = -1;
        public string? Key;
        public bool ExpectValue = true;   // after '[' / ',' (array) or ':' (object)
        public bool AfterComma;
    }

    /// <summary>The first departure from RFC 8259 (comments allowed), or null when the text is strict JSON.</summary>
    public static Problem? Check(string s)
    {
        int i = 0;
        if (s.Length > 0 && s[0] == '\uFEFF') i = 1;   // a byte-order mark: RFC 8259 §8.1 lets a reader ignore it
        var stack = new List<Frame>();
        bool done = false;   // the top-level value is complete

        while (true)
        {
            if (SkipSpace(s, ref i, stack) is { } bad) return bad;
            if (i >= s.Length)
                return stack.Count > 0 || !done ? Generic(s, i, stack, "the file ends before the JSON value is complete") : null;
            char c = s[i];
            if (done)
                return Generic(s, i, stack, "additional text after the end of the model object");

            var top = stack.Count > 0 ? stack[^1] : null;
            if (top is not null && !top.ExpectValue)
            {
                // After a value inside a container: ',' or the closing bracket.
                if (c == ',') { top.ExpectValue = true; top.AfterComma = true; i++; continue; }
                if (c == (top.IsObject ? '}' : ']')) { stack.RemoveAt(stack.Count - 1); i++; done = stack.Count == 0; MarkValue(stack); continue; }
                return Generic(s, i, stack, $"expected ',' or '{(top.IsObject ? '}' : ']')}', found {Show(c)}");
            }

            if (top is { IsObject: true } && top.Key is null)
            {
                // A key (or, right after '{', the end of an empty object).
                if (c == '}')
                {
                    if (top.AfterComma) return Lenient(s, i, stack, "a comma before '}' (a trailing comma)", "remove the comma after the last entry of the object");
                    stack.RemoveAt(stack.Count - 1); i++; done = stack.Count == 0; MarkValue(stack); continue;
                }
                if (c == '\'') return Lenient(s, i, stack, "a key in single quotes", "write keys in double quotes, e.g. \"id\"");
                if (c != '"')
                {
                    if (char.IsLetter(c) || c == '_' || c == '$')
                        return Lenient(s, i, stack, $"a key without quotes ({Word(s, i)})", $"write the key in double quotes: \"{Word(s, i)}\"");
                    return Generic(s, i, stack, $"expected a key in double quotes, found {Show(c)}");
                }
                int start = i;
                if (ReadString(s, ref i, stack) is { } sp) return sp;
                top.Key = Unescape(s, start + 1, i - 1);
                top.Index++;
                if (SkipSpace(s, ref i, stack) is { } bad2) return bad2;
                if (i >= s.Length || s[i] != ':') return Generic(s, i, stack, "expected ':' after the key");
                i++;
                top.ExpectValue = true;
                top.AfterComma = false;
                continue;
            }

            // A value.
            if (top is { IsObject: false })
            {
                if (c == ']')
                {
                    if (top.AfterComma) return Lenient(s, i, stack, "a comma before ']' (a trailing comma)", "remove the comma after the last entry of the array");
                    if (top.Index < 0) { stack.RemoveAt(stack.Count - 1); i++; done = stack.Count == 0; MarkValue(stack); continue; }
                }
                if (c == ',') return Lenient(s, i, stack, "an empty entry in an array (two commas)", "remove the extra comma");
                top.Index++;
            }
            switch (c)
            {
                case '{':
                case '[':
                    if (stack.Count >= 1000) return Generic(s, i, stack, "more than 1000 levels of nesting");
                    if (top is not null) top.ExpectValue = false;
                    stack.Add(new Frame(c == '{'));
                    if (c == '[') { stack[^1].ExpectValue = true; }
                    i++;
                    continue;
                case '"':
                    if (ReadString(s, ref i, stack) is { } sp) return sp;
                    break;
                case '\'':
                    return Lenient(s, i, stack, "a string in single quotes", "write strings in double quotes");
                default:
                    if (c == '-' || c == '+' || c == '.' || (c >= '0' && c <= '9'))
                    {
                        if (ReadNumber(s, ref i, stack) is { } np) return np;
                        break;
                    }
                    if (char.IsLetter(c))
                    {
                        string w = Word(s, i);
                        if (w is "true" or "false" or "null") { i += w.Length; break; }
                        if (w is "NaN" or "Infinity")
                            return Lenient(s, i, stack, $"{w} is not a finite number, and not a JSON value", "give a finite number");
                        if (w is "True" or "False" or "Null" or "TRUE" or "FALSE" or "NULL" or "None" or "undefined")
                            return Lenient(s, i, stack, $"'{w}' is not a JSON value", "write true, false or null, in lower case");
                        return Lenient(s, i, stack, $"a bare word ({w}) where a value should be", $"write it as a string in double quotes: \"{w}\"");
                    }
                    return Generic(s, i, stack, $"expected a value, found {Show(c)}");
            }
            if (top is null) done = true;
            else MarkValue(stack);
        }
    }

    private static void MarkValue(List<Frame> stack)
    {
        if (stack.Count == 0) return;
        var f = stack[^1];
        f.ExpectValue = false;
        f.AfterComma = false;
        if (f.IsObject) f.Key = null;
    }

    private static Problem? SkipSpace(string s, ref int i, List<Frame> stack)
    {
        while (i < s.Length)
        {
            char c = s[i];
            if (c is ' ' or '\t' or '\n' or '\r') { i++; continue; }
            if (c == '/' && i + 1 < s.Length && s[i + 1] == '/')
            {
                while (i < s.Length && s[i] != '\n') i++;
                continue;
            }
            if (c == '/' && i + 1 < s.Length && s[i + 1] == '*')
            {
                int end = s.IndexOf("*/", i + 2, StringComparison.Ordinal);
                if (end < 0) return Generic(s, i, stack, "a comment /* that is never closed");
                i = end + 2;
                continue;
            }
            if (c == '\0') return Lenient(s, i, stack, "a NUL byte (character 0)", "remove it: a model file is text; save it again as UTF-8 text");
            if (c < ' ' || c is '\u00A0' or '\uFEFF' or '\u2028' or '\u2029' or '\u000B' or '\u000C')
                return Lenient(s, i, stack, $"the character U+{(int)c:X4}, which JSON does not allow between values", "use only spaces, tabs and line breaks between values");
            return null;
        }
        return null;
    }

    private static Problem? ReadString(string s, ref int i, List<Frame> stack)
    {
        int open = i;
        i++;
        while (i < s.Length)
        {
            char c = s[i];
            if (c == '"') { i++; return null; }
            if (c == '\\')
            {
                if (i + 1 >= s.Length) break;
                char e = s[i + 1];
                if (e is '"' or '\\' or '/' or 'b' or 'f' or 'n' or 'r' or 't') { i += 2; continue; }
                if (e == 'u')
                {
                    if (i + 6 <= s.Length && s.AsSpan(i + 2, 4).ToString().All(Uri.IsHexDigit)) { i += 6; continue; }
                    return Lenient(s, i, stack, "a \\u escape without four hexadecimal digits", "write \\u followed by four hexadecimal digits, e.g. \\u00B0");
                }
                return Lenient(s, i, stack, $"the escape \\{e}, which JSON does not have", "use one of \\\" \\\\ \\/ \\b \\f \\n \\r \\t \\uXXXX (write \\\\ for a backslash)");
            }
            if (c == '\0') return Lenient(s, i, stack, "a NUL byte (character 0) inside a string", "remove it, or write \\u0000 if it is meant");
            if (c < ' ')
                return Lenient(s, i, stack, $"the control character U+{(int)c:X4} inside a string (a string cannot run over a line break)",
                    "close the string before the line ends, or write the character as an escape such as \\n or \\t");
            i++;
        }
        return Generic(s, open, stack, "a string that is never closed");
    }

    private static Problem? ReadNumber(string s, ref int i, List<Frame> stack)
    {
        int start = i;
        string text = Token(s, i);
        if (s[i] == '+') return Lenient(s, start, stack, $"a number with a plus sign ({text})", $"write it without the '+': {text.TrimStart('+')}");
        if (s[i] == '-') i++;
        if (i < s.Length && s[i] == 'I' && Word(s, i) == "Infinity")
            return Lenient(s, start, stack, "-Infinity is not a finite number, and not a JSON value", "give a finite number");
        if (i >= s.Length) return Generic(s, start, stack, "a '-' without a number");
        if (s[i] == '.') return Lenient(s, start, stack, $"a number that starts with a point ({text})", $"write a digit before the point: {text.Replace(".", "0.", StringComparison.Ordinal)}");
        if (s[i] == '0' && i + 1 < s.Length && (s[i + 1] is 'x' or 'X'))
            return Lenient(s, start, stack, $"a hexadecimal number ({text}); JSON numbers are decimal", "write the number in decimal");
        if (s[i] == '0' && i + 1 < s.Length && char.IsAsciiDigit(s[i + 1]))
            return Lenient(s, start, stack, $"a number with a leading zero ({text}), which some readers take as octal",
                $"write it without the leading zero ({Unpadded(text)}); JSON has no octal or zero-padded numbers");
        if (!char.IsAsciiDigit(s[i])) return Generic(s, start, stack, $"expected a digit, found {Show(s[i])}");
        while (i < s.Length && char.IsAsciiDigit(s[i])) i++;
        if (i < s.Length && s[i] == '.')
        {
            i++;
            if (i >= s.Length || !char.IsAsciiDigit(s[i])) return Lenient(s, start, stack, $"a number that ends with a point ({text})", "write a digit after the point, e.g. 3.0");
            while (i < s.Length && char.IsAsciiDigit(s[i])) i++;
        }
        if (i < s.Length && s[i] is 'e' or 'E')
        {
            i++;
            if (i < s.Length && s[i] is '+' or '-') i++;
            if (i >= s.Length || !char.IsAsciiDigit(s[i])) return Lenient(s, start, stack, $"an exponent without digits ({text})", "write digits after the 'e', e.g. 2.0e8");
            while (i < s.Length && char.IsAsciiDigit(s[i])) i++;
        }
        if (i < s.Length && (char.IsAsciiLetterOrDigit(s[i]) || s[i] is '.' or '_'))
            return Lenient(s, start, stack, $"a number followed by other characters ({text})", "write a plain decimal number such as 12, -0.5 or 2.9e4");
        return null;
    }

    private static string Unpadded(string text)
    {
        bool neg = text.StartsWith('-');
        string body = (neg ? text[1..] : text).TrimStart('0');
        if (body.Length == 0 || body[0] == '.') body = "0" + body;
        return (neg ? "-" : "") + body;
    }

    private static string Token(string s, int i)
    {
        int j = i;
        while (j < s.Length && j - i < 40 && (char.IsAsciiLetterOrDigit(s[j]) || s[j] is '.' or '+' or '-' or '_')) j++;
        return s[i..j];
    }

    private static string Word(string s, int i)
    {
        int j = i;
        while (j < s.Length && j - i < 40 && (char.IsLetterOrDigit(s[j]) || s[j] is '_' or '$' or '-')) j++;
        return s[i..j];
    }

    private static string Show(char c) => c < ' ' || c > '~' ? $"the character U+{(int)c:X4}" : $"'{c}'";

    private static Problem Lenient(string s, int at, List<Frame> stack, string what, string fix) => Make(s, at, stack, what, fix, true);

    private static Problem Generic(string s, int at, List<Frame> stack, string what) =>
        Make(s, at, stack, what, "correct the JSON syntax at that place (a missing comma, quote or bracket is the usual cause)", false);

    private static Problem Make(string s, int at, List<Frame> stack, string what, string fix, bool lenient)
    {
        at = Math.Min(at, s.Length);
        int line = 1, lineStart = 0;
        for (int k = 0; k < at; k++)
            if (s[k] == '\n') { line++; lineStart = k + 1; }
        return new Problem(line, at - lineStart + 1, PathOf(stack), what, fix, lenient);
    }

    /// <summary>The path of the value being read, in the reader's "$.members[3].section" form.</summary>
    private static string PathOf(List<Frame> stack)
    {
        var sb = new StringBuilder("$");
        foreach (var f in stack)
        {
            if (f.IsObject)
            {
                if (f.Key is null) break;
                bool plain = f.Key.Length > 0 && (char.IsLetter(f.Key[0]) || f.Key[0] == '_') && f.Key.All(ch => char.IsLetterOrDigit(ch) || ch == '_');
                sb.Append(plain ? "." + f.Key : "['" + f.Key.Replace("'", "\\'", StringComparison.Ordinal) + "']");
            }
            else
            {
                if (f.Index < 0) break;
                sb.Append('[').Append(f.Index.ToString(CultureInfo.InvariantCulture)).Append(']');
            }
        }
        return sb.ToString();
    }

    private static string Unescape(string s, int from, int to)
    {
        string raw = s[from..to];
        if (!raw.Contains('\\')) return raw;
        // JsonDocument, not JsonSerializer: the same unescaping without reflection, so a Native AOT build (docs/benchmarks.md,
        // "Start-up"), where reflection-based serialisation is off, reads an escaped key as the JIT build does.
        try
        {
            using var doc = System.Text.Json.JsonDocument.Parse("\"" + raw + "\"");
            return doc.RootElement.GetString() ?? raw;
        }
        catch (System.Text.Json.JsonException) { return raw; }
    }
}
