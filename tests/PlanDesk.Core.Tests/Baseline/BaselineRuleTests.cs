using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Tests.Fixtures;
using static PlanDesk.Core.Tests.Fixtures.SmallNetwork;

namespace PlanDesk.Core.Tests.Baseline;

/// <summary>The operator rules the baseline follows, each seen in a plan of the small network or an example network.</summary>
public class BaselineRuleTests
{
    [Fact]
    public void BaselineOfTheSmallNetworkPassesTheCheckerAndNamesNoProblem()
    {
        var planningCase = SmallNetwork.Case();

        var plan = RuleBasedBaseline.Build(planningCase);

        Assert.Empty(PlanChecker.Check(planningCase, plan).Violations.Select(v => v.Message));
        Assert.Empty(plan.Problems);
        Assert.Equal(("rules", "feasible"), (plan.Method, plan.Solve.Status));
    }

    [Theory]
    [InlineData("quickstart.json")]
    [InlineData("demo-region.json")]
    public void BaselineOfAnExampleNetworkPassesTheChecker(string file)
    {
        var network = NetworkLoader.Load(Path.Combine(TestNetworks.NetworksFolder, file)).Network!;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;

        var plan = RuleBasedBaseline.Build(planningCase);

        Assert.Empty(PlanChecker.Check(planningCase, plan).Violations.Select(v => v.Message));
    }

    [Fact]
    public void ProductionFollowsTheDrawSoTheTankStaysAtItsStartLevel()
    {
        var plan = RuleBasedBaseline.Build(SmallNetwork.Case());

        // No shifting to cheap hours: every hour the filter makes what the reservoir and the park take.
        Assert.All(plan.Tanks.Single(k => k.Tank == ClassATank).EndVolumeM3, v => Assert.Equal(900, v, 6));
    }

    [Fact]
    public void DailyVolumeIsSpreadEvenlyOverTheAllowedHours()
    {
        var plan = RuleBasedBaseline.Build(SmallNetwork.Case());
        var park = plan.Customers.Single(c => c.Customer == Park).DeliveredM3;

        // 1 200 m3 over the ten hours 21:00-07:00 of the day: 00:00-06:59 and 21:00-23:59.
        int[] allowed = [0, 1, 2, 3, 4, 5, 6, 21, 22, 23];
        Assert.All(allowed, t => Assert.Equal(120, park[t], 6));
        Assert.Equal(1200, park.Sum(), 6);
    }

    [Fact]
    public void StandardLevelRunsWhenItMeetsThePermit()
    {
        var plan = RuleBasedBaseline.Build(SmallNetwork.Case());

        Assert.Equal("standard", plan.Plants[0].LevelByDay[0].Value);
    }

    [Fact]
    public void FirstLevelMeetingTheConcentrationLimitReplacesAStandardLevelThatBreaksIt()
    {
        var planningCase = SmallNetwork.Case(WithPermit(p => p with { MaxTotalNitrogenMgPerL = 10 })); // standard makes 12 mg/L

        var plan = RuleBasedBaseline.Build(planningCase);

        Assert.Equal("tight", plan.Plants[0].LevelByDay[0].Value);
        Assert.Empty(PlanChecker.Check(planningCase, plan).Violations);
    }

    [Fact]
    public void LevelIsTightenedWhenTheStandardLevelWouldBreakTheDailyCap()
    {
        var loose = SmallNetwork.Case();
        var load = PlanCosting.Compute(loose, RuleBasedBaseline.Build(loose)).Plants[Norwick].TotalNitrogen.KgByDay[0];
        // The standard level (12 mg/L) discharges `load`; the tight level (8 mg/L) two thirds of it.
        var planningCase = SmallNetwork.Case(WithPermit(p => p with { DailyTotalNitrogenKg = load * 0.8 }));

        var plan = RuleBasedBaseline.Build(planningCase);

        Assert.Equal("tight", plan.Plants[0].LevelByDay[0].Value);
        Assert.DoesNotContain(plan.Problems, p => p.Kind == ProblemKinds.NitrogenDailyExcess);
    }

    [Fact]
    public void UnavoidableCapExcessIsNamedAmongTheProblems()
    {
        var planningCase = SmallNetwork.Case(WithPermit(p => p with { DailyTotalNitrogenKg = 5 }));

        var plan = RuleBasedBaseline.Build(planningCase);

        var excess = Assert.Single(plan.Problems, p => p.Kind == ProblemKinds.NitrogenDailyExcess);
        Assert.Equal((Norwick.Value, Start), (excess.Where, excess.Day));
        Assert.Equal("tight", plan.Plants[0].LevelByDay[0].Value);
        var violation = Assert.Single(PlanChecker.Check(planningCase, plan).Violations);
        Assert.Equal(excess.Amount, violation.Amount, 6);
    }

    [Fact]
    public void EngineBurnsTheGasAsItComesUpToItsSizeAndTheHolderKeepsTheRest()
    {
        var network = Build();
        var plant = network.Plants[0];
        // 100 Nm3/h against an engine that burns at most 180 kW / (6 kWh/Nm3 × 0.36) = 83.3 Nm3/h: 16.7 Nm3/h to the holder,
        // which fills from 250 to 600 Nm3 in 21 h, then flares.
        var gassy = network with { Plants = [plant with { Biogas = plant.Biogas! with { ProductionNm3PerHour = Series.Constant(100) } }] };
        var planningCase = SmallNetwork.Case(gassy);

        var plan = RuleBasedBaseline.Build(planningCase);

        var p = plan.Plants[0];
        Assert.All(p.EngineKWh, kWh => Assert.Equal(180, kWh, 6));
        Assert.Equal(250 + 100.0 / 6 * 20, p.HolderEndNm3[19], 6);
        Assert.Equal(0, p.GasFlaredNm3[19], 6);
        Assert.Equal(600, p.HolderEndNm3[23], 6);
        Assert.True(p.GasFlaredNm3[23] > 0);
        Assert.Empty(PlanChecker.Check(planningCase, plan).Violations);
    }

    [Fact]
    public void InfluentAboveTheSecondaryCapacityIsBypassedAndNamed()
    {
        var network = Build();
        var storm = network with { Plants = [network.Plants[0] with { InfluentM3PerHour = Series.Constant(900), Permit = new Permit() }] };

        var plan = RuleBasedBaseline.Build(SmallNetwork.Case(storm));

        Assert.All(plan.Plants[0].BypassM3, m3 => Assert.Equal(100, m3, 6));
        var bypass = Assert.Single(plan.Problems, p => p.Kind == ProblemKinds.Bypass);
        Assert.Equal(2400, bypass.Amount, 6);
    }
}
