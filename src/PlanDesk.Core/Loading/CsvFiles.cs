using System.Globalization;
using NodaTime;

namespace PlanDesk.Core.Loading;

/// <summary>A CSV time-series file: timestamps at a regular step and numeric columns (NaN where a cell is bad).</summary>
internal sealed record CsvTable(
    string DisplayPath,
    IReadOnlyList<string> Columns,
    IReadOnlyList<Instant> Times,
    IReadOnlyList<int> Lines,
    Duration Step,
    IReadOnlyDictionary<string, double[]> Values,
    bool Usable);

/// <summary>Reads each CSV file a network refers to once, reporting every bad line, cell and timestamp.</summary>
internal sealed class CsvFiles(LoadContext context)
{
    /// <summary>A CSV file larger than this is refused unread, like a network file.</summary>
    public const long MaxBytes = NetworkLoader.MaxFileBytes;
    private const int MaxCellProblems = 20;

    private readonly Dictionary<string, CsvTable?> cache = new(StringComparer.Ordinal);

    /// <summary>The table for <paramref name="relativePath"/>, or null when it cannot be used (problem reported at
    /// <paramref name="location"/>, the JSON path of the reference, or in the file itself).</summary>
    public CsvTable? Get(string relativePath, string location)
    {
        if (context.BaseDirectory is null)
        {
            context.Add(location, $"refers to the CSV file '{relativePath}' but this network was not read from a folder",
                "give the values inline as {start, stepMinutes, values}");
            return null;
        }
        if (Path.IsPathRooted(relativePath))
        {
            context.Add(location, $"'{relativePath}' is an absolute path", "give the CSV path relative to the network file");
            return null;
        }
        var fullPath = Path.GetFullPath(Path.Combine(context.BaseDirectory, relativePath));
        if (cache.TryGetValue(fullPath, out var known))
        {
            return known;
        }
        var display = Path.Combine(Path.GetDirectoryName(context.File) ?? "", relativePath);
        var table = Read(fullPath, display, relativePath, location);
        cache[fullPath] = table;
        return table;
    }

    private CsvTable? Read(string fullPath, string display, string relativePath, string location)
    {
        var info = new FileInfo(fullPath);
        if (!info.Exists)
        {
            context.Add(location, $"the CSV file '{relativePath}' does not exist (looked for {fullPath})", "check the path; it is relative to the network file");
            return null;
        }
        if (info.Length > MaxBytes)
        {
            context.AddIn(display, "", $"the file is {info.Length / 1e6:F1} MB, over the {MaxBytes / 1_000_000} MB limit", "split it or use a coarser step");
            return null;
        }
        string[] lines;
        try
        {
            lines = File.ReadAllLines(fullPath);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            context.Add(location, $"the CSV file '{relativePath}' cannot be read: {e.Message}", "check that the file is readable");
            return null;
        }
        return Parse(lines, display);
    }

