using System.Diagnostics;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Explaining;
using PlanDesk.Planning.Extraction;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// One solve, in stages: build the MILP; solve its LP relaxation (HiGHS's bound) and round it into a first plan;
/// solve the whole MILP in the time left (SCIP starts from the first plan); over several days, when HiGHS's first
/// try finds nothing, improve the first plan by fix-and-optimise over days; keep the best plan; explain it with a
/// fixed-decision LP.
/// </summary>
internal sealed class SolveRun(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress, CancellationToken cancellation)
{
    // Shares of the time left that the LP relaxation and the first plan's LP may use at most: generous, because
    // without them there is no bound and no safety net, and they normally take a small part of it.
    private const double RelaxationTimeShare = 0.5;
    private const double FirstPlanTimeShare = 0.5;
    // HiGHS's first try at the asked gap, as a share of the time left; the second try's gap and least time.
    private const double HighsFirstTryShare = 0.65;
    private const double LooserGapPercent = 2.0;
    private const double MinimumSecondTrySeconds = 3.0;
    private static readonly TimeSpan ProgressInterval = TimeSpan.FromMilliseconds(500);

    private readonly Stopwatch clock = Stopwatch.StartNew();
    private readonly List<string> notes = [];
    private double? incumbent;
    private double? relaxationBound;

    public Plan Execute()
    {
        var backend = SolverBackend.Normalise(options.Solver);
        if (backend is null)
        {
            return EmptyPlans.NoPlan(planningCase, new SolveInfo { Status = SolveStatus.NoPlan, Solver = options.Solver },
                $"unknown solver '{options.Solver}': choose one of {string.Join(", ", SolverBackend.Supported)}");
        }

        Report(SolvePhases.Building);
        var solver = SolverBackend.CreateMip(backend)!;
        SolvedModel? firstPlan = null;
        SolvedModel? dayByDay = null;
        SolvedModel? whole = null;
        try
        {
            var model = PlanModel.Build(solver, planningCase, IntegerMode.Integer);
            notes.AddRange(model.Notes);
            Report(SolvePhases.FirstPlan);
            firstPlan = RelaxAndRound(backend);
            incumbent = firstPlan?.Objective;
            cancellation.ThrowIfCancellationRequested();

            if (backend == SolverBackend.Scip && firstPlan is not null)
            {
                Hint(solver, firstPlan.Solver);
            }
            Report(SolvePhases.Solving);
            var (status, gapPercent) = SolveWhole(solver, backend);
            if (status is Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE)
            {
                whole = new SolvedModel(solver, model, solver.Objective().Value(), status);
            }
            else if (UsesFixAndOptimise(backend) && firstPlan is not null && !ProvenWithinGap(incumbent))
            {
                // Over several days, the time the whole MILP leaves goes to improving the first plan day by day
                // (see docs/formulation.md, "Scaling").
                var dayByDayNotes = new List<string>();
                dayByDay = Await(StartFixAndOptimise(backend, firstPlan, dayByDayNotes));
                notes.AddRange(dayByDayNotes);
                cancellation.ThrowIfCancellationRequested();
            }
            return Finish(backend, solver, model, status, gapPercent, whole, dayByDay, firstPlan);
        }
        finally
        {
            firstPlan?.Dispose();
            dayByDay?.Dispose();
            solver.Dispose();
        }
    }

    // HiGHS returns nothing when it stops on its time limit, so over several days its second try is fix-and-optimise
    // rather than the whole MILP at a looser gap. SCIP keeps its incumbent at the limit and runs once.
    private bool UsesFixAndOptimise(string backend) => backend == SolverBackend.Highs && planningCase.Horizon.DayCount > 1;

    private Task<SolvedModel?> StartFixAndOptimise(string backend, SolvedModel firstPlan, List<string> dayByDayNotes)
    {
        var values = firstPlan.Model.IntegerValues();
        var objective = firstPlan.Objective;
        return Task.Run(() => new FixAndOptimise(planningCase, backend, options, dayByDayNotes).Improve(objective, values, Remaining, cancellation),
            CancellationToken.None);
    }

