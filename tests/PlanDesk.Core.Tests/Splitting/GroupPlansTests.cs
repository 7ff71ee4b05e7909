using NodaTime;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Tests.Splitting;

/// <summary>
/// Restricting a case to a group and joining group plans. Plans come from the rule-based baseline run on each
/// restricted case, so the joining is tested without a solver: the joined plan must pass the checker on the whole
/// case exactly as a plan made for the whole case does.
/// </summary>
public class GroupPlansTests
{
    private static readonly LocalDate Start = new(2027, 3, 25);

    private static PlanningCase DemoCase(int days = 2)
    {
        var loaded = NetworkLoader.Load(Path.Combine(TestNetworks.NetworksFolder, "demo-region.json"));
        Assert.True(loaded.Network is not null, string.Join("\n", loaded.Problems));
        var created = PlanningCase.Create(loaded.Network!, Start, days);
        Assert.True(created.Succeeded, string.Join("; ", created.Problems));
        return created.Case!;
    }

    private static List<GroupPlan> BaselinePerGroup(PlanningCase whole) =>
        IndependentGroups.Of(whole.Network).Select(g => new GroupPlan(g, RuleBasedBaseline.Build(whole.Restrict(g)))).ToList();

    [Fact]
    public void RestrictedCaseHasExactlyItsElementsAndTheSameSeriesValues()
    {
        var whole = DemoCase();
        var group = IndependentGroups.Of(whole.Network)[0];

        var part = whole.Restrict(group);

        Assert.Same(whole.Horizon, part.Horizon);
        Assert.Equal(whole.BillingMonth, part.BillingMonth);
        Assert.Equal(group.Plants.OrderBy(id => id.ToString()), part.InfluentM3.Keys.OrderBy(id => id.ToString()));
        Assert.Equal(group.Plants.OrderBy(id => id.ToString()), part.ImportPricePerMWh.Keys.OrderBy(id => id.ToString()));
        Assert.Equal(whole.Network.Stages.Where(s => group.Plants.Contains(s.Plant)).Select(s => s.Id).OrderBy(id => id.ToString()), part.AvailableUnits.Keys.OrderBy(id => id.ToString()));
        Assert.Equal(group.Customers.OrderBy(id => id.ToString()), part.MaxDeliveryM3.Keys.OrderBy(id => id.ToString()));
        Assert.Equal(group.Customers.OrderBy(id => id.ToString()), part.DemandM3.Keys.Concat(part.DailyVolumeM3.Keys).OrderBy(id => id.ToString()));
        foreach (var (plant, influent) in part.InfluentM3)
        {
            Assert.Equal(whole.InfluentM3[plant], influent);
            Assert.Equal(whole.ImportPricePerMWh[plant], part.ImportPricePerMWh[plant]);
        }
        foreach (var (customer, demand) in part.DemandM3)
        {
            Assert.Equal(whole.DemandM3[customer], demand);
        }
        foreach (var (stage, units) in part.AvailableUnits)
        {
            Assert.Equal(whole.AvailableUnits[stage], units);
        }
    }

    [Fact]
    public void JoinedPlanCoversEveryElementOnceInNetworkOrder()
    {
        var whole = DemoCase();

        var joined = GroupPlans.Join(whole, BaselinePerGroup(whole), 0.5, 1.0);

        Assert.Equal(whole.Network.Plants.Select(p => p.Id), joined.Plants.Select(p => p.Plant));
        Assert.Equal(whole.Network.Stages.Select(s => s.Id), joined.Stages.Select(s => s.Stage));
        Assert.Equal(whole.Network.Tanks.Select(t => t.Id), joined.Tanks.Select(t => t.Tank));
        Assert.Equal(whole.Network.Pipelines.Select(l => l.Id), joined.Pipelines.Select(l => l.Pipeline));
        Assert.Equal(whole.Network.Customers.Select(c => c.Id), joined.Customers.Select(c => c.Customer));
        Assert.Equal(whole.PeriodCount, joined.PeriodStarts.Count);
    }

    [Fact]
    public void JoinedCostsAreTheSumsOfTheGroupCostsAndTheCheckerAgrees()
    {
        var whole = DemoCase();
        var parts = BaselinePerGroup(whole);

        var joined = GroupPlans.Join(whole, parts, 0.5, 1.0);
        var report = PlanChecker.Check(whole, joined);

        Assert.Equal(parts.Sum(p => p.Plan.Costs.EnergyImport), joined.Costs.EnergyImport, 6);
        Assert.Equal(parts.Sum(p => p.Plan.Costs.DemandCharge), joined.Costs.DemandCharge, 6);
        Assert.Equal(parts.Sum(p => p.Plan.Costs.ShortfallPenalty), joined.Costs.ShortfallPenalty, 6);
        Assert.Equal(parts.Sum(p => p.Plan.Costs.Total), joined.Costs.Total, 6);
        Assert.Empty(report.HardViolations.Select(v => v.Message));
        Assert.Empty(report.Violations.Where(v => !ProblemKinds.Names(joined.Problems, v)).Select(v => v.Message));
        Assert.Equal(joined.Costs.Total, report.RecomputedCosts!.Total, 6);
    }

