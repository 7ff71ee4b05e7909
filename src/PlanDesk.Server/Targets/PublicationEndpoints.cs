using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Targets;

/// <summary>Publishing a plan's targets, atomically; every publication is kept as history.</summary>
internal static class PublicationEndpoints
{
    public static RouteGroupBuilder MapPublications(this IEndpointRouteBuilder app)
    {
        app.MapPost("/api/plans/{planId:long}/publish", Publish).WithTags("Publications").RequireAuthorization(Access.Schedule)
            .WithSummary("Publish a plan's targets: each plant-day of the plan becomes the current version, superseding earlier ones.");
        var group = app.MapGroup("/api/publications").WithTags("Publications").RequireAuthorization(Access.Read);
        group.MapGet("/", ListPublications).WithSummary("Every publication, oldest first.");
        group.MapGet("/{publicationId:long}", GetPublication).WithSummary("One publication and the target versions it created.");
        return group;
    }

    private static async Task<Results<Created<PublicationResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> Publish(
        long planId, [FromBody] PublishRequest? request, HttpContext context, IPlanDeskStore store, IClock clock)
    {
        var plan = await store.GetPlanAsync(planId, withDocuments: true);
        if (plan is null)
        {
            return Problems.NotFound("Plan not found", $"There is no plan {planId}; GET /api/plans lists the plans.");
        }
        if (plan.State != JobState.Succeeded)
        {
            return Problems.Conflict("Plan cannot be published",
                $"Plan {planId} is {plan.State}{(plan.Message is null ? "" : $" ({plan.Message})")}; only a plan whose solve succeeded can be published.");
        }
        var summary = JsonSerializer.Deserialize<PlanSummaryResponse>(plan.SummaryJson!, ServerJson.Options)!;
        if (summary.Summary.Status == SolveStatus.NoPlan)
        {
            return Problems.Conflict("Plan cannot be published", $"The solver found no plan for plan {planId}, so it has no targets; solve again with a longer time limit.");
        }
        var sheets = JsonSerializer.Deserialize<List<PlantDayTargets>>(plan.TargetSheetsJson!, ServerJson.Options)!;
        if (sheets.Count == 0)
        {
            return Problems.Conflict("Plan has no targets", $"Plan {planId} has no target sheets to publish.");
        }
        var toPublish = sheets
            .Select(s => new TargetSheetToPublish(s.Plant.Value, s.Date, JsonSerializer.Serialize(s, ServerJson.Options)))
            .ToList();
        var publication = await store.PublishAsync(planId, toPublish, request?.Note, clock.GetCurrentInstant(), PlanDeskClaims.KeyIdOf(context.User));
        return TypedResults.Created($"/api/publications/{publication.Id}", PublicationResponse.From(publication));
    }

    private static async Task<Ok<IReadOnlyList<PublicationResponse>>> ListPublications(IPlanDeskStore store)
    {
        IReadOnlyList<PublicationResponse> publications = (await store.ListPublicationsAsync()).Select(PublicationResponse.From).ToList();
        return TypedResults.Ok(publications);
    }

    private static async Task<Results<Ok<PublicationResponse>, NotFound<ProblemDetails>>> GetPublication(long publicationId, IPlanDeskStore store)
    {
        var publication = await store.GetPublicationAsync(publicationId);
        return publication is null
            ? Problems.NotFound("Publication not found", $"There is no publication {publicationId}; GET /api/publications lists them.")
            : TypedResults.Ok(PublicationResponse.From(publication));
    }
}
