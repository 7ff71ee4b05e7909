using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// Fix-and-optimise: starting from a complete plan, the full-horizon model is solved with some decisions free and
/// the rest fixed to the plan's; a better solution becomes the plan, and the next window is freed. The windows are
/// every day's treatment levels at once (units and pumps fixed: levels are few, and a monthly cap ties them across
/// days), every unit and pump at once (levels fixed), then each local day's decisions in turn. Every window has the
/// whole horizon's constraints (tanks, monthly caps, end volumes, the demand-charge peak) and every accepted window
/// is a complete plan no worse than the one before. Windows are solved by SCIP whatever the backend of the whole
/// MILP, started from the plan (all its values as a hint): SCIP keeps its best solution at its time limit, where
/// HiGHS through OR-Tools returns none, and without the hint SCIP's own first solutions were far worse (measured at
/// size L: 127,824 against 58,191 EUR from a 59,357 EUR start). See docs/formulation.md, "Scaling".
/// </summary>
internal sealed class FixAndOptimise(PlanningCase planningCase, SolveOptions options, List<string> notes)
{
    // A window is worth trying only with at least this much time; it stops improving below this relative gain.
    public const double MinimumWindowSeconds = 1.0;
    private const double RelativeImprovement = 1e-6;
    private const int MaximumPasses = 3;
    // A window stops at this gap to its own bound: it looks for the best plan of its neighbourhood, not a proof.
    private const double WindowGapPercent = 0.01;
    // Shares of the time, as multiples of a day window's: the levels window gained most where measured (size M seed 1:
    // 34,670 to 33,797 EUR in 6 s; L seed 1's six-plant group: 45,027 to 43,565 EUR, proven in 12.8 s, while with 5 of
    // 15 shares it had 11.5 s and found nothing), the units window little (33,785 in a further 17 s; 43,555 in 20 s).
    // A window that ends early passes its time on. Weights 5 and 3 gave L seed 1 4.7 % in 60 s, 12 and 2 gave 2.35 %.
    private const double LevelsWindowWeight = 12;
    private const double UnitsWindowWeight = 2;

    private sealed record Window(string Name, double Weight, Func<int, string, IntegerMode> Rule);

    /// <summary>Improves a plan of objective <paramref name="startObjective"/> and integer values <paramref name="values"/>
    /// until <paramref name="remainingSeconds"/> runs out; returns the best plan found, or null when no window improved it.
    /// A window is not started with less than <paramref name="leastWindowSeconds"/> (at least a second): a window that
    /// cannot solve its LP in time overruns.</summary>
    public SolvedModel? Improve(double startObjective, Dictionary<string, double> values, Func<double> remainingSeconds, CancellationToken cancellation,
        double leastWindowSeconds = MinimumWindowSeconds)
    {
        leastWindowSeconds = Math.Max(leastWindowSeconds, MinimumWindowSeconds);
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var windows = Windows();
        // Every variable's value in the start plan, for SCIP's hint: the flows of the start's decisions.
        var hint = StartValues(values, remainingSeconds());
        if (hint is null)
        {
            notes.Add("fix-and-optimise was not started: the start plan's flows could not be re-solved in time");
            return null;
        }
        SolvedModel? best = null;
        var improved = new List<string>();
        var tried = 0;
        for (var pass = 0; pass < MaximumPasses; pass++)
        {
            var improvedInPass = false;
            for (var index = 0; index < windows.Count; index++)
            {
                cancellation.ThrowIfCancellationRequested();
                // A window gets its weight's share of the time left, and at least the least a window needs while that
                // much is left: with little time, the first windows (the ones that gain most) still run.
                var weightLeft = windows.Skip(index).Sum(w => w.Weight);
                var seconds = Math.Min(remainingSeconds(), Math.Max(remainingSeconds() * windows[index].Weight / weightLeft, leastWindowSeconds));
                if (seconds < leastWindowSeconds)
                {
                    continue;
                }
                tried++;
                var windowEnd = clock.Elapsed.TotalSeconds + seconds;
                var solved = SolveWindow(windows[index], values, hint, () => windowEnd - clock.Elapsed.TotalSeconds);
                MemoryRelease.AfterModel();
                if (solved is null || solved.Objective >= Objective(best) - RelativeImprovement * Math.Max(1, Math.Abs(Objective(best))))
                {
                    solved?.Dispose();
                    continue;
                }
                best?.Dispose();
                best = solved;
                values = solved.Model.IntegerValues();
                hint = AllValues(solved.Solver);
                improved.Add(windows[index].Name);
                improvedInPass = true;
            }
            if (!improvedInPass || remainingSeconds() < leastWindowSeconds * windows.Count)
            {
                break;
            }
        }
        notes.Add($"fix-and-optimise: {improved.Count} of {tried} windows improved the plan" +
                  (improved.Count > 0 ? $" ({string.Join(", ", improved.Distinct())})" : ""));
        return best;

        double Objective(SolvedModel? plan) => plan?.Objective ?? startObjective;
    }

    // Which decisions each window frees: every day's treatment levels, every unit and pump, then each local day's decisions.
    private List<Window> Windows()
    {
        var windows = new List<Window>();
        if (planningCase.Network.Plants.Any(p => p.Levels.Count > 1))
        {
            windows.Add(new Window("treatment levels", LevelsWindowWeight,
                (_, name) => PlanModel.IsLevelDecision(name) ? IntegerMode.Integer : IntegerMode.Fixed));
        }
        windows.Add(new Window("units and pumps", UnitsWindowWeight,
            (_, name) => PlanModel.IsLevelDecision(name) ? IntegerMode.Fixed : IntegerMode.Integer));
        for (var day = 0; day < planningCase.Horizon.DayCount; day++)
        {
            var freeDay = day;
            windows.Add(new Window($"day {day + 1}", 1, (d, _) => d == freeDay ? IntegerMode.Integer : IntegerMode.Fixed));
        }
        return windows;
    }

    private Dictionary<string, double>? StartValues(Dictionary<string, double> values, double seconds)
    {
        using var solved = FirstPlan.SolveFixed(planningCase, values, seconds);
        return solved is null ? null : AllValues(solved.Solver);
    }

    private static Dictionary<string, double> AllValues(Solver solver) => solver.variables().ToDictionary(v => v.Name(), v => v.SolutionValue());

    // The window's time counts its model's building too: SCIP gets what is left of it once the model is built.
    private SolvedModel? SolveWindow(Window window, Dictionary<string, double> values, Dictionary<string, double> hint, Func<double> secondsLeft)
    {
        var solver = SolverBackend.CreateMip(SolverBackend.Scip)!;
        var model = PlanModel.Build(solver, planningCase, new IntegerRule(window.Rule, values));
        var hinted = solver.variables().Where(v => hint.ContainsKey(v.Name())).ToArray();
        solver.SetHint(hinted, hinted.Select(v => hint[v.Name()]).ToArray());
        var seconds = secondsLeft();
        if (seconds < MinimumWindowSeconds)
        {
            solver.Dispose();
            return null;
        }
        var parameters = SolverBackend.ConfigureMip(solver, SolverBackend.Scip, options with { GapPercent = WindowGapPercent }, seconds);
        var status = solver.Solve(parameters);
        if (status is Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE)
        {
            return new SolvedModel(solver, model, solver.Objective().Value(), status);
        }
        solver.Dispose();
        return null;
    }
}
