using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.SolveJobs;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Plans;

/// <summary>Solve jobs: their state and progress, and cancelling one.</summary>
internal static class JobEndpoints
{
    public static RouteGroupBuilder MapJobs(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/jobs").WithTags("Plans").RequireAuthorization(Access.Read);
        group.MapGet("/{jobId:long}", GetJob).WithSummary("A solve job's state and latest progress.");
        group.MapPost("/{jobId:long}/cancel", CancelJob).RequireAuthorization(Access.Schedule)
            .WithSummary("Cancel a queued or running solve job.");
        return group;
    }

    public static JobResponse ToResponse(PlanRecord job, JobProgress? live) => new(
        job.Id, job.State, job.NetworkId, job.NetworkVersion, job.StartDate, job.Days,
        live ?? (job.ProgressJson is null ? null : JsonSerializer.Deserialize<JobProgress>(job.ProgressJson, ServerJson.Options)),
        job.Message, job.SubmittedAt, job.StartedAt, job.FinishedAt, $"/api/jobs/{job.Id}", $"/api/plans/{job.Id}");

    private static async Task<Results<Ok<JobResponse>, NotFound<ProblemDetails>>> GetJob(long jobId, IPlanDeskStore store, SolveJobQueue queue)
    {
        var job = await store.GetPlanAsync(jobId, withDocuments: false);
        return job is null ? UnknownJob(jobId) : TypedResults.Ok(ToResponse(job, queue.ProgressOf(jobId)));
    }

    private static async Task<Results<Ok<JobResponse>, Accepted<JobResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> CancelJob(
        long jobId, HttpContext context, IPlanDeskStore store, SolveJobQueue queue, IClock clock)
    {
        var outcome = await store.RequestCancelAsync(jobId, $"Cancelled before it started, by key {PlanDeskClaims.KeyIdOf(context.User)}.", clock.GetCurrentInstant());
        if (outcome == CancelOutcome.CancelRequested)
        {
            queue.Cancel(jobId);
        }
        var job = await store.GetPlanAsync(jobId, withDocuments: false);
        return (outcome, job) switch
        {
            (CancelOutcome.NotFound, _) or (_, null) => UnknownJob(jobId),
            (CancelOutcome.CancelledBeforeStart, _) => TypedResults.Ok(ToResponse(job, null)),
            (CancelOutcome.CancelRequested, _) => TypedResults.Accepted($"/api/jobs/{jobId}", ToResponse(job, queue.ProgressOf(jobId))),
            _ => Problems.Conflict("Job already finished", $"Job {jobId} already {job.State}; there is nothing to cancel."),
        };
    }

    private static NotFound<ProblemDetails> UnknownJob(long jobId) =>
        Problems.NotFound("Job not found", $"There is no solve job {jobId}; GET /api/plans lists the plans and their jobs.");
}
