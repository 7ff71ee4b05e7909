using NodaTime;

namespace PlanDesk.Server.Views;

// What the browser desk draws, computed here so the pages only plot: per-period arrays are indexed like the
// plan's periods (volumes m3 in the period, energies kWh in the period), per-day arrays by local day.

public sealed record ClassInfo(string ClassId, string Name, int Rank);

/// <summary>How hard an element works over the horizon, in percent of <see cref="Basis"/>.</summary>
/// <param name="Basis">What 100 % is, in words with units, e.g. "secondary capacity 1 100 m3/h".</param>
public sealed record CapacityUse(double MeanPercent, double PeakPercent, string Basis);

/// <summary>The region as the schematic draws it: plants with their stages, tanks, customers and the pipelines between them.</summary>
public sealed record SchematicResponse(
    long PlanId,
    string NetworkName,
    bool HasPlan,
    IReadOnlyList<ClassInfo> Classes,
    IReadOnlyList<SchematicPlant> Plants,
    IReadOnlyList<SchematicTank> Tanks,
    IReadOnlyList<SchematicCustomer> Customers,
    IReadOnlyList<SchematicPipeline> Pipelines);

/// <param name="Use">Secondary treatment against its capacity; null when the plan has no decisions.</param>
/// <param name="EngineUse">Engine output against its size; null without an engine or a plan.</param>
/// <param name="Binding">Limits of the plant that bind (capacity, engine, permit caps), in plain words.</param>
/// <param name="Problems">The plan's problems at this plant, in plain words.</param>
public sealed record SchematicPlant(
    string PlantId, string Name, CapacityUse? Use, CapacityUse? EngineUse, IReadOnlyList<SchematicStage> Stages,
    IReadOnlyList<string> Binding, IReadOnlyList<string> Problems);

/// <param name="FeedTankId">The tank the stage draws from; null when it takes secondary effluent.</param>
public sealed record SchematicStage(
    string StageId, string Name, string ClassId, string? FeedTankId, string ProductTankId, CapacityUse? Use, IReadOnlyList<string> Binding);

/// <param name="PlantId">Null for a regional reservoir.</param>
/// <param name="Use">Level within the usable range (minimum to maximum).</param>
public sealed record SchematicTank(
    string TankId, string Name, string? PlantId, string ClassId, CapacityUse? Use, IReadOnlyList<string> Binding, IReadOnlyList<string> Problems);

/// <summary>A customer with the horizon's totals, m3.</summary>
public sealed record SchematicCustomer(
    string CustomerId, string Name, string Kind, string ClassId, double DemandM3, double DeliveredM3, double ShortfallM3, IReadOnlyList<string> Problems);

/// <param name="ToKind">"tank" or "customer".</param>
public sealed record SchematicPipeline(
    string PipelineId, string Name, string FromTankId, string ToId, string ToKind, CapacityUse? Use, IReadOnlyList<string> Binding);

/// <summary>Every per-period quantity of a plan with what it is read against: prices, demand, bounds, caps.</summary>
public sealed record PlanSeriesResponse(
    long PlanId,
    string NetworkName,
    string Currency,
    string TimeZone,
    int PeriodMinutes,
    IReadOnlyList<ClassInfo> Classes,
    IReadOnlyList<SeriesPeriod> Periods,
    IReadOnlyList<SeriesDay> Days,
    IReadOnlyList<PlantSeries> Plants,
    IReadOnlyList<TankSeries> Reservoirs,
    IReadOnlyList<CustomerSeries> Customers);

/// <param name="UtcOffset">The local offset, e.g. "+01:00"; tells the two 02:00 hours of a fall-back day apart.</param>
public sealed record SeriesPeriod(int Index, Instant Start, LocalDateTime LocalStart, string UtcOffset, int Day);

public sealed record SeriesDay(int Index, LocalDate Date, int FirstPeriod, int PeriodCount);

