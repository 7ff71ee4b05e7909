using System.CommandLine;
using PlanDesk.Cli;

var root = new RootCommand("PlanDesk: hour-by-hour plans for reclaimed-water networks of several treatment plants.");
foreach (var command in Commands.All())
{
    root.Subcommands.Add(command);
}
return await root.Parse(args).InvokeAsync();
