using PlanDesk.Core.Plans;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>Backends, bounds, gaps and the no-plan outcome.</summary>
public class SolverSettingsTests
{
    // The storage-shift case of StorageShiftTests: optimum 150 EUR (600 m3 at 0.05 + 600 m3 at 0.20).
    private static PlanDesk.Core.Model.PlanningCase ShiftCase() => Build.Case(Build.Network(
        Build.HourlyTariff(Build.Weekday, Build.Prices(200, 50, 0, 1, 2, 3, 4, 5)),
        [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 1) with { StartupCost = 5, MinRunHours = 2 }])],
        tanks: [Build.Tank("store")],
        pipelines: [Build.ToCustomer("main", "store", "farm")],
        customers: [Build.HourlyCustomer("farm", 50)]));

    // Hand working: as in StorageShiftTests plus one start at 5 EUR (one run can cover the cheap hours and continue):
    // 155 EUR whichever backend solves it.
    [Theory]
    [InlineData("HIGHS")]
    [InlineData("SCIP")]
    [InlineData("scip")]
    public void EveryBackendFindsTheSameOptimum(string solver)
    {
        var plan = Build.Solve(ShiftCase(), solver);

        Assert.Equal(SolveStatus.Optimal, plan.Solve.Status);
        Assert.Equal(155.0, plan.Solve.Objective, 155.0 * 0.001);
        Assert.StartsWith(solver.ToUpperInvariant(), plan.Solve.Solver);
    }

    // A true bound is never above the objective and is never the objective reported as a bound by HiGHS:
    // the gap is consistent with it, and the model size is filled in.
    [Theory]
    [InlineData("HIGHS")]
    [InlineData("SCIP")]
    public void BestBoundIsAProvenLowerBoundWithItsGap(string solver)
    {
        var plan = Build.Solve(ShiftCase(), solver);

        Assert.True(double.IsFinite(plan.Solve.BestBound));
        Assert.True(plan.Solve.BestBound <= plan.Solve.Objective + 1e-9);
        Assert.Equal(100 * (plan.Solve.Objective - plan.Solve.BestBound) / plan.Solve.Objective, plan.Solve.GapPercent, 1e-9);
        Assert.True(plan.Solve.GapPercent <= 0.01 + 1e-9);
        Assert.True(plan.Solve.Variables > 0 && plan.Solve.IntegerVariables == 25 && plan.Solve.Constraints > 0);
    }

    // With HiGHS the wrapper's BestBound is the objective itself, so the bound comes from the LP relaxation or from
    // HiGHS's stopping rule (objective − gap × |objective|), and the plan says which.
    // Hand working for the 0.01 % gap used here: the stopping rule proves at least 155 − 0.0155 = 154.9845 EUR.
    [Fact]
    public void HighsBoundNamesItsSource()
    {
        var plan = Build.Solve(ShiftCase(), "HIGHS");

        var source = Assert.Single(plan.Solve.Notes, n => n.StartsWith("best bound from", StringComparison.Ordinal));
        Assert.True(source is "best bound from the LP relaxation" or "best bound from HiGHS's stopping rule at a 0.01 % gap", source);
        Assert.True(plan.Solve.BestBound >= 154.9845 - 1e-6);
    }

    // HiGHS sizes one thread pool per process at its first solve; a solve's notes and plan must not depend on what the
    // process solved before (a grouped solve runs each group with one thread, a single group asks for two).
    [Theory]
    [InlineData("HIGHS")]
    [InlineData("SCIP")]
    public void ThreadCountsOfEarlierSolvesLeaveNoTrace(string solver)
    {
        var plans = new[] { 1, 2, 1 }.Select(threads => Planner.Solve(ShiftCase(), new SolveOptions { Solver = solver, Threads = threads })).ToList();

        Assert.All(plans, plan => Assert.Equal(SolveStatus.Optimal, plan.Solve.Status));
        Assert.All(plans, plan => Assert.Equal(155.0, plan.Solve.Objective, 155.0 * 0.001));
        Assert.All(plans, plan => Assert.DoesNotContain(plan.Solve.Notes, n => n.Contains("thread", StringComparison.OrdinalIgnoreCase)));
        Assert.All(plans, plan => Assert.Equal(plans[0].Solve.Notes, plan.Solve.Notes));
    }

    [Fact]
    public void UnknownSolverGivesNoPlanSaidPlainly()
    {
        var plan = Planner.Solve(ShiftCase(), new SolveOptions { Solver = "SIMPLEXOR" });

        Assert.Equal(SolveStatus.NoPlan, plan.Solve.Status);
        Assert.Empty(plan.Plants);
        var problem = Assert.Single(plan.Problems);
        Assert.Equal("no plan: unknown solver 'SIMPLEXOR': choose one of HIGHS, SCIP", problem.Message);
    }

    [Fact]
    public void ProgressReportsEveryPhaseAgainstTheLimit()
    {
        var phases = new List<SolveProgress>();
        var progress = new SynchronousProgress(phases.Add);

        var plan = Planner.Solve(ShiftCase(), new SolveOptions { TimeLimitSeconds = 20 }, progress);

        // The whole MILP (building, solving) runs only when the relaxation does not already prove the start plan.
        string[] order = ["rule-based baseline", "first plan from the baseline's decisions", "relaxation and first plan", "first plan from the relaxation",
            "building the model", "solving", "explaining (marginal water costs)"];
        var seen = phases.Select(p => p.Phase).Distinct().ToList();
        Assert.Equal(order.Where(seen.Contains), seen);
        Assert.Equal(order[..4], seen.Take(4));
        Assert.Equal(order[^1], seen[^1]);
        Assert.Equal(plan.Solve.Notes.Any(n => n.StartsWith("the whole MILP was not run", StringComparison.Ordinal)), !seen.Contains("solving"));
        Assert.All(phases, p => Assert.Equal(20, p.TimeLimitSeconds));
    }

    private sealed class SynchronousProgress(Action<SolveProgress> report) : IProgress<SolveProgress>
    {
        public void Report(SolveProgress value) => report(value);
    }

    // Two days of the storage-shift case (each day as in StorageShiftTests, plus one 5 EUR start that can run on
    // through the night). Hand working: each day makes 600 m3 in its cheap hours and 600 m3 in dear ones
    // (2 × 150 EUR); a unit started in hour 0 of day 1 can run all horizon, so one start: 305 EUR. SCIP starts from the
    // first plan (a hint); both backends must agree.
    [Theory]
    [InlineData("HIGHS")]
    [InlineData("SCIP")]
    public void TwoDayPlanAgreesAcrossBackends(string solver)
    {
        var network = Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(200, 50, 0, 1, 2, 3, 4, 5), days: 2),
            [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 1) with { StartupCost = 5, MinRunHours = 2 }])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.HourlyCustomer("farm", 50)]);

        var plan = Build.Solve(Build.Case(network, days: 2), solver);

        Assert.Equal(SolveStatus.Optimal, plan.Solve.Status);
        Assert.Equal(305.0, plan.Solve.Objective, 305.0 * 0.001);
    }
}
