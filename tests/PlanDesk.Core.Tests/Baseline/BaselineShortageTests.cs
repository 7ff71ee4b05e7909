using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Tests.Fixtures;
using static PlanDesk.Core.Tests.Fixtures.SmallNetwork;

namespace PlanDesk.Core.Tests.Baseline;

/// <summary>When water is short the baseline rations it by contract priority and keeps to the units' rules.</summary>
public class BaselineShortageTests
{
    // The filter loses two of its three units: 120 m3/h × 0.97 of product against 150 m3/h for the orchard
    // (through the reservoir) and 120 m3/h for the park at night.
    private static PlanningCase Outage()
    {
        var network = Build();
        var plant = network.Plants[0];
        var stage = plant.Stages[0] with { AvailableUnits = Series.Constant(1), InitialUnitsRunning = 1 };
        return SmallNetwork.Case(network with { Plants = [plant with { Stages = [stage] }] });
    }

    [Fact]
    public void ShortWaterGoesToTheHigherPriorityCustomerFirst()
    {
        var planningCase = Outage();

        var plan = RuleBasedBaseline.Build(planningCase);

        var orchard = plan.Problems.Where(p => p.Kind == ProblemKinds.Shortfall && p.Where == Orchard.Value).Sum(p => p.Amount);
        var park = plan.Problems.Where(p => p.Kind == ProblemKinds.Shortfall && p.Where == Park.Value).Sum(p => p.Amount);
        Assert.True(park > orchard, $"the park (priority 2) should be shorter than the orchard (priority 1): {park} vs {orchard}");
        Assert.Empty(PlanChecker.Check(planningCase, plan).HardViolations);
    }

    [Fact]
    public void UnitsNeverExceedAvailabilityAndStartedUnitsRunTheirMinimumTime()
    {
        var network = Build();
        var plant = network.Plants[0];
        // Demand that comes and goes: the orchard takes water only from 08:00 to 12:00.
        var orchard = network.Customers[0] with
        {
            Demand = new HourlyDemand(new StepSeries(network.TimeZone.AtStartOfDay(Start).ToInstant(), NodaTime.Duration.FromHours(1),
                Enumerable.Range(0, 24).Select(h => h is >= 8 and < 12 ? 150.0 : 0).ToList())),
        };
        var stage = plant.Stages[0] with { InitialUnitsRunning = 0, MinRunHours = 3 };
        var planningCase = SmallNetwork.Case(network with { Plants = [plant with { Stages = [stage] }], Customers = [orchard, network.Customers[1]] });

        var plan = RuleBasedBaseline.Build(planningCase);

        var report = PlanChecker.Check(planningCase, plan);
        Assert.DoesNotContain(report.Violations, v => v.Kind is ViolationKind.MinimumRun or ViolationKind.UnitsAvailable or ViolationKind.UnitStarts);
        Assert.Empty(report.Violations);
        Assert.Contains(plan.Stages[0].UnitStarts, s => s > 0);
    }
}
