namespace PlanDesk.Server.Store;

/// <summary>Where the service keeps its data: a data directory for SQLite, or a PostgreSQL connection string.</summary>
public sealed record StoreSettings(string? DataDirectory, string? PostgresConnection)
{
    public const string DefaultDataDirectory = "plandesk-data";
    public const string DataDirectoryKey = "PlanDesk:DataDir";
    public const string PostgresKey = "PlanDesk:Postgres";

    public static StoreSettings From(IConfiguration configuration) =>
        new(configuration[DataDirectoryKey], configuration[PostgresKey]);

    /// <summary>A PostgreSQL store when a connection string is given, else SQLite in the data directory
    /// (<c>./plandesk-data</c> by default). The caller applies the migrations.</summary>
    public IPlanDeskStore CreateStore() =>
        !string.IsNullOrWhiteSpace(PostgresConnection)
            ? new PostgresStore(PostgresConnection)
            : new SqliteStore(string.IsNullOrWhiteSpace(DataDirectory) ? DefaultDataDirectory : DataDirectory);
}
