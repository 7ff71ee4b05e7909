using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Discharge permits: concentration limits on the chosen level, daily and monthly load caps, outfall flow.</summary>
internal static class PermitChecks
{
    public static void Check(Findings findings, PlanIndex index, PlanAccounts accounts)
    {
        foreach (var plant in findings.Case.Network.Plants)
        {
            var a = accounts.Plants[plant.Id];
            CheckConcentrations(findings, index, plant);
            CheckLoadCaps(findings, plant, a.TotalNitrogen, "total N", ViolationKind.DailyNitrogenCap, ViolationKind.MonthlyNitrogenCap);
            CheckLoadCaps(findings, plant, a.TotalPhosphorus, "total P", ViolationKind.DailyPhosphorusCap, ViolationKind.MonthlyPhosphorusCap);
            CheckOutfallFlow(findings, plant, a);
        }
    }

    private static void CheckConcentrations(Findings findings, PlanIndex index, Plant plant)
    {
        var levels = index.Plants[plant.Id].LevelByDay;
        for (var d = 0; d < levels.Count; d++)
        {
            var level = plant.Level(levels[d]);
            Concentration(findings, plant, d, level, "total N", level.EffluentTotalNitrogenMgPerL, plant.Permit.MaxTotalNitrogenMgPerL);
            Concentration(findings, plant, d, level, "total P", level.EffluentTotalPhosphorusMgPerL, plant.Permit.MaxTotalPhosphorusMgPerL);
        }
    }

    // The permit forbids the level outright, so no tolerance beyond the usual rounding applies.
    private static void Concentration(Findings findings, Plant plant, int day, TreatmentLevel level, string substance, double mgPerL, double? limit)
    {
        if (limit is { } max && findings.Tolerances.Above(mgPerL, max))
        {
            findings.AtDay(ViolationKind.ConcentrationLimit, plant.Id.Value, day, mgPerL - max, "mg/L", max,
                $"plant {plant.Id} runs level {level.Id} with effluent {substance} of {Findings.Q(mgPerL)} mg/L, above its permit's {Findings.Q(max)} mg/L");
        }
    }

    private static void CheckLoadCaps(Findings findings, Plant plant, LoadAccount load, string substance, string dailyKind, string monthlyKind)
    {
        var tol = findings.Tolerances;
        if (load.DailyCapKg is { } daily)
        {
            for (var d = 0; d < load.KgByDay.Length; d++)
            {
                if (tol.Above(load.KgByDay[d], daily))
                {
                    findings.AtDay(dailyKind, plant.Id.Value, d, load.KgByDay[d] - daily, "kg", daily,
                        $"plant {plant.Id} discharges {Findings.Q(load.KgByDay[d])} kg of {substance}, above its daily cap of {Findings.Q(daily)} kg",
                        penalised: true);
                }
            }
        }
        if (load.MonthlyCapKg is { } monthly)
        {
            foreach (var (kg, month) in load.KgByMonth.Select((kg, m) => (kg, m)))
            {
                if (tol.Above(kg, monthly))
                {
                    var firstDay = findings.Case.Horizon.Days.First(d => findings.Case.BillingMonth[d.FirstPeriod] == month);
                    var counted = month == 0 ? " (with the month-to-date load)" : "";
                    findings.AtDay(monthlyKind, plant.Id.Value, firstDay.Index, kg - monthly, "kg", monthly,
                        $"plant {plant.Id} discharges {Findings.Q(kg)} kg of {substance} in the month of {firstDay.Date:yyyy-MM}{counted}, " +
                        $"above its monthly cap of {Findings.Q(monthly)} kg",
                        penalised: true);
                }
            }
        }
    }

    private static void CheckOutfallFlow(Findings findings, Plant plant, PlantAccounts accounts)
    {
        if (plant.Permit.MaxOutfallM3PerHour is not { } max)
        {
            return;
        }
        var limit = max * findings.Case.PeriodHours;
        for (var t = 0; t < accounts.OutfallM3.Length; t++)
        {
            if (findings.Tolerances.Above(accounts.OutfallM3[t], limit))
            {
                findings.AtPeriod(ViolationKind.OutfallFlow, plant.Id.Value, t, accounts.OutfallM3[t] - limit, "m3", limit,
                    $"plant {plant.Id} sends {Findings.Q(accounts.OutfallM3[t])} m3 to its outfall, above its permit's {Findings.Q(limit)} m3 in the period",
                    penalised: true);
            }
        }
    }
}
