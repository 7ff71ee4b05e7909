using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>Reads a tariff: time-of-use seasons or a price series, holidays and charges.</summary>
internal static class TariffReader
{
    public static Tariff Read(Node tariff, LoadContext context)
    {
        var hasTimeOfUse = tariff.Has("timeOfUse");
        var hasSeries = tariff.Has("priceSeries");
        if (hasTimeOfUse == hasSeries)
        {
            context.Add(tariff.Path, hasTimeOfUse ? "gives both timeOfUse and priceSeries" : "gives neither timeOfUse nor priceSeries",
                "give exactly one: time-of-use seasons or a price series per MWh");
        }
        EnergyPrice price = hasSeries && !hasTimeOfUse
            ? new SeriesPrice(SeriesReader.Read(tariff.Field("priceSeries"), context, ValueRule.Any) ?? Series.Constant(double.NaN))
            : new TimeOfUsePrice(ReadSeasons(tariff.Field("timeOfUse"), context));
        return new Tariff
        {
            Id = new TariffId(tariff.Text("id")),
            Name = tariff.Text("name"),
            Price = price,
            Holidays = ReadHolidays(tariff, context),
            DemandChargePerKwMonth = tariff.NumberOr("demandChargePerKwMonth", 0),
            FeedInPricePerMWh = tariff.NumberOr("feedInPricePerMWh", 0),
            GridEmissionsKgPerMWh = tariff.NumberOr("gridEmissionsKgPerMWh", 0),
        };
    }

    private static List<TouSeason> ReadSeasons(Node? timeOfUse, LoadContext context)
    {
        if (timeOfUse is not { } tou)
        {
            return [];
        }
        var seasons = tou.Items("seasons").Select(season => new TouSeason(
            season.Text("name"),
            season.Int("fromMonth", 0),
            season.Int("toMonth", 0),
            season.Number("defaultPricePerMWh"),
            season.Items("windows").Select(ReadWindow).ToList())).ToList();
        var valid = seasons.Where(s => s.FromMonth is >= 1 and <= 12 && s.ToMonth is >= 1 and <= 12).ToList();
        var uncovered = Enumerable.Range(1, 12).Where(month => !valid.Any(s => s.Contains(month))).ToList();
        if (seasons.Count > 0 && valid.Count == seasons.Count && uncovered.Count > 0)
        {
            context.Add(tou.PathOf("seasons"), $"no season covers month(s) {string.Join(", ", uncovered)}",
                "add a season for them or widen fromMonth/toMonth so the seasons cover all twelve months");
        }
        return seasons;
    }

    private static TouWindow ReadWindow(Node window)
    {
        var dayTypes = window.Strings("dayTypes").Select(text => text switch
        {
            "weekday" => DayType.Weekday,
            "weekend" => DayType.Weekend,
            "holiday" => DayType.Holiday,
            _ => (DayType?)null,
        }).OfType<DayType>().ToHashSet();
        return new TouWindow(
            dayTypes,
            TimeText.ParseTimeOfDay(window.Text("from")) ?? LocalTime.Midnight,
            TimeText.ParseTimeOfDay(window.Text("to")) ?? LocalTime.Midnight,
            window.Number("pricePerMWh"));
    }

    private static HashSet<LocalDate> ReadHolidays(Node tariff, LoadContext context)
    {
        var holidays = new HashSet<LocalDate>();
        foreach (var item in tariff.Items("holidays"))
        {
            var text = item.Element.ValueKind == System.Text.Json.JsonValueKind.String ? item.Element.GetString()! : "";
            if (TimeText.ParseDate(text) is { } date)
            {
                holidays.Add(date);
            }
            else if (text.Length > 0)
            {
                context.Add(item.Path, $"'{text}' is not a calendar date", "give the holiday as YYYY-MM-DD, e.g. \"2027-04-02\"");
            }
        }
        return holidays;
    }
}
