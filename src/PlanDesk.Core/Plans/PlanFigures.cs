using PlanDesk.Core.Model;

namespace PlanDesk.Core.Plans;

/// <summary>
/// Quantities a plan implies but does not store: outfall volume, nutrient loads, plant load, peak import.
/// Targets and summaries read these; they follow docs/formulation.md.
/// </summary>
public static class PlanFigures
{
    public static PlantPlan PlantPlan(this Plan plan, PlantId id) => plan.Plants.First(p => p.Plant == id);
    public static StagePlan StagePlan(this Plan plan, StageId id) => plan.Stages.First(s => s.Stage == id);
    public static TankPlan TankPlan(this Plan plan, TankId id) => plan.Tanks.First(t => t.Tank == id);
    public static PipelinePlan PipelinePlan(this Plan plan, PipelineId id) => plan.Pipelines.First(p => p.Pipeline == id);
    public static CustomerPlan CustomerPlan(this Plan plan, CustomerId id) => plan.Customers.First(c => c.Customer == id);

    /// <summary>Volume discharged at the plant's outfall per period, m3: secondary effluent no stage takes,
    /// every stage's reject ((1 − recovery) × feed) and bypassed influent.</summary>
    public static double[] OutfallM3(PlanningCase planningCase, Plan plan, PlantId plantId)
    {
        var plant = planningCase.Network.Plant(plantId);
        var plantPlan = plan.PlantPlan(plantId);
        var outfall = new double[planningCase.PeriodCount];
        for (var t = 0; t < outfall.Length; t++)
        {
            outfall[t] = plantPlan.SecondaryToOutfallM3[t] + plantPlan.BypassM3[t];
        }
        foreach (var stage in plant.Stages)
        {
            var feed = plan.StagePlan(stage.Id).FeedM3;
            for (var t = 0; t < outfall.Length; t++)
            {
                outfall[t] += (1 - stage.RecoveryFraction) * feed[t];
            }
        }
        return outfall;
    }

    /// <summary>Outfall volume carrying secondary effluent's nutrients per period, m3: secondary effluent to the
    /// outfall plus the rejection fraction × feed of the plant's nutrient-rejecting stages.</summary>
    public static double[] NutrientBearingM3(PlanningCase planningCase, Plan plan, PlantId plantId)
    {
        var network = planningCase.Network;
        var plant = network.Plant(plantId);
        var volume = plan.PlantPlan(plantId).SecondaryToOutfallM3.ToArray();
        foreach (var stage in PermitNutrient.RejectingStages(network, plant))
        {
            var feed = plan.StagePlan(stage.Id).FeedM3;
            for (var t = 0; t < volume.Length; t++)
            {
                volume[t] += stage.NutrientRejectionFraction * feed[t];
            }
        }
        return volume;
    }

    /// <summary>Nutrient load discharged on local day <paramref name="day"/>, kg: the day's level concentration ×
    /// nutrient-bearing volume plus raw concentration × bypass (mg/L × m3 / 1000).</summary>
    public static double DayLoadKg(PlanningCase planningCase, Plan plan, PlantId plantId, PermitNutrient nutrient, int day)
    {
        var plant = planningCase.Network.Plant(plantId);
        var plantPlan = plan.PlantPlan(plantId);
        var level = plant.Level(plantPlan.LevelByDay[day]);
        var bearing = NutrientBearingM3(planningCase, plan, plantId);
        var periods = planningCase.Horizon.Days[day].PeriodIndices.ToList();
        return (nutrient.EffluentMgPerL(level) * periods.Sum(t => bearing[t]) + nutrient.RawMgPerL * periods.Sum(t => plantPlan.BypassM3[t])) / 1000.0;
    }

    /// <summary>The plant's electrical load per period, kWh: import − export + engine output.</summary>
    public static double[] LoadKWh(PlantPlan plantPlan) =>
        plantPlan.ImportKWh.Select((import, t) => import - plantPlan.ExportKWh[t] + plantPlan.EngineKWh[t]).ToArray();

    /// <summary>Highest grid import over the given periods, kW.</summary>
    public static double PeakImportKw(PlanningCase planningCase, PlantPlan plantPlan, IEnumerable<int> periods) =>
        periods.Select(t => plantPlan.ImportKWh[t] / planningCase.PeriodHours).DefaultIfEmpty(0).Max();

    /// <summary>Water delivered to each customer per period, m3, summed over pipelines from the given tanks.</summary>
    public static double[] DeliveredFromTanks(PlanningCase planningCase, Plan plan, CustomerId customer, IReadOnlySet<TankId> tanks)
    {
        var delivered = new double[planningCase.PeriodCount];
        foreach (var pipeline in planningCase.Network.Pipelines.Where(l => l.To.Customer == customer && tanks.Contains(l.From)))
        {
            var flow = plan.PipelinePlan(pipeline.Id).FlowM3;
            for (var t = 0; t < delivered.Length; t++)
            {
                delivered[t] += flow[t];
            }
        }
        return delivered;
    }
}
