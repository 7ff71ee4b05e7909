using System.Collections.Concurrent;
using PlanDesk.Server.Plans;

namespace PlanDesk.Server.SolveJobs;

/// <summary>
/// The in-memory side of the job queue: wakes the runner when a job is queued, holds the cancellation of the
/// running job and its latest progress. The jobs themselves, and their state, are in the store.
/// </summary>
internal sealed class SolveJobQueue
{
    private readonly SemaphoreSlim wake = new(0);
    private readonly ConcurrentDictionary<long, CancellationTokenSource> running = new();
    private readonly ConcurrentDictionary<long, JobProgress> progress = new();

    public void Notify() => wake.Release();

    /// <summary>Waits until a job is queued or the timeout passes; the store is the truth either way.</summary>
    public async Task WaitAsync(TimeSpan timeout, CancellationToken stopping)
    {
        try
        {
            await wake.WaitAsync(timeout, stopping);
        }
        catch (OperationCanceledException) when (stopping.IsCancellationRequested)
        {
        }
    }

    public CancellationTokenSource Track(long jobId, CancellationToken stopping)
    {
        var source = CancellationTokenSource.CreateLinkedTokenSource(stopping);
        running[jobId] = source;
        return source;
    }

    public void Untrack(long jobId)
    {
        running.TryRemove(jobId, out _);
        progress.TryRemove(jobId, out _);
    }

    /// <summary>Cancels the job if it is running in this process.</summary>
    public void Cancel(long jobId)
    {
        if (running.TryGetValue(jobId, out var source))
        {
            source.Cancel();
        }
    }

    public void Report(long jobId, JobProgress latest) => progress[jobId] = latest;

    public JobProgress? ProgressOf(long jobId) => progress.GetValueOrDefault(jobId);
}
