using System.Diagnostics;
using System.Runtime.ExceptionServices;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// Solves a region that falls apart into independent groups of plants as one model per group, on
/// <see cref="SolveOptions.Threads"/> workers side by side, and joins the group plans (exact: no constraint or cost
/// spans two groups; see docs/formulation.md, "Independent groups of plants"). Groups are dealt to workers largest
/// first, each to the least loaded worker, and each worker runs its own smallest first; a group gets the share of
/// its worker's remaining time that its size is of the groups that worker has left, so time a group does not use
/// passes on to the next.
/// </summary>
internal sealed class GroupedSolve(PlanningCase planningCase, IReadOnlyList<PlantGroup> groups, SolveOptions options,
    IProgress<SolveProgress>? progress, CancellationToken cancellation)
{
    private static readonly TimeSpan ProgressInterval = TimeSpan.FromMilliseconds(500);

    private readonly Stopwatch clock = Stopwatch.StartNew();
    private readonly GroupProgress[] states = groups.Select(_ => new GroupProgress()).ToArray();
    private readonly int[] sizes = groups.Select(g => g.Size(planningCase.Network)).ToArray();
    private readonly PlanningCase[] groupCases = groups.Select(planningCase.Restrict).ToArray();

    public Plan Execute()
    {
        var workerCount = Math.Clamp(options.Threads, 1, groups.Count);
        // A group that fails stops the others: the region gets no plan without it.
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellation);
        // Every group has a plan at once, its rule-based baseline (seconds even at 50 plants), so the region has one
        // before the first group's solve starts; a group's own reports replace it once it runs.
        var baselines = groupCases.Select(RuleBasedBaseline.Build).ToArray();
        for (var i = 0; i < groups.Count; i++)
        {
            states[i].StartFrom(baselines[i]);
        }
        Report();
        var workers = Assign(workerCount).Select(queue => Task.Run(() => RunWorker(queue, stop), CancellationToken.None)).ToArray();
        var all = Task.WhenAll(workers);
        while (!((IAsyncResult)all).AsyncWaitHandle.WaitOne(ProgressInterval))
        {
            Report();
        }
        if (!all.IsCompletedSuccessfully)
        {
            var failure = all.Exception?.InnerExceptions.FirstOrDefault(e => e is not OperationCanceledException);
            if (failure is not null)
            {
                ExceptionDispatchInfo.Throw(failure);
            }
            throw new OperationCanceledException(cancellation);
        }
        Report();
        var parts = groups.Select((group, i) => new GroupPlan(group, states[i].Plan!)).ToList();
        return GroupPlans.Join(planningCase, parts, options.GapPercent, clock.Elapsed.TotalSeconds);
    }

    // Groups are dealt largest first, each to the worker with the least size so far (the longest-processing-time
    // rule); each worker then runs its groups smallest first. HiGHS can overrun its time limit by a minute (65 s
    // measured at XL): run first, a large group overran into the small ones' time and left one with 0.5 s and no
    // plan, and so the region without one. Run last, it gets what the small ones leave and overruns only itself.
    private List<List<int>> Assign(int workerCount)
    {
        var queues = Enumerable.Range(0, workerCount).Select(_ => new List<int>()).ToList();
        var loads = new int[workerCount];
        foreach (var index in Enumerable.Range(0, groups.Count).OrderByDescending(i => sizes[i]).ThenBy(i => i))
        {
            var worker = Array.IndexOf(loads, loads.Min());
            queues[worker].Add(index);
            loads[worker] += sizes[index];
        }
        queues.ForEach(queue => queue.Reverse());
        return queues;
    }

    private void RunWorker(IReadOnlyList<int> queue, CancellationTokenSource stop)
    {
        try
        {
            RunGroups(queue, stop.Token);
        }
        catch (Exception failure) when (failure is not OperationCanceledException)
        {
            stop.Cancel();
            throw;
        }
    }

    private void RunGroups(IReadOnlyList<int> queue, CancellationToken token)
    {
        for (var position = 0; position < queue.Count; position++)
        {
            token.ThrowIfCancellationRequested();
            var index = queue[position];
            var left = queue.Skip(position).Sum(i => sizes[i]);
            var remainingSeconds = Math.Max(1, options.TimeLimitSeconds - clock.Elapsed.TotalSeconds);
            var budgetSeconds = remainingSeconds * sizes[index] / Math.Max(1, left);
            var startedSeconds = clock.Elapsed.TotalSeconds;
            var plan = new SolveRun(groupCases[index], options with { TimeLimitSeconds = budgetSeconds }, states[index], token,
                states[index].Baseline).Execute();
            var timing = $"solved from {startedSeconds:0.#} s to {clock.Elapsed.TotalSeconds:0.#} s of the region's solve, with a share of {budgetSeconds:0.#} s";
            states[index].Finish(plan with { Solve = plan.Solve with { Notes = [.. plan.Solve.Notes, timing] } });
        }
    }

    /// <summary>
    /// One progress for the region: the incumbent is the sum of the groups' incumbents once every group has one (a
    /// finished group counts with its plan's objective), the bound likewise, and the gap between those sums.
    /// </summary>
    private void Report()
    {
        if (progress is null)
        {
            return;
        }
        // Each group's own phase would flicker between groups; the earliest phase of the running ones says how far all have got.
        var running = states.Where(s => s.Plan is null && s.Phase is not null).Select(s => s.Phase!).ToList();
        var phase = states.All(s => s.Plan is not null) ? SolvePhases.Joining
            : running.Count == 0 ? SolvePhases.Baseline
            : SolvePhases.Earliest(running);
        var incumbent = SumOrNull(states.Select(s => s.Incumbent));
        var bound = SumOrNull(states.Select(s => s.Bound));
        var gap = incumbent is { } best && bound is { } lower ? Bounds.GapPercent(best, Math.Min(lower, best)) : (double?)null;
        progress.Report(new SolveProgress($"{phase} ({groups.Count} independent groups)", clock.Elapsed.TotalSeconds,
            options.TimeLimitSeconds, incumbent, bound, gap));
    }

    private static double? SumOrNull(IEnumerable<double?> values)
    {
        var sum = 0.0;
        foreach (var value in values)
        {
            if (value is not { } known)
            {
                return null;
            }
            sum += known;
        }
        return sum;
    }

    /// <summary>What one group's solve last reported, then its plan; written by its worker, read by the reporter.</summary>
    private sealed class GroupProgress : IProgress<SolveProgress>
    {
        private volatile SolveProgress? latest;
        private volatile Plan? plan;

        public Plan? Plan => plan;

        /// <summary>The phase last reported; null until the group's solve has started.</summary>
        public string? Phase => latest?.Phase;

        /// <summary>The group's rule-based plan: its incumbent until its own solve reports one, and that solve's start.</summary>
        public Plan? Baseline { get; private set; }

        public double? Incumbent => plan is { } p
            ? p.Solve.Status == SolveStatus.NoPlan ? null : p.Solve.Objective
            : latest?.Incumbent ?? Baseline?.Costs.Total;

        public void StartFrom(Plan baseline) => Baseline = baseline;

        public double? Bound => plan is { } p
            ? double.IsNaN(p.Solve.BestBound) ? null : p.Solve.BestBound
            : latest?.BestBound;

        public void Report(SolveProgress value) => latest = value;

        public void Finish(Plan finished) => plan = finished;
    }
}
