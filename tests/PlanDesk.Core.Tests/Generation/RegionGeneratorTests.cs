using PlanDesk.Core.Generation;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Generation;

public class RegionGeneratorTests
{
    public static TheoryData<string> SizeNames => new(RegionSize.All.Select(s => s.Name));

    [Fact]
    public void SameSizeAndSeedGiveTheSameFileText()
    {
        var first = RegionGenerator.Generate(RegionSize.M, 42);
        var second = RegionGenerator.Generate(RegionSize.M, 42);

        Assert.Equal(NetworkFileWriter.Write(first.Network, first.Heads), NetworkFileWriter.Write(second.Network, second.Heads));
    }

    [Fact]
    public void DifferentSeedsGiveDifferentRegions()
    {
        var first = RegionGenerator.Generate(RegionSize.S, 1);
        var second = RegionGenerator.Generate(RegionSize.S, 2);

        Assert.NotEqual(NetworkFileWriter.Write(first.Network, first.Heads), NetworkFileWriter.Write(second.Network, second.Heads));
        Assert.NotEqual(first.Network.Plants.Select(p => p.Id), second.Network.Plants.Select(p => p.Id));
    }

    [Theory]
    [MemberData(nameof(SizeNames))]
    public void EachSizeHasItsStatedPlantsCustomersAndHorizon(string sizeName)
    {
        var size = RegionSize.Parse(sizeName)!;
        var network = RegionGenerator.Generate(size, 7).Network;

        var (plants, customers, hours) = sizeName switch
        {
            "S" => (3, 8, 24),
            "M" => (5, 20, 168),
            "L" => (10, 40, 168),
            _ => (50, 200, 168),
        };
        Assert.Equal(plants, network.Plants.Count);
        Assert.Equal(customers, network.Customers.Count);
        Assert.Equal(hours, network.DefaultDays * 24);
        Assert.NotNull(network.DefaultStartDate);
    }

    [Theory]
    [MemberData(nameof(SizeNames))]
    public void DefaultHorizonResolvesIntoAPlanningCase(string sizeName)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(sizeName)!, 3).Network;

        var result = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays);

        Assert.Empty(result.Problems);
        Assert.True(result.Succeeded);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void IdsAreUniqueAcrossTheWholeNetwork(int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.XL, seed).Network;

        var ids = network.Classes.Select(c => c.Id.Value)
            .Concat(network.Tariffs.Select(t => t.Id.Value))
            .Concat(network.Plants.Select(p => p.Id.Value))
            .Concat(network.Stages.Select(s => s.Id.Value))
            .Concat(network.Tanks.Select(t => t.Id.Value))
            .Concat(network.Pipelines.Select(p => p.Id.Value))
            .Concat(network.Customers.Select(c => c.Id.Value))
            .ToList();

        Assert.Empty(ids.GroupBy(id => id).Where(g => g.Count() > 1).Select(g => g.Key));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    public void RegionsOfEveryBuildingBlockAreDrawn(int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.L, seed).Network;

        Assert.InRange(network.Tariffs.Count, 2, 3);
        Assert.Contains(network.Tariffs, t => t.Price is TimeOfUsePrice);
        Assert.Contains(network.Tariffs, t => t.Price is SeriesPrice);
        Assert.All(network.Tariffs, t => Assert.True(t.DemandChargePerKwMonth > 0));
        Assert.All(network.Plants, p => Assert.InRange(p.Levels.Count, 2, 3));
        Assert.Contains(network.Stages, s => s.NutrientRejectionFraction > 0);
        Assert.Contains(network.Stages, s => s.ProducesClass == new ClassId("A"));
        Assert.Contains(network.Plants, p => p.Biogas is not null);
        Assert.Contains(network.Tanks, t => t.Plant is null);
        Assert.Contains(network.Customers, c => c.Demand is HourlyDemand);
        Assert.Contains(network.Customers, c => c.Demand is DailyDemand);
        Assert.All(network.Plants, p => Assert.NotNull(p.Permit.DailyTotalNitrogenKg));
        Assert.All(network.Plants, p => Assert.NotNull(p.Permit.MonthlyTotalNitrogenKg));
    }

    [Fact]
    public void SomeSeedsGiveFarmsASalinityLimitWithMembraneWaterToBlendIn()
    {
        var blended = Enumerable.Range(1, 5)
            .Select(seed => RegionGenerator.Generate(RegionSize.L, seed).Network)
            .SelectMany(n => n.Customers.Where(c => c.Blend is not null).Select(c => (Network: n, Customer: c)))
            .ToList();

        Assert.NotEmpty(blended);
        Assert.All(blended, b =>
        {
            var sources = b.Network.Pipelines.Where(p => p.To.Customer == b.Customer.Id).Select(p => b.Network.Tank(p.From).Class).ToList();
            var best = sources.Min(c => b.Network.Class(c).Quality[b.Customer.Blend!.Parameter]);
            Assert.True(best < b.Customer.Blend!.Max, $"{b.Customer.Id} cannot meet its blend limit from {string.Join(", ", sources)}");
        });
    }
}
