using PlanDesk.Planning;

namespace PlanDesk.Cli.Bench;

/// <summary>
/// Records the planner's progress reports as they come (synchronously, unlike <see cref="Progress{T}"/>),
/// to read the build time and the LP relaxation bound out of them.
/// </summary>
internal sealed class PhaseRecorder : IProgress<SolveProgress>
{
    private readonly List<SolveProgress> reports = [];
    private readonly Lock gate = new();

    public void Report(SolveProgress value)
    {
        lock (gate)
        {
            reports.Add(value);
        }
    }

    private List<SolveProgress> Reports
    {
        get
        {
            lock (gate)
            {
                return [.. reports];
            }
        }
    }

    /// <summary>Seconds until the phase after the first one (building the model) began; null when only one phase was reported.</summary>
    public double? BuildSeconds
    {
        get
        {
            var all = Reports;
            return all.Count == 0 ? null : all.FirstOrDefault(r => r.Phase != all[0].Phase)?.ElapsedSeconds;
        }
    }

    /// <summary>Seconds spent in phases named for the bound (the LP relaxation), so they can be left out of the time to first plan.</summary>
    public double BoundingSeconds
    {
        get
        {
            var all = Reports;
            var seconds = 0.0;
            for (var i = 0; i + 1 < all.Count; i++)
            {
                if (all[i].Phase.StartsWith("bounding", StringComparison.OrdinalIgnoreCase) && all[i + 1].Phase != all[i].Phase)
                {
                    seconds += all[i + 1].ElapsedSeconds - all[i].ElapsedSeconds;
                }
            }
            return seconds;
        }
    }

    /// <summary>The first bound the planner reports, which it takes from the LP relaxation before the MIP search; null when it reports none.</summary>
    public double? RelaxationBound => Reports.FirstOrDefault(r => r.BestBound is { } b && double.IsFinite(b))?.BestBound;

    /// <summary>Elapsed seconds at the first report carrying an incumbent, when the planner reports incumbents.</summary>
    public double? FirstIncumbentSeconds => Reports.FirstOrDefault(r => r.Incumbent is not null)?.ElapsedSeconds;

    /// <summary>Objective of that first incumbent.</summary>
    public double? FirstIncumbent => Reports.FirstOrDefault(r => r.Incumbent is not null)?.Incumbent;
}
