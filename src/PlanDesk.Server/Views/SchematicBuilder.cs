using System.Globalization;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Server.Views;

/// <summary>The network of a plan as the schematic draws it, with each element's capacity use over the
/// horizon and the limits and problems the plan reports for it.</summary>
internal static class SchematicBuilder
{
    private const double Tiny = 1e-9;

    public static SchematicResponse Create(long planId, PlanningCase planningCase, Plan plan)
    {
        var network = planningCase.Network;
        var hasPlan = plan.Solve.Status != SolveStatus.NoPlan && plan.Plants.Count > 0;
        var hours = planningCase.PeriodHours;
        var binding = plan.BindingLimits.ToLookup(b => b.Where, b => b.Message);
        var problems = plan.Problems.ToLookup(p => p.Where, p => p.Message);
        IReadOnlyList<string> Binding(string id) => binding[id].Distinct().ToList();
        IReadOnlyList<string> Problems(string id) => problems[id].Distinct().ToList();

        var plants = network.Plants.Select(plant =>
        {
            var plantPlan = hasPlan ? plan.Plants.FirstOrDefault(p => p.Plant == plant.Id) : null;
            var secondary = plantPlan is null ? null : Use(
                plantPlan.TreatedM3.Select(treated => (treated, plant.SecondaryCapacityM3PerHour * hours)),
                $"secondary capacity {Number(plant.SecondaryCapacityM3PerHour)} m3/h");
            var engine = plantPlan is null || plant.Biogas is null ? null : Use(
                plantPlan.EngineKWh.Select(kWh => (kWh, plant.Biogas.EngineKw * hours)),
                $"engine size {Number(plant.Biogas.EngineKw)} kW");
            var stages = plant.Stages.Select(stage => StageOf(stage, hasPlan ? plan.Stages.FirstOrDefault(s => s.Stage == stage.Id) : null,
                planningCase, Binding(stage.Id.Value))).ToList();
            return new SchematicPlant(plant.Id.Value, plant.Name, secondary, engine, stages, Binding(plant.Id.Value), Problems(plant.Id.Value));
        }).ToList();

        var tanks = network.Tanks.Select(tank =>
        {
            var tankPlan = hasPlan ? plan.Tanks.FirstOrDefault(t => t.Tank == tank.Id) : null;
            var range = tank.MaxM3 - tank.MinM3;
            var use = tankPlan is null ? null : Use(
                tankPlan.EndVolumeM3.Select(volume => (volume - tank.MinM3, range)),
                $"usable volume {Number(tank.MinM3)} to {Number(tank.MaxM3)} m3");
            return new SchematicTank(tank.Id.Value, tank.Name, tank.Plant?.Value, tank.Class.Value, use, Binding(tank.Id.Value), Problems(tank.Id.Value));
        }).ToList();

        var customers = network.Customers.Select(customer =>
        {
            var customerPlan = hasPlan ? plan.Customers.FirstOrDefault(c => c.Customer == customer.Id) : null;
            var demand = planningCase.DemandM3.TryGetValue(customer.Id, out var hourly) ? hourly.Sum()
                : planningCase.DailyVolumeM3.TryGetValue(customer.Id, out var daily) ? daily.Sum() : 0;
            return new SchematicCustomer(customer.Id.Value, customer.Name, customer.Kind, customer.Class.Value, demand,
                customerPlan?.DeliveredM3.Sum() ?? 0, customerPlan?.ShortfallM3.Sum() ?? 0, Problems(customer.Id.Value));
        }).ToList();

        var pipelines = network.Pipelines.Select(pipeline =>
        {
            var flows = hasPlan ? plan.Pipelines.FirstOrDefault(p => p.Pipeline == pipeline.Id)?.FlowM3 : null;
            var use = flows is null ? null : Use(
                flows.Select(flow => (flow, pipeline.CapacityM3PerHour * hours)),
                $"capacity {Number(pipeline.CapacityM3PerHour)} m3/h");
            var toKind = pipeline.To.Customer is null ? "tank" : "customer";
            return new SchematicPipeline(pipeline.Id.Value, pipeline.Name, pipeline.From.Value, pipeline.To.ToString(), toKind, use, Binding(pipeline.Id.Value));
        }).ToList();

        var classes = network.Classes.Select(c => new ClassInfo(c.Id.Value, c.Name, c.Rank)).ToList();
        return new SchematicResponse(planId, network.Name, hasPlan, classes, plants, tanks, customers, pipelines);
    }

    private static SchematicStage StageOf(Stage stage, StagePlan? stagePlan, PlanningCase planningCase, IReadOnlyList<string> binding)
    {
        var available = planningCase.AvailableUnits[stage.Id];
        // Periods with no unit available are an outage, not idle capacity, so they do not lower the mean.
        var use = stagePlan is null ? null : Use(
            stagePlan.FeedM3.Select((feed, t) => (feed, available[t] * stage.UnitMaxFlowM3PerHour * planningCase.PeriodHours)),
            $"{stage.Units} × {Number(stage.UnitMaxFlowM3PerHour)} m3/h of available units");
        return new SchematicStage(stage.Id.Value, stage.Name, stage.ProducesClass.Value, stage.FeedTank?.Value, stage.ProductTank.Value, use, binding);
    }

    /// <summary>Mean and peak of used / capacity over the periods with some capacity, in percent.</summary>
    private static CapacityUse Use(IEnumerable<(double Used, double Capacity)> periods, string basis)
    {
        var percents = periods.Where(p => p.Capacity > Tiny).Select(p => 100 * Math.Max(0, p.Used) / p.Capacity).ToList();
        return percents.Count == 0
            ? new CapacityUse(0, 0, basis)
            : new CapacityUse(Math.Round(percents.Average(), 1), Math.Round(percents.Max(), 1), basis);
    }

    private static readonly NumberFormatInfo Grouped = new() { NumberGroupSeparator = " ", NumberDecimalSeparator = "." };

    internal static string Number(double value) => value.ToString("#,0.##", Grouped);
}
