namespace PlanDesk.Core.Loading;

/// <summary>The kinds of thing that share the file's single id space.</summary>
internal enum IdKind
{
    QualityClass,
    Tariff,
    Plant,
    Stage,
    Tank,
    Pipeline,
    Customer,
}

/// <summary>Every id declared in the file, with its kind and where it was declared; reports duplicates and
/// references that do not resolve.</summary>
internal sealed class IdIndex
{
    private readonly Dictionary<string, (IdKind Kind, string Path)> declared = new(StringComparer.Ordinal);

    public static string Describe(IdKind kind) => kind switch
    {
        IdKind.QualityClass => "quality class",
        IdKind.Tariff => "tariff",
        IdKind.Plant => "plant",
        IdKind.Stage => "stage",
        IdKind.Tank => "tank",
        IdKind.Pipeline => "pipeline",
        IdKind.Customer => "customer",
        _ => kind.ToString(),
    };

    /// <summary>Records the id of the item at <paramref name="item"/>; a second use of the same id is a problem.</summary>
    public void Declare(LoadContext context, IdKind kind, Node item)
    {
        var id = item.Text("id");
        if (id.Length == 0)
        {
            return; // missing or not a string: the schema check reports it
        }
        if (declared.TryGetValue(id, out var first))
        {
            context.Add(item.PathOf("id"), $"'{id}' is already the id of the {Describe(first.Kind)} at {first.Path}",
                "ids must be unique across classes, tariffs, plants, stages, tanks, pipelines and customers; rename one of them");
            return;
        }
        declared[id] = (kind, item.Path);
    }

    public bool Is(string id, IdKind kind) => declared.TryGetValue(id, out var entry) && entry.Kind == kind;

    public IEnumerable<string> IdsOf(IdKind kind) => declared.Where(e => e.Value.Kind == kind).Select(e => e.Key);

    /// <summary>Checks that <paramref name="id"/> names something of one of <paramref name="kinds"/>; reports at
    /// <paramref name="location"/> otherwise. An empty id is not checked (the schema reports missing fields).</summary>
    public bool Resolve(LoadContext context, string id, string location, params IdKind[] kinds)
    {
        if (id.Length == 0)
        {
            return false;
        }
        if (declared.TryGetValue(id, out var entry) && kinds.Contains(entry.Kind))
        {
            return true;
        }
        var wanted = string.Join(" or ", kinds.Select(Describe));
        var candidates = kinds.SelectMany(IdsOf).ToList();
        var what = declared.TryGetValue(id, out var other)
            ? $"'{id}' is a {Describe(other.Kind)}, not a {wanted}"
            : $"'{id}' is not the id of any {wanted}";
        context.Add(location, what, $"{Suggest.DidYouMean(id, candidates)}give the id of a {wanted}: {Suggest.List(candidates)}");
        return false;
    }
}
