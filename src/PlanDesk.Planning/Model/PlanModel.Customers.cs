using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Model;

// Customers: deliveries against demand, the hours daily volumes may arrive in, and blended quality.
internal sealed partial class PlanModel
{
    /// <summary>Hourly-demand customers: demand not met per period, m3.</summary>
    public Dictionary<(CustomerId Customer, int Period), Variable> ShortInPeriod { get; } = [];
    /// <summary>Daily-volume customers: volume not delivered per local day, m3.</summary>
    public Dictionary<(CustomerId Customer, int Day), Variable> ShortOnDay { get; } = [];
    /// <summary>delivery + shortfall = demand per period (hourly customers); the dual is the marginal cost of water.</summary>
    public Dictionary<(CustomerId Customer, int Period), Constraint> PeriodBalance { get; } = [];
    /// <summary>Σ deliveries over the day + shortfall = volume (daily customers).</summary>
    public Dictionary<(CustomerId Customer, int Day), Constraint> DayBalance { get; } = [];

    private IEnumerable<Pipeline> PipelinesTo(CustomerId customer) => Network.Pipelines.Where(l => l.To.Customer == customer);

    /// <summary>
    /// Hourly demand: Σ f + shortfall = demand in each period. Daily volume: Σ over the day's periods of Σ f +
    /// shortfall = volume, and Σ f ≤ the most the customer may take in each period (0 outside its hours).
    /// Shortfall costs the customer's penalty, which ranks customers when water is scarce.
    /// </summary>
    private void AddCustomerBalances()
    {
        foreach (var customer in Network.Customers)
        {
            var pipelines = PipelinesTo(customer.Id).ToList();
            if (customer.Demand is DailyDemand)
            {
                AddDailyVolume(customer, pipelines);
                continue;
            }
            var demand = Case.DemandM3[customer.Id];
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var shortfall = NumVar(0, double.PositiveInfinity, Name("short", customer.Id, P(t)));
                ShortInPeriod[(customer.Id, t)] = shortfall;
                var balance = EqualRow(demand[t], Name("deliver", customer.Id, P(t))).Add(shortfall, 1);
                foreach (var pipeline in pipelines)
                {
                    balance.Add(Flow[(pipeline.Id, t)], 1);
                }
                PeriodBalance[(customer.Id, t)] = balance;
                Costs.Add(CostComponent.ShortfallPenalty, shortfall, customer.ShortfallPenaltyPerM3);
            }
        }
    }

    private void AddDailyVolume(Customer customer, IReadOnlyList<Pipeline> pipelines)
    {
        var volume = Case.DailyVolumeM3[customer.Id];
        var maxDelivery = Case.MaxDeliveryM3[customer.Id];
        foreach (var day in Horizon.Days)
        {
            var shortfall = NumVar(0, double.PositiveInfinity, Name("short", customer.Id, DayLabel(day.Index)));
            ShortOnDay[(customer.Id, day.Index)] = shortfall;
            var balance = EqualRow(volume[day.Index], Name("deliver", customer.Id, DayLabel(day.Index))).Add(shortfall, 1);
            foreach (var t in day.PeriodIndices)
            {
                foreach (var pipeline in pipelines)
                {
                    balance.Add(Flow[(pipeline.Id, t)], 1);
                }
                if (double.IsFinite(maxDelivery[t]))
                {
                    var window = AtMostRow(maxDelivery[t], Name("delivery-window", customer.Id, P(t)));
                    foreach (var pipeline in pipelines)
                    {
                        window.Add(Flow[(pipeline.Id, t)], 1);
                    }
                }
            }
            DayBalance[(customer.Id, day.Index)] = balance;
            Costs.Add(CostComponent.ShortfallPenalty, shortfall, customer.ShortfallPenaltyPerM3);
        }
    }

    /// <summary>
    /// Flow-weighted blend in each period: Σ f·q_source / Σ f ≤ q_max, written linearly as Σ f·(q_source − q_max) ≤ 0,
    /// with q_source the nominal value of the from-tank's class. A source whose class gives no value for the
    /// parameter cannot be shown to comply, so it may not serve the customer.
    /// </summary>
    private void AddBlendLimits()
    {
        foreach (var customer in Network.Customers.Where(c => c.Blend is not null))
        {
            var limit = customer.Blend!;
            var pipelines = PipelinesTo(customer.Id).ToList();
            var unknown = pipelines.Where(l => !SourceQuality(l, limit.Parameter).HasValue).ToList();
            foreach (var pipeline in unknown)
            {
                Notes.Add($"pipeline {pipeline.Name} may not serve {customer.Name}: class {Network.Tank(pipeline.From).Class} " +
                          $"gives no value for {limit.Parameter}, so the blend limit cannot be shown to hold");
            }
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var blend = AtMostRow(0, Name("blend", customer.Id, P(t)));
                foreach (var pipeline in pipelines)
                {
                    var quality = SourceQuality(pipeline, limit.Parameter);
                    if (quality is { } q)
                    {
                        blend.Add(Flow[(pipeline.Id, t)], q - limit.Max);
                    }
                    else
                    {
                        Flow[(pipeline.Id, t)].SetUb(0);
                    }
                }
            }
        }
    }

    private double? SourceQuality(Pipeline pipeline, string parameter) =>
        Network.Class(Network.Tank(pipeline.From).Class).Quality.TryGetValue(parameter, out var value) ? value : null;
}
