using System.Net;
using NodaTime;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>What plants report becomes the starting state of the next plan, and the plan says so.</summary>
public sealed class ActualsFeedTests
{
    [Theory, OnSqlite, OnPostgres]
    public async Task TheNextPlanStartsFromReportedLevelsUnitsGasAndMonthToDateLoads(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        // Europe/Madrid is UTC+1 until 2027-03-28: local midnight of the 27th is 2027-03-26T23:00Z.
        var hours = new List<ActualsHour>
        {
            new() { HourStart = Instant.FromUtc(2027, 3, 1, 10, 0), OutfallTotalNitrogenKg = 4.5, EnergyImportedKWh = 260 },
            new() { HourStart = Instant.FromUtc(2027, 3, 26, 21, 0), OutfallTotalNitrogenKg = 5.5, EnergyImportedKWh = 310, TankLevelsM3 = new Dictionary<string, double> { ["ashby-tank"] = 1500 } },
            new()
            {
                HourStart = Instant.FromUtc(2027, 3, 26, 22, 0), OutfallTotalNitrogenKg = 6, EnergyImportedKWh = 240, GasHolderNm3 = 420,
                TankLevelsM3 = new Dictionary<string, double> { ["ashby-tank"] = 1234 }, UnitsRunning = new Dictionary<string, int> { ["ashby-filter"] = 2 },
            },
        };
        await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", new ActualsRequest { Hours = hours }, "feed-1")), HttpStatusCode.Created);

        var planId = await SolveAsync(served.Scheduler, new LocalDate(2027, 3, 27));

        var network = served.Factory.Solver.Cases.Single().Network;
        var ashby = network.Plants.Single(p => p.Id.Value == "ashby");
        var brindle = network.Plants.Single(p => p.Id.Value == "brindle");
        Assert.Equal(1234, network.Tanks.Single(t => t.Id.Value == "ashby-tank").InitialM3);
        Assert.Equal(400, network.Tanks.Single(t => t.Id.Value == "brindle-tank").InitialM3); // nothing reported: the file's value
        Assert.Equal(2, ashby.Stages.Single().InitialUnitsRunning);
        Assert.Equal(420, ashby.Biogas!.InitialHolderNm3);
        Assert.Equal(16, ashby.Permit.MonthToDateTotalNitrogenKg);
        Assert.Equal(310, ashby.MonthToDatePeakKw);
        Assert.Equal(0, brindle.Permit.MonthToDateTotalNitrogenKg);
        var summary = await ReadAsync<PlanSummaryResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/summary"), HttpStatusCode.OK);
        Assert.Contains(summary.Notes, n => n.Contains("tank ashby-tank: starts at 1234 m3, as reported at 2027-03-27 00:00"));
        Assert.Contains(summary.Notes, n => n.Contains("month-to-date total N 16 kg, summed over 3 reported hours"));
        Assert.Contains(summary.Notes, n => n.Contains("stage ashby-filter: starts with 2 units running"));
        Assert.Contains(summary.Notes, n => n.Contains("gas holder starts at 420 Nm3"));
        Assert.DoesNotContain(summary.Notes, n => n.Contains("brindle"));
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task ActualsFromAfterTheHorizonStartsAreNotUsed(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var afterStart = new ActualsHour { HourStart = Instant.FromUtc(2027, 3, 26, 23, 0), TankLevelsM3 = new Dictionary<string, double> { ["ashby-tank"] = 1999 } };
        await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", new ActualsRequest { Hours = [afterStart] }, "late")), HttpStatusCode.Created);

        await SolveAsync(served.Scheduler, new LocalDate(2027, 3, 27));

        Assert.Equal(800, served.Factory.Solver.Cases.Single().Network.Tanks.Single(t => t.Id.Value == "ashby-tank").InitialM3);
    }
}
