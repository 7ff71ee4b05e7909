using System.CommandLine;
using PlanDesk.Server.Store;

namespace PlanDesk.Cli;

/// <summary>The --data-dir / --postgres pair shared by the commands that open the service's store.</summary>
internal sealed class StoreOptions
{
    public Option<DirectoryInfo?> DataDir { get; } = new("--data-dir")
    {
        Description = $"Directory of the SQLite store (default ./{StoreSettings.DefaultDataDirectory}).",
    };

    public Option<string?> Postgres { get; } = new("--postgres")
    {
        Description = "PostgreSQL connection string, e.g. \"Host=127.0.0.1;Username=plandesk;Password=...;Database=plandesk\"; used instead of SQLite.",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(DataDir);
        command.Options.Add(Postgres);
        command.Validators.Add(result =>
        {
            if (result.GetValue(DataDir) is not null && !string.IsNullOrWhiteSpace(result.GetValue(Postgres)))
            {
                result.AddError("Give either --data-dir (SQLite) or --postgres (PostgreSQL), not both.");
            }
        });
    }

    public StoreSettings Read(ParseResult parse) => new(parse.GetValue(DataDir)?.FullName, parse.GetValue(Postgres));
}
