using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>
/// A utility's reclaimed-water network as loaded and validated from a network file.
/// Time series are kept as given; <see cref="PlanningCase"/> resolves them onto a horizon.
/// </summary>
public sealed record Network
{
    public required string Name { get; init; }
    public required DateTimeZone TimeZone { get; init; }
    /// <summary>ISO 4217 code used for every money amount in the file and the plan.</summary>
    public required string Currency { get; init; }
    /// <summary>Length of one planning period: 15, 30 or 60 minutes.</summary>
    public required int PeriodMinutes { get; init; }
    /// <summary>Horizon used when the user gives none.</summary>
    public LocalDate? DefaultStartDate { get; init; }
    public int DefaultDays { get; init; } = 1;
    /// <summary>Quality classes ordered best first; a class may serve any use needing it or a worse one.</summary>
    public required IReadOnlyList<QualityClass> Classes { get; init; }
    public required IReadOnlyList<Tariff> Tariffs { get; init; }
    public required IReadOnlyList<Plant> Plants { get; init; }
    public required IReadOnlyList<Tank> Tanks { get; init; }
    public required IReadOnlyList<Pipeline> Pipelines { get; init; }
    public required IReadOnlyList<Customer> Customers { get; init; }
    public Penalties Penalties { get; init; } = new();
    /// <summary>Optional price of CO2 emitted by grid imports, currency per tonne; 0 leaves carbon out.</summary>
    public double CarbonPricePerTonne { get; init; }
    /// <summary>The file the network was loaded from, for messages; empty for networks built in code.</summary>
    public string SourcePath { get; init; } = "";

    public QualityClass Class(ClassId id) => Classes.First(c => c.Id == id);
    public Plant Plant(PlantId id) => Plants.First(p => p.Id == id);
    public Tank Tank(TankId id) => Tanks.First(t => t.Id == id);
    public Tariff Tariff(TariffId id) => Tariffs.First(t => t.Id == id);
    public Customer Customer(CustomerId id) => Customers.First(c => c.Id == id);
    public IEnumerable<Stage> Stages => Plants.SelectMany(p => p.Stages);
    public Stage Stage(StageId id) => Stages.First(s => s.Id == id);

    /// <summary>True when water of class <paramref name="supplied"/> may serve a use needing <paramref name="required"/>.</summary>
    public bool Serves(ClassId supplied, ClassId required) => Class(supplied).Rank <= Class(required).Rank;
}

/// <summary>
/// Penalty prices that keep every plan feasible: a non-zero slack is reported as a problem, never hidden.
/// All in the network's currency.
/// </summary>
public sealed record Penalties
{
    /// <summary>Per m3 of influent bypassing secondary treatment.</summary>
    public double BypassPerM3 { get; init; } = 5.0;
    /// <summary>Per kg of total N or total P above a daily or monthly permit cap.</summary>
    public double PermitExcessPerKg { get; init; } = 200.0;
    /// <summary>Per m3 of outfall flow above the permit's maximum outfall flow.</summary>
    public double OutfallExcessPerM3 { get; init; } = 20.0;
    /// <summary>Per m3 a tank ends the horizon below its starting volume.</summary>
    public double TankEndDeficitPerM3 { get; init; } = 0.5;
    /// <summary>Per m3 a tank is below its minimum or above its maximum in a period: only when the data allow
    /// nothing else (a tank that starts outside its limits, or losses with no way to refill).</summary>
    public double TankLimitPerM3 { get; init; } = 10.0;
}

/// <summary>A reclaimed-water quality class with its nominal quality.</summary>
/// <param name="Rank">0 for the best class, increasing for worse ones.</param>
/// <param name="Quality">Nominal values by parameter name, e.g. <c>eColiPer100Ml</c>, <c>bod5MgPerL</c>,
/// <c>tssMgPerL</c>, <c>turbidityNtu</c>, <c>totalNitrogenMgPerL</c>, <c>conductivityUsPerCm</c>.</param>
public sealed record QualityClass(ClassId Id, string Name, int Rank, IReadOnlyDictionary<string, double> Quality);
