using System.Text.Json.Serialization;
using NodaTime;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Checking;

namespace PlanDesk.Server.Plans;

/// <summary>A request to plan a network version over whole local days.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record SolveRequest
{
    public required string NetworkId { get; init; }
    /// <summary>The version to plan; the latest when left out.</summary>
    public int? NetworkVersion { get; init; }
    /// <summary>First local day of the horizon, in the network's time zone.</summary>
    public required LocalDate StartDate { get; init; }
    /// <summary>1 to 7 local days.</summary>
    public int Days { get; init; } = 1;
    public SolveSettings? Options { get; init; }
}

/// <summary>Solver settings; each left out takes the planner's default.</summary>
/// <param name="Solver">SCIP (the default) or HIGHS.</param>
/// <param name="TimeLimitSeconds">1 to 3600 s.</param>
/// <param name="GapPercent">Relative gap at which the search stops, 0 to 100 %.</param>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record SolveSettings(string? Solver = null, double? TimeLimitSeconds = null, double? GapPercent = null);

/// <summary>What a long solve last reported.</summary>
public sealed record JobProgress(string Phase, double ElapsedSeconds, double TimeLimitSeconds, double? Incumbent, double? BestBound, double? GapPercent);

/// <summary>A solve job: queued, running, succeeded, failed or cancelled. The job and its plan share one id.</summary>
public sealed record JobResponse(
    long JobId,
    string State,
    string NetworkId,
    int NetworkVersion,
    LocalDate StartDate,
    int Days,
    JobProgress? Progress,
    string? Message,
    Instant SubmittedAt,
    Instant? StartedAt,
    Instant? FinishedAt,
    string JobHref,
    string PlanHref);

/// <summary>The headline of a finished plan: the Core summary (cost by component, energy, permit headroom,
/// shortfalls, problems, the rule-based baseline's cost and the saving against it), with what the service adds.</summary>
public sealed record PlanSummaryResponse
{
    public required long PlanId { get; init; }
    public required string NetworkId { get; init; }
    public required int NetworkVersion { get; init; }
    public required string NetworkName { get; init; }
    public required LocalDate StartDate { get; init; }
    public required int Days { get; init; }
    /// <summary>milp for the planner.</summary>
    public required string Method { get; init; }
    public required string Solver { get; init; }
    /// <summary>True when the independent checker found no violation.</summary>
    public required bool CheckPassed { get; init; }
    /// <summary>Starting values taken from reported actuals instead of the network file, and other solve notes.</summary>
    public required IReadOnlyList<string> Notes { get; init; }
    public required PlanSummary Summary { get; init; }
    public required string Caution { get; init; }
}

/// <summary>A plan in the list: its job state, and its headline once it has one.</summary>
public sealed record PlanListItem(long PlanId, string State, string NetworkId, int NetworkVersion, LocalDate StartDate, int Days,
    Instant SubmittedAt, Instant? FinishedAt, string? Status, double? TotalCost, string Href);

public sealed record PlanResponse(long PlanId, string NetworkId, int NetworkVersion, Plan Plan);

public sealed record PlanProblemsResponse(long PlanId, IReadOnlyList<PlanProblem> Problems);

/// <param name="PeriodStart">Start of the period, UTC.</param>
public sealed record MarginalWaterCostRow(string CustomerId, int Period, Instant PeriodStart, double CostPerM3);

public sealed record MarginalWaterCostsResponse(long PlanId, string Currency, IReadOnlyList<MarginalWaterCostRow> Costs);

public sealed record PlanCheckResponse(long PlanId, bool Passed, IReadOnlyList<Violation> Violations, CostBreakdown? RecomputedCosts);
