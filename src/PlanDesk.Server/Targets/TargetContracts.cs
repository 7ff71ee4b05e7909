using System.Text.Json.Serialization;
using NodaTime;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Targets;

/// <summary>A published version of a plant's targets for one local day, with the sheet itself.</summary>
/// <param name="Current">True when no later version supersedes this one.</param>
public sealed record TargetsResponse(
    string PlantId, LocalDate Date, int Version, bool Current, long PlanId, long PublicationId, Instant PublishedAt, PlantDayTargets Sheet);

/// <summary>One published version of a plant-day, without the sheet.</summary>
public sealed record TargetVersionResponse(string PlantId, LocalDate Date, int Version, long PlanId, long PublicationId, Instant PublishedAt, string Href)
{
    public static TargetVersionResponse From(TargetRecord record) => new(
        record.PlantId, record.Date, record.Version, record.PlanId, record.PublicationId, record.PublishedAt,
        $"/api/plants/{record.PlantId}/targets/{record.Date:uuuu-MM-dd}/versions/{record.Version}");
}

/// <summary>An optional note kept with a publication.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record PublishRequest(string? Note = null);

/// <summary>A publication: every plant-day of one plan, each now the current version for its plant and day.</summary>
public sealed record PublicationResponse(
    long PublicationId, long PlanId, Instant PublishedAt, string PublishedBy, string? Note, IReadOnlyList<TargetVersionResponse> Targets)
{
    public static PublicationResponse From(PublicationRecord record) => new(
        record.Id, record.PlanId, record.PublishedAt, record.PublishedBy, record.Note, record.Targets.Select(TargetVersionResponse.From).ToList());
}
