using System.Text.Json.Nodes;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>The optional penalty prices: read back as given, defaults when left out, bad values named by place.</summary>
public class PenaltyFieldTests
{
    [Fact]
    public void TankLimitPenaltyIsReadFromTheNetworkFile()
    {
        var result = LoadChanged(n => n["penalties"] = new JsonObject { ["tankLimitPerM3"] = 25.5, ["tankEndDeficitPerM3"] = 0.7 });

        Assert.True(result.Network is not null, string.Join("\n", result.Problems));
        Assert.Equal((25.5, 0.7), (result.Network.Penalties.TankLimitPerM3, result.Network.Penalties.TankEndDeficitPerM3));
    }

    [Fact]
    public void TankLimitPenaltyLeftOutKeepsItsDefaultOfTen()
    {
        var result = LoadChanged(n => n["penalties"] = new JsonObject { ["bypassPerM3"] = 6 });

        Assert.True(result.Network is not null, string.Join("\n", result.Problems));
        Assert.Equal((10.0, 6.0), (result.Network.Penalties.TankLimitPerM3, result.Network.Penalties.BypassPerM3));
    }

    [Fact]
    public void NegativeTankLimitPenaltyIsRejectedAtItsField()
    {
        var result = LoadChanged(n => n["penalties"] = new JsonObject { ["tankLimitPerM3"] = -3 });

        Assert.Contains("-3 is below the minimum 0", ProblemAt(result, "$.penalties.tankLimitPerM3").What);
    }

    [Fact]
    public void TankLimitPenaltyThatIsNotANumberIsRejectedAtItsField()
    {
        var result = LoadChanged(n => n["penalties"] = new JsonObject { ["tankLimitPerM3"] = "ten" });

        var problem = ProblemAt(result, "$.penalties.tankLimitPerM3");
        Assert.Contains("number", problem.ToString());
        Assert.StartsWith("networks/variant.json: $.penalties.tankLimitPerM3", problem.ToString());
    }
}
