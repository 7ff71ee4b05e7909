using System.CommandLine;

namespace PlanDesk.Cli;

/// <summary>The table of contents of the <c>plandesk</c> command: one line per subcommand, each in its own file.</summary>
internal static class Commands
{
    public static IEnumerable<Command> All() =>
    [
        ValidateCommand.Create(),
        SolveCommand.Create(),
        CheckCommand.Create(),
        GenerateCommand.Create(),
        BenchCommand.Create(),
        BenchOneCommand.Create(),
        ServeCommand.Create(),
        KeysCommand.Create(),
        NetworksCommand.Create(),
        LoadTestCommand.Create(),
    ];
}
