using Dapper;
using NodaTime;

namespace PlanDesk.Server.Store;

internal abstract partial class SqlStore
{
    private sealed class AcknowledgementRow
    {
        public long Id { get; set; }
        public string PlantId { get; set; } = "";
        public string LocalDate { get; set; } = "";
        public long TargetVersion { get; set; }
        public string IdempotencyKey { get; set; } = "";
        public string RequestHash { get; set; } = "";
        public long ReceivedAt { get; set; }
        public string KeyId { get; set; } = "";
        public string? AcknowledgedBy { get; set; }
        public string? Note { get; set; }

        public AcknowledgementRecord ToRecord() =>
            new(Id, PlantId, Day(LocalDate), (int)TargetVersion, IdempotencyKey, RequestHash, At(ReceivedAt), KeyId, AcknowledgedBy, Note);
    }

    private sealed class ActualsReportRow
    {
        public long Id { get; set; }
        public string PlantId { get; set; } = "";
        public string IdempotencyKey { get; set; } = "";
        public string RequestHash { get; set; } = "";
        public long ReceivedAt { get; set; }
        public string KeyId { get; set; } = "";
        public long RowCount { get; set; }
        public long FirstHourStart { get; set; }
        public long LastHourStart { get; set; }

        public ActualsReportRecord ToRecord() =>
            new(Id, PlantId, IdempotencyKey, RequestHash, At(ReceivedAt), KeyId, (int)RowCount, At(FirstHourStart), At(LastHourStart));
    }

    private sealed class ActualsHourRow
    {
        public long ReportId { get; set; }
        public string PlantId { get; set; } = "";
        public long HourStart { get; set; }
        public string RowData { get; set; } = "";
    }

    private const string AcknowledgementColumns =
        "id, plant_id, local_date, target_version, idempotency_key, request_hash, received_at, key_id, acknowledged_by, note";

    private const string ActualsReportColumns =
        "id, plant_id, idempotency_key, request_hash, received_at, key_id, row_count, first_hour_start, last_hour_start";

    // The unique (plant, idempotency key) constraint makes a retried write a no-op; the record stored
    // under the key, by this call or an earlier one, is read back in the same transaction.
    public async Task<Stored<AcknowledgementRecord>> AddAcknowledgementAsync(AcknowledgementRecord ack)
    {
        await using var connection = await OpenAsync();
        await using var transaction = await BeginWriteAsync(connection, lockTable: null);
        var inserted = await connection.ExecuteAsync(
            "INSERT INTO acknowledgements (plant_id, local_date, target_version, idempotency_key, request_hash, received_at, key_id, acknowledged_by, note) " +
            "VALUES (@PlantId, @date, @TargetVersion, @IdempotencyKey, @RequestHash, @receivedAt, @KeyId, @AcknowledgedBy, @Note) " +
            "ON CONFLICT (plant_id, idempotency_key) DO NOTHING",
            new { ack.PlantId, date = Day(ack.Date), ack.TargetVersion, ack.IdempotencyKey, ack.RequestHash, receivedAt = Ms(ack.ReceivedAt), ack.KeyId, ack.AcknowledgedBy, ack.Note },
            transaction);
        var stored = await connection.QuerySingleAsync<AcknowledgementRow>(
            $"SELECT {AcknowledgementColumns} FROM acknowledgements WHERE plant_id = @PlantId AND idempotency_key = @IdempotencyKey",
            new { ack.PlantId, ack.IdempotencyKey }, transaction);
        await transaction.CommitAsync();
        return new Stored<AcknowledgementRecord>(stored.ToRecord(), inserted == 1);
    }

    public async Task<IReadOnlyList<AcknowledgementRecord>> ListAcknowledgementsAsync(string plantId, LocalDate date)
    {
        await using var connection = await OpenAsync();
        var rows = await connection.QueryAsync<AcknowledgementRow>(
            $"SELECT {AcknowledgementColumns} FROM acknowledgements WHERE plant_id = @plantId AND local_date = @date ORDER BY id",
            new { plantId, date = Day(date) });
        return rows.Select(r => r.ToRecord()).ToList();
    }

    public async Task<Stored<ActualsReportRecord>> AddActualsAsync(ActualsReportRecord report, IReadOnlyList<ActualsHourRecord> hours)
    {
        await using var connection = await OpenAsync();
        await using var transaction = await BeginWriteAsync(connection, lockTable: null);
        var newId = await connection.QuerySingleOrDefaultAsync<long?>(
            "INSERT INTO actuals_reports (plant_id, idempotency_key, request_hash, received_at, key_id, row_count, first_hour_start, last_hour_start) " +
            "VALUES (@PlantId, @IdempotencyKey, @RequestHash, @receivedAt, @KeyId, @RowCount, @first, @last) " +
            "ON CONFLICT (plant_id, idempotency_key) DO NOTHING RETURNING id",
            new
            {
                report.PlantId, report.IdempotencyKey, report.RequestHash, receivedAt = Ms(report.ReceivedAt), report.KeyId,
                report.RowCount, first = Ms(report.FirstHourStart), last = Ms(report.LastHourStart),
            },
            transaction);
        if (newId is not null)
        {
            await connection.ExecuteAsync(
                "INSERT INTO actuals_hours (report_id, plant_id, hour_start, row_data) VALUES (@reportId, @PlantId, @hourStart, @RowJson)",
                hours.Select(h => new { reportId = newId.Value, h.PlantId, hourStart = Ms(h.HourStart), h.RowJson }),
                transaction);
        }
        var stored = await connection.QuerySingleAsync<ActualsReportRow>(
            $"SELECT {ActualsReportColumns} FROM actuals_reports WHERE plant_id = @PlantId AND idempotency_key = @IdempotencyKey",
            new { report.PlantId, report.IdempotencyKey }, transaction);
        await transaction.CommitAsync();
        return new Stored<ActualsReportRecord>(stored.ToRecord(), newId is not null);
    }

    public async Task<IReadOnlyList<ActualsHourRecord>> ListActualsAsync(string plantId, Instant from, Instant to)
    {
        await using var connection = await OpenAsync();
        var rows = await connection.QueryAsync<ActualsHourRow>(
            "SELECT h.report_id, h.plant_id, h.hour_start, h.row_data FROM actuals_hours h " +
            "WHERE h.plant_id = @plantId AND h.hour_start >= @from AND h.hour_start < @to AND h.report_id = " +
            "(SELECT MAX(l.report_id) FROM actuals_hours l WHERE l.plant_id = h.plant_id AND l.hour_start = h.hour_start) " +
            "ORDER BY h.hour_start",
            new { plantId, from = Ms(from), to = Ms(to) });
        return rows.Select(r => new ActualsHourRecord(r.ReportId, r.PlantId, At(r.HourStart), r.RowData)).ToList();
    }
}
