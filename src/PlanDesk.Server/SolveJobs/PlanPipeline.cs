using System.Text.Json;
using NodaTime;
using PlanDesk.Core.Actuals;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Planning;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.SolveJobs;

/// <summary>A network version set up for one horizon: the planning case (null when it could not be built,
/// with the reasons) and the starting values taken from actuals.</summary>
internal sealed record PreparedCase(LoadedNetwork Network, PlanningCase? Case, IReadOnlyList<string> Problems, IReadOnlyList<string> ActualsNotes);

internal sealed record SolvedPlan(PlanOutcome Outcome, string Message);

/// <summary>
/// One solve from stored data to stored documents: network version → starting state from actuals → planning
/// case → solve → independent check and baseline → target sheets → summary.
/// </summary>
internal sealed class PlanPipeline(
    NetworkCatalog catalog, IPlanDeskStore store, IPlanSolver solver, IPlanReviewer reviewer, ITargetSheetBuilder sheetBuilder)
{
    // Tank levels, units and gas holder older than this are not taken as the starting state.
    private static readonly Duration LatestStateWindow = Duration.FromDays(7);

    public async Task<PreparedCase?> PrepareAsync(string networkId, int? version, LocalDate startDate, int days)
    {
        var loaded = await catalog.GetAsync(networkId, version);
        if (loaded is null)
        {
            return null;
        }
        var actuals = await ActualsBeforeAsync(loaded.Network, startDate);
        var applied = ActualsApplier.Apply(loaded.Network, startDate, actuals);
        var created = PlanningCase.Create(applied.Network, startDate, days);
        return new PreparedCase(loaded, created.Case, created.Problems, applied.Notes);
    }

    public async Task<SolvedPlan> RunAsync(PlanRecord job, IProgress<SolveProgress> progress, CancellationToken cancellation)
    {
        var prepared = await PrepareAsync(job.NetworkId, job.NetworkVersion, job.StartDate, job.Days)
            ?? throw new PlanInputException($"Network {job.NetworkId} version {job.NetworkVersion} is no longer in the store.");
        var planningCase = prepared.Case
            ?? throw new PlanInputException("The plan could not be set up: " + string.Join("; ", prepared.Problems));
        var options = JsonSerializer.Deserialize<SolveOptions>(job.OptionsJson, ServerJson.Options) ?? new SolveOptions();
        return await Task.Run(() => Solve(job, prepared, planningCase, options, progress, cancellation), cancellation);
    }

    private SolvedPlan Solve(PlanRecord job, PreparedCase prepared, PlanningCase planningCase, SolveOptions options,
        IProgress<SolveProgress> progress, CancellationToken cancellation)
    {
        var plan = solver.Solve(planningCase, options, progress, cancellation);
        cancellation.ThrowIfCancellationRequested();
        plan = plan with { Solve = plan.Solve with { Notes = [.. plan.Solve.Notes, .. prepared.ActualsNotes] } };
        var hasPlan = plan.Solve.Status != SolveStatus.NoPlan;
        var check = reviewer.Check(planningCase, plan);
        var baseline = hasPlan ? reviewer.CompareWithBaseline(planningCase, plan) : null;
        IReadOnlyList<PlantDayTargets> sheets = hasPlan ? sheetBuilder.Build(planningCase, plan) : [];
        var summary = PlanSummaries.Create(job, prepared.Network, planningCase, plan, check, baseline);
        var outcome = new PlanOutcome(
            JsonSerializer.Serialize(summary, ServerJson.Options),
            PlanJson.Serialize(plan),
            JsonSerializer.Serialize(check, ServerJson.Options),
            JsonSerializer.Serialize(sheets, ServerJson.Options));
        var message = hasPlan
            ? $"{plan.Solve.Status} plan, total cost {plan.Costs.Total:0.00} {plan.Currency}{Saving(baseline)}, check {(check.Passed ? "passed" : $"found {check.Violations.Count} violation(s)")}"
            : "The solver found no plan within its limits; see the summary and try a longer time limit.";
        return new SolvedPlan(outcome, message);
    }

    private static string Saving(BaselineComparison? baseline) =>
        baseline?.SavingPercent is { } percent ? $" ({percent:0.0} % below the rule-based baseline)" : "";

    private async Task<List<HourlyActuals>> ActualsBeforeAsync(Network network, LocalDate startDate)
    {
        var zone = network.TimeZone;
        var start = zone.AtStartOfDay(startDate).ToInstant();
        var monthStart = zone.AtStartOfDay(startDate.With(DateAdjusters.StartOfMonth)).ToInstant();
        var from = Instant.Min(monthStart, start - LatestStateWindow);
        var rows = new List<HourlyActuals>();
        foreach (var plant in network.Plants)
        {
            foreach (var stored in await store.ListActualsAsync(plant.Id.Value, from, start))
            {
                var hour = JsonSerializer.Deserialize<ActualsHour>(stored.RowJson, ServerJson.Options)!;
                rows.Add(hour.ToCore(plant.Id.Value));
            }
        }
        return rows;
    }
}
