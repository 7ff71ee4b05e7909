using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>Blended quality, priorities and shortfalls in plain words.</summary>
public class CustomerTests
{
    // A class-B customer takes 100 m3/h with conductivity at most 1 000 uS/cm, from a class-A tank (800 uS/cm, pumping
    // 1 kWh/m3) and a class-B tank (1 500 uS/cm, no pumping); both tanks hold plenty; energy 100 EUR/MWh; no end penalty.
    // Hand working: -200 fA + 500 fB ≤ 0 and fA + fB = 100 give fA ≥ 100 / 1.4 = 71.43 m3/h, so
    // 24 × 71.43 kWh × 0.10 EUR/kWh = 171.43 EUR. Without the limit all water would come from B for 0 EUR.
    [Theory]
    [InlineData(true, 171.4286)]
    [InlineData(false, 0.0)]
    public void BlendingLimitNeedsTheBetterWater(bool withLimit, double expectedCost)
    {
        var customer = Build.HourlyCustomer("park", 100, @class: "B") with
        {
            Blend = withLimit ? new BlendLimit("conductivityUsPerCm", 1000) : null,
        };
        var network = Build.Network(
            Build.FlatTariff(100),
            [Build.Plant()],
            tanks: [Build.Tank("good", "A", initialM3: 10_000), Build.Tank("plain", "B", initialM3: 10_000)],
            pipelines: [Build.ToCustomer("from-good", "good", "park", energyKWhPerM3: 1), Build.ToCustomer("from-plain", "plain", "park")],
            customers: [customer],
            classes: [Build.ClassA, Build.ClassB],
            penalties: new Penalties { TankEndDeficitPerM3 = 0 });

        var plan = Build.Solve(Build.Case(network));

        Assert.Equal(expectedCost, plan.Costs.Total, Math.Max(expectedCost * 0.001, 1e-6));
        Assert.Equal(2400.0, plan.Customers[0].DeliveredM3.Sum(), 1e-3);
        if (withLimit)
        {
            Assert.All(plan.PipelinePlan(new PipelineId("from-good")).FlowM3, f => Assert.Equal(100 / 1.4, f, 1e-3));
        }
    }

    // A tank holds 1 000 m3 and nothing refills it; two customers are each owed 800 m3: "orchard" (priority 1,
    // 5 EUR/m3 short) and "golf" (priority 2, 1 EUR/m3 short); ending below the start costs 0.5 EUR/m3.
    // Hand working: using a m3 saves at least 1 − 0.5 EUR, so all 1 000 m3 are delivered; the orchard gets its 800,
    // golf 200 and is short 600: 600 × 1 + 1 000 × 0.5 = 1 100 EUR.
    [Fact]
    public void ShortageFallsOnTheLowerPriorityCustomer()
    {
        var network = Build.Network(
            Build.FlatTariff(100),
            [Build.Plant()],
            tanks: [Build.Tank("store", initialM3: 1000)],
            pipelines: [Build.ToCustomer("to-orchard", "store", "orchard"), Build.ToCustomer("to-golf", "store", "golf")],
            customers: [Build.DailyCustomer("orchard", 800, shortfallPenaltyPerM3: 5), Build.DailyCustomer("golf", 800, shortfallPenaltyPerM3: 1, priority: 2)]);

        var plan = Build.Solve(Build.Case(network));

        Assert.Equal(1100.0, plan.Costs.Total, 1100.0 * 0.001);
        Assert.Equal(0.0, plan.CustomerPlan(new CustomerId("orchard")).ShortfallM3[0], 1e-6);
        Assert.Equal(600.0, plan.CustomerPlan(new CustomerId("golf")).ShortfallM3[0], 1e-6);
        var shortfall = Assert.Single(plan.Problems, p => p.Kind == "shortfall");
        Assert.StartsWith("customer golf short 600 m3 of class A on 2027-03-24: the water that could reach it went to higher-priority customers (orchard)",
            shortfall.Message);
    }

    // The only stage that makes class-A water is out of service all day (0 of 2 units). Hand working: the customer gets
    // nothing (the tank is empty), short 24 × 50 = 1 200 m3, and the message says why.
    [Fact]
    public void ShortfallNamesTheStageOutage()
    {
        var stage = Build.Stage("filter", "store", units: 2) with { AvailableUnits = Series.Constant(0) };
        var network = Build.Network(
            Build.FlatTariff(100),
            [Build.Plant(influentM3PerHour: 500, stages: [stage])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "ridge-farm")],
            customers: [Build.HourlyCustomer("ridge-farm", 50) with { Name = "Ridge Farm" }]);

        var plan = Build.Solve(Build.Case(network));

        var shortfall = Assert.Single(plan.Problems);
        Assert.Equal(1200.0, shortfall.Amount, 1e-6);
        Assert.Equal("customer Ridge Farm short 1 200 m3 of class A on 2027-03-24: every stage that makes its water is out of service " +
                     "(filter: 0 of 2 units available)", shortfall.Message);
    }

    // Hand working: the customer is short in every hour, so one more m3 demanded costs its shortfall penalty, 10 EUR/m3.
    [Fact]
    public void MarginalWaterCostOfAShortCustomerIsItsPenalty()
    {
        var network = Build.Network(
            Build.FlatTariff(100),
            [Build.Plant()],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.HourlyCustomer("farm", 50, shortfallPenaltyPerM3: 10)]);

        var plan = Build.Solve(Build.Case(network));

        Assert.All(plan.MarginalWaterCosts, m => Assert.Equal(10.0, m.CostPerM3, 1e-6));
        Assert.Equal(24, plan.MarginalWaterCosts.Count);
    }

    // A pipeline with two pumps of 20-80 m3/h each serves customers from a full tank.
    // Hand working: 50 m3/h needs one pump (20 ≤ 50 ≤ 80) and is delivered in full; 10 m3/h is below one pump's
    // minimum and a delivery may not exceed the demand, so the customer is short 24 × 10 = 240 m3, and the message
    // names the pumps.
    [Theory]
    [InlineData(50.0, 0.0)]
    [InlineData(10.0, 240.0)]
    public void DiscretePumpsCarryBetweenTheirMinimumAndMaximum(double demandM3PerHour, double expectedShortM3)
    {
        var pipeline = Build.ToCustomer("main", "store", "farm") with { Pumps = new PumpSet(2, 20, 80) };
        var network = Build.Network(
            Build.FlatTariff(100),
            [Build.Plant()],
            tanks: [Build.Tank("store", initialM3: 10_000)],
            pipelines: [pipeline],
            customers: [Build.HourlyCustomer("farm", demandM3PerHour)],
            penalties: new Penalties { TankEndDeficitPerM3 = 0 });

        var plan = Build.Solve(Build.Case(network));

        Assert.Equal(expectedShortM3, plan.CustomerPlan(new CustomerId("farm")).ShortfallM3.Sum(), 1e-6);
        var pumps = plan.PipelinePlan(new PipelineId("main")).PumpsRunning!;
        Assert.All(pumps, n => Assert.Equal(expectedShortM3 > 0 ? 0 : 1, n));
        if (expectedShortM3 > 0)
        {
            Assert.EndsWith("the pumps of pipeline main cannot deliver less than 20 m3/h", Assert.Single(plan.Problems).Message);
        }
    }
}
