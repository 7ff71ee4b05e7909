using System.Reflection;
using Npgsql;
using PlanDesk.Server.Store;
using Xunit.Sdk;

namespace PlanDesk.Server.Tests.Infrastructure;

public enum StoreKind
{
    Sqlite,
    Postgres,
}

/// <summary>Runs a store theory on SQLite.</summary>
public sealed class OnSqliteAttribute : DataAttribute
{
    public override IEnumerable<object[]> GetData(MethodInfo testMethod) => [[StoreKind.Sqlite]];
}

/// <summary>Runs a store theory on PostgreSQL. Never passes silently: without PLANDESK_TEST_POSTGRES the test fails
/// saying how to provide one, unless PLANDESK_SKIP_POSTGRES=1 marks it skipped.</summary>
public sealed class OnPostgresAttribute : DataAttribute
{
    public OnPostgresAttribute()
    {
        Skip = PostgresDatabase.SkipReason;
    }

    public override IEnumerable<object[]> GetData(MethodInfo testMethod) => [[StoreKind.Postgres]];
}

/// <summary>A fact that needs PostgreSQL, with the same rule as <see cref="OnPostgresAttribute"/>.</summary>
public sealed class PostgresFactAttribute : FactAttribute
{
    public PostgresFactAttribute()
    {
        Skip = PostgresDatabase.SkipReason;
    }
}

/// <summary>A fresh, empty place for one test's data: a temporary directory, or a schema of its own in the test database.</summary>
public sealed class TestDatabase : IDisposable
{
    private readonly string? directory;
    private readonly string? schema;

    private TestDatabase(StoreKind kind, string? directory, string? schema, string? connection)
    {
        Kind = kind;
        this.directory = directory;
        this.schema = schema;
        Settings = new StoreSettings(directory, connection);
    }

    public StoreKind Kind { get; }
    public StoreSettings Settings { get; }
    public string? DataDirectory => directory;

    public static TestDatabase Create(StoreKind kind)
    {
        if (kind == StoreKind.Sqlite)
        {
            var path = Path.Combine(Path.GetTempPath(), "plandesk-test-" + Guid.NewGuid().ToString("N"));
            Directory.CreateDirectory(path);
            return new TestDatabase(kind, path, null, null);
        }
        var schema = "t_" + Guid.NewGuid().ToString("N");
        PostgresDatabase.Execute($"CREATE SCHEMA {schema}");
        var connection = new NpgsqlConnectionStringBuilder(PostgresDatabase.ConnectionString) { SearchPath = schema }.ToString();
        return new TestDatabase(kind, null, schema, connection);
    }

    public void Dispose()
    {
        if (directory is not null)
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            try
            {
                Directory.Delete(directory, recursive: true);
            }
            catch (IOException)
            {
                // A killed child process may still be releasing the file; the temp folder is cleaned by the OS.
            }
        }
        if (schema is not null)
        {
            PostgresDatabase.Execute($"DROP SCHEMA IF EXISTS {schema} CASCADE");
        }
    }
}

/// <summary>The PostgreSQL server the tests use, from PLANDESK_TEST_POSTGRES (see .ci/start-postgres.sh).</summary>
public static class PostgresDatabase
{
    public const string ConnectionVariable = "PLANDESK_TEST_POSTGRES";
    public const string SkipVariable = "PLANDESK_SKIP_POSTGRES";

    public static string? SkipReason =>
        Environment.GetEnvironmentVariable(SkipVariable) == "1" && string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable(ConnectionVariable))
            ? $"{SkipVariable}=1: the PostgreSQL variant of this test was skipped on purpose"
            : null;

    public static string ConnectionString =>
        Environment.GetEnvironmentVariable(ConnectionVariable) is { Length: > 0 } value
            ? value
            : throw new InvalidOperationException(
                $"{ConnectionVariable} is not set, so the PostgreSQL variant of this test cannot run. Start PostgreSQL with .ci/start-postgres.sh and set " +
                $"{ConnectionVariable}=\"Host=127.0.0.1;Port=5432;Username=plandesk;Password=plandesk;Database=plandesk_test\", " +
                $"or set {SkipVariable}=1 to skip the PostgreSQL variants deliberately.");

    public static void Execute(string sql)
    {
        using var connection = new NpgsqlConnection(ConnectionString);
        connection.Open();
        using var command = new NpgsqlCommand(sql, connection);
        command.ExecuteNonQuery();
    }
}
