using System.Globalization;

namespace PlaneLateral.Model;

/// <summary>
/// Reads the fields of one JSON object with line-aware problem reporting. Every read that fails records a
/// <see cref="ModelDiagnostic"/> and returns a placeholder, so a whole file is checked in one pass.
/// </summary>
internal sealed class JsonFields
{
    private readonly JsonMap _obj;
    private readonly DiagnosticSink _sink;
    // The keys asked for, in the order first asked: a short list (one is made per object of the file), with a set
    // beside it once it is long (an object whose every key is asked, e.g. a comparison check's).
    private readonly List<string> _known = new(8);
    private HashSet<string>? _knownSet;

    public JsonFields(JsonMap obj, DiagnosticSink sink)
    {
        _obj = obj;
        _sink = sink;
    }

    /// <summary>Largest magnitude accepted for any number in a model file, in the model's units.</summary>
    public const double MaxMagnitude = 1e15;

    public JsonMap Object => _obj;

    public bool Has(string key) => Token(key) is not null;

    /// <summary>The value of <paramref name="key"/>, or null when absent. A JSON null is reported once and read as absent.</summary>
    public JsonNode? Token(string key)
    {
        Remember(key);
        if (!_obj.TryGetValue(key, out var t)) return null;
        if (t.Type != JsonKind.Null) return t;
        if ((_nullsReported ??= new(StringComparer.Ordinal)).Add(key)) _sink.Add(t, $"'{key}' is null", "give a value, or leave the key out to take its default");
        return null;
    }

    private HashSet<string>? _nullsReported;

    private void Remember(string key)
    {
        if (Known(key)) return;
        _known.Add(key);
        if (_knownSet is not null) _knownSet.Add(key);
        else if (_known.Count > 32) _knownSet = new HashSet<string>(_known, StringComparer.Ordinal);
    }

    private bool Known(string key)
    {
        if (_knownSet is not null) return _knownSet.Contains(key);
        foreach (var k in _known)
            if (string.Equals(k, key, StringComparison.Ordinal)) return true;
        return false;
    }

    /// <summary>Reports keys that none of the reads asked for (most often a typo).</summary>
    public void RejectUnknownKeys()
    {
        foreach (var p in _obj.Properties())
            if (!Known(p.Name))
                _sink.Add(p, $"unknown key '{p.Name}'{SuggestBudget.Suggest(p.Name, _known)}", $"use one of: {string.Join(", ", _known.Order(StringComparer.Ordinal))}; or remove it");
    }

    public string? RequiredString(string key, string fix)
    {
        var t = Token(key);
        if (t is null) { _sink.Add(_obj, $"missing required key '{key}'", fix); return null; }
        if (t.Type != JsonKind.String) { _sink.Add(t, $"'{key}' must be a string, found {Describe(t)}", fix); return null; }
        var s = (string)t!;
        if (string.IsNullOrWhiteSpace(s)) { _sink.Add(t, $"'{key}' is empty", fix); return null; }
        return s;
    }

    public string? OptionalString(string key, string fix)
    {
        var t = Token(key);
        if (t is null) return null;
        if (t.Type != JsonKind.String) { _sink.Add(t, $"'{key}' must be a string, found {Describe(t)}", fix); return null; }
        return (string)t!;
    }

    public double RequiredNumber(string key, string fix) =>
        Token(key) is { } t ? Number(t, key, fix) : Missing(key, fix);

    public double OptionalNumber(string key, double fallback, string fix) =>
        Token(key) is { } t ? Number(t, key, fix) : fallback;

    public bool OptionalBool(string key, bool fallback, string fix)
    {
        var t = Token(key);
        if (t is null) return fallback;
        if (t.Type != JsonKind.Boolean) { _sink.Add(t, $"'{key}' must be true or false, found {Describe(t)}", fix); return fallback; }
        return (bool)t;
    }

    /// <summary>An array of objects (empty when absent and not required).</summary>
    public IReadOnlyList<JsonMap> Objects(string key, bool required, string fix)
    {
        var t = Token(key);
        if (t is null)
        {
            if (required) _sink.Add(_obj, $"missing required key '{key}'", fix);
            return [];
        }
        if (t is not JsonList arr) { _sink.Add(t, $"'{key}' must be an array, found {Describe(t)}", fix); return []; }
        var list = new List<JsonMap>();
        foreach (var item in arr)
        {
            if (item is JsonMap o) list.Add(o);
            else _sink.Add(item, $"each entry of '{key}' must be an object {{...}}, found {Describe(item)}", fix);
        }
        return list;
    }

    public JsonMap? OptionalObject(string key, string fix)
    {
        var t = Token(key);
        if (t is null) return null;
        if (t is JsonMap o) return o;
        _sink.Add(t, $"'{key}' must be an object {{...}}, found {Describe(t)}", fix);
        return null;
    }

    private double Missing(string key, string fix)
    {
        _sink.Add(_obj, $"missing required key '{key}'", fix);
        return double.NaN;
    }

