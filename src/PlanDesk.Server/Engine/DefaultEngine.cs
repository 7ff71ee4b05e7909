using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Planning;

namespace PlanDesk.Server.Engine;

/// <summary>The planner behind <see cref="IPlanSolver"/>.</summary>
internal sealed class PlannerSolver : IPlanSolver
{
    public Plan Solve(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress, CancellationToken cancellation) =>
        Planner.Solve(planningCase, options, progress, cancellation);
}

// Placeholders until the loader, checker, baseline and sheet builder land on main.
internal sealed class PendingNetworkReader : INetworkReader
{
    public NetworkReading Read(string json, string sourceName) =>
        new(null, [$"{sourceName}: this build has no network loader yet"]);
}

internal sealed class PendingReviewer : IPlanReviewer
{
    public PlanCheckReport Check(PlanningCase planningCase, Plan plan) =>
        new(false, [new CheckFinding("notChecked", "", "this build has no plan checker yet", null, null)]);

    public double? BaselineCost(PlanningCase planningCase) => null;
}

internal sealed class PendingSheetBuilder : ITargetSheetBuilder
{
    public IReadOnlyList<PlantDayTargets> Build(PlanningCase planningCase, Plan plan) => [];
}
