using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Extraction;

/// <summary>Why a customer was short on a day, as far as the network and the plan can tell.</summary>
internal static class ShortfallReasons
{
    private const double Tolerance = 1e-3;

    /// <param name="periods">The periods that matter: those short (hourly demand) or the delivery window (daily volume).</param>
    public static string Explain(PlanningCase planningCase, Plan plan, Customer customer, PlanDay day, IReadOnlyList<int> periods)
    {
        var network = planningCase.Network;
        var pipelines = network.Pipelines.Where(l => l.To.Customer == customer.Id).ToList();
        if (pipelines.Count == 0)
        {
            return "no pipeline reaches it";
        }
        var reasons = new List<string>();
        if (customer.Blend is { } blend && pipelines.All(l => !MeetsBlend(network, l, blend)))
        {
            reasons.Add($"no source meets its blend limit of {Amounts.Format(blend.Max, 2)} for {blend.Parameter}");
        }
        var favoured = HigherPriorityServed(planningCase, plan, customer, day);
        if (favoured.Count > 0)
        {
            reasons.Add($"the water that could reach it went to higher-priority customers ({string.Join(", ", favoured)})");
        }
        reasons.AddRange(StageOutages(planningCase, Upstream(network, customer.Id), day));
        if (customer.Demand is DailyDemand && periods.Count > 0)
        {
            var windowM3 = periods.Sum(t => Math.Min(planningCase.MaxDeliveryM3[customer.Id][t], pipelines.Sum(l => l.CapacityM3PerHour * planningCase.PeriodHours)));
            if (windowM3 + Tolerance < planningCase.DailyVolumeM3[customer.Id][day.Index])
            {
                reasons.Add($"its delivery hours and pipelines allow at most {Amounts.Format(windowM3)} m3 a day");
            }
        }
        if (customer.Demand is HourlyDemand && periods.Count > 0 && pipelines.All(l => l.Pumps is { } pumps &&
                periods.All(t => pumps.MinFlowM3PerHour * planningCase.PeriodHours > planningCase.DemandM3[customer.Id][t] + Tolerance)))
        {
            reasons.Add(string.Join(", ", pipelines.Select(l =>
                $"the pumps of pipeline {l.Name} cannot deliver less than {Amounts.Format(l.Pumps!.MinFlowM3PerHour)} m3/h")));
        }
        var full = pipelines.Where(l => periods.Count > 0 && periods.All(t =>
            plan.PipelinePlan(l.Id).FlowM3[t] >= l.CapacityM3PerHour * planningCase.PeriodHours - Tolerance)).ToList();
        if (full.Count == pipelines.Count)
        {
            reasons.Add(string.Join(", ", full.Select(l => $"pipeline {l.Name} is at its capacity of {Amounts.Format(l.CapacityM3PerHour)} m3/h")));
        }
        if (reasons.Count == 0)
        {
            reasons.Add($"more water would cost more than its shortfall penalty of {Amounts.Format(customer.ShortfallPenaltyPerM3, 2)} {network.Currency}/m3");
        }
        return string.Join("; ", reasons);
    }

    private static bool MeetsBlend(Network network, Pipeline pipeline, BlendLimit blend) =>
        network.Class(network.Tank(pipeline.From).Class).Quality.TryGetValue(blend.Parameter, out var quality) && quality <= blend.Max;

    private static IEnumerable<string> StageOutages(PlanningCase planningCase, IReadOnlyList<Stage> stages, PlanDay day)
    {
        if (stages.Count == 0)
        {
            yield return "no stage makes water for it, only stored water can reach it";
            yield break;
        }
        var least = stages.ToDictionary(s => s, s => day.PeriodIndices.Min(t => planningCase.AvailableUnits[s.Id][t]));
        if (least.All(pair => pair.Value == 0))
        {
            yield return "every stage that makes its water is out of service (" +
                         string.Join(", ", stages.Select(s => $"{s.Name}: 0 of {s.Units} units available")) + ")";
            yield break;
        }
        foreach (var (stage, available) in least.Where(pair => pair.Value < pair.Key.Units))
        {
            yield return $"stage {stage.Name} has only {available} of {stage.Units} units available";
        }
    }

    /// <summary>Stages whose product can reach the customer through tanks and pipelines.</summary>
    internal static IReadOnlyList<Stage> Upstream(Network network, CustomerId customer)
    {
        var tanks = UpstreamTanks(network, network.Pipelines.Where(l => l.To.Customer == customer).Select(l => l.From));
        return network.Stages.Where(s => tanks.Contains(s.ProductTank)).ToList();
    }

    private static HashSet<TankId> UpstreamTanks(Network network, IEnumerable<TankId> start)
    {
        var seen = new HashSet<TankId>();
        var queue = new Queue<TankId>(start);
        while (queue.TryDequeue(out var tank))
        {
            if (!seen.Add(tank))
            {
                continue;
            }
            foreach (var pipeline in network.Pipelines.Where(l => l.To.Tank == tank))
            {
                queue.Enqueue(pipeline.From);
            }
            foreach (var stage in network.Stages.Where(s => s.ProductTank == tank && s.FeedTank is not null))
            {
                queue.Enqueue(stage.FeedTank!.Value);
            }
        }
        return seen;
    }

    private static List<string> HigherPriorityServed(PlanningCase planningCase, Plan plan, Customer customer, PlanDay day)
    {
        var network = planningCase.Network;
        var sources = UpstreamTanks(network, network.Pipelines.Where(l => l.To.Customer == customer.Id).Select(l => l.From));
        return network.Customers
            .Where(other => other.Id != customer.Id && other.ShortfallPenaltyPerM3 > customer.ShortfallPenaltyPerM3)
            .Where(other => UpstreamTanks(network, network.Pipelines.Where(l => l.To.Customer == other.Id).Select(l => l.From)).Overlaps(sources))
            .Where(other => day.PeriodIndices.Sum(t => plan.CustomerPlan(other.Id).DeliveredM3[t]) > Tolerance)
            .Select(other => other.Name)
            .ToList();
    }
}
