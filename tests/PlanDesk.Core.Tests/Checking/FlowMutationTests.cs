using PlanDesk.Core.Model;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;
using static PlanDesk.Core.Tests.Fixtures.SmallNetwork;

namespace PlanDesk.Core.Tests.Checking;

/// <summary>
/// Each test breaks a valid plan of the small network one way, restates everything that follows from the
/// broken decision, and expects the checker to name exactly that rule, place and period.
/// </summary>
public class FlowMutationTests
{
    private readonly PlanningCase _case = SmallNetwork.Case();

    private Plan Valid()
    {
        var plan = RuleBasedBaseline.Build(_case);
        Assert.Empty(PlanChecker.Check(_case, plan).Violations);
        return PlanRestate.Copy(plan);
    }

    [Fact]
    public void FeedAboveTheRunningUnitsCapacityIsAStageFlowViolation()
    {
        var plan = Valid();
        var stage = plan.Stages.Single(s => s.Stage == Filter);
        stage.UnitsRunning[10] = 1;
        stage.FeedM3[10] = 150; // one unit carries at most 120 m3/h

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        ExpectViolation.Only(report, ViolationKind.StageFlowMax, Filter.Value, 10);
        Assert.Equal(30, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void FlowAbovePipelineCapacityIsAPipelineCapacityViolation()
    {
        var plan = Valid();
        plan.Pipelines.Single(l => l.Pipeline == ToReservoir).FlowM3[5] = 250; // capacity 200 m3/h

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        ExpectViolation.Only(report, ViolationKind.PipelineCapacity, ToReservoir.Value, 5);
        Assert.Equal(50, report.Violations[0].Amount, 6);
        Assert.Equal(200, report.Violations[0].Limit);
    }

    [Fact]
    public void WaterAppearingInATankIsATankBalanceViolationInThatPeriodOnly()
    {
        var plan = Valid();
        var volumes = plan.Tanks.Single(k => k.Tank == ClassATank).EndVolumeM3;
        for (var t = 7; t < volumes.Length; t++)
        {
            volumes[t] += 40;
        }

        var report = PlanChecker.Check(_case, PlanRestate.Costs(_case, plan));

        ExpectViolation.Only(report, ViolationKind.TankBalance, ClassATank.Value, 7);
        Assert.Equal(40, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void UnitStoppedBeforeItsMinimumRunIsAMinimumRunViolationWhileItShouldStillRun()
    {
        var plan = Valid();
        var stage = plan.Stages.Single(s => s.Stage == Filter);
        // Units 2 → 0 → 1 → 0 → 2: the unit started at 12 must run until 14 (3 h); the units restarted at 14 are fine.
        int[] units = [0, 1, 0];
        for (var i = 0; i < 3; i++)
        {
            stage.UnitsRunning[11 + i] = units[i];
            stage.FeedM3[11 + i] = units[i] * 100;
        }

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        Assert.All(report.Violations, v => Assert.Equal((ViolationKind.MinimumRun, Filter.Value), (v.Kind, v.Where)));
        Assert.Equal([13, 14], report.Violations.Select(v => v.Period!.Value));
    }

    [Fact]
    public void ClassCWaterSentToAClassACustomerIsAClassRuleViolation()
    {
        var plan = Valid();
        plan.Pipelines.Single(l => l.Pipeline == ReservoirToOrchard).FlowM3[9] -= 60;
        plan.Pipelines.Single(l => l.Pipeline == WrongClassToOrchard).FlowM3[9] = 60;

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        ExpectViolation.Only(report, ViolationKind.ClassRule, WrongClassToOrchard.Value, 9);
        Assert.Equal(60, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void StartsCountedBelowTheRiseInUnitsIsAStartsViolation()
    {
        var plan = Valid();
        var stage = plan.Stages.Single(s => s.Stage == Filter);
        Assert.Equal(1, stage.UnitStarts[21]);
        stage.UnitStarts[21] = 0;

        var report = PlanChecker.Check(_case, PlanRestate.Costs(_case, plan));

        ExpectViolation.Only(report, ViolationKind.UnitStarts, Filter.Value, 21);
    }

    [Fact]
    public void DeliveryOutsideTheAllowedHoursIsADeliveryWindowViolation()
    {
        var plan = Valid();
        // A scheduler moves the park's pumping from 06:00 to 12:00, outside its 21:00-07:00 window.
        var park = plan.Pipelines.Single(l => l.Pipeline == ToPark);
        (park.FlowM3[12], park.FlowM3[6]) = (park.FlowM3[6], 0);
        (park.PumpsRunning![12], park.PumpsRunning[6]) = (park.PumpsRunning[6], 0);

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        ExpectViolation.Only(report, ViolationKind.DeliveryWindow, Park.Value, 12);
    }

    [Fact]
    public void PumpingMovedWithinTheAllowedHoursStillPasses()
    {
        var plan = Valid();
        var park = plan.Pipelines.Single(l => l.Pipeline == ToPark);
        park.FlowM3[5] += park.FlowM3[6];
        park.FlowM3[6] = 0;
        park.PumpsRunning![5] = 2;
        park.PumpsRunning[6] = 0;

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        Assert.Empty(report.Violations);
    }

    [Fact]
    public void PumpsCarryingLessThanTheirLeastFlowIsAPumpFlowViolation()
    {
        var plan = Valid();
        var park = plan.Pipelines.Single(l => l.Pipeline == ToPark);
        park.PumpsRunning![22] = 2; // two pumps need at least 100 m3/h
        park.FlowM3[22] = 90;

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        ExpectViolation.Only(report, ViolationKind.PumpFlow, ToPark.Value, 22);
        Assert.Equal(10, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void DeliveryNotMatchingPipelinesIsADeliveryBalanceViolation()
    {
        var plan = Valid();
        var orchard = plan.Customers.Single(c => c.Customer == Orchard);
        orchard.DeliveredM3[3] -= 20;
        orchard.ShortfallM3[3] += 20;

        var report = PlanChecker.Check(_case, PlanRestate.Costs(_case, plan));

        ExpectViolation.Only(report, ViolationKind.DeliveryBalance, Orchard.Value, 3);
    }
}
