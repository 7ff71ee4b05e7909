using NodaTime;

namespace PlanDesk.Server.Store;

/// <summary>What a key may do. Stored as lower-case text.</summary>
public enum Role
{
    Scheduler,
    Plant,
    Viewer,
}

/// <summary>An API key as stored: only the SHA-256 of the secret is kept.</summary>
public sealed record ApiKeyRecord(string KeyId, string KeyHash, Role Role, string? PlantId, string Label, Instant CreatedAt, Instant? RevokedAt);

/// <summary>One uploaded version of a network; <see cref="Document"/> is null in listings.</summary>
public sealed record NetworkVersionRecord(
    string NetworkId, int Version, string Name, IReadOnlyList<NetworkPlantRecord> Plants, Instant UploadedAt, string UploadedBy, string? Document);

public sealed record NetworkPlantRecord(string PlantId, string PlantName);

/// <summary>States of a solve job, in the order they normally pass.</summary>
public static class JobState
{
    public const string Queued = "queued";
    public const string Running = "running";
    public const string Succeeded = "succeeded";
    public const string Failed = "failed";
    public const string Cancelled = "cancelled";

    public static bool IsFinished(string state) => state is Succeeded or Failed or Cancelled;
}

/// <summary>A solve job and, once it succeeded, its plan. The documents are JSON and null in listings.</summary>
public sealed record PlanRecord
{
    public required long Id { get; init; }
    public required string NetworkId { get; init; }
    public required int NetworkVersion { get; init; }
    public required LocalDate StartDate { get; init; }
    public required int Days { get; init; }
    public required string OptionsJson { get; init; }
    public required string State { get; init; }
    public bool CancelRequested { get; init; }
    public string? ProgressJson { get; init; }
    public string? Message { get; init; }
    public required Instant SubmittedAt { get; init; }
    public required string SubmittedBy { get; init; }
    public Instant? StartedAt { get; init; }
    public Instant? FinishedAt { get; init; }
    public string? SummaryJson { get; init; }
    public string? PlanJson { get; init; }
    public string? CheckJson { get; init; }
    public string? TargetSheetsJson { get; init; }
}

/// <summary>What a finished solve leaves behind, all as JSON documents.</summary>
public sealed record PlanOutcome(string SummaryJson, string PlanJson, string CheckJson, string TargetSheetsJson);

/// <summary>One plant-day sheet of a plan, ready to be published.</summary>
public sealed record TargetSheetToPublish(string PlantId, LocalDate Date, string SheetJson);

/// <summary>A published version of one plant's targets for one local day; the highest version is the current one.</summary>
public sealed record TargetRecord(string PlantId, LocalDate Date, int Version, long PublicationId, long PlanId, Instant PublishedAt, string? SheetJson);

public sealed record PublicationRecord(long Id, long PlanId, Instant PublishedAt, string PublishedBy, string? Note, IReadOnlyList<TargetRecord> Targets);

public sealed record AcknowledgementRecord(
    long Id, string PlantId, LocalDate Date, int TargetVersion, string IdempotencyKey, string RequestHash,
    Instant ReceivedAt, string KeyId, string? AcknowledgedBy, string? Note);

public sealed record ActualsReportRecord(
    long Id, string PlantId, string IdempotencyKey, string RequestHash, Instant ReceivedAt, string KeyId,
    int RowCount, Instant FirstHourStart, Instant LastHourStart);

/// <summary>One stored hour of actuals; <see cref="RowJson"/> is the hour as the plant reported it.</summary>
public sealed record ActualsHourRecord(long ReportId, string PlantId, Instant HourStart, string RowJson);

/// <summary>The result of an idempotent write: the record stored under the key, and whether this call stored it.</summary>
public sealed record Stored<T>(T Record, bool Created);

/// <summary>What a cancel request did.</summary>
public enum CancelOutcome
{
    NotFound,
    CancelledBeforeStart,
    CancelRequested,
    AlreadyFinished,
}
