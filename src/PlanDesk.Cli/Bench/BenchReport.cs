using System.Globalization;
using System.Runtime.InteropServices;
using Spectre.Console;

namespace PlanDesk.Cli.Bench;

/// <summary>Shows benchmark rows as a table and writes them as CSV, with the machine they ran on.</summary>
internal static class BenchReport
{
    /// <summary>Two tables narrow enough for a terminal — the model and its times, then the results — and the notes.</summary>
    public static void Show(IReadOnlyList<BenchResult> rows)
    {
        AnsiConsole.Write(Table(rows, ["vars", "ints", "cons", "build s", "1st plan s", "1st plan cost", "solve s", "peak MB"], r =>
        [
            Count(r.Variables), Count(r.Integers), Count(r.Constraints), Fixed(r.BuildSeconds, 2), Fixed(r.FirstPlanSeconds, 1),
            Fixed(r.FirstPlanObjective, 0), Fixed(r.SolveSeconds, 1), Fixed(r.PeakMemoryMB, 0),
        ]));
        AnsiConsole.Write(Table(rows, ["status", "objective", "bound", "gap %", "LP bound", "baseline", "saving %", "op. saving %", "violations (hard)"], r =>
        [
            r.Status, Fixed(r.Objective, 0), Fixed(r.BestBound, 0), Fixed(r.GapPercent, 2), Fixed(r.LpRelaxationBound, 0),
            Fixed(r.BaselineCost, 0), Fixed(r.SavingPercent, 1), Fixed(r.OperatingSavingPercent, 1),
            r.Violations is null ? "" : $"{r.Violations} ({r.HardViolations})",
        ]));
        foreach (var r in rows.Where(r => r.Note.Length > 0))
        {
            AnsiConsole.WriteLine($"{r.Size} seed {r.Seed} {r.Solver}: {r.Note}");
        }
    }

    private static Table Table(IReadOnlyList<BenchResult> rows, string[] headers, Func<BenchResult, string[]> cells)
    {
        var table = new Table().Border(TableBorder.Rounded);
        foreach (var header in new[] { "size", "seed", "solver" }.Concat(headers))
        {
            table.AddColumn(new TableColumn(header).RightAligned());
        }
        foreach (var r in rows)
        {
            table.AddRow(new[] { r.Size, Count(r.Seed), r.Solver }.Concat(cells(r)).Select(Markup.Escape).ToArray());
        }
        return table;
    }

    public static void WriteCsv(IReadOnlyList<BenchResult> rows, string path)
    {
        var columns = typeof(BenchResult).GetProperties();
        var lines = new List<string> { string.Join(",", columns.Select(c => Field(c.Name))) };
        lines.AddRange(rows.Select(row => string.Join(",", columns.Select(c => Field(c.GetValue(row) switch
        {
            null => "",
            // Enough digits to compare runs, not the noise of the last bits.
            double d => d.ToString("0.####", CultureInfo.InvariantCulture),
            IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
            var other => other.ToString() ?? "",
        })))));
        File.WriteAllLines(path, lines);
    }

    // RFC 4180: quote a field holding a comma, quote or line break, doubling its quotes.
    private static string Field(string text) =>
        text.IndexOfAny([',', '"', '\n', '\r']) < 0 ? text : "\"" + text.Replace("\"", "\"\"") + "\"";

    /// <summary>Cores, processor, memory, operating system and runtime, for the record of where figures were measured.</summary>
    public static string Machine()
    {
        var cpu = "";
        if (File.Exists("/proc/cpuinfo"))
        {
            cpu = File.ReadLines("/proc/cpuinfo").FirstOrDefault(l => l.StartsWith("model name", StringComparison.Ordinal))
                ?.Split(':', 2)[1].Trim() ?? "";
        }
        var memoryGb = GC.GetGCMemoryInfo().TotalAvailableMemoryBytes / 1024.0 / 1024 / 1024;
        return $"{Environment.ProcessorCount} cores{(cpu.Length > 0 ? $" ({cpu})" : "")}, {memoryGb:0.#} GB memory, " +
            $"{RuntimeInformation.OSDescription}, {RuntimeInformation.FrameworkDescription}";
    }

    private static string Count(int? value) => value?.ToString("N0", CultureInfo.InvariantCulture) ?? "";

    private static string Fixed(double? value, int decimals) => value?.ToString("N" + decimals, CultureInfo.InvariantCulture) ?? "";
}
