using PlanDesk.Core.Plans;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>A tank lets a stage make water in cheap hours for use in dear ones.</summary>
public class StorageShiftTests
{
    // One filter stage (1 kWh/m3, at most 100 m3/h) fills a tank that starts empty; a customer takes 50 m3/h all day.
    // Energy costs 50 EUR/MWh in hours 0-5 and 200 EUR/MWh otherwise.
    // Hand working: the day needs 24 × 50 = 1 200 m3. Hours 0-5 can make at most 6 × 100 = 600 m3 at 0.05 EUR/m3 = 30 EUR;
    // by the end of hour 5 the customer has taken only 300 m3, so the tank never runs dry. The other 600 m3 must be made
    // in dear hours at 0.20 EUR/m3 = 120 EUR. Optimum 150 EUR. Making water as it is taken would cost
    // 300 × 0.05 + 900 × 0.20 = 195 EUR.
    private static PlanDesk.Core.Model.PlanningCase ShiftCase()
    {
        var network = Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(200, 50, 0, 1, 2, 3, 4, 5)),
            [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 1)])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.HourlyCustomer("farm", 50)]);
        return Build.Case(network);
    }

    [Fact]
    public void StageMakesWaterInCheapHoursThroughTheTank()
    {
        var plan = Build.Solve(ShiftCase());

        Assert.Equal(SolveStatus.Optimal, plan.Solve.Status);
        Assert.Equal(150.0, plan.Costs.Total, 150.0 * 0.001);
        Assert.Equal(150.0, plan.Solve.Objective, 150.0 * 0.001);
        var feed = plan.StagePlan(new("filter")).FeedM3;
        Assert.All(feed.Take(6), f => Assert.Equal(100.0, f, 1e-6));
        Assert.Equal(1200.0, feed.Sum(), 1e-3);
        Assert.Empty(plan.Problems);
    }

    // Hand working for the dual: the cheap hours are used up, so one more m3 taken in any hour is made in a dear hour
    // at 1 kWh × 0.20 EUR/kWh = 0.20 EUR/m3.
    [Fact]
    public void MarginalWaterCostIsTheDearHourEnergy()
    {
        var plan = Build.Solve(ShiftCase());

        Assert.Equal(24, plan.MarginalWaterCosts.Count);
        Assert.All(plan.MarginalWaterCosts, m => Assert.Equal(0.20, m.CostPerM3, 1e-6));
    }

    // Hand working: in hours 0-5 the only unit runs at its 100 m3/h maximum: the stage binds there and only there
    // (dear-hour production can sit below capacity: 600 m3 over 18 hours).
    [Fact]
    public void StageAtFullFlowInCheapHoursIsABindingLimit()
    {
        var plan = Build.Solve(ShiftCase());

        var stageLimit = Assert.Single(plan.BindingLimits, b => b.Kind == "stageCapacity");
        Assert.Equal("filter", stageLimit.Where);
        Assert.Equal(0, stageLimit.Period);
        Assert.Contains("00:00–06:00", stageLimit.Message);
    }
}
