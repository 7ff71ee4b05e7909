using NodaTime;
using NodaTime.Text;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;

namespace PlanDesk.Server.Views;

/// <summary>
/// Lays a plan's decisions out per period beside the data they are read against. Production by class, outfall and
/// permit loads come from the plan's target sheets, so the desk shows exactly what a plant would be sent.
/// </summary>
internal static class PlanSeriesBuilder
{
    private static readonly OffsetPattern OffsetText = OffsetPattern.CreateWithInvariantCulture("+HH:mm");

    public static PlanSeriesResponse Create(long planId, PlanningCase planningCase, Plan plan, IReadOnlyList<PlantDayTargets> sheets)
    {
        var network = planningCase.Network;
        var horizon = planningCase.Horizon;
        var hasPlan = plan.Solve.Status != SolveStatus.NoPlan && plan.Plants.Count > 0;
        var periods = horizon.Periods
            .Select(p => new SeriesPeriod(p.Index, p.Start, p.LocalStart, OffsetText.Format(p.Start.InZone(horizon.Zone).Offset), p.Day))
            .ToList();
        var days = horizon.Days.Select(d => new SeriesDay(d.Index, d.Date, d.FirstPeriod, d.PeriodCount)).ToList();
        var periodOf = horizon.Periods.ToDictionary(p => p.Start, p => p.Index);
        var sheetsOf = sheets.ToLookup(s => s.Plant);

        var plants = network.Plants
            .Select(plant => PlantOf(plant, planningCase, hasPlan ? plan : null, sheetsOf[plant.Id].OrderBy(s => s.Date).ToList(), periodOf))
            .ToList();
        var reservoirs = network.Tanks.Where(t => t.Plant is null).Select(t => TankOf(t, hasPlan ? plan : null, planningCase.PeriodCount)).ToList();
        var customers = network.Customers.Select(c => CustomerOf(c, planningCase, hasPlan ? plan : null)).ToList();
        var classes = network.Classes.Select(c => new ClassInfo(c.Id.Value, c.Name, c.Rank)).ToList();
        return new PlanSeriesResponse(planId, network.Name, network.Currency, horizon.Zone.Id, horizon.PeriodMinutes,
            classes, periods, days, plants, reservoirs, customers);
    }

    private static PlantSeries PlantOf(Plant plant, PlanningCase planningCase, Plan? plan, IReadOnlyList<PlantDayTargets> sheets, Dictionary<Instant, int> periodOf)
    {
        var count = planningCase.PeriodCount;
        var hours = planningCase.PeriodHours;
        var plantPlan = plan?.Plants.FirstOrDefault(p => p.Plant == plant.Id);
        var production = new Dictionary<string, double[]>();
        var outfall = new double[count];
        foreach (var hour in sheets.SelectMany(s => s.Hours))
        {
            if (!periodOf.TryGetValue(hour.Start, out var t))
            {
                continue;
            }
            outfall[t] = hour.OutfallM3;
            foreach (var (classId, volume) in hour.ProductionM3ByClass)
            {
                if (!production.TryGetValue(classId.Value, out var byPeriod))
                {
                    production[classId.Value] = byPeriod = new double[count];
                }
                byPeriod[t] = volume;
            }
        }
        var stages = plant.Stages.Select(stage =>
        {
            var stagePlan = plan?.Stages.FirstOrDefault(s => s.Stage == stage.Id);
            return new StageSeries(stage.Id.Value, stage.Name, stage.ProducesClass.Value, stage.Units,
                stagePlan?.UnitsRunning ?? new int[count], planningCase.AvailableUnits[stage.Id], stagePlan?.FeedM3 ?? new double[count]);
        }).ToList();
        var tanks = planningCase.Network.Tanks.Where(t => t.Plant == plant.Id).Select(t => TankOf(t, plan, count)).ToList();
        var tariff = planningCase.TariffOf(plant);
        var energy = new EnergySeries(
            plantPlan?.ImportKWh ?? new double[count], plantPlan?.ExportKWh ?? new double[count], plantPlan?.EngineKWh ?? new double[count],
            planningCase.ImportPricePerMWh[plant.Id], tariff.FeedInPricePerMWh, plant.Biogas?.EngineKw,
            plant.Biogas is null ? null : plantPlan?.HolderEndNm3 ?? new double[count], plant.Biogas?.HolderNm3);
        var levels = plant.Levels
            .Select(l => new LevelInfo(l.Id.Value, l.Name, l.EffluentTotalNitrogenMgPerL, l.EffluentTotalPhosphorusMgPerL))
            .ToList();
        return new PlantSeries(plant.Id.Value, plant.Name, planningCase.InfluentM3[plant.Id],
            plantPlan?.TreatedM3 ?? new double[count], plantPlan?.BypassM3 ?? new double[count], plant.SecondaryCapacityM3PerHour * hours,
            production, outfall, plant.Permit.MaxOutfallM3PerHour * hours, stages, tanks, energy, levels,
            plantPlan?.LevelByDay.Select(l => l.Value).ToList() ?? [], PermitDays(plant, sheets, planningCase.Horizon.StartDate));
    }

