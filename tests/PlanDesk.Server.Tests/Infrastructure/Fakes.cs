using System.Collections.Concurrent;
using NodaTime;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning;
using PlanDesk.Server.Engine;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>
/// Stands in for the planner: returns <see cref="TestPlans.Simple"/> at once, marked with the plan's start day
/// (treated m3 = day of month), and remembers every case it was given. A solve starting on
/// <see cref="BlockingDate"/> waits until it is cancelled, for tests of running jobs.
/// </summary>
public sealed class FakeSolver : IPlanSolver
{
    public static readonly LocalDate BlockingDate = new(2027, 5, 1);

    public ConcurrentQueue<PlanningCase> Cases { get; } = new();

    /// <summary>Waits until a solve starting on <see cref="BlockingDate"/> is inside the solver; fails after 30 s.</summary>
    public async Task WaitUntilBlockedAsync()
    {
        for (var waited = 0; !Cases.Any(c => c.Horizon.StartDate == BlockingDate); waited += 10)
        {
            Assert.True(waited < 30_000, "the blocking solve did not reach the solver in 30 s");
            await Task.Delay(10);
        }
    }
    public ConcurrentQueue<CancellationToken> CancelledTokens { get; } = new();

    public Plan Solve(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress, CancellationToken cancellation)
    {
        Cases.Enqueue(planningCase);
        progress?.Report(new SolveProgress("search", 0.5, options.TimeLimitSeconds, 1200, 1100, 8.3));
        if (planningCase.Horizon.StartDate == BlockingDate)
        {
            cancellation.WaitHandle.WaitOne(TimeSpan.FromSeconds(60));
            if (cancellation.IsCancellationRequested)
            {
                CancelledTokens.Enqueue(cancellation);
            }
            cancellation.ThrowIfCancellationRequested();
        }
        return TestPlans.Simple(planningCase, planningCase.Horizon.StartDate.Day);
    }
}

/// <summary>Stands in for the checker and baseline: every plan passes; the baseline costs 2000, 48.7 % more than a plan.</summary>
public sealed class FakeReviewer : IPlanReviewer
{
    public PlanCheckReport Check(PlanningCase planningCase, Plan plan) => new(true, [], plan.Costs);

    public BaselineComparison CompareWithBaseline(PlanningCase planningCase, Plan plan) => new(2000, 48.7, 1900, 46.0, 0, 2);
}
