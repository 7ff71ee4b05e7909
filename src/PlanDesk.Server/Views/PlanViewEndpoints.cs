using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Plans;
using PlanDesk.Server.SolveJobs;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Views;

/// <summary>Read-only views of a finished plan for the browser desk: the schematic, the per-period series and what
/// publishing it would supersede. Same keys and roles as the other plan endpoints.</summary>
internal static class PlanViewEndpoints
{
    public static RouteGroupBuilder MapPlanViews(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/plans/{planId:long}").WithTags("Plans").RequireAuthorization(Access.Read);
        group.MapGet("/schematic", GetSchematic)
            .WithSummary("The network as a schematic: plants, stages, tanks, pipelines and customers with capacity use, binding limits and problems.");
        group.MapGet("/series", GetSeries)
            .WithSummary("Every per-period quantity of the plan beside prices, demand, bounds and permit caps, for charts.");
        group.MapGet("/publication-preview", GetPublicationPreview)
            .WithSummary("The plant-days publishing this plan would cover and the target versions it would supersede.");
        return group;
    }

    private static Task<Results<Ok<SchematicResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetSchematic(
        long planId, IPlanDeskStore store, PlanPipeline pipeline) =>
        PlanEndpoints.WithFinishedPlanAsync(store, planId, async record =>
        {
            var planningCase = await CaseOfAsync(record, pipeline);
            return SchematicBuilder.Create(record.Id, planningCase, PlanEndpoints.ReadPlan(record));
        });

    private static Task<Results<Ok<PlanSeriesResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetSeries(
        long planId, IPlanDeskStore store, PlanPipeline pipeline) =>
        PlanEndpoints.WithFinishedPlanAsync(store, planId, async record =>
        {
            var planningCase = await CaseOfAsync(record, pipeline);
            return PlanSeriesBuilder.Create(record.Id, planningCase, PlanEndpoints.ReadPlan(record), SheetsOf(record));
        });

    private static Task<Results<Ok<PublicationPreviewResponse>, NotFound<ProblemDetails>, Conflict<ProblemDetails>>> GetPublicationPreview(
        long planId, IPlanDeskStore store) =>
        PlanEndpoints.WithFinishedPlanAsync(store, planId, async record =>
        {
            var sheets = SheetsOf(record);
            var status = PlanEndpoints.ReadPlan(record).Solve.Status;
            var reason = status == SolveStatus.NoPlan
                ? "The solver found no plan, so there are no targets to publish; solve again with a longer time limit."
                : sheets.Count == 0 ? "This plan has no target sheets to publish." : null;
            var plantDays = new List<PlantDayPreview>();
            foreach (var sheet in sheets.OrderBy(s => s.Plant.Value, StringComparer.Ordinal).ThenBy(s => s.Date))
            {
                var current = await store.GetTargetAsync(sheet.Plant.Value, sheet.Date, null);
                plantDays.Add(new PlantDayPreview(sheet.Plant.Value, sheet.PlantName, sheet.Date, current?.Version, current?.PlanId));
            }
            return new PublicationPreviewResponse(record.Id, reason is null, reason, plantDays);
        });

    /// <summary>The planning case the plan was solved on, rebuilt from the stored network version and actuals.</summary>
    private static async Task<PlanningCase> CaseOfAsync(PlanRecord record, PlanPipeline pipeline)
    {
        var prepared = await pipeline.PrepareAsync(record.NetworkId, record.NetworkVersion, record.StartDate, record.Days);
        // The plan was solved on this very case, so it builds; anything else is a fault of the server.
        return prepared?.Case ?? throw new InvalidOperationException(
            $"plan {record.Id}: network {record.NetworkId} version {record.NetworkVersion} no longer plans for {record.StartDate} ({record.Days} days)");
    }

    private static IReadOnlyList<PlantDayTargets> SheetsOf(PlanRecord record) =>
        record.TargetSheetsJson is null ? [] : JsonSerializer.Deserialize<List<PlantDayTargets>>(record.TargetSheetsJson, ServerJson.Options)!;
}
