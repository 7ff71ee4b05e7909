using System.Text.Json.Serialization;
using NodaTime;
using PlanDesk.Core.Actuals;
using PlanDesk.Core.Model;

namespace PlanDesk.Server.Reports;

/// <summary>Hourly actuals from one plant: one entry per hour, measurements the plant does not have left out.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ActualsRequest
{
    public required IReadOnlyList<ActualsHour> Hours { get; init; }
}

/// <summary>One hour [hourStart, hourStart + 1 h) of a plant's measured results. Volumes m3 and energies kWh over
/// the hour; tank levels, units running and the gas holder at the end of the hour.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ActualsHour
{
    /// <summary>Start of the hour, on the hour, as UTC or with an offset.</summary>
    public required Instant HourStart { get; init; }
    public double? InfluentM3 { get; init; }
    /// <summary>Reclaimed water produced, m3 by quality class id.</summary>
    public IReadOnlyDictionary<string, double>? ProductionM3ByClass { get; init; }
    /// <summary>Volume in the plant's tanks at the end of the hour, m3 by tank id.</summary>
    public IReadOnlyDictionary<string, double>? TankLevelsM3 { get; init; }
    public double? EffluentTotalNitrogenMgPerL { get; init; }
    public double? EffluentTotalPhosphorusMgPerL { get; init; }
    public double? EnergyImportedKWh { get; init; }
    public double? EnergyGeneratedKWh { get; init; }
    /// <summary>Units running at the end of the hour, by stage id.</summary>
    public IReadOnlyDictionary<string, int>? UnitsRunning { get; init; }
    public double? GasHolderNm3 { get; init; }
    public double? OutfallM3 { get; init; }
    public double? OutfallTotalNitrogenKg { get; init; }
    public double? OutfallTotalPhosphorusKg { get; init; }

    public HourlyActuals ToCore(string plantId) => new()
    {
        Plant = new PlantId(plantId),
        HourStart = HourStart,
        InfluentM3 = InfluentM3,
        ProductionM3ByClass = (ProductionM3ByClass ?? new Dictionary<string, double>()).ToDictionary(p => new ClassId(p.Key), p => p.Value),
        TankEndM3 = (TankLevelsM3 ?? new Dictionary<string, double>()).ToDictionary(p => new TankId(p.Key), p => p.Value),
        EffluentTotalNitrogenMgPerL = EffluentTotalNitrogenMgPerL,
        EffluentTotalPhosphorusMgPerL = EffluentTotalPhosphorusMgPerL,
        ImportedKWh = EnergyImportedKWh,
        GeneratedKWh = EnergyGeneratedKWh,
        UnitsRunning = (UnitsRunning ?? new Dictionary<string, int>()).ToDictionary(p => new StageId(p.Key), p => p.Value),
        GasHolderNm3 = GasHolderNm3,
        OutfallM3 = OutfallM3,
        OutfallTotalNitrogenKg = OutfallTotalNitrogenKg,
        OutfallTotalPhosphorusKg = OutfallTotalPhosphorusKg,
    };
}

/// <summary>A stored report of actuals. A retry with the same Idempotency-Key returns the same report.</summary>
public sealed record ActualsReportResponse(long ReportId, string PlantId, int HourCount, Instant FirstHourStart, Instant LastHourStart, Instant ReceivedAt);

/// <summary>Stored hours of a plant; where an hour was reported twice, the later report.</summary>
public sealed record ActualsListResponse(string PlantId, IReadOnlyList<StoredActualsHour> Hours);

public sealed record StoredActualsHour(long ReportId, ActualsHour Hour);

/// <summary>Acknowledges one published version of a plant's targets for a local day.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record AcknowledgementRequest
{
    /// <summary>The target version being acknowledged (from the targets response).</summary>
    public required int Version { get; init; }
    /// <summary>Who or what acknowledged: an operator's name or the control system's id.</summary>
    public string? AcknowledgedBy { get; init; }
    public string? Note { get; init; }
}

/// <summary>A stored acknowledgement. A retry with the same Idempotency-Key returns the same acknowledgement.</summary>
public sealed record AcknowledgementResponse(
    long AcknowledgementId, string PlantId, LocalDate Date, int Version, Instant ReceivedAt, string? AcknowledgedBy, string? Note);
