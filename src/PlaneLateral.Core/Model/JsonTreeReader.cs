using System.Buffers;
using System.Globalization;
using System.Numerics;
using Newtonsoft.Json;
using Newtonsoft.Json.Linq;

namespace PlaneLateral.Model;

/// <summary>
/// Builds the compact <see cref="JsonNode"/> tree of a model text in one pass, and checks as it goes that the text is
/// JSON as RFC 8259 (Bray 2017) defines it. It reads only the common case: strict JSON with no comments, no byte-order
/// mark, no lone carriage return, no duplicate key, integers within 64 bits, no \u escape of a surrogate, nesting
/// within 60 levels. For anything else (every error included) it declines, returning null, and
/// <see cref="ModelReader.ReadTree"/> takes the path it always took: <see cref="StrictJson.Check"/>, then the JSON
/// library, whose messages, lines, columns and paths are therefore unchanged; a valid text read there becomes this tree
/// through <see cref="FromReference"/>. Where it reads, it gives the tree the JSON library gives: the same kinds (an
/// integer is a number without '.', 'e' or 'E'; every other number a double parsed from its text with the invariant
/// culture), values, names, lines and columns (tests/PlaneLateral.Core.Tests/Input/JsonTreeTests.cs).
/// </summary>
internal sealed class JsonTreeReader
{
    private const int MaxDepth = 60;   // the JSON library refuses more than 64; deeper text takes its path

    private sealed class Declined : Exception;
    private static readonly Declined Decline = new();

    private readonly string _s;
    private int _pos, _line = 1, _lineStart;
    private readonly List<JsonNode> _stack = new(64);
    private readonly Dictionary<string, string> _names = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string>.AlternateLookup<ReadOnlySpan<char>> _lookup;

    private JsonTreeReader(string s)
    {
        _s = s;
        _lookup = _names.GetAlternateLookup<ReadOnlySpan<char>>();
    }

    /// <summary>The tree of <paramref name="json"/>, or null when the text is outside the common case (see the class).</summary>
    public static JsonNode? TryRead(string json)
    {
        if (json.Length > 0 && json[0] == '\uFEFF') return null;
        var r = new JsonTreeReader(json);
        try
        {
            r.SkipSpace();
            var root = r.ReadValue(0);
            r.SkipSpace();
            return r._pos == json.Length ? root : null;
        }
        catch (Declined) { return null; }
        catch (Exception e) when (e is IndexOutOfRangeException or ArgumentOutOfRangeException) { return null; }   // the text ends inside a value
    }

    private void SkipSpace()
    {
        var s = _s;
        while (_pos < s.Length)
        {
            char c = s[_pos];
            if (c == ' ' || c == '\t') _pos++;
            else if (c == '\n') { _pos++; _line++; _lineStart = _pos; }
            else if (c == '\r')
            {
                if (_pos + 1 >= s.Length || s[_pos + 1] != '\n') throw Decline;
                _pos++;
            }
            else if (c == '/') throw Decline;
            else return;
        }
    }

    private JsonNode ReadValue(int depth)
    {
        var s = _s;
        char c = s[_pos];
        JsonNode node;
        switch (c)
        {
            case '{': node = ReadObject(depth + 1); break;
            case '[': node = ReadArray(depth + 1); break;
            case '"': node = JsonScalar.String(ReadString(false)); break;
            case 't': Literal("true"); node = JsonScalar.Boolean(true); break;
            case 'f': Literal("false"); node = JsonScalar.Boolean(false); break;
            case 'n': Literal("null"); node = JsonScalar.Null(); break;
            default: node = ReadNumber(); break;
        }
        if (node is not JsonMap and not JsonList) { node.Line = _line; node.Column = _pos - _lineStart; }
        return node;
    }

    private void Literal(string word)
    {
        if (string.CompareOrdinal(_s, _pos, word, 0, word.Length) != 0) throw Decline;
        _pos += word.Length;   // what follows is checked by the caller: only a separator, a closing bracket or space
    }

