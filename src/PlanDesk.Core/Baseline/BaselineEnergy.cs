using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>A plant's gas and engine under the operator's rule, per period.</summary>
internal sealed record GasSchedule(double[] ToEngineNm3, double[] FlaredNm3, double[] HolderEndNm3, double[] EngineKWh);

/// <summary>
/// The engine follows gas production: it burns the gas that comes in, up to its size; the holder keeps the
/// rest and the flare takes what the holder cannot. Import and export then close each plant's balance.
/// </summary>
internal static class BaselineEnergy
{
    public static GasSchedule Gas(PlanningCase planningCase, Plant plant)
    {
        var periods = planningCase.PeriodCount;
        var schedule = new GasSchedule(new double[periods], new double[periods], new double[periods], new double[periods]);
        if (plant.Biogas is not { } biogas)
        {
            return schedule;
        }
        var kWhPerNm3 = biogas.LowerHeatingValueKWhPerNm3 * biogas.EngineEfficiency;
        var engineMostNm3 = kWhPerNm3 > 0 ? biogas.EngineKw * planningCase.PeriodHours / kWhPerNm3 : 0;
        var produced = planningCase.BiogasNm3[plant.Id];
        var holder = biogas.InitialHolderNm3;
        for (var t = 0; t < periods; t++)
        {
            var burnt = Math.Min(produced[t], engineMostNm3);
            holder += produced[t] - burnt;
            var flared = Math.Max(0, holder - biogas.HolderNm3);
            holder -= flared;
            schedule.ToEngineNm3[t] = burnt;
            schedule.FlaredNm3[t] = flared;
            schedule.HolderEndNm3[t] = holder;
            schedule.EngineKWh[t] = burnt * kWhPerNm3;
        }
        return schedule;
    }

    /// <summary>Import and export that balance the load against the engine, kWh.</summary>
    public static (double[] ImportKWh, double[] ExportKWh) Grid(double[] loadKWh, double[] engineKWh) =>
        (loadKWh.Select((load, t) => Math.Max(0, load - engineKWh[t])).ToArray(),
         loadKWh.Select((load, t) => Math.Max(0, engineKWh[t] - load)).ToArray());
}
