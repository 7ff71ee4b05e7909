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
    // Fifty years of minutes: far beyond any use, and safely inside NodaTime's range from any plausible start.
    private const double MaxSpanMinutes = 50 * 525_600;

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
        var values = ReadValues(at, context);
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
        if ((double)stepMinutes * values.Count > MaxSpanMinutes)
        {
            context.Add(at.PathOf("values"), $"{values.Count} values of {stepMinutes} min span more than {MaxSpanMinutes / 525_600} years",
                "give the values for the weeks to be planned, not decades");
            return null;
        }
        if (start is null || stepMinutes < 1 || values.Count == 0 || values.Any(double.IsNaN))
        {
            return null;
        }
        return new StepSeries(start.Value, Duration.FromMinutes(stepMinutes), values) { Origin = at.Path };
    }

    // The schema does not see series values (see SchemaCheck), so their type is checked here.
    private static List<double> ReadValues(Node series, LoadContext context)
    {
        var values = new List<double>();
        var wrong = 0;
        if (series.Field("values") is not { Element.ValueKind: JsonValueKind.Array } array)
        {
            return values;
        }
        foreach (var item in array.Element.EnumerateArray())
        {
            if (item.ValueKind == JsonValueKind.Number)
            {
                values.Add(item.GetDouble());
                continue;
            }
            if (++wrong <= MaxValueProblems)
            {
                context.Add($"{array.Path}[{values.Count}]", $"{JsonPaths.Show(item)} is {JsonPaths.KindOf(item)}, not a number", "give a value of the series, e.g. 420");
            }
            values.Add(double.NaN);
        }
        if (wrong > MaxValueProblems)
        {
            context.Add(series.PathOf("values"), $"{wrong - MaxValueProblems} more values are not numbers", "give every value as a number, e.g. 420");
        }
        return values;
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
        var bad = Enumerable.Range(0, values.Count).Where(i => !double.IsNaN(values[i]) && !(Math.Abs(values[i]) <= SchemaCheck.MaxMagnitude && rule.Accepts(values[i]))).ToList();
        foreach (var i in bad.Take(MaxValueProblems))
        {
            var (file, location) = place(i);
            if (Math.Abs(values[i]) > SchemaCheck.MaxMagnitude)
            {
                context.AddIn(file, location, $"{values[i]} is far too large", "check the number; no quantity in a network file is above 1e15");
                continue;
            }
            context.AddIn(file, location, $"{values[i]} {rule.Problem}", rule.Fix);
        }
        if (bad.Count > MaxValueProblems)
        {
            var (file, location) = place(bad[MaxValueProblems]);
            context.AddIn(file, location, $"and {bad.Count - MaxValueProblems} more values of this series {rule.Problem.Replace("is ", "are ")}", rule.Fix);
        }
    }
}
