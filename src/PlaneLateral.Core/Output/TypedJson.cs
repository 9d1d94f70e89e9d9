using System.Globalization;
using Newtonsoft.Json;

namespace PlaneLateral.Output;

/// <summary>
/// Writes a results file from a typed object (a record whose properties carry their JSON names): the file's shape is the
/// type's, checked by the compiler, not a sequence of property writes. Indented by two spaces, line feeds only, numbers
/// at round-trip precision in the invariant culture, a non-finite number as a string ("NaN"), properties in declaration
/// order, so the same object always gives the same bytes on any machine. Ends with one line feed.
/// </summary>
public static class TypedJson
{
    private static readonly JsonSerializer Serializer = Create(rowConverter: true);

    /// <summary>
    /// The serializer: invariant culture, a non-finite number as a string, nulls written; with
    /// <paramref name="rowConverter"/>, the hot result rows are written by <see cref="ResultRowConverter"/> (the same text,
    /// without reflection; false gives the reflection-only reference its test compares with).
    /// </summary>
    internal static JsonSerializer Create(bool rowConverter)
    {
        var settings = new JsonSerializerSettings
        {
            Culture = CultureInfo.InvariantCulture,
            FloatFormatHandling = FloatFormatHandling.String,
            NullValueHandling = NullValueHandling.Include,
        };
        if (rowConverter) settings.Converters.Add(new ResultRowConverter());
        return JsonSerializer.Create(settings);
    }

    /// <summary>The file's text for <paramref name="value"/>, built in memory (a small file).</summary>
    public static string Write(object value)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        Write(sw, value);
        return sw.ToString();
    }

    /// <summary>
    /// Writes the file for <paramref name="value"/> into <paramref name="writer"/> as it is serialised, object by object:
    /// a sequence property (an <see cref="IEnumerable{T}"/> produced on demand) is read one item at a time, so a file of
    /// any size streams without its text or its objects all in memory. <paramref name="writer"/>'s <c>NewLine</c> should
    /// be a line feed (the writers of <see cref="OutputFile"/> and <see cref="Write(object)"/> are).
    /// </summary>
    public static void Write(TextWriter writer, object value) => Write(writer, value, Serializer);

    internal static void Write(TextWriter writer, object value, JsonSerializer serializer)
    {
        using (var w = new JsonTextWriter(writer) { Formatting = Formatting.Indented, Indentation = 2, CloseOutput = false })
            serializer.Serialize(w, value);
        writer.Write('\n');
    }

    /// <summary>A results file streamed from <paramref name="value"/> (see <see cref="Write(TextWriter, object)"/>).</summary>
    public static OutputFile File(string name, object value) => OutputFile.Streamed(name, w => Write(w, value));
}
