using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Plans;

/// <summary>
/// A plan: every decision for every period of a horizon, as produced by the planner, the rule-based
/// baseline or a scheduler's hand edit. Arrays are indexed by period of the horizon (volumes are m3 in
/// the period, energies kWh in the period); per-day arrays by local day. The checker needs nothing else
/// besides the network to verify it.
/// </summary>
public sealed record Plan
{
    public required string NetworkName { get; init; }
    public required LocalDate StartDate { get; init; }
    public required int Days { get; init; }
    public required int PeriodMinutes { get; init; }
    /// <summary>Start of every period, UTC; lets a reader see the DST days.</summary>
    public required IReadOnlyList<Instant> PeriodStarts { get; init; }
    /// <summary>"milp" for the planner, "rules" for the rule-based baseline, "edited" after a hand edit.</summary>
    public required string Method { get; init; }
    public required string Currency { get; init; }
    public required SolveInfo Solve { get; init; }
    public required IReadOnlyList<PlantPlan> Plants { get; init; }
    public required IReadOnlyList<StagePlan> Stages { get; init; }
    public required IReadOnlyList<TankPlan> Tanks { get; init; }
    public required IReadOnlyList<PipelinePlan> Pipelines { get; init; }
    public required IReadOnlyList<CustomerPlan> Customers { get; init; }
    /// <summary>The cost as its producer computed it; the checker recomputes and compares.</summary>
    public required CostBreakdown Costs { get; init; }
    /// <summary>Named, quantified problems (shortfalls, bypass, permit excess ...), each in plain words.</summary>
    public IReadOnlyList<PlanProblem> Problems { get; init; } = [];
    /// <summary>Marginal cost of water per customer and period, currency/m3 (planner only; empty otherwise).</summary>
    public IReadOnlyList<MarginalWaterCost> MarginalWaterCosts { get; init; } = [];
    /// <summary>Limits that bind in the plan (stage at capacity, tank full, permit cap ...).</summary>
    public IReadOnlyList<BindingLimit> BindingLimits { get; init; } = [];

    /// <summary>A plan for <paramref name="planningCase"/>'s horizon with no decisions yet: the header every producer
    /// shares; fill the sections with a <c>with</c> expression.</summary>
    public static Plan For(PlanningCase planningCase, string method, SolveInfo solve)
    {
        var horizon = planningCase.Horizon;
        return new Plan
        {
            NetworkName = planningCase.Network.Name,
            StartDate = horizon.StartDate,
            Days = horizon.DayCount,
            PeriodMinutes = horizon.PeriodMinutes,
            PeriodStarts = horizon.Periods.Select(p => p.Start).ToList(),
            Method = method,
            Currency = planningCase.Network.Currency,
            Solve = solve,
            Plants = [],
            Stages = [],
            Tanks = [],
            Pipelines = [],
            Customers = [],
            Costs = new CostBreakdown(),
        };
    }
}

/// <summary>How the plan was obtained. Status is one of optimal, feasible, noPlan.</summary>
public sealed record SolveInfo
{
    public required string Status { get; init; }
    public string Solver { get; init; } = "";
    public double Objective { get; init; }
    /// <summary>A proven lower bound on the objective (never the objective itself); NaN when none is known.</summary>
    public double BestBound { get; init; } = double.NaN;
    public double GapPercent { get; init; } = double.NaN;
    public double SolveSeconds { get; init; }
    public int Variables { get; init; }
    public int IntegerVariables { get; init; }
    public int Constraints { get; init; }
    /// <summary>Values taken from reported actuals instead of the network file, in plain words.</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>(objective − bound) / |objective| in percent; 0 when both are 0, NaN without a bound.</summary>
    public static double GapPercentBetween(double objective, double bound)
    {
        if (double.IsNaN(bound))
        {
            return double.NaN;
        }
        var difference = Math.Max(0, objective - bound);
        if (Math.Abs(objective) < 1e-9)
        {
            return difference < 1e-9 ? 0 : double.NaN;
        }
        return 100.0 * difference / Math.Abs(objective);
    }
}

public static class SolveStatus
{
    public const string Optimal = "optimal";
    public const string Feasible = "feasible";
    public const string NoPlan = "noPlan";
}

