using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Generation;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Tests;

/// <summary>
/// Plans for generated S regions (3 plants, 8 customers, 24 h with a storm) pass the independent checker:
/// no hard violation, and a priced soft limit (a cap the storm makes impossible) only when the plan names
/// it among its problems. The benchmark times larger regions; this only checks that the plans are right.
/// </summary>
public class GeneratedRegionPlanTests
{
    private static readonly SolveOptions Options = new() { TimeLimitSeconds = 120, GapPercent = 0.5 };

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void SmallGeneratedRegionPlanPassesTheChecker(int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.S, seed).Network;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;

        var plan = Planner.Solve(planningCase, Options);

        Assert.NotEqual(SolveStatus.NoPlan, plan.Solve.Status);
        var report = PlanChecker.Check(planningCase, plan);
        Assert.Empty(report.HardViolations.Select(v => v.Message));
        Assert.Empty(report.Violations.Where(v => !ProblemKinds.Names(plan.Problems, v)).Select(v => v.Message));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void SmallGeneratedRegionPlanCostsNoMoreThanTheRules(int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.S, seed).Network;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;

        var plan = Planner.Solve(planningCase, Options with { Explain = false });
        var comparison = BaselineComparison.Of(planningCase, plan);

        // The rules' plan is one the MILP could have chosen, so the MILP plan is cheaper, up to its stopping gap.
        Assert.NotNull(comparison.SavingPercent);
        Assert.True(comparison.SavingPercent >= -Options.GapPercent,
            $"plan {plan.Costs.Total:F0} against the rules' {comparison.BaselineCost:F0}: saving {comparison.SavingPercent:F2} %");
    }
}