    private JsonMap ReadObject(int depth)
    {
        if (depth > MaxDepth) throw Decline;
        _pos++;
        var map = new JsonMap { Line = _line, Column = _pos - _lineStart };
        int first = _stack.Count;
        HashSet<string>? keys = null;
        SkipSpace();
        if (_s[_pos] == '}') { _pos++; return map; }
        while (true)
        {
            if (_s[_pos] != '"') throw Decline;
            string name = ReadString(true);
            SkipSpace();
            if (_s[_pos] != ':') throw Decline;
            _pos++;
            int keyLine = _line, keyColumn = _pos - _lineStart;
            CheckUnique(name, first, ref keys);
            SkipSpace();
            var v = ReadValue(depth);
            v.Name = name;
            v.KeyLine = keyLine;
            v.KeyColumn = keyColumn;
            _stack.Add(v);
            SkipSpace();
            char c = _s[_pos++];
            if (c == '}') break;
            if (c != ',') throw Decline;
            SkipSpace();
        }
        map.SetItems(Pop(first));
        return map;
    }

    /// <summary>Declines a key already in the object (the JSON library reports it); a set of the keys once the object is large.</summary>
    private void CheckUnique(string name, int first, ref HashSet<string>? keys)
    {
        if (keys is null)
        {
            for (int k = first; k < _stack.Count; k++)
                if (string.Equals(_stack[k].Name, name, StringComparison.Ordinal)) throw Decline;
            if (_stack.Count - first < 16) return;
            keys = new HashSet<string>(StringComparer.Ordinal);
            for (int k = first; k < _stack.Count; k++) keys.Add(_stack[k].Name!);
        }
        if (!keys.Add(name)) throw Decline;
    }

    private JsonList ReadArray(int depth)
    {
        if (depth > MaxDepth) throw Decline;
        _pos++;
        var list = new JsonList { Line = _line, Column = _pos - _lineStart };
        int first = _stack.Count;
        SkipSpace();
        if (_s[_pos] == ']') { _pos++; return list; }
        while (true)
        {
            _stack.Add(ReadValue(depth));
            SkipSpace();
            char c = _s[_pos++];
            if (c == ']') break;
            if (c != ',') throw Decline;
            SkipSpace();
        }
        list.SetItems(Pop(first));
        return list;
    }

    private JsonNode[] Pop(int first)
    {
        var items = new JsonNode[_stack.Count - first];
        _stack.CopyTo(first, items, 0, items.Length);
        _stack.RemoveRange(first, items.Length);
        return items;
    }

    // The characters that end the plain run of a string: its closing quote, an escape, a control character (which
    // RFC 8259 section 7 does not allow unescaped).
    private static readonly SearchValues<char> StringStops = SearchValues.Create("\"\\\u0000\u0001\u0002\u0003\u0004\u0005\u0006\u0007\b\t\n\u000B\f\r\u000E\u000F\u0010\u0011\u0012\u0013\u0014\u0015\u0016\u0017\u0018\u0019\u001A\u001B\u001C\u001D\u001E\u001F");

    private string ReadString(bool intern)
    {
        var s = _s;
        int start = ++_pos;
        int run = s.AsSpan(start).IndexOfAny(StringStops);
        if (run < 0) throw Decline;
        int end = start + run;
        if (s[end] == '"')
        {
            _pos = end + 1;
            var span = s.AsSpan(start, run);
            return intern || span.Length <= 24 ? Intern(span) : span.ToString();
        }
        var sb = new System.Text.StringBuilder();
        sb.Append(s, start, run);
        int i = end;
        while (true)
        {
            char c = s[i];
            if (c == '"') break;
            if (c < ' ') throw Decline;
            if (c != '\\') { sb.Append(c); i++; continue; }
            char e = s[i + 1];
            switch (e)
            {
                case '"': sb.Append('"'); break;
                case '\\': sb.Append('\\'); break;
                case '/': sb.Append('/'); break;
                case 'b': sb.Append('\b'); break;
                case 'f': sb.Append('\f'); break;
                case 'n': sb.Append('\n'); break;
                case 'r': sb.Append('\r'); break;
                case 't': sb.Append('\t'); break;
                case 'u':
                    var hex = s.AsSpan(i + 2, 4);
                    if (!char.IsAsciiHexDigit(hex[0]) || !char.IsAsciiHexDigit(hex[1]) || !char.IsAsciiHexDigit(hex[2]) || !char.IsAsciiHexDigit(hex[3])) throw Decline;
                    int u = int.Parse(hex, NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture);
                    if (u >= 0xD800 && u <= 0xDFFF) throw Decline;
                    sb.Append((char)u);
                    i += 4;
                    break;
                default: throw Decline;
            }
            i += 2;
        }
        _pos = i + 1;
        string text = sb.ToString();
        return intern ? Intern(text) : text;
    }

