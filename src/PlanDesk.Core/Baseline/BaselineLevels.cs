using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// The treatment level an operator sets each day: the standard level, unless its effluent breaks a
/// concentration limit (then the first level in the plant's list that does not), or the day's forecast
/// load would break a daily cap or take more than the day's even share of the month's remaining allowance
/// (then the first allowed level that keeps within both; failing that, the allowed level with the smallest excess).
/// </summary>
internal static class BaselineLevels
{
    public static LevelId[] Choose(PlanningCase planningCase, Plant plant, double[] nitrogenBearingM3, double[] bypassM3)
    {
        var permit = plant.Permit;
        var allowed = plant.Levels.Where(l => Meets(l, permit)).ToList();
        if (allowed.Count == 0)
        {
            // No level meets the limits: the one that misses them least (reported as a problem).
            allowed = [plant.Levels.MinBy(l => Excess(l.EffluentTotalNitrogenMgPerL, permit.MaxTotalNitrogenMgPerL)
                + Excess(l.EffluentTotalPhosphorusMgPerL, permit.MaxTotalPhosphorusMgPerL))!];
        }
        var usual = allowed.FirstOrDefault(l => l.Id == plant.StandardLevel) ?? allowed[0];
        var monthN = new double[planningCase.BillingMonthCount];
        var monthP = new double[planningCase.BillingMonthCount];
        monthN[0] = permit.MonthToDateTotalNitrogenKg;
        monthP[0] = permit.MonthToDateTotalPhosphorusKg;

        var levels = new LevelId[planningCase.Horizon.Days.Count];
        foreach (var day in planningCase.Horizon.Days)
        {
            var m = planningCase.BillingMonth[day.FirstPeriod];
            var bearing = day.PeriodIndices.Sum(t => nitrogenBearingM3[t]);
            var bypass = day.PeriodIndices.Sum(t => bypassM3[t]);
            // Load in kg: mg/L × m3 / 1000.
            double LoadN(TreatmentLevel l) => (bearing * l.EffluentTotalNitrogenMgPerL + bypass * plant.RawTotalNitrogenMgPerL) / 1000.0;
            double LoadP(TreatmentLevel l) => (bearing * l.EffluentTotalPhosphorusMgPerL + bypass * plant.RawTotalPhosphorusMgPerL) / 1000.0;
            double Over(TreatmentLevel l) =>
                Excess(LoadN(l), permit.DailyTotalNitrogenKg) + Excess(monthN[m] + LoadN(l), permit.MonthlyTotalNitrogenKg)
                + Excess(LoadP(l), permit.DailyTotalPhosphorusKg) + Excess(monthP[m] + LoadP(l), permit.MonthlyTotalPhosphorusKg);
            // The month's remaining allowance is spread evenly over the days left in the calendar month.
            var daysLeft = day.Date.Calendar.GetDaysInMonth(day.Date.Year, day.Date.Month) - day.Date.Day + 1;
            bool Fits(TreatmentLevel l) =>
                Excess(LoadN(l), permit.DailyTotalNitrogenKg) + Excess(LoadP(l), permit.DailyTotalPhosphorusKg) <= 0
                && Excess(LoadN(l), Share(permit.MonthlyTotalNitrogenKg, monthN[m], daysLeft)) <= 0
                && Excess(LoadP(l), Share(permit.MonthlyTotalPhosphorusKg, monthP[m], daysLeft)) <= 0;

            var chosen = Fits(usual) ? usual : allowed.FirstOrDefault(Fits) ?? allowed.MinBy(Over)!;
            levels[day.Index] = chosen.Id;
            monthN[m] += LoadN(chosen);
            monthP[m] += LoadP(chosen);
        }
        return levels;
    }

    /// <summary>True when a level's effluent meets the permit's concentration limits.</summary>
    public static bool Meets(TreatmentLevel level, Permit permit) =>
        Excess(level.EffluentTotalNitrogenMgPerL, permit.MaxTotalNitrogenMgPerL) <= 0
        && Excess(level.EffluentTotalPhosphorusMgPerL, permit.MaxTotalPhosphorusMgPerL) <= 0;

    private static double? Share(double? monthlyCapKg, double usedKg, int daysLeft) =>
        monthlyCapKg is { } cap ? (cap - usedKg) / daysLeft : null;

    private static double Excess(double value, double? limit) => limit is { } max ? Math.Max(0, value - max) : 0;
}
