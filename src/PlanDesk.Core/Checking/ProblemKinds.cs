using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>
/// Kinds of <see cref="PlanProblem"/> for the priced outcomes every plan must name (the names the planner and the
/// baseline both use), and the kind under which a plan names each kind of violation, so a plan's problems can be
/// matched with the checker's findings.
/// </summary>
public static class ProblemKinds
{
    public const string Shortfall = "shortfall";
    public const string Bypass = "bypass";
    public const string NitrogenDailyExcess = "tnDailyExcess";
    public const string PhosphorusDailyExcess = "tpDailyExcess";
    public const string NitrogenMonthlyExcess = "tnMonthlyExcess";
    public const string PhosphorusMonthlyExcess = "tpMonthlyExcess";
    public const string OutfallExcess = "outfallExcess";
    public const string TankBelowMinimum = "tankBelowMinimum";
    public const string TankAboveMaximum = "tankAboveMaximum";
    public const string TankEndDeficit = "tankEndDeficit";
    /// <summary>No treatment level meets the permit's concentration limits (a fault of the data).</summary>
    public const string LevelLimit = "levelLimit";

    /// <summary>The problem kind under which a plan names a violation of <paramref name="violationKind"/>; a
    /// violation of a rule without a priced slack (a unit stopped inside its minimum run ...) under its own kind.</summary>
    public static string ForViolation(string violationKind) => violationKind switch
    {
        ViolationKind.DailyNitrogenCap => NitrogenDailyExcess,
        ViolationKind.DailyPhosphorusCap => PhosphorusDailyExcess,
        ViolationKind.MonthlyNitrogenCap => NitrogenMonthlyExcess,
        ViolationKind.MonthlyPhosphorusCap => PhosphorusMonthlyExcess,
        ViolationKind.OutfallFlow => OutfallExcess,
        ViolationKind.TankMin => TankBelowMinimum,
        ViolationKind.TankMax => TankAboveMaximum,
        ViolationKind.ConcentrationLimit => LevelLimit,
        _ => violationKind,
    };

    /// <summary>True when <paramref name="problems"/> name the violation: same kind (as mapped), same place, and the
    /// same local day (a problem without a day names the violation on every day).</summary>
    public static bool Names(IEnumerable<PlanProblem> problems, Violation violation) =>
        problems.Any(p => p.Kind == ForViolation(violation.Kind) && p.Where == violation.Where && (p.Day is null || p.Day == violation.Day));
}
