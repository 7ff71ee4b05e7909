using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.SolveJobs;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Plans;

/// <summary>Plans: schedulers submit solves (run as background jobs); schedulers and viewers read the results.</summary>
internal static class PlanEndpoints
{
    public static RouteGroupBuilder MapPlans(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/plans").WithTags("Plans").RequireAuthorization(Access.Read);
        group.MapPost("/", SubmitSolve).RequireAuthorization(Access.Schedule)
            .WithSummary("Submit a solve of a network version over whole local days; answers 202 with the job to poll.");
        group.MapGet("/", ListPlans).WithSummary("List plans with their job state and headline cost.");
        group.MapGet("/{planId:long}", GetPlan).WithSummary("The whole plan: every decision for every period.");
        group.MapGet("/{planId:long}/summary", GetSummary).WithSummary("Cost against the baseline, solve quality, check result and notes.");
        group.MapGet("/{planId:long}/problems", GetProblems).WithSummary("Named, quantified problems of the plan (shortfalls, bypass, permit excess ...).");
        group.MapGet("/{planId:long}/marginal-water-costs", GetMarginalWaterCosts).WithSummary("Marginal cost of water per customer and period.");
        group.MapGet("/{planId:long}/check", GetCheck).WithSummary("What the independent checker found.");
        return group;
    }

    private static async Task<Results<Accepted<JobResponse>, BadRequest<ProblemDetails>, NotFound<ProblemDetails>>> SubmitSolve(
        SolveRequest request, HttpContext context, IPlanDeskStore store, PlanPipeline pipeline, SolveJobQueue queue, IClock clock)
    {
        var invalid = CheckRequest(request);
        if (invalid is not null)
        {
            return Problems.BadRequest("Solve request not valid", invalid);
        }
        var prepared = await pipeline.PrepareAsync(request.NetworkId, request.NetworkVersion, request.StartDate, request.Days);
        if (prepared is null)
        {
            var which = request.NetworkVersion is { } v ? $"version {v} of network '{request.NetworkId}'" : $"network '{request.NetworkId}'";
            return Problems.NotFound("Network not found", $"There is no {which}; GET /api/networks lists the uploaded networks and versions.");
        }
        if (prepared.Case is null)
        {
            return Problems.BadRequest("The network cannot be planned for these days",
                $"{prepared.Problems[0]}{(prepared.Problems.Count > 1 ? $" ({prepared.Problems.Count} problems in all, listed in 'problems')" : "")}",
                prepared.Problems);
        }
        var defaults = new SolveOptions();
        var options = defaults with
        {
            Solver = request.Options?.Solver?.ToUpperInvariant() ?? defaults.Solver,
            TimeLimitSeconds = request.Options?.TimeLimitSeconds ?? defaults.TimeLimitSeconds,
            GapPercent = request.Options?.GapPercent ?? defaults.GapPercent,
        };
        var job = await store.AddPlanJobAsync(prepared.Network.Version.NetworkId, prepared.Network.Version.Version, request.StartDate, request.Days,
            JsonSerializer.Serialize(options, ServerJson.Options), clock.GetCurrentInstant(), PlanDeskClaims.KeyIdOf(context.User));
        queue.Notify();
        var response = JobEndpoints.ToResponse(job, null);
        return TypedResults.Accepted(response.JobHref, response);
    }

    private static string? CheckRequest(SolveRequest request)
    {
        if (request.Days is < 1 or > Horizon.MaxDays)
        {
            return $"days is {request.Days}; plan 1 to {Horizon.MaxDays} local days.";
        }
        if (request.Options?.Solver is { } solver && !string.Equals(solver, "HIGHS", StringComparison.OrdinalIgnoreCase)
            && !string.Equals(solver, "SCIP", StringComparison.OrdinalIgnoreCase))
        {
            return $"options.solver is '{solver}'; use HIGHS or SCIP, or leave it out.";
        }
        if (request.Options?.TimeLimitSeconds is { } limit && (!double.IsFinite(limit) || limit < 1 || limit > 3600))
        {
            return $"options.timeLimitSeconds is {limit}; give 1 to 3600 seconds.";
        }
        if (request.Options?.GapPercent is { } gap && (!double.IsFinite(gap) || gap < 0 || gap > 100))
        {
            return $"options.gapPercent is {gap}; give 0 to 100 percent.";
        }
        return null;
    }

