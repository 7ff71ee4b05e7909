using NodaTime;
using PlanDesk.Core.Actuals;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Actuals;

public sealed class ActualsApplierTests
{
    // The quickstart network: Europe/Madrid (UTC+1 in March before the 28th), tank larkmoor-class-a 200 to 2500 m3,
    // stage larkmoor-filter-uv with 3 units, gas holder 600 Nm3, month-to-date total N 3700 kg in the file.
    private static readonly Network Quickstart = TestNetworks.Load(TestNetworks.Quickstart()).Network!;
    private static readonly LocalDate Start = new(2027, 3, 26);
    private static readonly PlantId Larkmoor = new("larkmoor");

    private static HourlyActuals Hour(int day, int hourUtc) => new() { Plant = Larkmoor, HourStart = Instant.FromUtc(2027, 3, day, hourUtc, 0) };

    [Fact]
    public void WithoutActualsTheNetworkIsUnchangedAndThereAreNoNotes()
    {
        var applied = ActualsApplier.Apply(Quickstart, Start, []);

        Assert.Same(Quickstart.Plants[0], applied.Network.Plants[0]);
        Assert.Equal(Quickstart.Tanks, applied.Network.Tanks);
        Assert.Empty(applied.Notes);
    }

    [Fact]
    public void TheLatestTankLevelBeforeTheStartIsTaken()
    {
        var tank = new TankId("larkmoor-class-a");
        var rows = new[]
        {
            Hour(25, 20) with { TankEndM3 = new Dictionary<TankId, double> { [tank] = 1500 } },
            Hour(25, 22) with { TankEndM3 = new Dictionary<TankId, double> { [tank] = 1300 } },
            Hour(25, 23) with { TankEndM3 = new Dictionary<TankId, double> { [tank] = 2400 } }, // ends after local midnight
        };

        var applied = ActualsApplier.Apply(Quickstart, Start, rows);

        Assert.Equal(1300, applied.Network.Tank(tank).InitialM3);
        Assert.Equal("tank larkmoor-class-a: starts at 1300 m3, as reported at 2027-03-26 00:00", Assert.Single(applied.Notes));
    }

    [Fact]
    public void AReportedLevelOutsideTheTankRangeIsMovedIntoItAndTheNoteSaysSo()
    {
        var tank = new TankId("larkmoor-class-a");
        var rows = new[] { Hour(25, 22) with { TankEndM3 = new Dictionary<TankId, double> { [tank] = 150 } } };

        var applied = ActualsApplier.Apply(Quickstart, Start, rows);

        Assert.Equal(200, applied.Network.Tank(tank).InitialM3);
        Assert.Contains("outside its range 200 to 2500 m3; the plan starts from 200 m3", Assert.Single(applied.Notes));
    }

    [Fact]
    public void MonthToDateLoadsAndPeakAreSummedOverTheReportedHoursOfTheMonthOnly()
    {
        var rows = new[]
        {
            Hour(1, 3) with { OutfallTotalNitrogenKg = 2, OutfallTotalPhosphorusKg = 0.25, ImportedKWh = 280 }, // 04:00 local on the 1st: in the month
            Hour(10, 12) with { OutfallTotalNitrogenKg = 3, ImportedKWh = 330 },
            Hour(25, 22) with { OutfallTotalNitrogenKg = 4, OutfallTotalPhosphorusKg = 0.5, ImportedKWh = 300 },
            new HourlyActuals { Plant = Larkmoor, HourStart = Instant.FromUtc(2027, 2, 28, 22, 0), OutfallTotalNitrogenKg = 100, ImportedKWh = 999 }, // February 23:00 local
        };

        var plant = ActualsApplier.Apply(Quickstart, Start, rows).Network.Plants[0];

        Assert.Equal(9, plant.Permit.MonthToDateTotalNitrogenKg);
        Assert.Equal(0.75, plant.Permit.MonthToDateTotalPhosphorusKg);
        Assert.Equal(330, plant.MonthToDatePeakKw);
    }

    [Fact]
    public void WhenAnHourIsReportedTwiceTheLaterRowCountsOnce()
    {
        var rows = new[] { Hour(20, 5) with { OutfallTotalNitrogenKg = 7 }, Hour(20, 5) with { OutfallTotalNitrogenKg = 5 } };

        var plant = ActualsApplier.Apply(Quickstart, Start, rows).Network.Plants[0];

        Assert.Equal(5, plant.Permit.MonthToDateTotalNitrogenKg);
    }

    [Fact]
    public void UnitsRunningAndGasHolderAreClampedToWhatThePlantHas()
    {
        var stage = new StageId("larkmoor-filter-uv");
        var rows = new[] { Hour(25, 22) with { UnitsRunning = new Dictionary<StageId, int> { [stage] = 5 }, GasHolderNm3 = 700 } };

        var applied = ActualsApplier.Apply(Quickstart, Start, rows);

        Assert.Equal(3, applied.Network.Stage(stage).InitialUnitsRunning);
        Assert.Equal(600, applied.Network.Plants[0].Biogas!.InitialHolderNm3);
        Assert.Contains(applied.Notes, n => n.Contains("5 units reported running") && n.Contains("starts with 3"));
        Assert.Contains(applied.Notes, n => n.Contains("outside 0 to 600 Nm3"));
    }
}
