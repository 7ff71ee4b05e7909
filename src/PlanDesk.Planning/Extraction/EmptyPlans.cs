using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Extraction;

/// <summary>The plan record returned when there is no plan: status noPlan, empty arrays, the reason in plain words.</summary>
internal static class EmptyPlans
{
    public static Plan NoPlan(PlanningCase planningCase, SolveInfo info, string reason, IEnumerable<PlanProblem>? dataProblems = null)
    {
        return Plan.For(planningCase, "milp", info with { Status = SolveStatus.NoPlan }) with
        {
            Problems = [.. dataProblems ?? [], new PlanProblem("noPlan", planningCase.Network.Name, null, 0, "", $"no plan: {reason}")],
        };
    }
}