/// <summary>A plant's secondary treatment, outfall and energy.</summary>
public sealed record PlantPlan
{
    public required PlantId Plant { get; init; }
    /// <summary>Treatment level chosen for each local day.</summary>
    public required IReadOnlyList<LevelId> LevelByDay { get; init; }
    public required double[] TreatedM3 { get; init; }
    public required double[] BypassM3 { get; init; }
    /// <summary>Secondary effluent not taken by any stage, discharged at the outfall.</summary>
    public required double[] SecondaryToOutfallM3 { get; init; }
    /// <summary>Gas burnt in the engine, Nm3; zero arrays for plants without an engine.</summary>
    public required double[] GasToEngineNm3 { get; init; }
    public required double[] GasFlaredNm3 { get; init; }
    /// <summary>Gas in the holder at the end of each period, Nm3.</summary>
    public required double[] HolderEndNm3 { get; init; }
    public required double[] EngineKWh { get; init; }
    public required double[] ImportKWh { get; init; }
    public required double[] ExportKWh { get; init; }
}

/// <summary>A polishing stage's schedule.</summary>
public sealed record StagePlan
{
    public required StageId Stage { get; init; }
    public required int[] UnitsRunning { get; init; }
    public required int[] UnitStarts { get; init; }
    public required double[] FeedM3 { get; init; }
}

public sealed record TankPlan
{
    public required TankId Tank { get; init; }
    /// <summary>Volume at the end of each period, m3.</summary>
    public required double[] EndVolumeM3 { get; init; }
}

public sealed record PipelinePlan
{
    public required PipelineId Pipeline { get; init; }
    public required double[] FlowM3 { get; init; }
    /// <summary>Pumps running per period for pipelines with discrete pumps; null otherwise.</summary>
    public int[]? PumpsRunning { get; init; }
}

public sealed record CustomerPlan
{
    public required CustomerId Customer { get; init; }
    public required double[] DeliveredM3 { get; init; }
    /// <summary>Hourly-demand customers: shortfall per period. Daily-volume customers: per local day.</summary>
    public required double[] ShortfallM3 { get; init; }
}

/// <summary>Cost by component in the network's currency. Penalties are not money paid but are part of the objective.</summary>
public sealed record CostBreakdown
{
    public double EnergyImport { get; init; }
    /// <summary>Feed-in revenue, as a positive number subtracted from the total.</summary>
    public double EnergyExportCredit { get; init; }
    public double DemandCharge { get; init; }
    public double UnitStarts { get; init; }
    public double Chemicals { get; init; }
    public double Carbon { get; init; }
    public double ShortfallPenalty { get; init; }
    public double BypassPenalty { get; init; }
    public double PermitPenalty { get; init; }
    public double OutfallPenalty { get; init; }
    public double TankEndPenalty { get; init; }
    /// <summary>Penalty on tank volumes outside their minimum and maximum (only when the data leave no other way).</summary>
    public double TankLimitPenalty { get; init; }

    /// <summary>Money actually paid: energy, demand charge, starts, chemicals and carbon.</summary>
    public double Operating => EnergyImport - EnergyExportCredit + DemandCharge + UnitStarts + Chemicals + Carbon;
    public double Penalties => ShortfallPenalty + BypassPenalty + PermitPenalty + OutfallPenalty + TankEndPenalty + TankLimitPenalty;
    /// <summary>The objective: operating cost plus penalties.</summary>
    public double Total => Operating + Penalties;
}

/// <summary>A named, quantified problem of a plan, e.g. "customer Ridge Farm short 1 240 m3 of class A on 2027-03-28".</summary>
/// <param name="Kind">shortfall, bypass, permitExcess, outfallExcess, tankEndDeficit ...</param>
/// <param name="Where">The plant, customer, tank ... it concerns.</param>
public sealed record PlanProblem(string Kind, string Where, LocalDate? Day, double Amount, string Unit, string Message);

/// <summary>Marginal cost of delivering one more m3 to a customer in a period, currency/m3.</summary>
public sealed record MarginalWaterCost(CustomerId Customer, int Period, double CostPerM3);

/// <summary>A limit at its bound in the plan.</summary>
/// <param name="Kind">stageCapacity, pipelineCapacity, tankFull, tankEmpty, permitDailyCap, permitMonthlyCap, engineSize ...</param>
public sealed record BindingLimit(string Kind, string Where, int? Period, LocalDate? Day, string Message);
