using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>What follows from a plant's part of a plan: its electricity load, outfall flow and permit loads.
/// Per-period arrays are indexed by period, per-day by local day, per-month by billing month of the horizon.</summary>
public sealed record PlantAccounts
{
    public required PlantId Plant { get; init; }
    /// <summary>Aeration energy: the day's level kWh/m3 × treated, kWh.</summary>
    public required double[] AerationKWh { get; init; }
    /// <summary>Energy of the plant's stages: kWh/m3 × feed, kWh.</summary>
    public required double[] StageKWh { get; init; }
    /// <summary>Pumping energy of the pipelines this plant powers, kWh.</summary>
    public required double[] PumpKWh { get; init; }
    /// <summary>Aeration + stages + pumps + base load, kWh.</summary>
    public required double[] LoadKWh { get; init; }
    /// <summary>Secondary effluent to the outfall + stage rejects + bypass, m3.</summary>
    public required double[] OutfallM3 { get; init; }
    /// <summary>Outfall volume above the permit's maximum outfall flow, m3 (0 without a limit).</summary>
    public required double[] OutfallExcessM3 { get; init; }
    /// <summary>Outfall volume that carries the secondary effluent's nutrients: secondary to the outfall + the
    /// nutrient rejection fraction × feed of each stage fed from the secondary or a tank at the plant, m3
    /// (bypass is counted at raw concentration).</summary>
    public required double[] NitrogenBearingM3 { get; init; }
    public required LoadAccount TotalNitrogen { get; init; }
    public required LoadAccount TotalPhosphorus { get; init; }
    /// <summary>Highest import of each billing month in the horizon, kW.</summary>
    public required double[] PeakImportKwByMonth { get; init; }
    /// <summary>Demand charge of each billing month: rate × rise of the peak above the month-to-date peak, currency.</summary>
    public required double[] DemandChargeByMonth { get; init; }
}

/// <summary>Discharged mass of one substance (total N or total P) against the permit's caps.</summary>
/// <param name="KgByDay">Load discharged each local day, kg.</param>
/// <param name="DailyExcessKg">Load above the daily cap each day, kg (0 without a cap).</param>
/// <param name="KgByMonth">Load of each billing month in the horizon, with the month-to-date load added for the first month, kg.</param>
/// <param name="MonthlyExcessKg">Load above the monthly cap each billing month, kg (0 without a cap).</param>
public sealed record LoadAccount(
    double[] KgByDay,
    double? DailyCapKg,
    double[] DailyExcessKg,
    double[] KgByMonth,
    double? MonthlyCapKg,
    double[] MonthlyExcessKg);

/// <summary>Everything <see cref="PlanCosting"/> works out from a plan: the cost and what it is computed from.</summary>
public sealed record PlanAccounts(
    CostBreakdown Costs,
    IReadOnlyDictionary<PlantId, PlantAccounts> Plants,
    IReadOnlyDictionary<TankId, double> TankEndDeficitM3);
