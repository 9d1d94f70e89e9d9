using System.Collections;
using System.Globalization;
using System.Numerics;
using System.Text;
using Newtonsoft.Json;
using Newtonsoft.Json.Linq;

namespace PlaneLateral.Model;

/// <summary>The kind of a <see cref="JsonNode"/>; the member names are the JSON library's (JsonFields.Describe prints them).</summary>
internal enum JsonKind : byte { Object, Array, Integer, Float, String, Boolean, Null }

/// <summary>
/// A node of the compact JSON tree the model readers validate (built by <see cref="JsonTreeReader"/>): a value with its
/// line and column (1-based, where the JSON library puts them: the column just after the token, or after the ':' of a
/// key), the key it stands under in its object and where that key's ':' is, and its index in its container. Numbers,
/// strings and booleans are held in the node without boxing; property names are shared strings. Read-only once built.
/// </summary>
internal abstract class JsonNode
{
    /// <summary>The object or array holding this node; null at the root.</summary>
    public JsonNode? Parent { get; internal set; }

    /// <summary>The key this value stands under when its parent is an object; otherwise null.</summary>
    public string? Name { get; internal set; }

    /// <summary>Position in the parent (entry order for an object).</summary>
    internal int Index;

    public int Line { get; internal set; }
    public int Column { get; internal set; }

    /// <summary>Where the key of this value was read (the column after its ':'), when its parent is an object.</summary>
    internal int KeyLine, KeyColumn;

    public abstract JsonKind Type { get; }

    /// <summary>Makes this node the parent of <paramref name="items"/>, each with its index; returns them.</summary>
    private protected JsonNode[] Adopt(JsonNode[] items)
    {
        for (int i = 0; i < items.Length; i++) { items[i].Parent = this; items[i].Index = i; }
        return items;
    }

    /// <summary>The path in the JSON library's form (<c>members[3].section</c>, <c>['a b']</c>); empty at the root.</summary>
    public string Path
    {
        get
        {
            if (Parent is null) return "";
            var chain = new List<JsonNode>();
            for (var n = this; n.Parent is not null; n = n.Parent) chain.Add(n);
            var sb = new StringBuilder();
            for (int k = chain.Count - 1; k >= 0; k--)
            {
                var n = chain[k];
                if (n.Name is null) sb.Append('[').Append(n.Index.ToString(CultureInfo.InvariantCulture)).Append(']');
                else AppendName(sb, n.Name);
            }
            return sb.ToString();
        }
    }

    private static readonly char[] PathSpecial = ['.', ' ', '\'', '/', '"', '[', ']', '(', ')', '\t', '\n', '\r', '\f', '\b', '\\', '\u0085', '\u2028', '\u2029'];

    private static void AppendName(StringBuilder sb, string name)
    {
        if (name.IndexOfAny(PathSpecial) < 0)
        {
            if (sb.Length > 0) sb.Append('.');
            sb.Append(name);
            return;
        }
        // As the JSON library escapes a name inside ['...'] (single-quote delimiter, default escaping).
        sb.Append("['");
        foreach (char c in name)
        {
            switch (c)
            {
                case '\'': sb.Append("\\'"); break;
                case '\\': sb.Append("\\\\"); break;
                case '\t': sb.Append("\\t"); break;
                case '\n': sb.Append("\\n"); break;
                case '\r': sb.Append("\\r"); break;
                case '\f': sb.Append("\\f"); break;
                case '\b': sb.Append("\\b"); break;
                case '\u0085': sb.Append("\\u0085"); break;
                case '\u2028': sb.Append("\\u2028"); break;
                case '\u2029': sb.Append("\\u2029"); break;
                default:
                    if (c < ' ') sb.Append("\\u").Append(((int)c).ToString("x4", CultureInfo.InvariantCulture));
                    else sb.Append(c);
                    break;
            }
        }
        sb.Append("']");
    }

