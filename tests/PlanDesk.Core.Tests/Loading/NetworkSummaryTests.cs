using System.Text.Json.Nodes;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Loading;

public class NetworkSummaryTests
{
    [Fact]
    public void QuickstartSummaryCountsItsPartsAndTotalsDemandByClass()
    {
        var summary = NetworkSummary.Of(NetworkLoader.Load(QuickstartPath).Network!);

        Assert.Equal((1, 1, 1, 0, 1, 1), (summary.Plants, summary.Stages, summary.Tanks, summary.Reservoirs, summary.Pipelines, summary.Customers));
        var demand = Assert.Single(summary.DemandByClass);
        Assert.Equal(new ClassId("A"), demand.Class);
        Assert.Equal(2400, demand.VolumeM3, 6); // one day of Hollins Orchard's 2 400 m3 daily volume
    }

    [Fact]
    public void SeriesRangeIsWhereEverySteppedSeriesOverlaps()
    {
        var result = LoadChanged(n =>
        {
            Customer(n).Remove("dailyVolume");
            Customer(n)["demandM3PerHour"] = JsonNode.Parse(
                """{ "start": "2027-03-26T06:00", "stepMinutes": 60, "values": [100, 100, 100, 100, 100, 100] }""");
            n.Remove("horizon");
        });
        var network = Assert.IsType<Network>(result.Network);

        var summary = NetworkSummary.Of(network);

        // influent covers 00:00-24:00 local, the demand 06:00-12:00: they share 06:00-12:00 (UTC+1).
        Assert.Equal(NodaTime.Instant.FromUtc(2027, 3, 26, 5, 0), summary.SeriesStart);
        Assert.Equal(NodaTime.Instant.FromUtc(2027, 3, 26, 11, 0), summary.SeriesEnd);
    }
}
