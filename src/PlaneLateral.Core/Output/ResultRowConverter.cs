using Newtonsoft.Json;

namespace PlaneLateral.Output;

/// <summary>
/// Writes the rows that make up nearly all of a large results.json (a node's displacements, a support's reaction, a
/// wall panel's held base, a member's end forces: one of each per node, support, panel or member and case) field by
/// field, instead of through the serializer's reflection. The serializer reads each property by reflection and boxes
/// each number; in the native (ahead-of-time compiled) program that was most of the time spent writing results.json.
/// The text is the serializer's own: the same names in the same order (the records' <see cref="JsonPropertyAttribute"/>
/// names, declaration order), and each value through the same <see cref="JsonWriter.WriteValue(double)"/> or
/// <see cref="JsonWriter.WriteValue(string)"/> the serializer calls, so the writer's settings (round-trip numbers,
/// invariant culture, a non-finite number as a string) apply unchanged. <c>ResultRowConverterTests</c> checks the text
/// against the serializer without this converter, for every row type.
/// </summary>
internal sealed class ResultRowConverter : JsonConverter
{
    public override bool CanRead => false;

    public override bool CanConvert(Type objectType) =>
        objectType == typeof(ResultsDisplacement) || objectType == typeof(ResultsReaction) ||
        objectType == typeof(ResultsPanelBase) || objectType == typeof(ResultsMemberForces);

    public override object ReadJson(JsonReader reader, Type objectType, object? existingValue, JsonSerializer serializer) =>
        throw new NotSupportedException("results rows are written, not read");

    public override void WriteJson(JsonWriter w, object? value, JsonSerializer serializer)
    {
        w.WriteStartObject();
        switch (value)
        {
            case ResultsDisplacement d:
                Text(w, "node", d.Node); Number(w, "ux", d.Ux); Number(w, "uy", d.Uy); Number(w, "rz", d.Rz);
                break;
            case ResultsReaction r:
                Text(w, "node", r.Node); Number(w, "Fx", r.Fx); Number(w, "Fy", r.Fy); Number(w, "Mz", r.Mz);
                break;
            case ResultsPanelBase p:
                Text(w, "panel", p.Panel); Number(w, "Fx", p.Fx); Number(w, "Fy", p.Fy); Number(w, "Mz", p.Mz);
                Number(w, "momentAboutX", p.MomentAboutX); Number(w, "momentAboutY", p.MomentAboutY);
                break;
            case ResultsMemberForces m:
                Text(w, "member", m.Member);
                Number(w, "N1", m.N1); Number(w, "V1", m.V1); Number(w, "M1", m.M1);
                Number(w, "N2", m.N2); Number(w, "V2", m.V2); Number(w, "M2", m.M2);
                break;
            default:
                throw new JsonSerializationException($"ResultRowConverter cannot write {value?.GetType().Name ?? "null"}.");
        }
        w.WriteEndObject();
    }

    private static void Text(JsonWriter w, string name, string? value)
    {
        w.WritePropertyName(name);
        if (value is null) w.WriteNull(); else w.WriteValue(value);
    }

    private static void Number(JsonWriter w, string name, double value)
    {
        w.WritePropertyName(name);
        w.WriteValue(value);
    }
}
