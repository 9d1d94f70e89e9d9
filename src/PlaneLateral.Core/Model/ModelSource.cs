
namespace PlaneLateral.Model;

/// <summary>
/// A model file's text, read once and parsed once into its JSON tree (<see cref="ModelReader.ReadSource"/>), before it
/// is known whether it is a planar model or a building in plan; the readers then validate the tree without reading the
/// file again.
/// </summary>
public sealed class ModelSource
{
    internal ModelSource(string path, InputFile input, JsonNode root)
    {
        Path = path;
        Input = input;
        Root = root;
    }

    /// <summary>The path as given; messages name it.</summary>
    public string Path { get; }

    /// <summary>Size and SHA-256 of the very bytes read.</summary>
    public InputFile Input { get; }

    /// <summary>The JSON tree, with line information.</summary>
    internal JsonNode Root { get; }

    /// <summary>True for a building in plan: a JSON object with the top-level key <see cref="ModelReader.PlanKey"/> (as <see cref="ModelReader.IsPlanFile"/>).</summary>
    public bool IsPlan => Root is JsonMap o && o.ContainsKey(ModelReader.PlanKey);
}
