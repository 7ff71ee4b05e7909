using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Networks;

/// <summary>Network versions: schedulers upload a network file as a new version; schedulers and viewers read them.</summary>
internal static partial class NetworkEndpoints
{
    public static RouteGroupBuilder MapNetworks(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/networks").WithTags("Networks").RequireAuthorization(Access.Read);
        group.MapGet("/", ListNetworks).WithSummary("List networks and their versions.");
        group.MapGet("/{networkId}", GetNetwork).WithSummary("One network's versions.");
        group.MapGet("/{networkId}/versions/{version:int}", GetVersion).WithSummary("One version with its network document.");
        group.MapPost("/{networkId}/versions", UploadVersion)
            .RequireAuthorization(Access.Schedule)
            .WithBodySizeLimit(BodySizeLimit.NetworkBytes)
            .WithSummary("Upload a network file (JSON, series inline) as the network's next version.");
        return group;
    }

    private static async Task<Ok<IReadOnlyList<NetworkResponse>>> ListNetworks(IPlanDeskStore store)
    {
        var versions = await store.ListNetworkVersionsAsync();
        IReadOnlyList<NetworkResponse> networks = versions.GroupBy(v => v.NetworkId).Select(ToResponse).ToList();
        return TypedResults.Ok(networks);
    }

    private static async Task<Results<Ok<NetworkResponse>, NotFound<ProblemDetails>>> GetNetwork(string networkId, IPlanDeskStore store)
    {
        var versions = await store.ListNetworkVersionsAsync(networkId);
        return versions.Count == 0
            ? UnknownNetwork(networkId)
            : TypedResults.Ok(ToResponse(versions.GroupBy(v => v.NetworkId).Single()));
    }

    private static async Task<Results<Ok<NetworkDocumentResponse>, NotFound<ProblemDetails>>> GetVersion(string networkId, int version, IPlanDeskStore store)
    {
        var record = await store.GetNetworkVersionAsync(networkId, version);
        if (record?.Document is null)
        {
            return Problems.NotFound("Network version not found", $"Network '{networkId}' has no version {version}; GET /api/networks/{networkId} lists its versions.");
        }
        using var document = JsonDocument.Parse(record.Document);
        return TypedResults.Ok(new NetworkDocumentResponse(NetworkVersionResponse.From(record), document.RootElement.Clone()));
    }

    private static async Task<Results<Created<NetworkVersionResponse>, BadRequest<ProblemDetails>>> UploadVersion(
        string networkId, [FromBody] JsonElement document, HttpContext context, IPlanDeskStore store, INetworkReader reader, IClock clock)
    {
        if (!NetworkIds.IsValid(networkId))
        {
            return Problems.BadRequest("Network id not valid",
                $"'{networkId}' is not a network id: use 1 to 64 lower-case letters, digits and hyphens, e.g. 'larkmoor-region'.");
        }
        if (document.ValueKind != JsonValueKind.Object)
        {
            return Problems.BadRequest("Network file not valid", "The body must be a network file: a JSON object (see docs/network.schema.json).");
        }
        var text = document.GetRawText();
        var reading = reader.Read(text, $"upload of network {networkId}");
        if (reading.Network is null)
        {
            return Problems.BadRequest("Network file has problems",
                $"The network was not stored: {reading.Problems.Count} problem(s) found. Fix each and upload again; " +
                "series must be given inline, since CSV files cannot be uploaded with the network.",
                reading.Problems);
        }
        var plants = reading.Network.Plants.Select(p => new NetworkPlantRecord(p.Id.Value, p.Name)).ToList();
        var stored = await store.AddNetworkVersionAsync(networkId, reading.Network.Name, text, plants, clock.GetCurrentInstant(), PlanDeskClaims.KeyIdOf(context.User));
        var response = NetworkVersionResponse.From(stored);
        return TypedResults.Created(response.Href, response);
    }

    private static NetworkResponse ToResponse(IGrouping<string, NetworkVersionRecord> versions)
    {
        var ordered = versions.OrderBy(v => v.Version).ToList();
        return new NetworkResponse(versions.Key, ordered[^1].Name, ordered[^1].Version, ordered.Select(NetworkVersionResponse.From).ToList());
    }

    private static NotFound<ProblemDetails> UnknownNetwork(string networkId) =>
        Problems.NotFound("Network not found", $"No network '{networkId}' has been uploaded; GET /api/networks lists the networks.");

}
