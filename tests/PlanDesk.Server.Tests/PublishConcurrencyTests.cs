using System.Net;
using NodaTime;
using PlanDesk.Server.Store;
using PlanDesk.Server.Targets;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>Two schedulers publishing overlapping plans at the same moment: every plant-day ends with one
/// consistent current version, and no publication is lost from the history.</summary>
public sealed class PublishConcurrencyTests
{
    private const int Rounds = 4;

    [Theory, OnSqlite, OnPostgres]
    public async Task ConcurrentPublicationsOfOverlappingPlansLeaveOneWinnerPerPlantDayAndTheWholeHistory(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var otherScheduler = served.Factory.ClientWith(await served.Factory.AddKeyAsync(Role.Scheduler));
        // The fake solver marks each plan's hours with its start day: 26 for the first plan, 27 for the second.
        var early = await SolveAsync(served.Scheduler, new LocalDate(2027, 3, 26), days: 3);
        var late = await SolveAsync(otherScheduler, new LocalDate(2027, 3, 27), days: 3);
        var overlap = new[] { new LocalDate(2027, 3, 27), new LocalDate(2027, 3, 28) };
        var plants = new[] { "ashby", "brindle" };

        for (var round = 1; round <= Rounds; round++)
        {
            var publications = await Task.WhenAll(PublishAsync(served.Scheduler, early), PublishAsync(otherScheduler, late));

            var winner = publications.MaxBy(p => p.PublicationId)!;
            foreach (var plant in plants)
            {
                foreach (var day in overlap)
                {
                    var current = await ReadAsync<TargetsResponse>(await served.Scheduler.GetAsync($"/api/plants/{plant}/targets/{day:uuuu-MM-dd}"), HttpStatusCode.OK);
                    Assert.Equal(winner.PublicationId, current.PublicationId);
                    Assert.Equal(winner.PlanId == early ? 26 : 27, current.Sheet.Hours[0].TreatedM3);
                    Assert.Equal(2 * round, current.Version);
                }
            }
        }

        foreach (var plant in plants)
        {
            foreach (var day in overlap)
            {
                var history = await ReadAsync<List<TargetVersionResponse>>(
                    await served.Scheduler.GetAsync($"/api/plants/{plant}/targets/{day:uuuu-MM-dd}/versions"), HttpStatusCode.OK);
                Assert.Equal(Enumerable.Range(1, 2 * Rounds), history.Select(v => v.Version));
                Assert.Equal(Rounds, history.Count(v => v.PlanId == early));
                Assert.Equal(Rounds, history.Count(v => v.PlanId == late));
            }
            var onlyEarly = await ReadAsync<List<TargetVersionResponse>>(await served.Scheduler.GetAsync($"/api/plants/{plant}/targets/2027-03-26/versions"), HttpStatusCode.OK);
            Assert.All(onlyEarly, v => Assert.Equal(early, v.PlanId));
            Assert.Equal(Rounds, onlyEarly.Count);
        }
    }
}
