using Dapper;
using NodaTime;

namespace PlanDesk.Server.Store;

internal abstract partial class SqlStore
{
    private sealed class PlanRow
    {
        public long Id { get; set; }
        public string NetworkId { get; set; } = "";
        public long NetworkVersion { get; set; }
        public string StartDate { get; set; } = "";
        public long Days { get; set; }
        public string Options { get; set; } = "";
        public string State { get; set; } = "";
        public long CancelRequested { get; set; }
        public string? Progress { get; set; }
        public string? Message { get; set; }
        public long SubmittedAt { get; set; }
        public string SubmittedBy { get; set; } = "";
        public long? StartedAt { get; set; }
        public long? FinishedAt { get; set; }
        public string? SummaryDocument { get; set; }
        public string? PlanDocument { get; set; }
        public string? CheckDocument { get; set; }
        public string? TargetSheets { get; set; }

        public PlanRecord ToRecord() => new()
        {
            Id = Id,
            NetworkId = NetworkId,
            NetworkVersion = (int)NetworkVersion,
            StartDate = Day(StartDate),
            Days = (int)Days,
            OptionsJson = Options,
            State = State,
            CancelRequested = CancelRequested != 0,
            ProgressJson = Progress,
            Message = Message,
            SubmittedAt = At(SubmittedAt),
            SubmittedBy = SubmittedBy,
            StartedAt = At(StartedAt),
            FinishedAt = At(FinishedAt),
            SummaryJson = SummaryDocument,
            PlanJson = PlanDocument,
            CheckJson = CheckDocument,
            TargetSheetsJson = TargetSheets,
        };
    }

    private const string PlanColumns =
        "id, network_id, network_version, start_date, days, options, state, cancel_requested, progress, message, " +
        "submitted_at, submitted_by, started_at, finished_at, summary_document";

    private const string PlanDocumentColumns = ", plan_document, check_document, target_sheets";

    public async Task<PlanRecord> AddPlanJobAsync(string networkId, int networkVersion, LocalDate startDate, int days, string optionsJson, Instant at, string keyId)
    {
        await using var connection = await OpenAsync();
        var row = await connection.QuerySingleAsync<PlanRow>(
            "INSERT INTO plans (network_id, network_version, start_date, days, options, state, submitted_at, submitted_by) " +
            "VALUES (@networkId, @networkVersion, @startDate, @days, @optionsJson, @state, @at, @keyId) " +
            $"RETURNING {PlanColumns}",
            new { networkId, networkVersion, startDate = Day(startDate), days, optionsJson, state = JobState.Queued, at = Ms(at), keyId });
        return row.ToRecord();
    }

    public async Task<PlanRecord?> GetPlanAsync(long planId, bool withDocuments)
    {
        await using var connection = await OpenAsync();
        var columns = withDocuments ? PlanColumns + PlanDocumentColumns : PlanColumns;
        var row = await connection.QuerySingleOrDefaultAsync<PlanRow>($"SELECT {columns} FROM plans WHERE id = @planId", new { planId });
        return row?.ToRecord();
    }

    public async Task<IReadOnlyList<PlanRecord>> ListPlansAsync()
    {
        await using var connection = await OpenAsync();
        var rows = await connection.QueryAsync<PlanRow>($"SELECT {PlanColumns} FROM plans ORDER BY id");
        return rows.Select(r => r.ToRecord()).ToList();
    }

    public async Task<PlanRecord?> ClaimNextQueuedAsync(Instant at)
    {
        await using var connection = await OpenAsync();
        await using var transaction = await BeginWriteAsync(connection, "plans");
        var row = await connection.QuerySingleOrDefaultAsync<PlanRow>(
            "UPDATE plans SET state = @running, started_at = @at " +
            "WHERE id = (SELECT MIN(id) FROM plans WHERE state = @queued) AND state = @queued " +
            $"RETURNING {PlanColumns}",
            new { running = JobState.Running, queued = JobState.Queued, at = Ms(at) }, transaction);
        await transaction.CommitAsync();
        return row?.ToRecord();
    }

    public async Task UpdateProgressAsync(long planId, string progressJson)
    {
        await using var connection = await OpenAsync();
        await connection.ExecuteAsync(
            "UPDATE plans SET progress = @progressJson WHERE id = @planId AND state = @running",
            new { planId, progressJson, running = JobState.Running });
    }

    public async Task CompletePlanAsync(long planId, PlanOutcome outcome, string? message, Instant at)
    {
        await using var connection = await OpenAsync();
        await connection.ExecuteAsync(
            "UPDATE plans SET state = @succeeded, finished_at = @at, message = @message, summary_document = @SummaryJson, " +
            "plan_document = @PlanJson, check_document = @CheckJson, target_sheets = @TargetSheetsJson WHERE id = @planId",
            new { planId, succeeded = JobState.Succeeded, at = Ms(at), message, outcome.SummaryJson, outcome.PlanJson, outcome.CheckJson, outcome.TargetSheetsJson });
    }

    public async Task EndPlanAsync(long planId, string state, string message, Instant at)
    {
        await using var connection = await OpenAsync();
        await connection.ExecuteAsync(
            "UPDATE plans SET state = @state, message = @message, finished_at = @at WHERE id = @planId",
            new { planId, state, message, at = Ms(at) });
    }

    public async Task<int> FailRunningAsync(string message, Instant at)
    {
        await using var connection = await OpenAsync();
        return await connection.ExecuteAsync(
            "UPDATE plans SET state = @failed, message = @message, finished_at = @at WHERE state = @running",
            new { failed = JobState.Failed, running = JobState.Running, message, at = Ms(at) });
    }

    public async Task<CancelOutcome> RequestCancelAsync(long planId, string message, Instant at)
    {
        await using var connection = await OpenAsync();
        await using var transaction = await BeginWriteAsync(connection, "plans");
        var state = await connection.QuerySingleOrDefaultAsync<string>("SELECT state FROM plans WHERE id = @planId", new { planId }, transaction);
        CancelOutcome outcome;
        switch (state)
        {
            case null:
                outcome = CancelOutcome.NotFound;
                break;
            case JobState.Queued:
                await connection.ExecuteAsync(
                    "UPDATE plans SET state = @cancelled, cancel_requested = 1, message = @message, finished_at = @at WHERE id = @planId",
                    new { planId, cancelled = JobState.Cancelled, message, at = Ms(at) }, transaction);
                outcome = CancelOutcome.CancelledBeforeStart;
                break;
            case JobState.Running:
                await connection.ExecuteAsync("UPDATE plans SET cancel_requested = 1 WHERE id = @planId", new { planId }, transaction);
                outcome = CancelOutcome.CancelRequested;
                break;
            default:
                outcome = CancelOutcome.AlreadyFinished;
                break;
        }
        await transaction.CommitAsync();
        return outcome;
    }
}
