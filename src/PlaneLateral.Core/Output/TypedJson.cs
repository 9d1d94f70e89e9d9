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
    private static readonly JsonSerializer Serializer = JsonSerializer.Create(new JsonSerializerSettings
    {
        Culture = CultureInfo.InvariantCulture,
        FloatFormatHandling = FloatFormatHandling.String,
        NullValueHandling = NullValueHandling.Include,
    });

    public static string Write(object value)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2 })
            Serializer.Serialize(w, value);
        return sw.ToString() + "\n";
    }
}
