using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Core.Tests.Baseline;

public class SmallNetworkBaselineTests
{
    [Fact]
    public void BaselinePlanOfTheSmallNetworkPassesTheChecker()
    {
        var planningCase = SmallNetwork.Case();
        var plan = RuleBasedBaseline.Build(planningCase);

        var report = PlanChecker.Check(planningCase, plan);

        Assert.Empty(report.Violations.Select(v => v.Message));
        Assert.Equal(RuleBasedBaseline.Method, plan.Method);
    }
}
