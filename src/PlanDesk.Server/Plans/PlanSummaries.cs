using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Plans;

internal static class PlanSummaries
{
    public static PlanSummaryResponse Create(PlanRecord job, LoadedNetwork network, Plan plan, PlanCheckReport check, double? baselineCost) => new()
    {
        PlanId = job.Id,
        NetworkId = job.NetworkId,
        NetworkVersion = job.NetworkVersion,
        NetworkName = network.Network.Name,
        StartDate = plan.StartDate,
        Days = plan.Days,
        Method = plan.Method,
        Status = plan.Solve.Status,
        Solver = plan.Solve.Solver,
        Currency = plan.Currency,
        TotalCost = plan.Costs.Total,
        OperatingCost = plan.Costs.Operating,
        PenaltyCost = plan.Costs.Penalties,
        Costs = plan.Costs,
        BaselineCost = baselineCost,
        SavingAgainstBaseline = baselineCost - plan.Costs.Total,
        BestBound = double.IsFinite(plan.Solve.BestBound) ? plan.Solve.BestBound : null,
        GapPercent = double.IsFinite(plan.Solve.GapPercent) ? plan.Solve.GapPercent : null,
        SolveSeconds = plan.Solve.SolveSeconds,
        ProblemCount = plan.Problems.Count,
        CheckPassed = check.Passed,
        CheckViolationCount = check.Violations.Count,
        Notes = plan.Solve.Notes,
        Caution = Cautions.TargetSheet,
    };
}
