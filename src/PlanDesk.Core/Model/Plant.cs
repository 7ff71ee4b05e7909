namespace PlanDesk.Core.Model;

/// <summary>A wastewater treatment plant: secondary stage, polishing stages, energy and permit.</summary>
public sealed record Plant
{
    public required PlantId Id { get; init; }
    public required string Name { get; init; }
    public required TariffId Tariff { get; init; }
    /// <summary>Forecast influent, m3/h.</summary>
    public required Series InfluentM3PerHour { get; init; }
    /// <summary>Hydraulic capacity of the secondary (biological) stage, m3/h.</summary>
    public required double SecondaryCapacityM3PerHour { get; init; }
    /// <summary>Total N of raw sewage, mg/L: the load of bypassed influent.</summary>
    public required double RawTotalNitrogenMgPerL { get; init; }
    /// <summary>Total P of raw sewage, mg/L.</summary>
    public required double RawTotalPhosphorusMgPerL { get; init; }
    /// <summary>Treatment levels the secondary stage can run at; one is chosen per local day.</summary>
    public required IReadOnlyList<TreatmentLevel> Levels { get; init; }
    /// <summary>The level operators run without a planner (used by the rule-based baseline).</summary>
    public required LevelId StandardLevel { get; init; }
    public required IReadOnlyList<Stage> Stages { get; init; }
    /// <summary>Electrical load that does not depend on the plan (buildings, sludge handling ...), kW.</summary>
    public required double BaseLoadKw { get; init; }
    public Biogas? Biogas { get; init; }
    public required Permit Permit { get; init; }
    /// <summary>Highest grid import of the current billing month so far, kW.</summary>
    public double MonthToDatePeakKw { get; init; }

    public TreatmentLevel Level(LevelId id) => Levels.First(l => l.Id == id);
}

/// <summary>A treatment level of the secondary stage.</summary>
/// <param name="EffluentTotalNitrogenMgPerL">Total N of the secondary effluent at this level, mg/L.</param>
/// <param name="EffluentTotalPhosphorusMgPerL">Total P of the secondary effluent at this level, mg/L.</param>
/// <param name="AerationEnergyKWhPerM3">Aeration energy per m3 treated, kWh/m3.</param>
/// <param name="ChemicalCostPerM3">External carbon, coagulant etc. per m3 treated, currency/m3.</param>
public sealed record TreatmentLevel(
    LevelId Id,
    string Name,
    double EffluentTotalNitrogenMgPerL,
    double EffluentTotalPhosphorusMgPerL,
    double AerationEnergyKWhPerM3,
    double ChemicalCostPerM3);

/// <summary>
/// A polishing stage of identical units. It takes water from the secondary effluent or from a tank,
/// sends <see cref="RecoveryFraction"/> of it as product into <see cref="ProductTank"/> and the rest to the outfall.
/// </summary>
public sealed record Stage
{
    public required StageId Id { get; init; }
    public required string Name { get; init; }
    public required PlantId Plant { get; init; }
    /// <summary>The tank the stage draws from; null when it takes secondary effluent.</summary>
    public TankId? FeedTank { get; init; }
    public required TankId ProductTank { get; init; }
    public required ClassId ProducesClass { get; init; }
    /// <summary>Product per m3 fed, in (0, 1].</summary>
    public required double RecoveryFraction { get; init; }
    /// <summary>Share of the feed's nitrogen and phosphorus sent with the reject to the outfall, [0, 1].
    /// Membranes reject most nutrients; filtration and UV reject none.</summary>
    public double NutrientRejectionFraction { get; init; }
    /// <summary>Energy per m3 fed, kWh/m3.</summary>
    public required double EnergyKWhPerM3 { get; init; }
    /// <summary>Chemicals per m3 fed, currency/m3.</summary>
    public double ChemicalCostPerM3 { get; init; }
    public required int Units { get; init; }
    /// <summary>Least feed of one running unit, m3/h.</summary>
    public required double UnitMinFlowM3PerHour { get; init; }
    /// <summary>Most feed of one running unit, m3/h.</summary>
    public required double UnitMaxFlowM3PerHour { get; init; }
    /// <summary>Cost of starting one unit, currency.</summary>
    public double StartupCost { get; init; }
    /// <summary>A started unit runs at least this long, hours.</summary>
    public double MinRunHours { get; init; }
    /// <summary>Units running just before the horizon starts.</summary>
    public int InitialUnitsRunning { get; init; }
    /// <summary>Units available per period (outages); null means all units always.</summary>
    public Series? AvailableUnits { get; init; }
}

/// <summary>Digester gas, gas holder and the combined heat-and-power engine.</summary>
/// <param name="ProductionNm3PerHour">Biogas produced, Nm3/h.</param>
/// <param name="LowerHeatingValueKWhPerNm3">Energy content of the gas, kWh/Nm3 (about 6 at 60 % methane).</param>
/// <param name="HolderNm3">Gas holder size, Nm3.</param>
/// <param name="InitialHolderNm3">Gas in the holder at the start, Nm3.</param>
/// <param name="EngineKw">Electrical rating of the engine, kW.</param>
/// <param name="EngineEfficiency">Electrical efficiency, (0, 1].</param>
public sealed record Biogas(
    Series ProductionNm3PerHour,
    double LowerHeatingValueKWhPerNm3,
    double HolderNm3,
    double InitialHolderNm3,
    double EngineKw,
    double EngineEfficiency);

/// <summary>A plant's discharge permit at its outfall. Null caps and limits do not apply.</summary>
public sealed record Permit
{
    public double? DailyTotalNitrogenKg { get; init; }
    public double? MonthlyTotalNitrogenKg { get; init; }
    /// <summary>Total N discharged so far in the month the horizon starts in, kg.</summary>
    public double MonthToDateTotalNitrogenKg { get; init; }
    public double? DailyTotalPhosphorusKg { get; init; }
    public double? MonthlyTotalPhosphorusKg { get; init; }
    public double MonthToDateTotalPhosphorusKg { get; init; }
    /// <summary>Treatment levels whose effluent exceeds this concentration may not be chosen, mg/L.</summary>
    public double? MaxTotalNitrogenMgPerL { get; init; }
    public double? MaxTotalPhosphorusMgPerL { get; init; }
    public double? MaxOutfallM3PerHour { get; init; }
}
