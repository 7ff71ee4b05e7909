using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Extraction;

/// <summary>Every non-zero slack of a solved model as a named, quantified problem in plain words.</summary>
internal static class ProblemReport
{
    // Below these a slack is solver noise, not a problem anyone could act on.
    private const double MinimumM3 = 0.01;
    private const double MinimumKg = 0.001;

    public static IEnumerable<PlanProblem> Find(PlanModel model, Plan plan) =>
        Shortfalls(model, plan)
            .Concat(Bypasses(model))
            .Concat(PermitExcesses(model))
            .Concat(OutfallExcesses(model))
            .Concat(TankLimits(model))
            .Concat(TankEndDeficits(model));

    private static IEnumerable<PlanProblem> Shortfalls(PlanModel model, Plan plan)
    {
        var planningCase = model.Case;
        foreach (var customer in planningCase.Network.Customers)
        {
            foreach (var day in planningCase.Horizon.Days)
            {
                double amount;
                IReadOnlyList<int> periods;
                if (customer.Demand is DailyDemand)
                {
                    amount = model.ShortOnDay[(customer.Id, day.Index)].SolutionValue();
                    periods = day.PeriodIndices.Where(t => planningCase.MaxDeliveryM3[customer.Id][t] > 0).ToList();
                }
                else
                {
                    periods = day.PeriodIndices.Where(t => model.ShortInPeriod[(customer.Id, t)].SolutionValue() > MinimumM3 / 100).ToList();
                    amount = periods.Sum(t => model.ShortInPeriod[(customer.Id, t)].SolutionValue());
                }
                if (amount < MinimumM3)
                {
                    continue;
                }
                var reason = ShortfallReasons.Explain(planningCase, plan, customer, day, periods);
                yield return new PlanProblem("shortfall", customer.Id.Value, day.Date, amount, "m3",
                    $"customer {customer.Name} short {Amounts.Format(amount)} m3 of class {customer.Class} on {Date(day)}: {reason}");
            }
        }
    }

    private static IEnumerable<PlanProblem> Bypasses(PlanModel model)
    {
        var planningCase = model.Case;
        foreach (var plant in planningCase.Network.Plants)
        {
            var influent = planningCase.InfluentM3[plant.Id];
            foreach (var day in planningCase.Horizon.Days)
            {
                var amount = day.PeriodIndices.Sum(t => model.Bypass[(plant.Id, t)].SolutionValue());
                if (amount < MinimumM3)
                {
                    continue;
                }
                var peakM3PerHour = day.PeriodIndices.Max(t => influent[t]) / planningCase.PeriodHours;
                var reason = peakM3PerHour > plant.SecondaryCapacityM3PerHour + 1e-6
                    ? $"influent reaches {Amounts.Format(peakM3PerHour)} m3/h against a secondary capacity of {Amounts.Format(plant.SecondaryCapacityM3PerHour)} m3/h"
                    : $"bypassing cost less than treating at a bypass penalty of {Amounts.Format(planningCase.Network.Penalties.BypassPerM3, 2)} {planningCase.Network.Currency}/m3";
                yield return new PlanProblem("bypass", plant.Id.Value, day.Date, amount, "m3",
                    $"plant {plant.Name} bypasses {Amounts.Format(amount)} m3 of influent around secondary treatment on {Date(day)}: {reason}");
            }
        }
    }

    private static IEnumerable<PlanProblem> PermitExcesses(PlanModel model)
    {
        var planningCase = model.Case;
        var network = planningCase.Network;
        foreach (var ((plantId, key, day), excess) in model.DailyLoadExcess)
        {
            var amount = excess.SolutionValue();
            if (amount < MinimumKg)
            {
                continue;
            }
            var plant = network.Plant(plantId);
            var nutrient = PermitNutrient.Of(plant).First(n => n.Key == key);
            var planDay = planningCase.Horizon.Days[day];
            var rawKg = planDay.PeriodIndices.Sum(t => model.Bypass[(plantId, t)].SolutionValue()) * nutrient.RawMgPerL / 1000.0;
            var reason = rawKg > MinimumKg
                ? $"bypassed raw sewage adds {Amounts.Format(rawKg, 1)} kg"
                : "even the tightest allowed treatment level with all the reuse the network can take leaves more in the outfall";
            yield return new PlanProblem($"{key}DailyExcess", plantId.Value, planDay.Date, amount, "kg",
                $"plant {plant.Name} exceeds its daily {nutrient.Label} cap of {Amounts.Format(nutrient.DailyCapKg!.Value, 1)} kg " +
                $"by {Amounts.Format(amount, 1)} kg on {Date(planDay)}: {reason}");
        }
        foreach (var ((plantId, key, month), excess) in model.MonthlyLoadExcess)
        {
            var amount = excess.SolutionValue();
            if (amount < MinimumKg)
            {
                continue;
            }
            var plant = network.Plant(plantId);
            var nutrient = PermitNutrient.Of(plant).First(n => n.Key == key);
            var firstDay = planningCase.Horizon.Days.First(d => planningCase.BillingMonth[d.FirstPeriod] == month);
            var reason = month == 0 && nutrient.MonthToDateKg >= nutrient.MonthlyCapKg!.Value
                ? $"the month-to-date load of {Amounts.Format(nutrient.MonthToDateKg, 1)} kg already reaches the cap"
                : month == 0
                    ? $"only {Amounts.Format(nutrient.MonthlyCapKg!.Value - nutrient.MonthToDateKg, 1)} kg remain after the month-to-date {Amounts.Format(nutrient.MonthToDateKg, 1)} kg"
                    : "even the tightest allowed treatment level leaves more in the outfall";
            yield return new PlanProblem($"{key}MonthlyExcess", plantId.Value, firstDay.Date, amount, "kg",
                $"plant {plant.Name} exceeds its monthly {nutrient.Label} cap of {Amounts.Format(nutrient.MonthlyCapKg!.Value, 1)} kg " +
                $"for {firstDay.Date:yyyy-MM} by {Amounts.Format(amount, 1)} kg: {reason}");
        }
    }

