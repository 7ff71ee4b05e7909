using PlanDesk.Core.Model;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Core.Tests.Baseline;

public class BaselineComparisonTests
{
    private readonly PlanningCase _case = SmallNetwork.Case();

    [Fact]
    public void BaselineComparedWithItselfSavesNothingAndHasNoViolations()
    {
        var baseline = RuleBasedBaseline.Build(_case);

        var comparison = BaselineComparison.Of(_case, baseline, baseline);

        Assert.Equal(baseline.Costs.Total, comparison.BaselineCost, 9);
        Assert.Equal(0, comparison.SavingPercent!.Value, 9);
        Assert.Equal(0, comparison.OperatingSavingPercent!.Value, 9);
        Assert.Equal((0, 0), (comparison.CheckViolations, comparison.BaselineCheckViolations));
    }

    [Fact]
    public void CheaperPlanSavesItsShareOfTheBaselineTotal()
    {
        var baseline = RuleBasedBaseline.Build(_case);
        // The same plan with the park's last delivery cut by 100 m3: the tank ends higher, the park is short 100 m3
        // at 0.8 per m3, and the pumping saved is worth less than that penalty.
        var cheaper = PlanRestate.Copy(baseline);
        var park = cheaper.Pipelines.Single(l => l.Pipeline == SmallNetwork.ToPark);
        park.FlowM3[23] -= 100;
        var restated = PlanRestate.Flows(_case, cheaper);

        var comparison = BaselineComparison.Of(_case, restated, baseline);

        var expected = (baseline.Costs.Total - restated.Costs.Total) / baseline.Costs.Total * 100;
        Assert.Equal(expected, comparison.SavingPercent!.Value, 9);
        Assert.True(comparison.SavingPercent < 0, "leaving a customer short costs more than the pumping it saves");
        Assert.True(comparison.OperatingSavingPercent > 0, "less pumping lowers the operating cost");
    }

    [Fact]
    public void PlanWithoutDecisionsHasNoSaving()
    {
        var baseline = RuleBasedBaseline.Build(_case);
        var none = baseline with { Solve = new SolveInfo { Status = SolveStatus.NoPlan }, Plants = [], Stages = [], Tanks = [], Pipelines = [], Customers = [] };

        var comparison = BaselineComparison.Of(_case, none, baseline);

        Assert.Null(comparison.SavingPercent);
        Assert.Equal(1, comparison.CheckViolations);
    }
}
