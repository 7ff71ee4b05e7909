using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Net.Http.Headers;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Targets;

/// <summary>
/// A plant's published targets for a local day, as JSON or (with <c>Accept: text/csv</c>) CSV. Each answer carries
/// an ETag; a controller polling with <c>If-None-Match</c> gets 304 until a new version is published.
/// </summary>
internal static class TargetEndpoints
{
    public static RouteGroupBuilder MapTargets(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/plants/{plantId}/targets").WithTags("Targets").RequireAuthorization(Access.PlantRead);
        group.MapGet("/{date}", GetCurrent)
            .Produces<TargetsResponse>(StatusCodes.Status200OK, "application/json", "text/csv")
            .Produces(StatusCodes.Status304NotModified)
            .WithSummary("The current targets of a plant for a local day (JSON, or CSV with Accept: text/csv); 304 when If-None-Match matches.");
        group.MapGet("/{date}/versions", ListVersions).WithSummary("Every published version of the plant-day, oldest first.");
        group.MapGet("/{date}/versions/{version:int}", GetVersion).WithSummary("One published version of the plant-day.");
        return group;
    }

    private static Task<Results<Ok<TargetsResponse>, ContentHttpResult, StatusCodeHttpResult, BadRequest<ProblemDetails>, NotFound<ProblemDetails>>> GetCurrent(
        string plantId, string date, HttpContext context, IPlanDeskStore store) => ServeAsync(plantId, date, null, context, store);

    private static Task<Results<Ok<TargetsResponse>, ContentHttpResult, StatusCodeHttpResult, BadRequest<ProblemDetails>, NotFound<ProblemDetails>>> GetVersion(
        string plantId, string date, int version, HttpContext context, IPlanDeskStore store) => ServeAsync(plantId, date, version, context, store);

    private static async Task<Results<Ok<IReadOnlyList<TargetVersionResponse>>, BadRequest<ProblemDetails>, NotFound<ProblemDetails>>> ListVersions(
        string plantId, string date, IPlanDeskStore store)
    {
        if (!PlantRoutes.TryParseDate(date, out var day, out var badDate))
        {
            return badDate;
        }
        var versions = await store.ListTargetVersionsAsync(plantId, day);
        if (versions.Count == 0)
        {
            return await PlantRoutes.NoTargetsAsync(store, plantId, day, null);
        }
        IReadOnlyList<TargetVersionResponse> response = versions.Select(TargetVersionResponse.From).ToList();
        return TypedResults.Ok(response);
    }

    private static async Task<Results<Ok<TargetsResponse>, ContentHttpResult, StatusCodeHttpResult, BadRequest<ProblemDetails>, NotFound<ProblemDetails>>> ServeAsync(
        string plantId, string date, int? version, HttpContext context, IPlanDeskStore store)
    {
        if (!PlantRoutes.TryParseDate(date, out var day, out var badDate))
        {
            return badDate;
        }
        var record = await store.GetTargetAsync(plantId, day, version, withSheet: false);
        if (record is null)
        {
            return await PlantRoutes.NoTargetsAsync(store, plantId, day, version);
        }
        var current = version is null || (await store.GetTargetAsync(plantId, day, null, withSheet: false))?.Version == record.Version;
        var csv = WantsCsv(context.Request);
        // The version and publication identify the content; the format is part of the representation.
        var etag = new EntityTagHeaderValue($"\"v{record.Version}-p{record.PublicationId}-{(csv ? "csv" : "json")}\"");
        context.Response.Headers.ETag = etag.ToString();
        context.Response.Headers.CacheControl = "no-cache";
        var ifNoneMatch = context.Request.GetTypedHeaders().IfNoneMatch;
        if (ifNoneMatch.Any(tag => tag.Equals(EntityTagHeaderValue.Any) || tag.Compare(etag, useStrongComparison: false)))
        {
            return TypedResults.StatusCode(StatusCodes.Status304NotModified);
        }
        // The version read above identifies the sheet: versions never change once published.
        var sheetJson = (await store.GetTargetAsync(plantId, day, record.Version))!.SheetJson!;
        var sheet = JsonSerializer.Deserialize<PlantDayTargets>(sheetJson, ServerJson.Options)!;
        var response = new TargetsResponse(record.PlantId, record.Date, record.Version, current, record.PlanId, record.PublicationId, record.PublishedAt, sheet);
        return csv ? TypedResults.Text(TargetCsv.Write(response), "text/csv; charset=utf-8") : TypedResults.Ok(response);
    }

    private static bool WantsCsv(HttpRequest request) =>
        request.GetTypedHeaders().Accept.Any(a => a.MediaType.Equals("text/csv", StringComparison.OrdinalIgnoreCase));
}
