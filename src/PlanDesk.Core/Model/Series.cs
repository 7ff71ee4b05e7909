using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>
/// A time series as given in a network file: a constant, or values at regular instants.
/// <see cref="Resample"/> puts it onto a planning horizon: a coarser series is held, a finer one averaged.
/// </summary>
public abstract record Series
{
    /// <summary>Where the series came from, for messages (a JSON path or a CSV file and column).</summary>
    public string Origin { get; init; } = "";

    /// <summary>Values per period of <paramref name="horizon"/>, or a message saying which part is not covered.</summary>
    public abstract SeriesResult Resample(Horizon horizon);

    public static Series Constant(double value, string origin = "") => new ConstantSeries(value) { Origin = origin };
}

public sealed record SeriesResult(double[]? Values, string? Error)
{
    public static SeriesResult Ok(double[] values) => new(values, null);
    public static SeriesResult Fail(string error) => new(null, error);
}

/// <summary>The same value in every period.</summary>
public sealed record ConstantSeries(double Value) : Series
{
    public override SeriesResult Resample(Horizon horizon) => SeriesResult.Ok(Enumerable.Repeat(Value, horizon.Periods.Count).ToArray());
}

/// <summary>
/// Values at <see cref="Start"/> + k·<see cref="Step"/>; value k holds for [start + k·step, start + (k+1)·step).
/// </summary>
public sealed record StepSeries(Instant Start, Duration Step, IReadOnlyList<double> Values) : Series
{
    public Instant End => Start + Step * Values.Count;

    public override SeriesResult Resample(Horizon horizon)
    {
        if (horizon.Start < Start || horizon.End > End)
        {
            var zone = horizon.Zone;
            return SeriesResult.Fail(
                $"{Origin}: covers {Describe(Start, zone)} to {Describe(End, zone)} but the plan needs " +
                $"{Describe(horizon.Start, zone)} to {Describe(horizon.End, zone)}; extend the series to cover the horizon");
        }

        var result = new double[horizon.Periods.Count];
        for (var i = 0; i < result.Length; i++)
        {
            var period = horizon.Periods[i];
            result[i] = AverageOver(period.Start, period.End);
        }
        return SeriesResult.Ok(result);
    }

    // Time-weighted average over [from, to): holds a coarse series, averages a fine one.
    private double AverageOver(Instant from, Instant to)
    {
        var stepTicks = Step.BclCompatibleTicks;
        var first = (int)((from - Start).BclCompatibleTicks / stepTicks);
        var sum = 0.0;
        var covered = 0L;
        for (var k = first; k < Values.Count; k++)
        {
            var kStart = Start + Step * k;
            if (kStart >= to)
            {
                break;
            }
            var kEnd = kStart + Step;
            var overlap = (Min(kEnd, to) - Max(kStart, from)).BclCompatibleTicks;
            if (overlap > 0)
            {
                sum += Values[k] * overlap;
                covered += overlap;
            }
        }
        return covered == 0 ? 0 : sum / covered;
    }

    private static Instant Min(Instant a, Instant b) => a < b ? a : b;
    private static Instant Max(Instant a, Instant b) => a > b ? a : b;

    private static string Describe(Instant instant, DateTimeZone zone) =>
        instant.InZone(zone).LocalDateTime.ToString("yyyy-MM-dd HH:mm", null);
}
