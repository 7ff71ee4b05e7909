using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Targets;

/// <summary>Cuts a plan into what each plant is asked to do on each local day of the horizon.</summary>
public static class PlantDayTargetsBuilder
{
    /// <summary>Targets for every plant and local day; none when the plan has no schedule (status noPlan).</summary>
    public static IReadOnlyList<PlantDayTargets> Build(PlanningCase planningCase, Plan plan)
    {
        if (plan.Plants.Count == 0)
        {
            return [];
        }
        return planningCase.Network.Plants
            .SelectMany(p => planningCase.Horizon.Days.Select(d => Build(planningCase, plan, p.Id, d.Index)))
            .ToList();
    }

    public static PlantDayTargets Build(PlanningCase planningCase, Plan plan, PlantId plantId, int day)
    {
        var network = planningCase.Network;
        var plant = network.Plant(plantId);
        var planDay = planningCase.Horizon.Days[day];
        var plantPlan = plan.PlantPlan(plantId);
        var level = plant.Level(plantPlan.LevelByDay[day]);
        var outfall = PlanFigures.OutfallM3(planningCase, plan, plantId);
        var periods = planDay.PeriodIndices.ToList();

        return new PlantDayTargets
        {
            Plant = plantId,
            PlantName = plant.Name,
            Date = planDay.Date,
            TimeZone = network.TimeZone.Id,
            Currency = network.Currency,
            TreatmentLevel = level.Id,
            TreatmentLevelName = level.Name,
            EffluentTotalNitrogenMgPerL = level.EffluentTotalNitrogenMgPerL,
            EffluentTotalPhosphorusMgPerL = level.EffluentTotalPhosphorusMgPerL,
            Hours = periods.Select(t => Hour(planningCase, plan, plant, t, outfall[t])).ToList(),
            Permit = PermitOf(planningCase, plan, plant, day, periods.Sum(t => outfall[t])),
            Energy = EnergyOf(planningCase, plantPlan, periods),
            Deliveries = DeliveriesOf(planningCase, plan, plant, periods),
            Tanks = PlantTanks(network, plant).Select(k => new TankLimits(k.Id, k.Name, k.Class, k.MinM3, k.MaxM3)).ToList(),
        };
    }

    private static HourTarget Hour(PlanningCase planningCase, Plan plan, Plant plant, int t, double outfallM3)
    {
        var plantPlan = plan.PlantPlan(plant.Id);
        var period = planningCase.Horizon.Periods[t];
        return new HourTarget
        {
            Start = period.Start,
            LocalStart = period.LocalStart,
            TreatedM3 = plantPlan.TreatedM3[t],
            BypassM3 = plantPlan.BypassM3[t],
            ProductionM3ByClass = plant.Stages
                .GroupBy(s => s.ProducesClass)
                .ToDictionary(g => g.Key, g => g.Sum(s => s.RecoveryFraction * plan.StagePlan(s.Id).FeedM3[t])),
            UnitsRunning = plant.Stages.ToDictionary(s => s.Id, s => plan.StagePlan(s.Id).UnitsRunning[t]),
            TankEndM3 = PlantTanks(planningCase.Network, plant).ToDictionary(k => k.Id, k => plan.TankPlan(k.Id).EndVolumeM3[t]),
            OutfallM3 = outfallM3,
            ImportKWh = plantPlan.ImportKWh[t],
            EngineKWh = plantPlan.EngineKWh[t],
            ExportKWh = plantPlan.ExportKWh[t],
        };
    }

    private static PermitTargets PermitOf(PlanningCase planningCase, Plan plan, Plant plant, int day, double outfallM3)
    {
        var nutrients = PermitNutrient.Of(plant);
        var nitrogen = nutrients[0];
        var phosphorus = nutrients[1];
        var nitrogenKg = PlanFigures.DayLoadKg(planningCase, plan, plant.Id, nitrogen, day);
        var phosphorusKg = PlanFigures.DayLoadKg(planningCase, plan, plant.Id, phosphorus, day);
        return new PermitTargets(
            outfallM3,
            nitrogenKg,
            nitrogen.DailyCapKg,
            nitrogen.DailyCapKg - nitrogenKg,
            phosphorusKg,
            phosphorus.DailyCapKg,
            phosphorus.DailyCapKg - phosphorusKg);
    }

    private static EnergyBudget EnergyOf(PlanningCase planningCase, PlantPlan plantPlan, List<int> periods)
    {
        var load = PlanFigures.LoadKWh(plantPlan);
        return new EnergyBudget(
            periods.Sum(t => plantPlan.ImportKWh[t]),
            periods.Sum(t => plantPlan.EngineKWh[t]),
            periods.Sum(t => plantPlan.ExportKWh[t]),
            periods.Sum(t => load[t]),
            PlanFigures.PeakImportKw(planningCase, plantPlan, periods));
    }

    // Every customer a pipeline from one of the plant's tanks serves, with what the plan sends it that day.
    private static List<DeliveryTarget> DeliveriesOf(PlanningCase planningCase, Plan plan, Plant plant, List<int> periods)
    {
        var network = planningCase.Network;
        var tanks = PlantTanks(network, plant).Select(k => k.Id).ToHashSet();
        return network.Pipelines
            .Where(l => tanks.Contains(l.From) && l.To.Customer is not null)
            .Select(l => l.To.Customer!.Value)
            .Distinct()
            .Select(id =>
            {
                var customer = network.Customer(id);
                var delivered = PlanFigures.DeliveredFromTanks(planningCase, plan, id, tanks);
                return new DeliveryTarget(id, customer.Name, customer.Class, periods.Sum(t => delivered[t]));
            })
            .ToList();
    }

    private static IEnumerable<Tank> PlantTanks(Network network, Plant plant) => network.Tanks.Where(k => k.Plant == plant.Id);
}
