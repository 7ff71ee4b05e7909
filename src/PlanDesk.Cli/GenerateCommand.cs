using System.CommandLine;
using PlanDesk.Core.Generation;

namespace PlanDesk.Cli;

/// <summary><c>plandesk generate --size L --seed 7 --out DIR</c>: writes an invented region as DIR/network.json.</summary>
internal static class GenerateCommand
{
    public static Command Create()
    {
        var size = new Option<string>("--size") { Description = $"Region size: {RegionSize.Names}.", DefaultValueFactory = _ => "S" };
        var seed = new Option<int>("--seed") { Description = "Seed; the same size and seed always give the same region.", DefaultValueFactory = _ => 1 };
        var output = new Option<string>("--out") { Description = "Directory to write network.json into (created when missing).", Required = true };
        var command = new Command("generate", "Write a realistic invented region of the given size as a network file, for trials and benchmarks.")
        {
            size, seed, output,
        };
        command.SetAction(parse => Run(parse.GetValue(size)!, parse.GetValue(seed), parse.GetValue(output)!, Console.Out, Console.Error));
        return command;
    }

    /// <summary>Generates and writes the region; returns 0 on success, 2 for a bad size or an unwritable directory.</summary>
    public static int Run(string sizeName, int seed, string directory, TextWriter output, TextWriter error)
    {
        if (RegionSize.Parse(sizeName) is not { } regionSize)
        {
            error.WriteLine($"--size: '{sizeName}' is not a region size; use one of {RegionSize.Names}");
            return 2;
        }
        var region = RegionGenerator.Generate(regionSize, seed);
        string path;
        try
        {
            path = NetworkFileWriter.WriteToDirectory(region, directory);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"--out: cannot write into {Path.GetFullPath(directory)}: {e.Message}; choose a directory you can write to");
            return 2;
        }
        var network = region.Network;
        output.WriteLine($"wrote {path}");
        output.WriteLine($"  {network.Plants.Count} plants, {network.Stages.Count()} stages, {network.Tanks.Count} tanks, " +
            $"{network.Pipelines.Count} pipelines, {network.Customers.Count} customers, {network.Tariffs.Count} tariffs");
        output.WriteLine($"  default horizon: {network.DefaultStartDate:yyyy-MM-dd}, {network.DefaultDays} day(s)");
        output.WriteLine("  check it with: plandesk validate " + path);
        return 0;
    }
}
