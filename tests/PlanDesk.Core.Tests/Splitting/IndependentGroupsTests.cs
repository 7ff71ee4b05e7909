using PlanDesk.Core.Generation;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Splitting;

/// <summary>
/// How a network falls apart into groups of plants that nothing joins. The demo region's working: dunmarrow and
/// ambrook both feed the gorsebrow reservoir (and both serve hollowfield-coop), tessford and whinlow each have only
/// their own tanks and customers: three groups.
/// </summary>
public class IndependentGroupsTests
{
    private static Network Load(string fileName)
    {
        var result = NetworkLoader.Load(Path.Combine(TestNetworks.NetworksFolder, fileName));
        Assert.True(result.Network is not null, string.Join("\n", result.Problems));
        return result.Network!;
    }

    [Fact]
    public void DemoRegionFallsIntoThreeGroupsNamedByTheirPlants()
    {
        var groups = IndependentGroups.Of(Load("demo-region.json"));

        Assert.Equal(
            [["dunmarrow", "ambrook"], ["tessford"], ["whinlow"]],
            groups.Select(g => g.Plants.Select(p => p.Value).ToArray()).ToArray());
        Assert.Equal([1, 2, 3], groups.Select(g => g.Number));
        Assert.Contains(new TankId("gorsebrow-reservoir"), groups[0].Tanks);
        Assert.Contains(new CustomerId("hollowfield-coop"), groups[0].Customers);
        Assert.Equal(["tessford-gardens", "tessford-sports"], groups[1].Customers.Select(c => c.Value));
        Assert.Equal("group 1 (plants dunmarrow, ambrook)", groups[0].Label);
    }

    [Fact]
    public void QuickstartNetworkIsOneGroupHoldingEverything()
    {
        var network = Load("quickstart.json");

        var groups = IndependentGroups.Of(network);

        var group = Assert.Single(groups);
        Assert.Equal(network.Plants.Select(p => p.Id), group.Plants);
        Assert.Equal(network.Tanks.Select(t => t.Id), group.Tanks);
        Assert.Equal(network.Pipelines.Select(l => l.Id), group.Pipelines);
        Assert.Equal(network.Customers.Select(c => c.Id), group.Customers);
    }

    [Fact]
    public void GeneratedXlRegionHasTwelveGroupsWithEveryElementInExactlyOne()
    {
        var network = RegionGenerator.Generate(RegionSize.XL, 1).Network;

        var groups = IndependentGroups.Of(network);

        Assert.Equal([1, 1, 1, 1, 1, 1, 1, 3, 5, 5, 12, 18], groups.Select(g => g.Plants.Count).Order());
        Assert.Equal(network.Plants.Select(p => p.Id).OrderBy(id => id.ToString()), groups.SelectMany(g => g.Plants).OrderBy(id => id.ToString()));
        Assert.Equal(network.Tanks.Select(t => t.Id).OrderBy(id => id.ToString()), groups.SelectMany(g => g.Tanks).OrderBy(id => id.ToString()));
        Assert.Equal(network.Pipelines.Select(l => l.Id).OrderBy(id => id.ToString()), groups.SelectMany(g => g.Pipelines).OrderBy(id => id.ToString()));
        Assert.Equal(network.Customers.Select(c => c.Id).OrderBy(id => id.ToString()), groups.SelectMany(g => g.Customers).OrderBy(id => id.ToString()));
        AssertNothingCrossesGroups(network, groups);
    }

    [Fact]
    public void CustomerNoPlantReachesGoesWithTheFirstGroup()
    {
        var network = Load("demo-region.json");
        var stranded = network.Customers[^1] with { Id = new CustomerId("stranded-farm"), Name = "Stranded Farm" };
        network = network with { Customers = [.. network.Customers, stranded] };

        var groups = IndependentGroups.Of(network);

        Assert.Equal(3, groups.Count);
        Assert.Contains(stranded.Id, groups[0].Customers);
        Assert.Equal(1, groups.Count(g => g.Customers.Contains(stranded.Id)));
    }

    [Fact]
    public void SubnetworkHoldsExactlyTheGroupsElementsInNetworkOrder()
    {
        var network = Load("demo-region.json");
        var group = IndependentGroups.Of(network)[0];

        var part = IndependentGroups.Subnetwork(network, group);

        Assert.Equal(group.Plants, part.Plants.Select(p => p.Id));
        Assert.Equal(group.Tanks, part.Tanks.Select(t => t.Id));
        Assert.Equal(group.Pipelines, part.Pipelines.Select(l => l.Id));
        Assert.Equal(group.Customers, part.Customers.Select(c => c.Id));
        Assert.Equal(network.Classes, part.Classes);
        Assert.Equal(network.Tariffs, part.Tariffs);
        Assert.Equal(network.Name, part.Name);
    }

    // Every link the model has between elements stays inside one group.
    private static void AssertNothingCrossesGroups(Network network, IReadOnlyList<PlantGroup> groups)
    {
        int Of<T>(T id, Func<PlantGroup, IReadOnlyList<T>> members) => groups.Single(g => members(g).Contains(id)).Number;
        foreach (var stage in network.Stages)
        {
            Assert.Equal(Of(stage.Plant, g => g.Plants), Of(stage.ProductTank, g => g.Tanks));
            if (stage.FeedTank is { } feed)
            {
                Assert.Equal(Of(stage.Plant, g => g.Plants), Of(feed, g => g.Tanks));
            }
        }
        foreach (var tank in network.Tanks.Where(t => t.Plant is not null))
        {
            Assert.Equal(Of(tank.Plant!.Value, g => g.Plants), Of(tank.Id, g => g.Tanks));
        }
        foreach (var pipeline in network.Pipelines)
        {
            var group = Of(pipeline.Id, g => g.Pipelines);
            Assert.Equal(group, Of(pipeline.From, g => g.Tanks));
            Assert.Equal(group, Of(pipeline.PoweredBy, g => g.Plants));
            Assert.Equal(group, pipeline.To.Tank is { } tank ? Of(tank, g => g.Tanks) : Of(pipeline.To.Customer!.Value, g => g.Customers));
        }
    }
}
