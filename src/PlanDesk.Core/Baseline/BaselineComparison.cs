using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// The figures a solve summary shows beside a plan: what the rule-based baseline costs on the same case, the
/// plan's saving against it, and how many violations the independent checker found in the plan.
/// Both plans are costed by <see cref="PlanCosting"/>, so the comparison never rests on a producer's own sums.
/// </summary>
/// <param name="BaselineCost">The baseline's total objective: operating cost plus penalties, currency.</param>
/// <param name="SavingPercent">(baseline total − plan total) / baseline total × 100, on the total objective
/// including penalties, so a plan cannot look cheaper by leaving customers short or breaching a permit.
/// Null when the baseline total is not positive (no meaningful base) or the plan holds no decisions.</param>
/// <param name="BaselineOperatingCost">The baseline's money actually paid (energy, demand charge, starts, chemicals, carbon).</param>
/// <param name="OperatingSavingPercent">The same saving on operating cost alone; null like <paramref name="SavingPercent"/>.</param>
/// <param name="CheckViolations">Violations the checker found in the plan (priced soft limits included).</param>
/// <param name="BaselineCheckViolations">Violations the checker found in the baseline (each named among its problems).</param>
public sealed record BaselineComparison(
    double BaselineCost,
    double? SavingPercent,
    double BaselineOperatingCost,
    double? OperatingSavingPercent,
    int CheckViolations,
    int BaselineCheckViolations)
{
    /// <summary>Builds the baseline for <paramref name="planningCase"/> (unless given), checks both plans and compares them.</summary>
    public static BaselineComparison Of(PlanningCase planningCase, Plan plan, Plan? baseline = null)
    {
        baseline ??= RuleBasedBaseline.Build(planningCase);
        var baselineReport = PlanChecker.Check(planningCase, baseline);
        var planReport = PlanChecker.Check(planningCase, plan);
        var baselineCosts = baselineReport.RecomputedCosts ?? baseline.Costs;
        var planCosts = planReport.RecomputedCosts;
        return new BaselineComparison(
            baselineCosts.Total,
            Saving(baselineCosts.Total, planCosts?.Total),
            baselineCosts.Operating,
            Saving(baselineCosts.Operating, planCosts?.Operating),
            planReport.Violations.Count,
            baselineReport.Violations.Count);
    }

    /// <summary>The summary with the baseline cost, the savings and the checker's count filled in.</summary>
    public PlanSummary AddTo(PlanSummary summary) => summary with
    {
        BaselineCost = BaselineCost,
        SavingPercent = SavingPercent,
        OperatingSavingPercent = OperatingSavingPercent,
        CheckViolations = CheckViolations,
    };

    private static double? Saving(double baseline, double? plan) =>
        plan is { } cost && baseline > 0 ? (baseline - cost) / baseline * 100 : null;
}
