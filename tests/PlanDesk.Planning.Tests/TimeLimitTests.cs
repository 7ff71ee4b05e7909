using PlanDesk.Core.Checking;
using PlanDesk.Core.Generation;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Tests;

/// <summary>A solve with far too little time still returns a plan (at worst the baseline's), with an honest gap.</summary>
public class TimeLimitTests
{
    private sealed class Recorder : IProgress<SolveProgress>
    {
        public List<SolveProgress> Reports { get; } = [];

        public void Report(SolveProgress value)
        {
            lock (Reports)
            {
                Reports.Add(value);
            }
        }
    }

    // Generated M (5 plants, 168 h): its LP relaxation alone takes longer than the whole limit on 2 cores.
    [Fact]
    public void ATinyTimeLimitOnAWeekLongRegionStillReturnsACheckedPlanWithItsGapAgainstABoundOrNone()
    {
        var network = RegionGenerator.Generate(RegionSize.M, 1).Network;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;
        var recorder = new Recorder();

        var plan = Planner.Solve(planningCase, new SolveOptions { TimeLimitSeconds = 1 }, recorder);

        Assert.Equal(SolveStatus.Feasible, plan.Solve.Status);
        Assert.Equal(network.Plants.Count, plan.Plants.Count);
        Assert.Equal(planningCase.PeriodCount, plan.Plants[0].TreatedM3.Length);
        var notes = plan.Solve.Notes;
        Assert.Contains(notes, n => n.Contains("this is the", StringComparison.Ordinal));
        if (double.IsNaN(plan.Solve.GapPercent))
        {
            Assert.True(double.IsNaN(plan.Solve.BestBound));
            Assert.Contains(notes, n => n.Contains("no proven bound is known for this plan", StringComparison.Ordinal));
        }
        else
        {
            // Against a proven bound, never against the plan itself: the relaxation is well below any plan at M.
            Assert.True(plan.Solve.BestBound < plan.Solve.Objective, $"bound {plan.Solve.BestBound} against objective {plan.Solve.Objective}");
            Assert.Equal(100 * (plan.Solve.Objective - plan.Solve.BestBound) / plan.Solve.Objective, plan.Solve.GapPercent, 1e-9);
            Assert.Contains(notes, n => n.Contains("best bound from", StringComparison.Ordinal));
        }
        Assert.Empty(PlanChecker.Check(planningCase, plan).HardViolations.Select(v => v.Message));

        // The first plan is reported before the LP relaxation starts (the benchmark reads it as the time to a first plan).
        var reports = recorder.Reports;
        var firstWithPlan = reports.FindIndex(r => r.Incumbent is not null);
        var relaxation = reports.FindIndex(r => r.Phase.StartsWith("relaxation", StringComparison.Ordinal));
        Assert.InRange(firstWithPlan, 0, relaxation < 0 ? int.MaxValue : relaxation - 1);
        Assert.True(plan.Solve.Objective <= reports[firstWithPlan].Incumbent!.Value + 1e-6, "the plan returned is dearer than the first reported");
    }
}
