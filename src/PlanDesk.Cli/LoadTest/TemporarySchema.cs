using Npgsql;

namespace PlanDesk.Cli.LoadTest;

/// <summary>A schema of its own in a PostgreSQL database for one load test, dropped with everything in it afterwards.</summary>
internal sealed class TemporarySchema : IAsyncDisposable
{
    private readonly string adminConnection;
    private readonly string name;

    private TemporarySchema(string adminConnection, string name)
    {
        this.adminConnection = adminConnection;
        this.name = name;
        ConnectionString = new NpgsqlConnectionStringBuilder(adminConnection) { SearchPath = name }.ToString();
    }

    public string ConnectionString { get; }

    public static async Task<TemporarySchema> CreateAsync(string connection)
    {
        var schema = new TemporarySchema(connection, "loadtest_" + Guid.NewGuid().ToString("N"));
        await schema.ExecuteAsync($"CREATE SCHEMA {schema.name}");
        return schema;
    }

    public async ValueTask DisposeAsync()
    {
        NpgsqlConnection.ClearAllPools();
        await ExecuteAsync($"DROP SCHEMA IF EXISTS {name} CASCADE");
    }

    private async Task ExecuteAsync(string sql)
    {
        await using var connection = new NpgsqlConnection(adminConnection);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        await command.ExecuteNonQueryAsync();
    }
}