    private string Intern(ReadOnlySpan<char> span)
    {
        if (_lookup.TryGetValue(span, out var known)) return known;
        string text = span.ToString();
        _names[text] = text;
        return text;
    }

    /// <summary>A number as RFC 8259 section 6 writes it: -?(0|[1-9][0-9]*)(.[0-9]+)?([eE][+-]?[0-9]+)?; anything else declines.</summary>
    private JsonScalar ReadNumber()
    {
        var s = _s;
        int start = _pos;
        if (s[_pos] == '-') _pos++;
        if (s[_pos] == '0') _pos++;
        else if (s[_pos] is >= '1' and <= '9') Digits();
        else throw Decline;
        bool fraction = false;
        if (_pos < s.Length && s[_pos] == '.')
        {
            fraction = true;
            _pos++;
            if (!char.IsAsciiDigit(s[_pos])) throw Decline;
            Digits();
        }
        if (_pos < s.Length && s[_pos] is 'e' or 'E')
        {
            fraction = true;
            _pos++;
            if (s[_pos] is '+' or '-') _pos++;
            if (!char.IsAsciiDigit(s[_pos])) throw Decline;
            Digits();
        }
        // What follows (a letter, a digit after a leading zero, a second point) is checked by the caller, which
        // takes only a separator, a closing bracket or space.
        var text = s.AsSpan(start, _pos - start);
        if (!fraction)
        {
            if (long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out long v)) return JsonScalar.Integer(v);
            throw Decline;   // wider than 64 bits: the JSON library's BigInteger (and its length limit)
        }
        return JsonScalar.Float(double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture));
    }

    private void Digits()
    {
        var s = _s;
        while (_pos < s.Length && char.IsAsciiDigit(s[_pos])) _pos++;
    }

    /// <summary>
    /// The compact tree of a tree the JSON library read with line information (the path taken when
    /// <see cref="TryRead"/> declines): the same kinds, values, names and positions.
    /// </summary>
    public static JsonNode FromReference(JToken t)
    {
        JsonNode node;
        switch (t)
        {
            case JObject o:
            {
                var map = new JsonMap();
                var items = new JsonNode[o.Count];
                int k = 0;
                foreach (var p in o.Properties())
                {
                    var v = FromReference(p.Value);
                    v.Name = p.Name;
                    (v.KeyLine, v.KeyColumn) = LineOf(p);
                    items[k++] = v;
                }
                map.SetItems(items);
                node = map;
                break;
            }
            case JArray a:
            {
                var list = new JsonList();
                var items = new JsonNode[a.Count];
                for (int k = 0; k < items.Length; k++) items[k] = FromReference(a[k]);
                list.SetItems(items);
                node = list;
                break;
            }
            case JValue v:
                node = v.Type switch
                {
                    JTokenType.Integer => v.Value is BigInteger b ? JsonScalar.BigInteger(b) : JsonScalar.Integer(Convert.ToInt64(v.Value, CultureInfo.InvariantCulture)),
                    JTokenType.Float => JsonScalar.Float(Convert.ToDouble(v.Value, CultureInfo.InvariantCulture)),
                    JTokenType.String => JsonScalar.String((string)v.Value!),
                    JTokenType.Boolean => JsonScalar.Boolean((bool)v.Value!),
                    JTokenType.Null => JsonScalar.Null(),
                    _ => throw new InvalidOperationException($"unexpected JSON value of type {v.Type}"),
                };
                break;
            default:
                throw new InvalidOperationException($"unexpected JSON token of type {t.Type}");
        }
        (node.Line, node.Column) = LineOf(t);
        return node;
    }

    private static (int, int) LineOf(JToken t) =>
        t is IJsonLineInfo li && li.HasLineInfo() ? (li.LineNumber, li.LinePosition) : (0, 0);
}
