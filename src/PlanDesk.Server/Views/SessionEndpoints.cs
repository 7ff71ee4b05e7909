using Microsoft.AspNetCore.Authorization;
using Microsoft.AspNetCore.Http.HttpResults;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Views;

/// <summary>The plant a plant key belongs to, with its local "today" so a plant's desk opens on the right day.</summary>
/// <param name="Name">Null when no uploaded network has the plant yet.</param>
/// <param name="TimeZone">IANA zone of the plant's network; null when no network has the plant.</param>
/// <param name="Today">Today's local date in that zone.</param>
/// <param name="PublishedFrom">First local day with published targets, null when none are published.</param>
public sealed record SessionPlant(string PlantId, string? Name, string? TimeZone, LocalDate? Today, LocalDate? PublishedFrom, LocalDate? PublishedTo);

/// <summary>Who the presented key is: its role decides what the desk offers.</summary>
/// <param name="Role">scheduler, viewer or plant.</param>
public sealed record SessionResponse(string KeyId, string Role, string Label, SessionPlant? Plant);

/// <summary><c>GET /api/me</c>: any valid key may ask what it is.</summary>
internal static class SessionEndpoints
{
    public static RouteHandlerBuilder MapSession(this IEndpointRouteBuilder app)
    {
        var anyKey = new AuthorizationPolicyBuilder(PlanDeskClaims.Scheme).RequireAuthenticatedUser().Build();
        return app.MapGet("/api/me", GetSession).WithTags("Service").RequireAuthorization(anyKey)
            .WithSummary("The role of the presented key and, for a plant key, its plant, time zone, today and published days.");
    }

    private static async Task<Ok<SessionResponse>> GetSession(HttpContext context, IPlanDeskStore store, NetworkCatalog catalog, IClock clock)
    {
        var keyId = PlanDeskClaims.KeyIdOf(context.User);
        var key = await store.FindKeyAsync(keyId);
        var role = context.User.FindFirst(PlanDeskClaims.Role)?.Value ?? "";
        var plantId = context.User.FindFirst(PlanDeskClaims.Plant)?.Value;
        var plant = plantId is null ? null : await DescribePlantAsync(plantId, store, catalog, clock);
        return TypedResults.Ok(new SessionResponse(keyId, role, key?.Label ?? "", plant));
    }

    private static async Task<SessionPlant> DescribePlantAsync(string plantId, IPlanDeskStore store, NetworkCatalog catalog, IClock clock)
    {
        var loaded = await catalog.LatestWithPlantAsync(plantId);
        var published = await store.PublishedDaysAsync(plantId);
        if (loaded is null)
        {
            return new SessionPlant(plantId, null, null, null, published?.First, published?.Last);
        }
        var zone = loaded.Network.TimeZone;
        var name = loaded.Network.Plants.First(p => p.Id.Value == plantId).Name;
        return new SessionPlant(plantId, name, zone.Id, clock.GetCurrentInstant().InZone(zone).Date, published?.First, published?.Last);
    }
}
