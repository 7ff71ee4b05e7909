using System.Diagnostics;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Explaining;
using PlanDesk.Planning.Extraction;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// One solve, in stages, each model disposed before the next is built: the rule-based baseline (a plan within
/// seconds) and its on/off decisions with re-optimised flows; the LP relaxation (a true bound) and a plan rounded
/// from it; over several days, fix-and-optimise from the cheapest of these (SCIP windows); the whole MILP in the
/// time left, unless the relaxation already proves the plan; keep the cheapest plan; explain it with a
/// fixed-decision LP. A step that has no time limit of its own is not started when it could not end in time.
/// </summary>
/// <param name="knownBaseline">The case's rule-based plan when the caller has already built it (a group of a split region).</param>
internal sealed partial class SolveRun(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress, CancellationToken cancellation,
    Plan? knownBaseline = null)
{
    // HiGHS's first try at the asked gap, as a share of the time left; the second try's gap and least time.
    private const double HighsFirstTryShare = 0.65;
    private const double LooserGapPercent = 2.0;
    private const double MinimumSecondTrySeconds = 3.0;
    // Share of the search time fix-and-optimise may use before the whole MILP gets the rest. Half was measured and not
    // kept: better at M seed 2 in 60 s (7.8 % against 10.2 %), worse at 120 s (M 0.50 % against 0.18 %, L 3.8 % against 2.6 %).
    private const double FixAndOptimiseShare = 0.75;
    // The whole MILP starts only when its first try has this many times what the relaxation took: its root LP is that
    // LP again (with presolve and cuts), and HiGHS does not stop inside it on its time limit (overruns of 14-54 s measured).
    private const double RootLpFactor = 2.0;
    // Time kept back for the explanation LP (GLOP, fixed decisions), as a multiple of what the baseline's LP (HiGHS) took, and at
    // least (measured: at XL explanation 9 s, the baseline's LP 19-54 s under load; at M 0.5 s against 1.05 s).
    private const double ExplainLpFactor = 1.0;
    private const double MinimumExplainSeconds = 1.0;
    // At size M the explanation took 0.3-0.5 s; 3 s kept back left the search of a 10 s solve a third less time.
    private const double LeastExplainReserveSeconds = 1.5;
    private static readonly TimeSpan ProgressInterval = TimeSpan.FromMilliseconds(500);

    private readonly Stopwatch clock = Stopwatch.StartNew();
    private readonly List<string> notes = [];
    private double? incumbent;
    private double? relaxationBound;
    private double? relaxationSeconds;
    private (int Variables, int Integers, int Constraints)? modelSize;

    public Plan Execute()
    {
        var backend = SolverBackend.Normalise(options.Solver);
        if (backend is null)
        {
            return EmptyPlans.NoPlan(planningCase, new SolveInfo { Status = SolveStatus.NoPlan, Solver = options.Solver },
                $"unknown solver '{options.Solver}': choose one of {string.Join(", ", SolverBackend.Supported)}");
        }

        var start = StartPlan();
        cancellation.ThrowIfCancellationRequested();
        KeptPlan? dayByDay = null;
        if (UsesFixAndOptimise() && !ProvenWithinGap(start.Objective) && FixAndOptimiseFits())
        {
            // Over several days, fix-and-optimise improves the start plan first, then the whole MILP gets the time
            // left from the best plan (see docs/formulation.md, "Scaling").
            dayByDay = ImproveDayByDay(start);
            MemoryRelease.AfterModel();
        }
        var best = KeptPlan.Cheaper(start, dayByDay)!;
        incumbent = best.Objective;
        var whole = new WholeMilp(null, null, double.NaN, options.GapPercent);
        // Over one day the whole MILP is quick and runs even when the relaxation already proves the start plan: its
        // plan is kept on a tie, and its on/off decisions are the ones the marginal water costs are read under (a
        // rounded plan can leave a unit off where one more m3 would be made).
        if ((!UsesFixAndOptimise() || !ProvenWithinGap(best.Objective)) && WholeMilpFits(backend))
        {
            whole = SolveWholeMilp(backend, best);
            MemoryRelease.AfterModel();
        }
        return Finish(backend, whole, dayByDay, start);
    }

    /// <summary>What the whole MILP gave: its plan (null when none), its status (null when it was not run), SCIP's
    /// reported bound, and the gap HiGHS was last asked for.</summary>
    private sealed record WholeMilp(KeptPlan? Plan, Solver.ResultStatus? Status, double ReportedBound, double GapPercent);

    // Without the relaxation's time there is no telling how long the MILP's root LP takes, and HiGHS would overrun.
    private bool WholeMilpFits(string backend)
    {
        if (relaxationSeconds is not { } lpSeconds)
        {
            notes.Add("the whole MILP was not started: its root LP is the LP relaxation, which did not finish in time");
            return false;
        }
        var firstTry = SearchSecondsLeft() * (backend == SolverBackend.Highs ? HighsFirstTryShare : 1);
        if (firstTry < RootLpFactor * lpSeconds)
        {
            notes.Add($"the whole MILP was not started: the LP relaxation took {lpSeconds:0.#} s and its search would have had {Math.Max(0, firstTry):0.#} s");
            return false;
        }
        return true;
    }

    // A window re-solves the whole horizon's LP with some decisions free: its root LP takes about what the LP with the
    // baseline's decisions took, and no window is started without that time (twice over). Fix-and-optimise starts when
    // one window (the first: every day's treatment levels, the one that gains most) fits in its time.
    private bool FixAndOptimiseFits()
    {
        if (relaxationSeconds is null || baselineLpSeconds is not { } lpSeconds)
        {
            notes.Add("fix-and-optimise over days was not started: the LPs before it did not finish in time");
            return false;
        }
        if (FixAndOptimiseSeconds() < WindowLeastSeconds(lpSeconds))
        {
            notes.Add($"fix-and-optimise over days was not started: a window needs about {WindowLeastSeconds(lpSeconds):0.#} s " +
                      $"and {Math.Max(0, FixAndOptimiseSeconds()):0.#} s were left for it");
            return false;
        }
        return true;
    }

    // Fix-and-optimise's share of the search time; all of it when the whole MILP could not start in the rest anyway
    // (its root LP alone needs about twice the relaxation's time).
    private double FixAndOptimiseSeconds()
    {
        var search = SearchSecondsLeft();
        var milpCouldFollow = relaxationSeconds is { } lpSeconds && search * (1 - FixAndOptimiseShare) >= RootLpFactor * lpSeconds;
        return search * (milpCouldFollow ? FixAndOptimiseShare : 1);
    }

    private static double WindowLeastSeconds(double fixedLpSeconds) => Math.Max(RootLpFactor * fixedLpSeconds, FixAndOptimise.MinimumWindowSeconds);

    private WholeMilp SolveWholeMilp(string backend, KeptPlan start)
    {
        Report(SolvePhases.Building);
        using var solver = SolverBackend.CreateMip(backend)!;
        var model = PlanModel.Build(solver, planningCase, IntegerMode.Integer);
        NoteModel(model);
        if (backend == SolverBackend.Scip)
        {
            Hint(solver, start.IntegerValues);
        }
        Report(SolvePhases.Solving);
        var (status, gapPercent) = SolveWhole(solver, backend);
        var plan = status is Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE
            ? KeptPlan.Read(new SolvedModel(solver, model, solver.Objective().Value(), status), KeptPlan.WholeMilp)
            : null;
        return new WholeMilp(plan, status, solver.Objective().BestBound(), gapPercent);
    }

    private KeptPlan? ImproveDayByDay(KeptPlan start)
    {
        var dayByDayNotes = new List<string>();
        var values = new Dictionary<string, double>(start.IntegerValues);
        var leastWindowSeconds = WindowLeastSeconds(baselineLpSeconds ?? 0);
        // The windows keep a share of the search time for the whole MILP when it could start in it (see
        // FixAndOptimiseSeconds and WholeMilpFits).
        var deadline = clock.Elapsed.TotalSeconds + FixAndOptimiseSeconds();
        double WindowSecondsLeft() => Math.Min(SearchSecondsLeft(), deadline - clock.Elapsed.TotalSeconds);
        var task = Task.Run(() => new FixAndOptimise(planningCase, options, dayByDayNotes)
            .Improve(start.Objective, values, WindowSecondsLeft, cancellation, leastWindowSeconds), CancellationToken.None);
        using var solved = Await(task);
        notes.AddRange(dayByDayNotes);
        cancellation.ThrowIfCancellationRequested();
        return solved is null ? null : KeptPlan.Read(solved, KeptPlan.DayByDay);
    }

    // Over several days the whole MILP rarely finishes in time (HiGHS then returns nothing), so fix-and-optimise runs
    // first, whichever backend; over one day the whole MILP is quick and runs alone.
    private bool UsesFixAndOptimise() => planningCase.Horizon.DayCount > 1;

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
            var status = RunSolve(solver, SolverBackend.ConfigureMip(solver, backend, options, SearchSecondsLeft()));
            cancellation.ThrowIfCancellationRequested();
            return (status, options.GapPercent);
        }
        var firstTry = SearchSecondsLeft() * HighsFirstTryShare;
        var first = RunSolve(solver, SolverBackend.ConfigureMip(solver, backend, options, firstTry));
        cancellation.ThrowIfCancellationRequested();
        if (first is Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE || SearchSecondsLeft() < MinimumSecondTrySeconds || UsesFixAndOptimise())
        {
            return (first, options.GapPercent);
        }
        var looser = Math.Max(options.GapPercent * 4, LooserGapPercent);
        notes.Add($"HiGHS did not reach a {options.GapPercent:0.###} % gap in {firstTry:0} s; it was run again to a {looser:0.###} % gap");
        var second = RunSolve(solver, SolverBackend.ConfigureMip(solver, backend, options with { GapPercent = looser }, SearchSecondsLeft()));
        cancellation.ThrowIfCancellationRequested();
        return (second, looser);
    }

    private Plan Finish(string backend, WholeMilp whole, KeptPlan? dayByDay, KeptPlan start)
    {
        // Prefer the whole MILP's plan, then fix-and-optimise's, unless a later one is strictly cheaper.
        var chosen = new[] { whole.Plan, dayByDay, start }.Aggregate((KeptPlan?)null, KeptPlan.Cheaper)!;
        var milpOutcome = whole.Status is { } ran ? $"found no plan in time ({SolverBackend.Describe(ran)})" : "was not run";
        if (chosen == dayByDay)
        {
            notes.Add(whole.Plan is null
                ? $"the whole MILP {milpOutcome}: this is {chosen.Source}"
                : "fix-and-optimise over days found a better plan than the whole MILP in time");
        }
        else if (chosen == start)
        {
            notes.Add(whole.Plan is null
                ? $"the whole MILP {milpOutcome}: this is {chosen.Source}"
                : $"the whole MILP found no better plan in time than {chosen.Source}");
        }

        var status = whole.Status ?? Solver.ResultStatus.NOT_SOLVED;
        var bound = Bounds.Best(backend, status, whole.Plan?.Objective, whole.ReportedBound, relaxationBound, whole.GapPercent, chosen.Objective, notes);
        var gap = Bounds.GapPercent(chosen.Objective, bound);
        // Optimal means proven within the asked gap, whichever plan is kept and whichever try found it.
        var planStatus = gap <= options.GapPercent + 1e-9 ? SolveStatus.Optimal : SolveStatus.Feasible;
        var info = new SolveInfo
        {
            Status = planStatus,
            Solver = $"{backend} via OR-Tools ({(whole.Status is null ? "MILP not run" : SolverBackend.Describe(status))})",
            Objective = chosen.Objective,
            BestBound = bound,
            GapPercent = gap,
            Variables = modelSize?.Variables ?? 0,
            IntegerVariables = modelSize?.Integers ?? 0,
            Constraints = modelSize?.Constraints ?? 0,
            Notes = notes,
        };
        var plan = chosen.Plan with { Solve = info };
        if (options.Explain)
        {
            plan = Explain(plan, chosen.IntegerValues);
        }
        return plan with { Solve = plan.Solve with { SolveSeconds = clock.Elapsed.TotalSeconds, Notes = notes } };
    }

    // The explanation LP has a time limit of its own; with less than the least time left it is not started.
    private Plan Explain(Plan plan, IReadOnlyDictionary<string, double> integers)
    {
        if (TimeLeft() < MinimumExplainSeconds)
        {
            notes.Add("marginal water costs and binding limits were not computed: the time limit was reached");
            return plan;
        }
        Report(SolvePhases.Explaining);
        return Explanations.Add(planningCase, integers, plan, TimeLeft(), notes);
    }

    // SCIP takes a starting solution (its integer decisions; SCIP completes the flows); HiGHS must never get one (SetHint crashes it).
    private static void Hint(Solver scip, IReadOnlyDictionary<string, double> integers)
    {
        var variables = scip.variables().Where(v => integers.ContainsKey(v.Name())).ToArray();
        scip.SetHint(variables, variables.Select(v => integers[v.Name()]).ToArray());
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

    private double TimeLeft() => options.TimeLimitSeconds - clock.Elapsed.TotalSeconds;

    // For the steps that start the plan: at least a second, so that tiny limits still give the baseline's LP a chance.
    private double Remaining() => Math.Max(1, TimeLeft());

    // For the search (whole MILP, fix-and-optimise): the time left less what the explanation LP will need.
    private double SearchSecondsLeft() => TimeLeft() - ExplainReserveSeconds();

    private double ExplainReserveSeconds() =>
        options.Explain ? Math.Max(LeastExplainReserveSeconds, ExplainLpFactor * (baselineLpSeconds ?? MinimumExplainSeconds)) : 0;
}
