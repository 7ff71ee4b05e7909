using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>The hours every generated series covers: whole local days from the region's start date.</summary>
internal sealed class HourGrid
{
    public HourGrid(DateTimeZone zone, LocalDate startDate, int days)
    {
        Zone = zone;
        StartDate = startDate;
        Start = zone.AtStartOfDay(startDate).ToInstant();
        var end = zone.AtStartOfDay(startDate.PlusDays(days)).ToInstant();
        var local = new List<LocalDateTime>();
        for (var t = Start; t < end; t += Duration.FromHours(1))
        {
            local.Add(t.InZone(zone).LocalDateTime);
        }
        Local = local;
    }

    public DateTimeZone Zone { get; }
    public LocalDate StartDate { get; }
    public Instant Start { get; }
    /// <summary>Local start of each hour; a daylight-saving day has 23 or 25.</summary>
    public IReadOnlyList<LocalDateTime> Local { get; }
    public int Count => Local.Count;

    /// <summary>An hourly series on this grid.</summary>
    public Series Series(IReadOnlyList<double> values) => new StepSeries(Start, Duration.FromHours(1), values.ToArray());
}
