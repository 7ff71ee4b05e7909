using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>Per-plant day targets cut from solved plans, and their JSON, CSV and text forms.</summary>
public class TargetsTests
{
    // Europe/Madrid springs forward on 2027-03-28: 02:00 local does not exist, so the day has 23 hourly periods.
    // A filter (up to 100 m3/h) fills a tank for a customer owed 1 200 m3 that day; prices are flat.
    // Hand working: 23 h × 100 m3/h = 2 300 m3 of capacity ≥ 1 200, so the whole volume is delivered; the targets
    // have one row per period: 23, and the CSV 23 rows after its header.
    [Fact]
    public void DstSpringDayHasTwentyThreeRowsAndTheDailyVolumeIsDelivered()
    {
        var network = Build.Network(
            Build.HourlyTariff(Build.SpringForward, Enumerable.Repeat(100.0, 23).ToArray()),
            [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 0.1)])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.DailyCustomer("farm", 1200)]);
        var planningCase = Build.Case(network, Build.SpringForward);

        var plan = Build.Solve(planningCase);
        var targets = Assert.Single(PlantDayTargetsBuilder.Build(planningCase, plan));

        Assert.Equal(23, targets.Hours.Count);
        Assert.DoesNotContain(targets.Hours, h => h.LocalStart.Hour == 2);
        Assert.Equal(24, TargetWriters.ToCsv(targets).TrimEnd('\n').Split('\n').Length);
        Assert.Equal(1200.0, plan.CustomerPlan(new CustomerId("farm")).DeliveredM3.Sum(), 1e-3);
        Assert.Equal(0.0, plan.CustomerPlan(new CustomerId("farm")).ShortfallM3[0], 1e-6);
        Assert.Equal(1200.0, Assert.Single(targets.Deliveries).VolumeM3, 1e-3);
    }

    // The reuse case of PermitTests: 24 000 m3 treated at standard (12 mg/L), 4 800 m3 delivered, cap 250 kg.
    // Hand working: load 19 200 × 12 / 1 000 = 230.4 kg, headroom 19.6 kg; outfall volume 19 200 m3;
    // production 4 800 m3 of class A; aeration 24 000 × 0.20 = 4 800 kWh, all imported.
    [Fact]
    public void TargetsCarryPermitHeadroomProductionAndEnergy()
    {
        var network = Build.Network(
            Build.FlatTariff(100),
            [Build.Plant(influentM3PerHour: 1000, levels: [Build.Level("standard", nitrogenMgPerL: 12, aerationKWhPerM3: 0.2)],
                permit: new Permit { DailyTotalNitrogenKg = 250 }, stages: [Build.Stage("filter", "store", maxFlowM3PerHour: 300)])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.HourlyCustomer("farm", 200)]);
        var planningCase = Build.Case(network);

        var targets = Assert.Single(PlantDayTargetsBuilder.Build(planningCase, Build.Solve(planningCase)));

        Assert.Equal(230.4, targets.Permit.TotalNitrogenKg, 1e-3);
        Assert.Equal(19.6, targets.Permit.TotalNitrogenHeadroomKg!.Value, 1e-3);
        Assert.Equal(19_200.0, targets.Permit.OutfallM3, 1e-3);
        Assert.Equal(4800.0, targets.Hours.Sum(h => h.ProductionM3ByClass[new ClassId("A")]), 1e-3);
        Assert.Equal(4800.0, targets.Energy.ImportKWh, 1e-3);
        Assert.Equal(4800.0, targets.Energy.LoadKWh, 1e-3);
        Assert.Equal(12.0, targets.EffluentTotalNitrogenMgPerL);
    }

    [Fact]
    public void TargetSheetAndJsonCarryTheCaution()
    {
        var network = Build.Network(Build.FlatTariff(100), [Build.Plant(influentM3PerHour: 100)]);
        var planningCase = Build.Case(network);

        var targets = Assert.Single(PlantDayTargetsBuilder.Build(planningCase, Build.Solve(planningCase)));
        var text = TargetWriters.ToText(targets);
        var json = TargetWriters.ToJson(targets);

        Assert.Contains("CAUTION: " + Cautions.TargetSheet, text);
        Assert.True(text.IndexOf("CAUTION", StringComparison.Ordinal) < text.IndexOf("Treatment level", StringComparison.Ordinal));
        Assert.Contains("\"caution\"", json);
        Assert.Contains("verified by the plant's own monitoring", json.Replace("\\u0027", "'"));
    }

    [Fact]
    public void WriteAllWritesJsonCsvAndTextPerPlantDay()
    {
        var network = Build.Network(Build.FlatTariff(100), [Build.Plant(influentM3PerHour: 100)]);
        var planningCase = Build.Case(network, days: 2);
        var directory = Directory.CreateTempSubdirectory("plandesk-targets-").FullName;
        try
        {
            var paths = TargetWriters.WriteAll(PlantDayTargetsBuilder.Build(planningCase, Build.Solve(planningCase)), directory);

            Assert.Equal(6, paths.Count);
            Assert.True(File.Exists(Path.Combine(directory, "mill_2027-03-25.csv")));
            Assert.Equal(25, File.ReadAllLines(Path.Combine(directory, "mill_2027-03-24.csv")).Length);
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    // Europe/Madrid falls back on 2027-10-31: 02:00-03:00 local happens twice, so the day has 25 hourly periods.
    // Hand working: a constant 100 m3/h influent treats 25 × 100 = 2 500 m3 that day; 25 rows, 26 CSV lines.
    [Fact]
    public void DstFallBackDayHasTwentyFiveRows()
    {
        var fallBack = new NodaTime.LocalDate(2027, 10, 31);
        var network = Build.Network(Build.FlatTariff(100), [Build.Plant(influentM3PerHour: 100)]);
        var planningCase = Build.Case(network, fallBack);

        var targets = Assert.Single(PlantDayTargetsBuilder.Build(planningCase, Build.Solve(planningCase)));

        Assert.Equal(25, targets.Hours.Count);
        Assert.Equal(2, targets.Hours.Count(h => h.LocalStart.Hour == 2));
        Assert.Equal(2500.0, targets.Hours.Sum(h => h.TreatedM3), 1e-6);
        Assert.Equal(26, TargetWriters.ToCsv(targets).TrimEnd('\n').Split('\n').Length);
    }
}
