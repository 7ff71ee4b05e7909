using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Tests.Fixtures;

/// <summary>
/// Tiny networks built in code for hand-worked tests. Every default is neutral (no energy, no cost, no limit) so a
/// test states only the numbers its working needs. Ids are lower-case with dashes, as in network files.
/// </summary>
internal static class Build
{
    public static readonly DateTimeZone Madrid = DateTimeZoneProviders.Tzdb["Europe/Madrid"];
    /// <summary>A Wednesday with 24 hours (no daylight-saving change).</summary>
    public static readonly LocalDate Weekday = new(2027, 3, 24);
    /// <summary>Spring-forward day in Europe/Madrid: 23 hours.</summary>
    public static readonly LocalDate SpringForward = new(2027, 3, 28);

    public static QualityClass ClassA { get; } = new(new ClassId("A"), "Class A", 0, new Dictionary<string, double> { ["conductivityUsPerCm"] = 800 });
    public static QualityClass ClassB { get; } = new(new ClassId("B"), "Class B", 1, new Dictionary<string, double> { ["conductivityUsPerCm"] = 1500 });

    /// <summary>One price all day, every day, currency/MWh.</summary>
    public static Tariff FlatTariff(double pricePerMWh, double demandChargePerKwMonth = 0, double feedInPricePerMWh = 0) => new()
    {
        Id = new TariffId("grid"),
        Name = "Test grid",
        Price = new TimeOfUsePrice([new TouSeason("all year", 1, 12, pricePerMWh, [])]),
        DemandChargePerKwMonth = demandChargePerKwMonth,
        FeedInPricePerMWh = feedInPricePerMWh,
    };

    /// <summary>Prices per local hour of <paramref name="date"/> (23, 24 or 25 values), repeated for later days.</summary>
    public static Tariff HourlyTariff(LocalDate date, double[] pricesPerMWh, int days = 1, double demandChargePerKwMonth = 0) => new()
    {
        Id = new TariffId("grid"),
        Name = "Test grid",
        Price = new SeriesPrice(Hourly(date, Enumerable.Repeat(pricesPerMWh, days).SelectMany(p => p).ToArray())),
        DemandChargePerKwMonth = demandChargePerKwMonth,
    };

    /// <summary>Hourly values from local midnight of <paramref name="date"/>.</summary>
    public static Series Hourly(LocalDate date, double[] values) =>
        new StepSeries(Madrid.AtStartOfDay(date).ToInstant(), Duration.FromHours(1), values) { Origin = "test series" };

    public static TreatmentLevel Level(string id, double nitrogenMgPerL = 10, double phosphorusMgPerL = 1,
        double aerationKWhPerM3 = 0, double chemicalCostPerM3 = 0) =>
        new(new LevelId(id), id, nitrogenMgPerL, phosphorusMgPerL, aerationKWhPerM3, chemicalCostPerM3);

    public static Plant Plant(string id = "mill", double influentM3PerHour = 0, IReadOnlyList<TreatmentLevel>? levels = null,
        IReadOnlyList<Stage>? stages = null, Permit? permit = null) => new()
    {
        Id = new PlantId(id),
        Name = id,
        Tariff = new TariffId("grid"),
        InfluentM3PerHour = Series.Constant(influentM3PerHour),
        SecondaryCapacityM3PerHour = 10_000,
        RawTotalNitrogenMgPerL = 60,
        RawTotalPhosphorusMgPerL = 9,
        Levels = levels ?? [Level("standard")],
        StandardLevel = (levels ?? [Level("standard")])[0].Id,
        Stages = stages ?? [],
        BaseLoadKw = 0,
        Permit = permit ?? new Permit(),
    };

