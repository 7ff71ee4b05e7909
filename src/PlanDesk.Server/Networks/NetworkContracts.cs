using System.Text.Json;
using NodaTime;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Networks;

public sealed record PlantSummary(string PlantId, string Name);

/// <summary>One uploaded version of a network, without its document.</summary>
public sealed record NetworkVersionResponse(
    string NetworkId, int Version, string Name, IReadOnlyList<PlantSummary> Plants, Instant UploadedAt, string UploadedBy, string Href)
{
    public static NetworkVersionResponse From(NetworkVersionRecord record) => new(
        record.NetworkId, record.Version, record.Name,
        record.Plants.Select(p => new PlantSummary(p.PlantId, p.PlantName)).ToList(),
        record.UploadedAt, record.UploadedBy, $"/api/networks/{record.NetworkId}/versions/{record.Version}");
}

/// <summary>A network and all its versions, oldest first.</summary>
public sealed record NetworkResponse(string NetworkId, string Name, int LatestVersion, IReadOnlyList<NetworkVersionResponse> Versions);

/// <summary>One version with the network document exactly as uploaded.</summary>
public sealed record NetworkDocumentResponse(NetworkVersionResponse Version, JsonElement Document);
