namespace PlanDesk.Core.Loading;

/// <summary>
/// Facts read from the raw file before the model is built, so each reader can check rules that span the file
/// (classes of tanks and customers, which classes some stage produces) and say where the other side is.
/// Ids that are missing or declared twice are simply absent or first-wins here; they are reported elsewhere.
/// </summary>
internal sealed class Catalog
{
    private readonly Dictionary<string, (int Rank, string Path, HashSet<string> Parameters)> classes = new(StringComparer.Ordinal);
    private readonly Dictionary<string, (string Class, string? Plant)> tanks = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> customerClasses = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> blendParameters = new(StringComparer.Ordinal);
    private readonly List<string> producedClasses = [];

    public static Catalog From(Node root)
    {
        var catalog = new Catalog();
        var rank = 0;
        foreach (var item in root.Items("qualityClasses"))
        {
            var parameters = item.Field("quality") is { IsObject: true } quality
                ? quality.Element.EnumerateObject().Select(p => p.Name).ToHashSet()
                : [];
            catalog.classes.TryAdd(item.Text("id"), (rank++, item.Path, parameters));
        }
        foreach (var item in root.Items("tanks"))
        {
            catalog.tanks.TryAdd(item.Text("id"), (item.Text("class"), item.OptionalText("plant")));
        }
        foreach (var item in root.Items("customers"))
        {
            catalog.customerClasses.TryAdd(item.Text("id"), item.Text("class"));
            if (item.Field("blendLimit") is { } blend && blend.Text("parameter") is { Length: > 0 } parameter)
            {
                catalog.blendParameters.TryAdd(item.Text("id"), parameter);
            }
        }
        catalog.producedClasses.AddRange(root.Items("plants").SelectMany(p => p.Items("stages")).Select(s => s.Text("producesClass")));
        return catalog;
    }

    /// <summary>Rank of a class, 0 the best; null when the class is unknown.</summary>
    public int? Rank(string classId) => classes.TryGetValue(classId, out var entry) ? entry.Rank : null;

    public string? ClassPath(string classId) => classes.TryGetValue(classId, out var entry) ? entry.Path : null;

    public bool ClassDefines(string classId, string parameter) => classes.TryGetValue(classId, out var entry) && entry.Parameters.Contains(parameter);

    public (string Class, string? Plant)? Tank(string tankId) => tanks.TryGetValue(tankId, out var entry) ? entry : null;

    public string? CustomerClass(string customerId) => customerClasses.TryGetValue(customerId, out var entry) ? entry : null;

    public string? BlendParameter(string customerId) => blendParameters.TryGetValue(customerId, out var entry) ? entry : null;

    /// <summary>False only when both classes are known and <paramref name="supplied"/> is worse than <paramref name="required"/>;
    /// unknown classes are reported as unresolved references instead.</summary>
    public bool Serves(string supplied, string required) => Rank(supplied) is not { } s || Rank(required) is not { } r || s <= r;

    /// <summary>True when some stage produces <paramref name="classId"/> or a better class (unknown classes pass).</summary>
    public bool SomeStageProduces(string classId) =>
        Rank(classId) is not { } needed || producedClasses.Any(p => Rank(p) is { } produced && produced <= needed);
}
