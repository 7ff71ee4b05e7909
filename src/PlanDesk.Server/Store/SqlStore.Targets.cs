using Dapper;
using NodaTime;

namespace PlanDesk.Server.Store;

internal abstract partial class SqlStore
{
    private sealed class PublicationRow
    {
        public long Id { get; set; }
        public long PlanId { get; set; }
        public long PublishedAt { get; set; }
        public string PublishedBy { get; set; } = "";
        public string? Note { get; set; }
    }

    private sealed class TargetRow
    {
        public string PlantId { get; set; } = "";
        public string LocalDate { get; set; } = "";
        public long Version { get; set; }
        public long PublicationId { get; set; }
        public long PlanId { get; set; }
        public long PublishedAt { get; set; }
        public string? Sheet { get; set; }

        public TargetRecord ToRecord() => new(PlantId, Day(LocalDate), (int)Version, PublicationId, PlanId, At(PublishedAt), Sheet);
    }

    private const string TargetColumns = "plant_id, local_date, version, publication_id, plan_id, published_at";

    public async Task<PublicationRecord> PublishAsync(long planId, IReadOnlyList<TargetSheetToPublish> sheets, string? note, Instant at, string keyId)
    {
        at = Stored(at);
        await using var connection = await OpenAsync();
        // One writer at a time numbers versions, so every plant-day of this publication becomes current together
        // and a publication committed later supersedes all of this one's overlapping days.
        await using var transaction = await BeginWriteAsync(connection, "targets");
        var publicationId = await connection.ExecuteScalarAsync<long>(
            "INSERT INTO publications (plan_id, published_at, published_by, note) VALUES (@planId, @at, @keyId, @note) RETURNING id",
            new { planId, at = Ms(at), keyId, note }, transaction);
        var targets = new List<TargetRecord>();
        foreach (var sheet in sheets)
        {
            var date = Day(sheet.Date);
            var version = await connection.ExecuteScalarAsync<long>(
                "SELECT COALESCE(MAX(version), 0) + 1 FROM targets WHERE plant_id = @PlantId AND local_date = @date",
                new { sheet.PlantId, date }, transaction);
            await connection.ExecuteAsync(
                "INSERT INTO targets (plant_id, local_date, version, publication_id, plan_id, published_at, sheet) " +
                "VALUES (@PlantId, @date, @version, @publicationId, @planId, @at, @SheetJson)",
                new { sheet.PlantId, date, version, publicationId, planId, at = Ms(at), sheet.SheetJson }, transaction);
            targets.Add(new TargetRecord(sheet.PlantId, sheet.Date, (int)version, publicationId, planId, at, null));
        }
        await transaction.CommitAsync();
        return new PublicationRecord(publicationId, planId, at, keyId, note, targets);
    }

    public async Task<PublicationRecord?> GetPublicationAsync(long publicationId)
    {
        await using var connection = await OpenAsync();
        var row = await connection.QuerySingleOrDefaultAsync<PublicationRow>(
            "SELECT id, plan_id, published_at, published_by, note FROM publications WHERE id = @publicationId", new { publicationId });
        if (row is null)
        {
            return null;
        }
        var targets = await connection.QueryAsync<TargetRow>(
            $"SELECT {TargetColumns} FROM targets WHERE publication_id = @publicationId ORDER BY plant_id, local_date", new { publicationId });
        return ToRecord(row, targets);
    }

    public async Task<IReadOnlyList<PublicationRecord>> ListPublicationsAsync()
    {
        await using var connection = await OpenAsync();
        var rows = await connection.QueryAsync<PublicationRow>("SELECT id, plan_id, published_at, published_by, note FROM publications ORDER BY id");
        var targets = (await connection.QueryAsync<TargetRow>($"SELECT {TargetColumns} FROM targets ORDER BY plant_id, local_date"))
            .ToLookup(t => t.PublicationId);
        return rows.Select(r => ToRecord(r, targets[r.Id])).ToList();
    }

    public async Task<TargetRecord?> GetTargetAsync(string plantId, LocalDate date, int? version, bool withSheet = true)
    {
        await using var connection = await OpenAsync();
        var row = await connection.QuerySingleOrDefaultAsync<TargetRow>(
            $"SELECT {TargetColumns}{(withSheet ? ", sheet" : "")} FROM targets WHERE plant_id = @plantId AND local_date = @date AND version = COALESCE(@version, " +
            "(SELECT MAX(version) FROM targets WHERE plant_id = @plantId AND local_date = @date))",
            new { plantId, date = Day(date), version = (long?)version });
        return row?.ToRecord();
    }

    public async Task<IReadOnlyList<TargetRecord>> ListTargetVersionsAsync(string plantId, LocalDate date)
    {
        await using var connection = await OpenAsync();
        var rows = await connection.QueryAsync<TargetRow>(
            $"SELECT {TargetColumns} FROM targets WHERE plant_id = @plantId AND local_date = @date ORDER BY version",
            new { plantId, date = Day(date) });
        return rows.Select(r => r.ToRecord()).ToList();
    }

    public async Task<(LocalDate First, LocalDate Last)?> PublishedDaysAsync(string plantId)
    {
        await using var connection = await OpenAsync();
        var range = await connection.QuerySingleAsync<(string? First, string? Last)>(
            "SELECT MIN(local_date), MAX(local_date) FROM targets WHERE plant_id = @plantId", new { plantId });
        return range.First is null || range.Last is null ? null : (Day(range.First), Day(range.Last));
    }

    private static PublicationRecord ToRecord(PublicationRow row, IEnumerable<TargetRow> targets) =>
        new(row.Id, row.PlanId, At(row.PublishedAt), row.PublishedBy, row.Note, targets.Select(t => t.ToRecord()).ToList());
}
