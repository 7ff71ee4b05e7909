using NodaTime;

namespace PlanDesk.Core.Generation;

/// <summary>
/// Hour-by-hour shapes of a generated region: influent through the day with a storm, customer demand by
/// kind, and a spot-like energy price. Every shape is evaluated at the local time of each hour, so a
/// daylight-saving day simply has 23 or 25 values.
/// </summary>
internal static class Profiles
{
    // Dry-weather influent of a town through the local day, as a multiple of the daily average (night
    // minimum near 0.55, late-morning peak near 1.3, a smaller evening peak) [trade: typical shape].
    private static readonly double[] DiurnalInfluent =
    [
        0.80, 0.68, 0.60, 0.56, 0.55, 0.60, 0.75, 0.95, 1.15, 1.28, 1.32, 1.30,
        1.25, 1.20, 1.15, 1.10, 1.08, 1.10, 1.15, 1.20, 1.18, 1.10, 1.00, 0.90,
    ];

    private static readonly double DiurnalMean = DiurnalInfluent.Average();

    // Day-ahead energy price through the local day as a multiple of its average.
    private static readonly double[] DiurnalPrice =
    [
        0.70, 0.64, 0.60, 0.58, 0.60, 0.68, 0.88, 1.10, 1.18, 1.12, 1.02, 0.96,
        0.92, 0.90, 0.92, 0.98, 1.08, 1.22, 1.38, 1.45, 1.35, 1.15, 0.95, 0.80,
    ];

    /// <summary>Hours in the first <paramref name="days"/> local days of <paramref name="hours"/>.</summary>
    public static int HoursOfDays(HourGrid hours, int days) => hours.Local.Count(h => h.Date < hours.StartDate.PlusDays(days));

    public static bool IsWeekend(LocalDate date) => date.DayOfWeek is IsoDayOfWeek.Saturday or IsoDayOfWeek.Sunday;

    /// <summary>Influent, m3/h: the diurnal shape (damped for large catchments), a quieter weekend, noise, and
    /// one storm starting on <paramref name="stormDate"/> that raises flow for several hours and tails off.</summary>
    public static double[] Influent(SeededRandom random, IReadOnlyList<LocalDateTime> hours, double averageM3PerHour, double damping,
        LocalDate stormDate, double stormPeakFactor)
    {
        var stormStartHour = random.Int(0, 16);
        var stormRiseHours = random.Uniform(2, 5);
        var stormDecayHours = random.Uniform(5, 12);
        var stormStart = stormDate.At(new LocalTime(stormStartHour, 0));
        var values = new double[hours.Count];
        for (var i = 0; i < hours.Count; i++)
        {
            var local = hours[i];
            var weekend = IsWeekend(local.Date);
            // Weekend mornings start an hour or two later and run a little lower.
            var hour = weekend ? (local.Hour + 22) % 24 : local.Hour;
            var shape = 1 + (DiurnalInfluent[hour] / DiurnalMean - 1) * damping;
            var dry = averageM3PerHour * shape * (weekend ? 0.96 : 1.0) * (1 + random.Noise(0.025));
            var sinceStorm = Period.Between(stormStart, local, PeriodUnits.Minutes).Minutes / 60.0;
            var storm = sinceStorm < 0 ? 0
                : sinceStorm < stormRiseHours ? sinceStorm / stormRiseHours
                : Math.Exp(-(sinceStorm - stormRiseHours) / stormDecayHours);
            values[i] = SeededRandom.Round(dry + averageM3PerHour * stormPeakFactor * storm, 1);
        }
        return values;
    }

    /// <summary>Hourly demand, m3/h, around <paramref name="averageM3PerHour"/> in the pattern of <paramref name="pattern"/>.</summary>
    public static double[] Demand(SeededRandom random, IReadOnlyList<LocalDateTime> hours, DemandPattern pattern, double averageM3PerHour)
    {
        var raw = hours.Select(h => PatternFactor(pattern, h) * (1 + random.Noise(0.04))).ToArray();
        var mean = raw.Average();
        return raw.Select(v => SeededRandom.Round(Math.Max(0, v / mean * averageM3PerHour), 1)).ToArray();
    }

    private static double PatternFactor(DemandPattern pattern, LocalDateTime local)
    {
        var weekend = IsWeekend(local.Date);
        var hour = local.Hour;
        return pattern switch
        {
            // Cooling towers follow the production shifts and the afternoon heat.
            DemandPattern.Cooling => (weekend ? 0.8 : 1.0) * (hour is >= 6 and < 22 ? 1.15 : 0.85) * (hour is >= 12 and < 18 ? 1.1 : 1.0),
            // Continuous process water with a quieter weekend.
            DemandPattern.Process => weekend ? 0.9 : 1.0,
            // Street cleaning and utility filling points work the morning shift only.
            DemandPattern.DayShift => !weekend && hour is >= 6 and < 14 ? 1.0 : 0.0,
            // Sprinklers run in the evening and at night to limit evaporation.
            DemandPattern.NightIrrigation => hour is >= 21 || hour < 6 ? 1.0 : 0.0,
            _ => 1.0,
        };
    }

    /// <summary>A day-ahead style price series, currency/MWh, around <paramref name="averagePerMWh"/>.</summary>
    public static double[] SpotPrice(SeededRandom random, IReadOnlyList<LocalDateTime> hours, double averagePerMWh)
    {
        var dayLevel = new Dictionary<LocalDate, double>();
        var values = new double[hours.Count];
        for (var i = 0; i < hours.Count; i++)
        {
            var local = hours[i];
            if (!dayLevel.TryGetValue(local.Date, out var level))
            {
                level = (IsWeekend(local.Date) ? 0.85 : 1.0) * (1 + random.Noise(0.08));
                dayLevel[local.Date] = level;
            }
            values[i] = SeededRandom.Round(Math.Max(5, averagePerMWh * level * DiurnalPrice[local.Hour] * (1 + random.Noise(0.05))), 1);
        }
        return values;
    }
}

/// <summary>Shape of an hourly-demand customer's use through the week.</summary>
internal enum DemandPattern
{
    Cooling,
    Process,
    DayShift,
    NightIrrigation,
}
