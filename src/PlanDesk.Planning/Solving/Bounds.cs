using Google.OrTools.LinearSolver;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Solving;

/// <summary>The best proven lower bound on the objective, and the gap to it.</summary>
internal static class Bounds
{
    // HiGHS's default absolute MIP gap: it also stops when objective − bound is below this.
    private const double HighsAbsoluteGap = 1e-6;

    /// <summary>
    /// SCIP reports a true bound; the LP relaxation's optimum is one too, whichever backend. HiGHS's wrapper reports the objective as its bound, so for HiGHS the bound is
    /// the better of the LP relaxation's optimum and, when HiGHS says optimal, what its stopping rule proves:
    /// it stops only once (objective − bound) ≤ max(gap·|objective|, absolute gap).
    /// </summary>
    /// <param name="milpObjective">The whole MILP's objective, null when it found no plan.</param>
    /// <param name="objective">The objective of the plan kept (the MILP's or the day-by-day first plan's).</param>
    public static double Best(string backend, Solver.ResultStatus status, double? milpObjective, double reportedBound,
        double? relaxationBound, double gapPercent, double objective, List<string> notes)
    {
        var candidates = new List<(double Bound, string Source)>();
        if (relaxationBound is { } relaxed)
        {
            candidates.Add((relaxed, "the LP relaxation"));
        }
        if (backend == SolverBackend.Scip && milpObjective.HasValue && double.IsFinite(reportedBound))
        {
            candidates.Add((reportedBound, "SCIP's best bound"));
        }
        if (backend == SolverBackend.Highs && status == Solver.ResultStatus.OPTIMAL && milpObjective is { } stopped)
        {
            var gap = Math.Max(gapPercent, 0) / 100.0;
            candidates.Add((stopped - Math.Max(gap * Math.Abs(stopped), HighsAbsoluteGap), $"HiGHS's stopping rule at a {gapPercent:0.###} % gap"));
        }
        if (candidates.Count == 0)
        {
            notes.Add("no proven bound is known for this plan");
            return double.NaN;
        }
        var best = candidates.MaxBy(c => c.Bound);
        notes.Add($"best bound from {best.Source}");
        return Math.Min(objective, best.Bound);
    }

    /// <summary>(objective − bound) / |objective| in percent; 0 when both are 0, NaN without a bound.</summary>
    public static double GapPercent(double objective, double bound) => SolveInfo.GapPercentBetween(objective, bound);
}
