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
/// A first plan from the LP relaxation: its on/off decisions rounded (each day's most-chosen level; enough units
/// and pumps for the relaxed flows, with runs stretched to their minimum run time), then the flows re-solved as
/// an LP with those decisions fixed. When that LP fails, every unit and pump is switched off instead, which the
/// slacks always make feasible. It is the safety net of the whole MILP (a plan even when the MILP finds none in
/// time, as under heavy machine load) and SCIP's starting solution.
/// </summary>
internal static class FirstPlan
{
    private const double Tolerance = 1e-6;

    public static SolvedModel? Build(PlanningCase planningCase, PlanModel relaxed, SolveOptions options, double timeLimitSeconds, List<string> notes)
    {
        var rounded = Round(relaxed);
        var plan = SolveFixed(planningCase, rounded, options, timeLimitSeconds, notes);
        if (plan is not null)
        {
            return plan;
        }
        notes.Add("the rounded LP relaxation gave no first plan; the first plan switches every unit and pump off");
        var levelsOnly = rounded.Where(pair => pair.Key.StartsWith("level[", StringComparison.Ordinal)).ToDictionary();
        return SolveFixed(planningCase, levelsOnly, options, timeLimitSeconds, notes);
    }

    private static SolvedModel? SolveFixed(PlanningCase planningCase, IReadOnlyDictionary<string, double> values, SolveOptions options,
        double timeLimitSeconds, List<string> notes)
    {
        var solver = SolverBackend.CreateRelaxation(options, timeLimitSeconds, notes);
        var model = PlanModel.Build(solver, planningCase, IntegerMode.Fixed, values);
        var status = solver.Solve();
        if (status != Solver.ResultStatus.OPTIMAL)
        {
            solver.Dispose();
            return null;
        }
        return new SolvedModel(solver, model, solver.Objective().Value(), status);
    }

    /// <summary>Integer values by variable name rounded from a solved relaxation.</summary>
    internal static Dictionary<string, double> Round(PlanModel relaxed)
    {
        var planningCase = relaxed.Case;
        var network = planningCase.Network;
        var hours = planningCase.PeriodHours;
        var values = new Dictionary<string, double>();
        foreach (var plant in network.Plants)
        {
            var levels = relaxed.AllowedLevels[plant.Id];
            foreach (var day in planningCase.Horizon.Days)
            {
                var chosen = levels.MaxBy(l => relaxed.LevelOn[(plant.Id, day.Index, l.Id)].SolutionValue())!;
                foreach (var level in levels)
                {
                    values[relaxed.LevelOn[(plant.Id, day.Index, level.Id)].Name()] = level == chosen ? 1 : 0;
                }
            }
        }
        foreach (var stage in network.Stages)
        {
            var available = planningCase.AvailableUnits[stage.Id];
            var units = Enumerable.Range(0, planningCase.PeriodCount)
                .Select(t => Math.Min(available[t], UnitsFor(relaxed.Feed[(stage.Id, t)].SolutionValue(), stage.UnitMaxFlowM3PerHour * hours)))
                .ToArray();
            var minRunPeriods = (int)Math.Ceiling(stage.MinRunHours / hours - 1e-9);
            if (!StretchToMinimumRun(units, stage.InitialUnitsRunning, minRunPeriods, available))
            {
                Array.Clear(units);
            }
            for (var t = 0; t < units.Length; t++)
            {
                values[relaxed.Units[(stage.Id, t)].Name()] = units[t];
            }
        }
        foreach (var pipeline in network.Pipelines.Where(l => l.Pumps is not null))
        {
            var pumps = pipeline.Pumps!;
            for (var t = 0; t < planningCase.PeriodCount; t++)
            {
                var flow = relaxed.Flow[(pipeline.Id, t)].SolutionValue();
                var fewest = UnitsFor(flow, pumps.MaxFlowM3PerHour * hours);
                // More pumps than the flow allows at their minimum would force water the customer may not take.
                var most = pumps.MinFlowM3PerHour > 0 ? (int)Math.Floor(flow / (pumps.MinFlowM3PerHour * hours) + Tolerance) : pumps.Count;
                values[relaxed.PumpsOn[(pipeline.Id, t)].Name()] = Math.Min(pumps.Count, Math.Min(fewest, most));
            }
        }
        return values;
    }

    // Units (or pumps) needed to carry a flow at most maxPerUnit each.
    private static int UnitsFor(double flow, double maxPerUnit) =>
        flow <= Tolerance || maxPerUnit <= 0 ? 0 : (int)Math.Ceiling(flow / maxPerUnit - Tolerance);

    /// <summary>Raises units so every unit started in the last L periods still runs (n[t] ≥ Σ starts over the last L);
    /// false when an outage makes that impossible.</summary>
    internal static bool StretchToMinimumRun(int[] units, int initialUnits, int minRunPeriods, int[] available)
    {
        if (minRunPeriods < 2)
        {
            return true;
        }
        var starts = new int[units.Length];
        for (var t = 0; t < units.Length; t++)
        {
            var before = t == 0 ? initialUnits : units[t - 1];
            var stillRunning = 0;
            for (var back = Math.Max(0, t - minRunPeriods + 1); back < t; back++)
            {
                stillRunning += starts[back];
            }
            if (stillRunning > available[t])
            {
                return false;
            }
            // stillRunning ≤ units[t − 1], so raising to it starts nothing new.
            units[t] = Math.Max(units[t], stillRunning);
            starts[t] = Math.Max(0, units[t] - before);
        }
        return true;
    }
}
