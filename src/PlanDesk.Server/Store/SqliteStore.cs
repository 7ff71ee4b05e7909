using System.Data.Common;
using Dapper;
using Microsoft.Data.Sqlite;

namespace PlanDesk.Server.Store;

/// <summary>The default store: one SQLite file in the data directory, in write-ahead-log mode so readers never
/// wait for the writer. SQLite allows one writer at a time, so every write transaction takes the write lock at
/// its start (BEGIN IMMEDIATE) and waits up to 30 s for it.</summary>
internal sealed class SqliteStore : SqlStore, IDisposable
{
    public const string FileName = "plandesk.db";
    private readonly string connectionString;

    public SqliteStore(string dataDirectory)
    {
        var directory = Path.GetFullPath(dataDirectory);
        Directory.CreateDirectory(directory);
        FilePath = Path.Combine(directory, FileName);
        connectionString = new SqliteConnectionStringBuilder
        {
            DataSource = FilePath,
            ForeignKeys = true,
            Pooling = true,
            DefaultTimeout = 30,
        }.ToString();
        using var connection = new SqliteConnection(connectionString);
        connection.Open();
        // WAL is a property of the file and stays set; synchronous=FULL syncs the log at every commit,
        // so an acknowledged write survives the server or the machine stopping.
        connection.Execute("PRAGMA journal_mode=WAL; PRAGMA synchronous=FULL;");
    }

    public string FilePath { get; }

    public override string Description => $"SQLite file {FilePath}";

    protected override string IdentityColumn => "INTEGER PRIMARY KEY AUTOINCREMENT";

    protected override async Task<DbConnection> OpenAsync(CancellationToken cancellation = default)
    {
        var connection = new SqliteConnection(connectionString);
        // synchronous=FULL is also the bundled SQLite's default for every new connection.
        await connection.OpenAsync(cancellation);
        return connection;
    }

    protected override Task<DbTransaction> BeginWriteAsync(DbConnection connection, string? lockTable, CancellationToken cancellation = default) =>
        Task.FromResult<DbTransaction>(((SqliteConnection)connection).BeginTransaction(deferred: false));

    protected override Task<DbTransaction> BeginMigrationAsync(DbConnection connection, CancellationToken cancellation) =>
        BeginWriteAsync(connection, null, cancellation);

    public void Dispose() => SqliteConnection.ClearAllPools();
}
