using System.Diagnostics;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

/// <summary>A solved model and the solver that holds its values; dispose it when the plan has been read.</summary>
internal sealed record SolvedModel(Solver Solver, PlanModel Model, double Objective, Solver.ResultStatus Status) : IDisposable
{
    public void Dispose() => Solver.Dispose();
}

/// <summary>
/// A first plan built day by day (relax-and-fix): day d's on/off decisions are integer, earlier days' are fixed
/// to what the previous step chose, later days' are relaxed. Every step keeps all constraints, and every slack
/// keeps every step feasible, so the last step is a complete plan. It gives the full MILP a safety net (a plan
/// even when the MILP finds none in time, as under heavy machine load) and SCIP a starting solution.
/// </summary>
internal static class DayByDayPlan
{
    // Each day's MILP may stop at this gap at least: it is a starting point, not the answer.
    private const double StepGapPercent = 1.0;

    public static SolvedModel? Build(PlanningCase planningCase, string backend, SolveOptions options, double timeLimitSeconds,
        Action<int> onDay, List<string> notes, CancellationToken cancellation)
    {
        var clock = Stopwatch.StartNew();
        var fixedValues = new Dictionary<string, double>();
        var days = planningCase.Horizon.DayCount;
        SolvedModel? step = null;
        for (var day = 0; day < days; day++)
        {
            cancellation.ThrowIfCancellationRequested();
            onDay(day);
            step?.Dispose();
            var current = day;
            var solver = SolverBackend.CreateMip(backend)!;
            var rule = new IntegerRule(d => d < current ? IntegerMode.Fixed : d == current ? IntegerMode.Integer : IntegerMode.Relaxed, fixedValues);
            var model = PlanModel.Build(solver, planningCase, rule);
            var stepTime = Math.Max(1, (timeLimitSeconds - clock.Elapsed.TotalSeconds) / (days - day));
            var stepOptions = options with { GapPercent = Math.Max(options.GapPercent, StepGapPercent) };
            var status = solver.Solve(SolverBackend.ConfigureMip(solver, backend, stepOptions, stepTime, notes));
            if (status is not (Solver.ResultStatus.OPTIMAL or Solver.ResultStatus.FEASIBLE))
            {
                solver.Dispose();
                notes.Add($"the day-by-day first plan stopped at {planningCase.Horizon.Days[day].Date:yyyy-MM-dd} ({SolverBackend.Describe(status)})");
                return null;
            }
            foreach (var (name, value) in model.IntegerValues(day))
            {
                fixedValues[name] = value;
            }
            step = new SolvedModel(solver, model, solver.Objective().Value(), status);
        }
        return step;
    }
}
