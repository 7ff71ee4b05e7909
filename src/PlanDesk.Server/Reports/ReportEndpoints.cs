using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Store;
using PlanDesk.Server.Targets;

namespace PlanDesk.Server.Reports;

/// <summary>What plants send back: acknowledgements of target versions and hourly actuals, both idempotent.</summary>
internal static class ReportEndpoints
{
    public static RouteGroupBuilder MapPlantReports(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/plants/{plantId}").WithTags("Plant reports").RequireAuthorization(Access.PlantRead);
        group.MapPost("/targets/{date}/acknowledgements", Acknowledge).RequireAuthorization(Access.PlantWrite)
            .WithSummary("Acknowledge a published target version (needs an Idempotency-Key header).");
        group.MapGet("/targets/{date}/acknowledgements", ListAcknowledgements).WithSummary("Acknowledgements of the plant-day, oldest first.");
        group.MapPost("/actuals", ReportActuals).RequireAuthorization(Access.PlantWrite)
            .WithSummary("Report hourly actuals (needs an Idempotency-Key header).");
        group.MapGet("/actuals", ListActuals).WithSummary("Stored hourly actuals between two local dates (inclusive).");
        return group;
    }

    private static async Task<Results<Created<AcknowledgementResponse>, BadRequest<ProblemDetails>, NotFound<ProblemDetails>, UnprocessableEntity<ProblemDetails>>> Acknowledge(
        string plantId, string date, AcknowledgementRequest request, [FromHeader(Name = Idempotency.Header)] string? idempotencyKey,
        HttpContext context, IPlanDeskStore store, IClock clock)
    {
        if (!Idempotency.TryCheckKey(idempotencyKey, out var badKey))
        {
            return badKey;
        }
        if (!PlantRoutes.TryParseDate(date, out var day, out var badDate))
        {
            return badDate;
        }
        if (await store.GetTargetAsync(plantId, day, request.Version, withSheet: false) is null)
        {
            return await PlantRoutes.NoTargetsAsync(store, plantId, day, request.Version);
        }
        var hash = Idempotency.RequestHash(new { plantId, date = day, request });
        var stored = await store.AddAcknowledgementAsync(new AcknowledgementRecord(
            0, plantId, day, request.Version, idempotencyKey!, hash, clock.GetCurrentInstant(), PlanDeskClaims.KeyIdOf(context.User),
            request.AcknowledgedBy, request.Note));
        if (!stored.Created && stored.Record.RequestHash != hash)
        {
            return Idempotency.KeyReused(idempotencyKey!, "acknowledgement");
        }
        if (!stored.Created)
        {
            Idempotency.MarkReplay(context);
        }
        var ack = stored.Record;
        return TypedResults.Created($"/api/plants/{plantId}/targets/{date}/acknowledgements",
            new AcknowledgementResponse(ack.Id, ack.PlantId, ack.Date, ack.TargetVersion, ack.ReceivedAt, ack.AcknowledgedBy, ack.Note));
    }

    private static async Task<Results<Ok<IReadOnlyList<AcknowledgementResponse>>, BadRequest<ProblemDetails>>> ListAcknowledgements(
        string plantId, string date, IPlanDeskStore store)
    {
        if (!PlantRoutes.TryParseDate(date, out var day, out var badDate))
        {
            return badDate;
        }
        IReadOnlyList<AcknowledgementResponse> acks = (await store.ListAcknowledgementsAsync(plantId, day))
            .Select(a => new AcknowledgementResponse(a.Id, a.PlantId, a.Date, a.TargetVersion, a.ReceivedAt, a.AcknowledgedBy, a.Note))
            .ToList();
        return TypedResults.Ok(acks);
    }

    private static async Task<Results<Created<ActualsReportResponse>, BadRequest<ProblemDetails>, NotFound<ProblemDetails>, UnprocessableEntity<ProblemDetails>>> ReportActuals(
        string plantId, ActualsRequest request, [FromHeader(Name = Idempotency.Header)] string? idempotencyKey,
        HttpContext context, IPlanDeskStore store, NetworkCatalog catalog, IClock clock)
    {
        if (!Idempotency.TryCheckKey(idempotencyKey, out var badKey))
        {
            return badKey;
        }
        var loaded = await catalog.LatestWithPlantAsync(plantId);
        if (loaded is null)
        {
            return PlantRoutes.UnknownPlant(plantId);
        }
        var now = clock.GetCurrentInstant();
        var plant = loaded.Network.Plants.Single(p => p.Id.Value == plantId);
        var problems = ActualsValidation.Check(request, loaded.Network, plant, now);
        if (problems.Count > 0)
        {
            return Problems.BadRequest("Actuals not valid",
                $"{problems[0]}{(problems.Count > 1 ? $" ({problems.Count} problems in all, listed in 'problems')" : "")} Nothing was stored.", problems);
        }
        var hash = Idempotency.RequestHash(new { plantId, request });
        var hours = request.Hours.OrderBy(h => h.HourStart).ToList();
        var report = new ActualsReportRecord(0, plantId, idempotencyKey!, hash, now, PlanDeskClaims.KeyIdOf(context.User),
            hours.Count, hours[0].HourStart, hours[^1].HourStart);
        var rows = hours.Select(h => new ActualsHourRecord(0, plantId, h.HourStart, JsonSerializer.Serialize(h, ServerJson.Options))).ToList();
        var stored = await store.AddActualsAsync(report, rows);
        if (!stored.Created && stored.Record.RequestHash != hash)
        {
            return Idempotency.KeyReused(idempotencyKey!, "report of actuals");
        }
        if (!stored.Created)
        {
            Idempotency.MarkReplay(context);
        }
        var saved = stored.Record;
        var zone = loaded.Network.TimeZone;
        var location = $"/api/plants/{plantId}/actuals?from={saved.FirstHourStart.InZone(zone).Date:uuuu-MM-dd}&to={saved.LastHourStart.InZone(zone).Date:uuuu-MM-dd}";
        return TypedResults.Created(location,
            new ActualsReportResponse(saved.Id, saved.PlantId, saved.RowCount, saved.FirstHourStart, saved.LastHourStart, saved.ReceivedAt));
    }

    private static async Task<Results<Ok<ActualsListResponse>, BadRequest<ProblemDetails>, NotFound<ProblemDetails>>> ListActuals(
        string plantId, string from, string to, IPlanDeskStore store, NetworkCatalog catalog)
    {
        if (!PlantRoutes.TryParseDate(from, out var fromDay, out var badFrom))
        {
            return badFrom;
        }
        if (!PlantRoutes.TryParseDate(to, out var toDay, out var badTo))
        {
            return badTo;
        }
        if (toDay < fromDay || Period.Between(fromDay, toDay, PeriodUnits.Days).Days > 62)
        {
            return Problems.BadRequest("Date range not valid", $"from {from} to {to}: give from ≤ to, at most 62 days apart.");
        }
        var loaded = await catalog.LatestWithPlantAsync(plantId);
        if (loaded is null)
        {
            return PlantRoutes.UnknownPlant(plantId);
        }
        var zone = loaded.Network.TimeZone;
        var hours = await store.ListActualsAsync(plantId, zone.AtStartOfDay(fromDay).ToInstant(), zone.AtStartOfDay(toDay.PlusDays(1)).ToInstant());
        return TypedResults.Ok(new ActualsListResponse(plantId,
            hours.Select(h => new StoredActualsHour(h.ReportId, JsonSerializer.Deserialize<ActualsHour>(h.RowJson, ServerJson.Options)!)).ToList()));
    }
}
