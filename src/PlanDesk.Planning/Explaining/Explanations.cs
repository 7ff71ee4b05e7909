using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Model;
using PlanDesk.Planning.Solving;

namespace PlanDesk.Planning.Explaining;

/// <summary>
/// Marginal water costs and binding limits of a solved plan. Duals are 0 after a MIP solve, so the same model is
/// rebuilt in a fresh GLOP solver with every integer decision (levels, units, pumps) fixed to its MIP value and
/// solved as an LP; the dual of a customer's balance is then what one more m3 delivered there would cost.
/// </summary>
internal static class Explanations
{
    /// <param name="integers">The plan's integer decisions by variable name (<see cref="PlanModel.IntegerValues"/>).</param>
    /// <param name="timeLimitSeconds">Time the fixed-decision LP may take; past it the plan has no marginal costs, with a note.</param>
    public static Plan Add(PlanningCase planningCase, IReadOnlyDictionary<string, double> integers, Plan plan, double timeLimitSeconds, List<string> notes)
    {
        var marginal = MarginalWaterCosts(planningCase, integers, plan.Solve.Objective, timeLimitSeconds, notes);
        return plan with { MarginalWaterCosts = marginal, BindingLimits = BindingLimits.Find(planningCase, plan) };
    }

    private static List<MarginalWaterCost> MarginalWaterCosts(PlanningCase planningCase, IReadOnlyDictionary<string, double> integers,
        double milpObjective, double timeLimitSeconds, List<string> notes)
    {
        using var lp = SolverBackend.CreateDualLp(timeLimitSeconds);
        var model = PlanModel.Build(lp, planningCase, IntegerMode.Fixed, integers);
        var status = lp.Solve();
        if (status != Solver.ResultStatus.OPTIMAL)
        {
            notes.Add($"marginal water costs could not be computed: the fixed-decision LP ended {SolverBackend.Describe(status)}");
            return [];
        }
        var lpObjective = lp.Objective().Value();
        if (Math.Abs(lpObjective - milpObjective) > 1e-4 * Math.Max(1, Math.Abs(milpObjective)))
        {
            notes.Add($"with its on/off decisions fixed, the plan's flows could cost {Amounts.Format(lpObjective, 2)} instead of " +
                      $"{Amounts.Format(milpObjective, 2)}; marginal costs are those of the cheaper flows");
        }

        var costs = new List<MarginalWaterCost>();
        foreach (var customer in planningCase.Network.Customers)
        {
            if (customer.Demand is DailyDemand)
            {
                // The day's balance has one dual; it is the cost of one more m3 in any of the day's delivery periods.
                foreach (var day in planningCase.Horizon.Days)
                {
                    var dual = model.DayBalance[(customer.Id, day.Index)].DualValue();
                    costs.AddRange(day.PeriodIndices
                        .Where(t => planningCase.MaxDeliveryM3[customer.Id][t] > 0)
                        .Select(t => new MarginalWaterCost(customer.Id, t, Clean(dual))));
                }
            }
            else
            {
                costs.AddRange(planningCase.Horizon.Periods.Select(p =>
                    new MarginalWaterCost(customer.Id, p.Index, Clean(model.PeriodBalance[(customer.Id, p.Index)].DualValue()))));
            }
        }
        return costs;
    }

    private static double Clean(double value) => Math.Abs(value) < 1e-9 ? 0 : Math.Round(value, 6);
}
