using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Deliveries against pipelines, demand and shortfall, allowed delivery hours and blend limits.</summary>
internal static class CustomerChecks
{
    public static void Check(Findings findings, PlanIndex index)
    {
        foreach (var customer in findings.Case.Network.Customers)
        {
            var c = index.Customers[customer.Id];
            findings.NonNegative(customer.Id.Value, "delivered", c.DeliveredM3, "m3");
            CheckDeliveredByPipelines(findings, index, customer);
            if (customer.Demand is DailyDemand)
            {
                CheckDailyVolume(findings, index, customer);
            }
            else
            {
                CheckHourlyDemand(findings, index, customer);
            }
            if (customer.Blend is { } blend)
            {
                CheckBlend(findings, index, customer, blend);
            }
        }
    }

    private static void CheckDeliveredByPipelines(Findings findings, PlanIndex index, Customer customer)
    {
        var delivered = index.Customers[customer.Id].DeliveredM3;
        var pipelines = findings.Case.Network.Pipelines.Where(l => l.To.Customer == customer.Id).ToList();
        for (var t = 0; t < delivered.Length; t++)
        {
            var carried = pipelines.Sum(l => index.Pipelines[l.Id].FlowM3[t]);
            if (findings.Tolerances.Differ(delivered[t], carried))
            {
                findings.AtPeriod(ViolationKind.DeliveryBalance, customer.Id.Value, t, Math.Abs(delivered[t] - carried), "m3", carried,
                    $"customer {customer.Id} is said to receive {Findings.Q(delivered[t])} m3 but its pipelines carry {Findings.Q(carried)} m3");
            }
        }
    }

    private static void CheckHourlyDemand(Findings findings, PlanIndex index, Customer customer)
    {
        var c = index.Customers[customer.Id];
        var demand = findings.Case.DemandM3[customer.Id];
        findings.NonNegative(customer.Id.Value, "shortfall", c.ShortfallM3, "m3");
        for (var t = 0; t < demand.Length; t++)
        {
            var accounted = c.DeliveredM3[t] + c.ShortfallM3[t];
            if (findings.Tolerances.Differ(accounted, demand[t]))
            {
                findings.AtPeriod(ViolationKind.DemandBalance, customer.Id.Value, t, Math.Abs(accounted - demand[t]), "m3", demand[t],
                    $"customer {customer.Id} receives {Findings.Q(c.DeliveredM3[t])} m3 and is short {Findings.Q(c.ShortfallM3[t])} m3, " +
                    $"but wants {Findings.Q(demand[t])} m3; delivered + shortfall must equal the demand");
            }
        }
    }

    private static void CheckDailyVolume(Findings findings, PlanIndex index, Customer customer)
    {
        var c = index.Customers[customer.Id];
        var volume = findings.Case.DailyVolumeM3[customer.Id];
        var most = findings.Case.MaxDeliveryM3[customer.Id];
        foreach (var day in findings.Case.Horizon.Days)
        {
            if (findings.Tolerances.Below(c.ShortfallM3[day.Index], 0))
            {
                findings.AtDay(ViolationKind.NegativeValue, customer.Id.Value, day.Index, -c.ShortfallM3[day.Index], "m3", 0,
                    $"customer {customer.Id}: shortfall is {Findings.Q(c.ShortfallM3[day.Index])} m3; it cannot be negative");
            }
            var delivered = day.PeriodIndices.Sum(t => c.DeliveredM3[t]);
            var accounted = delivered + c.ShortfallM3[day.Index];
            if (findings.Tolerances.Differ(accounted, volume[day.Index]))
            {
                findings.AtDay(ViolationKind.DemandBalance, customer.Id.Value, day.Index, Math.Abs(accounted - volume[day.Index]), "m3", volume[day.Index],
                    $"customer {customer.Id} receives {Findings.Q(delivered)} m3 in the day and is short {Findings.Q(c.ShortfallM3[day.Index])} m3, " +
                    $"but is owed {Findings.Q(volume[day.Index])} m3; delivered + shortfall must equal the daily volume");
            }
        }
        for (var t = 0; t < most.Length; t++)
        {
            if (findings.Tolerances.Above(c.DeliveredM3[t], most[t]))
            {
                findings.AtPeriod(ViolationKind.DeliveryWindow, customer.Id.Value, t, c.DeliveredM3[t] - most[t], "m3", most[t],
                    most[t] == 0
                        ? $"customer {customer.Id} receives {Findings.Q(c.DeliveredM3[t])} m3 outside its allowed delivery hours"
                        : $"customer {customer.Id} receives {Findings.Q(c.DeliveredM3[t])} m3, above its most of {Findings.Q(most[t])} m3 in the period");
            }
        }
    }

    // Σ f·(q_source − max) ≤ 0: the flow-weighted blend may not exceed the limit. A class that does not state
    // the parameter is left out of the blend (the network loader requires it where a blend limit applies).
    private static void CheckBlend(Findings findings, PlanIndex index, Customer customer, BlendLimit blend)
    {
        var network = findings.Case.Network;
        var sources = network.Pipelines
            .Where(l => l.To.Customer == customer.Id)
            .Select(l => (Flow: index.Pipelines[l.Id].FlowM3, Quality: network.Tank(l.From).Class))
            .Where(s => network.Class(s.Quality).Quality.ContainsKey(blend.Parameter))
            .Select(s => (s.Flow, Value: network.Class(s.Quality).Quality[blend.Parameter]))
            .ToList();
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var volume = sources.Sum(s => s.Flow[t]);
            var weighted = sources.Sum(s => s.Flow[t] * s.Value);
            if (findings.Tolerances.Above(weighted, volume * blend.Max))
            {
                var blended = weighted / volume;
                findings.AtPeriod(ViolationKind.BlendLimit, customer.Id.Value, t, blended - blend.Max, blend.Parameter, blend.Max,
                    $"customer {customer.Id} receives a blend with {blend.Parameter} {Findings.Q(blended)}, above its limit of {Findings.Q(blend.Max)}");
            }
        }
    }
}
