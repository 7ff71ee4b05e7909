using PlanDesk.Core.Model;
using PlanDesk.Planning.Solving;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>Fix-and-optimise over days: each day's decisions re-solved with the other days fixed, on the whole model.</summary>
public class FixAndOptimiseTests
{
    // The two-day storage-shift case of SolverSettingsTests (optimum 305 EUR by hand working there).
    private static PlanningCase TwoDayCase() => Build.Case(Build.Network(
            Build.HourlyTariff(Build.Weekday, Build.Prices(200, 50, 0, 1, 2, 3, 4, 5), days: 2),
            [Build.Plant(influentM3PerHour: 500, stages: [Build.Stage("filter", "store", energyKWhPerM3: 1) with { StartupCost = 5, MinRunHours = 2 }])],
            tanks: [Build.Tank("store")],
            pipelines: [Build.ToCustomer("main", "store", "farm")],
            customers: [Build.HourlyCustomer("farm", 50)]),
        days: 2);

    // Every unit off; the one treatment level on both days (a level must be chosen each day).
    private static Dictionary<string, double> AllOff() => new()
    {
        ["level[mill,2027-03-24,standard]"] = 1,
        ["level[mill,2027-03-25,standard]"] = 1,
    };

    // Starting from every unit off (the farm short 2,400 m3 at 10 EUR/m3: 24,000 EUR), the days re-solved in turn
    // must find a cheaper plan, and no plan can be cheaper than the 305 EUR optimum.
    [Fact]
    public void ImprovesAnAllOffPlanButNeverBeatsTheOptimum()
    {
        var planningCase = TwoDayCase();
        using var allOff = FirstPlan.SolveFixed(planningCase, AllOff(), 30);
        Assert.NotNull(allOff);
        Assert.Equal(24_000.0, allOff.Objective, 1e-3);

        using var improved = new FixAndOptimise(planningCase, new SolveOptions(), [])
            .Improve(allOff.Objective, allOff.Model.IntegerValues(), () => 30, CancellationToken.None);

        Assert.NotNull(improved);
        Assert.True(improved.Objective < allOff.Objective - 1, $"no improvement: {improved.Objective}");
        Assert.True(improved.Objective >= 305.0 - 1e-6, $"cheaper than the optimum: {improved.Objective}");
    }

    // Its plan is a plan of the whole model: the whole model with every decision fixed to it costs the same.
    [Fact]
    public void ItsPlanIsAPlanOfTheWholeModel()
    {
        var planningCase = TwoDayCase();
        using var allOff = FirstPlan.SolveFixed(planningCase, AllOff(), 30);
        using var improved = new FixAndOptimise(planningCase, new SolveOptions(), [])
            .Improve(allOff!.Objective, allOff.Model.IntegerValues(), () => 30, CancellationToken.None);
        Assert.NotNull(improved);

        using var whole = FirstPlan.SolveFixed(planningCase, improved.Model.IntegerValues(), 30);

        Assert.NotNull(whole);
        Assert.Equal(improved.Objective, whole.Objective, 1e-6 * Math.Max(1, improved.Objective));
    }

    // A plan that is already optimal cannot be improved: no window is accepted and the caller keeps its plan.
    [Fact]
    public void AnOptimalPlanIsLeftAsItIs()
    {
        var planningCase = TwoDayCase();
        var optimal = Build.Solve(planningCase);
        var values = AllOff();
        foreach (var (units, t) in optimal.Stages.Single().UnitsRunning.Select((n, t) => (n, t)))
        {
            values[$"units[filter,t{t}]"] = units;
        }

        using var improved = new FixAndOptimise(planningCase, new SolveOptions(), [])
            .Improve(optimal.Solve.Objective, values, () => 30, CancellationToken.None);

        Assert.Null(improved);
    }
}
