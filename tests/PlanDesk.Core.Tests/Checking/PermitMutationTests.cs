using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Tests.Fixtures;
using static PlanDesk.Core.Tests.Fixtures.SmallNetwork;

namespace PlanDesk.Core.Tests.Checking;

/// <summary>Load caps, concentration limits and outfall flow: a valid plan checked against a tighter permit, or run
/// at a level the permit forbids, shows exactly the broken limit.</summary>
public class PermitMutationTests
{
    [Fact]
    public void DayAboveTheDailyNitrogenCapIsADailyCapViolationOfThatSize()
    {
        var loose = SmallNetwork.Case();
        var plan = RuleBasedBaseline.Build(loose);
        var loadKg = PlanCosting.Compute(loose, plan).Plants[SmallNetwork.Norwick].TotalNitrogen.KgByDay[0];
        var tight = SmallNetwork.Case(WithPermit(p => p with { DailyTotalNitrogenKg = loadKg - 10 }));

        var report = PlanChecker.Check(tight, PlanRestate.Costs(tight, plan));

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.DailyNitrogenCap, SmallNetwork.Norwick.Value, Start), (found.Kind, found.Where, found.Day));
        Assert.Equal(10, found.Amount, 6);
        Assert.True(found.Penalised);
    }

    [Fact]
    public void MonthToDateLoadCountsInTheStartMonthOnly()
    {
        // Horizon 31 March and 1 April: the month-to-date load belongs to March; April starts from zero.
        var marchEnd = new NodaTime.LocalDate(2027, 3, 31);
        var loose = SmallNetwork.Case(start: marchEnd, days: 2);
        var plan = RuleBasedBaseline.Build(loose);
        var load = PlanCosting.Compute(loose, plan).Plants[SmallNetwork.Norwick].TotalNitrogen;
        const double monthToDateKg = 3000;
        var capKg = monthToDateKg + load.KgByDay[0] - 14;
        Assert.True(monthToDateKg + load.KgByDay[1] > capKg, "the test needs April to break the cap if month-to-date were wrongly added");
        var tight = SmallNetwork.Case(WithPermit(p => p with { MonthlyTotalNitrogenKg = capKg, MonthToDateTotalNitrogenKg = monthToDateKg }), marchEnd, 2);

        var report = PlanChecker.Check(tight, PlanRestate.Costs(tight, plan));

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.MonthlyNitrogenCap, marchEnd), (found.Kind, found.Day));
        Assert.Equal(14, found.Amount, 6);
    }

    [Fact]
    public void LevelAboveTheConcentrationLimitsIsAConcentrationViolationForNitrogenAndPhosphorus()
    {
        var planningCase = SmallNetwork.Case();
        var plan = PlanRestate.Copy(RuleBasedBaseline.Build(planningCase));
        var levels = plan.Plants[0].LevelByDay.ToArray();
        levels[0] = new LevelId("loose"); // 18 mg/L TN and 2.5 mg/L TP against limits of 15 and 2

        var report = PlanChecker.Check(planningCase, PlanRestate.Flows(planningCase, plan with { Plants = [plan.Plants[0] with { LevelByDay = levels }] }));

        Assert.Equal(2, report.Violations.Count);
        Assert.All(report.Violations, v => Assert.Equal((ViolationKind.ConcentrationLimit, SmallNetwork.Norwick.Value, Start), (v.Kind, v.Where, v.Day)));
        Assert.Equal([3.0, 0.5], report.Violations.Select(v => Math.Round(v.Amount, 6)));
    }

    [Fact]
    public void OutfallAboveThePermittedFlowIsAnOutfallViolationInEachPeriodAboveIt()
    {
        var loose = SmallNetwork.Case();
        var plan = RuleBasedBaseline.Build(loose);
        var p = plan.Plants[0];
        var filter = plan.Stages[0];
        // Outfall = secondary effluent to the outfall + 3 % filter reject + bypass, worked out here by hand.
        var outfall = Enumerable.Range(0, loose.PeriodCount).Select(t => p.SecondaryToOutfallM3[t] + 0.03 * filter.FeedM3[t] + p.BypassM3[t]).ToArray();
        var limit = outfall.Max() - 5;
        var tight = SmallNetwork.Case(WithPermit(permit => permit with { MaxOutfallM3PerHour = limit }));

        var report = PlanChecker.Check(tight, PlanRestate.Costs(tight, plan));

        var expected = Enumerable.Range(0, outfall.Length).Where(t => outfall[t] > limit).ToList();
        Assert.NotEmpty(expected);
        Assert.Equal(expected, report.Violations.Select(v => v.Period!.Value));
        Assert.All(report.Violations, v => Assert.Equal((ViolationKind.OutfallFlow, 5.0), (v.Kind, Math.Round(v.Amount, 6))));
    }
}
