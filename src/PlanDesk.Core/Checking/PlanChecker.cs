using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>
/// The independent second opinion on a plan: recomputes every balance, bound, unit rule, class rule,
/// blend limit, permit load and cost from the plan's decisions and the network alone, and lists every
/// violation with its size. It shares no code with the MILP builder, so a bug in one shows in the other.
/// A malformed plan (missing entries, wrong array lengths) yields violations, never exceptions.
/// </summary>
public static class PlanChecker
{
    public static CheckReport Check(PlanningCase planningCase, Plan plan, CheckTolerances? tolerances = null)
    {
        var tol = tolerances ?? CheckTolerances.Default;
        var findings = new Findings(planningCase, tol);
        if (!PlanShape.Check(findings, plan))
        {
            return new CheckReport(findings.Items, null, tol);
        }

        var index = PlanIndex.Of(plan);
        var accounts = PlanCosting.Compute(planningCase, plan);
        SecondaryChecks.Check(findings, index);
        StageChecks.Check(findings, index);
        TankChecks.Check(findings, index);
        PipelineChecks.Check(findings, index);
        CustomerChecks.Check(findings, index);
        PermitChecks.Check(findings, index, accounts);
        EnergyChecks.Check(findings, index, accounts);
        CostChecks.Check(findings, plan, accounts.Costs);
        return new CheckReport(findings.Items, accounts.Costs, tol);
    }
}
