using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Model;

/// <summary>Local days on clock changes, with the real time-zone database shipped in NodaTime.</summary>
public class HorizonDstTests
{
    private static readonly DateTimeZone Madrid = DateTimeZoneProviders.Tzdb["Europe/Madrid"];

    [Fact]
    public void DstSpringDayHasTwentyThreeHourlyPeriods()
    {
        // EU rule: clocks go forward at 01:00 UTC on the last Sunday of March, which is 28 March in 2027.
        var horizon = Horizon.Create(Madrid, new LocalDate(2027, 3, 28), 1, 60);

        Assert.Equal(23, horizon.Periods.Count);
        Assert.Equal(new LocalTime(3, 0), horizon.Periods[2].LocalStart.TimeOfDay); // 00:00, 01:00, then 03:00
    }

    [Fact]
    public void DstAutumnDayHasTwentyFiveHourlyPeriods()
    {
        // Clocks go back at 01:00 UTC on the last Sunday of October, 31 October in 2027: 02:00-03:00 local happens twice.
        var horizon = Horizon.Create(Madrid, new LocalDate(2027, 10, 31), 1, 60);

        Assert.Equal(25, horizon.Periods.Count);
        Assert.Equal(horizon.Periods[2].LocalStart, horizon.Periods[3].LocalStart);
    }

    [Fact]
    public void QuarterHourPeriodsFollowTheSameClockChanges()
    {
        var spring = Horizon.Create(Madrid, new LocalDate(2027, 3, 28), 1, 15);
        var autumn = Horizon.Create(Madrid, new LocalDate(2027, 10, 31), 1, 15);

        Assert.Equal((23 * 4, 25 * 4), (spring.Periods.Count, autumn.Periods.Count));
    }

    [Fact]
    public void MultiDayHorizonAcrossTheSpringChangeKeepsEachLocalDayWhole()
    {
        var horizon = Horizon.Create(Madrid, new LocalDate(2027, 3, 27), 3, 60);

        Assert.Equal([24, 23, 24], horizon.Days.Select(d => d.PeriodCount).ToArray());
        Assert.Equal(71, horizon.Periods.Count);
        Assert.Equal(Duration.FromHours(71), horizon.End - horizon.Start);
    }
}
