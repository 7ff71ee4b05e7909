using System.Diagnostics;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Generation;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning;

namespace PlanDesk.Cli.Bench;

/// <summary>Runs one benchmark case in this process: generate, baseline, solve, check, and time each.</summary>
internal static class BenchRunner
{
    public static BenchResult Run(BenchCase benchCase)
    {
        var network = RegionGenerator.Generate(benchCase.Size, benchCase.Seed).Network;
        var created = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays);
        var row = new BenchResult
        {
            Size = benchCase.Size.Name,
            Seed = benchCase.Seed,
            Solver = benchCase.Solver,
            Plants = network.Plants.Count,
            Customers = network.Customers.Count,
            Status = "failed",
        };
        if (created.Case is not { } planningCase)
        {
            return row with { Note = "the generated region does not resolve: " + string.Join("; ", created.Problems) };
        }
        row = row with { Periods = planningCase.PeriodCount };
        var notes = new List<string>();
        var baseline = RuleBasedBaseline.Build(planningCase);

        var options = new SolveOptions { Solver = benchCase.Solver, TimeLimitSeconds = benchCase.TimeLimitSeconds, GapPercent = benchCase.GapPercent };
        var recorder = new PhaseRecorder();
        var clock = Stopwatch.StartNew();
        var plan = Planner.Solve(planningCase, options, recorder);
        var solveSeconds = clock.Elapsed.TotalSeconds;
        var info = plan.Solve;
        var hasPlan = info.Status != SolveStatus.NoPlan;
        // Both plans costed by the checker's own accounting, as every solve summary shows them.
        var comparison = BaselineComparison.Of(planningCase, plan, baseline);
        var report = PlanChecker.Check(planningCase, plan);
        row = row with
        {
            Status = info.Status,
            Variables = info.Variables,
            Integers = info.IntegerVariables,
            Constraints = info.Constraints,
            BuildSeconds = recorder.BuildSeconds,
            SolveSeconds = solveSeconds,
            Objective = hasPlan ? info.Objective : null,
            BestBound = Finite(info.BestBound),
            GapPercent = hasPlan ? Finite(info.GapPercent) : null,
            LpRelaxationBound = recorder.RelaxationBound,
            BaselineCost = comparison.BaselineCost,
            SavingPercent = comparison.SavingPercent,
            OperatingSavingPercent = comparison.OperatingSavingPercent,
            Violations = hasPlan ? report.Violations.Count : null,
            HardViolations = hasPlan ? report.HardViolations.Count() : null,
            BaselineViolations = comparison.BaselineCheckViolations,
        };
        if (!hasPlan)
        {
            notes.AddRange(plan.Problems.Take(1).Select(p => p.Message));
        }

        row = row with { FirstPlanSeconds = recorder.FirstIncumbentSeconds, FirstPlanObjective = recorder.FirstIncumbent };
        if (row.FirstPlanSeconds is null && benchCase.MeasureFirstPlan)
        {
            row = row with { FirstPlanSeconds = FirstPlanSeconds(planningCase, options) };
        }
        return Finish(row, notes);
    }

    // When the planner reports no plan before the end of its search (OR-Tools' MPSolver has no MIP callback
    // in .NET), the time to a first plan is measured by a second solve that stops at any plan (a 100 % gap).
    private static double? FirstPlanSeconds(PlanningCase planningCase, SolveOptions options)
    {
        var recorder = new PhaseRecorder();
        var clock = Stopwatch.StartNew();
        var plan = Planner.Solve(planningCase, options with { GapPercent = 100, Explain = false }, recorder);
        var seconds = clock.Elapsed.TotalSeconds - recorder.BoundingSeconds;
        return plan.Solve.Status == SolveStatus.NoPlan ? null : seconds;
    }

    private static BenchResult Finish(BenchResult row, List<string> notes)
    {
        using var process = Process.GetCurrentProcess();
        process.Refresh();
        return row with { PeakMemoryMB = process.PeakWorkingSet64 / 1024.0 / 1024.0, Note = string.Join("; ", notes) };
    }

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
