using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Actuals;

/// <summary>
/// One hour of a plant's measured results, as reported by its control system. Every measurement is optional:
/// a plant reports what its instruments give. Volumes in m3 over the hour, energies in kWh over the hour,
/// levels at the end of the hour.
/// </summary>
public sealed record HourlyActuals
{
    public required PlantId Plant { get; init; }
    /// <summary>Start of the hour [HourStart, HourStart + 1 h), UTC.</summary>
    public required Instant HourStart { get; init; }
    public double? InfluentM3 { get; init; }
    public IReadOnlyDictionary<ClassId, double> ProductionM3ByClass { get; init; } = new Dictionary<ClassId, double>();
    /// <summary>Volume in each of the plant's tanks at the end of the hour, m3.</summary>
    public IReadOnlyDictionary<TankId, double> TankEndM3 { get; init; } = new Dictionary<TankId, double>();
    public double? EffluentTotalNitrogenMgPerL { get; init; }
    public double? EffluentTotalPhosphorusMgPerL { get; init; }
    public double? ImportedKWh { get; init; }
    public double? GeneratedKWh { get; init; }
    /// <summary>Units of each stage running at the end of the hour.</summary>
    public IReadOnlyDictionary<StageId, int> UnitsRunning { get; init; } = new Dictionary<StageId, int>();
    /// <summary>Gas in the holder at the end of the hour, Nm3.</summary>
    public double? GasHolderNm3 { get; init; }
    public double? OutfallM3 { get; init; }
    public double? OutfallTotalNitrogenKg { get; init; }
    public double? OutfallTotalPhosphorusKg { get; init; }

    public Instant HourEnd => HourStart + Duration.FromHours(1);
}
