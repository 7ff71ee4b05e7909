using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Extraction;

/// <summary>The plan record returned when there is no plan: status noPlan, empty arrays, the reason in plain words.</summary>
internal static class EmptyPlans
{
    public static Plan NoPlan(PlanningCase planningCase, SolveInfo info, string reason, IEnumerable<PlanProblem>? dataProblems = null)
    {
        var horizon = planningCase.Horizon;
        return new Plan
        {
            NetworkName = planningCase.Network.Name,
            StartDate = horizon.StartDate,
            Days = horizon.DayCount,
            PeriodMinutes = horizon.PeriodMinutes,
            PeriodStarts = horizon.Periods.Select(p => p.Start).ToList(),
            Method = "milp",
            Currency = planningCase.Network.Currency,
            Solve = info with { Status = SolveStatus.NoPlan },
            Plants = [],
            Stages = [],
            Tanks = [],
            Pipelines = [],
            Customers = [],
            Costs = new CostBreakdown(),
            Problems = [.. dataProblems ?? [], new PlanProblem("noPlan", planningCase.Network.Name, null, 0, "", $"no plan: {reason}")],
        };
    }
}