    private static async Task<Ok<IReadOnlyList<PlanListItem>>> ListPlans(IPlanDeskStore store)
    {
        var plans = await store.ListPlansAsync();
        IReadOnlyList<PlanListItem> items = plans.Select(p =>
        {
            var summary = p.SummaryJson is null ? null : JsonSerializer.Deserialize<PlanSummaryResponse>(p.SummaryJson, ServerJson.Options);
            return new PlanListItem(p.Id, p.State, p.NetworkId, p.NetworkVersion, p.StartDate, p.Days, p.SubmittedAt, p.FinishedAt,
                summary?.Summary.Status, summary?.Summary.Costs.Total, $"/api/plans/{p.Id}");
        }).ToList();
        return TypedResults.Ok(items);
    }

    private static Task<Results<Ok<PlanResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetPlan(long planId, IPlanDeskStore store) =>
        WithFinishedPlan(store, planId, record => new PlanResponse(record.Id, record.NetworkId, record.NetworkVersion, ReadPlan(record)));

    private static Task<Results<Ok<PlanSummaryResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetSummary(long planId, IPlanDeskStore store) =>
        WithFinishedPlan(store, planId, record => JsonSerializer.Deserialize<PlanSummaryResponse>(record.SummaryJson!, ServerJson.Options)!);

    private static Task<Results<Ok<PlanProblemsResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetProblems(long planId, IPlanDeskStore store) =>
        WithFinishedPlan(store, planId, record => new PlanProblemsResponse(record.Id, ReadPlan(record).Problems));

    private static Task<Results<Ok<MarginalWaterCostsResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetMarginalWaterCosts(
        long planId, IPlanDeskStore store) =>
        WithFinishedPlan(store, planId, record =>
        {
            var plan = ReadPlan(record);
            var rows = plan.MarginalWaterCosts
                .Select(c => new MarginalWaterCostRow(c.Customer.Value, c.Period, plan.PeriodStarts[c.Period], c.CostPerM3))
                .ToList();
            return new MarginalWaterCostsResponse(record.Id, plan.Currency, rows);
        });

    private static Task<Results<Ok<PlanCheckResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetCheck(long planId, IPlanDeskStore store) =>
        WithFinishedPlan(store, planId, record =>
        {
            var check = JsonSerializer.Deserialize<PlanCheckReport>(record.CheckJson!, ServerJson.Options)!;
            return new PlanCheckResponse(record.Id, check.Passed, check.Violations, check.RecomputedCosts);
        });

    internal static Plan ReadPlan(PlanRecord record) => PlanJson.Deserialize(record.PlanJson!)!;

    private static Task<Results<Ok<T>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> WithFinishedPlan<T>(
        IPlanDeskStore store, long planId, Func<PlanRecord, T> read) =>
        WithFinishedPlanAsync(store, planId, record => Task.FromResult(read(record)));

    /// <summary>Answers from a plan whose job succeeded; otherwise 404 for no such plan, 409 for one not (or never) ready.</summary>
    internal static async Task<Results<Ok<T>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> WithFinishedPlanAsync<T>(
        IPlanDeskStore store, long planId, Func<PlanRecord, Task<T>> read)
    {
        var record = await store.GetPlanAsync(planId, withDocuments: true);
        if (record is null)
        {
            return Problems.NotFound("Plan not found", $"There is no plan {planId}; GET /api/plans lists the plans.");
        }
        return record.State switch
        {
            JobState.Succeeded => TypedResults.Ok(await read(record)),
            JobState.Queued or JobState.Running => Problems.Conflict("Plan not ready",
                $"Plan {planId} is still {record.State}; poll GET /api/jobs/{planId} until its state is succeeded."),
            _ => Problems.Conflict("Plan has no result",
                $"The solve of plan {planId} {record.State}: {record.Message} Submit a new solve with POST /api/plans."),
        };
    }
}
