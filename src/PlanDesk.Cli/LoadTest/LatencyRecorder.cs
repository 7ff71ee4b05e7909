using System.Collections.Concurrent;
using System.Globalization;

namespace PlanDesk.Cli.LoadTest;

/// <summary>Latencies and outcomes per kind of request, collected from many controllers at once.</summary>
internal sealed class LatencyRecorder
{
    private readonly ConcurrentDictionary<string, ConcurrentBag<double>> millisecondsByKind = new();
    private readonly ConcurrentDictionary<string, int> errorsByKind = new();
    private readonly ConcurrentDictionary<string, int> statusCounts = new();

    public void Record(string kind, int status, double milliseconds, bool expected)
    {
        millisecondsByKind.GetOrAdd(kind, _ => []).Add(milliseconds);
        statusCounts.AddOrUpdate($"{kind} {status}", 1, (_, n) => n + 1);
        if (!expected)
        {
            errorsByKind.AddOrUpdate(kind, 1, (_, n) => n + 1);
        }
    }

    public void RecordFailure(string kind, double milliseconds)
    {
        millisecondsByKind.GetOrAdd(kind, _ => []).Add(milliseconds);
        errorsByKind.AddOrUpdate(kind, 1, (_, n) => n + 1);
        statusCounts.AddOrUpdate($"{kind} no answer", 1, (_, n) => n + 1);
    }

    public int TotalRequests => millisecondsByKind.Values.Sum(b => b.Count);
    public int TotalErrors => errorsByKind.Values.Sum();

    /// <summary>A plain-text table: requests, throughput and latency percentiles per kind and overall.</summary>
    public string Report(TimeSpan elapsed)
    {
        var lines = new List<string> { $"{"request",-22} {"count",8} {"per s",8} {"p50 ms",8} {"p99 ms",8} {"max ms",8} {"errors",7}" };
        foreach (var (kind, samples) in millisecondsByKind.OrderBy(k => k.Key))
        {
            lines.Add(Row(kind, samples.ToArray(), errorsByKind.GetValueOrDefault(kind), elapsed));
        }
        lines.Add(Row("all", millisecondsByKind.Values.SelectMany(b => b).ToArray(), TotalErrors, elapsed));
        lines.Add("");
        lines.Add("answers: " + string.Join(", ", statusCounts.OrderBy(s => s.Key).Select(s => $"{s.Key}: {s.Value}")));
        return string.Join(Environment.NewLine, lines);
    }

    private static string Row(string kind, double[] samples, int errors, TimeSpan elapsed)
    {
        Array.Sort(samples);
        var perSecond = samples.Length / elapsed.TotalSeconds;
        return string.Create(CultureInfo.InvariantCulture,
            $"{kind,-22} {samples.Length,8} {perSecond,8:0.0} {Percentile(samples, 0.50),8:0.0} {Percentile(samples, 0.99),8:0.0} {(samples.Length == 0 ? 0 : samples[^1]),8:0.0} {errors,7}");
    }

    // Nearest-rank percentile of sorted samples.
    private static double Percentile(double[] sorted, double fraction) =>
        sorted.Length == 0 ? 0 : sorted[Math.Clamp((int)Math.Ceiling(fraction * sorted.Length) - 1, 0, sorted.Length - 1)];
}
