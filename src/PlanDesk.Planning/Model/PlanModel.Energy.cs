using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Model;

// Each plant's electricity: load, biogas engine and gas holder, grid import and export, monthly peak.
internal sealed partial class PlanModel
{
    public Dictionary<(PlantId Plant, int Period), Variable> Import { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> Export { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> Engine { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> GasToEngine { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> Flare { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> Holder { get; } = [];
    /// <summary>Highest import of each billing month, kW (only for tariffs with a demand charge).</summary>
    public Dictionary<(PlantId Plant, int Month), Variable> Peak { get; } = [];
    /// <summary>import − export + engine = load per plant and period.</summary>
    public Dictionary<(PlantId Plant, int Period), Constraint> PowerBalance { get; } = [];

    /// <summary>
    /// import − export = load − engine, with load = aeration + stages + pumping + base·Δh (kWh). The engine makes
    /// gas·LHV·efficiency kWh, at most engineKw·Δh; the holder keeps production − use − flare within [0, size].
    /// Only engine output can be exported. Energy bought at the period's price, sold at the feed-in price, and
    /// (with a carbon price) the grid's emissions of what is bought.
    /// </summary>
    private void AddEnergyBalances()
    {
        foreach (var plant in Network.Plants)
        {
            var tariff = Case.TariffOf(plant);
            var prices = Case.ImportPricePerMWh[plant.Id];
            var carbonPerKWh = Network.CarbonPricePerTonne * tariff.GridEmissionsKgPerMWh / 1e6;
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var import = NumVar(0, double.PositiveInfinity, Name("import", plant.Id, P(t)));
                var export = NumVar(0, plant.Biogas is null ? 0 : double.PositiveInfinity, Name("export", plant.Id, P(t)));
                Import[(plant.Id, t)] = import;
                Export[(plant.Id, t)] = export;
                var balance = EqualRow(plant.BaseLoadKw * PeriodHours, Name("power", plant.Id, P(t))).Add(import, 1).Add(export, -1);
                foreach (var (variable, kWhPerUnit) in loadTerms.GetValueOrDefault((plant.Id, t)) ?? [])
                {
                    balance.Add(variable, -kWhPerUnit);
                }
                if (plant.Biogas is { } biogas)
                {
                    var engine = AddEngine(plant.Id, biogas, t);
                    balance.Add(engine, 1);
                    AtMostRow(0, Name("export-limit", plant.Id, P(t))).Add(export, 1).Add(engine, -1);
                }
                PowerBalance[(plant.Id, t)] = balance;
                Costs.Add(CostComponent.EnergyImport, import, prices[t] / 1000.0);
                Costs.Add(CostComponent.EnergyExportCredit, export, -tariff.FeedInPricePerMWh / 1000.0);
                Costs.Add(CostComponent.Carbon, import, carbonPerKWh);
            }
        }
    }

    private Variable AddEngine(PlantId plant, Biogas biogas, int t)
    {
        var production = Case.BiogasNm3[plant];
        var engine = NumVar(0, biogas.EngineKw * PeriodHours, Name("engine", plant, P(t)));
        var gas = NumVar(0, double.PositiveInfinity, Name("gas-to-engine", plant, P(t)));
        var flare = NumVar(0, double.PositiveInfinity, Name("flare", plant, P(t)));
        // The holder may not end the horizon below its start: gas burnt from the holder is not free, and a plan
        // that empties it would only look cheaper than one that keeps it (always feasible: flare less, burn less).
        var holderLeast = t == Horizon.Periods.Count - 1 ? Math.Min(biogas.InitialHolderNm3, biogas.HolderNm3) : 0;
        var holder = NumVar(holderLeast, biogas.HolderNm3, Name("holder", plant, P(t)));
        Engine[(plant, t)] = engine;
        GasToEngine[(plant, t)] = gas;
        Flare[(plant, t)] = flare;
        Holder[(plant, t)] = holder;
        EqualRow(0, Name("engine-gas", plant, P(t))).Add(engine, 1).Add(gas, -biogas.LowerHeatingValueKWhPerNm3 * biogas.EngineEfficiency);
        var holderBalance = t == 0
            ? EqualRow(biogas.InitialHolderNm3 + production[t], Name("holder-balance", plant, P(t)))
            : EqualRow(production[t], Name("holder-balance", plant, P(t))).Add(Holder[(plant, t - 1)], -1);
        holderBalance.Add(holder, 1).Add(gas, 1).Add(flare, 1);
        return engine;
    }

    /// <summary>peak[p,month] ≥ import/Δh in each period of the month, and ≥ the month-to-date peak for the start
    /// month; the demand charge is paid on the increase over the month-to-date peak.</summary>
    private void AddPeakDemand()
    {
        foreach (var plant in Network.Plants)
        {
            var charge = Case.TariffOf(plant).DemandChargePerKwMonth;
            if (charge <= 0)
            {
                continue;
            }
            foreach (var month in Horizon.Periods.GroupBy(p => Case.BillingMonth[p.Index]))
            {
                var monthToDateKw = month.Key == 0 ? plant.MonthToDatePeakKw : 0;
                var peak = NumVar(monthToDateKw, double.PositiveInfinity, Name("peak", plant.Id, MonthLabel(month.Key)));
                Peak[(plant.Id, month.Key)] = peak;
                foreach (var period in month)
                {
                    AtLeastRow(0, Name("peak-import", plant.Id, P(period.Index)))
                        .Add(peak, 1)
                        .Add(Import[(plant.Id, period.Index)], -1 / PeriodHours);
                }
                Costs.Add(CostComponent.DemandCharge, peak, charge);
                Costs.AddConstant(CostComponent.DemandCharge, -charge * monthToDateKw);
            }
        }
    }
}
