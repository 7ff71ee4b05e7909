using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>An electricity tariff: energy price by time of use or as a series, demand charge and feed-in price.</summary>
public sealed record Tariff
{
    public required TariffId Id { get; init; }
    public required string Name { get; init; }
    public required EnergyPrice Price { get; init; }
    /// <summary>Local dates priced as holidays by time-of-use windows.</summary>
    public IReadOnlySet<LocalDate> Holidays { get; init; } = new HashSet<LocalDate>();
    /// <summary>Charge on the highest import of a billing month (calendar month in the network's zone), currency per kW.</summary>
    public double DemandChargePerKwMonth { get; init; }
    /// <summary>Paid for energy exported to the grid, currency/MWh.</summary>
    public double FeedInPricePerMWh { get; init; }
    /// <summary>Grid emissions factor, kg CO2 per MWh imported; used only with a carbon price.</summary>
    public double GridEmissionsKgPerMWh { get; init; }
}

/// <summary>How the energy price is given.</summary>
public abstract record EnergyPrice;

/// <summary>An hourly (or other step) price series, currency/MWh.</summary>
public sealed record SeriesPrice(Series PricePerMWh) : EnergyPrice;

/// <summary>Time-of-use seasons, each with its windows.</summary>
public sealed record TimeOfUsePrice(IReadOnlyList<TouSeason> Seasons) : EnergyPrice;

/// <summary>A season from <paramref name="FromMonth"/> to <paramref name="ToMonth"/> inclusive (wrapping over the new year
/// when ToMonth &lt; FromMonth). Hours no window covers cost <paramref name="DefaultPricePerMWh"/>.</summary>
public sealed record TouSeason(string Name, int FromMonth, int ToMonth, double DefaultPricePerMWh, IReadOnlyList<TouWindow> Windows)
{
    public bool Contains(int month) => FromMonth <= ToMonth ? month >= FromMonth && month <= ToMonth : month >= FromMonth || month <= ToMonth;
}

/// <summary>Kind of local day for time-of-use windows. A listed holiday is a <see cref="Holiday"/>, whatever its weekday.</summary>
public enum DayType
{
    Weekday,
    Weekend,
    Holiday,
}

/// <summary>A price window on the given day types from <paramref name="From"/> to <paramref name="To"/> local time
/// (wrapping past midnight when To ≤ From). The first matching window of a season wins.</summary>
public sealed record TouWindow(IReadOnlySet<DayType> DayTypes, LocalTime From, LocalTime To, double PricePerMWh)
{
    public bool Contains(LocalTime time) => From < To ? time >= From && time < To : time >= From || time < To;
}
