using System.Text.Json;
using PlanDesk.Core.Generation;

namespace PlanDesk.Cli.Tests;

public sealed class GenerateCommandTests : IDisposable
{
    private readonly string directory = Path.Combine(Path.GetTempPath(), "plandesk-generate-cli-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(directory))
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    [Fact]
    public void GenerateWritesNetworkJsonWithTheSizesCounts()
    {
        var output = new StringWriter();

        var exit = GenerateCommand.Run("L", 7, directory, output, new StringWriter());

        Assert.Equal(0, exit);
        using var file = JsonDocument.Parse(File.ReadAllText(Path.Combine(directory, "network.json")));
        Assert.Equal(10, file.RootElement.GetProperty("plants").GetArrayLength());
        Assert.Equal(40, file.RootElement.GetProperty("customers").GetArrayLength());
        Assert.Equal(7, file.RootElement.GetProperty("horizon").GetProperty("days").GetInt32());
        Assert.Contains("network.json", output.ToString());
    }

    [Fact]
    public void GeneratedFileIsTheWriterOutputForThatSizeAndSeed()
    {
        GenerateCommand.Run("s", 3, directory, new StringWriter(), new StringWriter());

        var region = RegionGenerator.Generate(RegionSize.S, 3);
        Assert.Equal(NetworkFileWriter.Write(region.Network, region.Heads), File.ReadAllText(Path.Combine(directory, "network.json")));
    }

    [Theory]
    [InlineData("S", 11)]
    [InlineData("XL", 12)]
    public void GeneratedFilePassesValidate(string size, int seed)
    {
        GenerateCommand.Run(size, seed, directory, new StringWriter(), new StringWriter());
        var output = new StringWriter();

        var exit = ValidateCommand.Run(Path.Combine(directory, "network.json"), output);

        Assert.True(exit == 0, output.ToString());
        Assert.Contains("valid.", output.ToString());
    }

    [Fact]
    public void UnknownSizeIsRefusedWithTheSizesThatExist()
    {
        var error = new StringWriter();

        var exit = GenerateCommand.Run("XXL", 1, directory, new StringWriter(), error);

        Assert.Equal(2, exit);
        Assert.Contains("'XXL' is not a region size; use one of S, M, L, XL", error.ToString());
        Assert.False(Directory.Exists(directory));
    }
}
