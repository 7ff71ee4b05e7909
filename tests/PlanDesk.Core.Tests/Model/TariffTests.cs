using System.Text.Json.Nodes;
using NodaTime;
using PlanDesk.Core.Model;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Model;

/// <summary>Energy prices per period from time-of-use windows and from price series, and tariff values carried
/// from the file into the model. Prices are invented; the working is written beside each check.</summary>
public class TariffTests
{
    private static readonly DateTimeZone Madrid = DateTimeZoneProviders.Tzdb["Europe/Madrid"];

    // Winter (Nov-Feb, wrapping over the new year) is a flat 120. The rest of the year: default 95; weekdays
    // 08-18 at 150 and 18-22 at 210; every kind of day 00-06 at 70. 2 April 2027 (a Friday) is a holiday.
    private static Tariff TimeOfUseTariff() => new()
    {
        Id = new TariffId("t"),
        Name = "worked example",
        Price = new TimeOfUsePrice(
        [
            new TouSeason("winter", 11, 2, 120, []),
            new TouSeason("rest", 3, 10, 95,
            [
                new TouWindow(new HashSet<DayType> { DayType.Weekday }, new LocalTime(8, 0), new LocalTime(18, 0), 150),
                new TouWindow(new HashSet<DayType> { DayType.Weekday }, new LocalTime(18, 0), new LocalTime(22, 0), 210),
                new TouWindow(new HashSet<DayType> { DayType.Weekday, DayType.Weekend, DayType.Holiday }, new LocalTime(0, 0), new LocalTime(6, 0), 70),
            ]),
        ]),
        Holidays = new HashSet<LocalDate> { new(2027, 4, 2) },
    };

    [Fact]
    public void WeekdayHolidayAndWeekendArePricedByTheirWindows()
    {
        // Thursday 1, holiday Friday 2 and Saturday 3 April 2027 (no clock change).
        var horizon = Horizon.Create(Madrid, new LocalDate(2027, 4, 1), 3, 60);

        var prices = TariffPricing.EnergyPricePerMWh(TimeOfUseTariff(), horizon).Values!;

        // Thursday, a weekday: 00-06 at 70 (6 h), 06-08 at 95 (2 h), 08-18 at 150 (10 h), 18-22 at 210 (4 h), 22-24 at 95 (2 h).
        Assert.Equal([70, 95, 150, 210, 95], new[] { 5, 7, 9, 19, 23 }.Select(h => prices[h]).ToArray());
        // Sum: 420 + 190 + 1500 + 840 + 190 = 3140.
        Assert.Equal(3140, prices[0..24].Sum());
        // Friday is a listed holiday: only the all-days window applies, 6 x 70 + 18 x 95 = 420 + 1710 = 2130.
        Assert.Equal(95, prices[24 + 9]);
        Assert.Equal(2130, prices[24..48].Sum());
        // Saturday is a weekend day: priced like the holiday, 2130, and 19:00 is 95, not 210.
        Assert.Equal(95, prices[48 + 19]);
        Assert.Equal(2130, prices[48..72].Sum());
    }

    [Fact]
    public void SeasonWrappingOverTheNewYearPricesJanuary()
    {
        var horizon = Horizon.Create(Madrid, new LocalDate(2027, 1, 15), 1, 60);

        var prices = TariffPricing.EnergyPricePerMWh(TimeOfUseTariff(), horizon).Values!;

        Assert.All(prices, p => Assert.Equal(120, p));
    }

    private static double[] QuickstartPricesWith(JsonNode priceSeries)
    {
        var result = LoadChanged(n =>
        {
            Tariff(n).Remove("timeOfUse");
            Tariff(n)["priceSeries"] = priceSeries;
        });
        Assert.True(result.Succeeded, string.Join("\n", result.Problems));
        var planningCase = PlanningCase.Create(result.Network!, new LocalDate(2027, 3, 26), 1).Case!;
        return planningCase.ImportPricePerMWh[new PlantId("larkmoor")];
    }

    [Fact]
    public void CoarserPriceSeriesIsHeldOverTheHoursItCovers()
    {
        // Three-hour steps: each value holds for three hourly periods.
        var prices = QuickstartPricesWith(JsonNode.Parse(
            """{ "start": "2027-03-26T00:00", "stepMinutes": 180, "values": [60, 50, 90, 120, 110, 100, 150, 80] }""")!);

        Assert.Equal([60, 60, 60, 50, 50, 50, 90], prices[0..7]);
        Assert.Equal(80, prices[23]);
    }

    [Fact]
    public void FinerPriceSeriesIsAveragedOverEachHour()
    {
        // Quarter-hour values 0, 1, 2, ... 95: hour h averages 4h, 4h+1, 4h+2, 4h+3, which is 4h + 1.5.
        var values = new JsonArray(Enumerable.Range(0, 96).Select(v => (JsonNode)v).ToArray());
        var prices = QuickstartPricesWith(new JsonObject { ["start"] = "2027-03-26T00:00", ["stepMinutes"] = 15, ["values"] = values });

        Assert.Equal(1.5, prices[0], 9);
        Assert.Equal(41.5, prices[10], 9);
        Assert.Equal(93.5, prices[23], 9);
    }

    [Fact]
    public void MonthToDatePeakAndDemandChargeAreCarriedIntoTheModel()
    {
        var network = LoadChanged(n => Plant(n)["monthToDatePeakKw"] = 412.5).Network!;

        Assert.Equal(412.5, network.Plants[0].MonthToDatePeakKw);
        Assert.Equal(8.5, network.Tariffs[0].DemandChargePerKwMonth);
        Assert.Contains(new LocalDate(2027, 4, 2), network.Tariffs[0].Holidays);
    }

    [Fact]
    public void MonthToDatePeakDefaultsToZeroWhenLeftOut()
    {
        var network = LoadChanged(n => Plant(n).Remove("monthToDatePeakKw")).Network!;

        Assert.Equal(0, network.Plants[0].MonthToDatePeakKw);
    }
}