    private static IEnumerable<PlanProblem> OutfallExcesses(PlanModel model)
    {
        var planningCase = model.Case;
        foreach (var plant in planningCase.Network.Plants.Where(p => p.Permit.MaxOutfallM3PerHour.HasValue))
        {
            foreach (var day in planningCase.Horizon.Days)
            {
                var amount = day.PeriodIndices.Sum(t => model.OutfallExcess[(plant.Id, t)].SolutionValue());
                if (amount < MinimumM3)
                {
                    continue;
                }
                yield return new PlanProblem("outfallExcess", plant.Id.Value, day.Date, amount, "m3",
                    $"plant {plant.Name} discharges {Amounts.Format(amount)} m3 above its maximum outfall flow of " +
                    $"{Amounts.Format(plant.Permit.MaxOutfallM3PerHour!.Value)} m3/h on {Date(day)}: the influent is more than its stages, tanks and customers can take");
            }
        }
    }

    private static IEnumerable<PlanProblem> TankLimits(PlanModel model)
    {
        var planningCase = model.Case;
        foreach (var tank in planningCase.Network.Tanks)
        {
            foreach (var day in planningCase.Horizon.Days)
            {
                var below = day.PeriodIndices.Max(t => model.BelowMinimum[(tank.Id, t)].SolutionValue());
                if (below >= MinimumM3)
                {
                    var reason = tank.InitialM3 < tank.MinM3
                        ? $"it starts at {Amounts.Format(tank.InitialM3)} m3"
                        : "its losses draw it down and nothing can refill it in time";
                    yield return new PlanProblem("tankBelowMinimum", tank.Id.Value, day.Date, below, "m3",
                        $"tank {tank.Name} is up to {Amounts.Format(below)} m3 below its minimum of {Amounts.Format(tank.MinM3)} m3 on {Date(day)}: {reason}");
                }
                var above = day.PeriodIndices.Max(t => model.AboveMaximum[(tank.Id, t)].SolutionValue());
                if (above >= MinimumM3)
                {
                    var reason = tank.InitialM3 > tank.MaxM3
                        ? $"it starts at {Amounts.Format(tank.InitialM3)} m3 and cannot be drawn down faster"
                        : "more water reaches it than can leave it";
                    yield return new PlanProblem("tankAboveMaximum", tank.Id.Value, day.Date, above, "m3",
                        $"tank {tank.Name} is up to {Amounts.Format(above)} m3 above its maximum of {Amounts.Format(tank.MaxM3)} m3 on {Date(day)}: {reason}");
                }
            }
        }
    }

    private static IEnumerable<PlanProblem> TankEndDeficits(PlanModel model)
    {
        var planningCase = model.Case;
        var lastDay = planningCase.Horizon.Days[^1];
        foreach (var tank in planningCase.Network.Tanks)
        {
            var amount = model.EndDeficit[tank.Id].SolutionValue();
            if (amount < MinimumM3)
            {
                continue;
            }
            yield return new PlanProblem("tankEndDeficit", tank.Id.Value, lastDay.Date, amount, "m3",
                $"tank {tank.Name} ends the horizon {Amounts.Format(amount)} m3 below its starting volume of {Amounts.Format(tank.InitialM3)} m3: " +
                $"refilling it would cost more than the end-of-horizon penalty of {Amounts.Format(planningCase.Network.Penalties.TankEndDeficitPerM3, 2)} {planningCase.Network.Currency}/m3");
        }
    }

    private static string Date(PlanDay day) => day.Date.ToString("yyyy-MM-dd", null);
}
