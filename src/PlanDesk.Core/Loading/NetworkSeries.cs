using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>Every time series of a network with what it measures, for coverage checks and summaries.</summary>
public static class NetworkSeries
{
    public static IEnumerable<(Series Series, string What)> All(Network network)
    {
        foreach (var tariff in network.Tariffs)
        {
            if (tariff.Price is SeriesPrice price)
            {
                yield return (price.PricePerMWh, $"energy price of tariff '{tariff.Id}'");
            }
        }
        foreach (var plant in network.Plants)
        {
            yield return (plant.InfluentM3PerHour, $"influent of plant '{plant.Id}'");
            if (plant.Biogas is { } biogas)
            {
                yield return (biogas.ProductionNm3PerHour, $"biogas of plant '{plant.Id}'");
            }
            foreach (var stage in plant.Stages.Where(s => s.AvailableUnits is not null))
            {
                yield return (stage.AvailableUnits!, $"available units of stage '{stage.Id}'");
            }
        }
        foreach (var customer in network.Customers)
        {
            if (customer.Demand is HourlyDemand hourly)
            {
                yield return (hourly.M3PerHour, $"demand of customer '{customer.Id}'");
            }
        }
    }

    /// <summary>The time range every series covers: from the latest start to the earliest end of the stepped series.
    /// Null bounds mean no stepped series limits that side (all constant). Start ≥ End means no common range.</summary>
    public static (NodaTime.Instant? Start, NodaTime.Instant? End) CommonRange(Network network)
    {
        var stepped = All(network).Select(s => s.Series).OfType<StepSeries>().ToList();
        return stepped.Count == 0 ? (null, null) : (stepped.Max(s => s.Start), stepped.Min(s => s.End));
    }
}
