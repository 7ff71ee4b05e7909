using System.Text;
using System.Text.Json;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>
/// Reads and validates a network file (docs/network-format.md). Never throws for a mistake in the file:
/// returns the network, or every problem found, each with its file, place, what is wrong and what would be valid.
/// </summary>
public static class NetworkLoader
{
    /// <summary>Files above this size are refused unread: a network with a week of 15-minute series is far smaller.</summary>
    public const long MaxFileBytes = 50_000_000;
    /// <summary>Deepest nesting accepted; the format itself needs about eight levels.</summary>
    public const int MaxDepth = 64;
    /// <summary>At most this many problems are listed; the rest are counted.</summary>
    public const int MaxProblems = 200;

    /// <summary>Loads the network file at <paramref name="path"/>; CSV paths in it are relative to its folder.</summary>
    public static NetworkLoadResult Load(string path)
    {
        var file = new FileInfo(path);
        if (!file.Exists)
        {
            return Fail(path, "", "the file does not exist", $"check the path (looked for {file.FullName})");
        }
        if (file.Length > MaxFileBytes)
        {
            return TooLarge(path, file.Length);
        }
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return Fail(path, "", $"the file cannot be read: {e.Message}", "check that it is a readable file");
        }
        return LoadBytes(bytes, path, file.DirectoryName);
    }

    /// <summary>Loads a network given as text. <paramref name="sourceName"/> names it in messages;
    /// <paramref name="baseDirectory"/> is where its CSV paths start (null: CSV references are refused).</summary>
    public static NetworkLoadResult LoadText(string json, string sourceName, string? baseDirectory)
    {
        if (json.Length > MaxFileBytes)
        {
            return TooLarge(sourceName, json.Length);
        }
        return LoadBytes(Encoding.UTF8.GetBytes(json), sourceName, baseDirectory);
    }

    private static NetworkLoadResult LoadBytes(byte[] bytes, string sourceName, string? baseDirectory)
    {
        var utf8 = bytes.AsMemory();
        if (utf8.Span.StartsWith(Encoding.UTF8.Preamble))
        {
            utf8 = utf8[Encoding.UTF8.Preamble.Length..];
        }
        var scan = JsonSyntax.Check(utf8.Span, sourceName);
        if (scan.Fatal is { } fatal)
        {
            return new NetworkLoadResult(null, [fatal]);
        }
        using var document = JsonDocument.Parse(utf8, new JsonDocumentOptions { MaxDepth = MaxDepth });
        var context = new LoadContext(sourceName, baseDirectory);
        var schemaProblems = SchemaCheck.Check(document.RootElement, sourceName);
        var network = NetworkReader.Read(document.RootElement, context);

        // A value the schema rejected is often rejected again by a reader; the schema's message is enough.
        var located = schemaProblems.Select(p => (p.File, p.Location)).ToHashSet();
        var problems = scan.RepeatedFields.Concat(schemaProblems).Concat(context.Problems.Where(p => !located.Contains((p.File, p.Location)))).Distinct().ToList();
        if (problems.Count == 0 && network is not null)
        {
            problems.AddRange(DefaultHorizonCoverage(network));
        }
        if (problems.Count > 0 || network is null)
        {
            return new NetworkLoadResult(null, Limit(problems));
        }
        return new NetworkLoadResult(network, []);
    }

    // A file that names a default horizon promises its series cover it; say which do not, before any solve.
    private static IEnumerable<LoadProblem> DefaultHorizonCoverage(Network network)
    {
        if (network.DefaultStartDate is not { } start)
        {
            yield break;
        }
        var horizon = Horizon.Create(network.TimeZone, start, network.DefaultDays, network.PeriodMinutes);
        foreach (var (series, what) in NetworkSeries.All(network))
        {
            if (series is StepSeries stepped && (stepped.Start > horizon.Start || stepped.End < horizon.End))
            {
                var zone = network.TimeZone;
                yield return new LoadProblem(network.SourcePath, stepped.Origin,
                    $"the {what} covers {TimeText.Describe(stepped.Start, zone)} to {TimeText.Describe(stepped.End, zone)} but the default horizon " +
                    $"needs {TimeText.Describe(horizon.Start, zone)} to {TimeText.Describe(horizon.End, zone)}",
                    "extend the series, or move $.horizon inside it");
            }
        }
    }

    private static IReadOnlyList<LoadProblem> Limit(List<LoadProblem> problems)
    {
        if (problems.Count <= MaxProblems)
        {
            return problems;
        }
        var more = problems.Count - MaxProblems;
        var first = problems[0].File;
        return [.. problems.Take(MaxProblems), new LoadProblem(first, "", $"{more} more problems are not listed", "fix the ones above and validate again")];
    }

    private static NetworkLoadResult TooLarge(string file, long size) =>
        Fail(file, "", $"the file is {size / 1e6:F1} MB, over the {MaxFileBytes / 1_000_000} MB limit for a network file",
            "keep long time series in CSV files next to the network, or plan a shorter period");

    private static NetworkLoadResult Fail(string file, string location, string what, string fix) =>
        new(null, [new LoadProblem(file, location, what, fix)]);
}
