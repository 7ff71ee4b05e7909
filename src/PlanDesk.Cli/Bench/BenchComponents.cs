using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Cli.Bench;

/// <summary>What the independent checker made of a plan.</summary>
internal sealed record CheckVerdict(int Violations, int HardViolations);

/// <summary>
/// The parts a benchmark case uses besides the planner: the rule-based baseline and the checker.
/// A part that is not available yet is null, and its columns stay blank with a note.
/// </summary>
internal static class BenchComponents
{
    public static Func<PlanningCase, Plan>? Baseline => RuleBasedBaseline.Build;

    public static Func<PlanningCase, Plan, CheckVerdict>? Checker => (planningCase, plan) =>
    {
        var report = PlanChecker.Check(planningCase, plan);
        return new CheckVerdict(report.Violations.Count, report.HardViolations.Count());
    };
}
