using System.Text.Json;
using NodaTime;
using PlanDesk.Planning;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.SolveJobs;

/// <summary>
/// Runs queued solve jobs one at a time, oldest first. At start a job left running by a stopped or crashed
/// server is marked failed with the reason (its solve was lost); queued jobs simply run.
/// </summary>
internal sealed class SolveJobRunner(
    IPlanDeskStore store, SolveJobQueue queue, PlanPipeline pipeline, IClock clock, ILogger<SolveJobRunner> logger) : BackgroundService
{
    private static readonly TimeSpan IdlePoll = TimeSpan.FromSeconds(5);
    private static readonly TimeSpan ProgressSaveInterval = TimeSpan.FromSeconds(2);

    protected override async Task ExecuteAsync(CancellationToken stopping)
    {
        await Task.Yield();
        var interrupted = await store.FailRunningAsync(
            "The server stopped while this solve was running, so it was not finished; submit the solve again.", clock.GetCurrentInstant());
        if (interrupted > 0)
        {
            logger.LogWarning("{Count} solve job(s) interrupted by the last shutdown were marked failed", interrupted);
        }
        while (!stopping.IsCancellationRequested)
        {
            var job = await store.ClaimNextQueuedAsync(clock.GetCurrentInstant());
            if (job is null)
            {
                await queue.WaitAsync(IdlePoll, stopping);
                continue;
            }
            await RunAsync(job, stopping);
        }
    }

    private async Task RunAsync(PlanRecord job, CancellationToken stopping)
    {
        logger.LogInformation("Solve job {JobId} started: network {NetworkId} v{Version}, {StartDate} for {Days} day(s)",
            job.Id, job.NetworkId, job.NetworkVersion, job.StartDate.ToString("uuuu-MM-dd", null), job.Days);
        using var cancellation = queue.Track(job.Id, stopping);
        var progress = new JobProgressRecorder(job.Id, queue);
        try
        {
            var work = pipeline.RunAsync(job, progress, cancellation.Token);
            while (await Task.WhenAny(work, Task.Delay(ProgressSaveInterval, CancellationToken.None)) != work)
            {
                await SaveProgressAsync(job.Id);
            }
            var outcome = await work;
            await store.CompletePlanAsync(job.Id, outcome.Outcome, outcome.Message, clock.GetCurrentInstant());
            logger.LogInformation("Solve job {JobId} finished: {Message}", job.Id, outcome.Message);
        }
        catch (OperationCanceledException) when (cancellation.IsCancellationRequested)
        {
            var (state, message) = stopping.IsCancellationRequested
                ? (JobState.Failed, "The server was stopped while this solve was running, so it was not finished; submit the solve again.")
                : (JobState.Cancelled, "Cancelled on request while solving.");
            await store.EndPlanAsync(job.Id, state, message, clock.GetCurrentInstant());
            logger.LogInformation("Solve job {JobId} ended: {Message}", job.Id, message);
        }
        catch (PlanInputException problem)
        {
            await store.EndPlanAsync(job.Id, JobState.Failed, problem.Message, clock.GetCurrentInstant());
            logger.LogInformation("Solve job {JobId} could not start: {Message}", job.Id, problem.Message);
        }
        catch (Exception fault)
        {
            logger.LogError(fault, "Solve job {JobId} failed", job.Id);
            await store.EndPlanAsync(job.Id, JobState.Failed,
                $"The solve failed inside the server ({fault.GetType().Name}: {fault.Message}); the details are in the server log.",
                clock.GetCurrentInstant());
        }
        finally
        {
            queue.Untrack(job.Id);
        }
    }

    private async Task SaveProgressAsync(long jobId)
    {
        if (queue.ProgressOf(jobId) is { } latest)
        {
            await store.UpdateProgressAsync(jobId, JsonSerializer.Serialize(latest, ServerJson.Options));
        }
    }

    private sealed class JobProgressRecorder(long jobId, SolveJobQueue queue) : IProgress<SolveProgress>
    {
        public void Report(SolveProgress value) => queue.Report(jobId,
            new JobProgress(value.Phase, value.ElapsedSeconds, value.TimeLimitSeconds, value.Incumbent, value.BestBound, value.GapPercent));
    }
}

/// <summary>The data cannot be planned as asked (a series does not cover the horizon, the network version is gone):
/// the message says what to fix.</summary>
internal sealed class PlanInputException(string message) : Exception(message);
