using System.CommandLine;
using System.Globalization;
using PlanDesk.Core.Loading;

namespace PlanDesk.Cli;

/// <summary><c>plandesk validate NETWORK</c>: a short summary of a good network file, or every problem in a bad one.</summary>
internal static class ValidateCommand
{
    public static Command Create()
    {
        var network = new Argument<string>("NETWORK") { Description = "The network file (JSON); CSV paths in it are relative to it." };
        var command = new Command("validate", "Check a network file and print a summary, or every problem found.") { network };
        command.SetAction(parse => Run(parse.GetValue(network)!, Console.Out));
        return command;
    }

    /// <summary>Validates <paramref name="path"/> and writes the outcome; returns 0 when the file is valid, 1 otherwise.</summary>
    public static int Run(string path, TextWriter output)
    {
        var result = NetworkLoader.Load(path);
        if (result.Network is not { } network)
        {
            var count = result.Problems.Count;
            output.WriteLine($"{path}: {count} problem{(count == 1 ? "" : "s")} found; nothing was changed.");
            foreach (var problem in result.Problems)
            {
                output.WriteLine($"  {problem}");
            }
            return 1;
        }
        output.WriteLine($"{path}: valid.");
        foreach (var (label, text) in SummaryRows(NetworkSummary.Of(network)))
        {
            output.WriteLine($"  {label,-10} {text}");
        }
        return 0;
    }

    private static IEnumerable<(string Label, string Text)> SummaryRows(NetworkSummary summary)
    {
        yield return ("Network", summary.Name);
        yield return ("Time", $"zone {summary.Zone.Id}, {summary.PeriodMinutes}-minute periods, money in {summary.Currency}");
        yield return ("Plants", $"{summary.Plants} with {Count(summary.Stages, "polishing stage")}");
        yield return ("Tanks", $"{summary.Tanks} ({Count(summary.Reservoirs, "regional reservoir")})");
        yield return ("Customers", $"{summary.Customers}, reached by {Count(summary.Pipelines, "pipeline")}");
        yield return ("Series", SeriesRange(summary));
        if (summary.DefaultStart is not { } start)
        {
            yield return ("Horizon", "none in the file; give one to each command");
            yield break;
        }
        yield return ("Horizon", $"{start:yyyy-MM-dd} for {Count(summary.DefaultDays, "day")} (the file's default)");
        foreach (var problem in summary.DemandProblems)
        {
            yield return ("Demand", $"cannot be totalled: {problem}");
        }
        foreach (var demand in summary.DemandByClass)
        {
            yield return ("Demand", $"class {demand.Class} ({demand.Name}): {demand.VolumeM3.ToString("N0", CultureInfo.InvariantCulture)} m3 over the horizon");
        }
    }

    private static string SeriesRange(NetworkSummary summary)
    {
        if (summary.SeriesStart is not { } from || summary.SeriesEnd is not { } to)
        {
            return "all constant, so any horizon is covered";
        }
        if (to <= from)
        {
            return "the time series share no common range: no horizon can be planned until they overlap";
        }
        string Local(NodaTime.Instant instant) => instant.InZone(summary.Zone).LocalDateTime.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);
        return $"all cover {Local(from)} to {Local(to)} local time";
    }

    private static string Count(int n, string noun) => $"{n} {noun}{(n == 1 ? "" : "s")}";
}
