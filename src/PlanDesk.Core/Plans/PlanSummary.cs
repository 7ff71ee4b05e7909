using System.Text.Json;
using System.Text.Json.Serialization;
using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Plans;

/// <summary>
/// The figures people look at first: status, cost by component, energy per plant, permit headroom, shortfalls and
/// other problems, solve figures. Written by <c>plandesk solve --summary-json</c> and served by the API; the checker
/// and baseline add <see cref="BaselineCost"/>, <see cref="SavingPercent"/> and <see cref="CheckViolations"/>.
/// Unknown numbers are null, never NaN.
/// </summary>
public sealed record PlanSummary
{
    /// <summary>optimal, feasible or noPlan.</summary>
    public required string Status { get; init; }
    public required string Currency { get; init; }
    public double? Objective { get; init; }
    public double? BestBound { get; init; }
    public double? GapPercent { get; init; }
    public double SolveSeconds { get; init; }
    public required ModelSize ModelSize { get; init; }
    public required CostBreakdown Costs { get; init; }
    public required IReadOnlyList<PlantEnergySummary> Energy { get; init; }
    public required IReadOnlyList<PermitHeadroom> Permits { get; init; }
    public required IReadOnlyList<ShortfallSummary> Shortfalls { get; init; }
    public required IReadOnlyList<ProblemSummary> Problems { get; init; }
    /// <summary>Cost of the rule-based baseline on the same case (set by the baseline helper).</summary>
    public double? BaselineCost { get; init; }
    /// <summary>(baseline − plan) / baseline in percent on the total objective, penalties included (set with <see cref="BaselineCost"/>).</summary>
    public double? SavingPercent { get; init; }
    /// <summary>The same saving on operating cost alone: money actually paid (set with <see cref="BaselineCost"/>).</summary>
    public double? OperatingSavingPercent { get; init; }
    /// <summary>Violations the independent checker found (set by the checker).</summary>
    public int? CheckViolations { get; init; }

    public static PlanSummary From(PlanningCase planningCase, Plan plan)
    {
        var hasPlan = plan.Plants.Count > 0;
        return new PlanSummary
        {
            Status = plan.Solve.Status,
            Currency = plan.Currency,
            Objective = hasPlan ? Known(plan.Solve.Objective) : null,
            BestBound = hasPlan ? Known(plan.Solve.BestBound) : null,
            GapPercent = hasPlan ? Known(plan.Solve.GapPercent) : null,
            SolveSeconds = plan.Solve.SolveSeconds,
            ModelSize = new ModelSize(plan.Solve.Variables, plan.Solve.IntegerVariables, plan.Solve.Constraints),
            Costs = plan.Costs,
            Energy = hasPlan ? planningCase.Network.Plants.Select(p => EnergyOf(planningCase, plan, p)).ToList() : [],
            Permits = hasPlan ? planningCase.Network.Plants.SelectMany(p => PermitsOf(planningCase, plan, p)).ToList() : [],
            Shortfalls = plan.Problems.Where(p => p.Kind == "shortfall")
                .Select(p => new ShortfallSummary(p.Where, p.Day, p.Amount)).ToList(),
            Problems = plan.Problems.Select(p => new ProblemSummary(p.Kind, p.Where, p.Day, p.Amount, p.Unit, p.Message)).ToList(),
        };
    }

    public string ToJson() => JsonSerializer.Serialize(this, SummaryJson);

    private static readonly JsonSerializerOptions SummaryJson = CreateJsonOptions();

    private static JsonSerializerOptions CreateJsonOptions()
    {
        var options = PlanJson.CreateOptions(indented: true);
        options.NumberHandling = JsonNumberHandling.Strict;
        return options;
    }

    private static double? Known(double value) => double.IsFinite(value) ? value : null;

    private static PlantEnergySummary EnergyOf(PlanningCase planningCase, Plan plan, Plant plant)
    {
        var plantPlan = plan.PlantPlan(plant.Id);
        var load = PlanFigures.LoadKWh(plantPlan).Sum();
        var engine = plantPlan.EngineKWh.Sum();
        return new PlantEnergySummary(
            plant.Id,
            plant.Name,
            load,
            engine,
            plantPlan.ImportKWh.Sum(),
            plantPlan.ExportKWh.Sum(),
            load > 0 ? 100.0 * Math.Min(engine, load) / load : null,
            PlanFigures.PeakImportKw(planningCase, plantPlan, Enumerable.Range(0, planningCase.PeriodCount)));
    }

    private static IEnumerable<PermitHeadroom> PermitsOf(PlanningCase planningCase, Plan plan, Plant plant)
    {
        var days = planningCase.Horizon.Days;
        foreach (var nutrient in PermitNutrient.Of(plant).Where(n => n.Capped))
        {
            var loads = days.Select(d => PlanFigures.DayLoadKg(planningCase, plan, plant.Id, nutrient, d.Index)).ToArray();
            if (nutrient.DailyCapKg is { } dailyCap)
            {
                foreach (var day in days)
                {
                    yield return new PermitHeadroom(plant.Id, nutrient.Label, "daily", day.Date, loads[day.Index], dailyCap, dailyCap - loads[day.Index]);
                }
            }
            if (nutrient.MonthlyCapKg is { } monthlyCap)
            {
                foreach (var month in days.GroupBy(d => planningCase.BillingMonth[d.FirstPeriod]))
                {
                    var load = month.Sum(d => loads[d.Index]) + (month.Key == 0 ? nutrient.MonthToDateKg : 0);
                    yield return new PermitHeadroom(plant.Id, nutrient.Label, "monthly", month.First().Date, load, monthlyCap, monthlyCap - load);
                }
            }
        }
    }
}

public sealed record ModelSize(int Variables, int IntegerVariables, int Constraints);

/// <summary>A plant's energy over the horizon, kWh; self-sufficiency is the engine's share of the load, percent.</summary>
public sealed record PlantEnergySummary(PlantId Plant, string Name, double LoadKWh, double EngineKWh, double ImportKWh, double ExportKWh,
    double? SelfSufficiencyPercent, double PeakImportKw);

/// <summary>A nutrient load against a cap: <paramref name="Period"/> is daily (for <paramref name="Day"/>) or monthly
/// (the month of <paramref name="Day"/>, month-to-date load included); negative headroom is an excess.</summary>
public sealed record PermitHeadroom(PlantId Plant, string Nutrient, string Period, LocalDate Day, double LoadKg, double CapKg, double HeadroomKg);

public sealed record ShortfallSummary(string Customer, LocalDate? Day, double M3);

public sealed record ProblemSummary(string Kind, string Where, LocalDate? Day, double Amount, string Unit, string Message);
