using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Explaining;

/// <summary>Limits a plan runs into, one entry per element and local day with the hours it is at the limit.</summary>
internal static class BindingLimits
{
    public static List<BindingLimit> Find(PlanningCase planningCase, Plan plan)
    {
        var limits = new List<BindingLimit>();
        var network = planningCase.Network;
        var hours = planningCase.PeriodHours;
        foreach (var stage in network.Stages)
        {
            var feed = plan.StagePlan(stage.Id).FeedM3;
            var available = planningCase.AvailableUnits[stage.Id];
            limits.AddRange(PerDay(planningCase, "stageCapacity", stage.Id.Value,
                t => available[t] > 0 && AtOrAbove(feed[t], stage.UnitMaxFlowM3PerHour * hours * available[t]),
                $"stage {stage.Name} runs every available unit at full flow"));
        }
        foreach (var pipeline in network.Pipelines)
        {
            var flow = plan.PipelinePlan(pipeline.Id).FlowM3;
            limits.AddRange(PerDay(planningCase, "pipelineCapacity", pipeline.Id.Value,
                t => pipeline.CapacityM3PerHour > 0 && AtOrAbove(flow[t], pipeline.CapacityM3PerHour * hours),
                $"pipeline {pipeline.Name} carries its capacity of {Amounts.Format(pipeline.CapacityM3PerHour)} m3/h"));
        }
        foreach (var tank in network.Tanks)
        {
            var volume = plan.TankPlan(tank.Id).EndVolumeM3;
            limits.AddRange(PerDay(planningCase, "tankFull", tank.Id.Value, t => AtOrAbove(volume[t], tank.MaxM3),
                $"tank {tank.Name} is full ({Amounts.Format(tank.MaxM3)} m3)"));
            limits.AddRange(PerDay(planningCase, "tankEmpty", tank.Id.Value, t => AtOrAbove(tank.MinM3, volume[t]),
                $"tank {tank.Name} is at its minimum ({Amounts.Format(tank.MinM3)} m3)"));
        }
        foreach (var plant in network.Plants)
        {
            limits.AddRange(PlantLimits(planningCase, plan, plant));
        }
        return limits;
    }

    private static IEnumerable<BindingLimit> PlantLimits(PlanningCase planningCase, Plan plan, Plant plant)
    {
        var hours = planningCase.PeriodHours;
        var plantPlan = plan.PlantPlan(plant.Id);
        foreach (var limit in PerDay(planningCase, "secondaryCapacity", plant.Id.Value,
                     t => AtOrAbove(plantPlan.TreatedM3[t], plant.SecondaryCapacityM3PerHour * hours),
                     $"plant {plant.Name} treats its secondary capacity of {Amounts.Format(plant.SecondaryCapacityM3PerHour)} m3/h"))
        {
            yield return limit;
        }
        if (plant.Biogas is { } biogas)
        {
            foreach (var limit in PerDay(planningCase, "engineSize", plant.Id.Value,
                         t => AtOrAbove(plantPlan.EngineKWh[t], biogas.EngineKw * hours),
                         $"plant {plant.Name}'s engine runs at its size of {Amounts.Format(biogas.EngineKw)} kW"))
            {
                yield return limit;
            }
        }
        if (plant.Permit.MaxOutfallM3PerHour is { } maxOutfall)
        {
            var outfall = PlanFigures.OutfallM3(planningCase, plan, plant.Id);
            foreach (var limit in PerDay(planningCase, "outfallMax", plant.Id.Value, t => AtOrAbove(outfall[t], maxOutfall * hours),
                         $"plant {plant.Name} discharges its maximum outfall flow of {Amounts.Format(maxOutfall)} m3/h"))
            {
                yield return limit;
            }
        }
        foreach (var limit in PermitCaps(planningCase, plan, plant))
        {
            yield return limit;
        }
    }

    private static IEnumerable<BindingLimit> PermitCaps(PlanningCase planningCase, Plan plan, Plant plant)
    {
        var days = planningCase.Horizon.Days;
        foreach (var nutrient in PermitNutrient.Of(plant).Where(n => n.Capped))
        {
            var loads = days.Select(d => PlanFigures.DayLoadKg(planningCase, plan, plant.Id, nutrient, d.Index)).ToArray();
            if (nutrient.DailyCapKg is { } dailyCap)
            {
                foreach (var day in days.Where(d => AtOrAbove(loads[d.Index], dailyCap)))
                {
                    yield return new BindingLimit("permitDailyCap", plant.Id.Value, day.FirstPeriod, day.Date,
                        $"plant {plant.Name} discharges {Amounts.Format(loads[day.Index], 1)} kg of {nutrient.Label} on {day.Date:yyyy-MM-dd}, " +
                        $"its daily cap of {Amounts.Format(dailyCap, 1)} kg");
                }
            }
            if (nutrient.MonthlyCapKg is { } monthlyCap)
            {
                foreach (var month in days.GroupBy(d => planningCase.BillingMonth[d.FirstPeriod]))
                {
                    var total = month.Sum(d => loads[d.Index]) + (month.Key == 0 ? nutrient.MonthToDateKg : 0);
                    if (AtOrAbove(total, monthlyCap))
                    {
                        var first = month.First();
                        yield return new BindingLimit("permitMonthlyCap", plant.Id.Value, first.FirstPeriod, first.Date,
                            $"plant {plant.Name} reaches its monthly {nutrient.Label} cap of {Amounts.Format(monthlyCap, 1)} kg for {first.Date:yyyy-MM}");
                    }
                }
            }
        }
    }

    // One entry per local day with the runs of hours at the limit, e.g. "02:00–06:00, 22:00–24:00".
    private static IEnumerable<BindingLimit> PerDay(PlanningCase planningCase, string kind, string where, Func<int, bool> atLimit, string what)
    {
        var horizon = planningCase.Horizon;
        foreach (var day in horizon.Days)
        {
            var periods = day.PeriodIndices.Where(atLimit).ToList();
            if (periods.Count == 0)
            {
                continue;
            }
            yield return new BindingLimit(kind, where, periods[0], day.Date, $"{what} on {day.Date:yyyy-MM-dd} {Runs(planningCase, periods)}");
        }
    }

    private static string Runs(PlanningCase planningCase, List<int> periods)
    {
        var horizon = planningCase.Horizon;
        var runs = new List<string>();
        var start = periods[0];
        for (var i = 1; i <= periods.Count; i++)
        {
            if (i < periods.Count && periods[i] == periods[i - 1] + 1)
            {
                continue;
            }
            var last = periods[i - 1];
            var from = horizon.Periods[start].LocalStart.TimeOfDay;
            var to = horizon.Periods[last].LocalStart.TimeOfDay.PlusMinutes(horizon.PeriodMinutes);
            runs.Add($"{from:HH:mm}–{(to == NodaTime.LocalTime.Midnight ? "24:00" : to.ToString("HH:mm", null))}");
            if (i < periods.Count)
            {
                start = periods[i];
            }
        }
        return string.Join(", ", runs);
    }

    private static bool AtOrAbove(double value, double limit) => value >= limit - (1e-3 + 1e-6 * Math.Abs(limit));
}
