namespace PlanDesk.Planning.Solving;

/// <summary>The phases a solve reports, in the order a solve goes through them.</summary>
internal static class SolvePhases
{
    public const string Baseline = "rule-based baseline";
    public const string BaselineDecisions = "first plan from the baseline's decisions";
    public const string FirstPlan = "relaxation and first plan";
    public const string RoundedPlan = "first plan from the relaxation";
    public const string DayByDay = "solving day by day";
    public const string Building = "building the model";
    public const string Solving = "solving";
    public const string Explaining = "explaining (marginal water costs)";
    public const string Joining = "joining the group plans";

    private static readonly string[] Order = [Baseline, BaselineDecisions, FirstPlan, RoundedPlan, DayByDay, Building, Solving, Explaining, Joining];

    /// <summary>The phase that comes first among <paramref name="phases"/>: how far groups run side by side have all got.</summary>
    public static string Earliest(IReadOnlyList<string> phases) => phases.MinBy(p => Math.Max(0, Array.IndexOf(Order, p)))!;
}
