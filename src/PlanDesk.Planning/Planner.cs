using System.Diagnostics;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Explaining;
using PlanDesk.Planning.Extraction;
using PlanDesk.Planning.Model;
using PlanDesk.Planning.Solving;

namespace PlanDesk.Planning;

/// <summary>Settings of one solve.</summary>
public sealed record SolveOptions
{
    /// <summary>MIP backend: "HIGHS" or "SCIP" (see docs/formulation.md for the measured choice).</summary>
    public string Solver { get; init; } = "HIGHS";
    public double TimeLimitSeconds { get; init; } = 60;
    /// <summary>Relative gap at which the search stops, percent.</summary>
    public double GapPercent { get; init; } = 0.5;
    /// <summary>Threads for HiGHS (SCIP always runs one). HiGHS fixes its thread count at the first solve of a process.</summary>
    public int Threads { get; init; } = 2;
    /// <summary>Compute marginal water costs and binding limits after the MILP (a fixed-integer LP re-solve).</summary>
    public bool Explain { get; init; } = true;
}

/// <summary>What a long solve reports while it runs; fields the backend does not expose are null.</summary>
public sealed record SolveProgress(string Phase, double ElapsedSeconds, double TimeLimitSeconds, double? Incumbent, double? BestBound, double? GapPercent);

/// <summary>Builds the MILP for a planning case, solves it and extracts the plan.</summary>
public static class Planner
{
    // Share of the time limit the LP relaxation (the bound for HiGHS) may use at most.
    private const double RelaxationTimeShare = 0.25;
    private static readonly TimeSpan ProgressInterval = TimeSpan.FromMilliseconds(500);

    /// <summary>Always returns a plan record; when the solver found none, <c>Solve.Status</c> is noPlan and its arrays are empty.
    /// Cancelling stops SCIP at once and HiGHS after its current solve; it then throws <see cref="OperationCanceledException"/>.</summary>
    public static Plan Solve(PlanningCase planningCase, SolveOptions options, IProgress<SolveProgress>? progress = null, CancellationToken cancellation = default)
    {
        var clock = Stopwatch.StartNew();
        var notes = new List<string>();
        void Report(string phase, double? bound = null) =>
            progress?.Report(new SolveProgress(phase, clock.Elapsed.TotalSeconds, options.TimeLimitSeconds, null, bound, null));
        double Remaining() => Math.Max(1, options.TimeLimitSeconds - clock.Elapsed.TotalSeconds);

        var backend = SolverBackend.Normalise(options.Solver);
        if (backend is null)
        {
            return EmptyPlans.NoPlan(planningCase, new SolveInfo { Status = SolveStatus.NoPlan, Solver = options.Solver },
                $"unknown solver '{options.Solver}': choose one of {string.Join(", ", SolverBackend.Supported)}");
        }

        Report("building the model");
        using var solver = SolverBackend.CreateMip(backend)!;
        var model = PlanModel.Build(solver, planningCase, IntegerMode.Integer);
        notes.AddRange(model.Notes);

        double? relaxationBound = null;
        if (backend == SolverBackend.Highs)
        {
            Report("bounding (LP relaxation)");
            relaxationBound = RelaxationBound(planningCase, options, Remaining() * RelaxationTimeShare, notes);
        }
        cancellation.ThrowIfCancellationRequested();

        Report("solving", relaxationBound);
        var parameters = SolverBackend.ConfigureMip(solver, backend, options, Remaining(), notes);
        var result = RunSolve(solver, parameters, clock, options, relaxationBound, progress, cancellation);
        cancellation.ThrowIfCancellationRequested();

        var info = new SolveInfo
        {
            Status = SolverBackend.StatusOf(result),
            Solver = $"{backend} via OR-Tools ({SolverBackend.Describe(result)})",
            Variables = solver.NumVariables(),
            IntegerVariables = model.IntegerVariables.Count,
            Constraints = solver.NumConstraints(),
            SolveSeconds = clock.Elapsed.TotalSeconds,
            Notes = notes,
        };
        if (info.Status == SolveStatus.NoPlan)
        {
            return EmptyPlans.NoPlan(planningCase, info,
                $"the {backend} solver found no plan within {options.TimeLimitSeconds:0.#} s ({SolverBackend.Describe(result)}); " +
                "allow a longer time limit, a larger gap or a shorter horizon", model.DataProblems);
        }

        var objective = solver.Objective().Value();
        var bound = Bounds.Best(backend, result, objective, solver.Objective().BestBound(), relaxationBound, options.GapPercent, notes);
        info = info with { Objective = objective, BestBound = bound, GapPercent = Bounds.GapPercent(objective, bound) };

        var plan = PlanExtractor.Extract(model, info);
        plan = plan with { Problems = [.. model.DataProblems, .. ProblemReport.Find(model, plan)] };
        if (options.Explain)
        {
            Report("explaining (marginal water costs)");
            plan = Explanations.Add(planningCase, model, plan, notes);
        }
        return plan with { Solve = plan.Solve with { SolveSeconds = clock.Elapsed.TotalSeconds, Notes = notes } };
    }

    private static double? RelaxationBound(PlanningCase planningCase, SolveOptions options, double timeLimitSeconds, List<string> notes)
    {
        using var lp = SolverBackend.CreateRelaxation(options, timeLimitSeconds, notes);
        PlanModel.Build(lp, planningCase, IntegerMode.Relaxed);
        var status = lp.Solve();
        if (status == Solver.ResultStatus.OPTIMAL)
        {
            return lp.Objective().Value();
        }
        notes.Add($"the LP relaxation gave no bound ({SolverBackend.Describe(status)})");
        return null;
    }

    // Solves on a worker thread so progress can be reported; the MPSolver API has no MIP callback in .NET.
    private static Solver.ResultStatus RunSolve(Solver solver, MPSolverParameters parameters, Stopwatch clock, SolveOptions options,
        double? bound, IProgress<SolveProgress>? progress, CancellationToken cancellation)
    {
        if (progress is null && !cancellation.CanBeCanceled)
        {
            return solver.Solve(parameters);
        }
        var solve = Task.Run(() => solver.Solve(parameters), CancellationToken.None);
        var interrupted = false;
        while (!solve.Wait(ProgressInterval, CancellationToken.None))
        {
            progress?.Report(new SolveProgress("solving", clock.Elapsed.TotalSeconds, options.TimeLimitSeconds, null, bound, null));
            if (cancellation.IsCancellationRequested && !interrupted)
            {
                interrupted = solver.InterruptSolve();
            }
        }
        return solve.Result;
    }
}
