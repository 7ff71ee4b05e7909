using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Keys;

/// <summary>A request for a new key.</summary>
/// <param name="Role">scheduler, plant or viewer.</param>
/// <param name="PlantId">Required for, and only for, a plant key.</param>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record KeyRequest(string Role, string? PlantId = null, string? Label = null);

/// <summary>A key as listed: never the key itself.</summary>
public sealed record KeyResponse(string KeyId, Role Role, string? PlantId, string Label, Instant CreatedAt, Instant? RevokedAt)
{
    public static KeyResponse From(ApiKeyRecord record) => new(record.KeyId, record.Role, record.PlantId, record.Label, record.CreatedAt, record.RevokedAt);
}

/// <summary>A new key. <see cref="Key"/> is shown only here: store it now, the server keeps only its hash.</summary>
public sealed record KeyCreatedResponse(string Key, KeyResponse Details);

/// <summary>Keys over the API, for schedulers; the first key comes from <c>plandesk keys add</c>.</summary>
internal static class KeyEndpoints
{
    public static RouteGroupBuilder MapKeys(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/keys").WithTags("Keys").RequireAuthorization(Access.Schedule);
        group.MapGet("/", ListKeys).WithSummary("Every key, revoked ones included (never the keys themselves).");
        group.MapPost("/", AddKey).WithSummary("Create a key; the answer shows it once.");
        group.MapDelete("/{keyId}", RevokeKey).WithSummary("Revoke a key; requests with it are refused from now on.");
        return group;
    }

    private static async Task<Ok<IReadOnlyList<KeyResponse>>> ListKeys(IPlanDeskStore store)
    {
        IReadOnlyList<KeyResponse> keys = (await store.ListKeysAsync()).Select(KeyResponse.From).ToList();
        return TypedResults.Ok(keys);
    }

    private static async Task<Results<Created<KeyCreatedResponse>, BadRequest<ProblemDetails>>> AddKey(KeyRequest request, IPlanDeskStore store, IClock clock)
    {
        if (!Enum.TryParse<Role>(request.Role, ignoreCase: true, out var role) || !Enum.IsDefined(role) || int.TryParse(request.Role, out _))
        {
            return Problems.BadRequest("Key request not valid", $"role is '{request.Role}'; give one of scheduler, plant, viewer.");
        }
        if (ApiKeys.CheckRoleAndPlant(role, request.PlantId) is { } problem)
        {
            return Problems.BadRequest("Key request not valid", problem);
        }
        var (key, record) = ApiKeys.Create(role, request.PlantId, request.Label ?? "", clock.GetCurrentInstant());
        await store.AddKeyAsync(record);
        return TypedResults.Created($"/api/keys/{record.KeyId}", new KeyCreatedResponse(key, KeyResponse.From(record)));
    }

    private static async Task<Results<Ok<KeyResponse>, NotFound<ProblemDetails>>> RevokeKey(string keyId, IPlanDeskStore store, IClock clock)
    {
        if (!await store.RevokeKeyAsync(keyId, clock.GetCurrentInstant()))
        {
            return Problems.NotFound("Key not found", $"There is no key '{keyId}'; GET /api/keys lists the key ids.");
        }
        return TypedResults.Ok(KeyResponse.From((await store.FindKeyAsync(keyId))!));
    }
}
