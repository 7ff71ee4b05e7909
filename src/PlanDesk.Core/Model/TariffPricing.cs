using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>Evaluates a tariff onto the periods of a horizon.</summary>
public static class TariffPricing
{
    /// <summary>The kind of a local date under a tariff: listed holidays first, then Saturday/Sunday as weekend.</summary>
    public static DayType DayTypeOf(Tariff tariff, LocalDate date) =>
        tariff.Holidays.Contains(date) ? DayType.Holiday
        : date.DayOfWeek is IsoDayOfWeek.Saturday or IsoDayOfWeek.Sunday ? DayType.Weekend
        : DayType.Weekday;

    /// <summary>Price of energy bought in each period, currency/MWh, or the reason it cannot be priced.</summary>
    public static SeriesResult EnergyPricePerMWh(Tariff tariff, Horizon horizon)
    {
        switch (tariff.Price)
        {
            case SeriesPrice series:
                return series.PricePerMWh.Resample(horizon);
            case TimeOfUsePrice tou:
                var prices = new double[horizon.Periods.Count];
                foreach (var period in horizon.Periods)
                {
                    var local = period.LocalStart;
                    var season = tou.Seasons.FirstOrDefault(s => s.Contains(local.Month));
                    if (season is null)
                    {
                        return SeriesResult.Fail($"tariff '{tariff.Id}': no season covers month {local.Month}; add a season that includes it");
                    }
                    var dayType = DayTypeOf(tariff, local.Date);
                    var window = season.Windows.FirstOrDefault(w => w.DayTypes.Contains(dayType) && w.Contains(local.TimeOfDay));
                    prices[period.Index] = window?.PricePerMWh ?? season.DefaultPricePerMWh;
                }
                return SeriesResult.Ok(prices);
            default:
                throw new InvalidOperationException($"unknown price kind {tariff.Price.GetType().Name}");
        }
    }

    /// <summary>Billing month (calendar month in the network's zone) of each period, numbered from 0 in horizon order.</summary>
    public static int[] BillingMonthIndex(Horizon horizon)
    {
        var months = new int[horizon.Periods.Count];
        var current = 0;
        var first = horizon.Periods[0].LocalStart;
        foreach (var period in horizon.Periods)
        {
            var local = period.LocalStart;
            current = (local.Year - first.Year) * 12 + local.Month - first.Month;
            months[period.Index] = current;
        }
        return months;
    }
}
