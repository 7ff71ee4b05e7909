using NodaTime;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>
/// One way a plan breaks the network's rules, found by <see cref="PlanChecker"/>.
/// </summary>
/// <param name="Kind">What kind of rule is broken; one of <see cref="ViolationKind"/>.</param>
/// <param name="Where">Id of the plant, stage, tank, pipeline or customer concerned ("plan" for the plan as a whole).</param>
/// <param name="Period">Index of the period, when the rule holds per period.</param>
/// <param name="LocalStart">Local start time of that period in the network's zone.</param>
/// <param name="Day">The local day, for daily rules (and the day of <paramref name="Period"/>).</param>
/// <param name="Amount">How far the plan is beyond the limit, in <paramref name="Unit"/> (always ≥ 0).</param>
/// <param name="Unit">Unit of <paramref name="Amount"/> and <paramref name="Limit"/>: m3, kWh, Nm3, kg, units, mg/L, currency code ...</param>
/// <param name="Limit">The limit or expected value the plan breaks, when there is one number.</param>
/// <param name="Message">The violation in plain words.</param>
/// <param name="Penalised">True for soft limits the objective prices (load caps, outfall flow, tank limits): the plan
/// pays for them and must name them among its problems; false for rules no plan may break.</param>
public sealed record Violation(
    string Kind,
    string Where,
    int? Period,
    LocalDateTime? LocalStart,
    LocalDate? Day,
    double Amount,
    string Unit,
    double? Limit,
    string Message,
    bool Penalised = false);

/// <summary>The outcome of checking one plan: every violation and the cost the checker worked out itself.</summary>
/// <param name="RecomputedCosts">The plan's cost by <see cref="PlanCosting"/>; null when the plan is too malformed to cost.</param>
public sealed record CheckReport(IReadOnlyList<Violation> Violations, CostBreakdown? RecomputedCosts, CheckTolerances Tolerances)
{
    public bool Passed => Violations.Count == 0;

    /// <summary>Violations of rules no plan may break (everything except priced soft limits).</summary>
    public IEnumerable<Violation> HardViolations => Violations.Where(v => !v.Penalised);
}

/// <summary>The kinds of violation the checker reports.</summary>
public static class ViolationKind
{
    // The plan's shape: it must cover the network and the horizon before anything else can be checked.
    public const string NoPlan = "noPlan";
    public const string HorizonMismatch = "horizonMismatch";
    public const string MissingEntry = "missingEntry";
    public const string UnknownEntry = "unknownEntry";
    public const string DuplicateEntry = "duplicateEntry";
    public const string ArrayLength = "arrayLength";
    public const string NotFinite = "notFinite";
    public const string UnknownLevel = "unknownLevel";

    // Flows and volumes.
    public const string NegativeValue = "negativeValue";
    public const string SecondaryBalance = "secondaryBalance";
    public const string SecondaryCapacity = "secondaryCapacity";
    public const string SecondarySplit = "secondarySplit";
    public const string UnitsAvailable = "unitsAvailable";
    public const string StageFlowMin = "stageFlowMin";
    public const string StageFlowMax = "stageFlowMax";
    public const string UnitStarts = "unitStarts";
    public const string MinimumRun = "minimumRun";
    public const string TankBalance = "tankBalance";
    public const string TankMin = "tankMin";
    public const string TankMax = "tankMax";
    public const string PipelineCapacity = "pipelineCapacity";
    public const string PumpCount = "pumpCount";
    public const string PumpFlow = "pumpFlow";
    public const string ClassRule = "classRule";
    public const string DeliveryBalance = "deliveryBalance";
    public const string DemandBalance = "demandBalance";
    public const string DeliveryWindow = "deliveryWindow";
    public const string BlendLimit = "blendLimit";

    // Permits.
    public const string ConcentrationLimit = "concentrationLimit";
    public const string DailyNitrogenCap = "dailyNitrogenCap";
    public const string DailyPhosphorusCap = "dailyPhosphorusCap";
    public const string MonthlyNitrogenCap = "monthlyNitrogenCap";
    public const string MonthlyPhosphorusCap = "monthlyPhosphorusCap";
    public const string OutfallFlow = "outfallFlow";

    // Energy.
    public const string EngineBalance = "engineBalance";
    public const string EngineSize = "engineSize";
    public const string HolderBalance = "holderBalance";
    public const string HolderLimits = "holderLimits";
    public const string HolderEndBelowStart = "holderEndBelowStart";
    public const string ElectricityBalance = "electricityBalance";

    // Cost.
    public const string CostMismatch = "costMismatch";
    public const string ObjectiveMismatch = "objectiveMismatch";
}