    // Waits for fix-and-optimise while reporting progress; a cancelled or failed run gives no plan.
    private SolvedModel? Await(Task<SolvedModel?>? task)
    {
        if (task is null)
        {
            return null;
        }
        while (!((IAsyncResult)task).AsyncWaitHandle.WaitOne(ProgressInterval))
        {
            Report(SolvePhases.DayByDay);
        }
        if (task.IsFaulted)
        {
            notes.Add($"fix-and-optimise stopped: {task.Exception!.GetBaseException().Message}");
        }
        return task.IsCompletedSuccessfully ? task.Result : null;
    }

    // The relaxation bound alone already proves the first plan within the asked gap: fix-and-optimise can add nothing.
    private bool ProvenWithinGap(double? objective) =>
        objective is { } value && relaxationBound is { } bound && Bounds.GapPercent(value, Math.Min(bound, value)) <= options.GapPercent;

    /// <summary>
    /// HiGHS through OR-Tools 9.15 returns no solution at all when it stops on the time limit (status 99), even
    /// with an incumbent: only reaching the gap gives a plan. So HiGHS first gets most of the time at the asked
    /// gap and, failing that, the rest at a looser gap. SCIP returns its incumbent at the limit, so it runs once.
    /// </summary>
    private (Solver.ResultStatus Status, double GapPercent) SolveWhole(Solver solver, string backend)
    {
        if (backend != SolverBackend.Highs)
        {
            var status = RunSolve(solver, SolverBackend.ConfigureMip(solver, backend, options, Remaining(), notes));
            cancellation.ThrowIfCancellationRequested();
            return (status, options.GapPercent);
        }
        var firstTry = Remaining() * HighsFirstTryShare;
        var first = RunSolve(solver, SolverBackend.ConfigureMip(solver, backend, options, firstTry, notes));
        cancellation.ThrowIfCancellationRequested();
        if (first is Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE || Remaining() < MinimumSecondTrySeconds || UsesFixAndOptimise(backend))
        {
            return (first, options.GapPercent);
        }
        var looser = Math.Max(options.GapPercent * 4, LooserGapPercent);
        notes.Add($"HiGHS did not reach a {options.GapPercent:0.###} % gap in {firstTry:0} s; it was run again to a {looser:0.###} % gap");
        var second = RunSolve(solver, SolverBackend.ConfigureMip(solver, backend, options with { GapPercent = looser }, Remaining(), notes));
        cancellation.ThrowIfCancellationRequested();
        return (second, looser);
    }