    /// <summary>Each day's loads with month-to-date totals: the permit's month-to-date load counts for the month the
    /// horizon starts in; a later month of the horizon starts from zero.</summary>
    private static List<PermitDay> PermitDays(Plant plant, IReadOnlyList<PlantDayTargets> sheets, LocalDate startDate)
    {
        var permit = plant.Permit;
        var days = new List<PermitDay>();
        double nitrogenToDate = permit.MonthToDateTotalNitrogenKg, phosphorusToDate = permit.MonthToDateTotalPhosphorusKg;
        var month = (startDate.Year, startDate.Month);
        foreach (var sheet in sheets)
        {
            if ((sheet.Date.Year, sheet.Date.Month) != month)
            {
                month = (sheet.Date.Year, sheet.Date.Month);
                nitrogenToDate = phosphorusToDate = 0;
            }
            var load = sheet.Permit;
            nitrogenToDate += load.TotalNitrogenKg;
            phosphorusToDate += load.TotalPhosphorusKg;
            days.Add(new PermitDay(sheet.Date, load.OutfallM3,
                load.TotalNitrogenKg, load.DailyTotalNitrogenCapKg, nitrogenToDate, permit.MonthlyTotalNitrogenKg,
                load.TotalPhosphorusKg, load.DailyTotalPhosphorusCapKg, phosphorusToDate, permit.MonthlyTotalPhosphorusKg));
        }
        return days;
    }

    private static TankSeries TankOf(Tank tank, Plan? plan, int count) => new(tank.Id.Value, tank.Name, tank.Class.Value,
        plan?.Tanks.FirstOrDefault(t => t.Tank == tank.Id)?.EndVolumeM3 ?? new double[count], tank.MinM3, tank.MaxM3, tank.InitialM3);

    private static CustomerSeries CustomerOf(Customer customer, PlanningCase planningCase, Plan? plan)
    {
        var count = planningCase.PeriodCount;
        var customerPlan = plan?.Customers.FirstOrDefault(c => c.Customer == customer.Id);
        var marginal = new double?[count];
        foreach (var cost in plan?.MarginalWaterCosts.Where(m => m.Customer == customer.Id) ?? [])
        {
            if (cost.Period >= 0 && cost.Period < count)
            {
                marginal[cost.Period] = cost.CostPerM3;
            }
        }
        var hourly = planningCase.DemandM3.GetValueOrDefault(customer.Id);
        var daily = planningCase.DailyVolumeM3.GetValueOrDefault(customer.Id);
        var shortfall = customerPlan?.ShortfallM3 ?? new double[hourly is null ? planningCase.Horizon.DayCount : count];
        return new CustomerSeries(customer.Id.Value, customer.Name, customer.Kind, customer.Class.Value, customer.Priority,
            hourly, daily, customerPlan?.DeliveredM3 ?? new double[count], shortfall, marginal);
    }
}