    /// <summary>A stage of one unit fed from the secondary, product to <paramref name="tank"/>.</summary>
    public static Stage Stage(string id, string tank, string plant = "mill", double maxFlowM3PerHour = 100, double minFlowM3PerHour = 0,
        double energyKWhPerM3 = 0, int units = 1) => new()
    {
        Id = new StageId(id),
        Name = id,
        Plant = new PlantId(plant),
        ProductTank = new TankId(tank),
        ProducesClass = new ClassId("A"),
        RecoveryFraction = 1,
        EnergyKWhPerM3 = energyKWhPerM3,
        Units = units,
        UnitMinFlowM3PerHour = minFlowM3PerHour,
        UnitMaxFlowM3PerHour = maxFlowM3PerHour,
    };

    public static Tank Tank(string id, string @class = "A", double initialM3 = 0, double minM3 = 0, double maxM3 = 100_000, string? plant = "mill") =>
        new(new TankId(id), id, plant is null ? null : new PlantId(plant), new ClassId(@class), minM3, maxM3, initialM3, 0);

    public static Pipeline ToCustomer(string id, string from, string customer, double capacityM3PerHour = 10_000, double energyKWhPerM3 = 0) =>
        new(new PipelineId(id), id, new TankId(from), PipelineEnd.ToCustomer(new CustomerId(customer)), capacityM3PerHour, energyKWhPerM3, new PlantId("mill"), null);

    public static Customer HourlyCustomer(string id, double m3PerHour, double shortfallPenaltyPerM3 = 10, string @class = "A") => new()
    {
        Id = new CustomerId(id),
        Name = id,
        Class = new ClassId(@class),
        Demand = new HourlyDemand(Series.Constant(m3PerHour)),
        ShortfallPenaltyPerM3 = shortfallPenaltyPerM3,
    };

    /// <summary>A daily volume; the default window 00:00–00:00 allows every hour.</summary>
    public static Customer DailyCustomer(string id, double m3PerDay, double shortfallPenaltyPerM3 = 10, LocalTime? from = null, LocalTime? to = null,
        double? maxM3PerHour = null, int priority = 1) => new()
    {
        Id = new CustomerId(id),
        Name = id,
        Class = new ClassId("A"),
        Demand = new DailyDemand(m3PerDay, from ?? LocalTime.Midnight, to ?? LocalTime.Midnight, maxM3PerHour),
        ShortfallPenaltyPerM3 = shortfallPenaltyPerM3,
        Priority = priority,
    };

    public static Network Network(Tariff tariff, IReadOnlyList<Plant> plants, IReadOnlyList<Tank>? tanks = null,
        IReadOnlyList<Pipeline>? pipelines = null, IReadOnlyList<Customer>? customers = null, IReadOnlyList<QualityClass>? classes = null,
        Penalties? penalties = null) => new()
    {
        Name = "test network",
        TimeZone = Madrid,
        Currency = "EUR",
        PeriodMinutes = 60,
        Classes = classes ?? [ClassA],
        Tariffs = [tariff],
        Plants = plants,
        Tanks = tanks ?? [],
        Pipelines = pipelines ?? [],
        Customers = customers ?? [],
        Penalties = penalties ?? new Penalties(),
    };

    public static PlanningCase Case(Network network, LocalDate? start = null, int days = 1)
    {
        var result = PlanningCase.Create(network, start ?? Weekday, days);
        return result.Case ?? throw new InvalidOperationException(string.Join("; ", result.Problems));
    }

    /// <summary>Solves with the defaults the product uses (HiGHS, 0.5 % gap) but a tight gap for hand-checked optima.</summary>
    public static Core.Plans.Plan Solve(PlanningCase planningCase, string solver = "HIGHS") =>
        Planner.Solve(planningCase, new SolveOptions { Solver = solver, GapPercent = 0.01, TimeLimitSeconds = 30 });

    /// <summary>Hours 0..23 at <paramref name="dear"/> except the listed ones at <paramref name="cheap"/>, currency/MWh.</summary>
    public static double[] Prices(double dear, double cheap, params int[] cheapHours) =>
        Enumerable.Range(0, 24).Select(h => cheapHours.Contains(h) ? cheap : dear).ToArray();
}