    [Fact]
    public void JoinedBaselineCostsWhatTheWholeRegionBaselineCosts()
    {
        var whole = DemoCase();

        var joined = GroupPlans.Join(whole, BaselinePerGroup(whole), 0.5, 1.0);
        var direct = RuleBasedBaseline.Build(whole);

        // Nothing joins two groups, so planning them apart changes nothing.
        Assert.Equal(direct.Costs.Total, joined.Costs.Total, 6);
        Assert.Equal(direct.Problems.Count, joined.Problems.Count);
    }

    [Fact]
    public void JoinedBoundIsTheSumOfGroupBoundsAndStatusFollowsTheJoinedGap()
    {
        var whole = DemoCase(1);
        var parts = WithSolves(BaselinePerGroup(whole), (100, 99.9), (50, 49.95), (10, 10));

        var withinHalfPercent = GroupPlans.Join(whole, parts, 0.5, 3.0);
        var withinOneTenth = GroupPlans.Join(whole, parts, 0.05, 3.0);

        Assert.Equal(160, withinHalfPercent.Solve.Objective, 9);
        Assert.Equal(159.85, withinHalfPercent.Solve.BestBound, 9);
        Assert.Equal(100 * 0.15 / 160, withinHalfPercent.Solve.GapPercent, 9);
        Assert.Equal(SolveStatus.Optimal, withinHalfPercent.Solve.Status);
        Assert.Equal(SolveStatus.Feasible, withinOneTenth.Solve.Status);
        Assert.Equal(3.0, withinHalfPercent.Solve.SolveSeconds);
        Assert.Equal(30, withinHalfPercent.Solve.Variables);
        Assert.Contains(withinHalfPercent.Solve.Notes, n => n.StartsWith("the region was solved as 3 independent groups", StringComparison.Ordinal));
        Assert.Contains("group 2 (plant tessford): note of group 2", withinHalfPercent.Solve.Notes);
    }

    [Fact]
    public void OneUnknownGroupBoundLeavesTheJoinedBoundUnknown()
    {
        var whole = DemoCase(1);
        var parts = WithSolves(BaselinePerGroup(whole), (100, 99.9), (50, double.NaN), (10, 10));

        var joined = GroupPlans.Join(whole, parts, 0.5, 1.0);

        Assert.True(double.IsNaN(joined.Solve.BestBound));
        Assert.True(double.IsNaN(joined.Solve.GapPercent));
        Assert.Equal(SolveStatus.Feasible, joined.Solve.Status);
    }

    [Fact]
    public void GroupWithoutPlanLeavesTheRegionWithoutOneAndIsNamed()
    {
        var whole = DemoCase(1);
        var parts = BaselinePerGroup(whole);
        var failed = Plan.For(whole.Restrict(parts[2].Group), "milp", new SolveInfo { Status = SolveStatus.NoPlan }) with
        {
            Problems = [new PlanProblem("noPlan", whole.Network.Name, null, 0, "", "no plan: the solver found no plan within 5 s")],
        };
        parts[2] = parts[2] with { Plan = failed };

        var joined = GroupPlans.Join(whole, parts, 0.5, 1.0);

        Assert.Equal(SolveStatus.NoPlan, joined.Solve.Status);
        Assert.Empty(joined.Plants);
        var problem = Assert.Single(joined.Problems, p => p.Kind == "noPlan");
        Assert.Equal("no plan for group 3 (plant whinlow): the solver found no plan within 5 s", problem.Message);
        Assert.Contains(joined.Solve.Notes, n => n.Contains("group 3 (plant whinlow)", StringComparison.Ordinal));
    }

    private static List<GroupPlan> WithSolves(List<GroupPlan> parts, params (double Objective, double Bound)[] solves) =>
        parts.Select((p, i) => p with
        {
            Plan = p.Plan with
            {
                Solve = new SolveInfo
                {
                    Status = SolveStatus.Optimal,
                    Solver = "test",
                    Objective = solves[i].Objective,
                    BestBound = solves[i].Bound,
                    Variables = 10,
                    Notes = [$"note of group {i + 1}"],
                },
            },
        }).ToList();
}
