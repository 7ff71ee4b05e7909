using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>The plan's stated cost, component by component, against the checker's own accounting.</summary>
internal static class CostChecks
{
    /// <summary>Method of a plan changed by hand: its stated cost is not compared, since nobody restates costs
    /// after moving a pump hour; the checker's own cost stands instead.</summary>
    public const string EditedMethod = "edited";

    public static void Check(Findings findings, Plan plan, CostBreakdown recomputed)
    {
        if (plan.Method == EditedMethod)
        {
            return;
        }
        var currency = findings.Case.Network.Currency;
        var stated = plan.Costs;
        var components = new (string Name, double Stated, double Recomputed)[]
        {
            ("energyImport", stated.EnergyImport, recomputed.EnergyImport),
            ("energyExportCredit", stated.EnergyExportCredit, recomputed.EnergyExportCredit),
            ("demandCharge", stated.DemandCharge, recomputed.DemandCharge),
            ("unitStarts", stated.UnitStarts, recomputed.UnitStarts),
            ("chemicals", stated.Chemicals, recomputed.Chemicals),
            ("carbon", stated.Carbon, recomputed.Carbon),
            ("shortfallPenalty", stated.ShortfallPenalty, recomputed.ShortfallPenalty),
            ("bypassPenalty", stated.BypassPenalty, recomputed.BypassPenalty),
            ("permitPenalty", stated.PermitPenalty, recomputed.PermitPenalty),
            ("outfallPenalty", stated.OutfallPenalty, recomputed.OutfallPenalty),
            ("tankEndPenalty", stated.TankEndPenalty, recomputed.TankEndPenalty),
            ("tankLimitPenalty", stated.TankLimitPenalty, recomputed.TankLimitPenalty),
        };
        var before = findings.Items.Count;
        foreach (var (name, s, r) in components)
        {
            Compare(findings, ViolationKind.CostMismatch, name, s, r, currency, $"the plan states {name} as");
        }
        // The total is the sum of the components, so it can only be off on its own through rounding.
        if (findings.Items.Count == before)
        {
            Compare(findings, ViolationKind.CostMismatch, "total", stated.Total, recomputed.Total, currency, "the plan states its total cost as");
        }
        if (plan.Method == "milp" && plan.Solve.Status is SolveStatus.Optimal or SolveStatus.Feasible)
        {
            Compare(findings, ViolationKind.ObjectiveMismatch, "objective", plan.Solve.Objective, recomputed.Total, currency, "the solver's objective is");
        }
    }

    private static void Compare(Findings findings, string kind, string name, double stated, double recomputed, string currency, string says)
    {
        if (findings.Tolerances.CostsDiffer(stated, recomputed))
        {
            findings.Overall(kind, name, Math.Abs(stated - recomputed), currency, recomputed,
                $"{says} {Findings.Q(stated)} {currency} but the plan's decisions cost {Findings.Q(recomputed)} {currency}");
        }
    }
}