    /// <summary>The node at a relative path of names and indices (<c>mesh.maxAspect</c>, <c>openings[2]</c>); null when absent.</summary>
    public JsonNode? SelectPath(string path)
    {
        JsonNode? n = this;
        int i = 0;
        while (n is not null && i < path.Length)
        {
            if (path[i] == '.') { i++; continue; }
            if (path[i] == '[')
            {
                int close = path.IndexOf(']', i);
                if (close < 0 || !int.TryParse(path.AsSpan(i + 1, close - i - 1), NumberStyles.None, CultureInfo.InvariantCulture, out int k)) return null;
                n = n is JsonList l && k < l.Count ? l[k] : null;
                i = close + 1;
                continue;
            }
            int end = path.IndexOfAny(['.', '['], i);
            if (end < 0) end = path.Length;
            n = n is JsonMap m ? m[path[i..end]] : null;
            i = end;
        }
        return n;
    }

    /// <summary>The value under <paramref name="key"/> of an object (null when absent); any other node has no keys and throws, as the JSON library's tokens do.</summary>
    public virtual JsonNode? this[string key] => throw new InvalidOperationException($"Cannot access child value on a JSON {Type}.");

    public static explicit operator double(JsonNode t) => t is JsonScalar s ? s.ToDouble() : throw NotA(t, "double");
    public static explicit operator long(JsonNode t) => t is JsonScalar s ? s.ToInt64() : throw NotA(t, "long");
    public static explicit operator int(JsonNode t) => checked((int)(long)t);
    public static explicit operator bool(JsonNode t) => t is JsonScalar { Type: JsonKind.Boolean } s ? s.Bits != 0 : throw NotA(t, "bool");
    public static explicit operator string?(JsonNode? t) => t is null ? null : t is JsonScalar s ? s.ToText() : throw NotA(t, "string");

    private static ArgumentException NotA(JsonNode t, string what) => new($"Can not convert {t.Type} to {what}.");

    /// <summary>The same value as a tree of the JSON library (no line information): only for printing a value in a message.</summary>
    internal abstract JToken ToReference();

    /// <summary>The value in compact JSON, as the JSON library writes it.</summary>
    public string ToCompactJson() => ToReference().ToString(Formatting.None);

    /// <summary>As the JSON library's own ToString: the plain value for a number, string or boolean; indented JSON for a container.</summary>
    public override string ToString() => ToReference().ToString();
}

/// <summary>A number, string, boolean or null.</summary>
internal sealed class JsonScalar : JsonNode
{
    private readonly JsonKind _kind;
    /// <summary>The long of an Integer, the bits of a Float's double, 1/0 for a Boolean.</summary>
    internal readonly long Bits;
    /// <summary>The string of a String, the BigInteger (boxed) of an Integer wider than 64 bits.</summary>
    private readonly object? _ref;

    private JsonScalar(JsonKind kind, long bits, object? reference) { _kind = kind; Bits = bits; _ref = reference; }

    public static JsonScalar Integer(long v) => new(JsonKind.Integer, v, null);
    public static JsonScalar BigInteger(BigInteger v) => new(JsonKind.Integer, 0, v);
    public static JsonScalar Float(double v) => new(JsonKind.Float, BitConverter.DoubleToInt64Bits(v), null);
    public static JsonScalar String(string v) => new(JsonKind.String, 0, v);
    public static JsonScalar Boolean(bool v) => new(JsonKind.Boolean, v ? 1 : 0, null);
    public static JsonScalar Null() => new(JsonKind.Null, 0, null);

    public override JsonKind Type => _kind;

    /// <summary>The value as the JSON library holds it (long, BigInteger, double, string, bool or null); boxes, so only for rare reads.</summary>
    public object? Value => _kind switch
    {
        JsonKind.Integer => _ref ?? Bits,
        JsonKind.Float => BitConverter.Int64BitsToDouble(Bits),
        JsonKind.String => _ref,
        JsonKind.Boolean => Bits != 0,
        _ => null,
    };

    /// <summary>True for an Integer that fits in 64 bits, with its value.</summary>
    public bool IsInt64(out long v)
    {
        v = Bits;
        return _kind == JsonKind.Integer && _ref is null;
    }

