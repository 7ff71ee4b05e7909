using NodaTime;
using NodaTime.Text;

namespace PlanDesk.Core.Loading;

/// <summary>Parsing of the date and time forms the network file and its CSV files use.</summary>
internal static class TimeText
{
    private static readonly LocalDatePattern Date = LocalDatePattern.Iso;
    private static readonly LocalTimePattern TimeOfDay = LocalTimePattern.CreateWithInvariantCulture("HH':'mm");
    private static readonly LocalDateTimePattern[] Local =
    [
        LocalDateTimePattern.CreateWithInvariantCulture("uuuu'-'MM'-'dd'T'HH':'mm"),
        LocalDateTimePattern.CreateWithInvariantCulture("uuuu'-'MM'-'dd'T'HH':'mm':'ss"),
    ];
    private static readonly OffsetDateTimePattern[] WithOffset =
    [
        OffsetDateTimePattern.CreateWithInvariantCulture("uuuu'-'MM'-'dd'T'HH':'mmo<G>"),
        OffsetDateTimePattern.CreateWithInvariantCulture("uuuu'-'MM'-'dd'T'HH':'mm':'sso<G>"),
        OffsetDateTimePattern.CreateWithInvariantCulture("uuuu'-'MM'-'dd'T'HH':'mm':'ss.FFFFFFFFFo<G>"),
    ];

    /// <summary>Dates and instants outside these years are typing mistakes (and would overflow time arithmetic).</summary>
    public const int FirstYear = 1900;
    public const int LastYear = 2200;

    public static bool IsPlausible(LocalDate date) => date.Year is >= FirstYear and <= LastYear;

    public static bool IsPlausible(Instant instant) => IsPlausible(instant.InUtc().Date);

    public static string PlausibleRange => $"a date from {FirstYear} to {LastYear}";

    public static LocalDate? ParseDate(string text) => Date.Parse(text) is { Success: true } r ? r.Value : null;

    public static LocalTime? ParseTimeOfDay(string text) => TimeOfDay.Parse(text) is { Success: true } r ? r.Value : null;

    /// <summary>An ISO-8601 timestamp with an offset or Z.</summary>
    public static Instant? ParseInstant(string text) =>
        WithOffset.Select(p => p.Parse(text)).FirstOrDefault(r => r.Success) is { } r ? r.Value.ToInstant() : null;

    /// <summary>A timestamp with an offset, or a local one placed in <paramref name="zone"/>. Returns the instant, or why
    /// the local time does not name exactly one instant.</summary>
    public static (Instant? Instant, string? Why) ParseStart(string text, DateTimeZone zone)
    {
        if (ParseInstant(text) is { } instant)
        {
            return IsPlausible(instant) ? (instant, null) : (null, $"is not {PlausibleRange}");
        }
        if (Local.Select(p => p.Parse(text)).FirstOrDefault(r => r.Success) is not { } local)
        {
            return (null, "is not a date and time like 2027-03-26T00:00 or 2027-03-26T00:00+01:00");
        }
        if (!IsPlausible(local.Value.Date))
        {
            return (null, $"is not {PlausibleRange}");
        }
        var mapping = zone.MapLocal(local.Value);
        return mapping.Count switch
        {
            1 => (mapping.Single().ToInstant(), null),
            0 => (null, $"falls in the hour skipped when clocks go forward in {zone.Id}"),
            _ => (null, $"happens twice in {zone.Id} (clocks go back); add the offset, e.g. {text}{mapping.First().Offset}"),
        };
    }

    public static string Describe(Instant instant, DateTimeZone zone) =>
        instant.InZone(zone).LocalDateTime.ToString("yyyy-MM-dd HH:mm", null);
}
