using System.CommandLine;

namespace PlanDesk.Cli;

internal static class ValidateCommand
{
    public static Command Create()
    {
        var network = new Argument<FileInfo>("NETWORK") { Description = "The network file (JSON)." };
        var command = new Command("validate", "Check a network file and print a summary, or every problem found.") { network };
        command.SetAction(parse =>
        {
            var file = parse.GetValue(network)!;
            Console.WriteLine($"would validate {file.FullName}");
            return 0;
        });
        return command;
    }
}
