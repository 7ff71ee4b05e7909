using System.Text.Json;
using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>What values a series may hold, e.g. flows of 0 or more.</summary>
/// <param name="Accepts">True for an allowed value.</param>
/// <param name="Problem">Said after the value when it is not allowed, e.g. "is negative".</param>
/// <param name="Fix">What to give instead.</param>
internal sealed record ValueRule(Func<double, bool> Accepts, string Problem, string Fix)
{
    public static readonly ValueRule Any = new(_ => true, "", "");

    public static ValueRule NonNegative(string quantity) => new(v => v >= 0, "is negative", $"give {quantity} of 0 or more");

    public static ValueRule UnitCount(int units) =>
        new(v => v >= 0 && v <= units && v == Math.Floor(v), $"is not a whole number of units from 0 to {units}",
            $"give how many of the stage's {units} units are available");
}

/// <summary>Reads a series in any of its three forms: a number, inline values, or a CSV column.</summary>
internal static class SeriesReader
{
    private const int MaxValueProblems = 5;

    /// <summary>The series at <paramref name="node"/>, or null when it is missing or unusable (problems reported).
    /// Every value is checked against <paramref name="rule"/>.</summary>
    public static Series? Read(Node? node, LoadContext context, ValueRule rule)
    {
        if (node is not { } at)
        {
            return null;
        }
        if (at.Element.ValueKind == JsonValueKind.Number)
        {
            var value = at.Element.GetDouble();
            Check(context, rule, [value], _ => (context.File, at.Path));
            return Series.Constant(value, at.Path);
        }
        if (!at.IsObject)
        {
            return null; // the schema reports a series of the wrong type
        }
        return at.Has("csv") ? ReadCsv(at, context, rule) : ReadInline(at, context, rule);
    }

    private static Series? ReadInline(Node at, LoadContext context, ValueRule rule)
    {
        var values = at.Items("values").Select(v => v.Element.ValueKind == JsonValueKind.Number ? v.Element.GetDouble() : double.NaN).ToList();
        var stepMinutes = at.Int("stepMinutes", 0);
        var startText = at.Text("start");
        Instant? start = null;
        if (startText.Length > 0)
        {
            var (instant, why) = TimeText.ParseStart(startText, context.Zone);
            if (why is not null)
            {
                context.Add(at.PathOf("start"), $"'{startText}' {why}", "give the local start of the first value in the network's zone, or add an offset");
            }
            start = instant;
        }
        Check(context, rule, values, i => (context.File, $"{at.PathOf("values")}[{i}]"));
        if (start is null || stepMinutes < 1 || values.Count == 0 || values.Any(double.IsNaN))
        {
            return null;
        }
        return new StepSeries(start.Value, Duration.FromMinutes(stepMinutes), values) { Origin = at.Path };
    }

    private static Series? ReadCsv(Node at, LoadContext context, ValueRule rule)
    {
        var file = at.Text("csv");
        var column = at.Text("column");
        if (file.Length == 0 || context.Csv.Get(file, at.PathOf("csv")) is not { } table)
        {
            return null;
        }
        if (column.Length == 0)
        {
            return null;
        }
        if (!table.Values.TryGetValue(column, out var values))
        {
            context.Add(at.PathOf("column"), $"'{column}' is not a column of {table.DisplayPath}",
                $"{Suggest.DidYouMean(column, table.Columns)}give one of its columns: {Suggest.List(table.Columns)}");
            return null;
        }
        Check(context, rule, values, i => (table.DisplayPath, $"line {table.Lines[i]}, column '{column}'"));
        if (!table.Usable)
        {
            return null;
        }
        return new StepSeries(table.Times[0], table.Step, values) { Origin = $"{file} column {column}" };
    }

    private static void Check(LoadContext context, ValueRule rule, IReadOnlyList<double> values, Func<int, (string File, string Location)> place)
    {
        var bad = Enumerable.Range(0, values.Count).Where(i => !double.IsNaN(values[i]) && !rule.Accepts(values[i])).ToList();
        foreach (var i in bad.Take(MaxValueProblems))
        {
            var (file, location) = place(i);
            context.AddIn(file, location, $"{values[i]} {rule.Problem}", rule.Fix);
        }
        if (bad.Count > MaxValueProblems)
        {
            var (file, location) = place(bad[MaxValueProblems]);
            context.AddIn(file, location, $"and {bad.Count - MaxValueProblems} more values of this series {rule.Problem.Replace("is ", "are ")}", rule.Fix);
        }
    }
}
