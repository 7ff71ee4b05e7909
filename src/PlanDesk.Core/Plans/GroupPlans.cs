using PlanDesk.Core.Model;

namespace PlanDesk.Core.Plans;

/// <summary>A plan for one group of plants, made from the case <see cref="PlanningCase.Restrict"/> gives.</summary>
public sealed record GroupPlan(PlantGroup Group, Plan Plan);

/// <summary>
/// Joins the plans of a network's independent groups (<see cref="IndependentGroups"/>) into one plan for the whole
/// case. Because no constraint or cost spans two groups, the joined plan is what one model of the whole region
/// would give: costs and objectives add up, and so do the groups' proven lower bounds.
/// </summary>
public static class GroupPlans
{
    /// <param name="askedGapPercent">The gap the solve was asked for: the joined plan is optimal only within it.</param>
    /// <param name="wallSeconds">Time the whole solve took (groups may have run side by side).</param>
    public static Plan Join(PlanningCase planningCase, IReadOnlyList<GroupPlan> parts, double askedGapPercent, double wallSeconds)
    {
        var method = parts.Count > 0 ? parts[0].Plan.Method : "milp";
        var info = CombinedInfo(parts, askedGapPercent, wallSeconds);
        var failed = parts.Where(p => p.Plan.Solve.Status == SolveStatus.NoPlan).ToList();
        if (failed.Count > 0)
        {
            return NoPlan(planningCase, method, info, failed);
        }

        var network = planningCase.Network;
        var plans = parts.Select(p => p.Plan).ToList();
        var plants = plans.SelectMany(p => p.Plants).ToDictionary(p => p.Plant);
        var stages = plans.SelectMany(p => p.Stages).ToDictionary(s => s.Stage);
        var tanks = plans.SelectMany(p => p.Tanks).ToDictionary(t => t.Tank);
        var pipelines = plans.SelectMany(p => p.Pipelines).ToDictionary(l => l.Pipeline);
        var customers = plans.SelectMany(p => p.Customers).ToDictionary(c => c.Customer);
        return Plan.For(planningCase, method, info) with
        {
            Plants = network.Plants.Select(p => plants[p.Id]).ToList(),
            Stages = network.Stages.Select(s => stages[s.Id]).ToList(),
            Tanks = network.Tanks.Select(t => tanks[t.Id]).ToList(),
            Pipelines = network.Pipelines.Select(l => pipelines[l.Id]).ToList(),
            Customers = network.Customers.Select(c => customers[c.Id]).ToList(),
            Costs = Sum(plans.Select(p => p.Costs)),
            Problems = [.. plans.SelectMany(p => p.Problems)],
            MarginalWaterCosts = [.. plans.SelectMany(p => p.MarginalWaterCosts)],
            BindingLimits = [.. plans.SelectMany(p => p.BindingLimits)],
        };
    }

    /// <summary>Sums of objectives, bounds and model sizes; optimal only when the joined gap is within the asked one.</summary>
    private static SolveInfo CombinedInfo(IReadOnlyList<GroupPlan> parts, double askedGapPercent, double wallSeconds)
    {
        var infos = parts.Select(p => p.Plan.Solve).ToList();
        var objective = infos.Sum(i => i.Objective);
        // Each group's bound is a proven lower bound on its own objective, so their sum bounds the sum; one unknown
        // bound leaves the sum unknown.
        var bound = infos.Any(i => double.IsNaN(i.BestBound)) ? double.NaN : infos.Sum(i => i.BestBound);
        var gap = SolveInfo.GapPercentBetween(objective, bound);
        var notes = new List<string>
        {
            $"the region was solved as {parts.Count} independent groups of plants (no tank, stage, pipeline or customer joins " +
            "two groups), each as its own model; the plan, its cost and its bound are the sums of theirs",
        };
        notes.AddRange(parts.SelectMany(p => p.Plan.Solve.Notes.Select(note => $"{p.Group.Label}: {note}")));
        return new SolveInfo
        {
            Status = gap <= askedGapPercent + 1e-9 ? SolveStatus.Optimal : SolveStatus.Feasible,
            Solver = string.Join("; ", infos.Select(i => i.Solver).Where(s => s.Length > 0).Distinct()),
            Objective = objective,
            BestBound = bound,
            GapPercent = gap,
            SolveSeconds = wallSeconds,
            Variables = infos.Sum(i => i.Variables),
            IntegerVariables = infos.Sum(i => i.IntegerVariables),
            Constraints = infos.Sum(i => i.Constraints),
            Notes = notes,
        };
    }

    // A plan must cover the whole region: one group without a plan leaves the region without one, named by group.
    private static Plan NoPlan(PlanningCase planningCase, string method, SolveInfo info, IReadOnlyList<GroupPlan> failed)
    {
        const string prefix = "no plan: ";
        var problems = failed.SelectMany(f => f.Plan.Problems.Select(problem => problem.Kind == "noPlan"
            ? problem with { Message = $"no plan for {f.Group.Label}: {(problem.Message.StartsWith(prefix, StringComparison.Ordinal) ? problem.Message[prefix.Length..] : problem.Message)}" }
            : problem));
        var notes = info.Notes.Append($"no plan for {string.Join("; ", failed.Select(f => f.Group.Label))}, so none for the region").ToList();
        return Plan.For(planningCase, method, info with { Status = SolveStatus.NoPlan, Objective = 0, BestBound = double.NaN, GapPercent = double.NaN, Notes = notes }) with { Problems = [.. problems] };
    }

    private static CostBreakdown Sum(IEnumerable<CostBreakdown> costs) => costs.Aggregate(new CostBreakdown(), (sum, c) => new CostBreakdown
    {
        EnergyImport = sum.EnergyImport + c.EnergyImport,
        EnergyExportCredit = sum.EnergyExportCredit + c.EnergyExportCredit,
        DemandCharge = sum.DemandCharge + c.DemandCharge,
        UnitStarts = sum.UnitStarts + c.UnitStarts,
        Chemicals = sum.Chemicals + c.Chemicals,
        Carbon = sum.Carbon + c.Carbon,
        ShortfallPenalty = sum.ShortfallPenalty + c.ShortfallPenalty,
        BypassPenalty = sum.BypassPenalty + c.BypassPenalty,
        PermitPenalty = sum.PermitPenalty + c.PermitPenalty,
        OutfallPenalty = sum.OutfallPenalty + c.OutfallPenalty,
        TankEndPenalty = sum.TankEndPenalty + c.TankEndPenalty,
        TankLimitPenalty = sum.TankLimitPenalty + c.TankLimitPenalty,
    });
}
