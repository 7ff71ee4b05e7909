using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>
/// The one accounting of what a plan costs, used by the checker and the rule-based baseline alike (never by
/// the MILP builder, so the two are independent). It takes the plan's flows, units, starts, shortfalls,
/// imports and exports as given and works out everything else from the network: loads, outfall,
/// demand charge, penalties (including tank volumes outside their limits, priced per m3 per period). Call it on plans whose shape <see cref="PlanChecker"/> accepts.
/// </summary>
public static class PlanCosting
{
    private const double KWhPerMWh = 1000.0;
    private const double KgPerTonne = 1000.0;

    public static PlanAccounts Compute(PlanningCase planningCase, Plan plan)
    {
        var index = PlanIndex.Of(plan);
        var network = planningCase.Network;
        var plants = network.Plants.ToDictionary(p => p.Id, p => Plant(planningCase, index, p));

        double import = 0, export = 0, carbon = 0, demand = 0, chemicals = 0;
        foreach (var plant in network.Plants)
        {
            var tariff = planningCase.TariffOf(plant);
            var p = index.Plants[plant.Id];
            var prices = planningCase.ImportPricePerMWh[plant.Id];
            for (var t = 0; t < planningCase.PeriodCount; t++)
            {
                import += p.ImportKWh[t] * prices[t] / KWhPerMWh;
                export += p.ExportKWh[t] * tariff.FeedInPricePerMWh / KWhPerMWh;
                carbon += p.ImportKWh[t] / KWhPerMWh * tariff.GridEmissionsKgPerMWh / KgPerTonne * network.CarbonPricePerTonne;
                chemicals += LevelOn(planningCase, plant, p, t).ChemicalCostPerM3 * p.TreatedM3[t];
            }
            demand += plants[plant.Id].DemandChargeByMonth.Sum();
        }
        foreach (var stage in network.Stages)
        {
            chemicals += stage.ChemicalCostPerM3 * index.Stages[stage.Id].FeedM3.Sum();
        }

        var tankDeficits = network.Tanks.ToDictionary(t => t.Id, t => Math.Max(0, t.InitialM3 - index.Tanks[t.Id].EndVolumeM3[^1]));
        var penalties = network.Penalties;
        var costs = new CostBreakdown
        {
            EnergyImport = import,
            EnergyExportCredit = export,
            DemandCharge = demand,
            UnitStarts = network.Stages.Sum(s => s.StartupCost * index.Stages[s.Id].UnitStarts.Sum()),
            Chemicals = chemicals,
            Carbon = carbon,
            ShortfallPenalty = network.Customers.Sum(c => c.ShortfallPenaltyPerM3 * index.Customers[c.Id].ShortfallM3.Sum()),
            BypassPenalty = penalties.BypassPerM3 * network.Plants.Sum(p => index.Plants[p.Id].BypassM3.Sum()),
            PermitPenalty = penalties.PermitExcessPerKg * plants.Values.Sum(a => Excess(a.TotalNitrogen) + Excess(a.TotalPhosphorus)),
            OutfallPenalty = penalties.OutfallExcessPerM3 * plants.Values.Sum(a => a.OutfallExcessM3.Sum()),
            TankEndPenalty = penalties.TankEndDeficitPerM3 * tankDeficits.Values.Sum(),
            TankLimitPenalty = penalties.TankLimitPerM3 * network.Tanks.Sum(k => index.Tanks[k.Id].EndVolumeM3.Sum(v => OutsideM3(k, v))),
        };
        return new PlanAccounts(costs, plants, tankDeficits);
    }

    /// <summary>The treatment level a plan runs a plant at in period <paramref name="t"/>.</summary>
    public static TreatmentLevel LevelOn(PlanningCase planningCase, Plant plant, PlantPlan plan, int t) =>
        plant.Level(plan.LevelByDay[planningCase.Horizon.Periods[t].Day]);

    /// <summary>How far a tank volume is below its minimum or above its maximum, m3.</summary>
    public static double OutsideM3(Tank tank, double volumeM3) => Math.Max(0, tank.MinM3 - volumeM3) + Math.Max(0, volumeM3 - tank.MaxM3);

    private static double Excess(LoadAccount load) => load.DailyExcessKg.Sum() + load.MonthlyExcessKg.Sum();

