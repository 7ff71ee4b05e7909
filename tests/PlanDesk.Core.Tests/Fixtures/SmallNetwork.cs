using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Fixtures;

/// <summary>
/// A small invented network built in code: one plant (Norwick) with a filter stage, biogas and a permit; a
/// class-A tank feeding a regional reservoir (Hillcrest) and a daily-volume park through discrete pumps; the
/// reservoir feeding an hourly orchard. A class-C tank at the plant has a pipeline to the class-A orchard
/// that breaks the class rule (a loader would refuse it; here it lets tests deliver the wrong class).
/// </summary>
internal static class SmallNetwork
{
    public static readonly LocalDate Start = new(2027, 3, 10);

    public static readonly PlantId Norwick = new("norwick");
    public static readonly StageId Filter = new("norwick-filter");
    public static readonly TankId ClassATank = new("norwick-a");
    public static readonly TankId ClassCTank = new("norwick-c");
    public static readonly TankId Reservoir = new("hillcrest");
    public static readonly PipelineId ToReservoir = new("norwick-to-hillcrest");
    public static readonly PipelineId ReservoirToOrchard = new("hillcrest-to-orchard");
    public static readonly PipelineId ToPark = new("norwick-to-park");
    public static readonly PipelineId WrongClassToOrchard = new("norwick-c-to-orchard");
    public static readonly CustomerId Orchard = new("tarn-orchard");
    public static readonly CustomerId Park = new("mere-park");

    public static Network Build() => new()
    {
        Name = "Small test network",
        TimeZone = DateTimeZoneProviders.Tzdb["Europe/Madrid"],
        Currency = "EUR",
        PeriodMinutes = 60,
        Classes =
        [
            new QualityClass(new ClassId("A"), "Class A", 0, new Dictionary<string, double> { ["conductivityUsPerCm"] = 900 }),
            new QualityClass(new ClassId("C"), "Class C", 1, new Dictionary<string, double> { ["conductivityUsPerCm"] = 1500 }),
        ],
        Tariffs = [Tariff()],
        Plants = [NorwickPlant()],
        Tanks =
        [
            new Tank(ClassATank, "Norwick class A tank", Norwick, new ClassId("A"), 200, 2500, 900, 0),
            new Tank(ClassCTank, "Norwick class C tank", Norwick, new ClassId("C"), 0, 1000, 500, 0),
            new Tank(Reservoir, "Hillcrest reservoir", null, new ClassId("A"), 100, 1500, 600, 0.01),
        ],
        Pipelines =
        [
            new Pipeline(ToReservoir, "Norwick to Hillcrest", ClassATank, PipelineEnd.ToTank(Reservoir), 200, 0.15, Norwick, null),
            new Pipeline(ReservoirToOrchard, "Hillcrest to Tarn Orchard", Reservoir, PipelineEnd.ToCustomer(Orchard), 260, 0.02, Norwick, null),
            new Pipeline(ToPark, "Norwick to Mere Park", ClassATank, PipelineEnd.ToCustomer(Park), 260, 0.12, Norwick, new PumpSet(2, 50, 130)),
            new Pipeline(WrongClassToOrchard, "Norwick class C to Tarn Orchard", ClassCTank, PipelineEnd.ToCustomer(Orchard), 100, 0.05, Norwick, null),
        ],
        Customers =
        [
            new Customer
            {
                Id = Orchard, Name = "Tarn Orchard", Kind = "farm irrigation", Class = new ClassId("A"),
                Demand = new HourlyDemand(Series.Constant(150)), ShortfallPenaltyPerM3 = 1.5, Priority = 1,
            },
            new Customer
            {
                Id = Park, Name = "Mere Park", Kind = "city parks", Class = new ClassId("C"),
                Demand = new DailyDemand(1200, new LocalTime(21, 0), new LocalTime(7, 0), 260), ShortfallPenaltyPerM3 = 0.8, Priority = 2,
            },
        ],
        CarbonPricePerTonne = 30,
    };

    public static Tariff Tariff() => new()
    {
        Id = new TariffId("norwick-grid"),
        Name = "Norwick time-of-use",
        Price = new TimeOfUsePrice(
        [
            new TouSeason("all year", 1, 12, 95,
            [
                new TouWindow(new HashSet<DayType> { DayType.Weekday }, new LocalTime(8, 0), new LocalTime(18, 0), 150),
                new TouWindow(new HashSet<DayType> { DayType.Weekday }, new LocalTime(18, 0), new LocalTime(22, 0), 210),
                new TouWindow(new HashSet<DayType> { DayType.Weekday, DayType.Weekend, DayType.Holiday }, new LocalTime(0, 0), new LocalTime(6, 0), 70),
            ]),
        ]),
        DemandChargePerKwMonth = 8.5,
        FeedInPricePerMWh = 40,
        GridEmissionsKgPerMWh = 250,
    };

    public static Plant NorwickPlant() => new()
    {
        Id = Norwick,
        Name = "Norwick WRRF",
        Tariff = new TariffId("norwick-grid"),
        InfluentM3PerHour = Series.Constant(500),
        SecondaryCapacityM3PerHour = 800,
        RawTotalNitrogenMgPerL = 60,
        RawTotalPhosphorusMgPerL = 9,
        Levels =
        [
            new TreatmentLevel(new LevelId("standard"), "Standard", 12, 1.5, 0.20, 0.008),
            new TreatmentLevel(new LevelId("tight"), "Tight N removal", 8, 1.0, 0.26, 0.020),
            new TreatmentLevel(new LevelId("loose"), "Aeration saving", 18, 2.5, 0.15, 0.004),
        ],
        StandardLevel = new LevelId("standard"),
        BaseLoadKw = 90,
        MonthToDatePeakKw = 100,
        Stages =
        [
            new Stage
            {
                Id = Filter, Name = "Sand filters with UV", Plant = Norwick, FeedTank = null, ProductTank = ClassATank,
                ProducesClass = new ClassId("A"), RecoveryFraction = 0.97, EnergyKWhPerM3 = 0.06, ChemicalCostPerM3 = 0.01,
                Units = 3, UnitMinFlowM3PerHour = 40, UnitMaxFlowM3PerHour = 120, StartupCost = 12, MinRunHours = 3, InitialUnitsRunning = 1,
            },
        ],
        Biogas = new Biogas(Series.Constant(50), 6.0, 600, 250, 180, 0.36),
        Permit = new Permit
        {
            DailyTotalNitrogenKg = 200, MonthlyTotalNitrogenKg = 6000, MonthToDateTotalNitrogenKg = 3000,
            DailyTotalPhosphorusKg = 30, MaxTotalNitrogenMgPerL = 15, MaxTotalPhosphorusMgPerL = 2, MaxOutfallM3PerHour = 1000,
        },
    };

    public static PlanningCase Case(Network? network = null, LocalDate? start = null, int days = 1)
    {
        var result = PlanningCase.Create(network ?? Build(), start ?? Start, days);
        Assert.True(result.Succeeded, string.Join("; ", result.Problems));
        return result.Case!;
    }

    /// <summary>The network with the plant's permit replaced.</summary>
    public static Network WithPermit(Func<Permit, Permit> change)
    {
        var network = Build();
        return network with { Plants = [network.Plants[0] with { Permit = change(network.Plants[0].Permit) }] };
    }
}
