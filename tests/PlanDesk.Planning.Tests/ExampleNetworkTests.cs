using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>The example networks shipped in networks/ solve with the product's defaults.</summary>
public class ExampleNetworkTests
{
    private static PlanningCase LoadDefaultHorizon(string fileName)
    {
        var loaded = NetworkLoader.Load(Repository.Network(fileName));
        Assert.True(loaded.Succeeded, string.Join("\n", loaded.Problems));
        var network = loaded.Network!;
        var created = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays);
        Assert.True(created.Succeeded, string.Join("\n", created.Problems));
        return created.Case!;
    }

    // quickstart.json: one plant, one filter/UV stage, one tank, one orchard owed 2 400 m3 between 21:00 and 07:00
    // through a 260 m3/h pipeline. Hand working: the window has 10 hours × 260 = 2 600 m3 ≥ 2 400, the tank starts
    // with 900 m3 and the stage can make up to 3 × 120 × 0.97 m3/h, so the volume is delivered in full; the daily
    // N cap (160 kg) is met even at standard (about 11 000 m3 × 12 mg/L = 135 kg), so no problem is reported.
    [Fact]
    public void QuickstartSolvesWithNoProblems()
    {
        var planningCase = LoadDefaultHorizon("quickstart.json");

        var plan = Planner.Solve(planningCase, new SolveOptions());

        Assert.Contains(plan.Solve.Status, new[] { SolveStatus.Optimal, SolveStatus.Feasible });
        Assert.Empty(plan.Problems);
        Assert.Equal(2400.0, plan.CustomerPlan(new CustomerId("hollins-orchard")).DeliveredM3.Sum(), 1e-3);
        Assert.Equal(new LevelId("standard"), plan.Plants[0].LevelByDay[0]);
        Assert.True(plan.Solve.GapPercent <= 0.5 + 1e-9);
        Assert.Equal(plan.Solve.Objective, plan.Costs.Total, 1e-6 * Math.Max(1, plan.Solve.Objective));
        Assert.Equal(24, Assert.Single(PlantDayTargetsBuilder.Build(planningCase, plan)).Hours.Count);
    }
}
