using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>
/// The planning horizon: whole local days in the network's zone, split into periods of equal length in
/// UTC. A spring-forward day has one hour fewer of periods, a fall-back day one hour more.
/// </summary>
public sealed class Horizon
{
    private Horizon(DateTimeZone zone, LocalDate startDate, int days, int periodMinutes, IReadOnlyList<Period> periods, IReadOnlyList<PlanDay> planDays)
    {
        Zone = zone;
        StartDate = startDate;
        DayCount = days;
        PeriodMinutes = periodMinutes;
        Periods = periods;
        Days = planDays;
    }

    public DateTimeZone Zone { get; }
    public LocalDate StartDate { get; }
    public int DayCount { get; }
    public int PeriodMinutes { get; }
    public IReadOnlyList<Period> Periods { get; }
    public IReadOnlyList<PlanDay> Days { get; }
    public Instant Start => Periods[0].Start;
    public Instant End => Periods[^1].End;
    /// <summary>Length of one period in hours (1, 0.5 or 0.25).</summary>
    public double PeriodHours => PeriodMinutes / 60.0;

    public static readonly IReadOnlyList<int> AllowedPeriodMinutes = [15, 30, 60];
    public const int MaxDays = 7;

    /// <summary>Builds the horizon; the caller has checked the period length (15, 30 or 60) and days (1 to 7).</summary>
    public static Horizon Create(DateTimeZone zone, LocalDate startDate, int days, int periodMinutes)
    {
        if (!AllowedPeriodMinutes.Contains(periodMinutes))
        {
            throw new ArgumentOutOfRangeException(nameof(periodMinutes), periodMinutes, "period length must be 15, 30 or 60 minutes");
        }
        if (days < 1 || days > MaxDays)
        {
            throw new ArgumentOutOfRangeException(nameof(days), days, $"a horizon has 1 to {MaxDays} days");
        }

        var step = Duration.FromMinutes(periodMinutes);
        var periods = new List<Period>();
        var planDays = new List<PlanDay>();
        for (var d = 0; d < days; d++)
        {
            var date = startDate.PlusDays(d);
            var dayStart = zone.AtStartOfDay(date).ToInstant();
            var dayEnd = zone.AtStartOfDay(date.PlusDays(1)).ToInstant();
            var first = periods.Count;
            for (var t = dayStart; t < dayEnd; t += step)
            {
                var local = t.InZone(zone).LocalDateTime;
                periods.Add(new Period(periods.Count, t, t + step, d, local));
            }
            planDays.Add(new PlanDay(d, date, first, periods.Count - first));
        }
        return new Horizon(zone, startDate, days, periodMinutes, periods, planDays);
    }
}

/// <summary>One planning period [Start, End) in UTC, with the local day it belongs to.</summary>
public sealed record Period(int Index, Instant Start, Instant End, int Day, LocalDateTime LocalStart);

/// <summary>A local day of the horizon and its periods [FirstPeriod, FirstPeriod + PeriodCount).</summary>
public sealed record PlanDay(int Index, LocalDate Date, int FirstPeriod, int PeriodCount)
{
    public IEnumerable<int> PeriodIndices => Enumerable.Range(FirstPeriod, PeriodCount);
}
