using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// What the operator asks of each pipeline, stage and tank in one period, worked out from the customers back
/// to the plants: each customer's demand this period goes to its pipelines; each tank asks its sources for
/// what is drawn from it plus what brings it back to its start level (no shifting to cheaper hours).
/// </summary>
internal sealed class PeriodRequests
{
    public Dictionary<CustomerId, double> Customer { get; } = [];
    public Dictionary<PipelineId, double> Pipeline { get; } = [];
    public Dictionary<StageId, double> StageFeed { get; } = [];
    /// <summary>The part of a stage's feed its tank needs to serve this period's draws without falling below its
    /// minimum; secondary effluent goes to these parts first, refilling comes after.</summary>
    public Dictionary<StageId, double> EssentialFeed { get; } = [];
    /// <summary>Everything asked of a tank: deliveries, transfers and stage feeds drawn from it, m3.</summary>
    public Dictionary<TankId, double> Outflow { get; } = [];

    public static PeriodRequests Compute(BaselineState state, TankOrder order, int t)
    {
        var requests = new PeriodRequests();
        var network = state.Case.Network;
        foreach (var tank in network.Tanks)
        {
            requests.Outflow[tank.Id] = 0;
        }
        foreach (var customer in network.Customers)
        {
            requests.Customer[customer.Id] = CustomerWants(state, customer, t);
            SplitOverPipelines(state.Case, order, customer, requests);
        }
        foreach (var tank in order.UpstreamFirst.Reverse())
        {
            AskSources(state, order, tank, requests, t);
        }
        return requests;
    }

    /// <summary>What a customer should receive this period: the hourly demand, or a daily volume spread evenly
    /// over the allowed periods left in the day (catching up what earlier periods missed).</summary>
    public static double CustomerWants(BaselineState state, Customer customer, int t)
    {
        var planningCase = state.Case;
        if (customer.Demand is not DailyDemand)
        {
            return planningCase.DemandM3[customer.Id][t];
        }
        var most = planningCase.MaxDeliveryM3[customer.Id];
        if (most[t] <= 0)
        {
            return 0;
        }
        var day = planningCase.Horizon.Days[planningCase.Horizon.Periods[t].Day];
        var left = Enumerable.Range(t, day.FirstPeriod + day.PeriodCount - t).Count(k => most[k] > 0);
        return Math.Min(most[t], DayRemainingM3(state, customer, t) / left);
    }

    /// <summary>A daily-volume customer's volume still owed for the day of period <paramref name="t"/>, before t.</summary>
    public static double DayRemainingM3(BaselineState state, Customer customer, int t)
    {
        var horizon = state.Case.Horizon;
        var day = horizon.Days[horizon.Periods[t].Day];
        var delivered = state.Delivered[customer.Id];
        var so = 0.0;
        for (var k = day.FirstPeriod; k < t; k++)
        {
            so += delivered[k];
        }
        return Math.Max(0, state.Case.DailyVolumeM3[customer.Id][day.Index] - so);
    }

    /// <summary>The most a pipeline can carry in a period, m3.</summary>
    public static double PipelineMostM3(Pipeline pipeline, double hours) =>
        Math.Min(pipeline.CapacityM3PerHour, pipeline.Pumps is { } p ? p.Count * p.MaxFlowM3PerHour : double.PositiveInfinity) * hours;

    /// <summary>The blend parameter's value in the water a pipeline carries, or null when its class does not state it.</summary>
    public static double? BlendValue(Network network, Pipeline pipeline, string parameter) =>
        network.Class(network.Tank(pipeline.From).Class).Quality.TryGetValue(parameter, out var value) ? value : null;

    /// <summary>A customer's pipelines in the order the operator uses them: with a blend limit, the cleanest water
    /// first; otherwise the worst class that still serves the customer first, keeping better water for those who need it.</summary>
    public static IEnumerable<Pipeline> CustomerPipelines(Network network, TankOrder order, Customer customer) =>
        network.Pipelines.Where(l => l.To.Customer == customer.Id && order.Uses(l))
            .OrderBy(l => customer.Blend is { } blend
                ? BlendValue(network, l, blend.Parameter) ?? blend.Max
                : -network.Class(network.Tank(l.From).Class).Rank);

    /// <summary>Splits what a customer is asked to receive (<see cref="Customer"/>) over its pipelines, in the order the
    /// operator uses them, adding each pipeline's part to its source tank's outflow.</summary>
    public static void SplitOverPipelines(PlanningCase planningCase, TankOrder order, Customer customer, PeriodRequests requests)
    {
        var network = planningCase.Network;
        var remaining = requests.Customer[customer.Id];
        var blendSlack = 0.0;
        foreach (var pipeline in CustomerPipelines(network, order, customer))
        {
            var most = PipelineMostM3(pipeline, planningCase.PeriodHours);
            if (customer.Blend is { } blend && BlendValue(network, pipeline, blend.Parameter) is { } value && value > blend.Max)
            {
                most = Math.Min(most, blendSlack / (value - blend.Max));
            }
            var asked = Math.Max(0, Math.Min(remaining, most));
            requests.Pipeline[pipeline.Id] = asked;
            requests.Outflow[pipeline.From] += asked;
            remaining -= asked;
            if (customer.Blend is { } b && BlendValue(network, pipeline, b.Parameter) is { } v)
            {
                blendSlack += asked * (b.Max - v);
            }
        }
    }

    private static void AskSources(BaselineState state, TankOrder order, Tank tank, PeriodRequests requests, int t)
    {
        var network = state.Case.Network;
        var start = state.VolumeBefore(tank, t) * Keep(tank, state.Case.PeriodHours);
        var need = requests.Outflow[tank.Id] + tank.InitialM3 - start;
        var essential = Math.Max(0, requests.Outflow[tank.Id] + tank.MinM3 - start);
        foreach (var stage in network.Stages.Where(s => s.ProductTank == tank.Id && order.Uses(s)))
        {
            var mostFeed = StageUnitRules.MostFeedM3(state, order, stage, t);
            var feed = Math.Max(0, Math.Min(need / stage.RecoveryFraction, mostFeed));
            requests.StageFeed[stage.Id] = feed;
            // A running unit needs at least its least flow; units kept on for their minimum run need it whatever the tank needs.
            var least = stage.UnitMinFlowM3PerHour * state.Case.PeriodHours;
            var committed = StageUnitRules.Allowed(state, order, stage, t).Fewest * least;
            var essentialFeed = essential > 0 ? Math.Min(mostFeed, Math.Max(essential / stage.RecoveryFraction, least)) : 0;
            requests.EssentialFeed[stage.Id] = Math.Max(committed, essentialFeed);
            essential -= essentialFeed * stage.RecoveryFraction;
            need -= feed * stage.RecoveryFraction;
            if (stage.FeedTank is { } from)
            {
                requests.Outflow[from] += feed;
            }
        }
        foreach (var pipeline in network.Pipelines.Where(l => l.To.Tank == tank.Id && order.Uses(l)))
        {
            var flow = Math.Max(0, Math.Min(need, PipelineMostM3(pipeline, state.Case.PeriodHours)));
            requests.Pipeline[pipeline.Id] = flow;
            requests.Outflow[pipeline.From] += flow;
            need -= flow;
        }
    }

    /// <summary>Share of a tank's volume kept through one period after losses.</summary>
    public static double Keep(Tank tank, double periodHours) => 1 - tank.LossFractionPerDay * periodHours / 24.0;
}
