using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Solving;

namespace PlanDesk.Planning;

/// <summary>Settings of one solve.</summary>
public sealed record SolveOptions
{
    /// <summary>MIP backend: "HIGHS" or "SCIP" (see docs/formulation.md for the measured choice).</summary>
    public string Solver { get; init; } = "SCIP";
    public double TimeLimitSeconds { get; init; } = 60;
    /// <summary>Relative gap at which the search stops, percent.</summary>
    public double GapPercent { get; init; } = 0.5;
    /// <summary>Cores to use: independent groups of plants are solved this many side by side (every solver runs on one thread).</summary>
    public int Threads { get; init; } = 2;
    /// <summary>Compute marginal water costs and binding limits after the MILP (a fixed-integer LP re-solve).</summary>
    public bool Explain { get; init; } = true;
    /// <summary>Solve each independent group of plants as its own model (exact; see <see cref="IndependentGroups"/>).
    /// Off only to compare against the whole-region model.</summary>
    internal bool SplitIntoGroups { get; init; } = true;
}

/// <summary>What a long solve reports while it runs; fields the backend does not expose are null.</summary>
public sealed record SolveProgress(string Phase, double ElapsedSeconds, double TimeLimitSeconds, double? Incumbent, double? BestBound, double? GapPercent);

/// <summary>Builds the MILP for a planning case, solves it and extracts the plan.</summary>
public static class Planner
{
    /// <summary>Always returns a plan record; when the solver found none, <c>Solve.Status</c> is noPlan and its arrays are empty.
    /// A region that falls apart into independent groups of plants is solved group by group, <see cref="SolveOptions.Threads"/>
    /// groups at once, and the group plans joined; that is exact, and the whole call keeps to the time limit.
    /// Cancelling stops SCIP at once and HiGHS after its current solve; it then throws <see cref="OperationCanceledException"/>.</summary>
    public static Plan Solve(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress = null, CancellationToken cancellation = default)
    {
        // An unknown solver name is reported once, for the region, by the single-model path.
        var groups = options.SplitIntoGroups && SolverBackend.Normalise(options.Solver) is not null
            ? IndependentGroups.Of(planningCase.Network)
            : [];
        return groups.Count > 1
            ? new GroupedSolve(planningCase, groups, options, progress, cancellation).Execute()
            : new SolveRun(planningCase, options, progress, cancellation).Execute();
    }
}
