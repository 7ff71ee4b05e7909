using PlanDesk.Core.Baseline;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Plans;

internal static class PlanSummaries
{
    public static PlanSummaryResponse Create(
        PlanRecord job, LoadedNetwork network, PlanningCase planningCase, Plan plan, PlanCheckReport check, BaselineComparison? baseline)
    {
        var summary = PlanSummary.From(planningCase, plan);
        return new PlanSummaryResponse
        {
            PlanId = job.Id,
            NetworkId = job.NetworkId,
            NetworkVersion = job.NetworkVersion,
            NetworkName = network.Network.Name,
            StartDate = plan.StartDate,
            Days = plan.Days,
            Method = plan.Method,
            Solver = plan.Solve.Solver,
            CheckPassed = check.Passed,
            Notes = plan.Solve.Notes,
            Summary = baseline is null ? summary with { CheckViolations = check.Violations.Count } : baseline.AddTo(summary),
            Caution = Cautions.TargetSheet,
        };
    }
}
