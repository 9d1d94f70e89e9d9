using System.Globalization;
using System.Numerics;
using Newtonsoft.Json;
using Newtonsoft.Json.Linq;

namespace PlaneLateral.Model;

/// <summary>
/// Builds the compact <see cref="JsonNode"/> tree of a model text in one pass. It reads only text that
/// <see cref="StrictJson.Check"/> has passed, and only the common case: no comments, no byte-order mark, no lone
/// carriage return, no duplicate key, integers within 64 bits, no \u escape of a surrogate, nesting within 60 levels.
/// For anything else it declines (returns null) and the model reader takes the JSON library's path, which gives
/// today's diagnostics word for word, or its tree (<see cref="FromReference"/>). Where it reads, it gives the tree the
/// JSON library gives: the same kinds (an integer is a number without '.', 'e' or 'E'; every other number a double
/// parsed from its text with the invariant culture), values, names, lines and columns (tests/…/JsonTreeTests.cs).
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
        catch (IndexOutOfRangeException) { return null; }   // text StrictJson would not have passed
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
            case 't': _pos += 4; node = JsonScalar.Boolean(true); break;
            case 'f': _pos += 5; node = JsonScalar.Boolean(false); break;
            case 'n': _pos += 4; node = JsonScalar.Null(); break;
            default: node = ReadNumber(); break;
        }
        if (node is not JsonMap and not JsonList) { node.Line = _line; node.Column = _pos - _lineStart; }
        return node;
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

    private string ReadString(bool intern)
    {
        var s = _s;
        int start = ++_pos;
        int end = s.IndexOfAny(['"', '\\'], start);
        if (end < 0) throw Decline;
        if (s[end] == '"')
        {
            _pos = end + 1;
            var span = s.AsSpan(start, end - start);
            return intern || span.Length <= 24 ? Intern(span) : span.ToString();
        }
        var sb = new System.Text.StringBuilder();
        sb.Append(s, start, end - start);
        int i = end;
        while (true)
        {
            char c = s[i];
            if (c == '"') break;
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
                    int u = int.Parse(s.AsSpan(i + 2, 4), NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture);
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

    private JsonScalar ReadNumber()
    {
        var s = _s;
        int start = _pos;
        bool fraction = false;
        while (_pos < s.Length)
        {
            char c = s[_pos];
            if (c is >= '0' and <= '9' or '-' or '+') { _pos++; continue; }
            if (c is '.' or 'e' or 'E') { fraction = true; _pos++; continue; }
            break;
        }
        var text = s.AsSpan(start, _pos - start);
        if (text.Length == 0) throw Decline;
        if (!fraction)
        {
            if (long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out long v)) return JsonScalar.Integer(v);
            throw Decline;   // wider than 64 bits: the JSON library's BigInteger (and its length limit)
        }
        return JsonScalar.Float(double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture));
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
