using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Core.Tests.Checking;

/// <summary>A plan that does not cover the network or the horizon gives violations, never exceptions.</summary>
public class PlanShapeTests
{
    private readonly PlanningCase _case = SmallNetwork.Case();

    private Plan Valid() => PlanRestate.Copy(RuleBasedBaseline.Build(_case));

    [Fact]
    public void MissingStageEntryIsReportedAndTheCostIsNotRecomputed()
    {
        var plan = Valid() with { Stages = [] };

        var report = PlanChecker.Check(_case, plan);

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.MissingEntry, SmallNetwork.Filter.Value), (found.Kind, found.Where));
        Assert.Null(report.RecomputedCosts);
    }

    [Fact]
    public void EntryForAnElementNotInTheNetworkIsReported()
    {
        var plan = Valid();
        var extra = plan.Tanks[0] with { Tank = new TankId("nowhere") };

        var report = PlanChecker.Check(_case, plan with { Tanks = [.. plan.Tanks, extra] });

        Assert.Equal((ViolationKind.UnknownEntry, "nowhere"), (report.Violations[0].Kind, report.Violations[0].Where));
    }

    [Fact]
    public void DuplicatedEntryIsReported()
    {
        var plan = Valid();

        var report = PlanChecker.Check(_case, plan with { Customers = [.. plan.Customers, plan.Customers[0]] });

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.DuplicateEntry, SmallNetwork.Orchard.Value), (found.Kind, found.Where));
    }

    [Fact]
    public void ArrayShorterThanTheHorizonIsAnArrayLengthViolation()
    {
        var plan = Valid();
        var tank = plan.Tanks[0] with { EndVolumeM3 = plan.Tanks[0].EndVolumeM3[..20] };

        var report = PlanChecker.Check(_case, plan with { Tanks = [tank, .. plan.Tanks.Skip(1)] });

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.ArrayLength, tank.Tank.Value, 4.0), (found.Kind, found.Where, found.Amount));
    }

    [Fact]
    public void MissingArrayIsAnArrayLengthViolation()
    {
        var plan = Valid();
        var pipeline = plan.Pipelines.Single(l => l.Pipeline == SmallNetwork.ToPark) with { PumpsRunning = null };

        var report = PlanChecker.Check(_case, plan with { Pipelines = [.. plan.Pipelines.Where(l => l.Pipeline != SmallNetwork.ToPark), pipeline] });

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.ArrayLength, SmallNetwork.ToPark.Value), (found.Kind, found.Where));
    }

    [Fact]
    public void NotANumberIsANotFiniteViolation()
    {
        var plan = Valid();
        plan.Plants[0].ImportKWh[7] = double.NaN;

        var report = PlanChecker.Check(_case, plan);

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.NotFinite, SmallNetwork.Norwick.Value), (found.Kind, found.Where));
    }

    [Fact]
    public void LevelThePlantDoesNotHaveIsAnUnknownLevelViolation()
    {
        var plan = Valid();
        var plant = plan.Plants[0] with { LevelByDay = [new LevelId("extreme")] };

        var report = PlanChecker.Check(_case, plan with { Plants = [plant] });

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.UnknownLevel, SmallNetwork.Start), (found.Kind, found.Day));
    }

    [Fact]
    public void PlanForAnotherHorizonIsAHorizonMismatch()
    {
        var twoDays = SmallNetwork.Case(days: 2);

        var report = PlanChecker.Check(twoDays, Valid());

        Assert.NotEmpty(report.Violations);
        Assert.All(report.Violations, v => Assert.Equal(ViolationKind.HorizonMismatch, v.Kind));
    }

    [Fact]
    public void NullListsAndSectionsAreViolationsNotExceptions()
    {
        // What a JSON file with "plants": null, "tanks": null, "solve": null and "costs": null deserialises to.
        var plan = Valid() with { Plants = null!, Tanks = null!, Solve = null!, Costs = null! };

        var report = PlanChecker.Check(_case, plan);

        Assert.Contains(report.Violations, v => v.Kind == ViolationKind.MissingEntry && v.Where == SmallNetwork.Norwick.Value);
        Assert.Contains(report.Violations, v => v.Kind == ViolationKind.MissingEntry && v.Where == SmallNetwork.Reservoir.Value);
        Assert.Equal(2, report.Violations.Count(v => v.Where == "plan"));
        Assert.Null(report.RecomputedCosts);
    }

    [Fact]
    public void PlanWithoutDecisionsIsANoPlanViolation()
    {
        var plan = Valid() with { Solve = new SolveInfo { Status = SolveStatus.NoPlan }, Plants = [], Stages = [] };

        var report = PlanChecker.Check(_case, plan);

        Assert.Equal(ViolationKind.NoPlan, Assert.Single(report.Violations).Kind);
    }
}