/// <param name="SecondaryCapacityM3">Most the secondary stage treats in one period, m3.</param>
/// <param name="ProductionM3ByClass">Reclaimed water produced per quality class (from the plan's target sheets).</param>
/// <param name="OutfallM3">Discharged at the outfall (from the plan's target sheets).</param>
/// <param name="MaxOutfallM3">The permit's most outfall flow in one period, m3; null when the permit has none.</param>
public sealed record PlantSeries(
    string PlantId,
    string Name,
    double[] InfluentM3,
    double[] TreatedM3,
    double[] BypassM3,
    double SecondaryCapacityM3,
    IReadOnlyDictionary<string, double[]> ProductionM3ByClass,
    double[] OutfallM3,
    double? MaxOutfallM3,
    IReadOnlyList<StageSeries> Stages,
    IReadOnlyList<TankSeries> Tanks,
    EnergySeries Energy,
    IReadOnlyList<LevelInfo> Levels,
    IReadOnlyList<string> LevelByDay,
    IReadOnlyList<PermitDay> Permit);

public sealed record StageSeries(string StageId, string Name, string ClassId, int UnitsInstalled, int[] UnitsRunning, int[] UnitsAvailable, double[] FeedM3);

/// <summary>A tank's volume at the end of each period, m3, and its bounds.</summary>
public sealed record TankSeries(string TankId, string Name, string ClassId, double[] LevelM3, double MinM3, double MaxM3, double InitialM3);

/// <param name="PricePerMWh">Price of imported energy per period, currency/MWh.</param>
/// <param name="HolderNm3">Gas in the holder at the end of each period, Nm3; null without an engine.</param>
public sealed record EnergySeries(
    double[] ImportKWh, double[] ExportKWh, double[] EngineKWh, double[] PricePerMWh, double FeedInPricePerMWh,
    double? EngineKw, double[]? HolderNm3, double? HolderMaxNm3);

public sealed record LevelInfo(string LevelId, string Name, double EffluentTotalNitrogenMgPerL, double EffluentTotalPhosphorusMgPerL);

/// <summary>A local day's outfall loads against the permit, kg (from the plan's target sheets); month to date
/// counts the permit's month-to-date load before the horizon plus the plan's days of the same month.</summary>
public sealed record PermitDay(
    LocalDate Date,
    double OutfallM3,
    double TotalNitrogenKg,
    double? DailyTotalNitrogenCapKg,
    double MonthToDateTotalNitrogenKg,
    double? MonthlyTotalNitrogenCapKg,
    double TotalPhosphorusKg,
    double? DailyTotalPhosphorusCapKg,
    double MonthToDateTotalPhosphorusKg,
    double? MonthlyTotalPhosphorusCapKg);

/// <param name="DemandM3">Hourly-demand customers: demand per period; null for daily-volume customers.</param>
/// <param name="OwedM3ByDay">Daily-volume customers: volume owed per local day; null for hourly customers.</param>
/// <param name="ShortfallM3">Per period for hourly customers, per local day for daily-volume customers.</param>
/// <param name="MarginalCostPerM3">Marginal cost of water per period, currency/m3; null where the plan has none.</param>
public sealed record CustomerSeries(
    string CustomerId,
    string Name,
    string Kind,
    string ClassId,
    int Priority,
    double[]? DemandM3,
    double[]? OwedM3ByDay,
    double[] DeliveredM3,
    double[] ShortfallM3,
    double?[] MarginalCostPerM3);

/// <summary>What publishing a plan would do: each plant-day it holds, and the version it would supersede.</summary>
/// <param name="Publishable">False when the plan has no targets (no plan found, or not yet solved).</param>
/// <param name="Reason">Why it cannot be published, when it cannot.</param>
public sealed record PublicationPreviewResponse(long PlanId, bool Publishable, string? Reason, IReadOnlyList<PlantDayPreview> PlantDays);

/// <param name="CurrentVersion">The version now in force for the plant-day; null when none is published.</param>
/// <param name="CurrentPlanId">The plan that version came from.</param>
public sealed record PlantDayPreview(string PlantId, string PlantName, LocalDate Date, int? CurrentVersion, long? CurrentPlanId);
