using PlanDesk.Core.Generation;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Generation;

/// <summary>The written network file is what the generator built: loaded back, it is the same network.</summary>
public sealed class GeneratedFileRoundTripTests : IDisposable
{
    private readonly string directory = Path.Combine(Path.GetTempPath(), "plandesk-generate-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(directory))
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    public static TheoryData<string, int> Regions => new()
    {
        { "S", 1 }, { "S", 2 }, { "M", 3 }, { "L", 4 }, { "XL", 5 },
    };

    [Theory]
    [MemberData(nameof(Regions))]
    public void WrittenFileLoadsWithoutProblems(string size, int seed)
    {
        var region = RegionGenerator.Generate(RegionSize.Parse(size)!, seed);
        var path = NetworkFileWriter.WriteToDirectory(region, directory);

        var loaded = NetworkLoader.Load(path);

        Assert.Empty(loaded.Problems.Select(p => p.ToString()));
        Assert.NotNull(loaded.Network);
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void LoadedFileIsTheGeneratedNetworkInSubstance(string size, int seed)
    {
        var region = RegionGenerator.Generate(RegionSize.Parse(size)!, seed);
        var path = NetworkFileWriter.WriteToDirectory(region, directory);

        var loaded = NetworkLoader.Load(path).Network!;

        // Written the same way (energy per m3 instead of head, which the model does not keep), the two
        // networks give the same text: every field the format carries survived the trip.
        Assert.Equal(NetworkFileWriter.Write(region.Network), NetworkFileWriter.Write(loaded));
        Assert.All(loaded.Pipelines, p => Assert.Equal(region.Network.Pipelines.Single(q => q.Id == p.Id).EnergyKWhPerM3, p.EnergyKWhPerM3, 12));
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void LoadedFileResolvesTheSameSeriesOntoTheDefaultHorizon(string size, int seed)
    {
        var region = RegionGenerator.Generate(RegionSize.Parse(size)!, seed);
        var loaded = NetworkLoader.Load(NetworkFileWriter.WriteToDirectory(region, directory)).Network!;
        var start = region.Network.DefaultStartDate!.Value;

        var fromMemory = PlanningCase.Create(region.Network, start, region.Network.DefaultDays).Case!;
        var fromFile = PlanningCase.Create(loaded, loaded.DefaultStartDate!.Value, loaded.DefaultDays).Case!;

        Assert.Equal(fromMemory.PeriodCount, fromFile.PeriodCount);
        Assert.All(region.Network.Plants, p =>
        {
            Assert.Equal(fromMemory.InfluentM3[p.Id], fromFile.InfluentM3[p.Id]);
            Assert.Equal(fromMemory.ImportPricePerMWh[p.Id], fromFile.ImportPricePerMWh[p.Id]);
        });
        Assert.All(region.Network.Customers, c => Assert.Equal(fromMemory.MaxDeliveryM3[c.Id], fromFile.MaxDeliveryM3[c.Id]));
    }
}
