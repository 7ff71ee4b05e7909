using System.Net;
using NodaTime;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

public sealed class SolveJobTests
{
    [Theory, OnSqlite, OnPostgres]
    public async Task AfterARestartAQueuedJobRunsAndAnInterruptedOneIsMarkedFailedWithTheReason(StoreKind store)
    {
        using var database = TestDatabase.Create(store);
        long interrupted, queued;
        await using (var before = new PlanDeskFactory(database))
        {
            var scheduler = before.ClientWith(await before.AddKeyAsync(Role.Scheduler));
            await UploadNetworkAsync(scheduler);
        }
        // What a crash leaves behind: one job taken by the runner and never finished, one still waiting.
        var crashed = database.Settings.CreateStore();
        await crashed.MigrateAsync();
        interrupted = (await crashed.AddPlanJobAsync(NetworkId, 1, Day, 1, "{}", PlanDeskFactory.Now, "k")).Id;
        Assert.Equal(interrupted, (await crashed.ClaimNextQueuedAsync(PlanDeskFactory.Now))!.Id);
        queued = (await crashed.AddPlanJobAsync(NetworkId, 1, Day, 1, "{}", PlanDeskFactory.Now, "k")).Id;
        (crashed as IDisposable)?.Dispose();

        await using var after = new PlanDeskFactory(database);
        var viewer = after.ClientWith(await after.AddKeyAsync(Role.Viewer));

        var failed = await WaitForJobAsync(viewer, interrupted);
        var ran = await WaitForJobAsync(viewer, queued);
        Assert.Equal(JobState.Failed, failed.State);
        Assert.Contains("server stopped while this solve was running", failed.Message);
        Assert.Equal(JobState.Succeeded, ran.State);
        Assert.Single(after.Solver.Cases);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task CancellingARunningJobStopsTheSolverAndKeepsNoPlan(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var job = await SubmitAsync(served.Scheduler, FakeSolver.BlockingDate);
        await served.Factory.Solver.WaitUntilBlockedAsync();

        var cancel = await served.Scheduler.PostAsync($"/api/jobs/{job.JobId}/cancel", null);
        var ended = await WaitForJobAsync(served.Scheduler, job.JobId);

        Assert.Equal(HttpStatusCode.Accepted, cancel.StatusCode);
        Assert.Equal(JobState.Cancelled, ended.State);
        Assert.Single(served.Factory.Solver.CancelledTokens);
        var plan = await served.Scheduler.GetAsync($"/api/plans/{job.JobId}");
        Assert.Equal(HttpStatusCode.Conflict, plan.StatusCode);
        Assert.Contains("cancelled", await plan.Content.ReadAsStringAsync());
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task CancellingAQueuedJobMeansItNeverRuns(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var blocking = await SubmitAsync(served.Scheduler, FakeSolver.BlockingDate);
        await WaitForJobAsync(served.Scheduler, blocking.JobId, JobState.Running);
        var waiting = await SubmitAsync(served.Scheduler, new LocalDate(2027, 3, 28));

        var cancelWaiting = await ReadAsync<JobResponse>(await served.Scheduler.PostAsync($"/api/jobs/{waiting.JobId}/cancel", null), HttpStatusCode.OK);
        await served.Scheduler.PostAsync($"/api/jobs/{blocking.JobId}/cancel", null);
        await WaitForJobAsync(served.Scheduler, blocking.JobId);

        Assert.Equal(JobState.Cancelled, cancelWaiting.State);
        Assert.Equal(JobState.Cancelled, (await WaitForJobAsync(served.Scheduler, waiting.JobId)).State);
        Assert.DoesNotContain(served.Factory.Solver.Cases, c => c.Horizon.StartDate == new LocalDate(2027, 3, 28));
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task AFinishedPlanOffersItsSummaryProblemsMarginalCostsAndCheck(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var planId = await SolveAsync(served.Scheduler, Day);

        var summary = await ReadAsync<PlanSummaryResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/summary"), HttpStatusCode.OK);
        var problems = await ReadAsync<PlanProblemsResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/problems"), HttpStatusCode.OK);
        var costs = await ReadAsync<MarginalWaterCostsResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/marginal-water-costs"), HttpStatusCode.OK);
        var check = await ReadAsync<PlanCheckResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}/check"), HttpStatusCode.OK);
        var plan = await ReadAsync<PlanResponse>(await served.Scheduler.GetAsync($"/api/plans/{planId}"), HttpStatusCode.OK);

        Assert.Equal((1026.0, 2000.0, 48.7, 0), (summary.Summary.Costs.Total, summary.Summary.BaselineCost!.Value, summary.Summary.SavingPercent!.Value, summary.Summary.CheckViolations));
        Assert.Equal(2, summary.Summary.Energy.Count);
        Assert.Equal("test shortfall", Assert.Single(problems.Problems).Message);
        Assert.Equal(("corran-farm", Instant.FromUtc(2027, 3, 25, 23, 0), 0.42), (costs.Costs[0].CustomerId, costs.Costs[0].PeriodStart, costs.Costs[0].CostPerM3));
        Assert.True(check.Passed);
        Assert.Equal(24, plan.Plan.PeriodStarts.Count);
    }
}