    private CsvTable? Parse(string[] lines, string display)
    {
        var header = lines.Length > 0 ? Split(lines[0]) : [];
        if (header.Length < 2 || !header[0].Equals("timestamp", StringComparison.OrdinalIgnoreCase))
        {
            context.AddIn(display, "line 1", lines.Length == 0 ? "the file is empty" : "the header does not start with 'timestamp' and a column name",
                "write a header such as: timestamp,larkmoor,fernbrook");
            return null;
        }
        var columns = header.Skip(1).ToList();
        if (columns.GroupBy(c => c).FirstOrDefault(g => g.Count() > 1) is { } repeated)
        {
            context.AddIn(display, "line 1", $"the column '{repeated.Key}' appears twice in the header", "give each column its own name");
            return null;
        }
        var times = new List<Instant>();
        var written = new List<string>();
        var lineNumbers = new List<int>();
        var values = columns.ToDictionary(c => c, _ => new List<double>());
        var usable = true;
        var cellProblems = 0;
        for (var i = 1; i < lines.Length; i++)
        {
            if (string.IsNullOrWhiteSpace(lines[i]))
            {
                continue;
            }
            var line = i + 1;
            var fields = Split(lines[i]);
            if (fields.Length != header.Length)
            {
                context.AddIn(display, $"line {line}", $"has {fields.Length} fields but the header has {header.Length}", "give a timestamp and one value per column");
                usable = false;
                continue;
            }
            if (TimeText.ParseInstant(fields[0]) is not { } time || !TimeText.IsPlausible(time))
            {
                context.AddIn(display, $"line {line}, column 'timestamp'", $"'{fields[0]}' is not an ISO-8601 timestamp with an offset",
                    "write it like 2027-03-26T00:00:00+01:00 or 2027-03-25T23:00:00Z");
                usable = false;
                continue;
            }
            times.Add(time);
            written.Add(fields[0]);
            lineNumbers.Add(line);
            for (var c = 0; c < columns.Count; c++)
            {
                var cell = fields[c + 1];
                if (double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out var number) && double.IsFinite(number))
                {
                    values[columns[c]].Add(number);
                    continue;
                }
                values[columns[c]].Add(double.NaN);
                usable = false;
                if (++cellProblems <= MaxCellProblems)
                {
                    context.AddIn(display, $"line {line}, column '{columns[c]}'", cell.Length == 0 ? "the cell is empty" : $"'{cell}' is not a number",
                        "give a number with '.' as the decimal point, e.g. 420.5");
                }
            }
        }
        if (cellProblems > MaxCellProblems)
        {
            context.AddIn(display, "", $"{cellProblems - MaxCellProblems} more cells are not numbers", "fix the cells listed above and the rest like them");
        }
        if (times.Count < 2)
        {
            context.AddIn(display, "", $"has {times.Count} data row(s); a CSV series needs at least two so its step can be seen", "add rows covering the horizon");
            return null;
        }
        var step = CheckSteps(times, written, lineNumbers, display, ref usable);
        return new CsvTable(display, columns, times, lineNumbers, step, values.ToDictionary(v => v.Key, v => v.Value.ToArray()), usable);
    }

    // The step is the most common gap between rows; every other gap is a repeated, missing or out-of-order timestamp.
    private Duration CheckSteps(List<Instant> times, List<string> written, List<int> lines, string display, ref bool usable)
    {
        var gaps = Enumerable.Range(1, times.Count - 1).Select(i => times[i] - times[i - 1]).ToList();
        var step = gaps.Where(g => g > Duration.Zero).GroupBy(g => g).OrderByDescending(g => g.Count()).Select(g => g.Key).FirstOrDefault();
        var stepText = $"{step.TotalMinutes:0.##} min";
        for (var i = 1; i < times.Count; i++)
        {
            var gap = gaps[i - 1];
            if (gap == step)
            {
                continue;
            }
            usable = false;
            var (what, fix) = gap == Duration.Zero
                ? ($"timestamp {written[i]} repeats line {lines[i - 1]}", "remove one of the two rows")
                : gap < Duration.Zero
                    ? ($"timestamp {written[i]} is earlier than line {lines[i - 1]}", "sort the rows by time")
                    : step > Duration.Zero && gap.BclCompatibleTicks % step.BclCompatibleTicks == 0
                        ? ($"{gap.BclCompatibleTicks / step.BclCompatibleTicks - 1} timestamp(s) missing after line {lines[i - 1]} ({written[i - 1]} to {written[i]})",
                            $"add the missing rows; the file's step is {stepText}")
                        : ($"timestamp {written[i]} is not one step of {stepText} after line {lines[i - 1]}", $"use the same step of {stepText} throughout");
            context.AddIn(display, $"line {lines[i]}", what, fix);
        }
        return step;
    }

    // Comma-separated, fields trimmed; a field may be wrapped in double quotes.
    private static string[] Split(string line) =>
        line.Split(',').Select(f => f.Trim().Trim('"').Trim()).ToArray();
}
