using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>
/// Two or three electricity tariffs for a region: time-of-use with a cheap night and a day or evening
/// peak [trade], and a spot-indexed hourly series; each with a demand charge of a few to ~20 per kW-month
/// [pub, magnitudes only].
/// </summary>
internal static class TariffFactory
{
    public static IReadOnlyList<Tariff> Create(SeededRandom random, HourGrid hours, int count, int horizonDays)
    {
        var tariffs = new List<Tariff> { Business(random, hours, horizonDays), Spot(random, hours) };
        if (count >= 3)
        {
            tariffs.Add(Industrial(random));
        }
        return tariffs;
    }

    private static Tariff Business(SeededRandom random, HourGrid hours, int horizonDays)
    {
        TouSeason Season(string name, int from, int to, double scale) => new(name, from, to, SeededRandom.Round(random.Uniform(95, 110) * scale, 1),
        [
            Window([DayType.Weekday], 8, 18, random.Uniform(125, 150) * scale),
            Window([DayType.Weekday], 18, 22, random.Uniform(190, 230) * scale),
            Window([DayType.Weekday, DayType.Weekend, DayType.Holiday], 0, 6, random.Uniform(60, 75) * scale),
        ]);

        // A regional holiday inside the horizon now and then, priced like a weekend.
        var holidays = new HashSet<LocalDate>();
        if (random.Chance(0.5))
        {
            holidays.Add(hours.StartDate.PlusDays(random.Int(0, horizonDays - 1)));
        }
        return new Tariff
        {
            Id = new TariffId("grid-business-tou"),
            Name = "Regional grid business time-of-use",
            Price = new TimeOfUsePrice([Season("summer", 4, 9, 1.0), Season("winter", 10, 3, 1.12)]),
            Holidays = holidays,
            DemandChargePerKwMonth = random.Uniform(6, 12, 1),
            FeedInPricePerMWh = random.Uniform(35, 50, 0),
            GridEmissionsKgPerMWh = random.Uniform(150, 300, 0),
        };
    }

    private static Tariff Industrial(SeededRandom random)
    {
        var peak = random.Uniform(200, 260, 0);
        var night = random.Uniform(55, 70, 0);
        var season = new TouSeason("all year", 1, 12, random.Uniform(100, 120, 0),
        [
            Window([DayType.Weekday], 7, 11, peak),
            Window([DayType.Weekday], 17, 21, peak),
            Window([DayType.Weekday, DayType.Weekend, DayType.Holiday], 23, 7, night),
        ]);
        return new Tariff
        {
            Id = new TariffId("grid-industrial-tou"),
            Name = "High-voltage industrial time-of-use",
            Price = new TimeOfUsePrice([season]),
            DemandChargePerKwMonth = random.Uniform(12, 20, 1),
            FeedInPricePerMWh = random.Uniform(30, 45, 0),
            GridEmissionsKgPerMWh = random.Uniform(150, 300, 0),
        };
    }

    private static Tariff Spot(SeededRandom random, HourGrid hours) => new()
    {
        Id = new TariffId("spot-indexed"),
        Name = "Spot-indexed supply contract",
        Price = new SeriesPrice(hours.Series(Profiles.SpotPrice(random, hours.Local, random.Uniform(90, 120)))),
        DemandChargePerKwMonth = random.Uniform(4, 9, 1),
        FeedInPricePerMWh = random.Uniform(35, 55, 0),
        GridEmissionsKgPerMWh = random.Uniform(150, 300, 0),
    };

    private static TouWindow Window(DayType[] days, int fromHour, int toHour, double pricePerMWh) =>
        new(new HashSet<DayType>(days), new LocalTime(fromHour, 0), new LocalTime(toHour % 24, 0), SeededRandom.Round(pricePerMWh, 1));
}
