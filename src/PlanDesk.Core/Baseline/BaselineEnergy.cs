using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>A plant's gas and engine under the operator's rule, per period.</summary>
internal sealed record GasSchedule(double[] ToEngineNm3, double[] FlaredNm3, double[] HolderEndNm3, double[] EngineKWh)
{
    /// <summary>No gas used: the draft the load is costed with before the engine rule can look at it.</summary>
    public static GasSchedule None(int periods) => new(new double[periods], new double[periods], new double[periods], new double[periods]);
}

/// <summary>
/// The engine follows gas production: it burns the gas that comes in, up to its size, the holder keeps the rest
/// and the flare takes what the holder cannot. One rule against needless peaks, as operators run a gas holder
/// against a peak-load alarm: when the plant's import would rise above the highest import already billed this
/// month, the engine burns gas from the holder (up to its size) to hold the import at that level; when the import
/// is below it, the engine burns less to bring the holder back to its start level, never taking the import above
/// it. The holder ends the horizon no lower than it started: the engine never burns gas the holder could not get
/// back before the end. No prices are looked at. Import and export then close each plant's balance.
/// </summary>
internal static class BaselineEnergy
{
    /// <param name="loadKWh">The plant's electrical load per period, before the engine.</param>
    public static GasSchedule Gas(PlanningCase planningCase, Plant plant, double[] loadKWh)
    {
        var periods = planningCase.PeriodCount;
        var schedule = GasSchedule.None(periods);
        if (plant.Biogas is not { } biogas)
        {
            return schedule;
        }
        var hours = planningCase.PeriodHours;
        var kWhPerNm3 = biogas.LowerHeatingValueKWhPerNm3 * biogas.EngineEfficiency;
        var engineMostNm3 = kWhPerNm3 > 0 ? biogas.EngineKw * hours / kWhPerNm3 : 0;
        var produced = planningCase.BiogasNm3[plant.Id];
        var holder = biogas.InitialHolderNm3;
        var peakKw = plant.MonthToDatePeakKw;
        var producedLaterNm3 = produced.Sum();
        for (var t = 0; t < periods; t++)
        {
            if (t > 0 && planningCase.BillingMonth[t] != planningCase.BillingMonth[t - 1])
            {
                peakKw = 0;
            }
            var burnt = Math.Min(produced[t], engineMostNm3);
            var gasAtHandNm3 = holder + produced[t];
            var overPeakKWh = loadKWh[t] - burnt * kWhPerNm3 - peakKw * hours;
            if (kWhPerNm3 > 0 && overPeakKWh > 0)
            {
                // Draw the holder only as far as later hours below the peak can refill it (the load is known).
                var spareNm3 = Math.Max(0, holder - (biogas.InitialHolderNm3 - RefillableNm3(planningCase, plant, loadKWh, t, peakKw)));
                burnt = Math.Min(Math.Min(engineMostNm3, gasAtHandNm3), burnt + Math.Min(spareNm3, overPeakKWh / kWhPerNm3));
            }
            else if (kWhPerNm3 > 0 && holder < biogas.InitialHolderNm3)
            {
                var keepNm3 = Math.Min(Math.Min(burnt, biogas.InitialHolderNm3 - holder), -overPeakKWh / kWhPerNm3);
                burnt -= Math.Max(0, keepNm3);
            }
            // Never burn gas the holder could not get back before the horizon ends, even by burning nothing later.
            producedLaterNm3 -= produced[t];
            burnt = Math.Max(0, Math.Min(burnt, gasAtHandNm3 - (biogas.InitialHolderNm3 - producedLaterNm3)));
            holder = gasAtHandNm3 - burnt;
            var flared = Math.Max(0, holder - biogas.HolderNm3);
            holder -= flared;
            schedule.ToEngineNm3[t] = burnt;
            schedule.FlaredNm3[t] = flared;
            schedule.HolderEndNm3[t] = holder;
            schedule.EngineKWh[t] = burnt * kWhPerNm3;
            peakKw = Math.Max(peakKw, (loadKWh[t] - schedule.EngineKWh[t]) / hours);
        }
        return schedule;
    }

    // Gas the holder could take back after period t by burning less where the import stays at or below the peak.
    private static double RefillableNm3(PlanningCase planningCase, Plant plant, double[] loadKWh, int t, double peakKw)
    {
        var biogas = plant.Biogas!;
        var hours = planningCase.PeriodHours;
        var kWhPerNm3 = biogas.LowerHeatingValueKWhPerNm3 * biogas.EngineEfficiency;
        var engineMostNm3 = biogas.EngineKw * hours / kWhPerNm3;
        var produced = planningCase.BiogasNm3[plant.Id];
        var refillable = 0.0;
        for (var k = t + 1; k < loadKWh.Length && planningCase.BillingMonth[k] == planningCase.BillingMonth[t]; k++)
        {
            var burnt = Math.Min(produced[k], engineMostNm3);
            refillable += Math.Min(burnt, Math.Max(0, peakKw * hours - (loadKWh[k] - burnt * kWhPerNm3)) / kWhPerNm3);
        }
        return refillable;
    }

    /// <summary>Import and export that balance the load against the engine, kWh.</summary>
    public static (double[] ImportKWh, double[] ExportKWh) Grid(double[] loadKWh, double[] engineKWh) =>
        (loadKWh.Select((load, t) => Math.Max(0, load - engineKWh[t])).ToArray(),
         loadKWh.Select((load, t) => Math.Max(0, engineKWh[t] - load)).ToArray());
}
