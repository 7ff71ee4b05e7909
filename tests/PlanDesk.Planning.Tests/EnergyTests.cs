using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>Biogas engine, gas holder and demand charge.</summary>
public class EnergyTests
{
    // A plant with no flows but a 100 kW base load. Biogas 30 Nm3/h at 6 kWh/Nm3 and 50 % efficiency = 90 kWh/h of
    // engine output if burnt as made; engine 100 kW; holder 1 000 Nm3, empty at the start.
    // Energy costs 50 EUR/MWh in hours 0-11 and 250 EUR/MWh in hours 12-23; nothing is paid for export.
    private static Network EngineNetwork(double holderNm3)
    {
        var plant = Build.Plant() with
        {
            BaseLoadKw = 100,
            Biogas = new Biogas(Series.Constant(30), 6, holderNm3, 0, 100, 0.5),
        };
        return Build.Network(Build.HourlyTariff(Build.Weekday, Build.Prices(250, 50, Enumerable.Range(0, 12).ToArray())), [plant]);
    }

    // Hand working with the holder: 720 Nm3 a day = 2 160 kWh. Dear hours need 12 × 100 = 1 200 kWh = 400 Nm3, of
    // which 12 × 30 = 360 arrive during those hours, so 40 Nm3 must be saved from the cheap hours (the holder holds it).
    // The remaining 960 kWh run the engine in cheap hours, leaving 1 200 − 960 = 240 kWh bought at 0.05 EUR/kWh = 12 EUR.
    // Without a holder the engine makes 90 kWh each hour: 10 kWh bought every hour, 120 × 0.05 + 120 × 0.25 = 36 EUR.
    [Fact]
    public void GasHolderMovesEngineOutputIntoDearHours()
    {
        var planningCase = Build.Case(EngineNetwork(holderNm3: 1000));

        var plan = Build.Solve(planningCase);

        Assert.Equal(SolveStatus.Optimal, plan.Solve.Status);
        Assert.Equal(12.0, plan.Costs.Total, 12.0 * 0.001);
        var plant = plan.Plants[0];
        Assert.All(plant.ImportKWh.Skip(12), import => Assert.Equal(0, import, 1e-6));
        Assert.Equal(240.0, plant.ImportKWh.Sum(), 1e-3);
    }

    [Fact]
    public void WithoutAHolderTheEngineBurnsGasAsItComes()
    {
        var plan = Build.Solve(Build.Case(EngineNetwork(holderNm3: 0)));

        Assert.Equal(36.0, plan.Costs.Total, 36.0 * 0.001);
        Assert.All(plan.Plants[0].EngineKWh, kwh => Assert.Equal(90.0, kwh, 1e-6));
    }

    // A filter stage (1 kWh/m3, one unit up to 100 m3/h) fills an empty tank for a customer owed 1 200 m3 over the day.
    // Energy 50 EUR/MWh in hours 0-5, 100 EUR/MWh otherwise; demand charge 10 EUR/kW-month, no peak yet this month.
    // Hand working: with a peak of P kW (P ≥ 1 200 / 24 = 50), cheap hours make 6P m3, so
    // cost = 10 P + 0.05 × 6P + 0.10 × (1 200 − 6P) = 120 + 9.7 P, least at P = 50: 605 EUR (peak 50 kW).
    // Without the demand charge the stage would run flat out in cheap hours (peak 100 kW, 90 EUR).
    [Theory]
    [InlineData(10.0, 605.0, 50.0)]
    [InlineData(0.0, 90.0, 100.0)]
    public void DemandChargeShavesThePeak(double demandChargePerKwMonth, double expectedCost, double expectedPeakKw)
    {
        var network = Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(100, 50, 0, 1, 2, 3, 4, 5), demandChargePerKwMonth: demandChargePerKwMonth),
            [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 1)])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.DailyCustomer("farm", 1200)]);
        var planningCase = Build.Case(network);

        var plan = Build.Solve(planningCase);

        Assert.Equal(expectedCost, plan.Costs.Total, expectedCost * 0.001);
        Assert.Equal(expectedPeakKw, PlanFigures.PeakImportKw(planningCase, plan.Plants[0], Enumerable.Range(0, 24)), 1e-3);
    }

    // A month-to-date peak of 80 kW is already paid for. Hand working: peaks up to 80 kW cost nothing more, so with
    // cost = 10 (P − 80) + 120 − 0.3 P for P ≥ 80 and 120 − 0.3 P below, the least is at P = 80:
    // 120 − 24 = 96 EUR (480 m3 in cheap hours at 0.05, 720 m3 at 0.10).
    [Fact]
    public void MonthToDatePeakIsFreeHeadroom()
    {
        var network = Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(100, 50, 0, 1, 2, 3, 4, 5), demandChargePerKwMonth: 10),
            [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 1)]) with { MonthToDatePeakKw = 80 }],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.DailyCustomer("farm", 1200)]);

        var plan = Build.Solve(Build.Case(network));

        Assert.Equal(96.0, plan.Costs.Total, 96.0 * 0.001);
        Assert.Equal(0.0, plan.Costs.DemandCharge, 1e-6);
    }

    // A 100 kW base load all day on a flat 100 EUR/MWh tariff whose grid emits 400 kg CO2/MWh, carbon at 50 EUR/t.
    // Hand working: 2.4 MWh × 100 = 240 EUR of energy; 2.4 MWh × 0.4 t/MWh × 50 EUR/t = 48 EUR of carbon; 288 EUR.
    [Fact]
    public void CarbonPriceChargesTheGridEmissionsOfImports()
    {
        var tariff = Build.FlatTariff(100) with { GridEmissionsKgPerMWh = 400 };
        var network = Build.Network(tariff, [Build.Plant() with { BaseLoadKw = 100 }]) with { CarbonPricePerTonne = 50 };

        var plan = Build.Solve(Build.Case(network));

        Assert.Equal(48.0, plan.Costs.Carbon, 1e-6);
        Assert.Equal(288.0, plan.Costs.Total, 288.0 * 0.001);
    }

    // No load at all; biogas 30 Nm3/h at 6 kWh/Nm3 and 50 % makes 90 kWh each hour, sold at 40 EUR/MWh.
    // Hand working: 24 × 90 = 2 160 kWh exported, 2.16 MWh × 40 = 86.40 EUR of credit: the objective is −86.40 EUR,
    // and the gap is taken against its absolute value.
    [Fact]
    public void EngineOutputAboveTheLoadIsSoldAtTheFeedInPrice()
    {
        var plant = Build.Plant() with { Biogas = new Biogas(Series.Constant(30), 6, 0, 0, 100, 0.5) };
        var network = Build.Network(Build.FlatTariff(100, feedInPricePerMWh: 40), [plant]);

        var plan = Build.Solve(Build.Case(network));

        Assert.Equal(86.4, plan.Costs.EnergyExportCredit, 1e-6);
        Assert.Equal(-86.4, plan.Solve.Objective, 86.4 * 0.001);
        Assert.True(plan.Solve.GapPercent >= 0 && plan.Solve.GapPercent <= 0.01 + 1e-9);
    }
}