    private static PlantAccounts Plant(PlanningCase planningCase, PlanIndex index, Plant plant)
    {
        var periods = planningCase.PeriodCount;
        var hours = planningCase.PeriodHours;
        var p = index.Plants[plant.Id];
        var pipelines = planningCase.Network.Pipelines.Where(l => l.PoweredBy == plant.Id).ToList();
        var aeration = new double[periods];
        var stageEnergy = new double[periods];
        var pumps = new double[periods];
        var load = new double[periods];
        var outfall = new double[periods];
        var outfallExcess = new double[periods];
        var bearing = new double[periods];
        // Rejects carry the plant's effluent nutrients when the stage takes the plant's own water: secondary effluent
        // or a tank at the plant. A stage fed from elsewhere (a regional reservoir) is left out, as in the MILP.
        var rejecting = plant.Stages.Where(s => s.FeedTank is not { } feed || planningCase.Network.Tank(feed).Plant == plant.Id).ToList();
        for (var t = 0; t < periods; t++)
        {
            aeration[t] = LevelOn(planningCase, plant, p, t).AerationEnergyKWhPerM3 * p.TreatedM3[t];
            stageEnergy[t] = plant.Stages.Sum(s => s.EnergyKWhPerM3 * index.Stages[s.Id].FeedM3[t]);
            pumps[t] = pipelines.Sum(l => l.EnergyKWhPerM3 * index.Pipelines[l.Id].FlowM3[t]);
            load[t] = aeration[t] + stageEnergy[t] + pumps[t] + plant.BaseLoadKw * hours;
            var rejects = plant.Stages.Sum(s => (1 - s.RecoveryFraction) * index.Stages[s.Id].FeedM3[t]);
            outfall[t] = p.SecondaryToOutfallM3[t] + rejects + p.BypassM3[t];
            outfallExcess[t] = plant.Permit.MaxOutfallM3PerHour is { } max ? Math.Max(0, outfall[t] - max * hours) : 0;
            bearing[t] = p.SecondaryToOutfallM3[t] + rejecting.Sum(s => s.NutrientRejectionFraction * index.Stages[s.Id].FeedM3[t]);
        }

        var permit = plant.Permit;
        var (peaks, charges) = DemandCharge(planningCase, plant, p);
        return new PlantAccounts
        {
            Plant = plant.Id,
            AerationKWh = aeration,
            StageKWh = stageEnergy,
            PumpKWh = pumps,
            LoadKWh = load,
            OutfallM3 = outfall,
            OutfallExcessM3 = outfallExcess,
            NitrogenBearingM3 = bearing,
            TotalNitrogen = Load(planningCase, p, bearing, l => l.EffluentTotalNitrogenMgPerL, plant.RawTotalNitrogenMgPerL,
                plant, permit.DailyTotalNitrogenKg, permit.MonthlyTotalNitrogenKg, permit.MonthToDateTotalNitrogenKg),
            TotalPhosphorus = Load(planningCase, p, bearing, l => l.EffluentTotalPhosphorusMgPerL, plant.RawTotalPhosphorusMgPerL,
                plant, permit.DailyTotalPhosphorusKg, permit.MonthlyTotalPhosphorusKg, permit.MonthToDateTotalPhosphorusKg),
            PeakImportKwByMonth = peaks,
            DemandChargeByMonth = charges,
        };
    }

    // mg/L × m3 = g, so kg = mg/L × m3 / 1000.
    private static LoadAccount Load(PlanningCase planningCase, PlantPlan p, double[] bearingM3, Func<TreatmentLevel, double> effluentMgPerL,
        double rawMgPerL, Plant plant, double? dailyCap, double? monthlyCap, double monthToDate)
    {
        var days = planningCase.Horizon.Days;
        var byDay = new double[days.Count];
        foreach (var day in days)
        {
            var level = plant.Level(p.LevelByDay[day.Index]);
            byDay[day.Index] = day.PeriodIndices.Sum(t => bearingM3[t] * effluentMgPerL(level) + p.BypassM3[t] * rawMgPerL) / 1000.0;
        }
        var byMonth = new double[planningCase.BillingMonthCount];
        byMonth[0] = monthToDate;
        foreach (var day in days)
        {
            byMonth[planningCase.BillingMonth[day.FirstPeriod]] += byDay[day.Index];
        }
        return new LoadAccount(
            byDay,
            dailyCap,
            byDay.Select(kg => dailyCap is { } cap ? Math.Max(0, kg - cap) : 0).ToArray(),
            byMonth,
            monthlyCap,
            byMonth.Select(kg => monthlyCap is { } cap ? Math.Max(0, kg - cap) : 0).ToArray());
    }

    // The demand charge bills the rise of each month's peak import above the peak already set this month
    // (reported for the first month only; a later month in the horizon starts from zero).
    private static (double[] PeaksKw, double[] Charges) DemandCharge(PlanningCase planningCase, Plant plant, PlantPlan p)
    {
        var months = planningCase.BillingMonthCount;
        var peaks = new double[months];
        for (var t = 0; t < planningCase.PeriodCount; t++)
        {
            var m = planningCase.BillingMonth[t];
            peaks[m] = Math.Max(peaks[m], p.ImportKWh[t] / planningCase.PeriodHours);
        }
        var rate = planningCase.TariffOf(plant).DemandChargePerKwMonth;
        var charges = peaks.Select((peak, m) => rate * Math.Max(0, peak - (m == 0 ? plant.MonthToDatePeakKw : 0))).ToArray();
        return (peaks, charges);
    }
}