    private double Number(JsonNode t, string key, string fix)
    {
        if (t.Type is JsonKind.Integer or JsonKind.Float)
        {
            double v = t.Type == JsonKind.Integer ? (double)t : ((double)t);
            if (double.IsFinite(v) && Math.Abs(v) > MaxMagnitude)
            {
                _sink.Add(t, $"'{key}' is {v.ToString("G6", CultureInfo.InvariantCulture)}, beyond the range accepted (magnitude up to 1e15 in the model's units)", fix + "; check the units and the exponent");
                return double.NaN;
            }
            if (double.IsFinite(v)) return v;
            _sink.Add(t, $"'{key}' is {v.ToString(CultureInfo.InvariantCulture)}, not a finite number", fix);
            return double.NaN;
        }
        _sink.Add(t, $"'{key}' must be a number, found {Describe(t)}", fix);
        return double.NaN;
    }

    /// <summary>
    /// A whole-number key (a count, a version) read safely from any JSON number: an integer wider than 64 bits, a
    /// fraction or a value outside [<paramref name="min"/>, <paramref name="max"/>] is reported with the key's own
    /// message and null is returned, so the rest of the file is still checked. Null too when the key is absent.
    /// </summary>
    public long? WholeNumber(string key, long min, long max, string fix)
    {
        var t = Token(key);
        if (t is null) return null;
        string range = $"a whole number from {min.ToString(CultureInfo.InvariantCulture)} to {max.ToString(CultureInfo.InvariantCulture)}";
        if (t.Type is not (JsonKind.Integer or JsonKind.Float))
        {
            _sink.Add(t, $"'{key}' must be {range}, found {Describe(t)}", fix);
            return null;
        }
        if (t is JsonScalar { Value: long v })
        {
            if (v >= min && v <= max) return v;
            _sink.Add(t, $"'{key}' is {v.ToString(CultureInfo.InvariantCulture)}; it must be {range}", fix);
            return null;
        }
        if (t.Type == JsonKind.Integer)   // wider than 64 bits (held as a BigInteger)
        {
            _sink.Add(t, $"'{key}' is {NumberText(t)}, far outside the range: it must be {range}", fix);
            return null;
        }
        double d = ((double)t);
        if (double.IsFinite(d) && d == Math.Floor(d) && d >= min && d <= max && Math.Abs(d) < 9e15) return (long)d;
        string why = !double.IsFinite(d) ? "not a finite number" : d != Math.Floor(d) ? "not a whole number" : "out of range";
        _sink.Add(t, $"'{key}' is {NumberText(t)}, {why}; it must be {range}", fix);
        return null;
    }

    /// <summary>The number as written, shortened when it is very long (a 10 000-digit integer is not echoed whole).</summary>
    public static string NumberText(JsonNode t)
    {
        string s = t.ToCompactJson();
        return s.Length <= 40 ? s : $"{s[..20]}... (a number of {s.Length} characters)";
    }

    public static string Describe(JsonNode t) => t.Type switch
    {
        JsonKind.String => $"the string \"{Truncate((string)t!)}\"",
        JsonKind.Integer or JsonKind.Float => $"the number {NumberText(t)}",
        JsonKind.Boolean => $"{t.ToCompactJson()}",
        JsonKind.Array => "an array",
        JsonKind.Object => "an object",
        JsonKind.Null => "null",
        _ => t.Type.ToString().ToLowerInvariant(),
    };

    private static string Truncate(string s) => s.Length <= 40 ? s : s[..37] + "...";
}

/// <summary>Collects diagnostics for one file.</summary>
internal sealed class DiagnosticSink(string file)
{
    private readonly List<ModelDiagnostic> _items = [];
    private readonly HashSet<ModelDiagnostic> _seen = [];

    public string File { get; } = file;
    public IReadOnlyList<ModelDiagnostic> Items => _items;
    public bool Any => _items.Count > 0;

    public void Add(JsonNode? at, string problem, string fix)
    {
        int line = 0, col = 0;
        if (at is not null) { line = at.Line; col = at.Column; }
        var d = new ModelDiagnostic(File, line, col, at is null ? "" : PathOf(at), problem, fix);
        if (_seen.Add(d)) _items.Add(d);   // a key read by two steps (e.g. "seismic") is reported once
    }

    /// <summary>A problem at an object's entry: at its key (the column after its ':'), with the value's path.</summary>
    public void Add(JsonEntry at, string problem, string fix)
    {
        var d = new ModelDiagnostic(File, at.Value.KeyLine, at.Value.KeyColumn, PathOf(at.Value), problem, fix);
        if (_seen.Add(d)) _items.Add(d);
    }

    /// <summary>JSON path in "$.members[3].section" form.</summary>
    public static string PathOf(JsonNode t)
    {
        string p = t.Path;
        if (p.Length == 0) return "$";
        return p.StartsWith('[') ? "$" + p : "$." + p;
    }
}
