using System.Data.Common;
using Dapper;
using NodaTime;
using NodaTime.Text;

namespace PlanDesk.Server.Store;

/// <summary>
/// The store's SQL, shared by SQLite and PostgreSQL: plain SQL both accept (INSERT ... ON CONFLICT DO NOTHING,
/// RETURNING, BIGINT and TEXT columns). Subclasses supply connections, the auto-numbered key column, and
/// the locks that serialise writers which number versions.
/// </summary>
internal abstract partial class SqlStore : IPlanDeskStore
{
    static SqlStore()
    {
        DefaultTypeMap.MatchNamesWithUnderscores = true;
    }

    public abstract string Description { get; }

    /// <summary>Column definition of an auto-numbered BIGINT primary key.</summary>
    protected abstract string IdentityColumn { get; }

    protected abstract Task<DbConnection> OpenAsync(CancellationToken cancellation = default);

    /// <summary>Begins a write transaction; with <paramref name="lockTable"/> it holds that table's write lock until it ends,
    /// so two writers numbering versions of the same thing are serialised.</summary>
    protected abstract Task<DbTransaction> BeginWriteAsync(DbConnection connection, string? lockTable, CancellationToken cancellation = default);

    /// <summary>Begins the transaction migrations run in, holding a lock that keeps any other process migrating the
    /// same database waiting until it ends (two servers may start at once).</summary>
    protected abstract Task<DbTransaction> BeginMigrationAsync(DbConnection connection, CancellationToken cancellation);

    public async Task MigrateAsync(CancellationToken cancellation = default)
    {
        await using var connection = await OpenAsync(cancellation);
        await using var transaction = await BeginMigrationAsync(connection, cancellation);
        await connection.ExecuteAsync(Migrations.CreateMigrationsTable, transaction: transaction);
        var applied = (await connection.QueryAsync<long>("SELECT version FROM schema_migrations", transaction: transaction)).ToHashSet();
        foreach (var step in Migrations.All.Where(s => !applied.Contains(s.Version)).OrderBy(s => s.Version))
        {
            await connection.ExecuteAsync(step.Sql.Replace("{id}", IdentityColumn), transaction: transaction);
            await connection.ExecuteAsync(
                "INSERT INTO schema_migrations (version, name, applied_at) VALUES (@Version, @Name, @At)",
                new { step.Version, step.Name, At = SystemClock.Instance.GetCurrentInstant().ToUnixTimeMilliseconds() },
                transaction);
        }
        await transaction.CommitAsync(cancellation);
    }

    public async Task<IReadOnlyList<int>> AppliedMigrationsAsync()
    {
        await using var connection = await OpenAsync();
        var versions = await connection.QueryAsync<long>("SELECT version FROM schema_migrations ORDER BY version");
        return versions.Select(v => (int)v).ToList();
    }

    protected static long Ms(Instant instant) => instant.ToUnixTimeMilliseconds();

    protected static long? Ms(Instant? instant) => instant?.ToUnixTimeMilliseconds();

    /// <summary>The instant as the store keeps it (whole milliseconds), so an answer built before reading back equals one read later.</summary>
    protected static Instant Stored(Instant instant) => At(Ms(instant));

    protected static Instant At(long ms) => Instant.FromUnixTimeMilliseconds(ms);

    protected static Instant? At(long? ms) => ms is null ? null : Instant.FromUnixTimeMilliseconds(ms.Value);

    protected static string Day(LocalDate date) => LocalDatePattern.Iso.Format(date);

    protected static LocalDate Day(string text) => LocalDatePattern.Iso.Parse(text).Value;
}
