using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Planning;

namespace PlanDesk.Server.Engine;

// The service reaches the loader, planner, checker, baseline and target-sheet builder only through these
// small interfaces, so tests of the store, roles and idempotency can run without a real solve.

/// <summary>Reads a network file's text into a validated network, or the problems found.</summary>
public interface INetworkReader
{
    NetworkReading Read(string json, string sourceName);
}

/// <param name="Problems">Each problem names the JSON path and the fix; empty when <paramref name="Network"/> is set.</param>
public sealed record NetworkReading(Network? Network, IReadOnlyList<string> Problems);

/// <summary>Solves a planning case into a plan; honours the cancellation token.</summary>
public interface IPlanSolver
{
    Plan Solve(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress, CancellationToken cancellation);
}

/// <summary>The independent second opinion on a plan, and the rule-based baseline it is compared with.</summary>
public interface IPlanReviewer
{
    PlanCheckReport Check(PlanningCase planningCase, Plan plan);

    /// <summary>The rule-based baseline on the same case, costed and compared with the plan.</summary>
    BaselineComparison CompareWithBaseline(PlanningCase planningCase, Plan plan);
}

/// <summary>What the checker found. <see cref="Passed"/> is true when there are no violations.</summary>
/// <param name="RecomputedCosts">The plan's cost as the checker works it out; null when the plan is too malformed to cost.</param>
public sealed record PlanCheckReport(bool Passed, IReadOnlyList<Violation> Violations, CostBreakdown? RecomputedCosts);

/// <summary>Cuts a plan into per-plant, per-local-day target sheets.</summary>
public interface ITargetSheetBuilder
{
    IReadOnlyList<PlantDayTargets> Build(PlanningCase planningCase, Plan plan);
}