    internal double ToDouble() => _kind switch
    {
        JsonKind.Float => BitConverter.Int64BitsToDouble(Bits),
        JsonKind.Integer => _ref is BigInteger b ? (double)b : Bits,
        _ => throw new ArgumentException($"Can not convert {_kind} to double."),
    };

    internal long ToInt64() => _kind switch
    {
        JsonKind.Integer => _ref is BigInteger b ? (long)b : Bits,
        JsonKind.Float => Convert.ToInt64(BitConverter.Int64BitsToDouble(Bits), CultureInfo.InvariantCulture),
        _ => throw new ArgumentException($"Can not convert {_kind} to long."),
    };

    internal string? ToText() => _kind switch
    {
        JsonKind.String => (string)_ref!,
        JsonKind.Null => null,
        _ => Convert.ToString(Value, CultureInfo.InvariantCulture),
    };

    internal override JToken ToReference() => _kind switch
    {
        JsonKind.Integer => _ref is BigInteger b ? new JValue(b) : new JValue(Bits),
        JsonKind.Float => new JValue(BitConverter.Int64BitsToDouble(Bits)),
        JsonKind.String => new JValue((string)_ref!),
        JsonKind.Boolean => new JValue(Bits != 0),
        _ => JValue.CreateNull(),
    };
}

/// <summary>An object: its values in the order written, each carrying its key (<see cref="JsonNode.Name"/>).</summary>
internal sealed class JsonMap : JsonNode
{
    private JsonNode[] _items = [];
    private Dictionary<string, JsonNode>? _index;

    public override JsonKind Type => JsonKind.Object;

    internal void SetItems(JsonNode[] items) => _items = Adopt(items);

    public int Count => _items.Length;

    /// <summary>The value under <paramref name="key"/>, or null.</summary>
    public override JsonNode? this[string key] => TryGetValue(key, out var v) ? v : null;

    public bool ContainsKey(string key) => TryGetValue(key, out _);

    public bool TryGetValue(string key, [System.Diagnostics.CodeAnalysis.NotNullWhen(true)] out JsonNode? value)
    {
        if (_items.Length > 16)
        {
            // A large object: an index of its keys, made on the first look-up (the keys are unique: a duplicate never
            // reaches a tree).
            if (_index is null)
            {
                var index = new Dictionary<string, JsonNode>(_items.Length, StringComparer.Ordinal);
                foreach (var n in _items) index[n.Name!] = n;
                _index = index;
            }
            return _index.TryGetValue(key, out value);
        }
        foreach (var n in _items)
            if ((object)n.Name! == key || string.Equals(n.Name, key, StringComparison.Ordinal)) { value = n; return true; }
        value = null;
        return false;
    }

    /// <summary>The entries (key and value) in the order written.</summary>
    public IEnumerable<JsonEntry> Properties()
    {
        foreach (var n in _items) yield return new JsonEntry(n);
    }

    internal override JToken ToReference()
    {
        var o = new JObject();
        foreach (var n in _items) o.Add(n.Name!, n.ToReference());
        return o;
    }
}

/// <summary>An array.</summary>
internal sealed class JsonList : JsonNode, IReadOnlyList<JsonNode>
{
    private JsonNode[] _items = [];

    public override JsonKind Type => JsonKind.Array;

    internal void SetItems(JsonNode[] items) => _items = Adopt(items);

    public int Count => _items.Length;
    public JsonNode this[int index] => _items[index];

    public IEnumerator<JsonNode> GetEnumerator() => ((IEnumerable<JsonNode>)_items).GetEnumerator();
    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();

    internal override JToken ToReference()
    {
        var a = new JArray();
        foreach (var n in _items) a.Add(n.ToReference());
        return a;
    }
}

/// <summary>A key and its value in an object (no object of its own: a view of the value node). A problem reported at
/// an entry stands at its key (<see cref="DiagnosticSink.Add(JsonEntry, string, string)"/>).</summary>
internal readonly record struct JsonEntry(JsonNode Value)
{
    public string Name => Value.Name!;
}
