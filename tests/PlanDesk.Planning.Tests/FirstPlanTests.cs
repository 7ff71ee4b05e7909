using PlanDesk.Planning.Solving;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>The first plan rounded from the LP relaxation: the safety net when the whole MILP finds no plan in time.</summary>
public class FirstPlanTests
{
    // Hand working, 3-period minimum run, one unit, none running before: 0 1 0 0 1 1 has a unit started in
    // period 1 and stopped in period 2, so it is stretched to 0 1 1 1 1 1 (the start in 4 is no start any more).
    [Fact]
    public void ShortRunsAreStretchedToTheMinimumRun()
    {
        int[] units = [0, 1, 0, 0, 1, 1];

        FirstPlan.KeepMinimumRun(units, initialUnits: 0, minRunPeriods: 3, available: [1, 1, 1, 1, 1, 1]);

        Assert.Equal([0, 1, 1, 1, 1, 1], units);
    }

    // Hand working: the same schedule with the unit out of service in period 2: the start in period 1 could not run
    // its 3 periods, so it is cancelled; the start in period 4 stays: 0 0 0 0 1 1.
    [Fact]
    public void StartsThatWouldRunIntoAnOutageAreCancelled()
    {
        int[] units = [0, 1, 0, 0, 1, 1];

        FirstPlan.KeepMinimumRun(units, initialUnits: 0, minRunPeriods: 3, available: [1, 1, 0, 1, 1, 1]);

        Assert.Equal([0, 0, 0, 0, 1, 1], units);
    }

    // Units of 40-120 m3 each. Hand working: 200 m3 needs ceil(200 / 120) = 2 units, whose minimum 80 ≤ 200: 2.
    // 30 m3: 1 unit would have to take 40 (10 more), 0 units carry nothing (30 less): 1. 10 m3: 30 more against
    // 10 less: 0. Limited to 1 available unit, 200 m3 gets 1.
    [Theory]
    [InlineData(200.0, 3, 2)]
    [InlineData(30.0, 3, 1)]
    [InlineData(10.0, 3, 0)]
    [InlineData(200.0, 1, 1)]
    [InlineData(0.0, 3, 0)]
    public void UnitsCarryTheRelaxedFlowWithTheLeastChange(double flowM3, int available, int expected)
    {
        Assert.Equal(expected, FirstPlan.UnitsFor(flowM3, 40, 120, available));
    }

    // The unit-commitment case of UnitCommitmentTests with a 4-hour minimum run (optimum 50 EUR): the first plan
    // built from the relaxation alone is a whole, valid plan — its cost can only be at least the optimum.
    [Fact]
    public void FirstPlanIsACompletePlanNoCheaperThanTheOptimum()
    {
        var stage = Build.Stage("filter", "store", maxFlowM3PerHour: 100, minFlowM3PerHour: 100, energyKWhPerM3: 1) with { MinRunHours = 4 };
        var planningCase = Build.Case(Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(200, 50, 2, 3, 20, 21)),
            [Build.Plant(influentM3PerHour: 500, stages: [stage])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.DailyCustomer("farm", 400)]));
        using var lp = Google.OrTools.LinearSolver.Solver.CreateSolver("GLOP");
        var relaxed = Model.PlanModel.Build(lp, planningCase, Model.IntegerMode.Relaxed);
        Assert.Equal(Google.OrTools.LinearSolver.Solver.ResultStatus.OPTIMAL, lp.Solve());

        var first = FirstPlan.Build(planningCase, relaxed, 10, []);

        Assert.NotNull(first);
        Assert.True(first.Objective >= 50.0 - 1e-6);
        var units = first.IntegerValues;
        var running = Enumerable.Range(0, 24).Select(t => (int)units[$"units[filter,t{t}]"]).ToArray();
        // Every run lasts 4 hours or until the horizon ends (the model asks no more of a run cut by the horizon's end).
        Assert.All(Enumerable.Range(0, 24).Where(t => running[t] == 1 && (t == 0 || running[t - 1] == 0)),
            start => Assert.True(running.Skip(start).Take(4).All(n => n == 1), $"run from {start} shorter than 4 h"));
    }

    // Dips of at most 2 periods between periods with at least k units are filled to k; a longer dip, a dip at the
    // horizon's edge and a dip through an outage are left alone.
    [Theory]
    [InlineData("2202", "2222", "2222", 2, true)]
    [InlineData("21012", "22222", "22222", 3, true)]
    [InlineData("21012", "21112", "22222", 2, true)]
    [InlineData("20002", "20002", "22222", 2, false)]
    [InlineData("0022", "0022", "2222", 2, false)]
    [InlineData("2002", "2002", "2002", 2, false)]
    [InlineData("2002", "2112", "2212", 2, true)]
    public void ShortDipsAreHeldWhereUnitsAreAvailable(string before, string after, string available, int maxGapPeriods, bool changed)
    {
        var units = before.Select(c => c - '0').ToArray();

        var result = FirstPlan.FillShortDips(units, maxGapPeriods, available.Select(c => c - '0').ToArray());

        Assert.Equal(after, string.Concat(units));
        Assert.Equal(changed, result);
    }
}
