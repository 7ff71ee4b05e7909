using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Core.Tests.Baseline;

/// <summary>
/// Property: on random valid networks the baseline plan passes the checker, except for violations the plan
/// itself names among its problems (a permit breach or an outage the rules cannot avoid).
/// 50 networks by default; set PLANDESK_PROPERTY_RUNS for more.
/// </summary>
public class BaselinePropertyTests
{
    public static IEnumerable<object[]> Seeds() =>
        Enumerable.Range(1, int.TryParse(Environment.GetEnvironmentVariable("PLANDESK_PROPERTY_RUNS"), out var runs) ? runs : 50)
            .Select(seed => new object[] { seed });

    [Theory]
    [MemberData(nameof(Seeds))]
    public void BaselinePlanPassesTheCheckerExceptForProblemsItNames(int seed)
    {
        var random = RandomNetworks.Create(seed);
        var created = PlanningCase.Create(random.Network, random.Start, random.Days);
        Assert.True(created.Succeeded, string.Join("; ", created.Problems));

        var plan = RuleBasedBaseline.Build(created.Case!);
        var report = PlanChecker.Check(created.Case!, plan);

        var unnamed = report.Violations.Where(v => !ProblemKinds.Names(plan.Problems, v)).Select(v => v.Message).ToList();
        Assert.Empty(unnamed);
        Assert.NotNull(report.RecomputedCosts);
    }
}
