using System.CommandLine;
using PlanDesk.Core.Generation;

namespace PlanDesk.Cli;

internal static class GenerateCommand
{
    public static Command Create()
    {
        var size = new Option<string>("--size") { Description = $"Region size: {RegionSize.Names}.", DefaultValueFactory = _ => "S" };
        var seed = new Option<int>("--seed") { Description = "Seed; the same size and seed always give the same region.", DefaultValueFactory = _ => 1 };
        var output = new Option<DirectoryInfo>("--out") { Description = "Directory to write network.json into.", Required = true };
        var command = new Command("generate", "Write a realistic invented region of the given size as a network file, for trials and benchmarks.")
        {
            size, seed, output,
        };
        command.SetAction(parse =>
        {
            var sizeName = parse.GetValue(size)!;
            var regionSize = RegionSize.Parse(sizeName);
            if (regionSize is null)
            {
                Console.Error.WriteLine($"--size: '{sizeName}' is not a region size; use one of {RegionSize.Names}");
                return 2;
            }
            var directory = parse.GetValue(output)!;
            var region = RegionGenerator.Generate(regionSize, parse.GetValue(seed));
            string path;
            try
            {
                path = NetworkFileWriter.WriteToDirectory(region, directory.FullName);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                Console.Error.WriteLine($"--out: cannot write into {directory.FullName}: {e.Message}; choose a directory you can write to");
                return 2;
            }
            var network = region.Network;
            Console.WriteLine($"wrote {path}");
            Console.WriteLine($"  {network.Plants.Count} plants, {network.Stages.Count()} stages, {network.Tanks.Count} tanks, " +
                $"{network.Pipelines.Count} pipelines, {network.Customers.Count} customers, {network.Tariffs.Count} tariffs");
            Console.WriteLine($"  default horizon: {network.DefaultStartDate:yyyy-MM-dd}, {network.DefaultDays} day(s)");
            return 0;
        });
        return command;
    }
}
