using NodaTime;

namespace PlanDesk.Core.Loading;

/// <summary>What the readers of one network file share: where it came from, the problems found so far, the ids
/// declared in it, and the CSV files already read.</summary>
internal sealed class LoadContext
{
    private readonly List<LoadProblem> problems = [];

    public LoadContext(string file, string? baseDirectory)
    {
        File = file;
        BaseDirectory = baseDirectory;
        Csv = new CsvFiles(this);
    }

    /// <summary>The network file as the user named it.</summary>
    public string File { get; }
    /// <summary>Directory CSV paths are relative to; null when the network came without one (no CSV allowed).</summary>
    public string? BaseDirectory { get; }
    /// <summary>The network's zone once read; UTC until then or when the zone is unknown (already reported).</summary>
    public DateTimeZone Zone { get; set; } = DateTimeZone.Utc;
    public IdIndex Ids { get; } = new();
    /// <summary>Facts spanning the file (classes of tanks and customers ...), read before the model is built.</summary>
    public Catalog Catalog { get; set; } = new();
    public CsvFiles Csv { get; }
    public IReadOnlyList<LoadProblem> Problems => problems;

    public void Add(string location, string what, string fix) => problems.Add(new LoadProblem(File, location, what, fix));

    public void AddIn(string file, string location, string what, string fix) => problems.Add(new LoadProblem(file, location, what, fix));

    public void AddRange(IEnumerable<LoadProblem> more) => problems.AddRange(more);
}
