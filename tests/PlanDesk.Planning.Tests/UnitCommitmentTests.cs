using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>Start-up costs and minimum run times shape when units run.</summary>
public class UnitCommitmentTests
{
    // One unit that runs at exactly 100 m3/h (min = max) for 1 kWh/m3 fills an empty tank; a customer is owed 400 m3
    // over the day. Energy costs 50 EUR/MWh in hours 2, 3, 20 and 21 and 200 EUR/MWh otherwise.
    private static PlanningCase TwoWindowCase(double startupCost, double minRunHours)
    {
        var stage = Build.Stage("filter", "store", maxFlowM3PerHour: 100, minFlowM3PerHour: 100, energyKWhPerM3: 1) with
        {
            StartupCost = startupCost,
            MinRunHours = minRunHours,
        };
        var network = Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(200, 50, 2, 3, 20, 21)),
            [Build.Plant(influentM3PerHour: 500, stages: [stage])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.DailyCustomer("farm", 400)]);
        return Build.Case(network);
    }

    // Hand working: free starts and no minimum run: run the four cheap hours, 400 × 0.05 = 20 EUR, two starts.
    [Fact]
    public void FreeStartsFollowTheCheapHours()
    {
        var plan = Build.Solve(TwoWindowCase(startupCost: 0, minRunHours: 0));

        Assert.Equal(20.0, plan.Costs.Total, 20.0 * 0.001);
        var units = plan.StagePlan(new StageId("filter")).UnitsRunning;
        Assert.Equal([2, 3, 20, 21], Enumerable.Range(0, 24).Where(t => units[t] == 1));
        Assert.Equal(2, plan.StagePlan(new StageId("filter")).UnitStarts.Sum());
    }

    // Hand working: a 4-hour minimum run. Two runs make 800 m3 (400 dear) for 100 EUR; one run of 4 hours that takes
    // in one cheap window makes 200 m3 at 0.05 + 200 m3 at 0.20 = 50 EUR. Optimum 50 EUR: one start, 4 hours in a row.
    [Fact]
    public void MinimumRunTimeKeepsOneLongerRun()
    {
        var plan = Build.Solve(TwoWindowCase(startupCost: 0, minRunHours: 4));

        Assert.Equal(50.0, plan.Costs.Total, 50.0 * 0.001);
        var stage = plan.StagePlan(new StageId("filter"));
        Assert.Equal(1, stage.UnitStarts.Sum());
        var running = Enumerable.Range(0, 24).Where(t => stage.UnitsRunning[t] == 1).ToList();
        Assert.Equal(4, running.Count);
        Assert.Equal(3, running[^1] - running[0]);
    }

    // Hand working: a start costs 40 EUR and there is no minimum run. Two runs in the cheap hours: 20 + 80 = 100 EUR;
    // one run of 4 hours with one cheap window: 50 + 40 = 90 EUR. Optimum 90 EUR with one start.
    [Fact]
    public void StartUpCostMergesRuns()
    {
        var plan = Build.Solve(TwoWindowCase(startupCost: 40, minRunHours: 0));

        Assert.Equal(90.0, plan.Costs.Total, 90.0 * 0.001);
        Assert.Equal(40.0, plan.Costs.UnitStarts, 1e-6);
        Assert.Equal(1, plan.StagePlan(new StageId("filter")).UnitStarts.Sum());
    }

    // The unit already runs before the horizon and starting costs 40 EUR. Hand working: keeping it running from hour 0
    // needs no start, so one run of hours 0-3 costs 2 × 20 + 2 × 5 = 50 EUR with no start-up; stopping and
    // restarting would add 40 EUR. Optimum 50 EUR, no starts.
    [Fact]
    public void UnitRunningBeforeTheHorizonNeedsNoStart()
    {
        var baseCase = TwoWindowCase(startupCost: 40, minRunHours: 0);
        var plant = baseCase.Network.Plants[0];
        var running = plant with { Stages = [plant.Stages[0] with { InitialUnitsRunning = 1 }] };
        var plan = Build.Solve(Build.Case(baseCase.Network with { Plants = [running] }));

        Assert.Equal(50.0, plan.Costs.Total, 50.0 * 0.001);
        Assert.Equal(0, plan.StagePlan(new StageId("filter")).UnitStarts.Sum());
        Assert.Equal(1, plan.StagePlan(new StageId("filter")).UnitsRunning[0]);
    }
}
