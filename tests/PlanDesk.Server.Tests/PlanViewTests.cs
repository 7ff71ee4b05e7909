using System.Net;
using NodaTime;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;
using PlanDesk.Server.Views;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>The read views the browser desk draws from. The fake solver treats (day of month) m3 in every period at
/// every plant and keeps every tank at its initial volume, so the expected values can be worked out by hand.</summary>
public sealed class PlanViewTests
{
    [Theory, OnSqlite, OnPostgres]
    public async Task SchematicGivesEachElementItsCapacityUseAndNamesTheProblemsThere(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var planId = await SolveAsync(served.Scheduler, new LocalDate(2027, 3, 28));

        var schematic = await ReadAsync<SchematicResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/schematic"), HttpStatusCode.OK);

        // ashby treats 28 m3 in every hour of a 900 m3/h secondary stage: 28 / 900 = 3.1 %.
        var ashby = schematic.Plants.Single(p => p.PlantId == "ashby");
        Assert.Equal(3.1, ashby.Use!.MeanPercent);
        Assert.Equal(3.1, ashby.Use.PeakPercent);
        Assert.Contains("900 m3/h", ashby.Use.Basis);
        // ashby-tank stays at 800 m3 in a usable range of 100 to 2 000 m3: (800 - 100) / 1 900 = 36.8 %.
        Assert.Equal(36.8, schematic.Tanks.Single(t => t.TankId == "ashby-tank").Use!.MeanPercent);
        Assert.Equal("ashby-tank", schematic.Pipelines.Single(p => p.PipelineId == "ashby-to-farm").FromTankId);
        Assert.Equal("customer", schematic.Pipelines.Single(p => p.PipelineId == "ashby-to-farm").ToKind);
        Assert.Contains("test shortfall", schematic.Customers.Single(c => c.CustomerId == "corran-farm").Problems);
        Assert.Empty(schematic.Customers.Single(c => c.CustomerId == "mere-park").Problems);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task SeriesOfASpringForwardDayHasTwentyThreePeriodsWithTheirOffsets(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var planId = await SolveAsync(served.Scheduler, new LocalDate(2027, 3, 28));

        var series = await ReadAsync<PlanSeriesResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/series"), HttpStatusCode.OK);

        Assert.Equal(23, series.Periods.Count);
        Assert.Equal(new LocalDateTime(2027, 3, 28, 1, 0), series.Periods[1].LocalStart);
        Assert.Equal("+01:00", series.Periods[1].UtcOffset);
        Assert.Equal(new LocalDateTime(2027, 3, 28, 3, 0), series.Periods[2].LocalStart);
        Assert.Equal("+02:00", series.Periods[2].UtcOffset);
        var ashby = series.Plants.Single(p => p.PlantId == "ashby");
        Assert.All(new[] { ashby.TreatedM3.Length, ashby.InfluentM3.Length, ashby.OutfallM3.Length, ashby.Energy.PricePerMWh.Length }, n => Assert.Equal(23, n));
        Assert.Equal(900, ashby.SecondaryCapacityM3);
        Assert.Equal(0.42, series.Customers.Single(c => c.CustomerId == "corran-farm").MarginalCostPerM3[0]);
        Assert.Null(series.Customers.Single(c => c.CustomerId == "corran-farm").MarginalCostPerM3[1]);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task SeriesOfAFallBackDayHasTwentyFivePeriodsAndTellsTheTwoTwoOClocksApart(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var planId = await SolveAsync(served.Scheduler, new LocalDate(2027, 10, 31));

        var series = await ReadAsync<PlanSeriesResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/series"), HttpStatusCode.OK);

        Assert.Equal(25, series.Periods.Count);
        var twoOClocks = series.Periods.Where(p => p.LocalStart == new LocalDateTime(2027, 10, 31, 2, 0)).ToList();
        Assert.Equal(["+02:00", "+01:00"], twoOClocks.Select(p => p.UtcOffset));
        Assert.Equal(25, series.Days.Single().PeriodCount);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task MonthToDateLoadsStartFromThePermitsFigureAndRestartInANewMonth(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var planId = await SolveAsync(served.Scheduler, new LocalDate(2027, 3, 31), days: 2);

        var series = await ReadAsync<PlanSeriesResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/series"), HttpStatusCode.OK);

        // The fake plan sends 31 m3 of secondary effluent at 12 mg/L total N to the outfall in each of 24 hours:
        // 744 m3 × 12 mg/L = 8.928 kg a day. March adds it to ashby's 1 000 kg before the plan; April starts afresh.
        var permit = series.Plants.Single(p => p.PlantId == "ashby").Permit;
        Assert.Equal([new LocalDate(2027, 3, 31), new LocalDate(2027, 4, 1)], permit.Select(d => d.Date));
        Assert.Equal(8.928, permit[0].TotalNitrogenKg, 6);
        Assert.Equal(1008.928, permit[0].MonthToDateTotalNitrogenKg, 6);
        Assert.Equal(8.928, permit[1].MonthToDateTotalNitrogenKg, 6);
        Assert.Equal(4000, permit[1].MonthlyTotalNitrogenCapKg);
        Assert.Equal(150, permit[1].DailyTotalNitrogenCapKg);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task PublicationPreviewNamesTheVersionAPlanWouldSupersede(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var earlier = await SolveAsync(served.Scheduler, Day);
        await PublishAsync(served.Scheduler, earlier);
        var later = await SolveAsync(served.Scheduler, Day);

        var preview = await ReadAsync<PublicationPreviewResponse>(
            await served.Scheduler.GetAsync($"/api/plans/{later}/publication-preview"), HttpStatusCode.OK);

        Assert.True(preview.Publishable);
        Assert.Equal(["ashby", "brindle"], preview.PlantDays.Select(d => d.PlantId));
        Assert.All(preview.PlantDays, d => Assert.Equal((1, (long?)earlier), (d.CurrentVersion!.Value, d.CurrentPlanId)));
        Assert.Equal("Ashby WRRF", preview.PlantDays[0].PlantName);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task APlantKeyLearnsItsPlantTimeZoneTodayAndPublishedDays(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: true);

        var me = await ReadAsync<SessionResponse>(await served.Plant.GetAsync("/api/me"), HttpStatusCode.OK);
        var scheduler = await ReadAsync<SessionResponse>(await served.Scheduler.GetAsync("/api/me"), HttpStatusCode.OK);

        Assert.Equal("plant", me.Role);
        Assert.Equal(new SessionPlant("ashby", "Ashby WRRF", "Europe/Madrid", new LocalDate(2027, 3, 27), Day, Day), me.Plant);
        Assert.Equal("scheduler", scheduler.Role);
        Assert.Null(scheduler.Plant);
    }
}
