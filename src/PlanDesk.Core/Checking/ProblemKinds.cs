namespace PlanDesk.Core.Checking;

/// <summary>
/// Kinds of <see cref="Plans.PlanProblem"/> for the penalised outcomes every plan must name, and the kind a
/// problem takes for each violation kind, so a plan's problems can be matched with the checker's findings.
/// </summary>
public static class ProblemKinds
{
    public const string Shortfall = "shortfall";
    public const string Bypass = "bypass";
    public const string PermitExcess = "permitExcess";
    public const string OutfallExcess = "outfallExcess";
    public const string TankEndDeficit = "tankEndDeficit";

    /// <summary>The problem kind under which a plan should name a violation of <paramref name="violationKind"/>:
    /// load caps as permitExcess, outfall flow as outfallExcess, anything else under its own kind.</summary>
    public static string ForViolation(string violationKind) => violationKind switch
    {
        ViolationKind.DailyNitrogenCap or ViolationKind.DailyPhosphorusCap
            or ViolationKind.MonthlyNitrogenCap or ViolationKind.MonthlyPhosphorusCap => PermitExcess,
        ViolationKind.OutfallFlow => OutfallExcess,
        _ => violationKind,
    };
}
