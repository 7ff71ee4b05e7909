namespace PlanDesk.Cli.Bench;

/// <summary>
/// The figures of one benchmark case, as one row of the table and the CSV. Figures that could not be
/// measured are null and stay blank; <see cref="Note"/> says why.
/// </summary>
internal sealed record BenchResult
{
    public required string Size { get; init; }
    public required int Seed { get; init; }
    public required string Solver { get; init; }
    public int Plants { get; init; }
    public int Customers { get; init; }
    public int Periods { get; init; }
    public int? Variables { get; init; }
    public int? Integers { get; init; }
    public int? Constraints { get; init; }
    /// <summary>Building the MILP, from the planner's progress reports.</summary>
    public double? BuildSeconds { get; init; }
    /// <summary>Seconds until the planner had a first plan: its first progress report carrying an incumbent, or else a
    /// second solve stopped at any plan (the LP bound step left out).</summary>
    public double? FirstPlanSeconds { get; init; }
    /// <summary>Objective of the planner's first plan, when it reports one; compare with <see cref="Objective"/> to see what the MIP search added.</summary>
    public double? FirstPlanObjective { get; init; }
    /// <summary>The whole planner call: build, bound, solve, extract, explain.</summary>
    public double? SolveSeconds { get; init; }
    /// <summary>optimal, feasible, noPlan, or failed (the case process gave no result; see the note).</summary>
    public required string Status { get; init; }
    public double? Objective { get; init; }
    public double? BestBound { get; init; }
    public double? GapPercent { get; init; }
    /// <summary>Bound from the LP relaxation when the planner reports one (HiGHS); blank otherwise.</summary>
    public double? LpRelaxationBound { get; init; }
    /// <summary>Total objective (operating cost plus penalties) of the rule-based baseline, by the checker's accounting.</summary>
    public double? BaselineCost { get; init; }
    /// <summary>(baseline − plan) / baseline on the total objective, penalties included, percent.</summary>
    public double? SavingPercent { get; init; }
    /// <summary>The same on money actually paid (energy, demand charge, starts, chemicals, carbon), percent.</summary>
    public double? OperatingSavingPercent { get; init; }
    /// <summary>Violations the independent checker found in the plan (priced soft limits included).</summary>
    public int? Violations { get; init; }
    /// <summary>Of those, rules no plan may break.</summary>
    public int? HardViolations { get; init; }
    /// <summary>Violations the checker found in the baseline (each named among its problems).</summary>
    public int? BaselineViolations { get; init; }
    /// <summary>Peak working set of the process that ran the case, MB.</summary>
    public double? PeakMemoryMB { get; init; }
    public string Note { get; init; } = "";
}
