using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;
using static PlanDesk.Core.Tests.Fixtures.SmallNetwork;

namespace PlanDesk.Core.Tests.Checking;

/// <summary>Availability, secondary capacity, tank limits, demand and blend limits, broken one way at a time.</summary>
public class LimitMutationTests
{
    private static (PlanningCase Case, Plan Plan) ValidOn(Network network)
    {
        var planningCase = SmallNetwork.Case(network);
        var plan = RuleBasedBaseline.Build(planningCase);
        Assert.Empty(PlanChecker.Check(planningCase, plan).Violations);
        return (planningCase, PlanRestate.Copy(plan));
    }

    [Fact]
    public void UnitRunDuringAnOutageIsAnAvailabilityViolation()
    {
        var network = Build();
        var plant = network.Plants[0];
        var outage = network with { Plants = [plant with { Stages = [plant.Stages[0] with { AvailableUnits = Series.Constant(2) }] }] };
        var (planningCase, plan) = ValidOn(outage);
        plan.Stages[0].UnitsRunning[10] = 3;

        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan));

        ExpectViolation.Only(report, ViolationKind.UnitsAvailable, Filter.Value, 10);
    }

    [Fact]
    public void TreatingMoreThanTheSecondaryCapacityIsACapacityViolation()
    {
        var network = Build();
        var noCaps = new Permit { MaxOutfallM3PerHour = 1000 };
        var storm = network with { Plants = [network.Plants[0] with { InfluentM3PerHour = Series.Constant(900), Permit = noCaps }] };
        var (planningCase, plan) = ValidOn(storm);
        plan.Plants[0].TreatedM3[3] = 900;
        plan.Plants[0].BypassM3[3] = 0;

        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan));

        ExpectViolation.Only(report, ViolationKind.SecondaryCapacity, Norwick.Value, 3);
        Assert.Equal(100, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void SecondaryEffluentUnaccountedForIsASecondarySplitViolation()
    {
        var (planningCase, plan) = ValidOn(Build());
        plan.Plants[0].SecondaryToOutfallM3[4] += 10;

        var report = PlanChecker.Check(planningCase, PlanRestate.Costs(planningCase, plan));

        ExpectViolation.Only(report, ViolationKind.SecondarySplit, Norwick.Value, 4);
    }

    [Fact]
    public void TankDrawnBelowItsMinimumIsATankMinViolation()
    {
        var (planningCase, plan) = ValidOn(Build());
        // The filter stops at 12:00; customers keep drawing on the tank.
        var stage = plan.Stages[0];
        for (var t = 12; t < 24; t++)
        {
            stage.UnitsRunning[t] = 0;
            stage.FeedM3[t] = 0;
        }
        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan));

        var volumes = plan.Tanks.Single(k => k.Tank == ClassATank).EndVolumeM3;
        var belowMinimum = Enumerable.Range(0, volumes.Length).Where(t => volumes[t] < 200).ToList();
        Assert.NotEmpty(belowMinimum);
        Assert.Equal(belowMinimum, report.Violations.Select(v => v.Period!.Value));
        Assert.All(report.Violations, v => Assert.Equal((ViolationKind.TankMin, ClassATank.Value), (v.Kind, v.Where)));
    }

    [Fact]
    public void TankFilledAboveItsMaximumIsATankMaxViolation()
    {
        var (planningCase, plan) = ValidOn(Build());
        var stage = plan.Stages[0];
        // Three units at full flow from 08:00 on fill the 2 500 m3 tank, starting from 900 m3.
        for (var t = 8; t < 24; t++)
        {
            stage.UnitsRunning[t] = 3;
            stage.FeedM3[t] = 360;
        }

        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan));

        Assert.NotEmpty(report.Violations);
        Assert.All(report.Violations, v => Assert.Equal((ViolationKind.TankMax, ClassATank.Value), (v.Kind, v.Where)));
        var first = report.Violations[0];
        Assert.True(plan.Tanks[0].EndVolumeM3[first.Period!.Value] > 2500 && plan.Tanks[0].EndVolumeM3[first.Period.Value - 1] <= 2500);
    }

    [Fact]
    public void ShortfallThatDoesNotCloseTheDemandIsADemandBalanceViolation()
    {
        var (planningCase, plan) = ValidOn(Build());
        plan.Customers.Single(c => c.Customer == Orchard).ShortfallM3[8] = 25;

        var report = PlanChecker.Check(planningCase, PlanRestate.Costs(planningCase, plan));

        ExpectViolation.Only(report, ViolationKind.DemandBalance, Orchard.Value, 8);
    }

    [Fact]
    public void BlendAboveTheCustomersLimitIsABlendViolation()
    {
        var network = Build();
        var blended = network with
        {
            Pipelines = [.. network.Pipelines, new Pipeline(new PipelineId("norwick-c-to-park"), "Norwick class C to Mere Park", ClassCTank, PipelineEnd.ToCustomer(Park), 200, 0.05, Norwick, null)],
            Customers = [network.Customers[0], network.Customers[1] with { Blend = new BlendLimit("conductivityUsPerCm", 1100) }],
        };
        var (planningCase, plan) = ValidOn(blended);
        var fromA = plan.Pipelines.Single(l => l.Pipeline == ToPark);
        var fromC = plan.Pipelines.Single(l => l.Pipeline.Value == "norwick-c-to-park");
        // 60 m3 at 900 µS/cm and 60 m3 at 1 500 µS/cm blend to 1 200 µS/cm against a limit of 1 100.
        fromA.FlowM3[22] = 60;
        fromA.PumpsRunning![22] = 1;
        fromC.FlowM3[22] = 60;

        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan));

        ExpectViolation.Only(report, ViolationKind.BlendLimit, Park.Value, 22);
        Assert.Equal(100, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void NegativeFlowIsANegativeValueViolation()
    {
        var (planningCase, plan) = ValidOn(Build());
        plan.Pipelines.Single(l => l.Pipeline == WrongClassToOrchard).FlowM3[2] = -5;
        plan.Pipelines.Single(l => l.Pipeline == ReservoirToOrchard).FlowM3[2] += 5;

        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan));

        ExpectViolation.Only(report, ViolationKind.NegativeValue, WrongClassToOrchard.Value, 2);
    }
}
