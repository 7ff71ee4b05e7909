using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Loading;
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

/// <summary>The network loader behind <see cref="INetworkReader"/>. Uploaded networks come without their CSV files,
/// so CSV references are refused and series must be inline.</summary>
internal sealed class LoaderNetworkReader : INetworkReader
{
    public NetworkReading Read(string json, string sourceName)
    {
        var result = NetworkLoader.LoadText(json, sourceName, baseDirectory: null);
        return new NetworkReading(result.Network, result.Problems.Select(p => p.ToString()).ToList());
    }
}

/// <summary>The Core target-sheet builder behind <see cref="ITargetSheetBuilder"/>.</summary>
internal sealed class CoreSheetBuilder : ITargetSheetBuilder
{
    public IReadOnlyList<PlantDayTargets> Build(PlanningCase planningCase, Plan plan) => PlantDayTargetsBuilder.Build(planningCase, plan);
}

/// <summary>The independent checker and the rule-based baseline behind <see cref="IPlanReviewer"/>.</summary>
internal sealed class CoreReviewer : IPlanReviewer
{
    public PlanCheckReport Check(PlanningCase planningCase, Plan plan)
    {
        var report = PlanChecker.Check(planningCase, plan);
        return new PlanCheckReport(report.Passed, report.Violations, report.RecomputedCosts);
    }

    public BaselineComparison CompareWithBaseline(PlanningCase planningCase, Plan plan) => BaselineComparison.Of(planningCase, plan);
}
