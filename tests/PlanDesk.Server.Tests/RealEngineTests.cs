using System.Net;
using NodaTime;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Store;
using PlanDesk.Server.Targets;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>The service with the real planner, checker, baseline and sheet builder behind it.</summary>
public sealed class RealEngineTests
{
    [Fact]
    public async Task AQuickstartSolvePassesTheCheckerBeatsTheBaselineAndPublishesItsSheet()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);
        await using var factory = new PlanDeskFactory(database, realEngine: true);
        var scheduler = factory.ClientWith(await factory.AddKeyAsync(Role.Scheduler));
        var plant = factory.ClientWith(await factory.AddKeyAsync(Role.Plant, "larkmoor"));
        var quickstart = File.ReadAllText(Path.Combine(Repository.Root, "networks", "quickstart.json"));
        Assert.Equal(HttpStatusCode.Created, (await scheduler.PostAsync("/api/networks/larkmoor/versions", JsonBody(quickstart))).StatusCode);
        // A reported tank level from the hour before the day starts (local midnight is 23:00 UTC) starts the plan.
        var lastHour = new ActualsHour { HourStart = Instant.FromUtc(2027, 3, 25, 22, 0), TankLevelsM3 = new Dictionary<string, double> { ["larkmoor-class-a"] = 1200 } };
        await ReadAsync<ActualsReportResponse>(await plant.SendAsync(Actuals("larkmoor", new ActualsRequest { Hours = [lastHour] }, "before-the-day")), HttpStatusCode.Created);

        var submitted = await ReadAsync<JobResponse>(await scheduler.PostAsync("/api/plans", JsonBody("""{ "networkId": "larkmoor", "startDate": "2027-03-26", "days": 1 }""")), HttpStatusCode.Accepted);
        var job = await WaitForJobAsync(scheduler, submitted.JobId);
        var summary = await ReadAsync<PlanSummaryResponse>(await scheduler.GetAsync($"/api/plans/{job.JobId}/summary"), HttpStatusCode.OK);
        await PublishAsync(scheduler, job.JobId);
        var targets = await ReadAsync<TargetsResponse>(await plant.GetAsync("/api/plants/larkmoor/targets/2027-03-26"), HttpStatusCode.OK);

        Assert.Equal(JobState.Succeeded, job.State);
        Assert.True(summary.CheckPassed, job.Message);
        Assert.Equal("milp", summary.Method);
        Assert.True(summary.Summary.SavingPercent > 0, $"saving against the baseline: {summary.Summary.SavingPercent}");
        Assert.Contains("tank larkmoor-class-a: starts at 1200 m3, as reported at 2027-03-26 00:00", summary.Notes);
        Assert.Equal(24, targets.Sheet.Hours.Count);
        Assert.Contains(targets.Sheet.Hours, h => h.TreatedM3 > 0);
    }
}
