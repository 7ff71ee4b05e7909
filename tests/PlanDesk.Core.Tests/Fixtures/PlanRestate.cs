using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Tests.Fixtures;

/// <summary>
/// Test helper for mutation tests: after one decision of a plan is changed by hand, restates everything that
/// follows from the decisions (secondary effluent to the outfall, starts, tank volumes, deliveries and
/// shortfalls, import and export, costs) so that only the rule the mutation targets is broken.
/// Works on deep copies; the plan passed in is never changed.
/// </summary>
internal static class PlanRestate
{
    public static Plan Copy(Plan plan) => PlanJson.Deserialize(PlanJson.Serialize(plan))!;

    public static Plan Flows(PlanningCase planningCase, Plan plan)
    {
        var network = planningCase.Network;
        var periods = planningCase.PeriodCount;
        var hours = planningCase.PeriodHours;
        var stages = plan.Stages.ToDictionary(s => s.Stage);
        var lines = plan.Pipelines.ToDictionary(l => l.Pipeline);
        foreach (var p in plan.Plants)
        {
            var plant = network.Plant(p.Plant);
            for (var t = 0; t < periods; t++)
            {
                p.SecondaryToOutfallM3[t] = p.TreatedM3[t] - plant.Stages.Where(s => s.FeedTank is null).Sum(s => stages[s.Id].FeedM3[t]);
            }
        }
        foreach (var s in plan.Stages)
        {
            var stage = network.Stage(s.Stage);
            for (var t = 0; t < periods; t++)
            {
                s.UnitStarts[t] = Math.Max(0, s.UnitsRunning[t] - (t == 0 ? stage.InitialUnitsRunning : s.UnitsRunning[t - 1]));
            }
        }
        foreach (var k in plan.Tanks)
        {
            var tank = network.Tank(k.Tank);
            var keep = 1 - tank.LossFractionPerDay * hours / 24;
            for (var t = 0; t < periods; t++)
            {
                var before = t == 0 ? tank.InitialM3 : k.EndVolumeM3[t - 1];
                k.EndVolumeM3[t] = before * keep
                    + network.Stages.Where(s => s.ProductTank == tank.Id).Sum(s => s.RecoveryFraction * stages[s.Id].FeedM3[t])
                    + network.Pipelines.Where(l => l.To.Tank == tank.Id).Sum(l => lines[l.Id].FlowM3[t])
                    - network.Stages.Where(s => s.FeedTank == tank.Id).Sum(s => stages[s.Id].FeedM3[t])
                    - network.Pipelines.Where(l => l.From == tank.Id).Sum(l => lines[l.Id].FlowM3[t]);
            }
        }
        foreach (var c in plan.Customers)
        {
            var customer = network.Customer(c.Customer);
            for (var t = 0; t < periods; t++)
            {
                c.DeliveredM3[t] = network.Pipelines.Where(l => l.To.Customer == customer.Id).Sum(l => lines[l.Id].FlowM3[t]);
            }
            var shortfall = customer.Demand is DailyDemand
                ? planningCase.Horizon.Days.Select(d => planningCase.DailyVolumeM3[customer.Id][d.Index] - d.PeriodIndices.Sum(t => c.DeliveredM3[t])).ToArray()
                : planningCase.DemandM3[customer.Id].Select((demand, t) => demand - c.DeliveredM3[t]).ToArray();
            shortfall.CopyTo(c.ShortfallM3, 0);
        }
        var accounts = PlanCosting.Compute(planningCase, plan);
        foreach (var p in plan.Plants)
        {
            for (var t = 0; t < periods; t++)
            {
                var net = accounts.Plants[p.Plant].LoadKWh[t] - p.EngineKWh[t];
                p.ImportKWh[t] = Math.Max(0, net);
                p.ExportKWh[t] = Math.Max(0, -net);
            }
        }
        return Costs(planningCase, plan);
    }

    /// <summary>Restates only the costs (and the objective) from the plan's decisions.</summary>
    public static Plan Costs(PlanningCase planningCase, Plan plan)
    {
        var costs = PlanCosting.Compute(planningCase, plan).Costs;
        return plan with { Costs = costs, Solve = plan.Solve with { Objective = costs.Total } };
    }
}
