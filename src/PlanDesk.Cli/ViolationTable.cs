using System.Globalization;
using PlanDesk.Core.Checking;

namespace PlanDesk.Cli;

/// <summary>Violations as a plain-text table: kind, place, when, size, limit, then the sentence.</summary>
internal static class ViolationTable
{
    public static void Write(IReadOnlyList<Violation> violations, TextWriter output)
    {
        var rows = violations.Select(v => new[]
        {
            v.Kind + (v.Penalised ? " (priced)" : ""),
            v.Where,
            v.LocalStart?.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture) ?? v.Day?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) ?? "",
            $"{Number(v.Amount)} {v.Unit}".Trim(),
            v.Limit is { } limit ? $"{Number(limit)} {v.Unit}".Trim() : "",
            v.Message,
        }).ToList();
        string[] header = ["kind", "where", "when", "size", "limit", "what"];
        var widths = Enumerable.Range(0, header.Length - 1).Select(i => rows.Select(r => r[i].Length).Append(header[i].Length).Max()).ToArray();
        void Line(string[] cells) =>
            output.WriteLine(string.Join("  ", cells.Take(widths.Length).Select((c, i) => c.PadRight(widths[i]))) + "  " + cells[^1]);
        Line(header);
        foreach (var row in rows)
        {
            Line(row);
        }
    }

    private static string Number(double value) => value.ToString("#,0.###", CultureInfo.InvariantCulture);
}
