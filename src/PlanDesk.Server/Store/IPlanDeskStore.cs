using NodaTime;

namespace PlanDesk.Server.Store;

/// <summary>
/// Everything the target service keeps: keys, network versions, solve jobs and plans, publications and
/// targets, acknowledgements and actuals. One implementation per database, sharing their SQL.
/// Writes that must not count twice take the caller's idempotency key and return the record already stored under it.
/// </summary>
public interface IPlanDeskStore
{
    /// <summary>Human-readable place of the data, for start-up messages (never contains a password).</summary>
    string Description { get; }

    /// <summary>Applies every schema migration not yet applied; safe to call at every start.</summary>
    Task MigrateAsync(CancellationToken cancellation = default);

    Task<IReadOnlyList<int>> AppliedMigrationsAsync();

    // Keys
    Task AddKeyAsync(ApiKeyRecord key);
    Task<ApiKeyRecord?> FindKeyAsync(string keyId);
    Task<IReadOnlyList<ApiKeyRecord>> ListKeysAsync();
    /// <summary>False when no such key exists; revoking twice keeps the first time.</summary>
    Task<bool> RevokeKeyAsync(string keyId, Instant at);

    // Networks
    /// <summary>Stores the next version of a network (1 for a new one) and returns it.</summary>
    Task<NetworkVersionRecord> AddNetworkVersionAsync(
        string networkId, string name, string document, IReadOnlyList<NetworkPlantRecord> plants, Instant at, string keyId);
    Task<IReadOnlyList<NetworkVersionRecord>> ListNetworkVersionsAsync(string? networkId = null);
    /// <summary>A version with its document; the latest when <paramref name="version"/> is null.</summary>
    Task<NetworkVersionRecord?> GetNetworkVersionAsync(string networkId, int? version);
    /// <summary>The latest network version that contains the plant, with its document, or null for an unknown plant.</summary>
    Task<NetworkVersionRecord?> LatestNetworkWithPlantAsync(string plantId);

    // Plans and solve jobs
    Task<PlanRecord> AddPlanJobAsync(string networkId, int networkVersion, LocalDate startDate, int days, string optionsJson, Instant at, string keyId);
    Task<PlanRecord?> GetPlanAsync(long planId, bool withDocuments);
    Task<IReadOnlyList<PlanRecord>> ListPlansAsync();
    /// <summary>Moves the oldest queued job to running and returns it, or null when none is queued.</summary>
    Task<PlanRecord?> ClaimNextQueuedAsync(Instant at);
    Task UpdateProgressAsync(long planId, string progressJson);
    Task CompletePlanAsync(long planId, PlanOutcome outcome, string? message, Instant at);
    /// <summary>Ends a job as failed or cancelled with a reason.</summary>
    Task EndPlanAsync(long planId, string state, string message, Instant at);
    /// <summary>Marks every running job failed with the reason; used at start-up after a crash or restart.</summary>
    Task<int> FailRunningAsync(string message, Instant at);
    Task<CancelOutcome> RequestCancelAsync(long planId, string message, Instant at);

    // Publications and targets
    /// <summary>Atomically publishes every sheet: each becomes the next version for its plant and day.</summary>
    Task<PublicationRecord> PublishAsync(long planId, IReadOnlyList<TargetSheetToPublish> sheets, string? note, Instant at, string keyId);
    Task<PublicationRecord?> GetPublicationAsync(long publicationId);
    Task<IReadOnlyList<PublicationRecord>> ListPublicationsAsync();
    /// <summary>The given version, or the current (highest) one when <paramref name="version"/> is null; with its sheet
    /// unless <paramref name="withSheet"/> is false (enough to answer a poll that has not changed).</summary>
    Task<TargetRecord?> GetTargetAsync(string plantId, LocalDate date, int? version, bool withSheet = true);
    Task<IReadOnlyList<TargetRecord>> ListTargetVersionsAsync(string plantId, LocalDate date);
    /// <summary>First and last local day with published targets for the plant, or null when none.</summary>
    Task<(LocalDate First, LocalDate Last)?> PublishedDaysAsync(string plantId);

    // Acknowledgements and actuals
    Task<Stored<AcknowledgementRecord>> AddAcknowledgementAsync(AcknowledgementRecord acknowledgement);
    Task<IReadOnlyList<AcknowledgementRecord>> ListAcknowledgementsAsync(string plantId, LocalDate date);
    Task<Stored<ActualsReportRecord>> AddActualsAsync(ActualsReportRecord report, IReadOnlyList<ActualsHourRecord> hours);
    /// <summary>Hours in [from, to) for the plant; where an hour was reported more than once, the latest report's row.</summary>
    Task<IReadOnlyList<ActualsHourRecord>> ListActualsAsync(string plantId, Instant from, Instant to);
}