    private Plan Finish(string backend, Solver solver, PlanModel model, Solver.ResultStatus status, double gapPercent, SolvedModel? whole,
        SolvedModel? dayByDay, SolvedModel? firstPlan)
    {
        var info = new SolveInfo
        {
            Status = SolveStatus.NoPlan,
            Solver = $"{backend} via OR-Tools ({SolverBackend.Describe(status)})",
            Variables = solver.NumVariables(),
            IntegerVariables = model.IntegerDecisions.Count,
            Constraints = solver.NumConstraints(),
            Notes = notes,
        };
        // Prefer the whole MILP's plan, then fix-and-optimise's, unless a later one is strictly better.
        var chosen = new[] { whole, dayByDay, firstPlan }.Where(p => p is not null)
            .Aggregate((SolvedModel?)null, (best, p) => best is null || p!.Objective < best.Objective - 1e-9 * Math.Max(1, Math.Abs(best.Objective)) ? p : best);
        if (chosen is null)
        {
            return EmptyPlans.NoPlan(planningCase, info with { SolveSeconds = clock.Elapsed.TotalSeconds },
                $"the {backend} solver found no plan within {options.TimeLimitSeconds:0.#} s ({SolverBackend.Describe(status)}); " +
                "allow a longer time limit, a larger gap or a shorter horizon", model.DataProblems);
        }
        if (chosen == dayByDay)
        {
            notes.Add(whole is null
                ? "the whole MILP found no plan in time: this is the first plan improved by fix-and-optimise over days"
                : "fix-and-optimise over days found a better plan than the whole MILP in time");
        }
        else if (chosen == firstPlan)
        {
            notes.Add(whole is null
                ? $"the whole MILP found no plan in time ({SolverBackend.Describe(status)}): this is the first plan rounded from the LP relaxation"
                : "the whole MILP found no better plan in time than the first plan rounded from the LP relaxation");
        }

        var bound = Bounds.Best(backend, status, whole?.Objective, solver.Objective().BestBound(), relaxationBound, gapPercent, chosen.Objective, notes);
        var gap = Bounds.GapPercent(chosen.Objective, bound);
        // Optimal means proven within the asked gap, whichever plan is kept and whichever try found it.
        var planStatus = gap <= options.GapPercent + 1e-9 ? SolveStatus.Optimal : SolveStatus.Feasible;
        info = info with { Status = planStatus, Objective = chosen.Objective, BestBound = bound, GapPercent = gap };

        var plan = PlanExtractor.Extract(chosen.Model, info);
        plan = plan with { Problems = [.. chosen.Model.DataProblems, .. ProblemReport.Find(chosen.Model, plan)] };
        if (options.Explain)
        {
            Report(SolvePhases.Explaining);
            plan = Explanations.Add(planningCase, chosen.Model, plan, notes);
        }
        return plan with { Solve = plan.Solve with { SolveSeconds = clock.Elapsed.TotalSeconds, Notes = notes } };
    }

    // The relaxation's optimum is a true lower bound (kept for HiGHS, whose own bound is not); its rounding is the first plan.
    private SolvedModel? RelaxAndRound(string backend)
    {
        using var lp = SolverBackend.CreateRelaxation(options, Remaining() * RelaxationTimeShare, notes);
        var relaxed = PlanModel.Build(lp, planningCase, IntegerMode.Relaxed);
        var status = lp.Solve();
        if (status != Solver.ResultStatus.OPTIMAL)
        {
            notes.Add($"the LP relaxation was not solved ({SolverBackend.Describe(status)}): no bound from it and no first plan");
            return null;
        }
        relaxationBound = lp.Objective().Value();
        return FirstPlan.Build(planningCase, relaxed, options, Remaining() * FirstPlanTimeShare, notes);
    }

    // SCIP takes a starting solution; HiGHS must never get one (SetHint crashes it).
    private static void Hint(Solver scip, Solver solved)
    {
        var values = solved.variables().ToDictionary(v => v.Name(), v => v.SolutionValue());
        var variables = scip.variables().Where(v => values.ContainsKey(v.Name())).ToArray();
        scip.SetHint(variables, variables.Select(v => values[v.Name()]).ToArray());
    }

    // Solves on a worker thread so progress can be reported; the MPSolver API has no MIP callback in .NET.
    private Solver.ResultStatus RunSolve(Solver solver, MPSolverParameters parameters)
    {
        if (progress is null && !cancellation.CanBeCanceled)
        {
            return solver.Solve(parameters);
        }
        var solve = Task.Run(() => solver.Solve(parameters), CancellationToken.None);
        var interrupted = false;
        while (!solve.Wait(ProgressInterval, CancellationToken.None))
        {
            Report(SolvePhases.Solving);
            if (cancellation.IsCancellationRequested && !interrupted)
            {
                interrupted = solver.InterruptSolve();
            }
        }
        return solve.Result;
    }

    private void Report(string phase)
    {
        var gap = incumbent is { } best && relaxationBound is { } bound ? Bounds.GapPercent(best, Math.Min(bound, best)) : (double?)null;
        progress?.Report(new SolveProgress(phase, clock.Elapsed.TotalSeconds, options.TimeLimitSeconds, incumbent, relaxationBound, gap));
    }

    private double Remaining() => Math.Max(1, options.TimeLimitSeconds - clock.Elapsed.TotalSeconds);
}
