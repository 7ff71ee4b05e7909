using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>
/// Property, on the seeded random networks the baseline tests use: every MILP plan passes the independent checker
/// (a priced soft limit only when the plan names it among its problems), and it never costs more than the
/// rule-based baseline when both are free of violations (the baseline is then a feasible point of the MILP).
/// 50 networks by default; set PLANDESK_PROPERTY_RUNS for more.
/// </summary>
public class CheckedPlanPropertyTests
{
    private static readonly SolveOptions Options = new() { TimeLimitSeconds = 10, GapPercent = 0.5, Explain = false };

    public static IEnumerable<object[]> Seeds() =>
        Enumerable.Range(1, int.TryParse(Environment.GetEnvironmentVariable("PLANDESK_PROPERTY_RUNS"), out var runs) ? runs : 50)
            .Select(seed => new object[] { seed });

    [Theory]
    [MemberData(nameof(Seeds))]
    public void MilpPlanPassesTheCheckerAndCostsNoMoreThanTheRules(int seed)
    {
        var random = RandomNetworks.Create(seed);
        var planningCase = PlanningCase.Create(random.Network, random.Start, random.Days).Case!;

        var plan = Planner.Solve(planningCase, Options);

        Assert.NotEqual(SolveStatus.NoPlan, plan.Solve.Status);
        var report = PlanChecker.Check(planningCase, plan);
        Assert.Empty(report.HardViolations.Select(v => v.Message));
        Assert.Empty(report.Violations.Where(v => !ProblemKinds.Names(plan.Problems, v)).Select(v => v.Message));
        var baseline = RuleBasedBaseline.Build(planningCase);
        if (report.Passed && PlanChecker.Check(planningCase, baseline).Passed)
        {
            // Within the solver's stopping gap of the optimum, which is at most the baseline's cost.
            var slack = Math.Max(0.01, Options.GapPercent / 100 * Math.Abs(baseline.Costs.Total));
            Assert.True(plan.Costs.Total <= baseline.Costs.Total + slack,
                $"the MILP plan costs {plan.Costs.Total:F2} ({plan.Solve.Status}), the rules {baseline.Costs.Total:F2}");
        }
    }
}
