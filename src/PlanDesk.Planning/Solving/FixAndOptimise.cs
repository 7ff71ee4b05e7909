using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// Fix-and-optimise: starting from a complete plan (the first plan), the full-horizon model is solved with some
/// decisions free and the rest fixed to the plan's; a better solution becomes the plan, and the next window is
/// freed. The windows are every day's treatment levels at once (units and pumps fixed: levels are few, and a
/// monthly cap ties them across days), then each local day's on/off decisions in turn. Every window has the whole horizon's constraints (tanks, monthly
/// caps, end volumes, the demand-charge peak) and every accepted window is a complete plan no worse than the one
/// before, so a window that finds nothing in time (HiGHS then returns no solution at all) loses nothing. Passes
/// over the days repeat while one improves and time is left. See docs/formulation.md, "Scaling".
/// </summary>
internal sealed class FixAndOptimise(PlanningCase planningCase, string backend, SolveOptions options, List<string> notes)
{
    // A window is worth trying only with at least this much time; it stops improving below this relative gain.
    private const double MinimumWindowSeconds = 1.0;
    private const double RelativeImprovement = 1e-6;
    private const int MaximumPasses = 3;

    /// <summary>Improves a plan of objective <paramref name="startObjective"/> and integer values <paramref name="values"/>
    /// until <paramref name="remainingSeconds"/> runs out; returns the best plan found, or null when no window improved it.
    /// A window is not started with less than <paramref name="leastWindowSeconds"/> (at least a second): HiGHS does not
    /// stop inside a root LP, so a window that cannot solve its LP in time overruns.</summary>
    public SolvedModel? Improve(double startObjective, Dictionary<string, double> values, Func<double> remainingSeconds, CancellationToken cancellation,
        double leastWindowSeconds = MinimumWindowSeconds)
    {
        leastWindowSeconds = Math.Max(leastWindowSeconds, MinimumWindowSeconds);
        var windowRules = Windows();
        SolvedModel? best = null;
        var improvedWindows = 0;
        var windows = 0;
        for (var pass = 0; pass < MaximumPasses; pass++)
        {
            var improvedInPass = false;
            for (var window = 0; window < windowRules.Count; window++)
            {
                cancellation.ThrowIfCancellationRequested();
                var seconds = remainingSeconds() / (windowRules.Count - window);
                if (seconds < leastWindowSeconds)
                {
                    break;
                }
                windows++;
                var solved = SolveWindow(windowRules[window], values, seconds);
                if (solved is null || solved.Objective >= Objective(best) - RelativeImprovement * Math.Max(1, Math.Abs(Objective(best))))
                {
                    solved?.Dispose();
                    continue;
                }
                best?.Dispose();
                best = solved;
                values = solved.Model.IntegerValues();
                improvedWindows++;
                improvedInPass = true;
            }
            if (!improvedInPass || remainingSeconds() < leastWindowSeconds * windowRules.Count)
            {
                break;
            }
        }
        notes.Add($"fix-and-optimise: {improvedWindows} of {windows} windows (the levels of every day, then each day) improved the plan");
        return best;

        double Objective(SolvedModel? plan) => plan?.Objective ?? startObjective;
    }

    // Which decisions each window frees: every day's treatment levels, then each local day's decisions.
    private List<Func<int, string, IntegerMode>> Windows()
    {
        var windows = new List<Func<int, string, IntegerMode>>();
        if (planningCase.Network.Plants.Any(p => p.Levels.Count > 1))
        {
            windows.Add((_, name) => PlanModel.IsLevelDecision(name) ? IntegerMode.Integer : IntegerMode.Fixed);
        }
        for (var day = 0; day < planningCase.Horizon.DayCount; day++)
        {
            var freeDay = day;
            windows.Add((d, _) => d == freeDay ? IntegerMode.Integer : IntegerMode.Fixed);
        }
        return windows;
    }

    private SolvedModel? SolveWindow(Func<int, string, IntegerMode> window, Dictionary<string, double> values, double seconds)
    {
        var solver = SolverBackend.CreateMip(backend)!;
        var rule = new IntegerRule(window, values);
        var model = PlanModel.Build(solver, planningCase, rule);
        var status = solver.Solve(SolverBackend.ConfigureMip(solver, backend, options, seconds, notes));
        if (status is Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE)
        {
            return new SolvedModel(solver, model, solver.Objective().Value(), status);
        }
        solver.Dispose();
        return null;
    }
}
